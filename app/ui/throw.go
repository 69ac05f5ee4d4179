package ui

import (
	"math"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/widget"

	"propflight/app/editor"
	"propflight/app/project"
	"propflight/physics"
	"propflight/widgets"
)

// throwPanel is the Throw tab: the spin (axis, tilt, rate), the release
// (speed and angle, or hang time and distance), heights, frame rate and
// gravity.
type throwPanel struct {
	w       *Window
	content *fyne.Container
	fields  fieldSet

	axis     *widget.Select
	named    *fyne.Container // tilt controls, for a named axis
	free     *fyne.Container // x, y, z, for a free direction
	tilt     *widgets.NumberField
	toward   *widget.Select
	freeF    [3]*widgets.NumberField
	rateMode *widget.RadioGroup
	tps      *widgets.NumberField
	fpt      *widgets.NumberField
	rateNote *widget.Label

	relMode  *widget.RadioGroup
	bySpeed  *fyne.Container
	byHang   *fyne.Container
	speed    *widgets.NumberField
	angle    *widgets.NumberField
	hang     *widgets.NumberField
	distance *widgets.NumberField
	heading  *widgets.NumberField
	relNote  *widget.Label

	height  *widgets.NumberField
	ground  *widgets.NumberField
	orient  [3]*widgets.NumberField
	fps     *widget.Select
	custom  *widget.Entry
	twos    *widget.RadioGroup
	gravity *widgets.NumberField
}

// Choices of the throw's radio groups and pickers.
const (
	axisFree     = "free direction"
	rateTurns    = "turns per second"
	rateFrames   = "frames per turn"
	relSpeed     = "speed and angle"
	relHang      = "hang time and distance"
	timingOnOnes = "on ones"
	timingOnTwos = "on twos"
)

// newThrowPanel builds the throw panel: the spin, the release, the
// release pose and the world and timing, in that order down the panel.
func newThrowPanel(w *Window) *throwPanel {
	t := &throwPanel{w: w}
	t.buildSpin()
	t.buildRelease()
	t.buildWorld()
	t.fields.alignLabels()
	t.content = t.layout()
	return t
}

// buildSpin makes the spin controls: the axis, the tilt of a named axis or
// the direction of a free one, and the rate in turns per second or frames
// per turn.
func (t *throwPanel) buildSpin() {
	w, fs := t.w, &t.fields
	t.axis = widget.NewSelect(append(append([]string(nil), axisNames...), axisFree), t.pickAxis)
	t.tilt = w.newField(fs, "tilt", widgets.Angle, -90, 90, func(v float64, final bool) {
		w.edit("Change tilt", "tilt", final, func(d *project.Document) error {
			setTilt(d, v, t.towardName())
			return nil
		})
	})
	t.toward = widget.NewSelect([]string{"middle", "greatest"}, func(s string) {
		if s == "" {
			return
		}
		w.edit("Tilt toward the "+s+" axis", "", true, func(d *project.Document) error {
			setTilt(d, t.tilt.Value(), s)
			return nil
		})
	})
	t.named = container.NewVBox(t.tilt, container.NewBorder(nil, nil, widget.NewLabel("tilt toward the"), widget.NewLabel("axis"), t.toward))
	for k, axis := range []string{"x", "y", "z"} {
		t.freeF[k] = w.newField(fs, "direction "+axis, widgets.Plain, -1, 1, func(v float64, final bool) {
			w.edit("Change spin direction", "spin dir "+axis, final, func(d *project.Document) error {
				vec := t.freeVec()
				vec[k] = v
				setFreeAxis(d, vec)
				return nil
			})
		})
	}
	t.free = container.NewVBox(t.freeF[0], t.freeF[1], t.freeF[2], note("A direction in the prop frame; its length does not matter."))
	t.rateMode = widget.NewRadioGroup([]string{rateTurns, rateFrames}, func(s string) {
		if s == "" {
			return
		}
		w.editAndSync("Give the spin in "+s, func(d *project.Document) error {
			setRateMode(d, s == rateFrames)
			return nil
		})
	})
	t.rateMode.Horizontal, t.rateMode.Required = true, true
	t.tps = w.newField(fs, "spin rate", widgets.TurnRate, 0, 20, func(v float64, final bool) {
		w.edit("Change spin rate", "tps", final, func(d *project.Document) error {
			s := ensureSpin(d)
			s.TurnsPerSecond, s.FramesPerTurn = ptrTo(v), nil
			return nil
		})
	})
	t.fpt = w.newField(fs, "frames per turn", widgets.Plain, 1, 240, func(v float64, final bool) {
		w.edit("Change frames per turn", "fpt", final, func(d *project.Document) error {
			s := ensureSpin(d)
			s.TurnsPerSecond, s.FramesPerTurn = nil, ptrTo(v)
			return nil
		})
	})
	t.fpt.SetLog(true)
	t.rateNote = note("")
}

