package cli

import (
	"fmt"
	"strings"
)

// exitText is the exit-status line every help page ends with.
const exitText = "Exit status: 0 ok, 2 bad input or usage, 1 other failure."

// Overview is the text of "propflight --help": every command's usage line
// and summary, from the registry.
func Overview() string {
	var b strings.Builder
	b.WriteString("propflight: plan a thrown prop - its mass properties, whether it will spin,\n")
	b.WriteString("tumble or wobble, and its flight frame by frame.\n\nUsage:\n")
	const col = 38 // where the summaries start
	fmt.Fprintf(&b, "%-*s%s\n", col, "  propflight", "open the window on the demo")
	for _, s := range registry {
		line := "  " + s.usageLine()
		if len(line) < col {
			fmt.Fprintf(&b, "%-*s%s\n", col, line, s.Summary)
		} else {
			fmt.Fprintf(&b, "%s\n%-*s%s\n", line, col, "", s.Summary)
		}
	}
	b.WriteString("\nEach command has its own page with its flags and their defaults:\n")
	b.WriteString("propflight help COMMAND (or propflight COMMAND --help). Flags go before or\n")
	b.WriteString("after FILE. FILE is a project file (format propflight/v1).\n" + exitText + "\n\n")
	b.WriteString(Safety + "\n")
	return b.String()
}

// HelpPage is the text of "propflight help NAME": the usage line, the
// paragraph, and every flag with its value, default and help line, taken
// from the command's declaration.
func HelpPage(name string) string {
	s := lookupCommand(name)
	if s == nil {
		return Overview()
	}
	var b strings.Builder
	fmt.Fprintf(&b, "Usage: %s\n\n", s.usageLine())
	text := s.About
	if text == "" {
		text = strings.ToUpper(s.Summary[:1]) + s.Summary[1:] + "."
	}
	b.WriteString(strings.TrimRight(text, "\n") + "\n\nFlags:\n")
	flags := append(append([]*Flag(nil), s.Flags...), helpFlag)
	width := 0
	for _, f := range flags {
		width = max(width, len(flagLabel(f)))
	}
	for _, f := range flags {
		help := f.Help
		if f.Default != "" {
			help += " (default " + f.Default + ")"
		}
		fmt.Fprintf(&b, "  %-*s  %s\n", width, flagLabel(f), help)
	}
	b.WriteString("\n" + exitText + "\n")
	return b.String()
}

// maxChoicesInLabel is the longest list of choices a flag's label shows
// ("--view front|side|top|free"); a longer one shows the placeholder and the help
// line names the choices (a test checks it does).
const maxChoicesInLabel = 22

// flagLabel is "-o, --output OUT": the aliases, the name and the value.
func flagLabel(f *Flag) string {
	var parts []string
	for _, a := range f.Aliases {
		if len(a) == 2 {
			parts = append(parts, a)
		}
	}
	label := strings.Join(append(parts, f.Name), ", ")
	switch {
	case len(f.Choices) > 0 && len(strings.Join(f.Choices, "|")) <= maxChoicesInLabel:
		label += " " + strings.Join(f.Choices, "|")
	case f.Value != "":
		label += " " + f.Value
	}
	return label
}
