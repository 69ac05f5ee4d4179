package physics

import (
	"fmt"
	"math"
	"strconv"
	"strings"
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
func (r Rate) Timecode(n int) string { return r.timecode(n, r.IsDropFrame()) }

// TimecodeNonDrop is Timecode counting every label (non-drop), also at
// 30000/1001 and 60000/1001, with ':' before FF: the counting some
// productions use at 29.97 although the labels drift from the clock by
// 3.6 s an hour.
func (r Rate) TimecodeNonDrop(n int) string { return r.timecode(n, false) }

// IsDropFrame reports whether Timecode counts drop-frame at r: 30000/1001
// and 60000/1001.
func (r Rate) IsDropFrame() bool { return r.Den == 1001 && (r.Num == 30000 || r.Num == 60000) }

// nominal is the whole rate the labels count at, rounded half up without
// overflowing int64; at least 1.
func (r Rate) nominal() int {
	base := int(r.Num / r.Den)
	if rem := r.Num % r.Den; rem >= r.Den-rem {
		base++
	}
	return max(base, 1)
}

// dropPerMinute is the number of labels drop-frame skips each minute: 2
// at 29.97, 4 at 59.94.
func dropPerMinute(base int) int { return 2 * base / 30 }

func (r Rate) timecode(n int, drop bool) string {
	if n < 0 {
		if n == math.MinInt {
			n++ // -MinInt overflows; one frame off at the end of the range
		}
		return "-" + r.timecode(-n, drop)
	}
	base := r.nominal()
	sep := ":"
	if drop {
		sep = ";"
		d := dropPerMinute(base)
		perMin := base*60 - d
		per10 := perMin*10 + d
		tens, rem := n/per10, n%per10
		n += 9 * d * tens
		if rem > d {
			n += d * ((rem - d) / perMin)
		}
	}
	ff := n % base
	s := n / base
	return fmt.Sprintf("%02d:%02d:%02d%s%02d", s/3600, s/60%60, s%60, sep, ff)
}

// ParseTimecode reads a label HH:MM:SS:FF (';' or ':' before FF) and
// returns the frame count it labels at r, counting drop-frame when drop is
// true (which only 30000/1001 and 60000/1001 allow): the inverse of
// Timecode (drop) or TimecodeNonDrop. Hours may be 0 to 99, minutes and
// seconds 0 to 59, frames 0 to the nominal rate - 1; a label drop-frame
// skips (SS = 00 and FF below the labels skipped, in a minute that is not
// a tenth) is an error. Errors say which part is wrong.
func (r Rate) ParseTimecode(s string, drop bool) (int, error) {
	if drop && !r.IsDropFrame() {
		return 0, fmt.Errorf("drop-frame timecode needs 30000/1001 or 60000/1001 fps, not %s", r)
	}
	t := strings.TrimSpace(s)
	if i := strings.LastIndexAny(t, ";:."); i >= 0 {
		t = t[:i] + ":" + t[i+1:]
	}
	parts := strings.Split(t, ":")
	if len(parts) != 4 {
		return 0, fmt.Errorf("%q is not a timecode HH:MM:SS:FF", s)
	}
	base := r.nominal()
	var v [4]int
	for i, p := range parts {
		x, err := strconv.Atoi(p)
		if err != nil || len(p) == 0 || len(p) > 2 || x < 0 {
			return 0, fmt.Errorf("%q is not a timecode HH:MM:SS:FF (two digits each)", s)
		}
		v[i] = x
	}
	h, m, sec, ff := v[0], v[1], v[2], v[3]
	switch {
	case m > 59:
		return 0, fmt.Errorf("%q: minutes must be 00 to 59", s)
	case sec > 59:
		return 0, fmt.Errorf("%q: seconds must be 00 to 59", s)
	case ff >= base:
		return 0, fmt.Errorf("%q: frames must be 00 to %02d at %s fps", s, base-1, r)
	}
	mins := 60*h + m
	n := (3600*h+60*m+sec)*base + ff
	if drop {
		d := dropPerMinute(base)
		if sec == 0 && ff < d && m%10 != 0 {
			return 0, fmt.Errorf("%q: drop-frame timecode skips frames 00 to %02d at the start of this minute", s, d-1)
		}
		n -= d * (mins - mins/10)
	}
	return n, nil
}
