package project

import "propflight/physics"

// VerdictRules is the optional top-level "verdict_rules" object: the three
// thresholds of DESIGN.md's verdict rules, saved with the project so that
// every command and the window judge it the same way. A nil field keeps
// its default (physics.DefaultThresholds).
type VerdictRules struct {
	SymmetricWithinPercent *float64 // "symmetric_within_percent": two moments this close (relative to the larger) count as equal (default 1)
	TumbleFromDeg          *float64 // "tumble_from_deg": an asymmetric prop tumbles from this excursion, degrees (default 45)
	WobbleFromDeg          *float64 // "wobble_from_deg": a symmetric prop wobbles from this tilt, degrees (default 0.5)
}

var rulesKeys = []string{"symmetric_within_percent", "tumble_from_deg", "wobble_from_deg"}

// Ranges of the rules. Above 90 degrees tumble_from_deg can never be
// reached (the excursion is at most 90), so it means "never tumble"; the
// wobble band wobble_from_deg..90-wobble_from_deg is empty from 45.
const (
	maxSymmetricPercent = 50
	maxTumbleDeg        = 180
	maxWobbleDeg        = 45
)

// Thresholds returns the document's verdict thresholds: its rules where it
// gives them, the defaults elsewhere.
func (d *Document) Thresholds() physics.Thresholds {
	thr := physics.DefaultThresholds()
	if r := d.VerdictRules; r != nil {
		if r.SymmetricWithinPercent != nil {
			thr.SymmetryTol = *r.SymmetricWithinPercent / 100
		}
		if r.TumbleFromDeg != nil {
			thr.TumbleDeg = *r.TumbleFromDeg
		}
		if r.WobbleFromDeg != nil {
			thr.WobbleMinDeg = *r.WobbleFromDeg
		}
	}
	return thr
}

// SetThresholds stores thr as the document's rules; thresholds equal to
// the defaults are left out of the file, so a project that never changed
// them keeps no "verdict_rules".
func (d *Document) SetThresholds(thr physics.Thresholds) {
	def := physics.DefaultThresholds()
	var r VerdictRules
	if thr.SymmetryTol != def.SymmetryTol {
		r.SymmetricWithinPercent = floatPtr(thr.SymmetryTol * 100)
	}
	if thr.TumbleDeg != def.TumbleDeg {
		r.TumbleFromDeg = floatPtr(thr.TumbleDeg)
	}
	if thr.WobbleMinDeg != def.WobbleMinDeg {
		r.WobbleFromDeg = floatPtr(thr.WobbleMinDeg)
	}
	if r == (VerdictRules{}) {
		d.VerdictRules = nil
		return
	}
	d.VerdictRules = &r
}

func floatPtr(x float64) *float64 { return &x }

// verdictRules parses "verdict_rules".
func (p *parser) verdictRules(v *value) (*VerdictRules, error) {
	const path = "verdict_rules"
	m, err := p.object(v, path, rulesKeys)
	if err != nil {
		return nil, err
	}
	var r VerdictRules
	for _, f := range []struct {
		key    string
		dst    **float64
		lo, hi float64
		loOpen bool
		unit   string
	}{
		{"symmetric_within_percent", &r.SymmetricWithinPercent, 0, maxSymmetricPercent, false, "percent"},
		{"tumble_from_deg", &r.TumbleFromDeg, 0, maxTumbleDeg, true, "degrees"},
		{"wobble_from_deg", &r.WobbleFromDeg, 0, maxWobbleDeg, false, "degrees"},
	} {
		x, err := p.numberPtr(m, f.key, path)
		if err != nil {
			return nil, err
		}
		if x == nil {
			continue
		}
		if *x < f.lo || (f.loOpen && *x == f.lo) || *x > f.hi {
			if f.loOpen {
				return nil, p.fail(join(path, f.key), "must be more than %g and at most %g %s", f.lo, f.hi, f.unit)
			}
			return nil, p.fail(join(path, f.key), "must be %g to %g %s", f.lo, f.hi, f.unit)
		}
		*f.dst = x
	}
	return &r, nil
}

// verdictRules writes "verdict_rules" when the document has it.
func (e *emitter) verdictRules(r *VerdictRules) {
	if r == nil {
		return
	}
	const path = "verdict_rules"
	e.key(path)
	e.open('{')
	e.num("symmetric_within_percent", path, r.SymmetricWithinPercent)
	e.num("tumble_from_deg", path, r.TumbleFromDeg)
	e.num("wobble_from_deg", path, r.WobbleFromDeg)
	e.close('}')
}
