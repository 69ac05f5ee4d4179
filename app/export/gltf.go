package export

import (
	"bytes"
	"encoding/base64"
	"encoding/binary"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"

	"gonum.org/v1/gonum/num/quat"
	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/wire"
)

// Input is what the 3D and image exporters need: the prop, its mass
// properties, the throw and its take.
type Input struct {
	Name  string
	Prop  *physics.Prop
	Mass  *physics.MassProps
	Throw *physics.Throw
	Take  *physics.Take
}

// GLTFOptions control WriteGLTF.
type GLTFOptions struct {
	Binary bool // GLB container (.glb) instead of JSON with an embedded buffer (.gltf)
	Detail int  // segments around a full circle for round primitives (wire.Segments); 0: wire.DefaultDetail; mesh parts keep their own triangles
}

// MaxKeyTurnDeg bounds (strictly) the rotation between two consecutive rotation
// keys. glTF 2.0 slerps LINEAR rotation keys the short way (Specification
// 2.0.1, Appendix C), so keys must stay well under 180 degrees apart; faster
// spins get evenly spaced sub-frame keys.
const MaxKeyTurnDeg = 90.0

// MaxGLTFKeys is the most animation keys WriteGLTF writes (frames times
// keys a frame): a million keys is about 44 MB of key data, far more than
// any 3D package wants for one throw.
const MaxGLTFKeys = 1_000_000

// checkKeys refuses a take of frames frames keyed perFrame times a frame
// beyond MaxGLTFKeys, naming the spin (whose rate sets the keys a frame).
func checkKeys(frames, perFrame int) error {
	if n := int64(frames) * int64(perFrame); n > MaxGLTFKeys {
		return &physics.FieldError{Field: "throw.spin", Msg: fmt.Sprintf("the glTF animation would need %d keys (%d frames, %d keys a frame to keep each turn under %g degrees), more than %d: lower the spin rate or the frame rate", n, frames, perFrame, MaxKeyTurnDeg, MaxGLTFKeys)}
	}
	return nil
}

// glTF 2.0 numeric codes (Specification 2.0.1, §5 "JSON Schema Reference").
const (
	compFloat       = 5126
	compUint32      = 5125
	targetArray     = 34962
	targetElements  = 34963
	modeTriangles   = 4
	glbMagic        = 0x46546C67 // "glTF"
	glbChunkJSON    = 0x4E4F534A // "JSON"
	glbChunkBIN     = 0x004E4942 // "BIN\0"
	glbVersion      = 2
	generatorString = "Propflight"
)

// WriteGLTF writes the prop as one mesh (each primitive part tessellated, a
// mesh part as its own triangles with crease-split smooth normals, see
// wire.Surface; metres, +Y up, u32 indices) on one node whose translation and rotation are animated with a LINEAR
// key per frame of the take (times in seconds from release), plus
// sub-frame keys where the prop turns more than MaxKeyTurnDeg in a frame.
// The node's origin is the prop's centre of mass, so its translation keys
// are the take's centre of mass and its rotation keys the take's
// orientation (glTF order x, y, z, w).
func WriteGLTF(w io.Writer, in Input, opt GLTFOptions) error {
	keys, err := animationKeys(in)
	if err != nil {
		return err
	}
	detail := opt.Detail
	if detail == 0 {
		detail = wire.DefaultDetail
	}
	mesh := wire.PropMesh(in.Prop, detail)
	if len(mesh.Triangles) == 0 {
		return errors.New("export: the prop has no triangles to put in the glTF file")
	}
	doc, bin := buildGLTF(in, mesh, keys)
	if !opt.Binary {
		return writeEmbedded(w, doc, bin)
	}
	js, err := json.Marshal(doc)
	if err != nil {
		return err
	}
	for len(js)%4 != 0 {
		js = append(js, ' ')
	}
	for len(bin)%4 != 0 {
		bin = append(bin, 0)
	}
	total := 12 + 8 + len(js) + 8 + len(bin)
	le := binary.LittleEndian
	var hdr []byte
	hdr = le.AppendUint32(hdr, glbMagic)
	hdr = le.AppendUint32(hdr, glbVersion)
	hdr = le.AppendUint32(hdr, uint32(total))
	hdr = le.AppendUint32(hdr, uint32(len(js)))
	hdr = le.AppendUint32(hdr, glbChunkJSON)
	hdr = append(hdr, js...)
	hdr = le.AppendUint32(hdr, uint32(len(bin)))
	hdr = le.AppendUint32(hdr, glbChunkBIN)
	// The buffer goes out as it is, without a copy behind the header.
	if _, err := w.Write(hdr); err != nil {
		return err
	}
	_, err = w.Write(bin)
	return err
}

