package ui

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"path/filepath"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/widget"

	"propflight/app/editor"
	"propflight/app/export"
	"propflight/app/fsutil"
	"propflight/app/project"
	"propflight/app/sheet"
	"propflight/internal/printable"
	"propflight/widgets/wire"
)

// Exports from the window: the timing sheet, the CSV take, glTF and a PNG
// sequence of the take the window shows (the last good result). Each runs
// off the UI goroutine behind a progress bar with a Cancel button; files
// are written atomically, so a cancelled or failed export leaves nothing
// half-written.

// exportJob is one export: what it is called, the file extension it
// writes (empty for a folder) and the work, which reports progress and
// stops early when cancel closes. The work runs off the UI goroutine: it
// reads no widget, only res and the settings taken from the controls
// before it starts.
type exportJob struct {
	title string
	ext   string
	work  func(path string, res editor.Result, set exportSettings, progress func(done, total int), cancel <-chan struct{}) (string, error)
}

// exportSettings are the window's settings an export uses, read from the
// controls on the UI goroutine when the export starts.
type exportSettings struct {
	twos bool      // the take is timed on twos
	view wire.View // the preview's view, for PNG frames
	// replaceReadOnly: the user agreed to replace a read-only file.
	replaceReadOnly bool
	// landing is the Land it tab's landing page for the sheet, or nil.
	landing func(*project.Scene) *sheet.Landing
	opts    exportOptions // the Export Settings
}

// write returns the file-writing options of the settings.
func (s exportSettings) write() fsutil.Options {
	return fsutil.Options{ReplaceReadOnly: s.replaceReadOnly}
}

// exportSettings reads the settings an export uses from the controls.
func (w *Window) exportSettings() exportSettings {
	return exportSettings{twos: w.throw.onTwos(), view: w.view.preview.View(), landing: w.land.sheetPage(), opts: w.exportOpts}
}

// errExportCancelled is the work's answer to a Cancel press.
var errExportCancelled = errors.New("cancelled")

// exportMenu returns the File menu's Export submenu.
func (w *Window) exportMenu() *fyne.MenuItem {
	item := func(j exportJob) *fyne.MenuItem { return fyne.NewMenuItem(j.title+"…", func() { w.startExport(j) }) }
	m := fyne.NewMenuItem("Export", nil)
	m.ChildMenu = fyne.NewMenu("",
		item(sheetJob(sheet.PaperA4)),
		item(sheetJob(sheet.PaperLetter)),
		item(csvJob()),
		item(gltfJob()),
		item(pngJob()),
		fyne.NewMenuItemSeparator(),
		fyne.NewMenuItem("Export Settings…", w.showExportOptions),
	)
	return m
}

func sheetJob(paper string) exportJob {
	return exportJob{title: "Timing Sheet (" + strings.ToUpper(paper[:1]) + paper[1:] + ")", ext: ".pdf",
		work: func(path string, res editor.Result, set exportSettings, progress func(int, int), cancel <-chan struct{}) (string, error) {
			thr := res.Thresholds
			in := sheet.Input{Scene: res.Scene, Verdict: res.Verdict, Take: res.Take, Thresholds: &thr}
			if set.landing != nil {
				in.Landing = set.landing(res.Scene)
			}
			var buf bytes.Buffer
			tc, err := set.opts.startTimecodeAt(res.Scene.Throw.FPS)
			if err != nil {
				return "", err
			}
			err = sheet.Write(&buf, in, sheet.Options{Paper: paper, Twos: set.twos, Progress: progress, Cancel: cancel,
				StartFrame: set.opts.startFrame, StartTimecode: tc, NonDropTimecode: set.opts.nonDrop, PoseView: set.opts.poseView})
			if errors.Is(err, sheet.ErrCancelled) {
				return "", errExportCancelled
			}
			if err != nil {
				return "", err
			}
			return "timing sheet", writeBytes(path, set.write(), buf.Bytes())
		}}
}

func csvJob() exportJob {
	return exportJob{title: "Take as CSV", ext: ".csv",
		work: func(path string, res editor.Result, set exportSettings, _ func(int, int), _ <-chan struct{}) (string, error) {
			opt := export.CSVOptions{Twos: set.twos, StartFrame: set.opts.startFrame, ZUp: set.opts.zUp}
			what := "CSV take"
			if opt.ZUp {
				what += " (z up)"
			}
			return what, fsutil.WriteFile(path, set.write(), func(f io.Writer) error { return export.WriteCSVWith(f, res.Take, opt) })
		}}
}

func gltfJob() exportJob {
	return exportJob{title: "Take as glTF (GLB)", ext: ".glb",
		work: func(path string, res editor.Result, set exportSettings, _ func(int, int), _ <-chan struct{}) (string, error) {
			in := exportInput(res)
			return "glTF animation", fsutil.WriteFile(path, set.write(), func(f io.Writer) error {
				return export.WriteGLTF(f, in, export.GLTFOptions{Binary: true})
			})
		}}
}

