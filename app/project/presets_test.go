package project

import (
	"math"
	"testing"

	"propflight/assets"
	"propflight/physics"
)

// presetMotion is what each demo preset is built to show. The test lives
// here rather than in assets so that assets need not import project.
var presetMotion = map[string]physics.Motion{
	"frying-pan":    physics.Tumbling, // asymmetric, spun about the middle axis with a small tilt: the slapstick flip
	"rolling-pin":   physics.Spinning, // prolate, end over end about a transverse (greatest) axis
	"dinner-plate":  physics.Wobbling, // oblate, spun about its symmetry axis with a 10 degree tilt
	"cutting-board": physics.Spinning, // asymmetric, about the least axis: stable
	"loaf":          physics.Spinning, // asymmetric, a lazy turn about the greatest axis: stable
	"ladle":         physics.Spinning, // a mesh part, nearly prolate, flipped end over end (handle over bowl)
}

func TestPresets_VerdictMatchesIntent(t *testing.T) {
	shown := map[physics.Motion]bool{}
	for _, name := range assets.PresetNames() {
		t.Run(name, func(t *testing.T) {
			want, ok := presetMotion[name]
			if !ok {
				t.Fatalf("preset %q has no intended motion in this test", name)
			}
			data, err := assets.Preset(name)
			if err != nil {
				t.Fatal(err)
			}
			doc, err := Parse(name+".json", data)
			if err != nil {
				t.Fatal(err)
			}
			sc, err := doc.Build()
			if err != nil {
				t.Fatal(err)
			}
			v := physics.Judge(&sc.Mass, &sc.Throw, physics.DefaultThresholds())
			if v.Motion != want {
				t.Errorf("verdict %v (symmetry %v, excursion %.2f deg), want %v", v.Motion, v.Symmetry, v.ExcursionDeg, want)
			}
			shown[v.Motion] = true
			switch want {
			case physics.Tumbling:
				if !v.HasFlip || !v.FirstFlipFound {
					t.Errorf("a tumble preset should flip: %+v", v)
				}
			case physics.Wobbling:
				if !v.HasWobble {
					t.Errorf("a wobble preset should carry wobble rates: %+v", v)
				}
			}

			// The demo throws are plausible for a live kitchen gag (common
			// practice, no source): released at chest to head height, in the
			// air for about a second, turning once to three times a second.
			th := sc.Throw
			if h := th.Position.Y; h < 1.2 || h > 1.6 {
				t.Errorf("release height %.2f m", h)
			}
			if hang := 2 * th.Velocity.Y / th.Gravity; hang < 0.7 || hang > 1.5 {
				t.Errorf("hang time %.2f s", hang)
			}
			if turns := th.Spin.Rate / (2 * math.Pi); turns < 1 || turns > 3 {
				t.Errorf("%.2f turns per second", turns)
			}
			take, err := physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw)
			if err != nil {
				t.Fatal(err)
			}
			if want == physics.Tumbling && v.FirstFlip > take.FlightTime {
				t.Errorf("first flip at %.3f s comes after landing at %.3f s", v.FirstFlip, take.FlightTime)
			}
		})
	}
	for _, m := range []physics.Motion{physics.Spinning, physics.Tumbling, physics.Wobbling} {
		if !shown[m] {
			t.Errorf("no preset shows %v", m)
		}
	}
	if _, ok := presetMotion[assets.Demo]; !ok {
		t.Errorf("the demo %q is not a preset", assets.Demo)
	}
}
