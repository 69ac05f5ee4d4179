package wire

import (
	"math"
	"strconv"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// Kind says what a segment or label shows; the palette gives each kind its
// colour and width.
type Kind int

// The kinds, in the order Draw paints them (back to front).
const (
	Grid         Kind = iota // ground grid lines
	Ground                   // the grid's outline and the world axes on the ground
	Arc                      // centre-of-mass arc over the whole take
	Tick                     // a tick across the arc at every frame; frame-number labels
	Drop                     // plumb line from the current centre of mass to the ground
	Onion                    // onion skin: frames before the current one
	OnionAhead               // onion skin: frames after the current one
	Part                     // the prop at the current frame
	AxisLeast                // principal axis of the least moment, and its label
	AxisMiddle               // principal axis of the middle moment
	AxisGreatest             // principal axis of the greatest moment
	Centre                   // cross on the current centre of mass
	Note                     // text only: a message about the scene (a prop that cannot be drawn)
	NumKinds                 // number of kinds
)

var kindNames = [NumKinds]string{"grid", "ground", "arc", "tick", "drop", "onion", "onion-ahead",
	"part", "axis-least", "axis-middle", "axis-greatest", "centre", "note"}

// String returns the kind's name in lower case ("axis-least").
func (k Kind) String() string {
	if k < 0 || k >= NumKinds {
		return "kind(" + strconv.Itoa(int(k)) + ")"
	}
	return kindNames[k]
}

// Segment is a straight line in image pixels (origin top left, y down).
// Alpha, from 0 to 1, multiplies the opacity of the kind's colour.
type Segment struct {
	A, B  [2]float64
	Kind  Kind
	Alpha float64
}

// Align says where a label's text sits relative to its At point.
type Align int

const (
	AlignLeft   Align = iota // At is the left end of the text's baseline
	AlignRight               // At is the right end of the baseline
	AlignCentre              // At is the middle of the baseline
)

// Label is a short text placed in image pixels. At is a point on the
// text's baseline (see Align); Draw places labels for text about
// LabelHeight pixels tall.
type Label struct {
	At    [2]float64
	Text  string
	Kind  Kind
	Align Align
}

// LabelHeight is the text height in pixels that Draw spaces labels for:
// the 7x13 bitmap font the rasteriser uses (ascent 11).
const LabelHeight = 11.0

// Drawing is a picture as 2D segments and labels in image pixels, Width by
// Height. Segments are listed back to front; consumers paint them in order.
// Every segment lies within a few pixels of the image.
type Drawing struct {
	Width, Height int
	Segments      []Segment
	Labels        []Label
	// LabelScale is the whole-number size of the label text: 1 is the
	// 7x13 font as is, 2 doubles it for a HiDPI screen (Scene.LabelScale).
	LabelScale int
}

// Scene is what Draw shows.
//
// The prop at frame F is placed by the take: a prop-frame point p goes to
// the world point Frame.CM + Frame.Orient.Rotate(p - Mass.CM). With no
// take the prop stands in its authored pose with the prop frame on the
// world (so its centre of mass is at Mass.CM) and there is no arc and no
// onion skin. Frame is clamped to the take's frames.
type Scene struct {
	Prop *physics.Prop
	Mass *physics.MassProps // nil: computed from Prop
	Take *physics.Take      // nil: the authored pose

	Frame                   int // current frame
	OnionBefore, OnionAfter int // onion-skin frames on each side of the current one

	ShowArc   bool    // the centre-of-mass arc, its plumb line and centre cross
	ShowTicks bool    // a tick at every frame, labels at release, apex and the last frame
	ShowAxes  bool    // the principal axes at the current frame, from the centre of mass
	ShowGrid  bool    // the ground grid
	GroundY   float64 // height of the ground plane, m

	Detail int // segments round a full circle of a round part; 0 means DefaultDetail
	// LabelScale enlarges the label text by a whole factor (0 or 1: the
	// 7x13 font; 2 for a screen of twice the pixel density); labels are
	// kept apart at that size.
	LabelScale int
}

// Screen sizes of the marks Draw makes, in pixels.
const (
	TickHalf    = 4.0 // half length of a frame tick
	KeyTickHalf = 7.0 // half length of the ticks at release, apex, last and current frame
	CentreHalf  = 5.0 // half size of the centre-of-mass cross
	// OnionAlpha is the opacity of the onion-skin frame next to the current
	// one; frame k away of n has OnionAlpha (1 - (k - 1) / n).
	OnionAlpha = 0.7
	// AxisScale is the length of a drawn principal axis over the prop's
	// radius (largest distance of a mesh vertex from the centre of mass).
	AxisScale = 1.35
	// ArcSteps is the number of straight pieces the arc takes per frame.
	ArcSteps = 4
	clipPad  = 4.0 // segments are clipped this many pixels outside the image
)

// Draw renders the scene for the camera as 2D segments and labels. Every
// wire edge is drawn, seen or not (a wireframe has no hidden lines). Draw
// never fails: a prop whose mass properties cannot be computed is left out
// and a Note label says why. It keeps no state and is safe to call from
// several goroutines.
//
// It stays one function: the layers are drawn in back-to-front order (grid,
// arc, ticks, onion skins, prop, axes, labels), each a short block over the
// same framing, and the order is the point.
func Draw(cam Camera, sc Scene) Drawing {
	lens := cam.Lens()
	w, h := lens.Size()
	ls := max(sc.LabelScale, 1)
	d := &drawer{lens: lens, out: Drawing{Width: w, Height: h, LabelScale: ls}, ls: float64(ls)}
	d.right, _, d.back = cam.Axes()
	d.ortho, d.eye = cam.Ortho, cam.Eye()
	d.xmax, d.ymax = float64(w)+clipPad, float64(h)+clipPad

	mp := sc.Mass
	if mp == nil && sc.Prop != nil {
		m, err := sc.Prop.MassProps()
		if err != nil {
			d.out.Labels = append(d.out.Labels, Label{At: [2]float64{8, 8 + LabelHeight*d.ls}, Text: "prop: " + err.Error(), Kind: Note})
		} else {
			mp = &m
		}
	}
	pw := newPropWire(sc.Prop, mp, sc.Detail)
	if pw != nil {
		d.radius = pw.radius
		// Room for the prop in every pose drawn (a mesh's contour is
		// guessed at a tenth of its creases) and the rest of the scene.
		lines := len(pw.edges) + 4*len(pw.chainStart)
		for _, po := range pw.outlines {
			lines += len(po.o.Creases())/10 + 64
		}
		poses := 1 + max(sc.OnionBefore, 0) + max(sc.OnionAfter, 0)
		d.out.Segments = make([]Segment, 0, lines*poses+1024)
	}
	var frames []physics.Frame
	if sc.Take != nil {
		frames = sc.Take.Frames
	}
	cur := min(max(sc.Frame, 0), max(len(frames)-1, 0))

	if sc.ShowGrid {
		d.grid(bounds(sc, mp, pw), sc.GroundY)
	}
	if len(frames) > 0 {
		if sc.ShowArc {
			d.arc(sc.Take)
		}
		if sc.ShowTicks {
			d.ticks(sc.Take, cur)
		}
	}
	cm, rot := pose(frames, cur, mp)
	if sc.ShowArc && mp != nil && cm.Y > sc.GroundY {
		d.segment3(cm, r3.Vec{X: cm.X, Y: sc.GroundY, Z: cm.Z}, Drop, 1)
	}
	if pw != nil {
		n := max(sc.OnionBefore, sc.OnionAfter, 0)
		for k := n; k >= 1; k-- { // farthest (faintest) first
			if k <= sc.OnionBefore && cur-k >= 0 && cur-k < len(frames) {
				c, r := pose(frames, cur-k, mp)
				d.prop(pw, c, r, Onion, onionAlpha(k, sc.OnionBefore))
			}
			if k <= sc.OnionAfter && cur+k < len(frames) {
				c, r := pose(frames, cur+k, mp)
				d.prop(pw, c, r, OnionAhead, onionAlpha(k, sc.OnionAfter))
			}
		}
		d.prop(pw, cm, rot, Part, 1)
	}
	if sc.ShowAxes && mp != nil {
		radius := 0.1
		if pw != nil {
			radius = pw.radius
		}
		for i := range 3 {
			tip := r3.Add(cm, rot.MulVec(r3.Scale(AxisScale*radius, mp.Axes[i])))
			k := AxisLeast + Kind(i)
			d.segment3(cm, tip, k, 1)
			d.axisLabel(cm, tip, physics.Axis(i).String(), k)
		}
	}
	if (sc.ShowArc || sc.ShowAxes) && mp != nil {
		if x, y, ok := d.lens.Project(cm); ok {
			d.segment2([2]float64{x - CentreHalf, y}, [2]float64{x + CentreHalf, y}, Centre, 1)
			d.segment2([2]float64{x, y - CentreHalf}, [2]float64{x, y + CentreHalf}, Centre, 1)
		}
	}
	return d.out
}

// Bounds returns the world box that the scene occupies: the prop's wire
// (and with ShowAxes the drawn axes) placed at every frame of the take, or
// at its authored pose, and the arc's end at landing; with ShowGrid it
// reaches to the ground. Camera.Frame(Bounds(sc)) shows the whole take.
// The grid itself reaches one spacing further.
func Bounds(sc Scene) r3.Box {
	mp := sc.Mass
	if mp == nil && sc.Prop != nil {
		if m, err := sc.Prop.MassProps(); err == nil {
			mp = &m
		}
	}
	return bounds(sc, mp, newPropWire(sc.Prop, mp, sc.Detail))
}

// Radius returns the largest distance of a vertex of the prop's meshes
// (PartMesh at detail; a mesh part's own vertices) from the centre of mass
// mp.CM, m: what Draw scales the principal axes by. With no prop or no
// mass properties it is 0.1 m.
func Radius(p *physics.Prop, mp *physics.MassProps, detail int) float64 {
	if pw := newPropWire(p, mp, detail); pw != nil {
		return pw.radius
	}
	return 0.1
}

func bounds(sc Scene, mp *physics.MassProps, pw *propWire) r3.Box {
	inf := math.Inf(1)
	b := r3.Box{Min: r3.Vec{X: inf, Y: inf, Z: inf}, Max: r3.Vec{X: -inf, Y: -inf, Z: -inf}}
	grow := func(p r3.Vec) {
		b.Min = r3.Vec{X: math.Min(b.Min.X, p.X), Y: math.Min(b.Min.Y, p.Y), Z: math.Min(b.Min.Z, p.Z)}
		b.Max = r3.Vec{X: math.Max(b.Max.X, p.X), Y: math.Max(b.Max.Y, p.Y), Z: math.Max(b.Max.Z, p.Z)}
	}
	place := func(cm r3.Vec, rot physics.Mat3) {
		if pw == nil {
			const r = 0.1 // no prop: a small box round the centre of mass
			grow(r3.Sub(cm, r3.Vec{X: r, Y: r, Z: r}))
			grow(r3.Add(cm, r3.Vec{X: r, Y: r, Z: r}))
			return
		}
		for _, v := range pw.bound {
			grow(r3.Add(cm, rot.MulVec(v)))
		}
		if sc.ShowAxes && mp != nil {
			for _, a := range mp.Axes {
				grow(r3.Add(cm, rot.MulVec(r3.Scale(AxisScale*pw.radius, a))))
			}
		}
	}
	var frames []physics.Frame
	if sc.Take != nil {
		frames = sc.Take.Frames
	}
	if len(frames) > 0 {
		for i := range frames {
			cm, rot := pose(frames, i, mp)
			place(cm, rot)
		}
		if end, ok := arcEnd(sc.Take); ok {
			grow(end)
		}
	} else {
		cm, rot := pose(nil, 0, mp)
		place(cm, rot)
	}
	if sc.ShowGrid && finite(sc.GroundY) {
		b.Min.Y = math.Min(b.Min.Y, sc.GroundY)
		b.Max.Y = math.Max(b.Max.Y, sc.GroundY)
	}
	return b
}

// pose returns the world centre of mass and the prop-frame -> world
// rotation matrix at frame i; with no frames, the authored pose.
func pose(frames []physics.Frame, i int, mp *physics.MassProps) (r3.Vec, physics.Mat3) {
	if i >= 0 && i < len(frames) {
		return frames[i].CM, (frames[i].Orient.Normalize()).Mat()
	}
	var cm r3.Vec
	if mp != nil {
		cm = mp.CM
	}
	return cm, physics.IdentityRotation().Mat()
}

// onionAlpha is the opacity of the onion-skin frame k away of n.
func onionAlpha(k, n int) float64 { return OnionAlpha * (1 - float64(k-1)/float64(n)) }

// propWire is the prop's wireframe ready to place: the vertices the edges
// use, relative to the centre of mass in prop axes, and the outlines of its
// mesh parts, whose contours change with the view.
type propWire struct {
	verts []r3.Vec
	edges [][2]uint32
	// bound are the points whose box bounds the prop, like verts: the
	// primitives' vertices and the mesh parts' extremes (their creases'
	// vertices lie inside those).
	bound    []r3.Vec
	outlines []placedOutline
	// Mesh parts' crease chains, as indices into verts: chain i runs
	// through chainVerts[chainStart[i]:chainStart[i+1]] (the last chain to
	// the end).
	chainVerts []uint32
	chainStart []int
	radius     float64 // largest |vertex|, m
}

// placedOutline is a mesh part's outline in the prop: a mesh point v is at
// pos + rot v relative to the prop's centre of mass, prop axes.
type placedOutline struct {
	o   *Outline
	rot physics.Mat3
	pos r3.Vec
}

func newPropWire(p *physics.Prop, mp *physics.MassProps, detail int) *propWire {
	if p == nil || mp == nil || len(p.Parts) == 0 {
		return nil
	}
	if detail == 0 {
		detail = DefaultDetail
	}
	pw := &propWire{}
	for i := range p.Parts {
		pt := &p.Parts[i]
		r := pt.Orient.Normalize().Mat()
		pos := r3.Sub(pt.Position, mp.CM)
		if o := partOutline(pt); o != nil {
			// A mesh part: its creases are fixed lines, its contour is
			// found per pose; its extremes bound it.
			po := placedOutline{o: o, rot: r, pos: pos}
			pw.outlines = append(pw.outlines, po)
			remap := make(map[int32]uint32, 2*len(o.Creases()))
			use := func(i int32) uint32 {
				if j, ok := remap[i]; ok {
					return j
				}
				j := uint32(len(pw.verts))
				pw.verts = append(pw.verts, r3.Add(pos, r.MulVec(o.Vertex(i))))
				remap[i] = j
				return j
			}
			for c := range o.Chains() {
				pw.chainStart = append(pw.chainStart, len(pw.chainVerts))
				for _, i := range o.Chain(c) {
					pw.chainVerts = append(pw.chainVerts, use(i))
				}
			}
			for _, i := range o.Extremes() {
				pw.bound = append(pw.bound, r3.Add(pos, r.MulVec(o.Vertex(i))))
			}
			// The radius is the farthest vertex of all, not of the extremes.
			c := r.T().MulVec(r3.Scale(-1, pos)) // the centre of mass in the mesh's frame
			reach := o.Reach(c)
			pw.radius = math.Max(pw.radius, reach*reach)
			continue
		}
		m := PartMesh(pt, detail)
		remap := make(map[uint32]uint32, len(m.Edges))
		use := func(i uint32) uint32 {
			if j, ok := remap[i]; ok {
				return j
			}
			j := uint32(len(pw.verts))
			w := r3.Add(pos, r.MulVec(m.Vertices[i]))
			pw.verts = append(pw.verts, w)
			pw.bound = append(pw.bound, w)
			remap[i] = j
			return j
		}
		for _, e := range m.Edges {
			pw.edges = append(pw.edges, [2]uint32{use(e[0]), use(e[1])})
		}
		for _, v := range m.Vertices {
			w := r3.Add(pos, r.MulVec(v))
			pw.radius = math.Max(pw.radius, r3.Dot(w, w))
		}
	}
	pw.radius = math.Sqrt(pw.radius)
	if !(pw.radius > 0) || !finite(pw.radius) {
		pw.radius = 0.1
	}
	return pw
}

// drawer accumulates a Drawing.
type drawer struct {
	lens       Lens
	out        Drawing
	xmax, ymax float64
	right      r3.Vec   // the camera's screen-right axis, world
	world      []r3.Vec // scratch for placed vertices
	radius     float64  // the prop's radius, m (0 with no prop)
	// The view for mesh contours: orthographic or not, the unit vector
	// toward the viewer and the eye, world.
	ortho     bool
	back, eye r3.Vec
	edges     [][2]int32   // scratch for contour edges
	chainPts  []r3.Vec     // scratch for a crease chain's world points
	screen    [][2]float64 // scratch for their pixels
	front     []bool       // scratch for facing faces
	// avoid is a screen disc (x, y, radius in pixels) that labels keep out
	// of: the current prop.
	avoid [3]float64
	ls    float64 // label text scale (Scene.LabelScale, at least 1)
}

// prop draws the wireframe placed at centre of mass cm with rotation rot.
func (d *drawer) prop(pw *propWire, cm r3.Vec, rot physics.Mat3, k Kind, alpha float64) {
	d.world = d.world[:0]
	for _, v := range pw.verts {
		d.world = append(d.world, r3.Add(cm, rot.MulVec(v)))
	}
	for _, e := range pw.edges {
		d.segment3(d.world[e[0]], d.world[e[1]], k, alpha)
	}
	for c, from := range pw.chainStart {
		to := len(pw.chainVerts)
		if c+1 < len(pw.chainStart) {
			to = pw.chainStart[c+1]
		}
		d.chainPts = d.chainPts[:0]
		for _, i := range pw.chainVerts[from:to] {
			d.chainPts = append(d.chainPts, d.world[i])
		}
		d.polyline(d.chainPts, k, alpha)
	}
	for i := range pw.outlines {
		d.contour(&pw.outlines[i], cm, rot, k, alpha)
	}
}

// contour draws the smooth edges of a mesh part on its contour in this
// pose: the view (toward the viewer, or the eye) is taken into the mesh's
// frame, where the outline's face normals are.
func (d *drawer) contour(po *placedOutline, cm r3.Vec, rot physics.Mat3, k Kind, alpha float64) {
	m := rot.Mul(po.rot)                     // mesh frame -> world
	origin := r3.Add(cm, rot.MulVec(po.pos)) // the mesh's origin, world
	mt := m.T()
	var view r3.Vec
	if d.ortho {
		view = mt.MulVec(d.back)
	} else {
		view = mt.MulVec(r3.Sub(d.eye, origin))
	}
	d.edges, d.front = po.o.Contour(d.edges[:0], view, d.ortho, d.front)
	for _, e := range d.edges {
		a := r3.Add(origin, m.MulVec(po.o.Vertex(e[0])))
		b := r3.Add(origin, m.MulVec(po.o.Vertex(e[1])))
		d.segment3(a, b, k, alpha)
	}
}

// segment3 projects and adds a world segment.
func (d *drawer) segment3(a, b r3.Vec, k Kind, alpha float64) {
	pa, pb, ok := d.lens.Segment(a, b)
	if ok {
		d.segment2(pa, pb, k, alpha)
	}
}

// segment2 clips an image segment to the image plus clipPad (Liang and
// Barsky, "A new concept and method for line clipping", ACM TOG 3(1), 1984)
// and adds what is left.
func (d *drawer) segment2(a, b [2]float64, k Kind, alpha float64) {
	if !finite(a[0]) || !finite(a[1]) || !finite(b[0]) || !finite(b[1]) {
		return
	}
	dx, dy := b[0]-a[0], b[1]-a[1]
	t0, t1 := 0.0, 1.0
	for _, c := range [4][2]float64{
		{-dx, a[0] + clipPad}, {dx, d.xmax - a[0]},
		{-dy, a[1] + clipPad}, {dy, d.ymax - a[1]},
	} {
		p, q := c[0], c[1]
		if p == 0 {
			if q < 0 {
				return
			}
			continue
		}
		r := q / p
		if p < 0 {
			t0 = math.Max(t0, r)
		} else {
			t1 = math.Min(t1, r)
		}
		if t0 > t1 {
			return
		}
	}
	a2 := [2]float64{a[0] + t0*dx, a[1] + t0*dy}
	b2 := [2]float64{a[0] + t1*dx, a[1] + t1*dy}
	if a2 == b2 {
		return
	}
	d.out.Segments = append(d.out.Segments, Segment{A: a2, B: b2, Kind: k, Alpha: alpha})
}
