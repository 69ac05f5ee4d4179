package physics

import (
	"context"
	"math"
	"sort"

	"gonum.org/v1/gonum/spatial/r3"
)

// PlanSpec is what a plan searches for: spin rates in [RateMin, RateMax]
// (rad/s, the |omega| at release) for which the prop lands on Target within
// Tolerance (radians). Only the spin rate varies; the release, the
// orientation and the spin direction are the throw's.
type PlanSpec struct {
	Target     Target
	End        End
	Tolerance  float64 // radians, in (0, pi]
	RateMin    float64 // rad/s, >= 0
	RateMax    float64 // rad/s, > RateMin
	Thresholds Thresholds
}

// Solution is one spin rate that lands the prop as wanted: a local minimum
// of the end-of-flight error, with its window.
type Solution struct {
	Rate       float64 // |omega| at release, rad/s
	Error      float64 // angle between the turned axis and the target direction at the end, radians
	FlightTime float64 // end of the flight at this rate, s
	Turns      float64 // turns in the air: Rate / 2pi * FlightTime
	Motion     Motion  // verdict of the throw at this rate
	// WindowLo and WindowHi bound the widest interval of rates around Rate
	// whose error stays within tolerance (rad/s), cut at the searched range.
	WindowLo, WindowHi float64
}

// Plan is the result of a search over spin rates.
type Plan struct {
	// FlightTime is the end of the flight, s: the catch time, which no
	// spin rate changes; for a ground landing the flight time of the best
	// solution (of the throw's own rate when there is none).
	FlightTime float64
	Solutions  []Solution // ascending by rate; empty when none is within tolerance
	Motion     Motion     // verdict of the spin direction (the same for every rate above zero)
	Rates      []float64  // the grid searched, rad/s
	Errors     []float64  // the end-of-flight error at each grid rate, radians
}

// Best returns the index of the solution with the smallest error, -1 when
// there is none.
func (p *Plan) Best() int {
	best := -1
	for i, s := range p.Solutions {
		if best < 0 || s.Error < p.Solutions[best].Error {
			best = i
		}
	}
	return best
}

// MaxPlanRates bounds the grid of a plan.
const MaxPlanRates = 20000

// Validate checks the spec's numbers; fields are named as the command-line
// flags (without dashes).
func (sp *PlanSpec) Validate() error {
	if err := sp.Target.Validate(); err != nil {
		return err
	}
	if err := validTolerance(sp.Tolerance); err != nil {
		return err
	}
	switch {
	case !finite(sp.RateMin) || sp.RateMin < 0:
		return fieldErr("rate-min", "must be zero or a positive number of turns per second")
	case !finite(sp.RateMax) || sp.RateMax <= 0 || sp.RateMax > 2*math.Pi*1000:
		return fieldErr("rate-max", "must be positive and at most 1000 turns per second")
	case sp.RateMin >= sp.RateMax:
		return fieldErr("rate-min", "must be below rate-max")
	}
	return nil
}

func validTolerance(t float64) error {
	if !(t > 0 && t <= math.Pi) {
		return fieldErr("tolerance-deg", "must be more than 0 and at most 180 degrees")
	}
	return nil
}

// planner evaluates the end of the flight for any spin rate about the
// throw's spin direction.
type planner struct {
	th     *Throw
	f      *flight
	target Target
	axis   r3.Vec // unit, prop frame
	dir    r3.Vec // unit, world
	motion *scaledMotion
	catch  bool
	tEnd   float64 // catch time, or when the CM reaches the ground
	tNear  float64 // ground landing: no contact before this
	l1     r3.Vec  // unit-rate body angular momentum
}

