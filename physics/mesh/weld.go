package mesh

import (
	"math"

	"gonum.org/v1/gonum/spatial/r3"
)

// welder numbers positions: equal positions (exact float64 equality, so +0
// and -0 are one position) get the same index. It is an open-addressing
// hash table over the positions' bits, grown to stay at most half full,
// several times faster than a Go map keyed by r3.Vec for the millions of
// corners of a scanned prop. Each slot keeps a few hash bits beside the
// index, so most probes that miss never touch the vertex array.
type welder struct {
	slots []weldSlot
	mask  uint64
	verts []r3.Vec
}

type weldSlot struct {
	idx int32 // index into verts + 1; 0 = empty
	tag uint32
}

// newWelder sizes the table for about n distinct positions (it grows past that).
func newWelder(n int) *welder {
	size := 64
	for size < 2*n {
		size *= 2
	}
	return &welder{slots: make([]weldSlot, size), mask: uint64(size - 1), verts: make([]r3.Vec, 0, n)}
}

func posBits(x float64) uint64 {
	if x == 0 {
		return 0 // -0 and +0 weld
	}
	return math.Float64bits(x)
}

func hashPos(p r3.Vec) uint64 {
	return fmix((fmix(posBits(p.X))^posBits(p.Y))*0x9e3779b97f4a7c15 ^ posBits(p.Z))
}

// index returns p's number, adding p if it is new.
func (w *welder) index(p r3.Vec) int32 {
	h := hashPos(p)
	tag := uint32(h >> 32)
	for i := h & w.mask; ; i = (i + 1) & w.mask {
		s := w.slots[i]
		if s.idx == 0 {
			w.verts = append(w.verts, p)
			w.slots[i] = weldSlot{int32(len(w.verts)), tag}
			if 2*len(w.verts) > len(w.slots) {
				w.grow()
			}
			return int32(len(w.verts) - 1)
		}
		if s.tag == tag && w.verts[s.idx-1] == p {
			return s.idx - 1
		}
	}
}

// grow doubles the table and re-inserts every position.
func (w *welder) grow() {
	w.slots = make([]weldSlot, 2*len(w.slots))
	w.mask = uint64(len(w.slots) - 1)
	for j, p := range w.verts {
		h := hashPos(p)
		i := h & w.mask
		for w.slots[i].idx != 0 {
			i = (i + 1) & w.mask
		}
		w.slots[i] = weldSlot{int32(j + 1), uint32(h >> 32)}
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

// radixSort sorts keys ascending (least significant digit first, 11 bits a
// pass, passes above the largest key's top bit skipped); it is several
// times faster than a comparison sort for the millions of edge keys.
func radixSort(keys []uint64) {
	var top uint64
	for _, k := range keys {
		top |= k
	}
	buf := make([]uint64, len(keys))
	src, dst := keys, buf
	const bitsPer = 11
	for shift := uint(0); shift < 64 && top>>shift != 0; shift += bitsPer {
		var count [1 << bitsPer]int
		for _, k := range src {
			count[(k>>shift)&(1<<bitsPer-1)]++
		}
		sum := 0
		for i, c := range count {
			count[i] = sum
			sum += c
		}
		for _, k := range src {
			d := (k >> shift) & (1<<bitsPer - 1)
			dst[count[d]] = k
			count[d]++
		}
		src, dst = dst, src
	}
	if &src[0] != &keys[0] {
		copy(keys, src)
	}
}
