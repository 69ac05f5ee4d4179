package export

import (
	"errors"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// TestWritePNGSequence_ImageLimit: a take with more images than
// MaxPNGImages is refused before anything is written, naming throw.fps;
// on twos the same take fits.
func TestWritePNGSequence_ImageLimit(t *testing.T) {
	in := pngTestInput(t)
	th := *in.Throw
	th.FPS = physics.Rate{Num: 10000, Den: 1}
	th.Velocity = r3.Vec{X: 0.2, Y: 6}
	take, err := physics.Simulate(in.Prop, in.Mass, &th)
	if err != nil {
		t.Fatal(err)
	}
	n := len(take.Frames)
	if n <= MaxPNGImages || (n+1)/2 > MaxPNGImages {
		t.Fatalf("the test take has %d frames; it needs more than %d and at most twice that", n, MaxPNGImages)
	}
	in.Throw, in.Take = &th, take
	dir := filepath.Join(t.TempDir(), "frames")
	files, err := WritePNGSequence(dir, in, PNGOptions{Width: 16, Height: 16}, nil)
	var fe *physics.FieldError
	if !errors.As(err, &fe) || fe.Field != "throw.fps" || len(files) != 0 {
		t.Fatalf("%d files, err %v: want a refusal on throw.fps", len(files), err)
	}
	if _, err := os.Stat(dir); err == nil {
		t.Error("the folder was made although nothing may be written")
	}
}

func TestGLTFKeyLimit(t *testing.T) {
	if err := checkKeys(100000, 1); err != nil {
		t.Errorf("100000 keys: %v", err)
	}
	err := checkKeys(100000, 11)
	var fe *physics.FieldError
	if !errors.As(err, &fe) || fe.Field != "throw.spin" {
		t.Errorf("1.1 million keys: %v", err)
	}
}
