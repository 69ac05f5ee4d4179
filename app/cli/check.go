package cli

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/printable"
	"propflight/physics"
)

func init() {
	register(&Spec{
		Name: "check", Order: 20,
		Synopsis: "[FILE] [--json]", Summary: "mass properties, verdict and flight timing",
		About: "Print a project's mass properties, its verdict (spin, tumble or wobble) with\n" +
			"the numbers behind it, and the flight's timing. Without FILE or --preset,\n" +
			"the demo.",
		Operand: "FILE",
		Flags: []*Flag{
			{Name: "--json", Aliases: []string{"-json"}, Help: "print one JSON object (DESIGN.md keys) instead of the summary"},
			presetFlag,
		},
		Run: runCheck,
	})
}

func runCheck(w io.Writer, cmd *Command) error {
	f, err := loadAndFly(cmd)
	if err != nil {
		return err
	}
	if cmd.Switch("--json") {
		return writeCheckJSON(w, f)
	}
	writeSummary(w, f)
	return nil
}

// checkJSON is the object "check --json" prints: exactly the keys of
// DESIGN.md's contract, in its order. Units: kg, m, kg m^2, degrees, s,
// frames from release.
type checkJSON struct {
	MassKg           float64       `json:"mass_kg"`
	CenterOfMass     [3]float64    `json:"center_of_mass"`
	InertiaTensor    [3][3]float64 `json:"inertia_tensor"`
	PrincipalMoments [3]float64    `json:"principal_moments"`
	PrincipalAxes    [3][3]float64 `json:"principal_axes"`
	Symmetry         string        `json:"symmetry"`
	Motion           string        `json:"motion"`
	ExcursionDeg     float64       `json:"excursion_deg"`
	WobblesPerTurn   *float64      `json:"wobbles_per_turn"`
	FlipPeriodS      *float64      `json:"flip_period_s"`
	FlightFrames     int           `json:"flight_frames"`
	FlightTimeS      float64       `json:"flight_time_s"`
	ApexFrame        int           `json:"apex_frame"`
	LandingFrame     int           `json:"landing_frame"`
}

func arr(v r3.Vec) [3]float64 { return [3]float64{v.X, v.Y, v.Z} }

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// newCheckJSON fills the contract's keys: wobbles_per_turn only for a
// wobble, flip_period_s only for a tumble with a finite flip period, null
// otherwise.
func newCheckJSON(f *flight) checkJSON {
	mp, v, take := &f.scene.Mass, &f.verdict, f.take
	j := checkJSON{
		MassKg:           mp.Mass,
		CenterOfMass:     arr(mp.CM),
		InertiaTensor:    mp.Inertia,
		PrincipalMoments: mp.Moments,
		Symmetry:         v.Symmetry.String(),
		Motion:           v.Motion.String(),
		ExcursionDeg:     v.ExcursionDeg,
		FlightFrames:     take.LandingFrame + 1,
		FlightTimeS:      take.FlightTime,
		ApexFrame:        take.ApexFrame,
		LandingFrame:     take.LandingFrame,
	}
	for i, a := range mp.Axes {
		j.PrincipalAxes[i] = arr(a)
	}
	if v.HasRatio {
		x := v.WobblesPerTurn
		j.WobblesPerTurn = &x
	}
	if v.HasFlip && finite(v.FlipPeriod) {
		x := v.FlipPeriod
		j.FlipPeriodS = &x
	}
	return j
}

func writeCheckJSON(w io.Writer, f *flight) error {
	data, err := json.MarshalIndent(newCheckJSON(f), "", "  ")
	if err != nil {
		// Only a NaN or infinity can get here; physics should never give one.
		return errors.New(printable.String(f.src.label) + ": the result holds a value that is not a finite number")
	}
	_, err = w.Write(append(data, '\n'))
	return err
}

// num formats x with four significant digits (%.4g).
func num(x float64) string { return fmt.Sprintf("%.4g", x) }

func vecText(v r3.Vec) string {
	return fmt.Sprintf("(%s, %s, %s)", num(clean(v.X)), num(clean(v.Y)), num(clean(v.Z)))
}

