package meshio

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/fsutil"
	"propflight/internal/units"
)

// Limits on what the readers accept.
const (
	// MaxFileBytes is the largest mesh file read (1 GiB). A 1.2M-triangle
	// binary STL is 60 MB.
	MaxFileBytes = 1 << 30
	// MaxTriangles is the most triangles read from one file.
	MaxTriangles = 10_000_000
)

// Unit lengths in metres, from the one table in [units] (NIST SP 811,
// Appendix B: 1 in = 0.0254 m and 1 ft = 0.3048 m exactly).
var lengthUnits = map[string]float64{"m": 1, "cm": units.Centimetre.Float(), "mm": units.Millimetre.Float(),
	"in": units.Inch.Float(), "ft": units.Foot.Float()}

// UnitNames lists the unit names a mesh part's "units" takes.
func UnitNames() []string { return []string{"m", "cm", "mm", "in", "ft"} }

// UnitScale returns the length of the named unit in metres.
func UnitScale(name string) (float64, bool) {
	s, ok := lengthUnits[name]
	return s, ok
}

// Format is a mesh file format.
type Format int

// The formats read.
const (
	STL Format = iota
	OBJ
	GLB
	GLTF
)

// String returns the format's usual name.
func (f Format) String() string {
	switch f {
	case STL:
		return "STL"
	case OBJ:
		return "OBJ"
	case GLB:
		return "GLB"
	case GLTF:
		return "glTF"
	}
	return fmt.Sprintf("Format(%d)", int(f))
}

// Extensions lists the file name endings read, for file dialogs.
func Extensions() []string { return []string{".stl", ".obj", ".glb", ".gltf"} }

// FormatOf returns the format a file name's extension (any case) names.
func FormatOf(name string) (Format, error) {
	switch strings.ToLower(filepath.Ext(name)) {
	case ".stl":
		return STL, nil
	case ".obj":
		return OBJ, nil
	case ".glb":
		return GLB, nil
	case ".gltf":
		return GLTF, nil
	}
	ext := filepath.Ext(name)
	if ext == "" {
		return 0, fmt.Errorf("not a mesh file this tool reads: the name has no extension (use .stl, .obj, .glb or .gltf)")
	}
	return 0, fmt.Errorf("not a mesh file this tool reads: %s (use .stl, .obj, .glb or .gltf)", clipS(ext))
}

// Options say how to turn a file's numbers into metres in the prop's axes.
type Options struct {
	Units string // m (default when empty), cm, mm, in or ft
	UpZ   bool   // the file is z up: its +z becomes +y, its +y becomes -z
}

// ReadFile reads the mesh file at path (format by extension) and returns its
// triangles in metres, in the prop's axes, wound as the file winds them.
// A .gltf file's buffers may be data URIs or files beside it. Errors do not
// repeat the file's name, except to say it is missing; the caller names the
// field or argument that gave it.
func ReadFile(path string, o Options) ([][3]r3.Vec, error) {
	if _, err := checkOptions(path, o); err != nil {
		return nil, err
	}
	data, err := readLimited(path)
	if err != nil {
		return nil, err
	}
	dir := filepath.Dir(path)
	return Read(path, data, o, func(uri string) ([]byte, error) { return sideCar(dir, uri) })
}

// Read reads a mesh file's bytes; name gives the format by its extension.
// load returns a .gltf file's side-car buffers by their uri as written
// (nil: only data URIs). See ReadFile.
func Read(name string, data []byte, o Options, load func(uri string) ([]byte, error)) ([][3]r3.Vec, error) {
	f, err := checkOptions(name, o)
	if err != nil {
		return nil, err
	}
	if len(data) > MaxFileBytes {
		return nil, fmt.Errorf("the file is %s, more than the %s this tool reads", byteSize(int64(len(data))), byteSize(MaxFileBytes))
	}
	var tris [][3]r3.Vec
	switch f {
	case STL:
		tris, err = ReadSTL(data)
	case OBJ:
		tris, err = ReadOBJ(data)
	case GLB:
		tris, err = ReadGLB(data)
	case GLTF:
		tris, err = ReadGLTF(data, load)
	}
	if err != nil {
		return nil, err
	}
	scale := 1.0
	if o.Units != "" {
		scale = lengthUnits[o.Units]
	}
	Transform(tris, scale, o.UpZ)
	return tris, nil
}

