package ui

import (
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"fyne.io/fyne/v2"

	"propflight/app/sheet"
	"propflight/assets"
)

// TestWindow_ExportSettings: the Export Settings reach the CSV (rows from
// 1001, z up) and the sheet (frame 1001 at 01:00:00:00, the chosen pose
// view), bad entries are refused naming the field, and the settings are
// kept for the next window.
func TestWindow_ExportSettings(t *testing.T) {
	w := newTestWindow(t, assets.Demo)
	for _, c := range []struct{ frame, tc, view, want string }{
		{"-1", "01:00:00:00", "best", "start frame"},
		{"1001", "1:00", "best", "start timecode"},
		{"1001", "01:00:00:00", "under", "pose view"},
	} {
		if err := w.setExportOptions(c.frame, c.tc, false, true, c.view); err == nil || !strings.HasPrefix(err.Error(), c.want) {
			t.Errorf("%+v: %v", c, err)
		}
	}
	if err := w.setExportOptions("1001", "01:00:00:00", false, true, "top"); err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	csv := filepath.Join(dir, "pan.csv")
	w.runExport(csvJob(), csv, w.good)
	data, err := os.ReadFile(csv)
	if err != nil {
		t.Fatal(err)
	}
	rows := strings.Split(string(data), "\n")
	f0 := w.good.Take.Frames[0]
	if !strings.HasPrefix(rows[1], "1001,0,") || !strings.Contains(w.lastDialog.message, "z up") {
		t.Errorf("first row %q, dialog %q", rows[1], w.lastDialog.message)
	}
	if cols := strings.Split(rows[1], ","); cols[4] != strings.TrimSpace(formatG(f0.CM.Y)) {
		t.Errorf("z up: cg_z %s, want the y-up height %v", cols[4], f0.CM.Y)
	}
	pdf := filepath.Join(dir, "pan.pdf")
	w.runExport(sheetJob("a4"), pdf, w.good)
	if exe, err := exec.LookPath("pdftotext"); err == nil {
		out, err := exec.Command(exe, pdf, "-").Output()
		text := strings.Join(strings.Fields(string(out)), " ")
		if err != nil || !strings.Contains(text, "(1001–") || !strings.Contains(text, "timecode from 01:00:00:00") || !strings.Contains(text, "top view (x right, −z up)") {
			t.Errorf("sheet text lacks frame 1001 at 01:00:00:00 or the top view (%v)", err)
		}
	}
	w2 := newTestWindowOn(t, w.app)
	if o := w2.exportOpts; o.startFrame != 1001 || o.startTimecode != "01:00:00:00" || !o.zUp || o.poseView != sheet.PoseTop {
		t.Errorf("settings not kept: %+v", o)
	}
}

func formatG(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// newTestWindowOn opens a second window on app a, as a restart would.
func newTestWindowOn(t *testing.T, a fyne.App) *Window {
	t.Helper()
	doc, err := presetDocument(assets.Demo)
	if err != nil {
		t.Fatal(err)
	}
	w, err := newWindow(a, doc, "", true)
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { w.closed = true; w.win.Close() })
	return w
}
