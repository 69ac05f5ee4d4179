package meshio

import (
	"bytes"
	"encoding/base64"
	"encoding/binary"
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"net/url"
	"path"
	"path/filepath"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"
)

// ReadGLB reads a binary glTF 2.0 file (.glb): a 12-byte header (magic
// "glTF", version 2, total length), a JSON chunk and an optional BIN chunk
// that a buffer without a uri refers to (Specification 2.0.1, §4.4). Other
// buffers must be data URIs (a .glb has no folder to look in).
func ReadGLB(data []byte) ([][3]r3.Vec, error) {
	if len(data) == 0 {
		return nil, errors.New("the file is empty")
	}
	if len(data) < 12 {
		return nil, fmt.Errorf("truncated GLB: %s, shorter than the 12-byte header", byteSize(int64(len(data))))
	}
	le := binary.LittleEndian
	if le.Uint32(data[0:4]) != 0x46546C67 {
		return nil, errors.New("not a GLB file: it does not begin with \"glTF\"")
	}
	if v := le.Uint32(data[4:8]); v != 2 {
		return nil, fmt.Errorf("GLB version %d: only glTF 2.0 is read", v)
	}
	total := uint64(le.Uint32(data[8:12]))
	if total > uint64(len(data)) {
		return nil, fmt.Errorf("truncated GLB: the header says %s, the file has %s", byteSize(int64(total)), byteSize(int64(len(data))))
	}
	data = data[:total]
	var jsonChunk, bin []byte
	haveBin := false
	for off, i := uint64(12), 0; off < total; i++ {
		if total-off < 8 {
			return nil, fmt.Errorf("truncated GLB: chunk %d has no room for its header", i)
		}
		n, typ := uint64(le.Uint32(data[off:])), le.Uint32(data[off+4:])
		off += 8
		if n > total-off {
			return nil, fmt.Errorf("truncated GLB: chunk %d says %s, only %s follow", i, byteSize(int64(n)), byteSize(int64(total-off)))
		}
		chunk := data[off : off+n]
		off += (n + 3) &^ 3
		switch {
		case i == 0 && typ != 0x4E4F534A:
			return nil, errors.New("not a GLB file: its first chunk is not JSON")
		case i == 0:
			jsonChunk = chunk
		case i == 1 && typ == 0x004E4942:
			bin, haveBin = chunk, true
		}
	}
	if jsonChunk == nil {
		return nil, errors.New("truncated GLB: no JSON chunk")
	}
	return readGLTF(jsonChunk, func(i int, uri *string) ([]byte, error) {
		if uri == nil {
			if i != 0 || !haveBin {
				return nil, fmt.Errorf("buffer %d has no uri and the file has no binary chunk", i)
			}
			return bin, nil
		}
		if d, ok, err := dataURI(*uri); ok {
			return d, err
		}
		return nil, fmt.Errorf("buffer %d refers to the file %q: a .glb must carry its data", i, clipS(*uri))
	})
}

// ReadGLTF reads a glTF 2.0 JSON file (.gltf). Buffers are data URIs
// (base64) or files that load returns, given the buffer's uri as written.
func ReadGLTF(data []byte, load func(uri string) ([]byte, error)) ([][3]r3.Vec, error) {
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, errors.New("the file is empty")
	}
	return readGLTF(data, func(i int, uri *string) ([]byte, error) {
		if uri == nil {
			return nil, fmt.Errorf("buffer %d has no uri", i)
		}
		if d, ok, err := dataURI(*uri); ok {
			return d, err
		}
		if load == nil {
			return nil, fmt.Errorf("buffer %d is in another file, %q, and none can be read here", i, clipS(*uri))
		}
		return load(*uri)
	})
}

// dataURI decodes a base64 data URI; ok is false for any other uri.
func dataURI(uri string) (data []byte, ok bool, err error) {
	if !strings.HasPrefix(uri, "data:") {
		return nil, false, nil
	}
	i := strings.Index(uri, ";base64,")
	if i < 0 {
		return nil, true, errors.New("a data URI buffer must be base64")
	}
	d, err := base64.StdEncoding.DecodeString(uri[i+len(";base64,"):])
	if err != nil {
		return nil, true, errors.New("a data URI buffer is not valid base64")
	}
	return d, true, nil
}

