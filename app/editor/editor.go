package editor

import (
	"bytes"
	"errors"
	"os"

	"propflight/app/fsutil"
	"propflight/app/project"
)

// MaxUndo is how many edits Undo can take back.
const MaxUndo = 200

// snapshot is one state of the document as its saved bytes, which makes a
// deep copy that can never share memory with the live document.
type snapshot struct {
	label string // what the edit that left this state did, for the menu
	key   string // merge key of the edit that left this state ("" = never merge)
	data  []byte
}

// Editor holds the open project. It is not safe for concurrent use: the
// UI goroutine owns it.
type Editor struct {
	doc   *project.Document
	cur   []byte // Marshal(doc), kept with doc: Doc copies from it
	path  string // "" until saved or opened
	clean []byte // bytes of the clean state: as opened, started or last saved
	undo  []snapshot
	redo  []snapshot
	open  string // merge key of the edit in progress, "" when none
}

// New returns an editor on doc, which came from path ("" for a new or
// demo project that has never been saved). doc as given is the clean
// state, with a path or without: an untouched demo has nothing to lose.
func New(doc *project.Document, path string) (*Editor, error) {
	data, err := project.Marshal(doc)
	if err != nil {
		return nil, err
	}
	return &Editor{doc: mustClone(data, doc.File), cur: data, path: path, clean: data}, nil
}

// Doc returns a copy of the current document, safe to keep or hand to
// another goroutine. The copy is parsed from the bytes the current state
// was marshalled to when it was made (every state is marshalled before it
// is accepted), so it never shares memory with the live document.
func (e *Editor) Doc() *project.Document {
	return mustClone(e.cur, e.doc.File)
}

// Path returns the file the project was last opened from or saved to.
func (e *Editor) Path() string { return e.path }

// Dirty reports whether the project differs from its clean state: the
// state it was opened or started with (New, Open, Replace), or last saved
// (Save). Undoing back to that state makes it clean again. A project
// never saved is clean until it is edited, so closing an untouched demo
// or new project loses nothing and needs no question.
func (e *Editor) Dirty() bool {
	return !bytes.Equal(e.cur, e.clean)
}

// Apply changes the document with edit, recording the previous state for
// Undo under label (such as "Change radius"). Edits with the same non-empty
// merge key in a row (the ticks of one slider drag) make one undo step;
// call EndMerge when the gesture ends. If edit returns an error the
// document is left as it was.
func (e *Editor) Apply(label, key string, edit func(d *project.Document) error) error {
	before := e.cur
	work := mustClone(before, e.doc.File)
	if err := edit(work); err != nil {
		return err
	}
	after, err := project.Marshal(work)
	if err != nil {
		return err
	}
	if bytes.Equal(before, after) {
		return nil
	}
	if key == "" || key != e.open || len(e.undo) == 0 {
		e.undo = append(e.undo, snapshot{label: label, key: key, data: before})
		if len(e.undo) > MaxUndo {
			e.undo = e.undo[len(e.undo)-MaxUndo:]
		}
	}
	e.open = key
	e.redo = nil
	e.doc, e.cur = work, after
	return nil
}

// EndMerge closes the current merge group, so the next edit is its own
// undo step even with the same key.
func (e *Editor) EndMerge() { e.open = "" }

// CanUndo and CanRedo report whether there is a step to take.
func (e *Editor) CanUndo() bool { return len(e.undo) > 0 }
func (e *Editor) CanRedo() bool { return len(e.redo) > 0 }

// UndoLabel and RedoLabel name the step Undo or Redo would take ("" if none).
func (e *Editor) UndoLabel() string {
	if len(e.undo) == 0 {
		return ""
	}
	return e.undo[len(e.undo)-1].label
}

func (e *Editor) RedoLabel() string {
	if len(e.redo) == 0 {
		return ""
	}
	return e.redo[len(e.redo)-1].label
}

// Undo restores the state before the last edit; it reports whether there
// was one.
func (e *Editor) Undo() bool { return e.travel(&e.undo, &e.redo) }

