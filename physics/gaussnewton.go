package physics

import "math"

// Newton solution of the Gauss stage equations, for the steps where the
// fixed-point iteration of stepper.next does not contract: a thin prop (a
// wire, a needle) has |L|/I1, the size of the Jacobian of Euler's
// equations, far above the rates its motion actually has, so a step sized
// for accuracy has h |L|/I1 >> 1.
//
// The unknowns are the stage increments Z_i = Y_i - y0 (i = 1..s) of
//
//	Z_i = h sum_j a_ij f(y0 + Z_j),
//
// solved by simplified Newton iteration (Hairer & Wanner, Solving Ordinary
// Differential Equations II, 2nd ed., §IV.8; Hairer, Lubich & Wanner,
// Geometric Numerical Integration, 2nd ed., §VIII.5):
//
//	(I - h A ⊗ J) dZ = -(Z - h (A ⊗ I) F(Z)),   J = f'(y0),
//
// one LU factorisation of the 4·7 = 28 square matrix a step and a
// forward/back substitution an iteration. If the iteration contracts slowly
// (ratio of successive increments over 1/2) the matrix is rebuilt once with
// each stage's own Jacobian f'(Y_j), which is Newton's method proper. The
// iteration stops at round-off: increments below 1e-15, or no longer
// shrinking below 1e-14 h |L|/I1 (the matrix's conditioning lifts the
// round-off floor of the increments, not of the result: the thin-prop
// tests check the result against the closed form). The new state is
// y1 = y0 + h sum_j b_j f(Y_j), as in the fixed-point path: the form
// y0 + sum_j d_j Z_j with d^T = b^T A^-1 (Hairer & Wanner II, §IV.8) lets
// the increments' round-off floor into the invariants (|L|^2 drifted 1e-11
// over 10^4 wire steps, against 1e-15 here). Solved to round-off, the step
// is the Gauss step, so it keeps the quadratic invariants E, |L|^2 and
// |Q|^2 (Hairer, Lubich & Wanner, GNI §IV.2, Theorem 2.2).
//
// The angular momentum components are scaled by 1/|L| inside the solve, so
// that every unknown is of order one.

// gaussDim is the size of the stage system: 4 stages of the 7 state values.
const gaussDim = gaussStages * 7

// jacobian writes f'(y), the 7x7 Jacobian of rotor.f at y, into J.
func (r *rotor) jacobian(y *state, J *[7][7]float64) {
	i0, i1, i2 := r.inv[0], r.inv[1], r.inv[2]
	l0, l1, l2 := y[0], y[1], y[2]
	w0, w1, w2 := l0*i0, l1*i1, l2*i2
	qw, qx, qy, qz := y[3], y[4], y[5], y[6]
	*J = [7][7]float64{
		// dL/dt = L x omega.
		{0, w2 - l2*i1, l1*i2 - w1},
		{l2*i0 - w2, 0, w0 - l0*i2},
		{w1 - l1*i0, l0*i1 - w0, 0},
		// dQ/dt = Q (0, omega) / 2: its L part through omega, its Q part.
		{-0.5 * qx * i0, -0.5 * qy * i1, -0.5 * qz * i2, 0, -0.5 * w0, -0.5 * w1, -0.5 * w2},
		{0.5 * qw * i0, -0.5 * qz * i1, 0.5 * qy * i2, 0.5 * w0, 0, 0.5 * w2, -0.5 * w1},
		{0.5 * qz * i0, 0.5 * qw * i1, -0.5 * qx * i2, 0.5 * w1, -0.5 * w2, 0, 0.5 * w0},
		{-0.5 * qy * i0, 0.5 * qx * i1, 0.5 * qw * i2, 0.5 * w2, 0.5 * w1, -0.5 * w0, 0},
	}
}

// stageMatrix is the LU factorisation of I - h (A ⊗ J) in scaled unknowns.
type stageMatrix struct {
	a   [gaussDim][gaussDim]float64
	piv [gaussDim]int
}

// build fills m with I - h a_ij J_j in the scaled unknowns (L by 1/|L|,
// sc[c] the scale of component c) and factorises it; J[j] is the Jacobian
// used for the stage column j. It reports false for a singular matrix.
func (m *stageMatrix) build(h float64, J *[gaussStages][7][7]float64, sc *[7]float64) bool {
	for i := range gaussStages {
		for j := range gaussStages {
			ha := h * gaussA[i][j]
			for c := range 7 {
				row := &m.a[7*i+c]
				for d := range 7 {
					row[7*j+d] = -ha * J[j][c][d] * sc[c] / sc[d]
				}
			}
		}
	}
	for k := range gaussDim {
		m.a[k][k]++
	}
	return m.factor()
}

// factor is LU decomposition with partial pivoting, in place (Golub & Van
// Loan, Matrix Computations, 4th ed., Algorithm 3.4.1).
func (m *stageMatrix) factor() bool {
	for k := range gaussDim {
		p, best := k, math.Abs(m.a[k][k])
		for i := k + 1; i < gaussDim; i++ {
			if v := math.Abs(m.a[i][k]); v > best {
				p, best = i, v
			}
		}
		if !(best > 0) || math.IsInf(best, 0) {
			return false
		}
		m.piv[k] = p
		m.a[k], m.a[p] = m.a[p], m.a[k]
		rk := &m.a[k]
		inv := 1 / rk[k]
		for i := k + 1; i < gaussDim; i++ {
			ri := &m.a[i]
			l := ri[k] * inv
			ri[k] = l
			if l == 0 {
				continue
			}
			for j := k + 1; j < gaussDim; j++ {
				ri[j] -= l * rk[j]
			}
		}
	}
	return true
}

