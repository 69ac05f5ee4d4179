package physics

import (
	"math"

	"gonum.org/v1/gonum/mathext"
	"gonum.org/v1/gonum/spatial/r3"
)

// Motion is the verdict's word for how a throw turns.
type Motion int

const (
	Spinning Motion = iota // a steady spin about the least or greatest axis (or a symmetric body end over end)
	Tumbling               // an irregular end-over-end flipping: the spin is too near the middle axis
	Wobbling               // a symmetric body whose axis circles the angular momentum at a rate locked to the spin
)

// String returns "spin", "tumble" or "wobble".
func (m Motion) String() string {
	switch m {
	case Tumbling:
		return "tumble"
	case Wobbling:
		return "wobble"
	}
	return "spin"
}

// Thresholds are the three adjustable numbers of the verdict rules.
type Thresholds struct {
	SymmetryTol  float64 // relative difference under which two moments count as equal (0.01)
	TumbleDeg    float64 // excursion at or above which an asymmetric body tumbles (45)
	WobbleMinDeg float64 // a symmetric body wobbles when this <= theta <= 90 - this (0.5)
}

// DefaultThresholds returns the verdict thresholds of DESIGN.md.
func DefaultThresholds() Thresholds {
	return Thresholds{SymmetryTol: DefaultSymmetryTol, TumbleDeg: 45, WobbleMinDeg: 0.5}
}

// Verdict classifies the rotation of a throw and carries its numbers.
// Durations are in seconds; frames count from release (frame 0).
type Verdict struct {
	Symmetry Symmetry
	Motion   Motion
	// Circles is the principal axis the motion circles: the least or
	// greatest axis of an asymmetric body, the symmetry axis (Least for
	// prolate, Greatest for oblate) of a symmetric one.
	Circles      Axis
	ExcursionDeg float64 // largest angle between L and Circles over the motion

	L      float64    // |L|, kg m^2/s
	Energy float64    // rotational kinetic energy, J
	D      float64    // L^2 / (2E), kg m^2; compare with I2
	Omega0 r3.Vec     // angular velocity at release, principal frame, rad/s
	Moment [3]float64 // principal moments used

	// The spin-to-wobble ratio (DESIGN.md, verdict rules): the mean rate at
	// which the circled axis goes round L (PrecessionRate, rad/s), the mean
	// rate of turn about it (AxialRate, omega . axis, rad/s) and their ratio
	// (WobblesPerTurn). For a symmetric body the rates are constant:
	// L / I_perp and |omega . axis|; for an asymmetric one they are means
	// over one polhode period (ratio.go). HasRatio is false for a tumble,
	// for a symmetric body end over end (theta > 90 - WobbleMinDeg) and for
	// no spin.
	HasRatio       bool
	PrecessionRate float64
	AxialRate      float64
	WobblesPerTurn float64

	// Symmetric bodies that wobble: the ratio to the Euler-angle spin
	// (1 - r) omega3 as well (REFERENCES.md §2.1). HasWobble is false
	// otherwise.
	HasWobble           bool
	WobblesPerEulerTurn float64

	// Tumble: time between flips of the middle axis (half the polhode
	// period, Landau & Lifshitz §37; +Inf on the separatrix) and the first
	// flip after release. HasFlip is false when not a tumble.
	HasFlip        bool
	FlipPeriod     float64
	FirstFlip      float64
	FirstFlipFound bool // false if no flip happens (exactly on the middle axis)

	// Near-middle-axis spin of an asymmetric body: growth rate of the
	// linearised perturbation (REFERENCES.md §3.4) and the time at which the
	// initial offset from the middle axis has grown to one radian.
	HasOnset   bool
	GrowthRate float64
	Onset      float64
}

// NearMiddleDeg is how close to the middle axis (degrees) a release spin of
// an asymmetric body must be for the verdict to predict an onset time.
const NearMiddleDeg = 30.0

// Judge returns the verdict for throwing a body with mass properties mp by
// th, under the thresholds thr.
func Judge(mp *MassProps, th *Throw, thr Thresholds) Verdict {
	wp := th.Omega(mp)
	w := r3.Vec{X: r3.Dot(wp, mp.Axes[0]), Y: r3.Dot(wp, mp.Axes[1]), Z: r3.Dot(wp, mp.Axes[2])}
	return judgeOmega(mp.Moments, SymmetryOf(mp.Moments, thr.SymmetryTol), w, thr, true)
}

