package nasa

import (
	"errors"
	"fmt"
	"math"
)

// This file holds the small dense least-squares kernels of the package. They
// work on flat row-major slices of at most a few hundred rows and ten
// columns, allocate only their workspaces and never form normal equations.

// householderQR reduces the m×n row-major matrix a (m ≥ n) and the right-hand
// side b in place by Householder reflections (Golub & Van Loan, Matrix
// Computations, 4th ed. 2013, §5.2): on return the upper triangle of the first
// n rows of a is R of A = QR and b[:n] is the first n entries of Qᵀb, so that
// min ‖A x − b‖ is solved by R x = b[:n]; Σ b[n:]² is the residual sum of
// squares. Entries below the diagonal are left undefined. A zero column
// leaves a zero on the diagonal of R (see triRank).
func householderQR(a []float64, m, n int, b []float64) {
	for k := range n {
		akk := a[k*n+k]
		tail := 0.0
		for i := k + 1; i < m; i++ {
			v := a[i*n+k]
			tail += v * v
		}
		if tail == 0 {
			continue // already triangular in this column
		}
		norm := math.Sqrt(akk*akk + tail)
		alpha := -math.Copysign(norm, akk)
		v0 := akk - alpha // |v0| = |akk| + norm: no cancellation
		vtv := v0*v0 + tail
		// Apply H = I − 2 v vᵀ/(vᵀv), v = (v0, a[k+1:m, k]), to the
		// remaining columns and to b.
		for j := k + 1; j < n; j++ {
			d := v0 * a[k*n+j]
			for i := k + 1; i < m; i++ {
				d += a[i*n+k] * a[i*n+j]
			}
			f := 2 * d / vtv
			a[k*n+j] -= f * v0
			for i := k + 1; i < m; i++ {
				a[i*n+j] -= f * a[i*n+k]
			}
		}
		d := v0 * b[k]
		for i := k + 1; i < m; i++ {
			d += a[i*n+k] * b[i]
		}
		f := 2 * d / vtv
		b[k] -= f * v0
		for i := k + 1; i < m; i++ {
			b[i] -= f * a[i*n+k]
		}
		a[k*n+k] = alpha
	}
}

// triRank reports whether the n×n upper triangle R stored with row stride
// stride has every |R_kk| > rel · max_j |R_jj| (and no NaN): a cheap test of
// full column rank after Householder QR of column-scaled data.
func triRank(r []float64, n, stride int, rel float64) bool {
	big := 0.0
	for k := range n {
		big = math.Max(big, math.Abs(r[k*stride+k]))
	}
	if !(big > 0) || math.IsInf(big, 0) {
		return false
	}
	for k := range n {
		if !(math.Abs(r[k*stride+k]) > rel*big) {
			return false
		}
	}
	return true
}

// backSolve solves R x = c for the n×n upper triangle R (row stride stride).
func backSolve(r []float64, n, stride int, c, x []float64) {
	for i := n - 1; i >= 0; i-- {
		s := c[i]
		for j := i + 1; j < n; j++ {
			s -= r[i*stride+j] * x[j]
		}
		x[i] = s / r[i*stride+i]
	}
}

// forwardSolveT solves Rᵀ y = g for the n×n upper triangle R (row stride
// stride).
func forwardSolveT(r []float64, n, stride int, g, y []float64) {
	for i := range n {
		s := g[i]
		for j := range i {
			s -= r[j*stride+i] * y[j]
		}
		y[i] = s / r[i*stride+i]
	}
}

// ineqFamily is a finite, indexed set of linear inequalities gᵢ·u ≥ hᵢ in n
// unknowns. Consecutive indices should be neighbouring constraints (grid
// points in order), since lsi adds one constraint per run of violated ones.
type ineqFamily interface {
	// size is the number of inequalities.
	size() int
	// slacks writes gᵢ·u − hᵢ for every i into s (len(s) = size()).
	slacks(u, s []float64)
	// row writes gᵢ into g (length n) and returns hᵢ.
	row(i int, g []float64) float64
}

