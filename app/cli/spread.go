package cli

import (
	"context"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/printable"
	"propflight/physics"
)

// Release-error flags of spread (and sheet). The defaults are a starting
// point for a practised thrower, common practice, no source: measure your
// performer's own (footage and marks) when it matters.
var (
	samplesFlag = &Flag{Name: "--samples", Value: "N", Kind: Int, Default: "1000", Help: "sampled throws (1 to 1000000)"}
	seedFlag    = &Flag{Name: "--seed", Value: "S", Default: "1", Help: "seed of the samples (whole number >= 0); same seed, same answer"}
	rateSDFlag  = &Flag{Name: "--rate-sd", Value: "PCT", Kind: Number, Default: "5", Help: "sd of the spin rate, percent of the rate"}
	tiltSDFlag  = &Flag{Name: "--tilt-sd", Value: "DEG", Kind: Number, Default: "3", Help: "sd of the spin direction's tilt toward a random side, degrees"}
	speedSDFlag = &Flag{Name: "--speed-sd", Value: "PCT", Kind: Number, Default: "3", Help: "sd of the release speed, percent"}
	angleSDFlag = &Flag{Name: "--angle-sd", Value: "DEG", Kind: Number, Default: "2", Help: "sd of the release angle in the vertical plane of the throw, degrees"}
)

func init() {
	register(&Spec{
		Name: "spread", Order: 56,
		Synopsis: "FILE [--samples N] [--seed S] [--land AXIS:DIR] [--json] [...]",
		Summary:  "sampled release errors and the landing they give",
		About: "Throw the project's throw N times with release errors drawn at random (the\n" +
			"spin rate, the spin direction, the release speed and angle, each normal with\n" +
			"the sd given) and report how often it tumbles, where it lands and, with\n" +
			"--land, how often the landing is within tolerance and the error percentiles.",
		Operand: "FILE",
		Flags: []*Flag{
			samplesFlag, seedFlag, rateSDFlag, tiltSDFlag, speedSDFlag, angleSDFlag,
			landFlag, toleranceFlag, catchFlag,
			{Name: "--json", Aliases: []string{"-json"}, Help: "print one JSON object instead of the summary"},
			presetFlag,
		},
		Check: func(c *Command) error { _, _, err := spreadOptions(c, "spread"); return err },
		Run:   runSpread,
	})
}

// spreadOptions reads the spread flags of command cmd and checks them,
// naming the flag. The target's axis is resolved later, against the prop.
func spreadOptions(c *Command, cmd string) (*landArg, physics.SpreadSpec, error) {
	spec := physics.SpreadSpec{
		Samples:    c.Int(samplesFlag.Name),
		RateSD:     c.Float(rateSDFlag.Name) / 100,
		TiltSD:     c.Float(tiltSDFlag.Name) * math.Pi / 180,
		SpeedSD:    c.Float(speedSDFlag.Name) / 100,
		AngleSD:    c.Float(angleSDFlag.Name) * math.Pi / 180,
		End:        endOf(c),
		Thresholds: physics.DefaultThresholds(),
	}
	seed, err := strconv.ParseUint(c.Text(seedFlag.Name), 10, 64)
	if err != nil {
		return nil, spec, usagef("%s: --seed: %s is not a whole number from 0 to %d", cmd, quote(c.Text(seedFlag.Name)), uint64(math.MaxUint64))
	}
	spec.Seed = seed
	var l *landArg
	if c.Has(landFlag.Name) {
		la, err := parseLand(c.Text(landFlag.Name))
		if err != nil {
			return nil, spec, usagef("%s: %v", cmd, err)
		}
		l = &la
		spec.Target = &physics.Target{Axis: r3.Vec{X: 1}, Dir: la.dir}
		spec.Tolerance = c.Float(toleranceFlag.Name) * math.Pi / 180
	} else if c.Has(toleranceFlag.Name) {
		return nil, spec, usagef("%s: --tolerance-deg goes with --land AXIS:DIR", cmd)
	}
	if err := spec.Validate(); err != nil {
		return nil, spec, validationError(cmd, err)
	}
	return l, spec, nil
}

