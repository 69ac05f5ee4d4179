package export

import (
	"bytes"
	"math"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// spinInput is a box spun steadily about its greatest axis at tps turns a
// second, 24 fps.
func spinInput(t *testing.T, tps float64) Input {
	t.Helper()
	prop := physics.Prop{Parts: []physics.Part{{Name: "board", Shape: physics.Box, Size: r3.Vec{X: 0.3, Y: 0.2, Z: 0.02}, Mass: 1, Orient: physics.IdentityRotation()}}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := physics.DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: 4}
	th.Spin = physics.Spin{Axis: physics.Greatest, Rate: tps * 2 * math.Pi}
	take, err := physics.Simulate(&prop, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	return Input{Name: "board", Prop: &prop, Mass: &mp, Throw: &th, Take: take}
}

// csvTurns returns the turn_deg column of a CSV.
func csvTurns(t *testing.T, b []byte) []float64 {
	t.Helper()
	var out []float64
	for _, l := range strings.Split(strings.TrimSpace(string(b)), "\n")[1:] {
		cols := strings.Split(l, ",")
		v, err := strconv.ParseFloat(cols[12], 64)
		if err != nil {
			t.Fatal(err)
		}
		out = append(out, v)
	}
	return out
}

// TestCSV_TurnOverHalfATurn: a steady spin of 16 turns/s at 24 fps turns
// 360 x 16 / 24 = 240 degrees a frame (common practice: turns per frame =
// rate / fps), and the CSV says 240 on ones and 480 on twos, not the
// shorter way back (120).
func TestCSV_TurnOverHalfATurn(t *testing.T) {
	in := spinInput(t, 16)
	var ones, twos bytes.Buffer
	if err := WriteCSV(&ones, in.Take); err != nil {
		t.Fatal(err)
	}
	if err := WriteCSVTwos(&twos, in.Take); err != nil {
		t.Fatal(err)
	}
	for i, v := range csvTurns(t, ones.Bytes())[1:] {
		if math.Abs(v-240) > 1e-9 {
			t.Fatalf("frame %d: turn_deg %g, want 240", i+1, v)
		}
	}
	for i, v := range csvTurns(t, twos.Bytes())[1:] {
		if math.Abs(v-480) > 1e-9 {
			t.Fatalf("row %d on twos: turn_deg %g, want 480", i+1, v)
		}
	}
}

// TestGLTF_AlmostFullTurnAFrame: at 23 turns/s and 24 fps a frame turns 345
// degrees, which the end orientations read as 15 the other way; the glTF
// keys must still come at most MaxKeyTurnDeg apart along the motion, so
// there are at least 4 keys a frame, and slerp between them follows the
// spin's own sense.
func TestGLTF_AlmostFullTurnAFrame(t *testing.T) {
	in := spinInput(t, 23)
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{Binary: true}); err != nil {
		t.Fatal(err)
	}
	doc, bin := readGLB(t, buf.Bytes())
	s := doc.Animations[0].Samplers
	times := floats(doc, bin, s[0].Input)
	if k := (len(times) - 1) / in.Take.LandingFrame; k < 4 {
		t.Fatalf("%d keys a frame for 345 degrees a frame", k)
	}
}
