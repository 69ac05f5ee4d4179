package cli

import (
	"fmt"
	"io"
	"slices"
	"strings"
)

// Spec declares one subcommand: its name, what its help page says, the
// operand it takes, its flags and the function that runs it. A command's
// file calls [register] from an init function; Parse, the help pages and
// the "does not apply here" messages all come from these declarations, so
// they cannot disagree with what the command does.
type Spec struct {
	Name  string // "sheet"
	Order int    // place in the overview, ascending (open 10, check 20, ...; help 1000)

	// Synopsis follows "propflight NAME " on the usage line: the operand
	// and the flags that matter, e.g. "FILE -o OUT.pdf [--paper a4|letter]".
	Synopsis string
	Summary  string // one line for the overview: "print the timing sheet"
	About    string // the help page's paragraph (wrapped by hand, may be empty)

	// Operand names the one positional argument ("FILE", "MARKS.csv");
	// empty when the command takes none. OperandRequired makes it
	// compulsory (the message says so in MissingOperand's words).
	Operand         string
	OperandRequired bool
	MissingOperand  string // the usage error when it is missing; default "give OPERAND"

	Flags []*Flag

	// Check, if set, finishes validating a parsed command (flags that go
	// together, values that depend on each other); it may fill in values
	// derived from others (export's format from -o's extension). It returns
	// a *UsageError for the user's mistakes.
	Check func(c *Command) error

	// Run runs the command, writing its report to out (Run buffers it so
	// that a failure half-way prints nothing). nil for commands that Run
	// handles itself (open, help, version).
	Run func(out io.Writer, c *Command) error
}

// Flag declares one flag of one or more commands. Commands that share a
// flag share the *Flag value (presetFlag, outputFlag), so it reads the same
// on every help page.
type Flag struct {
	Name    string   // canonical spelling, "--paper"
	Aliases []string // other spellings: "-o" for --output
	Value   string   // the value's placeholder in help ("PAPER"); "" for a switch that takes none
	Kind    Kind     // how the value is checked; ignored for switches
	Choices []string // allowed values (lower case); the given value is lowered first
	Default string   // the value a command gets when the flag is absent, shown as "(default ...)"
	Help    string   // one line: what it does (no default: that is added from Default)
}

// Kind is how a flag's value is checked when parsed.
type Kind int

const (
	Text   Kind = iota // any non-empty string
	Int                // a whole number (strconv.Atoi)
	Number             // a finite decimal number (strconv.ParseFloat)
)

// Shared flags.
var (
	presetFlag = &Flag{Name: "--preset", Value: "NAME", Help: "use a built-in preset instead of FILE (see propflight presets)"}
	helpFlag   = &Flag{Name: "--help", Aliases: []string{"-h"}, Help: "show this help"}
)

// registry holds every command, sorted by Order.
var registry []*Spec

// register adds a command; it panics on a declaration mistake (a
// programming error caught by every test run): a duplicate name, or a flag
// whose spelling or switch-ness differs between commands.
func register(s *Spec) {
	if lookupCommand(s.Name) != nil {
		panic("cli: command " + s.Name + " registered twice")
	}
	for _, f := range s.Flags {
		if f.Name == helpFlag.Name {
			panic("cli: " + s.Name + " declares --help; every command has it")
		}
		for _, other := range registry {
			for _, g := range other.Flags {
				clash := g != f && (g.Name == f.Name || slices.ContainsFunc(f.Aliases, func(a string) bool { return a == g.Name || slices.Contains(g.Aliases, a) }))
				if clash && (g.Name != f.Name || (g.Value == "") != (f.Value == "") || !slices.Equal(g.Aliases, f.Aliases)) {
					panic(fmt.Sprintf("cli: flag %s of %s clashes with %s of %s", f.Name, s.Name, g.Name, other.Name))
				}
			}
		}
	}
	registry = append(registry, s)
	slices.SortStableFunc(registry, func(a, b *Spec) int { return a.Order - b.Order })
}

// lookupCommand returns the command named name, or nil.
func lookupCommand(name string) *Spec {
	for _, s := range registry {
		if s.Name == name {
			return s
		}
	}
	return nil
}

// CommandNames lists the command names in the order the help shows them.
func CommandNames() []string {
	names := make([]string, len(registry))
	for i, s := range registry {
		names[i] = s.Name
	}
	return names
}

// flag returns the command's flag spelled name (canonical or alias), or
// nil; --help belongs to every command.
func (s *Spec) flag(name string) *Flag {
	for _, f := range s.Flags {
		if f.Name == name || slices.Contains(f.Aliases, name) {
			return f
		}
	}
	if helpFlag.Name == name || slices.Contains(helpFlag.Aliases, name) {
		return helpFlag
	}
	return nil
}

// anyFlag finds a flag by any spelling among all commands, with the names
// of the commands that have it.
func anyFlag(name string) (*Flag, []string) {
	if helpFlag.Name == name || slices.Contains(helpFlag.Aliases, name) {
		return helpFlag, CommandNames()
	}
	if name == versionFlag.Name {
		return versionFlag, nil
	}
	var found *Flag
	var cmds []string
	for _, s := range registry {
		if f := s.flag(name); f != nil && f != helpFlag {
			found = f
			cmds = append(cmds, s.Name)
		}
	}
	return found, cmds
}

// versionFlag is "propflight --version", which goes alone.
var versionFlag = &Flag{Name: "--version", Help: "print the version"}

// display returns how a flag is shown in messages: its shortest spelling
// when that is a one-letter alias ("-o"), else its name.
func (f *Flag) display() string {
	for _, a := range f.Aliases {
		if len(a) == 2 {
			return a
		}
	}
	return f.Name
}

// usageLine is "propflight NAME SYNOPSIS".
func (s *Spec) usageLine() string {
	return strings.TrimSpace("propflight " + s.Name + " " + s.Synopsis)
}
