package widgets

import (
	"image/color"
	"math"
	"slices"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/widget"

	"propflight/physics"
)

// Declare conformity with the interfaces Timeline implements.
var (
	_ fyne.Widget    = (*Timeline)(nil)
	_ fyne.Tappable  = (*Timeline)(nil)
	_ fyne.Draggable = (*Timeline)(nil)
	_ fyne.Focusable = (*Timeline)(nil)
)

// FlagKind says what a timeline flag stands for; each kind has its own
// colour.
type FlagKind int

// The flag kinds.
const (
	FlagRelease FlagKind = iota // frame 0, the prop leaves the hand
	FlagApex                    // the top of the centre-of-mass arc
	FlagLanding                 // the last frame before ground contact
	FlagFlip                    // a middle-axis flip of a tumbling prop
	FlagKey                     // a key the user set
)

// flagColors are Propflight's own flag colours, by FlagKind.
var flagColors = [...]color.NRGBA{
	FlagRelease: {72, 196, 132, 255},
	FlagApex:    {238, 184, 52, 255},
	FlagLanding: {232, 96, 72, 255},
	FlagFlip:    {196, 104, 228, 255},
	FlagKey:     {84, 156, 240, 255},
}

// Color returns the colour the timeline draws flags of kind k in.
func (k FlagKind) Color() color.NRGBA {
	if k < 0 || int(k) >= len(flagColors) {
		return color.NRGBA{160, 160, 160, 255}
	}
	return flagColors[k]
}

// Flag stands on the timeline at a frame where something happens in the
// take (release, apex, landing, a flip, a key), with a short label ("apex",
// "flip 1"). Flags outside the take are not drawn.
type Flag struct {
	Frame int
	Kind  FlagKind
	Label string
}

// Timeline is a strip of the take's frames: a tick per frame (longer every
// six frames, five at 25 and 50 fps, and longest at every timecode
// second; thinned when they crowd), frame numbers, the flags as coloured
// flags and the current frame as a cursor with its number and timecode
// (physics.Rate.Timecode). Tapping or dragging moves the cursor to the
// frame under the pointer and calls onChange; Left/Right step a frame and
// Home/End jump to the ends when it has the focus.
type Timeline struct {
	widget.BaseWidget

	// OnOtherKey is called with the keys the timeline does not use itself
	// while it has the focus (the window plays and pauses with Space), so
	// taking the focus with a tap swallows no key. It may be nil.
	OnOtherKey func(*fyne.KeyEvent)

	onChange func(frame int)
	frames   int
	fps      physics.Rate
	flags    []Flag
	frame    int
	focused  bool
	seconds  []int // frames on which a timecode second begins, ascending
}

// NewTimeline returns an empty timeline (no frames) at 24 fps. onChange is
// called with the new frame whenever the user moves the cursor; it may be
// nil.
func NewTimeline(onChange func(frame int)) *Timeline {
	t := &Timeline{onChange: onChange, fps: physics.Rate{Num: 24, Den: 1}}
	t.ExtendBaseWidget(t)
	return t
}

// SetRange sets the number of frames (frames 0 to frames-1; 0 or less
// shows an empty strip) and the frame rate, which places the second ticks
// and labels the timecode. An invalid rate counts as 24 fps. The current
// frame is clamped into the new range without calling onChange.
func (t *Timeline) SetRange(frames int, fps physics.Rate) {
	if !fps.Valid() {
		fps = physics.Rate{Num: 24, Den: 1}
	}
	t.frames = max(frames, 0)
	t.fps = fps
	t.seconds = secondStarts(t.frames, fps)
	t.frame = t.clamp(t.frame)
	t.Refresh()
}

// Frames returns the number of frames.
func (t *Timeline) Frames() int { return t.frames }

// SetFlags replaces the flags. The slice is copied.
func (t *Timeline) SetFlags(flags []Flag) {
	t.flags = slices.Clone(flags)
	slices.SortStableFunc(t.flags, func(a, b Flag) int { return a.Frame - b.Frame })
	t.Refresh()
}

// SetFrame moves the cursor to frame n, clamped to the take, without
// calling onChange.
func (t *Timeline) SetFrame(n int) {
	n = t.clamp(n)
	if n == t.frame {
		return
	}
	t.frame = n
	t.Refresh()
}

// Frame returns the current frame.
func (t *Timeline) Frame() int { return t.frame }

func (t *Timeline) clamp(n int) int { return min(max(n, 0), max(t.frames-1, 0)) }

// Tapped moves the cursor to the frame under the pointer and takes the
// keyboard focus.
func (t *Timeline) Tapped(e *fyne.PointEvent) {
	t.scrub(e.Position.X)
	if c := fyne.CurrentApp().Driver().CanvasForObject(t); c != nil && !t.focused {
		c.Focus(t)
	}
}

// Dragged follows the pointer frame by frame.
func (t *Timeline) Dragged(e *fyne.DragEvent) { t.scrub(e.Position.X) }

// DragEnd ends a scrub; the last frame was already reported.
func (t *Timeline) DragEnd() {}

