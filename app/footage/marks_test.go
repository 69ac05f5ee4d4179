package footage

import (
	"bytes"
	"errors"
	"math"
	"slices"
	"strings"
	"testing"

	"propflight/internal/mark"
)

func TestParseMarks_Accepts(t *testing.T) {
	tests := []struct {
		name, in string
		want     []mark.Mark
	}{
		{"header", "frame,x,y\n0,10,20\n1,11.5,19\n",
			[]mark.Mark{{Frame: 0, X: 10, Y: 20}, {Frame: 1, X: 11.5, Y: 19}}},
		{"no header", "3,1,2\n", []mark.Mark{{Frame: 3, X: 1, Y: 2}}},
		{"five columns", "frame,x,y,x2,y2\n0,1,2,3,4\n",
			[]mark.Mark{{Frame: 0, X: 1, Y: 2, HasSecond: true, X2: 3, Y2: 4}}},
		{"mixed widths, file order kept", "frame,x,y,x2,y2\n5,1,2\n2,1,2,3,4\n",
			[]mark.Mark{{Frame: 5, X: 1, Y: 2}, {Frame: 2, X: 1, Y: 2, HasSecond: true, X2: 3, Y2: 4}}},
		{"blank, space-only and comment lines", "\n# made by hand\nframe,x,y\n\n   \n0,1,2\n\n", []mark.Mark{{Frame: 0, X: 1, Y: 2}}},
		{"spaces, CRLF, case of header", "Frame, X , Y\r\n 0 , 1e2 , -2.5 \r\n", []mark.Mark{{Frame: 0, X: 100, Y: -2.5}}},
		{"byte order mark", "\uFEFFframe,x,y\n0,1,2\n", []mark.Mark{{Frame: 0, X: 1, Y: 2}}},
		{"empty file", "", nil},
		{"header only", "frame,x,y\n", nil},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, err := ParseMarks("marks.csv", strings.NewReader(tc.in))
			if err != nil {
				t.Fatal(err)
			}
			if !slices.Equal(got, tc.want) {
				t.Errorf("got %+v, want %+v", got, tc.want)
			}
		})
	}
}

func TestParseMarks_Errors(t *testing.T) {
	tests := []struct{ name, in, want string }{
		{"not a number", "frame,x,y\n0,1,2\n1,2,3\n2,abc,4\n", "marks.csv: line 4: x: not a number"},
		{"y not a number", "0,1,two\n", "marks.csv: line 1: y: not a number"},
		{"negative frame", "frame,x,y\n-1,1,2\n", "marks.csv: line 2: frame: must be 0 or more"},
		{"fractional frame", "1.5,1,2\n", "marks.csv: line 1: frame: not a whole number"},
		{"frame not a number", "x,1,2\n", "marks.csv: line 1: frame: not a number"},
		{"huge frame", "99999999999999999999999,1,2\n", "marks.csv: line 1: frame: must be at most 10000000"},
		{"huge negative frame", "-99999999999999999999999,1,2\n", "marks.csv: line 1: frame: must be 0 or more"},
		{"frame over the limit", "10000001,1,2\n", "marks.csv: line 1: frame: must be at most 10000000"},
		{"duplicate", "frame,x,y\n0,1,2\n\n0,3,4\n", "marks.csv: line 4: frame: frame 0 is marked twice (first on line 2)"},
		{"nan", "0,NaN,2\n", "marks.csv: line 1: x: must be a finite number"},
		{"inf", "0,1,-Inf\n", "marks.csv: line 1: y: must be a finite number"},
		{"overflow", "0,1e400,2\n", "marks.csv: line 1: x: must be a finite number"},
		{"too far", "0,1e10,2\n", "marks.csv: line 1: x: must be at most"},
		{"x2 without y2", "frame,x,y,x2,y2\n0,1,2,3\n", "marks.csv: line 2: y2: missing"},
		{"nan x2", "0,1,2,nan,4\n", "marks.csv: line 1: x2: must be a finite number"},
		{"bad y2", "0,1,2,3,?\n", "marks.csv: line 1: y2: not a number"},
		{"too few", "0,1\n", "marks.csv: line 1: y: missing"},
		{"empty field", "0,,2\n", "marks.csv: line 1: x: missing"},
		{"too many", "0,1,2,3,4,5\n", "marks.csv: line 1: 6 fields"},
		{"bad header", "frame,y,x\n0,1,2\n", "marks.csv: line 1: header must be"},
		{"bare quote", "0,1\"2,3\n", "marks.csv: line 1: bare \""},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := ParseMarks("marks.csv", strings.NewReader(tc.in))
			var fe *Error
			if err == nil || !errors.As(err, &fe) {
				t.Fatalf("err = %v, want an *Error", err)
			}
			if !strings.HasPrefix(err.Error(), tc.want) {
				t.Errorf("err = %q, want it to start %q", err, tc.want)
			}
		})
	}
	// The exact example message of the marks format.
	_, err := ParseMarks("marks.csv", strings.NewReader("frame,x,y\n0,1,2\n1,2,3\n2,abc,4\n"))
	if err == nil || err.Error() != "marks.csv: line 4: x: not a number" {
		t.Errorf("err = %v", err)
	}
}

