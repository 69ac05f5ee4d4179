package project

import (
	"errors"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"propflight/assets"
	"propflight/internal/mark"
	"propflight/physics"
)

// withFootage returns a valid project file with the given footage object.
func withFootage(f string) string {
	return `{"format": "propflight/v1", "prop": {"parts": [` + okPart + `]}, "footage": ` + f + `}`
}

// withMark returns a file whose footage has the one mark m.
func withMark(m string) string { return withFootage(`{"path": "clip", "marks": [` + m + `]}`) }

func TestParse_FootageErrors(t *testing.T) {
	runErrCases(t, []errCase{
		// structure and types: Parse
		{"footage type", withFootage(`"clip/"`), `pan.json: footage: must be an object`, true},
		{"footage null", withFootage(`null`), `pan.json: footage: must be an object`, true},
		{"unknown key", withFootage(`{"path": "clip", "speed": 2}`), `pan.json: footage.speed: unknown field`, true},
		{"typo key", withFootage(`{"path": "clip", "opactiy": 0.5}`), `pan.json: footage.opactiy: unknown field (did you mean "opacity"?)`, true},
		{"duplicate key", withFootage(`{"path": "clip", "offset": 1, "offset": 2}`), `pan.json: footage.offset: given twice`, true},
		{"path missing", withFootage(`{"fps": 24}`), `pan.json: footage.path: missing: give the folder of frames or the GIF file, relative to the project file`, true},
		{"path type", withFootage(`{"path": 5}`), `pan.json: footage.path: must be a string`, true},
		{"path empty", withFootage(`{"path": " "}`), `pan.json: footage.path: must not be empty`, true},
		{"fps type", withFootage(`{"path": "clip", "fps": [24]}`), `pan.json: footage.fps: must be a number or a string such as "24000/1001"`, true},
		{"fps empty", withFootage(`{"path": "clip", "fps": ""}`), `pan.json: footage.fps: must not be empty: write a number or a string such as "24000/1001"`, true},
		{"offset type", withFootage(`{"path": "clip", "offset": "0"}`), `pan.json: footage.offset: must be a number`, true},
		{"offset fraction", withFootage(`{"path": "clip", "offset": 1.5}`), `pan.json: footage.offset: must be a whole number, not 1.5`, true},
		{"offset huge", withFootage(`{"path": "clip", "offset": 1e300}`), `pan.json: footage.offset: the number 1e300 is out of range`, true},
		{"overlay type", withFootage(`{"path": "clip", "overlay": "yes"}`), `pan.json: footage.overlay: must be true or false`, true},
		{"overlay number", withFootage(`{"path": "clip", "overlay": 1}`), `pan.json: footage.overlay: must be true or false`, true},
		{"opacity type", withFootage(`{"path": "clip", "opacity": "0.5"}`), `pan.json: footage.opacity: must be a number`, true},
		{"marks type", withFootage(`{"path": "clip", "marks": {"frame": 1}}`), `pan.json: footage.marks: must be an array of marks such as {"frame": 3, "x": 412.5, "y": 300}`, true},
		{"mark type", withMark(`[3, 412, 300]`), `pan.json: footage.marks[0]: must be an object`, true},
		{"mark unknown key", withMark(`{"frame": 3, "x": 1, "y": 2, "z": 3}`), `pan.json: footage.marks[0].z: unknown field`, true},
		{"mark frame missing", withMark(`{"x": 1, "y": 2}`), `pan.json: footage.marks[0].frame: missing (a mark has frame, x and y, and optionally x2 and y2)`, true},
		{"mark y missing", withMark(`{"frame": 1, "x": 1}`), `pan.json: footage.marks[0].y: missing (a mark has frame, x and y, and optionally x2 and y2)`, true},
		{"mark frame fraction", withMark(`{"frame": 2.5, "x": 1, "y": 2}`), `pan.json: footage.marks[0].frame: must be a whole number, not 2.5`, true},
		{"mark frame string", withMark(`{"frame": "3", "x": 1, "y": 2}`), `pan.json: footage.marks[0].frame: must be a number`, true},
		{"mark x string", withMark(`{"frame": 3, "x": "412", "y": 2}`), `pan.json: footage.marks[0].x: must be a number`, true},
		{"mark y null", withMark(`{"frame": 3, "x": 1, "y": null}`), `pan.json: footage.marks[0].y: must be a number`, true},
		{"mark x huge", withMark(`{"frame": 3, "x": 1e999, "y": 2}`), `pan.json: footage.marks[0].x: the number 1e999 is out of range`, true},
		{"x2 without y2", withMark(`{"frame": 3, "x": 1, "y": 2, "x2": 4}`), `pan.json: footage.marks[0].y2: missing: x2 needs y2 (the second point has both)`, true},
		{"y2 without x2", withMark(`{"frame": 3, "x": 1, "y": 2, "y2": 4}`), `pan.json: footage.marks[0].x2: missing: y2 needs x2 (the second point has both)`, true},
		{"x2 bool", withMark(`{"frame": 3, "x": 1, "y": 2, "x2": true, "y2": 4}`), `pan.json: footage.marks[0].x2: must be a number`, true},
		// values: Build
		{"negative frame", withMark(`{"frame": -1, "x": 1, "y": 2}`), `pan.json: footage.marks[0].frame: must be 0 or more (footage frames count from 0)`, false},
		{"frame too large", withMark(`{"frame": 10000001, "x": 1, "y": 2}`), `pan.json: footage.marks[0].frame: must be at most 10000000`, false},
		{"frame marked twice", withFootage(`{"path": "clip", "marks": [{"frame": 2, "x": 1, "y": 2}, {"frame": 5, "x": 1, "y": 2}, {"frame": 2, "x": 3, "y": 4}]}`), `pan.json: footage.marks[2].frame: frame 2 is marked twice (first in footage.marks[0])`, false},
		{"coordinate too large", withMark(`{"frame": 1, "x": 1, "y": 2, "x2": 1e9, "y2": 0}`), `pan.json: footage.marks[0].x2: must be a finite number of at most 1e+06 pixels from the image corner`, false},
		{"opacity above 1", withFootage(`{"path": "clip", "opacity": 1.5}`), `pan.json: footage.opacity: must be from 0 (invisible) to 1 (opaque)`, false},
		{"opacity negative", withFootage(`{"path": "clip", "opacity": -0.1}`), `pan.json: footage.opacity: must be from 0 (invisible) to 1 (opaque)`, false},
		{"fps zero", withFootage(`{"path": "clip", "fps": 0}`), `pan.json: footage.fps: must be positive`, false},
		{"fps slow", withFootage(`{"path": "clip", "fps": "1/2"}`), `pan.json: footage.fps: must be at least 1 frame per second`, false},
		{"fps text", withFootage(`{"path": "clip", "fps": "fast"}`), `pan.json: footage.fps: must be a number or a ratio such as 24000/1001`, false},
		{"offset too large", withFootage(`{"path": "clip", "offset": -10000001}`), `pan.json: footage.offset: must be within +-10000000 frames`, false},
		{"path NUL", withFootage(`{"path": "cl\u0000ip"}`), `pan.json: footage.path: must not contain a NUL character`, false},
	})
}

