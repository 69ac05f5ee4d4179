package editor

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"

	"propflight/app/project"
	"propflight/assets"
	"propflight/physics"
)

func demoDoc(t *testing.T) *project.Document {
	t.Helper()
	data, err := assets.Preset(assets.Demo)
	if err != nil {
		t.Fatal(err)
	}
	d, err := project.Parse(assets.Demo+".json", data)
	if err != nil {
		t.Fatal(err)
	}
	return d
}

func setRadius(r float64) func(d *project.Document) error {
	return func(d *project.Document) error {
		for i := range d.Prop.Parts {
			if d.Prop.Parts[i].Radius != nil {
				d.Prop.Parts[i].Radius = &r
				return nil
			}
		}
		return nil
	}
}

func radius(d *project.Document) float64 {
	for _, p := range d.Prop.Parts {
		if p.Radius != nil {
			return *p.Radius
		}
	}
	return 0
}

func TestEditor_UndoRedo(t *testing.T) {
	e, err := New(demoDoc(t), "")
	if err != nil {
		t.Fatal(err)
	}
	r0 := radius(e.Doc())
	if err := e.Apply("Change radius", "", setRadius(0.2)); err != nil {
		t.Fatal(err)
	}
	if radius(e.Doc()) != 0.2 || !e.CanUndo() || e.UndoLabel() != "Change radius" {
		t.Fatalf("after edit: radius %g, undo %v %q", radius(e.Doc()), e.CanUndo(), e.UndoLabel())
	}
	if !e.Undo() || radius(e.Doc()) != r0 {
		t.Fatalf("undo: radius %g, want %g", radius(e.Doc()), r0)
	}
	if !e.CanRedo() || !e.Redo() || radius(e.Doc()) != 0.2 {
		t.Fatalf("redo: radius %g", radius(e.Doc()))
	}
	// A new edit clears the redo stack.
	e.Undo()
	_ = e.Apply("Change radius", "", setRadius(0.3))
	if e.CanRedo() {
		t.Error("redo survived a new edit")
	}
	// The copy from Doc is independent of the editor.
	d := e.Doc()
	*d.Prop.Parts[0].Radius = 9
	if radius(e.Doc()) == 9 {
		t.Error("Doc returned shared memory")
	}
}

// TestEditor_MergeDrag: the ticks of one slider drag are one undo step.
func TestEditor_MergeDrag(t *testing.T) {
	e, _ := New(demoDoc(t), "")
	r0 := radius(e.Doc())
	for _, r := range []float64{0.11, 0.12, 0.13, 0.14} {
		_ = e.Apply("Change radius", "radius", setRadius(r))
	}
	e.EndMerge()
	_ = e.Apply("Change radius", "radius", setRadius(0.2))
	e.Undo()
	if got := radius(e.Doc()); got != 0.14 {
		t.Fatalf("undo of second drag: %g, want 0.14", got)
	}
	e.Undo()
	if got := radius(e.Doc()); got != r0 {
		t.Fatalf("undo of first drag: %g, want %g", got, r0)
	}
	if e.CanUndo() {
		t.Error("more undo steps than drags")
	}
}

func TestEditor_FailedEditChangesNothing(t *testing.T) {
	e, _ := New(demoDoc(t), "")
	before := e.Doc()
	err := e.Apply("Break", "", func(d *project.Document) error {
		r := 5.0
		d.Prop.Parts[0].Radius = &r
		return os.ErrInvalid
	})
	if err == nil || e.CanUndo() || radius(e.Doc()) != radius(before) {
		t.Errorf("failed edit left a trace: err %v, undo %v", err, e.CanUndo())
	}
}

func TestEditor_DirtySaveOpen(t *testing.T) {
	dir := t.TempDir()
	e, _ := New(demoDoc(t), "")
	if e.Dirty() {
		t.Error("an untouched project that was never saved counts as unsaved: closing the demo would ask")
	}
	_ = e.Apply("Change radius", "", setRadius(0.2))
	if !e.Dirty() {
		t.Error("an edit of a never-saved project is not unsaved")
	}
	e.Undo()
	if e.Dirty() {
		t.Error("undo back to the state the project started in should be clean")
	}
	_ = e.Apply("Change radius", "", setRadius(0.21))
	path := filepath.Join(dir, "pan.json")
	if err := e.Save(path); err != nil {
		t.Fatal(err)
	}
	if e.Dirty() || e.Path() != path {
		t.Errorf("after save: dirty %v, path %q", e.Dirty(), e.Path())
	}
	_ = e.Apply("Change radius", "", setRadius(0.2))
	if !e.Dirty() {
		t.Error("edit not dirty")
	}
	e.Undo()
	if e.Dirty() {
		t.Error("undo back to the saved state should be clean")
	}
	// A bad file keeps the current project.
	bad := filepath.Join(dir, "bad.json")
	os.WriteFile(bad, []byte(`{"format": "propflight/v1", "prop": {"parts": [{"shape": "box", "size": [1, -1, 1], "mass": 1}]}}`), 0o644)
	_ = e.Apply("Change radius", "", setRadius(0.25))
	err := e.Open(bad)
	if err == nil || !strings.Contains(err.Error(), "bad.json") || !strings.Contains(err.Error(), "size") {
		t.Fatalf("open bad file: %v", err)
	}
	if radius(e.Doc()) != 0.25 || !e.CanUndo() {
		t.Error("a failed open changed the current project")
	}
	if err := e.Open(path); err != nil || e.Dirty() || e.CanUndo() {
		t.Errorf("open good file: %v, dirty %v, undo %v", err, e.Dirty(), e.CanUndo())
	}
	// Replace makes the new project's state the clean one, with or
	// without a file.
	_ = e.Apply("Change radius", "", setRadius(0.3))
	if err := e.Replace(demoDoc(t), ""); err != nil || e.Dirty() || e.Path() != "" {
		t.Errorf("replace: %v, dirty %v, path %q", err, e.Dirty(), e.Path())
	}
}

