package cli

import (
	"fmt"
	"maps"
	"math"
	"slices"
	"strconv"
	"strings"
)

// Command is a parsed command line.
type Command struct {
	// Name is the command ("check", "sheet", ..., "help", "version");
	// empty when there were no arguments at all (open the window).
	Name string
	// File is the operand (a project file, a marks file); empty when
	// none was given.
	File string
	// Topic is the command whose help page "help" shows ("propflight
	// help sheet", "propflight sheet --help"); empty for the overview.
	Topic string

	spec     *Spec
	set      map[string]string // canonical flag name -> value ("" for a switch)
	progress *progressLine     // stderr's progress line; nil unless it is a terminal (Run sets it)
}

// Has reports whether the flag (canonical name, "--paper") was given.
func (c *Command) Has(name string) bool {
	_, ok := c.set[name]
	return ok
}

// Switch reports whether the switch was given.
func (c *Command) Switch(name string) bool { return c.Has(name) }

// Text returns the flag's value, or its declared default when absent
// (lowered when the flag has choices).
func (c *Command) Text(name string) string {
	if v, ok := c.set[name]; ok {
		return v
	}
	if f := c.declared(name); f != nil {
		return f.Default
	}
	return ""
}

// Int returns a whole-number flag's value or default (0 when neither);
// Parse has checked the value.
func (c *Command) Int(name string) int {
	n, _ := strconv.Atoi(c.Text(name))
	return n
}

// Float returns a number flag's value or default (NaN when neither);
// Parse has checked the value.
func (c *Command) Float(name string) float64 {
	s := c.Text(name)
	if s == "" {
		return math.NaN()
	}
	v, _ := strconv.ParseFloat(s, 64)
	return v
}

// SetValue records a value for a flag, as Check functions do for values
// derived from others.
func (c *Command) SetValue(name, value string) {
	if c.set == nil {
		c.set = map[string]string{}
	}
	c.set[name] = value
}

// Flags returns the given flags (canonical name -> value), for tests.
func (c *Command) Flags() map[string]string { return maps.Clone(c.set) }

// declared returns the command's own declaration of a flag, or nil. Asking
// for a flag the command does not declare is a programming error caught by
// the tests of that command.
func (c *Command) declared(name string) *Flag {
	if c.spec == nil {
		return nil
	}
	return c.spec.flag(name)
}

// UsageError is a mistake in the command line (exit status 2).
type UsageError struct{ Msg string }

func (e *UsageError) Error() string { return e.Msg }

func usagef(format string, args ...any) error {
	return &UsageError{Msg: fmt.Sprintf(format, args...)}
}

// given is one flag as it appeared on the command line.
type given struct {
	flag    *Flag
	spelled string
	value   string
}

// Parse reads the arguments after the program name. Flags may come before
// or after the operand and the command; "--" ends the flags. Flag values
// follow as the next argument or after "=" (-o OUT, -o=OUT, -oOUT,
// --output OUT, --output=OUT). -h or --help asks for the command's help
// page (the overview without a command), --version alone for the version.
// Every mistake is a *UsageError.
func Parse(args []string) (Command, error) {
	if len(args) == 0 {
		return Command{}, nil
	}
	flags, positional, err := splitArgs(args)
	if err != nil {
		return Command{}, err
	}
	has := func(f *Flag) bool {
		return slices.ContainsFunc(flags, func(g given) bool { return g.flag == f })
	}
	help, version := has(helpFlag), has(versionFlag)
	switch {
	case version && len(positional) == 0 && len(flags) == 1:
		return Command{Name: "version"}, nil
	case len(positional) == 0 && help:
		return Command{Name: "help"}, nil
	case len(positional) == 0:
		return Command{}, usagef("no command given (commands: %s; see propflight --help)", strings.Join(CommandNames(), ", "))
	}
	name, operands := positional[0], positional[1:]
	spec := lookupCommand(name)
	if spec == nil && strings.EqualFold(extension(name), ".json") {
		// propflight FILE.json: open the window on that project.
		spec, operands = lookupCommand("open"), positional
	}
	if spec == nil {
		if help {
			return Command{Name: "help"}, nil
		}
		return Command{}, usagef("unknown command %s (commands: %s; see propflight --help)", quote(name), strings.Join(CommandNames(), ", "))
	}
	if version {
		return Command{}, usagef("--version goes alone, not with %s", spec.Name)
	}
	if spec.Name == "help" {
		return parseHelp(operands)
	}
	if help {
		return Command{Name: "help", Topic: spec.Name}, nil
	}
	cmd := Command{Name: spec.Name, spec: spec}
	if err := cmd.setFlags(flags); err != nil {
		return Command{}, err
	}
	if err := cmd.setOperand(operands); err != nil {
		return Command{}, err
	}
	if spec.Check != nil {
		if err := spec.Check(&cmd); err != nil {
			return Command{}, err
		}
	}
	return cmd, nil
}

