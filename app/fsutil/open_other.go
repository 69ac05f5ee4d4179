//go:build !unix

package fsutil

import (
	"os"
)

// oNonblock is 0 where opening a named pipe does not block the way it does
// on Unix; the checks before and after the open still apply.
const oNonblock = 0

func setBlocking(*os.File) error { return nil }
