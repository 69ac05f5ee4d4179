package project

import (
	"math"
	"os"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// Tolerances: closed forms agree to round-off; the thin-rod model below
// carries a 1e-6 m radius the handbook rod does not have.
const (
	closeTol = 1e-12
	rodTol   = 1e-10
)

func mustBuild(t *testing.T, file string) *Scene {
	t.Helper()
	doc, err := Parse("test.json", []byte(file))
	if err != nil {
		t.Fatal(err)
	}
	sc, err := doc.Build()
	if err != nil {
		t.Fatal(err)
	}
	return sc
}

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

func nearVec(a, b r3.Vec, tol float64) bool {
	return near(a.X, b.X, tol) && near(a.Y, b.Y, tol) && near(a.Z, b.Z, tol)
}

func TestBuild_BrickMoments(t *testing.T) {
	// Solid cuboid 2 kg, 0.2 x 0.1 x 0.05 m: I = m(b^2+c^2)/12 etc.
	// (Wikipedia "List of moments of inertia", solid cuboid; the numbers
	// are REFERENCES.md §1.2's box row).
	sc := mustBuild(t, withParts(okPart))
	want := [3]float64{0.002083333333, 0.007083333333, 0.008333333333}
	for i := range 3 {
		if !near(sc.Mass.Moments[i], want[i], 1e-12) {
			t.Errorf("I%d = %.12g, want %.12g", i+1, sc.Mass.Moments[i], want[i])
		}
	}
	if sc.Mass.Mass != 2 {
		t.Errorf("mass = %g", sc.Mass.Mass)
	}
}

func TestBuild_RotationDegrees(t *testing.T) {
	// Rotating the box's tensor, R I R^T (REFERENCES.md §1.4, check values
	// for +90 degrees about z and +30 degrees about x).
	for _, c := range []struct {
		rot  string
		want physics.Mat3
	}{
		{"[0, 0, 90]", physics.Mat3{{0.007083333333, 0, 0}, {0, 0.002083333333, 0}, {0, 0, 0.008333333333}}},
		{"[30, 0, 0]", physics.Mat3{{0.002083333333, 0, 0}, {0, 0.007395833333, -0.0005412658774}, {0, -0.0005412658774, 0.008020833333}}},
		{"[0, 0, 45]", physics.Mat3{{0.004583333333, -0.0025, 0}, {-0.0025, 0.004583333333, 0}, {0, 0, 0.008333333333}}},
	} {
		sc := mustBuild(t, withParts(`{"shape": "box", "size": [0.2, 0.1, 0.05], "mass": 2, "rotation_deg": `+c.rot+`}`))
		for i := range 3 {
			for j := range 3 {
				if !near(sc.Mass.Inertia[i][j], c.want[i][j], 1e-12) {
					t.Errorf("rotation_deg %s: I[%d][%d] = %.12g, want %.12g", c.rot, i, j, sc.Mass.Inertia[i][j], c.want[i][j])
				}
			}
		}
	}
}

func TestBuild_RotationOrderIsXThenYThenZ(t *testing.T) {
	// About fixed axes, x by 90 then z by 90: the part's x axis stays on x
	// under the first turn and goes to y under the second. The other order
	// (z first) would send it to z.
	sc := mustBuild(t, withParts(`{"shape": "box", "size": [0.2, 0.1, 0.05], "mass": 2, "rotation_deg": [90, 0, 90]}`))
	got := sc.Prop.Parts[0].Orient.Rotate(r3.Vec{X: 1})
	if !nearVec(got, r3.Vec{Y: 1}, closeTol) {
		t.Errorf("part x maps to %v, want +y", got)
	}
	// Likewise orientation_deg [-90, 0, 0] stands the prop's z axis up.
	sc = mustBuild(t, withThrow(`{"orientation_deg": [-90, 0, 0]}`))
	if got := sc.Throw.Orient.Rotate(r3.Vec{Z: 1}); !nearVec(got, r3.Vec{Y: 1}, closeTol) {
		t.Errorf("orientation_deg [-90,0,0] maps prop z to %v, want +y", got)
	}
}

func TestBuild_CompositeHammer(t *testing.T) {
	// REFERENCES.md §1.3 "Hammer (composite)": a 0.3 kg thin rod of 0.3 m
	// along y from 0 to 0.3 and a 0.5 kg head box 0.1 x 0.03 x 0.03 at
	// (0, 0.315, 0); parallel-axis theorem (Goldstein 3rd ed. §5.3).
	// The rod is a cylinder of radius 1e-6 m turned onto y.
	sc := mustBuild(t, withParts(
		`{"name": "rod", "shape": "cylinder", "radius": 1e-6, "length": 0.3, "mass": 0.3, "position": [0, 0.15, 0], "rotation_deg": [90, 0, 0]}`,
		`{"name": "head", "shape": "box", "size": [0.1, 0.03, 0.03], "mass": 0.5, "position": [0, 0.315, 0]}`))
	if !near(sc.Mass.Mass, 0.8, closeTol) {
		t.Errorf("mass %g", sc.Mass.Mass)
	}
	if !nearVec(sc.Mass.CM, r3.Vec{Y: 0.253125}, closeTol) {
		t.Errorf("CM %v, want (0, 0.253125, 0)", sc.Mass.CM)
	}
	want := physics.Diag(0.0074296875, 0.0004541666667, 0.007808854167)
	for i := range 3 {
		for j := range 3 {
			if !near(sc.Mass.Inertia[i][j], want[i][j], rodTol) {
				t.Errorf("I[%d][%d] = %.12g, want %.12g", i, j, sc.Mass.Inertia[i][j], want[i][j])
			}
		}
	}
}

func TestBuild_Density(t *testing.T) {
	// Solid cylinder r = 0.05 m, h = 0.3 m, 1000 kg/m^3: m = pi r^2 h rho,
	// axial m r^2 / 2 and transverse m (3 r^2 + h^2) / 12 (Wikipedia list,
	// solid cylinder; 1 kg gives 0.00125 and 0.008125, REFERENCES.md §1.2).
	sc := mustBuild(t, withParts(`{"shape": "cylinder", "radius": 0.05, "length": 0.3, "density": 1000}`))
	m := math.Pi * 0.05 * 0.05 * 0.3 * 1000
	if !near(sc.Mass.Mass, m, 1e-12) {
		t.Errorf("mass %.15g, want %.15g", sc.Mass.Mass, m)
	}
	if !near(sc.Mass.Moments[0], 0.00125*m, 1e-12) || !near(sc.Mass.Moments[2], 0.008125*m, 1e-12) {
		t.Errorf("moments %v, want axial %g and transverse %g", sc.Mass.Moments, 0.00125*m, 0.008125*m)
	}
}

func TestBuild_Defaults(t *testing.T) {
	sc := mustBuild(t, withParts(okPart))
	th := sc.Throw
	if th.FPS != (physics.Rate{Num: 24, Den: 1}) {
		t.Errorf("fps %v", th.FPS)
	}
	if th.Gravity != 9.80665 { // g_n, 3rd CGPM (1901)
		t.Errorf("gravity %g", th.Gravity)
	}
	if th.Position != (r3.Vec{Y: 1.5}) || th.Velocity != (r3.Vec{}) || th.GroundY != 0 {
		t.Errorf("position %v velocity %v ground %g", th.Position, th.Velocity, th.GroundY)
	}
	if th.Orient != physics.IdentityRotation() {
		t.Errorf("orientation %v", th.Orient)
	}
	if th.Spin.Rate != 0 || th.Spin.Axis != physics.Greatest {
		t.Errorf("spin %+v", th.Spin)
	}
	if err := th.Validate(); err != nil {
		t.Error(err)
	}
	if sc.Prop.Parts[0].Orient != physics.IdentityRotation() || sc.Prop.Parts[0].Position != (r3.Vec{}) {
		t.Errorf("part defaults %+v", sc.Prop.Parts[0])
	}
}

func TestBuild_SpinRates(t *testing.T) {
	for _, c := range []struct {
		throw string
		turns float64 // turns per second
	}{
		{`{"spin": {"turns_per_second": 2}}`, 2},
		{`{"spin": {"turns_per_second": 0}}`, 0},
		{`{"fps": 24, "spin": {"frames_per_turn": 12}}`, 2},
		{`{"fps": 30, "spin": {"frames_per_turn": 7.5}}`, 4},
		{`{"fps": "24000/1001", "spin": {"frames_per_turn": 12}}`, 24000.0 / 1001 / 12},
		{`{"fps": 23.976, "spin": {"frames_per_turn": 12}}`, 24000.0 / 1001 / 12}, // rounded NTSC name, ITU-R BT.709
		{`{"fps": "25", "spin": {"frames_per_turn": 50}}`, 0.5},
	} {
		sc := mustBuild(t, withThrow(c.throw))
		if want := 2 * math.Pi * c.turns; !near(sc.Throw.Spin.Rate, want, 1e-12) {
			t.Errorf("%s: rate %.15g rad/s, want %.15g", c.throw, sc.Throw.Spin.Rate, want)
		}
	}
}

func TestBuild_SpinAxisAndTilt(t *testing.T) {
	for _, c := range []struct {
		spin         string
		axis, toward physics.Axis
		tiltDeg      float64
	}{
		{`{"turns_per_second": 1}`, physics.Greatest, physics.Least, 0},
		{`{"axis": "least", "turns_per_second": 1}`, physics.Least, physics.Middle, 0},
		{`{"axis": "middle", "turns_per_second": 1}`, physics.Middle, physics.Least, 0},
		{`{"axis": "least", "tilt_deg": 3, "tilt_toward": "greatest", "turns_per_second": 1}`, physics.Least, physics.Greatest, 3},
		{`{"axis": "middle", "tilt_deg": -2, "turns_per_second": 1}`, physics.Middle, physics.Least, -2},
	} {
		sc := mustBuild(t, withSpin(c.spin))
		s := sc.Throw.Spin
		if s.Axis != c.axis || s.TiltToward != c.toward || !near(s.Tilt, c.tiltDeg*math.Pi/180, closeTol) {
			t.Errorf("%s: got axis %v toward %v tilt %g rad", c.spin, s.Axis, s.TiltToward, s.Tilt)
		}
	}
	for _, c := range []struct {
		vec  string
		want r3.Vec
	}{
		{"[0, 0.6, 0.8]", r3.Vec{Y: 0.6, Z: 0.8}},
		{"[0, 0, -3]", r3.Vec{Z: -1}},
		{"[1e-300, 0, 0]", r3.Vec{X: 1}},
		{"[1e308, 1e308, 0]", r3.Vec{X: math.Sqrt2 / 2, Y: math.Sqrt2 / 2}},
	} {
		sc := mustBuild(t, withSpin(`{"axis": `+c.vec+`, "turns_per_second": 1}`))
		if s := sc.Throw.Spin; s.Axis != physics.Free || !nearVec(s.Vector, c.want, closeTol) {
			t.Errorf("axis %s: got %v %v, want %v", c.vec, s.Axis, s.Vector, c.want)
		}
	}
}

func TestBuild_HangTime(t *testing.T) {
	// Ballistic check (REFERENCES.md §5.1, computed from r = r0 + v0 t +
	// g t^2 / 2 under g_n): v0 = (3, 8, 0) m/s flies level for
	// 1.631545941 s over 4.894637822 m, 39.157103 frame intervals at 24 fps.
	want := r3.Vec{X: 3, Y: 8}
	sc := mustBuild(t, withThrow(`{"hang_time_s": 1.631545941, "distance": 4.894637822}`))
	if !nearVec(sc.Throw.Velocity, want, 1e-8) {
		t.Errorf("hang_time_s: velocity %v, want %v", sc.Throw.Velocity, want)
	}
	sc = mustBuild(t, withThrow(`{"fps": 24, "hang_frames": 39.157103, "distance": 4.894637822, "heading_deg": 0}`))
	if !nearVec(sc.Throw.Velocity, want, 1e-5) {
		t.Errorf("hang_frames: velocity %v, want %v", sc.Throw.Velocity, want)
	}
	// heading 90 degrees is -z (DESIGN.md).
	sc = mustBuild(t, withThrow(`{"hang_time_s": 1.631545941, "distance": 4.894637822, "heading_deg": 90}`))
	if !nearVec(sc.Throw.Velocity, r3.Vec{Y: 8, Z: -3}, 1e-8) {
		t.Errorf("heading 90: velocity %v, want (0, 8, -3)", sc.Throw.Velocity)
	}
	// No distance: straight up, back at release height after the hang time.
	sc = mustBuild(t, withThrow(`{"gravity": 1.62, "hang_time_s": 2}`))
	if v := sc.Throw.Velocity; v != (r3.Vec{Y: 1.62}) {
		t.Errorf("lunar hang: velocity %v, want (0, 1.62, 0)", v)
	}
}

func TestBuild_SceneName(t *testing.T) {
	for _, c := range []struct {
		file, name, want string
	}{
		{"dir/pan.json", "frying pan", "frying pan"},
		{"dir/pan.json", "", "pan"},
		{"dir/pan.json", "   ", "pan"},
		{"", "", "untitled"},
	} {
		doc, err := Parse(c.file, []byte(withParts(okPart)))
		if err != nil {
			t.Fatal(err)
		}
		doc.Name = c.name
		sc, err := doc.Build()
		if err != nil {
			t.Fatal(err)
		}
		if sc.Name != c.want {
			t.Errorf("file %q name %q: scene %q, want %q", c.file, c.name, sc.Name, c.want)
		}
	}
}

func TestBuild_InMemoryDocumentIsChecked(t *testing.T) {
	r, one := 0.1, 1.0
	size := Vec3{1, 1, 1}
	for _, c := range []struct {
		name string
		doc  Document
		want string
	}{
		{"radius on box", Document{Prop: Prop{Parts: []Part{{Shape: "box", Size: &size, Radius: &r, Mass: &one}}}}, "prop.parts[0].radius: a box has no radius (it takes size)"},
		{"no shape", Document{Prop: Prop{Parts: []Part{{Mass: &one}}}}, "prop.parts[0].shape: missing (one of box, cylinder, tube, sphere, shell, ellipsoid, cone, torus, mesh)"},
		{"both masses", Document{File: "x.json", Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &r, Mass: &one, Density: &one}}}}, "x.json: prop.parts[0].mass: give mass or density, not both"},
		{"both rates", Document{Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &r, Mass: &one}}}, Throw: Throw{Spin: &Spin{TurnsPerSecond: &one, FramesPerTurn: &one}}}, "throw.spin.frames_per_turn: give turns_per_second or frames_per_turn, not both"},
		{"bad axis name", Document{Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &r, Mass: &one}}}, Throw: Throw{Spin: &Spin{Axis: &SpinAxis{Name: "up"}, TurnsPerSecond: &one}}}, `throw.spin.axis: "up" is not an axis (use least, middle, greatest or a vector [x, y, z])`},
		{"nan fps", Document{Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &r, Mass: &one}}}, Throw: Throw{FPS: &FrameRate{Number: math.NaN()}}}, "throw.fps: must be positive"},
	} {
		_, err := c.doc.Build()
		if err == nil || err.Error() != c.want {
			t.Errorf("%s: got %v, want %s", c.name, err, c.want)
		}
	}
}