// footageDoc returns the demo with footage at path, as written.
func footageDoc(t *testing.T, path string) *project.Document {
	t.Helper()
	d := demoDoc(t)
	d.Footage = &project.Footage{Path: path}
	return d
}

// TestEditor_Save_RebasesFootage: saving to another folder rewrites a
// relative footage path so that it names the same folder, without an undo
// step, leaves the project clean, and rewrites the undo and redo states
// too, so that undo after the save still names the same footage.
func TestEditor_Save_RebasesFootage(t *testing.T) {
	root := t.TempDir()
	clip := filepath.Join(root, "shots", "clip")
	oldPath := filepath.Join(root, "a", "pan.json")
	newPath := filepath.Join(root, "b", "deep", "pan.json")
	for _, d := range []string{clip, filepath.Dir(oldPath), filepath.Dir(newPath)} {
		if err := os.MkdirAll(d, 0o755); err != nil {
			t.Fatal(err)
		}
	}
	e, err := New(footageDoc(t, "../shots/clip"), oldPath)
	if err != nil {
		t.Fatal(err)
	}
	_ = e.Apply("Change radius", "", setRadius(0.2))
	_ = e.Apply("Change radius", "", setRadius(0.3))
	e.Undo() // one redo state
	if err := e.Save(newPath); err != nil {
		t.Fatal(err)
	}
	d := e.Doc()
	if d.Footage.Path != "../../shots/clip" || d.FootageDir(newPath) != clip {
		t.Errorf("after save as: footage.path %q (dir %q), want ../../shots/clip", d.Footage.Path, d.FootageDir(newPath))
	}
	if e.Dirty() {
		t.Error("the save's own footage rewrite left the project unsaved")
	}
	if e.UndoLabel() != "Change radius" || e.RedoLabel() != "Change radius" {
		t.Errorf("the save added a step: undo %q, redo %q", e.UndoLabel(), e.RedoLabel())
	}
	saved, err := project.Load(newPath)
	if err != nil || saved.Footage == nil || saved.Footage.Path != "../../shots/clip" {
		t.Fatalf("the saved file: %v, footage %+v", err, saved.Footage)
	}
	e.Redo()
	if got := e.Doc().FootageDir(newPath); got != clip {
		t.Errorf("redo after the save names footage %q, want %q", got, clip)
	}
	e.Undo()
	e.Undo()
	if got := e.Doc().FootageDir(newPath); got != clip || radius(e.Doc()) == 0.2 {
		t.Errorf("undo after the save names footage %q, want %q", got, clip)
	}
	// Saving again in place rewrites nothing; an absolute path is kept.
	abs, _ := New(footageDoc(t, filepath.ToSlash(clip)), oldPath)
	if err := abs.Save(newPath); err != nil || abs.Doc().Footage.Path != filepath.ToSlash(clip) {
		t.Errorf("absolute footage path after save as: %v, %q", err, abs.Doc().Footage.Path)
	}
}

// TestEditor_FirstSave_MakesFootageRelative: a project never saved keeps
// its footage as an absolute path; its first save makes it relative to the
// new file's folder, so the folder can move with its footage.
func TestEditor_FirstSave_MakesFootageRelative(t *testing.T) {
	root := t.TempDir()
	clip := filepath.Join(root, "clip")
	e, _ := New(footageDoc(t, filepath.ToSlash(clip)), "")
	path := filepath.Join(root, "pan.json")
	if err := e.Save(path); err != nil {
		t.Fatal(err)
	}
	if got := e.Doc().Footage.Path; got != "clip" || e.Dirty() || e.CanUndo() {
		t.Errorf("first save: footage.path %q, dirty %v, undo %v; want \"clip\", clean, no undo", got, e.Dirty(), e.CanUndo())
	}
}

