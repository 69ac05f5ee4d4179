// Package ui is Propflight's desktop window (Fyne): the prop's parts, the
// throw and the reference footage on the left, the wireframe preview of
// the take in the centre (with the footage beside it once a clip is
// loaded) and the timeline under it, and the verdict on the right.
//
// Footage (footage.go) follows the take by time, so clips at another
// frame rate line up; clicks on it are marks stored in the project, and
// the fit of the marks sets the throw's release velocity and spin rate.
//
// The window owns an editor.Editor (the open project, undo and redo, the
// unsaved-changes flag) and an editor.Worker. Every control edits the
// project.Document through Editor.Apply, so every edit is one undo step
// (the ticks of one slider drag share a merge key and make one step), and
// every edit asks the worker for a fresh verdict and take. Results come
// back on the worker goroutine and are applied inside fyne.Do, and only if
// they are newer than the last one applied: the window never waits for a
// computation. Exports and the opening of footage also run on their own
// goroutines with settings read on the UI goroutine beforehand, and hand
// their outcome back the same way.
//
// Units: the controls show the project file's units (metres, kilograms,
// kg/m^3, degrees, seconds, turns per second), with an imperial display
// toggle that changes only what the fields show. The world is +Y up,
// metres; positions and rotations of parts are in the prop frame; frame 0
// is the release.
//
// A project with a bad value (a negative radius typed into a field) is
// kept as typed, so the user can fix it; the verdict panel shows the error,
// which names the field as in the project file, and the preview keeps the
// last good take.
package ui
