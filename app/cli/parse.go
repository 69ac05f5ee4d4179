package cli

import (
	"fmt"
	"slices"
	"strconv"
	"strings"
)

// Command is a parsed command line.
type Command struct {
	// Name is the command: "check", "export", "sheet", "presets",
	// "version" or "help"; empty when there were no arguments at all
	// (open the window).
	Name   string
	File   string // project file; empty: the preset, or the demo
	Preset string // --preset NAME: a built-in preset instead of File
	JSON   bool   // --json (check)
	Format string // --format (export): csv, gltf or png
	Output string // -o, --output (export, sheet); "-" is standard output
	Paper  string // --paper (sheet): a4 or letter
	Twos   bool   // --twos (export csv/png, sheet): every other frame, each pose held two frames

	// PNG sequence (export --format png).
	Width, Height int    // --width, --height in pixels (default 1280 x 720)
	View          string // --view: front, side, top or free (default side)
	Transparent   bool   // --transparent: no background, for compositing
	Onion         int    // --onion N: onion-skin frames before and after
}

// UsageError is a mistake in the command line (exit status 2).
type UsageError struct{ Msg string }

func (e *UsageError) Error() string { return e.Msg }

func usagef(format string, args ...any) error {
	return &UsageError{Msg: fmt.Sprintf(format, args...)}
}

// Commands lists the command names in the order the help shows them.
var Commands = []string{"open", "check", "export", "sheet", "fit", "presets", "version", "help"}

// Export formats and sheet papers.
var (
	Formats = []string{"csv", "gltf", "png"}
	Papers  = []string{"a4", "letter"}
)

// flagSpec describes one flag: its canonical name, whether it takes a
// value, and the commands it belongs to.
type flagSpec struct {
	name     string
	value    bool
	commands []string
}

var flagSpecs = []flagSpec{
	{"--json", false, []string{"check"}},
	{"--preset", true, []string{"check", "export", "sheet"}},
	{"--format", true, []string{"export"}},
	{"--output", true, []string{"export", "sheet"}},
	{"--paper", true, []string{"sheet"}},
	{"--twos", false, []string{"export", "sheet"}},
	{"--width", true, []string{"export"}},
	{"--height", true, []string{"export"}},
	{"--view", true, []string{"export"}},
	{"--transparent", false, []string{"export"}},
	{"--onion", true, []string{"export"}},
	{"--help", false, nil},
	{"--version", false, nil},
}

// aliases maps other spellings to the canonical flag name.
var aliases = map[string]string{"-o": "--output", "-h": "--help", "-json": "--json"}

func lookupFlag(name string) (flagSpec, bool) {
	if c, ok := aliases[name]; ok {
		name = c
	}
	for _, f := range flagSpecs {
		if f.name == name {
			return f, true
		}
	}
	return flagSpec{}, false
}

// display returns how a flag is shown in messages: "-o" for output.
func display(name string) string {
	if name == "--output" {
		return "-o"
	}
	return name
}

// Parse reads the arguments after the program name. Flags may come before
// or after FILE and the command; "--" ends the flags. Flag values follow
// as the next argument or after "=" (-o OUT, -o=OUT, --output OUT,
// --output=OUT). -h or --help anywhere asks for help, --version for the
// version. Every mistake is a *UsageError.
func Parse(args []string) (Command, error) {
	var cmd Command
	if len(args) == 0 {
		return cmd, nil
	}
	seen := map[string]string{} // canonical flag -> the spelling used
	var positional []string
	help, version := false, false
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "--" {
			positional = append(positional, args[i+1:]...)
			break
		}
		if len(a) < 2 || a[0] != '-' {
			positional = append(positional, a)
			continue
		}
		name, val, hasVal := strings.Cut(a, "=")
		spec, ok := lookupFlag(name)
		if !ok && strings.HasPrefix(a, "-o") && len(a) > 2 && !hasVal {
			// -oOUT, the short form without a space.
			spec, _ = lookupFlag("-o")
			name, val, hasVal = "-o", a[2:], true
			ok = true
		}
		if !ok {
			return Command{}, usagef("unknown flag %s%s (see propflight --help)", quote(name), suggestFlag(name))
		}
		if prev, dup := seen[spec.name]; dup {
			return Command{}, usagef("%s given twice (as %s and %s)", display(spec.name), quote(prev), quote(name))
		}
		seen[spec.name] = name
		if spec.value {
			if !hasVal {
				if i+1 >= len(args) {
					return Command{}, usagef("%s needs a value", display(spec.name))
				}
				i++
				val = args[i]
			}
			if val == "" {
				return Command{}, usagef("%s needs a value", display(spec.name))
			}
		} else if hasVal {
			return Command{}, usagef("%s takes no value", display(spec.name))
		}
		switch spec.name {
		case "--json":
			cmd.JSON = true
		case "--preset":
			cmd.Preset = val
		case "--format":
			cmd.Format = strings.ToLower(val)
		case "--output":
			cmd.Output = val
		case "--paper":
			cmd.Paper = strings.ToLower(val)
		case "--twos":
			cmd.Twos = true
		case "--width", "--height", "--onion":
			n, err := strconv.Atoi(val)
			if err != nil {
				return Command{}, usagef("%s: %s is not a whole number", spec.name, quote(val))
			}
			switch spec.name {
			case "--width":
				cmd.Width = n
			case "--height":
				cmd.Height = n
			default:
				cmd.Onion = n
			}
		case "--view":
			cmd.View = strings.ToLower(val)
		case "--transparent":
			cmd.Transparent = true
		case "--help":
			help = true
		case "--version":
			version = true
		}
	}
	switch {
	case help:
		return Command{Name: "help"}, nil
	case version && len(positional) == 0:
		return Command{Name: "version"}, nil
	case len(positional) == 0:
		return Command{}, usagef("no command given (commands: %s; see propflight --help)", strings.Join(Commands, ", "))
	}
	cmd.Name = positional[0]
	files := positional[1:]
	if !slices.Contains(Commands, cmd.Name) && strings.EqualFold(extension(cmd.Name), ".json") {
		// propflight FILE.json: open the window on that project.
		cmd.Name, files = "open", positional
	}
	if !slices.Contains(Commands, cmd.Name) {
		return Command{}, usagef("unknown command %s (commands: %s; see propflight --help)", quote(cmd.Name), strings.Join(Commands, ", "))
	}
	if version {
		return Command{}, usagef("--version goes alone, not with %s", cmd.Name)
	}
	if cmd.Name == "help" {
		return Command{Name: "help"}, nil
	}
	for _, spec := range flagSpecs {
		spelled, used := seen[spec.name]
		if used && !slices.Contains(spec.commands, cmd.Name) {
			return Command{}, usagef("%s: %s does not apply here (it goes with %s)", cmd.Name, quote(spelled), strings.Join(spec.commands, " or "))
		}
	}
	takesFile := cmd.Name == "check" || cmd.Name == "export" || cmd.Name == "sheet" || cmd.Name == "open"
	switch {
	case len(files) > 0 && !takesFile:
		return Command{}, usagef("%s takes no file (got %s)", cmd.Name, quote(files[0]))
	case len(files) > 1:
		return Command{}, usagef("%s: more than one FILE given (%s and %s)", cmd.Name, quote(files[0]), quote(files[1]))
	case len(files) == 1:
		cmd.File = files[0]
	}
	if cmd.File != "" && cmd.Preset != "" {
		return Command{}, usagef("%s: give FILE or --preset, not both", cmd.Name)
	}
	if cmd.File == "-" {
		return Command{}, usagef("%s: reading a project from standard input is not supported; give a file name", cmd.Name)
	}
	switch cmd.Name {
	case "open":
		if cmd.File == "" {
			return Command{}, usagef("open: give the project file to open")
		}
	case "export":
		if err := checkExport(&cmd); err != nil {
			return Command{}, err
		}
	case "sheet":
		if cmd.Output == "" {
			return Command{}, usagef("sheet: -o OUT.pdf is required")
		}
		if cmd.Paper != "" && !slices.Contains(Papers, cmd.Paper) {
			return Command{}, usagef("sheet: unknown paper %s (use %s)", quote(cmd.Paper), strings.Join(Papers, " or "))
		}
	}
	return cmd, nil
}

