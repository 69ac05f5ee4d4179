package sheet

import (
	"errors"
	"fmt"
	"io"
	"strings"
	"time"

	"github.com/go-pdf/fpdf"
	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goregular"

	"propflight/app/project"
	"propflight/internal/printable"
	"propflight/physics"
)

// Caution is the safety caution every page carries, word for word from
// DEVELOPERS.md "Safety caution".
const Caution = "Propflight is a planning and animation aid. It ignores air drag and contact, so real " +
	"throws differ from its takes. Any live throw follows local safety rules and a qualified " +
	"stunt or safety coordinator."

// ErrCancelled is returned by Write when Options.Cancel is closed before the
// sheet is finished. Nothing has been written to the io.Writer then.
var ErrCancelled = errors.New("sheet: cancelled")

// creationDate is the fixed creation and modification date written into
// every sheet, so that equal input gives byte-equal files.
var creationDate = time.Date(2025, 1, 1, 0, 0, 0, 0, time.UTC)

// MaxStartFrame is the largest Options.StartFrame and StartTimecode (ten
// million frames is over four days at 24 fps).
const MaxStartFrame = 10_000_000

// Paper sizes Write accepts in Options.Paper.
const (
	PaperA4     = "a4"     // 210 x 297 mm (ISO 216), the default
	PaperLetter = "letter" // 8.5 x 11 in (215.9 x 279.4 mm)
)

// Options control Write. The zero value gives an A4 sheet on ones.
type Options struct {
	Paper string // PaperA4 (default when empty) or PaperLetter
	// Twos lists every other frame (0, 2, 4, ...) in the table and picks
	// poses on even frames: the sheet for animating on twos.
	Twos bool
	// Progress, when not nil, is called after each step of the work with
	// the steps done and the total: one step for the summary page, one per
	// pose and one per table row. It is called on Write's goroutine.
	Progress func(done, total int)
	// Cancel, when not nil, stops Write with ErrCancelled soon after it is
	// closed (it is checked before every step).
	Cancel <-chan struct{}
	// StartFrame is the number printed for the release frame; frame n of
	// the take is printed StartFrame + n everywhere on the sheet (shots
	// often start at 1001; REFERENCES.md §13). 0 to MaxStartFrame.
	StartFrame int
	// StartTimecode is the release's timecode as a count of labels at the
	// take's rate (physics.Rate.ParseTimecode of "01:00:00:00", say);
	// frame n gets the label of StartTimecode + n. 0 is 00:00:00:00.
	StartTimecode int
	// NonDropTimecode counts the timecode non-drop at 30000/1001 and
	// 60000/1001 fps, where it is drop-frame (HH:MM:SS;FF) by default.
	NonDropTimecode bool
	// PoseView is where the pose drawings look from; the zero value,
	// PoseBest, picks the view that shows the poses largest
	// (BestPoseView). The page names the view it used.
	PoseView PoseView
}

// Input is what the sheet shows. Scene holds the prop, its mass properties
// and the throw (project.Document.Build); Take and Verdict are
// physics.Simulate and physics.Judge of that scene.
type Input struct {
	Name    string // printed project name; empty: Scene.Name
	Scene   *project.Scene
	Verdict physics.Verdict
	Take    *physics.Take
	// Thresholds the verdict was judged under, printed beside it; nil
	// means the scene's (the project's verdict_rules), or
	// physics.DefaultThresholds() for a scene made without Build.
	Thresholds *physics.Thresholds
	// Landing, when set, adds the landing page (landing.go) after the
	// summary: the plan's target and solutions, the spread's figures.
	Landing *Landing
}

// Write lays out the timing sheet of in and writes the PDF to w. The PDF
// is built in memory and written in one piece at the end, so on an error
// or a cancel nothing reaches w; a caller writing a file should still
// write it atomically (app/fsutil.WriteAtomic).
//
// Errors: a missing scene or take, a take with no frames, an unknown
// paper name (naming the field "paper") and an unknown pose view are
// returned before any work;
// ErrCancelled when opt.Cancel is closed; a write error of w.
func Write(w io.Writer, in Input, opt Options) error {
	s, err := newSheet(in, opt)
	if err != nil {
		return err
	}
	if err := s.build(); err != nil {
		return err
	}
	return s.pdf.Output(w)
}

