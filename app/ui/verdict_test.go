package ui

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"propflight/app/editor"
	"propflight/app/project"
	"propflight/physics"
)

// thinDisc is a 10 cm radius, 1 mm thick solid disc spun about its
// greatest (symmetry) axis with a tilt.
func thinDisc(tiltDeg float64) *project.Document {
	return &project.Document{
		Prop: project.Prop{Parts: []project.Part{{Shape: "cylinder", Radius: ptrTo(0.1), Length: ptrTo(0.001), Mass: ptrTo(0.3)}}},
		Throw: project.Throw{
			ReleaseVelocity: &project.Vec3{1, 4, 0},
			Spin: &project.Spin{Axis: &project.SpinAxis{Name: "greatest"}, TiltDeg: ptrTo(tiltDeg),
				TiltToward: ptrTo("least"), TurnsPerSecond: ptrTo(3.0)},
		},
	}
}

// ratioOf reads the number after "1 : " in a row value.
func ratioOf(t *testing.T, value string) float64 {
	t.Helper()
	_, rest, ok := strings.Cut(value, "1 : ")
	if !ok {
		t.Fatalf("no ratio in %q", value)
	}
	x, err := strconv.ParseFloat(strings.Fields(rest)[0], 64)
	if err != nil {
		t.Fatal(err)
	}
	return x
}

func rowValue(r report, label string) (string, bool) {
	for _, rw := range r.Rows {
		if rw.Label == label {
			return rw.Value, true
		}
	}
	return "", false
}

func TestVerdictReport_ThinDisc_TwoWobblesPerTurn(t *testing.T) {
	res := editor.Compute(thinDisc(3), physics.DefaultThresholds())
	if res.Err != nil {
		t.Fatal(res.Err)
	}
	r := verdictReport(res, false)
	if r.Motion != "wobble" || !strings.Contains(r.Why, "oblate") || !strings.Contains(r.Why, "never tumbles") {
		t.Fatalf("disc: %q / %q", r.Motion, r.Why)
	}
	// A thin disc has I3 / I_perp = 6 r^2 / (3 r^2 + h^2) -> 2 (solid
	// cylinder, Wikipedia "List of moments of inertia"), so it wobbles
	// twice per turn against the axial spin and against the Euler-angle
	// spin (1 - r) omega3 alike (DESIGN.md physics notes; common practice).
	for _, label := range []string{"spin : wobble", "Euler spin : wobble"} {
		v, ok := rowValue(r, label)
		if !ok {
			t.Fatalf("no %q row in %v", label, r.Rows)
		}
		if x := ratioOf(t, v); math.Abs(x-2) > 0.02 {
			t.Errorf("%s: 1 : %g, want about 1 : 2", label, x)
		}
	}
}

func TestVerdictReport_Demo_TumbleWordsAndRows(t *testing.T) {
	doc, err := presetDocument("frying-pan")
	if err != nil {
		t.Fatal(err)
	}
	res := editor.Compute(doc, physics.DefaultThresholds())
	r := verdictReport(res, false)
	want := "It tumbles: you spun it about its middle axis (I1 < I2 < I3), which is unstable — small errors grow and it flips end over end."
	if !strings.HasPrefix(r.Why, want) {
		t.Errorf("why = %q\nwant prefix %q", r.Why, want)
	}
	for _, label := range []string{"mass", "centre of mass", "least axis", "middle axis", "greatest axis", "excursion",
		"flip period", "first flip", "flip onset", "flight", "apex", "landing"} {
		if _, ok := rowValue(r, label); !ok {
			t.Errorf("no %q row", label)
		}
	}
	// Flip period in frames is the period in seconds times the rate.
	v, _ := rowValue(r, "flip period")
	frames := res.Verdict.FlipPeriod * res.Scene.Throw.FPS.FPS()
	if !strings.HasPrefix(v, sig3(frames)+" frames (") {
		t.Errorf("flip period row %q, want %s frames", v, sig3(frames))
	}
	if v, _ := rowValue(r, "landing"); !strings.Contains(v, res.Scene.Throw.FPS.Timecode(res.Take.LandingFrame)) {
		t.Errorf("landing row %q has no timecode", v)
	}
}

func TestVerdictReport_BadProject_OnlyError(t *testing.T) {
	doc := thinDisc(3)
	doc.Prop.Parts[0].Radius = ptrTo(-1.0)
	r := verdictReport(editor.Compute(doc, physics.DefaultThresholds()), false)
	if r.Motion != "" || !strings.Contains(r.Err, "prop.parts[0].radius") {
		t.Errorf("bad radius: motion %q, err %q", r.Motion, r.Err)
	}
}

