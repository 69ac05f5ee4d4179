package widgets

import (
	"image"
	"image/color"
	"image/draw"
	"math"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/widgets/wire"
)

// Declare conformity with the interfaces Preview implements.
var (
	_ fyne.Widget         = (*Preview)(nil)
	_ fyne.Draggable      = (*Preview)(nil)
	_ fyne.Scrollable     = (*Preview)(nil)
	_ fyne.DoubleTappable = (*Preview)(nil)
)

// Interaction rates.
const (
	// OrbitPerUnit is the camera turn for a drag of one device-independent
	// unit, radians: 300 units swing the view about 170 degrees.
	OrbitPerUnit = 0.01
	// zoomPerUnit is ln of the zoom factor for one unit of scroll: a wheel
	// notch (25 units on most desktops) moves 15 % closer or farther.
	zoomPerUnit = 0.13976194237515863 / 25 // ln(1.15) / 25
	// reframeGrow and reframeShrink bound how much the scene's box may grow
	// or shrink (its diagonal, against the box last framed) before SetScene
	// frames it again; reframeSlack is how far, as a fraction of that
	// diagonal, the new box may reach outside the old one.
	reframeGrow   = 1.5
	reframeShrink = 0.5
	reframeSlack  = 0.1
)

// previewMin is the smallest size the preview asks for.
var previewMin = fyne.NewSize(160, 120)

// Preview shows a take as the wire renderer's wireframe: the prop at the
// current frame, its onion skin, arc, principal axes and ground grid, as the
// scene asks. Drag to orbit (a drag from the front, side or top view turns
// it into the free view and calls OnViewChanged), scroll to zoom, double
// tap to frame the whole take again.
//
// The picture is rendered at the canvas's pixel size, so it is sharp on
// HiDPI screens; line widths grow with the canvas scale. One image is kept
// and repainted only when the scene, frame, camera or size changes.
type Preview struct {
	widget.BaseWidget

	// OnViewChanged is called when a drag turns a fixed view into the free
	// view (not for SetView). It may be nil.
	OnViewChanged func(wire.View)

	scene   wire.Scene
	hasProp bool // a scene with a prop or take was set
	cam     wire.Camera
	auto    bool   // the camera is as Frame left it: re-frame when resized
	framed  r3.Box // the box last framed
	pal     wire.Palette
	themed  bool // pal follows the theme (no SetPalette yet)
	light   bool // the theme pal was chosen for is light
	painter wire.Painter
	raster  *canvas.Raster
	img     *image.RGBA
	scale   float64 // pixel scale of the last render
	stale   bool    // img no longer shows scene and camera
}

// NewPreview returns an empty preview looking from the front.
func NewPreview() *Preview {
	p := &Preview{pal: wire.DefaultPalette(), themed: true, stale: true}
	free := wire.NewCamera(wire.Free, 1, 1)
	p.cam = wire.NewCamera(wire.Front, int(previewMin.Width), int(previewMin.Height))
	p.cam.Yaw, p.cam.Pitch = free.Yaw, free.Pitch // what SetView(Free) starts from
	p.raster = canvas.NewRaster(p.render)
	p.ExtendBaseWidget(p)
	return p
}

// SetScene sets what to draw: prop, mass properties, take, onion skin,
// arc, ticks, axes and grid. The scene's own Frame is ignored: the preview
// keeps its current frame (see SetFrame), clamped to the new take. The
// camera stays where it is unless this is the first scene or the scene's
// box (wire.Bounds) grew or shrank a lot or moved out of the framed box,
// in which case the whole take is framed again.
func (p *Preview) SetScene(sc wire.Scene) {
	frame := p.scene.Frame
	p.scene = sc
	p.scene.Frame = p.clamp(frame)
	b := wire.Bounds(p.scene)
	first := !p.hasProp
	p.hasProp = sc.Prop != nil || sc.Take != nil
	if first || p.movedALot(b) {
		p.frameBox(b)
	}
	p.changed()
}

