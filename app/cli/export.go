package cli

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"slices"
	"strconv"
	"strings"

	"propflight/app/export"
	"propflight/app/fsutil"
	"propflight/app/project"
	"propflight/internal/printable"
	"propflight/physics"
	"propflight/widgets/wire"
)

// outputFlag is -o of export and sheet.
var outputFlag = &Flag{Name: "--output", Aliases: []string{"-o"}, Value: "OUT", Help: `where to write; "-" is standard output`}

// forceFlag is --force of the commands that write files.
var forceFlag = &Flag{Name: "--force", Help: "replace an output file even if it is read-only"}

// twosFlag is --twos of export and sheet.
var twosFlag = &Flag{Name: "--twos", Help: "every other frame, each pose held two frames (on twos)"}

// startFrameFlag is --start-frame of export and sheet.
var startFrameFlag = &Flag{Name: "--start-frame", Value: "N", Kind: Int, Default: "0",
	Help: "the number of the release frame (a shot: 1001)"}

// Export formats: the values of --format.
var formats = []string{"csv", "gltf", "png"}

// Default PNG sequence size (720p, common practice for reference overlays).
const (
	defaultPNGWidth  = 1280
	defaultPNGHeight = 720
)

// pngFlags go with --format png only.
var pngFlags = []*Flag{
	{Name: "--width", Value: "W", Kind: Int, Default: strconv.Itoa(defaultPNGWidth), Help: "png: image width in pixels"},
	{Name: "--height", Value: "H", Kind: Int, Default: strconv.Itoa(defaultPNGHeight), Help: "png: image height in pixels"},
	{Name: "--view", Value: "VIEW", Choices: []string{"front", "side", "top", "free"}, Default: "front", Help: "png: camera (front looks along -z, side along -x)"},
	{Name: "--onion", Value: "N", Kind: Int, Default: "0", Help: "png: onion-skin frames drawn before and after each frame"},
	{Name: "--transparent", Help: "png: no background, for compositing"},
}

func init() {
	register(&Spec{
		Name: "export", Order: 30,
		Synopsis: "FILE --format csv|gltf|png -o OUT",
		Summary:  "write the take: CSV rows, glTF 2.0 or PNG frames",
		About: "Write the take: CSV rows (one per frame, DESIGN.md columns), a glTF 2.0\n" +
			"animation (.glb binary or .gltf JSON), or a folder of numbered PNG frames.\n" +
			"Without --format the extension of OUT decides (.csv, .glb, .gltf).",
		Operand: "FILE",
		Flags: append([]*Flag{
			presetFlag,
			{Name: "--format", Value: "FORMAT", Choices: formats, Help: "what to write; without it the extension of OUT decides"},
			outputFlag,
			forceFlag,
			twosFlag,
			startFrameFlag,
			{Name: "--up", Value: "AXIS", Choices: []string{"y", "z"}, Default: "y",
				Help: "csv: up axis; z writes (x, y, z) as (x, -z, y)"},
		}, pngFlags...),
		Check: checkExport,
		Run:   runExport,
	})
}

// checkExport requires an output and a known format; without --format the
// output's extension names it.
func checkExport(cmd *Command) error {
	out := cmd.Text("--output")
	if out == "" {
		return usagef("export: -o OUT is required (use -o - for standard output)")
	}
	if !cmd.Has("--format") {
		ext := strings.ToLower(strings.TrimPrefix(extension(out), "."))
		if ext == "glb" {
			ext = "gltf"
		}
		if !slices.Contains(formats, ext) {
			return usagef("export: --format is required (%s)", strings.Join(formats, ", "))
		}
		cmd.SetValue("--format", ext)
	}
	format := cmd.Text("--format")
	if format != "png" && slices.ContainsFunc(pngFlags, func(f *Flag) bool { return cmd.Has(f.Name) }) {
		return usagef("export: --width, --height, --view, --transparent and --onion go with --format png")
	}
	if cmd.Switch("--twos") && format == "gltf" {
		return usagef("export: --twos goes with csv or png (glTF keys every frame so any package can re-time it)")
	}
	if cmd.Has("--start-frame") && format == "gltf" {
		return usagef("export: --start-frame goes with csv or png (glTF keys are in seconds from release)")
	}
	if n := cmd.Int("--start-frame"); n < 0 || n > export.MaxStartFrame {
		return usagef("export: --start-frame: must be 0 to %d, not %d", export.MaxStartFrame, n)
	}
	if cmd.Text("--up") == "z" && format != "csv" {
		return usagef("export: --up z goes with csv (glTF 2.0 is y up by its specification; PNG frames are pictures)")
	}
	if format == "png" && out == "-" {
		return usagef("export: a PNG sequence needs a folder: -o DIR")
	}
	return nil
}

