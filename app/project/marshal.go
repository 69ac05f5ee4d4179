package project

import (
	"bytes"
	"encoding/json"
	"io"
	"math"
	"strconv"

	"propflight/app/fsutil"
)

// Marshal returns the document as a version 1 project file: keys in the
// order of DESIGN.md's contract, two-space indentation, arrays of numbers
// on one line, a trailing newline. The same document always gives the same
// bytes. Fields left nil are left out. Numbers are written in their
// shortest form that reads back to the same float64; a NaN or infinity is
// an error naming its field (JSON cannot hold one).
func Marshal(d *Document) ([]byte, error) {
	e := emitter{file: d.File}
	e.open('{')
	e.key("format")
	e.string(Format)
	if d.Name != "" {
		e.key("name")
		e.string(d.Name)
	}
	e.key("prop")
	e.open('{')
	e.key("parts")
	e.open('[')
	for i := range d.Prop.Parts {
		e.part(&d.Prop.Parts[i], index("prop.parts", i))
	}
	e.close(']')
	e.close('}')
	if !d.Throw.empty() {
		e.key("throw")
		e.throw(&d.Throw)
	}
	e.verdictRules(d.VerdictRules)
	if d.Footage != nil {
		e.footage(d.Footage)
	}
	e.close('}')
	if e.err != nil {
		return nil, e.err
	}
	e.buf.WriteByte('\n')
	return e.buf.Bytes(), nil
}

// Save writes the document to path atomically (fsutil.WriteAtomic): the
// old file stays whole until the new one is complete on disk. A symbolic
// link stays a link to the file it names; a read-only file is refused
// (the error wraps fsutil.ErrReadOnly).
func Save(path string, d *Document) error { return SaveWith(path, d, fsutil.Options{}) }

// SaveWith is Save with the write options opt (such as replacing a
// read-only file after the user agreed).
func SaveWith(path string, d *Document, opt fsutil.Options) error {
	data, err := Marshal(d)
	if err != nil {
		return err
	}
	return fsutil.WriteFile(path, opt, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	})
}

func (t *Throw) empty() bool { return *t == Throw{} }

// emitter writes indented JSON with a sticky error, like image/png's
// encoder: after the first error every call does nothing.
type emitter struct {
	file    string
	buf     bytes.Buffer
	depth   int
	first   bool // no member written yet at this level
	err     error
	scratch [32]byte
}

func (e *emitter) newline() {
	e.buf.WriteByte('\n')
	for range e.depth {
		e.buf.WriteString("  ")
	}
}

// item starts a member or element: a comma after the previous one and a
// new line.
func (e *emitter) item() {
	if !e.first {
		e.buf.WriteByte(',')
	}
	e.first = false
	e.newline()
}

func (e *emitter) open(c byte) {
	e.buf.WriteByte(c)
	e.depth++
	e.first = true
}

func (e *emitter) close(c byte) {
	e.depth--
	if !e.first {
		e.newline()
	}
	e.buf.WriteByte(c)
	e.first = false
}

// key writes `"k": ` as the next member.
func (e *emitter) key(k string) {
	e.item()
	e.string(k)
	e.buf.WriteString(": ")
}

func (e *emitter) string(s string) {
	plain := true
	for i := 0; i < len(s) && plain; i++ {
		c := s[i]
		plain = c >= 0x20 && c < 0x7f && c != '"' && c != '\\'
	}
	if plain {
		e.buf.WriteByte('"')
		e.buf.WriteString(s)
		e.buf.WriteByte('"')
		return
	}
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetEscapeHTML(false) // keep "<", ">" and "&" readable in names
	enc.Encode(s)            // never fails for a string
	e.buf.Write(bytes.TrimSuffix(b.Bytes(), []byte{'\n'}))
}

