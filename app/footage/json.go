package footage

import "math"

// JSON returns the fit for the command line's --json output, with exactly
// these keys (a value the fit lacks is nil, JSON null):
//
//	gravity_px_per_frame2          2 c2, px/frame^2
//	metres_per_pixel               m/px; null without gravity
//	release_velocity_px_per_frame  [vx, vy] at the first marked frame, y up
//	apex_frame                     frame of the top of the arc
//	rms_px                         centre-fit residual, px; null with 3 marks
//	turn_deg_per_frame             counter-clockwise positive; null without 3 orientation marks
//	turn_rms_deg                   null likewise
//	hint                           "steady" or "irregular"; null likewise
func (r *FitResult) JSON() map[string]any {
	num := func(v float64) any {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil
		}
		return v
	}
	m := map[string]any{
		"gravity_px_per_frame2":         num(r.GravityPxPerFrame2),
		"metres_per_pixel":              num(r.MetresPerPixel),
		"release_velocity_px_per_frame": []float64{r.ReleaseVelocityPxPerFrame[0], r.ReleaseVelocityPxPerFrame[1]},
		"apex_frame":                    num(r.ApexFrame),
		"rms_px":                        num(r.RMSPx),
		"turn_deg_per_frame":            nil,
		"turn_rms_deg":                  nil,
		"hint":                          nil,
	}
	if r.HasTurn {
		m["turn_deg_per_frame"] = num(r.TurnDegPerFrame)
		m["turn_rms_deg"] = num(r.TurnRMSDeg)
		m["hint"] = r.Hint
	}
	return m
}
