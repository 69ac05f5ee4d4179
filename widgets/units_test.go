package widgets

import (
	"math"
	"math/big"
	"testing"
)

// Conversion factors checked against NIST Special Publication 811 (2008
// edition), Appendix B.8 "Factors for units listed alphabetically"; exact
// factors there are printed in bold, the others to seven digits.
func TestUnits_FactorsMatchNIST(t *testing.T) {
	for _, c := range []struct {
		u     unit
		want  float64
		exact bool
	}{
		{unitInch, 2.54e-02, true},       // inch to metre
		{unitFoot, 3.048e-01, true},      // foot to metre
		{unitPound, 4.5359237e-01, true}, // pound (avoirdupois) to kilogram
		{unitOunce, 2.834952e-02, false}, // ounce (avoirdupois) to kilogram
		{unitLbFt3, 1.601846e+01, false}, // pound per cubic foot to kg/m^3
		{unitFtS, 3.048e-01, true},       // foot per second to m/s
		{unitFtS2, 3.048e-01, true},      // foot per second squared to m/s^2
		{unitMph, 4.4704e-01, true},      // mile per hour to m/s
		{unitKmH, 2.777778e-01, false},   // kilometre per hour to m/s
		{unitGCm3, 1.0e+03, true},        // gram per cubic centimetre to kg/m^3
		{unitRpm, 1.0 / 60, true},        // revolution per minute to revolutions per second
		{unitMilli, 1.0e-03, true},       // SI prefix milli
		{unitCm, 1.0e-02, true},          // SI prefix centi
		{unitGram, 1.0e-03, true},        // gram to kilogram
		{unitMetre, 1, true},             // the base units
		{unitDegree, 1, true},            // degrees stay degrees
		{unitTurnsS, 1, true},            // turns per second stay
		{unitFrames, 1, true},            // frames stay
		{unitKgM3, 1, true},              // kg/m^3 stays
		{unitMS2, 1, true},               // m/s^2 stays
		{unitSecond, 1, true},            // s stays
		{unitKg, 1, true},                // kg stays
		{unitMS, 1, true},                // m/s stays
		{unitMm, 1.0e-03, true},          // SI prefix milli
		{unitNone, 1, true},              // plain
		{unitMeterlessCheck(), 1, true},  // a Plain field in imperial
	} {
		got, _ := c.u.factor.Float64()
		tol := 5e-7 * c.want // seven significant digits
		if c.exact {
			tol = 0
		}
		if math.Abs(got-c.want) > tol {
			t.Errorf("%s: factor %.10g, want %.10g (NIST SP 811 B.8)", c.u.symbol, got, c.want)
		}
	}
}

// unitMeterlessCheck returns the shown unit of a Plain field, which must
// convert nothing.
func unitMeterlessCheck() unit { return Plain.display(true, 1) }

func TestUnits_DisplayChoice(t *testing.T) {
	for _, c := range []struct {
		q        Quantity
		imperial bool
		max      float64
		want     string
	}{
		{Length, false, 1, "m"}, {Length, true, 1, "in"}, {Length, true, 2, "in"}, {Length, true, 50, "ft"},
		{Mass, true, 10, "lb"}, {Density, true, 2e4, "lb/ft³"}, {Speed, true, 30, "ft/s"},
		{Acceleration, true, 20, "ft/s²"}, {Angle, true, 180, "°"}, {TurnRate, true, 10, "turns/s"},
		{Duration, true, 10, "s"}, {Frames, true, 100, "frames"}, {Plain, true, 1, ""},
	} {
		if got := c.q.display(c.imperial, c.max).symbol; got != c.want {
			t.Errorf("%v imperial=%v max %g shows %q, want %q", c.q, c.imperial, c.max, got, c.want)
		}
	}
}

