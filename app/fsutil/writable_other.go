//go:build !unix

package fsutil

// writable is true where there is no access(2): the mode's write bit
// (readOnly) is the test there.
func writable(string) bool { return true }
