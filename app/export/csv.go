package export

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"

	"propflight/physics"
)

// CSVHeader is the first line WriteCSV writes (DESIGN.md "Contracts", CSV
// take), without its line ending.
const CSVHeader = "frame,time_s,cg_x,cg_y,cg_z,qw,qx,qy,qz,wx,wy,wz,turn_deg,spacing_m"

// WriteCSV writes the take as CSV: the CSVHeader line, then one row per
// frame from release (frame 0) to the landing frame, so LandingFrame+1
// rows. Columns per row:
//
//	frame          frame number n (t = n / fps)
//	time_s         seconds after release
//	cg_x..cg_z     centre of mass, world, m (+Y up)
//	qw,qx,qy,qz    unit quaternion, prop frame -> world
//	wx,wy,wz       angular velocity, world axes, rad/s
//	turn_deg       angle turned since the previous frame along the motion,
//	               degrees (0 on frame 0); can exceed 180 (physics.Take)
//	spacing_m      centre-of-mass distance since the previous frame, m (0 on frame 0)
//
// Numbers use the shortest form that reads back to the same float64
// (strconv 'g', -1), a '.' decimal point and no thousands separator; lines
// end in "\n". The take must be consistent (LandingFrame+1 frames numbered
// 0, 1, ...) and finite, else nothing is written and an error says why. A
// write error stops the output and is returned.
func WriteCSV(w io.Writer, take *physics.Take) error {
	if err := checkTake(take); err != nil {
		return err
	}
	cw := csvWriter{w: w}
	cw.line(append(cw.buf[:0], CSVHeader...))
	for i := range take.Frames {
		cw.row(&take.Frames[i])
	}
	return cw.err
}

// checkTake reports why a take cannot be written.
func checkTake(take *physics.Take) error {
	if take == nil {
		return errors.New("export: no take to write")
	}
	if len(take.Frames) != take.LandingFrame+1 {
		return fmt.Errorf("export: the take has %d frames but lands on frame %d", len(take.Frames), take.LandingFrame)
	}
	for i := range take.Frames {
		f := &take.Frames[i]
		if f.N != i {
			return fmt.Errorf("export: frame %d of the take is numbered %d", i, f.N)
		}
		for _, x := range frameValues(f) {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				return fmt.Errorf("export: frame %d holds a value that is not a finite number", i)
			}
		}
	}
	return nil
}

// frameValues returns the row's columns after the frame number, in header
// order.
func frameValues(f *physics.Frame) [13]float64 {
	return [13]float64{
		f.Time,
		f.CM.X, f.CM.Y, f.CM.Z,
		f.Orient.Real, f.Orient.Imag, f.Orient.Jmag, f.Orient.Kmag,
		f.Omega.X, f.Omega.Y, f.Omega.Z,
		f.TurnDeg, f.Spacing,
	}
}

// csvWriter writes lines and keeps the first error, after which it writes
// nothing more (the sticky-error style of image/png's encoder).
type csvWriter struct {
	w   io.Writer
	buf []byte
	err error
}

func (c *csvWriter) line(b []byte) {
	c.buf = append(b, '\n')
	if c.err != nil {
		return
	}
	_, c.err = c.w.Write(c.buf)
}

func (c *csvWriter) row(f *physics.Frame) {
	if c.err != nil {
		return
	}
	b := strconv.AppendInt(c.buf[:0], int64(f.N), 10)
	for _, x := range frameValues(f) {
		b = append(b, ',')
		b = strconv.AppendFloat(b, x, 'g', -1, 64)
	}
	c.line(b)
}
