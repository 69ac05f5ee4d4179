package export

import (
	"bytes"
	"encoding/base64"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/wire"
)

// rackInput is a prop of n small tori in a grid (invented demo data: a
// rack of pan lids' rings), tossed with a slow spin.
func rackInput(tb testing.TB, n int) Input {
	tb.Helper()
	prop := physics.Prop{Parts: make([]physics.Part, n)}
	for i := range prop.Parts {
		prop.Parts[i] = physics.Part{Shape: physics.Torus, Radius: 0.01, TubeRadius: 0.002, Mass: 0.01, Orient: physics.IdentityRotation(),
			Position: r3.Vec{X: float64(i%10) * 0.03, Y: float64(i/10%10) * 0.03, Z: float64(i/100) * 0.03}}
	}
	mp, err := prop.MassProps()
	if err != nil {
		tb.Fatal(err)
	}
	th := physics.DefaultThrow()
	th.Velocity = r3.Vec{X: 1, Y: 3}
	th.Spin = physics.Spin{Axis: physics.Least, TiltToward: physics.Middle, Rate: 2 * math.Pi}
	take, err := physics.Simulate(&prop, &mp, &th)
	if err != nil {
		tb.Fatal(err)
	}
	return Input{Name: "rack", Prop: &prop, Mass: &mp, Throw: &th, Take: take}
}

// BenchmarkWriteGLTF_Parts: time and memory against the part count; linear
// means ns/part and B/part stay flat from 10 to 1000 parts.
func BenchmarkWriteGLTF_Parts(b *testing.B) {
	for _, binary := range []bool{true, false} {
		for _, n := range []int{10, 100, 1000} {
			in := rackInput(b, n)
			b.Run(fmt.Sprintf("binary=%v/%d", binary, n), func(b *testing.B) {
				b.ReportAllocs()
				for b.Loop() {
					if err := WriteGLTF(io.Discard, in, GLTFOptions{Binary: binary}); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(n), "ns/part")
			})
		}
	}
}

// TestWriteGLTF_EmbeddedEqualsInMemory: the streamed .gltf equals the one
// encoding/json writes with the whole data URI in memory, also for a name
// holding the streaming marker itself.
func TestWriteGLTF_EmbeddedEqualsInMemory(t *testing.T) {
	for _, name := range []string{"pan", "\x00propflight-buffer\x00"} {
		in := rackInput(t, 3)
		in.Name = name
		var streamed bytes.Buffer
		if err := WriteGLTF(&streamed, in, GLTFOptions{}); err != nil {
			t.Fatal(err)
		}
		keys, err := animationKeys(in)
		if err != nil {
			t.Fatal(err)
		}
		doc, bin := buildGLTF(in, wire.PropMesh(in.Prop, wire.DefaultDetail), keys)
		doc.Buffers[0].URI = "data:application/octet-stream;base64," + base64.StdEncoding.EncodeToString(bin)
		var want bytes.Buffer
		enc := json.NewEncoder(&want)
		enc.SetIndent("", " ")
		if err := enc.Encode(doc); err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(streamed.Bytes(), want.Bytes()) {
			t.Errorf("name %q: streamed .gltf differs from the in-memory encoding (%d vs %d bytes)", name, streamed.Len(), want.Len())
		}
	}
}
