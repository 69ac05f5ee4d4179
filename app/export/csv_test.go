package export

import (
	"bufio"
	"bytes"
	"errors"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// brickTake flies the contract sample (a 2 kg box 0.2 x 0.1 x 0.05 m spun
// about its middle axis) as the CLI does.
func brickTake(t testing.TB) *physics.Take {
	t.Helper()
	prop := physics.Prop{Parts: []physics.Part{{Name: "brick", Shape: physics.Box, Size: r3.Vec{X: 0.2, Y: 0.1, Z: 0.05}, Mass: 2, Orient: physics.IdentityRotation()}}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := physics.DefaultThrow()
	th.Velocity = r3.Vec{X: 2, Y: 4}
	th.Spin = physics.Spin{Axis: physics.Middle, Tilt: 2 * math.Pi / 180, TiltToward: physics.Least, Rate: 4 * math.Pi}
	take, err := physics.Simulate(&prop, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	return take
}

func TestWriteCSV_HeaderRowsAndValues(t *testing.T) {
	take := brickTake(t)
	var buf bytes.Buffer
	if err := WriteCSV(&buf, take); err != nil {
		t.Fatal(err)
	}
	if !strings.HasSuffix(buf.String(), "\n") {
		t.Error("output does not end with a newline")
	}
	lines := strings.Split(strings.TrimSuffix(buf.String(), "\n"), "\n")
	if lines[0] != "frame,time_s,cg_x,cg_y,cg_z,qw,qx,qy,qz,wx,wy,wz,turn_deg,spacing_m" {
		t.Fatalf("header %q", lines[0])
	}
	rows := lines[1:]
	if len(rows) != take.LandingFrame+1 || take.LandingFrame < 10 {
		t.Fatalf("%d rows for landing frame %d", len(rows), take.LandingFrame)
	}
	for i, row := range rows {
		cols := strings.Split(row, ",")
		if len(cols) != 14 {
			t.Fatalf("row %d has %d columns", i, len(cols))
		}
		if n, err := strconv.Atoi(cols[0]); err != nil || n != i {
			t.Errorf("row %d: frame %q", i, cols[0])
		}
		var got [13]float64
		for j, c := range cols[1:] {
			x, err := strconv.ParseFloat(c, 64)
			if err != nil {
				t.Fatalf("row %d column %d: %v", i, j+1, err)
			}
			got[j] = x
		}
		// Exact: the shortest 'g' form round-trips a float64.
		if want := frameValues(&take.Frames[i]); got != want {
			t.Errorf("row %d reads back as %v, want %v", i, got, want)
		}
		q := quat.Number{Real: got[4], Imag: got[5], Jmag: got[6], Kmag: got[7]}
		if n := quat.Abs(q); math.Abs(n-1) > 1e-12 {
			t.Errorf("row %d: |q| = %.15g", i, n)
		}
	}
	// Frame 0 is release: no turn, no spacing.
	if !strings.HasSuffix(rows[0], ",0,0") {
		t.Errorf("frame 0 row %q", rows[0])
	}
}

func TestWriteCSV_BadTakes(t *testing.T) {
	good := brickTake(t)
	short := *good
	short.Frames = good.Frames[:3]
	renumbered := *good
	renumbered.Frames = append([]physics.Frame(nil), good.Frames...)
	renumbered.Frames[2].N = 7
	nan := *good
	nan.Frames = append([]physics.Frame(nil), good.Frames...)
	nan.Frames[1].CM.Y = math.NaN()
	for _, c := range []struct {
		take *physics.Take
		want string
	}{
		{nil, "export: no take to write"},
		{&short, "export: the take has 3 frames but lands on frame " + strconv.Itoa(good.LandingFrame)},
		{&renumbered, "export: frame 2 of the take is numbered 7"},
		{&nan, "export: frame 1 holds a value that is not a finite number"},
	} {
		var buf bytes.Buffer
		err := WriteCSV(&buf, c.take)
		if err == nil || err.Error() != c.want {
			t.Errorf("got %v, want %s", err, c.want)
		}
		if buf.Len() != 0 {
			t.Errorf("%s: wrote %d bytes", c.want, buf.Len())
		}
	}
}

// failAfter accepts n writes, then fails every one and counts them.
type failAfter struct {
	n, calls int
}

var errDiskFull = errors.New("disk full")

func (f *failAfter) Write(p []byte) (int, error) {
	f.calls++
	if f.calls > f.n {
		return 0, errDiskFull
	}
	return len(p), nil
}

func TestWriteCSV_StickyError(t *testing.T) {
	take := brickTake(t)
	w := &failAfter{n: 2}
	if err := WriteCSV(w, take); !errors.Is(err, errDiskFull) {
		t.Fatalf("err = %v", err)
	}
	if w.calls != 3 {
		t.Errorf("%d writes; want the failing one to be the last", w.calls)
	}
}

func ExampleWriteCSV() {
	// A prop dropped at 25 fps from rest, no spin: two frames by hand
	// (y = 1.5 - g t^2 / 2 with g = 9.80665 m/s^2, t = 0.04 s).
	take := &physics.Take{LandingFrame: 1, Frames: []physics.Frame{
		{N: 0, CM: r3.Vec{Y: 1.5}, Orient: physics.IdentityRotation()},
		{N: 1, Time: 0.04, CM: r3.Vec{Y: 1.49215468}, Orient: physics.IdentityRotation(), Spacing: 0.00784532},
	}}
	w := bufio.NewWriter(os.Stdout)
	if err := WriteCSV(w, take); err != nil {
		panic(err)
	}
	w.Flush()
	// Output:
	// frame,time_s,cg_x,cg_y,cg_z,qw,qx,qy,qz,wx,wy,wz,turn_deg,spacing_m
	// 0,0,0,1.5,0,1,0,0,0,0,0,0,0,0
	// 1,0.04,0,1.49215468,0,1,0,0,0,0,0,0,0,0.00784532
}

func BenchmarkWriteCSV(b *testing.B) {
	take := brickTake(b)
	var buf bytes.Buffer
	for b.Loop() {
		buf.Reset()
		if err := WriteCSV(&buf, take); err != nil {
			b.Fatal(err)
		}
	}
	b.SetBytes(int64(buf.Len()))
	b.ReportMetric(float64(len(take.Frames)), "frames")
}

// TestWriteCSVTwos: on twos the rows are frames 0, 2, 4, ... and each row's
// turn and spacing run from the previous row (for a steady spin about the
// greatest axis, twice the per-frame turn: 2 turns/s at 24 fps is 30
// degrees a frame, so 60 on twos; common practice, no source).
func TestWriteCSVTwos(t *testing.T) {
	take := twosTake(t)
	var buf bytes.Buffer
	if err := WriteCSVTwos(&buf, take); err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(buf.String()), "\n")
	if lines[0] != CSVHeader || len(lines)-1 != (len(take.Frames)+1)/2 {
		t.Fatalf("%d rows for %d frames", len(lines)-1, len(take.Frames))
	}
	for i, l := range lines[1:] {
		cols := strings.Split(l, ",")
		if cols[0] != strconv.Itoa(2*i) {
			t.Fatalf("row %d is frame %s", i, cols[0])
		}
		if i == 0 {
			continue
		}
		turn, _ := strconv.ParseFloat(cols[12], 64)
		if math.Abs(turn-60) > 1e-6 {
			t.Errorf("row %d turn %g, want 60", i, turn)
		}
		spacing, _ := strconv.ParseFloat(cols[13], 64)
		a, b := take.Frames[2*i-2].CM, take.Frames[2*i].CM
		if want := math.Sqrt((a.X-b.X)*(a.X-b.X) + (a.Y-b.Y)*(a.Y-b.Y) + (a.Z-b.Z)*(a.Z-b.Z)); math.Abs(spacing-want) > 1e-12 {
			t.Errorf("row %d spacing %g, want %g", i, spacing, want)
		}
	}
}

func twosTake(t *testing.T) *physics.Take {
	t.Helper()
	prop := physics.Prop{Parts: []physics.Part{{Shape: physics.Box, Size: r3.Vec{X: 0.3, Y: 0.2, Z: 0.02}, Mass: 1, Orient: physics.IdentityRotation()}}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := physics.DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: 4}
	th.Spin = physics.Spin{Axis: physics.Greatest, Rate: 2 * 2 * math.Pi}
	take, err := physics.Simulate(&prop, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	return take
}