// checkExport requires an output and a known format; without --format the
// output's extension names it.
func checkExport(cmd *Command) error {
	if cmd.Output == "" {
		return usagef("export: -o OUT is required (use -o - for standard output)")
	}
	if cmd.Format == "" {
		ext := strings.ToLower(strings.TrimPrefix(extension(cmd.Output), "."))
		if ext == "glb" {
			ext = "gltf"
		}
		if !slices.Contains(Formats, ext) {
			return usagef("export: --format is required (%s)", strings.Join(Formats, ", "))
		}
		cmd.Format = ext
	}
	if !slices.Contains(Formats, cmd.Format) {
		return usagef("export: unknown format %s (use %s)", quote(cmd.Format), strings.Join(Formats, ", "))
	}
	pngOnly := cmd.Width != 0 || cmd.Height != 0 || cmd.View != "" || cmd.Transparent || cmd.Onion != 0
	if pngOnly && cmd.Format != "png" {
		return usagef("export: --width, --height, --view, --transparent and --onion go with --format png")
	}
	if cmd.Twos && cmd.Format == "gltf" {
		return usagef("export: --twos goes with csv or png (glTF keys every frame so any package can re-time it)")
	}
	if cmd.Format == "png" && cmd.Output == "-" {
		return usagef("export: a PNG sequence needs a folder: -o DIR")
	}
	if cmd.View != "" && !slices.Contains(Views, cmd.View) {
		return usagef("export: --view: unknown view %s (use %s)", quote(cmd.View), strings.Join(Views, ", "))
	}
	return nil
}

// Views are the camera views of export --format png.
var Views = []string{"front", "side", "top", "free"}

// extension returns the extension of the last path element of p.
func extension(p string) string {
	base := p[strings.LastIndexAny(p, `/\`)+1:]
	if i := strings.LastIndexByte(base, '.'); i > 0 {
		return base[i:]
	}
	return ""
}

// quote shows an argument in a message, quoted when it holds anything
// unusual, cut to a readable length.
func quote(s string) string {
	r := []rune(s)
	if len(r) > 60 {
		s = string(r[:60]) + "..."
	}
	for _, c := range s {
		if c <= ' ' || c == '"' || c == '\\' || c > '~' {
			return fmt.Sprintf("%q", s)
		}
	}
	return s
}

// suggestFlag returns " (did you mean --x?)" for a near miss.
func suggestFlag(name string) string {
	bare := strings.TrimLeft(name, "-")
	for _, f := range flagSpecs {
		fb := strings.TrimPrefix(f.name, "--")
		if bare == fb || (len(bare) >= 3 && strings.HasPrefix(fb, bare)) || swapped(bare, fb) {
			return " (did you mean " + f.name + "?)"
		}
	}
	return ""
}

// swapped reports whether a and b differ by one swap of neighbours.
func swapped(a, b string) bool {
	if len(a) != len(b) || a == b {
		return false
	}
	for i := 0; i+1 < len(a); i++ {
		if a[i] != b[i] {
			return a[i] == b[i+1] && a[i+1] == b[i] && a[i+2:] == b[i+2:]
		}
	}
	return false
}
