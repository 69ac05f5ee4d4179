package footage

import (
	"bytes"
	"fmt"
	"image"
	"image/gif"
	"io"
	"slices"
	"sync"
	"sync/atomic"

	"propflight/physics"
)

// An animated GIF is kept as its file's bytes and an index of its frames;
// a frame is decoded only when a composite needs it, one at a time, so a
// GIF costs its file size plus the frames being composited, not one byte a
// pixel for every frame at once (14 frames of 6000 x 6000 would be 504 MB
// of palette images, a million 1 x 1 frames a million image headers).
//
// Compositing is sequential (each frame is drawn over what the frames
// before it left), so the canvas as it stands before frame k is drawn is
// kept at every ckEvery-th frame as a checkpoint, within a quarter of the
// memory cap: frame i is made from the nearest checkpoint or cached
// composite before it, drawing at most ckEvery frames, never from the
// start for every frame of a long GIF.

// gifEntry is one image of the GIF: the bytes of its blocks (the
// extensions before its image descriptor, the descriptor, its colour table
// and image data) in the file, its rectangle on the logical screen and its
// disposal method (raw GIF89a value; 0 counts as none).
type gifEntry struct {
	start, end     uint32
	x0, y0, x1, y1 uint16
	disposal       uint8
	previous       bool // disposal "restore to previous"
}

// gifEntryBytes bounds the memory of one gifEntry, for the budget.
const gifEntryBytes = 24

// gifFrames is an indexed animated GIF.
type gifFrames struct {
	w, h       int
	data       []byte
	head       int // end of the header, logical screen descriptor and global colour table
	frames     []gifEntry
	rate       physics.Rate // from the frame delays; zero when they give none
	maxFramePx int64        // the largest frame's area, pixels
	previous   bool         // some frame restores the previous canvas

	ckEvery  int // checkpoint interval in frames (len(frames)+1: none)
	ckBudget int64
	mu       sync.Mutex
	ck       map[int]*image.RGBA // the canvas before frame k is drawn
	ckUsed   int64

	decodes atomic.Int64 // frames decoded, for tests
}

// screenBytes is the size of one composite, an RGBA logical screen.
func (g *gifFrames) screenBytes() int64 { return 4 * int64(g.w) * int64(g.h) }

// compositeCost is what making one composite may allocate at once: the
// canvas, one decoded frame (one byte a pixel) and, if any frame restores
// the previous canvas, a copy of the canvas under it.
func (g *gifFrames) compositeCost() int64 {
	c := g.screenBytes() + g.maxFramePx
	if g.previous {
		c += g.screenBytes()
	}
	return c
}

// loadGIF reads and indexes the GIF in r within budget bytes of memory:
// the file itself, the frame index, the checkpoints and at least one
// composite. It returns the cache's share of the budget too. Nothing is
// decoded yet, but the structure of the whole file is checked (every block
// in place, every frame inside the logical screen, a colour table for every
// frame); the pixels of a frame are checked when it is first composited.
func loadGIF(path string, r io.Reader, maxPix int, budget int64) (*gifFrames, int64, error) {
	limit := budget / 2
	data, err := io.ReadAll(io.LimitReader(r, limit+1))
	if err != nil {
		return nil, 0, &Error{File: path, Msg: "cannot read: " + errText(err), Err: err}
	}
	if int64(len(data)) > limit {
		return nil, 0, &Error{File: path, Msg: fmt.Sprintf("the GIF file is larger than half the footage memory cap (%s)", mib(limit))}
	}
	cfg, err := gif.DecodeConfig(bytes.NewReader(data))
	if err != nil {
		return nil, 0, &Error{File: path, Msg: "cannot read the GIF header: " + err.Error(), Err: err}
	}
	if err := checkSize(path, cfg.Width, cfg.Height, maxPix); err != nil {
		return nil, 0, err
	}
	g := &gifFrames{w: cfg.Width, h: cfg.Height, data: data, ck: map[int]*image.RGBA{}}
	if err := g.index(); err != nil {
		return nil, 0, &Error{File: path, Msg: "cannot decode the GIF: " + err.Error(), Err: err}
	}
	n := int64(len(g.frames))
	fixed := int64(len(data)) + n*gifEntryBytes
	// Checkpoints: a quarter of the budget, if one fits in it.
	ckBytes := g.screenBytes() + 128 // 128: the image header
	if q := budget / 4; q >= ckBytes {
		g.ckBudget = min(q, n*ckBytes)
		g.ckEvery = int((n*ckBytes + g.ckBudget - 1) / g.ckBudget)
	} else {
		g.ckEvery = len(g.frames) + 1
	}
	cacheBytes := budget - fixed - g.ckBudget
	if cost := g.compositeCost(); cacheBytes < cost {
		return nil, 0, &Error{File: path, Msg: fmt.Sprintf("its %d frames of %dx%d pixels need %s to show, more than the footage memory cap (%s)",
			n, g.w, g.h, mib(fixed+g.ckBudget+cost), mib(budget))}
	}
	return g, cacheBytes, nil
}

