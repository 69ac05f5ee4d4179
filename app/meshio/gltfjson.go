package meshio

// The glTF 2.0 JSON objects the reader needs (Khronos glTF 2.0
// Specification 2.0.1, §5). Optional properties are pointers or have their
// specification defaults applied by the reader. These are the reading side
// only: app/export writes its own, smaller set with no optional fields.
type gltfDoc struct {
	Asset struct {
		Version string `json:"version"`
	} `json:"asset"`
	ExtensionsRequired []string       `json:"extensionsRequired"`
	Scene              *int           `json:"scene"`
	Scenes             []gltfScene    `json:"scenes"`
	Nodes              []gltfNode     `json:"nodes"`
	Meshes             []gltfMesh     `json:"meshes"`
	Accessors          []gltfAccessor `json:"accessors"`
	BufferViews        []gltfView     `json:"bufferViews"`
	Buffers            []gltfBuffer   `json:"buffers"`
}

type gltfScene struct {
	Nodes []int `json:"nodes"`
}

type gltfNode struct {
	Children    []int        `json:"children"`
	Mesh        *int         `json:"mesh"`
	Matrix      *[16]float64 `json:"matrix"`      // column major
	Translation *[3]float64  `json:"translation"` // default 0
	Rotation    *[4]float64  `json:"rotation"`    // x, y, z, w; default identity
	Scale       *[3]float64  `json:"scale"`       // default 1
}

type gltfMesh struct {
	Primitives []gltfPrimitive `json:"primitives"`
}

type gltfPrimitive struct {
	Attributes map[string]int `json:"attributes"`
	Indices    *int           `json:"indices"`
	Mode       *int           `json:"mode"` // default 4, triangles
}

type gltfAccessor struct {
	BufferView    *int      `json:"bufferView"`
	ByteOffset    int64     `json:"byteOffset"`
	ComponentType int       `json:"componentType"`
	Normalized    bool      `json:"normalized"`
	Count         int64     `json:"count"`
	Type          string    `json:"type"`
	Sparse        *struct{} `json:"sparse"`
}

type gltfView struct {
	Buffer     int    `json:"buffer"`
	ByteOffset int64  `json:"byteOffset"`
	ByteLength int64  `json:"byteLength"`
	ByteStride *int64 `json:"byteStride"`
}

type gltfBuffer struct {
	ByteLength int64   `json:"byteLength"`
	URI        *string `json:"uri"`
}

// Component types (§5.1.3 accessor.componentType).
const (
	compUByte  = 5121
	compUShort = 5123
	compUInt   = 5125
	compFloat  = 5126
)
