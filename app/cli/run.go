package cli

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"runtime"
	"runtime/debug"
	"strings"

	"propflight/app/footage"
	"propflight/app/project"
	"propflight/assets"
	"propflight/internal/printable"
	"propflight/physics"
)

// Version is the program version "propflight version" prints: the one in
// assets/VERSION.
var Version = assets.Version

// Exit statuses of Run.
const (
	ExitOK      = 0
	ExitFailure = 1 // anything that is not the user's input: I/O, internal errors
	ExitInput   = 2 // bad input or usage
)

// Safety is the caution every human-readable report ends with.
const Safety = "Planning and animation aid only: ignores air drag and contact; any live throw follows local safety rules and a qualified stunt or safety coordinator."

// Run runs the command line args (without the program name), writing
// results to stdout and errors, one line each, to stderr, and returns the
// exit status. With no arguments it calls openWindow with "" (the demo),
// and for "open FILE" (or a bare FILE.json) with FILE; when openWindow is
// nil it checks that project on the terminal instead. A panic anywhere below is caught and reported
// as one line with status 1.
func Run(args []string, stdout, stderr io.Writer, openWindow func(path string) error) (code int) {
	defer func() {
		if r := recover(); r != nil {
			fmt.Fprintf(stderr, "propflight: internal error: %s\n", printable.String(oneLine(fmt.Sprint(r))))
			code = ExitFailure
		}
	}()
	if err := noEmptyArgs(args); err != nil {
		return fail(stderr, err)
	}
	cmd, err := Parse(args)
	if err != nil {
		return fail(stderr, err)
	}
	if cmd.Name == "" || cmd.Name == "open" {
		if openWindow != nil {
			if err := openWindow(cmd.File); err != nil {
				return fail(stderr, err)
			}
			return ExitOK
		}
		cmd, err = Parse(append([]string{"check", "--"}, nonEmpty(cmd.File)...))
		if err != nil {
			return fail(stderr, err)
		}
	}
	// Commands write into a buffer first so that a failure half-way leaves
	// stdout empty.
	var out strings.Builder
	switch {
	case cmd.Name == "help" && cmd.Topic == "":
		out.WriteString(Overview())
	case cmd.Name == "help":
		out.WriteString(HelpPage(cmd.Topic))
	case cmd.Name == "version":
		fmt.Fprintf(&out, "propflight %s (%s %s/%s%s)\n", Version, runtime.Version(), runtime.GOOS, runtime.GOARCH, revision())
	case cmd.spec != nil && cmd.spec.Run != nil:
		cmd.progress = newProgress(stderr)
		err = cmd.spec.Run(&out, &cmd)
		cmd.progress.finish()
	default:
		err = fmt.Errorf("command %q has no handler", cmd.Name) // a bug in its declaration
	}
	if err != nil {
		return fail(stderr, err)
	}
	w := bufio.NewWriter(stdout)
	w.WriteString(out.String())
	if err := w.Flush(); err != nil {
		return fail(stderr, fmt.Errorf("writing the output: %w", err))
	}
	return ExitOK
}

// noEmptyArgs refuses an empty argument: `check ""` must not fall back to
// the demo, nor `-o ""` write somewhere unexpected. An empty argument is
// most often an unset shell variable ("$FILE").
func noEmptyArgs(args []string) error {
	for i, a := range args {
		if a != "" {
			continue
		}
		if i > 0 && strings.HasPrefix(args[i-1], "-") && args[i-1] != "--" {
			return usagef("%s: the value is empty (an unset shell variable?)", args[i-1])
		}
		return usagef("argument %d is empty: the empty path names no file (an unset shell variable?)", i+1)
	}
	return nil
}

// fail prints err as one line and returns its exit status.
func fail(stderr io.Writer, err error) int {
	fmt.Fprintf(stderr, "propflight: %s\n", printable.String(oneLine(err.Error())))
	return exitCode(err)
}

// exitCode is 2 for problems with the user's input or command line, 1 for
// everything else.
func exitCode(err error) int {
	var (
		ue *UsageError
		pe *project.Error
		fe *physics.FieldError
		me *footage.Error
	)
	if errors.As(err, &ue) || errors.As(err, &pe) || errors.As(err, &fe) || errors.As(err, &me) || errors.Is(err, physics.ErrNoLanding) {
		return ExitInput
	}
	return ExitFailure
}

// oneLine keeps a message on one line.
func oneLine(s string) string {
	return strings.Join(strings.Fields(strings.NewReplacer("\r", " ", "\n", " ").Replace(s)), " ")
}

// revision returns ", commit abc1234" when the build recorded one.
func revision() string {
	info, ok := debug.ReadBuildInfo()
	if !ok {
		return ""
	}
	for _, s := range info.Settings {
		if s.Key == "vcs.revision" && len(s.Value) >= 7 {
			return ", commit " + s.Value[:7]
		}
	}
	return ""
}

// source is where a command's project comes from.
type source struct {
	label string // file name or "preset NAME", used in messages
	doc   *project.Document
}

// load reads the command's project: the file, the preset, or the demo.
func load(cmd *Command) (*source, error) {
	if cmd.File != "" {
		doc, err := project.Load(cmd.File)
		if err != nil {
			return nil, err
		}
		return &source{label: cmd.File, doc: doc}, nil
	}
	name := cmd.Text(presetFlag.Name)
	if name == "" {
		name = assets.Demo
	}
	data, err := assets.Preset(name)
	if err != nil {
		return nil, usagef("--preset: %v", err)
	}
	label := "preset " + name
	doc, err := project.Parse(label, data)
	if err != nil {
		return nil, err
	}
	return &source{label: label, doc: doc}, nil
}

// loadScene reads the command's project (load) and builds its scene.
func loadScene(cmd *Command) (*source, *project.Scene, error) {
	src, err := load(cmd)
	if err != nil {
		return nil, nil, err
	}
	sc, err := src.doc.Build()
	if err != nil {
		return nil, nil, err
	}
	return src, sc, nil
}

// flight is a built scene with its verdict and take.
type flight struct {
	src     *source
	scene   *project.Scene
	verdict physics.Verdict
	take    *physics.Take
}

// loadAndFly loads the command's project and flies it.
func loadAndFly(cmd *Command) (*flight, error) {
	src, err := load(cmd)
	if err != nil {
		return nil, err
	}
	return fly(src)
}

// fly builds the scene, judges it under the project's verdict rules and
// simulates the take. Simulation problems name the file.
func fly(src *source) (*flight, error) {
	sc, err := src.doc.Build()
	if err != nil {
		return nil, err
	}
	f := &flight{src: src, scene: sc}
	f.verdict = physics.Judge(&sc.Mass, &sc.Throw, sc.Thresholds)
	f.take, err = physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw)
	if err != nil {
		var fe *physics.FieldError
		switch {
		case errors.As(err, &fe):
			return nil, &project.Error{File: src.label, Field: fe.Field, Msg: fe.Msg}
		case errors.Is(err, physics.ErrNoLanding):
			return nil, &project.Error{File: src.label, Field: "throw", Msg: strings.TrimPrefix(err.Error(), "throw: ")}
		}
		return nil, fmt.Errorf("%s: %w", src.label, err)
	}
	return f, nil
}

// nonEmpty returns {s}, or nothing for "".
func nonEmpty(s string) []string {
	if s == "" {
		return nil
	}
	return []string{s}
}
