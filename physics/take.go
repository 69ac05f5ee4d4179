package physics

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// Frame is one sample of a take, at frame N.
type Frame struct {
	N       int
	Time    float64  // seconds after release
	CM      r3.Vec   // centre of mass, world, m
	Orient  Rotation // prop frame -> world
	Omega   r3.Vec   // angular velocity, world axes, rad/s
	TurnDeg float64  // angle turned since the previous frame along the motion, degrees (0 at frame 0; see Take)
	Spacing float64  // centre-of-mass distance since the previous frame, m (0 at frame 0)
}

// Take is the simulated flight: one frame per frame of the throw's rate,
// from release (frame 0) to the landing frame.
//
// A frame's TurnDeg is the angle the prop turns along its integrated motion
// since the previous frame, the integral of |omega| dt over the frame
// (Gauss quadrature over the integration steps, so it does not depend on
// them). It is not the angle between the two end orientations, which can
// never exceed half a turn: a steady spin of 240 degrees a frame gives 240,
// not 120, and for a steady spin about a fixed axis it is exactly 360
// rate/fps. Turns add: the turn over several frames, on twos or in total,
// is the sum of their TurnDeg. Where the axis of rotation moves it is a
// little more than the angle between the end orientations.
type Take struct {
	Frames       []Frame
	FlightTime   float64 // first ground contact of the prop's lowest point, s
	LandingFrame int     // last frame at or before FlightTime
	ApexTime     float64 // top of the centre-of-mass arc, s (0 for a downward throw)
	ApexFrame    int     // frame nearest ApexTime, at most LandingFrame
}

// MaxFlight is the longest flight Simulate follows, in seconds, and
// MaxFrames the most frames a take may hold (about 10 MB of frames).
//
// MaxSteps bounds the integration steps of one take, so that no throw
// runs for hours (a 600 s flight at 1000 turns per second needs about
// 1.1e7, thin prop or not).
const (
	MaxFlight = 600.0
	MaxFrames = 100000
	MaxSteps  = 5e7
)

// errUnsolved reports a take whose implicit stage equations did not
// converge (never seen; rigid.go), rather than hand out an inaccurate one.
var errUnsolved = errors.New("throw: the rotation could not be integrated to full accuracy")

// ErrNoLanding is returned when the prop does not reach the ground within
// MaxFlight seconds.
var ErrNoLanding = errors.New("the prop does not reach the ground")

// flight holds what the take needs at any time: the throw, the rotor and
// the parts relative to the centre of mass.
type flight struct {
	th    *Throw
	rot   rotor
	qp    Rotation // principal frame -> prop frame
	parts []flightPart
	reach float64 // no point of the prop is farther than this from its CM, m
}

type flightPart struct {
	part   *Part
	offset r3.Vec   // part centre relative to the prop's CM, prop frame
	orient Rotation // part frame -> prop frame
}

func newFlight(p *Prop, mp *MassProps, th *Throw) *flight {
	f := &flight{th: th, rot: newRotor(mp.Moments), qp: RotationFromMat(mp.PrincipalMat())}
	for i := range p.Parts {
		pt := &p.Parts[i]
		fp := flightPart{part: pt, offset: r3.Sub(pt.Center(), mp.CM), orient: pt.Orient.Normalize()}
		f.parts = append(f.parts, fp)
		f.reach = math.Max(f.reach, r3.Norm(fp.offset)+pt.Reach())
	}
	return f
}

// initial returns the body state at release.
func (f *flight) initial(mp *MassProps) body {
	w := f.qp.RotateInv(f.th.Omega(mp)) // prop frame -> principal frame
	l := r3.Vec{X: mp.Moments[0] * w.X, Y: mp.Moments[1] * w.Y, Z: mp.Moments[2] * w.Z}
	return body{L: l, Q: f.th.Orient.Normalize().Mul(f.qp).Normalize()}
}

// propOrient returns the prop-frame -> world rotation of body state s.
func (f *flight) propOrient(s body) Rotation {
	return s.Q.Mul(f.qp.Inverse()).Normalize()
}

// clearance returns the height of the prop's lowest point above the ground
// at time t for body state s: the exact support of every part.
func (f *flight) clearance(t float64, s body) float64 {
	q := f.propOrient(s)
	cy := f.th.CMAt(t).Y
	low := math.Inf(1)
	down := r3.Vec{Y: -1}
	for i := range f.parts {
		fp := &f.parts[i]
		qw := q.Mul(fp.orient)
		u := qw.RotateInv(down) // world down in the part's own frame
		y := cy + q.Rotate(fp.offset).Y - fp.part.LocalSupport(u)
		low = math.Min(low, y)
	}
	return low - f.th.GroundY
}

