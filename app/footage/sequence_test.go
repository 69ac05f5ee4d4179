package footage

import (
	"bytes"
	"encoding/binary"
	"errors"
	"hash/crc32"
	"image"
	"image/color"
	"image/gif"
	"image/jpeg"
	"image/png"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"propflight/physics"
)

// indexFrame returns an opaque w x h frame whose pixel (0, 0) encodes i
// (red i, green 255 - i) over a seeded noise pattern, so that frames are
// told apart and do not compress to nothing.
func indexFrame(w, h, i int) *image.RGBA {
	rng := rand.New(rand.NewPCG(uint64(i), 7))
	m := image.NewRGBA(image.Rect(0, 0, w, h))
	for k := 0; k < len(m.Pix); k += 4 {
		m.Pix[k], m.Pix[k+1], m.Pix[k+2], m.Pix[k+3] = uint8(rng.IntN(256)), uint8(rng.IntN(256)), uint8(rng.IntN(256)), 255
	}
	m.SetRGBA(0, 0, color.RGBA{uint8(i), uint8(255 - i), 9, 255})
	return m
}

func writePNG(t testing.TB, path string, img image.Image) {
	t.Helper()
	var buf bytes.Buffer
	if err := png.Encode(&buf, img); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
}

// frameIndex reads the index indexFrame put into pixel (0, 0).
func frameIndex(img image.Image) int {
	r, g, _, _ := img.At(img.Bounds().Min.X, img.Bounds().Min.Y).RGBA()
	if r>>8+g>>8 != 255 {
		return -1
	}
	return int(r >> 8)
}

func TestNaturalCompare(t *testing.T) {
	sorted := []string{"frame1.png", "frame2.png", "frame10.png", "frame010a.png", "frame11.png", "Frame12.png", "frame100.png", "x.png"}
	got := slices.Clone(sorted)
	rand.New(rand.NewPCG(1, 1)).Shuffle(len(got), func(i, j int) { got[i], got[j] = got[j], got[i] })
	slices.SortFunc(got, naturalCompare)
	if !slices.Equal(got, sorted) {
		t.Errorf("natural order %v, want %v", got, sorted)
	}
	tests := []struct {
		a, b string
		want int
	}{
		{"frame2", "frame10", -1},
		{"a1b2", "a1b10", -1},
		{"take2_frame9", "take10_frame1", -1},
		{"frame01", "frame1", -1}, // equal numbers: byte order decides, '0' < '1'
		{"frame1", "frame01", 1},
		{"frame", "frame1", -1},
		{"same", "same", 0},
		{"b", "A", 1}, // case-insensitive first
	}
	for _, tc := range tests {
		if got := naturalCompare(tc.a, tc.b); got != tc.want {
			t.Errorf("naturalCompare(%q, %q) = %d, want %d", tc.a, tc.b, got, tc.want)
		}
	}
}

