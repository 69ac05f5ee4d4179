package footage

import (
	"bufio"
	"cmp"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"propflight/internal/mark"
)

// Limits of a marks file (a mark's own limits are mark.MaxFrame and
// mark.MaxCoord).
const (
	// MaxMarks is the most rows ParseMarks reads.
	MaxMarks = 1_000_000
	// MaxMarksFileBytes is the largest marks file ParseMarks reads: 64 MiB,
	// over 60 bytes for each of MaxMarks rows.
	MaxMarksFileBytes = 64 << 20
)

// errMarksTooLarge is the read error of a marks file over MaxMarksFileBytes.
var errMarksTooLarge = errors.New("the marks file is larger than 64 MiB")

// capReader reads at most n bytes from r, then fails with errMarksTooLarge.
type capReader struct {
	r io.Reader
	n int64
}

func (c *capReader) Read(p []byte) (int, error) {
	if c.n <= 0 {
		if k, _ := c.r.Read(make([]byte, 1)); k > 0 {
			return 0, errMarksTooLarge
		}
		return 0, io.EOF
	}
	if int64(len(p)) > c.n {
		p = p[:c.n]
	}
	k, err := c.r.Read(p)
	c.n -= int64(k)
	return k, err
}

// markColumns are the column names of a marks file, in order.
var markColumns = [...]string{"frame", "x", "y", "x2", "y2"}

// ParseMarks reads a marks file (MARKS.csv): one row per marked frame with
// the columns frame,x,y or frame,x,y,x2,y2 (rows of both widths may mix),
// comma separated. name is the file name used in errors. A first row whose
// first field is "frame" is the header and must name those columns; blank
// lines, lines starting with '#', spaces around fields and a UTF-8 byte
// order mark are allowed. Frames are whole numbers from 0 to mark.MaxFrame,
// each marked once; coordinates finite numbers of at most mark.MaxCoord
// pixels. A file over MaxMarksFileBytes is refused. The marks are returned
// in file order.
//
// Errors are [*Error] naming the file, the line and the column, such as
// "marks.csv: line 4: x: not a number".
func ParseMarks(name string, r io.Reader) ([]mark.Mark, error) {
	br := bufio.NewReader(&capReader{r: r, n: MaxMarksFileBytes})
	if b, err := br.Peek(3); err == nil && string(b) == "\uFEFF" {
		br.Discard(3)
	}
	cr := csv.NewReader(br)
	cr.FieldsPerRecord = -1
	cr.Comment = '#'
	cr.ReuseRecord = true
	var marks []mark.Mark
	seen := map[int]int{} // frame -> line
	first := true
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			if errors.Is(err, errMarksTooLarge) {
				return nil, &Error{File: name, Msg: errMarksTooLarge.Error() + " (at most " + strconv.Itoa(MaxMarks) + " marks)", Err: err}
			}
			var pe *csv.ParseError
			if errors.As(err, &pe) {
				return nil, &Error{File: name, Line: pe.Line, Msg: pe.Err.Error(), Err: err}
			}
			return nil, &Error{File: name, Msg: "cannot read: " + err.Error(), Err: err}
		}
		if len(rec) == 1 && strings.TrimSpace(rec[0]) == "" {
			continue // a line of spaces is blank too
		}
		line, _ := cr.FieldPos(0)
		if first {
			first = false
			if strings.EqualFold(strings.TrimSpace(rec[0]), "frame") {
				if err := checkHeader(rec); err != nil {
					return nil, &Error{File: name, Line: line, Msg: err.Error()}
				}
				continue
			}
		}
		if len(marks) == MaxMarks {
			return nil, &Error{File: name, Line: line, Msg: fmt.Sprintf("more than %d marks", MaxMarks)}
		}
		m, rowErr := parseRow(rec)
		if rowErr != nil {
			rowErr.File, rowErr.Line = name, line
			return nil, rowErr
		}
		if prev, ok := seen[m.Frame]; ok {
			return nil, &Error{File: name, Line: line, Field: "frame", Msg: fmt.Sprintf("frame %d is marked twice (first on line %d)", m.Frame, prev)}
		}
		seen[m.Frame] = line
		marks = append(marks, m)
	}
	return marks, nil
}