// FocusGained shows the focus.
func (t *Timeline) FocusGained() { t.focused = true; t.Refresh() }

// FocusLost hides the focus.
func (t *Timeline) FocusLost() { t.focused = false; t.Refresh() }

// TypedRune ignores text input.
func (t *Timeline) TypedRune(rune) {}

// TypedKey steps the cursor: Left and Right by a frame, Page Up and Page
// Down by a timecode second, Home and End to the first and last frame.
// Other keys go to OnOtherKey.
func (t *Timeline) TypedKey(k *fyne.KeyEvent) {
	n := t.frame
	base := nominalRate(t.fps)
	switch k.Name {
	case fyne.KeyLeft:
		n--
	case fyne.KeyRight:
		n++
	case fyne.KeyPageUp:
		n -= base
	case fyne.KeyPageDown:
		n += base
	case fyne.KeyHome:
		n = 0
	case fyne.KeyEnd:
		n = t.frames - 1
	default:
		if t.OnOtherKey != nil {
			t.OnOtherKey(k)
		}
		return
	}
	t.moveTo(n)
}

// scrub moves to the frame under widget x.
func (t *Timeline) scrub(x float32) {
	if t.frames == 0 {
		return
	}
	t.moveTo(newStrip(t.Size().Width, t.frames).frameAt(x))
}

// moveTo moves the cursor to n (clamped) and reports a change.
func (t *Timeline) moveTo(n int) {
	n = t.clamp(n)
	if t.frames == 0 || n == t.frame {
		return
	}
	t.frame = n
	t.Refresh()
	if t.onChange != nil {
		t.onChange(n)
	}
}

// CreateRenderer is a private method to Fyne which links this widget to its
// renderer.
func (t *Timeline) CreateRenderer() fyne.WidgetRenderer {
	r := &timelineRenderer{t: t}
	r.bg = canvas.NewRectangle(color.Transparent)
	r.base = canvas.NewLine(color.Transparent)
	r.cursor = canvas.NewLine(color.Transparent)
	r.readBox = canvas.NewRectangle(color.Transparent)
	r.readText = canvas.NewText("", color.Transparent)
	r.empty = canvas.NewText("no take", color.Transparent)
	r.empty.Alignment = fyne.TextAlignCenter
	r.rebuild(t.Size())
	return r
}

// Geometry of the strip, in device-independent units from its top edge.
const (
	timelineHeight = 48.0
	timelineWidth  = 160.0
	stripInset     = 14.0 // frame 0 and the last frame sit this far inside the ends
	baseY          = 30.0 // the line the ticks stand on
	tickFrame      = 4.0  // tick lengths: every frame
	tickSix        = 7.0  // every six (or five) frames
	tickSecond     = 11.0 // every timecode second
	minTickGap     = 3.0  // ticks closer than this are thinned
	flagTop        = 2.0  // top of a flag's pole
	flagW, flagH   = 7.0, 6.0
	labelSize      = 10.0 // text size of frame numbers, flag labels and the readout
)

// strip maps frames to x along a timeline of width w.
type strip struct {
	x0, step float32
	frames   int
}

func newStrip(w float32, frames int) strip {
	span := max(w-2*stripInset, 1)
	return strip{x0: stripInset, step: span / float32(max(frames-1, 1)), frames: frames}
}

func (s strip) x(n int) float32 { return s.x0 + float32(n)*s.step }

// frameAt returns the frame nearest widget x, clamped to the strip.
func (s strip) frameAt(x float32) int {
	n := int(math.Round(float64((x - s.x0) / s.step)))
	return min(max(n, 0), max(s.frames-1, 0))
}

// nominalRate returns the whole rate that timecode labels count in.
func nominalRate(r physics.Rate) int {
	return max(int((r.Num+r.Den/2)/r.Den), 1)
}

// secondStarts returns the frames below frames on which the timecode's
// seconds field changes, starting with 0. Drop-frame rates are read off
// physics.Rate.Timecode itself so that the ticks agree with the labels.
func secondStarts(frames int, fps physics.Rate) []int {
	if frames <= 0 {
		return nil
	}
	base := nominalRate(fps)
	drop := fps.Den == 1001 && (fps.Num == 30000 || fps.Num == 60000)
	if !drop {
		out := make([]int, 0, frames/base+1)
		for n := 0; n < frames; n += base {
			out = append(out, n)
		}
		return out
	}
	out := []int{0}
	prev := fps.Timecode(0)
	for n := 1; n < frames; n++ {
		tc := fps.Timecode(n)
		if tc[:8] != prev[:8] { // HH:MM:SS changed
			out = append(out, n)
		}
		prev = tc
	}
	return out
}

// labelPeriods returns the candidate spacings of frame-number labels in
// frames: the divisors of the nominal rate, then whole numbers of seconds.
func labelPeriods(base int) []int {
	var p []int
	for d := 1; d < base; d++ {
		if base%d == 0 {
			p = append(p, d)
		}
	}
	for _, s := range []int{1, 2, 5, 10, 15, 30, 60, 120, 300, 600} {
		p = append(p, s*base)
	}
	return p
}
