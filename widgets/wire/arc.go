package wire

import (
	"math"
	"strconv"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// The centre-of-mass arc and its frame ticks.

// arcAt returns the centre of mass at time t from the take's frames: the
// quadratic through three neighbouring frames (Lagrange form). The centre
// of mass of a take rides a parabola in time, which three samples give
// exactly, so the arc is exact between frames and out to landing.
func arcAt(fr []physics.Frame, i int, t float64) r3.Vec {
	n := len(fr)
	switch {
	case n == 1:
		return fr[0].CM
	case n == 2:
		t0, t1 := fr[0].Time, fr[1].Time
		u := (t - t0) / (t1 - t0)
		return r3.Add(fr[0].CM, r3.Scale(u, r3.Sub(fr[1].CM, fr[0].CM)))
	}
	j := min(max(i, 0), n-3) // frames j, j+1, j+2
	a, b, c := &fr[j], &fr[j+1], &fr[j+2]
	la := (t - b.Time) * (t - c.Time) / ((a.Time - b.Time) * (a.Time - c.Time))
	lb := (t - a.Time) * (t - c.Time) / ((b.Time - a.Time) * (b.Time - c.Time))
	lc := (t - a.Time) * (t - b.Time) / ((c.Time - a.Time) * (c.Time - b.Time))
	return r3.Add(r3.Add(r3.Scale(la, a.CM), r3.Scale(lb, b.CM)), r3.Scale(lc, c.CM))
}

// arcEnd returns the centre of mass at the landing instant, when the take
// records one after its last frame.
func arcEnd(tk *physics.Take) (r3.Vec, bool) {
	fr := tk.Frames
	n := len(fr)
	if n < 2 || !(tk.FlightTime > fr[n-1].Time) || !finite(tk.FlightTime) {
		return r3.Vec{}, false
	}
	return arcAt(fr, n-3, tk.FlightTime), true
}

// arc draws the centre-of-mass path from release to landing.
func (d *drawer) arc(tk *physics.Take) {
	fr := tk.Frames
	prev := fr[0].CM
	for i := 0; i+1 < len(fr); i++ {
		t0, t1 := fr[i].Time, fr[i+1].Time
		for s := 1; s <= ArcSteps; s++ {
			var p r3.Vec
			if s == ArcSteps {
				p = fr[i+1].CM
			} else {
				p = arcAt(fr, i, t0+(t1-t0)*float64(s)/ArcSteps)
			}
			d.segment3(prev, p, Arc, 1)
			prev = p
		}
	}
	if end, ok := arcEnd(tk); ok {
		n := len(fr)
		t0, t1 := fr[n-1].Time, tk.FlightTime
		steps := max(1, int(math.Ceil(ArcSteps*(t1-t0)/(fr[n-1].Time-fr[n-2].Time))))
		for s := 1; s <= steps; s++ {
			p := end
			if s < steps {
				p = arcAt(fr, n-3, t0+(t1-t0)*float64(s)/float64(steps))
			}
			d.segment3(prev, p, Arc, 1)
			prev = p
		}
	}
}

// ticks draws a short tick across the arc at every frame, perpendicular to
// the arc on the screen, longer at release, apex, the last frame and the
// current frame, and labels the first three with their frame numbers.
func (d *drawer) ticks(tk *physics.Take, cur int) {
	d.avoid = d.propDisc(tk.Frames[cur].CM)
	fr := tk.Frames
	n := len(fr)
	pts := make([][2]float64, n)
	vis := make([]bool, n)
	for i := range fr {
		x, y, ok := d.lens.Project(fr[i].CM)
		pts[i], vis[i] = [2]float64{x, y}, ok
	}
	apex := min(max(tk.ApexFrame, 0), n-1)
	for i := range fr {
		if !vis[i] {
			continue
		}
		a, b := max(i-1, 0), min(i+1, n-1)
		if !vis[a] {
			a = i
		}
		if !vis[b] {
			b = i
		}
		dx, dy := pts[b][0]-pts[a][0], pts[b][1]-pts[a][1]
		l := math.Hypot(dx, dy)
		nrm := [2]float64{0, -1} // the arc runs at the camera: tick upright
		if l > 1e-9 {
			nrm = [2]float64{dy / l, -dx / l}
			if nrm[1] > 0 { // keep the normal pointing up the screen for labels
				nrm = [2]float64{-nrm[0], -nrm[1]}
			}
		}
		half := TickHalf
		key := i == 0 || i == apex || i == n-1
		if key || i == cur {
			half = KeyTickHalf
		}
		p := pts[i]
		d.segment2([2]float64{p[0] - half*nrm[0], p[1] - half*nrm[1]}, [2]float64{p[0] + half*nrm[0], p[1] + half*nrm[1]}, Tick, 1)
		if key {
			d.labelBeside(p, nrm, d.clearOf(p, nrm, half+3), strconv.Itoa(fr[i].N), Tick)
		}
	}
}
