package ui

import (
	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/driver/desktop"
)

// menus is the window's main menu. The Undo and Redo items name the step
// they would take; Open Recent lists the recent projects that still exist.
type menus struct {
	w        *Window
	main     *fyne.MainMenu
	undo     *fyne.MenuItem
	redo     *fyne.MenuItem
	recent   *fyne.MenuItem
	imperial *fyne.MenuItem
	themes   map[string]*fyne.MenuItem // the View menu's theme choices
	shown    [4]string                 // undo and redo labels and enablement last shown
}

// Keyboard shortcuts (Ctrl on Linux and Windows, Cmd on macOS). Ctrl+Z
// reaches the window as fyne.ShortcutUndo and Ctrl+Y as
// fyne.ShortcutRedo; Ctrl+Shift+Z is a custom shortcut.
var (
	mod           = fyne.KeyModifierShortcutDefault
	shortcutNew   = &desktop.CustomShortcut{KeyName: fyne.KeyN, Modifier: mod}
	shortcutOpen  = &desktop.CustomShortcut{KeyName: fyne.KeyO, Modifier: mod}
	shortcutSave  = &desktop.CustomShortcut{KeyName: fyne.KeyS, Modifier: mod}
	shortcutSaveA = &desktop.CustomShortcut{KeyName: fyne.KeyS, Modifier: mod | fyne.KeyModifierShift}
	shortcutRedo  = &desktop.CustomShortcut{KeyName: fyne.KeyZ, Modifier: mod | fyne.KeyModifierShift}
)

func newMenus(w *Window) *menus {
	m := &menus{w: w}
	item := func(label string, sc fyne.Shortcut, f func()) *fyne.MenuItem {
		it := fyne.NewMenuItem(label, f)
		it.Shortcut = sc
		return it
	}
	m.recent = fyne.NewMenuItem("Open Recent", nil)
	m.recent.ChildMenu = fyne.NewMenu("", w.recentItems()...)
	quit := fyne.NewMenuItem("Quit", w.requestClose)
	quit.IsQuit = true
	file := fyne.NewMenu("File",
		item("New", shortcutNew, w.newProject),
		item("Open…", shortcutOpen, w.openDialog),
		m.recent,
		fyne.NewMenuItemSeparator(),
		item("Save", shortcutSave, func() { w.save(nil) }),
		item("Save As…", shortcutSaveA, func() { w.saveAs(nil) }),
		fyne.NewMenuItemSeparator(),
		w.exportMenu(),
		fyne.NewMenuItemSeparator(),
		quit,
	)
	m.undo = item("Undo", &fyne.ShortcutUndo{}, w.undo)
	m.redo = item("Redo", shortcutRedo, w.redo)
	edit := fyne.NewMenu("Edit", m.undo, m.redo)
	m.imperial = fyne.NewMenuItem("Imperial units", nil)
	m.imperial.Action = func() {
		m.imperial.Checked = !m.imperial.Checked
		w.setImperial(m.imperial.Checked)
		w.app.Preferences().SetBool(prefImperial, m.imperial.Checked)
		m.main.Refresh()
	}
	themeMenu := fyne.NewMenuItem("Theme", nil)
	m.themes = map[string]*fyne.MenuItem{}
	var themeItems []*fyne.MenuItem
	for _, c := range []struct{ choice, label string }{{themeSystem, "As the System"}, {themeLight, "Light"}, {themeDark, "Dark"}} {
		it := fyne.NewMenuItem(c.label, func() { w.setTheme(c.choice) })
		m.themes[c.choice] = it
		themeItems = append(themeItems, it)
	}
	themeMenu.ChildMenu = fyne.NewMenu("", themeItems...)
	view := fyne.NewMenu("View",
		m.imperial,
		themeMenu,
		fyne.NewMenuItemSeparator(),
		fyne.NewMenuItem("Play / Pause (Space)", w.togglePlayback),
		fyne.NewMenuItem("Frame all", func() { w.view.preview.ResetCamera() }),
	)
	help := fyne.NewMenu("Help", fyne.NewMenuItem("About Propflight", w.showAbout))
	m.main = fyne.NewMainMenu(file, edit, view, help)
	m.update()
	return m
}

