package cli

import (
	"errors"
	"reflect"
	"testing"
)

func TestParse_Commands(t *testing.T) {
	for _, c := range []struct {
		args []string
		want Command
	}{
		{nil, Command{}},
		{[]string{"check"}, Command{Name: "check"}},
		{[]string{"check", "pan.json"}, Command{Name: "check", File: "pan.json"}},
		{[]string{"check", "pan.json", "--json"}, Command{Name: "check", File: "pan.json", JSON: true}},
		{[]string{"check", "--json", "pan.json"}, Command{Name: "check", File: "pan.json", JSON: true}},
		{[]string{"--json", "check", "pan.json"}, Command{Name: "check", File: "pan.json", JSON: true}},
		{[]string{"check", "--preset", "loaf"}, Command{Name: "check", Preset: "loaf"}},
		{[]string{"check", "--preset=loaf", "--json"}, Command{Name: "check", Preset: "loaf", JSON: true}},
		{[]string{"check", "--", "-odd.json"}, Command{Name: "check", File: "-odd.json"}},
		{[]string{"export", "pan.json", "--format", "csv", "-o", "out.csv"}, Command{Name: "export", File: "pan.json", Format: "csv", Output: "out.csv"}},
		{[]string{"export", "--format=CSV", "-o=out.txt", "pan.json"}, Command{Name: "export", File: "pan.json", Format: "csv", Output: "out.txt"}},
		{[]string{"export", "pan.json", "--output", "-", "--format", "csv"}, Command{Name: "export", File: "pan.json", Format: "csv", Output: "-"}},
		{[]string{"export", "pan.json", "--output=t.csv"}, Command{Name: "export", File: "pan.json", Format: "csv", Output: "t.csv"}},
		{[]string{"export", "pan.json", "-o", "dir.v2/take.CSV"}, Command{Name: "export", File: "pan.json", Format: "csv", Output: "dir.v2/take.CSV"}},
		{[]string{"export", "pan.json", "-oshot.glb"}, Command{Name: "export", File: "pan.json", Format: "gltf", Output: "shot.glb"}},
		{[]string{"export", "--preset", "loaf", "-o", "f.png"}, Command{Name: "export", Preset: "loaf", Format: "png", Output: "f.png"}},
		{[]string{"sheet", "pan.json", "-o", "s.pdf", "--paper", "Letter"}, Command{Name: "sheet", File: "pan.json", Output: "s.pdf", Paper: "letter"}},
		{[]string{"pan.json"}, Command{Name: "open", File: "pan.json"}},
		{[]string{"open", "pan.json"}, Command{Name: "open", File: "pan.json"}},
		{[]string{"presets"}, Command{Name: "presets"}},
		{[]string{"version"}, Command{Name: "version"}},
		{[]string{"--version"}, Command{Name: "version"}},
		{[]string{"help"}, Command{Name: "help"}},
		{[]string{"-h"}, Command{Name: "help"}},
		{[]string{"check", "--help"}, Command{Name: "help"}},
		{[]string{"frobnicate", "-h"}, Command{Name: "help"}},
		{[]string{"help", "check"}, Command{Name: "help"}},
	} {
		got, err := Parse(c.args)
		if err != nil {
			t.Errorf("Parse(%q): %v", c.args, err)
			continue
		}
		if !reflect.DeepEqual(got, c.want) {
			t.Errorf("Parse(%q) = %+v, want %+v", c.args, got, c.want)
		}
	}
}

func TestParse_UsageErrors(t *testing.T) {
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"--json"}, "no command given (commands: open, check, export, sheet, fit, presets, version, help; see propflight --help)"},
		{[]string{"frobnicate"}, "unknown command frobnicate (commands: open, check, export, sheet, fit, presets, version, help; see propflight --help)"},
		{[]string{"pan.txt"}, "unknown command pan.txt (commands: open, check, export, sheet, fit, presets, version, help; see propflight --help)"},
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
		{[]string{"check", "-"}, "check: reading a project from standard input is not supported; give a file name"},
		{[]string{"check", "p.json", "--format", "csv"}, "check: --format does not apply here (it goes with export)"},
		{[]string{"check", "p.json", "-o", "x"}, "check: -o does not apply here (it goes with export or sheet)"},
		{[]string{"export", "p.json", "--json", "-o", "x.csv"}, "export: --json does not apply here (it goes with check)"},
		{[]string{"presets", "--preset", "loaf"}, "presets: --preset does not apply here (it goes with check or export or sheet)"},
		{[]string{"presets", "extra"}, "presets takes no file (got extra)"},
		{[]string{"version", "x"}, "version takes no file (got x)"},
		{[]string{"check", "--version"}, "--version goes alone, not with check"},
		{[]string{"export", "p.json"}, "export: -o OUT is required (use -o - for standard output)"},
		{[]string{"export", "p.json", "-o", "take"}, "export: --format is required (csv, gltf, png)"},
		{[]string{"export", "p.json", "-o", "-"}, "export: --format is required (csv, gltf, png)"},
		{[]string{"export", "p.json", "-o", "t.csv", "--format", "obj"}, "export: unknown format obj (use csv, gltf, png)"},
		{[]string{"sheet", "p.json"}, "sheet: -o OUT.pdf is required"},
		{[]string{"sheet", "p.json", "-o", "s.pdf", "--paper", "a3"}, "sheet: unknown paper a3 (use a4 or letter)"},
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
