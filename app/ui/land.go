package ui

import (
	"fmt"
	"image"
	"math"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/editor"
	"propflight/app/project"
	"propflight/app/sheet"
	"propflight/physics"
	"propflight/widgets"
)

// landPanel is the "Land it" tab: the plan (which spin rates land a prop
// axis along a world direction at the end of the flight) and, below it,
// the spread (how often the throw's own rate still lands under sampled
// release errors). Both run off the UI goroutine (landwork.go); the panel
// shows the latest.
type landPanel struct {
	w       *Window
	content *fyne.Container
	fields  fieldSet

	axis    *widget.Select
	parts   *widget.List
	dir     *widget.Select
	ends    *widget.RadioGroup
	catchY  *widgets.NumberField
	tol     *widgets.NumberField
	rateMin *widgets.NumberField
	rateMax *widgets.NumberField

	status    *widget.Label
	solutions *widget.List

	rateSD, tiltSD, speedSD, angleSD *widgets.NumberField
	samples                          *widget.Select
	seedLabel                        *widget.Label
	onSheet                          *widget.Check
	progress                         *widget.ProgressBar
	figures                          *widget.Label
	hist, scatter                    *canvas.Raster

	partNames []string // names of the parts, for the list and the axis picker
	partAxes  []r3.Vec // each part's long axis (least principal axis), prop frame
	seed      uint64
	catchSet  bool // the catch height has been set (else it follows the release height)

	visible bool // the tab is open: work runs only then
	stale   bool // something changed while the tab was closed

	job  landJob    // the latest request (landwork.go)
	last landResult // the latest result shown
}

// Choices of the pickers.
const (
	landUp      = "up"
	landDown    = "down"
	landForward = "forward (along the throw)"
	landBack    = "back (toward the thrower)"
	endCatch    = "at the catch"
	endGround   = "at the ground"
	partPrefix  = "long axis of "
)

var landAxisNames = []string{"least axis", "middle axis", "greatest axis"}

// sampleChoices are the spread sizes on offer.
var sampleChoices = []string{"200", "500", "1000", "2000", "5000"}

// newLandPanel builds the Land it tab: the plan's target and solutions,
// then the spread's release errors and figures, set to their defaults.
func newLandPanel(w *Window) *landPanel {
	p := &landPanel{w: w, seed: 1}
	p.buildPlan()
	newSeed := p.buildSpread()
	p.setDefaults()
	p.fields.alignLabels()
	p.content = p.layout(newSeed)
	return p
}

// changed is the fields' edit callback: a finished edit asks for new work.
func (p *landPanel) changed(_ float64, final bool) {
	if final {
		p.request()
	}
}

// buildPlan makes the plan's controls: the prop axis (or a part's long
// axis), the direction, how the flight ends, tolerance and rate range,
// the status line and the solutions list.
func (p *landPanel) buildPlan() {
	w, fs, changed := p.w, &p.fields, p.changed
	p.axis = widget.NewSelect(landAxisNames, func(string) { p.request() })
	p.parts = widget.NewList(func() int { return len(p.partNames) },
		func() fyne.CanvasObject { return newLabel("part") },
		func(i widget.ListItemID, o fyne.CanvasObject) { o.(*widget.Label).SetText(p.partNames[i]) })
	p.parts.OnSelected = func(i widget.ListItemID) {
		p.parts.UnselectAll()
		if i >= 0 && i < len(p.partNames) {
			p.axis.SetSelected(partPrefix + p.partNames[i])
		}
	}
	p.dir = widget.NewSelect([]string{landUp, landDown, landForward, landBack}, func(string) { p.request() })
	p.ends = widget.NewRadioGroup([]string{endCatch, endGround}, func(s string) {
		if s == endCatch {
			p.catchY.Enable()
		} else {
			p.catchY.Disable()
		}
		p.request()
	})
	p.ends.Horizontal = true
	p.catchY = w.newField(fs, "catch height", widgets.Length, 0.05, 5, func(v float64, final bool) {
		p.catchSet = true
		changed(v, final)
	})
	p.tol = w.newField(fs, "tolerance", widgets.Angle, 0.5, 90, changed)
	p.rateMin = w.newField(fs, "slowest spin", widgets.TurnRate, 0, 20, changed)
	p.rateMax = w.newField(fs, "fastest spin", widgets.TurnRate, 0.1, 30, changed)
	p.status = widget.NewLabel("")
	p.status.Wrapping = fyne.TextWrapWord
	p.solutions = widget.NewList(func() int { return p.solutionCount() },
		func() fyne.CanvasObject {
			sub := newLabel("window")
			sub.SizeName = theme.SizeNameCaptionText
			return container.NewVBox(newLabel("solution"), sub)
		},
		func(i widget.ListItemID, o fyne.CanvasObject) {
			main, sub := p.solutionText(i)
			rows := o.(*fyne.Container).Objects
			l := rows[0].(*widget.Label)
			l.TextStyle.Bold = p.last.plan != nil && i == p.last.plan.Best()
			l.SetText(main)
			rows[1].(*widget.Label).SetText(sub)
		})
	p.solutions.OnSelected = func(i widget.ListItemID) {
		p.solutions.UnselectAll()
		p.use(i)
	}
}

