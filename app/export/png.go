package export

import (
	"errors"
	"fmt"
	"image"
	"image/color"
	"image/png"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"propflight/app/fsutil"
	"propflight/physics"
	"propflight/widgets/wire"
)

// PNG sequence limits.
const (
	MinPNGSize = 16   // smallest image side, pixels
	MaxPNGSize = 8192 // largest image side, pixels
	MaxOnion   = 24   // most onion-skin frames on each side
	// MaxPNGImages is the most images one sequence writes: 10000 frames is
	// nearly seven minutes at 24 fps, and at 1280 x 720 about a gigabyte
	// of files and a few minutes of work.
	MaxPNGImages = 10000
)

// ErrCancelled is returned by an export stopped through its Cancel channel.
var ErrCancelled = errors.New("export: cancelled")

// PNGOptions control WritePNGSequence.
type PNGOptions struct {
	Width, Height int       // image size in pixels, each MinPNGSize to MaxPNGSize
	View          wire.View // where the camera looks from (wire.Front, Side, Top or Free)
	// Twos renders one image per drawing on twos: frames 0, 2, 4, ...
	// (each file is still named by its frame number).
	Twos bool
	// StartFrame is added to the frame number in each file name, so a
	// sequence starting at 1001 drops into a shot (REFERENCES.md §13);
	// 0 to MaxStartFrame.
	StartFrame int
	// Onion is the number of onion-skin frames of the take drawn on each
	// side of the current one (0 to MaxOnion).
	Onion int
	// Transparent leaves the background fully transparent (alpha 0), for
	// laying the sequence over footage in a compositing tool; otherwise
	// the background is the screen palette's dark slate.
	Transparent bool
	// Cancel, when not nil, stops the sequence with ErrCancelled before the
	// next image once it is closed; the images already written stay (each
	// is whole).
	Cancel <-chan struct{}
	// Guides adds the centre-of-mass arc with a tick at every frame and
	// the ground grid; without it only the prop (and its onion skin) is
	// drawn.
	Guides bool
	// ReplaceReadOnly replaces frame files that are read-only; without it
	// such a file stops the sequence with an error wrapping
	// fsutil.ErrReadOnly (see fsutil.Options).
	ReplaceReadOnly bool
}

// maxPNGStem bounds the file-name stem taken from the take's name, bytes:
// with "_", the frame number and ".png" the name stays far under the 255
// bytes file systems allow, and so does the temporary file's.
const maxPNGStem = 100

// Validate reports the first bad option, naming its field.
func (o *PNGOptions) Validate() error {
	switch {
	case o.Width < MinPNGSize || o.Width > MaxPNGSize:
		return fmt.Errorf("width: must be %d to %d pixels, not %d", MinPNGSize, MaxPNGSize, o.Width)
	case o.Height < MinPNGSize || o.Height > MaxPNGSize:
		return fmt.Errorf("height: must be %d to %d pixels, not %d", MinPNGSize, MaxPNGSize, o.Height)
	case o.View < wire.Front || o.View > wire.Free:
		return fmt.Errorf("view: must be front, side, top or free")
	case o.Onion < 0 || o.Onion > MaxOnion:
		return fmt.Errorf("onion: must be 0 to %d frames, not %d", MaxOnion, o.Onion)
	case o.StartFrame < 0 || o.StartFrame > MaxStartFrame:
		return fmt.Errorf("start-frame: must be 0 to %d, not %d", MaxStartFrame, o.StartFrame)
	}
	return nil
}

