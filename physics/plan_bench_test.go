package physics

import (
	"context"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// panThrow is the demo pan (demoProp) thrown for a 1.2 s flight back to
// its release height, spun about its greatest axis 5 degrees toward the
// least.
func panThrow() (Prop, MassProps, Throw) {
	p := demoProp()
	mp, _ := p.MassProps()
	th := DefaultThrow()
	th.Velocity = VelocityFromHang(1.2, 1, 0, th.Gravity)
	th.Spin = Spin{Axis: Greatest, Tilt: 5 * deg, TiltToward: Least, Rate: 2 * turn}
	return p, mp, th
}

func benchPlan(b *testing.B, end End) {
	p, mp, th := panThrow()
	spec := PlanSpec{Target: Target{Axis: mp.Axes[Greatest], Dir: r3.Vec{Y: 1}}, End: end, Tolerance: 10 * deg,
		RateMin: 0.25 * turn, RateMax: 10 * turn, Thresholds: DefaultThresholds()}
	for b.Loop() {
		if _, err := PlanLanding(context.Background(), &p, &mp, &th, spec); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkPlan_Catch1p2s: 0.25 to 10 turns per second, caught at the
// release height after 1.2 s.
func BenchmarkPlan_Catch1p2s(b *testing.B) { benchPlan(b, End{Catch: true, CatchY: 1.5}) }

// BenchmarkPlan_Ground: the same throw landing on the ground (about 1.37 s).
func BenchmarkPlan_Ground(b *testing.B) { benchPlan(b, End{}) }

// benchSpread times a 1000-sample spread of th (the pan, see panThrow)
// with every release error, caught at the release height.
func benchSpread(b *testing.B, p Prop, mp MassProps, th Throw) {
	tg := Target{Axis: mp.Axes[Greatest], Dir: r3.Vec{Y: 1}}
	spec := SpreadSpec{Samples: 1000, Seed: 1, RateSD: 0.05, TiltSD: 2 * deg, SpeedSD: 0.03, AngleSD: 2 * deg,
		Target: &tg, Tolerance: 10 * deg, End: End{Catch: true, CatchY: 1.5}, Thresholds: DefaultThresholds()}
	for b.Loop() {
		if _, err := SpreadThrows(context.Background(), &p, &mp, &th, spec); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSpread1000: 1000 samples of the 1.2 s pan throw with every
// release error, caught at the release height.
func BenchmarkSpread1000(b *testing.B) {
	p, mp, th := panThrow()
	benchSpread(b, p, mp, th)
}

// BenchmarkSpread1000_Tumble: the same spread of a throw 3 degrees off the
// pan's middle axis (every sample tumbles; the verdict finds each flip).
func BenchmarkSpread1000_Tumble(b *testing.B) {
	p, mp, th := panThrow()
	th.Spin = Spin{Axis: Middle, Tilt: 3 * deg, TiltToward: Least, Rate: 2 * turn}
	benchSpread(b, p, mp, th)
}

// BenchmarkPlan_TumbleGround: a plan of the tumbling pan to the ground.
func BenchmarkPlan_TumbleGround(b *testing.B) {
	p, mp, th := panThrow()
	th.Spin = Spin{Axis: Middle, Tilt: 3 * deg, TiltToward: Least, Rate: 2 * turn}
	spec := PlanSpec{Target: Target{Axis: mp.Axes[Greatest], Dir: r3.Vec{Y: 1}}, Tolerance: 10 * deg,
		RateMin: 0.25 * turn, RateMax: 10 * turn, Thresholds: DefaultThresholds()}
	for b.Loop() {
		if _, err := PlanLanding(context.Background(), &p, &mp, &th, spec); err != nil {
			b.Fatal(err)
		}
	}
}
