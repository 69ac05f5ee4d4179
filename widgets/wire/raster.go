package wire

import (
	"encoding/binary"
	"image"
	"image/color"
	"image/draw"
	"math"
	"sync"

	xdraw "golang.org/x/image/draw"
	"golang.org/x/image/font"
	"golang.org/x/image/font/basicfont"
	"golang.org/x/image/math/fixed"
	"golang.org/x/image/vector"
)

// Style is how one kind of segment or label looks.
type Style struct {
	Color color.NRGBA // straight (not premultiplied) colour; A is its opacity
	Width float64     // line width, pixels; 0 hides the kind's segments
}

// Palette gives the background and a style for every kind.
type Palette struct {
	Background color.NRGBA
	Styles     [NumKinds]Style
}

// DefaultPalette returns the screen palette: a dark slate background, warm
// light prop lines, cool and warm onion skins and three distinct axis
// colours. Propflight's own colours.
func DefaultPalette() Palette {
	var p Palette
	p.Background = color.NRGBA{24, 29, 37, 255}
	s := &p.Styles
	s[Grid] = Style{color.NRGBA{52, 62, 76, 255}, 1}
	s[Ground] = Style{color.NRGBA{92, 106, 124, 255}, 1.3}
	s[Arc] = Style{color.NRGBA{86, 182, 194, 255}, 1.3}
	s[Tick] = Style{color.NRGBA{178, 214, 222, 255}, 1.2}
	s[Drop] = Style{color.NRGBA{86, 182, 194, 120}, 1}
	s[Onion] = Style{color.NRGBA{132, 146, 214, 255}, 1.1}
	s[OnionAhead] = Style{color.NRGBA{214, 158, 112, 255}, 1.1}
	s[Part] = Style{color.NRGBA{246, 228, 198, 255}, 1.6}
	s[AxisLeast] = Style{color.NRGBA{236, 182, 64, 255}, 1.6}
	s[AxisMiddle] = Style{color.NRGBA{226, 102, 160, 255}, 1.6}
	s[AxisGreatest] = Style{color.NRGBA{98, 170, 244, 255}, 1.6}
	s[Centre] = Style{color.NRGBA{250, 250, 250, 255}, 1.4}
	s[Note] = Style{color.NRGBA{240, 124, 100, 255}, 0}
	return p
}

// PrintPalette returns a light palette for paper: dark ink on white, thin
// lines, the same hues as DefaultPalette made darker.
func PrintPalette() Palette {
	var p Palette
	p.Background = color.NRGBA{255, 255, 255, 255}
	s := &p.Styles
	s[Grid] = Style{color.NRGBA{214, 218, 224, 255}, 0.8}
	s[Ground] = Style{color.NRGBA{150, 156, 166, 255}, 1.1}
	s[Arc] = Style{color.NRGBA{18, 112, 138, 255}, 1.1}
	s[Tick] = Style{color.NRGBA{18, 112, 138, 255}, 1}
	s[Drop] = Style{color.NRGBA{18, 112, 138, 110}, 0.8}
	s[Onion] = Style{color.NRGBA{92, 104, 176, 255}, 0.9}
	s[OnionAhead] = Style{color.NRGBA{176, 108, 56, 255}, 0.9}
	s[Part] = Style{color.NRGBA{28, 30, 36, 255}, 1.4}
	s[AxisLeast] = Style{color.NRGBA{158, 100, 0, 255}, 1.3}
	s[AxisMiddle] = Style{color.NRGBA{184, 40, 112, 255}, 1.3}
	s[AxisGreatest] = Style{color.NRGBA{28, 96, 196, 255}, 1.3}
	s[Centre] = Style{color.NRGBA{28, 30, 36, 255}, 1.2}
	s[Note] = Style{color.NRGBA{180, 40, 30, 255}, 0}
	return p
}

// LightPalette returns the screen palette for a light theme: a light
// background with the print palette's darker hues, at DefaultPalette's
// line widths (the preview under the light theme).
func LightPalette() Palette {
	p := PrintPalette()
	p.Background = color.NRGBA{246, 247, 249, 255}
	d := DefaultPalette()
	for i := range p.Styles {
		p.Styles[i].Width = d.Styles[i].Width
	}
	return p
}

// Rasterize paints the drawing into a new Width x Height image with the
// palette.
func Rasterize(d Drawing, pal Palette) *image.RGBA {
	dst := image.NewRGBA(image.Rect(0, 0, max(d.Width, 0), max(d.Height, 0)))
	RasterizeInto(dst, d, pal)
	return dst
}

var painters = sync.Pool{New: func() any { return new(Painter) }}

