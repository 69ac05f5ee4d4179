package physics

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestTake_TurnFromMotion: a frame's turn is the angle turned along the
// integrated motion, so it can exceed half a turn. A steady spin about a
// principal axis turns 360 rate/fps degrees a frame exactly (common
// practice: turns per frame = turns per second / frames per second); 16
// turns/s at 24 fps is 240 degrees, which the end orientations alone read
// as 120 the other way.
func TestTake_TurnFromMotion(t *testing.T) {
	p := demoProp()
	mp := mustMass(t, &p)
	for _, c := range []struct {
		axis Axis
		tps  float64
	}{{Greatest, 16}, {Least, 16}, {Greatest, 7}, {Least, 23.5}, {Greatest, 100}} {
		th := DefaultThrow()
		th.Velocity = r3.Vec{X: 1, Y: 4}
		th.Spin = Spin{Axis: c.axis, Rate: c.tps * 2 * math.Pi}
		take, err := Simulate(&p, &mp, &th)
		if err != nil {
			t.Fatal(err)
		}
		want := 360 * c.tps / 24
		var total float64
		for _, f := range take.Frames[1:] {
			checkRel(t, "turn per frame", f.TurnDeg, want, 1e-9)
			total += f.TurnDeg
		}
		checkRel(t, "total turn", total, want*float64(len(take.Frames)-1), 1e-9)
	}
}

// TestTake_TurnOfWobble: for a free symmetric top |omega| is constant
// (omega_3 and the transverse rate are both constant; REFERENCES.md §2.1),
// so the angle turned along the motion in a frame is |omega|/fps even while
// the axis wobbles, whatever the integration steps.
func TestTake_TurnOfWobble(t *testing.T) {
	// Dinner plate: a thin disc (REFERENCES.md §1.2), wobbling 10 degrees.
	p := Prop{Parts: []Part{{Name: "plate", Shape: Cylinder, Radius: 0.135, Length: 0.004, Mass: 0.5, Orient: IdentityRotation()}}}
	mp := mustMass(t, &p)
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: 4}
	th.Spin = Spin{Axis: Greatest, Tilt: 10 * deg, TiltToward: Least, Rate: 9 * 2 * math.Pi}
	take, err := Simulate(&p, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	want := 9.0 * 360 / 24
	for _, f := range take.Frames[1:] {
		checkRel(t, "wobbling turn per frame", f.TurnDeg, want, 1e-9)
	}
}
