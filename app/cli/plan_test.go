package cli

import (
	"encoding/json"
	"math"
	"runtime"
	"strings"
	"testing"
)

// boardSpin is a cutting board spun exactly about its greatest axis, caught
// back at the release height 1.2 s later: the plan's closed form
// (REFERENCES.md §11) gives solutions n/1.2 turns per second with windows
// n/1.2 +- T/(360 x 1.2).
const boardSpin = `{ "format": "propflight/v1", "name": "board",
  "prop": { "parts": [ { "name": "board", "shape": "box", "size": [0.4, 0.25, 0.02], "mass": 1.5 } ] },
  "throw": { "fps": 24, "release_position": [0, 1.5, 0], "hang_time_s": 1.2, "distance": 1,
             "spin": { "axis": "greatest", "turns_per_second": 2 } } }`

func TestPlan_JSON_ClosedForm(t *testing.T) {
	path := writeFile(t, "board.json", boardSpin)
	code, out, errs := run(t, "plan", path, "--land", "1,0,0:1,0,0", "--catch-height", "1.5", "--tolerance-deg", "10", "--rate-max", "4", "--json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var j struct {
		FlightTimeS float64 `json:"flight_time_s"`
		Solutions   []struct {
			TurnsPerSecond float64    `json:"turns_per_second"`
			Turns          float64    `json:"turns"`
			ErrorDeg       float64    `json:"error_deg"`
			Motion         string     `json:"motion"`
			Window         [2]float64 `json:"window_turns_per_second"`
			FramesPerTurn  float64    `json:"frames_per_turn"`
		} `json:"solutions"`
	}
	if err := json.Unmarshal([]byte(out), &j); err != nil {
		t.Fatal(err)
	}
	if math.Abs(j.FlightTimeS-1.2) > 1e-9 || len(j.Solutions) != 4 {
		t.Fatalf("flight %v, %d solutions", j.FlightTimeS, len(j.Solutions))
	}
	half := 10 / (360 * 1.2)
	for i, s := range j.Solutions {
		want := float64(i+1) / 1.2
		if math.Abs(s.TurnsPerSecond-want) > 1e-7 || math.Abs(s.Window[0]-(want-half)) > 1e-7 || math.Abs(s.Window[1]-(want+half)) > 1e-7 ||
			s.Motion != "spin" || math.Abs(s.Turns-float64(i+1)) > 1e-6 || math.Abs(s.FramesPerTurn-24/want) > 1e-5 || s.ErrorDeg > 1e-4 {
			t.Errorf("solution %d: %+v, want %.6f +- %.6f", i, s, want, half)
		}
	}
	// The readable form lists the same solutions and marks the best.
	code, out, _ = run(t, "plan", path, "--land", "1,0,0:1,0,0", "--catch-height", "1.5", "--rate-max", "4")
	if code != 0 || !strings.Contains(out, "0.8333") || !strings.Contains(out, "<- best") || !strings.Contains(out, Safety) {
		t.Errorf("text form:\n%s", out)
	}
	// No solution is said so.
	code, out, _ = run(t, "plan", path, "--land", "1,0,0:0,0,1", "--catch-height", "1.5")
	if code != 0 || !strings.Contains(out, "No spin rate in that range") {
		t.Errorf("no solution:\n%s", out)
	}
}

func TestSpread_JSON_SameSeed(t *testing.T) {
	args := []string{"spread", brick, "--samples", "50", "--seed", "9", "--land", "least:1,0,0", "--tolerance-deg", "20", "--json"}
	code, a, errs := run(t, args...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	_, b, _ := run(t, args...)
	if a != b {
		t.Error("same seed, different output")
	}
	var j map[string]any
	if err := json.Unmarshal([]byte(a), &j); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"samples", "seed", "within_tolerance", "tumble_fraction", "error_deg_p50", "error_deg_p90", "landing_sd_m", "flight_time_sd_s"} {
		if _, ok := j[k]; !ok {
			t.Errorf("lacks %s", k)
		}
	}
	if j["tumble_fraction"] != 1.0 || j["samples"] != 50.0 || j["seed"] != 9.0 {
		t.Errorf("the brick tumbles on every sample: %v", j)
	}
	// Without --land the error figures are null.
	_, c, _ := run(t, "spread", brick, "--samples", "5", "--json")
	if !strings.Contains(c, `"within_tolerance": null`) || !strings.Contains(c, `"error_deg_p50": null`) {
		t.Errorf("no target:\n%s", c)
	}
	// GOMAXPROCS does not change the answer.
	for _, procs := range []int{1, 2} {
		old := runtime.GOMAXPROCS(procs)
		_, got, _ := run(t, args...)
		runtime.GOMAXPROCS(old)
		if got != a {
			t.Errorf("GOMAXPROCS=%d:\n%s", procs, got)
		}
	}
}

// TestPlanSpread_BadInput: exit 2 with the flag named, nothing on stdout.
func TestPlanSpread_BadInput(t *testing.T) {
	for _, c := range []struct {
		args []string
		flag string
	}{
		{[]string{"plan", brick, "--land", "0,0,0:up"}, "--land"},
		{[]string{"plan", brick, "--land", "least:NaN,0,1"}, "--land"},
		{[]string{"plan", brick, "--land", "least:sideways"}, "--land"},
		{[]string{"plan", brick, "--land", "least"}, "--land"},
		{[]string{"plan", brick}, "--land"},
		{[]string{"plan", brick, "--land", "least:up", "--rate-min", "5", "--rate-max", "2"}, "--rate-min"},
		{[]string{"plan", brick, "--land", "least:up", "--tolerance-deg", "0"}, "--tolerance-deg"},
		{[]string{"plan", brick, "--land", "least:up", "--tolerance-deg", "181"}, "--tolerance-deg"},
		{[]string{"plan", brick, "--land", "least:up", "--catch-height", "40"}, "--catch-height"},
		{[]string{"spread", brick, "--samples", "0"}, "--samples"},
		{[]string{"spread", brick, "--samples", "1000000000"}, "--samples"},
		{[]string{"spread", brick, "--rate-sd", "-1"}, "--rate-sd"},
		{[]string{"spread", brick, "--tilt-sd", "-1"}, "--tilt-sd"},
		{[]string{"spread", brick, "--speed-sd", "-0.5"}, "--speed-sd"},
		{[]string{"spread", brick, "--angle-sd", "-2"}, "--angle-sd"},
		{[]string{"spread", brick, "--seed", "-3"}, "--seed"},
		{[]string{"spread", brick, "--tolerance-deg", "5"}, "--tolerance-deg"},
		{[]string{"spread", brick, "--land", "least:up", "--tolerance-deg", "0"}, "--tolerance-deg"},
		{[]string{"spread", brick, "--land", "least:up", "--catch-height", "-9"}, "--catch-height"},
		{[]string{"sheet", brick, "-o", "x.pdf", "--samples", "10"}, "--samples"},
		{[]string{"sheet", brick, "-o", "x.pdf", "--land", "least:up", "--rate-sd", "-1"}, "--rate-sd"},
	} {
		code, out, errs := run(t, c.args...)
		if code != 2 || out != "" || !strings.Contains(errs, c.flag) {
			t.Errorf("%v: exit %d, stderr %q, stdout %q", c.args, code, errs, out)
		}
	}
}
