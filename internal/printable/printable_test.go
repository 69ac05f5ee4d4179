package printable

import (
	"strings"
	"testing"
	"unicode/utf8"
)

func TestString(t *testing.T) {
	tests := []struct{ in, want string }{
		{"frying pan", "frying pan"},
		{"Pfanne · große", "Pfanne · große"},
		{"煎锅 🍳", "煎锅 🍳"},
		{"", ""},
		{"pan\x1b[31mRED\x1b[0m", `pan\x1b[31mRED\x1b[0m`},
		{"bell\a", `bell\x07`},
		{"two\r\nlines", `two\x0d\x0alines`},
		{"tab\there", `tab\x09here`},
		{"nul\x00", `nul\x00`},
		{"del\x7f", `del\x7f`},
		{"csi\u009b31m", `csi\u009b31m`},
		{"nel\u0085", `nel\u0085`},
		{"abc\u202edcba", `abc\u202edcba`},
		{"iso\u2066x\u2069", `iso\u2066x\u2069`},
		{"ls\u2028ps\u2029", `ls\u2028ps\u2029`},
		{"bad\xffutf8", `bad\xffutf8`},
		{"\x1b]0;title\a", `\x1b]0;title\x07`},
	}
	for _, tt := range tests {
		if got := String(tt.in); got != tt.want {
			t.Errorf("String(%q) = %q, want %q", tt.in, got, tt.want)
		}
	}
}

// TestString_EveryControl checks every code point below U+00A0 against the
// definition of the C0 and C1 sets and DEL (ISO/IEC 6429, ECMA-48 §5):
// none reaches the output, and everything else passes unchanged.
func TestString_EveryControl(t *testing.T) {
	for r := rune(0); r < 0xa0; r++ {
		in := "a" + string(r) + "b"
		got := String(in)
		control := r < 0x20 || r >= 0x7f
		if control == (got == in) {
			t.Errorf("U+%04X: String gives %q", r, got)
		}
		for _, c := range got {
			if c < 0x20 || (c >= 0x7f && c < 0xa0) {
				t.Errorf("U+%04X: output %q still holds U+%04X", r, got, c)
			}
		}
	}
}

func TestString_OutputIsValidAndLinear(t *testing.T) {
	in := strings.Repeat("\x1b\xff é", 10000)
	got := String(in)
	if !utf8.ValidString(got) {
		t.Error("output is not valid UTF-8")
	}
	if len(got) > 6*len(in) {
		t.Errorf("output %d bytes for %d in", len(got), len(in))
	}
}

func FuzzString(f *testing.F) {
	f.Add("pan\x1b[2J")
	f.Add("\xff\u009b\u202e")
	f.Fuzz(func(t *testing.T, s string) {
		got := String(s)
		if !utf8.ValidString(got) {
			t.Fatalf("String(%q) = %q is not valid UTF-8", s, got)
		}
		for _, r := range got {
			if !safe(r) {
				t.Fatalf("String(%q) = %q holds U+%04X", s, got, r)
			}
		}
		if String(got) != got {
			t.Fatalf("String is not idempotent on %q", s)
		}
	})
}
