package project

import (
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"propflight/internal/mark"
	"propflight/physics"
)

// Footage is the optional top-level "footage" object: reference footage
// shown beside the take, and the user's marks on it.
//
//	"footage": {"path": "clip/", "fps": 24, "offset": 0, "overlay": false,
//	            "opacity": 0.6,
//	            "marks": [{"frame": 3, "x": 412.5, "y": 300.25, "x2": 440, "y2": 290}]}
//
// Path is required; every other field is optional and nil (or, for Marks,
// a nil slice) when the file leaves it out, so that Load then Save writes
// back what the user wrote. Build does not use the footage for the scene;
// it only checks the values (see [Document.Build]).
type Footage struct {
	// Path is the folder of numbered frames or the GIF file, as written:
	// relative to the project file's folder (with '/' separators) or
	// absolute. Use [Document.FootageDir] to resolve it and
	// [Document.SetFootagePath] to set it.
	Path string // "path"
	// FPS is the footage's own frame rate, written like throw.fps; nil
	// means the rate the clip itself gives (a GIF's frame delays) or 24.
	FPS *FrameRate // "fps"
	// Offset is the footage frame at the take's release (take frame 0);
	// it may be negative when the clip starts after the release. Default 0.
	Offset *int // "offset", frames of the footage
	// Overlay says whether the take is drawn over the footage. Default false.
	Overlay *bool // "overlay"
	// Opacity of that overlay, 0 (invisible) to 1. Default DefaultOpacity.
	Opacity *float64 // "opacity"
	// Marks are the user's clicks on the footage, in file order: the
	// elements of "footage.marks", {"frame", "x", "y"} and optionally
	// "x2" and "y2" together (the second point, mark.Mark.HasSecond).
	Marks []mark.Mark // "marks"
}

// Defaults of the footage object (its limits are mark.MaxFrame and
// mark.MaxCoord, the fits' own, so that every mark a project keeps can be
// fitted).
const (
	// DefaultOpacity is the overlay opacity when "opacity" is left out.
	DefaultOpacity = 0.6
)

var (
	footageKeys = []string{"path", "fps", "offset", "overlay", "opacity", "marks"}
	markKeys    = []string{"frame", "x", "y", "x2", "y2"}
)

// maxWholeNumber bounds the whole numbers Parse turns into an int, so that
// the conversion is exact on every platform; Build's ranges are far inside.
const maxWholeNumber = 1 << 31

// whole returns v as a whole number that fits an int.
func (p *parser) whole(v *value, path string) (int, error) {
	x, err := p.number(v, path)
	if err != nil {
		return 0, err
	}
	if x != math.Trunc(x) {
		return 0, p.fail(path, "must be a whole number, not %s", shorten(v.text))
	}
	if math.Abs(x) >= maxWholeNumber {
		return 0, p.fail(path, "the number %s is out of range", shorten(v.text))
	}
	return int(x), nil
}

// rateValue reads a frame rate written as a number or a string, as
// throw.fps and footage.fps are.
func (p *parser) rateValue(v *value, path string) (*FrameRate, error) {
	switch v.kind {
	case kindNumber:
		x, err := p.number(v, path)
		if err != nil {
			return nil, err
		}
		return &FrameRate{Number: x}, nil
	case kindString:
		if strings.TrimSpace(v.text) == "" {
			return nil, p.fail(path, "must not be empty: write a number or a string such as \"24000/1001\"")
		}
		return &FrameRate{Text: v.text}, nil
	}
	return nil, p.fail(path, "must be a number or a string such as \"24000/1001\"")
}

func (p *parser) footage(v *value) (*Footage, error) {
	const path = "footage"
	m, err := p.object(v, path, footageKeys)
	if err != nil {
		return nil, err
	}
	f := &Footage{}
	pv, ok := m["path"]
	if !ok {
		return nil, p.fail("footage.path", "missing: give the folder of frames or the GIF file, relative to the project file")
	}
	if f.Path, err = p.str(pv, "footage.path"); err != nil {
		return nil, err
	}
	if strings.TrimSpace(f.Path) == "" {
		return nil, p.fail("footage.path", "must not be empty")
	}
	if fv, ok := m["fps"]; ok {
		if f.FPS, err = p.rateValue(fv, "footage.fps"); err != nil {
			return nil, err
		}
	}
	if ov, ok := m["offset"]; ok {
		n, err := p.whole(ov, "footage.offset")
		if err != nil {
			return nil, err
		}
		f.Offset = &n
	}
	if ov, ok := m["overlay"]; ok {
		if ov.kind != kindBool {
			return nil, p.fail("footage.overlay", "must be true or false")
		}
		b := ov.text == "true"
		f.Overlay = &b
	}
	if f.Opacity, err = p.numberPtr(m, "opacity", path); err != nil {
		return nil, err
	}
	if mv, ok := m["marks"]; ok {
		if mv.kind != kindArray {
			return nil, p.fail("footage.marks", "must be an array of marks such as {\"frame\": 3, \"x\": 412.5, \"y\": 300}")
		}
		f.Marks = make([]mark.Mark, 0, len(mv.elems))
		for i, e := range mv.elems {
			mk, err := p.mark(e, index("footage.marks", i))
			if err != nil {
				return nil, err
			}
			f.Marks = append(f.Marks, mk)
		}
	}
	return f, nil
}