// TestOpen_Folder loads unpadded numbered PNGs and a JPEG among other
// files, and checks the order, sizes, names, times and decoded pixels.
//
// Long: one folder holding every kind of file a folder of frames meets
// (numbered PNGs, a JPEG, junk files), checked in one pass.
func TestOpen_Folder(t *testing.T) {
	dir := t.TempDir()
	const w, h = 16, 12
	for _, i := range []int{1, 2, 10, 11} {
		writePNG(t, filepath.Join(dir, "shot_"+strconv.Itoa(i)+".png"), indexFrame(w, h, i))
	}
	var jb bytes.Buffer
	if err := jpeg.Encode(&jb, indexFrame(w, h, 3), &jpeg.Options{Quality: 90}); err != nil {
		t.Fatal(err)
	}
	os.WriteFile(filepath.Join(dir, "shot_3.JPG"), jb.Bytes(), 0o644)
	os.WriteFile(filepath.Join(dir, "notes.txt"), []byte("not a frame"), 0o644)
	os.WriteFile(filepath.Join(dir, "._shot_0.png"), []byte("resource fork junk"), 0o644)
	os.Mkdir(filepath.Join(dir, "sub.png"), 0o755)

	s, err := Open(dir, Options{})
	if err != nil {
		t.Fatal(err)
	}
	wantNames := []string{"shot_1.png", "shot_2.png", "shot_3.JPG", "shot_10.png", "shot_11.png"}
	if s.Len() != len(wantNames) {
		t.Fatalf("Len = %d, want %d", s.Len(), len(wantNames))
	}
	for i, n := range wantNames {
		if s.Name(i) != n {
			t.Errorf("Name(%d) = %q, want %q", i, s.Name(i), n)
		}
	}
	if gw, gh := s.Size(); gw != w || gh != h {
		t.Errorf("Size = %dx%d, want %dx%d", gw, gh, w, h)
	}
	if s.FPS() != (physics.Rate{Num: 24, Den: 1}) {
		t.Errorf("FPS = %v, want the default 24", s.FPS())
	}
	for i, want := range []int{1, 2, -2, 10, 11} {
		img, err := s.Frame(i)
		if err != nil {
			t.Fatalf("Frame(%d): %v", i, err)
		}
		if want == -2 { // the JPEG: lossy, so compare loosely
			if _, ok := img.(*image.YCbCr); !ok {
				t.Errorf("JPEG frame decoded as %T", img)
			}
			continue
		}
		if !bytes.Equal(img.(*image.RGBA).Pix, indexFrame(w, h, want).Pix) {
			t.Errorf("Frame(%d) pixels differ from the file written as frame %d", i, want)
		}
	}
	if s.Name(-1) != "" || s.Name(5) != "" {
		t.Error("Name out of range should be empty")
	}
	if _, err := s.Frame(5); err == nil || !strings.Contains(err.Error(), "outside the footage") {
		t.Errorf("Frame(5) = %v, want an out-of-range error", err)
	}

	// Times and the take-time mapping at 24000/1001 fps.
	s, err = Open(dir, Options{FPS: physics.Rate{Num: 24000, Den: 1001}})
	if err != nil {
		t.Fatal(err)
	}
	checkRel(t, "TimeOf(3)", s.TimeOf(3), 3*1001.0/24000, closeTol)
	frameAt := []struct {
		t      float64
		offset int
		want   int
		ok     bool
	}{
		{0, 0, 0, true},
		{s.TimeOf(2), 0, 2, true},        // exactly a frame time: that frame
		{s.TimeOf(2) - 1e-6, 0, 1, true}, // just before: the previous frame is still showing
		{1.0 / 24, 1, 1, true},           // the take's frame 1 at 24 fps is still inside footage frame 0, plus the offset 1
		{0, 4, 4, true},                  // the release is footage frame 4
		{0, 5, 0, false},                 // past the end
		{-s.TimeOf(1), 0, 0, false},      // before the clip
		{-s.TimeOf(1), 2, 1, true},       // before the release, still in the clip
		{1e300, 0, 0, false},             // absurd times are outside, not overflow
	}
	for _, tc := range frameAt {
		got, ok := s.FrameAt(tc.t, tc.offset)
		if got != tc.want || ok != tc.ok {
			t.Errorf("FrameAt(%g, %d) = %d, %v; want %d, %v", tc.t, tc.offset, got, ok, tc.want, tc.ok)
		}
	}
	if _, ok := s.FrameAt(math.NaN(), 0); ok {
		t.Error("FrameAt(NaN) should be outside")
	}
}

