package physics

import (
	"math"
	"testing"
)

// TestTimecode checks drop-frame labels against the rule of SMPTE ST 12-1
// (labels :00 and :01 skipped each minute but every tenth; 10 minutes =
// 17982 frames) with the label table of REFERENCES.md §5.2, and plain
// counting at whole rates.
func TestTimecode(t *testing.T) {
	df := Rate{30000, 1001}
	tests := []struct {
		r    Rate
		n    int
		want string
	}{
		{df, 29, "00:00:00;29"},
		{df, 30, "00:00:01;00"},
		{df, 1799, "00:00:59;29"},
		{df, 1800, "00:01:00;02"},
		{df, 17981, "00:09:59;29"},
		{df, 17982, "00:10:00;00"},
		{df, 107892, "01:00:00;00"},
		{Rate{24, 1}, 0, "00:00:00:00"},
		{Rate{24, 1}, 23, "00:00:00:23"},
		{Rate{24, 1}, 24, "00:00:01:00"},
		{Rate{24, 1}, 24*3600 + 25, "01:00:01:01"},
		{Rate{25, 1}, 1499, "00:00:59:24"},
		{Rate{24000, 1001}, 24, "00:00:01:00"}, // non-drop at 23.976 (common practice, no source)
		{Rate{60000, 1001}, 3600, "00:01:00;04"},
		{Rate{24, 1}, -1, "-00:00:00:01"},
	}
	for _, tc := range tests {
		if got := tc.r.Timecode(tc.n); got != tc.want {
			t.Errorf("%v frame %d: %s, want %s", tc.r, tc.n, got, tc.want)
		}
	}
}

// TestTimecode_ExtremeRates: the nominal whole rate of a ratio near the
// int64 range is still its rounded value (here 10 fps: frame 25 is 2 s and 5
// frames), and the most negative frame does not recurse forever.
func TestTimecode_ExtremeRates(t *testing.T) {
	r := Rate{math.MaxInt64, math.MaxInt64 / 10} // 10.000000000000000007 fps
	if got := r.Timecode(25); got != "00:00:02:05" {
		t.Errorf("frame 25 at %v fps: %s, want 00:00:02:05", r, got)
	}
	if got := (Rate{24, 1}).Timecode(math.MinInt); got == "" || got[0] != '-' {
		t.Errorf("most negative frame: %q", got)
	}
}

// TestRate_FrameSaturates: a time beyond the int range (an infinite flip
// period, a rate of 1e-200 rad/s) gives the end of the int range, not the
// implementation-defined result of converting an out-of-range float.
func TestRate_FrameSaturates(t *testing.T) {
	r := Rate{24, 1}
	for _, c := range []struct {
		t    float64
		want int
	}{{math.Inf(1), math.MaxInt}, {1e300, math.MaxInt}, {math.Inf(-1), math.MinInt}, {-1e300, math.MinInt}, {math.NaN(), 0}, {1, 24}} {
		if got := r.Frame(c.t); got != c.want {
			t.Errorf("Frame(%g) = %d, want %d", c.t, got, c.want)
		}
		if got := r.Nearest(c.t); got != c.want {
			t.Errorf("Nearest(%g) = %d, want %d", c.t, got, c.want)
		}
	}
}

// TestParseTimecode: labels read back to the frames they label, and the
// one-hour counts of SMPTE ST 12-1: 86400 frames at 24, 108000 at 30
// non-drop, 107892 at 29.97 drop-frame (30 x 3600 minus 2 labels in each
// of the 54 minutes that are not a tenth).
func TestParseTimecode(t *testing.T) {
	r24, r2997, r5994 := Rate{Num: 24, Den: 1}, Rate{Num: 30000, Den: 1001}, Rate{Num: 60000, Den: 1001}
	for _, c := range []struct {
		r    Rate
		tc   string
		drop bool
		want int
	}{
		{r24, "01:00:00:00", false, 86400},
		{r24, "00:00:01:23", false, 47},
		{Rate{Num: 30, Den: 1}, "01:00:00:00", false, 108000},
		{r2997, "01:00:00;00", true, 107892},
		{r2997, "00:01:00;02", true, 1800},
		{r2997, "00:10:00;00", true, 17982},
		{r2997, "01:00:00:00", false, 108000},
		{r5994, "00:01:00;04", true, 3600},
	} {
		got, err := c.r.ParseTimecode(c.tc, c.drop)
		if err != nil || got != c.want {
			t.Errorf("%s at %s (drop %v) = %d, %v; want %d", c.tc, c.r, c.drop, got, err, c.want)
		}
	}
	// Round trips over the first eleven minutes and round the hour.
	for _, r := range []Rate{r24, r2997, r5994} {
		for _, start := range []int{0, 107800} {
			for n := start; n < start+11*60*60; n += 7 {
				if got, err := r.ParseTimecode(r.Timecode(n), r.IsDropFrame()); err != nil || got != n {
					t.Fatalf("%s: %d -> %s -> %d, %v", r, n, r.Timecode(n), got, err)
				}
				if got, err := r.ParseTimecode(r.TimecodeNonDrop(n), false); err != nil || got != n {
					t.Fatalf("%s non-drop: %d -> %s -> %d, %v", r, n, r.TimecodeNonDrop(n), got, err)
				}
			}
		}
	}
	for _, c := range []struct {
		r    Rate
		tc   string
		drop bool
	}{
		{r2997, "00:01:00;01", true}, {r24, "00:00:00:24", false}, {r24, "00:60:00:00", false},
		{r24, "1:00:00", false}, {r24, "aa:00:00:00", false}, {r24, "01:00:00:00", true}, {r24, "001:00:00:00", false},
	} {
		if _, err := c.r.ParseTimecode(c.tc, c.drop); err == nil {
			t.Errorf("%s at %s (drop %v): no error", c.tc, c.r, c.drop)
		}
	}
	if r2997.TimecodeNonDrop(1800) != "00:01:00:00" || r2997.Timecode(1800) != "00:01:00;02" {
		t.Errorf("29.97 labels of frame 1800: %s, %s", r2997.TimecodeNonDrop(1800), r2997.Timecode(1800))
	}
}
