package cli

import (
	"encoding/json"
	"fmt"
	"image/png"
	"io"
	"math"
	"strconv"

	"propflight/internal/printable"
	"propflight/physics"
	"propflight/widgets/axisview"
)

// mapSamplesFlag is map's --samples: the directions judged. Its own
// declaration (spread's --samples counts throws, with another default).
var mapSamplesFlag = &Flag{Name: "--samples", Value: "N", Kind: Int, Default: strconv.Itoa(physics.DefaultMapSamples),
	Help: "spin directions, spread evenly over the sphere (1 to " + strconv.Itoa(physics.MaxMapSamples) + ")"}

// Size of the picture -o writes, pixels, and its text scale.
const (
	mapPNGWidth  = 1200
	mapPNGHeight = 720
	mapPNGScale  = 2
)

func init() {
	register(&Spec{
		Name: "map", Order: 52,
		Synopsis: "FILE [--json] [--samples N] [-o MAP.png]",
		Summary:  "the axis map: what every spin direction of the prop does",
		About: "Judge spin directions spread evenly over the sphere for the prop's principal\n" +
			"moments: each one's motion (spin, tumble or wobble), excursion and\n" +
			"spin-to-wobble ratio, under the project's verdict rules. The verdict does\n" +
			"not depend on the spin rate, so the map holds every throw of the prop. A\n" +
			"direction and its opposite share their verdict. -o draws the map as a PNG:\n" +
			"two equal-area views of the sphere of directions, the throw's spin ringed.",
		Operand: "FILE",
		Flags: []*Flag{
			{Name: "--json", Aliases: []string{"-json"}, Help: "print one JSON object (DESIGN.md keys) instead of the summary"},
			mapSamplesFlag,
			outputFlag,
			forceFlag,
			presetFlag,
		},
		Check: checkMap,
		Run:   runMap,
	})
}

func checkMap(c *Command) error {
	if n := c.Int(mapSamplesFlag.Name); n < 1 || n > physics.MaxMapSamples {
		return usagef("map: --samples: %s is not a whole number from 1 to %d", quote(c.Text(mapSamplesFlag.Name)), physics.MaxMapSamples)
	}
	if c.Switch("--json") && c.Text(outputFlag.Name) == "-" {
		return usagef("map: -o -: the PNG and --json cannot both go to standard output")
	}
	return nil
}

// mapJSON is the object "map --json" prints (DESIGN.md keys): the prop's
// principal moments (kg m^2, ascending) and axes (rows, prop frame), and
// one entry a direction.
type mapJSON struct {
	PrincipalMoments [3]float64     `json:"principal_moments"`
	PrincipalAxes    [3][3]float64  `json:"principal_axes"`
	Directions       []mapDirection `json:"directions"`
}

// mapDirection is one judged direction: the unit spin axis in the prop
// frame, the motion, the excursion (degrees) and the spin-to-wobble ratio
// (null for a tumble and a symmetric prop end over end).
type mapDirection struct {
	Axis           [3]float64 `json:"axis"`
	Motion         string     `json:"motion"`
	ExcursionDeg   float64    `json:"excursion_deg"`
	WobblesPerTurn *float64   `json:"wobbles_per_turn"`
}

func runMap(out io.Writer, c *Command) error {
	src, sc, err := loadScene(c)
	if err != nil {
		return err
	}
	mp := &sc.Mass
	am := physics.MapDirections(mp, sc.Thresholds, c.Int(mapSamplesFlag.Name))
	if dest := c.Text(outputFlag.Name); dest != "" {
		spin := sc.Throw.SpinAxis(mp)
		m := physics.NewAxisMapper(mp, sc.Thresholds)
		img := axisview.Render(m, mapPNGWidth, mapPNGHeight, axisview.Options{Palette: axisview.PrintPalette(), Scale: mapPNGScale, Spin: &spin})
		// With -o - the PNG is the output; report nothing else.
		sink := out
		if dest != "-" && c.Switch("--json") {
			sink = io.Discard
		}
		if err := writeOut(sink, c, dest, func(w io.Writer) error { return png.Encode(w, img) },
			fmt.Sprintf("the axis map of %s, %d x %d pixels", printable.String(sc.Name), mapPNGWidth, mapPNGHeight)); err != nil {
			return err
		}
		if dest == "-" {
			return nil
		}
	}
	if c.Switch("--json") {
		j := mapJSON{PrincipalMoments: mp.Moments, Directions: make([]mapDirection, len(am.Directions))}
		for i, a := range mp.Axes {
			j.PrincipalAxes[i] = arr(a)
		}
		for i, d := range am.Directions {
			e := mapDirection{Axis: arr(d.Axis), Motion: d.Motion.String(), ExcursionDeg: d.ExcursionDeg}
			if d.HasRatio {
				x := d.WobblesPerTurn
				e.WobblesPerTurn = &x
			}
			j.Directions[i] = e
		}
		// One line: a map holds thousands of directions.
		return json.NewEncoder(out).Encode(j)
	}
	writeMapSummary(out, src.label, sc.Name, am, sc.Thresholds, physics.NewAxisMapper(mp, sc.Thresholds).Verdict(sc.Throw.SpinAxis(mp)))
	return nil
}

// writeMapSummary prints the share of directions of each motion, the
// range of the ratio among them, and the throw's own direction.
func writeMapSummary(out io.Writer, label, name string, am physics.AxisMap, thr physics.Thresholds, throw physics.DirectionVerdict) {
	p := func(format string, args ...any) { fmt.Fprintf(out, format+"\n", args...) }
	title := printable.String(name)
	if title == "" {
		title = "(unnamed)"
	}
	p("%s  (%s)", title, printable.String(label))
	p("Axis map of %d spin directions spread evenly over the sphere (any rate)", len(am.Directions))
	p("  moments   I1 = %s, I2 = %s, I3 = %s kg m^2  (%s)", num(am.Moments[0]), num(am.Moments[1]), num(am.Moments[2]), am.Symmetry)
	type share struct {
		n        int
		lo, hi   float64
		hasRatio bool
	}
	groups := map[string]*share{}
	var order []string
	for _, d := range am.Directions {
		key := d.Motion.String()
		if d.Motion == physics.Spinning {
			key = "spin about the " + d.Circles.String() + " axis"
		}
		g := groups[key]
		if g == nil {
			g = &share{lo: math.Inf(1), hi: math.Inf(-1)}
			groups[key] = g
			order = append(order, key)
		}
		g.n++
		if d.HasRatio {
			g.hasRatio = true
			g.lo, g.hi = math.Min(g.lo, d.WobblesPerTurn), math.Max(g.hi, d.WobblesPerTurn)
		}
	}
	for _, key := range order {
		g := groups[key]
		line := fmt.Sprintf("  %-30s %5.1f %% of directions", key, 100*float64(g.n)/float64(len(am.Directions)))
		if g.hasRatio {
			line += fmt.Sprintf(", spin : wobble 1 : %s to 1 : %s", num(g.lo), num(g.hi))
		}
		p("%s", line)
	}
	p("  (tumble from %g deg of excursion; wobble from %g deg)", thr.TumbleDeg, thr.WobbleMinDeg)
	a := throw.Axis
	line := fmt.Sprintf("This throw: axis (%.3f, %.3f, %.3f), %s, excursion %.1f deg", a.X, a.Y, a.Z, throw.Motion, throw.ExcursionDeg)
	if throw.HasRatio {
		line += ", spin : wobble 1 : " + num(throw.WobblesPerTurn)
	}
	p("%s", line)
}