// sideCar reads a buffer file named by uri relative to dir; it must stay
// inside dir (no absolute paths, no "..").
func sideCar(dir, uri string) ([]byte, error) {
	name, err := url.PathUnescape(uri)
	if err != nil || name == "" || strings.Contains(name, "\\") || path.IsAbs(name) || strings.Contains(name, ":") {
		return nil, fmt.Errorf("buffer file %q: not a relative file name", clipS(uri))
	}
	if c := path.Clean(name); c == ".." || strings.HasPrefix(c, "../") {
		return nil, fmt.Errorf("buffer file %q lies outside the file's folder", clipS(uri))
	}
	d, err := readLimited(filepath.Join(dir, filepath.FromSlash(name)))
	if err != nil {
		return nil, fmt.Errorf("buffer file %q: %v", clipS(uri), err)
	}
	return d, nil
}

// gltfReader holds one document while its triangles are gathered.
type gltfReader struct {
	doc     gltfDoc
	load    func(i int, uri *string) ([]byte, error)
	buffers map[int][]byte
	tris    [][3]r3.Vec
}

// mat4 is an affine transform, column major like glTF: m[c*4+r].
type mat4 [16]float64

var identity4 = mat4{1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1}

func (a mat4) mul(b mat4) mat4 {
	var c mat4
	for col := range 4 {
		for row := range 4 {
			s := 0.0
			for k := range 4 {
				s += a[k*4+row] * b[col*4+k]
			}
			c[col*4+row] = s
		}
	}
	return c
}

func (a mat4) apply(p r3.Vec) r3.Vec {
	return r3.Vec{
		X: a[0]*p.X + a[4]*p.Y + a[8]*p.Z + a[12],
		Y: a[1]*p.X + a[5]*p.Y + a[9]*p.Z + a[13],
		Z: a[2]*p.X + a[6]*p.Y + a[10]*p.Z + a[14],
	}
}

// det3 is the determinant of the linear part.
func (a mat4) det3() float64 {
	return a[0]*(a[5]*a[10]-a[9]*a[6]) - a[4]*(a[1]*a[10]-a[9]*a[2]) + a[8]*(a[1]*a[6]-a[5]*a[2])
}

// localMatrix is a node's transform: its matrix, or T R S (§5.25: "TRS
// properties are converted to matrices and postmultiplied in the T * R * S
// order").
func localMatrix(i int, n *gltfNode) (mat4, error) {
	if n.Matrix != nil {
		m := mat4(*n.Matrix)
		for _, v := range m {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return mat4{}, fmt.Errorf("node %d: its matrix has a number that is not finite", i)
			}
		}
		return m, nil
	}
	t, s := [3]float64{}, [3]float64{1, 1, 1}
	q := [4]float64{0, 0, 0, 1}
	if n.Translation != nil {
		t = *n.Translation
	}
	if n.Scale != nil {
		s = *n.Scale
	}
	if n.Rotation != nil {
		q = *n.Rotation
	}
	l := math.Sqrt(q[0]*q[0] + q[1]*q[1] + q[2]*q[2] + q[3]*q[3])
	if !(l > 0) || math.IsInf(l, 0) {
		return mat4{}, fmt.Errorf("node %d: its rotation is not a unit quaternion", i)
	}
	for _, v := range append(t[:], s[:]...) {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return mat4{}, fmt.Errorf("node %d: its translation or scale has a number that is not finite", i)
		}
	}
	x, y, z, w := q[0]/l, q[1]/l, q[2]/l, q[3]/l
	// The rotation matrix of a unit quaternion, columns scaled by s.
	r := [3][3]float64{
		{1 - 2*(y*y+z*z), 2 * (x*y - z*w), 2 * (x*z + y*w)},
		{2 * (x*y + z*w), 1 - 2*(x*x+z*z), 2 * (y*z - x*w)},
		{2 * (x*z - y*w), 2 * (y*z + x*w), 1 - 2*(x*x+y*y)},
	}
	var m mat4
	for col := range 3 {
		for row := range 3 {
			m[col*4+row] = r[row][col] * s[col]
		}
	}
	m[12], m[13], m[14], m[15] = t[0], t[1], t[2], 1
	return m, nil
}