// index walks the blocks of the GIF (GIF89a specification, sections 17 to
// 27: header, logical screen descriptor, optional global colour table,
// then extension blocks 0x21, image descriptors 0x2C and the trailer 0x3B),
// recording every frame, as image/gif's decoder reads them: a Graphic
// Control Extension's delay and transparency apply to the next image
// only, its disposal method until the next such extension.
//
// It stays one function: one loop over the block types in the order the
// specification lists them, each case a few lines, with the extension state
// carried from block to block.
func (g *gifFrames) index() error {
	data := g.data
	p := 13
	flags := data[10]
	global := flags&0x80 != 0
	if global {
		p += 3 << ((flags & 7) + 1)
	}
	if p > len(data) {
		return io.ErrUnexpectedEOF
	}
	g.head = p
	counts := map[int]int{}
	var disposal uint8
	delay := 0
	start := p
	skip := func() error { // sub-blocks up to the terminator
		for {
			if p >= len(data) {
				return io.ErrUnexpectedEOF
			}
			n := int(data[p])
			p++
			if n == 0 {
				return nil
			}
			p += n
		}
	}
	for {
		if p >= len(data) {
			return io.ErrUnexpectedEOF
		}
		switch data[p] {
		case 0x21:
			if p+2 > len(data) {
				return io.ErrUnexpectedEOF
			}
			label := data[p+1]
			if label == 0xF9 && p+7 <= len(data) && data[p+2] == 4 {
				disposal = (data[p+3] >> 2) & 7
				delay = int(data[p+4]) | int(data[p+5])<<8
			}
			p += 2
			if err := skip(); err != nil {
				return err
			}
		case 0x2C:
			if p+10 > len(data) {
				return io.ErrUnexpectedEOF
			}
			x0 := int(data[p+1]) | int(data[p+2])<<8
			y0 := int(data[p+3]) | int(data[p+4])<<8
			w := int(data[p+5]) | int(data[p+6])<<8
			h := int(data[p+7]) | int(data[p+8])<<8
			fl := data[p+9]
			if x0+w > g.w || y0+h > g.h {
				return fmt.Errorf("frame %d (%dx%d at %d,%d) is outside the %dx%d screen", len(g.frames), w, h, x0, y0, g.w, g.h)
			}
			if fl&0x80 == 0 && !global {
				return fmt.Errorf("frame %d has no colour table", len(g.frames))
			}
			p += 10
			if fl&0x80 != 0 {
				p += 3 << ((fl & 7) + 1)
			}
			p++ // LZW minimum code size
			if err := skip(); err != nil {
				return err
			}
			if p > len(data) || p > 1<<32-1 {
				return io.ErrUnexpectedEOF
			}
			g.frames = append(g.frames, gifEntry{start: uint32(start), end: uint32(p),
				x0: uint16(x0), y0: uint16(y0), x1: uint16(x0 + w), y1: uint16(y0 + h),
				disposal: disposal, previous: disposal == gif.DisposalPrevious})
			g.maxFramePx = max(g.maxFramePx, int64(w)*int64(h))
			g.previous = g.previous || disposal == gif.DisposalPrevious
			if delay > 0 {
				counts[delay]++
			}
			delay = 0
			start = p
		case 0x3B:
			if len(g.frames) == 0 {
				return fmt.Errorf("the GIF has no frames")
			}
			g.rate = rateOfCounts(counts)
			return nil
		default:
			return fmt.Errorf("unknown block type 0x%02x at byte %d", data[p], p)
		}
	}
}

