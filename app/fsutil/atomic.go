package fsutil

import (
	"bufio"
	"errors"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"time"
)

// newFileMode is the permission of a file WriteAtomic creates (the old
// file's permission is kept when it replaces one).
const newFileMode fs.FileMode = 0o644

// ErrReadOnly is the cause of the error WriteFile returns when the file it
// would replace is read-only and Options.ReplaceReadOnly is not set.
var ErrReadOnly = errors.New("is read-only")

// ErrFolder is the error WriteFile returns when the path it would write
// is a folder.
var ErrFolder = errors.New("is a folder")

// staleAge is how old a temporary file of ours must be before a save
// removes it as left over from a save that was killed. Younger ones may
// belong to a save still in progress in another process.
const staleAge = time.Minute

// maxLinks is how many symbolic links WriteFile follows before it gives up
// (the same bound as Linux's ELOOP for a path).
const maxLinks = 40

// Options changes how WriteFile replaces a file.
type Options struct {
	// ReplaceReadOnly replaces a file that is read-only (no write
	// permission for its owner, or none for this process). The new file
	// keeps the old one's permission bits, so it stays read-only. The
	// window asks the user first; the CLI needs --force.
	ReplaceReadOnly bool
	// KeepStale leaves temporary files of earlier, killed saves alone. A
	// caller writing many files into one folder (a PNG sequence) sets it
	// and calls RemoveStale once for the folder, so that each file does not
	// list the folder again.
	KeepStale bool
}

// WriteAtomic is WriteFile with the default Options: a read-only file is
// refused.
func WriteAtomic(path string, write func(io.Writer) error) error {
	return WriteFile(path, Options{}, write)
}

// WriteFile replaces the file at path with the bytes write produces.
//
// It writes into a temporary file in the same folder (so that the final
// rename stays on one file system), flushes it, fsyncs it, closes it and
// renames it over path, then fsyncs the folder where the platform allows.
// Readers therefore see either the old file or the complete new one, never
// a part. On any error, including one returned by write, the temporary file
// is removed and the old file at path is left untouched.
//
// Special cases:
//   - path is a symbolic link (or a chain of them): the file it points to
//     is replaced, in its own folder, and the link stays a link. A link to
//     a file that does not exist yet creates that file.
//   - the file is read-only: refused with an error wrapping ErrReadOnly,
//     unless opt.ReplaceReadOnly.
//   - path is a folder: refused with ErrFolder.
//   - temporary files of this file left by a save that was killed
//     (".NAME.tmp-DIGITS", over a minute old) are removed after a
//     successful save, unless opt.KeepStale.
//   - the temporary file's name is shortened for a long NAME, so that a
//     name the file system accepts always gets a temporary file too.
//
// The new file keeps the permission bits of the file it replaces, or gets
// 0644 when path did not exist. path must not be a folder. Every error is
// a *fs.PathError naming path as given, never the temporary file.
func WriteFile(path string, opt Options, write func(io.Writer) error) (err error) {
	fromWrite := false // an error of the caller's write is returned as it is
	defer func() {
		if err != nil && !fromWrite {
			err = nameOutput(path, err)
		}
	}()
	if _, base := filepath.Split(path); base == "" {
		return errors.New("the path names a folder, not a file")
	}
	target, err := resolveLinks(path)
	if err != nil {
		return err
	}
	dir, base := filepath.Split(target)
	if dir == "" {
		dir = "."
	}
	mode := newFileMode
	if info, statErr := os.Stat(target); statErr == nil {
		if info.IsDir() {
			return ErrFolder
		}
		mode = info.Mode().Perm()
		if !opt.ReplaceReadOnly && readOnly(target, info) {
			return ErrReadOnly
		}
	}

	prefix := tempPrefix(base)
	tmp, err := os.CreateTemp(dir, prefix+"*")
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
		fromWrite = true
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
	if err = os.Rename(tmpName, target); err != nil {
		return err
	}
	syncDir(dir)
	if !opt.KeepStale {
		stem := ShortName(base, maxTempStem)
		RemoveStale(dir, func(name string) bool { return name == stem })
	}
	return nil
}

// nameOutput turns err into a *fs.PathError on path: a failure on the
// temporary file or the rename is reported as a failure to write path,
// with the cause (ENOSPC, ENAMETOOLONG, ...) kept.
func nameOutput(path string, err error) error {
	var pe *fs.PathError
	var le *os.LinkError
	switch {
	case errors.As(err, &le):
		return &fs.PathError{Op: "write", Path: path, Err: le.Err}
	case errors.As(err, &pe):
		if pe.Path == path {
			return err
		}
		return &fs.PathError{Op: "write", Path: path, Err: pe.Err}
	}
	return &fs.PathError{Op: "write", Path: path, Err: err}
}

// resolveLinks follows symbolic links from path to the file they name,
// which need not exist. A relative link is relative to its own folder.
func resolveLinks(path string) (string, error) {
	p := path
	for range maxLinks {
		info, err := os.Lstat(p)
		if err != nil || info.Mode()&fs.ModeSymlink == 0 {
			return p, nil // a file, a folder, or nothing yet
		}
		dest, err := os.Readlink(p)
		if err != nil {
			return "", err
		}
		if !filepath.IsAbs(dest) {
			dest = filepath.Join(filepath.Dir(p), dest)
		}
		p = dest
	}
	return "", errors.New("too many levels of symbolic links")
}

// readOnly reports whether the existing file must not be replaced without
// asking: its owner may not write it (0444, the usual way to protect a
// file, which root too respects here), or this process may not.
func readOnly(path string, info fs.FileInfo) bool {
	return info.Mode().Perm()&0o200 == 0 || !writable(path)
}

// maxTempStem bounds the part of a temporary file's name taken from the
// file's name, in bytes: with the dot, ".tmp-" and up to ten digits it
// stays under the 255 bytes most file systems allow.
const maxTempStem = 200

// tempPrefix is the temporary-file prefix for the file name base:
// ".BASE.tmp-", with a long BASE shortened (ShortName).
func tempPrefix(base string) string {
	return "." + ShortName(base, maxTempStem) + ".tmp-"
}

// RemoveStale removes, from dir, temporary files that WriteFile left when
// a save was killed: regular files named ".NAME.tmp-DIGITS" (the names
// os.CreateTemp gives) over a minute old, for each NAME ours accepts (NAME
// as it appears there: a file name over 200 bytes is shortened by
// ShortName). It lists dir once; errors are ignored (a leftover is only
// clutter).
func RemoveStale(dir string, ours func(name string) bool) {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return
	}
	now := time.Now()
	for _, e := range entries {
		n := e.Name()
		if !e.Type().IsRegular() || !strings.HasPrefix(n, ".") {
			continue
		}
		i := strings.LastIndex(n, ".tmp-")
		if i < 1 || !allDigits(n[i+len(".tmp-"):]) || !ours(n[1:i]) {
			continue
		}
		info, err := e.Info()
		if err != nil || now.Sub(info.ModTime()) < staleAge {
			continue
		}
		os.Remove(filepath.Join(dir, n))
	}
}

func allDigits(s string) bool {
	if s == "" {
		return false
	}
	for i := 0; i < len(s); i++ {
		if s[i] < '0' || s[i] > '9' {
			return false
		}
	}
	return true
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
