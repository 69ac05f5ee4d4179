package cli

import (
	"fmt"
	"io"

	"propflight/app/export"
	"propflight/app/fsutil"
)

// runExport writes the take in cmd.Format to cmd.Output ("-": out, which
// Run copies to standard output). A file is written atomically.
func runExport(out io.Writer, cmd Command) error {
	if cmd.Format != "csv" {
		return usagef("export: the %s format is not available yet (use --format csv)", cmd.Format)
	}
	src, err := load(cmd)
	if err != nil {
		return err
	}
	f, err := fly(src)
	if err != nil {
		return err
	}
	if cmd.Output == "-" {
		return export.WriteCSV(out, f.take)
	}
	if err := fsutil.WriteAtomic(cmd.Output, func(w io.Writer) error { return export.WriteCSV(w, f.take) }); err != nil {
		return fmt.Errorf("%s: cannot write: %w", cmd.Output, err)
	}
	fmt.Fprintf(out, "wrote %s: %d frames of %s\n", cmd.Output, f.take.LandingFrame+1, f.scene.Name)
	return nil
}