// clean turns round-off like 1e-17 on a unit axis into 0 for display.
func clean(x float64) float64 {
	if math.Abs(x) < 1e-12 {
		return 0
	}
	return x
}

func rateText(r physics.Rate) string {
	if r.Den == 1 {
		return r.String() + " fps"
	}
	return fmt.Sprintf("%s fps (%.3f)", r.String(), r.FPS())
}

// frameAt formats time t as "frame N (t s)", N the first frame at or
// after t.
func frameAt(r physics.Rate, t float64) string {
	if n := r.FrameAtOrAfter(t); n < math.MaxInt {
		return fmt.Sprintf("frame %d (%.3f s)", n, t)
	}
	return fmt.Sprintf("beyond any frame (%.3g s)", t)
}

var axisWords = [3]string{"least", "middle", "greatest"}

// startAxis returns the principal axis nearest the release spin omega
// (principal frame) and the angle between them in degrees.
func startAxis(omega r3.Vec) (int, float64) {
	n := r3.Norm(omega)
	c := [3]float64{math.Abs(omega.X) / n, math.Abs(omega.Y) / n, math.Abs(omega.Z) / n}
	k := 0
	for i := 1; i < 3; i++ {
		if c[i] > c[k] {
			k = i
		}
	}
	return k, math.Acos(math.Min(1, c[k])) * 180 / math.Pi
}

// wrap breaks text into lines of at most width characters after indent.
func wrap(text, indent string, width int) []string {
	var lines []string
	line := indent
	for _, word := range strings.Fields(text) {
		if len(line) > len(indent) && len(line)+1+len(word) > width {
			lines = append(lines, line)
			line = indent
		}
		if len(line) > len(indent) {
			line += " "
		}
		line += word
	}
	return append(lines, line)
}

// partName is a part's name for the summary, "(unnamed)" when empty.
func partName(name string) string {
	if name == "" {
		return "(unnamed)"
	}
	return name
}

// label is the width of the left column of the summary.
const label = "%-16s"

// summaryWriter writes check's readable summary: lines, rows with a
// label in the left column, and indented sub-rows.
type summaryWriter struct{ w io.Writer }

func (s summaryWriter) p(format string, args ...any) { fmt.Fprintf(s.w, format+"\n", args...) }

func (s summaryWriter) row(name, format string, args ...any) {
	s.p(label+format, append([]any{name}, args...)...)
}

func (s summaryWriter) sub(name, format string, args ...any) {
	s.p("  %-14s"+format, append([]any{name}, args...)...)
}

// writeSummary writes check's summary of flight f: the prop, the throw,
// the verdict and the flight, then the safety caution.
func writeSummary(w io.Writer, f *flight) {
	s := summaryWriter{w}
	s.p("%s  (%s)", printable.String(f.scene.Name), printable.String(f.src.label))
	s.p("")
	s.prop(f)
	s.throw(f)
	s.verdict(f)
	s.flight(f)
	s.p("")
	s.p("%s", Safety)
}