// runExport writes the take in the chosen format to -o ("-": out, which
// Run copies to standard output). Files are written atomically. A limit of
// the export (PNG images, glTF keys) is reported on the project's field.
func runExport(out io.Writer, cmd *Command) error {
	f, err := loadAndFly(cmd)
	if err != nil {
		return err
	}
	err = exportTake(out, cmd, f)
	var fe *physics.FieldError
	if errors.As(err, &fe) {
		return &project.Error{File: f.src.label, Field: fe.Field, Msg: fe.Msg}
	}
	return err
}

// exportTake writes the flown take as runExport describes.
func exportTake(out io.Writer, cmd *Command, f *flight) error {
	in := export.Input{Name: f.scene.Name, Prop: &f.scene.Prop, Mass: &f.scene.Mass, Throw: &f.scene.Throw, Take: f.take}
	dest := cmd.Text("--output")
	switch cmd.Text("--format") {
	case "png":
		return runPNG(out, cmd, in)
	case "gltf":
		binary := !strings.EqualFold(extension(dest), ".gltf")
		return writeOut(out, cmd, dest, func(w io.Writer) error {
			return export.WriteGLTF(w, in, export.GLTFOptions{Binary: binary})
		}, fmt.Sprintf("%d frames of %s as glTF 2.0", f.take.LandingFrame+1, printable.String(f.scene.Name)))
	}
	opt := export.CSVOptions{Twos: cmd.Switch("--twos"), StartFrame: cmd.Int("--start-frame"), ZUp: cmd.Text("--up") == "z"}
	what := fmt.Sprintf("%d frames of %s", f.take.LandingFrame+1, printable.String(f.scene.Name))
	if opt.Twos {
		what = fmt.Sprintf("%d rows of %s on twos", len(export.OnTwos(f.take)), printable.String(f.scene.Name))
	}
	if opt.StartFrame != 0 {
		what += fmt.Sprintf(" from frame %d", opt.StartFrame)
	}
	if opt.ZUp {
		what += ", z up"
	}
	return writeOut(out, cmd, dest, func(w io.Writer) error { return export.WriteCSVWith(w, f.take, opt) }, what)
}

// writeOut writes with write to path atomically, or to out when path is
// "-", and then reports what it wrote. A read-only file is replaced only
// with --force; a symbolic link stays a link to the file it names.
func writeOut(out io.Writer, cmd *Command, path string, write func(io.Writer) error, what string) error {
	if path == "-" {
		return write(out)
	}
	if err := fsutil.WriteFile(path, fsutil.Options{ReplaceReadOnly: cmd.Switch("--force")}, write); err != nil {
		return writeError(path, err)
	}
	fmt.Fprintf(out, "wrote %s: %s\n", printable.String(path), what)
	return nil
}

// writeError describes a failure to write the output path: a read-only
// file is the user's to decide on and a folder is a mistake in -o (exit 2,
// with the way out); other
// failures keep their cause. The message names the output, never a
// temporary file.
func writeError(path string, err error) error {
	if errors.Is(err, fsutil.ErrReadOnly) {
		return usagef("%s: the file is read-only; give --force to replace it", path)
	}
	if errors.Is(err, fsutil.ErrFolder) {
		return usagef("%s: is a folder; give -o a file name", path)
	}
	var pe *fs.PathError
	if errors.As(err, &pe) && pe.Path == path {
		err = pe.Err
	}
	return fmt.Errorf("%s: cannot write: %w", path, err)
}

// views maps --view's values to cameras.
var views = map[string]wire.View{"front": wire.Front, "side": wire.Side, "top": wire.Top, "free": wire.Free}

func runPNG(out io.Writer, cmd *Command, in export.Input) error {
	opt := export.PNGOptions{
		Width: cmd.Int("--width"), Height: cmd.Int("--height"), View: views[cmd.Text("--view")],
		Twos: cmd.Switch("--twos"), Onion: cmd.Int("--onion"), Transparent: cmd.Switch("--transparent"),
		StartFrame:      cmd.Int("--start-frame"),
		ReplaceReadOnly: cmd.Switch("--force"),
	}
	if err := opt.Validate(); err != nil {
		return usagef("export: --%v", err)
	}
	dir := cmd.Text("--output")
	files, err := export.WritePNGSequence(dir, in, opt, cmd.progress.start("writing PNG frames"))
	if err != nil {
		var pe *fs.PathError
		if errors.As(err, &pe) {
			return writeError(pe.Path, err)
		}
		return fmt.Errorf("%s: %w", dir, err)
	}
	fmt.Fprintf(out, "wrote %d images of %s into %s (%dx%d, %s view)\n", len(files), printable.String(in.Name), printable.String(dir), opt.Width, opt.Height, opt.View)
	return nil
}
