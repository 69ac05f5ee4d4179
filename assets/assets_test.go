package assets

import (
	"encoding/json"
	"slices"
	"strings"
	"testing"
)

func TestPresetNames_SortedAndComplete(t *testing.T) {
	names := PresetNames()
	if !slices.IsSorted(names) {
		t.Errorf("names not sorted: %v", names)
	}
	for _, want := range []string{"frying-pan", "rolling-pin", "dinner-plate", "cutting-board", "loaf"} {
		if !slices.Contains(names, want) {
			t.Errorf("preset %q missing from %v", want, names)
		}
	}
	if !slices.Contains(names, Demo) {
		t.Errorf("Demo %q is not a preset", Demo)
	}
}

func TestPreset_EveryNameReadsAsProjectFile(t *testing.T) {
	for _, name := range PresetNames() {
		data, err := Preset(name)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		var head struct {
			Format string `json:"format"`
			Name   string `json:"name"`
		}
		if err := json.Unmarshal(data, &head); err != nil {
			t.Fatalf("%s: not JSON: %v", name, err)
		}
		if head.Format != "propflight/v1" || head.Name == "" {
			t.Errorf("%s: format %q, name %q", name, head.Format, head.Name)
		}
	}
}

func TestPreset_UnknownNameListsValidOnes(t *testing.T) {
	for _, bad := range []string{"spatula", "", "../assets", "frying-pan.json", "presets/loaf"} {
		_, err := Preset(bad)
		if err == nil {
			t.Fatalf("Preset(%q) succeeded", bad)
		}
		for _, n := range PresetNames() {
			if !strings.Contains(err.Error(), n) {
				t.Errorf("error %q does not list %q", err, n)
			}
		}
	}
}

func TestPreset_ReturnsFreshCopy(t *testing.T) {
	a, _ := Preset(Demo)
	a[0] = 'X'
	b, _ := Preset(Demo)
	if b[0] == 'X' {
		t.Error("Preset shares its bytes with the caller")
	}
}

func TestMesh_BuiltinLadle(t *testing.T) {
	data, err := Mesh("ladle.obj")
	if err != nil || len(data) == 0 {
		t.Fatalf("ladle.obj: %v", err)
	}
	for _, bad := range []string{"ladle", "ladle.json", "../assets.go", ""} {
		if _, err := Mesh(bad); err == nil || !strings.Contains(err.Error(), "ladle.obj") {
			t.Errorf("Mesh(%q): %v", bad, err)
		}
	}
}