// prop writes the parts (mesh parts with their triangles), the notes, the
// centre of mass, the principal moments and axes and the symmetry.
func (s summaryWriter) prop(f *flight) {
	sc, v := f.scene, &f.verdict
	mp, thr := &sc.Mass, sc.Thresholds
	parts := "parts"
	if len(sc.Prop.Parts) == 1 {
		parts = "part"
	}
	s.row("Prop", "%d %s, mass %s kg", len(sc.Prop.Parts), parts, num(mp.Mass))
	for _, pt := range sc.Prop.Parts {
		if pt.Shape == physics.MeshShape && pt.Mesh != nil {
			kind := "solid"
			if pt.Wall > 0 {
				kind = fmt.Sprintf("hollow, wall %s m", num(pt.Wall))
			}
			s.row("", "%s: mesh of %d triangles, %s", printable.String(partName(pt.Name)), len(pt.Mesh.T), kind)
		}
	}
	for _, n := range sc.Notes {
		s.row("Note", "%s", printable.String(n))
	}
	s.row("Centre of mass", "%s m, prop frame", vecText(mp.CM))
	s.p("Principal moments (kg m^2) and axes (unit vectors in the prop frame):")
	for i := range 3 {
		s.p("  %-8s  I%d = %-10s axis %s", axisWords[i], i+1, num(mp.Moments[i]), vecText(mp.Axes[i]))
	}
	tol := thr.SymmetryTol * 100
	switch v.Symmetry {
	case physics.Asymmetric:
		s.row("Symmetry", "none: no two moments within %g %% of each other", tol)
	case physics.Prolate:
		s.row("Symmetry", "prolate (rod-like): I2 = I3 within %g %%; the least axis is the symmetry axis", tol)
	case physics.Oblate:
		s.row("Symmetry", "oblate (disc-like): I1 = I2 within %g %%; the greatest axis is the symmetry axis", tol)
	case physics.Spherical:
		s.row("Symmetry", "spherical: all three moments equal within %g %%", tol)
	}
}

// throw writes the release and the spin.
func (s summaryWriter) throw(f *flight) {
	th, rate := &f.scene.Throw, f.scene.Throw.FPS
	spinTurns := th.Spin.Rate / (2 * math.Pi)
	s.row("Throw", "released at %s m moving %s m/s,", vecText(th.Position), vecText(th.Velocity))
	s.p(label+"spinning %s turns/s (%s rad/s, %s frames per turn)", "", num(spinTurns), num(th.Spin.Rate), framesPerTurn(spinTurns, rate))
	s.p("")

}

// verdict writes the verdict, why, and its numbers: excursion, wobble,
// flips and onset.
func (s summaryWriter) verdict(f *flight) {
	v, mp, thr := &f.verdict, &f.scene.Mass, f.scene.Thresholds
	rate, take := f.scene.Throw.FPS, f.take
	title, why := verdictText(v, mp, thr)
	s.row("Verdict", "%s", title)
	for _, line := range wrap(why, "  ", 80) {
		s.p("%s", line)
	}
	if v.L > 0 {
		switch {
		case v.Symmetry == physics.Spherical:
		case v.Symmetry == physics.Asymmetric:
			s.sub("Excursion", "%.1f deg from the %s axis (a tumble at %g deg or more)", v.ExcursionDeg, axisWords[v.Circles], thr.TumbleDeg)
		default:
			s.sub("Excursion", "%.2f deg between the angular momentum and the symmetry axis", v.ExcursionDeg)
			s.sub("", "(a wobble from %g to %g deg)", thr.WobbleMinDeg, 90-thr.WobbleMinDeg)
		}
	}
	if v.HasRatio {
		wobbles := "wobbles"
		if num(v.WobblesPerTurn) == "1" {
			wobbles = "wobble"
		}
		s.sub("Wobble", "%s %s per turn about the %s axis (spin : wobble = 1 : %s)", num(v.WobblesPerTurn), wobbles, axisWords[v.Circles], num(v.WobblesPerTurn))
		if v.HasWobble && v.WobblesPerEulerTurn > 0 {
			s.sub("", "against the Euler-angle spin, the turn relative to the wobble: 1 : %s", num(v.WobblesPerEulerTurn))
		}
		if v.Symmetry == physics.Asymmetric {
			s.sub("", "(mean rates over one polhode period: exact)")
		}
		period := 2 * math.Pi / v.PrecessionRate
		s.sub("", "one wobble every %.3f s (%s frames)", period, num(period*rate.FPS()))
	}
	if v.HasFlip {
		if finite(v.FlipPeriod) {
			s.sub("Flips", "every %.3f s (%s frames)", v.FlipPeriod, num(v.FlipPeriod*rate.FPS()))
		} else {
			s.sub("Flips", "unbounded time between flips: the spin is on the border between the two steady motions")
		}
		if v.FirstFlipFound {
			after := ""
			if rate.FrameAtOrAfter(v.FirstFlip) > take.LandingFrame {
				after = ", after landing"
			}
			s.sub("First flip", "%s%s", frameAt(rate, v.FirstFlip), after)
		}
	}
	if v.HasOnset {
		if finite(v.Onset) {
			s.sub("Onset", "the spin starts to leave the middle axis around %s", frameAt(rate, v.Onset))
		} else {
			s.sub("Onset", "never in theory: the spin is exactly on the middle axis (a real throw soon leaves it)")
		}
	}
	s.p("")
}

