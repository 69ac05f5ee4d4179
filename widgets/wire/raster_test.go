package wire_test

import (
	"image"
	"image/color"
	"math"
	"testing"

	"propflight/internal/fixture"
	"propflight/widgets/wire"
)

// whiteOnBlack draws Part segments in opaque white of the given width on
// black, so a pixel's red value over 255 is the line's coverage.
func whiteOnBlack(width float64) wire.Palette {
	var p wire.Palette
	p.Background = color.NRGBA{0, 0, 0, 255}
	p.Styles[wire.Part] = wire.Style{Color: color.NRGBA{255, 255, 255, 255}, Width: width}
	return p
}

// oracleCoverage is the slow, obviously correct reference: the fraction of
// a 32 x 32 grid of sample points in pixel (i, j) that lie in the
// segment's rectangle (within width/2 of the line through a and b, and
// from width/2 before a to width/2 past b: square caps).
func oracleCoverage(i, j int, a, b [2]float64, width float64) float64 {
	const n = 32
	dx, dy := b[0]-a[0], b[1]-a[1]
	l := math.Hypot(dx, dy)
	ux, uy := dx/l, dy/l
	hw := width / 2
	in := 0
	for s := range n {
		for r := range n {
			px := float64(i) + (float64(s)+0.5)/n - a[0]
			py := float64(j) + (float64(r)+0.5)/n - a[1]
			along := px*ux + py*uy
			across := math.Abs(-px*uy + py*ux)
			if across <= hw && along >= -hw && along <= l+hw {
				in++
			}
		}
	}
	return float64(in) / (n * n)
}

// distanceToRect is the distance from point p to the segment's rectangle.
func distanceToRect(p, a, b [2]float64, width float64) float64 {
	dx, dy := b[0]-a[0], b[1]-a[1]
	l := math.Hypot(dx, dy)
	ux, uy := dx/l, dy/l
	px, py := p[0]-a[0], p[1]-a[1]
	along := px*ux + py*uy
	across := math.Abs(-px*uy + py*ux)
	ea := math.Max(0, math.Max(-width/2-along, along-l-width/2))
	ec := math.Max(0, across-width/2)
	if ea == 0 && ec == 0 {
		return -math.Min(math.Min(along+width/2, l+width/2-along), width/2-across) // inside: minus depth
	}
	return math.Hypot(ea, ec)
}

// TestRasterize_LineCoverage_MatchesOracle compares every pixel of single
// lines at several angles, widths and sub-pixel positions with the
// supersampled oracle; on the line the coverage is full and a pixel whose
// square is clear of the rectangle (centre more than sqrt(2)/2 away) is
// untouched. Tolerance: 8-bit coverage (1/255) plus the 32 x 32 sampling
// error of one straight edge (at most about 1/32).
func TestRasterize_LineCoverage_MatchesOracle(t *testing.T) {
	const w, h = 48, 40
	cases := []struct {
		a, b  [2]float64
		width float64
	}{
		{[2]float64{5, 20}, [2]float64{43, 20}, 1},
		{[2]float64{5.3, 20.6}, [2]float64{42.1, 20.6}, 3},
		{[2]float64{24.5, 3.2}, [2]float64{24.5, 36.7}, 1.6},
		{[2]float64{4.1, 4.9}, [2]float64{40.7, 35.2}, 2.5},
		{[2]float64{6.6, 33.3}, [2]float64{41.2, 11.9}, 1.2},
		{[2]float64{10, 30}, [2]float64{30.25, 5.5}, 4},
	}
	for ci, c := range cases {
		d := wire.Drawing{Width: w, Height: h, Segments: []wire.Segment{{A: c.a, B: c.b, Kind: wire.Part, Alpha: 1}}}
		img := wire.Rasterize(d, whiteOnBlack(c.width))
		for j := range h {
			for i := range w {
				got := float64(img.RGBAAt(i, j).R) / 255
				want := oracleCoverage(i, j, c.a, c.b, c.width)
				if math.Abs(got-want) > 1.0/255+1.0/32 {
					t.Fatalf("case %d pixel (%d, %d): coverage %.3f, oracle %.3f", ci, i, j, got, want)
				}
				dist := distanceToRect([2]float64{float64(i) + 0.5, float64(j) + 0.5}, c.a, c.b, c.width)
				if dist > math.Sqrt2/2 && got != 0 {
					t.Fatalf("case %d pixel (%d, %d) %.2f px off the line has coverage %.3f", ci, i, j, dist, got)
				}
				if dist < -math.Sqrt2/2 && got < 254.0/255 {
					t.Fatalf("case %d pixel (%d, %d) inside the line has coverage %.3f", ci, i, j, got)
				}
			}
		}
	}
}

