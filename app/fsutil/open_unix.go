//go:build unix

package fsutil

import (
	"os"
	"syscall"
)

// oNonblock makes an open of a named pipe return at once instead of
// waiting for a writer.
const oNonblock = syscall.O_NONBLOCK

// setBlocking clears O_NONBLOCK again, so that reads of the (regular) file
// behave as usual.
func setBlocking(f *os.File) error {
	raw, err := f.SyscallConn()
	if err != nil {
		return err
	}
	var serr error
	err = raw.Control(func(fd uintptr) { serr = syscall.SetNonblock(int(fd), false) })
	if err != nil {
		return err
	}
	return serr
}