// pngHeaderOnly returns a PNG signature, an IHDR chunk declaring w x h
// 8-bit RGBA with a correct CRC (PNG specification, 2nd ed., §5.3 chunk
// layout and §11.2.2 IHDR), and IEND: a header that DecodeConfig accepts
// and that has no pixels at all.
func pngHeaderOnly(w, h uint32) []byte {
	var b bytes.Buffer
	b.WriteString("\x89PNG\r\n\x1a\n")
	chunk := func(typ string, data []byte) {
		var n [4]byte
		binary.BigEndian.PutUint32(n[:], uint32(len(data)))
		b.Write(n[:])
		td := append([]byte(typ), data...)
		b.Write(td)
		binary.BigEndian.PutUint32(n[:], crc32.ChecksumIEEE(td))
		b.Write(n[:])
	}
	ihdr := make([]byte, 13)
	binary.BigEndian.PutUint32(ihdr[0:], w)
	binary.BigEndian.PutUint32(ihdr[4:], h)
	ihdr[8], ihdr[9] = 8, 6 // bit depth 8, colour type 6 (RGBA); compression, filter, interlace 0
	chunk("IHDR", ihdr)
	chunk("IEND", nil)
	return b.Bytes()
}

func TestOpen_BadFootage(t *testing.T) {
	t.Run("empty folder", func(t *testing.T) {
		dir := t.TempDir()
		_, err := Open(dir, Options{})
		if err == nil || !strings.Contains(err.Error(), "the folder is empty") || !strings.Contains(err.Error(), dir) {
			t.Errorf("err = %v", err)
		}
	})
	t.Run("no image files", func(t *testing.T) {
		dir := t.TempDir()
		os.WriteFile(filepath.Join(dir, "readme.txt"), []byte("x"), 0o644)
		os.WriteFile(filepath.Join(dir, "clip.gif"), []byte("GIF89a"), 0o644)
		_, err := Open(dir, Options{})
		if err == nil || !strings.Contains(err.Error(), "no PNG or JPEG frames") {
			t.Errorf("err = %v", err)
		}
	})
	t.Run("missing path", func(t *testing.T) {
		p := filepath.Join(t.TempDir(), "nope")
		_, err := Open(p, Options{})
		if err == nil || !errors.Is(err, os.ErrNotExist) || !strings.Contains(err.Error(), p) {
			t.Errorf("err = %v", err)
		}
	})
	t.Run("plain file", func(t *testing.T) {
		p := filepath.Join(t.TempDir(), "one.png")
		writePNG(t, p, indexFrame(4, 4, 0))
		_, err := Open(p, Options{})
		if err == nil || !strings.Contains(err.Error(), "not a folder") {
			t.Errorf("err = %v", err)
		}
	})
	t.Run("huge header", func(t *testing.T) {
		dir := t.TempDir()
		writePNG(t, filepath.Join(dir, "f1.png"), indexFrame(4, 4, 1))
		bomb := filepath.Join(dir, "f2.png")
		os.WriteFile(bomb, pngHeaderOnly(50000, 50000), 0o644)
		// The header alone is valid: DecodeConfig reads the size from it.
		cfg, err := png.DecodeConfig(bytes.NewReader(pngHeaderOnly(50000, 50000)))
		if err != nil || cfg.Width != 50000 || cfg.Height != 50000 {
			t.Fatalf("crafted header: %+v, %v", cfg, err)
		}
		_, err = Open(dir, Options{})
		if err == nil || !strings.Contains(err.Error(), bomb) || !strings.Contains(err.Error(), "50000x50000") ||
			!strings.Contains(err.Error(), "the limit is 40 megapixels") {
			t.Errorf("err = %v", err)
		}
		// A lower limit refuses smaller frames too.
		os.Remove(bomb)
		writePNG(t, filepath.Join(dir, "f2.png"), indexFrame(4, 4, 2))
		if _, err := Open(dir, Options{MaxPixels: 15}); err == nil || !strings.Contains(err.Error(), "f1.png: declares 4x4") {
			t.Errorf("MaxPixels 15: %v", err)
		}
	})
	t.Run("mixed sizes", func(t *testing.T) {
		dir := t.TempDir()
		writePNG(t, filepath.Join(dir, "f1.png"), indexFrame(4, 4, 1))
		writePNG(t, filepath.Join(dir, "f2.png"), indexFrame(4, 4, 2))
		writePNG(t, filepath.Join(dir, "f10.png"), indexFrame(5, 4, 10))
		writePNG(t, filepath.Join(dir, "f11.png"), indexFrame(6, 6, 11))
		_, err := Open(dir, Options{})
		want := filepath.Join(dir, "f10.png") + ": is 5x4 pixels but f1.png is 4x4"
		if err == nil || !strings.HasPrefix(err.Error(), want) {
			t.Errorf("err = %v, want it to start %q", err, want)
		}
	})
	t.Run("unreadable header", func(t *testing.T) {
		dir := t.TempDir()
		os.WriteFile(filepath.Join(dir, "f1.png"), []byte("definitely not a png"), 0o644)
		_, err := Open(dir, Options{})
		if err == nil || !strings.Contains(err.Error(), "f1.png: cannot read the image header") {
			t.Errorf("err = %v", err)
		}
	})
	t.Run("bad fps", func(t *testing.T) {
		if _, err := Open(t.TempDir(), Options{FPS: physics.Rate{Num: -1, Den: 1}}); err == nil || !strings.HasPrefix(err.Error(), "fps:") {
			t.Errorf("err = %v", err)
		}
	})
}

