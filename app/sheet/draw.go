package sheet

import (
	"strconv"

	"github.com/go-pdf/fpdf"
)

// rgb is a colour of the sheet's own print palette.
type rgb struct{ r, g, b int }

// The sheet's colours: dark ink for text, a softer grey for secondary
// text, light rules, and pale fills that mark keys and breakdowns in the
// table and photocopy as light greys.
var (
	inkText      = rgb{28, 30, 36}
	inkSoft      = rgb{92, 98, 110}
	inkRule      = rgb{176, 182, 192}
	inkFaint     = rgb{222, 226, 232}
	inkArc       = rgb{18, 112, 138}
	inkGround    = rgb{120, 110, 96}
	inkAccent    = rgb{176, 72, 24}
	fillPanel    = rgb{243, 245, 248}
	fillHead     = rgb{229, 233, 239}
	fillKey      = rgb{250, 232, 196}
	fillBreak    = rgb{222, 236, 246}
	fillGroundBg = rgb{246, 243, 238}
)

func ink(p *fpdf.Fpdf, c rgb)  { p.SetTextColor(c.r, c.g, c.b) }
func pen(p *fpdf.Fpdf, c rgb)  { p.SetDrawColor(c.r, c.g, c.b) }
func fill(p *fpdf.Fpdf, c rgb) { p.SetFillColor(c.r, c.g, c.b) }

// rule draws a line of width w mm in colour c.
func rule(p *fpdf.Fpdf, x0, y0, x1, y1, w float64, c rgb) {
	p.SetLineWidth(w)
	pen(p, c)
	p.Line(x0, y0, x1, y1)
}

// box fills a rectangle with colour c.
func box(p *fpdf.Fpdf, x, y, w, h float64, c rgb) {
	fill(p, c)
	p.Rect(x, y, w, h, "F")
}

func itoa(n int) string { return strconv.Itoa(n) }

// fitText returns s shortened with "…" so that it is at most w mm wide in
// the current font: the longest prefix that fits with the ellipsis, found
// by bisection on the number of characters (a width never shrinks as
// characters are added), so the cost is O(n log n) in the length of s, not
// the O(n^2) of dropping one character at a time. It returns "" when not
// even "…" fits.
func fitText(p *fpdf.Fpdf, s string, w float64) string {
	if p.GetStringWidth(s) <= w {
		return s
	}
	r := []rune(s)
	// Invariant: the prefix of lo characters fits (lo = 0 may not: checked
	// at the end), the prefix of hi does not.
	lo, hi := 0, len(r)
	for hi-lo > 1 {
		mid := lo + (hi-lo)/2
		if p.GetStringWidth(string(r[:mid])+"…") <= w {
			lo = mid
		} else {
			hi = mid
		}
	}
	t := string(r[:lo]) + "…"
	if p.GetStringWidth(t) > w {
		return ""
	}
	return t
}
