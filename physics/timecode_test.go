package physics

import "testing"

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