// splitArgs sorts the arguments into flags with their values and the
// positional ones (the command and its operand), in order. An unknown
// flag, a missing value or a value given to a switch is a *UsageError.
func splitArgs(args []string) ([]given, []string, error) {
	var flags []given
	var positional []string
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "--" {
			positional = append(positional, args[i+1:]...)
			break
		}
		if len(a) < 2 || a[0] != '-' {
			positional = append(positional, a)
			continue
		}
		name, val, hasVal := strings.Cut(a, "=")
		f, _ := anyFlag(name)
		if f == nil && strings.HasPrefix(a, "-") && !strings.HasPrefix(a, "--") && len(a) > 2 && !hasVal {
			// -oOUT: a one-letter alias with its value attached.
			if g, _ := anyFlag(a[:2]); g != nil && g.Value != "" {
				f, name, val, hasVal = g, a[:2], a[2:], true
			}
		}
		if f == nil {
			return nil, nil, usagef("unknown flag %s%s (see propflight --help)", quote(name), suggestFlag(name))
		}
		if f.Value != "" {
			if !hasVal {
				if i+1 >= len(args) {
					return nil, nil, usagef("%s needs a value", f.display())
				}
				i++
				val = args[i]
			}
			if val == "" {
				return nil, nil, usagef("%s needs a value", f.display())
			}
		} else if hasVal {
			return nil, nil, usagef("%s takes no value", f.display())
		}
		flags = append(flags, given{flag: f, spelled: name, value: val})
	}
	return flags, positional, nil
}

// setFlags checks each given flag against the command's own (one that
// goes with other commands, one given twice, a bad value) and keeps its
// value.
func (cmd *Command) setFlags(flags []given) error {
	spec := cmd.spec
	for _, g := range flags {
		own := spec.flag(g.spelled)
		if own == nil {
			_, with := anyFlag(g.spelled)
			return usagef("%s: %s does not apply here (it goes with %s)", spec.Name, quote(g.spelled), strings.Join(with, " or "))
		}
		if cmd.Has(own.Name) {
			prev := ""
			for _, h := range flags {
				if h.flag.Name == own.Name {
					prev = h.spelled
					break
				}
			}
			return usagef("%s given twice (as %s and %s)", own.display(), quote(prev), quote(g.spelled))
		}
		v, err := own.check(g.value)
		if err != nil {
			return usagef("%s: %v", spec.Name, err)
		}
		cmd.SetValue(own.Name, v)
	}
	return nil
}

