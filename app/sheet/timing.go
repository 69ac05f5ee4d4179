package sheet

import (
	"math"
	"slices"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
)

// Role is what a frame is to the animator: a key, a breakdown or an
// in-between.
type Role int

const (
	InBetween Role = iota // any other frame
	Breakdown             // halfway between two consecutive keys
	Key                   // release, apex or landing
)

// timing is the frame-by-frame analysis behind the table, the chart and
// the poses, computed once from the take.
type timing struct {
	rate    physics.Rate
	frames  []physics.Frame
	total   []float64 // total turn since release at each frame, degrees
	roles   []Role
	notes   [][]string // notes at each frame (key, breakdown, quarter turns, flips, onset), in print order
	keys    []int      // key frames, ascending
	flips   []int      // frame of each flip of a tumble (first at or after the flip time)
	onset   int        // first frame at or after the verdict's onset; -1 if none in the take
	aliased bool       // some frame turns more than half a turn (a camera at this rate sees it the shorter way)
}

// keyFrames returns the keys of a take with its last frame: release (0),
// apex and landing, ascending without repeats.
func keyFrames(tk *physics.Take) []int {
	last := len(tk.Frames) - 1
	k := []int{0, min(max(tk.ApexFrame, 0), last), last}
	slices.Sort(k)
	return slices.Compact(k)
}

// breakdownFrames returns the breakdown between each pair of consecutive
// keys a < b: frame (a + b) / 2 rounded down, when b - a >= 2 (keys one
// frame apart have no frame between them).
func breakdownFrames(keys []int) []int {
	var bd []int
	for i := 0; i+1 < len(keys); i++ {
		a, b := keys[i], keys[i+1]
		if b-a >= 2 {
			bd = append(bd, (a+b)/2)
		}
	}
	return bd
}

// flipFrames returns, for a tumble, the frame of each flip of the middle
// axis inside the take: the flip times FirstFlip + k FlipPeriod (k = 0, 1,
// ...) up to the last frame's time, each mapped to the first frame at or
// after it.
func flipFrames(v *physics.Verdict, r physics.Rate, tk *physics.Take) []int {
	if !v.HasFlip || !v.FirstFlipFound || !(v.FlipPeriod > 0) || math.IsInf(v.FlipPeriod, 0) || math.IsNaN(v.FirstFlip) {
		return nil
	}
	last := len(tk.Frames) - 1
	tEnd := r.Time(last)
	var out []int
	for k := 0; ; k++ {
		t := v.FirstFlip + float64(k)*v.FlipPeriod
		f := r.FrameAtOrAfter(t)
		if t > tEnd+1e-9/r.FPS() || f > last || k > 100000 {
			return out
		}
		out = append(out, f)
	}
}

// quarterSlack is how close (degrees) a total turn may come to a multiple
// of 90 degrees to count as having reached it, so that a spin of exactly
// 30 degrees a frame notes 90 degrees on frame 3 despite round-off in the
// sum.
const quarterSlack = 1e-7

// quarters returns how many quarter turns a total turn of deg degrees
// has reached.
func quarters(deg float64) int { return int(math.Floor((deg + quarterSlack) / 90)) }

// quarterNote names the multiples of 90 degrees the total turn passes in
// one frame, from the (m0+1)th to the m1th: "90°", "90°, 180°", or for
// more than three "90°–450° (5 quarters)".
func quarterNote(m0, m1 int) string {
	n := m1 - m0
	q := func(m int) string { return strconv.Itoa(90*m) + "°" }
	switch {
	case n == 1:
		return q(m1)
	case n <= 3:
		var s []string
		for m := m0 + 1; m <= m1; m++ {
			s = append(s, q(m))
		}
		return strings.Join(s, ", ")
	}
	return q(m0+1) + "–" + q(m1) + " (" + strconv.Itoa(n) + " quarters)"
}

