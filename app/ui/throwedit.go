package ui

import (
	"math"
	"strconv"

	"propflight/app/project"
	"propflight/physics"
)

// This file holds the edits the throw controls make to a
// project.Document. Speeds are m/s, angles degrees, times seconds,
// heights metres, gravity m/s^2.

// rateChoice is one entry of the frame-rate picker.
type rateChoice struct {
	Label string
	Rate  physics.Rate
}

// rateChoices are the frame rates of film, PAL and NTSC video and their
// doubles (common practice, no source), then "custom".
var rateChoices = []rateChoice{
	{"24", physics.Rate{Num: 24, Den: 1}},
	{"25", physics.Rate{Num: 25, Den: 1}},
	{"30", physics.Rate{Num: 30, Den: 1}},
	{"48", physics.Rate{Num: 48, Den: 1}},
	{"50", physics.Rate{Num: 50, Den: 1}},
	{"60", physics.Rate{Num: 60, Den: 1}},
	{"23.976", physics.Rate{Num: 24000, Den: 1001}},
	{"29.97", physics.Rate{Num: 30000, Den: 1001}},
}

// customRate is the picker entry that shows the typed-rate entry.
const customRate = "custom…"

// rateLabels returns the picker's entries.
func rateLabels() []string {
	out := make([]string, 0, len(rateChoices)+1)
	for _, c := range rateChoices {
		out = append(out, c.Label)
	}
	return append(out, customRate)
}

// rateLabel returns the picker entry of rate r, customRate if none.
func rateLabel(r physics.Rate) string {
	for _, c := range rateChoices {
		if c.Rate == r {
			return c.Label
		}
	}
	return customRate
}

// frameRateOf returns how the project file writes rate r: a number for a
// whole rate, else its ratio as text ("24000/1001").
func frameRateOf(r physics.Rate) *project.FrameRate {
	if r.Den == 1 {
		return &project.FrameRate{Number: float64(r.Num)}
	}
	return &project.FrameRate{Text: r.String()}
}

// frameRateText is the text the custom entry shows for the document's fps.
func frameRateText(fr *project.FrameRate) string {
	switch {
	case fr == nil:
		return project.DefaultFPS.String()
	case fr.IsText():
		return fr.Text
	}
	return strconv.FormatFloat(fr.Number, 'g', -1, 64)
}

// releaseMode says how the controls give the release velocity.
type releaseMode int

const (
	bySpeed releaseMode = iota // speed and angle in the x-y plane -> release_velocity
	byHang                     // hang time, distance and heading
)

// throwView is the throw as the controls show it, read from a document
// with the project's defaults filled in.
type throwView struct {
	Rate       physics.Rate
	RateErr    bool // fps does not parse: the custom entry shows the text
	Gravity    float64
	Height     float64 // release_position y
	GroundY    float64
	Mode       releaseMode
	Speed      float64 // |(vx, vy)|
	AngleDeg   float64 // atan2(vy, vx): 0 = along +x, 90 = straight up
	Hang       float64 // seconds
	Distance   float64
	HeadingDeg float64
	Orient     project.Vec3

	AxisName      string // "least", "middle", "greatest" or "free"
	AxisVec       project.Vec3
	TiltDeg       float64
	TiltToward    string
	FramesPerTurn bool    // the rate is given as frames per turn
	TurnsPerSec   float64 // turns per second (also when given as frames per turn)
	FramesPer     float64 // frames per turn (also when given as turns per second; 0 for no spin)
}

