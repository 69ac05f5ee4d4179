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
		return errors.New("gltf: the prop has no triangles to export")
	}
	doc, bin := buildGLTF(in, mesh, keys)
	if !opt.Binary {
		doc.Buffers[0].URI = "data:application/octet-stream;base64," + base64.StdEncoding.EncodeToString(bin)
		enc := json.NewEncoder(w)
		enc.SetIndent("", " ")
		return enc.Encode(doc)
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
	var hdr bytes.Buffer
	le := binary.LittleEndian
	hdr.Write(le.AppendUint32(nil, glbMagic))
	hdr.Write(le.AppendUint32(nil, glbVersion))
	hdr.Write(le.AppendUint32(nil, uint32(total)))
	hdr.Write(le.AppendUint32(nil, uint32(len(js))))
	hdr.Write(le.AppendUint32(nil, glbChunkJSON))
	hdr.Write(js)
	hdr.Write(le.AppendUint32(nil, uint32(len(bin))))
	hdr.Write(le.AppendUint32(nil, glbChunkBIN))
	hdr.Write(bin)
	_, err = w.Write(hdr.Bytes())
	return err
}

// key is one animation key: time, centre of mass and orientation.
type key struct {
	t float64
	p r3.Vec
	q quat.Number
}

// animationKeys returns the keys: the take's frames, or a finer take at an
// integer multiple of the frame rate when a frame turns too far. Quaternion
// signs are made continuous (q and -q are one rotation).
func animationKeys(in Input) ([]key, error) {
	if in.Take == nil || len(in.Take.Frames) == 0 {
		return nil, errors.New("gltf: no take to export")
	}
	frames := in.Take.Frames
	// Raise the key rate by whole multiples until every key-to-key turn is
	// under the bound (the turn within a frame need not be even).
	for k := int(math.Floor(maxTurn(frames)/MaxKeyTurnDeg)) + 1; maxTurn(frames) >= MaxKeyTurnDeg; k++ {
		if k > 1024 {
			return nil, errors.New("gltf: the prop turns too fast to key (more than 1024 keys a frame)")
		}
		th := *in.Throw
		th.FPS = physics.Rate{Num: th.FPS.Num * int64(k), Den: th.FPS.Den}
		fine, err := physics.Simulate(in.Prop, in.Mass, &th)
		if err != nil {
			return nil, fmt.Errorf("gltf: sub-frame keys: %w", err)
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
				q = quat.Scale(-1, q)
			}
		}
		keys[i] = key{t: f.Time, p: f.CM, q: q}
	}
	for i := 1; i < len(keys); i++ {
		if float32(keys[i].t) <= float32(keys[i-1].t) {
			return nil, fmt.Errorf("gltf: key times %g and %g s are equal in single precision; lower the frame rate", keys[i-1].t, keys[i].t)
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

// buildGLTF lays out the binary buffer and the JSON that describes it.
func buildGLTF(in Input, mesh wire.Mesh, keys []key) (*gltfDoc, []byte) {
	var bin []byte
	doc := &gltfDoc{
		Asset:  gltfAsset{Version: "2.0", Generator: generatorString},
		Scenes: []gltfScene{{Name: in.Name, Nodes: []int{0}}},
		Materials: []gltfMaterial{{Name: "prop", PBR: gltfPBR{
			BaseColorFactor: [4]float64{0.85, 0.62, 0.38, 1}, MetallicFactor: 0, RoughnessFactor: 0.7}}},
	}
	view := func(data []byte, target int) int {
		for len(bin)%4 != 0 {
			bin = append(bin, 0)
		}
		doc.BufferViews = append(doc.BufferViews, gltfView{Buffer: 0, ByteOffset: len(bin), ByteLength: len(data), Target: target})
		bin = append(bin, data...)
		return len(doc.BufferViews) - 1
	}
	accessor := func(a gltfAccessor) int {
		doc.Accessors = append(doc.Accessors, a)
		return len(doc.Accessors) - 1
	}
	le := binary.LittleEndian
	f32 := func(b []byte, v float64) []byte { return le.AppendUint32(b, math.Float32bits(float32(v))) }

	// Vertices relative to the centre of mass, so the node's origin is the CM.
	cm := in.Mass.CM
	var pos, nrm []byte
	lo := [3]float32{float32(math.Inf(1)), float32(math.Inf(1)), float32(math.Inf(1))}
	hi := [3]float32{float32(math.Inf(-1)), float32(math.Inf(-1)), float32(math.Inf(-1))}
	for i, v := range mesh.Vertices {
		p := r3.Sub(v, cm)
		c := [3]float32{float32(p.X), float32(p.Y), float32(p.Z)}
		for k := range 3 {
			lo[k] = min(lo[k], c[k])
			hi[k] = max(hi[k], c[k])
		}
		pos = f32(f32(f32(pos, p.X), p.Y), p.Z)
		n := unitFloat32(mesh.Normals[i])
		nrm = f32(f32(f32(nrm, n.X), n.Y), n.Z)
	}
	var idx []byte
	for _, t := range mesh.Triangles {
		idx = le.AppendUint32(le.AppendUint32(le.AppendUint32(idx, t[0]), t[1]), t[2])
	}
	nv := len(mesh.Vertices)
	aPos := accessor(gltfAccessor{BufferView: view(pos, targetArray), ComponentType: compFloat, Count: nv, Type: "VEC3", Min: lo[:], Max: hi[:]})
	aNrm := accessor(gltfAccessor{BufferView: view(nrm, targetArray), ComponentType: compFloat, Count: nv, Type: "VEC3"})
	aIdx := accessor(gltfAccessor{BufferView: view(idx, targetElements), ComponentType: compUint32, Count: 3 * len(mesh.Triangles), Type: "SCALAR"})
	doc.Meshes = []gltfMesh{{Name: "prop", Primitives: []gltfPrimitive{{
		Attributes: map[string]int{"POSITION": aPos, "NORMAL": aNrm}, Indices: aIdx, Material: 0, Mode: modeTriangles}}}}

	// Animation: times, translations, rotations (x, y, z, w) and a scale
	// of 1 on every key. The prop never scales, but a converter that keys
	// the three channels together (assimp's COLLADA writer bakes them into
	// one matrix per key and drops the animation when their key counts
	// differ, reading a missing scale channel as one key) needs all three
	// with the same keys.
	var times, trans, rots, scales []byte
	for _, k := range keys {
		times = f32(times, k.t)
		trans = f32(f32(f32(trans, k.p.X), k.p.Y), k.p.Z)
		q := unitQuatFloat32(k.q)
		rots = f32(f32(f32(f32(rots, q.Imag), q.Jmag), q.Kmag), q.Real)
		scales = f32(f32(f32(scales, 1), 1), 1)
	}
	n := len(keys)
	aT := accessor(gltfAccessor{BufferView: view(times, 0), ComponentType: compFloat, Count: n, Type: "SCALAR",
		Min: []float32{float32(keys[0].t)}, Max: []float32{float32(keys[n-1].t)}})
	aTr := accessor(gltfAccessor{BufferView: view(trans, 0), ComponentType: compFloat, Count: n, Type: "VEC3"})
	aRo := accessor(gltfAccessor{BufferView: view(rots, 0), ComponentType: compFloat, Count: n, Type: "VEC4"})
	aSc := accessor(gltfAccessor{BufferView: view(scales, 0), ComponentType: compFloat, Count: n, Type: "VEC3"})
	doc.Animations = []gltfAnimation{{Name: "throw",
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
	k0 := keys[0]
	q0 := unitQuatFloat32(k0.q)
	doc.Nodes = []gltfNode{{Name: nodeName(in.Name), Mesh: 0,
		Translation: [3]float64{float64(float32(k0.p.X)), float64(float32(k0.p.Y)), float64(float32(k0.p.Z))},
		Rotation:    [4]float64{q0.Imag, q0.Jmag, q0.Kmag, q0.Real}}}
	doc.Buffers = []gltfBuffer{{ByteLength: len(bin)}}
	return doc, bin
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

func unitQuatFloat32(q quat.Number) quat.Number {
	q = physics.Normalize(q)
	return quat.Number{Real: float64(float32(q.Real)), Imag: float64(float32(q.Imag)), Jmag: float64(float32(q.Jmag)), Kmag: float64(float32(q.Kmag))}
}
