package mesh

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r3"
)

// BenchmarkNew_1M2 welds, checks and sums the moments of a 1.2M-triangle
// sphere (the size for a detailed prop scan).
func BenchmarkNew_1M2(b *testing.B) {
	tris := sphereTris(548, 0.1) // 4·548² - 2·548·2... ≈ 1.2M triangles
	b.ReportMetric(float64(len(tris)), "triangles")
	b.ResetTimer()
	for range b.N {
		m, _, err := New(tris)
		if err != nil {
			b.Fatal(err)
		}
		m.Solid()
		m.Surface()
	}
}

// BenchmarkSupport is one landing query on a 1.2M-triangle sphere (the tree
// is built before the timer starts).
func BenchmarkSupport(b *testing.B) {
	m, _, err := New(sphereTris(548, 0.1))
	if err != nil {
		b.Fatal(err)
	}
	m.Support(r3.Vec{X: 1})
	u := []r3.Vec{{X: 0.3, Y: -1, Z: 0.2}, {X: -1, Y: 0.1, Z: 0.7}, {Y: 1}}
	b.ResetTimer()
	for i := range b.N {
		m.Support(u[i%3])
	}
}

// BenchmarkNew_Grid is the weld on round coordinates (a voxel-like terrace
// of unit boxes), whose float bits end in zeros.
func BenchmarkNew_Grid(b *testing.B) {
	var tris [][3]r3.Vec
	for i := range 40 {
		for j := range 40 {
			tris = append(tris, transform(boxTris(1, 1, 1), diag(1, 1, 1), v(float64(2*i), float64(2*j), 0))...)
		}
	}
	b.ResetTimer()
	for range b.N {
		if _, _, err := New(tris); err != nil {
			b.Fatal(err)
		}
	}
}