// Scene returns the scene being drawn, with its current Frame.
func (p *Preview) Scene() wire.Scene { return p.scene }

// SetFrame shows frame n of the take, clamped to its frames.
func (p *Preview) SetFrame(n int) {
	n = p.clamp(n)
	if n == p.scene.Frame {
		return
	}
	p.scene.Frame = n
	p.changed()
}

// Frame returns the frame shown.
func (p *Preview) Frame() int { return p.scene.Frame }

// SetView looks from view v and frames the whole take. Front, Side and Top
// are orthographic (true arcs and spacing); Free is a perspective orbit
// from the last free angles. OnViewChanged is not called.
func (p *Preview) SetView(v wire.View) {
	p.cam.View = v
	p.cam.Ortho = v != wire.Free
	p.ResetCamera()
}

// View returns the view the camera looks from.
func (p *Preview) View() wire.View { return p.cam.View }

// Camera returns a copy of the camera, sized to the last render, for
// drawing the same picture elsewhere (the timing sheet).
func (p *Preview) Camera() wire.Camera { return p.cam }

// SetPalette sets the colours and line widths. Until it is called the
// preview follows the theme: wire.DefaultPalette on a dark background,
// wire.LightPalette on a light one (see followTheme).
func (p *Preview) SetPalette(pal wire.Palette) {
	p.pal = pal
	p.themed = false
	p.changed()
}

// followTheme picks the palette for the theme's background when the
// preview follows the theme, and reports whether it changed. A theme
// counts as light when its background's relative luminance (sRGB
// coefficients of ITU-R BT.709) is over one half, so a theme that forces
// a variant is read right whatever the system's variant.
func (p *Preview) followTheme() bool {
	if !p.themed || fyne.CurrentApp() == nil {
		return false
	}
	bg := p.Theme().Color(theme.ColorNameBackground, fyne.CurrentApp().Settings().ThemeVariant())
	r, g, b, _ := bg.RGBA()
	light := (0.2126*float64(r)+0.7152*float64(g)+0.0722*float64(b))/0xffff > 0.5
	if light == p.light && p.pal.Background != (color.NRGBA{}) {
		return false
	}
	p.light = light
	if light {
		p.pal = wire.LightPalette()
	} else {
		p.pal = wire.DefaultPalette()
	}
	p.stale = true
	return true
}

// ResetCamera frames the whole take in the current view.
func (p *Preview) ResetCamera() {
	p.frameBox(wire.Bounds(p.scene))
	p.changed()
}

// Image returns a copy of the picture as last rendered, rendering it first
// if the scene or camera changed since. Before the preview has been shown
// it renders at the preview's size (or its minimum size) at scale 1.
func (p *Preview) Image() image.Image {
	if p.img == nil || p.stale {
		w, h := p.cam.Width, p.cam.Height
		if p.img == nil {
			s := p.Size().Max(previewMin)
			w, h = int(math.Round(float64(s.Width))), int(math.Round(float64(s.Height)))
		}
		p.render(w, h)
	}
	out := image.NewRGBA(p.img.Bounds())
	draw.Draw(out, out.Rect, p.img, p.img.Rect.Min, draw.Src)
	return out
}

// Dragged orbits the camera about its target: right turns the scene to the
// right, down tilts its top toward the viewer.
func (p *Preview) Dragged(e *fyne.DragEvent) {
	was := p.cam.View
	p.cam.Orbit(-float64(e.Dragged.DX)*OrbitPerUnit, float64(e.Dragged.DY)*OrbitPerUnit)
	p.changed()
	if was != wire.Free && p.OnViewChanged != nil {
		p.OnViewChanged(p.cam.View)
	}
}

// DragEnd ends an orbit.
func (p *Preview) DragEnd() {}

// Scrolled zooms: scrolling up (away from the user) moves in.
func (p *Preview) Scrolled(e *fyne.ScrollEvent) {
	d := float64(e.Scrolled.DY)
	if d == 0 {
		return
	}
	p.cam.Zoom(math.Exp(-d * zoomPerUnit))
	p.auto = false
	p.changed()
}

