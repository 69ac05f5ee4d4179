package cli

import (
	"context"
	"math"

	"propflight/app/sheet"
	"propflight/physics"
)

// sheetLandingFlags add the landing page to the timing sheet: --land turns
// it on, the others are those of plan and spread.
var sheetLandingFlags = []*Flag{landFlag, catchFlag, toleranceFlag, samplesFlag, seedFlag, rateSDFlag, tiltSDFlag, speedSDFlag, angleSDFlag}

// The sheet's plan searches the plan command's default range.
const (
	sheetRateMin = 0.25 // turns per second
	sheetRateMax = 10.0
)

// checkSheetLanding refuses landing flags without --land and checks their
// values, naming the flag.
func checkSheetLanding(c *Command) error {
	if !c.Has(landFlag.Name) {
		for _, f := range sheetLandingFlags[1:] {
			if c.Has(f.Name) {
				return usagef("sheet: %s goes with --land AXIS:DIR (the landing page)", f.Name)
			}
		}
		return nil
	}
	_, _, err := spreadOptions(c, "sheet")
	return err
}

// sheetLanding plans and samples the landing page of the flown scene, or
// returns nil without --land.
func sheetLanding(c *Command, f *flight) (*sheet.Landing, error) {
	if !c.Has(landFlag.Name) {
		return nil, nil
	}
	l, spread, err := spreadOptions(c, "sheet")
	if err != nil {
		return nil, err
	}
	sc := f.scene
	tg := l.target(&sc.Mass)
	spread.Target, spread.Thresholds = &tg, sc.Thresholds
	spec := physics.PlanSpec{Target: tg, End: spread.End, Tolerance: spread.Tolerance,
		RateMin: sheetRateMin * 2 * math.Pi, RateMax: sheetRateMax * 2 * math.Pi, Thresholds: sc.Thresholds}
	plan, err := physics.PlanLanding(context.Background(), &sc.Prop, &sc.Mass, &sc.Throw, spec)
	if err != nil {
		return nil, asFlagError(c, f.src, err)
	}
	sp, err := physics.SpreadThrows(context.Background(), &sc.Prop, &sc.Mass, &sc.Throw, spread)
	if err != nil {
		return nil, asFlagError(c, f.src, err)
	}
	return &sheet.Landing{Target: l.describe(), End: spread.End, Tolerance: spread.Tolerance,
		RateMin: spec.RateMin, RateMax: spec.RateMax, Plan: plan, Spread: sp, Errors: spread}, nil
}
