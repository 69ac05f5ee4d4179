//go:build unix

package meshio

import (
	"strings"
	"testing"

	"propflight/internal/pipetest"
)

// TestReadFile_NamedPipeRefused: a mesh file that is a named pipe is
// refused at once instead of blocking the load forever.
func TestReadFile_NamedPipeRefused(t *testing.T) {
	pipe := pipetest.Make(t, t.TempDir(), "pan.stl")
	err := pipetest.Within(t, pipe, func() error {
		_, err := ReadFile(pipe, Options{})
		return err
	})
	if err == nil || !strings.Contains(err.Error(), "named pipe") {
		t.Errorf("err = %v, want a refusal of the named pipe", err)
	}
}