// checkHeader checks a header row: frame,x,y or frame,x,y,x2,y2.
func checkHeader(rec []string) error {
	if len(rec) == 3 || len(rec) == 5 {
		ok := true
		for i, f := range rec {
			ok = ok && strings.EqualFold(strings.TrimSpace(f), markColumns[i])
		}
		if ok {
			return nil
		}
	}
	return fmt.Errorf("header must be frame,x,y or frame,x,y,x2,y2, not %q", strings.Join(rec, ","))
}

// parseRow reads one data row; the returned error lacks File and Line.
func parseRow(rec []string) (mark.Mark, *Error) {
	switch {
	case len(rec) == 4:
		return mark.Mark{}, &Error{Field: "y2", Msg: "missing: x2 needs y2 (give frame,x,y or frame,x,y,x2,y2)"}
	case len(rec) > 5:
		return mark.Mark{}, &Error{Msg: fmt.Sprintf("%d fields; a row is frame,x,y or frame,x,y,x2,y2", len(rec))}
	case len(rec) < 3:
		return mark.Mark{}, &Error{Field: markColumns[len(rec)], Msg: "missing (a row is frame,x,y or frame,x,y,x2,y2)"}
	}
	var m mark.Mark
	f := strings.TrimSpace(rec[0])
	n, err := strconv.Atoi(f)
	switch {
	case err != nil && f == "":
		return mark.Mark{}, &Error{Field: "frame", Msg: "missing"}
	case err != nil && errors.Is(err, strconv.ErrRange) && strings.HasPrefix(f, "-"):
		return mark.Mark{}, &Error{Field: "frame", Msg: "must be 0 or more"}
	case err != nil && errors.Is(err, strconv.ErrRange):
		return mark.Mark{}, &Error{Field: "frame", Msg: fmt.Sprintf("must be at most %d", mark.MaxFrame)}
	case err != nil:
		if _, ferr := strconv.ParseFloat(f, 64); ferr == nil {
			return mark.Mark{}, &Error{Field: "frame", Msg: "not a whole number"}
		}
		return mark.Mark{}, &Error{Field: "frame", Msg: "not a number"}
	case n < 0:
		return mark.Mark{}, &Error{Field: "frame", Msg: "must be 0 or more"}
	case n > mark.MaxFrame:
		return mark.Mark{}, &Error{Field: "frame", Msg: fmt.Sprintf("must be at most %d", mark.MaxFrame)}
	}
	m.Frame = n
	vals := make([]float64, len(rec)-1)
	for i := 1; i < len(rec); i++ {
		v, e := parseCoord(markColumns[i], rec[i])
		if e != nil {
			return mark.Mark{}, e
		}
		vals[i-1] = v
	}
	m.X, m.Y = vals[0], vals[1]
	if len(vals) == 4 {
		m.HasSecond, m.X2, m.Y2 = true, vals[2], vals[3]
	}
	return m, nil
}

// parseCoord reads one pixel coordinate of column col.
func parseCoord(col, s string) (float64, *Error) {
	s = strings.TrimSpace(s)
	if s == "" {
		return 0, &Error{Field: col, Msg: "missing"}
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		var ne *strconv.NumError
		if errors.As(err, &ne) && ne.Err == strconv.ErrRange {
			return 0, &Error{Field: col, Msg: "must be a finite number"}
		}
		return 0, &Error{Field: col, Msg: "not a number"}
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, &Error{Field: col, Msg: "must be a finite number"}
	}
	if math.Abs(v) > mark.MaxCoord {
		return 0, &Error{Field: col, Msg: fmt.Sprintf("must be at most %g pixels from the image corner", mark.MaxCoord)}
	}
	return v, nil
}

