package sheet

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"

	"propflight/physics"
)

func TestWrite_PagesCautionAndPageNumbers(t *testing.T) {
	// The frying pan preset flies 28 frames: the summary page, the pose
	// page and one table page.
	in := presetInput(t, "frying-pan")
	if n := len(in.Take.Frames); n != 28 {
		t.Fatalf("the preset's take has %d frames; this test expects 28", n)
	}
	path := pdfFile(t, render(t, in, Options{}))
	pages := pageCount(t, path)
	if pages != 3 {
		t.Fatalf("%d pages, want 3", pages)
	}
	for pg := 1; pg <= pages; pg++ {
		text := squash(pageText(t, path, pg, false))
		if !strings.Contains(text, Caution) {
			t.Errorf("page %d lacks the caution word for word", pg)
		}
		if want := fmt.Sprintf("page %d of %d", pg, pages); !strings.Contains(text, want) {
			t.Errorf("page %d lacks %q", pg, want)
		}
	}
}

// TestCaution_MatchesDevelopersGuide keeps the constant word for word with
// DEVELOPERS.md "Safety caution".
func TestCaution_MatchesDevelopersGuide(t *testing.T) {
	data, err := readRepoFile("DEVELOPERS.md")
	if err != nil {
		t.Skipf("DEVELOPERS.md not readable: %v", err)
	}
	var quoted []string
	in := false
	for _, line := range strings.Split(data, "\n") {
		if strings.HasPrefix(line, "## Safety caution") {
			in = true
			continue
		}
		if in && strings.HasPrefix(line, "## ") {
			break
		}
		if in && strings.HasPrefix(line, "> ") {
			quoted = append(quoted, strings.TrimPrefix(line, "> "))
		}
	}
	if got := squash(strings.Join(quoted, " ")); got != Caution {
		t.Errorf("DEVELOPERS.md caution\n%q\nsheet.Caution\n%q", got, Caution)
	}
}

// checkRows compares the table rows read back from the PDF with the take's
// CSV values (formatted as the CSV writer does) to the printed precision.
func checkRows(t *testing.T, in Input, rows []tableRow, step int) {
	t.Helper()
	recs := csvRecords(in.Take)
	seen := map[int]bool{}
	for _, r := range rows {
		if seen[r.frame] {
			t.Errorf("frame %d listed twice", r.frame)
		}
		seen[r.frame] = true
	}
	want := 0
	for i := 0; i < len(recs); i += step {
		want++
		if !seen[i] {
			t.Errorf("frame %d missing from the table", i)
		}
	}
	if len(rows) != want {
		t.Errorf("%d rows, want %d", len(rows), want)
	}
	rate := in.Scene.Throw.FPS
	// Total turn: the sum of the CSV's turn_deg from release.
	total := make([]float64, len(recs))
	for i := 1; i < len(recs); i++ {
		total[i] = total[i-1] + csvNum(t, recs[i]["turn_deg"])
	}
	for _, r := range rows {
		if r.frame%step != 0 || r.frame >= len(recs) {
			t.Errorf("row for frame %d on %s", r.frame, map[int]string{1: "ones", 2: "twos"}[step])
			continue
		}
		c := recs[r.frame]
		if r.timecode != rate.Timecode(r.frame) {
			t.Errorf("frame %d: timecode %s, want %s", r.frame, r.timecode, rate.Timecode(r.frame))
		}
		for _, f := range []struct {
			name, printed, csv string
		}{{"x", r.x, "cg_x"}, {"y", r.y, "cg_y"}, {"z", r.z, "cg_z"}} {
			if p, e := num(t, f.printed), csvNum(t, c[f.csv]); !sameToDecimals(p, e, DecimalsMetres) {
				t.Errorf("frame %d %s: printed %s, CSV %s", r.frame, f.name, f.printed, c[f.csv])
			}
		}
		if p := num(t, r.total); !sameToDecimals(p, total[r.frame], DecimalsTotal) {
			t.Errorf("frame %d total turn: printed %s, CSV sum %g", r.frame, r.total, total[r.frame])
		}
		if r.frame == 0 {
			if r.spacing != "—" || r.turn != "—" {
				t.Errorf("frame 0: spacing %q turn %q, want dashes", r.spacing, r.turn)
			}
			continue
		}
		var spacing, turn float64
		if step == 1 {
			spacing, turn = csvNum(t, c["spacing_m"]), csvNum(t, c["turn_deg"])
		} else {
			// On twos: spacing from the previous listed row's CSV position,
			// turn the CSV's turn_deg of the frames since it, added (the
			// angle turned along the motion).
			p := recs[r.frame-step]
			dx := csvNum(t, c["cg_x"]) - csvNum(t, p["cg_x"])
			dy := csvNum(t, c["cg_y"]) - csvNum(t, p["cg_y"])
			dz := csvNum(t, c["cg_z"]) - csvNum(t, p["cg_z"])
			spacing = math.Sqrt(dx*dx + dy*dy + dz*dz)
			turn = total[r.frame] - total[r.frame-step]
		}
		if p := num(t, r.spacing); !sameToDecimals(p, spacing, DecimalsMetres) {
			t.Errorf("frame %d spacing: printed %s, CSV %g", r.frame, r.spacing, spacing)
		}
		// Allow 1e-6 degrees for the sums' round-off.
		if p := num(t, r.turn); math.Abs(p-turn) > 0.5*pow10(-DecimalsTurn)+1e-6 {
			t.Errorf("frame %d turn: printed %s, CSV %g", r.frame, r.turn, turn)
		}
	}
}

