package footage_test

import (
	"fmt"
	"strings"

	"propflight/app/footage"
	"propflight/physics"
)

// ExampleFit fits the exact data of REFERENCES.md §6 (y = 400 - 30 n +
// 4.256358507 n^2 px at 24 fps, true scale 0.002 m/px) under standard
// gravity.
func ExampleFit() {
	csv := "frame,x,y\n"
	for n := range 12 {
		f := float64(n)
		csv += fmt.Sprintf("%d,%g,%.9f\n", n, 100+5*f, 400-30*f+4.256358507*f*f)
	}
	marks, err := footage.ParseMarks("marks.csv", strings.NewReader(csv))
	if err != nil {
		fmt.Println(err)
		return
	}
	r, err := footage.Fit(marks, footage.FitOptions{FPS: 24, Gravity: physics.StandardGravity})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("gravity %.6f px/frame^2, scale %.6f m/px, apex at frame %.3f\n", r.GravityPxPerFrame2, r.MetresPerPixel, r.ApexFrame)
	// At 0.002 m/px and 24 fps the release velocity (5, 30) px/frame is
	// (0.24, 1.44) m/s: 1.460 m/s at atan(1.44/0.24) = 80.5 degrees, and it
	// comes back to its height after 2 (1.44) / 9.80665 = 0.2937 s.
	th, _ := r.ToThrow(r.MetresPerPixel)
	fmt.Printf("release %.3f m/s at %.1f degrees, hang %.4f s\n", th.Speed, th.AngleDeg, th.HangTime)
	// Output:
	// gravity 8.512717 px/frame^2, scale 0.002000 m/px, apex at frame 3.524
	// release 1.460 m/s at 80.5 degrees, hang 0.2937 s
}

// ExampleParseMarks shows the message for a bad cell.
func ExampleParseMarks() {
	_, err := footage.ParseMarks("marks.csv", strings.NewReader("frame,x,y\n0,1,2\n1,2,3\n2,abc,4\n"))
	fmt.Println(err)
	// Output:
	// marks.csv: line 4: x: not a number
}
