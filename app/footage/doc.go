// Package footage loads reference footage (a folder of numbered PNG or
// JPEG frames, or an animated GIF), reads and writes the user's marks on
// it, and fits the marks: a parabola through the marked centres gives
// gravity in pixels and, with the footage's frame rate and a known gravity,
// the scale in metres per pixel; the marked orientation gives the prop's
// turn per frame.
//
// Frames and units:
//   - Footage frames are numbered from 0: frame i is the i-th file of the
//     folder in natural order (frame2 before frame10), or the i-th image
//     of the GIF. Footage frame i is at TimeOf(i) = i / fps seconds from
//     the start of the clip, fps the footage's own frame rate, which may
//     differ from the take's: [Sequence.FrameAt] maps a take time to a
//     footage frame through time and a frame offset.
//   - Image pixels, as in package widgets/wire: origin at the top-left
//     corner, x to the right, y down; pixel (i, j) covers [i, i+1) x
//     [j, j+1), so a w x h image spans [0, w] x [0, h] in the continuous
//     coordinates that marks use.
//   - Fits keep the image's y-down axis for the raw coefficients (a real
//     throw curves with c2 > 0) and report velocities with y UP, like the
//     world. Angles are degrees, counter-clockwise positive as seen on the
//     screen; SI units (metres, seconds) appear only once a scale is known.
//
// Limits: Open reads every frame's header first ([image.DecodeConfig],
// a cheap read) and refuses a frame that declares more than
// Options.MaxPixels pixels or a side over mark.MaxCoord, naming the file, so
// a hostile or broken header cannot make the program allocate gigabytes.
// Options.CacheBytes bounds the footage's memory in the process: decoded
// frames are kept in a least-recently-used cache that also reserves each
// decode's cost (from the declared size) before it starts, a GIF is decoded
// a frame at a time with checkpoints, and Open sets a soft memory limit
// for the process (memlimit.go) so that garbage is collected in time.
// [Sequence.Frame] is safe for concurrent use. Marks files are read up to
// MaxMarksFileBytes; marks must lie inside the image where it is known
// ([CheckBounds]).
//
// Every problem with a file or a value is an [*Error] naming the file and,
// where there is one, the line and the column or option:
//
//	marks.csv: line 4: x: not a number
//	shots/pan/frame0007.png: declares 50000x50000 pixels (2500 megapixels); the limit is 40 megapixels
//
// This package has no UI; the window and the command line use it.
package footage
