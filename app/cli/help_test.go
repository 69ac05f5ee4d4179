package cli

import (
	"flag"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden help pages in testdata/help")

// golden compares got with testdata/help/NAME.txt (rewritten with -update).
func golden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join("testdata", "help", name+".txt")
	if *update {
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test ./app/cli -run Help -update to write it)", err)
	}
	if got != string(want) {
		t.Errorf("%s differs from %s:\n%s", name, path, got)
	}
}

// TestHelp_Golden: the overview and every command's page, each three ways
// (propflight help NAME, propflight NAME --help, propflight NAME -h), equal
// to its golden text.
func TestHelp_Golden(t *testing.T) {
	for _, args := range [][]string{{"--help"}, {"-h"}, {"help"}} {
		code, out, errs := run(t, args...)
		if code != 0 || errs != "" {
			t.Fatalf("%q: exit %d: %s", args, code, errs)
		}
		golden(t, "overview", out)
	}
	for _, name := range CommandNames() {
		t.Run(name, func(t *testing.T) {
			_, page, _ := run(t, "help", name)
			golden(t, name, page)
			if name == "help" {
				return
			}
			for _, args := range [][]string{{name, "--help"}, {name, "-h"}, {"--help", name}} {
				if code, out, _ := run(t, args...); code != 0 || out != page {
					t.Errorf("%q: exit %d, page differs from help %s", args, code, name)
				}
			}
		})
	}
}

// TestHelp_Truthful: every flag a command accepts is on its page with its
// default, the default is a value the flag accepts, and the overview lists
// every command as "propflight NAME " (what contract-check looks for).
func TestHelp_Truthful(t *testing.T) {
	overview := Overview()
	for _, s := range registry {
		if !strings.Contains(overview, "propflight "+s.Name+" ") && !strings.Contains(overview, "propflight "+s.Name+"\n") {
			t.Errorf("overview lacks %s", s.Name)
		}
		page := HelpPage(s.Name)
		for _, f := range s.Flags {
			if !strings.Contains(page, flagLabel(f)) {
				t.Errorf("%s: page lacks %s", s.Name, flagLabel(f))
			}
			for _, c := range f.Choices {
				if !strings.Contains(page, c) {
					t.Errorf("%s: page does not name %s's choice %s", s.Name, f.Name, c)
				}
			}
			if f.Default == "" {
				continue
			}
			if !strings.Contains(page, "(default "+f.Default+")") {
				t.Errorf("%s: page lacks the default of %s", s.Name, f.Name)
			}
			if v, err := f.check(f.Default); err != nil || v != f.Default {
				t.Errorf("%s: default %q of %s does not pass its own check: %v", s.Name, f.Default, f.Name, err)
			}
		}
		for _, line := range strings.Split(page, "\n") {
			if len(line) > 104 {
				t.Errorf("%s: line longer than 104 characters: %q", s.Name, line)
			}
		}
	}
}

// TestHelp_ViewDefaultIsWhatExportUses: the PNG view the help promises is
// the camera an export without --view gets.
func TestHelp_ViewDefaultIsWhatExportUses(t *testing.T) {
	cmd, err := Parse([]string{"export", "p.json", "-o", "frames", "--format", "png"})
	if err != nil {
		t.Fatal(err)
	}
	if got := views[cmd.Text("--view")]; got.String() != "front" {
		t.Errorf("export without --view uses %v", got)
	}
	if !strings.Contains(HelpPage("export"), "(default front)") {
		t.Error("the export page does not say front is the default")
	}
	if !slices.Contains(CommandNames(), "fit") {
		t.Error("fit is not a command of the one parser")
	}
}

// TestHelp_ToleranceRange: the page's range for --tolerance-deg is the one
// the flag takes: 0 is refused, so the page must not offer "0 to 180".
func TestHelp_ToleranceRange(t *testing.T) {
	code, _, errs := run(t, "plan", "--preset", "frying-pan", "--land", "greatest:up", "--tolerance-deg", "0")
	if code != 2 || !strings.Contains(errs, "--tolerance-deg") {
		t.Fatalf("--tolerance-deg 0: exit %d, %q; want 2 naming the flag", code, errs)
	}
	for _, name := range []string{"plan", "spread", "sheet"} {
		page := HelpPage(name)
		if strings.Contains(page, "(0 to 180)") || !strings.Contains(page, "(over 0, up to 180)") {
			t.Errorf("%s: --tolerance-deg's range is not \"over 0, up to 180\":\n%s", name, page)
		}
	}
}
