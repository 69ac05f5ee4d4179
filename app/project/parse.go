package project

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"slices"
	"strconv"
	"strings"

	"propflight/app/fsutil"
)

// Load reads and parses the project file at path (see Parse). Errors name
// path as the file.
func Load(path string) (*Document, error) {
	if path == "" {
		return nil, &Error{Msg: "the empty path names no project file"}
	}
	f, err := fsutil.OpenRegular(path)
	if err != nil {
		return nil, readError(path, err)
	}
	defer f.Close()
	// Read one byte past the limit to tell a file at the limit from a
	// larger one without trusting the reported size.
	data, err := io.ReadAll(io.LimitReader(f, MaxFileSize+1))
	if err != nil {
		return nil, readError(path, err)
	}
	return Parse(path, data)
}

// readError describes a failure to read path. A missing file is the
// user's input problem and comes back as *Error; other failures (such as
// permissions or I/O) keep their cause so that callers can tell them apart.
func readError(path string, err error) error {
	if errors.Is(err, fs.ErrNotExist) {
		return &Error{File: path, Msg: "no such file", Err: fs.ErrNotExist}
	}
	var nr *fsutil.NotRegularError
	if errors.As(err, &nr) {
		return &Error{File: path, Msg: "is " + nr.Kind + ", not a project file", Err: err}
	}
	var pe *fs.PathError
	if errors.As(err, &pe) {
		err = pe.Err
	}
	return fmt.Errorf("%s: cannot read: %w", path, err)
}

// Parse reads a version 1 project file from data. name is the file name
// used in error messages. It checks the JSON syntax, the format, that every
// key is known and belongs where it stands (a box has no radius), the type
// of every value, that required fields are present and that exclusive
// fields are not given together. It does not check the values' ranges:
// Build does. Every error is an *Error.
func Parse(name string, data []byte) (*Document, error) {
	if len(data) > MaxFileSize {
		return nil, &Error{File: name, Msg: fmt.Sprintf("the file is larger than %d MiB, the limit for project files; is it really one?", MaxFileSize>>20)}
	}
	// Some editors start UTF-8 files with a byte order mark; it is not JSON.
	data = bytes.TrimPrefix(data, []byte("\xef\xbb\xbf"))
	root, err := readTree(name, data)
	if err != nil {
		return nil, err
	}
	p := parser{file: name}
	doc, err := p.document(root)
	if err != nil {
		return nil, err
	}
	doc.File = name
	return doc, nil
}

// parser turns the JSON tree into a Document, naming fields in errors.
type parser struct{ file string }

func (p *parser) fail(field, format string, args ...any) *Error {
	return &Error{File: p.file, Field: field, Msg: fmt.Sprintf(format, args...)}
}

// object checks that v is an object whose keys are all in known, each at
// most once, and returns its members by key.
func (p *parser) object(v *value, path string, known []string) (map[string]*value, error) {
	if v.kind != kindObject {
		return nil, p.fail(path, "must be an object")
	}
	m := make(map[string]*value, len(v.members))
	for _, mb := range v.members {
		if !slices.Contains(known, mb.key) {
			return nil, p.fail(join(path, mb.key), "unknown field%s", suggest(mb.key, known))
		}
		if _, dup := m[mb.key]; dup {
			return nil, p.fail(join(path, mb.key), "given twice")
		}
		m[mb.key] = mb.val
	}
	return m, nil
}

// suggest returns ` (did you mean "k"?)` for the known key nearest to key
// when it is a likely typo; else, for an object of at most four keys (the
// verdict rules, the prop), ` (known: a, b, c)`, so the right name is on the
// line; else "".
func suggest(key string, known []string) string {
	best, bestD := "", 3
	for _, k := range known {
		if d := editDistance(strings.ToLower(key), k); d < bestD {
			best, bestD = k, d
		}
	}
	if best == "" || bestD*2 > len(best) || len(key) > 64 {
		if len(known) > 0 && len(known) <= 4 {
			return " (known: " + strings.Join(known, ", ") + ")"
		}
		return ""
	}
	return fmt.Sprintf(" (did you mean %q?)", best)
}

// editDistance is the Levenshtein distance between a and b (bytes).
func editDistance(a, b string) int {
	if len(a) > 64 || len(b) > 64 {
		return max(len(a), len(b))
	}
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}

// number returns v as a finite float64.
func (p *parser) number(v *value, path string) (float64, error) {
	if v.kind != kindNumber {
		return 0, p.fail(path, "must be a number")
	}
	x, err := strconv.ParseFloat(v.text, 64)
	if err != nil || math.IsInf(x, 0) || math.IsNaN(x) {
		return 0, p.fail(path, "the number %s is out of range", shorten(v.text))
	}
	return x, nil
}

func (p *parser) numberPtr(m map[string]*value, key, path string) (*float64, error) {
	v, ok := m[key]
	if !ok {
		return nil, nil
	}
	x, err := p.number(v, join(path, key))
	if err != nil {
		return nil, err
	}
	return &x, nil
}

