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
// unknowns.
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
// householderQR of the data matrix, and writes the result to u. An
// inequality counts as satisfied when gᵢ·u − hᵢ ≥ −tol.
//
// Method: the dual active-set method of Goldfarb & Idnani (Math. Program. 27
// (1983) 1–33) on the least-distance form of the problem (Lawson & Hanson,
// Solving Least Squares Problems, 1974, ch. 23): with z = R u − c and
// u₀ = R⁻¹c, ‖R u − c‖ = ‖z‖ and gᵢ·u ≥ hᵢ ⇔ eᵢ·z ≥ fᵢ with eᵢ = R⁻ᵀgᵢ,
// fᵢ = hᵢ − gᵢ·u₀ (rows scaled to unit length). The method starts at the
// unconstrained optimum z = 0 and, while some inequality is violated, adds
// the most violated one to the active set, stepping along the projection of
// its normal onto the complement of the active normals and dropping active
// constraints whose multiplier would turn negative; every step keeps the
// active constraints satisfied and the multipliers non-negative, so it ends at
// the exact optimum after finitely many steps. Only the inequalities that
// become active are ever formed as rows; the others are checked through
// fam.slacks. When none is violated — the common case — the cost is one
// triangular solve and one sweep over the constraints.
//
// hint, if not nil, is a guess of the active set (indices into fam), e.g. the
// one returned for a neighbouring problem: when the equality-constrained
// optimum on it has non-negative multipliers it is a valid starting point of
// the method, which then usually just confirms it. The final active set is
// returned (a fresh slice).
func lsi(r []float64, n, stride int, c []float64, fam ineqFamily, tol float64, u []float64, hint []int) ([]int, error) {
	m := fam.size()
	backSolve(r, n, stride, c, u)
	if m == 0 {
		return nil, nil
	}
	buf := make([]float64, 2*n*n+8*n+m)
	take := func(k int) []float64 { v := buf[:k:k]; buf = buf[k:]; return v }
	var (
		u0  = take(n)
		s   = take(m)
		z   = take(n)
		g   = take(n)
		ep  = take(n)
		d   = take(n)
		rd  = take(n) // dual direction, one entry per active constraint
		tmp = take(n)
		lam = take(n)[:0] // multipliers of the active constraints
		nrm = take(n * n) // active normals eᵢ, n per constraint
		qr  = take(n * n) // triangular factor of the active normals
		act = make([]int, 0, n)
		inA = make([]bool, m)
	)
	copy(u0, u)
	// normal writes the unit normal eᵢ of inequality i in z-space into e
	// and returns fᵢ on the same scale.
	normal := func(i int, e []float64) (float64, error) {
		h := fam.row(i, g)
		forwardSolveT(r, n, stride, g, e)
		f := h - dot(g, u0)
		nn := math.Sqrt(dot(e, e))
		if !(nn > 0) || math.IsInf(nn, 0) {
			return 0, fmt.Errorf("constrained least squares: inequality %d has no usable normal", i)
		}
		for k := range e {
			e[k] /= nn
		}
		return f / nn, nil
	}
	if k := len(hint); k > 0 && k <= n && warmStart(hint, m, n, nrm, qr, lam[:k], tmp, normal) {
		act = append(act, hint...)
		lam = lam[:k]
		for _, i := range hint {
			inA[i] = true
		}
		for j := range k {
			for i := range n {
				z[i] += lam[j] * nrm[j*n+i]
			}
		}
		backSolve(r, n, stride, z, tmp)
		for i := range u {
			u[i] = u0[i] + tmp[i]
		}
	}
	for iter := 0; ; iter++ {
		if iter > 2*m+4*n {
			return nil, errors.New("constrained least squares: active-set method did not terminate")
		}
		fam.slacks(u, s)
		p, worst := -1, -tol
		for i, v := range s {
			if math.IsNaN(v) {
				return nil, errors.New("constrained least squares: NaN in the constraints")
			}
			if v < worst && !inA[i] {
				p, worst = i, v
			}
		}
		if p < 0 {
			return append([]int(nil), act...), nil
		}
		// Normal and right-hand side of the new constraint in z-space.
		fp, err := normal(p, ep)
		if err != nil {
			return nil, err
		}
		lp := 0.0
		for step := 0; ; step++ {
			if step > 2*n+2 {
				return nil, errors.New("constrained least squares: no progress adding an inequality")
			}
			k := len(act)
			if err := projectOut(nrm[:k*n], qr, n, k, ep, rd[:k], d, tmp); err != nil {
				return nil, err
			}
			// Partial step: the first active multiplier to reach zero.
			t1, kb := math.Inf(1), -1
			for j := range k {
				if rd[j] > 0 {
					if q := lam[j] / rd[j]; q < t1 {
						t1, kb = q, j
					}
				}
			}
			// Full step: makes the new constraint active.
			t2 := math.Inf(1)
			// d is numerically zero (|d| ≤ 1e-9 |e|) when the new normal lies
			// in the span of the active ones; then only the dual step exists.
			if dd := dot(d, ep); dd > 1e-18 && k < n {
				t2 = -(dot(ep, z) - fp) / dd
			}
			t := math.Min(t1, t2)
			if math.IsInf(t, 1) {
				return nil, errors.New("constrained least squares: inequality constraints are infeasible")
			}
			if !math.IsInf(t2, 1) {
				for i := range z {
					z[i] += t * d[i]
				}
			}
			for j := range k {
				lam[j] -= t * rd[j]
			}
			lp += t
			if t2 <= t1 {
				act = append(act, p)
				copy(nrm[k*n:(k+1)*n], ep)
				lam = append(lam, lp)
				inA[p] = true
				break
			}
			// Drop active constraint kb.
			inA[act[kb]] = false
			act = append(act[:kb], act[kb+1:]...)
			lam = append(lam[:kb], lam[kb+1:]...)
			copy(nrm[kb*n:], nrm[(kb+1)*n:k*n])
		}
		backSolve(r, n, stride, z, tmp)
		for i := range u {
			u[i] = u0[i] + tmp[i]
		}
	}
}