// buildSpread makes the spread's controls: the release errors, samples and
// seed (its New seed button returned for the layout), the timing sheet
// choice, progress, figures, the error histogram and the landing scatter.
func (p *landPanel) buildSpread() (newSeed *widget.Button) {
	w, fs, changed := p.w, &p.fields, p.changed
	p.rateSD = w.newField(fs, "spin rate sd %", widgets.Plain, 0, 25, changed)
	p.tiltSD = w.newField(fs, "spin direction sd", widgets.Angle, 0, 20, changed)
	p.speedSD = w.newField(fs, "release speed sd %", widgets.Plain, 0, 20, changed)
	p.angleSD = w.newField(fs, "release angle sd", widgets.Angle, 0, 15, changed)
	p.samples = widget.NewSelect(sampleChoices, func(string) { p.request() })
	p.seedLabel = widget.NewLabel("")
	newSeed = widget.NewButton("New seed", func() {
		p.seed++
		p.request()
	})
	p.onSheet = widget.NewCheck("Add to the timing sheet", nil)
	p.onSheet.SetChecked(true)
	p.progress = widget.NewProgressBar()
	p.progress.Hide()
	p.figures = widget.NewLabel("")
	p.figures.Wrapping = fyne.TextWrapWord
	p.hist = canvas.NewRaster(func(wd, ht int) image.Image { return histogramImage(p.bins(), p.tolFraction(), wd, ht) })
	p.hist.SetMinSize(fyne.NewSize(360, 110))
	p.scatter = canvas.NewRaster(func(wd, ht int) image.Image { return scatterImage(p.landings(), wd, ht) })
	p.scatter.SetMinSize(fyne.NewSize(360, 200))
	return newSeed
}

// setDefaults sets the controls without asking for work: a flat landing
// of the greatest axis, caught at the release height, 10 degrees, 0.25 to
// 10 turns/s; release errors of a practised thrower (common practice, no
// source; measure your own).
func (p *landPanel) setDefaults() {
	w := p.w
	w.syncing++
	p.axis.SetSelected(landAxisNames[physics.Greatest])
	p.dir.SetSelected(landUp)
	p.ends.SetSelected(endCatch)
	p.catchY.SetValue(1.5)
	p.tol.SetValue(10)
	p.rateMin.SetValue(0.25)
	p.rateMax.SetValue(10)
	p.rateSD.SetValue(5)
	p.tiltSD.SetValue(3)
	p.speedSD.SetValue(3)
	p.angleSD.SetValue(2)
	p.samples.SetSelected("1000")
	w.syncing--
}

// layout returns the tab's content, the controls under their headings.
func (p *landPanel) layout(newSeed *widget.Button) *fyne.Container {
	return container.NewVBox(
		heading("Land it"),
		note("The spin rates that land the prop as you want, each with its window: the rates around it that still land within tolerance. Only the rate changes; the release and the spin direction are the Throw tab's. Click a solution to use it (Undo takes it back)."),
		container.NewBorder(nil, nil, widget.NewLabel("Prop axis"), nil, p.axis),
		note("Or click a part to use its long axis:"),
		sized(p.parts, 0, 112),
		container.NewBorder(nil, nil, widget.NewLabel("points"), nil, p.dir),
		container.NewBorder(nil, nil, widget.NewLabel("Flight ends"), nil, p.ends),
		p.catchY, p.tol, p.rateMin, p.rateMax,
		p.status,
		sized(p.solutions, 0, 230),
		widget.NewSeparator(),
		heading("Spread"),
		note("The throw as set now, thrown many times with normal release errors of these sizes: how often it lands within tolerance, and how often it tumbles instead."),
		p.rateSD, p.tiltSD, p.speedSD, p.angleSD,
		container.NewBorder(nil, nil, widget.NewLabel("samples"), container.NewHBox(p.seedLabel, newSeed), p.samples),
		p.progress,
		p.figures,
		widget.NewLabel("Landing error, 0° to 180° (tolerance in orange)"),
		p.hist,
		widget.NewLabel("Landing points from above (x right, z down)"),
		p.scatter,
		p.onSheet,
	)
}

