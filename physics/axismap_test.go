package physics

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

func randomUnit(rng *rand.Rand) r3.Vec {
	return r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
}

// TestSpreadDirections_NoGap: 2000 directions leave no empty cap wider
// than 8 degrees (probed at 4000 random directions), are unit vectors,
// and split evenly between any hemisphere's halves (equal area 4 pi / n,
// González 2010).
func TestSpreadDirections_NoGap(t *testing.T) {
	dirs := SpreadDirections(2000)
	if len(dirs) != 2000 {
		t.Fatalf("%d directions", len(dirs))
	}
	for i, d := range dirs {
		if math.Abs(r3.Norm(d)-1) > 1e-14 {
			t.Fatalf("direction %d has length %g", i, r3.Norm(d))
		}
	}
	rng := rand.New(rand.NewPCG(1, 1))
	worst := 0.0
	for range 4000 {
		p := randomUnit(rng)
		best := -1.0
		for _, d := range dirs {
			best = math.Max(best, r3.Dot(p, d))
		}
		worst = math.Max(worst, math.Acos(math.Min(1, best)))
	}
	if worst/deg > 8 {
		t.Errorf("gap of %.2f degrees, want at most 8", worst/deg)
	}
	for range 20 {
		c := randomUnit(rng)
		n := 0
		for _, d := range dirs {
			if r3.Dot(c, d) > 0 {
				n++
			}
		}
		if n < 950 || n > 1050 {
			t.Errorf("hemisphere about %v holds %d of 2000 directions", c, n)
		}
	}
	if len(SpreadDirections(0)) != 1 || len(SpreadDirections(MaxMapSamples+5)) != MaxMapSamples {
		t.Error("SpreadDirections does not clamp n")
	}
}

// mapProps are bodies to map: asymmetric (the handbook brick, turned so
// its principal axes are not the prop axes), oblate and prolate.
func mapProps(t *testing.T) map[string]MassProps {
	brick := Prop{Parts: []Part{box(2, 0.2, 0.1, 0.05)}}
	brick.Parts[0].Orient = EulerXYZ(0.3, -0.5, 0.8)
	disc := Prop{Parts: []Part{{Shape: Cylinder, Radius: 0.135, Length: 0.01, Mass: 0.5, Orient: IdentityRotation()}}}
	pin := Prop{Parts: []Part{{Shape: Cylinder, Radius: 0.03, Length: 0.45, Mass: 1, Orient: EulerXYZ(0, 0.4, 0)}}}
	return map[string]MassProps{"brick": mustMass(t, &brick), "disc": mustMass(t, &disc), "pin": mustMass(t, &pin)}
}

