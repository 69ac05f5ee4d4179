package cli

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/app/project"
	"propflight/physics"
)

// Flags shared by plan, spread and sheet: what the landing aims for and
// where the flight ends.
var (
	landFlag = &Flag{Name: "--land", Value: "AXIS:DIR",
		Help: "prop axis AXIS (least|middle|greatest|x,y,z) along DIR (up|down|x,y,z, world)"}
	catchFlag = &Flag{Name: "--catch-height", Value: "Y", Kind: Number,
		Help: "end when the centre of mass comes down through Y m, not at ground contact"}
	toleranceFlag = &Flag{Name: "--tolerance-deg", Value: "T", Kind: Number, Default: "10",
		Help: "largest landing error that counts, degrees (over 0, up to 180)"}
)

// landArg is a parsed --land AXIS:DIR.
type landArg struct {
	named physics.Axis // Least, Middle, Greatest, or Free for a vector
	axis  r3.Vec       // prop frame, when Free
	dir   r3.Vec       // world
	text  string       // as given
}

// parseLand reads AXIS:DIR. Every problem names --land.
func parseLand(s string) (landArg, error) {
	a, d, ok := strings.Cut(s, ":")
	if !ok || strings.Contains(d, ":") {
		return landArg{}, usagef("--land: %s is not AXIS:DIR (for example greatest:up or 1,0,0:0,1,0)", quote(s))
	}
	l := landArg{named: physics.Free, text: s}
	if ax, ok := physics.ParseAxis(strings.ToLower(strings.TrimSpace(a))); ok {
		l.named = ax
	} else {
		v, err := parseVec(a)
		if err != nil {
			return landArg{}, usagef("--land: the prop axis %s %v (least, middle, greatest or x,y,z)", quote(a), err)
		}
		l.axis = v
	}
	switch strings.ToLower(strings.TrimSpace(d)) {
	case "up":
		l.dir = r3.Vec{Y: 1}
	case "down":
		l.dir = r3.Vec{Y: -1}
	default:
		v, err := parseVec(d)
		if err != nil {
			return landArg{}, usagef("--land: the direction %s %v (up, down or x,y,z)", quote(d), err)
		}
		l.dir = v
	}
	return l, nil
}

// parseVec reads "x,y,z": three finite numbers, not all zero.
func parseVec(s string) (r3.Vec, error) {
	f := strings.Split(s, ",")
	if len(f) != 3 {
		return r3.Vec{}, errors.New("is not three numbers x,y,z")
	}
	var c [3]float64
	for i, p := range f {
		x, err := strconv.ParseFloat(strings.TrimSpace(p), 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return r3.Vec{}, fmt.Errorf("has %s, not a finite number", quote(strings.TrimSpace(p)))
		}
		c[i] = x
	}
	v := r3.Vec{X: c[0], Y: c[1], Z: c[2]}
	if r3.Norm(v) == 0 {
		return r3.Vec{}, errors.New("has zero length")
	}
	return v, nil
}

// target turns the argument into the physics target for mass properties mp.
func (l landArg) target(mp *physics.MassProps) physics.Target {
	ax := l.axis
	if l.named != physics.Free {
		ax = mp.Axes[l.named]
	}
	return physics.Target{Axis: ax, Dir: l.dir}
}

// describe is the target in words: "the greatest axis pointing up".
func (l landArg) describe() string {
	a := "the prop axis " + vecText(r3.Unit(l.axis))
	if l.named != physics.Free {
		a = "the " + axisWords[l.named] + " axis"
	}
	switch l.dir {
	case r3.Vec{Y: 1}:
		return a + " pointing up"
	case r3.Vec{Y: -1}:
		return a + " pointing down"
	}
	return a + " along " + vecText(r3.Unit(l.dir)) + " (world)"
}

// endOf reads --catch-height.
func endOf(c *Command) physics.End {
	if c.Has(catchFlag.Name) {
		return physics.End{Catch: true, CatchY: c.Float(catchFlag.Name)}
	}
	return physics.End{}
}

// endText describes the end of the flight.
func endText(e physics.End) string {
	if e.Catch {
		return fmt.Sprintf("at the catch (centre of mass down through %s m)", num(e.CatchY))
	}
	return "at the first ground contact"
}

// asFlagError turns a physics field error about one of the command's own
// flags into a usage error naming the flag, and any other into the file's
// error, as fly does.
func asFlagError(cmd *Command, src *source, err error) error {
	var fe *physics.FieldError
	switch {
	case errors.As(err, &fe) && cmd.spec != nil && cmd.spec.flag("--"+fe.Field) != nil:
		return usagef("%s: --%s: %s", cmd.Name, fe.Field, fe.Msg)
	case errors.As(err, &fe):
		return &project.Error{File: src.label, Field: fe.Field, Msg: fe.Msg}
	case errors.Is(err, physics.ErrNoLanding):
		return &project.Error{File: src.label, Field: "throw", Msg: err.Error()}
	}
	return fmt.Errorf("%s: %w", src.label, err)
}

// validationError names the flag of a physics validation error.
func validationError(cmd string, err error) error {
	var fe *physics.FieldError
	if errors.As(err, &fe) {
		return usagef("%s: --%s: %s", cmd, fe.Field, fe.Msg)
	}
	return err
}

// turnsText formats a rate in turns per second.
func turnsText(rad float64) string { return fmt.Sprintf("%.4f", rad/(2*math.Pi)) }
