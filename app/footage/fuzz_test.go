package footage

import (
	"bytes"
	"cmp"
	"errors"
	"slices"
	"testing"

	"propflight/internal/mark"
)

// FuzzParseMarks checks that ParseMarks never panics, that every refusal
// is an *Error naming the file, and that whatever it accepts WriteMarks
// writes and ParseMarks reads back exactly (sorted by frame). Fit and
// CheckBounds must not panic on accepted marks either. Seeds: the corpus
// in testdata/fuzz/FuzzParseMarks and the ones added here.
func FuzzParseMarks(f *testing.F) {
	for _, s := range []string{
		"frame,x,y\n0,10,20\n1,11,19\n2,12,19.5\n",
		"frame,x,y,x2,y2\n0,1,2,3,4\n3,1,2\n",
		"0,1,2\n",
		"\uFEFF# c\nframe, x, y\r\n 5 ,1e3,-0\r\n",
		"0,\"1\",2\n",
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		marks, err := ParseMarks("fuzz.csv", bytes.NewReader(data))
		if err != nil {
			var fe *Error
			if !errors.As(err, &fe) || fe.File != "fuzz.csv" {
				t.Fatalf("error %v (%T) is not an *Error naming the file", err, err)
			}
			return
		}
		var buf bytes.Buffer
		if err := WriteMarks(&buf, marks); err != nil {
			t.Fatalf("WriteMarks refused accepted marks %+v: %v", marks, err)
		}
		back, err := ParseMarks("again.csv", bytes.NewReader(buf.Bytes()))
		if err != nil {
			t.Fatalf("written marks do not parse: %v\n%s", err, buf.Bytes())
		}
		want := slices.Clone(marks)
		slices.SortFunc(want, func(a, b mark.Mark) int { return cmp.Compare(a.Frame, b.Frame) })
		if !slices.Equal(back, want) {
			t.Fatalf("round trip changed the marks:\n got %+v\nwant %+v", back, want)
		}
		_, _ = Fit(marks, FitOptions{FPS: 24, Gravity: 9.80665})
		_ = CheckBounds(marks, 640, 480)
	})
}
