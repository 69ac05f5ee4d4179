package export

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"

	"gonum.org/v1/gonum/spatial/r3"

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
	return WriteCSVWith(w, take, CSVOptions{})
}

// MaxStartFrame is the largest CSVOptions.StartFrame and
// PNGOptions.StartFrame (ten million frames is over four days at 24 fps).
const MaxStartFrame = 10_000_000

// CSVOptions are the pipeline conventions of WriteCSVWith.
type CSVOptions struct {
	// Twos writes only the frames of OnTwos (0, 2, 4, ...), with turn_deg
	// and spacing_m since the previous row.
	Twos bool
	// StartFrame is the number the frame column gives the release: row n
	// says StartFrame + n (shots often start at 1001; REFERENCES.md §13).
	// time_s stays the seconds since release. 0 to MaxStartFrame.
	StartFrame int
	// ZUp writes the world z up for packages that use it: every position
	// and angular velocity turned by (x, y, z) -> (x, -z, y), a quarter
	// turn about x (REFERENCES.md §13), and the orientation conjugated by
	// that turn, (qw, qx, qy, qz) -> (qw, qx, -qz, qy), so that it is the
	// same rotation written in the z-up axes: it maps the z-up version of
	// the prop (its model turned the same way) into the z-up world.
	ZUp bool
}

// WriteCSVWith writes the take as WriteCSV does, under opt's conventions;
// the header is always CSVHeader.
func WriteCSVWith(w io.Writer, take *physics.Take, opt CSVOptions) error {
	if err := checkTake(take); err != nil {
		return err
	}
	if opt.StartFrame < 0 || opt.StartFrame > MaxStartFrame {
		return fmt.Errorf("start-frame: must be 0 to %d, not %d", MaxStartFrame, opt.StartFrame)
	}
	frames := take.Frames
	if opt.Twos {
		frames = OnTwos(take)
	}
	cw := csvWriter{w: w}
	cw.line(append(cw.buf[:0], CSVHeader...))
	for _, f := range frames {
		if opt.ZUp {
			f = ZUpFrame(f)
		}
		f.N += opt.StartFrame
		cw.row(&f)
	}
	return cw.err
}

// ZUpVec turns a y-up world vector into z-up axes: (x, y, z) -> (x, -z, y).
func ZUpVec(v r3.Vec) r3.Vec { return r3.Vec{X: v.X, Y: -v.Z, Z: v.Y} }

// ZUpFrame returns f written in z-up axes (see CSVOptions.ZUp): the
// centre of mass and the angular velocity by ZUpVec, the orientation
// conjugated by the same quarter turn c about x, c q c*, whose vector part
// turns like any vector. Turn angles and spacings do not change.
func ZUpFrame(f physics.Frame) physics.Frame {
	f.CM = ZUpVec(f.CM)
	f.Omega = ZUpVec(f.Omega)
	q := f.Orient
	f.Orient = physics.Rotation{Real: q.Real, Imag: q.Imag, Jmag: -q.Kmag, Kmag: q.Jmag}
	return f
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
