package assets

import (
	"embed"
	"fmt"
	"io/fs"
	"path"
	"slices"
	"strings"
)

// Demo is the preset the window and "propflight check" open when given no
// file.
const Demo = "frying-pan"

//go:embed presets/*.json
var presets embed.FS

// PresetNames returns the names of the embedded presets, sorted: the file
// names under presets/ without ".json".
func PresetNames() []string {
	entries, err := fs.ReadDir(presets, "presets")
	if err != nil {
		panic("assets: embedded presets missing: " + err.Error()) // a build bug
	}
	var names []string
	for _, e := range entries {
		if n, ok := strings.CutSuffix(e.Name(), ".json"); ok {
			names = append(names, n)
		}
	}
	slices.Sort(names)
	return names
}

// Preset returns the project file of the named preset. An unknown name is
// an error listing the valid ones.
func Preset(name string) ([]byte, error) {
	if slices.Contains(PresetNames(), name) {
		if data, err := presets.ReadFile(path.Join("presets", name+".json")); err == nil {
			return data, nil
		}
	}
	return nil, fmt.Errorf("no preset named %q (presets: %s)", name, strings.Join(PresetNames(), ", "))
}
