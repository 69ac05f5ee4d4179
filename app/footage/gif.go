package footage

import (
	"bytes"
	"fmt"
	"image"
	"image/color"
	"image/draw"
	"image/gif"
	"io"
	"slices"

	"propflight/physics"
)

// gifFrames is a decoded animated GIF: its frames as palette images placed
// on the logical screen, and how each is disposed of before the next.
type gifFrames struct {
	w, h     int
	frames   []*image.Paletted
	disposal []byte       // gif.DisposalNone, DisposalBackground, DisposalPrevious (0 counts as none)
	rate     physics.Rate // from the frame delays; zero when they give none
}

// loadGIF checks and decodes the GIF in r. Before anything is decoded, the
// logical screen is checked against maxPix and every image descriptor is
// scanned (scanGIF), so that the palette frames DecodeAll allocates, one
// byte a pixel, stay within budget bytes.
func loadGIF(path string, r io.Reader, maxPix int, budget int64) (*gifFrames, error) {
	data, err := io.ReadAll(io.LimitReader(r, budget+1))
	if err != nil {
		return nil, &Error{File: path, Msg: "cannot read: " + errText(err), Err: err}
	}
	if int64(len(data)) > budget {
		return nil, &Error{File: path, Msg: fmt.Sprintf("the GIF file is larger than the frame memory limit (%d bytes)", budget)}
	}
	cfg, err := gif.DecodeConfig(bytes.NewReader(data))
	if err != nil {
		return nil, &Error{File: path, Msg: "cannot read the GIF header: " + err.Error(), Err: err}
	}
	if err := checkSize(path, cfg.Width, cfg.Height, maxPix); err != nil {
		return nil, err
	}
	n, pixels := scanGIF(data)
	if pixels > budget {
		return nil, &Error{File: path, Msg: fmt.Sprintf("its %d frames hold %d pixels, more than the frame memory limit (%d bytes)", n, pixels, budget)}
	}
	g, err := decodeGIFAll(data)
	if err != nil {
		return nil, &Error{File: path, Msg: "cannot decode the GIF: " + err.Error(), Err: err}
	}
	if len(g.Image) == 0 {
		return nil, &Error{File: path, Msg: "the GIF has no frames"}
	}
	gf := &gifFrames{w: g.Config.Width, h: g.Config.Height, frames: g.Image, disposal: g.Disposal, rate: delayRate(g.Delay)}
	if len(gf.disposal) != len(gf.frames) {
		gf.disposal = make([]byte, len(gf.frames))
	}
	return gf, nil
}

// decodeGIFAll is gif.DecodeAll with a decoder panic returned as an error.
func decodeGIFAll(data []byte) (g *gif.GIF, err error) {
	defer func() {
		if p := recover(); p != nil {
			g, err = nil, fmt.Errorf("the GIF decoder failed: %v", p)
		}
	}()
	return gif.DecodeAll(bytes.NewReader(data))
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

// scanGIF walks the blocks of a GIF file (GIF89a specification, sections
// 17 to 27: header, logical screen descriptor, optional global colour
// table, then extension blocks 0x21, image descriptors 0x2C and the
// trailer 0x3B) and returns the number of image descriptors and the sum
// of their declared areas in pixels. It stops quietly at anything it does
// not understand or at the end of the data: the decoder reports those.
func scanGIF(data []byte) (frames int, pixels int64) {
	const header = 6 + 7
	if len(data) < header {
		return 0, 0
	}
	p := header
	if flags := data[10]; flags&0x80 != 0 {
		p += 3 << ((flags & 7) + 1)
	}
	skipSubBlocks := func() bool {
		for p < len(data) {
			n := int(data[p])
			p++
			if n == 0 {
				return true
			}
			p += n
		}
		return false
	}
	for p < len(data) {
		switch data[p] {
		case 0x21: // extension: label, then sub-blocks
			p += 2
			if !skipSubBlocks() {
				return frames, pixels
			}
		case 0x2C: // image descriptor: left, top, width, height, flags
			if p+10 > len(data) {
				return frames, pixels
			}
			w := int64(data[p+5]) | int64(data[p+6])<<8
			h := int64(data[p+7]) | int64(data[p+8])<<8
			flags := data[p+9]
			frames++
			pixels += w * h
			p += 10
			if flags&0x80 != 0 {
				p += 3 << ((flags & 7) + 1)
			}
			p++ // LZW minimum code size
			if !skipSubBlocks() {
				return frames, pixels
			}
		default: // 0x3B trailer, or something the decoder will refuse
			return frames, pixels
		}
	}
	return frames, pixels
}

// composite returns frame i as the viewer sees it: the frames before it
// drawn in order onto a transparent logical screen, each disposed of as it
// asks (none: left in place; background: its rectangle cleared to
// transparent, which is what browsers do rather than painting the
// background colour, common practice, no source; previous: the screen put
// back as it was before the frame), then frame i drawn over them. GIF89a
// specification, section 23 (Graphic Control Extension, disposal method).
//
// It starts from the nearest earlier composite still in the cache whose
// disposal is not "previous", so playing forward costs one frame's drawing.
func (g *gifFrames) composite(i int, c *frameCache) (image.Image, error) {
	screen := image.Rect(0, 0, g.w, g.h)
	canvas := image.NewRGBA(screen)
	start := 0
	for k := i - 1; k >= 0; k-- {
		if g.disposal[k] == gif.DisposalPrevious {
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
	for k := start; k < i; k++ {
		var saved *image.RGBA
		if g.disposal[k] == gif.DisposalPrevious {
			r := g.frames[k].Rect.Intersect(screen)
			saved = image.NewRGBA(r)
			draw.Draw(saved, r, canvas, r.Min, draw.Src)
		}
		g.draw(canvas, k)
		g.dispose(canvas, k, saved)
	}
	g.draw(canvas, i)
	return canvas, nil
}

// draw paints frame k over the canvas; its transparent pixels leave the
// canvas as it is.
func (g *gifFrames) draw(canvas *image.RGBA, k int) {
	f := g.frames[k]
	draw.Draw(canvas, f.Rect, f, f.Rect.Min, draw.Over)
}

// dispose applies frame k's disposal to the canvas after it was shown;
// saved holds the canvas under frame k's rectangle before it was drawn
// (needed only for "previous").
func (g *gifFrames) dispose(canvas *image.RGBA, k int, saved *image.RGBA) {
	switch g.disposal[k] {
	case gif.DisposalBackground:
		draw.Draw(canvas, g.frames[k].Rect, image.NewUniform(color.Transparent), image.Point{}, draw.Src)
	case gif.DisposalPrevious:
		if saved != nil {
			draw.Draw(canvas, saved.Rect, saved, saved.Rect.Min, draw.Src)
		}
	}
}