// RasterizeInto paints the drawing into dst, reusing dst's pixels and
// pooled scratch buffers: drawing pixel (0, 0) lands on dst.Rect.Min and
// anything outside dst is cut off. It is safe for concurrent use on
// different images.
func RasterizeInto(dst *image.RGBA, d Drawing, pal Palette) {
	p := painters.Get().(*Painter)
	p.Paint(dst, d, pal)
	painters.Put(p)
}

// Painter rasterises drawings, keeping its buffers from call to call. The
// zero value is ready to use; a Painter is not safe for concurrent use.
type Painter struct {
	z    vector.Rasterizer
	mask []uint8
	row  []uint8
	bins [][]int32 // segment indices per tile of a large run
	sel  []Segment // the segments of one tile
}

// Paint fills dst with the palette's background and paints the segments in
// order, then the labels (7x13 bitmap font with a one-pixel halo of the
// background colour).
//
// Each segment is a quad as wide as its kind's Width, extended by half
// the width past both ends (square caps), anti-aliased by exact area
// coverage (golang.org/x/image/vector). A run of consecutive segments of
// one kind and alpha is one path, all quads wound the same way: the
// rasteriser gives each pixel min(1, sum of the quads' areas in it), so
// where lines overlap inside a run the colour is laid down once, never
// twice (only the anti-aliased fringe of a crossing comes out a little
// heavier than the exact union). The run's coverage is composited
// source-over onto dst. Square caps: a PDF drawing of the same segments
// matches with projecting square line caps (PDF cap style 2). A run wider or taller
// than a few hundred pixels is rasterised tile by tile, skipping tiles no
// segment reaches.
func (p *Painter) Paint(dst *image.RGBA, d Drawing, pal Palette) {
	p.fill(dst, pal.Background)
	segs := d.Segments
	for i := 0; i < len(segs); {
		j := i + 1
		for j < len(segs) && segs[j].Kind == segs[i].Kind && segs[j].Alpha == segs[i].Alpha {
			j++
		}
		k := segs[i].Kind
		if k >= 0 && k < NumKinds {
			p.run(dst, segs[i:j], pal.Styles[k])
		}
		i = j
	}
	for _, l := range d.Labels {
		if l.Kind >= 0 && l.Kind < NumKinds {
			drawLabel(dst, l, pal.Styles[l.Kind].Color, pal.Background, d.LabelScale)
		}
	}
}

// fill sets every pixel of dst to c.
func (p *Painter) fill(dst *image.RGBA, c color.NRGBA) {
	b := dst.Bounds()
	if b.Empty() {
		return
	}
	pc := color.RGBAModel.Convert(c).(color.RGBA)
	w := b.Dx() * 4
	if cap(p.row) < w {
		p.row = make([]uint8, w)
	}
	row := p.row[:w]
	for x := 0; x < w; x += 4 {
		row[x], row[x+1], row[x+2], row[x+3] = pc.R, pc.G, pc.B, pc.A
	}
	for y := b.Min.Y; y < b.Max.Y; y++ {
		i := dst.PixOffset(b.Min.X, y)
		copy(dst.Pix[i:i+w], row)
	}
}

// tileSize is the side in pixels of the square tiles a large run is cut
// into, so that the work follows the ink: a tile no segment reaches costs
// nothing, where one bounding box over a long arc would be all empty pixels.
const tileSize = 96

