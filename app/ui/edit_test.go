package ui

import (
	"math"
	"strings"
	"testing"

	"propflight/app/project"
	"propflight/physics"
)

func TestUseDensity_KeepsTheMass(t *testing.T) {
	p := project.Part{Shape: "cylinder", Radius: ptrTo(0.12), Length: ptrTo(0.006), Mass: ptrTo(0.7)}
	d := useDensity(p, true)
	if d.Mass != nil || d.Density == nil {
		t.Fatalf("to density: %+v", d)
	}
	// Solid cylinder volume pi r^2 L (standard geometry).
	want := 0.7 / (math.Pi * 0.12 * 0.12 * 0.006)
	if math.Abs(*d.Density-want) > 1e-9*want {
		t.Errorf("density %g, want %g", *d.Density, want)
	}
	m := useDensity(d, false)
	if m.Density != nil || m.Mass == nil || math.Abs(*m.Mass-0.7) > 1e-12 {
		t.Errorf("back to mass: %+v", m)
	}
	shell := project.Part{Shape: "shell", Radius: ptrTo(0.1), Mass: ptrTo(0.2)}
	if s := useDensity(shell, true); s.Density != nil {
		t.Errorf("a shell took a density: %+v", s)
	}
}

func TestChangeShape_KeepsSharedFields(t *testing.T) {
	p := project.Part{Name: "rim", Shape: "cylinder", Radius: ptrTo(0.2), Length: ptrTo(0.03), Density: ptrTo(900.0),
		Position: &project.Vec3{0, 0, 0.1}, RotationDeg: &project.Vec3{0, 10, 0}}
	c := changeShape(p, "cone")
	if c.Shape != "cone" || c.Name != "rim" || *c.Radius != 0.2 || c.Height == nil || c.Length != nil ||
		*c.Density != 900 || c.Position[2] != 0.1 || c.RotationDeg[1] != 10 {
		t.Errorf("cone: %+v", c)
	}
	s := changeShape(p, "shell")
	if s.Density != nil || s.Mass == nil {
		t.Fatalf("shell kept a density: %+v", s)
	}
	// The shell weighs what the cylinder did: density pi r^2 L.
	if want := 900 * math.Pi * 0.2 * 0.2 * 0.03; math.Abs(*s.Mass-want) > 1e-9 {
		t.Errorf("shell mass %g, want %g", *s.Mass, want)
	}
	for _, shape := range physics.ShapeNames() {
		doc := &project.Document{Prop: project.Prop{Parts: []project.Part{changeShape(p, shape)}}}
		if _, err := doc.Build(); err != nil {
			t.Errorf("%s: %v", shape, err)
		}
		if n := len(shapeDimensions(shape)); n == 0 {
			t.Errorf("%s has no dimension controls", shape)
		}
	}
}

func TestNewPart_EveryShapeBuilds(t *testing.T) {
	for _, shape := range physics.ShapeNames() {
		doc := &project.Document{Prop: project.Prop{Parts: []project.Part{newPart(shape, shape)}}}
		if _, err := doc.Build(); err != nil {
			t.Errorf("%s: %v", shape, err)
		}
	}
	if _, err := emptyDocument().Build(); err != nil {
		t.Errorf("empty document: %v", err)
	}
}

func TestReleaseModes_RoundTrip(t *testing.T) {
	d := &project.Document{Throw: project.Throw{HangTimeS: ptrTo(0.95), Distance: ptrTo(1.2), HeadingDeg: ptrTo(30.0)}}
	g := physics.StandardGravity
	want := physics.VelocityFromHang(0.95, 1.2, 30*math.Pi/180, g)
	setReleaseMode(d, bySpeed)
	v := d.Throw.ReleaseVelocity
	if v == nil || d.Throw.HangTimeS != nil || math.Abs(v[0]-want.X)+math.Abs(v[1]-want.Y)+math.Abs(v[2]-want.Z) > 1e-12 {
		t.Fatalf("to speed: %+v, want %v", d.Throw, want)
	}
	setReleaseMode(d, byHang)
	if math.Abs(*d.Throw.HangTimeS-0.95) > 1e-12 || math.Abs(*d.Throw.Distance-1.2) > 1e-12 || math.Abs(*d.Throw.HeadingDeg-30) > 1e-9 {
		t.Errorf("back to hang: %g s, %g m, %g°", *d.Throw.HangTimeS, *d.Throw.Distance, *d.Throw.HeadingDeg)
	}
	// Speed and angle: v = s (cos a, sin a) in the x-y plane.
	setSpeedAngle(d, 5, 60)
	v = d.Throw.ReleaseVelocity
	if math.Abs(v[0]-2.5) > 1e-12 || math.Abs(v[1]-5*math.Sqrt(3)/2) > 1e-12 || v[2] != 0 {
		t.Errorf("5 m/s at 60°: %v", *v)
	}
	tv := readThrow(d)
	if tv.Mode != bySpeed || math.Abs(tv.Speed-5) > 1e-12 || math.Abs(tv.AngleDeg-60) > 1e-9 {
		t.Errorf("read back: %+v", tv)
	}
}

