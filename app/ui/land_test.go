package ui

import (
	"bytes"
	"context"
	"image/color"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/test"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// openLand opens the Land it tab of a synchronous test window on the pan
// with 200 spread samples (the tests' own size).
func openLand(t *testing.T) (*Window, *landPanel) {
	t.Helper()
	w := newTestWindow(t, "frying-pan")
	p := w.land
	w.syncing++
	p.samples.SetSelected("200")
	w.syncing--
	p.setVisible(true)
	if p.last.plan == nil {
		t.Fatalf("no plan: %v", p.last.planErr)
	}
	return w, p
}

// TestLand_Plan_MatchesPhysics: the tab's default target (the pan's
// greatest axis, its face, up at the catch at the release height, 10
// degrees, 0.25 to 10 turns/s) lists exactly physics.PlanLanding's
// solutions.
func TestLand_Plan_MatchesPhysics(t *testing.T) {
	w, p := openLand(t)
	sc := w.good.Scene
	spec := physics.PlanSpec{Target: physics.Target{Axis: sc.Mass.Axes[physics.Greatest], Dir: r3.Vec{Y: 1}},
		End: physics.End{Catch: true, CatchY: sc.Throw.Position.Y}, Tolerance: 10 * math.Pi / 180,
		RateMin: 0.25 * 2 * math.Pi, RateMax: 10 * 2 * math.Pi, Thresholds: w.good.Thresholds}
	want, err := physics.PlanLanding(context.Background(), &sc.Prop, &sc.Mass, &sc.Throw, spec)
	if err != nil {
		t.Fatal(err)
	}
	got := p.last.plan
	if len(got.Solutions) == 0 || len(got.Solutions) != len(want.Solutions) {
		t.Fatalf("%d solutions, physics %d", len(got.Solutions), len(want.Solutions))
	}
	for i := range want.Solutions {
		if got.Solutions[i] != want.Solutions[i] {
			t.Errorf("solution %d: %+v, physics %+v", i, got.Solutions[i], want.Solutions[i])
		}
		main, sub := p.solutionText(i)
		if !strings.Contains(main, "turns/s") || !strings.Contains(sub, "window") {
			t.Errorf("row %d: %q / %q", i, main, sub)
		}
	}
	if !strings.Contains(p.status.Text, "solutions") || !strings.Contains(p.status.Text, "0.950 s") {
		t.Errorf("status %q", p.status.Text)
	}
}

// TestLand_UseSolution_Undoable: one click sets the throw's spin rate to
// the solution's; Undo puts the old rate back; the spread follows.
func TestLand_UseSolution_Undoable(t *testing.T) {
	w, p := openLand(t)
	before := *w.ed.Doc().Throw.Spin.TurnsPerSecond
	best := p.last.plan.Best()
	rate := p.last.plan.Solutions[best].Rate / (2 * math.Pi)
	p.solutions.Select(best)
	got := *w.ed.Doc().Throw.Spin.TurnsPerSecond
	if math.Abs(got-rate) > 1e-6 {
		t.Fatalf("turns per second %v after use, want %v", got, rate)
	}
	if math.Abs(w.throw.tps.Value()-got) > 1e-9 {
		t.Errorf("the Throw tab shows %v", w.throw.tps.Value())
	}
	if !strings.HasPrefix(w.ed.UndoLabel(), "Use spin") {
		t.Errorf("undo label %q", w.ed.UndoLabel())
	}
	if r := p.last.scene.Throw.Spin.Rate / (2 * math.Pi); math.Abs(r-got) > 1e-9 || p.last.spread == nil {
		t.Errorf("the spread is of %v turns/s, want %v", r, got)
	}
	w.win.Canvas().(fyne.Shortcutable).TypedShortcut(&fyne.ShortcutUndo{})
	if back := *w.ed.Doc().Throw.Spin.TurnsPerSecond; back != before {
		t.Errorf("after undo %v, want %v", back, before)
	}
}

// TestLand_PartLongAxis: clicking the handle aims its long axis: the
// box's x turned by its rotation_deg [0, -12, 0] (the least principal
// axis of a box is along its longest edge, Goldstein §5.3).
func TestLand_PartLongAxis(t *testing.T) {
	_, p := openLand(t)
	p.parts.Select(2)
	if p.axis.Selected != partPrefix+"handle" {
		t.Fatalf("axis %q", p.axis.Selected)
	}
	s, c := math.Sincos(12 * math.Pi / 180)
	want := r3.Vec{X: c, Z: s}
	if got := p.last.set.plan.Target.Axis; r3.Norm(r3.Sub(got, want)) > 1e-9 {
		t.Errorf("target axis %v, want %v", got, want)
	}
	if !strings.Contains(p.last.set.words, "handle") {
		t.Errorf("words %q", p.last.set.words)
	}
}

// TestLand_Spread_MatchesPhysics: the figures are SpreadThrows' for the
// throw as set, and the histogram counts every sample.
func TestLand_Spread_MatchesPhysics(t *testing.T) {
	w, p := openLand(t)
	sc := w.good.Scene
	tg := physics.Target{Axis: sc.Mass.Axes[physics.Greatest], Dir: r3.Vec{Y: 1}}
	spec := physics.SpreadSpec{Samples: 200, Seed: 1, RateSD: 0.05, TiltSD: 3 * math.Pi / 180, SpeedSD: 0.03, AngleSD: 2 * math.Pi / 180,
		Target: &tg, Tolerance: 10 * math.Pi / 180, End: physics.End{Catch: true, CatchY: sc.Throw.Position.Y}, Thresholds: w.good.Thresholds}
	want, err := physics.SpreadThrows(context.Background(), &sc.Prop, &sc.Mass, &sc.Throw, spec)
	if err != nil {
		t.Fatal(err)
	}
	got := p.last.spread
	if math.Abs(got.WithinTolerance-want.WithinTolerance) > 1e-12 || math.Abs(got.ErrorP50-want.ErrorP50) > 1e-9 || got.TumbleFraction != want.TumbleFraction {
		t.Errorf("spread within %v, p50 %v, tumbles %v; physics %v, %v, %v", got.WithinTolerance, got.ErrorP50, got.TumbleFraction,
			want.WithinTolerance, want.ErrorP50, want.TumbleFraction)
	}
	n := 0
	for _, b := range p.bins() {
		n += b
	}
	if n != 200 || !strings.Contains(p.figures.Text, "of 200 throws") {
		t.Errorf("histogram holds %d samples; figures %q", n, p.figures.Text)
	}
	// A new seed gives another sample of the same throw.
	seed := p.last.set.spread.Seed
	p.seed++
	p.request()
	if p.last.set.spread.Seed != seed+1 {
		t.Errorf("seed %d", p.last.set.spread.Seed)
	}
	if land := p.forSheet(w.good.Scene); land == nil || land.Spread != p.last.spread || land.Plan != p.last.plan {
		t.Error("the timing sheet does not get the tab's plan and spread")
	}
	p.onSheet.SetChecked(false)
	if p.forSheet(w.good.Scene) != nil {
		t.Error("unticked, the sheet still gets the landing page")
	}
}

// TestLand_BadRange_Says: the slowest spin above the fastest is refused in
// the panel's words, and nothing is planned.
func TestLand_BadRange_Says(t *testing.T) {
	_, p := openLand(t)
	typeInto(t, p.rateMin, "12")
	if !strings.Contains(p.status.Text, "slowest spin must be below the fastest") || p.last.plan != nil || p.solutionCount() != 0 {
		t.Errorf("status %q", p.status.Text)
	}
	typeInto(t, p.rateMin, "0.5")
	if p.last.plan == nil {
		t.Error("no plan after the range was put right")
	}
}

// TestLand_ClosedTab_NoWork: nothing runs while the tab is closed; opening
// it runs what was asked for.
func TestLand_ClosedTab_NoWork(t *testing.T) {
	w := newTestWindow(t, "frying-pan")
	if w.land.last.plan != nil || !w.land.stale {
		t.Fatal("the plan ran with its tab closed")
	}
	w.land.setVisible(true)
	if w.land.last.plan == nil {
		t.Error("opening the tab did not plan")
	}
}

// TestLand_LatestWins: requests on the worker goroutines; only the last
// one's result is shown, and the progress bar is hidden when it is.
func TestLand_LatestWins(t *testing.T) {
	t.Setenv("XDG_CONFIG_HOME", t.TempDir())
	a := test.NewTempApp(t)
	doc, err := presetDocument("frying-pan")
	if err != nil {
		t.Fatal(err)
	}
	queue := make(chan func(), 1024)
	w, err := newWindowWith(a, doc, "", windowOptions{do: func(f func()) { queue <- f }})
	if err != nil {
		t.Fatal(err)
	}
	defer w.closeNow()
	deadline := time.After(60 * time.Second)
	drain := func(done func() bool) {
		t.Helper()
		for !done() {
			select {
			case f := <-queue:
				f()
			case <-deadline:
				t.Fatal("timed out")
			}
		}
	}
	drain(func() bool { return w.good.Take != nil })
	p := w.land
	p.samples.SetSelected("200")
	p.setVisible(true)
	typeInto(t, p.tol, "20")
	typeInto(t, p.tol, "15")
	last := p.job.seq
	drain(func() bool { return p.last.seq == last })
	if math.Abs(p.last.set.plan.Tolerance-15*math.Pi/180) > 1e-12 || p.last.plan == nil || p.progress.Visible() {
		t.Errorf("shown: tolerance %v, plan %v, progress visible %v", p.last.set.plan.Tolerance, p.last.plan != nil, p.progress.Visible())
	}
	old := p.last
	old.seq = last - 1
	old.plan = nil
	p.show(old)
	if p.last.plan == nil {
		t.Error("a stale result was shown")
	}
}

// TestLandCharts: bars up to the tallest bin, the tolerance line, and a
// landing point drawn where it lies.
func TestLandCharts(t *testing.T) {
	img := histogramImage([]int{4, 2, 0, 0}, 0.5, 40, 20)
	at := func(x, y int) color.NRGBA { return color.NRGBAModel.Convert(img.At(x, y)).(color.NRGBA) }
	if at(5, 3) != chartBar || at(15, 3) != chartBack || at(15, 15) != chartBar || at(20, 5) != chartTol && at(19, 5) != chartTol {
		t.Errorf("histogram pixels %v %v %v %v", at(5, 3), at(15, 3), at(15, 15), at(20, 5))
	}
	sc := scatterImage([][2]float64{{0, 0}, {1, 0}}, 100, 100)
	// Two points 1 m apart in x, framed with a 1.2 margin: at 50 +- 41.7 px.
	if c := color.NRGBAModel.Convert(sc.At(8, 50)).(color.NRGBA); c == chartBack {
		t.Errorf("no point drawn at the left landing (%v)", c)
	}
}

// TestLand_Export_SheetHasLandingPage: with the tab's plan and spread
// shown, the exported timing sheet has one more page, carrying them.
func TestLand_Export_SheetHasLandingPage(t *testing.T) {
	w, p := openLand(t)
	dir := t.TempDir()
	pages := func(name string) int {
		t.Helper()
		b, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil {
			t.Fatal(err)
		}
		return bytes.Count(b, []byte("/Type /Page\n")) + bytes.Count(b, []byte("/Type /Page "))
	}
	w.runExport(sheetJob("a4"), filepath.Join(dir, "with.pdf"), w.good)
	p.onSheet.SetChecked(false)
	w.runExport(sheetJob("a4"), filepath.Join(dir, "without.pdf"), w.good)
	if a, b := pages("with.pdf"), pages("without.pdf"); a != b+1 || b == 0 {
		t.Errorf("%d pages with the landing page, %d without", a, b)
	}
}