// TestRasterize_LargeRunTiled_MatchesOracle: one run of long lines over a
// large image is rasterised tile by tile; every pixel must match the
// oracle across tile borders too. A run's coverage is, by the rasteriser's
// construction (signed-area accumulation, all quads wound alike),
// min(1, sum over lines of each line's coverage), so that is the oracle,
// each term by supersampling. Pixels clear of every rectangle must be
// untouched. (16 x 16 samples to keep it quick: tolerance 1/16 per line
// plus 1/255.)
func TestRasterize_LargeRunTiled_MatchesOracle(t *testing.T) {
	const w, h, width = 420, 330, 2.2
	lines := [][2][2]float64{
		{{3.3, 7.1}, {415.2, 321.9}},   // the long diagonal
		{{2.5, 200.5}, {418.5, 200.5}}, // horizontal across every column of tiles
		{{96.2, 1}, {97.9, 329}},       // steep, along a tile border
		{{400, 20}, {30.7, 300.2}},
		{{190, 190}, {195, 194}}, // short, inside one tile
	}
	var segs []wire.Segment
	for _, l := range lines {
		segs = append(segs, wire.Segment{A: l[0], B: l[1], Kind: wire.Part, Alpha: 1})
	}
	img := wire.Rasterize(wire.Drawing{Width: w, Height: h, Segments: segs}, whiteOnBlack(width))
	const n = 16
	for j := range h {
		for i := range w {
			got := float64(img.RGBAAt(i, j).R) / 255
			c := [2]float64{float64(i) + 0.5, float64(j) + 0.5}
			var sum float64
			touching := 0
			for _, l := range lines {
				if distanceToRect(c, l[0], l[1], width) > math.Sqrt2/2 {
					continue // this line misses the pixel
				}
				touching++
				in := 0
				for s := range n {
					for r := range n {
						p := [2]float64{float64(i) + (float64(s)+0.5)/n, float64(j) + (float64(r)+0.5)/n}
						if distanceToRect(p, l[0], l[1], width) <= 0 {
							in++
						}
					}
				}
				sum += float64(in) / (n * n)
			}
			want := math.Min(1, sum)
			if touching == 0 && got != 0 {
				t.Fatalf("pixel (%d, %d) clear of every line has coverage %.3f", i, j, got)
			}
			if math.Abs(got-want) > float64(max(touching, 1))/16+1.0/255 {
				t.Fatalf("pixel (%d, %d): coverage %.3f, oracle %.3f", i, j, got, want)
			}
		}
	}
}