func TestExplain_NoSpin(t *testing.T) {
	doc := thinDisc(0)
	doc.Throw.Spin.TurnsPerSecond = ptrTo(0.0)
	r := verdictReport(editor.Compute(doc, physics.DefaultThresholds()), false)
	if r.Headline != "It does not turn." {
		t.Errorf("no spin: %q", r.Headline)
	}
}

func TestFlipFrames_EveryPeriodUntilLanding(t *testing.T) {
	rate := physics.Rate{Num: 24, Den: 1}
	v := physics.Verdict{HasFlip: true, FirstFlipFound: true, FirstFlip: 0.5, FlipPeriod: 0.3}
	tk := &physics.Take{FlightTime: 1.52, LandingFrame: 36}
	// Flips at 0.5, 0.8, 1.1, 1.4 s: frames 12, 19.2 -> 19, 26.4 -> 26, 33.6 -> 34.
	got := flipFrames(v, tk, rate)
	want := []int{12, 19, 26, 34}
	if len(got) != len(want) {
		t.Fatalf("flipFrames = %v, want %v", got, want)
	}
	for i := range want {
		if got[i] != want[i] {
			t.Errorf("flipFrames = %v, want %v", got, want)
		}
	}
	if got := flipFrames(physics.Verdict{}, tk, rate); got != nil {
		t.Errorf("no tumble: %v", got)
	}
	v.FlipPeriod = math.Inf(1)
	if got := flipFrames(v, tk, rate); got != nil {
		t.Errorf("infinite period: %v", got)
	}
}

func TestSig_Formats(t *testing.T) {
	cases := map[float64]string{0: "0", math.Copysign(0, -1): "0", 1.2: "1.2", 0.004347: "0.004347", 2.435: "2.435", 1234567: "1.235e+06"}
	for x, want := range cases {
		if got := sig(x); got != want {
			t.Errorf("sig(%g) = %q, want %q", x, got, want)
		}
	}
	if got := sig3(2); got != "2.00" {
		t.Errorf("sig3(2) = %q", got)
	}
	if got := dir2(-0.0001); got != "0.00" {
		t.Errorf("dir2(-0.0001) = %q", got)
	}
}

func TestExplain_FreeAxisNearMiddle_SaysUnstable(t *testing.T) {
	doc, err := presetDocument("frying-pan")
	if err != nil {
		t.Fatal(err)
	}
	// The pan's middle axis is the prop's y (see its verdict rows); a free
	// direction a few degrees off it tumbles like the named middle axis.
	setFreeAxis(doc, project.Vec3{0.05, 1, 0})
	r := verdictReport(editor.Compute(doc, physics.DefaultThresholds()), false)
	if r.Motion != "tumble" || !strings.Contains(r.Why, "from its middle axis (I1 < I2 < I3), which is unstable") {
		t.Errorf("free axis near the middle: %q / %q", r.Motion, r.Why)
	}
}

// TestVerdictReport_Imperial: the imperial display gives the mass in lb,
// the centre of mass in inches and the moments in lb in^2, by the exact
// factors 1 lb = 0.45359237 kg and 1 in = 0.0254 m (NIST SP 811, App. B);
// the handbook box of REFERENCES.md §1.2 (2 kg, greatest moment
// 0.008333333333 kg m^2) is 4.409 lb and 28.48 lb in^2.
func TestVerdictReport_Imperial(t *testing.T) {
	doc, err := project.Parse("brick.json", []byte(`{"format": "propflight/v1", "prop": {"parts": [{"shape": "box", "size": [0.2, 0.1, 0.05], "mass": 2, "position": [0.0254, 0, 0]}]}}`))
	if err != nil {
		t.Fatal(err)
	}
	r := verdictReport(editor.Compute(doc, physics.DefaultThresholds()), true)
	want := map[string]string{"mass": "4.409 lb", "centre of mass": "(1.000, 0.000, 0.000) in"}
	for _, row := range r.Rows {
		if w, ok := want[row.Label]; ok && row.Value != w {
			t.Errorf("%s = %q, want %q", row.Label, row.Value, w)
		}
		if row.Label == "greatest axis" && !strings.HasPrefix(row.Value, "I3 = 28.48 lb·in²") {
			t.Errorf("greatest axis = %q, want I3 = 28.48 lb·in²", row.Value)
		}
	}
}