// readThrow returns the throw of d as the controls show it.
func readThrow(d *project.Document) throwView {
	t := &d.Throw
	v := throwView{Gravity: physics.StandardGravity, Height: project.DefaultReleasePosition[1]}
	r, err := d.Rate()
	v.Rate, v.RateErr = r, err != nil
	if err != nil {
		v.Rate = project.DefaultFPS
	}
	if t.Gravity != nil {
		v.Gravity = *t.Gravity
	}
	if t.ReleasePosition != nil {
		v.Height = t.ReleasePosition[1]
	}
	if t.GroundY != nil {
		v.GroundY = *t.GroundY
	}
	if t.OrientationDeg != nil {
		v.Orient = *t.OrientationDeg
	}
	switch {
	case t.HangTimeS != nil || t.HangFrames != nil:
		v.Mode = byHang
		if t.HangTimeS != nil {
			v.Hang = *t.HangTimeS
		} else {
			v.Hang = *t.HangFrames / v.Rate.FPS()
		}
		if t.Distance != nil {
			v.Distance = *t.Distance
		}
		if t.HeadingDeg != nil {
			v.HeadingDeg = *t.HeadingDeg
		}
		vel := physics.VelocityFromHang(v.Hang, v.Distance, v.HeadingDeg*math.Pi/180, v.Gravity)
		v.Speed, v.AngleDeg = math.Hypot(vel.X, vel.Y), math.Atan2(vel.Y, vel.X)*180/math.Pi
	default:
		vel := vecOr(t.ReleaseVelocity)
		v.Speed = math.Hypot(vel[0], vel[1])
		if v.Speed > 0 {
			v.AngleDeg = math.Atan2(vel[1], vel[0]) * 180 / math.Pi
		}
		v.Hang, v.Distance, v.HeadingDeg = hangOf(vel, v.Gravity)
	}
	v.AxisName, v.TiltToward = "greatest", "least"
	if s := t.Spin; s != nil {
		if s.Axis != nil {
			if s.Axis.Vector != nil {
				v.AxisName, v.AxisVec = "free", *s.Axis.Vector
			} else {
				v.AxisName = s.Axis.Name
			}
		}
		if v.AxisName == "least" {
			v.TiltToward = "middle"
		}
		if s.TiltToward != nil {
			v.TiltToward = *s.TiltToward
		}
		if s.TiltDeg != nil {
			v.TiltDeg = *s.TiltDeg
		}
		switch {
		case s.FramesPerTurn != nil:
			v.FramesPerTurn, v.FramesPer = true, *s.FramesPerTurn
			if v.FramesPer > 0 {
				v.TurnsPerSec = v.Rate.FPS() / v.FramesPer
			}
		case s.TurnsPerSecond != nil:
			v.TurnsPerSec = *s.TurnsPerSecond
			if v.TurnsPerSec > 0 {
				v.FramesPer = v.Rate.FPS() / v.TurnsPerSec
			}
		}
	}
	return v
}

// hangOf returns the hang time (s), distance (m) and heading (degrees) of
// release velocity vel under gravity g: the inverse of
// physics.VelocityFromHang. A throw that does not rise has no hang time;
// then it returns half a second and no distance, a starting point for the
// hang controls.
func hangOf(vel project.Vec3, g float64) (hang, dist, headingDeg float64) {
	if !(vel[1] > 0) || !(g > 0) {
		return 0.5, 0, 0
	}
	hang = 2 * vel[1] / g
	dist = math.Hypot(vel[0], vel[2]) * hang
	if dist > 0 {
		headingDeg = math.Atan2(-vel[2], vel[0]) * 180 / math.Pi
	}
	return hang, dist, headingDeg
}

// clearRelease removes every way the throw gives its release velocity.
func clearRelease(t *project.Throw) {
	t.ReleaseVelocity, t.HangTimeS, t.HangFrames, t.Distance, t.HeadingDeg = nil, nil, nil, nil, nil
}

// setSpeedAngle gives the release velocity as speed (m/s) at angleDeg
// above +x in the x-y plane, keeping any z velocity the file had.
func setSpeedAngle(d *project.Document, speed, angleDeg float64) {
	vz := 0.0
	if d.Throw.ReleaseVelocity != nil {
		vz = d.Throw.ReleaseVelocity[2]
	}
	s, c := math.Sincos(angleDeg * math.Pi / 180)
	clearRelease(&d.Throw)
	d.Throw.ReleaseVelocity = &project.Vec3{speed * c, speed * s, vz}
}

