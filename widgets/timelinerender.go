package widgets

import (
	"image/color"
	"strconv"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/theme"
)

var _ fyne.WidgetRenderer = (*timelineRenderer)(nil)

// timelineRenderer draws the strip from canvas primitives. The tick, label
// and flag objects are pooled and rebuilt for the current size by rebuild,
// which Layout and Refresh share.
type timelineRenderer struct {
	t *Timeline

	bg, readBox    *canvas.Rectangle
	base, cursor   *canvas.Line
	readText       *canvas.Text
	empty          *canvas.Text
	ticks          []*canvas.Line
	labels         []*canvas.Text
	poles          []*canvas.Line
	flags          []*canvas.Rectangle
	flagText       []*canvas.Text
	nTicks, nLabel int
	nFlags, nFlagT int
	objects        []fyne.CanvasObject
}

func (r *timelineRenderer) Layout(size fyne.Size) { r.rebuild(size) }

func (r *timelineRenderer) MinSize() fyne.Size { return fyne.NewSize(timelineWidth, timelineHeight) }

func (r *timelineRenderer) Objects() []fyne.CanvasObject { return r.objects }

func (r *timelineRenderer) Refresh() {
	r.rebuild(r.t.Size())
	for _, o := range r.objects {
		o.Refresh()
	}
}

func (r *timelineRenderer) Destroy() {}

// tick returns the next pooled tick line.
func (r *timelineRenderer) tick() *canvas.Line {
	if r.nTicks == len(r.ticks) {
		r.ticks = append(r.ticks, canvas.NewLine(color.Transparent))
	}
	r.nTicks++
	return r.ticks[r.nTicks-1]
}

// label returns the next pooled frame-number label.
func (r *timelineRenderer) label() *canvas.Text { return nextText(&r.labels, &r.nLabel) }

// flag returns the next pooled pole and pennant.
func (r *timelineRenderer) flag() (*canvas.Line, *canvas.Rectangle) {
	if r.nFlags == len(r.poles) {
		r.poles = append(r.poles, canvas.NewLine(color.Transparent))
		r.flags = append(r.flags, canvas.NewRectangle(color.Transparent))
	}
	r.nFlags++
	return r.poles[r.nFlags-1], r.flags[r.nFlags-1]
}

// flagLabel returns the next pooled flag label.
func (r *timelineRenderer) flagLabel() *canvas.Text { return nextText(&r.flagText, &r.nFlagT) }

// nextText returns text *n of pool at labelSize, adding one to the pool
// when all are in use, and counts it used.
func nextText(pool *[]*canvas.Text, n *int) *canvas.Text {
	if *n == len(*pool) {
		*pool = append(*pool, canvas.NewText("", color.Transparent))
	}
	*n++
	l := (*pool)[*n-1]
	l.TextSize = labelSize
	return l
}

