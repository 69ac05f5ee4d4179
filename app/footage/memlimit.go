package footage

import (
	"math"
	"runtime/debug"
	"runtime/metrics"
	"sync"
)

// The cache keeps the footage's live memory within Options.CacheBytes, but
// a garbage-collected process also holds the frames it decoded and
// evicted until the collector runs: with the default GOGC the heap may
// grow to twice what is live before it does. So Open also sets a soft
// memory limit for the whole process (debug.SetMemoryLimit; the Go
// runtime's documentation, "A Guide to the Go Garbage Collector"): the Go
// memory in use when the footage opens, plus its cap, plus
// memoryHeadroom for the rest of the program. The collector then works
// harder as the process nears that, and returns freed memory to the
// operating system. A limit set by the user (GOMEMLIMIT) or by the program
// before is kept; a later Open only raises the limit it set itself.
//
// The limit is soft: live memory beyond it is still allowed (the window's
// other work, a second footage), at the price of more collection.

// memoryHeadroom is the part of the limit left for everything but the
// footage: an eighth of its cap (64 MiB for the default), at least 8 MiB.
func memoryHeadroom(capBytes int64) int64 { return max(capBytes/8, 8<<20) }

var memLimit struct {
	sync.Mutex
	ours int64 // the limit Open set, 0 if none
}

// limitProcessMemory sets the process's soft memory limit for footage of
// capBytes, as described above, and returns the limit in force.
func limitProcessMemory(capBytes int64) int64 {
	memLimit.Lock()
	defer memLimit.Unlock()
	cur := debug.SetMemoryLimit(-1)
	if cur != math.MaxInt64 && cur != memLimit.ours {
		return cur // the user's or the program's own
	}
	s := []metrics.Sample{{Name: "/memory/classes/total:bytes"}, {Name: "/memory/classes/heap/released:bytes"}}
	metrics.Read(s)
	var inUse int64
	if s[0].Value.Kind() == metrics.KindUint64 && s[1].Value.Kind() == metrics.KindUint64 {
		inUse = int64(min(s[0].Value.Uint64()-min(s[1].Value.Uint64(), s[0].Value.Uint64()), math.MaxInt64/4))
	}
	want := inUse + capBytes + memoryHeadroom(capBytes)
	if cur == math.MaxInt64 || want > cur {
		debug.SetMemoryLimit(want)
		memLimit.ours = want
		return want
	}
	return cur
}
