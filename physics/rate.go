package physics

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"
)

// Rate is a frame rate as an exact rational Num/Den frames per second, such
// as 24/1 or 24000/1001 (23.976). Frame n is at n Den / Num seconds.
type Rate struct {
	Num, Den int64
}

// FPS returns the rate in frames per second.
func (r Rate) FPS() float64 { return float64(r.Num) / float64(r.Den) }

// Time returns the time in seconds of frame n after release.
func (r Rate) Time(n int) float64 { return float64(n) * float64(r.Den) / float64(r.Num) }

// Frame returns the last frame at or before time t (seconds), allowing a
// relative slack of 1e-9 frame so that a time that is a frame exactly, up
// to round-off, counts as that frame. Times beyond the int range (such as
// +Inf) give math.MaxInt or math.MinInt.
func (r Rate) Frame(t float64) int { return saturate(math.Floor(t*r.FPS() + 1e-9)) }

// FrameAtOrAfter returns the first frame at or after time t: the frame on
// which an event at t has happened (with Frame's slack for a time that is
// a frame up to round-off), saturating as Frame does.
func (r Rate) FrameAtOrAfter(t float64) int { return saturate(math.Ceil(t*r.FPS() - 1e-9)) }

// Nearest returns the frame nearest time t, saturating as Frame does.
func (r Rate) Nearest(t float64) int { return saturate(math.Floor(t*r.FPS() + 0.5)) }

// saturate converts a whole number x to int, clamped to the int range (a
// plain conversion of an out-of-range float is implementation-defined in
// Go). NaN gives 0.
func saturate(x float64) int {
	switch {
	case x >= math.MaxInt: // float64(math.MaxInt) is 2^63, out of range
		return math.MaxInt
	case x <= math.MinInt:
		return math.MinInt
	case x == x:
		return int(x)
	}
	return 0
}

// String returns "24" for whole rates and "24000/1001" otherwise.
func (r Rate) String() string {
	if r.Den == 1 {
		return strconv.FormatInt(r.Num, 10)
	}
	return fmt.Sprintf("%d/%d", r.Num, r.Den)
}

// Valid reports whether the rate is positive and in a sane range (at most
// 10000 frames per second).
func (r Rate) Valid() bool {
	return r.Num > 0 && r.Den > 0 && float64(r.Num) <= 10000*float64(r.Den)
}

// ntscRates maps the rounded names of the 1000/1001 rates to their exact
// values (ITU-R BT.709; REFERENCES.md §5.2).
var ntscRates = map[string]Rate{
	"23.976": {24000, 1001}, "23.98": {24000, 1001},
	"29.97": {30000, 1001}, "47.952": {48000, 1001},
	"59.94": {60000, 1001}, "119.88": {120000, 1001},
}

// ParseRate reads a frame rate: a whole number ("24"), a ratio
// ("24000/1001"), or a decimal ("12.5"; the rounded NTSC names such as
// "23.976" and "29.97" mean their exact 1000/1001 rates).
func ParseRate(s string) (Rate, error) {
	s = strings.TrimSpace(s)
	if r, ok := ntscRates[s]; ok {
		return r, nil
	}
	var r Rate
	if num, den, ok := strings.Cut(s, "/"); ok {
		n, err1 := strconv.ParseInt(strings.TrimSpace(num), 10, 64)
		d, err2 := strconv.ParseInt(strings.TrimSpace(den), 10, 64)
		if err1 != nil || err2 != nil {
			return Rate{}, errors.New("must be a number or a ratio such as 24000/1001")
		}
		r = Rate{n, d}
	} else {
		x, ok := new(big.Rat).SetString(s)
		if !ok {
			return Rate{}, errors.New("must be a number or a ratio such as 24000/1001")
		}
		if !x.Num().IsInt64() || !x.Denom().IsInt64() {
			return Rate{}, errors.New("is out of range")
		}
		r = Rate{x.Num().Int64(), x.Denom().Int64()}
	}
	if r.Num <= 0 || r.Den <= 0 {
		return Rate{}, errors.New("must be positive")
	}
	g := gcd(r.Num, r.Den)
	r = Rate{r.Num / g, r.Den / g}
	if !r.Valid() {
		return Rate{}, errors.New("must be at most 10000 frames per second")
	}
	return r, nil
}

func gcd(a, b int64) int64 {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}
