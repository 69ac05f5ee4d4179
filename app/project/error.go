package project

import (
	"strconv"
	"strings"
)

// Error is a problem with a project file. File is the file name as given
// to Parse or Load (empty for a document made in memory), Field the
// project-file path of the field ("prop.parts[1].size", "throw.fps"),
// empty when the problem is with the file as a whole or at a text
// position, and Line and Column the 1-based position of a JSON syntax
// error (0 otherwise; Column counts characters, not bytes). Err, when
// not nil, is the underlying cause (fs.ErrNotExist for a missing file),
// reachable through errors.Is and errors.As; it is not printed.
type Error struct {
	File   string
	Field  string
	Line   int
	Column int
	Msg    string
	Err    error
}

// Unwrap returns the underlying cause, or nil.
func (e *Error) Unwrap() error { return e.Err }

// Error returns "FILE: FIELD: MSG", "FILE: line L, column C: MSG" or
// "FILE: MSG"; the "FILE: " part is left out when File is empty.
func (e *Error) Error() string {
	var b strings.Builder
	if e.File != "" {
		b.WriteString(e.File)
		b.WriteString(": ")
	}
	switch {
	case e.Field != "":
		b.WriteString(e.Field)
		b.WriteString(": ")
	case e.Line > 0:
		b.WriteString("line ")
		b.WriteString(strconv.Itoa(e.Line))
		b.WriteString(", column ")
		b.WriteString(strconv.Itoa(e.Column))
		b.WriteString(": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}

// keyName returns a JSON key for use in a field path: as it is when it is
// a plain name (letters, digits, '_', '-'), quoted otherwise so that odd
// keys cannot break the one-line message.
func keyName(k string) string {
	if k == "" {
		return `""`
	}
	for _, r := range k {
		if !(r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '_' || r == '-') {
			return strconv.Quote(k)
		}
	}
	return k
}

// join returns the path of key inside the object at path.
func join(path, key string) string {
	if path == "" {
		return keyName(key)
	}
	return path + "." + keyName(key)
}

// index returns the path of element i of the array at path.
func index(path string, i int) string { return path + "[" + strconv.Itoa(i) + "]" }
