package physics

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// TestLocalInertia_Handbook checks every shape's tensor against the standard
// table of moments of inertia (Wikipedia, "List of moments of inertia" /
// "List of moment of inertia tensors"; the torus from Tatum, Classical
// Mechanics, §2.8; the cone about its centre of mass by the parallel-axis
// theorem from the table's apex value). Expected numbers are the table
// formulas evaluated by hand as printed in REFERENCES.md §1.2.
func TestLocalInertia_Handbook(t *testing.T) {
	id := IdentityRotation()
	tests := []struct {
		name        string
		part        Part
		axial, perp float64 // about part z, about part x (= y for axisymmetric)
		full        *Mat3
	}{
		{name: "box 2kg 0.2x0.1x0.05: m(b^2+c^2)/12 ...", part: box(2, 0.2, 0.1, 0.05),
			full: &Mat3{{0.002083333333, 0, 0}, {0, 0.007083333333, 0}, {0, 0, 0.008333333333}}},
		{name: "solid cylinder m r^2/2, m(3r^2+h^2)/12", part: Part{Shape: Cylinder, Radius: 0.05, Length: 0.3, Mass: 1, Orient: id},
			axial: 0.00125, perp: 0.008125},
		{name: "thick tube m(r1^2+r2^2)/2, m(3(r1^2+r2^2)+h^2)/12", part: Part{Shape: Tube, Radius: 0.05, InnerRadius: 0.04, Length: 0.3, Mass: 1, Orient: id},
			axial: 0.00205, perp: 0.008525},
		{name: "solid sphere 2mr^2/5", part: Part{Shape: Sphere, Radius: 0.11, Mass: 0.45, Orient: id},
			axial: 0.002178, perp: 0.002178},
		{name: "thin shell 2mr^2/3", part: Part{Shape: Shell, Radius: 0.11, Mass: 0.45, Orient: id},
			axial: 0.00363, perp: 0.00363},
		{name: "prolate spheroid m(a^2+b^2)/5", part: Part{Shape: Ellipsoid, SemiAxes: r3.Vec{X: 0.085, Y: 0.085, Z: 0.14}, Mass: 0.42, Orient: id},
			axial: 0.42 * 2 * 0.085 * 0.085 / 5, perp: 0.42 * (0.085*0.085 + 0.14*0.14) / 5},
		{name: "ellipsoid a,b,c", part: Part{Shape: Ellipsoid, SemiAxes: r3.Vec{X: 0.1, Y: 0.2, Z: 0.3}, Mass: 5, Orient: id},
			full: &Mat3{{5 * (0.04 + 0.09) / 5, 0, 0}, {0, 5 * (0.01 + 0.09) / 5, 0}, {0, 0, 5 * (0.01 + 0.04) / 5}}},
		{name: "solid cone 3mr^2/10, about CM 3m(r^2+h^2/4)/20", part: Part{Shape: Cone, Radius: 0.1, Height: 0.3, Mass: 1, Orient: id},
			axial: 0.003, perp: 0.004875},
		{name: "solid torus m(R^2+3a^2/4), m(R^2/2+5a^2/8)", part: Part{Shape: Torus, Radius: 0.2, TubeRadius: 0.05, Mass: 1, Orient: id},
			axial: 0.041875, perp: 0.0215625},
		{name: "thin disc as a short cylinder: mR^2/2, mR^2/4", part: Part{Shape: Cylinder, Radius: 0.135, Length: 1e-9, Mass: 0.2, Orient: id},
			axial: 0.0018225, perp: 0.00091125},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			if err := tc.part.Validate(); err != nil {
				t.Fatal(err)
			}
			got := tc.part.LocalInertia()
			want := Diag(tc.perp, tc.perp, tc.axial)
			if tc.full != nil {
				want = *tc.full
			}
			checkMat(t, "I", got, want, closeTol)
		})
	}
}

// TestLocalInertia_ConeApex checks the cone against the table's value about
// its apex, 3mr^2/20 + 3mh^2/5 (Wikipedia list; mathmos.net table), moving
// our centre-of-mass tensor to the apex, 3h/4 from the centre.
func TestLocalInertia_ConeApex(t *testing.T) {
	c := Part{Shape: Cone, Radius: 0.1, Height: 0.3, Mass: 1, Orient: IdentityRotation()}
	apex := c.LocalInertia().Shifted(1, r3.Vec{Z: 0.75 * 0.3})
	checkRel(t, "I_apex transverse", apex[0][0], 3*0.01/20+3*0.09/5, closeTol)
	checkRel(t, "I_apex transverse (REFERENCES.md 0.0555)", apex[1][1], 0.0555, closeTol)
}