// TestAxisMap_AgreesWithJudge: every mapped direction gets the verdict
// Judge gives a throw spun about it (at any rate), Class agrees with
// Verdict, and the opposite direction has the same class, excursion and
// ratio (Euler's equations are even in omega).
func TestAxisMap_AgreesWithJudge(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 1))
	for name, mp := range mapProps(t) {
		m := NewAxisMapper(&mp, DefaultThresholds())
		am := MapDirections(&mp, DefaultThresholds(), 400)
		counts := map[Motion]int{}
		for i, dv := range am.Directions {
			th := DefaultThrow()
			th.Spin = Spin{Axis: Free, Vector: dv.Axis, Rate: 1 + 20*rng.Float64()}
			v := Judge(&mp, &th, DefaultThresholds())
			if v.Motion != dv.Motion || v.Circles != dv.Circles || v.HasRatio != dv.HasRatio {
				t.Fatalf("%s %d: map %v about %v, Judge %v about %v", name, i, dv.Motion, dv.Circles, v.Motion, v.Circles)
			}
			checkRel(t, name+" excursion", dv.ExcursionDeg, v.ExcursionDeg, 1e-12)
			if v.HasRatio {
				checkRel(t, name+" ratio", dv.WobblesPerTurn, v.WobblesPerTurn, 1e-12)
			}
			mo, c, exc := m.Class(dv.Axis)
			if mo != dv.Motion || c != dv.Circles || math.Abs(exc-dv.ExcursionDeg) > 1e-9 {
				t.Fatalf("%s %d: Class %v %v %g, Verdict %v %v %g", name, i, mo, c, exc, dv.Motion, dv.Circles, dv.ExcursionDeg)
			}
			op := m.Verdict(r3.Scale(-1, dv.Axis))
			if op.Motion != dv.Motion || op.Circles != dv.Circles || math.Abs(op.ExcursionDeg-dv.ExcursionDeg) > 1e-9 ||
				op.HasRatio != dv.HasRatio || math.Abs(op.WobblesPerTurn-dv.WobblesPerTurn) > 1e-9*math.Abs(dv.WobblesPerTurn) {
				t.Fatalf("%s %d: -omega %+v, +omega %+v", name, i, op, dv)
			}
			counts[dv.Motion]++
		}
		t.Logf("%s: %v", name, counts)
		switch name {
		case "brick":
			if counts[Spinning] == 0 || counts[Tumbling] == 0 || counts[Wobbling] != 0 {
				t.Errorf("brick classes %v", counts)
			}
		case "disc", "pin":
			if counts[Wobbling] == 0 || counts[Tumbling] != 0 {
				t.Errorf("%s classes %v", name, counts)
			}
		}
	}
	if v := NewAxisMapper(&MassProps{Moments: [3]float64{1, 2, 3}, Axes: [3]r3.Vec{{X: 1}, {Y: 1}, {Z: 1}}}, DefaultThresholds()).Verdict(r3.Vec{}); v.HasRatio || v.Motion != Spinning {
		t.Errorf("zero direction: %+v", v)
	}
}

// TestAxisMap_Separatrix: directions on the two separatrix planes have
// D = I2 (REFERENCES.md §3.1); just off them, the two sides circle
// different axes. A symmetric prop has none.
func TestAxisMap_Separatrix(t *testing.T) {
	mps := mapProps(t)
	mp := mps["brick"]
	m := NewAxisMapper(&mp, DefaultThresholds())
	normals, ok := m.Separatrix()
	if !ok {
		t.Fatal("no separatrix for the brick")
	}
	rng := rand.New(rand.NewPCG(4, 1))
	for _, n := range normals {
		if math.Abs(r3.Dot(n, mp.Axes[1])) > 1e-12 {
			t.Errorf("separatrix plane does not hold the middle axis")
		}
		for range 50 {
			p := randomUnit(rng)
			on := r3.Unit(r3.Sub(p, r3.Scale(r3.Dot(p, n), n)))
			if math.Abs(r3.Dot(on, mp.Axes[1])) > 0.999 {
				continue
			}
			checkRel(t, "D on the separatrix", m.Verdict(on).D, mp.Moments[1], 1e-9)
			a := m.Verdict(r3.Add(on, r3.Scale(1e-4, n)))
			b := m.Verdict(r3.Sub(on, r3.Scale(1e-4, n)))
			if a.Circles == b.Circles {
				t.Errorf("both sides of the separatrix circle %v", a.Circles)
			}
		}
	}
	disc := mps["disc"]
	if _, ok := NewAxisMapper(&disc, DefaultThresholds()).Separatrix(); ok {
		t.Error("the disc has a separatrix")
	}
}

// BenchmarkMapDirections2000: the map of `propflight map` with the default
// samples, for the demo pan (asymmetric).
func BenchmarkMapDirections2000(b *testing.B) {
	p := demoProp()
	mp := mustMass(b, &p)
	for b.Loop() {
		MapDirections(&mp, DefaultThresholds(), DefaultMapSamples)
	}
}

// BenchmarkAxisMapperClass: one pixel of the drawn map.
func BenchmarkAxisMapperClass(b *testing.B) {
	p := demoProp()
	mp := mustMass(b, &p)
	m := NewAxisMapper(&mp, DefaultThresholds())
	d := r3.Vec{X: 0.3, Y: 0.5, Z: 0.7}
	for b.Loop() {
		m.Class(d)
	}
}