// setHang gives the release by hang time (s), distance (m) and heading
// (degrees).
func setHang(d *project.Document, hang, dist, headingDeg float64) {
	clearRelease(&d.Throw)
	d.Throw.HangTimeS, d.Throw.Distance, d.Throw.HeadingDeg = ptrTo(hang), ptrTo(dist), ptrTo(headingDeg)
}

// setReleaseMode switches the document between the two ways of giving the
// release, converting so that the throw stays the same.
func setReleaseMode(d *project.Document, m releaseMode) {
	v := readThrow(d)
	if m == byHang {
		setHang(d, v.Hang, v.Distance, v.HeadingDeg)
		return
	}
	if v.Mode == bySpeed {
		return
	}
	vel := physics.VelocityFromHang(v.Hang, v.Distance, v.HeadingDeg*math.Pi/180, v.Gravity)
	clearRelease(&d.Throw)
	d.Throw.ReleaseVelocity = &project.Vec3{vel.X, vel.Y, vel.Z}
}

// ensureSpin returns the document's spin, adding a still one (greatest
// axis, no turns) when the throw has none.
func ensureSpin(d *project.Document) *project.Spin {
	if d.Throw.Spin == nil {
		d.Throw.Spin = &project.Spin{Axis: &project.SpinAxis{Name: "greatest"}, TurnsPerSecond: ptrTo(0.0)}
	}
	return d.Throw.Spin
}

// axisNames are the named principal axes in order of moment.
var axisNames = []string{"least", "middle", "greatest"}

// otherAxes returns the two named axes other than axis.
func otherAxes(axis string) []string {
	var out []string
	for _, a := range axisNames {
		if a != axis {
			out = append(out, a)
		}
	}
	return out
}

// setSpinAxis makes the spin about the named axis ("least", "middle",
// "greatest"). A tilt toward the new axis itself is moved to the first
// other axis, since a tilt must lean toward a different one.
func setSpinAxis(d *project.Document, name string) {
	s := ensureSpin(d)
	s.Axis = &project.SpinAxis{Name: name}
	if s.TiltToward != nil && *s.TiltToward == name {
		s.TiltToward = ptrTo(otherAxes(name)[0])
	}
}

// setFreeAxis makes the spin about the prop-frame direction vec; a free
// axis takes no tilt.
func setFreeAxis(d *project.Document, vec project.Vec3) {
	s := ensureSpin(d)
	s.Axis = &project.SpinAxis{Vector: &vec}
	s.TiltDeg, s.TiltToward = nil, nil
}

// setTilt tilts a named spin axis by deg toward the named axis toward.
func setTilt(d *project.Document, deg float64, toward string) {
	s := ensureSpin(d)
	s.TiltDeg, s.TiltToward = ptrTo(deg), ptrTo(toward)
}

// setRateMode switches the spin rate between turns per second and frames
// per turn, converting at the document's frame rate. A still prop (0
// turns per second) has no frames per turn: it starts from one turn a
// second.
func setRateMode(d *project.Document, framesPerTurn bool) {
	v := readThrow(d)
	s := ensureSpin(d)
	switch {
	case framesPerTurn && v.TurnsPerSec > 0:
		s.TurnsPerSecond, s.FramesPerTurn = nil, ptrTo(v.Rate.FPS()/v.TurnsPerSec)
	case framesPerTurn:
		s.TurnsPerSecond, s.FramesPerTurn = nil, ptrTo(v.Rate.FPS())
	case s.FramesPerTurn != nil:
		s.TurnsPerSecond, s.FramesPerTurn = ptrTo(v.TurnsPerSec), nil
	}
}

// setReleaseHeight sets the y of release_position (m), keeping x and z.
func setReleaseHeight(d *project.Document, y float64) {
	p := project.DefaultReleasePosition
	if d.Throw.ReleasePosition != nil {
		p = *d.Throw.ReleasePosition
	}
	p[1] = y
	d.Throw.ReleasePosition = &p
}
