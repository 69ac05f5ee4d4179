package footage

import (
	"bytes"
	"errors"
	"fmt"
	"image"
	"io"
	"math"
	"os"
	"path/filepath"

	"propflight/app/fsutil"
	"propflight/physics"
)

// Defaults and limits of [Options].
const (
	// DefaultFPS is the frame rate assumed for a folder of frames, or a GIF
	// without usable frame delays, when Options.FPS is zero: film rate.
	DefaultFPS = 24
	// DefaultMaxPixels is the largest frame Open accepts by default: 40
	// megapixels (a 7680 x 4320 "8K" frame is 33.2 megapixels).
	DefaultMaxPixels = 40_000_000
	// DefaultCacheBytes is the default memory cap of decoded frames, 512 MiB.
	DefaultCacheBytes = 512 << 20
)

// Options tune Open. The zero value gives the defaults.
type Options struct {
	// FPS is the footage's own frame rate. Zero means the GIF's rate from
	// its frame delays, or DefaultFPS.
	FPS physics.Rate
	// MaxPixels refuses any frame whose header declares more pixels than
	// this (width x height). Zero or less means DefaultMaxPixels.
	MaxPixels int
	// CacheBytes caps the memory of the footage, in bytes: decoded frames
	// kept for reuse and decodes in flight; for a GIF also its file, its
	// frame index and its checkpoints. Zero or less means
	// DefaultCacheBytes.
	CacheBytes int64
}

// Sequence is reference footage: numbered frames of one size, decoded on
// demand. It is safe for concurrent use.
type Sequence struct {
	path   string
	n      int      // number of frames
	names  []string // folder: display name of each frame (Name)
	files  []string // folder: path of each frame file
	costs  []int64  // folder: bytes decoding each frame allocates (decodeCost)
	w, h   int
	fps    physics.Rate
	maxPix int
	gif    *gifFrames // nil for a folder
	cache  *frameCache
}

// Open loads the footage at path: a folder of PNG or JPEG frames or an
// animated GIF file.
//
// A folder's frames are its files ending in .png, .jpg or .jpeg (any case)
// in natural order, so that frame2 comes before frame10; other files,
// sub-folders and names starting with "." are ignored. Every frame's header
// is read (not its pixels): a frame larger than opt.MaxPixels, a header
// that cannot be read, or a frame whose size differs from the first
// frame's is refused with an error naming the file. Pixels are decoded
// lazily by Frame.
//
// A GIF is read whole (it may take at most half of Options.CacheBytes) and
// its blocks indexed (a broken structure is refused); Frame decodes its
// frames one at a time as it composites them onto the logical screen,
// honouring each frame's disposal (gif.go).
//
// Memory: Options.CacheBytes bounds what the footage holds at any time,
// decodes in flight included: each frame's decode cost is worked out from
// its declared size before it is decoded (decodeCost) and reserved in the
// cache, and a frame (or GIF) that could not be shown within the cap is
// refused by Open. Open also sets the process's soft memory limit
// (limitProcessMemory), so that the garbage of frames decoded and evicted
// is collected before the process grows past the cap.
func Open(path string, opt Options) (*Sequence, error) {
	if opt.FPS != (physics.Rate{}) && !opt.FPS.Valid() {
		return nil, &Error{Field: "fps", Msg: "must be a positive frame rate of at most 10000 frames per second"}
	}
	if opt.MaxPixels <= 0 {
		opt.MaxPixels = DefaultMaxPixels
	}
	if opt.CacheBytes <= 0 {
		opt.CacheBytes = DefaultCacheBytes
	}
	fi, err := os.Stat(path)
	if err != nil {
		return nil, &Error{File: path, Msg: "cannot open the footage: " + errText(err), Err: err}
	}
	s := &Sequence{path: path, maxPix: opt.MaxPixels, cache: newFrameCache(opt.CacheBytes)}
	limitProcessMemory(opt.CacheBytes)
	if fi.IsDir() {
		err = s.openFolder(path)
	} else {
		err = s.openFile(path, opt)
	}
	if err != nil {
		return nil, err
	}
	s.fps = opt.FPS
	if s.fps == (physics.Rate{}) {
		s.fps = physics.Rate{Num: DefaultFPS, Den: 1}
		if s.gif != nil && s.gif.rate.Valid() {
			s.fps = s.gif.rate
		}
	}
	return s, nil
}

