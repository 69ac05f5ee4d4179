package cli

import (
	"bytes"
	"fmt"
	"io"
	"strings"

	"propflight/app/export"
	"propflight/app/fsutil"
	"propflight/app/sheet"
	"propflight/physics"
	"propflight/widgets/wire"
)

// Default PNG sequence size (720p, common practice for reference overlays).
const (
	defaultPNGWidth  = 1280
	defaultPNGHeight = 720
)

// runExport writes the take in cmd.Format to cmd.Output ("-": out, which
// Run copies to standard output). Files are written atomically.
func runExport(out io.Writer, cmd Command) error {
	f, err := loadAndFly(cmd)
	if err != nil {
		return err
	}
	in := export.Input{Name: f.scene.Name, Prop: &f.scene.Prop, Mass: &f.scene.Mass, Throw: &f.scene.Throw, Take: f.take}
	switch cmd.Format {
	case "png":
		return runPNG(out, cmd, in)
	case "gltf":
		binary := !strings.EqualFold(extension(cmd.Output), ".gltf")
		return writeOut(out, cmd.Output, func(w io.Writer) error {
			return export.WriteGLTF(w, in, export.GLTFOptions{Binary: binary})
		}, fmt.Sprintf("%d frames of %s as glTF 2.0", f.take.LandingFrame+1, f.scene.Name))
	}
	write := export.WriteCSV
	what := fmt.Sprintf("%d frames of %s", f.take.LandingFrame+1, f.scene.Name)
	if cmd.Twos {
		write = export.WriteCSVTwos
		what = fmt.Sprintf("%d rows of %s on twos", len(export.OnTwos(f.take)), f.scene.Name)
	}
	return writeOut(out, cmd.Output, func(w io.Writer) error { return write(w, f.take) }, what)
}

// writeOut writes with write to path atomically, or to out when path is
// "-", and then reports what it wrote.
func writeOut(out io.Writer, path string, write func(io.Writer) error, what string) error {
	if path == "-" {
		return write(out)
	}
	if err := fsutil.WriteAtomic(path, write); err != nil {
		return fmt.Errorf("%s: cannot write: %w", path, err)
	}
	fmt.Fprintf(out, "wrote %s: %s\n", path, what)
	return nil
}

func runPNG(out io.Writer, cmd Command, in export.Input) error {
	opt := export.PNGOptions{Width: cmd.Width, Height: cmd.Height, View: wire.Front, Twos: cmd.Twos, Onion: cmd.Onion, Transparent: cmd.Transparent}
	if opt.Width == 0 {
		opt.Width = defaultPNGWidth
	}
	if opt.Height == 0 {
		opt.Height = defaultPNGHeight
	}
	switch cmd.View {
	case "side":
		opt.View = wire.Side
	case "top":
		opt.View = wire.Top
	case "free":
		opt.View = wire.Free
	}
	if err := opt.Validate(); err != nil {
		return usagef("export: --%v", err)
	}
	files, err := export.WritePNGSequence(cmd.Output, in, opt, nil)
	if err != nil {
		return fmt.Errorf("%s: %w", cmd.Output, err)
	}
	fmt.Fprintf(out, "wrote %d images of %s into %s (%dx%d, %s view)\n", len(files), in.Name, cmd.Output, opt.Width, opt.Height, opt.View)
	return nil
}

// runSheet writes the timing sheet PDF.
func runSheet(out io.Writer, cmd Command) error {
	f, err := loadAndFly(cmd)
	if err != nil {
		return err
	}
	thr := physics.DefaultThresholds()
	in := sheet.Input{Name: f.scene.Name, Scene: f.scene, Verdict: f.verdict, Take: f.take, Thresholds: &thr}
	var buf bytes.Buffer
	if err := sheet.Write(&buf, in, sheet.Options{Paper: cmd.Paper, Twos: cmd.Twos}); err != nil {
		return err
	}
	return writeOut(out, cmd.Output, func(w io.Writer) error { _, err := w.Write(buf.Bytes()); return err },
		fmt.Sprintf("timing sheet of %s, %d frames", f.scene.Name, f.take.LandingFrame+1))
}