// analyse computes the timing of take tk at rate r under verdict v.
func analyse(tk *physics.Take, r physics.Rate, v *physics.Verdict) *timing {
	n := len(tk.Frames)
	tm := &timing{rate: r, frames: tk.Frames, total: make([]float64, n), roles: make([]Role, n),
		notes: make([][]string, n), onset: -1}
	half := 180.0
	dt := r.Time(1)
	for i := range tk.Frames {
		f := &tk.Frames[i]
		if i > 0 {
			tm.total[i] = tm.total[i-1] + f.TurnDeg
		}
		if deg(r3.Norm(f.Omega)*dt) > half {
			tm.aliased = true
		}
	}
	tm.keys = keyFrames(tk)
	last := n - 1
	apex := min(max(tk.ApexFrame, 0), last)
	add := func(i int, s string) { tm.notes[i] = append(tm.notes[i], s) }

	// Keys first, then breakdowns, quarter turns, flips and the onset.
	for _, k := range tm.keys {
		tm.roles[k] = Key
		var names []string
		if k == 0 {
			names = append(names, "release")
		}
		if k == apex && tk.ApexTime > 0 {
			names = append(names, "apex")
		}
		if k == last {
			names = append(names, "landing")
		}
		if len(names) > 0 {
			add(k, "key: "+strings.Join(names, ", "))
		}
	}
	for _, b := range breakdownFrames(tm.keys) {
		if tm.roles[b] == InBetween {
			tm.roles[b] = Breakdown
			add(b, "breakdown")
		}
	}
	for i := 1; i < n; i++ {
		m0, m1 := quarters(tm.total[i-1]), quarters(tm.total[i])
		if m1 > m0 {
			add(i, quarterNote(m0, m1))
		}
	}
	tm.flips = flipFrames(v, r, tk)
	for k, f := range tm.flips {
		add(f, "flip "+strconv.Itoa(k+1))
	}
	if v.HasOnset && !math.IsInf(v.Onset, 0) && !math.IsNaN(v.Onset) {
		if f := r.FrameAtOrAfter(v.Onset); f <= last {
			tm.onset = f
			add(f, "onset")
		}
	}
	return tm
}

// row is one line of the frame table.
type row struct {
	frame   int
	cm      r3.Vec
	spacing float64  // m, since the previous row
	turn    float64  // degrees, since the previous row
	total   float64  // degrees since release
	role    Role     // the strongest role of the frames the row stands for
	notes   []string // the notes column (printed under the head "marks")
}

// rows returns the table rows: every frame, or with twos every other frame
// (0, 2, 4, ...). On twos a row's drawing is held for the next frame too,
// so the notes of that skipped frame join the row with "(at N)", its role
// counts toward the row's, and spacing and turn are measured from the
// previous listed row: the straight distance between the two centres of
// mass and the angle turned along the motion (the frames' TurnDeg added,
// so a fast spin is not read the shorter way round). On ones they are the
// take's own Spacing and TurnDeg.
func (tm *timing) rows(twos bool) []row {
	step := 1
	if twos {
		step = 2
	}
	var out []row
	for i := 0; i < len(tm.frames); i += step {
		f := &tm.frames[i]
		r := row{frame: f.N, cm: f.CM, total: tm.total[i], role: tm.roles[i], notes: slices.Clone(tm.notes[i])}
		switch {
		case i == 0:
		case step == 1:
			r.spacing, r.turn = f.Spacing, f.TurnDeg
		default:
			p := &tm.frames[i-step]
			r.spacing = r3.Norm(r3.Sub(f.CM, p.CM))
			r.turn = tm.total[i] - tm.total[i-step]
		}
		for j := i + 1; j < i+step && j < len(tm.frames); j++ {
			r.role = max(r.role, tm.roles[j])
			for _, m := range tm.notes[j] {
				r.notes = append(r.notes, m+" (at "+strconv.Itoa(tm.frames[j].N)+")")
			}
		}
		out = append(out, r)
	}
	return out
}
