package project

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"unicode/utf8"
)

// kind is the JSON type of a value in the file.
type kind uint8

const (
	kindObject kind = iota
	kindArray
	kindString
	kindNumber
	kindBool
	kindNull
)

func (k kind) String() string {
	return [...]string{"an object", "an array", "a string", "a number", "true or false", "null"}[k]
}

// value is one JSON value of the file, with object members in file order
// (duplicate keys are kept so that they can be reported).
type value struct {
	kind    kind
	text    string // string content, or the number's literal
	members []member
	elems   []*value
}

type member struct {
	key string
	val *value
}

// maxDepth bounds the nesting of the file. Project files nest five deep;
// the bound keeps hostile input from building a deep tree.
const maxDepth = 64

// readTree parses data as exactly one JSON value. Syntax errors come back
// as *Error with the line and column of the problem.
func readTree(file string, data []byte) (*value, error) {
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, &Error{File: file, Msg: "the file is empty (a project file is a JSON object starting with \"format\": \"propflight/v1\")"}
	}
	// First pass: the standard decoder finds syntax errors and their offsets.
	dec := json.NewDecoder(bytes.NewReader(data))
	var raw json.RawMessage
	if err := dec.Decode(&raw); err != nil {
		return nil, syntaxError(file, data, err)
	}
	if tok, err := dec.Token(); err != io.EOF {
		var se *json.SyntaxError
		if errors.As(err, &se) {
			// Token reports the offset of the bad character itself, where
			// Decode reports the offset just past it.
			line, col := position(data, se.Offset+1)
			return nil, &Error{File: file, Line: line, Column: col, Msg: se.Error()}
		}
		if err != nil {
			return nil, syntaxError(file, data, err)
		}
		off := dec.InputOffset()
		line, col := position(data, off)
		return nil, &Error{File: file, Line: line, Column: col, Msg: fmt.Sprintf("unexpected %v after the end of the project object", tokenWord(tok))}
	}
	// Second pass: build the tree from the checked value.
	td := json.NewDecoder(bytes.NewReader(raw))
	td.UseNumber()
	v, err := readValue(td, 0)
	if err != nil {
		var pe *Error
		if errors.As(err, &pe) {
			pe.File = file
			return nil, pe
		}
		return nil, &Error{File: file, Msg: err.Error()}
	}
	return v, nil
}

func tokenWord(tok json.Token) string {
	switch t := tok.(type) {
	case json.Delim:
		return fmt.Sprintf("%q", string(t))
	case string:
		return "string"
	case nil:
		return "null"
	}
	return "value"
}

// syntaxError converts a decoder error to an *Error with a position.
func syntaxError(file string, data []byte, err error) error {
	var se *json.SyntaxError
	switch {
	case errors.As(err, &se):
		line, col := position(data, se.Offset)
		return &Error{File: file, Line: line, Column: col, Msg: se.Error()}
	case errors.Is(err, io.ErrUnexpectedEOF), errors.Is(err, io.EOF):
		line, col := position(data, int64(len(data)))
		return &Error{File: file, Line: line, Column: col, Msg: "unexpected end of file (a bracket or quote is not closed)"}
	}
	return &Error{File: file, Msg: err.Error()}
}

// position returns the 1-based line and column of the character that ends
// at byte offset off: the decoder's offsets point just past the character
// that caused the error.
func position(data []byte, off int64) (line, col int) {
	if off > int64(len(data)) {
		off = int64(len(data))
	}
	if off < 0 {
		off = 0
	}
	head := data[:off]
	line = 1 + bytes.Count(head, []byte{'\n'})
	start := bytes.LastIndexByte(head, '\n') + 1
	col = utf8.RuneCount(head[start:])
	if col == 0 {
		col = 1
	}
	return line, col
}

// readValue reads one value from a decoder positioned before it.
func readValue(dec *json.Decoder, depth int) (*value, error) {
	if depth > maxDepth {
		return nil, &Error{Msg: fmt.Sprintf("the file nests deeper than %d levels", maxDepth)}
	}
	tok, err := dec.Token()
	if err != nil {
		return nil, err
	}
	switch t := tok.(type) {
	case json.Delim:
		switch t {
		case '{':
			v := &value{kind: kindObject}
			for dec.More() {
				kt, err := dec.Token()
				if err != nil {
					return nil, err
				}
				key, ok := kt.(string)
				if !ok {
					return nil, errors.New("object key is not a string")
				}
				mv, err := readValue(dec, depth+1)
				if err != nil {
					return nil, err
				}
				v.members = append(v.members, member{key, mv})
			}
			if _, err := dec.Token(); err != nil { // '}'
				return nil, err
			}
			return v, nil
		case '[':
			v := &value{kind: kindArray}
			for dec.More() {
				ev, err := readValue(dec, depth+1)
				if err != nil {
					return nil, err
				}
				v.elems = append(v.elems, ev)
			}
			if _, err := dec.Token(); err != nil { // ']'
				return nil, err
			}
			return v, nil
		}
		return nil, fmt.Errorf("unexpected %q", string(t))
	case string:
		return &value{kind: kindString, text: t}, nil
	case json.Number:
		return &value{kind: kindNumber, text: string(t)}, nil
	case bool:
		if t {
			return &value{kind: kindBool, text: "true"}, nil
		}
		return &value{kind: kindBool, text: "false"}, nil
	case nil:
		return &value{kind: kindNull}, nil
	}
	return nil, fmt.Errorf("unexpected token %v", tok)
}
