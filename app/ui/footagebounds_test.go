package ui

import (
	"path/filepath"
	"strings"
	"testing"

	"propflight/app/project"
)

// TestFootage_MarksOutsideImageRefused: marks that the project file places
// outside the clip's image (here at 1e5 px, past the right edge) are
// refused by the fit with a message naming the frame, instead of being
// fitted.
func TestFootage_MarksOutsideImageRefused(t *testing.T) {
	w := boardWindow(t)
	clip := makeClip(t, filepath.Join(t.TempDir(), "clip"))
	if !w.footage.load(clip.dir) {
		t.Fatalf("load failed: %v", w.lastDialog)
	}
	for i, f := range markedFrames {
		x, y, _, _ := clip.clicks(f)
		if i == 2 {
			x = 1e5
		}
		if !w.footage.edit("Mark", "", true, func(d *project.Document) error { return setMark(d, f, x, y, false) }) {
			t.Fatalf("mark on frame %d refused", f)
		}
	}
	w.footage.refit()
	if w.footage.fit != nil || w.footage.fitErr == nil || !strings.Contains(w.footage.fitErr.Error(), "frame 8: the mark's centre (100000, ") ||
		!strings.Contains(w.footage.fitErr.Error(), "is outside the") {
		t.Errorf("fit with a mark outside the image: %v, %v", w.footage.fit, w.footage.fitErr)
	}
}
