package physics_test

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// A cutting board is a box; its principal moments follow the handbook
// formula m(b^2+c^2)/12 for each axis.
func ExampleProp_MassProps() {
	board := physics.Prop{Parts: []physics.Part{{
		Name: "board", Shape: physics.Box, Size: r3.Vec{X: 0.4, Y: 0.25, Z: 0.02},
		Mass: 1.5, Orient: physics.Identity(),
	}}}
	mp, err := board.MassProps()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("mass %.2f kg\n", mp.Mass)
	fmt.Printf("moments %.8f %.8f %.8f kg m^2\n", mp.Moments[0], mp.Moments[1], mp.Moments[2])
	// Output:
	// mass 1.50 kg
	// moments 0.00786250 0.02005000 0.02781250 kg m^2
}

// A board spun about its middle axis, 2 degrees off, tumbles.
func ExampleJudge() {
	board := physics.Prop{Parts: []physics.Part{{
		Shape: physics.Box, Size: r3.Vec{X: 0.4, Y: 0.25, Z: 0.02}, Mass: 1.5, Orient: physics.Identity(),
	}}}
	mp, _ := board.MassProps()
	th := physics.DefaultThrow()
	th.Spin = physics.Spin{Axis: physics.Middle, Tilt: 2 * math.Pi / 180, TiltToward: physics.Least, Rate: 2 * 2 * math.Pi}
	v := physics.Judge(&mp, &th, physics.DefaultThresholds())
	fmt.Println(v.Motion, v.Symmetry)
	// Output: tumble none
}