// buildRelease makes the release controls: by speed and angle, or by hang
// time, distance and heading.
func (t *throwPanel) buildRelease() {
	w, fs := t.w, &t.fields
	t.relMode = widget.NewRadioGroup([]string{relSpeed, relHang}, func(s string) {
		if s == "" {
			return
		}
		w.editAndSync("Give the release by "+s, func(d *project.Document) error {
			if s == relHang {
				setReleaseMode(d, byHang)
			} else {
				setReleaseMode(d, bySpeed)
			}
			return nil
		})
	})
	t.relMode.Required = true
	t.speed = w.newField(fs, "speed", widgets.Speed, 0, 30, func(v float64, final bool) {
		w.edit("Change release speed", "speed", final, func(d *project.Document) error {
			setSpeedAngle(d, v, t.angle.Value())
			return nil
		})
	})
	t.angle = w.newField(fs, "angle", widgets.Angle, -90, 90, func(v float64, final bool) {
		w.edit("Change release angle", "angle", final, func(d *project.Document) error {
			setSpeedAngle(d, t.speed.Value(), v)
			return nil
		})
	})
	t.bySpeed = container.NewVBox(t.speed, t.angle, note("Angle above the +x direction, in the x-y plane; 90° is straight up."))
	hangEdit := func(label, key string) func(v float64, final bool) {
		return func(_ float64, final bool) {
			w.edit(label, key, final, func(d *project.Document) error {
				setHang(d, t.hang.Value(), t.distance.Value(), t.heading.Value())
				return nil
			})
		}
	}
	t.hang = w.newField(fs, "hang time", widgets.Duration, 0.05, 5, hangEdit("Change hang time", "hang"))
	t.distance = w.newField(fs, "distance", widgets.Length, 0, 30, hangEdit("Change distance", "distance"))
	t.heading = w.newField(fs, "heading", widgets.Angle, -180, 180, hangEdit("Change heading", "heading"))
	t.byHang = container.NewVBox(t.hang, t.distance, t.heading,
		note("Time until the centre of mass is back at release height, and how far it travels meanwhile; heading 0° is +x, 90° is −z."))
	t.relNote = note("")
}

// buildWorld makes the controls of where and when: the release height
// and pose, the ground, the frame rate, ones or twos and gravity.
func (t *throwPanel) buildWorld() {
	w, fs := t.w, &t.fields
	t.height = w.newField(fs, "release height", widgets.Length, 0, 20, func(v float64, final bool) {
		w.edit("Change release height", "height", final, func(d *project.Document) error {
			setReleaseHeight(d, v)
			return nil
		})
	})
	t.ground = w.newField(fs, "ground height", widgets.Length, -10, 10, func(v float64, final bool) {
		w.edit("Change ground height", "ground", final, func(d *project.Document) error {
			d.Throw.GroundY = ptrTo(v)
			return nil
		})
	})
	for k, axis := range []string{"x", "y", "z"} {
		t.orient[k] = w.newField(fs, "turn about "+axis, widgets.Angle, -180, 180, func(v float64, final bool) {
			w.edit("Change release pose", "orient "+axis, final, func(d *project.Document) error {
				d.Throw.OrientationDeg = setVecElem(d.Throw.OrientationDeg, k, v)
				return nil
			})
		})
	}
	t.fps = widget.NewSelect(rateLabels(), t.pickRate)
	t.custom = widget.NewEntry()
	t.custom.SetPlaceHolder("a rate such as 12.5 or 24000/1001, then Enter")
	t.custom.OnSubmitted = t.typeRate
	t.custom.Hide()
	t.twos = widget.NewRadioGroup([]string{timingOnOnes, timingOnTwos}, func(string) {
		if w.syncing == 0 {
			w.showFrame()
		}
	})
	t.twos.Horizontal, t.twos.Required = true, true
	t.twos.SetSelected(timingOnOnes)
	t.gravity = w.newField(fs, "gravity", widgets.Acceleration, 0.5, 30, func(v float64, final bool) {
		w.edit("Change gravity", "gravity", final, func(d *project.Document) error {
			d.Throw.Gravity = ptrTo(v)
			return nil
		})
	})
}