// notesOf returns the notes column (head "marks") of every row by frame.
func notesOf(rows []tableRow) map[int]string {
	m := map[int]string{}
	for _, r := range rows {
		m[r.frame] = r.notes
	}
	return m
}

func TestWrite_TableMatchesCSV_OnOnes(t *testing.T) {
	in := presetInput(t, "frying-pan")
	path := pdfFile(t, render(t, in, Options{}))
	rows := tableRows(t, path, pageCount(t, path))
	checkRows(t, in, rows, 1)

	// Marks: the keys, the breakdowns between them, each quarter turn of
	// the CSV's summed turn and each flip of the tumble.
	marks := notesOf(rows)
	tk := in.Take
	last := len(tk.Frames) - 1
	want := map[int][]string{0: {"key: release"}, tk.ApexFrame: {"key: apex"}, last: {"key: landing"}}
	want[tk.ApexFrame/2] = append(want[tk.ApexFrame/2], "breakdown")
	want[(tk.ApexFrame+last)/2] = append(want[(tk.ApexFrame+last)/2], "breakdown")
	recs := csvRecords(tk)
	total := 0.0
	for i := 1; i <= last; i++ {
		before := total
		total += csvNum(t, recs[i]["turn_deg"])
		for q := 90.0; q <= total+1e-7; q += 90 {
			if q > before+1e-7 {
				want[i] = append(want[i], strconv.Itoa(int(q))+"°")
			}
		}
	}
	v := in.Verdict
	if v.Motion != physics.Tumbling || !v.FirstFlipFound {
		t.Fatalf("the frying pan preset should tumble with a flip; verdict %v", v.Motion)
	}
	fps := in.Scene.Throw.FPS.FPS()
	for k := 0; ; k++ {
		tf := v.FirstFlip + float64(k)*v.FlipPeriod
		f := int(math.Ceil(tf*fps - 1e-9)) // the first frame at or after the flip
		if f > last {
			break
		}
		want[f] = append(want[f], "flip "+strconv.Itoa(k+1))
	}
	for f, ms := range want {
		for _, m := range ms {
			if !strings.Contains(marks[f], m) {
				t.Errorf("frame %d: marks %q lack %q", f, marks[f], m)
			}
		}
	}
}

func TestWrite_LongTake_PagesAndRepeatedHeads(t *testing.T) {
	in := highTossInput(t)
	n := len(in.Take.Frames)
	if n < 90 || n > 110 {
		t.Fatalf("the high toss has %d frames; this test expects about 100", n)
	}
	path := pdfFile(t, render(t, in, Options{}))
	pages := pageCount(t, path)
	rows := tableRows(t, path, pages)
	checkRows(t, in, rows, 1)
	// The table starts on page 3, after the summary and the poses; every
	// table page but the last is full, so the page count follows from the
	// rows that fit on the first.
	perPage := 0
	for _, r := range rows {
		if r.page == 3 {
			perPage++
		}
	}
	if perPage == 0 {
		t.Fatal("no rows on page 3")
	}
	if want := 2 + (n+perPage-1)/perPage; pages != want || pages < 4 {
		t.Errorf("%d pages for %d rows at %d a page, want %d (and at least 4)", pages, n, perPage, want)
	}
	for pg := 3; pg <= pages; pg++ {
		text := pageText(t, path, pg, false)
		for _, head := range []string{"timecode", "HH:MM:SS:FF", "spacing", "total turn", "marks", "Breakdowns:"} {
			if !strings.Contains(text, head) {
				t.Errorf("table page %d lacks the column head or footnote %q", pg, head)
			}
		}
	}
}