// warmStart tries the active set hint (distinct indices below m, at most n):
// it writes the unit normals into nrm and the multipliers y of the
// equality-constrained optimum min ‖z‖ subject to E_A z = f_A (z = E_Aᵀy,
// RᵀR y = f_A with E_Aᵀ = QR) into lam, and reports whether they are all
// non-negative with independent normals, i.e. whether the set is a valid
// start of the dual method.
func warmStart(hint []int, m, n int, nrm, qr, lam, tmp []float64, normal func(int, []float64) (float64, error)) bool {
	k := len(hint)
	var f [16]float64
	for j, i := range hint {
		if i < 0 || i >= m {
			return false
		}
		for _, i2 := range hint[:j] {
			if i2 == i {
				return false
			}
		}
		fj, err := normal(i, nrm[j*n:(j+1)*n])
		if err != nil {
			return false
		}
		f[j] = fj
	}
	a := qr[:n*k]
	for c := range k {
		for i := range n {
			a[i*k+c] = nrm[c*n+i]
		}
	}
	householderQR(a, n, k, tmp[:n])
	if !triRank(a, k, k, 1e-12) {
		return false
	}
	forwardSolveT(a, k, k, f[:k], tmp[:k])
	backSolve(a, k, k, tmp[:k], lam)
	for _, v := range lam {
		if !(v >= 0) {
			return false
		}
	}
	return true
}

// projectOut splits the unit vector e into its component d orthogonal to the
// k active normals N (rows of nrm, n each) and the coefficients rd with
// e = Nᵀrd + d, i.e. rd = (N Nᵀ)⁻¹ N e, through the triangular factor of
// Nᵀ = Q R (so N Nᵀ = RᵀR) and one step of iterative refinement (Björck,
// Numerical Methods for Least Squares Problems, 1996, §2.3). qr and tmp are
// scratch (n×n and n).
func projectOut(nrm, qr []float64, n, k int, e, rd, d, tmp []float64) error {
	copy(d, e)
	if k == 0 {
		return nil
	}
	if k > n {
		return errors.New("constrained least squares: more active constraints than unknowns")
	}
	a := qr[:n*k]
	for c := range k {
		for i := range n {
			a[i*k+c] = nrm[c*n+i]
		}
	}
	householderQR(a, n, k, tmp[:n])
	if !triRank(a, k, k, 1e-12) {
		return errors.New("constrained least squares: dependent active constraints")
	}
	clear(rd)
	for range 2 {
		// rd += (RᵀR)⁻¹ N d, d = e − Nᵀ rd.
		var nd [16]float64
		for c := range k {
			nd[c] = dot(nrm[c*n:(c+1)*n], d)
		}
		forwardSolveT(a, k, k, nd[:k], tmp[:k])
		backSolve(a, k, k, tmp[:k], nd[:k])
		for c := range k {
			rd[c] += nd[c]
		}
		copy(d, e)
		for c := range k {
			row := nrm[c*n : (c+1)*n]
			for i := range n {
				d[i] -= rd[c] * row[i]
			}
		}
	}
	return nil
}

func dot(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}

// scaledQR scales the columns of the m×n row-major matrix a to unit length,
// given their sums of squares in cs (replaced by the factors 1/‖column‖, so
// that the solution of the scaled problem times cs is the solution of the
// original), reduces a and b by Householder QR, and reports whether the
// triangular factor has full rank to tol (triRank): with unit columns the
// test sees collinearity only. False also when a column is zero or not
// finite.
func scaledQR(a []float64, m, n int, b, cs []float64, tol float64) bool {
	for k := range n {
		if !(cs[k] > 0) || math.IsInf(cs[k], 0) {
			return false
		}
		cs[k] = 1 / math.Sqrt(cs[k])
	}
	for i := range m {
		for k := range n {
			a[i*n+k] *= cs[k]
		}
	}
	householderQR(a, m, n, b)
	return triRank(a, n, n, tol)
}
