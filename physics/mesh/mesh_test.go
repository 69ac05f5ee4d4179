package mesh

import (
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// exactTol is the relative tolerance for results that are exact up to
// round-off (REFERENCES.md §9: the method has no quadrature error).
const exactTol = 1e-12

func mustNew(t testing.TB, tris [][3]r3.Vec) (*Mesh, []string) {
	t.Helper()
	m, notes, err := New(tris)
	if err != nil {
		t.Fatal(err)
	}
	return m, notes
}

func checkRel(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if math.Abs(got-want) > tol*math.Abs(want) {
		t.Errorf("%s = %.15g, want %.15g (rel err %.3g, tol %g)", what, got, want, math.Abs(got-want)/math.Abs(want), tol)
	}
}

// checkTensor compares tensors relative to the largest entry of want.
func checkTensor(t *testing.T, what string, got, want [3][3]float64, tol float64) {
	t.Helper()
	scale := 0.0
	for i := range 3 {
		for j := range 3 {
			scale = math.Max(scale, math.Abs(want[i][j]))
		}
	}
	for i := range 3 {
		for j := range 3 {
			if math.Abs(got[i][j]-want[i][j]) > tol*scale {
				t.Errorf("%s[%d][%d] = %.15g, want %.15g", what, i, j, got[i][j], want[i][j])
			}
		}
	}
}

func diag(a, b, c float64) [3][3]float64 { return [3][3]float64{{a, 0, 0}, {0, b, 0}, {0, 0, c}} }

// TestSolid_CanonicalTetrahedron: (0,0,0), (1,0,0), (0,1,0), (0,0,1), unit
// density: V = 1/6, centre (1/4,1/4,1/4), inertia about the origin
// (1/120)[[4,-1,-1],[-1,4,-1],[-1,-1,4]] (REFERENCES.md §9, Blow & Binstock
// 2004; Tonon 2005).
func TestSolid_CanonicalTetrahedron(t *testing.T) {
	o, x, y, z := v(0, 0, 0), v(1, 0, 0), v(0, 1, 0), v(0, 0, 1)
	m, notes := mustNew(t, [][3]r3.Vec{{o, y, x}, {o, x, z}, {o, z, y}, {x, y, z}})
	if len(notes) != 0 {
		t.Errorf("notes %q, want none", notes)
	}
	s := m.Solid()
	checkRel(t, "volume", s.Measure, 1.0/6, exactTol)
	for _, c := range []float64{s.Center.X, s.Center.Y, s.Center.Z} {
		checkRel(t, "centre", c, 0.25, exactTol)
	}
	// Move the tensor back to the origin: I_o = I_cm + V (|c|^2 E - c c^T).
	c := s.Center
	var io [3][3]float64
	cc := [3]float64{c.X, c.Y, c.Z}
	for i := range 3 {
		for j := range 3 {
			io[i][j] = s.Inertia[i][j] - s.Measure*cc[i]*cc[j]
			if i == j {
				io[i][j] += s.Measure * r3.Dot(c, c)
			}
		}
	}
	want := [3][3]float64{{4, -1, -1}, {-1, 4, -1}, {-1, -1, 4}}
	for i := range 3 {
		for j := range 3 {
			want[i][j] /= 120
		}
	}
	checkTensor(t, "inertia about origin", io, want, exactTol)
	checkRel(t, "Ixx", io[0][0], 1.0/30, exactTol)
}

// TestSolid_BoxAnyPose: a 12-triangle box equals the box formula
// m(b²+c²)/12 ... of REFERENCES.md §1.1 to round-off, moved anywhere and
// turned any way, wound either way.
func TestSolid_BoxAnyPose(t *testing.T) {
	const a, b, c = 0.3, 0.12, 0.05
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := range 20 {
		axis := v(rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64())
		r := rotation(axis, rng.Float64()*2*math.Pi)
		d := v(rng.Float64()*20-10, rng.Float64()*20-10, rng.Float64()*20-10)
		if trial == 0 {
			r, d = diag(1, 1, 1), r3.Vec{}
		}
		want := rotTensor(r, diag((b*b+c*c)/12, (a*a+c*c)/12, (a*a+b*b)/12))
		vol := a * b * c
		for _, inward := range []bool{false, true} {
			tris := transform(boxTris(a, b, c), r, d)
			if inward {
				tris = reversed(tris)
			}
			m, notes := mustNew(t, tris)
			if inward != (len(notes) == 1 && strings.Contains(notes[0], "inward")) {
				t.Errorf("inward %v: notes %q", inward, notes)
			}
			s := m.Solid()
			checkRel(t, "volume", s.Measure, vol, exactTol)
			if r3.Norm(r3.Sub(s.Center, d)) > exactTol*(1+r3.Norm(d)) {
				t.Errorf("centre %v, want %v", s.Center, d)
			}
			var perMass [3][3]float64
			for i := range 3 {
				for j := range 3 {
					perMass[i][j] = s.Inertia[i][j] / s.Measure
				}
			}
			checkTensor(t, "inertia/mass", perMass, want, exactTol)
		}
	}
}

// TestSolid_Prism: the regular n-gon prism of circumradius r, length h:
// area (n/2) r² sin(2π/n) (REFERENCES.md §9) and, for any centroidal axis in
// its plane, the polygon's second moment of area A(6R²-a²)/24 with side a
// (Roark's Formulas for Stress and Strain, Table A.1, regular polygon; from
// memory), so I_z/m = (6R²-a²)/12 and I_x/m = (6R²-a²)/24 + h²/12.
func TestSolid_Prism(t *testing.T) {
	const r, h = 0.04, 0.25
	for _, n := range []int{3, 5, 6, 17} {
		m, _ := mustNew(t, prismTris(n, r, h))
		s := m.Solid()
		th := 2 * math.Pi / float64(n)
		area := float64(n) / 2 * r * r * math.Sin(th)
		side := 2 * r * math.Sin(th/2)
		checkRel(t, "volume", s.Measure, area*h, exactTol)
		k := 6*r*r - side*side
		checkRel(t, "Iz/m", s.Inertia[2][2]/s.Measure, k/12, exactTol)
		checkRel(t, "Ix/m", s.Inertia[0][0]/s.Measure, k/24+h*h/12, exactTol)
		checkRel(t, "Iy/m", s.Inertia[1][1]/s.Measure, k/24+h*h/12, exactTol)
	}
}

// TestSolid_CylinderConverges: an inscribed n-gon prism approaches the solid
// cylinder of REFERENCES.md §1.1 (I_z = m r²/2 for density 1: ρπr²h r²/2)
// from below, its error falling as O(1/n²): doubling n quarters it.
func TestSolid_CylinderConverges(t *testing.T) {
	const r, h = 0.05, 0.3
	want := math.Pi * r * r * h * r * r / 2
	var errs []float64
	for _, n := range []int{16, 32, 64, 128} {
		m, _ := mustNew(t, prismTris(n, r, h))
		got := m.Solid().Inertia[2][2]
		if got >= want {
			t.Errorf("n=%d: Iz %.9g not below the cylinder's %.9g", n, got, want)
		}
		errs = append(errs, (want-got)/want)
	}
	// The ratio tends to 4 from below (the next term is O(1/n^4)).
	for i := 1; i < len(errs); i++ {
		ratio := errs[i-1] / errs[i]
		if ratio < 3.9 || ratio > 4 || (i == len(errs)-1 && ratio < 3.99) {
			t.Errorf("error ratio on doubling n = %.4f, want 4 (O(1/n^2)); errors %v", ratio, errs)
		}
	}
}

// TestSurface_ThinCube: a closed thin-walled cube of side a and mass m has
// (5/18) m a² about every axis through its centre (REFERENCES.md §9).
func TestSurface_ThinCube(t *testing.T) {
	const a = 0.2
	rng := rand.New(rand.NewPCG(1, 1))
	r := rotation(v(rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64()), 1.1)
	m, _ := mustNew(t, transform(boxTris(a, a, a), r, v(3, -2, 5)))
	s := m.Surface()
	checkRel(t, "area", s.Measure, 6*a*a, exactTol)
	want := 5.0 / 18 * a * a
	checkTensor(t, "inertia/mass", scale(s.Inertia, 1/s.Measure), diag(want, want, want), exactTol)
}

// TestSurface_SphereConverges: a fine sphere's surface moments approach the
// thin shell's (2/3) m r² (REFERENCES.md §1.1), the error falling as O(1/n²).
func TestSurface_SphereConverges(t *testing.T) {
	const r = 0.11
	want := 2.0 / 3 * r * r
	var errs []float64
	for _, n := range []int{16, 32, 64} {
		m, _ := mustNew(t, sphereTris(n, r))
		s := m.Surface()
		e := math.Abs(s.Inertia[0][0]/s.Measure-want) / want
		errs = append(errs, e)
		checkRel(t, "Iz/m", s.Inertia[2][2]/s.Measure, want, 4/float64(n*n))
	}
	if errs[2] > 1e-3 {
		t.Errorf("n=64 relative error %.3g, want under 1e-3", errs[2])
	}
	for i := 1; i < len(errs); i++ {
		if ratio := errs[i-1] / errs[i]; ratio < 3.5 || ratio > 4.5 {
			t.Errorf("error ratio %.3f on doubling n, want about 4; errors %v", ratio, errs)
		}
	}
}

func scale(a [3][3]float64, k float64) [3][3]float64 {
	for i := range 3 {
		for j := range 3 {
			a[i][j] *= k
		}
	}
	return a
}

// TestNew_TwoShells: two separate boxes add up; a box with a box-shaped
// cavity (inner shell wound inward) subtracts.
func TestNew_TwoShells(t *testing.T) {
	two := append(boxTris(1, 1, 1), transform(boxTris(1, 2, 3), diag(1, 1, 1), v(5, 0, 0))...)
	m, notes := mustNew(t, two)
	checkRel(t, "volume", m.Solid().Measure, 7, exactTol)
	checkRel(t, "centre x", m.Solid().Center.X, 6*5.0/7, exactTol)
	if len(notes) != 1 || !strings.Contains(notes[0], "2 closed shells") {
		t.Errorf("notes %q", notes)
	}
	hollow := append(boxTris(2, 2, 2), reversed(boxTris(1, 1, 1))...)
	m, _ = mustNew(t, hollow)
	checkRel(t, "hollow volume", m.Solid().Measure, 7, exactTol)
	// I_x per density: (8·8 - 1·2)/12 for cubes of side 2 and 1: m a²/6.
	checkRel(t, "hollow Ixx", m.Solid().Inertia[0][0], (8*4.0/6 - 1.0/6), exactTol)
}

// TestNew_Bad: each broken mesh is refused in plain words.
func TestNew_Bad(t *testing.T) {
	b := boxTris(1, 1, 1)
	flipped := append([][3]r3.Vec(nil), b...)
	flipped[3] = [3]r3.Vec{b[3][0], b[3][2], b[3][1]}
	nan := append([][3]r3.Vec(nil), b...)
	nan[5][1].Y = math.NaN()
	inf := append([][3]r3.Vec(nil), b...)
	inf[0][0].Z = math.Inf(-1)
	// A third face on the edge (0,0,0)-(1,0,0)... of a box: a fin.
	fin := append(append([][3]r3.Vec(nil), b...), [3]r3.Vec{b[0][0], b[0][1], v(0, 0, -3)})
	degenerate := [][3]r3.Vec{{v(0, 0, 0), v(1, 0, 0), v(2, 0, 0)}, {v(1, 1, 1), v(1, 1, 1), v(0, 1, 0)}}
	flat := [][3]r3.Vec{{v(0, 0, 0), v(1, 0, 0), v(0, 1, 0)}, {v(0, 0, 0), v(0, 1, 0), v(1, 0, 0)}}
	for _, c := range []struct {
		name string
		tris [][3]r3.Vec
		want string
	}{
		{"empty", nil, "no triangles"},
		{"hole", b[:11], "not closed: 3 edges belong to one face only"},
		{"two holes", b[:10], "not closed: 4 edges belong to one face only"},
		{"flipped face", flipped, "faces wound both ways: 3 edges are run the same way by both their faces"},
		{"NaN", nan, "triangle 6 has a coordinate that is not a finite number"},
		{"Inf", inf, "triangle 1 has a coordinate that is not a finite number"},
		{"third face", fin, "non-manifold"},
		{"degenerate only", degenerate, "all 2 triangles have zero area"},
		{"flat", flat, "encloses no volume"},
		{"huge", transform(boxTris(1e120, 1e120, 1e120), diag(1, 1, 1), r3.Vec{}), "the coordinates are too large"},
	} {
		m, _, err := New(c.tris)
		if err == nil || m != nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		if !strings.Contains(err.Error(), c.want) || strings.Contains(err.Error(), "\n") {
			t.Errorf("%s: error %q, want one line with %q", c.name, err, c.want)
		}
	}
}

// TestNew_DropsZeroArea: a box with extra degenerate triangles is the box, and
// a sliver filling a crack along a split edge is accepted.
func TestNew_DropsZeroArea(t *testing.T) {
	b := append(boxTris(1, 1, 1), [3]r3.Vec{v(0, 0, 0), v(0, 0, 0), v(1, 2, 3)})
	m, notes := mustNew(t, b)
	if len(m.T) != 12 || len(m.V) != 8 {
		t.Errorf("%d triangles %d vertices, want 12 and 8", len(m.T), len(m.V))
	}
	if len(notes) != 1 || !strings.Contains(notes[0], "1 triangle of zero area dropped") {
		t.Errorf("notes %q", notes)
	}
	// The tetrahedron o,x,y,z with its x-y edge split at the midpoint h on
	// one side (face o,h... uses h) and a zero-area sliver x,h,y closing the crack.
	o, x, y, z := v(0, 0, 0), v(1, 0, 0), v(0, 1, 0), v(0, 0, 1)
	h := v(0.5, 0.5, 0)
	tris := [][3]r3.Vec{{o, y, h}, {o, h, x}, {o, x, z}, {o, z, y}, {x, y, z}, {x, h, y}}
	m, _ = mustNew(t, tris)
	checkRel(t, "split tetrahedron volume", m.Solid().Measure, 1.0/6, exactTol)
}

// TestSupport_Oracle: the tree's support equals a scan over every vertex.
func TestSupport_Oracle(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	m, _ := mustNew(t, transform(sphereTris(40, 0.3), rotation(v(1, 2, 3), 0.4), v(0.1, -2, 0.5)))
	long, _ := mustNew(t, prismTris(200, 0.01, 2))
	for _, mm := range []*Mesh{m, long} {
		for range 500 {
			u := v(rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64())
			want := math.Inf(-1)
			for _, p := range mm.V {
				want = math.Max(want, r3.Dot(p, u))
			}
			if got := mm.Support(u); got != want {
				t.Fatalf("Support(%v) = %.17g, scan gives %.17g", u, got, want)
			}
		}
	}
	if got := (&Mesh{}).Support(v(1, 0, 0)); !math.IsInf(got, -1) {
		t.Errorf("empty mesh support %g, want -Inf", got)
	}
}

// TestRadixSort against the standard library's sort (a slow, obvious oracle).
func TestRadixSort(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, n := range []int{1, 2, 17, 5000} {
		for _, bitsUsed := range []uint{3, 20, 54, 64} {
			keys := make([]uint64, n)
			for i := range keys {
				keys[i] = rng.Uint64() >> (64 - bitsUsed)
			}
			want := slices.Clone(keys)
			slices.Sort(want)
			radixSort(keys)
			if !slices.Equal(keys, want) {
				t.Fatalf("n=%d bits=%d: not sorted", n, bitsUsed)
			}
		}
	}
}

// TestMesh_ConcurrentUse: the lazily built caches (moments, support tree,
// reach) are safe to fill from several goroutines at once (run with -race).
func TestMesh_ConcurrentUse(t *testing.T) {
	m, _ := mustNew(t, sphereTris(12, 1))
	want := m.Reach(r3.Vec{})
	m2, _ := mustNew(t, sphereTris(12, 1))
	done := make(chan float64)
	for i := range 4 {
		go func() {
			u := v(float64(i), 1, 0.5)
			s := m2.Support(u) + m2.Solid().Measure + m2.Surface().Measure
			done <- s + m2.Reach(r3.Vec{})
		}()
	}
	for range 4 {
		<-done
	}
	if got := m2.Reach(r3.Vec{}); got != want {
		t.Errorf("reach %g, want %g", got, want)
	}
}

// TestNew_OneShellInward: a file of two separate closed shells, one of them
// wound inward (one object's normals flipped on export), is the two solids:
// the inward shell lies inside no other, so it is no cavity and is turned
// outward, whichever shell is the larger. The volume is the sum of the box
// formulas (x y z); a real cavity (TestNew_TwoShells) still subtracts.
func TestNew_OneShellInward(t *testing.T) {
	small, big := boxTris(1, 1, 1), transform(boxTris(1, 2, 3), diag(1, 1, 1), v(5, 0, 0))
	for _, c := range []struct {
		name string
		tris [][3]r3.Vec
	}{
		{"small inward", append(reversed(small), big...)},
		{"big inward", append(slices.Clone(small), reversed(big)...)},
		{"hollow, inward throughout", reversed(append(boxTris(2, 2, 2), reversed(boxTris(1, 1, 1))...))},
	} {
		m, notes := mustNew(t, c.tris)
		want := 7.0
		checkRel(t, c.name+": volume", m.Solid().Measure, want, exactTol)
		if c.name != "hollow, inward throughout" {
			checkRel(t, c.name+": centre x", m.Solid().Center.X, 6*5.0/7, exactTol)
		}
		if !strings.Contains(strings.Join(notes, "; "), "outward") {
			t.Errorf("%s: notes %q say nothing of the turned shell", c.name, notes)
		}
	}
}
