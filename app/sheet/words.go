package sheet

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// item is one "label: value" line of a summary block.
type item struct{ label, value string }

// axisName returns "least axis", "middle axis" or "greatest axis".
func axisName(a physics.Axis) string { return a.String() + " axis" }

// headline returns the verdict in a few plain words, and why: the numbers
// and thresholds that decided it.
func (s *sheet) headline() (title, why string) {
	v := &s.v
	thr := s.thr
	exc := fixed(v.ExcursionDeg, 1) + "°"
	if v.L == 0 {
		return "No spin: the prop keeps its release orientation",
			"The throw gives the prop no spin, so it flies without turning; only its centre of mass moves, on its parabola."
	}
	switch v.Motion {
	case physics.Tumbling:
		t := "Tumble: irregular end-over-end flips"
		w := "The spin is close to the middle axis, the unstable one. Its angular momentum swings up to " + exc +
			" from the " + axisName(v.Circles) + ", at or over the " + fixed(thr.TumbleDeg, 0) + "° tumble threshold"
		if v.HasFlip && !math.IsInf(v.FlipPeriod, 0) {
			w += ", and the middle axis reverses every " + sig(v.FlipPeriod, 3) + " s (" + sig(v.FlipPeriod*s.fps(), 3) + " frames)"
		}
		return t, w + ". Each flip is marked in the frame table."
	case physics.Wobbling:
		sym := "the least axis (prolate: I2 ≈ I3)"
		if v.Symmetry == physics.Oblate {
			sym = "the greatest axis (oblate: I1 ≈ I2)"
		}
		return "Wobble locked to the spin: " + sig(v.WobblesPerTurn, 3) + " wobbles per turn",
			"The prop is symmetric about " + sym + " and spins " + exc + " off that axis, between the " +
				fixed(thr.WobbleMinDeg, 1) + "° and " + fixed(90-thr.WobbleMinDeg, 1) + "° wobble limits. The tilt stays fixed while the axis circles the angular momentum " +
				sig(v.WobblesPerTurn, 3) + " times per turn of the axial spin (" + sig(v.WobblesPerEulerTurn, 3) + " per Euler-angle turn)."
	}
	switch v.Symmetry {
	case physics.Spherical:
		return "Steady spin", "All three principal moments are equal (within " + fixed(100*thr.SymmetryTol, 1) + " %), so any spin stays steady."
	case physics.Prolate, physics.Oblate:
		if v.ExcursionDeg > 90-thr.WobbleMinDeg {
			return "Steady end-over-end spin",
				"The prop is " + v.Symmetry.String() + " and spins within " + fixed(90-v.ExcursionDeg, 1) + "° of an axis square to its symmetry axis (over the " +
					fixed(90-thr.WobbleMinDeg, 1) + "° limit): it turns end over end without a visible wobble."
		}
		return "Steady spin about the " + axisName(v.Circles),
			"The prop is " + v.Symmetry.String() + " and spins within " + exc + " of its symmetry axis, the " + axisName(v.Circles) +
				" (under the " + fixed(thr.WobbleMinDeg, 1) + "° wobble limit): no visible wobble."
	}
	w := "The angular momentum stays within " + exc + " of the " + axisName(v.Circles) + ", under the " +
		fixed(thr.TumbleDeg, 0) + "° tumble threshold, so the prop turns steadily about it."
	if v.HasOnset {
		w += " The release spin is within " + fixed(physics.NearMiddleDeg, 0) + "° of the middle axis, so watch for the onset frame below."
	}
	return "Steady spin about the " + axisName(v.Circles), w
}

func (s *sheet) fps() float64 { return s.sc.Throw.FPS.FPS() }

// atFrame describes time t as "0.212 s, frame 6" (the first frame at or
// after t), noting a frame past the take's last.
func (s *sheet) atFrame(t float64) string {
	f := s.sc.Throw.FPS.FrameAtOrAfter(t)
	out := sig(t, 3) + " s, frame " + s.frameNo(f)
	if f > len(s.tk.Frames)-1 {
		out += " (after landing)"
	}
	return out
}

