package ui

import (
	"fmt"
	"strconv"
	"strings"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/dialog"
	"fyne.io/fyne/v2/widget"

	"propflight/app/export"
	"propflight/app/sheet"
	"propflight/physics"
)

// exportOptions are the pipeline conventions the window's exports follow,
// set in File > Export > Export Settings: the number and timecode of the
// release frame (CSV frame column, PNG file numbers, the sheet), the
// sheet's non-drop choice and pose view, and the CSV's up axis. They are
// the user's, kept in the preferences like the other window settings.
type exportOptions struct {
	startFrame    int
	startTimecode string // HH:MM:SS:FF, read at the take's rate when a sheet is written
	nonDrop       bool
	zUp           bool
	poseView      sheet.PoseView
}

// Preference keys of the export options.
const (
	prefStartFrame    = "export_start_frame"
	prefStartTimecode = "export_start_timecode"
	prefNonDrop       = "export_non_drop"
	prefZUp           = "export_z_up"
	prefPoseView      = "export_pose_view"
)

// loadExportOptions reads the export options from the preferences; a
// value out of range is the default.
func (w *Window) loadExportOptions() exportOptions {
	prefs := w.app.Preferences()
	o := exportOptions{startTimecode: "00:00:00:00"}
	if n := prefs.Int(prefStartFrame); n >= 0 && n <= export.MaxStartFrame {
		o.startFrame = n
	}
	if tc := prefs.String(prefStartTimecode); tc != "" {
		o.startTimecode = tc
	}
	o.nonDrop = prefs.Bool(prefNonDrop)
	o.zUp = prefs.Bool(prefZUp)
	if v, err := sheet.ParsePoseView(prefs.StringWithFallback(prefPoseView, "best")); err == nil {
		o.poseView = v
	}
	return o
}

// setExportOptions checks the dialog's text and keeps the options: an
// error names the field as the dialog labels it.
func (w *Window) setExportOptions(startFrame, startTimecode string, nonDrop, zUp bool, poseView string) error {
	n, err := strconv.Atoi(strings.TrimSpace(startFrame))
	if err != nil || n < 0 || n > export.MaxStartFrame {
		return fmt.Errorf("start frame: a whole number from 0 to %d", export.MaxStartFrame)
	}
	tc := strings.TrimSpace(startTimecode)
	// The syntax here (frames up to 59); the frames against the take's own
	// rate when a sheet is written.
	if _, err := (physics.Rate{Num: 60, Den: 1}).ParseTimecode(tc, false); err != nil {
		return fmt.Errorf("start timecode: %v", err)
	}
	v, err := sheet.ParsePoseView(poseView)
	if err != nil {
		return fmt.Errorf("pose view: %v", err)
	}
	w.exportOpts = exportOptions{startFrame: n, startTimecode: tc, nonDrop: nonDrop, zUp: zUp, poseView: v}
	prefs := w.app.Preferences()
	prefs.SetInt(prefStartFrame, n)
	prefs.SetString(prefStartTimecode, tc)
	prefs.SetBool(prefNonDrop, nonDrop)
	prefs.SetBool(prefZUp, zUp)
	prefs.SetString(prefPoseView, v.String())
	return nil
}

// startTimecodeAt returns the options' start timecode as a label count at
// rate r, drop-frame unless non-drop is chosen (30000/1001 and
// 60000/1001 only).
func (o exportOptions) startTimecodeAt(r physics.Rate) (int, error) {
	drop := r.IsDropFrame() && !o.nonDrop
	n, err := r.ParseTimecode(o.startTimecode, drop)
	if err != nil {
		return 0, fmt.Errorf("start timecode (File > Export > Export Settings): %v", err)
	}
	return n, nil
}

// showExportOptions opens the Export Settings dialog.
func (w *Window) showExportOptions() {
	o := w.exportOpts
	frame := widget.NewEntry()
	frame.SetText(strconv.Itoa(o.startFrame))
	tc := widget.NewEntry()
	tc.SetText(o.startTimecode)
	nonDrop := widget.NewCheck("non-drop at 29.97 and 59.94 fps (else drop-frame, HH:MM:SS;FF)", nil)
	nonDrop.SetChecked(o.nonDrop)
	up := widget.NewRadioGroup([]string{"y up", "z up"}, nil)
	up.Horizontal = true
	up.SetSelected(map[bool]string{false: "y up", true: "z up"}[o.zUp])
	view := widget.NewSelect(sheet.PoseViewNames, nil)
	view.SetSelected(o.poseView.String())
	problem := widget.NewLabel("")
	problem.Importance = widget.DangerImportance
	problem.Wrapping = fyne.TextWrapWord
	problem.Hide()
	items := []*widget.FormItem{
		{Text: "start frame", Widget: frame, HintText: "the release frame's number: CSV rows, PNG files, the sheet (a shot: 1001)"},
		{Text: "start timecode", Widget: tc, HintText: "the sheet's timecode of the release (a shot: 01:00:00:00)"},
		{Text: "timecode", Widget: nonDrop},
		{Text: "CSV axes", Widget: up, HintText: "z up writes (x, y, z) as (x, -z, y); glTF and PNG stay y up"},
		{Text: "sheet poses", Widget: view, HintText: "best: the view that shows the poses largest; spin: along L"},
		{Text: "", Widget: problem},
	}
	var d *dialog.FormDialog
	d = dialog.NewForm("Export Settings", "Apply", "Cancel", items, func(ok bool) {
		if !ok {
			return
		}
		if err := w.setExportOptions(frame.Text, tc.Text, nonDrop.Checked, up.Selected == "z up", view.Selected); err != nil {
			problem.SetText(err.Error())
			problem.Show()
			d.Show() // keep the dialog, with the problem, until it is right or cancelled
		}
	}, w.win)
	w.lastDialog = &shownDialog{title: "Export Settings", d: d}
	d.Resize(fyne.NewSize(640, 0))
	d.Show()
}
