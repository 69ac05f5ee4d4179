package footage

import (
	"container/list"
	"fmt"
	"image"
	"sync"
)

// frameCache keeps decoded frames, least recently used first out, with
// the total of their pixel buffers (imageBytes) never above capBytes. A
// frame bigger than the whole cap is returned but not kept. Concurrent
// requests for a frame that is being decoded wait for that decode instead
// of starting another. Errors are not cached: a frame that failed is tried
// again next time (the file may have been fixed).
type frameCache struct {
	mu       sync.Mutex
	capBytes int64
	used     int64
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
	return &frameCache{capBytes: capBytes, order: list.New(), entries: map[int]*list.Element{}, pending: map[int]*pendingLoad{}}
}

// get returns frame i from the cache, or calls load once to make it.
func (c *frameCache) get(i int, load func() (image.Image, error)) (image.Image, error) {
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
	c.mu.Unlock()

	p.img, p.err = safeLoad(load)

	c.mu.Lock()
	delete(c.pending, i)
	if p.err == nil {
		c.put(i, p.img)
	}
	c.mu.Unlock()
	close(p.done)
	return p.img, p.err
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
// until it fits. c.mu must be held.
func (c *frameCache) put(i int, img image.Image) {
	n := imageBytes(img)
	if n > c.capBytes {
		return
	}
	if el, ok := c.entries[i]; ok { // cannot happen while pending guards i; kept for safety
		c.used -= el.Value.(*cacheEntry).bytes
		c.order.Remove(el)
		delete(c.entries, i)
	}
	for c.used+n > c.capBytes {
		back := c.order.Back()
		e := back.Value.(*cacheEntry)
		c.order.Remove(back)
		delete(c.entries, e.index)
		c.used -= e.bytes
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
