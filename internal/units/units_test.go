package units

import (
	"math/big"
	"strings"
	"testing"
)

// The exact definitions, NIST SP 811 (2008), Appendix B.8 and B.9:
// 1 in = 0.0254 m, 1 ft = 12 in = 0.3048 m, 1 mi = 5280 ft = 1609.344 m,
// 1 lb = 0.45359237 kg, 1 oz = 1/16 lb.
func TestFactors_NIST(t *testing.T) {
	for _, c := range []struct {
		name string
		f    Factor
		want string // exact decimal
	}{
		{"inch", Inch, "0.0254"},
		{"foot", Foot, "0.3048"},
		{"mile", Mile, "1609.344"},
		{"pound", Pound, "0.45359237"},
		{"ounce", Ounce, "0.028349523125"},
		{"centimetre", Centimetre, "0.01"},
		{"millimetre", Millimetre, "0.001"},
		{"gram", Gram, "0.001"},
	} {
		if got := c.f.Rat().FloatString(12); trimZeros(got) != c.want {
			t.Errorf("%s = %s, want %s", c.name, got, c.want)
		}
	}
	if Foot.Rat().Cmp(Inch.Rat().Mul(Inch.Rat(), bigInt(12))) != 0 {
		t.Error("foot is not 12 inches")
	}
	if Mile.Rat().Cmp(Foot.Rat().Mul(Foot.Rat(), bigInt(5280))) != 0 {
		t.Error("mile is not 5280 feet")
	}
	if Inch.Float() != 0.0254 || Pound.Float() != 0.45359237 {
		t.Errorf("Float: inch %v, pound %v", Inch.Float(), Pound.Float())
	}
}

func bigInt(n int64) *big.Rat { return big.NewRat(n, 1) }

func trimZeros(s string) string {
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	return s
}
