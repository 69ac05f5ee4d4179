package sheet

import (
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"
)

// Minus is the real minus sign (U+2212) the sheet prints for negative
// numbers, in place of the hyphen-minus of strconv.
const Minus = "\u2212"

// Decimals of the frame table's columns. A printed value is the take's
// value rounded to this many decimals (strconv 'f'), so it equals the CSV's
// value (strconv 'g' -1) to the printed precision.
const (
	DecimalsMetres = 4 // centre of mass and spacing, m
	DecimalsTurn   = 2 // turn since the previous row, degrees
	DecimalsTotal  = 1 // total turn since release, degrees
)

// fixed formats v with d decimals, a real minus sign, and no sign on a
// value that rounds to zero ("0.0000", never "−0.0000"). NaN and
// infinities print as "—".
func fixed(v float64, d int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	s := strconv.FormatFloat(v, 'f', d, 64)
	if strings.HasPrefix(s, "-") {
		if strings.Trim(s[1:], "0.") == "" {
			return s[1:]
		}
		return Minus + s[1:]
	}
	return s
}

var superscript = map[rune]rune{
	'0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴',
	'5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻',
}

// sig formats v to n significant figures: plain decimals for magnitudes
// from 0.001 to under 100000, else a mantissa times a power of ten written
// with superscripts ("1.25×10⁻⁵"). Real minus signs; "—" for NaN or an
// infinity.
func sig(v float64, n int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	if v == 0 {
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e-3 && a < 1e5 {
		s := strconv.FormatFloat(v, 'g', n, 64)
		if !strings.ContainsAny(s, "e") {
			return strings.Replace(s, "-", Minus, 1)
		}
		// 'g' chose an exponent (a value like 12345 at 3 figures): round
		// and print it whole.
		p := math.Pow(10, math.Floor(math.Log10(a))-float64(n)+1)
		return strings.Replace(strconv.FormatFloat(math.Round(v/p)*p, 'f', 0, 64), "-", Minus, 1)
	}
	s := strconv.FormatFloat(v, 'e', n-1, 64)
	mant, exp, _ := strings.Cut(s, "e")
	e, _ := strconv.Atoi(exp)
	var b strings.Builder
	b.WriteString(strings.Replace(mant, "-", Minus, 1))
	b.WriteString("×10")
	for _, r := range strconv.Itoa(e) {
		b.WriteRune(superscript[r])
	}
	return b.String()
}

// vec formats a vector as "(x, y, z)" with d decimals.
func vec(v r3.Vec, d int) string {
	return "(" + fixed(v.X, d) + ", " + fixed(v.Y, d) + ", " + fixed(v.Z, d) + ")"
}

// deg converts radians to degrees.
func deg(rad float64) float64 { return rad * 180 / math.Pi }

// plural returns "1 frame" or "3 frames".
func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return strconv.Itoa(n) + " " + word + "s"
}
