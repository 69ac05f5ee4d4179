package footage

import (
	"strconv"
	"strings"
)

// Error is a problem with footage, marks or fit settings. File is the file
// as named to the caller (a frame's path, a marks file's name; empty for
// data made in memory), Line the 1-based line of a marks file (0 when the
// problem is not at a line), Field the column ("frame", "x", "y2") or
// setting ("fps", "gravity") concerned, and Err the underlying error, if
// any (a decoder's or the file system's).
type Error struct {
	File  string
	Line  int
	Field string
	Msg   string
	Err   error
}

// Error returns "FILE: line L: FIELD: MSG", leaving out the parts that are
// empty.
func (e *Error) Error() string {
	var b strings.Builder
	if e.File != "" {
		b.WriteString(e.File)
		b.WriteString(": ")
	}
	if e.Line > 0 {
		b.WriteString("line ")
		b.WriteString(strconv.Itoa(e.Line))
		b.WriteString(": ")
	}
	if e.Field != "" {
		b.WriteString(e.Field)
		b.WriteString(": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}

// Unwrap returns the underlying error, so that errors.Is(err,
// fs.ErrNotExist) works through an *Error.
func (e *Error) Unwrap() error { return e.Err }
