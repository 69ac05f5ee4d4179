package sheet

import (
	"bytes"
	"os/exec"
	"strings"
	"testing"

	"propflight/physics"
)

// TestWrite_SummaryAxisMap: page 1 carries the axis map picture and
// beside it the throw's own direction with its verdict and each motion's
// share of evenly spread directions, as the physics computes them.
func TestWrite_SummaryAxisMap(t *testing.T) {
	in := presetInput(t, "frying-pan")
	path := pdfFile(t, render(t, in, Options{}))
	text := squash(pageText(t, path, 1, false))
	mp := &in.Scene.Mass
	spin := in.Scene.Throw.SpinAxis(mp)
	thr := in.Scene.Thresholds
	d := physics.NewAxisMapper(mp, thr).Verdict(spin)
	want := []string{"Axis map: every spin direction of this prop", "this throw", "axis " + vec(spin, 3) + " (prop frame), ringed",
		d.Motion.String() + ", excursion " + fixed(d.ExcursionDeg, 1) + "°"}
	for _, it := range mapShares(physics.MapDirections(mp, thr, axisMapSamples)) {
		want = append(want, it.label, it.value)
	}
	for _, w := range want {
		if !strings.Contains(text, w) {
			t.Errorf("page 1 lacks %q", w)
		}
	}
	// One picture on page 1: the map (the rest of the sheet is vector).
	tool := needTool(t, "pdfimages")
	out, err := exec.Command(tool, "-list", "-f", "1", "-l", "1", path).Output()
	if err != nil {
		t.Fatal(err)
	}
	lines := bytes.Count(out, []byte("\n")) - 2 // two header lines
	if lines < 1 || !bytes.Contains(out, []byte(" 1100 ")) {
		t.Errorf("page 1 images:\n%s", out)
	}
}
