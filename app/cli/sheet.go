package cli

import (
	"bytes"
	"fmt"
	"io"
	"propflight/internal/printable"

	"propflight/app/sheet"
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
			{Name: "--paper", Value: "PAPER", Choices: []string{"a4", "letter"}, Default: "a4", Help: "paper size"},
			twosFlag,
		}, sheetLandingFlags...),
		Check: func(c *Command) error {
			if c.Text("--output") == "" {
				return usagef("sheet: -o OUT.pdf is required")
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
	var buf bytes.Buffer
	if err := sheet.Write(&buf, in, sheet.Options{Paper: cmd.Text("--paper"), Twos: cmd.Switch("--twos")}); err != nil {
		return err
	}
	return writeOut(out, cmd.Text("--output"), func(w io.Writer) error { _, err := w.Write(buf.Bytes()); return err },
		fmt.Sprintf("timing sheet of %s, %d frames", printable.String(f.scene.Name), f.take.LandingFrame+1))
}
