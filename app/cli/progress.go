package cli

import (
	"fmt"
	"io"
	"os"
	"time"
)

// progressLine shows the progress of long work (a PNG sequence, a long
// timing sheet) on one line of stderr, rewritten in place, and only when
// stderr is a terminal: a log file or a pipe gets nothing but the usual
// one-line report, so scripts see the same output as before.
type progressLine struct {
	w       io.Writer
	what    string
	shown   bool      // a line is on screen (finish ends it)
	last    time.Time // when it was last drawn
	percent int       // the percentage last drawn
	now     func() time.Time
}

// progressEvery is the longest a line goes without a redraw while the
// percentage stays the same, and the shortest between two redraws.
const progressEvery = 250 * time.Millisecond

// newProgress returns a progress line on w, or nil when w is not a
// terminal (then every method does nothing).
func newProgress(w io.Writer) *progressLine {
	if !isTerminal(w) {
		return nil
	}
	return &progressLine{w: w, percent: -1, now: time.Now}
}

// isTerminal reports whether w is a terminal: a character device (the
// test os.Stderr.Stat's Mode()&os.ModeCharDevice, which needs no terminal
// package), or a writer that says so itself (tests).
func isTerminal(w io.Writer) bool {
	switch t := w.(type) {
	case interface{ IsTerminal() bool }:
		return t.IsTerminal()
	case *os.File:
		fi, err := t.Stat()
		return err == nil && fi.Mode()&os.ModeCharDevice != 0
	}
	return false
}

// start names the work ("writing PNG frames") and returns the function to
// call with the work done and the total; nil when there is no terminal.
func (p *progressLine) start(what string) func(done, total int) {
	if p == nil {
		return nil
	}
	p.what = what
	return p.update
}

// update redraws the line when the percentage changed and at least
// progressEvery passed, and always for the last step.
func (p *progressLine) update(done, total int) {
	if total <= 0 {
		return
	}
	pc := int(int64(done) * 100 / int64(total))
	t := p.now()
	if done < total && (pc == p.percent || t.Sub(p.last) < progressEvery) {
		return
	}
	p.percent, p.last, p.shown = pc, t, true
	fmt.Fprintf(p.w, "\rpropflight: %s %d/%d (%d%%)", p.what, done, total, pc)
}

// finish ends the line so that what follows starts on a fresh one.
func (p *progressLine) finish() {
	if p != nil && p.shown {
		fmt.Fprintln(p.w)
		p.shown = false
	}
}
