package cli

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"

	"propflight/app/footage"
	"propflight/app/fsutil"
	"propflight/physics"
)

func init() {
	register(&Spec{
		Name: "fit", Order: 50,
		Synopsis: "MARKS.csv --fps N [--gravity G] [--scale M] [--json]",
		Summary:  "fit marks on footage: gravity, scale, release, turn",
		About: "Fit the marks clicked on footage (a CSV of frame,x,y[,x2,y2] in pixels):\n" +
			"a parabola through the centres gives gravity in pixels per frame^2 and, with\n" +
			"--gravity, the scale; a second point per frame gives the turn. --fps may be\n" +
			"left out when --gravity and --scale are both given, to solve it.",
		Operand: "MARKS.csv", OperandRequired: true, MissingOperand: "the marks file is missing",
		Flags: []*Flag{
			{Name: "--fps", Value: "N", Help: "the footage's frame rate (24, 25, 24000/1001, 29.97, ...)"},
			{Name: "--gravity", Value: "G", Kind: Number, Help: "gravity in m/s^2 (9.80665 is standard); without it no scale is found"},
			{Name: "--scale", Value: "M", Kind: Number, Help: "a known scale in metres per pixel"},
			{Name: "--json", Aliases: []string{"-json"}, Help: "print one JSON object instead of the summary"},
		},
		Check: checkFit,
		Run:   runFit,
	})
}

// fitOptions reads the fit flags; Check has validated them.
func fitOptions(c *Command) (footage.FitOptions, error) {
	var opt footage.FitOptions
	if c.Has("--fps") {
		r, err := physics.ParseRate(c.Text("--fps"))
		if err != nil {
			return opt, usagef("fit: --fps: %s %v", quote(c.Text("--fps")), err)
		}
		opt.FPS = r.FPS()
	}
	for _, f := range []struct {
		name, unit string
		v          *float64
	}{{"--gravity", "m/s^2", &opt.Gravity}, {"--scale", "metres per pixel", &opt.MetresPerPixel}} {
		if c.Has(f.name) {
			if *f.v = c.Float(f.name); !(*f.v > 0) {
				return opt, usagef("fit: %s: %s must be positive (%s)", f.name, quote(c.Text(f.name)), f.unit)
			}
		}
	}
	if !c.Has("--fps") && !(opt.Gravity > 0 && opt.MetresPerPixel > 0) {
		return opt, usagef("fit: --fps: required (the footage's frame rate), unless --gravity and --scale are both given to solve it")
	}
	return opt, nil
}

func checkFit(c *Command) error {
	_, err := fitOptions(c)
	return err
}

// fitFlags names the flag of each footage.FitOptions field, for errors.
var fitFlags = map[string]string{"fps": "--fps", "gravity": "--gravity", "metres_per_pixel": "--scale"}

// runFit reads the marks file, fits it and prints the summary or JSON.
// Problems with the file are *footage.Error (exit 2).
func runFit(out io.Writer, c *Command) error {
	opt, err := fitOptions(c)
	if err != nil {
		return err
	}
	path := c.File
	f, err := fsutil.OpenRegular(path)
	if err != nil {
		msg := err.Error()
		var pe *os.PathError
		if errors.As(err, &pe) {
			msg = pe.Err.Error()
		}
		return &footage.Error{File: path, Msg: "cannot open: " + msg, Err: err}
	}
	marks, err := footage.ParseMarks(path, f)
	f.Close()
	if err != nil {
		return err
	}
	res, err := footage.Fit(marks, opt)
	if err != nil {
		var fe *footage.Error
		if errors.As(err, &fe) && fe.File == "" {
			if flag, ok := fitFlags[fe.Field]; ok {
				return usagef("fit: %s: %s", flag, fe.Msg)
			}
			fe.File = path
		}
		return err
	}
	if c.Switch("--json") {
		data, err := json.MarshalIndent(res.JSON(), "", "  ")
		if err != nil {
			return fmt.Errorf("fit: %w", err)
		}
		_, err = fmt.Fprintf(out, "%s\n", data)
		return err
	}
	_, err = io.WriteString(out, res.Summary(path, opt))
	return err
}
