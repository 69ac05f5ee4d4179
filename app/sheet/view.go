package sheet

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"gonum.org/v1/gonum/spatial/r3"

	"propflight/physics"
	"propflight/widgets/wire"
)

// PoseView is where the pose drawings look from.
type PoseView int

const (
	// PoseBest (the zero value) picks, of front, side, top and along the
	// spin, the view that shows the poses largest: see BestPoseView.
	PoseBest  PoseView = iota
	PoseFront          // from +z: x right, y up (the arc chart's view of a throw along x)
	PoseSide           // from +x: -z right, y up
	PoseTop            // from above: x right, -z up
	PoseSpin           // along the angular momentum L, which stays fixed in the world for a free prop
	PoseFree           // the preview's three-quarter perspective
)

// PoseViewNames are the names of the pose views, in PoseView order, as
// the command line and the window offer them.
var PoseViewNames = []string{"best", "front", "side", "top", "spin", "free"}

func (v PoseView) String() string {
	if v >= 0 && int(v) < len(PoseViewNames) {
		return PoseViewNames[v]
	}
	return fmt.Sprintf("PoseView(%d)", int(v))
}

// ParsePoseView returns the view named s (PoseViewNames, any case).
func ParsePoseView(s string) (PoseView, error) {
	if i := slices.Index(PoseViewNames, strings.ToLower(strings.TrimSpace(s))); i >= 0 {
		return PoseView(i), nil
	}
	return 0, fmt.Errorf("%q is not a pose view (use %s)", s, strings.Join(PoseViewNames, ", "))
}

// viewWords names a view's projection the same way on the arc chart and
// the pose page: which world directions are right and up on paper.
func viewWords(v PoseView) string {
	switch v {
	case PoseFront:
		return "front view (x right, y up)"
	case PoseSide:
		return "side view (−z right, y up)"
	case PoseTop:
		return "top view (x right, −z up)"
	case PoseSpin:
		return "view along the spin's angular momentum L"
	case PoseFree:
		return "three-quarter perspective view"
	}
	return v.String() + " view"
}

// worldL returns the prop's angular momentum in world axes at frame f of
// the take, kg m^2/s: R I R^T omega with I the inertia tensor about the
// centre of mass in prop axes and R the frame's orientation.
func worldL(mp *physics.MassProps, f *physics.Frame) r3.Vec {
	r := f.Orient.Normalize().Mat()
	return r.MulVec(mp.Inertia.MulVec(r.T().MulVec(f.Omega)))
}

// poseCamera returns the camera of view v for a cell of w x h pixels. The
// spin view is orthographic, looking along L (from its tip toward the
// prop); with no spin it is the front view. Best must be resolved first.
func poseCamera(v PoseView, w, h int, mp *physics.MassProps, tk *physics.Take) wire.Camera {
	switch v {
	case PoseSide:
		return wire.NewCamera(wire.Side, w, h)
	case PoseTop:
		return wire.NewCamera(wire.Top, w, h)
	case PoseFree:
		return wire.NewCamera(wire.Free, w, h)
	case PoseSpin:
		l := worldL(mp, &tk.Frames[0])
		if n := r3.Norm(l); n > 0 {
			l = r3.Scale(1/n, l)
			c := wire.NewCamera(wire.Free, w, h)
			c.Ortho = true
			c.Yaw = math.Atan2(l.X, l.Z)
			c.Pitch = math.Max(-wire.MaxPitch, math.Min(wire.MaxPitch, math.Asin(math.Max(-1, math.Min(1, l.Y)))))
			return c
		}
	}
	return wire.NewCamera(wire.Front, w, h)
}

// maxHullPoints bounds the prop vertices BestPoseView projects per pose.
const maxHullPoints = 4000

// BestPoseView returns the view, of front, side, top and spin (in that
// order on a tie), in which the poses at the given frames cover the
// largest mean area: for each pose, the area of the convex hull of the
// prop's vertices projected on the view's screen plane (right and up
// axes, metres). The rule is measurable and keeps a flat prop face-on
// rather than edge-on: a disc of radius r seen face-on covers pi r^2,
// edge-on only 2 r times its thickness. With no frames it is front.
func BestPoseView(prop *physics.Prop, mp *physics.MassProps, tk *physics.Take, frames []int) PoseView {
	verts := wire.PropMesh(prop, wire.DefaultDetail).Vertices
	if step := len(verts)/maxHullPoints + 1; step > 1 {
		thin := make([]r3.Vec, 0, len(verts)/step+1)
		for i := 0; i < len(verts); i += step {
			thin = append(thin, verts[i])
		}
		verts = thin
	}
	best, bestArea := PoseFront, -1.0
	pts := make([][2]float64, len(verts))
	for _, v := range []PoseView{PoseFront, PoseSide, PoseTop, PoseSpin} {
		cam := poseCamera(v, 100, 100, mp, tk)
		right, up, _ := cam.Axes()
		sum := 0.0
		for _, n := range frames {
			f := &tk.Frames[n]
			r := f.Orient.Normalize().Mat()
			for i, p := range verts {
				q := r.MulVec(r3.Sub(p, mp.CM)) // about the centre of mass, world axes
				pts[i] = [2]float64{r3.Dot(q, right), r3.Dot(q, up)}
			}
			sum += hullArea(pts)
		}
		if mean := sum / float64(max(len(frames), 1)); mean > bestArea*(1+1e-9) {
			best, bestArea = v, mean
		}
	}
	return best
}

// hullArea returns the area of the convex hull of points (Andrew's
// monotone chain, then the shoelace formula). It sorts pts in place.
func hullArea(pts [][2]float64) float64 {
	if len(pts) < 3 {
		return 0
	}
	slices.SortFunc(pts, func(a, b [2]float64) int {
		if a[0] != b[0] {
			return cmpF(a[0], b[0])
		}
		return cmpF(a[1], b[1])
	})
	cross := func(o, a, b [2]float64) float64 { return (a[0]-o[0])*(b[1]-o[1]) - (a[1]-o[1])*(b[0]-o[0]) }
	hull := make([][2]float64, 0, 2*len(pts))
	for _, p := range pts { // lower hull
		for len(hull) >= 2 && cross(hull[len(hull)-2], hull[len(hull)-1], p) <= 0 {
			hull = hull[:len(hull)-1]
		}
		hull = append(hull, p)
	}
	lower := len(hull) + 1
	for i := len(pts) - 2; i >= 0; i-- { // upper hull
		p := pts[i]
		for len(hull) >= lower && cross(hull[len(hull)-2], hull[len(hull)-1], p) <= 0 {
			hull = hull[:len(hull)-1]
		}
		hull = append(hull, p)
	}
	area := 0.0
	for i := 0; i+1 < len(hull); i++ {
		area += hull[i][0]*hull[i+1][1] - hull[i+1][0]*hull[i][1]
	}
	return math.Abs(area) / 2
}

func cmpF(a, b float64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}