// TestVolume checks the volume formulas (CRC Standard Mathematical Tables,
// "Volumes of solids") through density * volume = mass.
func TestVolume(t *testing.T) {
	id := IdentityRotation()
	tests := []struct {
		part Part
		want float64
	}{
		{Part{Shape: Box, Size: r3.Vec{X: 1, Y: 2, Z: 3}, Density: 1, Orient: id}, 6},
		{Part{Shape: Cylinder, Radius: 1, Length: 2, Density: 1, Orient: id}, 2 * math.Pi},
		{Part{Shape: Tube, Radius: 2, InnerRadius: 1, Length: 1, Density: 1, Orient: id}, 3 * math.Pi},
		{Part{Shape: Sphere, Radius: 1, Density: 1, Orient: id}, 4 * math.Pi / 3},
		{Part{Shape: Ellipsoid, SemiAxes: r3.Vec{X: 1, Y: 2, Z: 3}, Density: 1, Orient: id}, 8 * math.Pi},
		{Part{Shape: Cone, Radius: 1, Height: 3, Density: 1, Orient: id}, math.Pi},
		{Part{Shape: Torus, Radius: 2, TubeRadius: 1, Density: 1, Orient: id}, 4 * math.Pi * math.Pi},
	}
	for _, tc := range tests {
		checkRel(t, tc.part.Shape.String()+" mass from density", tc.part.TotalMass(), tc.want, closeTol)
	}
}

// samplePoints returns points of the shape's boundary in its own frame, for
// the brute-force support oracle.
func samplePoints(p *Part, n int) []r3.Vec {
	var pts []r3.Vec
	if p.Shape == Box {
		h := r3.Scale(0.5, p.Size)
		for _, sx := range []float64{-1, 1} {
			for _, sy := range []float64{-1, 1} {
				for _, sz := range []float64{-1, 1} {
					pts = append(pts, r3.Vec{X: sx * h.X, Y: sy * h.Y, Z: sz * h.Z})
				}
			}
		}
		return pts
	}
	for i := 0; i <= n; i++ {
		v := float64(i) / float64(n) // 0..1
		for j := 0; j < n; j++ {
			u := 2 * math.Pi * float64(j) / float64(n)
			cu, su := math.Cos(u), math.Sin(u)
			th := math.Pi * v // 0..pi
			ct, st := math.Cos(th), math.Sin(th)
			switch p.Shape {
			case Cylinder, Tube:
				pts = append(pts, r3.Vec{X: p.Radius * cu, Y: p.Radius * su, Z: (v - 0.5) * p.Length})
			case Sphere, Shell:
				pts = append(pts, r3.Scale(p.Radius, r3.Vec{X: st * cu, Y: st * su, Z: ct}))
			case Ellipsoid:
				a := p.SemiAxes
				pts = append(pts, r3.Vec{X: a.X * st * cu, Y: a.Y * st * su, Z: a.Z * ct})
			case Cone:
				z := -p.Height/4 + v*p.Height
				r := p.Radius * (1 - v)
				pts = append(pts, r3.Vec{X: r * cu, Y: r * su, Z: z})
			case Torus:
				w := 2 * math.Pi * v
				rr := p.Radius + p.TubeRadius*math.Cos(w)
				pts = append(pts, r3.Vec{X: rr * cu, Y: rr * su, Z: p.TubeRadius * math.Sin(w)})
			}
		}
	}
	return pts
}