// scanGIF returns the number of frames of the GIF in data and the sum of
// their areas in pixels (0, 0 when its structure is broken).
func scanGIF(data []byte) (frames int, pixels int64) {
	if len(data) < 13 {
		return 0, 0
	}
	cfg, err := gif.DecodeConfig(bytes.NewReader(data))
	if err != nil {
		return 0, 0
	}
	g := &gifFrames{w: cfg.Width, h: cfg.Height, data: data}
	if g.index() != nil {
		return 0, 0
	}
	for _, f := range g.frames {
		pixels += int64(f.x1-f.x0) * int64(f.y1-f.y0)
	}
	return len(g.frames), pixels
}

// decode decodes frame k alone: the file's header and colour table, the
// frame's own blocks and a trailer make a one-frame GIF for image/gif. A
// decoder panic is returned as an error.
func (g *gifFrames) decode(k int) (m *image.Paletted, err error) {
	g.decodes.Add(1)
	f := &g.frames[k]
	r := io.MultiReader(bytes.NewReader(g.data[:g.head]), bytes.NewReader(g.data[f.start:f.end]), bytes.NewReader([]byte{0x3B}))
	defer func() {
		if p := recover(); p != nil {
			m, err = nil, fmt.Errorf("the GIF decoder failed: %v", p)
		}
	}()
	img, err := gif.Decode(r)
	if err != nil {
		return nil, err
	}
	m, ok := img.(*image.Paletted)
	if !ok {
		return nil, fmt.Errorf("frame %d is not a palette image", k)
	}
	return m, nil
}

// delayRate returns the frame rate that the GIF's most common positive
// frame delay (hundredths of a second; ties go to the shorter delay)
// gives, 100/d frames per second, or the zero Rate when no delay is
// positive.
func delayRate(delays []int) physics.Rate {
	count := map[int]int{}
	for _, d := range delays {
		if d > 0 {
			count[d]++
		}
	}
	return rateOfCounts(count)
}

// rateOfCounts is delayRate from the number of frames of each positive
// delay.
func rateOfCounts(count map[int]int) physics.Rate {
	best, bestN := 0, 0
	keys := make([]int, 0, len(count))
	for d := range count {
		keys = append(keys, d)
	}
	slices.Sort(keys)
	for _, d := range keys {
		if count[d] > bestN {
			best, bestN = d, count[d]
		}
	}
	if best == 0 {
		return physics.Rate{}
	}
	a, b := int64(100), int64(best)
	for b != 0 {
		a, b = b, a%b
	}
	return physics.Rate{Num: 100 / a, Den: int64(best) / a}
}

// composite returns frame i as the viewer sees it: the frames before it
// drawn in order onto a transparent logical screen, each disposed of as it
// asks (none: left in place; background: its rectangle cleared to
// transparent, which is what browsers do rather than painting the
// background colour, common practice, no source; previous: the screen put
// back as it was before the frame), then frame i drawn over them. GIF89a
// specification, section 23 (Graphic Control Extension, disposal method).
//
// It starts from the nearest earlier composite still in the cache (whose
// disposal is not "previous") or checkpoint, whichever is later, so playing
// forward costs one frame's drawing and any frame at most ckEvery; the
// checkpoints it passes that are not kept yet are kept.
func (g *gifFrames) composite(i int, c *frameCache) (image.Image, error) {
	screen := image.Rect(0, 0, g.w, g.h)
	canvas := image.NewRGBA(screen)
	start := 0
	for k := i - 1; k >= 0 && i-k <= g.ckEvery; k-- {
		if g.frames[k].previous {
			continue
		}
		if prev, ok := c.peek(k); ok {
			rgba, ok := prev.(*image.RGBA) // composite's own output, so always
			if !ok || rgba.Rect != screen {
				continue
			}
			copy(canvas.Pix, rgba.Pix)
			g.dispose(canvas, k, nil)
			start = k + 1
			break
		}
	}
	if k, ck := g.checkpoint(i); ck != nil && k > start {
		copy(canvas.Pix, ck.Pix)
		start = k
	}
	for k := start; k <= i; k++ {
		if k != start {
			g.keepCheckpoint(k, canvas)
		}
		f, err := g.decode(k)
		if err != nil {
			return nil, fmt.Errorf("frame %d: %w", k, err)
		}
		if k == i {
			drawOver(canvas, f)
			break
		}
		var saved *image.RGBA
		if g.frames[k].previous {
			r := f.Rect.Intersect(screen)
			saved = image.NewRGBA(r)
			copyRect(saved, canvas, r)
		}
		drawOver(canvas, f)
		g.dispose(canvas, k, saved)
	}
	return canvas, nil
}

