package footage

import (
	"bufio"
	"cmp"
	"fmt"
	"image"
	"image/color"
	"image/jpeg"
	"image/png"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"propflight/app/fsutil"
	"propflight/internal/mark"
)

// frameExt reports whether a folder file name is a frame: .png, .jpg or
// .jpeg in any case.
func frameExt(name string) bool {
	switch strings.ToLower(filepath.Ext(name)) {
	case ".png", ".jpg", ".jpeg":
		return true
	}
	return false
}

// openFolder lists the frames of dir and checks every frame's header.
func (s *Sequence) openFolder(dir string) error {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return &Error{File: dir, Msg: "cannot list the folder: " + errText(err), Err: err}
	}
	if len(entries) == 0 {
		return &Error{File: dir, Msg: "the folder is empty: it needs numbered PNG or JPEG frames"}
	}
	var names []string
	for _, e := range entries {
		n := e.Name()
		if strings.HasPrefix(n, ".") || !frameExt(n) {
			continue
		}
		if e.IsDir() {
			continue
		}
		if e.Type()&os.ModeSymlink != 0 {
			if fi, err := os.Stat(filepath.Join(dir, n)); err != nil || fi.IsDir() {
				continue
			}
		}
		names = append(names, n)
	}
	if len(names) == 0 {
		return &Error{File: dir, Msg: fmt.Sprintf("no PNG or JPEG frames in the folder (%d other entries ignored)", len(entries))}
	}
	slices.SortFunc(names, naturalCompare)
	s.names = names
	s.n = len(names)
	s.files = make([]string, len(names))
	s.costs = make([]int64, len(names))
	for i, n := range names {
		s.files[i] = filepath.Join(dir, n)
		w, h, cost, err := frameConfig(s.files[i], s.maxPix)
		if err != nil {
			return err
		}
		if cost > s.cache.capBytes {
			return &Error{File: s.files[i], Msg: (&errOverCap{cost, s.cache.capBytes}).Error()}
		}
		s.costs[i] = cost
		if i == 0 {
			s.w, s.h = w, h
		} else if w != s.w || h != s.h {
			return &Error{File: s.files[i], Msg: fmt.Sprintf("is %dx%d pixels but %s is %dx%d: all frames must be the same size",
				w, h, names[0], s.w, s.h)}
		}
	}
	return nil
}

// frameConfig reads the header of the PNG or JPEG frame at path, checks
// its size against maxPix and returns its decode cost.
func frameConfig(path string, maxPix int) (w, h int, cost int64, err error) {
	f, err := fsutil.OpenRegular(path)
	if err != nil {
		return 0, 0, 0, &Error{File: path, Msg: "cannot open: " + errText(err), Err: err}
	}
	defer f.Close()
	w, h, _, cost, err = readConfig(path, bufio.NewReaderSize(f, headPeek), maxPix)
	return w, h, cost, err
}

// headPeek is how much of a frame file readConfig looks at for the facts
// of decodeCost that image.DecodeConfig does not give.
const headPeek = 64 << 10

// readConfig reads an image header from r and checks it.
func readConfig(path string, r *bufio.Reader, maxPix int) (w, h int, format string, cost int64, err error) {
	head, _ := r.Peek(headPeek) // what there is: a short file gives less
	cfg, format, err := image.DecodeConfig(r)
	if err != nil {
		return 0, 0, "", 0, &Error{File: path, Msg: "cannot read the image header: " + err.Error(), Err: err}
	}
	if format != "png" && format != "jpeg" {
		return 0, 0, "", 0, &Error{File: path, Msg: fmt.Sprintf("is a %s image; frames must be PNG or JPEG", format)}
	}
	if err := checkSize(path, cfg.Width, cfg.Height, maxPix); err != nil {
		return 0, 0, "", 0, err
	}
	return cfg.Width, cfg.Height, format, decodeCost(format, cfg, head), nil
}

// decodeCost returns the bytes the standard decoder allocates for a frame
// with header cfg, from its declared size (head: the file's first bytes):
//   - PNG (image/png): the image, 1 to 8 bytes a pixel by colour model; an
//     interlaced file (IHDR interlace byte, PNG specification §11.2.2)
//     decodes each of its 7 passes into an image of its own first, so
//     twice that.
//   - JPEG (image/jpeg): the planes, a byte a pixel for each of its
//     components (4:4:4 at worst; CMYK also converts, 8 bytes a pixel),
//     and for a progressive file (SOF2, ITU T.81 Table B.1) every
//     coefficient block kept until the end, 64 int32 per 8x8 block: 4 bytes
//     a pixel for each component.
//
// Row buffers and decoder state, a few rows, are left out.
func decodeCost(format string, cfg image.Config, head []byte) int64 {
	px := int64(cfg.Width) * int64(cfg.Height)
	if format == "png" {
		bpp := int64(8)
		switch cfg.ColorModel {
		case color.GrayModel:
			bpp = 1
		case color.Gray16Model:
			bpp = 2
		case color.RGBAModel, color.NRGBAModel:
			bpp = 4
		default:
			if _, ok := cfg.ColorModel.(color.Palette); ok {
				bpp = 1
			}
		}
		cost := px * bpp
		if len(head) > 28 && head[28] == 1 {
			cost *= 2
		}
		return cost
	}
	comps, out := int64(3), int64(3)
	switch cfg.ColorModel {
	case color.GrayModel:
		comps, out = 1, 1
	case color.CMYKModel:
		comps, out = 4, 8
	}
	cost := px * out
	if jpegProgressive(head) {
		cost += px * comps * 4
	}
	return cost
}

