package ui

import (
	"strconv"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"propflight/widgets"
	"propflight/widgets/wire"
)

// previewPane is the centre: the wireframe preview of the take and its
// toolbar (view, onion skin, what to draw, reset camera).
type previewPane struct {
	w       *Window
	preview *widgets.Preview
	toolbar *fyne.Container
	fields  fieldSet

	views  [4]*widget.Button // Front, Side, Top, Free
	onion  *widget.Select
	arc    *widget.Check
	axes   *widget.Check
	grid   *widget.Check
	reset  *widget.Button
	before int // onion-skin frames before and after the current one
}

// maxOnion is the most onion-skin frames shown on each side.
const maxOnion = 6

func newPreviewPane(w *Window) *previewPane {
	p := &previewPane{w: w}
	p.preview = widgets.NewPreview()
	p.preview.OnViewChanged = func(wire.View) { p.markView() }
	names := [4]string{"Front", "Side", "Top", "Free"}
	for i := range p.views {
		v := wire.View(i)
		p.views[i] = widget.NewButton(names[i], func() { p.setView(v) })
	}
	opts := make([]string, 0, maxOnion+1)
	for i := 0; i <= maxOnion; i++ {
		opts = append(opts, onionLabel(i))
	}
	p.onion = widget.NewSelect(opts, func(s string) {
		for i, o := range opts {
			if o == s {
				p.before = i
			}
		}
		if w.syncing == 0 { // not while the window is built or restored
			w.app.Preferences().SetInt(prefOnion, p.before)
		}
		p.refreshScene()
	})
	p.onion.SetSelected(onionLabel(2))
	p.arc = widget.NewCheck("arc + ticks", func(bool) { p.refreshScene() })
	p.axes = widget.NewCheck("axes", func(bool) { p.refreshScene() })
	p.grid = widget.NewCheck("grid", func(bool) { p.refreshScene() })
	p.arc.SetChecked(true)
	p.axes.SetChecked(true)
	p.grid.SetChecked(true)
	p.reset = widget.NewButtonWithIcon("frame all", theme.ViewRestoreIcon(), func() { p.preview.ResetCamera() })
	p.toolbar = container.NewHBox(
		p.views[0], p.views[1], p.views[2], p.views[3],
		widget.NewSeparator(),
		p.onion,
		p.arc, p.axes, p.grid,
		widget.NewSeparator(),
		p.reset,
	)
	p.markView()
	return p
}

// onionLabel names an onion-skin choice: "no onion skin", "onion ±1",
// ... "onion ±6" (frames before and after the current one).
func onionLabel(n int) string {
	if n == 0 {
		return "no onion skin"
	}
	return "onion ±" + strconv.Itoa(n)
}

// setView looks from view v and frames the take.
func (p *previewPane) setView(v wire.View) {
	p.preview.SetView(v)
	p.markView()
}

// markView highlights the button of the current view and saves it as the
// user's.
func (p *previewPane) markView() {
	cur := p.preview.View()
	if p.w.syncing == 0 {
		p.w.app.Preferences().SetInt(prefView, int(cur))
	}
	for i, b := range p.views {
		if wire.View(i) == cur {
			b.Importance = widget.HighImportance
		} else {
			b.Importance = widget.MediumImportance
		}
		b.Refresh()
	}
}

// scene returns what the preview draws for the window's last good result
// and the toolbar's settings.
func (p *previewPane) scene() wire.Scene {
	res := p.w.good
	sc := wire.Scene{
		OnionBefore: p.before, OnionAfter: p.before,
		ShowArc: p.arc.Checked, ShowTicks: p.arc.Checked,
		ShowAxes: p.axes.Checked, ShowGrid: p.grid.Checked,
	}
	if res.Scene != nil {
		sc.Prop, sc.Mass, sc.Take = &res.Scene.Prop, &res.Scene.Mass, res.Take
		sc.GroundY = res.Scene.Throw.GroundY
	}
	return sc
}

// refreshScene hands the preview the current scene and frame.
func (p *previewPane) refreshScene() {
	if p.w.view == nil { // still building
		return
	}
	p.preview.SetScene(p.scene())
	p.preview.SetFrame(p.w.shownFrame())
}

// showFrame shows frame n's pose.
func (p *previewPane) showFrame(n int) { p.preview.SetFrame(n) }