func pngJob() exportJob {
	return exportJob{title: "Take as PNG Frames", ext: "",
		work: func(dir string, res editor.Result, set exportSettings, progress func(int, int), cancel <-chan struct{}) (string, error) {
			view := set.view
			opt := export.PNGOptions{Width: 1280, Height: 720, View: view, Twos: set.twos, Transparent: true, Cancel: cancel,
				ReplaceReadOnly: set.replaceReadOnly, StartFrame: set.opts.startFrame}
			files, err := export.WritePNGSequence(dir, exportInput(res), opt, progress)
			if errors.Is(err, export.ErrCancelled) {
				return "", errExportCancelled
			}
			if err != nil {
				return "", err
			}
			return fmt.Sprintf("%d PNG frames (%s view, 1280x720, transparent)", len(files), view), nil
		}}
}

func exportInput(res editor.Result) export.Input {
	sc := res.Scene
	return export.Input{Name: sc.Name, Prop: &sc.Prop, Mass: &sc.Mass, Throw: &sc.Throw, Take: res.Take}
}

func writeBytes(path string, opt fsutil.Options, b []byte) error {
	return fsutil.WriteFile(path, opt, func(f io.Writer) error { _, err := f.Write(b); return err })
}

// startExport asks where to write, then runs the job.
func (w *Window) startExport(j exportJob) {
	if w.good.Take == nil {
		w.showError("Nothing to export", errors.New("there is no take yet: fix the project's error first"))
		return
	}
	res := w.good
	name := safeFileName(projectName(w.ed.Doc(), w.ed.Path()))
	if j.ext == "" {
		d := dialog.NewFolderOpen(func(u fyne.ListableURI, err error) {
			if err != nil {
				w.showError("Cannot export", err)
				return
			}
			if u != nil {
				w.runExport(j, filepath.Join(u.Path(), name+"-frames"), res)
			}
		}, w.win)
		w.startIn(d)
		d.Resize(fileDialogSize)
		d.Show()
		return
	}
	w.askSavePath("Export "+strings.ToLower(j.title[:1])+j.title[1:], name, j.ext, "", func(path string) { w.runExport(j, path, res) })
}

// runExport runs the job's work on its own goroutine behind a progress
// dialog with Cancel, and reports the outcome. In a synchronous (test)
// window it runs inline.
func (w *Window) runExport(j exportJob, path string, res editor.Result) {
	w.runExportWith(j, path, res, false)
}

// runExportWith is runExport; replaceReadOnly is set once the user agreed
// to replace a read-only file, which the first attempt asks about.
func (w *Window) runExportWith(j exportJob, path string, res editor.Result, replaceReadOnly bool) {
	bar := widget.NewProgressBar()
	cancel := make(chan struct{})
	cancelled := false
	var d dialog.Dialog
	stop := widget.NewButton("Cancel", func() {
		if !cancelled {
			cancelled = true
			close(cancel)
		}
	})
	label := widget.NewLabel("Writing " + printable.String(filepath.Base(path)) + "…")
	d = dialog.NewCustomWithoutButtons(j.title, sized(container.NewVBox(label, bar, stop), 360, 0), w.win)
	done := func(what string, err error) {
		d.Hide()
		switch {
		case errors.Is(err, errExportCancelled):
			w.lastDialog = &shownDialog{title: "Export cancelled", message: path}
		case errors.Is(err, fsutil.ErrReadOnly) && !replaceReadOnly:
			ro := path
			var pe *fs.PathError
			if errors.As(err, &pe) {
				ro = pe.Path // a frame file of a PNG sequence
			}
			w.confirmReadOnly(ro, func() { w.runExportWith(j, path, res, true) })
		case err != nil:
			var pe *fs.PathError
			if errors.As(err, &pe) && pe.Path == path {
				err = pe.Err // the message names the path once
			}
			w.showError("Export failed", fmt.Errorf("%s: %w", path, err))
		default:
			w.showInfo("Exported", fmt.Sprintf("Wrote the %s to %s.", what, path))
		}
	}
	set := w.exportSettings()
	set.replaceReadOnly = replaceReadOnly
	if w.synchronous {
		what, err := j.work(path, res, set, func(int, int) {}, cancel)
		done(what, err)
		return
	}
	d.Show()
	do := w.do
	go func() {
		what, err := j.work(path, res, set, func(n, total int) {
			do(func() {
				if total > 0 {
					bar.SetValue(float64(n) / float64(total))
				}
			})
		}, cancel)
		do(func() { done(what, err) })
	}()
}

// showInfo shows a short message with an OK button.
func (w *Window) showInfo(title, msg string) {
	text := widget.NewLabel(msg)
	text.Wrapping = fyne.TextWrapWord
	d := dialog.NewCustom(title, "OK", sized(text, 420, 0), w.win)
	w.lastDialog = &shownDialog{title: title, message: msg, d: d}
	d.Show()
}