// judgeOmega judges the release angular velocity w (principal frame,
// rad/s) of a body with principal moments I and symmetry sym. With full
// false it leaves out the tumble's flip times and the onset (the axis map
// needs only the class, excursion and ratio; the flip time integrates).
func judgeOmega(I [3]float64, sym Symmetry, w r3.Vec, thr Thresholds, full bool) Verdict {
	v := Verdict{Moment: I, Symmetry: sym}
	v.Omega0 = w
	l := r3.Vec{X: I[0] * w.X, Y: I[1] * w.Y, Z: I[2] * w.Z}
	v.L = r3.Norm(l)
	v.Energy = 0.5 * (I[0]*w.X*w.X + I[1]*w.Y*w.Y + I[2]*w.Z*w.Z)
	v.Circles = Greatest
	if v.L == 0 {
		v.Motion = Spinning
		return v
	}
	// D, the excursion and the wobble ratio depend only on the direction
	// of omega, and times scale as 1/|omega|: work with the unit direction
	// so that a tiny rate (omega^2 underflowing) gives no NaN.
	wn := r3.Norm(w)
	lu := r3.Scale(1/wn, l)
	v.D = r3.Norm2(lu) / r3.Dot(lu, r3.Scale(1/wn, w))
	switch v.Symmetry {
	case Spherical:
		// Every axis is principal: the spin axis itself is the circled
		// one, turning at |omega| about L with no precession to speak of.
		// Ratio 1, the common limit of both near-axis formulas as the
		// moments become equal (REFERENCES.md §10).
		v.Motion = Spinning
		v.HasRatio = true
		v.PrecessionRate, v.AxialRate, v.WobblesPerTurn = wn, wn, 1
	case Prolate, Oblate:
		judgeSymmetric(&v, l, thr)
	default:
		judgeAsymmetric(&v, lu, wn, thr, full)
	}
	return v
}

func judgeSymmetric(v *Verdict, l r3.Vec, thr Thresholds) {
	I := v.Moment
	var lAxis, iAxis, iPerp float64
	if v.Symmetry == Oblate {
		v.Circles, lAxis, iAxis, iPerp = Greatest, l.Z, I[2], (I[0]+I[1])/2
	} else {
		v.Circles, lAxis, iAxis, iPerp = Least, l.X, I[0], (I[1]+I[2])/2
	}
	theta := math.Acos(math.Min(1, math.Abs(lAxis)/v.L)) * 180 / math.Pi
	v.ExcursionDeg = theta
	if theta > 90-thr.WobbleMinDeg {
		v.Motion = Spinning // end over end: no wobble ratio
		return
	}
	v.HasRatio = true
	v.PrecessionRate = v.L / iPerp
	v.AxialRate = math.Abs(lAxis) / iAxis
	v.WobblesPerTurn = v.PrecessionRate / v.AxialRate
	if theta < thr.WobbleMinDeg {
		v.Motion = Spinning
		return
	}
	v.Motion = Wobbling
	v.HasWobble = true
	r := iAxis / iPerp
	if r != 1 {
		v.WobblesPerEulerTurn = v.PrecessionRate / (math.Abs(1-r) * v.AxialRate)
	}
}

// judgeAsymmetric judges an asymmetric body from lu, the body angular
// momentum per unit |omega| (I omega / |omega|), and the rate wn = |omega|.
func judgeAsymmetric(v *Verdict, lu r3.Vec, wn float64, thr Thresholds, full bool) {
	I := v.Moment
	D := v.D
	v.Circles, v.ExcursionDeg = asymmetricExcursion(I, D)

	// Onset of a near-middle-axis spin, from the linearised growth rate
	// lambda = Omega sqrt((I2-I1)(I3-I2)/(I1 I3)).
	w := v.Omega0
	off := math.Acos(math.Min(1, math.Abs(w.Y)/wn))
	if full && off*180/math.Pi < NearMiddleDeg {
		v.HasOnset = true
		v.GrowthRate = math.Abs(w.Y) * math.Sqrt((I[1]-I[0])*(I[2]-I[1])/(I[0]*I[2]))
		if off > 0 {
			v.Onset = math.Max(0, math.Log(1/off)/v.GrowthRate)
		} else {
			v.Onset = math.Inf(1)
		}
	}

	if v.ExcursionDeg < thr.TumbleDeg {
		v.Motion = Spinning
		if p, a, _, ok := asymmetricRatio(I, lu); ok {
			v.HasRatio = true
			v.PrecessionRate, v.AxialRate = p*wn, a*wn
			v.WobblesPerTurn = p / a
		}
		return
	}
	v.Motion = Tumbling
	if !full {
		return
	}
	v.HasFlip = true
	// The unit-rate motion, then times scaled by 1/|omega|.
	half := PolhodePeriod(I, r3.Norm2(lu), r3.Dot(lu, r3.Vec{X: lu.X / I[0], Y: lu.Y / I[1], Z: lu.Z / I[2]})) / 2
	v.FlipPeriod = half / wn
	first, ok := firstFlip(I, lu, half)
	v.FirstFlip, v.FirstFlipFound = first/wn, ok
}

