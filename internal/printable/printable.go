// Package printable makes text from a project file (a project or part
// name, a file name) safe to show: on a terminal, in a PDF, in a window
// label. Such text may hold control characters: ESC starts terminal escape
// sequences that can recolour, move the cursor or retitle the terminal,
// BEL rings, CR and LF break a one-line report, and the Unicode bidi
// controls can reorder what a reader sees. The file keeps the text as
// written; only what is shown goes through [String].
//
// The package imports only the standard library.
package printable

import (
	"strconv"
	"strings"
	"unicode/utf8"
)

// String returns s with every character that is not safe to show written
// as a visible escape, the way Go writes it in a quoted string:
//
//	C0 controls U+0000-U+001F and DEL U+007F   \x1b, \x07, \x0d, \x0a, \x7f
//	C1 controls U+0080-U+009F                  \u009b
//	bidi controls U+200E, U+200F, U+202A-U+202E, U+2066-U+2069, and
//	U+2028, U+2029 (line and paragraph separators)   \u202e
//	a byte that is not valid UTF-8             \xff
//
// Everything else (letters of any script, accents, emoji, spaces) is kept.
// A string with nothing to escape is returned as it is, without copying.
func String(s string) string {
	i := firstUnsafe(s)
	if i < 0 {
		return s
	}
	var b strings.Builder
	b.Grow(len(s) + 8)
	b.WriteString(s[:i])
	for i < len(s) {
		r, size := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == utf8.RuneError && size == 1:
			writeHex(&b, 'x', uint32(s[i]), 2)
		case !safe(r):
			if r < 0x80 {
				writeHex(&b, 'x', uint32(r), 2)
			} else {
				writeHex(&b, 'u', uint32(r), 4)
			}
		default:
			b.WriteString(s[i : i+size])
		}
		i += size
	}
	return b.String()
}

// firstUnsafe returns the byte index of the first character String must
// escape, or -1.
func firstUnsafe(s string) int {
	for i := 0; i < len(s); {
		c := s[i]
		if c < utf8.RuneSelf {
			if c < 0x20 || c == 0x7f {
				return i
			}
			i++
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if (r == utf8.RuneError && size == 1) || !safe(r) {
			return i
		}
		i += size
	}
	return -1
}

// safe reports whether r may be shown as it is.
func safe(r rune) bool {
	switch {
	case r < 0x20, r == 0x7f, r >= 0x80 && r <= 0x9f:
		return false
	case r == 0x200e, r == 0x200f, r >= 0x202a && r <= 0x202e, r >= 0x2066 && r <= 0x2069, r == 0x2028, r == 0x2029:
		return false
	}
	return true
}

// writeHex writes `\x1b` (kind 'x', 2 digits) or `\u009b` (kind 'u', 4).
func writeHex(b *strings.Builder, kind byte, v uint32, digits int) {
	b.WriteByte('\\')
	b.WriteByte(kind)
	h := strconv.FormatUint(uint64(v), 16)
	for range digits - len(h) {
		b.WriteByte('0')
	}
	b.WriteString(h)
}
