package ui

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"propflight/app/footage"
	"propflight/app/project"
	"propflight/internal/mark"
	"propflight/physics"
)

// This file holds the edits the footage controls make to a
// project.Document, and hands its marks (one type, mark.Mark, for the
// document, app/footage and the footage view) on. Coordinates are the
// footage's image pixels (origin top left, y down); frames are footage
// frames.

// errNoCentre is the refusal of a second point on a frame without a
// centre mark.
var errNoCentre = errors.New("mark the prop's centre on this frame first (a plain click), then Shift-click or right-click a point on the prop")

// errNoFootage refuses a mark on a project without footage.
var errNoFootage = errors.New("load the footage first")

// markIndex returns the index of the mark on footage frame f, -1 if none.
func markIndex(d *project.Document, f int) int {
	if d.Footage == nil {
		return -1
	}
	for i, m := range d.Footage.Marks {
		if m.Frame == f {
			return i
		}
	}
	return -1
}

// setMark marks footage frame f: the centre at (x, y), or with second the
// second point. A new mark is kept in frame order; a frame has one mark.
// A second point needs a centre on the frame: errNoCentre otherwise.
func setMark(d *project.Document, f int, x, y float64, second bool) error {
	fo := d.Footage
	if fo == nil {
		return errNoFootage
	}
	i := markIndex(d, f)
	switch {
	case i >= 0 && second:
		fo.Marks[i].HasSecond, fo.Marks[i].X2, fo.Marks[i].Y2 = true, x, y
	case i >= 0:
		fo.Marks[i].X, fo.Marks[i].Y = x, y
	case second:
		return errNoCentre
	default:
		m := mark.Mark{Frame: f, X: x, Y: y}
		at, _ := slices.BinarySearchFunc(fo.Marks, f, func(m mark.Mark, f int) int { return m.Frame - f })
		if !slices.IsSortedFunc(fo.Marks, func(a, b mark.Mark) int { return a.Frame - b.Frame }) {
			at = len(fo.Marks)
		}
		fo.Marks = slices.Insert(fo.Marks, at, m)
	}
	return nil
}

// checkMarkIndex reports a mark index that the document does not have.
func checkMarkIndex(d *project.Document, i int) error {
	if d.Footage == nil || i < 0 || i >= len(d.Footage.Marks) {
		return fmt.Errorf("footage.marks[%d]: there is no such mark", i)
	}
	return nil
}

// moveMark moves the centre of mark i to (x, y).
func moveMark(d *project.Document, i int, x, y float64) error {
	if err := checkMarkIndex(d, i); err != nil {
		return err
	}
	d.Footage.Marks[i].X, d.Footage.Marks[i].Y = x, y
	return nil
}

// moveSecond moves the second point of mark i to (x, y).
func moveSecond(d *project.Document, i int, x, y float64) error {
	if err := checkMarkIndex(d, i); err != nil {
		return err
	}
	d.Footage.Marks[i].HasSecond, d.Footage.Marks[i].X2, d.Footage.Marks[i].Y2 = true, x, y
	return nil
}

// deleteMark removes mark i.
func deleteMark(d *project.Document, i int) error {
	if err := checkMarkIndex(d, i); err != nil {
		return err
	}
	d.Footage.Marks = slices.Delete(d.Footage.Marks, i, i+1)
	return nil
}

// docMarks returns a copy of the document's marks, in the document's
// order (the footage view's indexes are the document's), for the footage
// view and footage.Fit.
func docMarks(d *project.Document) []mark.Mark {
	if d.Footage == nil {
		return nil
	}
	return slices.Clone(d.Footage.Marks)
}

// applyFitToThrow sets the throw from fitted settings: the release
// velocity from their speed and angle in the image plane, which is the
// world's x-y plane of a front view (image right = +x, up = +y; any z
// velocity the throw had is kept), and, when the fit found a turn, the
// spin rate in turns per second, written the way the throw already gives
// it (turns_per_second, or frames_per_turn at the take's rate). The spin
// axis is kept; a throw without spin gets one about the greatest axis.
func applyFitToThrow(d *project.Document, ts footage.ThrowSettings, rate physics.Rate) error {
	if !(ts.Speed >= 0) || math.IsInf(ts.Speed, 0) {
		return fmt.Errorf("the fitted release speed %g m/s is not a number that can be used", ts.Speed)
	}
	angle := math.Atan2(ts.Velocity[1], ts.Velocity[0]) * 180 / math.Pi
	setSpeedAngle(d, ts.Speed, angle)
	if ts.HasSpin {
		s := ensureSpin(d)
		if s.FramesPerTurn != nil && ts.TurnsPerSecond > 0 {
			s.FramesPerTurn = ptrTo(rate.FPS() / ts.TurnsPerSecond)
		} else {
			s.TurnsPerSecond, s.FramesPerTurn = ptrTo(ts.TurnsPerSecond), nil
		}
	}
	return nil
}