// DoubleTapped frames the whole take again.
func (p *Preview) DoubleTapped(*fyne.PointEvent) { p.ResetCamera() }

// CreateRenderer is a private method to Fyne which links this widget to its
// renderer.
func (p *Preview) CreateRenderer() fyne.WidgetRenderer {
	return &previewRenderer{p: p}
}

// clamp keeps n inside the take's frames (0 with no take).
func (p *Preview) clamp(n int) int {
	last := 0
	if p.scene.Take != nil {
		last = max(len(p.scene.Take.Frames)-1, 0)
	}
	return min(max(n, 0), last)
}

// changed marks the picture stale and asks for a repaint.
func (p *Preview) changed() {
	p.stale = true
	p.Refresh()
}

// frameBox aims the camera at box b and remembers it.
func (p *Preview) frameBox(b r3.Box) {
	p.cam.Frame(b)
	p.framed = b
	p.auto = true
}

// movedALot reports whether box b differs enough from the framed box for
// SetScene to frame again.
func (p *Preview) movedALot(b r3.Box) bool {
	old := diagonal(p.framed)
	now := diagonal(b)
	if !(old > 0) || !(now > 0) {
		return now != old
	}
	if now > reframeGrow*old || now < reframeShrink*old {
		return true
	}
	s := reframeSlack * old
	return b.Min.X < p.framed.Min.X-s || b.Min.Y < p.framed.Min.Y-s || b.Min.Z < p.framed.Min.Z-s ||
		b.Max.X > p.framed.Max.X+s || b.Max.Y > p.framed.Max.Y+s || b.Max.Z > p.framed.Max.Z+s
}

func diagonal(b r3.Box) float64 {
	d := r3.Norm(r3.Sub(b.Max, b.Min))
	if math.IsNaN(d) || math.IsInf(d, 0) {
		return 0
	}
	return d
}

// render is the raster's generator: it returns the picture at w x h
// pixels, repainting it only when something changed. It reuses one image
// as long as the size holds.
func (p *Preview) render(w, h int) image.Image {
	w, h = max(w, 1), max(h, 1)
	if p.img == nil || p.img.Rect.Dx() != w || p.img.Rect.Dy() != h {
		p.img = image.NewRGBA(image.Rect(0, 0, w, h))
		p.stale = true
	}
	if p.cam.Width != w || p.cam.Height != h {
		p.cam.Width, p.cam.Height = w, h
		if p.auto {
			p.cam.Frame(p.framed)
		}
		p.stale = true
	}
	scale := 1.0
	if sw := float64(p.Size().Width); sw > 0 {
		scale = math.Max(1, float64(w)/sw)
	}
	if scale != p.scale {
		p.scale = scale
		p.stale = true
	}
	p.followTheme()
	if !p.stale {
		return p.img
	}
	pal := p.pal
	for i := range pal.Styles {
		pal.Styles[i].Width *= scale
	}
	sc := p.scene
	sc.LabelScale = int(math.Round(scale)) // label text grows with the canvas scale too
	p.painter.Paint(p.img, wire.Draw(p.cam, sc), pal)
	p.stale = false
	return p.img
}

var _ fyne.WidgetRenderer = (*previewRenderer)(nil)

// previewRenderer shows the preview's raster over its whole size.
type previewRenderer struct {
	p *Preview
}

func (r *previewRenderer) Layout(size fyne.Size) {
	r.p.raster.Move(fyne.NewPos(0, 0))
	r.p.raster.Resize(size)
}

func (r *previewRenderer) MinSize() fyne.Size { return previewMin }

func (r *previewRenderer) Objects() []fyne.CanvasObject { return []fyne.CanvasObject{r.p.raster} }

func (r *previewRenderer) Refresh() {
	r.p.followTheme() // a theme change refreshes every widget
	r.Layout(r.p.Size())
	r.p.raster.Refresh()
}

func (r *previewRenderer) Destroy() {}
