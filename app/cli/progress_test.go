package cli

import (
	"bytes"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// termBuffer is a stderr that says it is a terminal.
type termBuffer struct{ bytes.Buffer }

func (*termBuffer) IsTerminal() bool { return true }

func TestRun_ProgressOnlyOnATerminal(t *testing.T) {
	for _, args := range [][]string{
		{"export", brick, "--format", "png", "--width", "32", "--height", "32", "-o", filepath.Join(t.TempDir(), "frames")},
		{"sheet", brick, "-o", filepath.Join(t.TempDir(), "s.pdf")},
	} {
		var out bytes.Buffer
		var term termBuffer
		if code := Run(args, &out, &term, nil); code != 0 {
			t.Fatalf("%s: exit %d: %s", args[0], code, term.String())
		}
		e := term.String()
		if !strings.HasPrefix(e, "\rpropflight: ") || !strings.Contains(e, "(100%)") || !strings.HasSuffix(e, "\n") || strings.Count(e, "\n") != 1 {
			t.Errorf("%s: progress on a terminal: %q", args[0], e)
		}
		if strings.Contains(out.String(), "\r") {
			t.Errorf("%s: progress reached stdout: %q", args[0], out.String())
		}
		var plain bytes.Buffer
		out.Reset()
		if code := Run(args, &out, &plain, nil); code != 0 || plain.Len() != 0 {
			t.Errorf("%s: stderr that is not a terminal got %q", args[0], plain.String())
		}
	}
}

func TestProgressLine_Throttled(t *testing.T) {
	var term termBuffer
	p := newProgress(&term)
	clock := time.Unix(0, 0)
	p.now = func() time.Time { return clock }
	update := p.start("writing PNG frames")
	for i := 1; i <= 100000; i++ {
		clock = clock.Add(time.Millisecond)
		update(i, 100000)
	}
	p.finish()
	// 100 s of work at one redraw per percent at most, and not more often
	// than every 250 ms: about 100 redraws, not 100000.
	if n := strings.Count(term.String(), "\r"); n < 50 || n > 101 {
		t.Errorf("%d redraws for 100000 steps", n)
	}
	if !strings.HasSuffix(term.String(), "100000/100000 (100%)\n") {
		t.Errorf("last line %q", term.String()[max(0, term.Len()-40):])
	}
}
