package meshio

import (
	"bytes"
	"encoding/binary"
	"fmt"

	"gonum.org/v1/gonum/spatial/r3"
)

// ReadSTL reads a binary or an ASCII STL file, in the file's units.
//
// Binary STL is an 80-byte header, a little-endian uint32 triangle count n
// and n records of 50 bytes (normal, three corners as float32, a uint16
// attribute). A file of exactly 84 + 50 n bytes is binary, whatever its
// header says; anything else must be ASCII ("solid", then "facet normal ...
// outer loop, vertex x y z (three times), endloop, endfacet" blocks,
// "endsolid"). The stored normals are ignored: the winding decides outward
// (REFERENCES.md §9, common practice).
func ReadSTL(data []byte) ([][3]r3.Vec, error) {
	if len(data) == 0 {
		return nil, fmt.Errorf("the file is empty")
	}
	if len(data) >= 84 {
		n := uint64(binary.LittleEndian.Uint32(data[80:84]))
		if uint64(len(data)) == 84+50*n {
			return readBinarySTL(data, n)
		}
		if !looksASCII(data) {
			return nil, fmt.Errorf("not an STL file: as binary it declares %d triangles (%s) but has %s, and it does not begin with \"solid\"",
				n, byteSize(int64(84+50*n)), byteSize(int64(len(data))))
		}
	} else if !looksASCII(data) {
		return nil, fmt.Errorf("not an STL file: %s is too short for binary STL and it does not begin with \"solid\"", byteSize(int64(len(data))))
	}
	return readASCIISTL(data)
}

// looksASCII reports whether data begins, after white space, with "solid".
func looksASCII(data []byte) bool {
	return bytes.HasPrefix(bytes.TrimLeft(data[:min(len(data), 512)], " \t\r\n"), []byte("solid"))
}

func readBinarySTL(data []byte, n uint64) ([][3]r3.Vec, error) {
	if n == 0 {
		return nil, fmt.Errorf("no triangles: the STL file declares 0")
	}
	if n > MaxTriangles {
		return nil, tooMany(n)
	}
	tris := make([][3]r3.Vec, n)
	for i := range tris {
		rec := data[84+50*i:]
		tris[i] = [3]r3.Vec{vec32(rec[12:24]), vec32(rec[24:36]), vec32(rec[36:48])}
	}
	return tris, nil
}

func readASCIISTL(data []byte) ([][3]r3.Vec, error) {
	var tris [][3]r3.Vec
	var cur [3]r3.Vec
	corners := 0
	line := 1
	tok := tokens{data: data}
	for {
		w, ln, ok := tok.next()
		if !ok {
			break
		}
		line = ln
		switch string(w) {
		case "vertex":
			var p [3]float64
			for k := range 3 {
				s, ln, ok := tok.next()
				if !ok {
					return nil, fmt.Errorf("line %d: a vertex needs three numbers", ln)
				}
				v, err := parseFloat(s)
				if err != nil {
					return nil, fmt.Errorf("line %d: %q is not a finite number", ln, clip(s))
				}
				p[k] = v
			}
			if corners == 3 {
				return nil, fmt.Errorf("line %d: a facet has more than three vertices", ln)
			}
			cur[corners] = r3.Vec{X: p[0], Y: p[1], Z: p[2]}
			corners++
		case "endloop":
			if corners != 3 {
				return nil, fmt.Errorf("line %d: a facet has %d vertices, not three", ln, corners)
			}
			if len(tris) >= MaxTriangles {
				return nil, tooMany(uint64(len(tris)) + 1)
			}
			tris = append(tris, cur)
			corners = 0
		}
	}
	if corners != 0 {
		return nil, fmt.Errorf("line %d: the file ends inside a facet", line)
	}
	if len(tris) == 0 {
		return nil, fmt.Errorf("no triangles: the ASCII STL file has no complete facet")
	}
	return tris, nil
}

// tokens splits text into white-space separated words, counting lines.
type tokens struct {
	data []byte
	pos  int
	line int
}

func (t *tokens) next() (word []byte, line int, ok bool) {
	if t.line == 0 {
		t.line = 1
	}
	d := t.data
	for t.pos < len(d) && isSpace(d[t.pos]) {
		if d[t.pos] == '\n' {
			t.line++
		}
		t.pos++
	}
	if t.pos == len(d) {
		return nil, t.line, false
	}
	start := t.pos
	for t.pos < len(d) && !isSpace(d[t.pos]) {
		t.pos++
	}
	return d[start:t.pos], t.line, true
}

func isSpace(c byte) bool {
	return c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' || c == '\v'
}

// clip shortens a word for an error message.
func clip(b []byte) string {
	if len(b) > 24 {
		return string(b[:24]) + "..."
	}
	return string(b)
}
