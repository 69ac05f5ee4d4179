package physics

import (
	"context"
	"math"
	"reflect"
	"runtime"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestSpread_RateOnly_ClosedForm: about a solution r of a steady spin, a
// rate drawn with relative sd sigma lands off by 360 r t sigma |z| degrees,
// z ~ N(0,1), so the fraction within T is erf(T / (360 r t sigma sqrt 2))
// and the median error 0.67449 x 360 r t sigma (REFERENCES.md §11; the
// standard normal quartile 0.6744897502, Abramowitz & Stegun table 26.5).
// Monte Carlo error of a fraction p from N samples: sqrt(p (1 - p) / N);
// the checks allow 4 of them (a false alarm about once in 16000 seeds, and
// the seed is fixed).
func TestSpread_RateOnly_ClosedForm(t *testing.T) {
	const hang, n, sigma, N = 1.2, 3, 0.02, 4000
	p, mp, th := brickThrow(hang)
	r := n / hang // turns per second, a solution (TestPlan_PrincipalSpin_ClosedForm)
	th.Spin.Rate = r * turn
	tg := Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{X: 1}}
	tolD := 10.0
	spec := SpreadSpec{Samples: N, Seed: 7, RateSD: sigma, Target: &tg, Tolerance: tolD * deg,
		End: End{Catch: true, CatchY: th.Position.Y}, Thresholds: DefaultThresholds()}
	sp, err := SpreadThrows(context.Background(), &p, &mp, &th, spec)
	if err != nil {
		t.Fatal(err)
	}
	s := 360 * r * hang * sigma // degrees per unit z
	pWant := math.Erf(tolD / (s * math.Sqrt2))
	mc := math.Sqrt(pWant * (1 - pWant) / N)
	if math.Abs(sp.WithinTolerance-pWant) > 4*mc {
		t.Errorf("within tolerance %.4f, want erf: %.4f +- %.4f (4 MC errors)", sp.WithinTolerance, pWant, 4*mc)
	}
	// The median: half the samples below 0.67449 s, within sqrt(0.25 / N).
	med := 0.6744897502 * s
	below := 0
	for _, pt := range sp.Points {
		if pt.Error/deg <= med {
			below++
		}
	}
	if f := float64(below) / N; math.Abs(f-0.5) > 4*math.Sqrt(0.25/N) {
		t.Errorf("fraction under the closed-form median %.4f, want 0.5 +- %.4f", f, 4*math.Sqrt(0.25/N))
	}
	// The sample median itself: sd 1 / (2 f(m) sqrt N) with f the
	// half-normal density at its median, 2 phi(0.67449) / s (asymptotic
	// variance of a sample quantile, p (1 - p) / (N f^2); Serfling,
	// Approximation Theorems of Mathematical Statistics, 1980, §2.3.3).
	fm := 2 * math.Exp(-0.6744897502*0.6744897502/2) / math.Sqrt(2*math.Pi) / s
	if sdm := 1 / (2 * fm * math.Sqrt(N)); math.Abs(sp.ErrorP50/deg-med) > 4*sdm {
		t.Errorf("median error %.3f deg, want %.3f +- %.3f", sp.ErrorP50/deg, med, 4*sdm)
	}
	if sp.TumbleFraction != 0 || sp.FlightTimeSD != 0 || sp.LandingSD != [2]float64{} || sp.Short != 0 {
		t.Errorf("rate errors alone change nothing but the turn: %+v", sp)
	}
}

// TestSpread_Stability: a stable spin sampled with no error never tumbles
// (and every sample is the nominal throw); a throw 2 degrees off the middle
// axis always tumbles under small errors; a small tilt sd about the least
// axis stays a spin (Landau & Lifshitz, Mechanics §37: rotation about the
// least and greatest axes is stable, about the middle one unstable).
func TestSpread_Stability(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	base := SpreadSpec{Samples: 200, Seed: 3, Thresholds: DefaultThresholds()}
	sp, err := SpreadThrows(context.Background(), &p, &mp, &th, base)
	if err != nil {
		t.Fatal(err)
	}
	if sp.TumbleFraction != 0 || sp.LandingSD != [2]float64{} || sp.FlightTimeSD != 0 {
		t.Errorf("no error: %+v", sp)
	}
	mid := th
	mid.Spin = Spin{Axis: Middle, Tilt: 2 * deg, TiltToward: Least, Rate: 3 * turn}
	noisy := base
	noisy.RateSD, noisy.TiltSD, noisy.SpeedSD, noisy.AngleSD = 0.05, 1*deg, 0.03, 2*deg
	if sp, err := SpreadThrows(context.Background(), &p, &mp, &mid, noisy); err != nil || sp.TumbleFraction != 1 {
		t.Errorf("middle axis: tumble fraction %v (%v)", sp.TumbleFraction, err)
	}
	least := th
	least.Spin = Spin{Axis: Least, Rate: 3 * turn}
	tilt := base
	tilt.TiltSD = 3 * deg
	if sp, err := SpreadThrows(context.Background(), &p, &mp, &least, tilt); err != nil || sp.TumbleFraction != 0 {
		t.Errorf("least axis, 3 degree tilt sd: tumble fraction %v (%v)", sp.TumbleFraction, err)
	}
}