func TestWriteMarks_RoundTrip(t *testing.T) {
	marks := []mark.Mark{
		{Frame: 10, X: 0.1, Y: 1.0 / 3},
		{Frame: 2, X: math.Copysign(0, -1), Y: 1e-300, HasSecond: true, X2: math.Pi, Y2: 123456.789125},
		{Frame: 7, X: 640, Y: 480},
	}
	var buf bytes.Buffer
	if err := WriteMarks(&buf, marks); err != nil {
		t.Fatal(err)
	}
	wantText := "frame,x,y,x2,y2\n2,-0,1e-300,3.141592653589793,123456.789125\n7,640,480\n10,0.1,0.3333333333333333\n"
	if buf.String() != wantText {
		t.Errorf("wrote %q, want %q", buf.String(), wantText)
	}
	back, err := ParseMarks("back.csv", &buf)
	if err != nil {
		t.Fatal(err)
	}
	want := []mark.Mark{marks[1], marks[2], marks[0]}
	if !slices.Equal(back, want) || !math.Signbit(back[0].X) {
		t.Errorf("read back %+v, want %+v", back, want)
	}

	buf.Reset()
	if err := WriteMarks(&buf, []mark.Mark{{Frame: 0, X: 1, Y: 2}}); err != nil || buf.String() != "frame,x,y\n0,1,2\n" {
		t.Errorf("three-column file %q, %v", buf.String(), err)
	}

	for _, bad := range [][]mark.Mark{
		{{Frame: -1}},
		{{Frame: 1}, {Frame: 1}},
		{{Frame: 1, Y: math.Inf(1)}},
		{{Frame: 1, HasSecond: true, X2: math.NaN()}},
	} {
		buf.Reset()
		if err := WriteMarks(&buf, bad); err == nil || buf.Len() != 0 {
			t.Errorf("WriteMarks(%+v) = %v, wrote %q; want an error and nothing", bad, err, buf.String())
		}
	}
	// A second point not in use is not checked or written.
	buf.Reset()
	if err := WriteMarks(&buf, []mark.Mark{{Frame: 1, X2: math.NaN()}}); err != nil || buf.String() != "frame,x,y\n1,0,0\n" {
		t.Errorf("unused second point: %q, %v", buf.String(), err)
	}
}

func TestCheckBounds(t *testing.T) {
	marks := []mark.Mark{
		{Frame: 0, X: 0, Y: 0},
		{Frame: 1, X: 640, Y: 480}, // on the far edge: inside
		{Frame: 2, X: 320, Y: 240, HasSecond: true, X2: 300, Y2: 200},
	}
	if err := CheckBounds(marks, 640, 480); err != nil {
		t.Errorf("inside marks: %v", err)
	}
	out := append(slices.Clone(marks),
		mark.Mark{Frame: 12, X: 700.5, Y: 20},
		mark.Mark{Frame: 13, X: 10, Y: 10, HasSecond: true, X2: 10, Y2: -1})
	err := CheckBounds(out, 640, 480)
	if err == nil {
		t.Fatal("no error for marks outside the image")
	}
	for _, s := range []string{"frame 12", "(700.5, 20)", "640x480", "2 marks are outside"} {
		if !strings.Contains(err.Error(), s) {
			t.Errorf("error %q lacks %q", err, s)
		}
	}
	err = CheckBounds([]mark.Mark{{Frame: 4, X: 1, Y: 1, HasSecond: true, X2: 1, Y2: 481}}, 640, 480)
	if err == nil || !strings.Contains(err.Error(), "frame 4") || !strings.Contains(err.Error(), "second point") {
		t.Errorf("second point outside: %v", err)
	}
}
