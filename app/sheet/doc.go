// Package sheet writes the timing sheet: a printable PDF of a take for the
// animation desk. Write lays it out on A4 or US letter paper:
//
//   - page 1, the summary: the project name, the verdict in plain words with
//     its numbers, the prop's parts and mass properties, the throw, and a
//     side-view chart of the centre-of-mass arc with a tick at every frame;
//   - the poses: the prop drawn at the keys, the breakdowns and every Nth
//     frame, as vector lines from the same 2D segments the preview
//     rasterises (widgets/wire), so paper and screen agree;
//   - the frame table: one row per frame (every other frame on twos) with
//     timecode, centre of mass, spacing, turn and marks, its column heads
//     repeated on every page.
//
// Every page carries the safety caution of DEVELOPERS.md and "page N of M".
//
// Units and frames: the world is right-handed with +Y up, in metres (glTF
// 2.0); the prop frame is the frame the parts are authored in. The sheet
// prints metres to 4 decimals, degrees to 2 (turn per row) or 1 (total
// turn), and seconds to 3; negative numbers use the real minus sign U+2212.
// Frame 0 is release; frame n is at n / fps seconds. Page coordinates are
// millimetres from the top-left corner of the page, y down.
//
// The text is set in the Go fonts (golang.org/x/image/font/gofont, BSD
// licence), embedded as UTF-8 TrueType subsets so that degree signs, minus
// signs and superscripts print. The bytes are deterministic: a fixed
// creation date and sorted catalogues, so equal input gives an equal file.
package sheet