// checkpoint returns the latest kept checkpoint at or before frame i.
func (g *gifFrames) checkpoint(i int) (int, *image.RGBA) {
	g.mu.Lock()
	defer g.mu.Unlock()
	for k := i / g.ckEvery * g.ckEvery; k > 0; k -= g.ckEvery {
		if ck, ok := g.ck[k]; ok {
			return k, ck
		}
	}
	return 0, nil
}

// keepCheckpoint keeps a copy of the canvas as it stands before frame k is
// drawn, if k is a checkpoint frame not kept yet and the budget allows.
func (g *gifFrames) keepCheckpoint(k int, canvas *image.RGBA) {
	if k%g.ckEvery != 0 {
		return
	}
	g.mu.Lock()
	defer g.mu.Unlock()
	n := int64(len(canvas.Pix)) + 128
	if _, ok := g.ck[k]; ok || g.ckUsed+n > g.ckBudget {
		return
	}
	cp := image.NewRGBA(canvas.Rect)
	copy(cp.Pix, canvas.Pix)
	g.ck[k] = cp
	g.ckUsed += n
}

// drawOver paints palette frame f over the canvas (Porter-Duff "over", as
// image/draw.Draw with draw.Over computes it); transparent pixels leave the
// canvas as it is.
func drawOver(canvas *image.RGBA, f *image.Paletted) {
	r := f.Rect.Intersect(canvas.Rect)
	if r.Empty() {
		return
	}
	var pal [256][4]uint32 // premultiplied 16-bit r, g, b, a
	np := min(len(f.Palette), 256)
	for j := range np {
		cr, cg, cb, ca := f.Palette[j].RGBA()
		pal[j] = [4]uint32{cr, cg, cb, ca}
	}
	const m = 1<<16 - 1
	w := r.Dx()
	for y := r.Min.Y; y < r.Max.Y; y++ {
		src := f.Pix[f.PixOffset(r.Min.X, y):][:w]
		dst := canvas.Pix[canvas.PixOffset(r.Min.X, y):][:4*w]
		for x, idx := range src {
			if int(idx) >= np {
				continue // image/gif refuses such a pixel; kept for safety
			}
			c := pal[idx]
			d := dst[4*x : 4*x+4 : 4*x+4]
			switch c[3] {
			case 0:
			case m:
				d[0], d[1], d[2], d[3] = uint8(c[0]>>8), uint8(c[1]>>8), uint8(c[2]>>8), uint8(c[3]>>8)
			default:
				a := (m - c[3]) * 0x101
				d[0] = uint8((uint32(d[0])*a/m + c[0]) >> 8)
				d[1] = uint8((uint32(d[1])*a/m + c[1]) >> 8)
				d[2] = uint8((uint32(d[2])*a/m + c[2]) >> 8)
				d[3] = uint8((uint32(d[3])*a/m + c[3]) >> 8)
			}
		}
	}
}

// copyRect copies rectangle r of src into dst (both RGBA; r inside both).
func copyRect(dst, src *image.RGBA, r image.Rectangle) {
	w := 4 * r.Dx()
	for y := r.Min.Y; y < r.Max.Y; y++ {
		copy(dst.Pix[dst.PixOffset(r.Min.X, y):][:w], src.Pix[src.PixOffset(r.Min.X, y):][:w])
	}
}

// dispose applies frame k's disposal to the canvas after it was shown;
// saved holds the canvas under frame k's rectangle before it was drawn
// (needed only for "previous").
func (g *gifFrames) dispose(canvas *image.RGBA, k int, saved *image.RGBA) {
	f := &g.frames[k]
	switch f.disposal {
	case gif.DisposalBackground:
		r := image.Rect(int(f.x0), int(f.y0), int(f.x1), int(f.y1)).Intersect(canvas.Rect)
		w := 4 * r.Dx()
		for y := r.Min.Y; y < r.Max.Y; y++ {
			clear(canvas.Pix[canvas.PixOffset(r.Min.X, y):][:w])
		}
	case gif.DisposalPrevious:
		if saved != nil {
			copyRect(canvas, saved, saved.Rect)
		}
	}
}