func TestUnits_ParseTyped(t *testing.T) {
	for _, c := range []struct {
		text  string
		q     Quantity
		shown unit
		want  float64 // exact: the float64 nearest the exact product
	}{
		{"0.25", Length, unitMetre, 0.25},
		{" 12 ", Length, unitInch, 0.3048}, // 12 x 0.0254 m, one rounding
		{"12 in", Length, unitMetre, 0.3048},
		{"1/8 in", Length, unitMetre, 0.003175},
		{"30cm", Length, unitInch, 0.3},
		{"2 ft", Length, unitMetre, 0.6096},
		{"6\"", Length, unitMetre, 0.1524},
		{"1", Mass, unitPound, 0.45359237},
		{"250 g", Mass, unitPound, 0.25},
		{"16 oz", Mass, unitKg, 0.45359237},
		{"1e3", Density, unitKgM3, 1000},
		{"7.85 g/cm3", Density, unitKgM3, 7850},
		{"−2.5", Speed, unitMS, -2.5}, // U+2212 minus
		{"10 mph", Speed, unitMS, 4.4704},
		{"90 rpm", TurnRate, unitTurnsS, 1.5},
		{"45°", Angle, unitDegree, 45},
		{"500 ms", Duration, unitSecond, 0.5},
		{"32.174", Acceleration, unitFtS2, 9.8066352}, // 32.174 ft/s^2
		{"72", Frames, unitFrames, 72},
		{"+.5", Plain, unitNone, 0.5},
	} {
		got, err := parseTyped(c.text, c.q, c.shown)
		if err != nil || got != c.want {
			t.Errorf("parseTyped(%q, %v, %s) = %v, %v; want %v", c.text, c.q, c.shown.symbol, got, err, c.want)
		}
	}
}

func TestUnits_ParseTyped_Rejects(t *testing.T) {
	for _, c := range []struct {
		text string
		q    Quantity
		want string
	}{
		{"", Length, "not a number"},
		{"abc", Length, "not a number"},
		{"1,5", Length, `unknown unit ",5" (use m, cm, mm, in, ft)`},
		{"3 kg", Length, `unknown unit "kg" (use m, cm, mm, in, ft)`},
		{"1e9999", Length, "is out of range"}, // exponents of more than three digits
		{"NaN", Length, "not a number"},
		{"Inf", Length, "not a number"},
		{"1/0", Length, "not a number"},
		{"2.5", Frames, "must be a whole number of frames"},
		{"2 m", Plain, `unknown unit "m" (type a bare number)`},
		{"1e999 ft", Length, "is too large"},
	} {
		_, err := parseTyped(c.text, c.q, c.q.display(false, 1))
		if err == nil || err.Error() != c.want {
			t.Errorf("parseTyped(%q, %v) error %v, want %q", c.text, c.q, err, c.want)
		}
	}
}

func TestUnits_Format(t *testing.T) {
	for _, c := range []struct {
		v    float64
		q    Quantity
		u    unit
		want string
	}{
		{9.80665, Acceleration, unitMS2, "9.807"},
		{7850, Density, unitKgM3, "7850"},
		{0.13, Length, unitMetre, "0.13"},
		{0.3048, Length, unitInch, "12"},
		{0.45359237, Mass, unitPound, "1"},
		{0.45359237, Mass, unitKg, "0.4536"},
		{0.000123456, Length, unitMetre, "0.0001235"},
		{-0.0001, Speed, unitMS, "-0.0001"},
		{-0.00001, Plain, unitNone, "-0.00001"},
		{1e-12, Plain, unitNone, "0"},
		{0, Plain, unitNone, "0"},
		{71.6, Frames, unitFrames, "72"},
		{123456.7, Plain, unitNone, "123457"},
	} {
		if got := formatValue(c.v, c.q, c.u); got != c.want {
			t.Errorf("formatValue(%v, %v, %s) = %q, want %q", c.v, c.q, c.u.symbol, got, c.want)
		}
	}
}

func ratInt(k int) *big.Rat { return big.NewRat(int64(k), 1) }

// Shown, then typed back: a value that is a whole number of the display
// unit comes back bit for bit.
func TestUnits_RoundTripExact(t *testing.T) {
	for _, c := range []struct {
		q Quantity
		u unit
	}{{Length, unitInch}, {Length, unitFoot}, {Mass, unitPound}, {Density, unitLbFt3}, {Speed, unitFtS}, {Acceleration, unitFtS2}} {
		for k := -40; k <= 400; k++ {
			v := fromDisplay(ratInt(k), c.u)
			text := formatValue(v, c.q, c.u)
			back, err := parseTyped(text, c.q, c.u)
			if err != nil || back != v {
				t.Fatalf("%s: %d shows %q and reads back %v (%v), want %v", c.u.symbol, k, text, back, err, v)
			}
		}
	}
}