// solve overwrites x with the solution of (LU) x = x.
func (m *stageMatrix) solve(x *[gaussDim]float64) {
	for k := range gaussDim {
		if p := m.piv[k]; p != k {
			x[k], x[p] = x[p], x[k]
		}
	}
	for i := 1; i < gaussDim; i++ {
		ri := &m.a[i]
		s := x[i]
		for j := range i {
			s -= ri[j] * x[j]
		}
		x[i] = s
	}
	for i := gaussDim - 1; i >= 0; i-- {
		ri := &m.a[i]
		s := x[i]
		for j := i + 1; j < gaussDim; j++ {
			s -= ri[j] * x[j]
		}
		x[i] = s / ri[i]
	}
}

// newton solves the stage equations of one step of size st.h from s by
// (simplified) Newton iteration, starting from the stage derivatives k, and
// returns the new state; k is overwritten with the converged stage
// derivatives (for the next step's starting guess). It reports false if the
// iteration did not reach round-off.
func (st *stepper) newton(s *state, k *[gaussStages]state) (state, bool) {
	r, h := st.rot, st.h
	norm := math.Sqrt(s[0]*s[0] + s[1]*s[1] + s[2]*s[2])
	if norm == 0 {
		norm = 1
	}
	sc := [7]float64{1 / norm, 1 / norm, 1 / norm, 1, 1, 1, 1}
	z := stageGuess(k, h)
	m := &st.newtonMatrix
	var J [gaussStages][7][7]float64
	r.jacobian(s, &J[0])
	J[1], J[2], J[3] = J[0], J[0], J[0]
	if !m.build(h, &J, &sc) {
		return *s, false
	}
	floor := 1e-16 * math.Max(1, h*norm*r.inv[0])
	full := false
	prev := math.Inf(1)
	ok := false
	for range 40 {
		var x [gaussDim]float64
		st.residual(s, &z, &sc, &x)
		m.solve(&x)
		change := addIncrement(&z, &x, &sc)
		if !(change < math.Inf(1)) {
			return *s, false
		}
		// Converged: to round-off, or to the floor set by the matrix's
		// conditioning (round-off times h |L|/I1), where the increments
		// stop shrinking.
		if change < 1e-15 || (change < floor && change > 0.25*prev) {
			ok = true
			break
		}
		if full && change >= prev {
			break // Newton proper does not converge either
		}
		if !full && change > 0.5*prev {
			// Simplified Newton stalls: switch to Newton proper, with the
			// Jacobian at every stage.
			for j := range gaussStages {
				y := stagePoint(s, &z, j)
				r.jacobian(&y, &J[j])
			}
			if !m.build(h, &J, &sc) {
				return *s, false
			}
			full = true
			prev = math.Inf(1)
			continue
		}
		prev = change
	}
	st.addTurn(s, &z)
	// y1 = y0 + h sum b_j f(Y_j); k keeps the stage derivatives.
	next := *s
	for j := range gaussStages {
		y := stagePoint(s, &z, j)
		r.f(&y, &k[j])
	}
	for c := range 7 {
		next[c] += h * (gaussB[0]*k[0][c] + gaussB[1]*k[1][c] + gaussB[2]*k[2][c] + gaussB[3]*k[3][c])
	}
	return next, ok
}

// stageGuess returns the starting stage increments z_i = h sum_j a_ij k_j
// from the stage derivatives k.
func stageGuess(k *[gaussStages]state, h float64) [gaussStages]state {
	var z [gaussStages]state
	for i := range gaussStages {
		for c := range 7 {
			var v float64
			for j := range gaussStages {
				v += gaussA[i][j] * k[j][c]
			}
			z[i][c] = h * v
		}
	}
	return z
}

// stagePoint returns the state at stage j, s + z_j.
func stagePoint(s *state, z *[gaussStages]state, j int) state {
	var y state
	for c := range 7 {
		y[c] = s[c] + z[j][c]
	}
	return y
}

// residual sets x to minus the stage equations' residual, g_i = z_i - h
// sum_j a_ij f(s + z_j), scaled by sc: the right-hand side of a Newton
// step.
func (st *stepper) residual(s *state, z *[gaussStages]state, sc *[7]float64, x *[gaussDim]float64) {
	h := st.h
	var fz [gaussStages]state
	for j := range gaussStages {
		y := stagePoint(s, z, j)
		st.rot.f(&y, &fz[j])
	}
	for i := range gaussStages {
		for c := range 7 {
			g := z[i][c] - h*(gaussA[i][0]*fz[0][c]+gaussA[i][1]*fz[1][c]+gaussA[i][2]*fz[2][c]+gaussA[i][3]*fz[3][c])
			x[7*i+c] = -g * sc[c]
		}
	}
}

// addIncrement adds the solved Newton step x (scaled by sc) to z and
// returns its largest scaled component.
func addIncrement(z *[gaussStages]state, x *[gaussDim]float64, sc *[7]float64) float64 {
	var change float64
	for i := range gaussStages {
		for c := range 7 {
			dz := x[7*i+c]
			z[i][c] += dz / sc[c]
			change = math.Max(change, math.Abs(dz))
		}
	}
	return change
}
