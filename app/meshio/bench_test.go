package meshio

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics/mesh"
)

// uvSphere is a latitude-longitude sphere of radius r with n bands and 2n
// segments, about 4n² triangles, wound outward.
func uvSphere(n int, r float64) [][3]r3.Vec {
	at := func(i, j int) r3.Vec {
		if i == 0 {
			return r3.Vec{Z: r}
		}
		if i == n {
			return r3.Vec{Z: -r}
		}
		th, ph := math.Pi*float64(i)/float64(n), 2*math.Pi*float64(j%(2*n))/float64(2*n)
		// Round through float32 so that the STL stores these exact corners
		// and the weld finds every shared one.
		return r3.Vec{X: float64(float32(r * math.Sin(th) * math.Cos(ph))), Y: float64(float32(r * math.Sin(th) * math.Sin(ph))), Z: float64(float32(r * math.Cos(th)))}
	}
	var t [][3]r3.Vec
	for i := range n {
		for j := range 2 * n {
			a, b, c, d := at(i, j), at(i+1, j), at(i+1, j+1), at(i, j+1)
			if i != 0 {
				t = append(t, [3]r3.Vec{a, b, d})
			}
			if i != n-1 {
				t = append(t, [3]r3.Vec{d, b, c})
			}
		}
	}
	return t
}

// BenchmarkSTL_1M2 reads a 1.2M-triangle binary STL (60 MB), checks it and
// sums its solid and surface moments: the whole path of a detailed mesh
// part (issue 8: under 2 s and 1 GB). Peak memory: run the test binary
// under /usr/bin/time -v.
func BenchmarkSTL_1M2(b *testing.B) {
	tris := uvSphere(548, 0.1)
	path := filepath.Join(b.TempDir(), "scan.stl")
	if err := os.WriteFile(path, stlBinary(tris, "scan"), 0o644); err != nil {
		b.Fatal(err)
	}
	b.ReportMetric(float64(len(tris)), "triangles")
	tris = nil
	b.ResetTimer()
	for range b.N {
		got, err := ReadFile(path, Options{Units: "mm", UpZ: true})
		if err != nil {
			b.Fatal(err)
		}
		m, _, err := mesh.New(got)
		if err != nil {
			b.Fatal(err)
		}
		m.Solid()
		m.Surface()
	}
}
