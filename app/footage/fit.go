package footage

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"

	"propflight/internal/mark"
)

// Ranges of the fit's inputs and of what it solves. They keep every
// derived number finite and physical, so that no report shows +Inf, NaN or
// 0 fps.
const (
	MaxFitFPS = 10000 // frames per second, as physics.Rate
	// MinFitGravity and MaxFitGravity bound a gravity given or solved,
	// m/s^2; the project file's throw.gravity has the same range.
	MinFitGravity = 0.01
	MaxFitGravity = 1000
	// MinMetresPerPixel and MaxMetresPerPixel bound a scale given or
	// solved: a nanometre to a kilometre per pixel.
	MinMetresPerPixel = 1e-9
	MaxMetresPerPixel = 1e3
)

// FitOptions are what is known about the footage besides the marks.
type FitOptions struct {
	// FPS is the footage's frame rate, frames per second, > 0. It may be
	// zero only when MetresPerPixel and Gravity are both given: then the
	// frame rate is solved (FitResult.SolvedFPS).
	FPS float64
	// Gravity is the free-fall acceleration, m/s^2 (physics.StandardGravity
	// on Earth); 0 means unknown, and then no scale comes out of the fit.
	Gravity float64
	// MetresPerPixel is an optional known scale of the flight plane, m/px
	// (from a ruler in the shot). 0 means unknown.
	MetresPerPixel float64
}

// FitResult is what Fit finds in the marks. Frame numbers n are those of
// the marks (footage frames); pixel coordinates have y down as in the
// image except where a field says y up. A value that the marks or the
// options cannot give is NaN.
type FitResult struct {
	Marks                 int // marks used for the centre fit
	FirstFrame, LastFrame int // first and last marked frame

	// Y holds c0, c1, c2 of the centre's image y(n) = c0 + c1 n + c2 n^2
	// (px, px/frame, px/frame^2; y down), X holds d0, d1 of x(n) = d0 +
	// d1 n (px, px/frame).
	Y [3]float64
	X [2]float64

	// GravityPxPerFrame2 is 2 c2, the fall acceleration in the image,
	// px/frame^2 (positive: down the image).
	GravityPxPerFrame2 float64
	// FPS is the frame rate the SI results use: FitOptions.FPS, or
	// SolvedFPS when that was not given.
	FPS float64
	// MetresPerPixel is the scale g / (2 c2 f^2), m/px, when the gravity is
	// known (with the frame rate given, or solved from a given scale, in
	// which case it is that scale); NaN without gravity.
	MetresPerPixel float64
	// SolvedFPS is the frame rate sqrt(g / (2 c2 s)) that makes the arc
	// fall at gravity g with the given scale s, frames per second; NaN
	// unless FitOptions gave both MetresPerPixel and Gravity.
	SolvedFPS float64
	// SolvedGravity is the gravity 2 c2 f^2 s that the arc shows with the
	// given frame rate f and scale s, m/s^2; NaN unless FitOptions gave
	// FPS and MetresPerPixel but no Gravity. Far from 9.8 it says the
	// footage was slowed down or sped up, or the scale is wrong.
	SolvedGravity float64
	// ReleaseVelocityPxPerFrame is the centre's velocity [vx, vy] at the
	// first marked frame with y UP: vx = d1, vy = -(c1 + 2 c2 n0), px/frame.
	ReleaseVelocityPxPerFrame [2]float64
	// ApexFrame is the frame of the top of the arc, -c1 / (2 c2), a
	// fraction of a frame; it may lie outside the marked frames.
	ApexFrame float64
	// RMSPx is the root mean square, over the marks, of the distance
	// between each marked centre and the fitted one (both axes), px; NaN
	// with only 3 marks, which the parabola fits exactly.
	RMSPx float64

	// HasTurn says whether at least 3 marks have a second point, which
	// the turn fields need (see turn.go for how they are found).
	HasTurn   bool
	TurnMarks int // marks with a second point
	// TurnDegPerFrame is the slope of the unwrapped prop-line angle over
	// frames, degrees per frame, counter-clockwise positive on the screen.
	TurnDegPerFrame float64
	// TurnRMSDeg is the RMS residual of that line fit, degrees.
	TurnRMSDeg float64
	// Hint is "steady" or "irregular" (the rule is at SteadyMaxRMSDeg); ""
	// without a turn.
	Hint string
}

// MinFitMarks is the fewest marks Fit accepts: a parabola has three
// coefficients. One more is needed for a residual.
const MinFitMarks = 3