// TestWorker_LatestWins: of a burst of requests the last one's result is
// always delivered, results arrive in increasing order, and none is older
// than one already delivered.
func TestWorker_LatestWins(t *testing.T) {
	var mu sync.Mutex
	var got []uint64
	done := make(chan Result, 64)
	w := NewWorker(func(r Result) {
		mu.Lock()
		got = append(got, r.Seq)
		mu.Unlock()
		done <- r
	})
	defer w.Close()
	doc := demoDoc(t)
	var last uint64
	for i := range 20 {
		d := *doc
		_ = i
		last = w.Request(&d, physics.DefaultThresholds())
	}
	deadline := time.After(30 * time.Second)
	for {
		select {
		case r := <-done:
			if r.Err != nil {
				t.Fatal(r.Err)
			}
			if r.Seq == last {
				mu.Lock()
				defer mu.Unlock()
				for i := 1; i < len(got); i++ {
					if got[i] <= got[i-1] {
						t.Fatalf("results out of order: %v", got)
					}
				}
				if r.Take == nil || r.Verdict.Motion != physics.Tumbling {
					t.Errorf("demo result: take %v, motion %v", r.Take != nil, r.Verdict.Motion)
				}
				return
			}
		case <-deadline:
			t.Fatalf("latest result never delivered; got %v", got)
		}
	}
}

func TestRecent(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "cfg", "recent.json")
	r := LoadRecent(path)
	for i := range MaxRecent + 3 {
		f := filepath.Join(dir, "p"+string(rune('a'+i))+".json")
		os.WriteFile(f, []byte("{}"), 0o644)
		if err := r.Add(f); err != nil {
			t.Fatal(err)
		}
	}
	again := LoadRecent(path)
	if len(again.Files) != MaxRecent || !strings.HasSuffix(again.Files[0], "pk.json") {
		t.Fatalf("recent = %v", again.Files)
	}
	os.Remove(again.Files[1])
	if n := len(again.Existing()); n != MaxRecent-1 {
		t.Errorf("existing = %d", n)
	}
	// A corrupt list is an empty one, never an error.
	os.WriteFile(path, []byte("{not json"), 0o644)
	if r := LoadRecent(path); len(r.Files) != 0 {
		t.Errorf("corrupt list gave %v", r.Files)
	}
}

func TestEditor_Doc_NeverTheLiveDocument(t *testing.T) {
	// Even when the live document cannot be marshalled (a NaN set behind
	// the editor's back), Doc must hand out a copy, never the document the
	// UI goroutine keeps editing.
	e, err := New(demoDoc(t), "")
	if err != nil {
		t.Fatal(err)
	}
	nan := math.NaN()
	e.doc.Throw.Gravity = &nan
	if _, err := project.Marshal(e.doc); err == nil {
		t.Fatal("a NaN gravity marshals; the test needs a document Marshal refuses")
	}
	if d := e.Doc(); d == e.doc {
		t.Fatal("Doc returned the live document")
	}
}

// TestEditor_Save_RebasesMeshFile: a mesh part's relative file names the
// same mesh after a save into another folder, and the project still builds.
func TestEditor_Save_RebasesMeshFile(t *testing.T) {
	root := t.TempDir()
	obj := filepath.Join(root, "a", "meshes", "crate.obj")
	if err := os.MkdirAll(filepath.Dir(obj), 0o755); err != nil {
		t.Fatal(err)
	}
	os.MkdirAll(filepath.Join(root, "b"), 0o755)
	// A closed box as OBJ quads, wound outward.
	os.WriteFile(obj, []byte("v 0 0 0\nv 0 0 1\nv 0 1 0\nv 0 1 1\nv 1 0 0\nv 1 0 1\nv 1 1 0\nv 1 1 1\n"+
		"f 5 7 8 6\nf 1 2 4 3\nf 3 4 8 7\nf 1 5 6 2\nf 2 6 8 4\nf 1 3 7 5\n"), 0o644)
	oldPath := filepath.Join(root, "a", "crate.json")
	os.WriteFile(oldPath, []byte(`{"format": "propflight/v1", "prop": {"parts": [{"shape": "mesh", "file": "meshes/crate.obj", "mass": 2}]}}`), 0o644)
	doc, err := project.Load(oldPath)
	if err != nil {
		t.Fatal(err)
	}
	e, err := New(doc, oldPath)
	if err != nil {
		t.Fatal(err)
	}
	newPath := filepath.Join(root, "b", "crate.json")
	if err := e.Save(newPath); err != nil {
		t.Fatal(err)
	}
	d := e.Doc()
	if got := *d.Prop.Parts[0].File; got != "../a/meshes/crate.obj" {
		t.Errorf("file after save as %q, want ../a/meshes/crate.obj", got)
	}
	if _, err := d.Build(); err != nil {
		t.Errorf("after save as: %v", err)
	}
}
