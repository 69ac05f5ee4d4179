package physics

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics/mesh"
)

// boxMesh returns the 12-triangle box of full edges s centred at c, in the
// mesh's (file's) own frame.
func boxMesh(t testing.TB, s, c r3.Vec) *mesh.Mesh {
	t.Helper()
	p := func(i, j, k float64) r3.Vec {
		return r3.Vec{X: c.X + (i-0.5)*s.X, Y: c.Y + (j-0.5)*s.Y, Z: c.Z + (k-0.5)*s.Z}
	}
	q := func(a, b, c, d r3.Vec) [][3]r3.Vec { return [][3]r3.Vec{{a, b, c}, {a, c, d}} }
	var tris [][3]r3.Vec
	for _, f := range [][][3]r3.Vec{
		q(p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0)),
		q(p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1)),
		q(p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1)),
		q(p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0)),
		q(p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0)),
		q(p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1)),
	} {
		tris = append(tris, f...)
	}
	m, _, err := mesh.New(tris)
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// TestMeshPart_EqualsBox: a box mesh whose file puts it off the origin,
// placed by Position and Orient (which move the file's origin), has the box
// formula's mass properties (REFERENCES.md §1.1, §9) with the centre at
// Position + Orient(file centre), and the box's exact support.
func TestMeshPart_EqualsBox(t *testing.T) {
	size := r3.Vec{X: 0.3, Y: 0.08, Z: 0.05}
	rng := rand.New(rand.NewPCG(1, 1))
	for range 10 {
		fileCentre := r3.Vec{X: rng.Float64() - 0.5, Y: rng.Float64(), Z: -2 * rng.Float64()}
		q := AxisAngle(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()}, rng.Float64()*6)
		pos := r3.Vec{X: rng.Float64(), Y: rng.Float64(), Z: rng.Float64()}
		mp := Part{Shape: MeshShape, Mesh: boxMesh(t, size, fileCentre), Density: 700, Position: pos, Orient: q}
		bp := Part{Shape: Box, Size: size, Density: 700, Position: r3.Add(pos, q.Rotate(fileCentre)), Orient: q}
		// A second, plain part so the parallel-axis shift matters.
		other := Part{Shape: Sphere, Radius: 0.05, Mass: 0.4, Position: r3.Vec{X: 0.5}, Orient: IdentityRotation()}
		got := mustMass(t, &Prop{Parts: []Part{mp, other}})
		want := mustMass(t, &Prop{Parts: []Part{bp, other}})
		checkRel(t, "mass", got.Mass, want.Mass, 1e-12)
		if !vecClose(got.CM, want.CM, 1e-12) {
			t.Errorf("centre %v, want %v", got.CM, want.CM)
		}
		checkMat(t, "inertia", got.Inertia, want.Inertia, 1e-12)
		if !vecClose(mp.Center(), bp.Position, 1e-12) {
			t.Errorf("Center %v, want %v", mp.Center(), bp.Position)
		}
		for range 20 {
			u := r3.Unit(r3.Vec{X: rng.NormFloat64(), Y: rng.NormFloat64(), Z: rng.NormFloat64()})
			checkRel(t, "support", mp.LocalSupport(u), bp.LocalSupport(u), 1e-12)
		}
		checkRel(t, "reach", mp.Reach(), bp.Reach(), 1e-12)
	}
}

// TestMeshPart_ThinWall: a thin-walled cube of side a, density rho and wall
// t weighs rho 6a² t and has (5/18) m a² about its centre (REFERENCES.md §9).
func TestMeshPart_ThinWall(t *testing.T) {
	const a, rho, wall = 0.2, 2700, 0.001
	p := Part{Shape: MeshShape, Mesh: boxMesh(t, r3.Vec{X: a, Y: a, Z: a}, r3.Vec{Z: 1}), Density: rho, Wall: wall, Orient: IdentityRotation()}
	mp := mustMass(t, &Prop{Parts: []Part{p}})
	m := rho * 6 * a * a * wall
	checkRel(t, "mass", mp.Mass, m, 1e-12)
	for i := range 3 {
		checkRel(t, "moment", mp.Moments[i], 5.0/18*m*a*a, 1e-12)
	}
	if !vecClose(mp.CM, r3.Vec{Z: 1}, 1e-12) {
		t.Errorf("centre %v", mp.CM)
	}
}

