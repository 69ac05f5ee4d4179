package fsutil

import (
	"hash/fnv"
	"strconv"
	"unicode/utf8"
)

// ShortName returns name if it is at most max bytes long, and otherwise
// its longest prefix that ends on a character boundary and leaves room for
// "-" and eight hex digits of the FNV-1a hash of the whole name, followed
// by them. Two long names that differ anywhere therefore stay apart, and
// the result is at most max bytes (max must be at least 16). File names
// made from a project's name go through it, so that a long name never
// gives "file name too long" (most file systems allow 255 bytes).
func ShortName(name string, max int) string {
	if len(name) <= max {
		return name
	}
	h := fnv.New32a()
	h.Write([]byte(name))
	sum := strconv.FormatUint(uint64(h.Sum32()), 16)
	for len(sum) < 8 {
		sum = "0" + sum
	}
	cut := max - 1 - len(sum)
	for cut > 0 && !utf8.RuneStart(name[cut]) {
		cut--
	}
	return name[:cut] + "-" + sum
}
