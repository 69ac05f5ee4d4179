package ui

import (
	"fmt"
	"math"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/widget"

	"propflight/app/footage"
	"propflight/app/project"
	"propflight/widgets/wire"
)

// This file is the footage pane's fit: fitting the marks, wording the
// result, applying it to the throw, and the overlay of the take that the
// fit places on the footage.

// overlayCamera returns the camera that lays the take over the footage
// at the fitted scale, with the take's release centre of mass on the
// fitted centre at the release frame; ok is false without a usable fit or
// take.
func (p *footagePane) overlayCamera() (cam wire.Camera, ok bool) {
	r, tk := p.fit, p.w.good.Take
	if p.seq == nil || r == nil || tk == nil || len(tk.Frames) == 0 || !(r.MetresPerPixel > 0) || math.IsInf(r.MetresPerPixel, 0) {
		return wire.Camera{}, false
	}
	w, h := p.seq.Size()
	ox, oy := r.CentreAt(float64(p.offsetFrames()))
	// The view stretches the overlay over the frame, so a huge clip's
	// overlay is drawn k times coarser (k pixels of the clip to one),
	// within maxOverlayPixels, not at the clip's own size.
	k := max(1, math.Ceil(math.Sqrt(float64(w)*float64(h)/maxOverlayPixels)))
	return footage.OverlayCamera(r.MetresPerPixel*k, [2]float64{ox / k, oy / k}, tk.Frames[0].CM, int(math.Ceil(float64(w)/k)), int(math.Ceil(float64(h)/k))), true
}

// maxOverlayPixels bounds the overlay raster: 4 megapixels, twice a 1080p
// frame (a 6000 x 6000 clip would otherwise make a 144 MB raster a frame).
const maxOverlayPixels = 4_000_000

// renderOverlay draws the take over the footage frame shown, when the
// overlay is on and there is a fit to place it.
func (p *footagePane) renderOverlay() {
	fo := p.w.ed.Doc().Footage
	if !fo.OverlayOn() {
		p.view.SetOverlay(nil, 0)
		return
	}
	cam, ok := p.overlayCamera()
	sc := p.w.good.Scene
	if !ok || sc == nil {
		p.view.SetOverlay(nil, 0)
		return
	}
	in := footage.OverlayInput{Prop: &sc.Prop, Mass: &sc.Mass, Take: p.w.good.Take}
	p.view.SetOverlay(footage.RenderOverlay(in, cam, p.takeFrameOf(p.frame)), fo.OpacityOrDefault())
}

// refit fits the document's marks and, after the Fit button, shows the
// result. The overlay uses the fit whether or not it is shown; callers
// draw it again (renderOverlay).
func (p *footagePane) refit() {
	d := p.w.ed.Doc()
	marks := docMarks(d)
	p.fit, p.fitErr = nil, nil
	var outside error
	if p.seq != nil {
		// Marks from the project file may lie outside the clip's image (a
		// slip, or other footage): fit none of them then.
		w, h := p.seq.Size()
		outside = footage.CheckBounds(marks, w, h)
	}
	if outside != nil {
		p.fitErr = fmt.Errorf("footage.marks: %w; move or delete it to fit", outside)
	} else if len(marks) >= footage.MinFitMarks {
		p.fit, p.fitErr = footage.Fit(marks, footage.FitOptions{FPS: p.footageRate().FPS(), Gravity: p.gravity()})
	} else {
		p.fitErr = fmt.Errorf("the fit needs at least %d marked frames; there are %d", footage.MinFitMarks, len(marks))
	}
	if p.showFit {
		p.showFitRows()
	}
}

// clearFit takes the fit off the panel (another project).
func (p *footagePane) clearFit() {
	p.showFit = false
	p.fitText = ""
	p.fitProblem.Hide()
	p.fitForm.Objects = nil
	p.fitForm.Refresh()
}

// fitRow is one line of the fit on the panel.
type fitRow struct{ Label, Value string }

// fitRows words the fit for the panel; the error, when there is one.
func (p *footagePane) fitRows() ([]fitRow, error) {
	if p.fitErr != nil {
		return nil, p.fitErr
	}
	r := p.fit
	off := p.offsetFrames()
	fpsF := p.footageRate().FPS()
	rows := []fitRow{
		{"marks", fmt.Sprintf("%d, on footage frames %d to %d", r.Marks, r.FirstFrame, r.LastFrame)},
		{"gravity", sig(r.GravityPxPerFrame2) + " px/frame² in the image"},
		{"scale", fmt.Sprintf("%s mm/px (gravity %s m/s² at %s fps)", sig(1000*r.MetresPerPixel), sig(p.gravity()), sig(fpsF))},
	}
	if ts, err := r.ThrowAt(off, r.MetresPerPixel); err == nil {
		side := "to the right"
		if ts.Leftward {
			side = "to the left"
		}
		rows = append(rows, fitRow{"release", fmt.Sprintf("%s m/s at %s° above level, %s (footage frame %d)", sig(ts.Speed), sig(ts.AngleDeg), side, off)})
	}
	apexTake := (r.ApexFrame - float64(off)) / fpsF * p.w.rate().FPS()
	rows = append(rows, fitRow{"apex", fmt.Sprintf("footage frame %s (take frame %s)", sig(r.ApexFrame), sig(apexTake))})
	if math.IsNaN(r.RMSPx) {
		rows = append(rows, fitRow{"residual", "none with 3 marks: mark more frames"})
	} else {
		rows = append(rows, fitRow{"residual", sig(r.RMSPx) + " px RMS"})
	}
	if r.HasTurn {
		sense := "counter-clockwise"
		if r.TurnDegPerFrame < 0 {
			sense = "clockwise"
		}
		rows = append(rows,
			fitRow{"turn", fmt.Sprintf("%s°/frame %s, %s turns/s", sig(r.TurnDegPerFrame), sense, sig(math.Abs(r.TurnDegPerFrame)*fpsF/360))},
			fitRow{"the turn is", turnHintText(r.Hint, r.TurnRMSDeg)})
	} else {
		rows = append(rows, fitRow{"turn", fmt.Sprintf("needs %d marks with a second point (%d so far)", footage.MinTurnMarks, r.TurnMarks)})
	}
	return rows, nil
}