// TestParse_FootageEdges accepts the edges of every range.
func TestParse_FootageEdges(t *testing.T) {
	for _, f := range []string{
		`{"path": "clip"}`,
		`{"path": "/abs/clip.gif", "opacity": 0, "offset": -10000000, "marks": []}`,
		`{"path": "clip", "opacity": 1, "offset": 10000000, "fps": 1, "overlay": false}`,
		`{"path": "clip", "fps": 10000, "marks": [{"frame": 0, "x": -1e6, "y": 1e6}, {"frame": 10000000, "x": 0, "y": 0, "x2": 0, "y2": 0}]}`,
	} {
		doc, err := Parse("pan.json", []byte(withFootage(f)))
		if err != nil {
			t.Errorf("%s: %v", f, err)
			continue
		}
		if _, err := doc.Build(); err != nil {
			t.Errorf("%s: Build: %v", f, err)
		}
	}
}

func TestParse_FootageFields(t *testing.T) {
	doc, err := Load("testdata/footage.json")
	if err != nil {
		t.Fatal(err)
	}
	f := doc.Footage
	if f == nil {
		t.Fatal("no footage")
	}
	x2, y2 := 440.0, 290.0
	want := &Footage{
		Path: "clips/pin take 2/", FPS: &FrameRate{Text: "24000/1001"}, Offset: ptr(-2), Overlay: ptr(true), Opacity: ptr(0.45),
		Marks: []mark.Mark{{Frame: 3, X: 412.5, Y: 300.25, HasSecond: true, X2: x2, Y2: y2}, {Frame: 4, X: 430, Y: 280.125}, {Frame: 0, X: 0, Y: 1e-7}},
	}
	if !reflect.DeepEqual(f, want) {
		t.Errorf("footage\n got %+v\nwant %+v", f, want)
	}
	if !f.Marks[0].HasSecond || f.Marks[1].HasSecond {
		t.Error("HasSecond")
	}
	r, ok, err := doc.FootageRate()
	if err != nil || !ok || r != (physics.Rate{Num: 24000, Den: 1001}) {
		t.Errorf("FootageRate = %v %v %v", r, ok, err)
	}
	if f.OffsetOrZero() != -2 || !f.OverlayOn() || f.OpacityOrDefault() != 0.45 {
		t.Errorf("accessors %d %v %g", f.OffsetOrZero(), f.OverlayOn(), f.OpacityOrDefault())
	}
	if _, err := doc.Build(); err != nil {
		t.Fatal(err)
	}
	// Defaults of a footage object that gives only its path.
	var none *Footage
	bare := &Footage{Path: "clip"}
	for _, g := range []*Footage{none, bare} {
		if g.OffsetOrZero() != 0 || g.OverlayOn() || g.OpacityOrDefault() != DefaultOpacity {
			t.Errorf("defaults of %+v: %d %v %g", g, g.OffsetOrZero(), g.OverlayOn(), g.OpacityOrDefault())
		}
	}
	if _, ok, err := (&Document{Footage: bare}).FootageRate(); ok || err != nil {
		t.Errorf("FootageRate without fps: %v %v", ok, err)
	}
}

