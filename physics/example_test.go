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
		Mass: 1.5, Orient: physics.IdentityRotation(),
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
		Shape: physics.Box, Size: r3.Vec{X: 0.4, Y: 0.25, Z: 0.02}, Mass: 1.5, Orient: physics.IdentityRotation(),
	}}}
	mp, _ := board.MassProps()
	th := physics.DefaultThrow()
	th.Spin = physics.Spin{Axis: physics.Middle, Tilt: 2 * math.Pi / 180, TiltToward: physics.Least, Rate: 2 * 2 * math.Pi}
	v := physics.Judge(&mp, &th, physics.DefaultThresholds())
	fmt.Println(v.Motion, v.Symmetry)
	// Output: tumble none
}

// A flat plate with principal moments (1, 2, 3) kg m^2 spun 5 degrees off
// its greatest axis toward the least: a steady spin whose greatest axis
// goes round the angular momentum 2.0019153 times per turn about it
// (REFERENCES.md §10).
func ExampleJudge_wobblesPerTurn() {
	mp := physics.MassProps{Moments: [3]float64{1, 2, 3}, Axes: [3]r3.Vec{{X: 1}, {Y: 1}, {Z: 1}}}
	th := physics.DefaultThrow()
	th.Spin = physics.Spin{Axis: physics.Greatest, Tilt: 5 * math.Pi / 180, TiltToward: physics.Least, Rate: 2 * math.Pi}
	v := physics.Judge(&mp, &th, physics.DefaultThresholds())
	fmt.Printf("%v about the %v axis, spin : wobble 1 : %.7f\n", v.Motion, v.Circles, v.WobblesPerTurn)
	// Output: spin about the greatest axis, spin : wobble 1 : 2.0019153
}

// The axis map of a handbook brick (2 kg, 0.2 x 0.1 x 0.05 m): the share of
// spin directions that give each motion.
func ExampleMapDirections() {
	brick := physics.Prop{Parts: []physics.Part{{
		Shape: physics.Box, Size: r3.Vec{X: 0.2, Y: 0.1, Z: 0.05}, Mass: 2, Orient: physics.IdentityRotation(),
	}}}
	mp, _ := brick.MassProps()
	am := physics.MapDirections(&mp, physics.DefaultThresholds(), 2000)
	n := map[physics.Motion]int{}
	for _, d := range am.Directions {
		n[d.Motion]++
	}
	fmt.Printf("spin %.0f%%, tumble %.0f%%\n", float64(n[physics.Spinning])/20, float64(n[physics.Tumbling])/20)
	// Output: spin 28%, tumble 72%
}