// openFile opens a single file, which must be a GIF.
func (s *Sequence) openFile(path string, opt Options) error {
	f, err := fsutil.OpenRegular(path)
	if err != nil {
		return &Error{File: path, Msg: "cannot open the footage: " + errText(err), Err: err}
	}
	defer f.Close()
	var magic [6]byte
	if _, err := io.ReadFull(f, magic[:]); err != nil || !(bytes.Equal(magic[:], []byte("GIF87a")) || bytes.Equal(magic[:], []byte("GIF89a"))) {
		return &Error{File: path, Msg: "not a folder of PNG or JPEG frames nor an animated GIF"}
	}
	if _, err := f.Seek(0, io.SeekStart); err != nil {
		return &Error{File: path, Msg: "cannot read: " + errText(err), Err: err}
	}
	g, cacheBytes, err := loadGIF(path, f, opt.MaxPixels, opt.CacheBytes)
	if err != nil {
		return err
	}
	s.gif = g
	s.w, s.h = g.w, g.h
	s.n = len(g.frames)
	s.cache = newFrameCache(cacheBytes)
	return nil
}

// Path returns the folder or GIF file the sequence was opened from.
func (s *Sequence) Path() string { return s.path }

// Len returns the number of frames.
func (s *Sequence) Len() int { return s.n }

// Size returns the frame size in pixels (a GIF's logical screen).
func (s *Sequence) Size() (w, h int) { return s.w, s.h }

// FPS returns the footage's own frame rate: Options.FPS, else the GIF's
// rate, else DefaultFPS.
func (s *Sequence) FPS() physics.Rate { return s.fps }

// Name returns the display name of frame i: the file name for a folder,
// "clip.gif#i" for a GIF; "" when i is out of range.
func (s *Sequence) Name(i int) string {
	if i < 0 || i >= s.n {
		return ""
	}
	if s.gif != nil {
		return fmt.Sprintf("%s#%d", filepath.Base(s.path), i)
	}
	return s.names[i]
}

// TimeOf returns the time of frame i in seconds from the first frame of
// the clip, i / fps at the footage's own rate.
func (s *Sequence) TimeOf(i int) float64 { return s.fps.Time(i) }

// FrameAt returns the footage frame to show at take time t (seconds from
// release, frame 0 of the take): offset + floor(t fps) with fps the
// footage's own rate, so that a footage frame is shown from its own time
// until the next one's (a time within 1e-9 frame of a frame counts as that
// frame, as physics.Rate.Frame). offset is the footage frame of the
// release. ok is false when that frame is outside the clip or t is not
// finite.
func (s *Sequence) FrameAt(t float64, offset int) (int, bool) {
	if math.IsNaN(t) || math.IsInf(t, 0) {
		return 0, false
	}
	f := math.Floor(t*s.fps.FPS()+1e-9) + float64(offset)
	if !(f >= 0 && f < float64(s.n)) {
		return 0, false
	}
	return int(f), true
}

// Frame returns frame i decoded (a GIF frame composited onto its logical
// screen). Images come from a cache shared by all callers: do not modify
// them. A frame that cannot be read or decoded gives an error naming its
// file; the other frames stay usable. Frame is safe for concurrent use, and
// concurrent calls for the same frame decode it once.
func (s *Sequence) Frame(i int) (image.Image, error) {
	if i < 0 || i >= s.n {
		return nil, &Error{File: s.path, Msg: fmt.Sprintf("frame %d is outside the footage (frames 0 to %d)", i, s.n-1)}
	}
	if s.gif != nil {
		img, err := s.cache.get(i, s.gif.compositeCost(), func() (image.Image, error) { return s.gif.composite(i, s.cache) })
		if err != nil {
			var fe *Error
			if !errors.As(err, &fe) {
				err = &Error{File: s.Name(i), Msg: "cannot decode the GIF: " + err.Error(), Err: err}
			}
		}
		return img, err
	}
	img, err := s.cache.get(i, s.costs[i], func() (image.Image, error) { return decodeFrame(s.files[i], s.w, s.h, s.maxPix, s.costs[i]) })
	var oc *errOverCap
	if errors.As(err, &oc) {
		err = &Error{File: s.files[i], Msg: oc.Error(), Err: err}
	}
	return img, err
}

// errText returns the message of a file-system error without the path,
// which the caller names itself.
func errText(err error) string {
	if pe, ok := err.(*os.PathError); ok {
		return pe.Err.Error()
	}
	return err.Error()
}
