//go:build unix

package fsutil

import "syscall"

// writable reports whether this process may write the file (access(2)
// with W_OK; root may write any file, so readOnly also checks the mode).
func writable(path string) bool { return syscall.Access(path, 2) == nil }
