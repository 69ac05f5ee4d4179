package physics

import (
	"context"
	"math"
	"math/rand/v2"
	"runtime"
	"sort"
	"sync"
	"sync/atomic"

	"gonum.org/v1/gonum/spatial/r3"
	"gonum.org/v1/gonum/stat"
)

// SpreadSpec says which release errors to sample and what to measure.
//
// Each sample draws, independently and normally (DESIGN.md, spread):
//   - the spin rate, relative sd RateSD (0.05 = 5 %);
//   - the spin direction, tilted by |N(0, TiltSD)| radians toward a
//     uniformly random side (prop frame);
//   - the release speed, relative sd SpeedSD;
//   - the release angle, sd AngleSD radians, in the vertical plane of the
//     throw (the plane of the release velocity and +Y).
type SpreadSpec struct {
	Samples int
	Seed    uint64
	RateSD  float64 // relative
	TiltSD  float64 // radians
	SpeedSD float64 // relative
	AngleSD float64 // radians

	Target     *Target // nil: no landing target (no error figures)
	Tolerance  float64 // radians, with Target
	End        End
	Thresholds Thresholds

	// Progress, when set, is called from the workers with the number of
	// samples done so far (not in order; safe to hand to fyne.Do).
	Progress func(done int)
}

// MaxSpreadSamples bounds a spread's samples.
const MaxSpreadSamples = 1000000

// SpreadSample is the outcome of one sampled throw.
type SpreadSample struct {
	Rate       float64 // drawn |omega| at release, rad/s
	Motion     Motion
	FlightTime float64 // end of the flight, s
	Landing    r3.Vec  // centre of mass at the end of the flight, world, m
	Error      float64 // landing error, radians (with a target; else 0)
	Short      bool    // the centre of mass never came down through the catch height
}

// Spread is the summary of a spread's samples. Short samples (a catch
// height the sampled arc does not reach) count as outside tolerance with an
// error of pi, and are left out of the landing and flight-time figures.
type Spread struct {
	Samples         int
	Seed            uint64
	HasTarget       bool
	WithinTolerance float64        // fraction of samples landing within tolerance (with a target)
	TumbleFraction  float64        // fraction of samples whose verdict is tumble
	ErrorP50        float64        // median landing error, radians (with a target)
	ErrorP90        float64        // 90th percentile, radians
	LandingSD       [2]float64     // sd of the landing point's x and z, m
	FlightTimeSD    float64        // sd of the flight time, s
	Short           int            // samples that never reach the catch height
	Points          []SpreadSample // by sample index
}

// Validate checks the spec; fields are named as the command-line flags.
func (sp *SpreadSpec) Validate() error {
	switch {
	case sp.Samples < 1 || sp.Samples > MaxSpreadSamples:
		return fieldErr("samples", "must be between 1 and %d", MaxSpreadSamples)
	case !finite(sp.RateSD) || sp.RateSD < 0 || sp.RateSD > 1:
		return fieldErr("rate-sd", "must be between 0 and 100 percent")
	case !finite(sp.TiltSD) || sp.TiltSD < 0 || sp.TiltSD > math.Pi:
		return fieldErr("tilt-sd", "must be between 0 and 180 degrees")
	case !finite(sp.SpeedSD) || sp.SpeedSD < 0 || sp.SpeedSD > 1:
		return fieldErr("speed-sd", "must be between 0 and 100 percent")
	case !finite(sp.AngleSD) || sp.AngleSD < 0 || sp.AngleSD > math.Pi/2:
		return fieldErr("angle-sd", "must be between 0 and 90 degrees")
	}
	if sp.Target != nil {
		if err := sp.Target.Validate(); err != nil {
			return err
		}
		if err := validTolerance(sp.Tolerance); err != nil {
			return err
		}
	}
	return nil
}

// sampleSeed mixes the index into a second PCG seed (SplitMix64's
// finaliser, Steele, Lea & Flood, OOPSLA 2014), so that neighbouring
// samples get unrelated streams; each sample's draws depend only on the seed
// and its index, never on which worker ran it.
func sampleSeed(seed uint64, i int) uint64 {
	z := seed ^ (uint64(i)+1)*0x9e3779b97f4a7c15
	z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9
	z = (z ^ (z >> 27)) * 0x94d049bb133111eb
	return z ^ (z >> 31)
}

// SampleThrow returns the throw of sample i: th with the release errors of
// spec drawn from the sample's own stream. The draws are made in a fixed
// order (rate, tilt, side, speed, angle) whether or not an sd is zero, and a
// zero sd leaves its quantity exactly as in th.
func SampleThrow(mp *MassProps, th *Throw, spec *SpreadSpec, i int) Throw {
	rng := rand.New(rand.NewPCG(spec.Seed, sampleSeed(spec.Seed, i)))
	zRate, zTilt, side := rng.NormFloat64(), rng.NormFloat64(), 2*math.Pi*rng.Float64()
	zSpeed, zAngle := rng.NormFloat64(), rng.NormFloat64()
	s := *th
	if spec.RateSD != 0 {
		s.Spin.Rate = math.Max(0, th.Spin.Rate*(1+spec.RateSD*zRate))
	}
	if spec.TiltSD != 0 {
		n := th.SpinAxis(mp)
		e1, e2 := perpendicular(mp, n)
		sn, cs := math.Sincos(side)
		toward := r3.Add(r3.Scale(cs, e1), r3.Scale(sn, e2))
		st, ct := math.Sincos(math.Abs(spec.TiltSD * zTilt))
		s.Spin.Axis, s.Spin.Vector, s.Spin.Tilt = Free, r3.Add(r3.Scale(ct, n), r3.Scale(st, toward)), 0
	}
	if spec.SpeedSD != 0 || spec.AngleSD != 0 {
		v := th.Velocity
		horiz := math.Hypot(v.X, v.Z)
		u := r3.Vec{X: 1} // heading of a vertical throw: +x
		if horiz > 0 {
			u = r3.Vec{X: v.X / horiz, Z: v.Z / horiz}
		}
		speed := r3.Norm(v) * math.Max(0, 1+spec.SpeedSD*zSpeed)
		elev := math.Atan2(v.Y, horiz) + spec.AngleSD*zAngle
		se, ce := math.Sincos(elev)
		s.Velocity = r3.Add(r3.Scale(speed*ce, u), r3.Vec{Y: speed * se})
	}
	return s
}

