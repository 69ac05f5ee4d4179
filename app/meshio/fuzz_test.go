package meshio

import (
	"testing"

	"propflight/physics/mesh"
)

// The fuzz targets feed each reader arbitrary bytes: it must return
// triangles or an error, never panic, and whatever it returns must go
// through the mesh checks without a panic either. Seeds are the test
// files; testdata/fuzz holds a few more.

func fuzzSeeds(f *testing.F, add func(f *testing.F)) {
	add(f)
	f.Add([]byte{})
	f.Add([]byte("solid"))
}

func checkTris(t *testing.T, n int, err error) {
	if err == nil && n == 0 {
		t.Fatal("no error and no triangles")
	}
}

func FuzzReadSTL(f *testing.F) {
	fuzzSeeds(f, func(f *testing.F) {
		tris := fans(lumpQuads())
		f.Add(stlBinary(tris[:3], "x"))
		f.Add(stlASCII(tris[:2]))
	})
	f.Fuzz(func(t *testing.T, data []byte) {
		tris, err := ReadSTL(data)
		checkTris(t, len(tris), err)
		if err == nil {
			mesh.New(tris)
		}
	})
}

func FuzzReadOBJ(f *testing.F) {
	fuzzSeeds(f, func(f *testing.F) {
		f.Add(objQuads(lumpQuads()))
		f.Add([]byte("v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 -1\n"))
	})
	f.Fuzz(func(t *testing.T, data []byte) {
		tris, err := ReadOBJ(data)
		checkTris(t, len(tris), err)
		if err == nil {
			mesh.New(tris)
		}
	})
}

func FuzzReadGLB(f *testing.F) {
	fuzzSeeds(f, func(f *testing.F) {
		tris := fans(lumpQuads())
		bin, acc, views := meshBuffer(tris[:4])
		f.Add(glb(gltfJSON(`[{"mesh":0,"children":[1]},{"scale":[1,2,3]}]`, `[{"primitives":[{"attributes":{"POSITION":0},"indices":1}]}]`, acc, views, len(bin), ""), bin))
	})
	f.Fuzz(func(t *testing.T, data []byte) {
		tris, err := ReadGLB(data)
		checkTris(t, len(tris), err)
		if err == nil {
			mesh.New(tris)
		}
	})
}

func FuzzReadGLTF(f *testing.F) {
	fuzzSeeds(f, func(f *testing.F) {
		f.Add([]byte(`{"asset":{"version":"2.0"},"scenes":[{"nodes":[0]}],"nodes":[{"mesh":0}],"meshes":[{"primitives":[{"attributes":{"POSITION":0},"mode":6}]}],"accessors":[{"bufferView":0,"componentType":5126,"count":3,"type":"VEC3"}],"bufferViews":[{"buffer":0,"byteLength":36}],"buffers":[{"byteLength":36,"uri":"data:application/octet-stream;base64,AAAAAAAAAAAAAAAAAACAPwAAAAAAAAAAAAAAAAAAgD8AAAAA"}]}`))
	})
	f.Fuzz(func(t *testing.T, data []byte) {
		tris, err := ReadGLTF(data, nil)
		checkTris(t, len(tris), err)
		if err == nil {
			mesh.New(tris)
		}
	})
}
