package ui

import (
	"fmt"
	"math"
	"strconv"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/editor"
	"propflight/internal/units"
	"propflight/physics"
)

// report is the verdict panel's text for one result: a headline, the
// reason in plain words, and rows of numbers.
type report struct {
	Motion   string // "spin", "tumble", "wobble"; "" when there is no verdict
	Headline string // "It tumbles."
	Why      string // why, naming the axis and the order of the moments
	Rows     []row
	Err      string // the project's error, naming the field; "" if none
}

type row struct{ Label, Value string }

// verdictReport describes result res. Frames count from release (frame 0)
// at the throw's rate; times are seconds; mass, centre of mass and moments
// are in kg, m and kg m^2, or with imperial in lb, in and lb in^2.
func verdictReport(res editor.Result, imperial bool) report {
	var r report
	if res.Err != nil {
		r.Err = res.Err.Error()
	}
	if res.Scene == nil {
		return r
	}
	sc := res.Scene
	v := res.Verdict
	rate := sc.Throw.FPS
	r.Motion = v.Motion.String()
	r.Headline, r.Why = explain(v, sc.Throw.Spin, &sc.Mass, res.Thresholds)

	mp := &sc.Mass
	add := func(label, format string, args ...any) {
		r.Rows = append(r.Rows, row{label, fmt.Sprintf(format, args...)})
	}
	add("motion", "%s", r.Motion)
	massUnit, lenUnit, momUnit, mass, length := "kg", "m", "kg·m²", 1.0, 1.0
	if imperial {
		massUnit, lenUnit, momUnit, mass, length = "lb", "in", "lb·in²", 1/units.Pound.Float(), 1/units.Inch.Float()
	}
	add("mass", "%s %s", sig(mp.Mass*mass), massUnit)
	add("centre of mass", "(%s, %s, %s) %s", fixed(mp.CM.X*length), fixed(mp.CM.Y*length), fixed(mp.CM.Z*length), lenUnit)
	for i, name := range axisNames {
		a := mp.Axes[i]
		add(name+" axis", "I%d = %s %s  along (%s, %s, %s)", i+1, sig(mp.Moments[i]*mass*length*length), momUnit, dir2(a.X), dir2(a.Y), dir2(a.Z))
	}
	add("symmetry", "%s (%s)", v.Symmetry, ordering(v.Symmetry))
	add("excursion", "%s° from the %s axis", sig(v.ExcursionDeg), v.Circles)
	if v.HasRatio {
		add("spin : wobble", "1 : %s (against the turn about the %s axis)", sig3(v.WobblesPerTurn), v.Circles)
		period := 2 * math.Pi / v.PrecessionRate
		add("wobble", "one every %s frames (%s s)", sig3(period*rate.FPS()), sig3(period))
		if v.HasWobble && v.WobblesPerEulerTurn > 0 {
			add("Euler spin : wobble", "1 : %s (against the Euler-angle spin)", sig3(v.WobblesPerEulerTurn))
		}
	}
	if v.HasFlip {
		if math.IsInf(v.FlipPeriod, 1) {
			add("flip period", "never repeats (exactly on the boundary)")
		} else {
			add("flip period", "%s frames (%s s)", sig3(v.FlipPeriod*rate.FPS()), sig3(v.FlipPeriod))
		}
		if v.FirstFlipFound {
			add("first flip", "frame %d (%s s)", rate.FrameAtOrAfter(v.FirstFlip), sig3(v.FirstFlip))
		} else {
			add("first flip", "none found")
		}
	}
	if v.HasOnset {
		if math.IsInf(v.Onset, 1) {
			add("flip onset", "never (the spin is exactly on the middle axis)")
		} else {
			add("flip onset", "frame %d (%s s), predicted", rate.FrameAtOrAfter(v.Onset), sig3(v.Onset))
		}
	}
	if tk := res.Take; tk != nil {
		add("flight", "%d frames (%s s)", tk.LandingFrame+1, sig3(tk.FlightTime))
		add("apex", "frame %d (%s)", tk.ApexFrame, rate.Timecode(tk.ApexFrame))
		add("landing", "frame %d (%s)", tk.LandingFrame, rate.Timecode(tk.LandingFrame))
	}
	return r
}