// TestLocalSupport_Oracle compares each shape's exact support with the
// maximum over a dense sample of its boundary (a slow, obvious oracle). The
// sample can only fall short, by at most the sampling error.
func TestLocalSupport_Oracle(t *testing.T) {
	id := IdentityRotation()
	parts := []Part{
		box(1, 0.3, 0.2, 0.1),
		{Shape: Cylinder, Radius: 0.1, Length: 0.4, Mass: 1, Orient: id},
		{Shape: Tube, Radius: 0.1, InnerRadius: 0.05, Length: 0.2, Mass: 1, Orient: id},
		{Shape: Sphere, Radius: 0.15, Mass: 1, Orient: id},
		{Shape: Shell, Radius: 0.15, Mass: 1, Orient: id},
		{Shape: Ellipsoid, SemiAxes: r3.Vec{X: 0.1, Y: 0.2, Z: 0.3}, Mass: 1, Orient: id},
		{Shape: Cone, Radius: 0.1, Height: 0.3, Mass: 1, Orient: id},
		{Shape: Torus, Radius: 0.2, TubeRadius: 0.05, Mass: 1, Orient: id},
	}
	rng := rand.New(rand.NewPCG(1, 1))
	for _, p := range parts {
		pts := samplePoints(&p, 400)
		for range 50 {
			u := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
			best := math.Inf(-1)
			for _, q := range pts {
				best = math.Max(best, r3.Dot(q, u))
			}
			got := p.LocalSupport(u)
			if got < best-1e-12 || got > best+2e-4 {
				t.Errorf("%v support along %v = %.9g, sampled max %.9g", p.Shape, u, got, best)
			}
		}
	}
}

func TestPartValidate_Errors(t *testing.T) {
	id := IdentityRotation()
	tests := []struct {
		part  Part
		field string
	}{
		{box(1, 0, 1, 1), "size"},
		{box(-1, 1, 1, 1), "mass"},
		{Part{Shape: Box, Size: r3.Vec{X: 1, Y: 1, Z: 1}, Orient: id}, "mass"},
		{Part{Shape: Box, Size: r3.Vec{X: 1, Y: 1, Z: 1}, Mass: 1, Density: 2, Orient: id}, "mass"},
		{Part{Shape: Box, Size: r3.Vec{X: 1, Y: 1, Z: 1}, Density: math.NaN(), Orient: id}, "density"},
		{Part{Shape: Tube, Radius: 1, InnerRadius: 1, Length: 1, Mass: 1, Orient: id}, "inner_radius"},
		{Part{Shape: Torus, Radius: 1, TubeRadius: 2, Mass: 1, Orient: id}, "tube_radius"},
		{Part{Shape: Cone, Radius: 1, Height: math.Inf(1), Mass: 1, Orient: id}, "height"},
		{Part{Shape: Shell, Radius: 1, Density: 1000, Orient: id}, "density"},
		{Part{Shape: Sphere, Radius: 1, Mass: 1, Position: r3.Vec{X: math.NaN()}, Orient: id}, "position"},
	}
	for _, tc := range tests {
		err := tc.part.Validate()
		fe, ok := err.(*FieldError)
		if !ok || fe.Field != tc.field {
			t.Errorf("%v: got %v, want an error on %q", tc.part.Shape, err, tc.field)
		}
	}
}

// TestReach_BoundsSupport: no direction's support exceeds Reach, and the
// sampled boundary comes within the sampling error of it.
func TestReach_BoundsSupport(t *testing.T) {
	id := IdentityRotation()
	parts := []Part{
		box(1, 0.3, 0.2, 0.1),
		{Shape: Cylinder, Radius: 0.1, Length: 0.4, Mass: 1, Orient: id},
		{Shape: Tube, Radius: 0.1, InnerRadius: 0.05, Length: 0.2, Mass: 1, Orient: id},
		{Shape: Sphere, Radius: 0.15, Mass: 1, Orient: id},
		{Shape: Ellipsoid, SemiAxes: r3.Vec{X: 0.1, Y: 0.2, Z: 0.3}, Mass: 1, Orient: id},
		{Shape: Cone, Radius: 0.1, Height: 0.3, Mass: 1, Orient: id},
		{Shape: Cone, Radius: 0.3, Height: 0.1, Mass: 1, Orient: id},
		{Shape: Torus, Radius: 0.2, TubeRadius: 0.05, Mass: 1, Orient: id},
	}
	for _, p := range parts {
		far := 0.0
		for _, q := range samplePoints(&p, 200) {
			far = math.Max(far, r3.Norm(q))
		}
		if r := p.Reach(); far > r+1e-12 || far < r-1e-3 {
			t.Errorf("%v: Reach %g, farthest sampled point %g", p.Shape, r, far)
		}
	}
}
