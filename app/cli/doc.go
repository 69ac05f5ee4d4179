// Package cli is Propflight's command line: it parses the arguments
// (Parse), runs the batch commands without a window (Run) and maps every
// outcome to an exit status: ExitOK 0, ExitInput 2 (bad input or usage),
// ExitFailure 1 (anything else) (DESIGN.md "Contracts", CLI).
//
// To add a command, add one file NAME.go (see sheet.go or
// fit.go), whose init function calls register(&Spec{...}) with the
// command's Name, Order (its place in the overview: between its
// neighbours'), Synopsis, Summary and About text, its Operand (FILE,
// MARKS.csv, ...; empty for none), its Flags (each a *Flag: Name, Aliases,
// Value placeholder or "" for a switch, Kind Int/Number/Text, Choices,
// Default, one Help line), an optional Check (flags that go together) and
// its Run function, which reads c.File, c.Text, c.Int, c.Float, c.Switch
// and writes its report to out. To add a flag to an existing command,
// append a *Flag to its Flags (share one *Flag value, like presetFlag,
// when several commands have it) and read it in its Run. Parse, the
// overview, "propflight help NAME" (= "propflight NAME --help"), the
// defaults shown and the "does not apply here" messages all come from the
// declarations; then run `go test ./app/cli -run Help -update` and read
// the new page in testdata/help/ before committing it.
//
// Errors are one line on stderr naming the file and the field, for
// example
//
//	propflight: pan.json: prop.parts[0].mass: must be positive
//
// and nothing is written to stdout then. Run never lets a panic escape: it
// prints one line and returns 1. A command returns a *UsageError for a
// mistake in the command line, a *project.Error, *physics.FieldError or
// *footage.Error for bad input (exit 2 all), any other error for exit 1.
//
// Units in the output follow the project: SI (m, kg, s), angles in
// degrees, frames counted from release (frame 0), frame n at n / fps.
package cli
