package cli

import (
	"bytes"
	"fmt"
	"io"

	"propflight/app/sheet"
	"propflight/internal/printable"
)

func init() {
	register(&Spec{
		Name: "sheet", Order: 40,
		Synopsis: "FILE -o OUT.pdf [--paper a4|letter] [--twos] [--land AXIS:DIR ...]",
		Summary:  "print the timing sheet (PDF)",
		About: "Write the timing sheet: a PDF with the verdict, the arc chart, the pose\n" +
			"drawings and the frame-by-frame table, for the desk or the animator. With\n" +
			"--land, a landing page: the plan's solutions for that target (0.25 to 10\n" +
			"turns/s) and the spread of the project's throw under the release errors.",
		Operand: "FILE",
		Flags: append([]*Flag{
			presetFlag,
			outputFlag,
			forceFlag,
			{Name: "--paper", Value: "PAPER", Choices: []string{"a4", "letter"}, Default: "a4", Help: "paper size"},
			twosFlag,
			{Name: "--view", Value: "VIEW", Choices: sheet.PoseViewNames, Default: "best",
				Help: "poses from front, side, top, spin (along L), free or best"},
			startFrameFlag,
			{Name: "--start-timecode", Value: "TC", Default: "00:00:00:00", Help: "HH:MM:SS:FF of the release (a shot: 01:00:00:00)"},
			{Name: "--non-drop", Help: "at 29.97 and 59.94 fps: non-drop timecode (else drop-frame, ;FF)"},
		}, sheetLandingFlags...),
		Check: func(c *Command) error {
			if c.Text("--output") == "" {
				return usagef("sheet: -o OUT.pdf is required")
			}
			if n := c.Int("--start-frame"); n < 0 || n > sheet.MaxStartFrame {
				return usagef("sheet: --start-frame: must be 0 to %d, not %d", sheet.MaxStartFrame, n)
			}
			return checkSheetLanding(c)
		},
		Run: runSheet,
	})
}

// runSheet writes the timing sheet PDF.
func runSheet(out io.Writer, cmd *Command) error {
	f, err := loadAndFly(cmd)
	if err != nil {
		return err
	}
	in := sheet.Input{Name: f.scene.Name, Scene: f.scene, Verdict: f.verdict, Take: f.take}
	if in.Landing, err = sheetLanding(cmd, f); err != nil {
		return err
	}
	opt := sheet.Options{Paper: cmd.Text("--paper"), Twos: cmd.Switch("--twos"), Progress: cmd.progress.start("laying out the timing sheet"), StartFrame: cmd.Int("--start-frame"),
		NonDropTimecode: cmd.Switch("--non-drop")}
	if opt.PoseView, err = sheet.ParsePoseView(cmd.Text("--view")); err != nil {
		return usagef("sheet: --view: %v", err)
	}
	rate := f.scene.Throw.FPS
	drop := rate.IsDropFrame() && !opt.NonDropTimecode
	if opt.StartTimecode, err = rate.ParseTimecode(cmd.Text("--start-timecode"), drop); err != nil {
		return usagef("sheet: --start-timecode: %v", err)
	}
	var buf bytes.Buffer
	if err := sheet.Write(&buf, in, opt); err != nil {
		return err
	}
	return writeOut(out, cmd, cmd.Text("--output"), func(w io.Writer) error { _, err := w.Write(buf.Bytes()); return err },
		fmt.Sprintf("timing sheet of %s, %d frames", printable.String(f.scene.Name), f.take.LandingFrame+1))
}