// rebuild places every primitive for a strip of the given size and sets
// its colours from the theme. It never refreshes.
func (r *timelineRenderer) rebuild(size fyne.Size) {
	t := r.t
	th := t.Theme()
	v := fyne.CurrentApp().Settings().ThemeVariant()
	fg := th.Color(theme.ColorNameForeground, v)
	dim := th.Color(theme.ColorNamePlaceHolder, v)
	primary := th.Color(theme.ColorNamePrimary, v)
	r.nTicks, r.nLabel, r.nFlags, r.nFlagT = 0, 0, 0, 0
	w := size.Width

	r.bg.FillColor = th.Color(theme.ColorNameInputBackground, v)
	r.bg.CornerRadius = th.Size(theme.SizeNameInputRadius)
	r.bg.StrokeWidth = 0
	if t.focused {
		r.bg.StrokeColor = th.Color(theme.ColorNameFocus, v)
		r.bg.StrokeWidth = 1
	}
	r.bg.Move(fyne.NewPos(0, 0))
	r.bg.Resize(size)

	r.objects = append(r.objects[:0], r.bg)
	if t.frames == 0 {
		r.empty.Color = dim
		r.empty.TextSize = labelSize
		r.empty.Move(fyne.NewPos(0, (size.Height-labelSize)/2-2))
		r.empty.Resize(fyne.NewSize(w, labelSize+4))
		r.objects = append(r.objects, r.empty)
		return
	}
	s := newStrip(w, t.frames)

	r.base.StrokeColor = dim
	r.base.StrokeWidth = 1
	r.base.Position1 = fyne.NewPos(s.x(0), baseY)
	r.base.Position2 = fyne.NewPos(s.x(t.frames-1), baseY)
	r.objects = append(r.objects, r.base)

	r.placeTicks(s, fg, dim)
	readX0, readX1 := r.placeReadout(s, size, primary, th.Color(theme.ColorNameForegroundOnPrimary, v))
	r.placeLabels(s, dim, readX0, readX1)
	r.placeFlags(s)

	r.cursor.StrokeColor = primary
	r.cursor.StrokeWidth = 2
	cx := s.x(t.frame)
	r.cursor.Position1 = fyne.NewPos(cx, 1)
	r.cursor.Position2 = fyne.NewPos(cx, baseY+2)

	for _, o := range r.ticks[:r.nTicks] {
		r.objects = append(r.objects, o)
	}
	for _, o := range r.labels[:r.nLabel] {
		r.objects = append(r.objects, o)
	}
	for i := range r.nFlags {
		r.objects = append(r.objects, r.poles[i], r.flags[i])
	}
	for _, o := range r.flagText[:r.nFlagT] {
		r.objects = append(r.objects, o)
	}
	r.objects = append(r.objects, r.cursor, r.readBox, r.readText)
}

// placeTicks draws the frame, six-frame and second ticks, thinning levels
// whose ticks would be closer than minTickGap.
func (r *timelineRenderer) placeTicks(s strip, fg, dim color.Color) {
	t := r.t
	base := nominalRate(t.fps)
	six := 6
	if base%6 != 0 && base%5 == 0 {
		six = 5
	}
	add := func(n int, length float32, c color.Color) {
		l := r.tick()
		x := s.x(n)
		l.StrokeColor = c
		l.StrokeWidth = 1
		l.Position1 = fyne.NewPos(x, baseY-length)
		l.Position2 = fyne.NewPos(x, baseY)
	}
	isSecond := make(map[int]bool, len(t.seconds))
	for _, n := range t.seconds {
		isSecond[n] = true
	}
	switch {
	case s.step >= minTickGap || float32(six)*s.step >= minTickGap:
		every := 1
		if s.step < minTickGap {
			every = six
		}
		for n := 0; n < t.frames; n++ {
			switch {
			case isSecond[n]:
				add(n, tickSecond, fg)
			case n%six == 0:
				add(n, tickSix, dim)
			case every == 1:
				add(n, tickFrame, dim)
			}
		}
	default:
		// Only seconds, every k-th when even they crowd.
		k := 1
		for _, c := range []int{1, 5, 10, 30, 60, 300, 600} {
			k = c
			if float32(c*base)*s.step >= minTickGap {
				break
			}
		}
		for i, n := range t.seconds {
			if i%k == 0 {
				add(n, tickSecond, fg)
			}
		}
	}
	add(t.frames-1, tickSix, fg) // the last frame always shows its end
}

// placeLabels writes frame numbers under the ticks at the finest period
// whose labels do not touch, leaving out the ones under the readout.
func (r *timelineRenderer) placeLabels(s strip, c color.Color, skip0, skip1 float32) {
	t := r.t
	base := nominalRate(t.fps)
	widest := fyne.MeasureText(strconv.Itoa(t.frames-1), labelSize, fyne.TextStyle{}).Width
	need := widest + 8
	period := 0
	for _, p := range labelPeriods(base) {
		if float32(p)*s.step >= need {
			period = p
			break
		}
	}
	if period == 0 {
		return
	}
	var at []int
	if period < base {
		for n := 0; n < t.frames; n += period {
			at = append(at, n)
		}
	} else {
		k := period / base
		for i, n := range t.seconds {
			if i%k == 0 {
				at = append(at, n)
			}
		}
	}
	for _, n := range at {
		text := strconv.Itoa(n)
		sz := fyne.MeasureText(text, labelSize, fyne.TextStyle{})
		x := s.x(n) - sz.Width/2
		if x+sz.Width > skip0-2 && x < skip1+2 {
			continue
		}
		l := r.label()
		l.Text = text
		l.Color = c
		l.Move(fyne.NewPos(x, baseY+2))
		l.Resize(sz)
	}
}