func TestBuild_EveryFieldFile(t *testing.T) {
	doc, err := Load("testdata/every-field.json")
	if err != nil {
		t.Fatal(err)
	}
	sc, err := doc.Build()
	if err != nil {
		t.Fatal(err)
	}
	if len(sc.Prop.Parts) != 8 {
		t.Fatalf("%d parts", len(sc.Prop.Parts))
	}
	for i, name := range physics.ShapeNames() {
		if got := sc.Prop.Parts[i].Shape.String(); got != name {
			t.Errorf("part %d is a %s, want %s", i, got, name)
		}
	}
	if sc.Throw.FPS != (physics.Rate{Num: 24000, Den: 1001}) || sc.Throw.Gravity != 9.81 || sc.Throw.GroundY != -0.1 {
		t.Errorf("throw %+v", sc.Throw)
	}
	if _, err := physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw); err != nil {
		t.Errorf("simulate: %v", err)
	}
}

func TestDocument_Rate(t *testing.T) {
	for _, c := range []struct {
		throw string
		want  physics.Rate
	}{
		{`{}`, physics.Rate{Num: 24, Den: 1}},
		{`{"fps": 25}`, physics.Rate{Num: 25, Den: 1}},
		{`{"fps": 29.97}`, physics.Rate{Num: 30000, Den: 1001}}, // ITU-R BT.709 fractional rate
		{`{"fps": "60000/1001"}`, physics.Rate{Num: 60000, Den: 1001}},
		{`{"fps": 12.5}`, physics.Rate{Num: 25, Den: 2}},
	} {
		doc, err := Parse("r.json", []byte(withThrow(c.throw)))
		if err != nil {
			t.Fatal(err)
		}
		got, err := doc.Rate()
		if err != nil || got != c.want {
			t.Errorf("%s: %v, %v; want %v", c.throw, got, err, c.want)
		}
	}
}

func BenchmarkParseBuild(b *testing.B) {
	data, err := os.ReadFile("../../assets/presets/frying-pan.json")
	if err != nil {
		b.Fatal(err)
	}
	b.SetBytes(int64(len(data)))
	for b.Loop() {
		doc, err := Parse("frying-pan.json", data)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := doc.Build(); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkMarshal(b *testing.B) {
	doc, err := Load("testdata/every-field.json")
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		if _, err := Marshal(doc); err != nil {
			b.Fatal(err)
		}
	}
}