// TestRasterize_RunCoversOnce: crossing, overlapping and reversed segments
// of one kind and alpha make one path, so inside them the colour is laid
// down once (reversed lines do not cancel); a separate run (another alpha)
// composites again on top.
func TestRasterize_RunCoversOnce(t *testing.T) {
	half := wire.Segment{Kind: wire.Part, Alpha: 0.5}
	s1, s2, s3 := half, half, half
	s1.A, s1.B = [2]float64{2, 10.5}, [2]float64{30, 10.5}
	s2.A, s2.B = [2]float64{16.5, 2}, [2]float64{16.5, 20}
	s3.A, s3.B = s1.B, s1.A // the same line backwards
	pal := whiteOnBlack(3)
	img := wire.Rasterize(wire.Drawing{Width: 32, Height: 24, Segments: []wire.Segment{s1, s2, s3}}, pal)
	alone := img.RGBAAt(6, 10).R // on s1 only
	cross := img.RGBAAt(16, 10).R
	if alone < 126 || alone > 129 || cross != alone {
		t.Errorf("half-alpha line %d, at the crossing %d: want both about 127", alone, cross)
	}
	s2.Alpha = 0.25
	img = wire.Rasterize(wire.Drawing{Width: 32, Height: 24, Segments: []wire.Segment{s1, s2}}, pal)
	// 0.5 white then 0.25 white on top: 1 - 0.5 * 0.75 = 0.625 of white.
	if got := img.RGBAAt(16, 10).R; got < 158 || got > 161 {
		t.Errorf("two runs at the crossing: %d, want about 0.625 * 255 = 159", got)
	}
}

// TestRasterize_SourceOver: a half-opaque colour over the background mixes
// them half and half; the style's own alpha multiplies the segment's.
func TestRasterize_SourceOver(t *testing.T) {
	var pal wire.Palette
	pal.Background = color.NRGBA{40, 80, 120, 255}
	pal.Styles[wire.Arc] = wire.Style{Color: color.NRGBA{200, 100, 50, 128}, Width: 4}
	d := wire.Drawing{Width: 20, Height: 20, Segments: []wire.Segment{{A: [2]float64{2, 10}, B: [2]float64{18, 10}, Kind: wire.Arc, Alpha: 0.5}}}
	img := wire.Rasterize(d, pal)
	// a = 128/255 * 0.5 = 0.25098; out = c a + bg (1 - a).
	a := 128.0 / 255 * 0.5
	want := [3]float64{200*a + 40*(1-a), 100*a + 80*(1-a), 50*a + 120*(1-a)}
	got := img.RGBAAt(10, 10)
	for k, g := range [3]uint8{got.R, got.G, got.B} {
		if math.Abs(float64(g)-want[k]) > 1 {
			t.Errorf("channel %d: %d, want %.1f", k, g, want[k])
		}
	}
	if got.A != 255 || img.RGBAAt(10, 2) != (color.RGBA{40, 80, 120, 255}) {
		t.Errorf("alpha %d, background pixel %v", got.A, img.RGBAAt(10, 2))
	}
}

// TestRasterizeInto_OffsetAndReuse: drawing pixel (0, 0) lands on
// dst.Rect.Min, and painting twice into the same image gives the same
// pixels as a fresh Rasterize.
func TestRasterizeInto_OffsetAndReuse(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3.2, 1.5, 8)
	d := wire.Draw(framedCamera(wire.Free, 160, 100, sc), sc)
	pal := wire.DefaultPalette()
	want := wire.Rasterize(d, pal)
	dst := image.NewRGBA(image.Rect(10, 20, 170, 120))
	for range 2 {
		wire.RasterizeInto(dst, d, pal)
	}
	for y := range 100 {
		for x := range 160 {
			if g, w := dst.RGBAAt(x+10, y+20), want.RGBAAt(x, y); g != w {
				t.Fatalf("pixel (%d, %d): %v, want %v", x, y, g, w)
			}
		}
	}
	var p wire.Painter
	small := image.NewRGBA(image.Rect(0, 0, 40, 30)) // smaller than the drawing: cut, no panic
	p.Paint(small, d, pal)
}