// TestMeshPart_TakeMatchesBox: the landing (exact support of each part) of
// a box mesh equals the box primitive's.
func TestMeshPart_TakeMatchesBox(t *testing.T) {
	size := r3.Vec{X: 0.4, Y: 0.1, Z: 0.06}
	q := AxisAngle(r3.Vec{X: 1, Y: 2, Z: 3}, 0.7)
	mp := Prop{Parts: []Part{{Shape: MeshShape, Mesh: boxMesh(t, size, r3.Vec{X: 0.1}), Mass: 1.2, Orient: q}}}
	bp := Prop{Parts: []Part{{Shape: Box, Size: size, Mass: 1.2, Position: q.Rotate(r3.Vec{X: 0.1}), Orient: q}}}
	th := DefaultThrow()
	th.Velocity = r3.Vec{X: 2, Y: 4}
	th.Spin.Rate = 9
	var times [2]float64
	for i, p := range []*Prop{&mp, &bp} {
		m := mustMass(t, p)
		take, err := Simulate(p, &m, &th)
		if err != nil {
			t.Fatal(err)
		}
		times[i] = take.FlightTime
	}
	if math.Abs(times[0]-times[1]) > 1e-9 {
		t.Errorf("mesh lands at %.12g s, box at %.12g s", times[0], times[1])
	}
}

func TestMeshPart_Validate(t *testing.T) {
	m := boxMesh(t, r3.Vec{X: 1, Y: 1, Z: 1}, r3.Vec{})
	for _, c := range []struct {
		part  Part
		field string
	}{
		{Part{Shape: MeshShape, Mass: 1, Orient: IdentityRotation()}, "file"},
		{Part{Shape: MeshShape, Mesh: m, Mass: 1, Wall: -0.001, Orient: IdentityRotation()}, "wall_m"},
		{Part{Shape: MeshShape, Mesh: m, Mass: 1, Wall: math.NaN(), Orient: IdentityRotation()}, "wall_m"},
		// A wall of 5 m on a 1 m cube: area times wall (30 m^3) is far more
		// than the solid's 1 m^3; the most is volume / area = 1/6 m.
		{Part{Shape: MeshShape, Mesh: m, Mass: 1, Wall: 5, Orient: IdentityRotation()}, "wall_m"},
		{Part{Shape: MeshShape, Mesh: m, Density: 1000, Wall: 0.17, Orient: IdentityRotation()}, "wall_m"},
		{Part{Shape: MeshShape, Mesh: m, Orient: IdentityRotation()}, "mass"},
	} {
		fe, ok := c.part.Validate().(*FieldError)
		if !ok || fe.Field != c.field {
			t.Errorf("got %v, want an error on %q", c.part.Validate(), c.field)
		}
	}
	if err := (&Part{Shape: MeshShape, Mesh: m, Density: 1000, Wall: 0.002, Orient: IdentityRotation()}).Validate(); err != nil {
		t.Errorf("thin wall with density: %v", err)
	}
	if err := (&Part{Shape: MeshShape, Mesh: m, Density: 1000, Wall: 0.16, Orient: IdentityRotation()}).Validate(); err != nil {
		t.Errorf("wall just under volume / area: %v", err)
	}
}

// TestMeshShape_Name: the mesh shape is named "mesh" and numbered after the
// eight primitives, which keep their numbers.
func TestMeshShape_Name(t *testing.T) {
	if s, ok := ParseShape("mesh"); !ok || s != MeshShape || s.String() != "mesh" || MeshShape != Torus+1 {
		t.Errorf("ParseShape(mesh) = %v, %v", s, ok)
	}
	for _, n := range ShapeNames() {
		if n == "mesh" {
			t.Error("ShapeNames lists mesh, which needs a file")
		}
	}
}