// layout returns the panel's content, the controls under their headings.
func (t *throwPanel) layout() *fyne.Container {
	return container.NewVBox(
		heading("Spin"),
		container.NewBorder(nil, nil, widget.NewLabel("spin about the"), nil, t.axis),
		t.named, t.free,
		t.rateMode, t.tps, t.fpt, t.rateNote,
		widget.NewSeparator(),
		heading("Release"),
		t.relMode, t.bySpeed, t.byHang, t.relNote,
		t.height,
		heading("Release pose"),
		note("Turns the prop from its authored pose into the world, about world x, then y, then z."),
		t.orient[0], t.orient[1], t.orient[2],
		widget.NewSeparator(),
		heading("World and timing"),
		t.ground, t.gravity,
		container.NewBorder(nil, nil, widget.NewLabel("frame rate"), widget.NewLabel("fps"), t.fps),
		t.custom,
		t.twos,
	)
}

// onTwos reports whether the preview holds each pose for two frames.
func (t *throwPanel) onTwos() bool { return t.twos.Selected == timingOnTwos }

// towardName returns the axis the tilt leans toward, as picked.
func (t *throwPanel) towardName() string {
	if t.toward.Selected != "" {
		return t.toward.Selected
	}
	return t.toward.Options[0]
}

// freeVec returns the free spin direction as the fields show it.
func (t *throwPanel) freeVec() project.Vec3 {
	return project.Vec3{t.freeF[0].Value(), t.freeF[1].Value(), t.freeF[2].Value()}
}

// pickAxis spins about a named principal axis or a free direction.
func (t *throwPanel) pickAxis(s string) {
	if s == "" || t.w.syncing > 0 {
		return
	}
	if s == axisFree {
		// Start from the direction the spin was about, tilt and all.
		start := project.Vec3{0, 0, 1}
		if sc := t.w.good.Scene; sc != nil {
			a := sc.Throw.SpinAxis(&sc.Mass)
			start = project.Vec3{a.X, a.Y, a.Z}
		}
		t.w.editAndSync("Spin about a free direction", func(d *project.Document) error {
			setFreeAxis(d, roundVec(start))
			return nil
		})
		return
	}
	t.w.editAndSync("Spin about the "+s+" axis", func(d *project.Document) error {
		setSpinAxis(d, s)
		return nil
	})
}

// roundVec rounds a direction to four decimals, so the file stays readable.
func roundVec(v project.Vec3) project.Vec3 {
	for i := range v {
		v[i] = math.Round(v[i]*1e4) / 1e4
	}
	return v
}

// pickRate sets the frame rate from the picker.
func (t *throwPanel) pickRate(s string) {
	if t.w.syncing > 0 || s == "" {
		return
	}
	if s == customRate {
		t.custom.SetText(frameRateText(t.w.ed.Doc().Throw.FPS))
		t.custom.Show()
		t.w.win.Canvas().Focus(t.custom)
		return
	}
	t.custom.Hide()
	for _, c := range rateChoices {
		if c.Label == s {
			r := c.Rate
			t.w.editAndSync("Change frame rate to "+s, func(d *project.Document) error {
				d.Throw.FPS = frameRateOf(r)
				return nil
			})
		}
	}
}

