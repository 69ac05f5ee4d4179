package footage

import (
	"fmt"
	"math"
	"strings"
)

// Summary is the readable report of a fit of the marks file path under
// opt, one labelled line per result (the command line's "fit" prints it):
// the arc in pixels, gravity, the scale or frame rate found, the release,
// apex, residual, turn and, when a scale is known, the throw in SI units.
func (r *FitResult) Summary(path string, opt FitOptions) string {
	var b strings.Builder
	p := func(label, format string, a ...any) {
		fmt.Fprintf(&b, "%-10s %s\n", label, fmt.Sprintf(format, a...))
	}
	fmt.Fprintf(&b, "%s: %d marks on frames %d to %d, %d with a second point\n", path, r.Marks, r.FirstFrame, r.LastFrame, r.TurnMarks)
	p("arc", "y = %.6g %+.6g n %+.6g n^2 px (image y down), x = %.6g %+.6g n px", r.Y[0], r.Y[1], r.Y[2], r.X[0], r.X[1])
	p("gravity", "%.6g px/frame^2", r.GravityPxPerFrame2)
	switch {
	case !math.IsNaN(r.MetresPerPixel) && opt.FPS > 0:
		p("scale", "%.6g m/px (gravity %g m/s^2 at %.6g fps)", r.MetresPerPixel, opt.Gravity, opt.FPS)
	case !math.IsNaN(r.MetresPerPixel):
		p("scale", "%.6g m/px (given)", r.MetresPerPixel)
	default:
		p("scale", "unknown (give --gravity)")
	}
	if !math.IsNaN(r.SolvedFPS) {
		p("frame rate", "%.6g fps solved from the scale %g m/px and gravity %g m/s^2", r.SolvedFPS, opt.MetresPerPixel, opt.Gravity)
	}
	if !math.IsNaN(r.SolvedGravity) {
		p("gravity", "%.6g m/s^2 from the scale %g m/px at %.6g fps", r.SolvedGravity, opt.MetresPerPixel, opt.FPS)
	}
	v := r.ReleaseVelocityPxPerFrame
	p("release", "vx %.6g px/frame, vy %.6g px/frame (y up) at frame %d", v[0], v[1], r.FirstFrame)
	p("apex", "frame %.4f", r.ApexFrame)
	if math.IsNaN(r.RMSPx) {
		p("residual", "none (3 marks fit exactly; mark 4 or more for a residual)")
	} else {
		p("residual", "%.4g px RMS", r.RMSPx)
	}
	if r.HasTurn {
		sense := "counter-clockwise"
		if r.TurnDegPerFrame < 0 {
			sense = "clockwise"
		}
		p("turn", "%.5g deg/frame (%s), %.3g deg RMS: %s", r.TurnDegPerFrame, sense, r.TurnRMSDeg, r.Hint)
	} else {
		p("turn", "none (mark a second point on %d or more frames)", MinTurnMarks)
	}
	scale := r.MetresPerPixel
	if math.IsNaN(scale) {
		scale = opt.MetresPerPixel
	}
	if t, err := r.ToThrow(scale); err == nil {
		dir := "right"
		if t.Leftward {
			dir = "left"
		}
		line := fmt.Sprintf("%.4g m/s at %.4g deg above horizontal, to the %s", t.Speed, t.AngleDeg, dir)
		if t.HasSpin {
			line += fmt.Sprintf("; %.4g turns/s", t.TurnsPerSecond)
		}
		if t.HasHang {
			line += fmt.Sprintf("; hang %.4g s, distance %.4g m", t.HangTime, t.Distance)
		}
		p("throw", "%s", line)
	}
	return b.String()
}
