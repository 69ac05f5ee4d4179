package footage

import (
	"bufio"
	"fmt"
	"image"
	"image/jpeg"
	"image/png"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"propflight/app/fsutil"
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
	s.files = make([]string, len(names))
	for i, n := range names {
		s.files[i] = filepath.Join(dir, n)
		w, h, _, err := frameConfig(s.files[i], s.maxPix)
		if err != nil {
			return err
		}
		if i == 0 {
			s.w, s.h = w, h
		} else if w != s.w || h != s.h {
			return &Error{File: s.files[i], Msg: fmt.Sprintf("is %dx%d pixels but %s is %dx%d: all frames must be the same size",
				w, h, names[0], s.w, s.h)}
		}
	}
	return nil
}

// frameConfig reads the header of the PNG or JPEG frame at path and checks
// its size against maxPix.
func frameConfig(path string, maxPix int) (w, h int, format string, err error) {
	f, err := fsutil.OpenRegular(path)
	if err != nil {
		return 0, 0, "", &Error{File: path, Msg: "cannot open: " + errText(err), Err: err}
	}
	defer f.Close()
	return readConfig(path, bufio.NewReader(f), maxPix)
}

// readConfig reads an image header from r and checks it.
func readConfig(path string, r io.Reader, maxPix int) (w, h int, format string, err error) {
	cfg, format, err := image.DecodeConfig(r)
	if err != nil {
		return 0, 0, "", &Error{File: path, Msg: "cannot read the image header: " + err.Error(), Err: err}
	}
	if format != "png" && format != "jpeg" {
		return 0, 0, "", &Error{File: path, Msg: fmt.Sprintf("is a %s image; frames must be PNG or JPEG", format)}
	}
	if err := checkSize(path, cfg.Width, cfg.Height, maxPix); err != nil {
		return 0, 0, "", err
	}
	return cfg.Width, cfg.Height, format, nil
}

// checkSize refuses an empty size or one over maxPix pixels.
func checkSize(path string, w, h, maxPix int) error {
	if w <= 0 || h <= 0 {
		return &Error{File: path, Msg: fmt.Sprintf("declares an empty image (%dx%d pixels)", w, h)}
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

// decodeFrame decodes the frame file at path, which Open found to be w x h.
// The header is read and checked again first, so that a file replaced
// since Open cannot bypass the size limit. A decoder panic, which would be
// a bug in the standard library, is returned as an error.
func decodeFrame(path string, w, h, maxPix int) (img image.Image, err error) {
	f, err := fsutil.OpenRegular(path)
	if err != nil {
		return nil, &Error{File: path, Msg: "cannot open: " + errText(err), Err: err}
	}
	defer f.Close()
	fw, fh, format, err := readConfig(path, bufio.NewReader(f), maxPix)
	if err != nil {
		return nil, err
	}
	if fw != w || fh != h {
		return nil, &Error{File: path, Msg: fmt.Sprintf("is now %dx%d pixels; the footage is %dx%d (was the file replaced?)", fw, fh, w, h)}
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
				return cmpInt(len(da), len(db))
			}
			if c := strings.Compare(da, db); c != 0 {
				return c
			}
			continue
		}
		la, lb := lower(ca), lower(cb)
		if la != lb {
			return cmpInt(int(la), int(lb))
		}
		i++
		j++
	}
	if c := cmpInt(len(a)-i, len(b)-j); c != 0 {
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

func cmpInt(a, b int) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}
