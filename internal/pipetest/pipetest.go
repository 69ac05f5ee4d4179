//go:build unix

// Package pipetest makes named pipes for the tests that check a FIFO is
// refused at once instead of blocking a read forever, and guards those
// tests against the hang they look for. Standard library only, so any
// package's tests may import it.
package pipetest

import (
	"os"
	"path/filepath"
	"syscall"
	"testing"
	"time"
)

// Patience is how long Within waits before it calls the call stuck. It is
// a hang guard, not a speed check: the bug it catches is a call that never
// returns.
const Patience = 30 * time.Second

// Make creates a named pipe called name in dir and returns its path. It
// skips the test where the system cannot make one.
func Make(t testing.TB, dir, name string) string {
	t.Helper()
	path := filepath.Join(dir, name)
	if err := syscall.Mkfifo(path, 0o644); err != nil {
		t.Skipf("cannot make a named pipe: %v", err)
	}
	return path
}

// Within runs call on another goroutine and returns its result. If call
// has not returned after Patience, Within opens the pipe's writing end
// (which frees an open stuck on it) and fails the test.
func Within[T any](t testing.TB, pipe string, call func() T) T {
	t.Helper()
	done := make(chan T, 1)
	go func() { done <- call() }()
	select {
	case r := <-done:
		return r
	case <-time.After(Patience):
		if w, err := os.OpenFile(pipe, os.O_WRONLY|syscall.O_NONBLOCK, 0); err == nil {
			w.Close()
		}
		t.Fatalf("a call on the named pipe %s did not return", pipe)
		var zero T
		return zero
	}
}
