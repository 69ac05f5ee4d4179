package physics

import (
	"math"
	"testing"
)

// TestRate_FrameAtOrAfter: an event at t shows on the first frame at or
// after it; a time that is a frame up to round-off is that frame (frame n
// at n/fps, DESIGN.md "Conventions").
func TestRate_FrameAtOrAfter(t *testing.T) {
	r := Rate{24000, 1001}
	tests := []struct {
		t    float64
		want int
	}{
		{0, 0}, {r.Time(5), 5}, {r.Time(5) + 1e-6, 6}, {r.Time(5) - 1e-6, 5},
		{math.Inf(1), math.MaxInt}, {math.NaN(), 0},
	}
	for _, tc := range tests {
		if got := r.FrameAtOrAfter(tc.t); got != tc.want {
			t.Errorf("FrameAtOrAfter(%g) = %d, want %d", tc.t, got, tc.want)
		}
	}
}
