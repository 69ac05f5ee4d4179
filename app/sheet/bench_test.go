package sheet

import (
	"bytes"
	"fmt"
	"strings"
	"testing"

	"github.com/go-pdf/fpdf"
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

// manyParts returns a project of n small boxes in a row with a name of
// nameLen characters (invented demo data: a rack of spatulas).
func manyParts(tb testing.TB, n, nameLen int) Input {
	tb.Helper()
	var b strings.Builder
	b.WriteString(`{"format": "propflight/v1", "name": "`)
	b.WriteString(strings.Repeat("s", nameLen))
	b.WriteString(`", "prop": {"parts": [`)
	for i := range n {
		if i > 0 {
			b.WriteString(",")
		}
		fmt.Fprintf(&b, `{"name": "spatula %d", "shape": "box", "size": [0.3, 0.06, 0.004], "mass": 0.08, "position": [%g, %g, %g]}`, i, float64(i%10)*0.01, float64(i/10%10)*0.01, float64(i/100)*0.01)
	}
	b.WriteString(`]}, "throw": {"release_velocity": [1, 4, 0], "spin": {"axis": "least", "turns_per_second": 1}}}`)
	return docInput(tb, "rack.json", []byte(b.String()))
}

// BenchmarkWrite_Parts: the sheet's cost against the part count; linear
// means the time per part stays flat from 100 to 1000 parts.
func BenchmarkWrite_Parts(b *testing.B) {
	for _, n := range []int{100, 300, 1000} {
		in := manyParts(b, n, 10)
		b.Run(fmt.Sprint(n), func(b *testing.B) {
			var buf bytes.Buffer
			for b.Loop() {
				buf.Reset()
				if err := Write(&buf, in, Options{}); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(n), "ns/part")
		})
	}
}

// BenchmarkWrite_NameLength: the sheet's cost against the project name's
// length, up to project.MaxNameLength.
func BenchmarkWrite_NameLength(b *testing.B) {
	for _, n := range []int{10, 100, 1000} {
		in := manyParts(b, 1, n)
		b.Run(fmt.Sprint(n), func(b *testing.B) {
			var buf bytes.Buffer
			for b.Loop() {
				buf.Reset()
				if err := Write(&buf, in, Options{}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkFitText: shortening a text to a cell, against its length (far
// past the name limit, to show the growth): n log n, where dropping one
// character at a time was n^2 (a 100000-character name took 21 s).
func BenchmarkFitText(b *testing.B) {
	p := fpdf.New("P", "mm", "A4", "")
	p.SetFont("Helvetica", "", 10)
	for _, n := range []int{1000, 10000, 100000} {
		s := strings.Repeat("frying pan ", n/11+1)[:n]
		b.Run(fmt.Sprint(n), func(b *testing.B) {
			for b.Loop() {
				if t := fitText(p, s, 120); len(t) == 0 || len(t) >= len(s) {
					b.Fatalf("fitText gave %d bytes", len(t))
				}
			}
		})
	}
}
