package footage

import (
	"container/list"
	"fmt"
	"image"
	"strconv"
	"strings"
	"sync"
)

// frameCache keeps decoded frames, least recently used first out. It is a
// budget for decoding too, not only for keeping: before a frame is decoded
// its cost (the bytes the decoder will allocate, from the declared size) is
// reserved, evicting older frames or waiting for other decodes to finish,
// so that the cached frames plus the decodes in flight never need more
// than capBytes. A frame whose cost is over the whole cap is refused
// (Open refuses such footage first). Concurrent requests for a frame that
// is being decoded wait for that decode instead of starting another.
// Errors are not cached: a frame that failed is tried again next time (the
// file may have been fixed).
type frameCache struct {
	mu       sync.Mutex
	room     *sync.Cond // signalled when a reservation is released
	capBytes int64
	used     int64      // bytes of the cached frames (imageBytes)
	reserved int64      // bytes reserved by decodes in flight
	order    *list.List // front: most recently used; values *cacheEntry
	entries  map[int]*list.Element
	pending  map[int]*pendingLoad
	loads    int // number of load calls made, for tests
}

type cacheEntry struct {
	index int
	img   image.Image
	bytes int64
}

type pendingLoad struct {
	done chan struct{}
	img  image.Image
	err  error
}

func newFrameCache(capBytes int64) *frameCache {
	c := &frameCache{capBytes: capBytes, order: list.New(), entries: map[int]*list.Element{}, pending: map[int]*pendingLoad{}}
	c.room = sync.NewCond(&c.mu)
	return c
}

// errOverCap is returned by get for a decode whose cost is over the cap.
type errOverCap struct{ cost, cap int64 }

func (e *errOverCap) Error() string {
	return fmt.Sprintf("decoding it needs %s, more than the footage memory cap (%s)", mib(e.cost), mib(e.cap))
}

// mib formats a byte count in MiB, "12.5 MiB", or in bytes below 1 MiB.
func mib(n int64) string {
	if n < 1<<20 {
		return strconv.FormatInt(n, 10) + " bytes"
	}
	return strings.TrimSuffix(strings.TrimRight(fmt.Sprintf("%.1f", float64(n)/(1<<20)), "0"), ".") + " MiB"
}

// get returns frame i from the cache, or calls load once to make it after
// reserving cost bytes for the decode.
func (c *frameCache) get(i int, cost int64, load func() (image.Image, error)) (image.Image, error) {
	if cost > c.capBytes {
		return nil, &errOverCap{cost, c.capBytes}
	}
	c.mu.Lock()
	if el, ok := c.entries[i]; ok {
		c.order.MoveToFront(el)
		img := el.Value.(*cacheEntry).img
		c.mu.Unlock()
		return img, nil
	}
	if p, ok := c.pending[i]; ok {
		c.mu.Unlock()
		<-p.done
		return p.img, p.err
	}
	p := &pendingLoad{done: make(chan struct{})}
	c.pending[i] = p
	c.loads++
	// Reserve the decode's cost: evict the least recently used frames, and
	// wait for other decodes while even that leaves too little room.
	for c.used+c.reserved+cost > c.capBytes {
		if !c.evictOne() {
			c.room.Wait()
		}
	}
	c.reserved += cost
	c.mu.Unlock()

	p.img, p.err = safeLoad(load)

	c.mu.Lock()
	c.reserved -= cost
	delete(c.pending, i)
	if p.err == nil {
		c.put(i, p.img)
	}
	c.room.Broadcast()
	c.mu.Unlock()
	close(p.done)
	return p.img, p.err
}

// evictOne drops the least recently used frame; false when none is cached.
// c.mu must be held.
func (c *frameCache) evictOne() bool {
	back := c.order.Back()
	if back == nil {
		return false
	}
	e := back.Value.(*cacheEntry)
	c.order.Remove(back)
	delete(c.entries, e.index)
	c.used -= e.bytes
	return true
}

// safeLoad calls load, turning a panic into an error so that waiting
// callers are always released.
func safeLoad(load func() (image.Image, error)) (img image.Image, err error) {
	defer func() {
		if p := recover(); p != nil {
			img, err = nil, fmt.Errorf("footage: decoding failed: %v", p)
		}
	}()
	return load()
}

// put stores img as frame i, evicting the least recently used frames
// until it fits beside the decodes in flight; a frame that cannot fit is
// not kept. c.mu must be held.
func (c *frameCache) put(i int, img image.Image) {
	n := imageBytes(img)
	if n+c.reserved > c.capBytes {
		return
	}
	if el, ok := c.entries[i]; ok { // cannot happen while pending guards i; kept for safety
		c.used -= el.Value.(*cacheEntry).bytes
		c.order.Remove(el)
		delete(c.entries, i)
	}
	for c.used+c.reserved+n > c.capBytes && c.evictOne() {
	}
	c.entries[i] = c.order.PushFront(&cacheEntry{index: i, img: img, bytes: n})
	c.used += n
}

// peek returns frame i if it is cached, without making it more recent.
func (c *frameCache) peek(i int) (image.Image, bool) {
	c.mu.Lock()
	defer c.mu.Unlock()
	if el, ok := c.entries[i]; ok {
		return el.Value.(*cacheEntry).img, true
	}
	return nil, false
}

// stats returns the number of cached frames and their bytes.
func (c *frameCache) stats() (frames int, bytes int64) {
	c.mu.Lock()
	defer c.mu.Unlock()
	return len(c.entries), c.used
}

// imageBytes returns the size of an image's pixel buffers in bytes: the
// memory the cache accounts for. Types it does not know count 8 bytes a
// pixel, the most any standard image type uses.
func imageBytes(img image.Image) int64 {
	switch m := img.(type) {
	case *image.RGBA:
		return int64(len(m.Pix))
	case *image.NRGBA:
		return int64(len(m.Pix))
	case *image.RGBA64:
		return int64(len(m.Pix))
	case *image.NRGBA64:
		return int64(len(m.Pix))
	case *image.Gray:
		return int64(len(m.Pix))
	case *image.Gray16:
		return int64(len(m.Pix))
	case *image.Alpha:
		return int64(len(m.Pix))
	case *image.Alpha16:
		return int64(len(m.Pix))
	case *image.CMYK:
		return int64(len(m.Pix))
	case *image.Paletted:
		return int64(len(m.Pix)) + 4*int64(len(m.Palette))
	case *image.YCbCr:
		return int64(len(m.Y) + len(m.Cb) + len(m.Cr))
	case *image.NYCbCrA:
		return int64(len(m.Y) + len(m.Cb) + len(m.Cr) + len(m.A))
	}
	b := img.Bounds()
	return 8 * int64(b.Dx()) * int64(b.Dy())
}