func readGLTF(js []byte, load func(i int, uri *string) ([]byte, error)) ([][3]r3.Vec, error) {
	g := &gltfReader{load: load, buffers: map[int][]byte{}}
	if err := json.Unmarshal(js, &g.doc); err != nil {
		var se *json.SyntaxError
		if errors.As(err, &se) {
			return nil, fmt.Errorf("not valid glTF JSON: %v (at byte %d)", se, se.Offset)
		}
		var te *json.UnmarshalTypeError
		if errors.As(err, &te) {
			return nil, fmt.Errorf("not valid glTF JSON: %s should be %s", te.Field, te.Type)
		}
		return nil, fmt.Errorf("not valid glTF JSON: %v", err)
	}
	d := &g.doc
	if !strings.HasPrefix(d.Asset.Version, "2.") {
		return nil, fmt.Errorf("glTF version %q: only 2.x is read", clipS(d.Asset.Version))
	}
	if len(d.ExtensionsRequired) > 0 {
		return nil, fmt.Errorf("needs the glTF extension %s, which this tool does not read", clipS(d.ExtensionsRequired[0]))
	}
	scene := 0
	if d.Scene != nil {
		scene = *d.Scene
	}
	if len(d.Scenes) == 0 {
		return nil, errors.New("no scene: the glTF file has no scenes")
	}
	if scene < 0 || scene >= len(d.Scenes) {
		return nil, fmt.Errorf("the default scene %d does not exist (%d scenes)", scene, len(d.Scenes))
	}
	// Walk the node trees of the default scene, parents before children.
	type item struct {
		node  int
		world mat4
	}
	seen := make([]bool, len(d.Nodes))
	var stack []item
	for _, n := range d.Scenes[scene].Nodes {
		stack = append(stack, item{n, identity4})
	}
	for len(stack) > 0 {
		it := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if it.node < 0 || it.node >= len(d.Nodes) {
			return nil, fmt.Errorf("node %d does not exist (%d nodes)", it.node, len(d.Nodes))
		}
		if seen[it.node] {
			return nil, fmt.Errorf("node %d is reached twice: the nodes must form trees", it.node)
		}
		seen[it.node] = true
		n := &d.Nodes[it.node]
		local, err := localMatrix(it.node, n)
		if err != nil {
			return nil, err
		}
		world := it.world.mul(local)
		if n.Mesh != nil {
			if err := g.addMesh(*n.Mesh, world); err != nil {
				return nil, err
			}
		}
		for _, c := range n.Children {
			stack = append(stack, item{c, world})
		}
	}
	if len(g.tris) == 0 {
		return nil, errors.New("no triangles: the default scene has no triangle meshes")
	}
	return g.tris, nil
}

