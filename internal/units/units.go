// Package units holds the one table of unit factors Propflight reads and
// shows: metric prefixes and the imperial units, each as an exact ratio of
// SI base units (metres or kilograms) per one of the unit. The number
// fields convert through [Factor.Rat] exactly and round once; the verdict
// panel and the mesh readers take [Factor.Float], the nearest float64.
//
// The imperial factors are exact by definition, from NIST Special
// Publication 811 (2008), Appendix B: the international inch is 0.0254 m,
// the foot 0.3048 m, the avoirdupois pound 0.45359237 kg (the ounce a
// sixteenth of it) and the statute mile 5280 ft = 1609.344 m.
//
// The package imports only the standard library.
package units

import "math/big"

// Factor is an exact unit factor: num/den base units per one of the unit.
// It is a value, so the table cannot be changed by a caller.
type Factor struct{ num, den int64 }

// The factors. Lengths are metres per unit, masses kilograms per unit.
var (
	One        = Factor{1, 1}
	Centimetre = Factor{1, 100}
	Millimetre = Factor{1, 1000}
	Inch       = Factor{254, 10_000}
	Foot       = Factor{3048, 10_000}
	Mile       = Factor{1_609_344, 1000}
	Gram       = Factor{1, 1000}
	Pound      = Factor{45_359_237, 100_000_000}
	Ounce      = Factor{45_359_237, 1_600_000_000}
)

// Rat returns the factor as a new exact rational.
func (f Factor) Rat() *big.Rat { return big.NewRat(f.num, f.den) }

// Float returns the float64 nearest to the factor (0.0254 for the inch,
// the same number as the literal).
func (f Factor) Float() float64 {
	v, _ := f.Rat().Float64()
	return v
}
