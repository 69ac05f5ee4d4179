package widgets

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"regexp"
	"strconv"
	"strings"

	"propflight/internal/units"
)

// Quantity says what a NumberField holds, and so its unit inside, the
// units it shows and the units its entry accepts.
//
// The value inside is SI (m, kg, kg/m^3, m/s, s, m/s^2) except for Angle,
// which is in degrees, TurnRate, which is in turns per second, and Frames,
// which counts frames: these are the units the screen and the project file
// use, and the caller converts to radians where physics wants them.
type Quantity int

// The quantities and their units inside.
const (
	Plain        Quantity = iota // a bare number, no unit
	Length                       // m; imperial display in (short fields) or ft
	Mass                         // kg; imperial lb
	Density                      // kg/m^3; imperial lb/ft^3
	Angle                        // degrees (not radians)
	Speed                        // m/s; imperial ft/s
	TurnRate                     // turns per second
	Duration                     // s
	Acceleration                 // m/s^2; imperial ft/s^2
	Frames                       // frames, whole numbers
)

var quantityNames = [...]string{"plain", "length", "mass", "density", "angle", "speed",
	"turn rate", "duration", "acceleration", "frames"}

// String returns the quantity's name in lower case ("turn rate").
func (q Quantity) String() string {
	if q < 0 || int(q) >= len(quantityNames) {
		return "quantity(" + strconv.Itoa(int(q)) + ")"
	}
	return quantityNames[q]
}

// ratMul and ratQuo return new rationals, leaving their operands alone.
func ratMul(a, b *big.Rat) *big.Rat { return new(big.Rat).Mul(a, b) }
func ratQuo(a, b *big.Rat) *big.Rat { return new(big.Rat).Quo(a, b) }

// unit is one way of writing a quantity: value inside = number * factor.
type unit struct {
	symbol string   // as shown beside the entry
	names  []string // what the entry accepts after a number, lower case
	factor *big.Rat // exact base units per one of this unit
}

// The units, their factors from the one table in [units] (NIST SP 811,
// Appendix B, for the imperial ones).
var (
	unitNone    = unit{"", nil, units.One.Rat()}
	unitMetre   = unit{"m", []string{"m"}, units.One.Rat()}
	unitCm      = unit{"cm", []string{"cm"}, units.Centimetre.Rat()}
	unitMm      = unit{"mm", []string{"mm"}, units.Millimetre.Rat()}
	unitInch    = unit{"in", []string{"in", "\"", "inch", "inches"}, units.Inch.Rat()}
	unitFoot    = unit{"ft", []string{"ft", "'", "foot", "feet"}, units.Foot.Rat()}
	unitKg      = unit{"kg", []string{"kg"}, units.One.Rat()}
	unitGram    = unit{"g", []string{"g"}, units.Gram.Rat()}
	unitPound   = unit{"lb", []string{"lb", "lbs"}, units.Pound.Rat()}
	unitOunce   = unit{"oz", []string{"oz"}, units.Ounce.Rat()}
	unitKgM3    = unit{"kg/m³", []string{"kg/m³", "kg/m3", "kg/m^3"}, units.One.Rat()}
	unitGCm3    = unit{"g/cm³", []string{"g/cm³", "g/cm3", "g/cm^3"}, big.NewRat(1000, 1)}
	unitLbFt3   = unit{"lb/ft³", []string{"lb/ft³", "lb/ft3", "lb/ft^3"}, ratQuo(units.Pound.Rat(), ratMul(units.Foot.Rat(), ratMul(units.Foot.Rat(), units.Foot.Rat())))}
	unitDegree  = unit{"°", []string{"°", "deg", "degrees"}, units.One.Rat()}
	unitMS      = unit{"m/s", []string{"m/s"}, units.One.Rat()}
	unitFtS     = unit{"ft/s", []string{"ft/s"}, units.Foot.Rat()}
	unitKmH     = unit{"km/h", []string{"km/h", "kph"}, big.NewRat(1000, 3600)}
	unitMph     = unit{"mph", []string{"mph", "mi/h"}, ratQuo(units.Mile.Rat(), big.NewRat(3600, 1))}
	unitTurnsS  = unit{"turns/s", []string{"turns/s", "turn/s", "rps", "/s"}, units.One.Rat()}
	unitRpm     = unit{"rpm", []string{"rpm", "turns/min"}, big.NewRat(1, 60)}
	unitSecond  = unit{"s", []string{"s", "sec"}, units.One.Rat()}
	unitMilli   = unit{"ms", []string{"ms"}, big.NewRat(1, 1000)}
	unitMS2     = unit{"m/s²", []string{"m/s²", "m/s2", "m/s^2"}, units.One.Rat()}
	unitFtS2    = unit{"ft/s²", []string{"ft/s²", "ft/s2", "ft/s^2"}, units.Foot.Rat()}
	unitFrames  = unit{"frames", []string{"frames", "frame", "fr", "f"}, units.One.Rat()}
	shortLength = 2.0 // m: a length field whose range ends at or below this shows inches in imperial
)

// display returns the unit a field of quantity q shows: metric or imperial,
// and for lengths inches when the field's largest value is at most
// shortLength metres, feet above.
func (q Quantity) display(imperial bool, max float64) unit {
	switch q {
	case Length:
		if !imperial {
			return unitMetre
		}
		if max <= shortLength {
			return unitInch
		}
		return unitFoot
	case Mass:
		if imperial {
			return unitPound
		}
		return unitKg
	case Density:
		if imperial {
			return unitLbFt3
		}
		return unitKgM3
	case Angle:
		return unitDegree
	case Speed:
		if imperial {
			return unitFtS
		}
		return unitMS
	case TurnRate:
		return unitTurnsS
	case Duration:
		return unitSecond
	case Acceleration:
		if imperial {
			return unitFtS2
		}
		return unitMS2
	case Frames:
		return unitFrames
	}
	return unitNone
}

