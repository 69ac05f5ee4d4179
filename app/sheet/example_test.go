package sheet_test

import (
	"bytes"
	"fmt"

	"propflight/app/project"
	"propflight/app/sheet"
	"propflight/assets"
	"propflight/physics"
)

// Example writes the timing sheet of the demo preset on twos, on letter
// paper. A real caller writes it into a file with app/fsutil.WriteAtomic.
func Example() {
	data, _ := assets.Preset(assets.Demo)
	doc, err := project.Parse("demo.json", data)
	if err != nil {
		fmt.Println(err)
		return
	}
	sc, err := doc.Build()
	if err != nil {
		fmt.Println(err)
		return
	}
	take, err := physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw)
	if err != nil {
		fmt.Println(err)
		return
	}
	in := sheet.Input{Scene: sc, Verdict: physics.Judge(&sc.Mass, &sc.Throw, physics.DefaultThresholds()), Take: take}
	var pdf bytes.Buffer
	if err := sheet.Write(&pdf, in, sheet.Options{Paper: sheet.PaperLetter, Twos: true}); err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(bytes.HasPrefix(pdf.Bytes(), []byte("%PDF-")), pdf.Len() < 2<<20)
	// Output: true true
}
