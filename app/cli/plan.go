package cli

import (
	"context"
	"encoding/json"
	"fmt"
	"io"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/internal/printable"
	"propflight/physics"
)

func init() {
	register(&Spec{
		Name: "plan", Order: 55,
		Synopsis: "FILE --land AXIS:DIR [--catch-height Y] [--tolerance-deg T] [--json] [...]",
		Summary:  "spin rates that land the prop as wanted",
		About: "Search the spin rates between --rate-min and --rate-max for those that land\n" +
			"the prop with AXIS pointing along DIR at the end of the flight (the first\n" +
			"ground contact, or with --catch-height the moment the centre of mass comes\n" +
			"down through that height). Only the rate changes: the release and the spin\n" +
			"direction are the project's. Each solution is a rate where the landing error\n" +
			"is smallest, with its window: the rates around it that stay within tolerance.",
		Operand: "FILE",
		Flags: []*Flag{
			landFlag, catchFlag, toleranceFlag,
			{Name: "--rate-min", Value: "A", Kind: Number, Default: "0.25", Help: "slowest spin to try, turns per second"},
			{Name: "--rate-max", Value: "B", Kind: Number, Default: "10", Help: "fastest spin to try, turns per second"},
			{Name: "--json", Aliases: []string{"-json"}, Help: "print one JSON object instead of the summary"},
			presetFlag,
		},
		Check: func(c *Command) error { _, _, err := planOptions(c); return err },
		Run:   runPlan,
	})
}

// planOptions reads the plan flags into a spec (target axes not yet
// resolved against the prop) and checks them, naming the flag.
func planOptions(c *Command) (landArg, physics.PlanSpec, error) {
	if !c.Has(landFlag.Name) {
		return landArg{}, physics.PlanSpec{}, usagef("plan: --land AXIS:DIR is required (for example --land greatest:up)")
	}
	l, err := parseLand(c.Text(landFlag.Name))
	if err != nil {
		return l, physics.PlanSpec{}, usagef("plan: %v", err)
	}
	spec := physics.PlanSpec{
		Target:     physics.Target{Axis: r3.Vec{X: 1}, Dir: l.dir},
		End:        endOf(c),
		Tolerance:  c.Float(toleranceFlag.Name) * math.Pi / 180,
		RateMin:    c.Float("--rate-min") * 2 * math.Pi,
		RateMax:    c.Float("--rate-max") * 2 * math.Pi,
		Thresholds: physics.DefaultThresholds(),
	}
	if err := spec.Validate(); err != nil {
		return l, spec, validationError("plan", err)
	}
	return l, spec, nil
}

// planJSON is the object "plan --json" prints (DESIGN.md keys first).
type planJSON struct {
	FlightTimeS  float64            `json:"flight_time_s"`
	Solutions    []planSolutionJSON `json:"solutions"`
	Motion       string             `json:"motion"`
	ToleranceDeg float64            `json:"tolerance_deg"`
	End          string             `json:"end"`
}

type planSolutionJSON struct {
	TurnsPerSecond       float64    `json:"turns_per_second"`
	Turns                float64    `json:"turns"`
	ErrorDeg             float64    `json:"error_deg"`
	Motion               string     `json:"motion"`
	WindowTurnsPerSecond [2]float64 `json:"window_turns_per_second"`
	FramesPerTurn        float64    `json:"frames_per_turn"`
	FlightTimeS          float64    `json:"flight_time_s"`
}

func runPlan(out io.Writer, c *Command) error {
	l, spec, err := planOptions(c)
	if err != nil {
		return err
	}
	src, sc, err := loadScene(c)
	if err != nil {
		return err
	}
	spec.Target, spec.Thresholds = l.target(&sc.Mass), sc.Thresholds
	plan, err := physics.PlanLanding(context.Background(), &sc.Prop, &sc.Mass, &sc.Throw, spec)
	if err != nil {
		return asFlagError(c, src, err)
	}
	fps := sc.Throw.FPS.FPS()
	if c.Switch("--json") {
		j := planJSON{FlightTimeS: plan.FlightTime, Solutions: []planSolutionJSON{}, Motion: plan.Motion.String(),
			ToleranceDeg: spec.Tolerance * 180 / math.Pi, End: "ground"}
		if spec.End.Catch {
			j.End = "catch"
		}
		for _, s := range plan.Solutions {
			tps := s.Rate / (2 * math.Pi)
			j.Solutions = append(j.Solutions, planSolutionJSON{TurnsPerSecond: tps, Turns: s.Turns, ErrorDeg: s.Error * 180 / math.Pi,
				Motion: s.Motion.String(), WindowTurnsPerSecond: [2]float64{s.WindowLo / (2 * math.Pi), s.WindowHi / (2 * math.Pi)},
				FramesPerTurn: fps / tps, FlightTimeS: s.FlightTime})
		}
		data, err := json.MarshalIndent(j, "", "  ")
		if err != nil {
			return fmt.Errorf("plan: %w", err)
		}
		_, err = fmt.Fprintf(out, "%s\n", data)
		return err
	}
	p := func(format string, args ...any) { fmt.Fprintf(out, format+"\n", args...) }
	p("%s  (%s)", printable.String(sc.Name), printable.String(src.label))
	p("")
	p("Plan: land %s %s, within %g deg,", l.describe(), endText(spec.End), spec.Tolerance*180/math.Pi)
	p("spinning %s to %s turns/s about the project's spin direction (a %s).", turnsText(spec.RateMin), turnsText(spec.RateMax), plan.Motion)
	if spec.End.Catch {
		p("Flight: %.3f s (%.1f frames at %v fps) at every rate.", plan.FlightTime, plan.FlightTime*fps, sc.Throw.FPS)
	}
	p("")
	if len(plan.Solutions) == 0 {
		best := 0
		for i, e := range plan.Errors {
			if e < plan.Errors[best] {
				best = i
			}
		}
		p("No spin rate in that range lands it within %g deg: the closest is %.1f deg off, at %s turns/s.",
			spec.Tolerance*180/math.Pi, plan.Errors[best]*180/math.Pi, turnsText(plan.Rates[best]))
		p("Try a wider rate range, a larger tolerance, another spin direction or release.")
	} else {
		p("  %-3s %9s %12s %7s %8s %8s   %s", "#", "turns/s", "frames/turn", "turns", "error", "flight", "window (turns/s)")
		best := plan.Best()
		for i, s := range plan.Solutions {
			tps := s.Rate / (2 * math.Pi)
			mark := ""
			if i == best {
				mark = "  <- best"
			}
			p("  %-3d %9.4f %12.2f %7.2f %6.1f deg %6.3f s   %.4f - %.4f (%.4f wide)%s", i+1, tps, fps/tps, s.Turns,
				s.Error*180/math.Pi, s.FlightTime, s.WindowLo/(2*math.Pi), s.WindowHi/(2*math.Pi), (s.WindowHi-s.WindowLo)/(2*math.Pi), mark)
		}
		p("")
		p("A wide window forgives the thrower's spin; set turns_per_second (or frames_per_turn) in the throw to use one.")
	}
	p("")
	p("%s", Safety)
	return nil
}