func TestWrite_Twos_HalvesTheRows(t *testing.T) {
	in := highTossInput(t)
	path := pdfFile(t, render(t, in, Options{Twos: true}))
	pages := pageCount(t, path)
	rows := tableRows(t, path, pages)
	n := len(in.Take.Frames)
	if want := (n + 1) / 2; len(rows) != want {
		t.Errorf("%d rows on twos for %d frames, want %d", len(rows), n, want)
	}
	checkRows(t, in, rows, 2)
	all := pageText(t, path, 3, false)
	if !strings.Contains(all, "on twos") {
		t.Error("the table page does not say on twos")
	}
	// A key on an odd frame is carried to the row before it.
	last := n - 1
	if last%2 == 1 {
		if m := notesOf(rows)[last-1]; !strings.Contains(m, "key: landing (at "+strconv.Itoa(last)+")") {
			t.Errorf("row %d marks %q: want the landing at %d carried", last-1, m, last)
		}
	}
}

func TestWrite_VerdictOnPageOne(t *testing.T) {
	for _, name := range []string{"frying-pan", "dinner-plate", "rolling-pin"} {
		t.Run(name, func(t *testing.T) {
			in := presetInput(t, name)
			path := pdfFile(t, render(t, in, Options{}))
			// Layout mode keeps each label beside its value.
			text := squash(strings.ReplaceAll(pageText(t, path, 1, true), "\u2212", "-"))
			v := in.Verdict
			tk := in.Take
			want := []string{
				"motion " + v.Motion.String(),
				"symmetry " + v.Symmetry.String(),
				strconv.FormatFloat(v.ExcursionDeg, 'f', 1, 64) + "°",
				fmt.Sprintf("%d frames (0–%d)", len(tk.Frames), len(tk.Frames)-1),
				fmt.Sprintf("landing frame %d", tk.LandingFrame),
				fmt.Sprintf("apex frame %d", tk.ApexFrame),
				strconv.FormatFloat(tk.FlightTime, 'f', 3, 64) + " s",
				in.Scene.Name,
			}
			if v.HasWobble {
				want = append(want, fmt.Sprintf("%.3g wobbles per turn", v.WobblesPerTurn))
			}
			if v.HasRatio {
				want = append(want, fmt.Sprintf("wobbles per turn %.3g", v.WobblesPerTurn), "one wobble every")
			}
			if v.HasFlip {
				want = append(want, fmt.Sprintf("flip period %.3g s", v.FlipPeriod),
					fmt.Sprintf("frame %d", int(math.Ceil(v.FirstFlip*in.Scene.Throw.FPS.FPS()-1e-9))))
			}
			for _, w := range want {
				if !strings.Contains(text, w) {
					t.Errorf("page 1 lacks %q", w)
				}
			}
		})
	}
}

func TestWrite_PrintsDegreeAndMinusSigns(t *testing.T) {
	in := presetInput(t, "frying-pan") // its principal axes have negative components
	path := pdfFile(t, render(t, in, Options{}))
	text := pageText(t, path, 1, false)
	for _, r := range []string{"°", "\u2212", "kg·m²"} {
		if !strings.Contains(text, r) {
			t.Errorf("page 1 text lacks %q: the embedded font should map it", r)
		}
	}
}

func TestWrite_PaperSize(t *testing.T) {
	in := presetInput(t, "loaf")
	for _, c := range []struct{ paper, want string }{
		{"", "595.28 x 841.89 pts (A4)"},
		{"a4", "595.28 x 841.89 pts (A4)"},
		{"letter", "612 x 792 pts (letter)"},
		{"Letter", "612 x 792 pts (letter)"},
	} {
		path := pdfFile(t, render(t, in, Options{Paper: c.paper}))
		if got := pdfInfo(t, path)["Page size"]; got != c.want {
			t.Errorf("paper %q: page size %q, want %q", c.paper, got, c.want)
		}
	}
	err := Write(&bytes.Buffer{}, in, Options{Paper: "a5"})
	if err == nil || !strings.HasPrefix(err.Error(), "paper:") {
		t.Errorf("paper a5: error %v, want one naming paper", err)
	}
}