// Page geometry in millimetres.
const (
	margin      = 12.0 // left, right and top
	headTop     = 9.0  // top of the running head
	contentTop  = 20.0 // top of the page's content
	footerH     = 19.0 // the footer band above the bottom edge
	footerGap   = 3.0  // space between content and the footer rule
	fontFamily  = "go"
	sizeRunHead = 7.5
)

// sheet is one Write in progress. The fpdf error is sticky: once set,
// every drawing call does nothing and build returns it.
type sheet struct {
	pdf   *fpdf.Fpdf
	in    Input
	opt   Options
	sc    *project.Scene
	tk    *physics.Take
	v     physics.Verdict
	thr   physics.Thresholds
	name  string
	tm    *timing
	rows  []row
	poses []int
	// poseStep is the spacing of the in-between poses, frames.
	poseStep int
	// poseView is the view the poses are drawn from (never PoseBest).
	poseView PoseView
	pw, ph   float64 // page size, mm
	done     int
	total    int
}

func newSheet(in Input, opt Options) (*sheet, error) {
	if in.Scene == nil {
		return nil, errors.New("sheet: no scene to print")
	}
	if in.Take == nil || len(in.Take.Frames) == 0 {
		return nil, errors.New("sheet: the take has no frames")
	}
	size := "A4"
	switch strings.ToLower(strings.TrimSpace(opt.Paper)) {
	case "", PaperA4:
	case PaperLetter:
		size = "Letter"
	default:
		return nil, fmt.Errorf("paper: must be %q or %q, not %q", PaperA4, PaperLetter, opt.Paper)
	}
	if opt.StartFrame < 0 || opt.StartFrame > MaxStartFrame {
		return nil, fmt.Errorf("start-frame: must be 0 to %d, not %d", MaxStartFrame, opt.StartFrame)
	}
	if opt.StartTimecode < 0 || opt.StartTimecode > MaxStartFrame {
		return nil, fmt.Errorf("start-timecode: must be 00:00:00:00 or later and under a hundred hours")
	}
	if opt.PoseView < PoseBest || opt.PoseView > PoseFree {
		return nil, fmt.Errorf("pose view: must be one of %s, not %v", strings.Join(PoseViewNames, ", "), opt.PoseView)
	}
	s := &sheet{in: in, opt: opt, sc: in.Scene, tk: in.Take, v: in.Verdict, thr: physics.DefaultThresholds()}
	if in.Scene != nil && in.Scene.Thresholds != (physics.Thresholds{}) {
		s.thr = in.Scene.Thresholds
	}
	if in.Thresholds != nil {
		s.thr = *in.Thresholds
	}
	s.name = strings.TrimSpace(in.Name)
	if s.name == "" {
		s.name = strings.TrimSpace(in.Scene.Name)
	}
	if s.name == "" {
		s.name = "untitled"
	}
	s.name = printable.String(s.name)
	s.tm = analyse(s.tk, s.sc.Throw.FPS, &s.v)
	s.rows = s.tm.rows(opt.Twos)
	s.poses, s.poseStep = s.tm.poseFrames(opt.Twos, maxPoses)
	s.poseView = opt.PoseView
	if s.poseView == PoseBest {
		s.poseView = BestPoseView(&s.sc.Prop, &s.sc.Mass, s.tk, s.poses)
	}
	s.total = 1 + len(s.poses) + len(s.rows)
	if in.Landing != nil {
		s.total++
	}

	p := fpdf.NewCustom(&fpdf.InitType{OrientationStr: "P", UnitStr: "mm", SizeStr: size})
	p.SetCatalogSort(true)
	p.SetCreationDate(creationDate)
	p.SetModificationDate(creationDate)
	p.SetCompression(true)
	p.SetProducer("Propflight", true)
	p.SetCreator("Propflight", true)
	p.SetTitle("Timing sheet: "+s.name, true)
	p.SetSubject("Propflight timing sheet", true)
	p.SetMargins(margin, contentTop, margin)
	p.SetAutoPageBreak(false, 0)
	p.SetCellMargin(0.8)
	p.AddUTF8FontFromBytes(fontFamily, "", goregular.TTF)
	p.AddUTF8FontFromBytes(fontFamily, "B", gobold.TTF)
	p.AliasNbPages(nbAlias)
	p.SetFooterFunc(s.footer)
	s.pdf = p
	s.pw, s.ph = p.GetPageSize()
	return s, nil
}

