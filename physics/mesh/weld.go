package mesh

import (
	"math"
	"math/bits"

	"gonum.org/v1/gonum/spatial/r3"
)

// welder numbers positions: equal positions (exact float64 equality, so +0
// and -0 are one position) get the same index. It is an open-addressing
// hash table over the positions' bits, several times faster than a Go map
// keyed by r3.Vec for the millions of corners of a scanned prop.
type welder struct {
	slots []int32 // index into verts + 1; 0 = empty
	mask  uint64
	verts []r3.Vec
}

// newWelder sizes the table for up to n distinct positions.
func newWelder(n int) *welder {
	size := 1 << bits.Len(uint(2*n+16))
	return &welder{slots: make([]int32, size), mask: uint64(size - 1), verts: make([]r3.Vec, 0, n/2+8)}
}

func posBits(x float64) uint64 {
	if x == 0 {
		return 0 // -0 and +0 weld
	}
	return math.Float64bits(x)
}

// index returns p's number, adding p if it is new.
func (w *welder) index(p r3.Vec) int32 {
	h := fmix((fmix(posBits(p.X))^posBits(p.Y))*0x9e3779b97f4a7c15 ^ posBits(p.Z))
	for i := h & w.mask; ; i = (i + 1) & w.mask {
		s := w.slots[i]
		if s == 0 {
			w.verts = append(w.verts, p)
			w.slots[i] = int32(len(w.verts))
			return int32(len(w.verts) - 1)
		}
		if w.verts[s-1] == p {
			return s - 1
		}
	}
}

// fmix is MurmurHash3's 64-bit finaliser (A. Appleby, public domain): every
// input bit reaches the low bits the table indexes with, which matters for
// round coordinates whose low mantissa bits are all zero.
func fmix(h uint64) uint64 {
	h ^= h >> 33
	h *= 0xff51afd7ed558ccd
	h ^= h >> 33
	h *= 0xc4ceb9fe1a85ec53
	h ^= h >> 33
	return h
}