// Simulate flies prop with the throw th and returns the take. mp must be
// prop's mass properties. The orientation is integrated as described in
// rigid.go; the centre of mass is on its exact parabola. Landing is the
// first time the lowest point of any part meets the ground: the clearance
// is checked after every integration step and the crossing is root-found.
func Simulate(p *Prop, mp *MassProps, th *Throw) (*Take, error) {
	if err := p.Validate(); err != nil {
		return nil, err
	}
	if err := th.Validate(); err != nil {
		return nil, err
	}
	f := newFlight(p, mp, th)
	s := f.initial(mp)
	if c := f.clearance(0, s); c <= 0 {
		return nil, fieldErr("throw.release_position", "the prop starts at or below the ground (its lowest point is %.3g m below ground_y)", -c)
	}
	dt := th.FPS.Time(1)
	n := f.rot.substeps(s.L, dt) // |L| is conserved, so one count serves
	h := dt / float64(n)
	maxFrames := int(MaxFlight/dt) + 1
	capped := maxFrames > MaxFrames
	maxFrames = min(maxFrames, MaxFrames)
	// The landing comes no later than the centre of mass reaching the
	// ground (the lowest point is never above the centre of mass), so the
	// work is bounded before it starts. Steps are sized by the motion's
	// fastest rate (rigid.go), so within Throw.Validate's limits (1000
	// turns/s, MaxFlight) this stays near 1e7; the check is a backstop.
	if steps := float64(n) * float64(min(maxFrames, th.FPS.Frame(math.Min(th.groundTime(), MaxFlight))+2)); steps > MaxSteps {
		return nil, fieldErr("throw.spin.turns_per_second",
			"the flight needs about %.3g integration steps, more than %g; lower the spin or shorten the flight",
			steps, float64(MaxSteps))
	}

	// Every substep has the same size h, so each step's stages start the
	// next; frame k is reached after k n steps (k n h = k dt up to round-off).
	st := stepper{rot: &f.rot, h: h}
	take := &Take{}
	appendFrame := func(k int, t float64, b body) {
		fr := Frame{N: k, Time: t, CM: th.CMAt(t), Orient: f.propOrient(b), Omega: b.Q.Rotate(f.rot.omega(b.L))}
		if k > 0 {
			prev := &take.Frames[k-1]
			fr.TurnDeg = st.turned * 180 / math.Pi
			fr.Spacing = r3.Norm(r3.Sub(fr.CM, prev.CM))
		}
		take.Frames = append(take.Frames, fr)
	}
	appendFrame(0, 0, s)
	for k := 0; k < maxFrames; k++ {
		t0 := th.FPS.Time(k)
		st.turned = 0
		for j := range n {
			ta := t0 + float64(j)*h
			tb := t0 + float64(j+1)*h
			next := st.next(s)
			// The exact clearance only matters once the CM is within the
			// prop's reach of the ground.
			near := th.CMAt(tb).Y-f.reach <= th.GroundY
			if near && f.clearance(tb, next) <= 0 {
				if st.unsolved > 0 {
					return nil, errUnsolved
				}
				tl := f.landingTime(ta, s, tb)
				take.FlightTime = tl
				take.LandingFrame = min(th.FPS.Frame(tl), len(take.Frames)-1)
				take.Frames = take.Frames[:take.LandingFrame+1]
				take.ApexTime = th.ApexTime()
				take.ApexFrame = min(th.FPS.Nearest(take.ApexTime), take.LandingFrame)
				return take, nil
			}
			s = next
		}
		appendFrame(k+1, th.FPS.Time(k+1), s)
	}
	if capped {
		return nil, fieldErr("throw.fps", "the flight is longer than %d frames at %v fps; lower the frame rate or shorten the throw", MaxFrames, th.FPS)
	}
	return nil, fmt.Errorf("throw: %w within %g s (check ground_y and release_velocity)", ErrNoLanding, MaxFlight)
}

// landingTime finds the contact time in (ta, tb] where the clearance, which
// is positive at ta (state sa) and not at tb, reaches zero. It uses the
// Illinois variant of regula falsi (Dowell & Jarratt, BIT 11, 1971), each
// trial time reached by one integration step from ta.
func (f *flight) landingTime(ta float64, sa body, tb float64) float64 {
	g := func(t float64) float64 {
		if t == ta {
			return f.clearance(ta, sa)
		}
		return f.clearance(t, f.rot.step(sa, t-ta))
	}
	a, b := ta, tb
	ga, gb := g(a), g(b)
	side := 0
	for range 100 {
		if b-a <= 1e-13*math.Max(1, math.Abs(b)) {
			break
		}
		c := b - gb*(b-a)/(gb-ga)
		if !(c > a && c < b) {
			c = (a + b) / 2
		}
		gc := g(c)
		if gc == 0 {
			return c
		}
		if gc > 0 {
			a, ga = c, gc
			if side == -1 {
				gb /= 2
			}
			side = -1
		} else {
			b, gb = c, gc
			if side == 1 {
				ga /= 2
			}
			side = 1
		}
	}
	return b
}
