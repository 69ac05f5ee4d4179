package export

import (
	"bytes"
	"encoding/base64"
	"encoding/binary"
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// panInput is a small asymmetric prop (a pan disc and a handle) tumbling.
func panInput(t testing.TB, turnsPerSecond float64) Input {
	t.Helper()
	prop := physics.Prop{Parts: []physics.Part{
		{Name: "pan", Shape: physics.Cylinder, Radius: 0.12, Length: 0.03, Mass: 0.9, Orient: physics.EulerXYZ(math.Pi/2, 0, 0)},
		{Name: "handle", Shape: physics.Box, Size: r3.Vec{X: 0.22, Y: 0.025, Z: 0.03}, Mass: 0.3, Position: r3.Vec{X: 0.23}, Orient: physics.IdentityRotation()},
	}}
	mp, err := prop.MassProps()
	if err != nil {
		t.Fatal(err)
	}
	th := physics.DefaultThrow()
	th.Velocity = r3.Vec{X: 2, Y: 4}
	th.Spin = physics.Spin{Axis: physics.Middle, Tilt: 3 * math.Pi / 180, TiltToward: physics.Least, Rate: turnsPerSecond * 2 * math.Pi}
	take, err := physics.Simulate(&prop, &mp, &th)
	if err != nil {
		t.Fatal(err)
	}
	return Input{Name: "pan", Prop: &prop, Mass: &mp, Throw: &th, Take: take}
}

// readGLB splits a GLB into its JSON and BIN chunks (glTF 2.0.1 §4.4).
func readGLB(t *testing.T, b []byte) (gltfDoc, []byte) {
	t.Helper()
	le := binary.LittleEndian
	if len(b) < 20 || le.Uint32(b) != glbMagic || le.Uint32(b[4:]) != 2 || int(le.Uint32(b[8:])) != len(b) {
		t.Fatalf("bad GLB header")
	}
	jl := int(le.Uint32(b[12:]))
	if le.Uint32(b[16:]) != glbChunkJSON || jl%4 != 0 {
		t.Fatalf("bad JSON chunk")
	}
	var doc gltfDoc
	if err := json.Unmarshal(b[20:20+jl], &doc); err != nil {
		t.Fatal(err)
	}
	rest := b[20+jl:]
	bl := int(le.Uint32(rest))
	if le.Uint32(rest[4:]) != glbChunkBIN || bl%4 != 0 {
		t.Fatalf("bad BIN chunk")
	}
	return doc, rest[8 : 8+bl]
}

func floats(doc gltfDoc, bin []byte, acc int) []float64 {
	a := doc.Accessors[acc]
	v := doc.BufferViews[a.BufferView]
	width := map[string]int{"SCALAR": 1, "VEC3": 3, "VEC4": 4}[a.Type]
	out := make([]float64, a.Count*width)
	for i := range out {
		out[i] = float64(math.Float32frombits(binary.LittleEndian.Uint32(bin[v.ByteOffset+4*i:])))
	}
	return out
}

// TestGLTF_KeysEqualTake: the animation has one LINEAR key per frame whose
// time, translation and rotation are the take's (to single precision).
func TestGLTF_KeysEqualTake(t *testing.T) {
	in := panInput(t, 2)
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{Binary: true}); err != nil {
		t.Fatal(err)
	}
	doc, bin := readGLB(t, buf.Bytes())
	s := doc.Animations[0].Samplers
	times, trans, rots := floats(doc, bin, s[0].Input), floats(doc, bin, s[0].Output), floats(doc, bin, s[1].Output)
	frames := in.Take.Frames
	if len(times) != len(frames) {
		t.Fatalf("%d keys for %d frames", len(times), len(frames))
	}
	for i, f := range frames {
		if math.Abs(times[i]-f.Time) > 1e-6 {
			t.Errorf("key %d time %g, frame time %g", i, times[i], f.Time)
		}
		p := r3.Vec{X: trans[3*i], Y: trans[3*i+1], Z: trans[3*i+2]}
		if r3.Norm(r3.Sub(p, f.CM)) > 1e-6 {
			t.Errorf("key %d translation %v, CM %v", i, p, f.CM)
		}
		q := physics.Rotation{Real: rots[4*i+3], Imag: rots[4*i], Jmag: rots[4*i+1], Kmag: rots[4*i+2]}
		if a := physics.RotationAngle(q.Normalize(), f.Orient); a > 1e-6 {
			t.Errorf("key %d rotation off by %g rad", i, a)
		}
	}
	if s[0].Interpolation != "LINEAR" || s[1].Interpolation != "LINEAR" {
		t.Errorf("interpolation %q %q", s[0].Interpolation, s[1].Interpolation)
	}
}

