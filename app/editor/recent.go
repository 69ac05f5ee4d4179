package editor

import (
	"encoding/json"
	"io"
	"os"
	"path/filepath"
	"slices"

	"propflight/app/fsutil"
)

// MaxRecent is how many recent files the list keeps.
const MaxRecent = 8

// Recent is the list of recently opened or saved project files, newest
// first, kept in a small JSON file (see DefaultRecentPath).
type Recent struct {
	path  string
	store func(files []string) // where Add saves the list instead of path; may be nil
	Files []string             `json:"files"`
}

// NewRecent returns a list holding files (newest first; blanks and
// repeats dropped, at most MaxRecent) that Add hands to store, such as the
// window's Fyne preferences.
func NewRecent(files []string, store func(files []string)) *Recent {
	r := &Recent{store: store}
	for _, p := range files {
		if p != "" && len(r.Files) < MaxRecent && !slices.Contains(r.Files, p) {
			r.Files = append(r.Files, p)
		}
	}
	return r
}

// DefaultRecentPath is where the window kept its list before it moved to
// the Fyne preferences: <user config dir>/propflight/recent.json (read
// once to migrate it).
func DefaultRecentPath() (string, error) {
	dir, err := os.UserConfigDir()
	if err != nil {
		return "", err
	}
	return filepath.Join(dir, "propflight", "recent.json"), nil
}

// LoadRecent reads the list at path. A missing or unreadable list is an
// empty one: recent files are a convenience, never a reason to fail.
func LoadRecent(path string) *Recent {
	r := &Recent{path: path}
	f0, err := fsutil.OpenRegular(path)
	if err != nil {
		return r
	}
	data, err := io.ReadAll(io.LimitReader(f0, 1<<20))
	f0.Close()
	if err != nil {
		return r
	}
	var f struct {
		Files []string `json:"files"`
	}
	if json.Unmarshal(data, &f) == nil {
		for _, p := range f.Files {
			if p != "" && len(r.Files) < MaxRecent && !slices.Contains(r.Files, p) {
				r.Files = append(r.Files, p)
			}
		}
	}
	return r
}

// Existing returns the files of the list that still exist.
func (r *Recent) Existing() []string {
	var out []string
	for _, p := range r.Files {
		if exists(p) {
			out = append(out, p)
		}
	}
	return out
}

// Add puts file at the head of the list (as an absolute path) and saves the
// list atomically.
func (r *Recent) Add(file string) error {
	if abs, err := filepath.Abs(file); err == nil {
		file = abs
	}
	files := []string{file}
	for _, p := range r.Files {
		if p != file && len(files) < MaxRecent {
			files = append(files, p)
		}
	}
	r.Files = files
	if r.store != nil {
		r.store(slices.Clone(files))
		return nil
	}
	if r.path == "" {
		return nil
	}
	if err := os.MkdirAll(filepath.Dir(r.path), 0o755); err != nil {
		return err
	}
	return fsutil.WriteAtomic(r.path, func(w io.Writer) error {
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		return enc.Encode(struct {
			Files []string `json:"files"`
		}{r.Files})
	})
}