// lsi minimises ‖R u − c‖₂ subject to the inequalities of fam (gᵢ·u ≥ hᵢ),
// where R is an n×n non-singular upper triangle (row stride stride), e.g. from
// householderQR of the data matrix. The result is written to u.
//
// Method: constraint generation around the least-distance formulation of
// Lawson & Hanson (Solving Least Squares Problems, 1974, ch. 23). The
// unconstrained optimum u₀ = R⁻¹c is checked against every inequality; while
// some are violated by more than tol, the worst point of each run of
// consecutive violated inequalities is added to a working set W and
//
//	min ‖z‖ subject to (gᵢ R⁻¹) z ≥ hᵢ − gᵢ·u₀,  i ∈ W,   u = u₀ + R⁻¹ z
//
// (‖R u − c‖² = ‖z‖² + const) is solved exactly through non-negative least
// squares (nnlsLDP). A solution of the relaxed problem that satisfies every
// inequality is the solution of the full problem; since W only grows, the
// loop ends after at most size() rounds, usually after one to three. When no
// inequality is violated — the common case — the cost is one triangular
// solve and one sweep over the constraints.
func lsi(r []float64, n, stride int, c []float64, fam ineqFamily, tol float64, u []float64) error {
	m := fam.size()
	backSolve(r, n, stride, c, u)
	if m == 0 {
		return nil
	}
	u0 := make([]float64, n)
	copy(u0, u)
	s := make([]float64, m)
	inW := make([]bool, m)
	var (
		// e holds the rows gᵢR⁻¹ of the working set, n per constraint,
		// and f the right-hand sides hᵢ − gᵢ·u₀.
		e, f []float64
		g    = make([]float64, n)
		z    = make([]float64, n)
		dz   = make([]float64, n)
		nw   int
		ws   nnlsWork
	)
	for round := 0; ; round++ {
		fam.slacks(u, s)
		added, worstW := 0, 0.0
		for i := 0; i < m; {
			if s[i] >= -tol {
				i++
				continue
			}
			// A run of violated inequalities: add its worst
			// member not yet in W.
			worst := -1
			for ; i < m && !(s[i] >= -tol); i++ {
				switch {
				case math.IsNaN(s[i]):
					return errors.New("constrained least squares: NaN in the constraints")
				case inW[i]:
					worstW = math.Min(worstW, s[i])
				case worst < 0 || !(s[i] >= s[worst]):
					worst = i
				}
			}
			if worst < 0 {
				continue
			}
			// The worst point and its grid neighbours: the continuous
			// optimum usually touches between two grid points, and
			// adding both at once saves rounds.
			for _, j := range [3]int{worst, worst - 1, worst + 1} {
				if j < 0 || j >= m || inW[j] {
					continue
				}
				inW[j] = true
				h := fam.row(j, g)
				e = append(e, make([]float64, n)...)
				forwardSolveT(r, n, stride, g, e[nw*n:])
				f = append(f, h-dot(g, u0))
				nw++
				added++
			}
		}
		if added == 0 {
			if worstW < 0 {
				return fmt.Errorf("constrained least squares: working-set inequality violated by %g", -worstW)
			}
			return nil
		}
		if round > m {
			return errors.New("constrained least squares: constraint generation did not terminate")
		}
		if err := nnlsLDP(e, f, nw, n, z, &ws); err != nil {
			return fmt.Errorf("constrained least squares: %w", err)
		}
		polishLDP(e, f, nw, n, ws.passive, z)
		backSolve(r, n, stride, z, dz)
		for k := range n {
			u[k] = u0[k] + dz[k]
		}
	}
}

// nnlsWork holds the scratch slices of nnlsLDP so that repeated calls reuse
// them.
type nnlsWork struct {
	cols, u, w, s, a, b []float64
	passive, rejected   []bool
	idx                 []int
}

func grow(s []float64, n int) []float64 {
	if cap(s) < n {
		return make([]float64, n)
	}
	return s[:n]
}