// setVisible is told when the tab opens or closes; opening it runs the
// work that changes asked for while it was closed.
func (p *landPanel) setVisible(on bool) {
	p.visible = on
	if on && p.stale {
		p.request()
	}
}

// setResult follows a new take: the part list, the default catch height,
// and a new plan and spread.
func (p *landPanel) setResult(res editor.Result) {
	sc := res.Scene
	p.partNames = p.partNames[:0]
	p.partAxes = p.partAxes[:0]
	for i := range sc.Prop.Parts {
		pt := sc.Prop.Parts[i]
		name := pt.Name
		if name == "" {
			name = fmt.Sprintf("part %d", i+1)
		}
		p.partNames = append(p.partNames, name)
		one := physics.Prop{Parts: []physics.Part{pt}}
		ax := r3.Vec{X: 1}
		if mp, err := one.MassProps(); err == nil {
			ax = mp.Axes[physics.Least]
		}
		p.partAxes = append(p.partAxes, ax)
	}
	p.parts.Refresh()
	opts := append([]string(nil), landAxisNames...)
	for _, n := range p.partNames {
		opts = append(opts, partPrefix+n)
	}
	p.w.syncing++
	sel := p.axis.Selected
	p.axis.SetOptions(opts)
	if !containsString(opts, sel) {
		sel = landAxisNames[physics.Greatest]
	}
	p.axis.SetSelected(sel)
	if !p.catchSet {
		setValue(p.catchY, sc.Throw.Position.Y)
	}
	p.w.syncing--
	p.request()
}