// jpegProgressive reports whether the JPEG whose first bytes are head is
// progressive (its frame header is SOF2, or SOF6, SOF10, SOF14), walking
// the marker segments (ITU T.81 §B.1.1). A header past head counts as
// progressive, the dearer case.
func jpegProgressive(head []byte) bool {
	p := 2 // SOI
	for p+4 <= len(head) {
		if head[p] != 0xFF {
			return true
		}
		m := head[p+1]
		switch {
		case m == 0xFF: // fill byte
			p++
			continue
		case m >= 0xC0 && m <= 0xCF && m != 0xC4 && m != 0xC8 && m != 0xCC:
			return m == 0xC2 || m == 0xC6 || m == 0xCA || m == 0xCE
		}
		p += 2 + (int(head[p+2])<<8 | int(head[p+3]))
	}
	return true
}

// checkSize refuses an empty size, one over maxPix pixels or one with a
// side over mark.MaxCoord.
func checkSize(path string, w, h, maxPix int) error {
	if w <= 0 || h <= 0 {
		return &Error{File: path, Msg: fmt.Sprintf("declares an empty image (%dx%d pixels)", w, h)}
	}
	if float64(max(w, h)) > mark.MaxCoord {
		return &Error{File: path, Msg: fmt.Sprintf("declares %dx%d pixels; a side may be at most %g pixels", w, h, mark.MaxCoord)}
	}
	if int64(w)*int64(h) > int64(maxPix) {
		return &Error{File: path, Msg: fmt.Sprintf("declares %dx%d pixels (%s megapixels); the limit is %s megapixels",
			w, h, megapixels(int64(w)*int64(h)), megapixels(int64(maxPix)))}
	}
	return nil
}

// megapixels formats a pixel count in millions, "2500" or "0.3".
func megapixels(n int64) string {
	return strings.TrimSuffix(strings.TrimRight(fmt.Sprintf("%.1f", float64(n)/1e6), "0"), ".")
}

// decodeFrame decodes the frame file at path, which Open found to be w x h
// and to cost at most budget bytes to decode (decodeCost).
// The header is read and checked again first, so that a file replaced
// since Open cannot bypass the size limit. A decoder panic, which would be
// a bug in the standard library, is returned as an error.
func decodeFrame(path string, w, h, maxPix int, budget int64) (img image.Image, err error) {
	f, err := fsutil.OpenRegular(path)
	if err != nil {
		return nil, &Error{File: path, Msg: "cannot open: " + errText(err), Err: err}
	}
	defer f.Close()
	fw, fh, format, cost, err := readConfig(path, bufio.NewReaderSize(f, headPeek), maxPix)
	if err != nil {
		return nil, err
	}
	if fw != w || fh != h {
		return nil, &Error{File: path, Msg: fmt.Sprintf("is now %dx%d pixels; the footage is %dx%d (was the file replaced?)", fw, fh, w, h)}
	}
	if cost > budget {
		return nil, &Error{File: path, Msg: fmt.Sprintf("now needs %s to decode, more than when the footage was opened (%s; was the file replaced?)", mib(cost), mib(budget))}
	}
	if _, err := f.Seek(0, io.SeekStart); err != nil {
		return nil, &Error{File: path, Msg: "cannot read: " + errText(err), Err: err}
	}
	defer func() {
		if p := recover(); p != nil {
			img, err = nil, &Error{File: path, Msg: fmt.Sprintf("the %s decoder failed: %v", format, p)}
		}
	}()
	r := bufio.NewReader(f)
	if format == "png" {
		img, err = png.Decode(r)
	} else {
		img, err = jpeg.Decode(r)
	}
	if err != nil {
		return nil, &Error{File: path, Msg: "cannot decode the " + strings.ToUpper(format) + " frame: " + err.Error(), Err: err}
	}
	if b := img.Bounds(); b.Dx() != w || b.Dy() != h {
		return nil, &Error{File: path, Msg: fmt.Sprintf("decoded to %dx%d pixels; the footage is %dx%d", b.Dx(), b.Dy(), w, h)}
	}
	return img, nil
}

// naturalCompare orders file names the way people number frames: runs of
// digits compare by their value (frame2 < frame10 < frame010a), other text
// by its bytes, case-insensitively first. Names equal under those rules
// (frame01, frame1) fall back to a plain byte comparison, so the order is
// total and stable.
func naturalCompare(a, b string) int {
	i, j := 0, 0
	for i < len(a) && j < len(b) {
		ca, cb := a[i], b[j]
		if isDigit(ca) && isDigit(cb) {
			si, sj := i, j
			for i < len(a) && isDigit(a[i]) {
				i++
			}
			for j < len(b) && isDigit(b[j]) {
				j++
			}
			da := strings.TrimLeft(a[si:i], "0")
			db := strings.TrimLeft(b[sj:j], "0")
			if len(da) != len(db) {
				return cmp.Compare(len(da), len(db))
			}
			if c := strings.Compare(da, db); c != 0 {
				return c
			}
			continue
		}
		la, lb := lower(ca), lower(cb)
		if la != lb {
			return cmp.Compare(int(la), int(lb))
		}
		i++
		j++
	}
	if c := cmp.Compare(len(a)-i, len(b)-j); c != 0 {
		return c
	}
	return strings.Compare(a, b)
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func lower(c byte) byte {
	if c >= 'A' && c <= 'Z' {
		return c + 'a' - 'A'
	}
	return c
}