// accepted returns every unit the entry of quantity q accepts after a
// number, metric and imperial alike.
func (q Quantity) accepted() []unit {
	switch q {
	case Length:
		return []unit{unitMetre, unitCm, unitMm, unitInch, unitFoot}
	case Mass:
		return []unit{unitKg, unitGram, unitPound, unitOunce}
	case Density:
		return []unit{unitKgM3, unitGCm3, unitLbFt3}
	case Angle:
		return []unit{unitDegree}
	case Speed:
		return []unit{unitMS, unitFtS, unitKmH, unitMph}
	case TurnRate:
		return []unit{unitTurnsS, unitRpm}
	case Duration:
		return []unit{unitSecond, unitMilli}
	case Acceleration:
		return []unit{unitMS2, unitFtS2}
	case Frames:
		return []unit{unitFrames}
	}
	return nil
}

// toDisplay converts a value inside to the number shown in unit u: one
// exact rational division, rounded once to the nearest float64. NaN and
// infinities pass through.
func toDisplay(v float64, u unit) float64 {
	r := new(big.Rat)
	if math.IsNaN(v) || math.IsInf(v, 0) || r.SetFloat64(v) == nil {
		return v
	}
	f, _ := r.Quo(r, u.factor).Float64()
	return f
}

// fromDisplay converts an exact typed number in unit u to the value inside,
// rounded once to the nearest float64, so "12 in" is exactly 0.3048 m as
// a float64 literal.
func fromDisplay(x *big.Rat, u unit) float64 {
	f, _ := new(big.Rat).Mul(x, u.factor).Float64()
	return f
}

// Digits shown: displayDigits significant digits for values and
// boundDigits in the range messages.
const (
	displayDigits = 4
	boundDigits   = 6
	maxDecimals   = 9
)

// formatSig formats x with sig significant digits (at most maxDecimals
// decimals, never exponent notation) and no trailing zeros: 9.80665 with 4
// digits is "9.807", 7850 is "7850", 0 is "0".
func formatSig(x float64, sig int) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return strconv.FormatFloat(x, 'g', -1, 64)
	}
	if x == 0 {
		return "0"
	}
	dec := sig - 1 - int(math.Floor(math.Log10(math.Abs(x))))
	dec = min(max(dec, 0), maxDecimals)
	s := strconv.FormatFloat(x, 'f', dec, 64)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	if s == "-0" {
		s = "0"
	}
	return s
}

// formatValue returns the entry text of value v (inside units) shown in
// unit u: whole numbers for Frames, displayDigits significant digits
// otherwise.
func formatValue(v float64, q Quantity, u unit) string {
	x := toDisplay(v, u)
	if q == Frames {
		return strconv.FormatFloat(math.Round(x), 'f', 0, 64)
	}
	return formatSig(x, displayDigits)
}

// withUnit appends the unit symbol to a number for messages ("0.001 m").
func withUnit(s string, u unit) string {
	switch {
	case u.symbol == "":
		return s
	case u.symbol == "°":
		return s + "°"
	}
	return s + " " + u.symbol
}

// numberRE matches a typed number and what follows it: a decimal with an
// optional exponent (group 2), or a fraction of whole numbers ("1/8").
var numberRE = regexp.MustCompile(`^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?(\d+))?(?:/\d{1,15})?)\s*(.*)$`)

// maxExpDigits bounds the exponent's digits so that the exact rational of
// a typed number stays small (10^999 at most).
const maxExpDigits = 3

// errNotNumber is the message for text that does not start with a number.
var errNotNumber = errors.New("not a number")

// maxTyped is the longest text the entry parses, in bytes.
const maxTyped = 64

// parseTyped reads the entry text of a field of quantity q shown in unit
// shown: a number, optionally followed by one of the quantity's units
// ("12", "12 in", "30cm", "1/8 in"); a bare number is in the shown unit.
// It returns the value inside units, converted exactly and rounded once.
func parseTyped(text string, q Quantity, shown unit) (float64, error) {
	s := strings.TrimSpace(strings.ReplaceAll(text, "−", "-")) // U+2212 minus
	if s == "" || len(s) > maxTyped {
		return 0, errNotNumber
	}
	m := numberRE.FindStringSubmatch(s)
	if m == nil {
		return 0, errNotNumber
	}
	if len(m[2]) > maxExpDigits {
		return 0, errors.New("is out of range")
	}
	x, ok := new(big.Rat).SetString(m[1])
	if !ok {
		return 0, errNotNumber
	}
	u := shown
	if name := strings.ToLower(strings.TrimSpace(m[3])); name != "" {
		found := false
		for _, cand := range q.accepted() {
			for _, n := range cand.names {
				if strings.ToLower(n) == name {
					u, found = cand, true
				}
			}
		}
		if !found {
			return 0, unknownUnit(m[3], q)
		}
	}
	v := fromDisplay(x, u)
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, errors.New("is too large")
	}
	if q == Frames && v != math.Trunc(v) {
		return 0, errors.New("must be a whole number of frames")
	}
	return v, nil
}

// unknownUnit is the message for a unit the quantity does not accept.
func unknownUnit(name string, q Quantity) error {
	var syms []string
	for _, u := range q.accepted() {
		syms = append(syms, u.symbol)
	}
	if len(syms) == 0 {
		return fmt.Errorf("unknown unit %q (type a bare number)", name)
	}
	return fmt.Errorf("unknown unit %q (use %s)", name, strings.Join(syms, ", "))
}