// uriMark is how encoding/json writes the placeholder URI that
// writeEmbedded puts in while it encodes the JSON: NUL characters come out
// escaped as \u0000. A name that holds the very same text makes it occur
// twice, and writeEmbedded then falls back to encoding in memory.
const uriMark = `\u0000propflight-buffer\u0000`

// writeEmbedded writes the .gltf JSON with the buffer as a base64 data URI,
// encoding the buffer straight into w: the JSON is encoded with a marker
// in place of the URI, and the base64 text is streamed where the marker
// stands, so the buffer is never held a second time as a string.
func writeEmbedded(w io.Writer, doc *gltfDoc, bin []byte) error {
	doc.Buffers[0].URI = "\x00propflight-buffer\x00"
	var js bytes.Buffer
	enc := json.NewEncoder(&js)
	enc.SetIndent("", " ")
	if err := enc.Encode(doc); err != nil {
		return err
	}
	if bytes.Count(js.Bytes(), []byte(uriMark)) != 1 {
		// A name holding the marker itself: encode the URI in memory.
		doc.Buffers[0].URI = "data:application/octet-stream;base64," + base64.StdEncoding.EncodeToString(bin)
		enc := json.NewEncoder(w)
		enc.SetIndent("", " ")
		return enc.Encode(doc)
	}
	head, tail, _ := bytes.Cut(js.Bytes(), []byte(uriMark))
	if _, err := io.WriteString(w, string(head)+"data:application/octet-stream;base64,"); err != nil {
		return err
	}
	b64 := base64.NewEncoder(base64.StdEncoding, w)
	if _, err := b64.Write(bin); err != nil {
		return err
	}
	if err := b64.Close(); err != nil {
		return err
	}
	_, err := w.Write(tail)
	return err
}

// key is one animation key: time, centre of mass and orientation.
type key struct {
	t float64
	p r3.Vec
	q physics.Rotation
}

// animationKeys returns the keys: the take's frames, or a finer take at an
// integer multiple of the frame rate when a frame turns too far. Quaternion
// signs are made continuous (q and -q are one rotation).
func animationKeys(in Input) ([]key, error) {
	if in.Take == nil || len(in.Take.Frames) == 0 {
		return nil, errors.New("export: no take to export as glTF")
	}
	frames := in.Take.Frames
	// Raise the key rate by whole multiples until every key-to-key turn is
	// under the bound (the turn within a frame need not be even).
	for k := int(math.Floor(maxTurn(frames)/MaxKeyTurnDeg)) + 1; maxTurn(frames) >= MaxKeyTurnDeg; k++ {
		if k > 1024 {
			return nil, errors.New("export: the prop turns too fast to key in glTF (more than 1024 keys a frame)")
		}
		if err := checkKeys(in.Take.LandingFrame+1, k); err != nil {
			return nil, err
		}
		th := *in.Throw
		th.FPS = physics.Rate{Num: th.FPS.Num * int64(k), Den: th.FPS.Den}
		fine, err := physics.Simulate(in.Prop, in.Mass, &th)
		if err != nil {
			return nil, fmt.Errorf("export: glTF sub-frame keys: %w", err)
		}
		// Keep the fine frames up to the take's last frame.
		last := in.Take.LandingFrame * k
		frames = fine.Frames[:min(last+1, len(fine.Frames))]
	}
	keys := make([]key, len(frames))
	for i, f := range frames {
		q := f.Orient
		if i > 0 {
			p := keys[i-1].q
			if p.Real*q.Real+p.Imag*q.Imag+p.Jmag*q.Jmag+p.Kmag*q.Kmag < 0 {
				q = physics.Rotation(quat.Scale(-1, q.Quat())) // the same rotation
			}
		}
		keys[i] = key{t: f.Time, p: f.CM, q: q}
	}
	for i := 1; i < len(keys); i++ {
		if float32(keys[i].t) <= float32(keys[i-1].t) {
			return nil, fmt.Errorf("export: glTF key times %g and %g s are equal in single precision; lower the frame rate", keys[i-1].t, keys[i].t)
		}
	}
	return keys, nil
}

