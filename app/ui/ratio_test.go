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

// TestVerdictReport_AsymmetricRatio: an asymmetric board spun a hair off
// its greatest axis shows the spin-to-wobble ratio and the frames per
// wobble. The ratio is checked against the near-axis limit
// 1 + sqrt((I3-I1)(I3-I2)/(I1 I2)) (REFERENCES.md §10) with the box's
// moments from the handbook formula I = m (b^2 + c^2) / 12
// (REFERENCES.md §1.1), not through the project's own mass properties.
func TestVerdictReport_AsymmetricRatio(t *testing.T) {
	a, b, c, m := 0.40, 0.25, 0.02, 1.5
	doc := &project.Document{
		Prop: project.Prop{Parts: []project.Part{{Shape: "box", Size: &project.Vec3{a, b, c}, Mass: ptrTo(m)}}},
		Throw: project.Throw{
			ReleaseVelocity: &project.Vec3{1, 4, 0},
			Spin: &project.Spin{Axis: &project.SpinAxis{Name: "greatest"}, TiltDeg: ptrTo(0.001),
				TiltToward: ptrTo("least"), TurnsPerSecond: ptrTo(3.0)},
		},
	}
	res := editor.Compute(doc, physics.DefaultThresholds())
	if res.Err != nil {
		t.Fatal(res.Err)
	}
	r := verdictReport(res, false)
	if r.Motion != "spin" {
		t.Fatalf("board: %s", r.Motion)
	}
	i1, i2, i3 := m*(b*b+c*c)/12, m*(a*a+c*c)/12, m*(a*a+b*b)/12
	want := 1 + math.Sqrt((i3-i1)*(i3-i2)/(i1*i2))
	v, ok := rowValue(r, "spin : wobble")
	if !ok {
		t.Fatalf("no spin : wobble row in %v", r.Rows)
	}
	if x := ratioOf(t, v); math.Abs(x-want) > 0.005*want {
		t.Errorf("spin : wobble 1 : %g, want 1 : %.4g", x, want)
	}
	// One wobble every fps / (ratio x turns per second about the axis) frames.
	w, ok := rowValue(r, "wobble")
	if !ok || !strings.HasPrefix(w, "one every ") {
		t.Fatalf("wobble row %q", w)
	}
	n, err := strconv.ParseFloat(strings.Fields(w)[2], 64)
	if err != nil {
		t.Fatal(err)
	}
	if wantN := 24 / (want * 3); math.Abs(n-wantN) > 0.01*wantN {
		t.Errorf("one wobble every %g frames, want about %.3g", n, wantN)
	}
	// A tumble has no ratio.
	doc.Throw.Spin.Axis = &project.SpinAxis{Name: "middle"}
	doc.Throw.Spin.TiltDeg = ptrTo(2.0)
	if _, ok := rowValue(verdictReport(editor.Compute(doc, physics.DefaultThresholds()), false), "spin : wobble"); ok {
		t.Error("a tumble shows a spin : wobble row")
	}
}
