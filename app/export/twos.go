package export

import (
	"io"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// OnTwos returns the frames an animator draws on twos: every other frame of
// the take (0, 2, 4, ...), each drawing held for two frames. A returned
// frame's TurnDeg and Spacing are measured from the previous returned frame:
// the angle turned along the motion over the two frames (the sum of their
// TurnDeg, so a fast spin is not read the shorter way round; see
// physics.Take) and the straight distance between the two centres of mass,
// as the timing sheet's table on twos measures them. The take is not
// changed.
func OnTwos(take *physics.Take) []physics.Frame {
	var out []physics.Frame
	for i := 0; i < len(take.Frames); i += 2 {
		f := take.Frames[i]
		if i > 0 {
			p := &take.Frames[i-2]
			f.TurnDeg = take.Frames[i-1].TurnDeg + f.TurnDeg
			f.Spacing = r3.Norm(r3.Sub(f.CM, p.CM))
		}
		out = append(out, f)
	}
	return out
}

// WriteCSVTwos writes the take as WriteCSV does, but only the frames of
// OnTwos: rows for frames 0, 2, 4, ..., with turn_deg and spacing_m since
// the previous row.
func WriteCSVTwos(w io.Writer, take *physics.Take) error {
	return WriteCSVWith(w, take, CSVOptions{Twos: true})
}