// TestGLTF_FastSpinSubframeKeys: at 12 turns per second and 24 fps a frame
// turns 180 degrees, which LINEAR slerp cannot tell from -180 (glTF 2.0.1
// Appendix C); keys must then come at sub-frame times, each pair well under
// 180 degrees apart with continuous signs.
func TestGLTF_FastSpinSubframeKeys(t *testing.T) {
	in := panInput(t, 12)
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{Binary: true}); err != nil {
		t.Fatal(err)
	}
	doc, bin := readGLB(t, buf.Bytes())
	s := doc.Animations[0].Samplers
	times, rots := floats(doc, bin, s[0].Input), floats(doc, bin, s[1].Output)
	if len(times) <= len(in.Take.Frames) {
		t.Fatalf("%d keys for %d frames: no sub-frame keys", len(times), len(in.Take.Frames))
	}
	for i := 1; i < len(times); i++ {
		d := rots[4*i]*rots[4*i-4] + rots[4*i+1]*rots[4*i-3] + rots[4*i+2]*rots[4*i-2] + rots[4*i+3]*rots[4*i-1]
		if d <= 0 {
			t.Fatalf("keys %d-%d: sign flip (dot %g)", i-1, i, d)
		}
		if turn := 2 * math.Acos(math.Min(1, d)) * 180 / math.Pi; turn > MaxKeyTurnDeg+1e-3 {
			t.Fatalf("keys %d-%d turn %.1f degrees", i-1, i, turn)
		}
	}
	// Every frame of the take is still a key, at its own time.
	k := (len(times) - 1) / in.Take.LandingFrame
	for _, f := range in.Take.Frames {
		if math.Abs(times[f.N*k]-f.Time) > 1e-6 {
			t.Errorf("frame %d not a key", f.N)
		}
	}
}

// validatorDir is the npm package folder that holds the Khronos validator.
func validatorDir() string {
	_, file, _, _ := runtime.Caller(0)
	return filepath.Join(filepath.Dir(file), "..", "..", "tools", "gltf-validator")
}

// TestGLTF_KhronosValidator runs the Khronos glTF validator (npm package
// gltf-validator, installed by .ci/run) on a GLB and a .gltf export: no
// errors and no warnings. Outside CI it is skipped when node or the package
// is missing; in CI (CI=true) that is a failure.
func TestGLTF_KhronosValidator(t *testing.T) {
	for _, c := range []struct {
		name string
		opt  GLTFOptions
		spin float64
	}{{"pan.glb", GLTFOptions{Binary: true}, 2}, {"pan.gltf", GLTFOptions{}, 2}, {"fast.glb", GLTFOptions{Binary: true, Detail: 12}, 12}} {
		in := panInput(t, c.spin)
		path := filepath.Join(t.TempDir(), c.name)
		var buf bytes.Buffer
		if err := WriteGLTF(&buf, in, c.opt); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
			t.Fatal(err)
		}
		validate(t, path)
	}
}

// validate runs the Khronos validator on the file at path and fails on any
// error or warning. Outside CI it skips the test when node or the package
// is missing; in CI (CI=true) that is a failure.
func validate(t *testing.T, path string) {
	t.Helper()
	dir := validatorDir()
	node, err := exec.LookPath("node")
	if _, serr := os.Stat(filepath.Join(dir, "node_modules", "gltf-validator")); err != nil || serr != nil {
		if os.Getenv("CI") == "true" {
			t.Fatalf("the glTF validator is not installed (run npm ci in %s)", dir)
		}
		t.Skip("node or the gltf-validator npm package is missing; `make test` installs it")
	}
	name := filepath.Base(path)
	out, err := exec.Command(node, filepath.Join(dir, "validate.js"), path).Output()
	if err != nil {
		t.Fatalf("%s: validator: %v", name, err)
	}
	var rep struct {
		Errors, Warnings, Infos, Hints int
		Messages                       []string
	}
	if err := json.Unmarshal(out, &rep); err != nil {
		t.Fatalf("%s: validator output %q: %v", name, out, err)
	}
	if rep.Errors != 0 || rep.Warnings != 0 {
		t.Errorf("%s: %d errors, %d warnings:\n%s", name, rep.Errors, rep.Warnings, strings.Join(rep.Messages, "\n"))
	}
	st, _ := os.Stat(path)
	t.Logf("%s: %d bytes, %d infos, %d hints %v", name, st.Size(), rep.Infos, rep.Hints, rep.Messages)
}

func TestGLTF_EmbeddedBuffer(t *testing.T) {
	in := panInput(t, 2)
	var buf bytes.Buffer
	if err := WriteGLTF(&buf, in, GLTFOptions{}); err != nil {
		t.Fatal(err)
	}
	var doc gltfDoc
	if err := json.Unmarshal(buf.Bytes(), &doc); err != nil {
		t.Fatal(err)
	}
	uri := doc.Buffers[0].URI
	data, err := base64.StdEncoding.DecodeString(strings.TrimPrefix(uri, "data:application/octet-stream;base64,"))
	if err != nil || len(data) != doc.Buffers[0].ByteLength {
		t.Fatalf("embedded buffer: %d bytes, want %d (%v)", len(data), doc.Buffers[0].ByteLength, err)
	}
}
