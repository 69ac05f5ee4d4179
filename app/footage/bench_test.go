package footage

import (
	"testing"
)

// BenchmarkFit fits 48 marks with orientation (two seconds at 24 fps).
func BenchmarkFit(b *testing.B) {
	marks := turnMarks(frameRange(0, 47, 1), func(n float64) float64 { return 30 * n })
	opt := FitOptions{FPS: 24, Gravity: 9.80665}
	for b.Loop() {
		if _, err := Fit(marks, opt); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkFrame_Cached is a cache hit, what playback costs once frames
// are decoded.
func BenchmarkFrame_Cached(b *testing.B) {
	s, err := Open(indexFolder(b, 4, 640, 360), Options{})
	if err != nil {
		b.Fatal(err)
	}
	s.Frame(1)
	for b.Loop() {
		if _, err := s.Frame(1); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkFrame_Decode decodes a 640 x 360 PNG frame each time (the cache
// holds one frame, and frames 1 and 2 take turns).
func BenchmarkFrame_Decode(b *testing.B) {
	s, err := Open(indexFolder(b, 4, 640, 360), Options{CacheBytes: 4 * 640 * 360})
	if err != nil {
		b.Fatal(err)
	}
	i := 0
	for b.Loop() {
		if _, err := s.Frame(1 + i%2); err != nil {
			b.Fatal(err)
		}
		i++
	}
}

// BenchmarkGIF_Forward plays the 8 x 6 test GIF in a loop with room for
// two composites in the cache, so that each frame is composited from the
// one before it (and frame 3, after a "previous" disposal, from frame 1).
func BenchmarkGIF_Forward(b *testing.B) {
	path := b.TempDir() + "/clip.gif"
	writeTestGIF(b, path)
	s, err := Open(path, Options{CacheBytes: 686 + 2*8*6*4}) // one composite's making, two kept
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		for i := range s.Len() {
			s.Frame(i)
		}
	}
}
