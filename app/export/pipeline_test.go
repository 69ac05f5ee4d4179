package export

import (
	"bytes"
	"math"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// TestWriteCSVWith_StartFrameAndZUp: with StartFrame 1001 and ZUp the
// frame column counts from 1001, time_s stays the time since release,
// positions and angular velocities are turned by (x, y, z) -> (x, -z, y)
// (REFERENCES.md §13), and the orientation is the same rotation in the
// z-up axes: applied to a prop vector turned the same way, it gives the
// turned world vector (C R v = R' C v for every v).
func TestWriteCSVWith_StartFrameAndZUp(t *testing.T) {
	in := panInput(t, 2)
	var buf bytes.Buffer
	if err := WriteCSVWith(&buf, in.Take, CSVOptions{StartFrame: 1001, ZUp: true}); err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSuffix(buf.String(), "\n"), "\n")
	if lines[0] != CSVHeader || len(lines)-1 != len(in.Take.Frames) {
		t.Fatalf("header %q, %d rows for %d frames", lines[0], len(lines)-1, len(in.Take.Frames))
	}
	probes := []r3.Vec{{X: 1}, {Y: 1}, {Z: 1}, {X: 0.3, Y: -0.7, Z: 0.2}}
	for i, f := range in.Take.Frames {
		var c [14]float64
		for k, s := range strings.Split(lines[i+1], ",") {
			x, err := strconv.ParseFloat(s, 64)
			if err != nil {
				t.Fatalf("row %d column %d: %v", i, k, err)
			}
			c[k] = x
		}
		if c[0] != float64(1001+f.N) || c[1] != f.Time {
			t.Errorf("row %d: frame %v time %v, want %d and %v", i, c[0], c[1], 1001+f.N, f.Time)
		}
		if c[2] != f.CM.X || c[3] != -f.CM.Z || c[4] != f.CM.Y {
			t.Errorf("row %d: cg %v, want (x, -z, y) of %v", i, c[2:5], f.CM)
		}
		if c[9] != f.Omega.X || c[10] != -f.Omega.Z || c[11] != f.Omega.Y {
			t.Errorf("row %d: w %v, want (x, -z, y) of %v", i, c[9:12], f.Omega)
		}
		q := physics.Rotation{Real: c[5], Imag: c[6], Jmag: c[7], Kmag: c[8]}
		if n := quat.Abs(q.Quat()); math.Abs(n-1) > 1e-12 {
			t.Errorf("row %d: |q| = %v", i, n)
		}
		for _, v := range probes {
			want := ZUpVec(f.Orient.Rotate(v))
			got := q.Rotate(ZUpVec(v))
			if r3.Norm(r3.Sub(got, want)) > 1e-12 {
				t.Errorf("row %d: R' C v = %v, C R v = %v", i, got, want)
			}
		}
		if c[12] != f.TurnDeg || c[13] != f.Spacing {
			t.Errorf("row %d: turn and spacing changed", i)
		}
	}
	// The quarter turn keeps right-handed axes: z-up's z is y-up's y and
	// x stays (x cross y = z in both).
	if x, y := ZUpVec(r3.Vec{X: 1}), ZUpVec(r3.Vec{Z: -1}); r3.Cross(x, y) != ZUpVec(r3.Vec{Y: 1}) || ZUpVec(r3.Vec{Y: 1}) != (r3.Vec{Z: 1}) {
		t.Errorf("z-up axes are not right-handed or y does not go to z")
	}
	if err := WriteCSVWith(&buf, in.Take, CSVOptions{StartFrame: -1}); err == nil || !strings.Contains(err.Error(), "start-frame") {
		t.Errorf("negative start frame: %v", err)
	}
}

// TestWritePNGSequence_StartFrameNames: file numbers start at StartFrame
// and pad to the last one.
func TestWritePNGSequence_StartFrameNames(t *testing.T) {
	in := panInput(t, 2)
	dir := t.TempDir()
	files, err := WritePNGSequence(dir, in, PNGOptions{Width: 16, Height: 16, StartFrame: 1001, Twos: true}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.HasSuffix(files[0], "pan_1001.png") || !strings.HasSuffix(files[1], "pan_1003.png") {
		t.Errorf("files %v...", files[:2])
	}
}
