package ui

import (
	"context"
	"fmt"
	"math"
	"strings"

	"propflight/app/project"
	"propflight/physics"
)

// The Land it tab's work: a plan and a spread of the shown scene, run on
// their own goroutine. Each request cancels the one before it (latest
// wins); a result is shown only if no newer request has been made, and
// progress only for the latest request.

// landJob is the request in flight.
type landJob struct {
	seq    uint64
	cancel context.CancelFunc
}

// landResult is one finished request. It is immutable once delivered.
type landResult struct {
	seq       uint64
	scene     *project.Scene
	set       landSettings
	plan      *physics.Plan
	planErr   error
	spread    *physics.Spread
	spreadErr error
}

// request starts a plan and spread of the shown scene with the controls'
// settings, replacing any request in flight.
func (p *landPanel) request() {
	w := p.w
	if w.syncing > 0 || w.closed {
		return
	}
	if !p.visible {
		p.stale = true
		return
	}
	p.stale = false
	sc, thr := w.good.Scene, w.good.Thresholds
	if sc == nil {
		p.status.SetText("Nothing to plan yet: the project does not fly.")
		return
	}
	set, err := p.settings(sc, thr)
	if p.job.cancel != nil {
		p.job.cancel()
	}
	p.job.seq++
	seq := p.job.seq
	if err != nil {
		p.job.cancel = nil
		p.show(landResult{seq: seq, scene: sc, set: set, planErr: err})
		return
	}
	ctx, cancel := context.WithCancel(context.Background())
	p.job.cancel = cancel
	p.seedLabel.SetText(fmt.Sprintf("seed %d", set.spread.Seed))
	p.progress.SetValue(0)
	p.progress.Show()
	p.status.SetText("Planning…")
	if w.synchronous {
		p.show(runLand(ctx, seq, sc, set))
		return
	}
	n := float64(set.spread.Samples)
	set.spread.Progress = func(done int) {
		w.do(func() {
			if seq == p.job.seq {
				p.progress.SetValue(float64(done) / n)
			}
		})
	}
	go func() {
		r := runLand(ctx, seq, sc, set)
		w.do(func() { p.show(r) })
	}()
}

// runLand does one request's work: the plan, then the spread.
func runLand(ctx context.Context, seq uint64, sc *project.Scene, set landSettings) landResult {
	r := landResult{seq: seq, scene: sc, set: set}
	r.plan, r.planErr = physics.PlanLanding(ctx, &sc.Prop, &sc.Mass, &sc.Throw, set.plan)
	if ctx.Err() != nil {
		return r
	}
	r.spread, r.spreadErr = physics.SpreadThrows(ctx, &sc.Prop, &sc.Mass, &sc.Throw, set.spread)
	return r
}

// show puts a result on the panel, unless a newer request has been made.
func (p *landPanel) show(r landResult) {
	if r.seq != p.job.seq || p.w.closed {
		return
	}
	p.job.cancel = nil
	p.last = r
	p.progress.Hide()
	p.status.SetText(p.planText(r))
	p.solutions.Refresh()
	p.figures.SetText(p.spreadText(r))
	p.hist.Refresh()
	p.scatter.Refresh()
}

// planText words the plan's outcome for the status line.
func (p *landPanel) planText(r landResult) string {
	if r.planErr != nil {
		return "Cannot plan: " + landErrorText(r.planErr)
	}
	pl := r.plan
	var b strings.Builder
	fps := r.scene.Throw.FPS.FPS()
	if r.set.plan.End.Catch {
		fmt.Fprintf(&b, "Flight %.3f s (%.1f frames) to the catch at every rate. ", pl.FlightTime, pl.FlightTime*fps)
	}
	fmt.Fprintf(&b, "The spin direction gives a %s. ", pl.Motion)
	if len(pl.Solutions) == 0 {
		best := 0
		for i, e := range pl.Errors {
			if e < pl.Errors[best] {
				best = i
			}
		}
		fmt.Fprintf(&b, "No rate from %.2f to %.2f turns/s lands within %.1f°: the closest is %.1f° off at %.3f turns/s. Widen the range, the tolerance, or change the spin direction.",
			r.set.plan.RateMin/(2*math.Pi), r.set.plan.RateMax/(2*math.Pi), r.set.plan.Tolerance*180/math.Pi, pl.Errors[best]*180/math.Pi, pl.Rates[best]/(2*math.Pi))
		return b.String()
	}
	fmt.Fprintf(&b, "%d solutions; click one to use it:", len(pl.Solutions))
	if len(pl.Solutions) == 1 {
		b.Reset()
		fmt.Fprintf(&b, "One solution; click it to use it:")
	}
	return b.String()
}

// spreadText words the spread's figures.
func (p *landPanel) spreadText(r landResult) string {
	switch {
	case r.planErr != nil && r.spread == nil:
		return ""
	case r.spreadErr != nil:
		return "Cannot sample the spread: " + landErrorText(r.spreadErr)
	case r.spread == nil:
		return ""
	}
	sp := r.spread
	fps := r.scene.Throw.FPS.FPS()
	rate := r.scene.Throw.Spin.Rate / (2 * math.Pi)
	s := fmt.Sprintf("At %.4g turns/s: %.1f %% of %d throws land within %.1f° (median error %.1f°, 90th percentile %.1f°); %.1f %% tumble.\n"+
		"Landing point sd %.3f m along x, %.3f m along z; flight time sd %.3f s (%.1f frames).",
		rate, 100*sp.WithinTolerance, sp.Samples, r.set.spread.Tolerance*180/math.Pi, sp.ErrorP50*180/math.Pi, sp.ErrorP90*180/math.Pi,
		100*sp.TumbleFraction, sp.LandingSD[0], sp.LandingSD[1], sp.FlightTimeSD, sp.FlightTimeSD*fps)
	if sp.Short > 0 {
		s += fmt.Sprintf("\n%d throws top out below the catch height (counted as misses).", sp.Short)
	}
	return s
}

// landErrorText words a plan or spread error with the panel's names for
// the settings rather than the command-line flags.
func landErrorText(err error) string {
	var fe *physics.FieldError
	if e, ok := err.(*physics.FieldError); ok {
		fe = e
	}
	if fe == nil {
		return err.Error()
	}
	names := map[string]string{"catch-height": "catch height", "rate-min": "slowest spin", "rate-max": "fastest spin",
		"tolerance-deg": "tolerance", "land": "target", "samples": "samples", "rate-sd": "spin rate sd",
		"tilt-sd": "spin direction sd", "speed-sd": "release speed sd", "angle-sd": "release angle sd"}
	if n, ok := names[fe.Field]; ok {
		return n + ": " + fe.Msg
	}
	return err.Error()
}