func TestWrite_Cancel(t *testing.T) {
	in := highTossInput(t)
	closed := make(chan struct{})
	close(closed)
	var b bytes.Buffer
	if err := Write(&b, in, Options{Cancel: closed}); !errors.Is(err, ErrCancelled) {
		t.Errorf("cancelled before: %v, want ErrCancelled", err)
	}
	if b.Len() != 0 {
		t.Errorf("%d bytes written on cancel", b.Len())
	}

	// Cancel half way through the work.
	stop := make(chan struct{})
	var last, closedAt int
	err := Write(&b, in, Options{Cancel: stop, Progress: func(done, total int) {
		last = done
		if done == total/2 {
			closedAt = done
			close(stop)
		}
	}})
	if !errors.Is(err, ErrCancelled) {
		t.Errorf("cancelled half way: %v, want ErrCancelled", err)
	}
	if b.Len() != 0 {
		t.Errorf("%d bytes written on cancel", b.Len())
	}
	if last != closedAt {
		t.Errorf("work went on to step %d after the cancel at step %d", last, closedAt)
	}
}

func TestWrite_Progress(t *testing.T) {
	in := presetInput(t, "rolling-pin")
	var calls [][2]int
	render(t, in, Options{Progress: func(done, total int) { calls = append(calls, [2]int{done, total}) }})
	if len(calls) == 0 {
		t.Fatal("no progress calls")
	}
	total := calls[0][1]
	// One step for the summary, one per pose, one per row.
	if total < 1+len(in.Take.Frames)+3 {
		t.Errorf("total %d, want at least %d", total, 1+len(in.Take.Frames)+3)
	}
	for i, c := range calls {
		if c != [2]int{i + 1, total} {
			t.Fatalf("call %d: %v, want [%d %d]", i, c, i+1, total)
		}
	}
	if len(calls) != total {
		t.Errorf("%d calls, want %d", len(calls), total)
	}
}

func TestWrite_Deterministic(t *testing.T) {
	in := presetInput(t, "dinner-plate")
	a := render(t, in, Options{Paper: "letter", Twos: true})
	b := render(t, in, Options{Paper: "letter", Twos: true})
	if !bytes.Equal(a, b) {
		t.Error("two writes of the same input differ")
	}
	if !bytes.HasPrefix(a, []byte("%PDF-")) {
		t.Error("not a PDF")
	}
}

func TestWrite_RejectsMissingInput(t *testing.T) {
	in := presetInput(t, "loaf")
	for _, c := range []struct {
		name string
		in   Input
	}{
		{"no scene", Input{Take: in.Take}},
		{"no take", Input{Scene: in.Scene}},
		{"empty take", Input{Scene: in.Scene, Take: &physics.Take{}}},
	} {
		var b bytes.Buffer
		if err := Write(&b, c.in, Options{}); err == nil || b.Len() != 0 {
			t.Errorf("%s: error %v and %d bytes, want an error and nothing written", c.name, err, b.Len())
		}
	}
}

type failWriter struct{}

func (failWriter) Write([]byte) (int, error) { return 0, errors.New("disk full") }

func TestWrite_ReturnsWriterError(t *testing.T) {
	in := presetInput(t, "loaf")
	if err := Write(failWriter{}, in, Options{}); err == nil || !strings.Contains(err.Error(), "disk full") {
		t.Errorf("error %v, want the writer's", err)
	}
}

func TestWrite_ControlCharactersInNamesEscaped(t *testing.T) {
	// A project and a part name with ESC, BEL, CR/LF and a C1 control:
	// the PDF's title, running head, summary and parts table show them as
	// visible escapes.
	src := strings.Replace(highToss, `"cutting board, high toss"`, `"board\u001b[31m\u0007\r\nnext\u009b"`, 1)
	src = strings.Replace(src, `"name": "board"`, `"name": "slab\u001b]0;t\u0007"`, 1)
	in := docInput(t, "hostile.json", []byte(src))
	path := pdfFile(t, render(t, in, Options{}))
	title := pdfInfo(t, path)["Title"]
	text := pageText(t, path, 1, false)
	for what, s := range map[string]string{"title": title, "page 1": text} {
		for _, r := range s {
			if (r < 0x20 && r != '\n' && r != '\f') || (r >= 0x7f && r < 0xa0) {
				t.Errorf("%s holds U+%04X: %q", what, r, s)
				break
			}
		}
	}
	if !strings.Contains(title, `board\x1b[31m\x07`) {
		t.Errorf("title = %q, want the escaped name", title)
	}
	if !strings.Contains(text, `slab\x1b]0;t\x07`) {
		t.Errorf("page 1 lacks the escaped part name:\n%s", text)
	}
}