func maxTurn(frames []physics.Frame) float64 {
	worst := 0.0
	for _, f := range frames {
		worst = math.Max(worst, f.TurnDeg)
	}
	return worst
}

// The glTF JSON objects used (Specification 2.0.1, §5).
type gltfDoc struct {
	Asset       gltfAsset       `json:"asset"`
	Scene       int             `json:"scene"`
	Scenes      []gltfScene     `json:"scenes"`
	Nodes       []gltfNode      `json:"nodes"`
	Meshes      []gltfMesh      `json:"meshes"`
	Materials   []gltfMaterial  `json:"materials"`
	Animations  []gltfAnimation `json:"animations"`
	Accessors   []gltfAccessor  `json:"accessors"`
	BufferViews []gltfView      `json:"bufferViews"`
	Buffers     []gltfBuffer    `json:"buffers"`
}

type gltfAsset struct {
	Version   string `json:"version"`
	Generator string `json:"generator"`
}

type gltfScene struct {
	Name  string `json:"name,omitempty"`
	Nodes []int  `json:"nodes"`
}

type gltfNode struct {
	Name        string     `json:"name,omitempty"`
	Mesh        int        `json:"mesh"`
	Translation [3]float64 `json:"translation"`
	Rotation    [4]float64 `json:"rotation"`
}

type gltfMesh struct {
	Name       string          `json:"name,omitempty"`
	Primitives []gltfPrimitive `json:"primitives"`
}

type gltfPrimitive struct {
	Attributes map[string]int `json:"attributes"`
	Indices    int            `json:"indices"`
	Material   int            `json:"material"`
	Mode       int            `json:"mode"`
}

type gltfMaterial struct {
	Name string  `json:"name,omitempty"`
	PBR  gltfPBR `json:"pbrMetallicRoughness"`
}

type gltfPBR struct {
	BaseColorFactor [4]float64 `json:"baseColorFactor"`
	MetallicFactor  float64    `json:"metallicFactor"`
	RoughnessFactor float64    `json:"roughnessFactor"`
}

type gltfAnimation struct {
	Name     string        `json:"name,omitempty"`
	Channels []gltfChannel `json:"channels"`
	Samplers []gltfSampler `json:"samplers"`
}

type gltfChannel struct {
	Sampler int        `json:"sampler"`
	Target  gltfTarget `json:"target"`
}

type gltfTarget struct {
	Node int    `json:"node"`
	Path string `json:"path"`
}

type gltfSampler struct {
	Input         int    `json:"input"`
	Output        int    `json:"output"`
	Interpolation string `json:"interpolation"`
}

type gltfAccessor struct {
	BufferView    int       `json:"bufferView"`
	ComponentType int       `json:"componentType"`
	Count         int       `json:"count"`
	Type          string    `json:"type"`
	Min           []float32 `json:"min,omitempty"`
	Max           []float32 `json:"max,omitempty"`
}

type gltfView struct {
	Buffer     int `json:"buffer"`
	ByteOffset int `json:"byteOffset"`
	ByteLength int `json:"byteLength"`
	Target     int `json:"target,omitempty"`
}

type gltfBuffer struct {
	ByteLength int    `json:"byteLength"`
	URI        string `json:"uri,omitempty"`
}

