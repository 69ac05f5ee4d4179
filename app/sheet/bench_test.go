package sheet

import (
	"bytes"
	"testing"
)

// BenchmarkWrite_100Frames lays out and writes the sheet of a 100-frame
// take (the high toss: four pages with 25 poses). Targets: under 1 s and
// under 2 MB a sheet; the size is reported as pdf-bytes.
func BenchmarkWrite_100Frames(b *testing.B) {
	in := highTossInput(b)
	if n := len(in.Take.Frames); n != 100 {
		b.Fatalf("the high toss has %d frames, want 100", n)
	}
	var buf bytes.Buffer
	for b.Loop() {
		buf.Reset()
		if err := Write(&buf, in, Options{}); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(buf.Len()), "pdf-bytes")
}
