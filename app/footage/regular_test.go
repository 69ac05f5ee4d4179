//go:build unix

package footage

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"propflight/app/fsutil"
	"propflight/internal/pipetest"
)

// openGuarded runs Open on path under the hang guard of the pipe.
func openGuarded(t *testing.T, path, pipe string) error {
	t.Helper()
	return pipetest.Within(t, pipe, func() error {
		_, err := Open(path, Options{})
		return err
	})
}

func TestOpen_NamedPipeIsRefused(t *testing.T) {
	dir := t.TempDir()
	// A named pipe as the footage itself.
	pipe := pipetest.Make(t, dir, "clip.gif")
	err := openGuarded(t, pipe, pipe)
	var fe *Error
	if !errors.As(err, &fe) || !errors.Is(err, fsutil.ErrNotRegular) || !strings.Contains(err.Error(), "named pipe") {
		t.Errorf("pipe as footage: %v", err)
	}

	// A named pipe among a folder's frames.
	frames := filepath.Join(dir, "frames")
	if err := os.Mkdir(frames, 0o755); err != nil {
		t.Fatal(err)
	}
	writePNG(t, filepath.Join(frames, "f0001.png"), indexFrame(8, 6, 1))
	framePipe := pipetest.Make(t, frames, "f0002.png")
	err = openGuarded(t, frames, framePipe)
	if !errors.As(err, &fe) || fe.File != framePipe || !strings.Contains(err.Error(), "named pipe") {
		t.Errorf("pipe among the frames: %v", err)
	}
}
