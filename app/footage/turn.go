package footage

import (
	"fmt"
	"math"

	"propflight/internal/mark"
)

// The rule for FitResult.Hint. A turn is "steady" when the line fit of
// angle over frames leaves an RMS residual
//
//	TurnRMSDeg < SteadyMaxRMSDeg, and
//	TurnRMSDeg < SteadyFraction * |mean turn per frame|  or  TurnRMSDeg < SteadyNoiseDeg,
//
// else "irregular". The mean turn per frame is the unwrapped angle turned
// from the first to the last orientation mark over the frames between
// them. Why these numbers (our choices, no source):
//   - SteadyFraction: a residual under a quarter of one frame's turn
//     means every marked angle sits within a quarter of a frame's step of
//     an even spacing, which an in-between at an even rate matches; a
//     wobble or a tumble breaks that.
//   - SteadyMaxRMSDeg: for a fast spin a quarter of the step is large
//     (22 degrees at 90 degrees a frame), and an angle off its steady place
//     by 5 degrees or more is plainly visible on a prop; beyond it the turn
//     is not a steady spin whatever the rate.
//   - SteadyNoiseDeg: the residual that clicking alone makes. Clicks off
//     by 0.75 pixel RMS along each axis, at both ends of a 40-pixel prop
//     line, turn it by sqrt(2) 0.75 / 40 rad = 1.5 degrees RMS; below that
//     the marks cannot tell an irregular turn from a steady one, so a prop
//     that hardly turns is not called irregular for the user's clicking.
const (
	SteadyMaxRMSDeg = 5.0
	SteadyFraction  = 0.25
	SteadyNoiseDeg  = 1.5
)

// Hint values.
const (
	HintSteady    = "steady"
	HintIrregular = "irregular"
)

// MinTurnMarks is the fewest marks with a second point that give a turn.
const MinTurnMarks = 3

// fitTurn fits the prop-line angle of the sorted marks that have a second
// point. The angle of a mark is atan2(-(y2 - y), x2 - x) in degrees, with
// the image's y flipped so that counter-clockwise on the screen is
// positive. Consecutive marked angles are unwrapped by the shortest step
// between them (so the prop must turn less than half a turn from one
// orientation mark to the next; mark more frames of a fast spin), and a
// least-squares line of unwrapped angle over frame gives the turn per
// frame and the residual.
func (r *FitResult) fitTurn(s []mark.Mark) error {
	var n, ang []float64
	for _, m := range s {
		if !m.HasSecond {
			continue
		}
		dx, dy := m.X2-m.X, -(m.Y2 - m.Y)
		if dx == 0 && dy == 0 {
			return &Error{Field: fmt.Sprintf("frame %d", m.Frame), Msg: "the second point is on the centre, so it shows no direction"}
		}
		a := math.Atan2(dy, dx) * 180 / math.Pi
		if k := len(ang); k > 0 {
			a = ang[k-1] + math.Remainder(a-ang[k-1], 360) // shortest step, in [-180, 180]
		}
		n = append(n, float64(m.Frame))
		ang = append(ang, a)
	}
	r.TurnMarks = len(ang)
	if len(ang) < MinTurnMarks {
		return nil
	}
	ax := newAxis(n)
	b, err := ax.fit(ang, 1)
	if err != nil {
		return err
	}
	var sum float64
	for i := range ang {
		d := ang[i] - ax.eval(b, n[i])
		sum += d * d
	}
	r.HasTurn = true
	r.TurnDegPerFrame = b[1] / ax.half
	r.TurnRMSDeg = math.Sqrt(sum / float64(len(ang)))
	mean := (ang[len(ang)-1] - ang[0]) / (n[len(n)-1] - n[0])
	r.Hint = turnHint(r.TurnRMSDeg, mean)
	return nil
}

// turnHint applies the rule above to a residual and a mean turn per
// frame, both in degrees.
func turnHint(rms, meanTurn float64) string {
	if rms < SteadyMaxRMSDeg && (rms < SteadyFraction*math.Abs(meanTurn) || rms < SteadyNoiseDeg) {
		return HintSteady
	}
	return HintIrregular
}