// Redo takes back the last Undo.
func (e *Editor) Redo() bool { return e.travel(&e.redo, &e.undo) }

// travel restores the newest state of from, recording the current state on
// to under the same label, and reports whether from had one.
func (e *Editor) travel(from, to *[]snapshot) bool {
	if len(*from) == 0 {
		return false
	}
	s := (*from)[len(*from)-1]
	*from = (*from)[:len(*from)-1]
	*to = append(*to, snapshot{label: s.label, data: e.cur})
	e.doc, e.cur = mustClone(s.data, e.doc.File), s.data
	e.open = ""
	return true
}

// Save writes the project to path atomically (a temporary file, then a
// rename), makes path the project's file and the saved state the clean
// one. On error nothing changes.
//
// A relative footage.path (and a mesh part's file) is relative to the
// project file's folder, so a save to another folder rewrites it to name the same footage from there
// (project.Document.RebaseFootage); so does the first save of a project
// that had no file, which also turns an absolute footage path into one
// relative to the new folder where one can be made. The rewrite is part of
// the save, not an undo step: it is applied to the undo and redo states
// too, so that Undo after the save still names the same footage. An
// absolute path of a project that had a file is kept as written.
func (e *Editor) Save(path string) error { return e.SaveWith(path, fsutil.Options{}) }

// SaveWith is Save with the write options opt: ReplaceReadOnly once the
// user agreed to replace a read-only file (Save refuses one with an error
// wrapping fsutil.ErrReadOnly).
func (e *Editor) SaveWith(path string, opt fsutil.Options) error {
	if path == "" {
		return errors.New("editor: save: no file name")
	}
	doc := e.Doc()
	doc.File = path
	rebase := footageRebase(e.path, path)
	rebase(doc)
	if err := project.SaveWith(path, doc, opt); err != nil {
		return err
	}
	data, err := project.Marshal(doc)
	if err != nil {
		return err // cannot happen: Save marshalled the same document
	}
	e.rebaseHistory(rebase)
	e.doc, e.cur, e.clean, e.path = doc, data, data, path
	return nil
}

// footageRebase returns the rewrite of footage.path and of every mesh
// part's file for a project that moves from the file oldPath ("" for none)
// to newPath (project.Document.RebasePaths); see Save.
func footageRebase(oldPath, newPath string) func(d *project.Document) {
	return func(d *project.Document) { d.RebasePaths(oldPath, newPath) }
}

// rebaseHistory applies rebase to every undo and redo state. A state that
// does not parse back is our own bug (mustClone).
func (e *Editor) rebaseHistory(rebase func(d *project.Document)) {
	for _, stack := range [][]snapshot{e.undo, e.redo} {
		for i := range stack {
			d := mustClone(stack[i].data, e.doc.File)
			rebase(d)
			if data, err := project.Marshal(d); err == nil {
				stack[i].data = data
			}
		}
	}
}

// Open reads a project from path and makes it the current one with a fresh
// history. On any error (unreadable, bad JSON, a bad field) the current
// project is kept untouched and the error names the file and field.
func (e *Editor) Open(path string) error {
	doc, err := project.Load(path)
	if err != nil {
		return err
	}
	if _, err := doc.Build(); err != nil {
		return err
	}
	return e.Replace(doc, path)
}

// Replace makes doc the current project (from path, "" if never saved),
// clearing the history.
func (e *Editor) Replace(doc *project.Document, path string) error {
	ne, err := New(doc, path)
	if err != nil {
		return err
	}
	*e = *ne
	return nil
}

// mustClone parses bytes that Marshal produced; failure is our own bug.
func mustClone(data []byte, file string) *project.Document {
	d, err := project.Parse(file, data)
	if err != nil {
		panic("editor: the project's own bytes do not parse: " + err.Error())
	}
	return d
}

// exists reports whether a file is there (for recent files).
func exists(path string) bool {
	_, err := os.Stat(path)
	return err == nil
}