// TestFrame_Corrupt checks that a damaged frame gives an error naming its
// file from Frame while the other frames still load.
func TestFrame_Corrupt(t *testing.T) {
	dir := t.TempDir()
	for i := range 4 {
		writePNG(t, filepath.Join(dir, "f"+strconv.Itoa(i)+".png"), indexFrame(32, 32, i))
	}
	// f1: truncated to half; f2: a byte flipped inside the pixel data (CRC
	// mismatch); f3: a JPEG cut short.
	b, _ := os.ReadFile(filepath.Join(dir, "f1.png"))
	os.WriteFile(filepath.Join(dir, "f1.png"), b[:len(b)/2], 0o644)
	b, _ = os.ReadFile(filepath.Join(dir, "f2.png"))
	b[len(b)/2] ^= 0xff
	os.WriteFile(filepath.Join(dir, "f2.png"), b, 0o644)
	var jb bytes.Buffer
	jpeg.Encode(&jb, indexFrame(32, 32, 3), nil)
	os.Remove(filepath.Join(dir, "f3.png"))
	os.WriteFile(filepath.Join(dir, "f3.jpg"), jb.Bytes()[:jb.Len()/2], 0o644)

	s, err := Open(dir, Options{})
	if err != nil {
		t.Fatalf("Open refused footage whose headers are fine: %v", err)
	}
	for round := range 2 { // errors are not cached: the second round fails the same way
		for i, want := range []string{"", "f1.png: cannot decode the PNG frame", "f2.png: cannot decode the PNG frame", "f3.jpg: cannot decode the JPEG frame"} {
			img, err := s.Frame(i)
			if want == "" {
				if err != nil || frameIndex(img) != 0 {
					t.Errorf("round %d: good frame %d: %v", round, i, err)
				}
				continue
			}
			var fe *Error
			if err == nil || !errors.As(err, &fe) || !strings.Contains(err.Error(), filepath.Join(dir, want)) {
				t.Errorf("round %d: Frame(%d) = %v, want an error containing %q", round, i, err, want)
			}
		}
	}
	// A file grown behind Open's back is refused by the header check
	// before it is decoded.
	os.WriteFile(filepath.Join(dir, "f1.png"), pngHeaderOnly(50000, 50000), 0o644)
	if _, err := s.Frame(1); err == nil || !strings.Contains(err.Error(), "50000x50000") {
		t.Errorf("replaced frame: %v", err)
	}
}