func (p *parser) mark(v *value, path string) (mark.Mark, error) {
	m, err := p.object(v, path, markKeys)
	if err != nil {
		return mark.Mark{}, err
	}
	var mk mark.Mark
	for _, k := range []string{"frame", "x", "y"} {
		if _, ok := m[k]; !ok {
			return mark.Mark{}, p.fail(join(path, k), "missing (a mark has frame, x and y, and optionally x2 and y2)")
		}
	}
	if mk.Frame, err = p.whole(m["frame"], join(path, "frame")); err != nil {
		return mark.Mark{}, err
	}
	if mk.X, err = p.number(m["x"], join(path, "x")); err != nil {
		return mark.Mark{}, err
	}
	if mk.Y, err = p.number(m["y"], join(path, "y")); err != nil {
		return mark.Mark{}, err
	}
	x2, err := p.numberPtr(m, "x2", path)
	if err != nil {
		return mark.Mark{}, err
	}
	y2, err := p.numberPtr(m, "y2", path)
	if err != nil {
		return mark.Mark{}, err
	}
	switch {
	case x2 != nil && y2 == nil:
		return mark.Mark{}, p.fail(join(path, "y2"), "missing: x2 needs y2 (the second point has both)")
	case y2 != nil && x2 == nil:
		return mark.Mark{}, p.fail(join(path, "x2"), "missing: y2 needs x2 (the second point has both)")
	case x2 != nil:
		mk.HasSecond, mk.X2, mk.Y2 = true, *x2, *y2
	}
	return mk, nil
}

// footage writes the "footage" object. Marks are written one to a line.
func (e *emitter) footage(f *Footage) {
	const path = "footage"
	e.key("footage")
	e.open('{')
	e.key("path")
	e.string(f.Path)
	if f.FPS != nil {
		e.key("fps")
		if f.FPS.IsText() {
			e.string(f.FPS.Text)
		} else {
			e.number(func() string { return "footage.fps" }, f.FPS.Number)
		}
	}
	if f.Offset != nil {
		e.key("offset")
		e.buf.WriteString(strconv.Itoa(*f.Offset))
	}
	if f.Overlay != nil {
		e.key("overlay")
		e.buf.WriteString(strconv.FormatBool(*f.Overlay))
	}
	e.num("opacity", path, f.Opacity)
	if f.Marks != nil {
		e.key("marks")
		e.open('[')
		for i := range f.Marks {
			e.item()
			e.inlineMark(&f.Marks[i], index("footage.marks", i))
		}
		e.close(']')
	}
	e.close('}')
}

// inlineMark writes a mark as a one-line object.
func (e *emitter) inlineMark(mk *mark.Mark, path string) {
	e.buf.WriteString(`{"frame": `)
	e.buf.WriteString(strconv.Itoa(mk.Frame))
	field := func(k string, x float64) {
		e.buf.WriteString(`, "` + k + `": `)
		e.number(func() string { return join(path, k) }, x)
	}
	field("x", mk.X)
	field("y", mk.Y)
	if mk.HasSecond {
		field("x2", mk.X2)
		field("y2", mk.Y2)
	}
	e.buf.WriteByte('}')
}