func growBool(s []bool, n int) []bool {
	if cap(s) < n {
		return make([]bool, n)
	}
	s = s[:n]
	clear(s)
	return s
}

// nnlsLDP solves the least-distance problem min ‖z‖ subject to E z ≥ f, E
// the m×n row-major matrix e and f of length m, and writes z (length n).
//
// Method (Lawson & Hanson 1974, ch. 23): with the (n+1)×m matrix
// Ê = [Eᵀ; fᵀ] and f̂ = (0,…,0,1), solve min ‖Ê v − f̂‖ subject to v ≥ 0 by
// the Lawson–Hanson active-set algorithm (ch. 23, algorithm NNLS, including
// its test that rejects a column nearly dependent on the passive ones); the
// residual ρ = Ê v − f̂ gives z = −ρ[:n]/ρ[n]. A zero residual means the
// inequalities are infeasible.
func nnlsLDP(e, f []float64, m, n int, z []float64, w *nnlsWork) error {
	p := n + 1
	// Column j of Ê, contiguous: (e_j, f_j).
	w.cols = grow(w.cols, m*p)
	for j := range m {
		copy(w.cols[j*p:j*p+n], e[j*n:(j+1)*n])
		w.cols[j*p+n] = f[j]
	}
	col := func(j int) []float64 { return w.cols[j*p : (j+1)*p] }
	// Scale every column to unit length (v_j then scales inversely; the
	// residual, and so z, is unchanged): the tolerances below are then
	// relative, whatever the units of the constraints.
	for j := range m {
		c := col(j)
		nrm := math.Sqrt(dot(c, c))
		if !(nrm > 0) || math.IsInf(nrm, 0) {
			return errors.New("nnls: zero or non-finite constraint")
		}
		for i := range c {
			c[i] /= nrm
		}
	}
	const tol = 1e-12
	w.u = grow(w.u, m)
	clear(w.u)
	w.w = grow(w.w, m)
	w.s = grow(w.s, m)
	w.passive = growBool(w.passive, m)
	w.rejected = growBool(w.rejected, m)
	w.a = grow(w.a, p*p)
	w.b = grow(w.b, p)
	res := make([]float64, p)
	residual := func() { // res = f̂ − Ê v
		clear(res)
		res[n] = 1
		for j := range m {
			if v := w.u[j]; v != 0 {
				for i, c := range col(j) {
					res[i] -= v * c
				}
			}
		}
	}
	// solvePassive writes into w.s the least-squares solution on the
	// passive columns (zero elsewhere); false if they are dependent.
	solvePassive := func() bool {
		w.idx = w.idx[:0]
		for j, on := range w.passive {
			if on {
				w.idx = append(w.idx, j)
			}
		}
		k := len(w.idx)
		clear(w.s)
		if k == 0 {
			return true
		}
		if k > p {
			return false
		}
		a := w.a[:p*k]
		for c, j := range w.idx {
			for i, v := range col(j) {
				a[i*k+c] = v
			}
		}
		b := w.b[:p]
		clear(b)
		b[n] = 1
		householderQR(a, p, k, b)
		for c, j := range w.idx {
			// Column j's part orthogonal to the passive columns before it.
			if !(math.Abs(a[c*k+c]) > 1e-10*math.Sqrt(dot(col(j), col(j)))) {
				return false
			}
		}
		x := w.b[:k] // back-substitute in place
		backSolve(a, k, k, b[:k], x)
		for c, j := range w.idx {
			w.s[j] = x[c]
		}
		return true
	}
	for range 3*m + 3 {
		residual()
		best, t := tol, -1
		for j := range m {
			if w.passive[j] || w.rejected[j] {
				continue
			}
			g := dot(col(j), res)
			if g > best {
				best, t = g, j
			}
		}
		if t < 0 {
			residual()
			rn := res[n] // ρ = −res
			if norm := math.Sqrt(dot(res, res)); norm < 1e-12 || math.Abs(rn) < 1e-14 {
				return errors.New("inequality constraints are infeasible")
			}
			for i := range n {
				z[i] = -res[i] / rn
			}
			return nil
		}
		w.passive[t] = true
		if !solvePassive() || w.s[t] <= 0 {
			// Lawson & Hanson's safeguard: a column that is dependent on
			// the passive set, or would enter with a non-positive
			// coefficient, is not admitted in this step.
			w.passive[t] = false
			w.rejected[t] = true
			continue
		}
		clear(w.rejected)
		for inner := 0; ; inner++ {
			if inner > 3*m+3 {
				return errors.New("nnls: inner loop did not terminate")
			}
			alpha, hit := 1.0, false
			for j := range m {
				if w.passive[j] && w.s[j] <= 0 {
					if a := w.u[j] / (w.u[j] - w.s[j]); a < alpha {
						alpha = a
					}
					hit = true
				}
			}
			if !hit {
				for j := range m {
					w.u[j] = w.s[j]
				}
				break
			}
			for j := range m {
				if w.passive[j] {
					w.u[j] += alpha * (w.s[j] - w.u[j])
					if w.u[j] <= tol {
						w.u[j] = 0
						w.passive[j] = false
					}
				}
			}
			if !solvePassive() {
				return errors.New("nnls: passive columns became dependent")
			}
		}
	}
	return errors.New("nnls: did not converge")
}