// Fit fits the marks' centres with a least-squares parabola in y and a
// straight line in x over the frame number, and their second points (when
// at least 3 marks have one) with a straight line of angle over frames.
// See [FitResult] for what comes out.
//
// The fits solve the overdetermined Vandermonde system A c = v in the
// least-squares sense by QR (gonum mat.VecDense.SolveVec), never by the
// normal equations, which square the condition number, and with the frame
// axis centred on the mean marked frame and scaled by half the marked span
// for conditioning (J. Kiusalaas, Numerical Methods in Engineering with
// Python, §3.4 "Least-Squares Fit"; W. H. Press et al., Numerical Recipes
// 3rd ed., §15.4 "General Linear Least Squares"). The scale follows from
// the fall's acceleration, g / s in px/s^2 and 2 c2 f^2 as fitted, so
// s = g / (2 c2 f^2) (REFERENCES.md §6), valid when the flight plane faces
// the camera, the lens does not distort and the camera holds still; drag
// is neglected.
//
// Errors: fewer than 3 marks, marks that do not curve downward (c2 <= 0:
// image y grows downward, so a real throw has c2 > 0), a frame marked
// twice, bad options, or a second point on its centre.
func Fit(marks []mark.Mark, opt FitOptions) (*FitResult, error) {
	if err := opt.check(); err != nil {
		return nil, err
	}
	s, err := sortedMarks(marks)
	if err != nil {
		return nil, err
	}
	if len(s) < MinFitMarks {
		return nil, &Error{Field: "marks", Msg: fmt.Sprintf("need at least %d marked frames to fit the arc (4 or more also give a residual); there are %d", MinFitMarks, len(s))}
	}
	nan := math.NaN()
	r := &FitResult{Marks: len(s), FirstFrame: s[0].Frame, LastFrame: s[len(s)-1].Frame,
		FPS: nan, MetresPerPixel: nan, SolvedFPS: nan, SolvedGravity: nan, RMSPx: nan,
		TurnDegPerFrame: nan, TurnRMSDeg: nan}

	n := make([]float64, len(s))
	xs := make([]float64, len(s))
	ys := make([]float64, len(s))
	for i, m := range s {
		n[i], xs[i], ys[i] = float64(m.Frame), m.X, m.Y
	}
	ax := newAxis(n)
	a, err := ax.fit(ys, 2)
	if err != nil {
		return nil, err
	}
	b, err := ax.fit(xs, 1)
	if err != nil {
		return nil, err
	}
	r.Y = ax.raw2(a)
	r.X = ax.raw1(b)
	c2 := r.Y[2]
	if !(c2 > 0) {
		return nil, &Error{Field: "marks", Msg: fmt.Sprintf("the marks do not curve downward (c2 = %.4g px/frame^2; image y grows down, so a thrown prop has c2 > 0): check the frame numbers and that the prop is in free flight", c2)}
	}
	r.GravityPxPerFrame2 = 2 * c2

	n0 := n[0]
	r.ReleaseVelocityPxPerFrame = [2]float64{b[1] / ax.half, -ax.slope2(a, n0)}
	r.ApexFrame = ax.mean - a[1]*ax.half/(2*a[2])
	if len(s) > MinFitMarks {
		var sum float64
		for i := range s {
			dy := ys[i] - ax.eval(a, n[i])
			dx := xs[i] - ax.eval(b, n[i])
			sum += dx*dx + dy*dy
		}
		r.RMSPx = math.Sqrt(sum / float64(len(s)))
	}

	g, f, sc := opt.Gravity, opt.FPS, opt.MetresPerPixel
	switch {
	case g > 0 && f > 0:
		r.FPS = f
		r.MetresPerPixel = g / (2 * c2 * f * f)
		if sc > 0 {
			r.SolvedFPS = math.Sqrt(g / (2 * c2 * sc))
		}
	case g > 0 && sc > 0:
		r.SolvedFPS = math.Sqrt(g / (2 * c2 * sc))
		r.FPS = r.SolvedFPS
		r.MetresPerPixel = sc
	case f > 0:
		r.FPS = f
		if sc > 0 {
			r.SolvedGravity = 2 * c2 * f * f * sc
		}
	}

	if err := r.checkSolved(opt); err != nil {
		return nil, err
	}
	if err := r.fitTurn(s); err != nil {
		return nil, err
	}
	return r, nil
}

// checkSolved refuses a solved frame rate, scale or gravity outside its
// range, naming the option that led to it: the arc with these options
// does not describe a real throw.
func (r *FitResult) checkSolved(opt FitOptions) error {
	given := "metres_per_pixel"
	if opt.MetresPerPixel == 0 {
		given = "gravity"
	}
	if !math.IsNaN(r.SolvedFPS) && !(r.SolvedFPS > 0 && r.SolvedFPS <= MaxFitFPS) {
		return &Error{Field: given, Msg: fmt.Sprintf("with gravity %g m/s^2 and %g m/px the arc gives a frame rate of %.3g fps, outside 0 to %d: check the scale and the gravity", opt.Gravity, opt.MetresPerPixel, r.SolvedFPS, MaxFitFPS)}
	}
	if !math.IsNaN(r.SolvedGravity) && !(r.SolvedGravity >= MinFitGravity && r.SolvedGravity <= MaxFitGravity) {
		return &Error{Field: "metres_per_pixel", Msg: fmt.Sprintf("at %g m/px the arc gives a gravity of %.3g m/s^2, outside %g to %g: check the scale", opt.MetresPerPixel, r.SolvedGravity, float64(MinFitGravity), float64(MaxFitGravity))}
	}
	if m := r.MetresPerPixel; !math.IsNaN(m) && !(m >= MinMetresPerPixel*1e-3 && m <= MaxMetresPerPixel*1e3) {
		return &Error{Field: given, Msg: fmt.Sprintf("the arc gives a scale of %.3g m/px, which no footage has: check the options and the marks", m)}
	}
	return nil
}