// asymmetricExcursion returns the axis an asymmetric body (I ascending,
// distinct) circles for D = L^2/(2E) (Least when D < I2) and the largest
// angle between L and that axis over the motion, in degrees: the point
// where the polhode crosses the plane of the middle axis, from |L|^2 and
// 2E = sum L_i^2 / I_i (see verdict_test.go and ratio_test.go).
func asymmetricExcursion(I [3]float64, D float64) (Axis, float64) {
	var c2 float64
	circles := Greatest
	if D < I[1] {
		circles = Least
		c2 = I[0] * (I[1] - D) / (D * (I[1] - I[0]))
	} else {
		c2 = I[2] * (D - I[1]) / (D * (I[2] - I[1]))
	}
	c2 = math.Max(0, math.Min(1, c2))
	return circles, math.Acos(math.Sqrt(c2)) * 180 / math.Pi
}

// PolhodePeriod returns the period T of the body-frame angular velocity of a
// free asymmetric top with principal moments I (ascending), squared angular
// momentum l2 and twice the energy e2 (Landau & Lifshitz, Mechanics, §37):
//
//	L^2 > 2E I2:  T = 4 K(k) sqrt(I1 I2 I3 / ((I3-I2)(L^2 - 2E I1))),
//	              k^2 = (I2-I1)(2E I3 - L^2) / ((I3-I2)(L^2 - 2E I1))
//	L^2 < 2E I2:  the same with the indices 1 and 3 swapped.
//
// K is gonum's mathext.CompleteK, which takes the parameter m = k^2. On the
// separatrix L^2 = 2E I2 the period is +Inf.
func PolhodePeriod(I [3]float64, l2, e2 float64) float64 {
	i1, i2, i3 := I[0], I[1], I[2]
	var k2, denom float64
	if l2 > e2*i2 {
		denom = (i3 - i2) * (l2 - e2*i1)
		k2 = (i2 - i1) * (e2*i3 - l2) / denom
	} else {
		denom = (i2 - i1) * (e2*i3 - l2)
		k2 = (i3 - i2) * (l2 - e2*i1) / denom
	}
	if k2 >= 1 || denom <= 0 {
		return math.Inf(1)
	}
	return 4 * mathext.CompleteK(math.Max(0, k2)) * math.Sqrt(i1*i2*i3/denom)
}

// firstFlip integrates Euler's equations from body angular momentum l until
// the middle-axis component L2 first changes sign, searching up to two flip
// periods ahead; it returns that time and whether one was found.
func firstFlip(I [3]float64, l r3.Vec, halfPeriod float64) (float64, bool) {
	if math.IsInf(halfPeriod, 1) || math.IsNaN(halfPeriod) {
		return 0, false
	}
	rot := newRotor(I)
	s := body{L: l, Q: identity}
	horizon := 2.2 * halfPeriod
	n := rot.substeps(l, horizon)
	h := horizon / float64(n)
	sign := math.Copysign(1, l.Y)
	if l.Y == 0 {
		// Starting on the crossing itself: take the sign just after it.
		sign = math.Copysign(1, rot.step(s, h).L.Y)
	}
	st := stepper{rot: &rot, h: h}
	for i := range n {
		next := st.next(s)
		if next.L.Y*sign < 0 {
			ta := float64(i) * h
			g := func(t float64) float64 { return rot.step(s, t).L.Y * sign }
			a, b := 0.0, h
			for range 200 {
				c := (a + b) / 2
				if g(c) > 0 {
					a = c
				} else {
					b = c
				}
				if b-a < 1e-14*(ta+h) {
					break
				}
			}
			return ta + (a+b)/2, true
		}
		s = next
	}
	return 0, false
}
