package cli

import (
	"math"
	"strings"
	"testing"

	"propflight/physics"
)

func TestFrameAtOrAfter(t *testing.T) {
	r24 := physics.Rate{Num: 24, Den: 1}
	ntsc := physics.Rate{Num: 30000, Den: 1001}
	for _, c := range []struct {
		r    physics.Rate
		t    float64
		want int
	}{
		{r24, 0, 0},
		{r24, 0.5, 12},                     // exactly frame 12
		{r24, 0.5 + 1e-6, 13},              // just after: the next frame shows it
		{r24, 0.49, 12},                    // between 11 and 12
		{r24, 12.0 / 24 * (1 - 1e-15), 12}, // round-off below a frame counts as it
		{ntsc, 1.001, 30},                  // 30 frames at 30000/1001 fps is 1.001 s (REFERENCES.md §5.2)
		{ntsc, 1.0, 30},
	} {
		if got := c.r.FrameAtOrAfter(c.t); got != c.want {
			t.Errorf("%v.FrameAtOrAfter(%v) = %d, want %d", c.r, c.t, got, c.want)
		}
	}
}

// TestFrameAt_BeyondRange: a flip time of 1e300 s (a spin of 1e-299 rad/s)
// is past every frame; the summary says so instead of printing a wrapped
// negative frame number.
func TestFrameAt_BeyondRange(t *testing.T) {
	r24 := physics.Rate{Num: 24, Den: 1}
	if got := r24.FrameAtOrAfter(1e300); got != math.MaxInt {
		t.Errorf("1e300 s) = %d.FrameAtOrAfter(want math.MaxInt", got)
	}
	if got := frameAt(r24, 1e300); !strings.HasPrefix(got, "beyond any frame") || len(got) > 40 {
		t.Errorf("frameAt(1e300 s) = %q", got)
	}
	if got := frameAt(r24, 0.5); got != "frame 12 (0.500 s)" {
		t.Errorf("frameAt(0.5 s) = %q", got)
	}
}
