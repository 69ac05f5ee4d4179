package widgets

import (
	"image"
	"image/color"
	"testing"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/theme"

	"propflight/widgets/wire"
)

// variantTheme is the default theme held at one variant, as a user's
// light or dark choice is.
type variantTheme struct {
	fyne.Theme
	v fyne.ThemeVariant
}

func (t variantTheme) Color(n fyne.ThemeColorName, _ fyne.ThemeVariant) color.Color {
	return t.Theme.Color(n, t.v)
}

// TestPreview_FollowsTheme: under a light theme the preview paints the
// light palette's background, under a dark one the dark palette's, and a
// theme change repaints it; a palette set by hand stays.
func TestPreview_FollowsTheme(t *testing.T) {
	p, w := previewWindow(t)
	a := fyne.CurrentApp()
	corner := func() color.RGBA {
		w.Canvas().Capture()
		return p.Image().(*image.RGBA).RGBAAt(1, 1)
	}
	nrgba := func(c color.NRGBA) color.RGBA { return color.RGBA(c) } // the backgrounds are opaque, so the bytes are the same
	a.Settings().SetTheme(variantTheme{theme.DefaultTheme(), theme.VariantLight})
	p.Refresh()
	if got, want := corner(), nrgba(wire.LightPalette().Background); got != want {
		t.Errorf("light theme: background %v, want %v", got, want)
	}
	a.Settings().SetTheme(variantTheme{theme.DefaultTheme(), theme.VariantDark})
	p.Refresh()
	if got, want := corner(), nrgba(wire.DefaultPalette().Background); got != want {
		t.Errorf("dark theme: background %v, want %v", got, want)
	}
	p.SetPalette(wire.PrintPalette())
	a.Settings().SetTheme(variantTheme{theme.DefaultTheme(), theme.VariantDark})
	p.Refresh()
	if got := corner(); got != (color.RGBA{255, 255, 255, 255}) {
		t.Errorf("a palette set by hand: background %v", got)
	}
}