// spreadJSON is the object "spread --json" prints (DESIGN.md keys first);
// the error figures are null without --land.
type spreadJSON struct {
	Samples         int        `json:"samples"`
	Seed            uint64     `json:"seed"`
	WithinTolerance *float64   `json:"within_tolerance"`
	TumbleFraction  float64    `json:"tumble_fraction"`
	ErrorDegP50     *float64   `json:"error_deg_p50"`
	ErrorDegP90     *float64   `json:"error_deg_p90"`
	LandingSDM      [2]float64 `json:"landing_sd_m"`
	FlightTimeSDS   float64    `json:"flight_time_sd_s"`
	ShortOfCatch    int        `json:"short_of_catch"`
}

// runSpreadOn samples the spread of a built scene.
func runSpreadOn(sc *sceneRef, l *landArg, spec physics.SpreadSpec) (*physics.Spread, error) {
	if l != nil {
		tg := l.target(&sc.mp)
		spec.Target = &tg
	}
	return physics.SpreadThrows(context.Background(), sc.prop, &sc.mp, sc.th, spec)
}

// sceneRef is what a spread needs of a scene.
type sceneRef struct {
	prop *physics.Prop
	mp   physics.MassProps
	th   *physics.Throw
}

func runSpread(out io.Writer, c *Command) error {
	l, spec, err := spreadOptions(c, "spread")
	if err != nil {
		return err
	}
	src, sc, err := loadScene(c)
	if err != nil {
		return err
	}
	spec.Thresholds = sc.Thresholds
	sp, err := runSpreadOn(&sceneRef{prop: &sc.Prop, mp: sc.Mass, th: &sc.Throw}, l, spec)
	if err != nil {
		return asFlagError(c, src, err)
	}
	if c.Switch("--json") {
		j := spreadJSON{Samples: sp.Samples, Seed: sp.Seed, TumbleFraction: sp.TumbleFraction,
			LandingSDM: sp.LandingSD, FlightTimeSDS: sp.FlightTimeSD, ShortOfCatch: sp.Short}
		if sp.HasTarget {
			w, p50, p90 := sp.WithinTolerance, sp.ErrorP50*180/math.Pi, sp.ErrorP90*180/math.Pi
			j.WithinTolerance, j.ErrorDegP50, j.ErrorDegP90 = &w, &p50, &p90
		}
		data, err := json.MarshalIndent(j, "", "  ")
		if err != nil {
			return fmt.Errorf("spread: %w", err)
		}
		_, err = fmt.Fprintf(out, "%s\n", data)
		return err
	}
	fmt.Fprintf(out, "%s  (%s)\n\n", printable.String(sc.Name), printable.String(src.label))
	writeSpreadText(out, sp, &spec, l, sc.Throw.FPS.FPS())
	fmt.Fprintf(out, "\n%s\n", Safety)
	return nil
}

// writeSpreadText writes the readable form of a spread.
func writeSpreadText(out io.Writer, sp *physics.Spread, spec *physics.SpreadSpec, l *landArg, fps float64) {
	p := func(format string, args ...any) { fmt.Fprintf(out, format+"\n", args...) }
	pct := func(f float64) string { return fmt.Sprintf("%.1f %%", 100*f) }
	const label = "%-18s"
	p("Spread: %d sampled throws (seed %d), ending %s.", sp.Samples, sp.Seed, endText(spec.End))
	p("Release errors (sd): spin rate %g %%, spin direction %g deg, release speed %g %%, release angle %g deg.",
		spec.RateSD*100, spec.TiltSD*180/math.Pi, spec.SpeedSD*100, spec.AngleSD*180/math.Pi)
	p("")
	if l != nil {
		p(label+"%s of the throws land %s within %g deg", "Within tolerance", pct(sp.WithinTolerance), l.describe(), spec.Tolerance*180/math.Pi)
		p(label+"median %.1f deg, 90th percentile %.1f deg", "Landing error", sp.ErrorP50*180/math.Pi, sp.ErrorP90*180/math.Pi)
	}
	p(label+"%s of the throws", "Tumbles", pct(sp.TumbleFraction))
	p(label+"sd %.3f m along x, %.3f m along z (world)", "Landing point", sp.LandingSD[0], sp.LandingSD[1])
	p(label+"sd %.3f s (%.1f frames)", "Flight time", sp.FlightTimeSD, sp.FlightTimeSD*fps)
	if sp.Short > 0 {
		p(label+"%d throws top out below the catch height (counted as misses)", "Short", sp.Short)
	}
}