// update names the undo and redo steps and enables the items; the menu
// bar is rebuilt only when that changed.
func (m *menus) update() {
	ed := m.w.ed
	m.undo.Label, m.undo.Disabled = "Undo", !ed.CanUndo()
	if l := ed.UndoLabel(); l != "" {
		m.undo.Label = "Undo " + l
	}
	m.redo.Label, m.redo.Disabled = "Redo", !ed.CanRedo()
	if l := ed.RedoLabel(); l != "" {
		m.redo.Label = "Redo " + l
	}
	now := [4]string{m.undo.Label, m.redo.Label, boolText(m.undo.Disabled), boolText(m.redo.Disabled)}
	if now != m.shown {
		m.shown = now
		if m.w.win.MainMenu() == m.main {
			m.main.Refresh()
		}
	}
}

// updateRecent lists the recent projects again.
func (m *menus) updateRecent() {
	m.recent.ChildMenu.Items = m.w.recentItems()
	if m.w.win.MainMenu() == m.main {
		m.main.Refresh()
	}
}

func boolText(b bool) string {
	if b {
		return "1"
	}
	return "0"
}

// undo takes back the last edit.
func (w *Window) undo() {
	if w.ed.Undo() {
		w.editErr = nil
		w.syncControls()
	}
}

// redo takes back the last undo.
func (w *Window) redo() {
	if w.ed.Redo() {
		w.editErr = nil
		w.syncControls()
	}
}

// installKeys adds the keyboard: the menu shortcuts on the canvas too
// (they act when no menu bar is shown), and typedKey's keys when no
// control has the keyboard focus, so typing into an entry never moves the
// take.
func (w *Window) installKeys() {
	c := w.win.Canvas()
	c.AddShortcut(shortcutNew, func(fyne.Shortcut) { w.newProject() })
	c.AddShortcut(shortcutOpen, func(fyne.Shortcut) { w.openDialog() })
	c.AddShortcut(shortcutSave, func(fyne.Shortcut) { w.save(nil) })
	c.AddShortcut(shortcutSaveA, func(fyne.Shortcut) { w.saveAs(nil) })
	c.AddShortcut(&fyne.ShortcutUndo{}, func(fyne.Shortcut) { w.undo() })
	c.AddShortcut(&fyne.ShortcutRedo{}, func(fyne.Shortcut) { w.redo() })
	c.AddShortcut(shortcutRedo, func(fyne.Shortcut) { w.redo() })
	c.SetOnTypedKey(w.typedKey)
}

// typedKey handles a key no focused control took: Space plays or pauses,
// Left and Right step a frame, Page Up and Page Down a timecode second,
// Home and End go to the first and last frame.
func (w *Window) typedKey(k *fyne.KeyEvent) {
	if w.win.Canvas().Focused() != nil {
		return // an entry or other control has the keyboard
	}
	w.frameKey(k)
}

// frameKey acts on the keys of typedKey; the footage view hands it the
// keys it does not use itself, so the take steps while marking.
func (w *Window) frameKey(k *fyne.KeyEvent) {
	switch k.Name {
	case fyne.KeySpace:
		w.togglePlayback()
	case fyne.KeyLeft:
		w.stopPlayback()
		w.setFrame(w.frame - 1)
	case fyne.KeyRight:
		w.stopPlayback()
		w.setFrame(w.frame + 1)
	case fyne.KeyPageUp, fyne.KeyPageDown:
		step := int((w.rate().Num + w.rate().Den/2) / w.rate().Den) // a timecode second
		if k.Name == fyne.KeyPageUp {
			step = -step
		}
		w.stopPlayback()
		w.setFrame(w.frame + step)
	case fyne.KeyHome:
		w.stopPlayback()
		w.setFrame(0)
	case fyne.KeyEnd:
		w.stopPlayback()
		w.setFrame(w.lastFrame())
	}
}
