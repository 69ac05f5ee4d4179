package export

import (
	"bytes"
	"encoding/xml"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// daeSource is one <source> of a COLLADA 1.4.1 animation: its id and the
// numbers of its float_array.
type daeSource struct {
	ID     string `xml:"id,attr"`
	Floats string `xml:"float_array"`
}

// TestGLTF_SurvivesAssimp converts the take with an independent program,
// assimp (Debian assimp-utils), from GLB to COLLADA and reads the
// animation back: one key per glTF key, at times proportional to ours, and
// each key's baked matrix (COLLADA 1.4.1 spec, "matrix": row-major, the
// translation in the last column) equal to the take's rotation and centre
// of mass. assimp bakes translation, rotation and scale into one matrix a
// key and leaves the animation empty when their key counts differ, so this
// fails on a GLB whose channels do not share their keys. Skipped when
// assimp is not installed (CI installs it: .ci/run).
func TestGLTF_SurvivesAssimp(t *testing.T) {
	exe, err := exec.LookPath("assimp")
	if err != nil {
		t.Skip("assimp is not installed (apt-get install assimp-utils)")
	}
	in := panInput(t, 2)
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{Binary: true}); err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	glb, dae := filepath.Join(dir, "take.glb"), filepath.Join(dir, "take.dae")
	if err := os.WriteFile(glb, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	if out, err := exec.Command(exe, "export", glb, dae).CombinedOutput(); err != nil {
		t.Fatalf("assimp export: %v\n%s", err, out)
	}
	data, err := os.ReadFile(dae)
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Animations []struct {
			Sources []daeSource `xml:"source"`
		} `xml:"library_animations>animation"`
	}
	if err := xml.Unmarshal(data, &doc); err != nil {
		t.Fatalf("COLLADA: %v", err)
	}
	var times, mats []float64
	for _, a := range doc.Animations {
		for _, s := range a.Sources {
			switch {
			case strings.HasSuffix(s.ID, "-input"):
				times = parseFloats(t, s.Floats)
			case strings.HasSuffix(s.ID, "-output"):
				mats = parseFloats(t, s.Floats)
			}
		}
	}
	frames := in.Take.Frames
	if len(times) != len(frames) || len(mats) != 16*len(frames) {
		t.Fatalf("assimp kept %d key times and %d matrix numbers for %d keys (want %d and %d): the animation did not survive",
			len(times), len(mats), len(frames), len(frames), 16*len(frames))
	}
	last := frames[len(frames)-1].Time
	for i, f := range frames {
		// assimp writes its own time unit (ticks); the ratios are ours.
		if got := times[i] / times[len(times)-1]; math.Abs(got-f.Time/last) > 1e-5 {
			t.Errorf("key %d at %g of the flight, want %g", i, got, f.Time/last)
		}
		m := mats[16*i : 16*i+16]
		if p := (r3.Vec{X: m[3], Y: m[7], Z: m[11]}); r3.Norm(r3.Sub(p, f.CM)) > 1e-5 {
			t.Errorf("key %d translation %v, centre of mass %v", i, p, f.CM)
		}
		for j, e := range []r3.Vec{{X: 1}, {Y: 1}, {Z: 1}} {
			want := f.Orient.Rotate(e) // column j of the rotation
			got := r3.Vec{X: m[j], Y: m[4+j], Z: m[8+j]}
			if r3.Norm(r3.Sub(got, want)) > 1e-5 {
				t.Errorf("key %d: column %d of the rotation %v, want %v", i, j, got, want)
			}
		}
	}
}

func parseFloats(t *testing.T, s string) []float64 {
	t.Helper()
	var out []float64
	for _, w := range strings.Fields(s) {
		x, err := strconv.ParseFloat(w, 64)
		if err != nil {
			t.Fatalf("COLLADA number %q: %v", w, err)
		}
		out = append(out, x)
	}
	return out
}
