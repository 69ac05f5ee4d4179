package footage

import (
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// repeatReader yields b over and over, n bytes in all, without holding
// them.
type repeatReader struct {
	b []byte
	n int64
	i int
}

func (r *repeatReader) Read(p []byte) (int, error) {
	if r.n <= 0 {
		return 0, io.EOF
	}
	if int64(len(p)) > r.n {
		p = p[:r.n]
	}
	k := 0
	for k < len(p) {
		c := copy(p[k:], r.b[r.i:])
		k += c
		r.i = (r.i + c) % len(r.b)
	}
	r.n -= int64(k)
	return k, nil
}

// TestParseMarks_FileTooLarge: a marks file over MaxMarksFileBytes is
// refused with a message saying so, whatever it holds (here one endless
// comment line, which no row limit would stop), before it is read whole.
func TestParseMarks_FileTooLarge(t *testing.T) {
	r := io.MultiReader(strings.NewReader("frame,x,y\n0,1,2\n#"), &repeatReader{b: []byte("comment "), n: MaxMarksFileBytes + 1000})
	_, err := ParseMarks("big.csv", r)
	if err == nil || !strings.Contains(err.Error(), "big.csv: the marks file is larger than 64 MiB") {
		t.Errorf("a marks file over the size limit: %v", err)
	}
	// Just under the limit is read.
	r = io.MultiReader(strings.NewReader("frame,x,y\n0,1,2\n#"), &repeatReader{b: []byte("comment "), n: MaxMarksFileBytes - 100})
	if _, err := ParseMarks("fine.csv", r); err != nil {
		t.Errorf("a marks file just under the limit: %v", err)
	}
}

// TestParseMarks_FarCoordinates: a mark at 1e9 px lies outside any footage
// Open accepts (sides of at most mark.MaxCoord pixels) and is refused,
// naming the line and the column.
func TestParseMarks_FarCoordinates(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"frame,x,y\n0,1e9,2\n", "far.csv: line 2: x: must be at most 1e+06 pixels from the image corner"},
		{"frame,x,y,x2,y2\n0,1,2,3,-1000001\n", "far.csv: line 2: y2: must be at most 1e+06 pixels"},
	} {
		if _, err := ParseMarks("far.csv", strings.NewReader(c.in)); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q: %v, want %q", c.in, err, c.want)
		}
	}
	if _, err := ParseMarks("edge.csv", strings.NewReader("frame,x,y\n0,1e6,-1e6\n")); err != nil {
		t.Errorf("marks at the limit: %v", err)
	}
	// Open refuses a frame with a side over the limit (a 2,000,000 x 1
	// PNG: 2 megapixels, under the pixel limit).
	dir := t.TempDir()
	os.WriteFile(filepath.Join(dir, "f0.png"), pngHeaderOnly(2_000_000, 1), 0o644)
	if _, err := Open(dir, Options{}); err == nil || !strings.Contains(err.Error(), "declares 2000000x1 pixels; a side may be at most 1e+06 pixels") {
		t.Errorf("a frame 2,000,000 pixels wide: %v", err)
	}
}
