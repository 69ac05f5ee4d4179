package physics

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// twentyParts is a prop of 20 mixed, offset and turned parts.
func twentyParts() Prop {
	var p Prop
	base := demoProp().Parts
	for i := range 20 {
		pt := base[i%len(base)]
		pt.Position = r3.Add(pt.Position, r3.Vec{X: 0.01 * float64(i), Z: 0.005 * float64(i%3)})
		pt.Orient = EulerXYZ(0.1*float64(i), 0.05*float64(i), 0)
		p.Parts = append(p.Parts, pt)
	}
	return p
}

func BenchmarkMassProps20(b *testing.B) {
	p := twentyParts()
	for b.Loop() {
		if _, err := p.MassProps(); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkTake10s24fps flies a four-part prop for 10 s at 24 fps, 2 turns
// per second about a direction off every principal axis.
func BenchmarkTake10s24fps(b *testing.B) {
	p := demoProp()
	mp, _ := p.MassProps()
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: StandardGravity * 10 / 2}
	th.Position = r3.Vec{Y: 0.5}
	th.Spin = Spin{Axis: Free, Vector: r3.Vec{X: 0.3, Y: 1, Z: 0.2}, Rate: 2 * 2 * math.Pi}
	for b.Loop() {
		take, err := Simulate(&p, &mp, &th)
		if err != nil || take.FlightTime < 10 {
			b.Fatal(err, take.FlightTime)
		}
	}
}

func BenchmarkJudgeTumble(b *testing.B) {
	brick := Prop{Parts: []Part{box(2, 0.2, 0.1, 0.05)}}
	mp, _ := brick.MassProps()
	th := DefaultThrow()
	th.Spin = Spin{Axis: Middle, Tilt: 2 * deg, TiltToward: Least, Rate: 4 * math.Pi}
	for b.Loop() {
		Judge(&mp, &th, DefaultThresholds())
	}
}
