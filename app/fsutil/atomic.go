package fsutil

import (
	"bufio"
	"errors"
	"io"
	"io/fs"
	"os"
	"path/filepath"
)

// newFileMode is the permission of a file WriteAtomic creates (the old
// file's permission is kept when it replaces one).
const newFileMode fs.FileMode = 0o644

// WriteAtomic replaces the file at path with the bytes write produces.
//
// It writes into a temporary file in the same folder (so that the final
// rename stays on one file system), flushes it, fsyncs it, closes it and
// renames it over path, then fsyncs the folder where the platform allows.
// Readers therefore see either the old file or the complete new one, never
// a part. On any error, including one returned by write, the temporary file
// is removed and the old file at path is left untouched.
//
// The new file keeps the permission bits of the file it replaces, or gets
// 0644 when path did not exist. path must not be a folder.
func WriteAtomic(path string, write func(io.Writer) error) (err error) {
	dir, base := filepath.Split(path)
	if dir == "" {
		dir = "."
	}
	if base == "" {
		return &fs.PathError{Op: "write", Path: path, Err: errors.New("the path names a folder, not a file")}
	}
	mode := newFileMode
	if info, statErr := os.Stat(path); statErr == nil {
		if info.IsDir() {
			return &fs.PathError{Op: "write", Path: path, Err: errors.New("is a folder")}
		}
		mode = info.Mode().Perm()
	}

	tmp, err := os.CreateTemp(dir, "."+base+".tmp-*")
	if err != nil {
		return err
	}
	tmpName := tmp.Name()
	closed := false
	defer func() {
		if err != nil {
			if !closed {
				tmp.Close()
			}
			os.Remove(tmpName)
		}
	}()

	bw := bufio.NewWriterSize(tmp, 64<<10)
	if err = write(bw); err != nil {
		return err
	}
	if err = bw.Flush(); err != nil {
		return err
	}
	if err = tmp.Chmod(mode); err != nil {
		return err
	}
	if err = tmp.Sync(); err != nil {
		return err
	}
	closed = true
	if err = tmp.Close(); err != nil {
		return err
	}
	if err = os.Rename(tmpName, path); err != nil {
		return err
	}
	syncDir(dir)
	return nil
}

// syncDir fsyncs the folder so that the rename itself is durable. Some
// platforms and file systems cannot sync a folder; the rename has already
// happened by then, so a failure here is not reported.
func syncDir(dir string) {
	d, err := os.Open(dir)
	if err != nil {
		return
	}
	d.Sync()
	d.Close()
}