// verdictItems returns the verdict's numbers.
func (s *sheet) verdictItems() []item {
	v := &s.v
	tk := s.tk
	th := &s.sc.Throw
	last := len(tk.Frames) - 1
	items := []item{
		{"motion", v.Motion.String()},
		{"symmetry", v.Symmetry.String()},
		{"circles", axisName(v.Circles)},
		{"excursion", fixed(v.ExcursionDeg, 1) + "°"},
	}
	switch {
	case v.HasWobble:
		items = append(items, item{"wobbles per turn", sig(v.WobblesPerTurn, 3) + " (" + sig(v.WobblesPerEulerTurn, 3) + " per Euler-angle turn)"})
	case v.HasRatio:
		items = append(items, item{"wobbles per turn", sig(v.WobblesPerTurn, 3) + " about the " + axisName(v.Circles)})
	default:
		items = append(items, item{"wobbles per turn", "— (none for a tumble or end over end)"})
	}
	if v.HasRatio && v.PrecessionRate > 0 {
		period := 2 * math.Pi / v.PrecessionRate
		items = append(items, item{"one wobble every", sig(period*s.fps(), 3) + " frames (" + sig(period, 3) + " s)"})
	}
	switch {
	case !v.HasFlip:
		items = append(items, item{"flip period", "— (a tumble only)"}, item{"first flip", "—"})
	case math.IsInf(v.FlipPeriod, 0):
		items = append(items, item{"flip period", "none: on the separatrix"}, item{"first flip", "—"})
	default:
		items = append(items, item{"flip period", sig(v.FlipPeriod, 3) + " s = " + sig(v.FlipPeriod*s.fps(), 3) + " frames"})
		if v.FirstFlipFound {
			items = append(items, item{"first flip", s.atFrame(v.FirstFlip)})
		} else {
			items = append(items, item{"first flip", "none found"})
		}
	}
	switch {
	case !v.HasOnset:
		items = append(items, item{"onset", "— (spin not near the middle axis)"})
	case math.IsInf(v.Onset, 0):
		items = append(items, item{"onset", "never: exactly on the middle axis"})
	default:
		items = append(items, item{"onset", s.atFrame(v.Onset) + "; growth " + sig(v.GrowthRate, 3) + " /s"})
	}
	items = append(items,
		item{"flight", plural(len(tk.Frames), "frame") + " (" + s.frameNo(0) + "–" + s.frameNo(last) + "), " + fixed(tk.FlightTime, 3) + " s to contact"})
	if tk.ApexTime > 0 {
		items = append(items, item{"apex", "frame " + s.frameNo(tk.ApexFrame) + " (top at " + fixed(tk.ApexTime, 3) + " s, centre of mass y " + fixed(th.CMAt(tk.ApexTime).Y, 3) + " m)"})
	} else {
		items = append(items, item{"apex", "frame " + s.frameNo(0) + ": the throw starts level or downward"})
	}
	items = append(items,
		item{"landing", "frame " + s.frameNo(tk.LandingFrame) + " (first contact at " + fixed(tk.FlightTime, 3) + " s = frame " + fixed(float64(s.opt.StartFrame)+tk.FlightTime*s.fps(), 2) + ")"},
		item{"rules", "symmetry within " + sig(100*s.thr.SymmetryTol, 3) + " %, tumble at " + sig(s.thr.TumbleDeg, 3) + "° or more, wobble " +
			sig(s.thr.WobbleMinDeg, 3) + "° to " + sig(90-s.thr.WobbleMinDeg, 3) + "°"},
	)
	return items
}

// partDims describes a part's shape dimensions in metres.
func partDims(p *physics.Part) string {
	m := func(x float64) string { return sig(x, 4) }
	switch p.Shape {
	case physics.Box:
		return m(p.Size.X) + " × " + m(p.Size.Y) + " × " + m(p.Size.Z) + " m"
	case physics.Cylinder:
		return "radius " + m(p.Radius) + ", length " + m(p.Length) + " m"
	case physics.Tube:
		return "radius " + m(p.Radius) + ", inner " + m(p.InnerRadius) + ", length " + m(p.Length) + " m"
	case physics.Sphere:
		return "radius " + m(p.Radius) + " m"
	case physics.Shell:
		return "radius " + m(p.Radius) + " m, thin hollow"
	case physics.Ellipsoid:
		return "semi-axes " + m(p.SemiAxes.X) + " × " + m(p.SemiAxes.Y) + " × " + m(p.SemiAxes.Z) + " m"
	case physics.Cone:
		return "radius " + m(p.Radius) + ", height " + m(p.Height) + " m"
	case physics.Torus:
		return "radius " + m(p.Radius) + ", tube " + m(p.TubeRadius) + " m"
	case physics.MeshShape:
		if p.Mesh == nil {
			break
		}
		lo, hi := p.Mesh.Bounds()
		s := itoa(len(p.Mesh.T)) + " triangles in " + m(hi.X-lo.X) + " × " + m(hi.Y-lo.Y) + " × " + m(hi.Z-lo.Z) + " m"
		if p.Wall > 0 {
			s += ", wall " + m(p.Wall) + " m"
		}
		return s
	}
	return "—"
}