// addMesh appends every triangle primitive of mesh mi, transformed by world.
//
// It stays one function: the primitive's checks (mode, attributes, accessor
// types, index bounds) run in the order the specification states them, each
// naming what it refuses, before the triangles are added.
func (g *gltfReader) addMesh(mi int, world mat4) error {
	d := &g.doc
	if mi < 0 || mi >= len(d.Meshes) {
		return fmt.Errorf("mesh %d does not exist (%d meshes)", mi, len(d.Meshes))
	}
	flip := world.det3() < 0 // a mirroring transform reverses the winding (§3.7.4)
	for pi, p := range d.Meshes[mi].Primitives {
		mode := 4
		if p.Mode != nil {
			mode = *p.Mode
		}
		if mode < 4 { // points and lines enclose nothing
			continue
		}
		if mode > 6 {
			return fmt.Errorf("mesh %d primitive %d: mode %d is not a glTF primitive mode", mi, pi, mode)
		}
		where := fmt.Sprintf("mesh %d primitive %d", mi, pi)
		ai, ok := p.Attributes["POSITION"]
		if !ok {
			return fmt.Errorf("%s has no POSITION", where)
		}
		pos, err := g.positions(ai)
		if err != nil {
			return fmt.Errorf("%s: %w", where, err)
		}
		var idx []uint32
		if p.Indices != nil {
			if idx, err = g.indices(*p.Indices); err != nil {
				return fmt.Errorf("%s: %w", where, err)
			}
		} else {
			idx = make([]uint32, len(pos))
			for i := range idx {
				idx[i] = uint32(i)
			}
		}
		for _, k := range idx {
			if int(k) >= len(pos) {
				return fmt.Errorf("%s: index %d is out of range (%d positions)", where, k, len(pos))
			}
		}
		for i := range pos {
			pos[i] = world.apply(pos[i])
		}
		add := func(a, b, c uint32) error {
			if len(g.tris) >= MaxTriangles {
				return tooMany(uint64(len(g.tris)) + 1)
			}
			t := [3]r3.Vec{pos[a], pos[b], pos[c]}
			if flip {
				t[1], t[2] = t[2], t[1]
			}
			g.tris = append(g.tris, t)
			return nil
		}
		switch mode {
		case 4:
			if len(idx)%3 != 0 {
				return fmt.Errorf("%s: %d indices is not a whole number of triangles", where, len(idx))
			}
			for i := 0; i+2 < len(idx); i += 3 {
				if err := add(idx[i], idx[i+1], idx[i+2]); err != nil {
					return err
				}
			}
		case 5: // strip: every other triangle is wound the other way (§3.7.2.1)
			for i := 0; i+2 < len(idx); i++ {
				a, b := idx[i], idx[i+1]
				if i%2 == 1 {
					a, b = b, a
				}
				if err := add(a, b, idx[i+2]); err != nil {
					return err
				}
			}
		case 6: // fan
			for i := 1; i+1 < len(idx); i++ {
				if err := add(idx[0], idx[i], idx[i+1]); err != nil {
					return err
				}
			}
		}
	}
	return nil
}

// accessorBytes returns the bytes of accessor ai's elements: the element
// size, the stride and the slice that holds them (first element at 0).
// Every declared size is checked against the bytes that exist before use.
func (g *gltfReader) accessorBytes(ai int, elem int64) (data []byte, stride int64, err error) {
	d := &g.doc
	a := &d.Accessors[ai]
	if a.Count < 0 || a.ByteOffset < 0 {
		return nil, 0, fmt.Errorf("accessor %d has a negative count or offset", ai)
	}
	if a.Sparse != nil {
		return nil, 0, fmt.Errorf("accessor %d is sparse, which this tool does not read", ai)
	}
	if a.Count > 3*MaxTriangles {
		return nil, 0, tooMany(uint64(a.Count) / 3)
	}
	if a.BufferView == nil {
		// All zeros (§5.1): every triangle would have zero area.
		return nil, 0, fmt.Errorf("accessor %d has no buffer view (all zeros)", ai)
	}
	vi := *a.BufferView
	if vi < 0 || vi >= len(d.BufferViews) {
		return nil, 0, fmt.Errorf("accessor %d: buffer view %d does not exist", ai, vi)
	}
	v := &d.BufferViews[vi]
	if v.Buffer < 0 || v.Buffer >= len(d.Buffers) {
		return nil, 0, fmt.Errorf("buffer view %d: buffer %d does not exist", vi, v.Buffer)
	}
	buf, err := g.buffer(v.Buffer)
	if err != nil {
		return nil, 0, err
	}
	if v.ByteOffset < 0 || v.ByteLength < 0 || v.ByteOffset > int64(len(buf)) || v.ByteLength > int64(len(buf))-v.ByteOffset {
		return nil, 0, fmt.Errorf("buffer view %d runs past the end of buffer %d (truncated?)", vi, v.Buffer)
	}
	view := buf[v.ByteOffset : v.ByteOffset+v.ByteLength]
	stride = elem
	if v.ByteStride != nil && *v.ByteStride != 0 {
		stride = *v.ByteStride
		if stride < elem || stride > 252 {
			return nil, 0, fmt.Errorf("buffer view %d: byte stride %d does not fit %d-byte elements", vi, stride, elem)
		}
	}
	if a.Count == 0 {
		return nil, stride, nil
	}
	if a.ByteOffset > int64(len(view)) || (a.Count-1) > (int64(len(view))-a.ByteOffset-elem)/stride || int64(len(view))-a.ByteOffset < elem {
		return nil, 0, fmt.Errorf("accessor %d: %d elements do not fit in buffer view %d (%s)", ai, a.Count, vi, byteSize(v.ByteLength))
	}
	return view[a.ByteOffset:], stride, nil
}

