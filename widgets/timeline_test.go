package widgets

import (
	"slices"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/canvas"
	"fyne.io/fyne/v2/test"

	"propflight/physics"
)

var fps24 = physics.Rate{Num: 24, Den: 1}

// timelineWindow shows a 300-unit-wide timeline of frames frames at 24 fps
// and records the frames onChange reports.
func timelineWindow(t *testing.T, frames int) (*Timeline, fyne.Window, *[]int) {
	t.Helper()
	test.NewTempApp(t)
	var got []int
	tl := NewTimeline(func(n int) { got = append(got, n) })
	tl.SetRange(frames, fps24)
	w := test.NewTempWindow(t, tl)
	w.SetPadded(false)
	w.Resize(fyne.NewSize(300, timelineHeight))
	return tl, w, &got
}

// frameX is the x of frame n on a strip of width w with frames frames:
// frame 0 at stripInset, the last frame at w - stripInset.
func frameX(w float32, frames, n int) float32 {
	return stripInset + float32(n)*(w-2*stripInset)/float32(frames-1)
}

func TestTimeline_Tap_CallsOnChange(t *testing.T) {
	tl, _, got := timelineWindow(t, 24)
	test.TapAt(tl, fyne.NewPos(frameX(300, 24, 10), 20))
	if !slices.Equal(*got, []int{10}) || tl.Frame() != 10 {
		t.Fatalf("tap at frame 10: onChange %v, Frame() %d", *got, tl.Frame())
	}
	// Half a frame step to the right of frame 10 still rounds to 10 or 11,
	// a little less than half stays on 10: no second call.
	step := float32(300-2*stripInset) / 23
	test.TapAt(tl, fyne.NewPos(frameX(300, 24, 10)+0.4*step, 20))
	if len(*got) != 1 {
		t.Errorf("tap on the current frame called onChange again: %v", *got)
	}
}

func TestTimeline_Drag_ScrubsAndClamps(t *testing.T) {
	tl, w, got := timelineWindow(t, 24)
	test.Drag(w.Canvas(), fyne.NewPos(frameX(300, 24, 5), 20), 30, 0)
	if !slices.Equal(*got, []int{5}) {
		t.Fatalf("drag at frame 5: onChange %v", *got)
	}
	// A real drag keeps reporting positions outside the widget.
	tl.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(5000, 20)}})
	tl.Dragged(&fyne.DragEvent{PointEvent: fyne.PointEvent{Position: fyne.NewPos(-80, 20)}})
	tl.DragEnd()
	if !slices.Equal(*got, []int{5, 23, 0}) {
		t.Errorf("drag past the ends: onChange %v, want [5 23 0]", *got)
	}
}

func TestTimeline_SetFrame_DoesNotCallBack(t *testing.T) {
	tl, _, got := timelineWindow(t, 24)
	tl.SetFrame(7)
	tl.SetFrame(99)
	if len(*got) != 0 {
		t.Errorf("SetFrame called onChange: %v", *got)
	}
	if tl.Frame() != 23 {
		t.Errorf("SetFrame(99) on 24 frames gives %d, want 23", tl.Frame())
	}
	tl.SetRange(10, fps24)
	if tl.Frame() != 9 {
		t.Errorf("shrinking the range to 10 frames leaves frame %d, want 9", tl.Frame())
	}
}

func TestTimeline_Keys_StepFrames(t *testing.T) {
	tl, _, got := timelineWindow(t, 60)
	for _, k := range []fyne.KeyName{fyne.KeyRight, fyne.KeyRight, fyne.KeyLeft, fyne.KeyPageDown, fyne.KeyEnd, fyne.KeyRight, fyne.KeyHome} {
		tl.TypedKey(&fyne.KeyEvent{Name: k})
	}
	// 1, 2, 1, 1+24, 59, (no move past the end), 0.
	if want := []int{1, 2, 1, 25, 59, 0}; !slices.Equal(*got, want) {
		t.Errorf("keys gave %v, want %v", *got, want)
	}
}

// TestTimeline_OtherKeys_PassedOn: keys the timeline does not use reach
// OnOtherKey (the window plays with Space); its own keys do not.
func TestTimeline_OtherKeys_PassedOn(t *testing.T) {
	tl, _, got := timelineWindow(t, 24)
	var other []fyne.KeyName
	tl.OnOtherKey = func(k *fyne.KeyEvent) { other = append(other, k.Name) }
	for _, k := range []fyne.KeyName{fyne.KeySpace, fyne.KeyRight, fyne.KeyReturn, fyne.KeyHome} {
		tl.TypedKey(&fyne.KeyEvent{Name: k})
	}
	if want := []fyne.KeyName{fyne.KeySpace, fyne.KeyReturn}; !slices.Equal(other, want) {
		t.Errorf("OnOtherKey got %v, want %v", other, want)
	}
	if want := []int{1, 0}; !slices.Equal(*got, want) {
		t.Errorf("onChange %v, want %v", *got, want)
	}
	tl.OnOtherKey = nil
	tl.TypedKey(&fyne.KeyEvent{Name: fyne.KeySpace}) // no callback: nothing happens
}