// run paints segments of one kind and alpha as one path.
func (p *Painter) run(dst *image.RGBA, segs []Segment, st Style) {
	alpha := float64(st.Color.A) / 255 * segs[0].Alpha
	if !(st.Width > 0) || !(alpha > 0) || math.IsInf(st.Width, 0) {
		return
	}
	alpha = math.Min(alpha, 1)
	hw := st.Width / 2
	// pad reaches past a segment's ends and sides by the square cap's
	// corner plus a pixel of anti-aliasing.
	pad := hw*math.Sqrt2 + 1
	// The run's bounding box in dst pixels, cut to dst.
	db := dst.Bounds()
	x0, y0, x1, y1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for _, s := range segs {
		x0 = math.Min(x0, math.Min(s.A[0], s.B[0]))
		x1 = math.Max(x1, math.Max(s.A[0], s.B[0]))
		y0 = math.Min(y0, math.Min(s.A[1], s.B[1]))
		y1 = math.Max(y1, math.Max(s.A[1], s.B[1]))
	}
	if !(x1-x0 < 1e7 && y1-y0 < 1e7) { // also NaN
		return
	}
	r := image.Rect(int(math.Floor(x0-pad)), int(math.Floor(y0-pad)), int(math.Ceil(x1+pad)), int(math.Ceil(y1+pad)))
	r = r.Add(db.Min).Intersect(db)
	if r.Empty() {
		return
	}
	if r.Dx() <= 2*tileSize && r.Dy() <= 2*tileSize {
		p.paintRect(dst, r, segs, hw, st.Color, alpha)
		return
	}
	// Bin the segments into the tiles their quads may reach.
	nx, ny := (r.Dx()+tileSize-1)/tileSize, (r.Dy()+tileSize-1)/tileSize
	for len(p.bins) < nx*ny {
		p.bins = append(p.bins, nil)
	}
	bins := p.bins[:nx*ny]
	for i := range bins {
		bins[i] = bins[i][:0]
	}
	ox, oy := float64(r.Min.X-db.Min.X), float64(r.Min.Y-db.Min.Y) // r's corner in drawing pixels
	const halfDiag = tileSize * math.Sqrt2 / 2
	for si, s := range segs {
		ax, ay, bx, by := s.A[0]-ox, s.A[1]-oy, s.B[0]-ox, s.B[1]-oy
		dx, dy := bx-ax, by-ay
		l := math.Hypot(dx, dy)
		if !(l > 1e-9) {
			continue
		}
		i0 := max(int(math.Floor((math.Min(ax, bx)-pad)/tileSize)), 0)
		i1 := min(int(math.Floor((math.Max(ax, bx)+pad)/tileSize)), nx-1)
		j0 := max(int(math.Floor((math.Min(ay, by)-pad)/tileSize)), 0)
		j1 := min(int(math.Floor((math.Max(ay, by)+pad)/tileSize)), ny-1)
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				// Keep the tile if its centre is near the segment's line.
				cx, cy := (float64(i)+0.5)*tileSize, (float64(j)+0.5)*tileSize
				if math.Abs((cx-ax)*dy-(cy-ay)*dx)/l <= halfDiag+pad {
					bins[j*nx+i] = append(bins[j*nx+i], int32(si))
				}
			}
		}
	}
	for j := range ny {
		for i := range nx {
			bin := bins[j*nx+i]
			if len(bin) == 0 {
				continue
			}
			p.sel = p.sel[:0]
			for _, si := range bin {
				p.sel = append(p.sel, segs[si])
			}
			t := image.Rect(r.Min.X+i*tileSize, r.Min.Y+j*tileSize, r.Min.X+(i+1)*tileSize, r.Min.Y+(j+1)*tileSize).Intersect(r)
			p.paintRect(dst, t, p.sel, hw, st.Color, alpha)
		}
	}
}

// paintRect rasterises the quads of segs (half width hw) over the rectangle
// r of dst only and composites them there. Parts of quads outside r are
// allowed: the rasteriser clamps them into r's edge columns, which keeps
// every row's winding right.
func (p *Painter) paintRect(dst *image.RGBA, r image.Rectangle, segs []Segment, hw float64, c color.NRGBA, alpha float64) {
	db := dst.Bounds()
	w, h := r.Dx(), r.Dy()
	ox, oy := float64(r.Min.X-db.Min.X), float64(r.Min.Y-db.Min.Y)
	p.z.Reset(w, h)
	p.z.DrawOp = draw.Src
	for _, s := range segs {
		ax, ay, bx, by := s.A[0]-ox, s.A[1]-oy, s.B[0]-ox, s.B[1]-oy
		dx, dy := bx-ax, by-ay
		l := math.Hypot(dx, dy)
		if !(l > 1e-9) || math.IsInf(l, 0) {
			continue
		}
		ux, uy := dx/l*hw, dy/l*hw // along the segment, half a width
		nx, ny := -uy, ux          // across it
		ax, ay, bx, by = ax-ux, ay-uy, bx+ux, by+uy
		// Every quad winds the same way, so overlaps add up (and are
		// capped at full coverage) instead of cancelling.
		p.z.MoveTo(float32(ax+nx), float32(ay+ny))
		p.side(ax+nx, ay+ny, bx+nx, by+ny)
		p.z.LineTo(float32(bx-nx), float32(by-ny))
		p.side(bx-nx, by-ny, ax-nx, ay-ny)
		p.z.ClosePath()
	}
	if cap(p.mask) < w*h {
		p.mask = make([]uint8, w*h)
	}
	m := &image.Alpha{Pix: p.mask[:w*h], Stride: w, Rect: image.Rect(0, 0, w, h)}
	// Opaque source with draw.Src writes the coverage straight into m.
	p.z.Draw(m, m.Bounds(), image.Opaque, image.Point{})
	composite(dst, r, m, c, alpha)
}

// maxSideRows is the most rows one LineTo of a quad's long side spans.
// The rasteriser's fixed-point path (used for areas up to 512 pixels, so
// for every tile) advances x by dy * dx/dy truncated to 1/512 pixel on
// each row, which drifts by up to 1/512 pixel a row along a steep edge;
// restarting from an exact point every maxSideRows rows keeps the drift
// under maxSideRows/512 pixel (0.03).
const maxSideRows = 16

