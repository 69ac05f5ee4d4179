package sheet

import (
	"math"

	"propflight/physics"
)

// Frame table layout.
const (
	rowH       = 4.2 // mm a row
	sizeRow    = 8.0 // points, row text (8 pt at least, for reading at the desk)
	sizeNoteLo = 8.0 // points: the smallest the notes column (head "marks") shrinks to (then it is shortened)
	sizeHead   = 8.0 // points, column heads
	sizeUnit   = 5.6 // points, the unit line of the heads
	headH      = 8.0 // mm, the two-line column heads
	sizeNote   = 6.2 // points, footnotes
)

// column is one column of the frame table: its heads, its share of the
// width and its alignment.
type column struct {
	head, unit string
	frac       float64
	align      string
}

var columns = []column{
	{"frame", "", 0.055, "R"},
	{"timecode", "HH:MM:SS:FF", 0.105, "R"},
	{"x", "m", 0.09, "R"},
	{"y", "m", 0.09, "R"},
	{"z", "m", 0.09, "R"},
	{"spacing", "m, from last row", 0.095, "R"},
	{"turn", "°, from last row", 0.085, "R"},
	{"total turn", "° since release", 0.09, "R"},
	{"marks", "", 0.30, "L"},
}

// cells returns the printed cells of row r.
func (s *sheet) cells(r *row) []string {
	spacing, turn := fixed(r.spacing, DecimalsMetres), fixed(r.turn, DecimalsTurn)
	if r.frame == 0 {
		spacing, turn = "—", "—"
	}
	return []string{
		s.frameNo(r.frame),
		s.timecode(r.frame),
		fixed(r.cm.X, DecimalsMetres),
		fixed(r.cm.Y, DecimalsMetres),
		fixed(r.cm.Z, DecimalsMetres),
		spacing,
		turn,
		fixed(r.total, DecimalsTotal),
		joinNotes(r.notes),
	}
}

// frameNo is frame n of the take as the sheet prints it: n plus the
// start frame.
func (s *sheet) frameNo(n int) string { return itoa(n + s.opt.StartFrame) }

// dropFrame reports whether the sheet's timecode is drop-frame.
func (s *sheet) dropFrame() bool { return s.sc.Throw.FPS.IsDropFrame() && !s.opt.NonDropTimecode }

// timecode is the label of frame n of the take: the start timecode plus n,
// drop-frame or not.
func (s *sheet) timecode(n int) string {
	if s.dropFrame() {
		return s.sc.Throw.FPS.Timecode(s.opt.StartTimecode + n)
	}
	return s.sc.Throw.FPS.TimecodeNonDrop(s.opt.StartTimecode + n)
}

// timecodeUnit is the timecode column's unit line: HH:MM:SS;FF for
// drop-frame (SMPTE ST 12-1's separator), HH:MM:SS:FF otherwise.
func (s *sheet) timecodeUnit() string {
	if s.dropFrame() {
		return "HH:MM:SS;FF DF"
	}
	if s.sc.Throw.FPS.IsDropFrame() {
		return "HH:MM:SS:FF NDF"
	}
	return "HH:MM:SS:FF"
}

// dropExtra names the further labels 59.94 drop-frame skips.
func dropExtra(r physics.Rate) string {
	if r.Num == 60000 {
		return " (;00 to ;03 at 59.94)"
	}
	return ""
}

// notes returns the table's footnotes.
func (s *sheet) notes() []string {
	n := []string{
		"Keys: release (frame " + s.frameNo(0) + "), apex (the frame nearest the top of the centre-of-mass arc) and landing (the last frame before first ground contact). " +
			"Breakdowns: the frame halfway between two consecutive keys a and b, (a + b) / 2 rounded down; none where the keys are less than two frames apart.",
		"Marks: 90°, 180°, ... where the total turn (the sum of the turns from frame to frame) reaches a multiple of a quarter turn; flip k where a tumble's middle axis reverses " +
			"(first flip + (k − 1) × flip period, on the first frame at or after it); onset where a spin near the middle axis starts to grow (the verdict's onset time, same rule).",
		"Spacing is the straight distance the centre of mass moves since the previous row, turn the angle the prop turns along its motion since then (more than 180° for a fast spin). " +
			"Values are the take's, rounded: metres to 4 decimals, turn to 2, total turn to 1.",
	}
	switch {
	case s.dropFrame():
		n = append(n, "Timecode: drop-frame (DF, SMPTE ST 12-1): labels ;00 and ;01"+dropExtra(s.sc.Throw.FPS)+" are skipped at the start of every minute but each tenth, "+
			"so the labels keep to the clock; no frames are dropped.")
	case s.sc.Throw.FPS.IsDropFrame():
		n = append(n, "Timecode: non-drop (NDF): every label is counted at "+itoa(int(math.Round(s.fps())))+" a second, so the labels run 3.6 s an hour behind the clock.")
	}
	if s.opt.Twos {
		n = append(n, "On twos: every other frame is listed and each drawing holds for two frames; the marks of a held frame join the row before it with (at N), "+
			"and spacing and turn are measured from the previous listed row.")
	}
	if s.tm.aliased {
		n = append(n, "Caution: somewhere the prop turns more than half a turn in one frame; the turn columns give the real turn, but drawings "+
			"(or a camera) at this frame rate read it the shorter way round (the wagon-wheel effect): add in-betweens or lower the spin.")
	}
	return n
}

