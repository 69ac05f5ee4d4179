package footage

import (
	"image"
	"math/rand/v2"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"testing"
)

// indexFolder writes n indexFrame PNGs of w x h into a new folder.
func indexFolder(t testing.TB, n, w, h int) string {
	dir := t.TempDir()
	for i := range n {
		writePNG(t, filepath.Join(dir, "f"+strconv.Itoa(i)+".png"), indexFrame(w, h, i))
	}
	return dir
}

// TestCache_Cap decodes more frames than fit and checks that the cached
// bytes never exceed the cap, that the least recently used frame goes
// first, and that a frame larger than the cap is returned but not kept.
func TestCache_Cap(t *testing.T) {
	const w, h = 32, 24
	frameBytes := int64(4 * w * h) // an opaque PNG decodes to *image.RGBA
	dir := indexFolder(t, 10, w, h)
	capBytes := 2*frameBytes + frameBytes/2 // room for two frames
	s, err := Open(dir, Options{CacheBytes: capBytes})
	if err != nil {
		t.Fatal(err)
	}
	img, err := s.Frame(0)
	if err != nil {
		t.Fatal(err)
	}
	if got := imageBytes(img); got != frameBytes {
		t.Fatalf("a frame counts %d bytes, want %d (%T)", got, frameBytes, img)
	}
	for sweep := range 2 {
		for i := range 10 {
			img, err := s.Frame(i)
			if err != nil || frameIndex(img) != i {
				t.Fatalf("Frame(%d): %v, index %d", i, err, frameIndex(img))
			}
			if n, b := s.cache.stats(); b > capBytes || n > 2 {
				t.Fatalf("sweep %d frame %d: %d frames, %d bytes cached; cap %d bytes", sweep, i, n, b, capBytes)
			}
		}
	}
	// Frame 0 was cached before the first sweep; after that, a sweep
	// through more frames than fit misses every time: 1 + 9 + 10 loads.
	if s.cache.loads != 20 {
		t.Errorf("%d loads, want 20", s.cache.loads)
	}

	// LRU: with 8 and 9 cached, use 8, then load 3: 9 goes, 8 stays.
	before := s.cache.loads
	s.Frame(8)
	s.Frame(3)
	s.Frame(8)
	if got := s.cache.loads - before; got != 1 {
		t.Errorf("%d loads for 8 (cached), 3 (new), 8 (kept); want 1", got)
	}
	if _, ok := s.cache.peek(9); ok {
		t.Error("frame 9 was the least recently used and should have been evicted")
	}

	// A frame that needs more than the cap to decode is refused by Open,
	// naming the file (the cap holds for decoding too).
	if _, err := Open(dir, Options{CacheBytes: frameBytes / 2}); err == nil || !strings.Contains(err.Error(), "f0.png: decoding it needs 3072 bytes, more than the footage memory cap (1536 bytes)") {
		t.Errorf("a cap smaller than one frame: %v", err)
	}
}

// TestCache_Concurrent calls Frame from several goroutines on a folder and
// a GIF, with a cap smaller than the footage (run with -race).
func TestCache_Concurrent(t *testing.T) {
	const w, h = 24, 16
	dir := indexFolder(t, 12, w, h)
	capBytes := int64(4 * 4 * w * h) // four frames
	s, err := Open(dir, Options{CacheBytes: capBytes})
	if err != nil {
		t.Fatal(err)
	}
	gifPath := filepath.Join(t.TempDir(), "clip.gif")
	writeTestGIF(t, gifPath)
	g, err := Open(gifPath, Options{CacheBytes: 2048}) // a few composites beside the file
	if err != nil {
		t.Fatal(err)
	}
	var wg sync.WaitGroup
	errs := make(chan string, 16)
	for k := range 8 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			rng := rand.New(rand.NewPCG(uint64(k), 1))
			for range 150 {
				i := rng.IntN(s.Len())
				img, err := s.Frame(i)
				if err != nil || frameIndex(img) != i {
					errs <- "folder frame " + strconv.Itoa(i)
					return
				}
				if _, b := s.cache.stats(); b > capBytes {
					errs <- "cache over its cap"
					return
				}
				j := rng.IntN(g.Len())
				gi, err := g.Frame(j)
				if err != nil {
					errs <- err.Error()
					return
				}
				for y := range 6 {
					for x := range 8 {
						if gi.(*image.RGBA).RGBAAt(x, y) != gifWant(j, x, y) {
							errs <- "gif frame " + strconv.Itoa(j)
							return
						}
					}
				}
			}
		}()
	}
	wg.Wait()
	close(errs)
	for e := range errs {
		t.Error(e)
	}
}

// TestCache_OneLoadPerFrame checks that callers asking for a frame while it
// is being decoded wait for that decode instead of decoding it again.
func TestCache_OneLoadPerFrame(t *testing.T) {
	c := newFrameCache(1 << 20)
	started, release := make(chan struct{}), make(chan struct{})
	want := image.NewRGBA(image.Rect(0, 0, 2, 2))
	var wg sync.WaitGroup
	wg.Add(1)
	go func() {
		defer wg.Done()
		c.get(5, 1, func() (image.Image, error) {
			close(started)
			<-release
			return want, nil
		})
	}()
	<-started
	results := make(chan image.Image, 4)
	for range 4 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			img, _ := c.get(5, 1, func() (image.Image, error) {
				t.Error("a second decode of frame 5 started")
				return nil, nil
			})
			results <- img
		}()
	}
	close(release)
	wg.Wait()
	close(results)
	for img := range results {
		if img != image.Image(want) {
			t.Error("a waiting caller got a different image")
		}
	}
	if c.loads != 1 {
		t.Errorf("%d loads, want 1", c.loads)
	}
	// A panicking load is an error, and the frame can be tried again.
	if _, err := c.get(6, 1, func() (image.Image, error) { panic("boom") }); err == nil {
		t.Error("a panicking load gave no error")
	}
	if img, err := c.get(6, 1, func() (image.Image, error) { return want, nil }); err != nil || img != image.Image(want) {
		t.Errorf("retry after a panic: %v", err)
	}
}