// positions reads a POSITION accessor: VEC3 of float32.
func (g *gltfReader) positions(ai int) ([]r3.Vec, error) {
	d := &g.doc
	if ai < 0 || ai >= len(d.Accessors) {
		return nil, fmt.Errorf("accessor %d does not exist (%d accessors)", ai, len(d.Accessors))
	}
	a := &d.Accessors[ai]
	if a.Type != "VEC3" || a.ComponentType != compFloat || a.Normalized {
		return nil, fmt.Errorf("accessor %d: positions must be VEC3 of float (quantized positions are not read)", ai)
	}
	data, stride, err := g.accessorBytes(ai, 12)
	if err != nil {
		return nil, err
	}
	out := make([]r3.Vec, a.Count)
	for i := range out {
		out[i] = vec32(data[int64(i)*stride:])
		if p := out[i]; math.IsNaN(p.X+p.Y+p.Z) || math.IsInf(p.X+p.Y+p.Z, 0) {
			return nil, fmt.Errorf("accessor %d: position %d is not a finite number", ai, i)
		}
	}
	return out, nil
}

// indices reads an index accessor: SCALAR of u8, u16 or u32.
func (g *gltfReader) indices(ai int) ([]uint32, error) {
	d := &g.doc
	if ai < 0 || ai >= len(d.Accessors) {
		return nil, fmt.Errorf("accessor %d does not exist (%d accessors)", ai, len(d.Accessors))
	}
	a := &d.Accessors[ai]
	var size int64
	switch a.ComponentType {
	case compUByte:
		size = 1
	case compUShort:
		size = 2
	case compUInt:
		size = 4
	}
	if a.Type != "SCALAR" || size == 0 {
		return nil, fmt.Errorf("accessor %d: indices must be SCALAR of unsigned byte, short or int", ai)
	}
	data, stride, err := g.accessorBytes(ai, size)
	if err != nil {
		return nil, err
	}
	out := make([]uint32, a.Count)
	le := binary.LittleEndian
	for i := range out {
		b := data[int64(i)*stride:]
		switch size {
		case 1:
			out[i] = uint32(b[0])
		case 2:
			out[i] = uint32(le.Uint16(b))
		default:
			out[i] = le.Uint32(b)
		}
	}
	return out, nil
}

// buffer returns buffer i's bytes, loading them once.
func (g *gltfReader) buffer(i int) ([]byte, error) {
	if b, ok := g.buffers[i]; ok {
		return b, nil
	}
	bd := &g.doc.Buffers[i]
	b, err := g.load(i, bd.URI)
	if err != nil {
		return nil, err
	}
	if bd.ByteLength < 0 || int64(len(b)) < bd.ByteLength {
		return nil, fmt.Errorf("buffer %d has %s, less than the %s it declares (truncated)", i, byteSize(int64(len(b))), byteSize(bd.ByteLength))
	}
	b = b[:bd.ByteLength]
	g.buffers[i] = b
	return b, nil
}

func clipS(s string) string {
	if len(s) > 40 {
		return s[:40] + "..."
	}
	return s
}