// number writes x as encoding/json does: the shortest form that reads
// back to the same float64, in exponent form only below 1e-6 or from 1e21.
// field names the value for the error a NaN or infinity gives; it is only
// called then.
func (e *emitter) number(field func() string, x float64) {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		if e.err == nil {
			e.err = &Error{File: e.file, Field: field(), Msg: "must be a finite number"}
		}
		e.buf.WriteString("0")
		return
	}
	format := byte('f')
	if a := math.Abs(x); a != 0 && (a < 1e-6 || a >= 1e21) {
		format = 'e'
	}
	b := strconv.AppendFloat(e.scratch[:0], x, format, -1, 64)
	if format == 'e' {
		// e-07 -> e-7, as encoding/json writes it.
		if n := len(b); n >= 4 && b[n-4] == 'e' && b[n-3] == '-' && b[n-2] == '0' {
			b[n-2] = b[n-1]
			b = b[:n-1]
		}
	}
	e.buf.Write(b)
}

func (e *emitter) num(k, path string, x *float64) {
	if x == nil {
		return
	}
	e.key(k)
	e.number(func() string { return join(path, k) }, *x)
}

func (e *emitter) vec(k, path string, v *Vec3) {
	if v == nil {
		return
	}
	e.key(k)
	e.inlineVec(func() string { return join(path, k) }, *v)
}

func (e *emitter) inlineVec(field func() string, v Vec3) {
	e.buf.WriteByte('[')
	for i, x := range v {
		if i > 0 {
			e.buf.WriteString(", ")
		}
		e.number(func() string { return index(field(), i) }, x)
	}
	e.buf.WriteByte(']')
}

func (e *emitter) part(p *Part, path string) {
	e.item()
	e.open('{')
	if p.Name != "" {
		e.key("name")
		e.string(p.Name)
	}
	e.key("shape")
	e.string(p.Shape)
	for _, f := range []struct {
		key string
		val *string
	}{{"file", p.File}, {"units", p.Units}, {"up", p.Up}} {
		if f.val != nil {
			e.key(f.key)
			e.string(*f.val)
		}
	}
	e.vec("size", path, p.Size)
	e.num("radius", path, p.Radius)
	e.num("inner_radius", path, p.InnerRadius)
	e.num("length", path, p.Length)
	e.num("height", path, p.Height)
	e.num("tube_radius", path, p.TubeRadius)
	e.vec("semi_axes", path, p.SemiAxes)
	e.num("mass", path, p.Mass)
	e.num("density", path, p.Density)
	e.num("wall_m", path, p.WallM)
	e.vec("position", path, p.Position)
	e.vec("rotation_deg", path, p.RotationDeg)
	e.close('}')
}

func (e *emitter) throw(t *Throw) {
	const path = "throw"
	e.open('{')
	if t.FPS != nil {
		e.key("fps")
		if t.FPS.IsText() {
			e.string(t.FPS.Text)
		} else {
			e.number(func() string { return "throw.fps" }, t.FPS.Number)
		}
	}
	e.num("gravity", path, t.Gravity)
	e.vec("release_position", path, t.ReleasePosition)
	e.vec("release_velocity", path, t.ReleaseVelocity)
	e.num("hang_time_s", path, t.HangTimeS)
	e.num("hang_frames", path, t.HangFrames)
	e.num("distance", path, t.Distance)
	e.num("heading_deg", path, t.HeadingDeg)
	e.vec("orientation_deg", path, t.OrientationDeg)
	e.num("ground_y", path, t.GroundY)
	if s := t.Spin; s != nil {
		const sp = "throw.spin"
		e.key("spin")
		e.open('{')
		if s.Axis != nil {
			e.key("axis")
			if s.Axis.Vector != nil {
				e.inlineVec(func() string { return "throw.spin.axis" }, *s.Axis.Vector)
			} else {
				e.string(s.Axis.Name)
			}
		}
		e.num("tilt_deg", sp, s.TiltDeg)
		if s.TiltToward != nil {
			e.key("tilt_toward")
			e.string(*s.TiltToward)
		}
		e.num("turns_per_second", sp, s.TurnsPerSecond)
		e.num("frames_per_turn", sp, s.FramesPerTurn)
		e.close('}')
	}
	e.close('}')
}
