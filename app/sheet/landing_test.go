package sheet

import (
	"context"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// TestWrite_LandingPage: with a Landing the sheet gains page 2 with the
// target, every solution (the best shaded) and the spread's figures, as
// printed numbers equal to the computed ones.
func TestWrite_LandingPage(t *testing.T) {
	in := presetInput(t, "frying-pan")
	sc := in.Scene
	tg := physics.Target{Axis: sc.Mass.Axes[physics.Greatest], Dir: r3.Vec{Y: 1}}
	end := physics.End{Catch: true, CatchY: sc.Throw.Position.Y}
	spec := physics.PlanSpec{Target: tg, End: end, Tolerance: 10 * math.Pi / 180, RateMin: 0.5 * 2 * math.Pi, RateMax: 6 * 2 * math.Pi}
	plan, err := physics.PlanLanding(context.Background(), &sc.Prop, &sc.Mass, &sc.Throw, spec)
	if err != nil {
		t.Fatal(err)
	}
	errs := physics.SpreadSpec{Samples: 200, Seed: 4, RateSD: 0.05, TiltSD: 0.05, Target: &tg, Tolerance: spec.Tolerance, End: end}
	sp, err := physics.SpreadThrows(context.Background(), &sc.Prop, &sc.Mass, &sc.Throw, errs)
	if err != nil {
		t.Fatal(err)
	}
	plain := renderPages(t, in)
	in.Landing = &Landing{Target: "the greatest axis pointing up", End: end, Tolerance: spec.Tolerance,
		RateMin: spec.RateMin, RateMax: spec.RateMax, Plan: plan, Spread: sp, Errors: errs}
	path := pdfFile(t, render(t, in, Options{}))
	if n := pageCount(t, path); n != plain+1 {
		t.Fatalf("%d pages with the landing page, %d without", n, plain)
	}
	text := squash(pageText(t, path, 2, false))
	want := []string{"Landing: plan and spread", "the greatest axis pointing up", "at the catch", "10.0°",
		"Spread: 200 sampled throws (seed 4)", fixed(100*sp.WithinTolerance, 1) + " % of the throws",
		"median " + fixed(deg(sp.ErrorP50), 1) + "°", Caution}
	if len(plan.Solutions) == 0 {
		t.Fatal("the pan preset should have solutions between 0.5 and 6 turns/s")
	}
	for _, s := range plan.Solutions {
		want = append(want, fixed(s.Rate/(2*math.Pi), 4), fixed(s.WindowLo/(2*math.Pi), 4)+"–"+fixed(s.WindowHi/(2*math.Pi), 4))
	}
	// The scatter's caption gives the points' extent in plain words; a
	// "frame" here would read as an animation frame.
	want = append(want, "the landing points span ")
	for _, w := range want {
		if !strings.Contains(text, w) {
			t.Errorf("landing page lacks %q:\n%s", w, text)
		}
	}
	if strings.Contains(text, "m across the points") {
		t.Errorf("scatter caption still reads \"frame ... m across the points\":\n%s", text)
	}
}

func renderPages(t *testing.T, in Input) int {
	return pageCount(t, pdfFile(t, render(t, in, Options{})))
}

// TestErrorBins: every sample lands in one bin; 180 degrees in the last.
func TestErrorBins(t *testing.T) {
	sp := &physics.Spread{Points: []physics.SpreadSample{{Error: 0}, {Error: math.Pi}, {Error: math.Pi / 2}, {Error: 0.01}}}
	b := ErrorBins(sp, 4)
	if b[0] != 2 || b[2] != 1 || b[3] != 1 {
		t.Errorf("bins %v", b)
	}
}
