// Package editor is the window's model without any UI: the open project
// with undo and redo, the unsaved-changes flag, recent files, and the
// recompute worker that turns a project into a take off the UI goroutine
// (latest request wins, stale results dropped).
//
// Nothing here imports Fyne; the window (package app/ui) calls it from the
// UI goroutine and hands worker results back to the UI with fyne.Do.
package editor
