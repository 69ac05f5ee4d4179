package cli

import (
	"encoding/json"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestRun_MapJSON: map --json has DESIGN.md's keys, N unit directions,
// and for the brick (I = m (b^2 + c^2) / 12, REFERENCES.md §1.1) the
// spins about the greatest axis near it carry the near-axis ratio
// 1 + sqrt((I3-I1)(I3-I2)/(I1 I2)) (REFERENCES.md §10), tumbles none.
func TestRun_MapJSON(t *testing.T) {
	code, stdout, stderr := run(t, "map", brick, "--json", "--samples", "500")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var j struct {
		PrincipalMoments [3]float64    `json:"principal_moments"`
		PrincipalAxes    [3][3]float64 `json:"principal_axes"`
		Directions       []struct {
			Axis           [3]float64 `json:"axis"`
			Motion         string     `json:"motion"`
			ExcursionDeg   float64    `json:"excursion_deg"`
			WobblesPerTurn *float64   `json:"wobbles_per_turn"`
		} `json:"directions"`
	}
	dec := json.NewDecoder(strings.NewReader(stdout))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&j); err != nil {
		t.Fatal(err)
	}
	if len(j.Directions) != 500 {
		t.Fatalf("%d directions, want 500", len(j.Directions))
	}
	m, a, b, c := 2.0, 0.2, 0.1, 0.05
	I := [3]float64{m * (b*b + c*c) / 12, m * (a*a + c*c) / 12, m * (a*a + b*b) / 12}
	for i := range 3 {
		if math.Abs(j.PrincipalMoments[i]-I[i]) > 1e-12 {
			t.Errorf("principal_moments[%d] = %g, want %g", i, j.PrincipalMoments[i], I[i])
		}
	}
	limit := 1 + math.Sqrt((I[2]-I[0])*(I[2]-I[1])/(I[0]*I[1]))
	counts := map[string]int{}
	near := 0
	for i, d := range j.Directions {
		n := math.Sqrt(d.Axis[0]*d.Axis[0] + d.Axis[1]*d.Axis[1] + d.Axis[2]*d.Axis[2])
		if math.Abs(n-1) > 1e-12 {
			t.Fatalf("direction %d not unit: %v", i, d.Axis)
		}
		counts[d.Motion]++
		if (d.Motion == "tumble") != (d.WobblesPerTurn == nil) {
			t.Errorf("direction %d: %s with wobbles_per_turn %v", i, d.Motion, d.WobblesPerTurn)
		}
		// The greatest axis of the box is z.
		if d.Motion == "spin" && math.Abs(d.Axis[2]) > math.Cos(8*math.Pi/180) {
			near++
			if math.Abs(*d.WobblesPerTurn-limit) > 0.03*limit {
				t.Errorf("direction %v: ratio %g, want about %g", d.Axis, *d.WobblesPerTurn, limit)
			}
		}
	}
	if counts["spin"] == 0 || counts["tumble"] == 0 || near == 0 {
		t.Errorf("classes %v, %d near the greatest axis", counts, near)
	}
}

// TestRun_MapPNGAndSummary: -o writes a PNG of the map; the summary gives
// the share of each motion and the throw's own verdict.
func TestRun_MapPNGAndSummary(t *testing.T) {
	out := filepath.Join(t.TempDir(), "map.png")
	code, stdout, stderr := run(t, "map", brick, "-o", out)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	f, err := os.Open(out)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	img, err := png.Decode(f)
	if err != nil {
		t.Fatal(err)
	}
	if img.Bounds().Dx() != mapPNGWidth || img.Bounds().Dy() != mapPNGHeight {
		t.Errorf("PNG is %v", img.Bounds())
	}
	for _, want := range []string{"wrote " + out, "Axis map of 2000 spin directions", "tumble", "spin about the greatest axis", "This throw:", "tumble, excursion"} {
		if !strings.Contains(stdout, want) {
			t.Errorf("output lacks %q:\n%s", want, stdout)
		}
	}
}

// TestRun_MapBadInput: bad --samples and a missing file exit 2 naming
// the flag or the file, and write nothing.
func TestRun_MapBadInput(t *testing.T) {
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"map", brick, "--samples", "0"}, "--samples"},
		{[]string{"map", brick, "--samples", "100001"}, "--samples"},
		{[]string{"map", brick, "--samples", "many"}, "--samples"},
		{[]string{"map", brick, "--samples"}, "--samples"},
		{[]string{"map", brick, "--json", "-o", "-"}, "-o"},
		{[]string{"map", "testdata/no-such-file.json"}, "no-such-file.json"},
	} {
		code, stdout, stderr := run(t, c.args...)
		if code != 2 || !strings.Contains(stderr, c.want) || strings.Count(strings.TrimSpace(stderr), "\n") != 0 {
			t.Errorf("%v: exit %d, stderr %q (want 2 naming %s)", c.args, code, stderr, c.want)
		}
		if stdout != "" {
			t.Errorf("%v printed %q", c.args, stdout)
		}
	}
	if _, stdout, _ := run(t, "help"); !strings.Contains(stdout, "map") {
		t.Error("the overview does not list map")
	}
}
