package project

import (
	"strings"
	"testing"

	"propflight/physics"
)

const rulesBase = `{"format": "propflight/v1", "prop": {"parts": [{"shape": "box", "size": [0.2, 0.1, 0.05], "mass": 2}]}`

// TestVerdictRules_ParseSaveBuild: the rules read back the same after a
// save, reach the scene's thresholds, and a file without them keeps the
// defaults of DESIGN.md (1 %, 45°, 0.5°).
func TestVerdictRules_ParseSaveBuild(t *testing.T) {
	doc, err := Parse("r.json", []byte(rulesBase+`, "verdict_rules": {"symmetric_within_percent": 2, "tumble_from_deg": 95, "wobble_from_deg": 0.25}}`))
	if err != nil {
		t.Fatal(err)
	}
	want := physics.Thresholds{SymmetryTol: 0.02, TumbleDeg: 95, WobbleMinDeg: 0.25}
	if got := doc.Thresholds(); got != want {
		t.Errorf("Thresholds %+v, want %+v", got, want)
	}
	sc, err := doc.Build()
	if err != nil {
		t.Fatal(err)
	}
	if sc.Thresholds != want {
		t.Errorf("scene thresholds %+v", sc.Thresholds)
	}
	data, err := Marshal(doc)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(data), "\"verdict_rules\": {\n    \"symmetric_within_percent\": 2,\n    \"tumble_from_deg\": 95,\n    \"wobble_from_deg\": 0.25\n  }") {
		t.Errorf("saved file:\n%s", data)
	}
	back, err := Parse("r.json", data)
	if err != nil || back.Thresholds() != want {
		t.Errorf("read back %+v, %v", back.Thresholds(), err)
	}

	plain, _ := Parse("p.json", []byte(rulesBase+"}"))
	if plain.Thresholds() != physics.DefaultThresholds() || plain.VerdictRules != nil {
		t.Errorf("no rules: %+v", plain.Thresholds())
	}
	// Setting the defaults back leaves no verdict_rules in the file.
	doc.SetThresholds(physics.DefaultThresholds())
	if data, _ := Marshal(doc); strings.Contains(string(data), "verdict_rules") {
		t.Errorf("default rules still saved:\n%s", data)
	}
	doc.SetThresholds(physics.Thresholds{SymmetryTol: 0.01, TumbleDeg: 30, WobbleMinDeg: 0.5})
	if r := doc.VerdictRules; r == nil || r.TumbleFromDeg == nil || *r.TumbleFromDeg != 30 || r.SymmetricWithinPercent != nil || r.WobbleFromDeg != nil {
		t.Errorf("only the changed rule should be saved: %+v", r)
	}
}

func TestVerdictRules_BadValues(t *testing.T) {
	for _, c := range []struct{ rules, want string }{
		{`{"tumble_from_deg": 0}`, "r.json: verdict_rules.tumble_from_deg: must be more than 0 and at most 180 degrees"},
		{`{"tumble_from_deg": 181}`, "r.json: verdict_rules.tumble_from_deg: must be more than 0 and at most 180 degrees"},
		{`{"symmetric_within_percent": -1}`, "r.json: verdict_rules.symmetric_within_percent: must be 0 to 50 percent"},
		{`{"wobble_from_deg": 50}`, "r.json: verdict_rules.wobble_from_deg: must be 0 to 45 degrees"},
		{`{"wobble_from_deg": "1"}`, "r.json: verdict_rules.wobble_from_deg: must be a number"},
		{`{"tumble_deg": 1}`, "r.json: verdict_rules.tumble_deg: unknown field (known: symmetric_within_percent, tumble_from_deg, wobble_from_deg)"},
		{`[]`, "r.json: verdict_rules: must be"},
	} {
		_, err := Parse("r.json", []byte(rulesBase+`, "verdict_rules": `+c.rules+"}"))
		if err == nil || !strings.HasPrefix(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.rules, err, c.want)
		}
	}
}