// WritePNGSequence renders the take into dir, one PNG image per frame (on
// twos, per even frame), named NAME_0000.png by frame number (plus
// opt.StartFrame) with enough
// zero padding for the last frame (at least four digits). NAME is
// in.Name with every character other than letters, digits, '-', '_' and
// '.' replaced by '_' ("take" when empty), shortened to 100 bytes
// (fsutil.ShortName) when longer. dir is created if missing; temporary
// files that a killed export of the same name left in it are removed.
//
// The camera is framed once on the whole take (wire.Bounds and
// Camera.Frame), so the prop stays in view and at one scale across the
// sequence. Lines use the screen palette (wire.DefaultPalette).
//
// Each file is written atomically (app/fsutil.WriteAtomic). progress, when
// not nil, is called after each file with the files done and the total.
// It returns the paths written, in frame order; on an error, the paths
// written before it.
//
// It stays one function: the checks, the one framing of the whole take and
// the frame loop with its progress, cancellation and partial file list share
// their state, and the loop reads best whole.
func WritePNGSequence(dir string, in Input, opt PNGOptions, progress func(done, total int)) ([]string, error) {
	if err := opt.Validate(); err != nil {
		return nil, err
	}
	if in.Take == nil || len(in.Take.Frames) == 0 {
		return nil, errors.New("export: the take has no frames to render as PNG")
	}
	if in.Prop == nil || len(in.Prop.Parts) == 0 {
		return nil, errors.New("export: no prop to render as PNG")
	}
	mp := in.Mass
	if mp == nil {
		m, err := in.Prop.MassProps()
		if err != nil {
			return nil, fmt.Errorf("export: PNG frames: %w", err)
		}
		mp = &m
	}
	if images := pngImages(len(in.Take.Frames), opt.Twos); images > MaxPNGImages {
		hint := "export on twos or lower the frame rate"
		if opt.Twos {
			hint = "lower the frame rate"
		}
		return nil, &physics.FieldError{Field: "throw.fps", Msg: fmt.Sprintf("the take needs %d PNG images, more than the %d a sequence may have: %s", images, MaxPNGImages, hint)}
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, err
	}

	var groundY float64
	if in.Throw != nil {
		groundY = in.Throw.GroundY
	}
	sc := wire.Scene{Prop: in.Prop, Mass: mp, Take: in.Take, OnionBefore: opt.Onion, OnionAfter: opt.Onion,
		ShowArc: opt.Guides, ShowTicks: opt.Guides, ShowGrid: opt.Guides, GroundY: groundY}
	cam := wire.NewCamera(opt.View, opt.Width, opt.Height)
	cam.Frame(wire.Bounds(sc))
	pal := wire.DefaultPalette()
	if opt.Transparent {
		pal.Background = color.NRGBA{}
	}

	frames := in.Take.Frames
	step := 1
	if opt.Twos {
		step = 2
	}
	total := (len(frames) + step - 1) / step
	last := frames[len(frames)-1].N + opt.StartFrame
	digits := max(4, len(strconv.Itoa(last)))
	base := pngBaseName(in.Name)
	fsutil.RemoveStale(dir, func(name string) bool {
		return strings.HasPrefix(name, base+"_") && strings.HasSuffix(name, ".png")
	})
	wopt := fsutil.Options{ReplaceReadOnly: opt.ReplaceReadOnly, KeepStale: true}
	enc := png.Encoder{CompressionLevel: png.DefaultCompression}
	var painter wire.Painter
	img := image.NewRGBA(image.Rect(0, 0, opt.Width, opt.Height)) // reused: each file is encoded before the next frame
	var paths []string
	for i := 0; i < len(frames); i += step {
		if opt.Cancel != nil {
			select {
			case <-opt.Cancel:
				return paths, ErrCancelled
			default:
			}
		}
		sc.Frame = i
		d := wire.Draw(cam, sc)
		painter.Paint(img, d, pal) // fills the background first
		name := fmt.Sprintf("%s_%0*d.png", base, digits, frames[i].N+opt.StartFrame)
		path := filepath.Join(dir, name)
		if err := fsutil.WriteFile(path, wopt, func(w io.Writer) error { return enc.Encode(w, img) }); err != nil {
			return paths, err
		}
		paths = append(paths, path)
		if progress != nil {
			progress(len(paths), total)
		}
	}
	return paths, nil
}

// pngImages is the number of images of a take of n frames, on ones or on
// twos.
func pngImages(n int, twos bool) int {
	if twos {
		return (n + 1) / 2
	}
	return n
}

// pngBaseName makes a file-name stem of a take's name.
func pngBaseName(name string) string {
	var b strings.Builder
	for _, r := range strings.TrimSpace(name) {
		switch {
		case r >= 'a' && r <= 'z', r >= 'A' && r <= 'Z', r >= '0' && r <= '9', r == '-', r == '_', r == '.':
			b.WriteRune(r)
		default:
			b.WriteByte('_')
		}
	}
	s := strings.Trim(b.String(), ".")
	if s == "" {
		return "take"
	}
	return fsutil.ShortName(s, maxPNGStem)
}
