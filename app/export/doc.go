// Package export writes a take for other programs: CSV rows (on ones with
// [WriteCSV] and [WriteCSVWith], on twos with [WriteCSVTwos]), a glTF 2.0
// file with the prop's triangles and its animation ([WriteGLTF]) and a PNG
// image a frame ([WritePNGSequence], drawn by widgets/wire as on screen).
//
// Frames and units are the project's: world right-handed, +Y up, metres,
// seconds, orientations as unit quaternions from the prop frame to the
// world, frame n at n / fps from release. [CSVOptions] ZUp (--up z) writes
// the CSV's rows in a z-up world for packages that want one ([ZUpVec],
// [ZUpFrame]); glTF is always y up (Specification 2.0.1, §3.4).
//
// Writers take an io.Writer (PNG frames a folder) and give the same bytes
// for the same take. Errors: an option out of range names its field, as
// the project file and the flags spell it ("width: must be 16 to 8192
// pixels, not 5"), so that the command line can say "--width" and the
// window its control; every other error starts with "export: ".
package export