func TestRateMode_Converts(t *testing.T) {
	d := &project.Document{Throw: project.Throw{FPS: &project.FrameRate{Text: "24000/1001"},
		Spin: &project.Spin{Axis: &project.SpinAxis{Name: "least"}, TurnsPerSecond: ptrTo(2.0)}}}
	setRateMode(d, true)
	fps := 24000.0 / 1001
	if fpt := d.Throw.Spin.FramesPerTurn; fpt == nil || math.Abs(*fpt-fps/2) > 1e-12 || d.Throw.Spin.TurnsPerSecond != nil {
		t.Fatalf("frames per turn: %+v", d.Throw.Spin)
	}
	setRateMode(d, false)
	if tps := d.Throw.Spin.TurnsPerSecond; tps == nil || math.Abs(*tps-2) > 1e-12 {
		t.Errorf("back to turns per second: %+v", d.Throw.Spin)
	}
	if v := readThrow(d); v.TiltToward != "middle" {
		t.Errorf("least axis tilts toward %q by default, want middle", v.TiltToward)
	}
}

func TestRateChoices_MatchTheirLabels(t *testing.T) {
	for _, c := range rateChoices {
		r, err := physics.ParseRate(c.Label)
		if err != nil || r != c.Rate {
			t.Errorf("%s: ParseRate gives %v, %v; choice has %v", c.Label, r, err, c.Rate)
		}
		if rateLabel(c.Rate) != c.Label {
			t.Errorf("rateLabel(%v) = %q", c.Rate, rateLabel(c.Rate))
		}
		d := &project.Document{Throw: project.Throw{FPS: frameRateOf(c.Rate)}}
		if got, err := d.Rate(); err != nil || got != c.Rate {
			t.Errorf("%s written as %+v reads back %v, %v", c.Label, d.Throw.FPS, got, err)
		}
	}
	if rateLabel(physics.Rate{Num: 12, Den: 1}) != customRate {
		t.Error("12 fps is not custom")
	}
}

func TestSafeFileName(t *testing.T) {
	for in, want := range map[string]string{"frying pan flip": "frying-pan-flip", "a/b:c": "abc", "  ": "untitled", "loaf_2": "loaf_2"} {
		if got := safeFileName(in); got != want {
			t.Errorf("safeFileName(%q) = %q, want %q", in, got, want)
		}
	}
}

func TestWindow_CustomFrameRate_KeepsTypedText(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	w.throw.fps.SetSelected(customRate)
	if !w.throw.custom.Visible() || w.throw.custom.Text != "24" {
		t.Fatalf("custom entry visible %v, text %q", w.throw.custom.Visible(), w.throw.custom.Text)
	}
	w.throw.typeRate("12.5")
	if fr := w.ed.Doc().Throw.FPS; fr == nil || fr.IsText() || fr.Number != 12.5 {
		t.Errorf("12.5 stored as %+v", fr)
	}
	if r := w.rate(); r != (physics.Rate{Num: 25, Den: 2}) {
		t.Errorf("rate %v", r)
	}
	w.throw.typeRate("fast")
	if w.result.Err == nil || !strings.Contains(w.result.Err.Error(), "throw.fps") {
		t.Errorf("bad rate error %v does not name throw.fps", w.result.Err)
	}
}