// nbAlias stands for the page count until the document is closed.
const nbAlias = "{nb}"

// step counts one unit of work, reports progress and checks for a cancel.
func (s *sheet) step() error {
	if s.opt.Cancel != nil {
		select {
		case <-s.opt.Cancel:
			return ErrCancelled
		default:
		}
	}
	if err := s.pdf.Error(); err != nil {
		return err
	}
	s.done++
	if s.opt.Progress != nil {
		s.opt.Progress(s.done, s.total)
	}
	return nil
}

// cancelled reports whether Cancel is closed.
func (s *sheet) cancelled() bool {
	if s.opt.Cancel == nil {
		return false
	}
	select {
	case <-s.opt.Cancel:
		return true
	default:
		return false
	}
}

func (s *sheet) build() error {
	if s.cancelled() {
		return ErrCancelled
	}
	if err := s.summary(); err != nil {
		return err
	}
	if s.in.Landing != nil {
		if err := s.landingPage(); err != nil {
			return err
		}
	}
	if err := s.posePage(); err != nil {
		return err
	}
	if err := s.table(); err != nil {
		return err
	}
	return s.pdf.Error()
}

// contentBottom is the lowest y the page's content may reach.
func (s *sheet) contentBottom() float64 { return s.ph - footerH - footerGap }

// width is the width of the content, mm.
func (s *sheet) width() float64 { return s.pw - 2*margin }

// newPage starts a page with the running head: the sheet's name at the
// left, the frame rate and ones or twos at the right.
func (s *sheet) newPage() {
	p := s.pdf
	p.AddPage()
	s.font("B", sizeRunHead)
	ink(p, inkSoft)
	p.SetXY(margin, headTop)
	p.CellFormat(s.width()*0.6, 4, fitText(p, "Propflight timing sheet · "+s.name, s.width()*0.6), "", 0, "L", false, 0, "")
	s.font("", sizeRunHead)
	p.SetXY(margin+s.width()*0.4, headTop)
	p.CellFormat(s.width()*0.6, 4, s.sc.Throw.FPS.String()+" fps · "+s.onesOrTwos(), "", 0, "R", false, 0, "")
	rule(p, margin, headTop+5.5, s.pw-margin, headTop+5.5, 0.2, inkRule)
	ink(p, inkText)
}

func (s *sheet) onesOrTwos() string {
	if s.opt.Twos {
		return "on twos"
	}
	return "on ones"
}

// footer draws the page number and the caution at the foot of every page.
func (s *sheet) footer() {
	p := s.pdf
	top := s.ph - footerH
	rule(p, margin, top, s.pw-margin, top, 0.2, inkRule)
	s.font("", 7)
	ink(p, inkSoft)
	p.SetXY(margin, top+1.2)
	tail := " · frames " + s.frameNo(0) + "–" + s.frameNo(len(s.tk.Frames)-1) + " at " + s.sc.Throw.FPS.String() + " fps"
	p.CellFormat(s.width()*0.7, 3.6, fitText(p, s.name, s.width()*0.7-p.GetStringWidth(tail))+tail, "", 0, "L", false, 0, "")
	s.font("B", 7)
	p.SetXY(margin+s.width()*0.7, top+1.2)
	p.CellFormat(s.width()*0.3, 3.6, "page "+itoa(p.PageNo())+" of "+nbAlias, "", 0, "R", false, 0, "")
	s.font("", 6.8)
	ink(p, inkText)
	p.SetXY(margin, top+5.4)
	p.MultiCell(s.width(), 3.1, Caution, "", "L", false)
}

// font sets the Go font in style "" or "B" at size points.
func (s *sheet) font(style string, size float64) { s.pdf.SetFont(fontFamily, style, size) }