// table draws the frame table over as many pages as it needs, with the
// column heads and the footnotes on every page.
func (s *sheet) table() error {
	p := s.pdf
	x, w := margin, s.width()
	notes := s.notes()
	s.font("", sizeNote)
	lh := lineH(sizeNote)
	var noteLines [][]string
	notesH := 0.0
	for _, n := range notes {
		l := p.SplitText(n, w)
		noteLines = append(noteLines, l)
		notesH += float64(len(l))*lh + 0.8
	}
	title := "Frame table, " + s.onesOrTwos()
	if s.opt.Twos {
		title += ": every other frame"
	} else {
		title += ": every frame"
	}

	i := 0
	for i < len(s.rows) {
		s.newPage()
		y := contentTop + 1
		y = s.section(x, y, w, title)
		y = s.heads(x, y, w)
		bottom := s.contentBottom() - notesH - 2
		perPage := max(1, int(math.Floor((bottom-y)/rowH)))
		end := min(len(s.rows), i+perPage)
		for ; i < end; i++ {
			if err := s.step(); err != nil {
				return err
			}
			s.tableRow(x, y, w, &s.rows[i])
			y += rowH
		}
		// Footnotes at the foot of the page.
		ny := s.contentBottom() - notesH
		rule(p, x, ny-1, x+w*0.3, ny-1, 0.15, inkRule)
		s.font("", sizeNote)
		ink(p, inkSoft)
		for _, l := range noteLines {
			for _, line := range l {
				p.SetXY(x, ny)
				p.CellFormat(w, lh, line, "", 0, "L", false, 0, "")
				ny += lh
			}
			ny += 0.8
		}
	}
	return p.Error()
}

// heads draws the column heads and returns the y below them.
func (s *sheet) heads(x, y, w float64) float64 {
	p := s.pdf
	box(p, x, y, w, headH, fillHead)
	cx := x
	for _, c := range columns {
		cw := c.frac * w
		s.font("B", sizeHead)
		ink(p, inkText)
		pad := 0.0
		if c.align == "L" {
			pad = 1.6 // as the notes in the rows
		}
		p.SetXY(cx+pad, y+0.6)
		p.CellFormat(cw, 3.4, c.head, "", 0, c.align, false, 0, "")
		unit := c.unit
		if c.head == "timecode" {
			unit = s.timecodeUnit()
		}
		if unit != "" {
			s.font("", sizeUnit)
			ink(p, inkSoft)
			p.SetXY(cx, y+4.1)
			p.CellFormat(cw, 3, fitText(p, unit, cw-1.6), "", 0, c.align, false, 0, "")
		}
		cx += cw
	}
	rule(p, x, y+headH, x+w, y+headH, 0.3, inkSoft)
	return y + headH + 0.3
}

// tableRow draws one row at y.
func (s *sheet) tableRow(x, y, w float64, r *row) {
	p := s.pdf
	style := ""
	switch r.role {
	case Key:
		box(p, x, y, w, rowH, fillKey)
		style = "B"
	case Breakdown:
		box(p, x, y, w, rowH, fillBreak)
	}
	cells := s.cells(r)
	cx := x
	ink(p, inkText)
	for j, c := range columns {
		cw := c.frac * w
		txt := cells[j]
		s.font(style, sizeRow)
		if c.align == "L" {
			// Notes: shrink to fit, then shorten.
			size := sizeRow
			for size > sizeNoteLo && p.GetStringWidth(txt) > cw-1.8 {
				size -= 0.2
				s.font(style, size)
			}
			txt = fitText(p, txt, cw-1.8)
			p.SetXY(cx+1.6, y)
		} else {
			p.SetXY(cx, y)
		}
		p.CellFormat(cw, rowH, txt, "", 0, c.align, false, 0, "")
		cx += cw
	}
	rule(p, x, y+rowH, x+w, y+rowH, 0.1, inkFaint)
}
