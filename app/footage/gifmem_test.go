package footage

import (
	"bytes"
	"errors"
	"image"
	"image/draw"
	"image/gif"
	"os"
	"path/filepath"
	"testing"
)

// TestGIF_LongClipCheckpoints: in a 100,000-frame GIF, once the clip has
// been played through, any frame is composited from a checkpoint or a
// cached composite with at most ckEvery frames drawn, not from the start.
func TestGIF_LongClipCheckpoints(t *testing.T) {
	m := image.NewPaletted(image.Rect(0, 0, 2, 2), memPalette)
	m.Pix[0], m.Pix[3] = 1, 2
	path := filepath.Join(t.TempDir(), "long.gif")
	os.WriteFile(path, gifRepeat(t, m, 100_000), 0o644)
	s, err := Open(path, Options{CacheBytes: 8 << 20}) // room for checkpoints every few frames
	if err != nil {
		t.Fatal(err)
	}
	g := s.gif
	if _, err := s.Frame(99_999); err != nil {
		t.Fatal(err)
	}
	if d := g.decodes.Load(); d != 100_000 {
		t.Errorf("first composite of the last frame decoded %d frames, want 100000", d)
	}
	for _, i := range []int{50_000, 12_345, 99_998, 3, 77_777, 50_001} {
		before := g.decodes.Load()
		if _, err := s.Frame(i); err != nil {
			t.Fatal(err)
		}
		if d := g.decodes.Load() - before; d > int64(g.ckEvery)+1 {
			t.Errorf("frame %d decoded %d frames, want at most %d (checkpoint interval %d)", i, d, g.ckEvery+1, g.ckEvery)
		}
	}
	if g.ckEvery < 2 {
		t.Errorf("checkpoint every %d frames: the cap should not hold one a frame", g.ckEvery)
	}
	t.Logf("checkpoint every %d frames, %d kept", g.ckEvery, len(g.ck))
}

// referenceComposite is the slow, obvious oracle for composite: the whole
// GIF decoded by image/gif.DecodeAll and drawn frame after frame with
// image/draw, disposals as in composite's doc.
func referenceComposite(g *gif.GIF, i int) *image.RGBA {
	screen := image.Rect(0, 0, g.Config.Width, g.Config.Height)
	canvas := image.NewRGBA(screen)
	for k := 0; k <= i; k++ {
		f := g.Image[k]
		var saved *image.RGBA
		if k < len(g.Disposal) && g.Disposal[k] == gif.DisposalPrevious {
			saved = image.NewRGBA(f.Rect.Intersect(screen))
			draw.Draw(saved, saved.Rect, canvas, saved.Rect.Min, draw.Src)
		}
		draw.Draw(canvas, f.Rect, f, f.Rect.Min, draw.Over)
		if k == i {
			break
		}
		switch {
		case k < len(g.Disposal) && g.Disposal[k] == gif.DisposalBackground:
			draw.Draw(canvas, f.Rect, image.Transparent, image.Point{}, draw.Src)
		case saved != nil:
			draw.Draw(canvas, saved.Rect, saved, saved.Rect.Min, draw.Src)
		}
	}
	return canvas
}

// FuzzOpenGIF: Open never panics on any bytes; every refusal is an *Error
// naming the file; and when image/gif decodes the whole file too, every
// frame Open shows equals the reference composite, in a scrambled order
// through a small cache with checkpoints.
func FuzzOpenGIF(f *testing.F) {
	dir := f.TempDir()
	good := filepath.Join(dir, "clip.gif")
	writeTestGIF(f, good)
	data, _ := os.ReadFile(good)
	f.Add(data)
	f.Add(data[:len(data)-12])
	f.Add([]byte("GIF89a\x60\xea\x60\xea\x00\x00\x00\x3b"))
	m := image.NewPaletted(image.Rect(0, 0, 2, 2), memPalette)
	m.Pix[1] = 2
	f.Add(gifRepeat(f, m, 9))
	f.Fuzz(func(t *testing.T, data []byte) {
		path := filepath.Join(t.TempDir(), "fuzz.gif")
		if err := os.WriteFile(path, data, 0o644); err != nil {
			t.Fatal(err)
		}
		s, err := Open(path, Options{CacheBytes: 1 << 20, MaxPixels: 1 << 16})
		if err != nil {
			var fe *Error
			if !errors.As(err, &fe) || fe.File != path {
				t.Fatalf("error %v (%T) is not an *Error naming the file", err, err)
			}
			return
		}
		ref, refErr := gif.DecodeAll(bytes.NewReader(data))
		n := s.Len()
		for j := range 2 * n {
			i := (j * 7) % n
			img, err := s.Frame(i)
			if err != nil {
				if refErr == nil {
					t.Fatalf("frame %d: %v, but image/gif decodes the file", i, err)
				}
				continue
			}
			if refErr != nil || len(ref.Image) != n {
				continue
			}
			want := referenceComposite(ref, i)
			if !bytes.Equal(img.(*image.RGBA).Pix, want.Pix) {
				t.Fatalf("frame %d differs from the reference composite", i)
			}
		}
	})
}

// BenchmarkGIF_LongClipRandomFrame shows random frames of a played-through
// 100,000-frame GIF through a cache too small to keep them: each is made
// from its checkpoint.
func BenchmarkGIF_LongClipRandomFrame(b *testing.B) {
	m := image.NewPaletted(image.Rect(0, 0, 2, 2), memPalette)
	m.Pix[0], m.Pix[3] = 1, 2
	path := filepath.Join(b.TempDir(), "long.gif")
	os.WriteFile(path, gifRepeat(b, m, 100_000), 0o644)
	s, err := Open(path, Options{CacheBytes: 8 << 20})
	if err != nil {
		b.Fatal(err)
	}
	s.Frame(99_999)
	i := 0
	for b.Loop() {
		i = (i*7919 + 13) % 100_000
		if _, err := s.Frame(i); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkGIF_HugeFrame composites one 2000 x 2000 frame over the one
// before it (forward playback).
func BenchmarkGIF_HugeFrame(b *testing.B) {
	m := image.NewPaletted(image.Rect(0, 0, 2000, 2000), memPalette)
	for i := range m.Pix {
		m.Pix[i] = uint8(1 + i%2)
	}
	path := filepath.Join(b.TempDir(), "huge.gif")
	os.WriteFile(path, gifRepeat(b, m, 64), 0o644)
	s, err := Open(path, Options{CacheBytes: 96 << 20})
	if err != nil {
		b.Fatal(err)
	}
	i := 0
	for b.Loop() {
		if _, err := s.Frame(i % 64); err != nil {
			b.Fatal(err)
		}
		i++
	}
}
