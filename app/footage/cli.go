package footage

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"strconv"
	"strings"

	"propflight/physics"
)

// fitUsage is the usage line of the fit subcommand.
const fitUsage = "usage: propflight fit MARKS.csv --fps N [--gravity G] [--scale M_PER_PX] [--json]"

// Exit codes of RunFit (DESIGN.md "CLI").
const (
	ExitOK      = 0
	ExitFailure = 1 // something other than the input went wrong (writing the output)
	ExitBadUse  = 2 // bad input or usage; stderr names the file or the flag
)

// RunFit runs "propflight fit": args are the arguments after the
// subcommand's name,
//
//	MARKS.csv --fps N [--gravity G] [--scale M_PER_PX] [--json]
//
// in any order, each flag as "--flag value" or "--flag=value" (one dash
// also works). --fps is the footage's frame rate (24, 25, 24000/1001,
// 29.97, ...), which may be left out when --gravity and --scale are both
// given, to solve it; --gravity in m/s^2 (9.80665 is standard gravity;
// without it no scale is found); --scale a known metres per pixel. The
// output is a readable summary, or with --json the object of
// [FitResult.JSON]. It returns ExitOK, ExitBadUse with a message naming
// the file or flag on stderr and nothing on stdout, or ExitFailure when
// stdout cannot be written.
func RunFit(args []string, stdout, stderr io.Writer) int {
	bad := func(format string, a ...any) int {
		fmt.Fprintf(stderr, "propflight: fit: "+format+"\n", a...)
		return ExitBadUse
	}
	var (
		path                  string
		fpsText, gText, sText string
		haveFPS, asJSON       bool
		opt                   FitOptions
	)
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "-h" || a == "--help" || a == "-help" {
			fmt.Fprintln(stdout, fitUsage)
			return ExitOK
		}
		if !strings.HasPrefix(a, "-") || a == "-" {
			if path != "" {
				return bad("one marks file, please (got %q and %q) (%s)", path, a, fitUsage)
			}
			path = a
			continue
		}
		name, value, hasValue := strings.Cut(strings.TrimLeft(a, "-"), "=")
		switch name {
		case "json":
			if hasValue {
				return bad("--json takes no value (%s)", fitUsage)
			}
			asJSON = true
			continue
		case "fps", "gravity", "scale":
		default:
			return bad("unknown flag %s (%s)", a, fitUsage)
		}
		if !hasValue {
			if i+1 >= len(args) {
				return bad("--%s needs a value (%s)", name, fitUsage)
			}
			i++
			value = args[i]
		}
		switch name {
		case "fps":
			fpsText, haveFPS = value, true
		case "gravity":
			gText = value
		case "scale":
			sText = value
		}
	}
	if path == "" {
		return bad("the marks file is missing (%s)", fitUsage)
	}
	if haveFPS {
		r, err := physics.ParseRate(fpsText)
		if err != nil {
			return bad("--fps: %q %v", fpsText, err)
		}
		opt.FPS = r.FPS()
	}
	var err error
	if gText != "" {
		if opt.Gravity, err = positive(gText); err != nil {
			return bad("--gravity: %q %v (m/s^2)", gText, err)
		}
	}
	if sText != "" {
		if opt.MetresPerPixel, err = positive(sText); err != nil {
			return bad("--scale: %q %v (metres per pixel)", sText, err)
		}
	}
	if !haveFPS && !(opt.Gravity > 0 && opt.MetresPerPixel > 0) {
		return bad("--fps: required (the footage's frame rate), unless --gravity and --scale are both given to solve it (%s)", fitUsage)
	}

	f, err := os.Open(path)
	if err != nil {
		return bad("%s: cannot open: %s", path, errText(err))
	}
	marks, err := ParseMarks(path, f)
	f.Close()
	if err != nil {
		return bad("%v", err)
	}
	res, err := Fit(marks, opt)
	if err != nil {
		var fe *Error
		if errors.As(err, &fe) && fe.File == "" {
			fe.File = path
		}
		return bad("%v", err)
	}

	var out []byte
	if asJSON {
		out, err = json.MarshalIndent(res.JSON(), "", "  ")
		if err != nil {
			fmt.Fprintf(stderr, "propflight: fit: %v\n", err)
			return ExitFailure
		}
		out = append(out, '\n')
	} else {
		out = []byte(summary(path, res, opt))
	}
	if _, err := stdout.Write(out); err != nil {
		fmt.Fprintf(stderr, "propflight: fit: writing the output: %v\n", err)
		return ExitFailure
	}
	return ExitOK
}

// positive parses a positive finite number.
func positive(s string) (float64, error) {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, errors.New("is not a number")
	}
	if v <= 0 {
		return 0, errors.New("must be positive")
	}
	return v, nil
}

// summary is the readable report of a fit.
func summary(path string, r *FitResult, opt FitOptions) string {
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