// placeReadout puts the current frame number and timecode in a box under
// the cursor, kept inside the strip, and returns its left and right x.
func (r *timelineRenderer) placeReadout(s strip, size fyne.Size, fill, ink color.Color) (float32, float32) {
	t := r.t
	r.readText.Text = strconv.Itoa(t.frame) + "  " + t.fps.Timecode(t.frame)
	r.readText.TextSize = labelSize
	r.readText.Color = ink
	sz := fyne.MeasureText(r.readText.Text, labelSize, fyne.TextStyle{})
	bw, bh := sz.Width+8, sz.Height+2
	x := s.x(t.frame) - bw/2
	x = max(0, min(x, size.Width-bw))
	y := float32(baseY + 1)
	r.readBox.FillColor = fill
	r.readBox.CornerRadius = 3
	r.readBox.Move(fyne.NewPos(x, y))
	r.readBox.Resize(fyne.NewSize(bw, bh))
	r.readText.Move(fyne.NewPos(x+4, y+1))
	r.readText.Resize(sz)
	return x, x + bw
}

// placeFlags draws each flag inside the take as a pole with a pennant, and its
// label to the right of the flag, or to the left of the pole when the
// right has no room before the next flag or the strip's end; a label that
// fits neither side is left out (the flag stays). The labels of the
// release, the apex and the landing are placed first, so that a crowd of
// flips near the end never hides "landing".
func (r *timelineRenderer) placeFlags(s strip) {
	t := r.t
	var in []Flag
	for _, m := range t.flags {
		if m.Frame >= 0 && m.Frame < t.frames {
			in = append(in, m)
		}
	}
	type span struct {
		lo, hi float32
		frame  int // a pennant's frame; -1 for a label
	}
	var taken []span // pennants and the labels drawn, in x
	for _, m := range in {
		c := m.Kind.Color()
		pole, flag := r.flag()
		x := s.x(m.Frame)
		pole.StrokeColor = c
		pole.StrokeWidth = 1
		pole.Position1 = fyne.NewPos(x, flagTop)
		pole.Position2 = fyne.NewPos(x, baseY)
		flag.FillColor = c
		flag.Move(fyne.NewPos(x, flagTop))
		flag.Resize(fyne.NewSize(flagW, flagH))
		taken = append(taken, span{x, x + flagW, m.Frame})
	}
	// free: [lo, hi] keeps 3 px from every label drawn and every pennant
	// but those of its own frame (flags sharing a frame share the pole).
	free := func(lo, hi float32, frame int) bool {
		for _, sp := range taken {
			if sp.frame != frame && lo < sp.hi+3 && hi > sp.lo-3 {
				return false
			}
		}
		return true
	}
	main := func(k FlagKind) bool { return k == FlagRelease || k == FlagApex || k == FlagLanding }
	for _, first := range []bool{true, false} {
		for i, m := range in {
			if m.Label == "" || main(m.Kind) != first {
				continue
			}
			x := s.x(m.Frame)
			limit := s.x(t.frames-1) + stripInset // the strip's right end
			if i+1 < len(in) {
				limit = min(limit, s.x(in[i+1].Frame)-3)
			}
			sz := fyne.MeasureText(m.Label, labelSize, fyne.TextStyle{})
			lx := x + flagW + 2
			if lx+sz.Width > limit {
				lx = x - 2 - sz.Width
			}
			if lx < 0 || !free(lx, lx+sz.Width, m.Frame) {
				continue
			}
			l := r.flagLabel()
			l.Text = m.Label
			l.Color = m.Kind.Color()
			l.Move(fyne.NewPos(lx, flagTop-3))
			l.Resize(sz)
			taken = append(taken, span{lx, lx + sz.Width, -1})
		}
	}
}