// checkOptions returns the format of name and checks that o suits it.
func checkOptions(name string, o Options) (Format, error) {
	if o.Units != "" {
		if _, ok := UnitScale(o.Units); !ok {
			return 0, fmt.Errorf("%q is not a unit (use m, cm, mm, in or ft)", o.Units)
		}
	}
	f, err := FormatOf(name)
	if err != nil {
		return 0, err
	}
	if o.UpZ && (f == GLB || f == GLTF) {
		return 0, errors.New("a glTF file is always y up: leave up out or set it to y")
	}
	return f, nil
}

// Transform scales tris by scale (metres per file unit) and, with upZ, turns
// the file's +z to +y and its +y to -z, in place.
func Transform(tris [][3]r3.Vec, scale float64, upZ bool) {
	for i := range tris {
		for k, p := range tris[i] {
			if upZ {
				p = r3.Vec{X: p.X, Y: p.Z, Z: -p.Y}
			}
			tris[i][k] = r3.Scale(scale, p)
		}
	}
}

// readLimited reads a whole file of at most MaxFileBytes.
func readLimited(path string) ([]byte, error) {
	// Only a regular file: a named pipe would block the load forever and a
	// device never end (fsutil.OpenRegular).
	f, err := fsutil.OpenRegular(path)
	var nr *fsutil.NotRegularError
	if errors.As(err, &nr) && nr.Kind == "a folder" {
		return nil, fmt.Errorf("a folder, not a file: %s", path)
	}
	if err != nil {
		return nil, openError(path, err)
	}
	defer f.Close()
	st, err := f.Stat()
	if err != nil {
		return nil, openError(path, err)
	}
	if st.IsDir() {
		return nil, fmt.Errorf("a folder, not a file: %s", path)
	}
	if st.Size() > MaxFileBytes {
		return nil, fmt.Errorf("the file is %s, more than the %s this tool reads", byteSize(st.Size()), byteSize(MaxFileBytes))
	}
	// Read the size the file had when opened (no growing buffer to copy);
	// a file that changes meanwhile is read as far as it goes.
	data := make([]byte, st.Size())
	n, err := io.ReadFull(f, data)
	if err != nil && err != io.ErrUnexpectedEOF {
		return nil, fmt.Errorf("cannot read it: %v", err)
	}
	return data[:n], nil
}

// openError says in plain words why path could not be opened, naming the
// path as given (a relative name may have been resolved somewhere the user
// did not expect).
func openError(path string, err error) error {
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return fmt.Errorf("no such file: %s", path)
	case errors.Is(err, fs.ErrPermission):
		return fmt.Errorf("not allowed to read %s", path)
	}
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return fmt.Errorf("cannot open %s: %v", path, pe.Err)
	}
	return fmt.Errorf("cannot open %s: %v", path, err)
}

// byteSize writes n bytes in the largest fitting unit ("1.2 MB").
func byteSize(n int64) string {
	const k = 1000
	switch {
	case n < k:
		return fmt.Sprintf("%d bytes", n)
	case n < k*k:
		return fmt.Sprintf("%.3g kB", float64(n)/k)
	case n < k*k*k:
		return fmt.Sprintf("%.3g MB", float64(n)/(k*k))
	}
	return fmt.Sprintf("%.3g GB", float64(n)/(k*k*k))
}

// vec32 returns the float32 triple at b[0:12], little-endian, as a vector.
func vec32(b []byte) r3.Vec {
	return r3.Vec{X: f32(b[0:4]), Y: f32(b[4:8]), Z: f32(b[8:12])}
}

func f32(b []byte) float64 {
	return float64(math.Float32frombits(uint32(b[0]) | uint32(b[1])<<8 | uint32(b[2])<<16 | uint32(b[3])<<24))
}

func tooMany(n uint64) error {
	return fmt.Errorf("%d triangles is more than the %d this tool reads", n, MaxTriangles)
}
