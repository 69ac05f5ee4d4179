// Package mark holds the footage mark, the user's click on one frame of
// the footage, and the limits every package holds marks to. The project
// file (app/project) keeps marks, the fits (app/footage) read them and the
// footage view (widgets) shows and edits them: all three use this one type,
// so marks pass between them without copying field by field.
//
// Coordinates are image pixels of the footage frame: origin at the
// top-left corner, x to the right, y down.
//
// The package imports nothing.
package mark

// Mark is the user's click on footage frame Frame (from 0): the prop's
// centre (X, Y) and, with HasSecond, a second point (X2, Y2) on the prop
// that shows which way it points, such as one end of a rolling pin.
// Without HasSecond, X2 and Y2 are zero and mean nothing.
type Mark struct {
	Frame     int
	X, Y      float64
	HasSecond bool
	X2, Y2    float64
}

// Limits of a mark, the same for the project file, the marks file and the
// fits.
const (
	// MaxFrame is the largest frame number a mark may have (and the
	// largest |offset| of the footage in a project): 10 million frames is
	// over four days at 24 fps, so anything beyond is a typing slip (and
	// keeps n^2 in the fits far from float64 trouble).
	MaxFrame = 10_000_000
	// MaxCoord bounds |x|, |y|, |x2| and |y2| of a mark, pixels: footage
	// with a side over it is refused, so a mark beyond it is outside any
	// footage (a typing slip). Where the footage is known, marks must also
	// lie inside its image.
	MaxCoord = 1e6
)
