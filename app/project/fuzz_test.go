package project

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"testing"

	"propflight/assets"
)

// FuzzParse feeds arbitrary bytes to Parse. It must never panic; every
// error must be an *Error; a parsed document must survive Marshal -> Parse
// unchanged; and Build must either refuse it or give finite mass
// properties with positive moments.
func FuzzParse(f *testing.F) {
	for _, name := range assets.PresetNames() {
		data, _ := assets.Preset(name)
		f.Add(data)
	}
	files, _ := filepath.Glob("testdata/*.json")
	for _, file := range files {
		if data, err := os.ReadFile(file); err == nil {
			f.Add(data)
		}
	}
	f.Add([]byte(withSpin(`{"axis": [1e-300, 0, 1e308], "tilt_deg": 1, "frames_per_turn": 1e-300}`)))
	f.Add([]byte(`{"format": "propflight/v1", "prop": {"parts": [{"shape": "tube", "radius": 1, "inner_radius": 1, "length": 1e-6, "mass": 1e6}]}}`))
	f.Add([]byte(`{"format": "propflight/v1", "prop": {"parts": [[[[[[[[`))
	// A footage object with every field (testdata/footage.json is a seed too).
	f.Add([]byte(withFootage(`{"path": "clip/", "fps": "24000/1001", "offset": -3, "overlay": true, "opacity": 0.6,
		"marks": [{"frame": 3, "x": 412.5, "y": 300.25, "x2": 440, "y2": 290}, {"frame": 4, "x": 1e-7, "y": -0}]}`)))

	f.Fuzz(func(t *testing.T, data []byte) {
		doc, err := Parse("fuzz.json", data)
		if err != nil {
			var pe *Error
			if !errors.As(err, &pe) {
				t.Fatalf("Parse error %T is not *Error: %v", err, err)
			}
			return
		}
		out, err := Marshal(doc)
		if err != nil {
			t.Fatalf("Marshal of a parsed document: %v", err)
		}
		back, err := Parse("fuzz.json", out)
		if err != nil {
			t.Fatalf("reparse of Marshal output: %v\n%s", err, out)
		}
		if !reflect.DeepEqual(doc, back) {
			t.Fatalf("Marshal -> Parse changed the document:\n%s", out)
		}
		sc, err := doc.Build()
		if err != nil {
			var pe *Error
			if !errors.As(err, &pe) {
				t.Fatalf("Build error %T is not *Error: %v", err, err)
			}
			return
		}
		mp := sc.Mass
		finite := func(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }
		ok := finite(mp.Mass) && mp.Mass > 0 && finite(mp.CM.X) && finite(mp.CM.Y) && finite(mp.CM.Z)
		for i := range 3 {
			ok = ok && finite(mp.Moments[i]) && mp.Moments[i] > 0
			for j := range 3 {
				ok = ok && finite(mp.Inertia[i][j])
			}
		}
		if !ok {
			t.Fatalf("Build gave non-finite mass properties %+v", mp)
		}
		if err := sc.Throw.Validate(); err != nil {
			t.Fatalf("Build gave a throw physics refuses: %v", err)
		}
	})
}
