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

//go:embed presets/*.json presets/*.obj
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

// BuiltinPrefix begins a mesh part's file that names a mesh shipped inside
// Propflight ("builtin:ladle.obj"), so that a preset's mesh is found
// wherever the project is saved.
const BuiltinPrefix = "builtin:"

// Mesh returns the built-in mesh file named name ("ladle.obj"). An unknown
// name is an error listing the valid ones.
func Mesh(name string) ([]byte, error) {
	entries, err := fs.ReadDir(presets, "presets")
	if err != nil {
		panic("assets: embedded presets missing: " + err.Error()) // a build bug
	}
	var names []string
	for _, e := range entries {
		if !strings.HasSuffix(e.Name(), ".json") {
			names = append(names, e.Name())
		}
	}
	if slices.Contains(names, name) {
		if data, err := presets.ReadFile(path.Join("presets", name)); err == nil {
			return data, nil
		}
	}
	return nil, fmt.Errorf("no built-in mesh named %q (built-in meshes: %s)", name, strings.Join(names, ", "))
}
