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
		"--\x00check", "-o", "-o\x00", "--preset=", "help\x00check", "-oo\x00-o", "check\x00--\x00-", "=\x00-=\x00--=",
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
			if cmd != (Command{}) {
				t.Fatalf("no args gave %+v", cmd)
			}
			return
		}
		if !slices.Contains(Commands, cmd.Name) {
			t.Fatalf("Parse(%q) gave unknown command %q", args, cmd.Name)
		}
		if cmd.File != "" && cmd.Preset != "" {
			t.Fatalf("Parse(%q) gave both a file and a preset", args)
		}
		if cmd.Name == "export" && (cmd.Output == "" || !slices.Contains(Formats, cmd.Format)) {
			t.Fatalf("Parse(%q) gave export without output or format: %+v", args, cmd)
		}
		if cmd.JSON && cmd.Name != "check" {
			t.Fatalf("Parse(%q) gave --json to %s", args, cmd.Name)
		}
	})
}