// GIF test palette: 0 transparent, 1 red, 2 green, 3 blue, 4 white.
var (
	gifPalette = color.Palette{color.RGBA{}, color.RGBA{255, 0, 0, 255}, color.RGBA{0, 255, 0, 255}, color.RGBA{0, 0, 255, 255}, color.RGBA{255, 255, 255, 255}}
	gifClear   = color.RGBA{}
	gifRed     = color.RGBA{255, 0, 0, 255}
	gifGreen   = color.RGBA{0, 255, 0, 255}
	gifBlue    = color.RGBA{0, 0, 255, 255}
	gifWhite   = color.RGBA{255, 255, 255, 255}
)

func gifFrame(r image.Rectangle, index uint8) *image.Paletted {
	m := image.NewPaletted(r, gifPalette)
	for i := range m.Pix {
		m.Pix[i] = index
	}
	return m
}

// writeTestGIF writes an 8x6 GIF whose frames differ in size and place and
// use each disposal method:
//
//	0: the whole screen red, disposal none
//	1: blue at (2,1)-(5,4) with a transparent pixel at (2,1), disposal background
//	2: green at (0,0)-(2,2), disposal previous
//	3: white at (6,4)-(8,6), disposal none
func writeTestGIF(t testing.TB, path string) {
	t.Helper()
	f1 := gifFrame(image.Rect(2, 1, 5, 4), 3)
	f1.SetColorIndex(2, 1, 0)
	g := &gif.GIF{
		Image:    []*image.Paletted{gifFrame(image.Rect(0, 0, 8, 6), 1), f1, gifFrame(image.Rect(0, 0, 2, 2), 2), gifFrame(image.Rect(6, 4, 8, 6), 4)},
		Delay:    []int{4, 4, 4, 4},
		Disposal: []byte{gif.DisposalNone, gif.DisposalBackground, gif.DisposalPrevious, gif.DisposalNone},
		Config:   image.Config{ColorModel: gifPalette, Width: 8, Height: 6},
	}
	var buf bytes.Buffer
	if err := gif.EncodeAll(&buf, g); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
}

// gifWant is the expected composite of frame i of writeTestGIF at (x, y),
// worked out by hand from the disposal rules (GIF89a §23).
func gifWant(i, x, y int) color.RGBA {
	in := func(r image.Rectangle) bool { return image.Pt(x, y).In(r) }
	blue, green, white := image.Rect(2, 1, 5, 4), image.Rect(0, 0, 2, 2), image.Rect(6, 4, 8, 6)
	switch i {
	case 0:
		return gifRed
	case 1:
		if in(blue) && !(x == 2 && y == 1) {
			return gifBlue
		}
		return gifRed
	case 2:
		switch {
		case in(green):
			return gifGreen
		case in(blue): // frame 1's rectangle was cleared after it was shown
			return gifClear
		}
		return gifRed
	default: // frame 2 put back the screen as before it (no green)
		switch {
		case in(white):
			return gifWhite
		case in(blue):
			return gifClear
		}
		return gifRed
	}
}

func TestOpen_GIF(t *testing.T) {
	path := filepath.Join(t.TempDir(), "clip.gif")
	writeTestGIF(t, path)
	for _, order := range [][]int{{0, 1, 2, 3}, {3, 2, 1, 0}, {2, 0, 3, 1, 3, 2}} {
		s, err := Open(path, Options{})
		if err != nil {
			t.Fatal(err)
		}
		if s.Len() != 4 || s.Name(2) != "clip.gif#2" || s.Path() != path {
			t.Fatalf("Len %d, Name(2) %q", s.Len(), s.Name(2))
		}
		if w, h := s.Size(); w != 8 || h != 6 {
			t.Errorf("Size = %dx%d, want the logical screen 8x6", w, h)
		}
		// Delays of 4/100 s: 25 fps.
		if s.FPS() != (physics.Rate{Num: 25, Den: 1}) {
			t.Errorf("FPS = %v, want 25 from the frame delays", s.FPS())
		}
		for _, i := range order {
			img, err := s.Frame(i)
			if err != nil {
				t.Fatal(err)
			}
			if img.Bounds() != image.Rect(0, 0, 8, 6) {
				t.Fatalf("frame %d bounds %v", i, img.Bounds())
			}
			for y := range 6 {
				for x := range 8 {
					if got := color.RGBAModel.Convert(img.At(x, y)).(color.RGBA); got != gifWant(i, x, y) {
						t.Errorf("order %v: frame %d pixel (%d,%d) = %v, want %v", order, i, x, y, got, gifWant(i, x, y))
					}
				}
			}
		}
	}
	// The footage's own rate wins over the delays.
	s, err := Open(path, Options{FPS: physics.Rate{Num: 30, Den: 1}})
	if err != nil || s.FPS() != (physics.Rate{Num: 30, Den: 1}) {
		t.Errorf("FPS option: %v, %v", s, err)
	}
}

