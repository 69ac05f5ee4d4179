// Package cli is Propflight's command line: it parses the arguments
// (Parse), runs the batch commands without a window (Run) and maps every
// outcome to an exit status: 0 ok, 2 bad input or usage, 1 any other
// failure (DESIGN.md "Contracts", CLI).
//
// Errors are one line on stderr naming the file and the field, for
// example
//
//	propflight: pan.json: prop.parts[0].mass: must be positive
//
// and nothing is written to stdout then. Run never lets a panic escape: it
// prints one line and returns 1.
//
// Units in the output follow the project: SI (m, kg, s), angles in
// degrees, frames counted from release (frame 0), frame n at n / fps.
package cli