// TestSpread_SameSeed: the same seed gives the same samples whatever the
// number of workers; another seed gives others.
func TestSpread_SameSeed(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	tg := Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{Y: 1}}
	spec := SpreadSpec{Samples: 64, Seed: 11, RateSD: 0.05, TiltSD: 2 * deg, SpeedSD: 0.03, AngleSD: 2 * deg,
		Target: &tg, Tolerance: 15 * deg, Thresholds: DefaultThresholds()}
	run := func(procs int, seed uint64) *Spread {
		old := runtime.GOMAXPROCS(procs)
		defer runtime.GOMAXPROCS(old)
		s := spec
		s.Seed = seed
		sp, err := SpreadThrows(context.Background(), &p, &mp, &th, s)
		if err != nil {
			t.Fatal(err)
		}
		return sp
	}
	a, b, c := run(1, 11), run(3, 11), run(2, 12)
	if !reflect.DeepEqual(a, b) {
		t.Error("GOMAXPROCS 1 and 3 disagree")
	}
	if reflect.DeepEqual(a.Points, c.Points) {
		t.Error("seeds 11 and 12 agree")
	}
}

// TestSampleThrow_Draws: a zero sd leaves its quantity exactly; the tilt
// is |N(0, sd)|, whose mean is sd sqrt(2/pi) (half-normal mean); the speed
// keeps the throw's heading; the release angle turns in the vertical plane.
func TestSampleThrow_Draws(t *testing.T) {
	_, mp, th := brickThrow(1.2)
	th.Velocity = r3.Vec{X: 2, Y: 5, Z: -1}
	zero := SpreadSpec{Seed: 1}
	if s := SampleThrow(&mp, &th, &zero, 5); !reflect.DeepEqual(s, th) {
		t.Errorf("zero sd changed the throw: %+v", s)
	}
	spec := SpreadSpec{Seed: 1, TiltSD: 3 * deg, SpeedSD: 0.1, AngleSD: 5 * deg}
	const N = 20000
	var sum float64
	n0 := th.SpinAxis(&mp)
	for i := range N {
		s := SampleThrow(&mp, &th, &spec, i)
		sum += math.Acos(math.Min(1, r3.Dot(r3.Unit(s.SpinAxis(&mp)), n0)))
		if h := r3.Cross(r3.Vec{X: s.Velocity.X, Z: s.Velocity.Z}, r3.Vec{X: 2, Z: -1}); r3.Norm(h) > 1e-12 {
			t.Fatalf("sample %d left the vertical plane of the throw: %v", i, s.Velocity)
		}
	}
	mean := sum / N
	want := 3 * deg * math.Sqrt(2/math.Pi)
	// sd of |z| is sqrt(1 - 2/pi); 4 standard errors.
	if se := 3 * deg * math.Sqrt(1-2/math.Pi) / math.Sqrt(N); math.Abs(mean-want) > 4*se {
		t.Errorf("mean tilt %.5f deg, want %.5f", mean/deg, want/deg)
	}
}

// TestSpread_BadInput: each bad number is refused naming its flag.
func TestSpread_BadInput(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	for _, c := range []struct {
		field string
		edit  func(*SpreadSpec)
	}{
		{"samples", func(s *SpreadSpec) { s.Samples = 0 }},
		{"samples", func(s *SpreadSpec) { s.Samples = 1e9 }},
		{"rate-sd", func(s *SpreadSpec) { s.RateSD = -0.01 }},
		{"tilt-sd", func(s *SpreadSpec) { s.TiltSD = -1 }},
		{"speed-sd", func(s *SpreadSpec) { s.SpeedSD = math.NaN() }},
		{"angle-sd", func(s *SpreadSpec) { s.AngleSD = -1 }},
		{"tolerance-deg", func(s *SpreadSpec) { s.Target = &Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{Y: 1}} }},
		{"land", func(s *SpreadSpec) { s.Target, s.Tolerance = &Target{Dir: r3.Vec{Y: 1}}, 0.1 }},
		{"catch-height", func(s *SpreadSpec) { s.End = End{Catch: true, CatchY: 40} }},
	} {
		s := SpreadSpec{Samples: 10}
		c.edit(&s)
		_, err := SpreadThrows(context.Background(), &p, &mp, &th, s)
		if fe, ok := err.(*FieldError); !ok || fe.Field != c.field {
			t.Errorf("want a %s error, got %v", c.field, err)
		}
	}
}

// TestSpread_ShortOfCatch: a sample whose arc tops out below the catch
// counts as a miss and stays out of the landing figures.
func TestSpread_ShortOfCatch(t *testing.T) {
	p, mp, th := brickThrow(1.2)
	top := th.Position.Y + th.Velocity.Y*th.Velocity.Y/(2*th.Gravity)
	tg := Target{Axis: r3.Vec{X: 1}, Dir: r3.Vec{X: 1}}
	spec := SpreadSpec{Samples: 100, Seed: 2, SpeedSD: 0.05, Target: &tg, Tolerance: math.Pi,
		End: End{Catch: true, CatchY: top - 0.01}}
	sp, err := SpreadThrows(context.Background(), &p, &mp, &th, spec)
	if err != nil {
		t.Fatal(err)
	}
	if sp.Short == 0 || sp.Short == 100 || sp.WithinTolerance != float64(100-sp.Short)/100 {
		t.Errorf("short %d, within %v", sp.Short, sp.WithinTolerance)
	}
}