// check validates the options; fields are named as in FitOptions, in
// snake case.
func (o FitOptions) check() error {
	bad := func(v float64) bool { return math.IsNaN(v) || math.IsInf(v, 0) || v < 0 }
	switch {
	case bad(o.FPS) || o.FPS > MaxFitFPS:
		return &Error{Field: "fps", Msg: fmt.Sprintf("must be a positive number of frames per second, at most %d", MaxFitFPS)}
	case bad(o.Gravity) || o.Gravity != 0 && !(o.Gravity >= MinFitGravity && o.Gravity <= MaxFitGravity):
		return &Error{Field: "gravity", Msg: fmt.Sprintf("must be between %g and %g m/s^2, or 0 when unknown", float64(MinFitGravity), float64(MaxFitGravity))}
	case bad(o.MetresPerPixel) || o.MetresPerPixel != 0 && !(o.MetresPerPixel >= MinMetresPerPixel && o.MetresPerPixel <= MaxMetresPerPixel):
		return &Error{Field: "metres_per_pixel", Msg: fmt.Sprintf("must be between %g and %g m/px, or 0 when unknown", float64(MinMetresPerPixel), float64(MaxMetresPerPixel))}
	case o.FPS == 0 && !(o.Gravity > 0 && o.MetresPerPixel > 0):
		return &Error{Field: "fps", Msg: "must be positive (it can be left out only when both gravity and metres_per_pixel are given, to solve it)"}
	}
	return nil
}

// axis is the frame axis of a fit, centred and scaled for conditioning:
// u = (n - mean) / half, with half half the span of the frames (1 when
// they are all equal, which sortedMarks rules out).
type axis struct {
	mean, half float64
	u          []float64
}

func newAxis(n []float64) axis {
	var sum float64
	for _, v := range n {
		sum += v
	}
	ax := axis{mean: sum / float64(len(n)), half: (n[len(n)-1] - n[0]) / 2}
	if !(ax.half > 0) {
		ax.half = 1
	}
	ax.u = make([]float64, len(n))
	for i, v := range n {
		ax.u[i] = (v - ax.mean) / ax.half
	}
	return ax
}

// fit returns the least-squares coefficients a_0..a_deg of v = sum a_j
// u^j, solved by QR (gonum: VecDense.SolveVec of an overdetermined
// system; an LU solve when the system is square).
func (ax axis) fit(v []float64, deg int) ([]float64, error) {
	m := len(v)
	A := mat.NewDense(m, deg+1, nil)
	for i, u := range ax.u {
		p := 1.0
		for j := 0; j <= deg; j++ {
			A.Set(i, j, p)
			p *= u
		}
	}
	var c mat.VecDense
	if err := c.SolveVec(A, mat.NewVecDense(m, append([]float64(nil), v...))); err != nil {
		return nil, &Error{Field: "marks", Msg: "the least-squares fit failed: " + err.Error()}
	}
	return c.RawVector().Data, nil
}

// eval returns sum a_j u^j at frame n.
func (ax axis) eval(a []float64, n float64) float64 {
	u := (n - ax.mean) / ax.half
	v := 0.0
	for j := len(a) - 1; j >= 0; j-- {
		v = v*u + a[j]
	}
	return v
}

// slope2 returns d/dn of the quadratic a at frame n.
func (ax axis) slope2(a []float64, n float64) float64 {
	return a[1]/ax.half + 2*a[2]*(n-ax.mean)/(ax.half*ax.half)
}

// raw2 converts a quadratic in u to c0 + c1 n + c2 n^2.
func (ax axis) raw2(a []float64) [3]float64 {
	m, h := ax.mean, ax.half
	return [3]float64{a[0] - a[1]*m/h + a[2]*m*m/(h*h), a[1]/h - 2*a[2]*m/(h*h), a[2] / (h * h)}
}

// raw1 converts a line in u to d0 + d1 n.
func (ax axis) raw1(b []float64) [2]float64 {
	return [2]float64{b[0] - b[1]*ax.mean/ax.half, b[1] / ax.half}
}