// side adds the line from (x0, y0), where the pen is, to (x1, y1) in
// pieces of at most maxSideRows rows.
func (p *Painter) side(x0, y0, x1, y1 float64) {
	n := int(math.Abs(y1-y0) / maxSideRows)
	for k := 1; k <= n; k++ {
		f := float64(k) / float64(n+1)
		p.z.LineTo(float32(x0+f*(x1-x0)), float32(y0+f*(y1-y0)))
	}
	p.z.LineTo(float32(x1), float32(y1))
}

// composite paints colour c at opacity alpha (0..1) through coverage mask m
// onto the rectangle r of dst, source over: out = c a + dst (1 - a) with
// a = alpha * coverage, in premultiplied 16-bit arithmetic. Runs of eight
// empty mask bytes are skipped a word at a time.
func composite(dst *image.RGBA, r image.Rectangle, m *image.Alpha, c color.NRGBA, alpha float64) {
	aa := uint32(alpha*0xffff + 0.5)
	cr, cg, cb := uint32(c.R)*0x101, uint32(c.G)*0x101, uint32(c.B)*0x101
	w := r.Dx()
	for y := 0; y < r.Dy(); y++ {
		mrow := m.Pix[y*m.Stride : y*m.Stride+w]
		pix := dst.Pix[dst.PixOffset(r.Min.X, r.Min.Y+y):]
		for x := 0; x < w; {
			if x+8 <= w && binary.LittleEndian.Uint64(mrow[x:]) == 0 {
				x += 8
				continue
			}
			mv := uint32(mrow[x])
			if mv == 0 {
				x++
				continue
			}
			a := mv * 0x101 * aa / 0xffff // 0..0xffff
			ia := (0xffff - a) * 0x101
			i := 4 * x
			pix[i+0] = uint8((cr*a + uint32(pix[i+0])*ia) / 0xffff >> 8)
			pix[i+1] = uint8((cg*a + uint32(pix[i+1])*ia) / 0xffff >> 8)
			pix[i+2] = uint8((cb*a + uint32(pix[i+2])*ia) / 0xffff >> 8)
			pix[i+3] = uint8((0xffff*a + uint32(pix[i+3])*ia) / 0xffff >> 8)
			x++
		}
	}
}

// labelFace is the font of labels: 7 pixels a character, ascent 11.
var labelFace = basicfont.Face7x13

// drawLabel draws one label in colour c with a halo of colour halo, its
// text enlarged scale times (whole pixels, nearest neighbour: a bitmap
// font stays crisp).
func drawLabel(dst *image.RGBA, l Label, c, halo color.NRGBA, scale int) {
	scale = max(scale, 1)
	x, y := l.At[0], l.At[1]
	w := float64(font.MeasureString(labelFace, l.Text).Round() * scale)
	switch l.Align {
	case AlignRight:
		x -= w
	case AlignCentre:
		x -= w / 2
	}
	if !finite(x) || !finite(y) || x > 1e6 || y > 1e6 || x < -1e6 || y < -1e6 {
		return
	}
	b := dst.Bounds()
	ix, iy := b.Min.X+int(math.Round(x)), b.Min.Y+int(math.Round(y))
	if scale == 1 {
		textAt(dst, l.Text, ix, iy, c, halo)
		return
	}
	// Draw at the font's own size into a small transparent image, then
	// enlarge it onto dst.
	m := labelFace.Metrics()
	asc, desc := m.Ascent.Ceil(), m.Descent.Ceil()
	tw := font.MeasureString(labelFace, l.Text).Ceil()
	tmp := image.NewRGBA(image.Rect(0, 0, tw+2, asc+desc+2))
	textAt(tmp, l.Text, 1, asc+1, c, halo)
	r := image.Rect(ix-scale, iy-(asc+1)*scale, ix+(tw+1)*scale, iy+(desc+1)*scale)
	xdraw.NearestNeighbor.Scale(dst, r, tmp, tmp.Bounds(), xdraw.Over, nil)
}

// textAt draws text with its baseline starting at (x, y) in colour c over
// a one-pixel halo of colour halo.
func textAt(dst draw.Image, text string, x, y int, c, halo color.NRGBA) {
	dr := font.Drawer{Dst: dst, Src: image.NewUniform(halo), Face: labelFace}
	for _, o := range [4][2]int{{-1, 0}, {1, 0}, {0, -1}, {0, 1}} {
		dr.Dot = fixed.P(x+o[0], y+o[1])
		dr.DrawString(text)
	}
	dr.Src = image.NewUniform(c)
	dr.Dot = fixed.P(x, y)
	dr.DrawString(text)
}