// newPlanner prepares the unit-rate motion for rates up to rateMax.
func newPlanner(p *Prop, mp *MassProps, th *Throw, tg Target, end End, rateMax float64) (*planner, error) {
	if err := p.Validate(); err != nil {
		return nil, err
	}
	if err := th.Validate(); err != nil {
		return nil, err
	}
	if err := tg.Validate(); err != nil {
		return nil, err
	}
	unit := *th
	unit.Spin.Rate = 1
	pl := &planner{th: th, f: newFlight(p, mp, th), target: tg, axis: r3.Unit(tg.Axis), dir: r3.Unit(tg.Dir), catch: end.Catch}
	s0 := pl.f.initial(mp)
	s0.L = newFlight(p, mp, &unit).initial(mp).L
	pl.l1 = s0.L
	if c := pl.f.clearance(0, s0); c <= 0 {
		return nil, fieldErr("throw.release_position", "the prop starts at or below the ground (its lowest point is %.3g m below ground_y)", -c)
	}
	if end.Catch {
		t, err := end.catchTime(th)
		if err != nil {
			return nil, err
		}
		pl.tEnd = t
	} else {
		pl.tEnd = th.groundTime()
		if !(pl.tEnd <= MaxFlight) {
			return nil, ErrNoLanding
		}
		pl.tNear = th.nearTime(pl.f.reach)
	}
	m, ok := newScaledMotion(pl.f.rot, s0, rateMax*pl.tEnd+1)
	if !ok {
		return nil, fieldErr("rate-max", "the flight at this rate needs more than %g integration steps; lower rate-max or shorten the flight", float64(MaxSteps))
	}
	pl.motion = m
	return pl, nil
}

// end returns the end of the flight at spin rate r (rad/s) and the turned
// target axis there (world, unit).
func (pl *planner) end(r float64) (float64, r3.Vec) {
	t := pl.tEnd
	if !pl.catch {
		t = pl.contact(r)
	}
	q := pl.f.propOrient(pl.motion.at(r * t))
	return t, q.Rotate(pl.axis)
}

// contact returns the first ground contact at rate r, checked on the same
// grid of times as Simulate (after every integration step once the centre
// of mass is within the prop's reach of the ground) and root-found between.
func (pl *planner) contact(r float64) float64 {
	dt := pl.th.FPS.Time(1)
	n := pl.f.rot.substeps(r3.Scale(r, pl.l1), dt)
	h := dt / float64(n)
	clear := func(t float64) float64 { return pl.f.clearance(t, pl.motion.at(r*t)) }
	j := math.Floor(pl.tNear / h)
	ta := j * h
	ca := clear(ta)
	for ta < pl.tEnd+h {
		tb := ta + h
		cb := clear(tb)
		if cb <= 0 {
			if ca <= 0 { // touching at the first check (a prop released near the ground)
				return ta
			}
			return brentZero(clear, ta, tb, ca, cb, 1e-13*math.Max(1, tb))
		}
		ta, ca = tb, cb
	}
	return pl.tEnd // not reached: the lowest point is never above the CM
}

// errAt returns the end-of-flight error at rate r as chord2 (see aim.go).
func (pl *planner) cost(r float64) float64 {
	_, a := pl.end(r)
	return chord2(a, pl.dir)
}