// explain returns the headline and the reason for verdict v of a throw
// with spin s, in words a newcomer follows: which axis, the ordering of
// the moments and what that means for the motion.
func explain(v physics.Verdict, s physics.Spin, mp *physics.MassProps, thr physics.Thresholds) (headline, why string) {
	order := ordering(v.Symmetry)
	if v.L == 0 {
		return "It does not turn.", "The spin rate is zero, so the prop keeps its release pose all the way down."
	}
	asked := spinWords(s, mp)
	switch v.Symmetry {
	case physics.Spherical:
		return "It spins steadily.", fmt.Sprintf("All three moments are equal (%s), so every axis is stable: it keeps turning about the axis you gave it.", order)
	case physics.Prolate, physics.Oblate:
		shape, axis := "long and round (prolate)", "least"
		if v.Symmetry == physics.Oblate {
			shape, axis = "flat and round (oblate)", "greatest"
		}
		switch v.Motion {
		case physics.Wobbling:
			return "It wobbles.", fmt.Sprintf("It wobbles: the prop is %s, symmetric about its %s axis (%s), and you spun it %s, which leaves its angular momentum %s° off that axis. "+
				"The symmetry axis circles round steadily, %s wobbles for every turn; a symmetric prop never tumbles.",
				shape, axis, order, asked, sig(v.ExcursionDeg), sig3(v.WobblesPerTurn))
		case physics.Spinning:
			if v.ExcursionDeg < 45 {
				return "It spins cleanly.", fmt.Sprintf("It spins cleanly: the prop is %s, symmetric about its %s axis (%s), and you spun it %s, within %s° of that axis: too little for a wobble to show.",
					shape, axis, order, asked, sig(thr.WobbleMinDeg))
			}
			return "It turns end over end.", fmt.Sprintf("It turns end over end: the prop is %s (%s) and you spun it %s, square to its symmetry axis within %s°. For a symmetric prop that is steady.",
				shape, order, asked, sig(thr.WobbleMinDeg))
		}
	}
	switch v.Motion {
	case physics.Tumbling:
		near, _ := nearestAxis(s, mp)
		switch {
		case s.Axis == physics.Middle:
			why = fmt.Sprintf("It tumbles: you spun it about its middle axis (%s), which is unstable — small errors grow and it flips end over end.", order)
			if s.Tilt != 0 {
				why += fmt.Sprintf(" Here the small error is the %s° tilt toward the %s axis.", sig(math.Abs(s.Tilt)*180/math.Pi), s.TiltToward)
			}
		case near == physics.Middle:
			why = fmt.Sprintf("It tumbles: you spun it %s (%s), which is unstable — small errors grow and it flips end over end.", asked, order)
		default:
			why = fmt.Sprintf("It tumbles: you spun it %s, too far from the %s axis to stay near it (%s). The turning axis swings %s° away, past the middle axis, so the prop flips end over end.",
				asked, v.Circles, order, sig(v.ExcursionDeg))
		}
		return "It tumbles.", why
	default:
		if s.Axis == v.Circles && s.Tilt == 0 {
			why = fmt.Sprintf("It spins steadily: you spun it about its %s axis (%s), which is stable — it keeps turning about the same line.", v.Circles, order)
		} else {
			why = fmt.Sprintf("It spins steadily: you spun it %s, close enough to the %s axis (%s), which is stable — the turning axis stays within %s° of it.",
				asked, v.Circles, order, sig(v.ExcursionDeg))
		}
		if v.HasOnset {
			why += " The spin is near the unstable middle axis, though: a bigger tilt would make it tumble."
		}
		return "It spins.", why
	}
}