func TestTimeline_Empty_IgnoresInput(t *testing.T) {
	tl, _, got := timelineWindow(t, 0)
	test.TapAt(tl, fyne.NewPos(150, 20))
	tl.TypedKey(&fyne.KeyEvent{Name: fyne.KeyRight})
	if len(*got) != 0 || tl.Frame() != 0 {
		t.Errorf("empty timeline: onChange %v, frame %d", *got, tl.Frame())
	}
}

// The drop-frame rule of SMPTE ST 12-1: at 30000/1001 the labels ;00 and
// ;01 are skipped at the start of every minute but each tenth, so the
// second 00:01:00 starts on frame 1800 (labelled 00:01:00;02) and has only
// 28 frames; 00:01:01 starts on frame 1828.
func TestSecondStarts_DropFrame(t *testing.T) {
	s := secondStarts(1900, physics.Rate{Num: 30000, Den: 1001})
	if s[1] != 30 || s[59] != 1770 || s[60] != 1800 || s[61] != 1828 || s[62] != 1858 {
		t.Errorf("second starts 1, 59..62 = %d %v, want 30 [1770 1800 1828 1858]", s[1], s[59:63])
	}
	if tc := (physics.Rate{Num: 30000, Den: 1001}).Timecode(1800); tc != "00:01:00;02" {
		t.Errorf("Timecode(1800) = %q", tc)
	}
	if s := secondStarts(50, fps24); !slices.Equal(s, []int{0, 24, 48}) {
		t.Errorf("24 fps second starts below 50 = %v", s)
	}
}

func TestTimeline_Golden(t *testing.T) {
	tl, w, _ := timelineWindow(t, 32)
	w.Resize(fyne.NewSize(420, timelineHeight))
	tl.SetFlags([]Flag{{0, FlagRelease, "release"}, {13, FlagApex, "apex"}, {21, FlagKey, "key"},
		{30, FlagFlip, "flip"}, {31, FlagLanding, "land"}, {40, FlagKey, "outside"}})
	tl.SetFrame(13)
	test.AssertImageMatches(t, "timeline/apex.png", w.Canvas().Capture())

	long, w2, _ := timelineWindow(t, 600)
	long.SetRange(600, physics.Rate{Num: 30000, Den: 1001})
	long.SetFrame(599)
	w2.Resize(fyne.NewSize(420, timelineHeight))
	test.AssertImageMatches(t, "timeline/long_dropframe.png", w2.Canvas().Capture())
}

// TestTimeline_LandingLabel_BeatsAFlip: a flip two frames before the
// landing (flip 4 at 25, landing at 27 of 28 frames, in the window's 690 px
// strip) does not hide the "landing" label with its own label: the
// release, apex and landing labels are placed first. (One frame before,
// the flip's pennant leaves "landing" no room on either side.)
func TestTimeline_LandingLabel_BeatsAFlip(t *testing.T) {
	tl, w, _ := timelineWindow(t, 28)
	w.Resize(fyne.NewSize(690, timelineHeight))
	// A flip on the apex's own frame, listed before or after it, shares
	// its pole and leaves the apex label its room.
	for _, flip2 := range []int{0, 1} {
		flags := []Flag{{0, FlagRelease, "release"}, {4, FlagFlip, "flip 1"}, {11, FlagApex, "apex"},
			{19, FlagFlip, "flip 3"}, {25, FlagFlip, "flip 4"}, {27, FlagLanding, "landing"}}
		flags = slices.Insert(flags, 2+flip2, Flag{11, FlagFlip, "flip 2"})
		tl.SetFlags(flags)
		shown := map[string]bool{}
		for _, o := range test.WidgetRenderer(tl).Objects() {
			if l, ok := o.(*canvas.Text); ok && l.Visible() && l.Text != "" {
				shown[l.Text] = true
			}
		}
		for _, want := range []string{"release", "apex", "landing", "flip 1", "flip 3"} {
			if !shown[want] {
				t.Errorf("flip 2 at index %d: label %q not drawn; drawn: %v", 2+flip2, want, shown)
			}
		}
	}
}
