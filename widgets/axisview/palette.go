package axisview

import (
	"image/color"

	"propflight/physics"
)

// Palette is the map's colours: a light and a dark end for each motion
// (the light end at excursion 0, the dark at 90 degrees), the lines, the
// text and the background. Propflight's own colours.
type Palette struct {
	Background  color.NRGBA
	Text        color.NRGBA
	Halo        color.NRGBA // behind text drawn over the discs
	Rim         color.NRGBA // disc outline and class boundaries
	Separatrix  color.NRGBA
	Ring        color.NRGBA // the ring round the current spin direction
	Greatest    [2]color.NRGBA
	Least       [2]color.NRGBA
	Tumble      [2]color.NRGBA
	Wobble      [2]color.NRGBA
	PolhodeDark float64 // how much a polhode line darkens the colour under it (0..1)
}

// ScreenPalette suits the window's dark preview background.
func ScreenPalette() Palette {
	return Palette{
		Background:  color.NRGBA{24, 29, 37, 255},
		Text:        color.NRGBA{226, 230, 236, 255},
		Halo:        color.NRGBA{24, 29, 37, 255},
		Rim:         color.NRGBA{12, 14, 18, 255},
		Separatrix:  color.NRGBA{255, 255, 255, 255},
		Ring:        color.NRGBA{255, 255, 255, 255},
		Greatest:    [2]color.NRGBA{{188, 222, 250, 255}, {24, 74, 150, 255}},
		Least:       [2]color.NRGBA{{252, 228, 168, 255}, {150, 96, 10, 255}},
		Tumble:      [2]color.NRGBA{{248, 190, 206, 255}, {150, 28, 70, 255}},
		Wobble:      [2]color.NRGBA{{196, 238, 204, 255}, {28, 116, 70, 255}},
		PolhodeDark: 0.28,
	}
}

// PrintPalette suits paper: dark text on white, the same hues.
func PrintPalette() Palette {
	p := ScreenPalette()
	p.Background = color.NRGBA{255, 255, 255, 255}
	p.Text = color.NRGBA{28, 30, 36, 255}
	p.Halo = color.NRGBA{255, 255, 255, 255}
	p.Rim = color.NRGBA{60, 64, 72, 255}
	p.Ring = color.NRGBA{0, 0, 0, 255}
	return p
}

// Colour returns the colour of a direction with motion m circling axis c
// at excursion exc degrees (0..90).
func (p *Palette) Colour(m physics.Motion, c physics.Axis, exc float64) color.NRGBA {
	var ends [2]color.NRGBA
	switch {
	case m == physics.Tumbling:
		ends = p.Tumble
	case m == physics.Wobbling:
		ends = p.Wobble
	case c == physics.Least:
		ends = p.Least
	default:
		ends = p.Greatest
	}
	t := min(max(exc/90, 0), 1)
	return mix(ends[0], ends[1], t)
}

// Swatch returns the legend colour of a motion (its mid shade).
func (p *Palette) Swatch(m physics.Motion, c physics.Axis) color.NRGBA {
	return p.Colour(m, c, 40)
}

func mix(a, b color.NRGBA, t float64) color.NRGBA {
	f := func(x, y uint8) uint8 { return uint8(float64(x) + (float64(y)-float64(x))*t + 0.5) }
	return color.NRGBA{f(a.R, b.R), f(a.G, b.G), f(a.B, b.B), f(a.A, b.A)}
}