func ptr[T any](v T) *T { return &v }

// TestMarshal_Footage checks the layout of the footage object: after the
// throw, keys in the documented order, one mark a line.
func TestMarshal_Footage(t *testing.T) {
	doc, err := Parse("m.json", []byte(withFootage(`{"marks": [{"y2": 290, "x2": 440, "y": 300.25, "x": 412.5, "frame": 3}, {"frame": 4, "x": 430, "y": 280}],
		"opacity": 0.6, "overlay": false, "offset": 0, "fps": 24, "path": "clip/"}`)))
	if err != nil {
		t.Fatal(err)
	}
	got, err := Marshal(doc)
	if err != nil {
		t.Fatal(err)
	}
	want := `{
  "format": "propflight/v1",
  "prop": {
    "parts": [
      {
        "shape": "box",
        "size": [0.2, 0.1, 0.05],
        "mass": 2
      }
    ]
  },
  "footage": {
    "path": "clip/",
    "fps": 24,
    "offset": 0,
    "overlay": false,
    "opacity": 0.6,
    "marks": [
      {"frame": 3, "x": 412.5, "y": 300.25, "x2": 440, "y2": 290},
      {"frame": 4, "x": 430, "y": 280}
    ]
  }
}
`
	if string(got) != want {
		t.Errorf("got\n%s\nwant\n%s", got, want)
	}
	// An empty marks list stays an empty list; a left-out one stays out.
	for _, c := range []struct{ in, want string }{
		{`{"path": "clip", "marks": []}`, "\"marks\": []\n"},
		{`{"path": "clip"}`, "\"path\": \"clip\"\n  }"},
	} {
		doc, err := Parse("m.json", []byte(withFootage(c.in)))
		if err != nil {
			t.Fatal(err)
		}
		got, _ := Marshal(doc)
		if !strings.Contains(string(got), c.want) {
			t.Errorf("%s gave\n%s", c.in, got)
		}
	}
}

// TestFootage_RoundTrip saves and loads the footage file and a document
// whose footage was made in memory.
func TestFootage_RoundTrip(t *testing.T) {
	doc, err := Load("testdata/footage.json")
	if err != nil {
		t.Fatal(err)
	}
	back, data := roundTrip(t, doc)
	back.File = doc.File
	if !reflect.DeepEqual(doc, back) {
		t.Errorf("Load -> Save -> Load changed the document\n%s", data)
	}

	mem, err := Parse("pan.json", []byte(withParts(okPart)))
	if err != nil {
		t.Fatal(err)
	}
	x2, y2 := 12.0, -3.5
	mem.SetFootagePath("", "/shots/pan")
	mem.Footage.Marks = []mark.Mark{{Frame: 7, X: 0.1, Y: 1e21, HasSecond: true, X2: x2, Y2: y2}}
	mem.Footage.Opacity = ptr(0.3)
	back, data = roundTrip(t, mem)
	back.File = mem.File
	if !reflect.DeepEqual(mem, back) {
		t.Errorf("in-memory footage changed on the way\n%s", data)
	}
	// NaN cannot be saved: the error names the field.
	mem.Footage.Marks[0].Y = nanValue()
	if _, err := Marshal(mem); err == nil || err.Error() != "pan.json: footage.marks[0].y: must be a finite number" {
		t.Errorf("NaN mark: %v", err)
	}
}