// partMass describes a part's mass in kg, with the density it came from.
func partMass(p *physics.Part) string {
	s := sig(p.TotalMass(), 4) + " kg"
	if p.Mass <= 0 && p.Density > 0 {
		s += " (" + sig(p.Density, 4) + " kg/m³)"
	}
	return s
}

// massItems returns the mass properties in the prop frame.
func (s *sheet) massItems() []item {
	mp := &s.sc.Mass
	items := []item{
		{"mass", sig(mp.Mass, 4) + " kg"},
		{"centre of mass", vec(mp.CM, 4) + " m"},
	}
	for i := range 3 {
		items = append(items, item{"I" + itoa(i+1) + " " + physics.Axis(i).String(),
			sig(mp.Moments[i], 4) + " kg·m² about " + vec(mp.Axes[i], 3)})
	}
	sym := mp.Moments
	word := physics.SymmetryOf(sym, s.thr.SymmetryTol).String()
	switch physics.SymmetryOf(sym, s.thr.SymmetryTol) {
	case physics.Prolate:
		word += " (I2 ≈ I3)"
	case physics.Oblate:
		word += " (I1 ≈ I2)"
	case physics.Spherical:
		word += " (I1 ≈ I2 ≈ I3)"
	}
	items = append(items, item{"symmetry", word})
	return items
}

// rotationWords describes a prop-to-world rotation as an angle about a
// world axis.
func rotationWords(q physics.Rotation) string {
	o := q.Normalize()
	v := r3.Vec{X: o.Imag, Y: o.Jmag, Z: o.Kmag}
	n := r3.Norm(v)
	angle := 2 * math.Atan2(n, math.Abs(o.Real))
	if angle < 1e-9 || n == 0 {
		return "none (prop frame = world)"
	}
	if o.Real < 0 {
		v = r3.Scale(-1, v)
	}
	return fixed(deg(angle), 1) + "° about " + vec(r3.Scale(1/n, v), 3)
}

// throwItems returns the throw: frame rate, release, spin and world.
func (s *sheet) throwItems() []item {
	th := &s.sc.Throw
	mp := &s.sc.Mass
	rate := th.FPS.String() + " fps"
	if th.FPS.Den != 1 {
		rate += " (" + sig(th.FPS.FPS(), 5) + ")"
	}
	speed := r3.Norm(th.Velocity)
	items := []item{
		{"frame rate", rate},
		{"release position", vec(th.Position, 4) + " m (centre of mass, world)"},
		{"release velocity", vec(th.Velocity, 4) + " m/s, speed " + fixed(speed, 3) + " m/s"},
		{"orientation", rotationWords(th.Orient)},
	}
	sp := th.Spin
	var axis string
	switch {
	case sp.Rate == 0:
		axis = "— (no spin)"
	case sp.Axis == physics.Free:
		axis = "the prop-frame vector " + vec(th.SpinAxis(mp), 3)
	default:
		axis = axisName(sp.Axis)
		if sp.Tilt != 0 {
			axis += " tilted " + fixed(deg(sp.Tilt), 1) + "° toward the " + axisName(sp.TiltToward)
		}
		axis += " = " + vec(th.SpinAxis(mp), 3) + " in the prop frame"
	}
	items = append(items, item{"spin axis", axis})
	if sp.Rate > 0 {
		turns := sp.Rate / (2 * math.Pi)
		items = append(items, item{"spin rate", sig(turns, 4) + " turns/s = " + sig(sp.Rate, 4) + " rad/s = " + sig(th.FPS.FPS()/turns, 4) + " frames per turn"})
	} else {
		items = append(items, item{"spin rate", "0"})
	}
	items = append(items,
		item{"gravity", sig(th.Gravity, 6) + " m/s² along −y"},
		item{"ground", "y = " + fixed(th.GroundY, 4) + " m"},
	)
	return items
}
