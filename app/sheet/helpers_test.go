package sheet

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"propflight/app/project"
	"propflight/assets"
	"propflight/physics"
)

// presetInput builds the sheet input of an embedded demo preset (our
// kitchen scene; demo data, never a check value).
func presetInput(t testing.TB, name string) Input {
	t.Helper()
	data, err := assets.Preset(name)
	if err != nil {
		t.Fatal(err)
	}
	return docInput(t, name+".json", data)
}

// docInput parses, builds, judges and simulates a project file.
func docInput(t testing.TB, file string, data []byte) Input {
	t.Helper()
	doc, err := project.Parse(file, data)
	if err != nil {
		t.Fatal(err)
	}
	sc, err := doc.Build()
	if err != nil {
		t.Fatal(err)
	}
	v := physics.Judge(&sc.Mass, &sc.Throw, physics.DefaultThresholds())
	tk, err := physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw)
	if err != nil {
		t.Fatal(err)
	}
	return Input{Scene: sc, Verdict: v, Take: tk}
}

// highToss is a cutting board (demo data) tossed high and a little
// sideways, for a take of about a hundred frames at 24 fps.
const highToss = `{"format": "propflight/v1", "name": "cutting board, high toss",
 "prop": {"parts": [{"name": "board", "shape": "box", "size": [0.36, 0.24, 0.02], "density": 650}]},
 "throw": {"fps": 24, "release_position": [0, 1.5, 0], "release_velocity": [1.2, 20, -0.4],
  "spin": {"axis": "least", "tilt_deg": 20, "turns_per_second": 1.2}}}`

func highTossInput(t testing.TB) Input {
	t.Helper()
	return docInput(t, "high-toss.json", []byte(highToss))
}

// render writes the sheet to memory.
func render(t testing.TB, in Input, opt Options) []byte {
	t.Helper()
	var b bytes.Buffer
	if err := Write(&b, in, opt); err != nil {
		t.Fatal(err)
	}
	return b.Bytes()
}

// needTool skips the test when a poppler tool is missing, and fails it on
// CI (CI=true), where the tools must be installed.
func needTool(t *testing.T, name string) string {
	t.Helper()
	p, err := exec.LookPath(name)
	if err != nil {
		if os.Getenv("CI") == "true" {
			t.Fatalf("%s is missing (poppler-utils) and CI=true", name)
		}
		t.Skipf("%s not found (install poppler-utils); skipping the PDF text checks", name)
	}
	return p
}

// pdfFile writes pdf to a temporary file and returns its path.
func pdfFile(t *testing.T, pdf []byte) string {
	t.Helper()
	path := filepath.Join(t.TempDir(), "sheet.pdf")
	if err := os.WriteFile(path, pdf, 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// pdfInfo returns pdfinfo's fields ("Pages", "Page size", ...).
func pdfInfo(t *testing.T, path string) map[string]string {
	t.Helper()
	out, err := exec.Command(needTool(t, "pdfinfo"), path).Output()
	if err != nil {
		t.Fatalf("pdfinfo: %v", err)
	}
	info := map[string]string{}
	for _, line := range strings.Split(string(out), "\n") {
		if k, v, ok := strings.Cut(line, ":"); ok {
			info[strings.TrimSpace(k)] = strings.TrimSpace(v)
		}
	}
	return info
}

// pageCount returns pdfinfo's page count.
func pageCount(t *testing.T, path string) int {
	t.Helper()
	n, err := strconv.Atoi(pdfInfo(t, path)["Pages"])
	if err != nil {
		t.Fatalf("pdfinfo Pages: %v", err)
	}
	return n
}

// pageText returns the text of page n (from 1) by pdftotext, in layout
// mode when layout is set.
func pageText(t *testing.T, path string, n int, layout bool) string {
	t.Helper()
	args := []string{"-f", strconv.Itoa(n), "-l", strconv.Itoa(n)}
	if layout {
		args = append(args, "-layout")
	}
	args = append(args, path, "-")
	out, err := exec.Command(needTool(t, "pdftotext"), args...).Output()
	if err != nil {
		t.Fatalf("pdftotext page %d: %v", n, err)
	}
	return string(out)
}

// squash collapses runs of white space to one space.
func squash(s string) string { return strings.Join(strings.Fields(s), " ") }

// tableRow is one frame row as read back from the PDF's text.
type tableRow struct {
	page                   int
	frame                  int
	timecode               string
	x, y, z, spacing, turn string
	total                  string
	notes                  string // the column under the head "marks"
}

var rowPattern = regexp.MustCompile(`^\s*(\d+)\s+(\d{2}:\d{2}:\d{2}[:;]\d{2})\s+(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s+(\S+)(?:\s+(.*?))?\s*$`)

// tableRows reads every frame row of the PDF, page by page.
func tableRows(t *testing.T, path string, pages int) []tableRow {
	t.Helper()
	var rows []tableRow
	for pg := 1; pg <= pages; pg++ {
		for _, line := range strings.Split(pageText(t, path, pg, true), "\n") {
			m := rowPattern.FindStringSubmatch(line)
			if m == nil {
				continue
			}
			f, _ := strconv.Atoi(m[1])
			rows = append(rows, tableRow{page: pg, frame: f, timecode: m[2], x: m[3], y: m[4], z: m[5],
				spacing: m[6], turn: m[7], total: m[8], notes: m[9]})
		}
	}
	return rows
}

// csvRecord is one row of the take's CSV (DESIGN.md "CSV take"), formatted
// the way the CSV writer does: strconv 'g' with the shortest exact
// representation.
type csvRecord map[string]string

var csvColumns = []string{"frame", "time_s", "cg_x", "cg_y", "cg_z", "qw", "qx", "qy", "qz", "wx", "wy", "wz", "turn_deg", "spacing_m"}

func csvRecords(tk *physics.Take) []csvRecord {
	g := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
	var out []csvRecord
	for _, f := range tk.Frames {
		vals := []string{strconv.Itoa(f.N), g(f.Time), g(f.CM.X), g(f.CM.Y), g(f.CM.Z),
			g(f.Orient.Real), g(f.Orient.Imag), g(f.Orient.Jmag), g(f.Orient.Kmag),
			g(f.Omega.X), g(f.Omega.Y), g(f.Omega.Z), g(f.TurnDeg), g(f.Spacing)}
		r := csvRecord{}
		for i, c := range csvColumns {
			r[c] = vals[i]
		}
		out = append(out, r)
	}
	return out
}

// num parses a number as printed on the sheet (real minus sign).
func num(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(strings.ReplaceAll(s, "\u2212", "-"), 64)
	if err != nil {
		t.Fatalf("not a number on the sheet: %q", s)
	}
	return v
}

// csvNum parses a CSV field.
func csvNum(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("bad CSV number %q", s)
	}
	return v
}

// sameToDecimals reports whether printed equals exact to d decimals: the
// printed value is within half a unit of its last decimal (plus round-off).
func sameToDecimals(printed, exact float64, d int) bool {
	half := 0.5 * pow10(-d)
	return printed-exact <= half*(1+1e-9) && exact-printed <= half*(1+1e-9)
}

func pow10(n int) float64 {
	v := 1.0
	for ; n < 0; n++ {
		v /= 10
	}
	for ; n > 0; n-- {
		v *= 10
	}
	return v
}

// readRepoFile reads a file at the repository root (two folders up).
func readRepoFile(name string) (string, error) {
	b, err := os.ReadFile(filepath.Join("..", "..", name))
	return string(b), err
}
