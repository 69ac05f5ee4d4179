package cli

import (
	"errors"
	"reflect"
	"testing"
)

// want is what a parsed command line must hold: the command (help's
// topic after a slash, "help/check"), the operand and the given flags.
type want struct {
	name, file string
	flags      map[string]string
}

func TestParse_Commands(t *testing.T) {
	for _, c := range []struct {
		args []string
		want want
	}{
		{nil, want{"", "", map[string]string{}}},
		{[]string{"check"}, want{"check", "", map[string]string{}}},
		{[]string{"check", "pan.json"}, want{"check", "pan.json", map[string]string{}}},
		{[]string{"check", "pan.json", "--json"}, want{"check", "pan.json", map[string]string{"--json": ""}}},
		{[]string{"check", "--json", "pan.json"}, want{"check", "pan.json", map[string]string{"--json": ""}}},
		{[]string{"--json", "check", "pan.json"}, want{"check", "pan.json", map[string]string{"--json": ""}}},
		{[]string{"check", "--preset", "loaf"}, want{"check", "", map[string]string{"--preset": "loaf"}}},
		{[]string{"check", "--preset=loaf", "--json"}, want{"check", "", map[string]string{"--preset": "loaf", "--json": ""}}},
		{[]string{"check", "--", "-odd.json"}, want{"check", "-odd.json", map[string]string{}}},
		{[]string{"export", "pan.json", "--format", "csv", "-o", "out.csv"}, want{"export", "pan.json", map[string]string{"--format": "csv", "--output": "out.csv"}}},
		{[]string{"export", "--format=CSV", "-o=out.txt", "pan.json"}, want{"export", "pan.json", map[string]string{"--format": "csv", "--output": "out.txt"}}},
		{[]string{"export", "pan.json", "--output", "-", "--format", "csv"}, want{"export", "pan.json", map[string]string{"--format": "csv", "--output": "-"}}},
		{[]string{"export", "pan.json", "--output=t.csv"}, want{"export", "pan.json", map[string]string{"--format": "csv", "--output": "t.csv"}}},
		{[]string{"export", "pan.json", "-o", "dir.v2/take.CSV"}, want{"export", "pan.json", map[string]string{"--format": "csv", "--output": "dir.v2/take.CSV"}}},
		{[]string{"export", "pan.json", "-oshot.glb"}, want{"export", "pan.json", map[string]string{"--format": "gltf", "--output": "shot.glb"}}},
		{[]string{"export", "--preset", "loaf", "-o", "f.png"}, want{"export", "", map[string]string{"--preset": "loaf", "--format": "png", "--output": "f.png"}}},
		{[]string{"sheet", "pan.json", "-o", "s.pdf", "--paper", "Letter"}, want{"sheet", "pan.json", map[string]string{"--output": "s.pdf", "--paper": "letter"}}},
		{[]string{"pan.json"}, want{"open", "pan.json", map[string]string{}}},
		{[]string{"open", "pan.json"}, want{"open", "pan.json", map[string]string{}}},
		{[]string{"presets"}, want{"presets", "", map[string]string{}}},
		{[]string{"version"}, want{"version", "", map[string]string{}}},
		{[]string{"--version"}, want{"version", "", map[string]string{}}},
		{[]string{"help"}, want{"help", "", map[string]string{}}},
		{[]string{"-h"}, want{"help", "", map[string]string{}}},
		{[]string{"check", "--help"}, want{"help/check", "", map[string]string{}}},
		{[]string{"frobnicate", "-h"}, want{"help", "", map[string]string{}}},
		{[]string{"help", "check"}, want{"help/check", "", map[string]string{}}},
		{[]string{"help", "--", "sheet"}, want{"help/sheet", "", map[string]string{}}},
		{[]string{"fit", "--help"}, want{"help/fit", "", map[string]string{}}},
		{[]string{"fit", "m.csv", "--fps=24000/1001", "--gravity", "9.8", "--json"}, want{"fit", "m.csv", map[string]string{"--fps": "24000/1001", "--gravity": "9.8", "--json": ""}}},
		{[]string{"fit", "m.csv", "--gravity", "9.8", "--scale", "0.002"}, want{"fit", "m.csv", map[string]string{"--gravity": "9.8", "--scale": "0.002"}}},
		{[]string{"export", "p.json", "-o", "d", "--format", "png", "--view", "Side", "--width=64"}, want{"export", "p.json", map[string]string{"--format": "png", "--output": "d", "--view": "side", "--width": "64"}}},
	} {
		got, err := Parse(c.args)
		if err != nil {
			t.Errorf("Parse(%q): %v", c.args, err)
			continue
		}
		name := got.Name
		if got.Topic != "" {
			name += "/" + got.Topic
		}
		flags := got.Flags()
		if flags == nil {
			flags = map[string]string{}
		}
		if name != c.want.name || got.File != c.want.file || !reflect.DeepEqual(flags, c.want.flags) {
			t.Errorf("Parse(%q) = %s %q %v, want %+v", c.args, name, got.File, flags, c.want)
		}
	}
}

