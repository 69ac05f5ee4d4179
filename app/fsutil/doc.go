// Package fsutil holds the file-system helpers shared by Propflight's use
// cases. Its one job is saving without losing anything: [WriteAtomic]
// replaces a file only once the new content is complete and on disk.
package fsutil
