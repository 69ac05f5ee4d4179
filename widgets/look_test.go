package widgets

import (
	"image/png"
	"os"
	"path/filepath"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/test"
	"fyne.io/fyne/v2/theme"

	"propflight/internal/fixture"
	"propflight/physics"
	"propflight/widgets/wire"
)

// TestLook writes PNG captures of the widgets to $PROPFLIGHT_LOOK for a
// person to look at. It is skipped unless that variable names a folder.
func TestLook(t *testing.T) {
	dir := os.Getenv("PROPFLIGHT_LOOK")
	if dir == "" {
		t.Skip("set PROPFLIGHT_LOOK to a folder to write captures")
	}
	test.NewTempApp(t)
	test.ApplyTheme(t, theme.DefaultTheme())
	sc := fixture.PanScene(t, 1.1, 2.8, 1.5, 0)
	n := len(sc.Take.Frames)

	pv := NewPreview()
	pv.SetScene(sc)
	pv.SetFrame(sc.Take.ApexFrame)
	tl := NewTimeline(nil)
	tl.SetRange(n, physics.Rate{Num: 24, Den: 1})
	tl.SetFlags([]Flag{{0, FlagRelease, "release"}, {sc.Take.ApexFrame, FlagApex, "apex"}, {30, FlagFlip, "flip"}, {33, FlagKey, "key"}, {n - 1, FlagLanding, "land"}})
	tl.SetFrame(sc.Take.ApexFrame)
	f1 := NewNumberField("Radius", Length, 0.001, 1, nil)
	f1.SetValue(0.13)
	f2 := NewNumberField("Density", Density, 10, 20000, nil)
	f2.SetLog(true)
	f2.SetValue(7850)
	f2.SetImperial(true)
	f3 := NewNumberField("Spin", TurnRate, 0, 10, nil)
	f3.SetValue(1.5)
	f3.entry.SetText("abc")
	f3.commit()
	lw := max(f1.LabelMinWidth(), f2.LabelMinWidth(), f3.LabelMinWidth())
	for _, f := range []*NumberField{f1, f2, f3} {
		f.SetLabelWidth(lw)
	}
	content := container.NewBorder(nil, container.NewVBox(tl, f1, f2, f3), nil, nil, pv)
	w := test.NewTempWindow(t, content)
	w.Resize(fyne.NewSize(720, 560))
	save(t, filepath.Join(dir, "window.png"), w)

	pv.Dragged(&fyne.DragEvent{Dragged: fyne.Delta{DX: -60, DY: 25}})
	save(t, filepath.Join(dir, "window-orbit.png"), w)
	pv.SetView(wire.Free)
	save(t, filepath.Join(dir, "window-free.png"), w)

	tl3 := NewTimeline(nil)
	tl3.SetRange(n, physics.Rate{Num: 24, Den: 1})
	tl3.SetFlags([]Flag{{0, FlagRelease, "release"}, {sc.Take.ApexFrame, FlagApex, "apex"}, {30, FlagFlip, "flip"}, {33, FlagKey, "key"}, {n - 1, FlagLanding, "land"}})
	tl3.SetFrame(5)
	w3 := test.NewTempWindow(t, tl3)
	w3.Canvas().(test.WindowlessCanvas).SetScale(2)
	w3.Resize(fyne.NewSize(500, 56))
	save(t, filepath.Join(dir, "timeline-x2.png"), w3)

	tl2 := NewTimeline(nil)
	tl2.SetRange(24*20, physics.Rate{Num: 30000, Den: 1001})
	tl2.SetFrame(300)
	w2 := test.NewTempWindow(t, tl2)
	w2.Resize(fyne.NewSize(600, 60))
	save(t, filepath.Join(dir, "timeline-long.png"), w2)
}

func save(t *testing.T, path string, w fyne.Window) {
	t.Helper()
	img := w.Canvas().Capture()
	f, err := os.Create(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	if err := png.Encode(f, img); err != nil {
		t.Fatal(err)
	}
}
