package cli

import (
	"fmt"
	"io"

	"propflight/app/project"
	"propflight/assets"
	"propflight/internal/printable"
)

func init() {
	register(&Spec{
		Name: "presets", Order: 60,
		Summary: "list the built-in demo props",
		About:   "List the built-in demo props of our kitchen scene, one a line: the name\n--preset takes, then the prop's title. The demo is marked.",
		Run:     func(out io.Writer, _ *Command) error { return listPresets(out) },
	})
}

func listPresets(w io.Writer) error {
	names := assets.PresetNames()
	width := 0
	for _, n := range names {
		width = max(width, len(n))
	}
	for _, n := range names {
		data, err := assets.Preset(n)
		if err != nil {
			return err
		}
		doc, err := project.Parse("preset "+n, data)
		if err != nil {
			return err
		}
		title := doc.Name
		if n == assets.Demo {
			title += " (the demo)"
		}
		fmt.Fprintf(w, "%-*s  %s\n", width, n, printable.String(title))
	}
	return nil
}