// spinWords says how the prop was spun: "about its middle axis tilted 3°
// toward the least axis", or for a free direction the principal axis it is
// nearest to.
func spinWords(s physics.Spin, mp *physics.MassProps) string {
	if s.Axis != physics.Free {
		w := "about its " + s.Axis.String() + " axis"
		if s.Tilt != 0 {
			w += fmt.Sprintf(" tilted %s° toward the %s axis", sig(math.Abs(s.Tilt)*180/math.Pi), s.TiltToward)
		}
		return w
	}
	best, ang := nearestAxis(s, mp)
	if ang < 0.05 {
		return "about its " + best.String() + " axis"
	}
	return fmt.Sprintf("about a direction %s° from its %s axis", sig(ang), best)
}

// nearestAxis returns the principal axis nearest the spin direction and
// the angle to it in degrees (a named axis is its own, tilt and all).
func nearestAxis(s physics.Spin, mp *physics.MassProps) (physics.Axis, float64) {
	if s.Axis != physics.Free {
		return s.Axis, math.Abs(s.Tilt) * 180 / math.Pi
	}
	u := r3.Unit(s.Vector)
	best, bestCos := physics.Least, -1.0
	for i, a := range mp.Axes {
		if c := math.Abs(r3.Dot(u, a)); c > bestCos {
			best, bestCos = physics.Axis(i), c
		}
	}
	return best, math.Acos(math.Min(1, bestCos)) * 180 / math.Pi
}

// ordering writes the order of the principal moments for symmetry s.
func ordering(s physics.Symmetry) string {
	switch s {
	case physics.Prolate:
		return "I1 < I2 ≈ I3"
	case physics.Oblate:
		return "I1 ≈ I2 < I3"
	case physics.Spherical:
		return "I1 ≈ I2 ≈ I3"
	}
	return "I1 < I2 < I3"
}

// sig formats x with up to four significant digits, without exponent for
// everyday sizes.
func sig(x float64) string {
	if x == 0 {
		return "0" // also for -0
	}
	if x != 0 && (math.Abs(x) < 1e-3 || math.Abs(x) >= 1e6) {
		return strconv.FormatFloat(x, 'e', 3, 64)
	}
	return strconv.FormatFloat(x, 'g', 4, 64)
}

// sig3 formats x with three significant digits, keeping trailing zeros
// ("2.00") so that ratios line up.
func sig3(x float64) string {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return strconv.FormatFloat(x, 'g', 3, 64)
	}
	d := 2 - int(math.Floor(math.Log10(math.Abs(x))))
	if d < 0 {
		d = 0
	}
	return strconv.FormatFloat(x, 'f', d, 64)
}

// dir2 formats a direction component to two decimals, never "-0.00".
func dir2(x float64) string {
	s := strconv.FormatFloat(x, 'f', 2, 64)
	if s == "-0.00" {
		s = "0.00"
	}
	return s
}

// fixed formats a coordinate in metres to the millimetre.
func fixed(x float64) string {
	s := strconv.FormatFloat(x, 'f', 3, 64)
	if s == "-0.000" {
		s = "0.000"
	}
	return s
}

// flipFrames returns the frames nearest each flip of a tumble during the
// flight: FirstFlip + k FlipPeriod seconds, k = 0, 1, ..., up to the
// landing frame.
func flipFrames(v physics.Verdict, tk *physics.Take, rate physics.Rate) []int {
	if !v.HasFlip || !v.FirstFlipFound || tk == nil || !(v.FlipPeriod > 0) || math.IsInf(v.FlipPeriod, 1) {
		return nil
	}
	var out []int
	for k := 0; ; k++ {
		t := v.FirstFlip + float64(k)*v.FlipPeriod
		if t > tk.FlightTime {
			break
		}
		n := rate.Nearest(t)
		if n > tk.LandingFrame {
			break
		}
		if len(out) == 0 || out[len(out)-1] != n {
			out = append(out, n)
		}
		if k > 10000 {
			break
		}
	}
	return out
}
