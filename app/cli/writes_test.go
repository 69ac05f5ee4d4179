package cli

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestRun_OutputThroughSymlinkKeepsTheLink(t *testing.T) {
	dir := t.TempDir()
	target := filepath.Join(dir, "real.csv")
	if err := os.WriteFile(target, []byte("old\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "take.csv")
	if err := os.Symlink("real.csv", link); err != nil {
		t.Fatal(err)
	}
	if code, _, errs := run(t, "export", brick, "-o", link); code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if fi, err := os.Lstat(link); err != nil || fi.Mode()&os.ModeSymlink == 0 {
		t.Fatal("the output link was replaced by a file")
	}
	if b, _ := os.ReadFile(target); !strings.HasPrefix(string(b), "frame,") {
		t.Errorf("the link's target holds %q", b)
	}
}

func TestRun_ReadOnlyOutputNeedsForce(t *testing.T) {
	dir := t.TempDir()
	for _, args := range [][]string{
		{"export", brick, "--format", "csv", "-o", filepath.Join(dir, "take.csv")},
		{"sheet", brick, "-o", filepath.Join(dir, "sheet.pdf")},
	} {
		out := args[len(args)-1]
		if err := os.WriteFile(out, []byte("keep"), 0o444); err != nil {
			t.Fatal(err)
		}
		code, stdout, errs := run(t, args...)
		if code != ExitInput || stdout != "" || !strings.Contains(errs, out) || !strings.Contains(errs, "read-only") || !strings.Contains(errs, "--force") {
			t.Errorf("%v: exit %d, stderr %q", args[0], code, errs)
		}
		if strings.Contains(errs, ".tmp-") {
			t.Errorf("%v: the error names a temporary file: %s", args[0], errs)
		}
		if b, _ := os.ReadFile(out); string(b) != "keep" {
			t.Errorf("%v: the read-only file was replaced", args[0])
		}
		code, _, errs = run(t, append(args, "--force")...)
		if code != 0 {
			t.Errorf("%v --force: exit %d: %s", args[0], code, errs)
		}
		if b, _ := os.ReadFile(out); string(b) == "keep" {
			t.Errorf("%v --force did not replace the file", args[0])
		}
	}
}

func TestRun_PNGExportOfALongName(t *testing.T) {
	long := strings.Repeat("frying pan ", 28) // 308 characters
	path := brickWith(t, `"brick flip (contract sample)"`, `"`+long+`"`)
	dir := filepath.Join(t.TempDir(), "frames")
	code, _, errs := run(t, "export", path, "--format", "png", "--width", "64", "--height", "36", "-o", dir)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errs)
	}
	entries, err := os.ReadDir(dir)
	if err != nil || len(entries) == 0 {
		t.Fatalf("no frames: %v", err)
	}
	for _, e := range entries {
		if len(e.Name()) > 160 {
			t.Errorf("frame file name of %d bytes: %s", len(e.Name()), e.Name())
		}
	}
}

func TestRun_PNGImageLimitNamesTheField(t *testing.T) {
	path := brickWith(t, `"fps": 24`, `"fps": 10000`)
	dir := filepath.Join(t.TempDir(), "frames")
	code, _, errs := run(t, "export", path, "--format", "png", "-o", dir)
	if code != ExitInput || !strings.Contains(errs, path+": throw.fps: the take needs") {
		t.Errorf("exit %d: %s", code, errs)
	}
}
