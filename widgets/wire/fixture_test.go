package wire_test

import (
	"testing"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/widgets/wire"
)

// The demo pan and its throw live in internal/fixture, shared with the
// widget tests; these wrappers keep the tests' short names.

func fryingPan() *physics.Prop { return fixture.FryingPan() }

func panThrow(_ *physics.MassProps, hang, distance, turns float64) physics.Throw {
	return fixture.PanThrow(hang, distance, turns)
}

// panScene simulates the pan's throw and returns a scene at frame.
func panScene(t testing.TB, hang, distance, turns float64, frame int) wire.Scene {
	t.Helper()
	sc, err := fixture.PanScene(hang, distance, turns, frame)
	if err != nil {
		t.Fatal(err)
	}
	return sc
}
