package cli

import (
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
		if got := frameAtOrAfter(c.r, c.t); got != c.want {
			t.Errorf("frameAtOrAfter(%v, %v) = %d, want %d", c.r, c.t, got, c.want)
		}
	}
}