// typeRate sets a typed frame rate: a number ("12.5"; the rounded NTSC
// names such as 29.97 mean their exact 1000/1001 rates when the project
// is built) or a ratio such as 24000/1001, kept as the user wrote it.
// Text that is not a rate is kept too, so that the verdict panel names
// throw.fps and says what is wrong.
func (t *throwPanel) typeRate(text string) {
	text = strings.TrimSpace(text)
	t.w.editAndSync("Change frame rate to "+text, func(d *project.Document) error {
		if x, err := strconv.ParseFloat(text, 64); err == nil && !math.IsInf(x, 0) && !math.IsNaN(x) {
			d.Throw.FPS = &project.FrameRate{Number: x}
		} else {
			d.Throw.FPS = &project.FrameRate{Text: text}
		}
		return nil
	})
}

// sync sets the controls from the document.
func (t *throwPanel) sync(d *project.Document) {
	v := readThrow(d)
	if v.AxisName == "free" {
		t.axis.SetSelected(axisFree)
		t.named.Hide()
		t.free.Show()
		for k := range 3 {
			setValue(t.freeF[k], v.AxisVec[k])
		}
	} else {
		t.axis.SetSelected(v.AxisName)
		t.free.Hide()
		t.named.Show()
		t.toward.Options = otherAxes(v.AxisName)
		t.toward.SetSelected(v.TiltToward)
		setValue(t.tilt, v.TiltDeg)
	}
	if v.FramesPerTurn {
		t.rateMode.SetSelected(rateFrames)
		t.tps.Hide()
		t.fpt.Show()
		setValue(t.fpt, v.FramesPer)
	} else {
		t.rateMode.SetSelected(rateTurns)
		t.fpt.Hide()
		t.tps.Show()
		setValue(t.tps, v.TurnsPerSec)
	}
	t.showRateNote(v)
	if v.Mode == byHang {
		t.relMode.SetSelected(relHang)
		t.bySpeed.Hide()
		t.byHang.Show()
	} else {
		t.relMode.SetSelected(relSpeed)
		t.byHang.Hide()
		t.bySpeed.Show()
	}
	setValue(t.speed, v.Speed)
	setValue(t.angle, v.AngleDeg)
	setValue(t.hang, v.Hang)
	setValue(t.distance, v.Distance)
	setValue(t.heading, v.HeadingDeg)
	setValue(t.height, v.Height)
	setValue(t.ground, v.GroundY)
	for k := range 3 {
		setValue(t.orient[k], v.Orient[k])
	}
	setValue(t.gravity, v.Gravity)
	label := rateLabel(v.Rate)
	if v.RateErr || (label == customRate) {
		t.fps.SetSelected(customRate)
		t.custom.SetText(frameRateText(d.Throw.FPS))
		t.custom.Show()
	} else {
		t.fps.SetSelected(label)
		t.custom.Hide()
	}
}

// showRateNote says the spin rate the other way round.
func (t *throwPanel) showRateNote(v throwView) {
	switch {
	case v.TurnsPerSec == 0:
		t.rateNote.SetText("No spin: the prop keeps its release pose.")
	case v.FramesPerTurn:
		t.rateNote.SetText(sig(v.TurnsPerSec) + " turns per second at " + rateLabelText(v.Rate) + " fps.")
	default:
		t.rateNote.SetText("One turn every " + sig(v.FramesPer) + " frames at " + rateLabelText(v.Rate) + " fps.")
	}
}

// rateLabelText names a rate for a sentence: "24", "23.976".
func rateLabelText(r physics.Rate) string {
	if l := rateLabel(r); l != customRate {
		return l
	}
	return sig(r.FPS())
}

// setResult shows the release of a fresh result in the other form.
func (t *throwPanel) setResult(res editor.Result) {
	sc := res.Scene
	v := sc.Throw.Velocity
	g := sc.Throw.Gravity
	if sc.Throw.Velocity.Y > 0 {
		hang := 2 * v.Y / g
		t.relNote.SetText("Release velocity (" + sig(v.X) + ", " + sig(v.Y) + ", " + sig(v.Z) + ") m/s; back at release height after " +
			sig(hang) + " s, " + sig(math.Hypot(v.X, v.Z)*hang) + " m away.")
	} else {
		t.relNote.SetText("Release velocity (" + sig(v.X) + ", " + sig(v.Y) + ", " + sig(v.Z) + ") m/s; it does not rise.")
	}
}