// checkMark reports the first problem ParseMarks would find with m.
func checkMark(m mark.Mark) *Error {
	if m.Frame < 0 || m.Frame > mark.MaxFrame {
		return &Error{Field: "frame", Msg: fmt.Sprintf("frame %d must be from 0 to %d", m.Frame, mark.MaxFrame)}
	}
	vals := []float64{m.X, m.Y, m.X2, m.Y2}
	if !m.HasSecond {
		vals = vals[:2]
	}
	for i, v := range vals {
		if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > mark.MaxCoord {
			return &Error{Field: markColumns[i+1], Msg: fmt.Sprintf("frame %d: %g is not a finite coordinate of at most %g pixels", m.Frame, v, mark.MaxCoord)}
		}
	}
	return nil
}

// sortedMarks returns a copy of marks sorted by frame, or an error for a
// mark ParseMarks would refuse or a frame marked twice.
func sortedMarks(marks []mark.Mark) ([]mark.Mark, error) {
	s := slices.Clone(marks)
	slices.SortStableFunc(s, func(a, b mark.Mark) int { return cmp.Compare(a.Frame, b.Frame) })
	for i, m := range s {
		if e := checkMark(m); e != nil {
			return nil, e
		}
		if i > 0 && s[i-1].Frame == m.Frame {
			return nil, &Error{Field: "frame", Msg: fmt.Sprintf("frame %d is marked twice", m.Frame)}
		}
	}
	return s, nil
}

// WriteMarks writes marks as a marks file that ParseMarks reads back
// exactly: a header (frame,x,y,x2,y2 when any mark has a second point,
// else frame,x,y), then one row per mark sorted by frame, numbers in the
// shortest form that round-trips (strconv 'g', -1). Marks that ParseMarks
// would refuse (a negative frame, a frame marked twice, a non-finite
// coordinate) are an error and nothing is written.
func WriteMarks(w io.Writer, marks []mark.Mark) error {
	s, err := sortedMarks(marks)
	if err != nil {
		return err
	}
	second := slices.ContainsFunc(s, func(m mark.Mark) bool { return m.HasSecond })
	bw := bufio.NewWriter(w)
	if second {
		bw.WriteString("frame,x,y,x2,y2\n")
	} else {
		bw.WriteString("frame,x,y\n")
	}
	var buf []byte
	for _, m := range s {
		buf = strconv.AppendInt(buf[:0], int64(m.Frame), 10)
		vals := []float64{m.X, m.Y, m.X2, m.Y2}
		if !m.HasSecond {
			vals = vals[:2]
		}
		for _, v := range vals {
			buf = append(buf, ',')
			buf = strconv.AppendFloat(buf, v, 'g', -1, 64)
		}
		buf = append(buf, '\n')
		bw.Write(buf)
	}
	return bw.Flush()
}

// CheckBounds reports marks outside a w x h image, whose pixels span
// [0, w] x [0, h] (a point on the far edge counts as inside). The error
// names the first such mark's frame and says how many there are.
func CheckBounds(marks []mark.Mark, w, h int) error {
	in := func(x, y float64) bool { return x >= 0 && x <= float64(w) && y >= 0 && y <= float64(h) }
	var first *Error
	count := 0
	for _, m := range marks {
		bad := ""
		switch {
		case !in(m.X, m.Y):
			bad = fmt.Sprintf("centre (%g, %g)", m.X, m.Y)
		case m.HasSecond && !in(m.X2, m.Y2):
			bad = fmt.Sprintf("second point (%g, %g)", m.X2, m.Y2)
		default:
			continue
		}
		count++
		if first == nil {
			first = &Error{Field: fmt.Sprintf("frame %d", m.Frame), Msg: fmt.Sprintf("the mark's %s is outside the %dx%d image", bad, w, h)}
		}
	}
	if first != nil && count > 1 {
		first.Msg += fmt.Sprintf(" (%d marks are outside)", count)
	}
	if first == nil {
		return nil
	}
	return first
}
