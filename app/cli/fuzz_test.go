package cli

import (
	"errors"
	"slices"
	"strings"
	"testing"
)

// FuzzParse feeds argument lists (NUL-separated) to Parse: it must never
// panic, every error must be a *UsageError, and a success must name a known
// command with the fields that command needs.
func FuzzParse(f *testing.F) {
	for _, seed := range []string{
		"", "check", "check\x00pan.json\x00--json", "export\x00pan.json\x00--format\x00csv\x00-o\x00out.csv",
		"export\x00-o=-\x00--format=csv\x00--preset\x00loaf", "sheet\x00p.json\x00-o\x00s.pdf\x00--paper=a4",
		"--\x00check", "fit\x00m.csv\x00--fps=24", "help\x00sheet", "export\x00p\x00-o\x00d\x00--format\x00png\x00--width\x00-5", "-o", "-o\x00", "--preset=", "help\x00check", "plan\x00p.json\x00--land\x00least:up\x00--catch-height=1", "spread\x00p.json\x00--samples\x0010\x00--land\x001,0,0:down", "-oo\x00-o", "check\x00--\x00-", "=\x00-=\x00--=",
	} {
		f.Add(seed)
	}
	f.Fuzz(func(t *testing.T, joined string) {
		var args []string
		if joined != "" {
			args = strings.Split(joined, "\x00")
		}
		cmd, err := Parse(args)
		if err != nil {
			var ue *UsageError
			if !errors.As(err, &ue) {
				t.Fatalf("Parse(%q): %T %v", args, err, err)
			}
			if strings.ContainsAny(oneLine(err.Error()), "\n\r") {
				t.Fatalf("message not one line: %q", err)
			}
			return
		}
		if len(args) == 0 {
			if cmd.Name != "" || cmd.File != "" || len(cmd.Flags()) != 0 {
				t.Fatalf("no args gave %+v", cmd)
			}
			return
		}
		if !slices.Contains(CommandNames(), cmd.Name) {
			t.Fatalf("Parse(%q) gave unknown command %q", args, cmd.Name)
		}
		if cmd.File != "" && cmd.Has("--preset") {
			t.Fatalf("Parse(%q) gave both a file and a preset", args)
		}
		if cmd.Name == "export" && (cmd.Text("--output") == "" || !slices.Contains(formats, cmd.Text("--format"))) {
			t.Fatalf("Parse(%q) gave export without output or format: %+v", args, cmd)
		}
		if cmd.Name == "help" && cmd.Topic != "" && lookupCommand(cmd.Topic) == nil {
			t.Fatalf("Parse(%q) gave help on an unknown command %q", args, cmd.Topic)
		}
		// Every given flag is one the command declares, with a value that
		// passes the flag's own check.
		for name, v := range cmd.Flags() {
			f := cmd.spec.flag(name)
			if f == nil || f.Name != name {
				t.Fatalf("Parse(%q) gave %s to %s", args, name, cmd.Name)
			}
			if got, err := f.check(v); err != nil || got != v {
				t.Fatalf("Parse(%q): %s = %q does not pass its check (%v)", args, name, v, err)
			}
		}
	})
}