// perpendicular returns two unit vectors completing the unit n to a
// right-handed set, built from the principal axis least aligned with n.
func perpendicular(mp *MassProps, n r3.Vec) (r3.Vec, r3.Vec) {
	a := mp.Axes[0]
	for _, b := range mp.Axes[1:] {
		if math.Abs(r3.Dot(b, n)) < math.Abs(r3.Dot(a, n)) {
			a = b
		}
	}
	e1 := r3.Unit(r3.Cross(n, a))
	return e1, r3.Cross(n, e1)
}

// SpreadThrows samples spec.Samples throws around th and flies each to the
// end of its flight (no take kept), on as many goroutines as GOMAXPROCS.
// Results are placed by sample index and summed in index order, so the
// answer depends only on the seed, never on the number of workers. ctx may
// cancel the work (nil: never).
func SpreadThrows(ctx context.Context, p *Prop, mp *MassProps, th *Throw, spec SpreadSpec) (*Spread, error) {
	if err := spec.Validate(); err != nil {
		return nil, err
	}
	if err := p.Validate(); err != nil {
		return nil, err
	}
	if err := th.Validate(); err != nil {
		return nil, err
	}
	if spec.End.Catch {
		// The nominal throw must reach the catch; a sample may fall short.
		if _, err := spec.End.catchTime(th); err != nil {
			return nil, err
		}
	}
	if ctx == nil {
		ctx = context.Background()
	}
	pts := make([]SpreadSample, spec.Samples)
	errs := make([]error, spec.Samples)
	var next, done atomic.Int64
	var wg sync.WaitGroup
	for range min(runtime.GOMAXPROCS(0), spec.Samples) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for {
				i := int(next.Add(1) - 1)
				if i >= spec.Samples || ctx.Err() != nil {
					return
				}
				pts[i], errs[i] = flySample(p, mp, th, &spec, i)
				if d := done.Add(1); spec.Progress != nil && (d%16 == 0 || int(d) == spec.Samples) {
					spec.Progress(int(d))
				}
			}
		}()
	}
	wg.Wait()
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	for _, err := range errs {
		if err != nil {
			return nil, err
		}
	}
	return summarize(pts, &spec), nil
}

// flySample draws and flies sample i.
func flySample(p *Prop, mp *MassProps, th *Throw, spec *SpreadSpec, i int) (SpreadSample, error) {
	s := SampleThrow(mp, th, spec, i)
	out := SpreadSample{Rate: s.Spin.Rate, Motion: Judge(mp, &s, spec.Thresholds).Motion}
	if spec.End.Catch {
		if _, err := spec.End.catchTime(&s); err != nil {
			out.Short = true
			out.Error = math.Pi
			return out, nil
		}
	}
	f := newFlight(p, mp, &s)
	t, b, err := f.flyToEnd(f.initial(mp), spec.End)
	if err != nil {
		return out, err
	}
	out.FlightTime = t
	out.Landing = s.CMAt(t)
	if spec.Target != nil {
		out.Error = spec.Target.Error(f.propOrient(b))
	}
	return out, nil
}

// summarize computes the figures of a spread from its samples, in index
// order.
func summarize(pts []SpreadSample, spec *SpreadSpec) *Spread {
	sp := &Spread{Samples: len(pts), Seed: spec.Seed, HasTarget: spec.Target != nil, Points: pts}
	var xs, zs, ts, es []float64
	var within, tumbles int
	for _, s := range pts {
		if s.Motion == Tumbling {
			tumbles++
		}
		if sp.HasTarget {
			es = append(es, s.Error)
			if !s.Short && s.Error <= spec.Tolerance {
				within++
			}
		}
		if s.Short {
			sp.Short++
			continue
		}
		xs, zs, ts = append(xs, s.Landing.X), append(zs, s.Landing.Z), append(ts, s.FlightTime)
	}
	n := float64(len(pts))
	sp.TumbleFraction = float64(tumbles) / n
	if sp.HasTarget {
		sp.WithinTolerance = float64(within) / n
		sort.Float64s(es)
		sp.ErrorP50 = stat.Quantile(0.5, stat.LinInterp, es, nil)
		sp.ErrorP90 = stat.Quantile(0.9, stat.LinInterp, es, nil)
	}
	sp.LandingSD = [2]float64{sd(xs), sd(zs)}
	sp.FlightTimeSD = sd(ts)
	return sp
}

// sd is the sample standard deviation (n - 1), 0 for fewer than two values.
func sd(x []float64) float64 {
	if len(x) < 2 {
		return 0
	}
	return stat.StdDev(x, nil)
}