// buildGLTF lays out the binary buffer and the JSON that describes it:
// the mesh's views, then the animation's.
func buildGLTF(in Input, mesh wire.Mesh, keys []key) (*gltfDoc, []byte) {
	doc := &gltfDoc{
		Asset:  gltfAsset{Version: "2.0", Generator: generatorString},
		Scenes: []gltfScene{{Name: in.Name, Nodes: []int{0}}},
		Materials: []gltfMaterial{{Name: "prop", PBR: gltfPBR{
			BaseColorFactor: [4]float64{0.85, 0.62, 0.38, 1}, MetallicFactor: 0, RoughnessFactor: 0.7}}},
	}
	// The buffer is allocated once at its final size (each view padded to
	// 4 bytes) and every view is written straight into it: no view is
	// built on its own and copied, so the peak memory is the mesh plus one
	// buffer.
	nv, nt, n := len(mesh.Vertices), len(mesh.Triangles), len(keys)
	pad4 := func(x int) int { return (x + 3) &^ 3 }
	b := &bufferWriter{doc: doc, bin: make([]byte, 0, pad4(12*nv)+pad4(12*nv)+pad4(12*nt)+pad4(4*n)+pad4(12*n)+pad4(16*n)+pad4(12*n))}
	b.mesh(mesh, in.Mass.CM)
	b.animation(keys)
	k0 := keys[0]
	q0 := unitQuatFloat32(k0.q)
	doc.Nodes = []gltfNode{{Name: nodeName(in.Name), Mesh: 0,
		Translation: [3]float64{float64(float32(k0.p.X)), float64(float32(k0.p.Y)), float64(float32(k0.p.Z))},
		Rotation:    [4]float64{q0.Imag, q0.Jmag, q0.Kmag, q0.Real}}}
	doc.Buffers = []gltfBuffer{{ByteLength: len(b.bin)}}
	return doc, b.bin
}

// bufferWriter writes the views of the one binary buffer of doc, each
// padded to 4 bytes and little-endian, and their accessors.
type bufferWriter struct {
	doc   *gltfDoc
	bin   []byte
	start int // where the view being written begins
}

// begin pads the buffer to 4 bytes and starts a view there.
func (b *bufferWriter) begin() {
	for len(b.bin)%4 != 0 {
		b.bin = append(b.bin, 0)
	}
	b.start = len(b.bin)
}

// end closes the view begun last, for target (0 for none), and returns its
// index.
func (b *bufferWriter) end(target int) int {
	b.doc.BufferViews = append(b.doc.BufferViews, gltfView{Buffer: 0, ByteOffset: b.start, ByteLength: len(b.bin) - b.start, Target: target})
	return len(b.doc.BufferViews) - 1
}

// accessor adds a and returns its index.
func (b *bufferWriter) accessor(a gltfAccessor) int {
	b.doc.Accessors = append(b.doc.Accessors, a)
	return len(b.doc.Accessors) - 1
}

// f32 appends each of vs as a single-precision float.
func (b *bufferWriter) f32(vs ...float64) {
	for _, v := range vs {
		b.bin = binary.LittleEndian.AppendUint32(b.bin, math.Float32bits(float32(v)))
	}
}

// mesh writes the positions (relative to the centre of mass cm, so that
// the node's origin is the CM), the normals and the triangles' indices,
// and the document's one mesh.
func (b *bufferWriter) mesh(mesh wire.Mesh, cm r3.Vec) {
	nv, nt := len(mesh.Vertices), len(mesh.Triangles)
	lo := [3]float32{float32(math.Inf(1)), float32(math.Inf(1)), float32(math.Inf(1))}
	hi := [3]float32{float32(math.Inf(-1)), float32(math.Inf(-1)), float32(math.Inf(-1))}
	b.begin()
	for _, v := range mesh.Vertices {
		p := r3.Sub(v, cm)
		c := [3]float32{float32(p.X), float32(p.Y), float32(p.Z)}
		for k := range 3 {
			lo[k] = min(lo[k], c[k])
			hi[k] = max(hi[k], c[k])
		}
		b.f32(p.X, p.Y, p.Z)
	}
	aPos := b.accessor(gltfAccessor{BufferView: b.end(targetArray), ComponentType: compFloat, Count: nv, Type: "VEC3", Min: lo[:], Max: hi[:]})
	b.begin()
	for _, nr := range mesh.Normals {
		u := unitFloat32(nr)
		b.f32(u.X, u.Y, u.Z)
	}
	aNrm := b.accessor(gltfAccessor{BufferView: b.end(targetArray), ComponentType: compFloat, Count: nv, Type: "VEC3"})
	b.begin()
	le := binary.LittleEndian
	for _, t := range mesh.Triangles {
		b.bin = le.AppendUint32(le.AppendUint32(le.AppendUint32(b.bin, t[0]), t[1]), t[2])
	}
	aIdx := b.accessor(gltfAccessor{BufferView: b.end(targetElements), ComponentType: compUint32, Count: 3 * nt, Type: "SCALAR"})
	b.doc.Meshes = []gltfMesh{{Name: "prop", Primitives: []gltfPrimitive{{
		Attributes: map[string]int{"POSITION": aPos, "NORMAL": aNrm}, Indices: aIdx, Material: 0, Mode: modeTriangles}}}}
}

