package widgets

import (
	"testing"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/widgets/wire"
)

// The demo pan and its throw live in internal/fixture, shared with the
// renderer tests; these wrappers keep the tests' short names.

func fryingPan() *physics.Prop { return fixture.FryingPan() }

func panThrow(_ *physics.MassProps, hang, distance, turns float64) physics.Throw {
	return fixture.PanThrow(hang, distance, turns)
}

// panScene simulates the pan's throw and returns the scene with onion skins
// of three frames each side, arc, ticks, axes and grid.
func panScene(tb testing.TB, hang, distance, turns float64) wire.Scene {
	tb.Helper()
	sc, err := fixture.PanScene(hang, distance, turns, 0)
	if err != nil {
		tb.Fatal(err)
	}
	return sc
}

const threeSecondHang = fixture.ThreeSecondHang