// TestRasterize_Label: label text is drawn in its kind's colour on the
// correct side of At.
func TestRasterize_Label(t *testing.T) {
	pal := wire.DefaultPalette()
	c := pal.Styles[wire.AxisLeast].Color
	for _, al := range []wire.Align{wire.AlignLeft, wire.AlignRight} {
		d := wire.Drawing{Width: 120, Height: 30, Labels: []wire.Label{{At: [2]float64{60, 20}, Text: "least", Kind: wire.AxisLeast, Align: al}}}
		img := wire.Rasterize(d, pal)
		minX, maxX := 1000, -1
		for y := range 30 {
			for x := range 120 {
				if p := img.RGBAAt(x, y); p.R == c.R && p.G == c.G && p.B == c.B {
					minX, maxX = min(minX, x), max(maxX, x)
					if y > 22 || y < 20-int(wire.LabelHeight)-1 {
						t.Errorf("text pixel at row %d, baseline 20", y)
					}
				}
			}
		}
		if maxX < 0 {
			t.Fatalf("align %v: no text pixels", al)
		}
		if al == wire.AlignLeft && (minX < 60 || maxX > 60+35) || al == wire.AlignRight && (maxX >= 60 || minX < 60-35) {
			t.Errorf("align %v: text spans x %d..%d around At.x = 60", al, minX, maxX)
		}
	}
}

// TestRasterize_LabelScale: at LabelScale 2 the text covers twice the width
// and height it covers at 1 (nearest-neighbour enlargement of the 7x13
// font), in the same colour, on the same side of At.
func TestRasterize_LabelScale(t *testing.T) {
	pal := wire.DefaultPalette()
	c := pal.Styles[wire.AxisMiddle].Color
	extent := func(scale int) (w, h, minX int) {
		d := wire.Drawing{Width: 200, Height: 60, LabelScale: scale,
			Labels: []wire.Label{{At: [2]float64{40, 40}, Text: "middle", Kind: wire.AxisMiddle}}}
		img := wire.Rasterize(d, pal)
		x0, x1, y0, y1 := 1000, -1, 1000, -1
		for y := range 60 {
			for x := range 200 {
				if p := img.RGBAAt(x, y); p.R == c.R && p.G == c.G && p.B == c.B {
					x0, x1, y0, y1 = min(x0, x), max(x1, x), min(y0, y), max(y1, y)
				}
			}
		}
		return x1 - x0 + 1, y1 - y0 + 1, x0
	}
	w1, h1, m1 := extent(1)
	w2, h2, m2 := extent(2)
	if w1 <= 0 || w2 != 2*w1 || h2 != 2*h1 {
		t.Errorf("text %dx%d at scale 1, %dx%d at scale 2: want twice", w1, h1, w2, h2)
	}
	if m1 < 40 || m2 < 40 {
		t.Errorf("left-aligned text starts at x %d / %d, left of At.x = 40", m1, m2)
	}
}

// TestDraw_LabelScaleKeepsLabelsApart: at LabelScale 2 the labels Draw
// places do not overlap when measured at the doubled size.
func TestDraw_LabelScaleKeepsLabelsApart(t *testing.T) {
	sc := fixture.PanScene(t, 1.2, 3, 1.5, 10)
	sc.LabelScale = 2
	cam := wire.NewCamera(wire.Free, 640, 400)
	cam.Frame(wire.Bounds(sc))
	d := wire.Draw(cam, sc)
	if d.LabelScale != 2 || len(d.Labels) == 0 {
		t.Fatalf("scale %d, %d labels", d.LabelScale, len(d.Labels))
	}
	box := func(l wire.Label) [4]float64 {
		w := wire.LabelAdvance * 2 * float64(len(l.Text))
		x := l.At[0]
		switch l.Align {
		case wire.AlignRight:
			x -= w
		case wire.AlignCentre:
			x -= w / 2
		}
		return [4]float64{x, l.At[1] - 2*wire.LabelHeight, x + w, l.At[1] + 4}
	}
	for i, a := range d.Labels {
		for _, b := range d.Labels[i+1:] {
			p, q := box(a), box(b)
			if p[0] < q[2] && q[0] < p[2] && p[1] < q[3] && q[1] < p[3] {
				t.Errorf("labels %q and %q overlap at scale 2", a.Text, b.Text)
			}
		}
	}
}