func containsString(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// landSettings is what one plan and spread use, read from the controls on
// the UI goroutine.
type landSettings struct {
	plan   physics.PlanSpec
	spread physics.SpreadSpec
	words  string // the target in words
}

// settings reads the controls against scene sc. A problem is an error in
// the panel's own words, naming the control.
func (p *landPanel) settings(sc *project.Scene, thr physics.Thresholds) (landSettings, error) {
	var s landSettings
	var tg physics.Target
	axisWords := p.axis.Selected
	switch {
	case strings.HasPrefix(axisWords, partPrefix):
		name := strings.TrimPrefix(axisWords, partPrefix)
		for i, n := range p.partNames {
			if n == name {
				tg.Axis = p.partAxes[i]
			}
		}
	default:
		for i, n := range landAxisNames {
			if n == axisWords {
				tg.Axis = sc.Mass.Axes[i]
			}
		}
	}
	if r3.Norm(tg.Axis) == 0 {
		return s, fmt.Errorf("prop axis: pick an axis or a part")
	}
	heading := r3.Vec{X: sc.Throw.Velocity.X, Z: sc.Throw.Velocity.Z}
	if r3.Norm(heading) == 0 {
		heading = r3.Vec{X: 1}
	}
	switch p.dir.Selected {
	case landDown:
		tg.Dir = r3.Vec{Y: -1}
	case landForward:
		tg.Dir = r3.Unit(heading)
	case landBack:
		tg.Dir = r3.Scale(-1, r3.Unit(heading))
	default:
		tg.Dir = r3.Vec{Y: 1}
	}
	end := physics.End{}
	words := "the " + axisWords + " pointing " + strings.SplitN(p.dir.Selected, " (", 2)[0]
	if p.ends.Selected == endCatch {
		end = physics.End{Catch: true, CatchY: p.catchY.Value()}
	}
	if p.rateMin.Value() >= p.rateMax.Value() {
		return s, fmt.Errorf("slowest spin must be below the fastest spin")
	}
	s.plan = physics.PlanSpec{Target: tg, End: end, Tolerance: p.tol.Value() * math.Pi / 180,
		RateMin: p.rateMin.Value() * 2 * math.Pi, RateMax: p.rateMax.Value() * 2 * math.Pi, Thresholds: thr}
	n := 1000
	fmt.Sscan(p.samples.Selected, &n)
	target := tg
	s.spread = physics.SpreadSpec{Samples: n, Seed: p.seed, RateSD: p.rateSD.Value() / 100, TiltSD: p.tiltSD.Value() * math.Pi / 180,
		SpeedSD: p.speedSD.Value() / 100, AngleSD: p.angleSD.Value() * math.Pi / 180,
		Target: &target, Tolerance: s.plan.Tolerance, End: end, Thresholds: thr}
	s.words = words
	return s, nil
}

// use applies solution i to the throw: its spin rate, as turns per second
// (or frames per turn when the throw is written that way). One undo step.
func (p *landPanel) use(i int) {
	pl := p.last.plan
	if pl == nil || i < 0 || i >= len(pl.Solutions) || p.last.scene == nil {
		return
	}
	tps := math.Round(pl.Solutions[i].Rate/(2*math.Pi)*1e6) / 1e6
	fps := p.last.scene.Throw.FPS.FPS()
	p.w.editAndSync(fmt.Sprintf("Use spin %.4g turns/s", tps), func(d *project.Document) error {
		if d.Throw.Spin == nil {
			d.Throw.Spin = &project.Spin{}
		}
		sp := d.Throw.Spin
		if sp.FramesPerTurn != nil && sp.TurnsPerSecond == nil {
			fpt := math.Round(fps/tps*1e6) / 1e6
			sp.FramesPerTurn = &fpt
		} else {
			sp.TurnsPerSecond, sp.FramesPerTurn = &tps, nil
		}
		return nil
	})
}

func (p *landPanel) solutionCount() int {
	if p.last.plan == nil {
		return 0
	}
	return len(p.last.plan.Solutions)
}

// solutionText is one row of the solutions list: the rate, frames per
// turn, turns in the air and error; then the window.
func (p *landPanel) solutionText(i int) (string, string) {
	pl := p.last.plan
	if pl == nil || i >= len(pl.Solutions) || p.last.scene == nil {
		return "", ""
	}
	s := pl.Solutions[i]
	tps := s.Rate / (2 * math.Pi)
	best := ""
	if i == pl.Best() {
		best = "★ "
	}
	main := fmt.Sprintf("%s%.4f turns/s · %.2f frames/turn · %.2f turns · %.1f° off",
		best, tps, p.last.scene.Throw.FPS.FPS()/tps, s.Turns, s.Error*180/math.Pi)
	sub := fmt.Sprintf("window %.4f–%.4f turns/s (±%.4f), a %s", s.WindowLo/(2*math.Pi), s.WindowHi/(2*math.Pi),
		(s.WindowHi-s.WindowLo)/(4*math.Pi), s.Motion)
	return main, sub
}

// bins is the histogram of the shown spread's errors (nil for none).
func (p *landPanel) bins() []int {
	if p.last.spread == nil {
		return nil
	}
	return sheet.ErrorBins(p.last.spread, 36)
}

// tolFraction is the tolerance as a fraction of 180 degrees.
func (p *landPanel) tolFraction() float64 { return p.tol.Value() / 180 }

// landings are the shown spread's landing points (x, z), m.
func (p *landPanel) landings() [][2]float64 {
	if p.last.spread == nil {
		return nil
	}
	pts := make([][2]float64, 0, len(p.last.spread.Points))
	for _, s := range p.last.spread.Points {
		if !s.Short {
			pts = append(pts, [2]float64{s.Landing.X, s.Landing.Z})
		}
	}
	return pts
}

// sheetPage returns, on the UI goroutine, a function an export may call
// from its own goroutine for the landing page of the scene it prints
// (forSheet of the result shown now).
func (p *landPanel) sheetPage() func(*project.Scene) *sheet.Landing {
	r, on := p.last, p.onSheet.Checked
	return func(sc *project.Scene) *sheet.Landing { return landingOf(r, on, sc) }
}

// forSheet returns the landing page for the timing sheet of scene sc: the
// shown plan and spread when they belong to that scene and the box is
// ticked, else nil.
func (p *landPanel) forSheet(sc *project.Scene) *sheet.Landing {
	return landingOf(p.last, p.onSheet.Checked, sc)
}

// landingOf is forSheet for result r and the box's state on.
func landingOf(r landResult, on bool, sc *project.Scene) *sheet.Landing {
	if !on || r.scene == nil || r.scene != sc || r.plan == nil {
		return nil
	}
	return &sheet.Landing{Target: r.set.words, End: r.set.plan.End, Tolerance: r.set.plan.Tolerance,
		RateMin: r.set.plan.RateMin, RateMax: r.set.plan.RateMax, Plan: r.plan, Spread: r.spread, Errors: r.set.spread}
}