// flight writes the flight's frames, apex and landing.
func (s summaryWriter) flight(f *flight) {
	rate, take := f.scene.Throw.FPS, f.take
	s.row("Flight", "%d frames (0 to %d) at %s, %.3f s in the air", take.LandingFrame+1, take.LandingFrame, rateText(rate), take.FlightTime)
	s.sub("Apex", "frame %d (%.3f s), the top of the centre-of-mass arc", take.ApexFrame, take.ApexTime)
	s.sub("Landing", "frame %d, the last frame before the prop touches the ground at %.3f s", take.LandingFrame, take.FlightTime)
}

// framesPerTurn formats fps / turns, or "no" for no spin.
func framesPerTurn(turns float64, r physics.Rate) string {
	if turns == 0 {
		return "no"
	}
	return num(r.FPS() / turns)
}

// verdictText names the verdict and explains in plain words what the prop
// will do, about which axis, and why.
func verdictText(v *physics.Verdict, mp *physics.MassProps, thr physics.Thresholds) (title, why string) {
	I := mp.Moments
	if v.L == 0 {
		return "NO SPIN", "The throw gives no spin, so the prop keeps its release orientation all the way."
	}
	k, off := startAxis(v.Omega0)
	start := fmt.Sprintf("The spin starts %.1f deg from the %s axis.", off, axisWords[k])
	order := fmt.Sprintf("The moments order I1 < I2 < I3 (%s < %s < %s kg m^2).", num(I[0]), num(I[1]), num(I[2]))
	switch v.Symmetry {
	case physics.Spherical:
		return "SPIN (steady)", "All three moments are equal, so a spin about any axis is steady: no wobble, no tumble."
	case physics.Prolate, physics.Oblate:
		shape, axis := "rod-like (prolate)", "least"
		if v.Symmetry == physics.Oblate {
			shape, axis = "disc-like (oblate)", "greatest"
		}
		switch {
		case v.Motion == physics.Wobbling:
			return "WOBBLE (locked to the spin)", fmt.Sprintf("The prop is %s, so its %s axis is a symmetry axis. %s "+
				"Its angular momentum is off the symmetry axis, so that axis circles the angular momentum "+
				"at a steady rate locked to the spin: a wobble.", shape, axis, start)
		case v.ExcursionDeg > 45:
			return "SPIN (end over end)", fmt.Sprintf("The prop is %s and spins about an axis across its symmetry (%s) axis, "+
				"which is steady: it turns end over end without wobbling.", shape, axis)
		default:
			return "SPIN (about its symmetry axis)", fmt.Sprintf("The prop is %s and spins about its symmetry (%s) axis, "+
				"which is steady; the tilt is below the %g deg it takes to show as a wobble.", shape, axis, thr.WobbleMinDeg)
		}
	}
	if v.Motion == physics.Tumbling {
		if k != int(physics.Middle) {
			start = fmt.Sprintf("The spin starts %.1f deg from the %s axis, too far off it and toward the middle axis to stay steady.", off, axisWords[k])
		}
		return "TUMBLE (irregular flips)", start + " " + order + " A spin near the middle axis is unstable: " +
			"small offsets grow and the prop flips end over end irregularly, its angular momentum swinging far from the " +
			axisWords[v.Circles] + " axis it circles."
	}
	ease := "the axis it turns most easily about"
	if v.Circles == physics.Greatest {
		ease = "the axis it is hardest to turn about"
	}
	return "SPIN (steady)", fmt.Sprintf("%s %s The spin stays near the %s axis (%s), and a spin there is stable.",
		start, order, axisWords[v.Circles], ease)
}