// vec3 returns v as an array of three finite numbers.
func (p *parser) vec3(v *value, path string) (Vec3, error) {
	if v.kind != kindArray || len(v.elems) != 3 {
		return Vec3{}, p.fail(path, "must be an array of 3 numbers")
	}
	var out Vec3
	for i, e := range v.elems {
		x, err := p.number(e, index(path, i))
		if err != nil {
			return Vec3{}, err
		}
		out[i] = x
	}
	return out, nil
}

func (p *parser) vec3Ptr(m map[string]*value, key, path string) (*Vec3, error) {
	v, ok := m[key]
	if !ok {
		return nil, nil
	}
	x, err := p.vec3(v, join(path, key))
	if err != nil {
		return nil, err
	}
	return &x, nil
}

func (p *parser) str(v *value, path string) (string, error) {
	if v.kind != kindString {
		return "", p.fail(path, "must be a string")
	}
	return v.text, nil
}

// shorten quotes s for a message, cut to a readable length.
func shorten(s string) string {
	const n = 40
	if len(s) > n {
		return s[:n] + "..."
	}
	return s
}

func quoteShort(s string) string {
	r := []rune(s)
	if len(r) > 40 {
		return strconv.Quote(string(r[:40])) + "..."
	}
	return strconv.Quote(s)
}

var (
	documentKeys = []string{"format", "name", "prop", "throw", "verdict_rules", "footage"}
	propKeys     = []string{"parts"}
	partKeys     = []string{"name", "shape", "size", "radius", "inner_radius", "length", "height", "tube_radius", "semi_axes", "mass", "density", "position", "rotation_deg", "file", "units", "up", "wall_m"}
	throwKeys    = []string{"fps", "gravity", "release_position", "release_velocity", "hang_time_s", "hang_frames", "distance", "heading_deg", "orientation_deg", "ground_y", "spin"}
	spinKeys     = []string{"axis", "tilt_deg", "tilt_toward", "turns_per_second", "frames_per_turn"}
	axisNames    = []string{"least", "middle", "greatest"}
)

func (p *parser) document(root *value) (*Document, error) {
	if root.kind != kindObject {
		return nil, &Error{File: p.file, Msg: fmt.Sprintf("a project file must hold one JSON object, not %s", root.kind)}
	}
	// The format comes first: a file of another kind gets one clear message
	// rather than a list of unknown keys.
	var format *value
	for _, mb := range root.members {
		if mb.key == "format" {
			format = mb.val
			break
		}
	}
	if format == nil {
		return nil, p.fail("format", "missing: a project file starts with \"format\": %q", Format)
	}
	if format.kind != kindString {
		return nil, p.fail("format", "must be the string %q", Format)
	}
	if format.text != Format {
		return nil, p.fail("format", "%s is not a format this version reads (it reads %q)", quoteShort(format.text), Format)
	}
	m, err := p.object(root, "", documentKeys)
	if err != nil {
		return nil, err
	}
	doc := &Document{}
	if v, ok := m["name"]; ok {
		if doc.Name, err = p.str(v, "name"); err != nil {
			return nil, err
		}
	}
	pv, ok := m["prop"]
	if !ok {
		return nil, p.fail("prop", "missing: a project needs a prop with its parts")
	}
	if doc.Prop, err = p.prop(pv); err != nil {
		return nil, err
	}
	if tv, ok := m["throw"]; ok {
		if doc.Throw, err = p.throw(tv); err != nil {
			return nil, err
		}
	}
	if rv, ok := m["verdict_rules"]; ok {
		if doc.VerdictRules, err = p.verdictRules(rv); err != nil {
			return nil, err
		}
	}
	if fv, ok := m["footage"]; ok {
		if doc.Footage, err = p.footage(fv); err != nil {
			return nil, err
		}
	}
	return doc, nil
}

func (p *parser) prop(v *value) (Prop, error) {
	m, err := p.object(v, "prop", propKeys)
	if err != nil {
		return Prop{}, err
	}
	pv, ok := m["parts"]
	if !ok {
		return Prop{}, p.fail("prop.parts", "missing: a prop needs a list of parts")
	}
	if pv.kind != kindArray {
		return Prop{}, p.fail("prop.parts", "must be an array of parts")
	}
	prop := Prop{Parts: make([]Part, 0, len(pv.elems))}
	for i, e := range pv.elems {
		part, err := p.part(e, index("prop.parts", i))
		if err != nil {
			return Prop{}, err
		}
		prop.Parts = append(prop.Parts, part)
	}
	return prop, nil
}

// article returns "a" or "an" for a shape name.
func article(shape string) string {
	if strings.IndexByte("aeiou", shape[0]) >= 0 {
		return "an"
	}
	return "a"
}

