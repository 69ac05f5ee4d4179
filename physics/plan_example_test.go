package physics_test

import (
	"context"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// A cutting board spun about its greatest axis and caught 1.2 s later at
// the release height comes back to its release attitude after whole
// turns: n / 1.2 turns per second, each with a window of +- 10 / (360 x
// 1.2) turns per second for a 10 degree tolerance.
func ExamplePlanLanding() {
	board := physics.Prop{Parts: []physics.Part{{
		Shape: physics.Box, Size: r3.Vec{X: 0.4, Y: 0.25, Z: 0.02}, Mass: 1.5, Orient: physics.IdentityRotation(),
	}}}
	mp, _ := board.MassProps()
	th := physics.DefaultThrow()
	th.Velocity = physics.VelocityFromHang(1.2, 1, 0, th.Gravity)
	th.Spin = physics.Spin{Axis: physics.Greatest, TiltToward: physics.Least}
	spec := physics.PlanSpec{
		Target:    physics.Target{Axis: mp.Axes[physics.Least], Dir: r3.Vec{X: 1}},
		End:       physics.End{Catch: true, CatchY: th.Position.Y},
		Tolerance: 10 * math.Pi / 180, RateMin: 0.25 * 2 * math.Pi, RateMax: 3 * 2 * math.Pi,
	}
	plan, err := physics.PlanLanding(context.Background(), &board, &mp, &th, spec)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, s := range plan.Solutions {
		fmt.Printf("%.4f turns/s, %.2f turns, window %.4f-%.4f\n", s.Rate/(2*math.Pi), s.Turns, s.WindowLo/(2*math.Pi), s.WindowHi/(2*math.Pi))
	}
	// Output:
	// 0.8333 turns/s, 1.00 turns, window 0.8102-0.8565
	// 1.6667 turns/s, 2.00 turns, window 1.6435-1.6898
	// 2.5000 turns/s, 3.00 turns, window 2.4769-2.5231
}