// footage checks the footage object's values: a path, a frame rate of at
// least 1 frame per second, an offset and mark frames in range, an opacity
// from 0 to 1, mark coordinates of at most mark.MaxCoord pixels and each
// frame marked at most once.
func (b *builder) footage(f *Footage) error {
	if f == nil {
		return nil
	}
	if strings.TrimSpace(f.Path) == "" {
		return b.fail("footage.path", "must not be empty")
	}
	if strings.ContainsRune(f.Path, 0) {
		return b.fail("footage.path", "must not contain a NUL character")
	}
	if f.FPS != nil {
		if _, err := b.rateAt("footage.fps", f.FPS); err != nil {
			return err
		}
	}
	if f.Offset != nil {
		if o := *f.Offset; o < -mark.MaxFrame || o > mark.MaxFrame {
			return b.fail("footage.offset", "must be within +-%d frames", mark.MaxFrame)
		}
	}
	if f.Opacity != nil {
		if o := *f.Opacity; !(o >= 0 && o <= 1) {
			return b.fail("footage.opacity", "must be from 0 (invisible) to 1 (opaque)")
		}
	}
	first := make(map[int]int, len(f.Marks)) // frame -> index of its first mark
	for i := range f.Marks {
		mk := &f.Marks[i]
		path := index("footage.marks", i)
		switch {
		case mk.Frame < 0:
			return b.fail(join(path, "frame"), "must be 0 or more (footage frames count from 0)")
		case mk.Frame > mark.MaxFrame:
			return b.fail(join(path, "frame"), "must be at most %d", mark.MaxFrame)
		}
		coords := []struct {
			k string
			x float64
		}{{"x", mk.X}, {"y", mk.Y}, {"x2", mk.X2}, {"y2", mk.Y2}}
		if !mk.HasSecond {
			coords = coords[:2]
		}
		for _, c := range coords {
			if math.IsNaN(c.x) || math.Abs(c.x) > mark.MaxCoord {
				return b.fail(join(path, c.k), "must be a finite number of at most %g pixels from the image corner", mark.MaxCoord)
			}
		}
		if j, dup := first[mk.Frame]; dup {
			return b.fail(join(path, "frame"), "frame %d is marked twice (first in footage.marks[%d])", mk.Frame, j)
		}
		first[mk.Frame] = i
	}
	return nil
}

// FootageDir returns the footage's folder or GIF file as a path to open:
// footage.path resolved against the folder of projectPath (the project
// file) when it is relative, or as written when it is absolute. With an
// empty projectPath (a project never saved) a relative path is returned as
// it is, relative to the working directory. It returns "" when the
// document has no footage.
func (d *Document) FootageDir(projectPath string) string {
	if d.Footage == nil || d.Footage.Path == "" {
		return ""
	}
	p := filepath.FromSlash(d.Footage.Path)
	if filepath.IsAbs(p) || projectPath == "" {
		return filepath.Clean(p)
	}
	return filepath.Join(filepath.Dir(projectPath), p)
}

// SetFootagePath sets footage.path (adding the footage object if there is
// none) to footagePath, stored relative to the folder of projectPath when
// one can be made (filepath.Rel of the absolute paths) and with '/'
// separators, so that a project folder can be moved with its footage, or
// absolute otherwise (a project never saved, another Windows drive). A
// trailing separator on footagePath is not kept.
func (d *Document) SetFootagePath(projectPath, footagePath string) {
	if d.Footage == nil {
		d.Footage = &Footage{}
	}
	d.Footage.Path = footagePathFor(projectPath, footagePath)
}

// RebaseFootage rewrites a relative footage.path for a project that moves
// from oldProject to newProject (a "Save as" to another folder), so that it
// still names the same footage. An absolute path, or a document without
// footage, is left as it is.
func (d *Document) RebaseFootage(oldProject, newProject string) {
	if d.Footage == nil || d.Footage.Path == "" || filepath.IsAbs(filepath.FromSlash(d.Footage.Path)) {
		return
	}
	d.Footage.Path = footagePathFor(newProject, d.FootageDir(oldProject))
}

// footagePathFor returns footagePath as footage.path for a project at
// projectPath.
func footagePathFor(projectPath, footagePath string) string {
	abs, err := filepath.Abs(footagePath)
	if err != nil {
		return filepath.ToSlash(filepath.Clean(footagePath))
	}
	if projectPath == "" {
		return filepath.ToSlash(abs)
	}
	base, err := filepath.Abs(filepath.Dir(projectPath))
	if err != nil {
		return filepath.ToSlash(abs)
	}
	rel, err := filepath.Rel(base, abs)
	if err != nil {
		return filepath.ToSlash(abs)
	}
	return filepath.ToSlash(rel)
}

// FootageRate returns footage.fps as an exact rate. ok is false when the
// document has no footage or leaves the rate out (then the clip's own rate
// applies). Errors name footage.fps.
func (d *Document) FootageRate() (r physics.Rate, ok bool, err error) {
	if d.Footage == nil || d.Footage.FPS == nil {
		return physics.Rate{}, false, nil
	}
	b := builder{file: d.File}
	r, err = b.rateAt("footage.fps", d.Footage.FPS)
	return r, err == nil, err
}

// OffsetOrZero returns footage.offset, 0 when it is left out.
func (f *Footage) OffsetOrZero() int {
	if f == nil || f.Offset == nil {
		return 0
	}
	return *f.Offset
}

// OverlayOn reports footage.overlay, false when it is left out.
func (f *Footage) OverlayOn() bool { return f != nil && f.Overlay != nil && *f.Overlay }

// OpacityOrDefault returns footage.opacity, DefaultOpacity when it is left
// out.
func (f *Footage) OpacityOrDefault() float64 {
	if f == nil || f.Opacity == nil {
		return DefaultOpacity
	}
	return *f.Opacity
}
