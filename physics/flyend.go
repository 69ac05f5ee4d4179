package physics

import "math"

// flyToEnd integrates the flight f from its release state s0 in real time
// to the end of the flight only (no frames kept) and returns the end time
// and the body state there. The step rule and the ground checks are those
// of Simulate, so a ground landing agrees with the take's FlightTime.
//
// A catch ends at the catch time, reached by whole steps and one partial
// step; a ground landing at the first contact of the lowest point, root-
// found as in Simulate. The field of a refusal is that of Simulate's.
func (f *flight) flyToEnd(s0 body, end End) (float64, body, error) {
	th := f.th
	tEnd := th.groundTime()
	if end.Catch {
		t, err := end.catchTime(th)
		if err != nil {
			return 0, body{}, err
		}
		tEnd = t
	}
	if !(tEnd <= MaxFlight) {
		return 0, body{}, ErrNoLanding
	}
	dt := th.FPS.Time(1)
	n := f.rot.substeps(s0.L, dt)
	h := dt / float64(n)
	if steps := tEnd / h; steps > MaxSteps {
		return 0, body{}, fieldErr("throw.spin.turns_per_second", "the flight needs about %.3g integration steps, more than %g", steps, float64(MaxSteps))
	}
	st := stepper{rot: &f.rot, h: h}
	s := s0
	if end.Catch {
		m := int(math.Floor(tEnd / h))
		for range m {
			s = st.next(s)
		}
		if rest := tEnd - float64(m)*h; rest > 0 {
			s = f.rot.step(s, rest)
		}
		return tEnd, s, nil
	}
	if c := f.clearance(0, s); c <= 0 {
		return 0, body{}, fieldErr("throw.release_position", "the prop starts at or below the ground (its lowest point is %.3g m below ground_y)", -c)
	}
	// Simulate's step times are frame k's time plus j h; k n + j steps of h
	// from release reach the same times up to round-off.
	for j := 0; ; j++ {
		ta := float64(j) * h
		tb := float64(j+1) * h
		next := st.next(s)
		if th.CMAt(tb).Y-f.reach <= th.GroundY && f.clearance(tb, next) <= 0 {
			tl := f.landingTime(ta, s, tb)
			return tl, f.rot.step(s, tl-ta), nil
		}
		s = next
		if tb > tEnd+2*h { // cannot happen: the lowest point is never above the CM
			return tb, s, nil
		}
	}
}
