package widgets

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/wire"
)

// fryingPan is demo data from our slapstick kitchen scene (invented, never
// a check value): a pan body and a flat handle along +x.
func fryingPan() *physics.Prop {
	return &physics.Prop{Parts: []physics.Part{
		{Name: "pan", Shape: physics.Cylinder, Radius: 0.13, Length: 0.035, Mass: 0.85, Orient: physics.Identity()},
		{Name: "handle", Shape: physics.Box, Size: r3.Vec{X: 0.2, Y: 0.03, Z: 0.018}, Mass: 0.22,
			Position: r3.Vec{X: 0.23, Z: 0.01}, Orient: physics.Identity()},
	}}
}

// panThrow returns a throw of the pan from x = -1.6 m, 1.4 m up, that comes
// back to release height after hang seconds, distance metres down +x,
// spun near its middle axis at turns turns per second, at 24 fps.
func panThrow(mp *physics.MassProps, hang, distance, turns float64) physics.Throw {
	th := physics.DefaultThrow()
	th.Position = r3.Vec{X: -1.6, Y: 1.4, Z: 0.3}
	th.Velocity = physics.VelocityFromHang(hang, distance, 0.15, th.Gravity)
	th.Orient = physics.EulerXYZ(-math.Pi/2.5, 0.3, 0)
	th.Spin = physics.Spin{Axis: physics.Middle, Tilt: 4 * math.Pi / 180, TiltToward: physics.Greatest, Rate: 2 * math.Pi * turns}
	return th
}

// panScene simulates the pan's throw and returns the scene with onion
// skins of three frames each side, arc, ticks, axes and grid.
func panScene(tb testing.TB, hang, distance, turns float64) wire.Scene {
	tb.Helper()
	p := fryingPan()
	mp, err := p.MassProps()
	if err != nil {
		tb.Fatal(err)
	}
	th := panThrow(&mp, hang, distance, turns)
	tk, err := physics.Simulate(p, &mp, &th)
	if err != nil {
		tb.Fatal(err)
	}
	return wire.Scene{Prop: p, Mass: &mp, Take: tk, OnionBefore: 3, OnionAfter: 3,
		ShowArc: true, ShowTicks: true, ShowAxes: true, ShowGrid: true, GroundY: th.GroundY}
}

// threeSecondHang is the hang time (s) that gives panScene a flight of
// about three seconds (72 frames at 24 fps; the extra fall from release
// height to the ground adds a little).
const threeSecondHang = 2.91