// animation writes the keys' times, translations, rotations (x, y, z, w)
// and a scale of 1 on every key, and the animation that plays them. The
// prop never scales, but a converter that keys the three channels
// together (assimp's COLLADA writer bakes them into one matrix per key
// and drops the animation when their key counts differ, reading a missing
// scale channel as one key) needs all three with the same keys.
func (b *bufferWriter) animation(keys []key) {
	n := len(keys)
	b.begin()
	for _, k := range keys {
		b.f32(k.t)
	}
	aT := b.accessor(gltfAccessor{BufferView: b.end(0), ComponentType: compFloat, Count: n, Type: "SCALAR",
		Min: []float32{float32(keys[0].t)}, Max: []float32{float32(keys[n-1].t)}})
	b.begin()
	for _, k := range keys {
		b.f32(k.p.X, k.p.Y, k.p.Z)
	}
	aTr := b.accessor(gltfAccessor{BufferView: b.end(0), ComponentType: compFloat, Count: n, Type: "VEC3"})
	b.begin()
	for _, k := range keys {
		q := unitQuatFloat32(k.q)
		b.f32(q.Imag, q.Jmag, q.Kmag, q.Real)
	}
	aRo := b.accessor(gltfAccessor{BufferView: b.end(0), ComponentType: compFloat, Count: n, Type: "VEC4"})
	b.begin()
	for range keys {
		b.f32(1, 1, 1)
	}
	aSc := b.accessor(gltfAccessor{BufferView: b.end(0), ComponentType: compFloat, Count: n, Type: "VEC3"})
	b.doc.Animations = []gltfAnimation{{Name: "throw",
		Channels: []gltfChannel{
			{Sampler: 0, Target: gltfTarget{Node: 0, Path: "translation"}},
			{Sampler: 1, Target: gltfTarget{Node: 0, Path: "rotation"}},
			{Sampler: 2, Target: gltfTarget{Node: 0, Path: "scale"}},
		},
		Samplers: []gltfSampler{
			{Input: aT, Output: aTr, Interpolation: "LINEAR"},
			{Input: aT, Output: aRo, Interpolation: "LINEAR"},
			{Input: aT, Output: aSc, Interpolation: "LINEAR"},
		},
	}}
}

func nodeName(s string) string {
	if s == "" {
		return "prop"
	}
	return s
}

// unitFloat32 returns v scaled to unit length and rounded to single
// precision, renormalised so the stored vector is unit to within float32.
func unitFloat32(v r3.Vec) r3.Vec {
	n := r3.Norm(v)
	if n == 0 {
		return r3.Vec{Z: 1}
	}
	return r3.Vec{X: float64(float32(v.X / n)), Y: float64(float32(v.Y / n)), Z: float64(float32(v.Z / n))}
}

func unitQuatFloat32(q physics.Rotation) physics.Rotation {
	q = q.Normalize()
	return physics.Rotation{Real: float64(float32(q.Real)), Imag: float64(float32(q.Imag)), Jmag: float64(float32(q.Jmag)), Kmag: float64(float32(q.Kmag))}
}
