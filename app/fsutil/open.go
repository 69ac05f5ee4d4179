package fsutil

import (
	"errors"
	"io/fs"
	"os"
)

// ErrNotRegular is the cause of the error OpenRegular returns for a path
// that exists but is not a regular file (a folder, a named pipe, a device,
// a socket).
var ErrNotRegular = errors.New("not a regular file")

// OpenRegular opens path for reading only if it is a regular file (after
// following symbolic links), so that reading it always ends: a named pipe
// with no writer would block a plain open forever, a device such as
// /dev/zero would never reach the end.
//
// It checks the path before opening it, opens it non-blocking (so that a
// pipe put in its place between the check and the open cannot block
// either), and checks the opened file again. The error of a path that is
// not a regular file is a *fs.PathError whose Err is a *NotRegularError
// (which wraps ErrNotRegular) saying what the path is ("is a named pipe,
// not a regular file").
func OpenRegular(path string) (*os.File, error) {
	info, err := os.Stat(path)
	if err != nil {
		return nil, err
	}
	if err := regular(path, info); err != nil {
		return nil, err
	}
	f, err := os.OpenFile(path, os.O_RDONLY|oNonblock, 0)
	if err != nil {
		return nil, err
	}
	info, err = f.Stat()
	if err == nil {
		err = regular(path, info)
	}
	if err != nil {
		f.Close()
		return nil, err
	}
	if err := setBlocking(f); err != nil {
		f.Close()
		return nil, err
	}
	return f, nil
}

// NotRegularError says what a path that is not a regular file is: Kind is
// "a folder", "a named pipe", "a socket", "a character device", "a device"
// or "a special file".
type NotRegularError struct{ Kind string }

func (e *NotRegularError) Error() string { return "is " + e.Kind + ", not a regular file" }

// Unwrap returns ErrNotRegular.
func (e *NotRegularError) Unwrap() error { return ErrNotRegular }

// regular returns nil for a regular file and a *fs.PathError otherwise.
func regular(path string, info fs.FileInfo) error {
	m := info.Mode()
	if m.IsRegular() {
		return nil
	}
	kind := "a special file"
	switch {
	case m.IsDir():
		kind = "a folder"
	case m&fs.ModeNamedPipe != 0:
		kind = "a named pipe"
	case m&fs.ModeSocket != 0:
		kind = "a socket"
	case m&fs.ModeCharDevice != 0:
		kind = "a character device"
	case m&fs.ModeDevice != 0:
		kind = "a device"
	}
	return &fs.PathError{Op: "open", Path: path, Err: &NotRegularError{Kind: kind}}
}
