package physics

import (
	"fmt"
	"math"
)

// Timecode returns the SMPTE timecode label of frame n (frame 0 =
// 00:00:00:00) at rate r, as HH:MM:SS:FF.
//
// Whole rates count FF from 0 to rate-1. The 1000/1001 rates are labelled
// by their nominal whole rate (24000/1001 -> 24, 30000/1001 -> 30); 30000/1001
// and 60000/1001 use drop-frame counting (SMPTE ST 12-1): labels :00 and :01
// (:00 to :03 at 59.94) are skipped at the start of every minute except
// each tenth, no frames are dropped, and the last separator is ';'. Other
// fractional rates count at their rounded rate. Negative n gives "-" and
// the label of -n.
func (r Rate) Timecode(n int) string {
	if n < 0 {
		if n == math.MinInt {
			n++ // -MinInt overflows; one frame off at the end of the range
		}
		return "-" + r.Timecode(-n)
	}
	// Nominal whole rate, rounded half up without overflowing int64.
	base := int(r.Num / r.Den)
	if rem := r.Num % r.Den; rem >= r.Den-rem {
		base++
	}
	if base < 1 {
		base = 1
	}
	sep := ":"
	if r.Den == 1001 && (r.Num == 30000 || r.Num == 60000) {
		sep = ";"
		drop := 2 * base / 30 // labels skipped a minute: 2 at 29.97, 4 at 59.94
		perMin := base*60 - drop
		per10 := perMin*10 + drop
		tens, rem := n/per10, n%per10
		n += 9 * drop * tens
		if rem > drop {
			n += drop * ((rem - drop) / perMin)
		}
	}
	ff := n % base
	s := n / base
	return fmt.Sprintf("%02d:%02d:%02d%s%02d", s/3600, s/60%60, s%60, sep, ff)
}
