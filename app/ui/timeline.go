package ui

import (
	"fmt"
	"time"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/layout"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"

	"propflight/app/editor"
	"propflight/physics"
	"propflight/widgets"
)

// timelinePane is under the preview: the timeline with its flags, the
// transport buttons, the loop toggle and the frame readout.
type timelinePane struct {
	w        *Window
	content  *fyne.Container
	timeline *widgets.Timeline
	play     *widget.Button
	loop     *widget.Check
	frame    *widget.Label
	timecode *widget.Label
	flags    []widgets.Flag
}

func newTimelinePane(w *Window) *timelinePane {
	t := &timelinePane{w: w}
	t.timeline = widgets.NewTimeline(func(n int) {
		w.stopPlayback()
		w.setFrame(n)
	})
	// With the focus after a tap the timeline steps frames itself and
	// hands on the rest: Space plays and pauses as everywhere else.
	t.timeline.OnOtherKey = w.frameKey
	t.play = widget.NewButtonWithIcon("play", theme.MediaPlayIcon(), w.togglePlayback)
	t.play.Importance = widget.HighImportance
	step := func(icon fyne.Resource, f func()) *widget.Button { return widget.NewButtonWithIcon("", icon, f) }
	home := step(theme.MediaSkipPreviousIcon(), func() { w.stopPlayback(); w.setFrame(0) })
	back := step(theme.NavigateBackIcon(), func() { w.stopPlayback(); w.setFrame(w.frame - 1) })
	fwd := step(theme.NavigateNextIcon(), func() { w.stopPlayback(); w.setFrame(w.frame + 1) })
	end := step(theme.MediaSkipNextIcon(), func() { w.stopPlayback(); w.setFrame(w.lastFrame()) })
	t.loop = widget.NewCheck("loop", func(on bool) { w.play.loop = on })
	t.loop.SetChecked(w.play.loop)
	t.frame = widget.NewLabelWithStyle("frame 0 / 0", fyne.TextAlignLeading, fyne.TextStyle{Monospace: true})
	t.timecode = widget.NewLabelWithStyle("00:00:00:00", fyne.TextAlignLeading, fyne.TextStyle{Monospace: true})
	bar := container.NewHBox(home, back, t.play, fwd, end, t.loop, layout.NewSpacer(), t.frame, t.timecode)
	t.content = container.NewVBox(t.timeline, bar)
	return t
}

// setTake follows a new take: its frames, rate and flags.
func (t *timelinePane) setTake(res editor.Result) {
	tk := res.Take
	rate := res.Scene.Throw.FPS
	t.timeline.SetRange(len(tk.Frames), rate)
	t.flags = takeFlags(res)
	t.timeline.SetFlags(t.flags)
	t.w.view.refreshScene()
}

// takeFlags returns the timeline flags of a result: release, apex,
// landing and each flip of a tumble.
func takeFlags(res editor.Result) []widgets.Flag {
	tk := res.Take
	flags := []widgets.Flag{{Frame: 0, Kind: widgets.FlagRelease, Label: "release"}}
	if tk.ApexFrame > 0 && tk.ApexFrame < tk.LandingFrame {
		flags = append(flags, widgets.Flag{Frame: tk.ApexFrame, Kind: widgets.FlagApex, Label: "apex"})
	}
	for k, n := range flipFrames(res.Verdict, tk, res.Scene.Throw.FPS) {
		flags = append(flags, widgets.Flag{Frame: n, Kind: widgets.FlagFlip, Label: fmt.Sprintf("flip %d", k+1)})
	}
	return append(flags, widgets.Flag{Frame: tk.LandingFrame, Kind: widgets.FlagLanding, Label: "landing"})
}

// showFrame puts frame n on the timeline and the readout.
func (t *timelinePane) showFrame(n int) {
	t.timeline.SetFrame(n)
	t.frame.SetText(fmt.Sprintf("frame %d / %d", n, t.w.lastFrame()))
	t.timecode.SetText(t.w.rate().Timecode(n))
}

// playback is the state of play: whether it runs, whether it loops, and
// the generation that tells a stopped player's late ticks from the
// current one's.
type playback struct {
	on   bool
	loop bool
	gen  int
	stop chan struct{}
}

// togglePlayback plays or pauses.
func (w *Window) togglePlayback() {
	if w.play.on {
		w.stopPlayback()
	} else {
		w.startPlayback()
	}
}

// startPlayback plays the take from the current frame at its true frame
// rate (from the first frame if at the end). A goroutine ticks at the
// frame period Den/Num seconds and works out the frame from the time
// played, so a slow repaint drops frames instead of slowing the take; the
// frame is shown inside fyne.DoAndWait, so ticks never pile up.
func (w *Window) startPlayback() {
	if w.good.Take == nil || w.lastFrame() == 0 {
		return
	}
	if w.frame >= w.lastFrame() {
		w.setFrame(0)
	}
	w.play.on = true
	w.play.gen++
	gen, start, rate := w.play.gen, w.frame, w.rate()
	stop := make(chan struct{})
	w.play.stop = stop
	w.timeline.play.SetText("pause")
	w.timeline.play.SetIcon(theme.MediaPauseIcon())
	period := time.Duration(float64(time.Second) * float64(rate.Den) / float64(rate.Num))
	go func() {
		tick := time.NewTicker(period)
		defer tick.Stop()
		t0 := time.Now()
		for {
			select {
			case <-stop:
				return
			case now := <-tick.C:
				k := framesIn(now.Sub(t0), rate)
				fyne.DoAndWait(func() {
					if w.play.gen == gen && w.play.on {
						w.playTo(start, k)
					}
				})
			}
		}
	}()
}

// playTo shows the frame k frames after start, wrapping when looping and
// stopping at the last frame otherwise.
func (w *Window) playTo(start, k int) {
	n, done := playFrame(start, k, w.lastFrame(), w.play.loop)
	w.setFrame(n)
	if done {
		w.stopPlayback()
	}
}

// stopPlayback pauses; the frame stays where it is.
func (w *Window) stopPlayback() {
	if !w.play.on {
		return
	}
	w.play.on = false
	w.play.gen++
	close(w.play.stop)
	w.timeline.play.SetText("play")
	w.timeline.play.SetIcon(theme.MediaPlayIcon())
}

// framesIn returns how many whole frames of rate r fit in d
// (physics.Rate.Frame, which forgives round-off at exact frame times).
func framesIn(d time.Duration, r physics.Rate) int {
	if d <= 0 || !r.Valid() {
		return 0
	}
	return r.Frame(d.Seconds())
}

// playFrame returns the frame k frames after start in a take whose last
// frame is last, and whether play ends there: looping wraps to frame 0
// after the last, otherwise play stops on the last frame.
func playFrame(start, k, last int, loop bool) (frame int, done bool) {
	if last <= 0 {
		return 0, true
	}
	n := start + k
	if n <= last {
		return n, false
	}
	if loop {
		return n % (last + 1), false
	}
	return last, true
}