func listWords(words []string) string {
	switch len(words) {
	case 1:
		return words[0]
	case 2:
		return words[0] + " and " + words[1]
	}
	return strings.Join(words[:len(words)-1], ", ") + " and " + words[len(words)-1]
}

func (p *parser) part(v *value, path string) (Part, error) {
	m, err := p.object(v, path, partKeys)
	if err != nil {
		return Part{}, err
	}
	var part Part
	if nv, ok := m["name"]; ok {
		if part.Name, err = p.str(nv, join(path, "name")); err != nil {
			return Part{}, err
		}
	}
	if sv, ok := m["shape"]; ok {
		if part.Shape, err = p.str(sv, join(path, "shape")); err != nil {
			return Part{}, err
		}
		if part.Shape == "" {
			return Part{}, p.fail(join(path, "shape"), "must not be empty (one of %s)", strings.Join(shapeNames(), ", "))
		}
	}
	for _, f := range []struct {
		key string
		dst **string
	}{{"file", &part.File}, {"units", &part.Units}, {"up", &part.Up}} {
		if sv, ok := m[f.key]; ok {
			s, err := p.str(sv, join(path, f.key))
			if err != nil {
				return Part{}, err
			}
			*f.dst = &s
		}
	}
	for _, f := range []struct {
		key string
		dst **float64
	}{
		{"radius", &part.Radius}, {"inner_radius", &part.InnerRadius}, {"length", &part.Length},
		{"height", &part.Height}, {"tube_radius", &part.TubeRadius}, {"mass", &part.Mass}, {"density", &part.Density},
		{"wall_m", &part.WallM},
	} {
		if *f.dst, err = p.numberPtr(m, f.key, path); err != nil {
			return Part{}, err
		}
	}
	for _, f := range []struct {
		key string
		dst **Vec3
	}{
		{"size", &part.Size}, {"semi_axes", &part.SemiAxes}, {"position", &part.Position}, {"rotation_deg", &part.RotationDeg},
	} {
		if *f.dst, err = p.vec3Ptr(m, f.key, path); err != nil {
			return Part{}, err
		}
	}
	if pr := partFields(&part, path); pr != nil {
		return Part{}, pr.in(p.file)
	}
	return part, nil
}

func (p *parser) throw(v *value) (Throw, error) {
	const path = "throw"
	m, err := p.object(v, path, throwKeys)
	if err != nil {
		return Throw{}, err
	}
	var th Throw
	if fv, ok := m["fps"]; ok {
		if th.FPS, err = p.rateValue(fv, "throw.fps"); err != nil {
			return Throw{}, err
		}
	}
	for _, f := range []struct {
		key string
		dst **float64
	}{
		{"gravity", &th.Gravity}, {"hang_time_s", &th.HangTimeS}, {"hang_frames", &th.HangFrames},
		{"distance", &th.Distance}, {"heading_deg", &th.HeadingDeg}, {"ground_y", &th.GroundY},
	} {
		if *f.dst, err = p.numberPtr(m, f.key, path); err != nil {
			return Throw{}, err
		}
	}
	for _, f := range []struct {
		key string
		dst **Vec3
	}{
		{"release_position", &th.ReleasePosition}, {"release_velocity", &th.ReleaseVelocity}, {"orientation_deg", &th.OrientationDeg},
	} {
		if *f.dst, err = p.vec3Ptr(m, f.key, path); err != nil {
			return Throw{}, err
		}
	}
	if sv, ok := m["spin"]; ok {
		spin, err := p.spin(sv)
		if err != nil {
			return Throw{}, err
		}
		th.Spin = &spin
	}
	if pr := throwFields(&th); pr != nil {
		return Throw{}, pr.in(p.file)
	}
	return th, nil
}

func (p *parser) spin(v *value) (Spin, error) {
	const path = "throw.spin"
	m, err := p.object(v, path, spinKeys)
	if err != nil {
		return Spin{}, err
	}
	var s Spin
	if av, ok := m["axis"]; ok {
		switch av.kind {
		case kindString:
			s.Axis = &SpinAxis{Name: av.text}
		case kindArray:
			vec, err := p.vec3(av, "throw.spin.axis")
			if err != nil {
				return Spin{}, err
			}
			s.Axis = &SpinAxis{Vector: &vec}
		default:
			return Spin{}, p.fail("throw.spin.axis", "must be \"least\", \"middle\", \"greatest\" or a vector [x, y, z]")
		}
	}
	if tv, ok := m["tilt_toward"]; ok {
		name, err := p.str(tv, "throw.spin.tilt_toward")
		if err != nil {
			return Spin{}, err
		}
		s.TiltToward = &name
	}
	for _, f := range []struct {
		key string
		dst **float64
	}{{"tilt_deg", &s.TiltDeg}, {"turns_per_second", &s.TurnsPerSecond}, {"frames_per_turn", &s.FramesPerTurn}} {
		if *f.dst, err = p.numberPtr(m, f.key, path); err != nil {
			return Spin{}, err
		}
	}
	return s, nil
}