// setOperand keeps the command's operand (the file), refusing one the
// command does not take, two of them, standard input, a file with
// --preset, and a missing one the command needs.
func (cmd *Command) setOperand(operands []string) error {
	spec := cmd.spec
	switch {
	case len(operands) > 0 && spec.Operand == "":
		return usagef("%s takes no file (got %s)", spec.Name, quote(operands[0]))
	case len(operands) > 1:
		return usagef("%s: more than one %s given (%s and %s)", spec.Name, spec.Operand, quote(operands[0]), quote(operands[1]))
	case len(operands) == 1:
		cmd.File = operands[0]
	}
	if cmd.File == "-" {
		return usagef("%s: reading %s from standard input is not supported; give a file name", spec.Name, spec.Operand)
	}
	if cmd.File != "" && cmd.Has(presetFlag.Name) {
		return usagef("%s: give FILE or --preset, not both", spec.Name)
	}
	if cmd.File == "" && spec.OperandRequired {
		msg := spec.MissingOperand
		if msg == "" {
			msg = "give " + spec.Operand
		}
		return usagef("%s: %s (usage: %s)", spec.Name, msg, spec.usageLine())
	}
	return nil
}

// parseHelp reads "help [COMMAND]".
func parseHelp(operands []string) (Command, error) {
	switch {
	case len(operands) == 0:
		return Command{Name: "help"}, nil
	case len(operands) > 1:
		return Command{}, usagef("help: one command at a time (got %s and %s)", quote(operands[0]), quote(operands[1]))
	}
	if lookupCommand(operands[0]) == nil {
		return Command{}, usagef("help: unknown command %s (commands: %s)", quote(operands[0]), strings.Join(CommandNames(), ", "))
	}
	return Command{Name: "help", Topic: operands[0]}, nil
}

// check validates a flag's value by its kind and choices and returns it as
// the command keeps it (lowered when there are choices).
func (f *Flag) check(v string) (string, error) {
	if f.Value == "" {
		return "", nil
	}
	switch f.Kind {
	case Int:
		if _, err := strconv.Atoi(v); err != nil {
			return "", usagef("%s: %s is not a whole number", f.Name, quote(v))
		}
	case Number:
		x, err := strconv.ParseFloat(v, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return "", usagef("%s: %s is not a number", f.Name, quote(v))
		}
	}
	if len(f.Choices) > 0 {
		v = strings.ToLower(v)
		if !slices.Contains(f.Choices, v) {
			return "", usagef("%s: unknown value %s (use %s)", f.Name, quote(v), strings.Join(f.Choices, ", "))
		}
	}
	return v, nil
}

// extension returns the extension of the last path element of p.
func extension(p string) string {
	base := p[strings.LastIndexAny(p, `/\`)+1:]
	if i := strings.LastIndexByte(base, '.'); i > 0 {
		return base[i:]
	}
	return ""
}

// quote shows an argument in a message, quoted when it holds anything
// unusual, cut to a readable length.
func quote(s string) string {
	r := []rune(s)
	if len(r) > 60 {
		s = string(r[:60]) + "..."
	}
	for _, c := range s {
		if c <= ' ' || c == '"' || c == '\\' || c > '~' {
			return fmt.Sprintf("%q", s)
		}
	}
	return s
}

// suggestFlag returns " (did you mean --x?)" for a near miss.
func suggestFlag(name string) string {
	bare := strings.TrimLeft(name, "-")
	var names []string
	for _, s := range registry {
		for _, f := range s.Flags {
			if !slices.Contains(names, f.Name) {
				names = append(names, f.Name)
			}
		}
	}
	names = append(names, helpFlag.Name, versionFlag.Name)
	for _, n := range names {
		fb := strings.TrimPrefix(n, "--")
		if bare == fb || (len(bare) >= 3 && strings.HasPrefix(fb, bare)) || swapped(bare, fb) {
			return " (did you mean " + n + "?)"
		}
	}
	return ""
}

// swapped reports whether a and b differ by one swap of neighbours.
func swapped(a, b string) bool {
	if len(a) != len(b) || a == b {
		return false
	}
	for i := 0; i+1 < len(a); i++ {
		if a[i] != b[i] {
			return a[i] == b[i+1] && a[i+1] == b[i] && a[i+2:] == b[i+2:]
		}
	}
	return false
}