// turnHintText words the fit's turn hint with its RMS (degrees); an
// irregular turn says that its rate is only a rough on-screen one.
func turnHintText(hint string, rms float64) string {
	if hint == footage.HintIrregular {
		return fmt.Sprintf("irregular (%s° RMS off a steady turn): a tumble or wobble on screen, so the rate is only a rough on-screen turn rate", sig(rms))
	}
	return fmt.Sprintf("%s (%s° RMS off a steady turn)", hint, sig(rms))
}

// fitReport is the fit as text, one "label: value" a line, as the panel
// shows it.
func (p *footagePane) fitReport() string {
	rows, err := p.fitRows()
	if err != nil {
		return errorText(err)
	}
	lines := make([]string, len(rows))
	for i, r := range rows {
		lines[i] = r.Label + ": " + r.Value
	}
	return strings.Join(lines, "\n")
}

// showFitRows puts the fit on the panel.
func (p *footagePane) showFitRows() {
	rows, err := p.fitRows()
	var objs []fyne.CanvasObject
	if err != nil {
		p.fitProblem.SetText(errorText(err))
		p.fitProblem.Show()
	} else {
		p.fitProblem.Hide()
		for _, r := range rows {
			val := widget.NewLabel(r.Value)
			val.Wrapping = fyne.TextWrapWord
			objs = append(objs, widget.NewLabelWithStyle(r.Label, fyne.TextAlignTrailing, fyne.TextStyle{}), val)
		}
	}
	p.fitForm.Objects = objs
	p.fitForm.Refresh()
	p.fitText = p.fitReport()
}

// applyFit sets the throw from the fit at the release frame: its release
// velocity and spin rate, in one undo step. When the footage's turn is
// irregular (a tumble or a wobble seen on screen) the fitted turn is only
// the mean rate of the prop line on the screen, not the spin |omega| at
// release, so the window asks first (confirmIrregular).
func (p *footagePane) applyFit() {
	p.refit()
	if p.fitErr != nil {
		p.w.showError("Cannot apply the fit", p.fitErr)
		return
	}
	ts, err := p.fit.ThrowAt(p.offsetFrames(), p.fit.MetresPerPixel)
	if err != nil {
		p.w.showError("Cannot apply the fit", err)
		return
	}
	if ts.HasSpin && p.fit.Hint == footage.HintIrregular {
		p.confirmIrregular(ts)
		return
	}
	p.applyThrow(ts)
}

// applyThrow sets the throw from ts as one undo step.
func (p *footagePane) applyThrow(ts footage.ThrowSettings) {
	rate := p.w.rate()
	p.w.editAndSync("Apply the footage fit to the throw", func(d *project.Document) error {
		return applyFitToThrow(d, ts, rate)
	})
}

// irregularTurnText explains, before Apply, why an irregular turn gives
// only a rough spin rate; rms is the turn's RMS off a steady turn, degrees.
func irregularTurnText(turnsPerSecond, rms float64) string {
	return fmt.Sprintf("The footage's turn is irregular: the marked directions are %s° RMS off a steady turn, "+
		"as when the prop tumbles or wobbles on screen. The fitted %s turns/s is only a rough on-screen turn rate "+
		"(the mean turn of the prop line in the picture), not the spin rate at release.\n\n"+
		"Apply the release velocity only, or also set the spin to this rough rate?",
		sig(rms), sig(turnsPerSecond))
}

// confirmIrregular asks whether to apply a fit whose turn is irregular:
// the velocity only, the velocity and the rough rate, or nothing.
func (p *footagePane) confirmIrregular(ts footage.ThrowSettings) {
	velocityOnly := ts
	velocityOnly.HasSpin = false
	p.w.ask("The footage's turn is irregular", irregularTurnText(ts.TurnsPerSecond, p.fit.TurnRMSDeg), 460,
		answer{label: "Cancel"},
		answer{label: "Apply the rough rate too", run: func() { p.applyThrow(ts) }},
		answer{label: "Velocity only", run: func() { p.applyThrow(velocityOnly) }, look: widget.HighImportance})
}
