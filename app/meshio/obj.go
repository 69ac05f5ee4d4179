package meshio

import (
	"bytes"
	"fmt"
	"math"
	"strconv"

	"gonum.org/v1/gonum/spatial/r3"
)

// ReadOBJ reads a Wavefront OBJ file, in the file's units.
//
// "v x y z [w]" lines give positions (w and any colour after it are
// ignored); "f" lines give polygons as 1-based position indices, negative
// ones counting back from the last position so far, each in the v, v/t,
// v//n or v/t/n form; a polygon of k corners becomes the fan of k-2
// triangles from its first corner. Every other line (o, g, s, usemtl,
// mtllib, vt, vn, l, p, comments) carries nothing for mass and is skipped.
// Common practice (the format's original documentation), from memory.
//
// It stays one function: one pass over the lines, one short case a statement,
// with the positions read so far shared by the faces.
func ReadOBJ(data []byte) ([][3]r3.Vec, error) {
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, fmt.Errorf("the file is empty")
	}
	var pos []r3.Vec
	type corner struct {
		idx  int64 // resolved 0-based index, or the raw positive index - 1 (checked at the end)
		line int
	}
	var faces []corner // flattened triangles
	var poly []corner
	lineNo := 0
	for len(data) > 0 {
		lineNo++
		var line []byte
		if i := bytes.IndexByte(data, '\n'); i >= 0 {
			line, data = data[:i], data[i+1:]
		} else {
			line, data = data, nil
		}
		if i := bytes.IndexByte(line, '#'); i >= 0 {
			line = line[:i]
		}
		f := bytes.Fields(line)
		if len(f) == 0 {
			continue
		}
		switch string(f[0]) {
		case "v":
			if len(f) < 4 {
				return nil, fmt.Errorf("line %d: a vertex needs three numbers", lineNo)
			}
			var c [3]float64
			for k := range 3 {
				v, err := parseFloat(f[1+k])
				if err != nil {
					return nil, fmt.Errorf("line %d: %q is not a finite number", lineNo, clip(f[1+k]))
				}
				c[k] = v
			}
			pos = append(pos, r3.Vec{X: c[0], Y: c[1], Z: c[2]})
		case "f", "fo":
			if len(f) < 4 {
				return nil, fmt.Errorf("line %d: a face needs at least three corners", lineNo)
			}
			poly = poly[:0]
			for _, w := range f[1:] {
				if i := bytes.IndexByte(w, '/'); i >= 0 {
					w = w[:i]
				}
				n, err := strconv.ParseInt(string(w), 10, 64)
				switch {
				case err != nil:
					return nil, fmt.Errorf("line %d: %q is not a vertex number", lineNo, clip(w))
				case n == 0:
					return nil, fmt.Errorf("line %d: vertex numbers start at 1 (or count back from -1), not 0", lineNo)
				case n < 0:
					if -n > int64(len(pos)) {
						return nil, fmt.Errorf("line %d: vertex %d counts back past the first vertex (%d defined so far)", lineNo, n, len(pos))
					}
					poly = append(poly, corner{int64(len(pos)) + n, lineNo})
				default:
					poly = append(poly, corner{n - 1, lineNo})
				}
			}
			if k := uint64(len(faces)/3 + len(poly) - 2); k > MaxTriangles {
				return nil, tooMany(k)
			}
			for i := 1; i+1 < len(poly); i++ {
				faces = append(faces, poly[0], poly[i], poly[i+1])
			}
		}
	}
	if len(faces) == 0 {
		return nil, fmt.Errorf("no faces: the OBJ file has no \"f\" lines")
	}
	tris := make([][3]r3.Vec, len(faces)/3)
	for i, c := range faces {
		if c.idx >= int64(len(pos)) {
			return nil, fmt.Errorf("line %d: face refers to vertex %d, but the file has only %d", c.line, c.idx+1, len(pos))
		}
		tris[i/3][i%3] = pos[c.idx]
	}
	return tris, nil
}

// parseFloat parses a decimal number, refusing NaN, infinities and numbers
// too large for float64, so that the message can give the line.
func parseFloat(b []byte) (float64, error) {
	v, err := strconv.ParseFloat(string(b), 64)
	if err != nil {
		return 0, err
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, fmt.Errorf("not finite")
	}
	return v, nil
}