func nanValue() float64 { z := 0.0; return z / z }

// TestFootage_OldFilesUnchanged checks that files without footage keep
// their bytes: the presets and the older test files marshal exactly as
// they did before footage existed (their Marshal output has no "footage"
// key and parses back to a document without one).
func TestFootage_OldFilesUnchanged(t *testing.T) {
	for _, name := range assets.PresetNames() {
		data, _ := assets.Preset(name)
		doc, err := Parse(name, data)
		if err != nil {
			t.Fatal(err)
		}
		if doc.Footage != nil {
			t.Fatalf("%s: footage from nowhere", name)
		}
		out, err := Marshal(doc)
		if err != nil {
			t.Fatal(err)
		}
		if strings.Contains(string(out), "footage") {
			t.Errorf("%s: marshal gained footage:\n%s", name, out)
		}
	}
}

func TestFootage_Paths(t *testing.T) {
	dir := t.TempDir()
	proj := filepath.Join(dir, "shots", "pan.json")
	clip := filepath.Join(dir, "shots", "ref", "clip")
	var d Document
	if got := d.FootageDir(proj); got != "" {
		t.Errorf("no footage: %q", got)
	}
	d.SetFootagePath(proj, clip+string(filepath.Separator))
	if d.Footage.Path != "ref/clip" {
		t.Errorf("relative path %q, want ref/clip", d.Footage.Path)
	}
	if got := d.FootageDir(proj); got != clip {
		t.Errorf("FootageDir = %q, want %q", got, clip)
	}
	// A clip beside the project's folder goes up with "..".
	other := filepath.Join(dir, "plates", "take.gif")
	d.SetFootagePath(proj, other)
	if d.Footage.Path != "../plates/take.gif" {
		t.Errorf("path %q, want ../plates/take.gif", d.Footage.Path)
	}
	if got := d.FootageDir(proj); got != other {
		t.Errorf("FootageDir = %q, want %q", got, other)
	}
	// A project never saved keeps the absolute path, which resolves as it is.
	d.SetFootagePath("", other)
	if d.Footage.Path != filepath.ToSlash(other) {
		t.Errorf("unsaved project: %q", d.Footage.Path)
	}
	if got := d.FootageDir(""); got != other {
		t.Errorf("FootageDir of an absolute path = %q", got)
	}
	if got := d.FootageDir(proj); got != other {
		t.Errorf("FootageDir of an absolute path with a project = %q", got)
	}
	// A project file given by a relative path, footage relative to it.
	d.Footage.Path = "clip"
	if got := d.FootageDir(filepath.Join("a", "b.json")); got != filepath.Join("a", "clip") {
		t.Errorf("relative project: %q", got)
	}
	// Save as to another folder keeps pointing at the same clip.
	d.SetFootagePath(proj, clip)
	moved := filepath.Join(dir, "archive", "2026", "pan.json")
	d.RebaseFootage(proj, moved)
	if d.Footage.Path != "../../shots/ref/clip" || d.FootageDir(moved) != clip {
		t.Errorf("rebased to %q -> %q", d.Footage.Path, d.FootageDir(moved))
	}
	d.SetFootagePath("", clip)
	d.RebaseFootage(proj, moved)
	if d.Footage.Path != filepath.ToSlash(clip) {
		t.Errorf("an absolute path was rebased: %q", d.Footage.Path)
	}
	var none Document
	none.RebaseFootage(proj, moved)
	if none.Footage != nil {
		t.Error("RebaseFootage added footage")
	}
}

// TestFootage_BuildErrorIsProjectError: Build's footage errors are *Error
// like the rest, and a document edited in memory is checked too.
func TestFootage_BuildErrorIsProjectError(t *testing.T) {
	doc, err := Parse("pan.json", []byte(withParts(okPart)))
	if err != nil {
		t.Fatal(err)
	}
	doc.Footage = &Footage{Path: "clip", Marks: []mark.Mark{{Frame: 1, HasSecond: true, X2: 1e9}}}
	_, err = doc.Build()
	var pe *Error
	if !errors.As(err, &pe) || err.Error() != "pan.json: footage.marks[0].x2: must be a finite number of at most 1e+06 pixels from the image corner" {
		t.Errorf("got %v", err)
	}
}