func TestParse_UsageErrors(t *testing.T) {
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"--json"}, "no command given (commands: open, check, import, export, sheet, fit, map, plan, spread, presets, version, help; see propflight --help)"},
		{[]string{"frobnicate"}, "unknown command frobnicate (commands: open, check, import, export, sheet, fit, map, plan, spread, presets, version, help; see propflight --help)"},
		{[]string{"pan.txt"}, "unknown command pan.txt (commands: open, check, import, export, sheet, fit, map, plan, spread, presets, version, help; see propflight --help)"},
		{[]string{"check", "--jsno"}, "unknown flag --jsno (did you mean --json?) (see propflight --help)"},
		{[]string{"check", "--pre", "loaf"}, "unknown flag --pre (did you mean --preset?) (see propflight --help)"},
		{[]string{"check", "-x"}, "unknown flag -x (see propflight --help)"},
		{[]string{"check", "--json=yes"}, "--json takes no value"},
		{[]string{"check", "--json", "--json"}, "--json given twice (as --json and --json)"},
		{[]string{"export", "p.json", "-o", "a.csv", "--output", "b.csv"}, "-o given twice (as -o and --output)"},
		{[]string{"export", "p.json", "-o"}, "-o needs a value"},
		{[]string{"export", "p.json", "-o="}, "-o needs a value"},
		{[]string{"check", "--preset"}, "--preset needs a value"},
		{[]string{"check", "a.json", "b.json"}, "check: more than one FILE given (a.json and b.json)"},
		{[]string{"check", "a.json", "--preset", "loaf"}, "check: give FILE or --preset, not both"},
		{[]string{"check", "-"}, "check: reading FILE from standard input is not supported; give a file name"},
		{[]string{"check", "p.json", "--format", "csv"}, "check: --format does not apply here (it goes with export)"},
		{[]string{"check", "p.json", "-o", "x"}, "check: -o does not apply here (it goes with import or export or sheet or map)"},
		{[]string{"export", "p.json", "--json", "-o", "x.csv"}, "export: --json does not apply here (it goes with check or fit or map or plan or spread)"},
		{[]string{"presets", "--preset", "loaf"}, "presets: --preset does not apply here (it goes with check or export or sheet or map or plan or spread)"},
		{[]string{"presets", "extra"}, "presets takes no file (got extra)"},
		{[]string{"version", "x"}, "version takes no file (got x)"},
		{[]string{"check", "--version"}, "--version goes alone, not with check"},
		{[]string{"export", "p.json"}, "export: -o OUT is required (use -o - for standard output)"},
		{[]string{"export", "p.json", "-o", "take"}, "export: --format is required (csv, gltf, png)"},
		{[]string{"export", "p.json", "-o", "-"}, "export: --format is required (csv, gltf, png)"},
		{[]string{"export", "p.json", "-o", "t.csv", "--format", "obj"}, "export: --format: unknown value obj (use csv, gltf, png)"},
		{[]string{"sheet", "p.json"}, "sheet: -o OUT.pdf is required"},
		{[]string{"sheet", "p.json", "-o", "s.pdf", "--paper", "a3"}, "sheet: --paper: unknown value a3 (use a4, letter)"},
		{[]string{"help", "frobnicate"}, "help: unknown command frobnicate (commands: open, check, import, export, sheet, fit, map, plan, spread, presets, version, help)"},
		{[]string{"help", "check", "sheet"}, "help: one command at a time (got check and sheet)"},
		{[]string{"open"}, "open: give the project file to open (usage: propflight open FILE.json)"},
		{[]string{"fit"}, "fit: the marks file is missing (usage: propflight fit MARKS.csv --fps N [--gravity G] [--scale M] [--json])"},
		{[]string{"fit", "m.csv"}, "fit: --fps: required (the footage's frame rate), unless --gravity and --scale are both given to solve it"},
		{[]string{"fit", "m.csv", "--fps", "fast"}, "fit: --fps: fast must be a number or a ratio such as 24000/1001"},
		{[]string{"fit", "m.csv", "--fps", "24", "--gravity", "-9.8"}, "fit: --gravity: -9.8 must be positive (m/s^2)"},
		{[]string{"fit", "m.csv", "--fps", "24", "--scale", "NaN"}, "fit: --scale: NaN is not a number"},
		{[]string{"fit", "m.csv", "--fps"}, "--fps needs a value"},
		{[]string{"fit", "m.csv", "--fps", "24", "--fast"}, "unknown flag --fast (see propflight --help)"},
		{[]string{"fit", "m.csv", "n.csv", "--fps", "24"}, "fit: more than one MARKS.csv given (m.csv and n.csv)"},
		{[]string{"fit", "m.csv", "--fps", "24", "-o", "x"}, "fit: -o does not apply here (it goes with import or export or sheet or map)"},
		{[]string{"export", "p.json", "-o", "d", "--format", "png", "--width", "wide"}, "export: --width: wide is not a whole number"},
		{[]string{"export", "p.json", "-o", "d", "--format", "png", "--view", "under"}, "export: --view: unknown value under (use front, side, top, free)"},
		{[]string{"check", "--bad\nflag"}, `unknown flag "--bad\nflag" (see propflight --help)`},
	} {
		_, err := Parse(c.args)
		var ue *UsageError
		if !errors.As(err, &ue) {
			t.Errorf("Parse(%q): error %v is not a *UsageError", c.args, err)
			continue
		}
		if err.Error() != c.want {
			t.Errorf("Parse(%q)\n got %s\nwant %s", c.args, err, c.want)
		}
	}
}

// BenchmarkParse: a sheet command line with several flags.
func BenchmarkParse(b *testing.B) {
	args := []string{"sheet", "pan.json", "-o", "s.pdf", "--paper", "letter", "--start-frame", "1001", "--start-timecode", "01:00:00:00", "--view", "top"}
	for b.Loop() {
		if _, err := Parse(args); err != nil {
			b.Fatal(err)
		}
	}
}