// PlanLanding searches the spin rates of spec for those that land prop
// (mass properties mp) thrown by th on the target: every local minimum of
// the end-of-flight error within the tolerance, refined by Brent's method,
// with its window and its turns in the air.
//
// The error is first sampled on a grid fine enough that the target axis
// turns by at most min(tolerance/2, 4 degrees) between neighbours at the
// end of the flight (d/dr of Q_1(r t) turns the axis at most t |omega_1|
// per unit rate, with |omega_1| the unit-rate motion's largest angular
// speed), so that a tumble's irregular error curve is bracketed too; each bracket is then refined, and
// each window's edges root-found. The grid holds at least 64 and at most
// MaxPlanRates rates; at the cap a very fast or long range is sampled more
// coarsely than that rule. ctx may cancel the search (nil: never).
func PlanLanding(ctx context.Context, p *Prop, mp *MassProps, th *Throw, spec PlanSpec) (*Plan, error) {
	if err := spec.Validate(); err != nil {
		return nil, err
	}
	pl, err := newPlanner(p, mp, th, spec.Target, spec.End, spec.RateMax)
	if err != nil {
		return nil, err
	}
	lo, hi := spec.RateMin, spec.RateMax
	step := math.Min(spec.Tolerance/2, 4*math.Pi/180) / (pl.motion.maxOmega() * pl.tEnd)
	n := int(math.Ceil((hi-lo)/step)) + 1
	n = max(64, min(n, MaxPlanRates))
	plan := &Plan{Rates: make([]float64, n), Errors: make([]float64, n)}
	cost := make([]float64, n)
	for i := range n {
		if i%256 == 0 && ctx != nil && ctx.Err() != nil {
			return nil, ctx.Err()
		}
		r := lo + (hi-lo)*float64(i)/float64(n-1)
		plan.Rates[i] = r
		cost[i] = pl.cost(r)
		plan.Errors[i] = chordAngle(cost[i])
	}
	tolC := chord2FromAngle(spec.Tolerance)
	rateTol := 1e-10 * math.Max(1, hi)
	for i := range n {
		left := i == 0 || cost[i] <= cost[i-1]
		right := i == n-1 || cost[i] < cost[i+1]
		if !left || !right || (i == 0 && n > 1 && cost[0] == cost[1]) {
			continue
		}
		a, b := plan.Rates[max(i-1, 0)], plan.Rates[min(i+1, n-1)]
		r, c := brentMin(pl.cost, a, b, plan.Rates[i], rateTol)
		if c > cost[i] { // a rough curve: keep the grid point
			r, c = plan.Rates[i], cost[i]
		}
		if c > tolC {
			continue
		}
		if k := len(plan.Solutions); k > 0 && math.Abs(plan.Solutions[k-1].Rate-r) <= 10*rateTol {
			continue // two brackets found the same minimum
		}
		t, _ := pl.end(r)
		sol := Solution{Rate: r, Error: chordAngle(c), FlightTime: t, Turns: r / (2 * math.Pi) * t}
		sol.WindowLo = pl.windowEdge(plan, cost, tolC, r, -1, rateTol)
		sol.WindowHi = pl.windowEdge(plan, cost, tolC, r, +1, rateTol)
		rt := *th
		rt.Spin.Rate = r
		sol.Motion = Judge(mp, &rt, spec.Thresholds).Motion
		plan.Solutions = append(plan.Solutions, sol)
	}
	sort.Slice(plan.Solutions, func(i, j int) bool { return plan.Solutions[i].Rate < plan.Solutions[j].Rate })
	rt := *th
	rt.Spin.Rate = 1
	plan.Motion = Judge(mp, &rt, spec.Thresholds).Motion
	switch {
	case pl.catch:
		plan.FlightTime = pl.tEnd
	case plan.Best() >= 0:
		plan.FlightTime = plan.Solutions[plan.Best()].FlightTime
	case th.Spin.Rate <= spec.RateMax:
		plan.FlightTime, _ = pl.end(th.Spin.Rate)
	default:
		// The throw's own rate lies above the range the scaled motion
		// covers: fly it in real time, as Simulate does.
		t, _, err := pl.f.flyToEnd(pl.f.initial(mp), spec.End)
		if err != nil {
			return nil, err
		}
		plan.FlightTime = t
	}
	return plan, nil
}

// windowEdge walks the grid from the solution at rate r in direction dir
// (-1 down, +1 up) to the first rate outside tolerance and root-finds the
// edge between it and the last rate inside; the range's end if none is.
func (pl *planner) windowEdge(plan *Plan, cost []float64, tolC, r float64, dir int, rateTol float64) float64 {
	rates := plan.Rates
	n := len(rates)
	// First grid index strictly beyond r in direction dir.
	j := sort.SearchFloat64s(rates, r)
	if dir < 0 {
		j--
		for j >= 0 && rates[j] >= r {
			j--
		}
	} else {
		for j < n && rates[j] <= r {
			j++
		}
	}
	inside := r
	for j >= 0 && j < n && cost[j] <= tolC {
		inside = rates[j]
		j += dir
	}
	if j < 0 {
		return rates[0]
	}
	if j >= n {
		return rates[n-1]
	}
	g := func(x float64) float64 { return pl.cost(x) - tolC }
	a, b := inside, rates[j]
	return brentZero(g, a, b, g(a), cost[j]-tolC, rateTol)
}

// chord2FromAngle is the chord2 of an error angle theta (radians).
func chord2FromAngle(theta float64) float64 {
	s := 2 * math.Sin(theta/2)
	return s * s
}