// polishLDP refines the least-distance solution z of nnlsLDP (E z ≥ f, E the
// m×n row-major matrix e) on its active set A, the passive columns of the
// NNLS problem. z = −ρ[:n]/ρ[n] loses relative precision of order ‖z‖² ε
// when ρ[n] is small (constraints far from the origin), while the solution of
// min ‖z‖ subject to E_A z = f_A,
//
//	z = E_Aᵀ y,  (E_A E_Aᵀ) y = f_A,
//
// computed with the triangular factor of E_Aᵀ = Q R (RᵀR y = f_A) and one
// step of iterative refinement (Björck, Numerical Methods for Least Squares
// Problems, 1996, §2.3), is accurate to the conditioning of E_A. The polished
// z replaces the NNLS one only if it violates no inequality by more than the
// latter does (measured on rows scaled to unit length).
func polishLDP(e, f []float64, m, n int, active []bool, z []float64) {
	var idx []int
	for j := range m {
		if active[j] {
			idx = append(idx, j)
		}
	}
	k := len(idx)
	if k == 0 || k > n {
		return
	}
	mt := make([]float64, n*k) // E_Aᵀ, n×k
	for c, j := range idx {
		for i := range n {
			mt[i*k+c] = e[j*n+i]
		}
	}
	qr := append([]float64(nil), mt...)
	householderQR(qr, n, k, make([]float64, n))
	if !triRank(qr, k, k, 1e-10) {
		return
	}
	y := make([]float64, k)
	rhs := make([]float64, k)
	t := make([]float64, k)
	dy := make([]float64, k)
	zp := make([]float64, n)
	for c, j := range idx {
		rhs[c] = f[j]
	}
	for step := range 2 {
		forwardSolveT(qr, k, k, rhs, t)
		backSolve(qr, k, k, t, dy)
		for c := range k {
			y[c] += dy[c]
		}
		for i := range n {
			zp[i] = dot(mt[i*k:(i+1)*k], y)
		}
		if step == 0 { // residual f_A − E_A z for the refinement step
			for c, j := range idx {
				rhs[c] = f[j] - dot(e[j*n:(j+1)*n], zp)
			}
		}
	}
	worst := func(z []float64) float64 {
		v := 0.0
		for j := range m {
			row := e[j*n : (j+1)*n]
			if d := (dot(row, z) - f[j]) / math.Sqrt(dot(row, row)); !(d >= v) {
				v = d
			}
		}
		return v
	}
	if wp := worst(zp); !math.IsNaN(wp) && wp >= worst(z) {
		copy(z, zp)
	}
}

func dot(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}
