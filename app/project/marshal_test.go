package project

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
)

// roundTrip saves doc to a fresh file and loads it back.
func roundTrip(t *testing.T, doc *Document) (*Document, []byte) {
	t.Helper()
	path := filepath.Join(t.TempDir(), "saved.json")
	if err := Save(path, doc); err != nil {
		t.Fatal(err)
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	back, err := Load(path)
	if err != nil {
		t.Fatalf("reloading what Save wrote: %v\n%s", err, data)
	}
	return back, data
}

func TestSave_RoundTrip(t *testing.T) {
	files, err := filepath.Glob("testdata/*.json")
	if err != nil || len(files) < 3 {
		t.Fatalf("testdata files: %v %v", files, err)
	}
	files = append(files, "../../assets/presets/frying-pan.json")
	for _, f := range files {
		doc, err := Load(f)
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		back, data := roundTrip(t, doc)
		back.File = doc.File
		if !reflect.DeepEqual(doc, back) {
			t.Errorf("%s: Load -> Save -> Load changed the document\nsaved:\n%s", f, data)
		}
		// Saving again gives the same bytes.
		again, err := Marshal(back)
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(again, data) {
			t.Errorf("%s: Marshal is not stable:\n%s\n---\n%s", f, data, again)
		}
	}
}

func TestSave_KeepsUsersChoices(t *testing.T) {
	// What the user wrote comes back, and no default is added.
	doc, err := Load("testdata/hang.json")
	if err != nil {
		t.Fatal(err)
	}
	_, data := roundTrip(t, doc)
	s := string(data)
	for _, want := range []string{`"fps": 30`, `"hang_frames": 27`, `"distance": 2.5`, `"heading_deg": 45`, `"axis": [0, 0.6, 0.8]`, `"frames_per_turn": 15.5`} {
		if !strings.Contains(s, want) {
			t.Errorf("saved file lacks %s:\n%s", want, s)
		}
	}
	for _, absent := range []string{"gravity", "release_position", "release_velocity", "turns_per_second", "ground_y", "orientation_deg", "tilt", `"name"`} {
		if strings.Contains(s, absent) {
			t.Errorf("saved file gained %s:\n%s", absent, s)
		}
	}
	doc, err = Load("testdata/every-field.json")
	if err != nil {
		t.Fatal(err)
	}
	_, data = roundTrip(t, doc)
	if !strings.Contains(string(data), `"fps": "24000/1001"`) {
		t.Errorf("a string frame rate did not stay a string:\n%s", data)
	}
	if !strings.Contains(string(data), `<one of each shape> & a velocity`) {
		t.Errorf("name escaped:\n%s", data)
	}
}

func TestMarshal_Layout(t *testing.T) {
	doc, err := Parse("m.json", []byte(`{"prop": {"parts": [{"mass": 2, "size": [0.2, 0.1, 0.05], "shape": "box"}]},
		"throw": {"spin": {"turns_per_second": 2, "axis": "middle"}, "fps": 24, "release_velocity": [1e-7, 4, -0]},
		"format": "propflight/v1"}`))
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
  "throw": {
    "fps": 24,
    "release_velocity": [1e-7, 4, -0],
    "spin": {
      "axis": "middle",
      "turns_per_second": 2
    }
  }
}
`
	if string(got) != want {
		t.Errorf("got\n%s\nwant\n%s", got, want)
	}
}

func TestMarshal_EmptyPartsAndNoThrow(t *testing.T) {
	got, err := Marshal(&Document{})
	if err != nil {
		t.Fatal(err)
	}
	want := "{\n  \"format\": \"propflight/v1\",\n  \"prop\": {\n    \"parts\": []\n  }\n}\n"
	if string(got) != want {
		t.Errorf("got %q, want %q", got, want)
	}
}

func TestMarshal_NonFiniteIsAnError(t *testing.T) {
	r, nan := 0.1, math.NaN()
	inf := math.Inf(1)
	for _, c := range []struct {
		doc  Document
		want string
	}{
		{Document{File: "p.json", Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &r, Mass: &nan}}}}, "p.json: prop.parts[0].mass: must be a finite number"},
		{Document{Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &r, Mass: &r, Position: &Vec3{0, inf, 0}}}}}, "prop.parts[0].position[1]: must be a finite number"},
		{Document{Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &r, Mass: &r}}}, Throw: Throw{FPS: &FrameRate{Number: inf}}}, "throw.fps: must be a finite number"},
	} {
		_, err := Marshal(&c.doc)
		if err == nil || err.Error() != c.want {
			t.Errorf("got %v, want %s", err, c.want)
		}
	}
}

func TestSave_FailureLeavesOldFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "pan.json")
	old := []byte(withParts(okPart))
	if err := os.WriteFile(path, old, 0o644); err != nil {
		t.Fatal(err)
	}
	nan := math.NaN()
	bad := &Document{Prop: Prop{Parts: []Part{{Shape: "sphere", Radius: &nan, Mass: &nan}}}}
	if err := Save(path, bad); err == nil {
		t.Fatal("saved a NaN")
	}
	got, _ := os.ReadFile(path)
	if !bytes.Equal(got, old) {
		t.Error("old file changed")
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		t.Errorf("folder holds %d entries, want only pan.json", len(entries))
	}
	if err := Save(filepath.Join(dir, "missing", "x.json"), &Document{}); err == nil {
		t.Error("saved into a missing folder")
	}
}

func TestLoad_Errors(t *testing.T) {
	dir := t.TempDir()
	missing := filepath.Join(dir, "nope.json")
	_, err := Load(missing)
	var pe *Error
	if !errors.As(err, &pe) || err.Error() != missing+": no such file" {
		t.Errorf("missing file: %v", err)
	}
	_, err = Load(dir)
	if !errors.As(err, &pe) || err.Error() != dir+": is a folder, not a project file" {
		t.Errorf("folder: %v", err)
	}
}

func TestLoad_SizeLimit(t *testing.T) {
	dir := t.TempDir()
	// A valid file padded with spaces to exactly the limit loads...
	body := withParts(okPart)
	at := filepath.Join(dir, "at.json")
	if err := os.WriteFile(at, []byte(body+strings.Repeat(" ", MaxFileSize-len(body))), 0o644); err != nil {
		t.Fatal(err)
	}
	if _, err := Load(at); err != nil {
		t.Errorf("file of exactly %d bytes: %v", MaxFileSize, err)
	}
	// ... and one byte more is refused with a clear message.
	over := filepath.Join(dir, "over.json")
	if err := os.WriteFile(over, []byte(body+strings.Repeat(" ", MaxFileSize-len(body)+1)), 0o644); err != nil {
		t.Fatal(err)
	}
	_, err := Load(over)
	want := over + ": the file is larger than 16 MiB, the limit for project files; is it really one?"
	if err == nil || err.Error() != want {
		t.Errorf("got %v, want %s", err, want)
	}
	if _, err := Parse("big.json", make([]byte, MaxFileSize+1)); err == nil || !strings.Contains(err.Error(), "16 MiB") {
		t.Errorf("Parse of a large buffer: %v", err)
	}
}

func TestMarshal_NumbersAsEncodingJSON(t *testing.T) {
	// The emitter's number form must be encoding/json's, the reference
	// for what JSON readers accept and for the shortest round trip.
	rng := rand.New(rand.NewPCG(1, 1))
	values := []float64{0, math.Copysign(0, -1), 1, -1, 0.1, 1e-6, 9.99e-7, 1e-7, 1e20, 1e21, 123456789012345678901234.0, 5e-324, math.MaxFloat64, -2.5e-10, 24000.0 / 1001}
	for range 2000 {
		values = append(values, math.Float64frombits(rng.Uint64()))
	}
	for _, x := range values {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			continue
		}
		var e emitter
		e.number(func() string { return "x" }, x)
		want, _ := json.Marshal(x)
		if got := e.buf.String(); got != string(want) {
			t.Errorf("%v: emitter writes %s, encoding/json %s", x, got, want)
		}
	}
}