func TestOpen_BadGIF(t *testing.T) {
	dir := t.TempDir()
	good := filepath.Join(dir, "clip.gif")
	writeTestGIF(t, good)
	data, _ := os.ReadFile(good)

	if n, px := scanGIF(data); n != 4 || px != 8*6+3*3+2*2+2*2 {
		t.Errorf("scanGIF = %d frames, %d pixels; want 4, 65", n, px)
	}

	cut := filepath.Join(dir, "cut.gif")
	os.WriteFile(cut, data[:len(data)-12], 0o644)
	if _, err := Open(cut, Options{}); err == nil || !strings.Contains(err.Error(), cut+": cannot decode the GIF") {
		t.Errorf("truncated GIF: %v", err)
	}

	// A logical screen of 60000 x 60000 in an otherwise empty GIF.
	huge := filepath.Join(dir, "huge.gif")
	os.WriteFile(huge, []byte("GIF89a\x60\xea\x60\xea\x00\x00\x00\x3b"), 0o644)
	if _, err := Open(huge, Options{}); err == nil || !strings.Contains(err.Error(), "60000x60000") {
		t.Errorf("huge GIF: %v", err)
	}

	// A GIF that cannot be shown within the memory cap: a 100 x 100
	// composite alone is 40000 bytes.
	big := filepath.Join(dir, "big.gif")
	g := &gif.GIF{Config: image.Config{ColorModel: gifPalette, Width: 100, Height: 100}}
	for i := range 4 {
		g.Image = append(g.Image, gifFrame(image.Rect(0, 0, 100, 100), uint8(1+i)))
		g.Delay = append(g.Delay, 0)
	}
	var buf bytes.Buffer
	gif.EncodeAll(&buf, g)
	os.WriteFile(big, buf.Bytes(), 0o644)
	if buf.Len() >= 20000 {
		t.Fatalf("test GIF is %d bytes; it must be smaller than the cap below", buf.Len())
	}
	if _, err := Open(big, Options{CacheBytes: 20000}); err == nil || !strings.Contains(err.Error(), "its 4 frames of 100x100 pixels need") {
		t.Errorf("GIF over the cap: %v", err)
	}
	// No positive delay: the default rate.
	if s, err := Open(big, Options{}); err != nil || s.FPS() != (physics.Rate{Num: 24, Den: 1}) {
		t.Errorf("GIF without delays: %v, %v", s, err)
	}
}

func TestDelayRate(t *testing.T) {
	tests := []struct {
		delays []int
		want   physics.Rate
	}{
		{[]int{4, 4, 4}, physics.Rate{Num: 25, Den: 1}},
		{[]int{3, 3, 3}, physics.Rate{Num: 100, Den: 3}},
		{[]int{10, 5, 5, 10}, physics.Rate{Num: 20, Den: 1}}, // tie: the shorter delay
		{[]int{0, 0, 0, 7}, physics.Rate{Num: 100, Den: 7}},
		{[]int{0, 0}, physics.Rate{}},
		{nil, physics.Rate{}},
	}
	for _, tc := range tests {
		if got := delayRate(tc.delays); got != tc.want {
			t.Errorf("delayRate(%v) = %v, want %v", tc.delays, got, tc.want)
		}
	}
}
