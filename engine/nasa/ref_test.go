package nasa

// This file keeps the first, straightforward implementation of the fits
// (gonum SVD/QR, Lawson–Hanson NNLS over every grid constraint, dense B scan)
// as a slow reference: the tests check that the fast code in lsq.go,
// wilhoit.go and fit.go reaches the same optima.

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// refRow is one linear constraint row c·x (= or ≥) rhs.
type refRow struct {
	c   []float64
	rhs float64
}

// refConstrainedLSQ minimises ‖A x − b‖₂ subject to the equalities eq (c·x =
// rhs) and the inequalities ineq (c·x ≥ rhs). A must have full column rank
// on the null space of the equalities.
//
// Method (Lawson & Hanson, Solving Least Squares Problems, 1974, ch. 20–23):
// the equalities are eliminated with the SVD of their matrix C: x = x_p + Z w,
// x_p the minimum-norm solution of C x = d, Z a basis of the null space of C.
// The remaining problem min ‖A′w − b′‖ with G′w ≥ h′ is turned into a
// least-distance problem by the SVD A′ = U Σ Vᵀ: with w = V Σ⁻¹(z + Uᵀb′),
// ‖A′w − b′‖² = ‖z‖² + const, and min ‖z‖ subject to linear inequalities is
// solved exactly (up to rounding) through a non-negative least-squares
// problem (nnls). No normal equations are formed. tolIneq is the violation
// accepted when the result is verified.
func refConstrainedLSQ(a *mat.Dense, b []float64, eq, ineq []refRow, tolIneq float64) ([]float64, error) {
	_, n := a.Dims()
	xp := make([]float64, n)
	var z *mat.Dense // n × k null-space basis; nil means identity
	k := n
	if len(eq) > 0 {
		c := mat.NewDense(len(eq), n, nil)
		d := mat.NewVecDense(len(eq), nil)
		for i, r := range eq {
			c.SetRow(i, r.c)
			d.SetVec(i, r.rhs)
		}
		var svd mat.SVD
		if !svd.Factorize(c, mat.SVDFull) {
			return nil, errors.New("constrained least squares: SVD of the equalities did not converge")
		}
		rank := svd.Rank(1e-12)
		if rank < len(eq) {
			return nil, errors.New("constrained least squares: dependent equality constraints")
		}
		xv := mat.NewVecDense(n, xp)
		svd.SolveVecTo(xv, d, rank)
		var v mat.Dense
		svd.VTo(&v)
		k = n - rank
		if k == 0 {
			return refCheckIneq(xp, ineq, tolIneq)
		}
		z = mat.DenseCopyOf(v.Slice(0, n, rank, n))
	}
	// Reduced problem in w: A′ = A Z, b′ = b − A x_p.
	ar := a
	if z != nil {
		ar = new(mat.Dense)
		ar.Mul(a, z)
	}
	br := mat.NewVecDense(len(b), nil)
	br.MulVec(a, mat.NewVecDense(n, xp))
	br.SubVec(mat.NewVecDense(len(b), b), br)

	var svd mat.SVD
	if !svd.Factorize(ar, mat.SVDThin) {
		return nil, errors.New("constrained least squares: SVD did not converge")
	}
	if svd.Rank(1e-12) < k {
		return nil, errors.New("constrained least squares: too few independent data for the unknowns")
	}
	sv := svd.Values(nil)
	var u, v mat.Dense
	svd.UTo(&u)
	svd.VTo(&v)
	// M = V Σ⁻¹ (k × k); w = M (z + Uᵀ b′).
	m := mat.NewDense(k, k, nil)
	for i := range k {
		for j := range k {
			m.Set(i, j, v.At(i, j)/sv[j])
		}
	}
	var utb mat.VecDense
	utb.MulVec(u.T(), br)
	w := mat.NewVecDense(k, nil)
	w.MulVec(m, &utb) // unconstrained optimum (z = 0)
	if len(ineq) > 0 {
		// x = x_p + Z w; G x ≥ h  ⇔  (G Z M) z ≥ h − G x_p − G Z w₀.
		g := mat.NewDense(len(ineq), n, nil)
		h := make([]float64, len(ineq))
		for i, r := range ineq {
			g.SetRow(i, r.c)
			h[i] = r.rhs - dot(r.c, xp)
		}
		gz := g
		if z != nil {
			gz = new(mat.Dense)
			gz.Mul(g, z)
		}
		var gzw mat.VecDense
		gzw.MulVec(gz, w)
		var e mat.Dense
		e.Mul(gz, m)
		for i := range h {
			h[i] -= gzw.AtVec(i)
		}
		zz, err := refLeastDistance(&e, h)
		if err != nil {
			return nil, fmt.Errorf("constrained least squares: %w", err)
		}
		var dw mat.VecDense
		dw.MulVec(m, mat.NewVecDense(k, zz))
		w.AddVec(w, &dw)
	}
	x := append([]float64(nil), xp...)
	if z != nil {
		var zw mat.VecDense
		zw.MulVec(z, w)
		for i := range x {
			x[i] += zw.AtVec(i)
		}
	} else {
		for i := range x {
			x[i] += w.AtVec(i)
		}
	}
	return refCheckIneq(x, ineq, tolIneq)
}

// refCheckIneq returns x if every inequality holds within tol.
func refCheckIneq(x []float64, ineq []refRow, tol float64) ([]float64, error) {
	for j, r := range ineq {
		if v := dot(r.c, x) - r.rhs; v < -tol || math.IsNaN(v) {
			return nil, fmt.Errorf("constrained least squares: inequality %d violated by %g", j, -v)
		}
	}
	return x, nil
}

// refLeastDistance solves min ‖z‖ subject to G z ≥ h (Lawson & Hanson 1974,
// ch. 23): with E = [Gᵀ; hᵀ] and f = (0,…,0,1), solve the non-negative least
// squares min ‖E u − f‖, u ≥ 0; the residual r = E u − f gives
// z = −r[:n]/r[n]. A zero residual means the inequalities are infeasible.
func refLeastDistance(g *mat.Dense, h []float64) ([]float64, error) {
	mRows, n := g.Dims()
	e := mat.NewDense(n+1, mRows, nil)
	for i := range mRows {
		for j := range n {
			e.Set(j, i, g.At(i, j))
		}
		e.Set(n, i, h[i])
	}
	f := make([]float64, n+1)
	f[n] = 1
	u, err := refNNLS(e, f)
	if err != nil {
		return nil, err
	}
	r := make([]float64, n+1)
	for i := range n + 1 {
		r[i] = dot(e.RawRowView(i), u) - f[i]
	}
	if norm := math.Sqrt(dot(r, r)); norm < 1e-12 || math.Abs(r[n]) < 1e-14 {
		return nil, errors.New("inequality constraints are infeasible")
	}
	z := make([]float64, n)
	for i := range n {
		z[i] = -r[i] / r[n]
	}
	return z, nil
}

// nnls solves min ‖E u − f‖₂ subject to u ≥ 0 by the active-set algorithm of
// Lawson & Hanson (1974, ch. 23), with at most 3·(columns) outer steps.
func refNNLS(e *mat.Dense, f []float64) ([]float64, error) {
	p, m := e.Dims()
	u := make([]float64, m)
	passive := make([]bool, m)
	fv := mat.NewVecDense(p, f)
	scale := 0.0
	for j := range m {
		col := mat.Col(nil, j, e)
		scale = math.Max(scale, math.Sqrt(dot(col, col)))
	}
	tol := 1e-12 * math.Max(scale, 1)
	gradient := func() []float64 {
		var r mat.VecDense
		r.MulVec(e, mat.NewVecDense(m, u))
		r.SubVec(fv, &r)
		var wv mat.VecDense
		wv.MulVec(e.T(), &r)
		return wv.RawVector().Data
	}
	// solvePassive returns the unconstrained least-squares solution on the
	// passive columns (zero elsewhere).
	solvePassive := func() ([]float64, error) {
		var cols []int
		for j, on := range passive {
			if on {
				cols = append(cols, j)
			}
		}
		s := make([]float64, m)
		if len(cols) == 0 {
			return s, nil
		}
		sub := mat.NewDense(p, len(cols), nil)
		for k, j := range cols {
			for i := range p {
				sub.Set(i, k, e.At(i, j))
			}
		}
		sv, err := refLeastSquares(sub, fv)
		if err != nil {
			return nil, err
		}
		for k, j := range cols {
			s[j] = sv.AtVec(k)
		}
		return s, nil
	}
	for range 3 * m {
		w := gradient()
		best, t := tol, -1
		for j := range m {
			if !passive[j] && w[j] > best {
				best, t = w[j], j
			}
		}
		if t < 0 {
			return u, nil
		}
		passive[t] = true
		for inner := 0; ; inner++ {
			if inner > 3*m {
				return nil, errors.New("nnls: inner loop did not terminate")
			}
			s, err := solvePassive()
			if err != nil {
				return nil, fmt.Errorf("nnls: %w", err)
			}
			alpha, hit := 1.0, false
			for j := range m {
				if passive[j] && s[j] <= 0 {
					if a := u[j] / (u[j] - s[j]); a < alpha {
						alpha = a
					}
					hit = true
				}
			}
			if !hit {
				copy(u, s)
				break
			}
			for j := range m {
				if passive[j] {
					u[j] += alpha * (s[j] - u[j])
					if u[j] <= tol {
						u[j] = 0
						passive[j] = false
					}
				}
			}
		}
	}
	return nil, errors.New("nnls: did not converge")
}

// refLeastSquares solves min ‖A x − b‖₂ by SVD, truncating singular values below
// 1e-12 of the largest (minimum-norm solution for rank-deficient A).
//
// A well-conditioned A (the usual case) is solved by QR, which is faster.
func refLeastSquares(a *mat.Dense, b *mat.VecDense) (*mat.VecDense, error) {
	if r, c := a.Dims(); r >= c {
		var qr mat.QR
		qr.Factorize(a)
		if qr.Cond() < 1e10 {
			x := mat.NewVecDense(c, nil)
			if err := qr.SolveVecTo(x, false, b); err == nil {
				return x, nil
			}
		}
	}
	var svd mat.SVD
	if !svd.Factorize(a, mat.SVDThin) {
		return nil, errors.New("least squares: SVD did not converge")
	}
	rank := svd.Rank(1e-12)
	if rank == 0 {
		return nil, errors.New("least squares: zero matrix")
	}
	_, c := a.Dims()
	x := mat.NewVecDense(c, nil)
	svd.SolveVecTo(x, b, rank)
	return x, nil
}

// refFitWilhoit fits the Wilhoit form (see Wilhoit) to heat capacities Cp
// (J/(mol K)) at temperatures T (K, > 0) with the limits cp0 and cpInf held
// fixed (typically from ClassicalLimits; 0 < cp0 ≤ cpInf). It minimises the
// sum of squared relative residuals ((Cp_fit − Cp)/Cp)²: A0…A3 by linear least
// squares for each trial B, constrained so that Cp rises monotonically from
// cp0 to cpInf, and B (30 K to 30 000 K) by a logarithmic grid search refined
// by golden-section search (25 grid points, 25 golden steps). When no B gives a monotone shape with four A
// terms, fewer terms are used (with none, Cp = cp0 + (cpInf −
// cp0) y² is always monotone). At most len(T)−1 A terms are fitted, so one
// point already determines a curve. When cp0 = cpInf (an atom) the result is
// the constant cp0 with B = 500 K.
func refFitWilhoit(T, Cp []float64, cp0, cpInf float64) (Wilhoit, error) {
	if len(T) != len(Cp) {
		return Wilhoit{}, fmt.Errorf("wilhoit fit: %d temperatures but %d heat capacities", len(T), len(Cp))
	}
	if len(T) == 0 {
		return Wilhoit{}, errors.New("wilhoit fit: no points")
	}
	if !(cp0 > 0) || math.IsInf(cp0, 0) || !(cpInf >= cp0) || math.IsInf(cpInf, 0) {
		return Wilhoit{}, fmt.Errorf("wilhoit fit: limits cp0=%g, cpInf=%g J/(mol K) must satisfy 0 < cp0 ≤ cpInf", cp0, cpInf)
	}
	for i := range T {
		if !(T[i] > 0) || math.IsInf(T[i], 0) || !(Cp[i] > 0) || math.IsInf(Cp[i], 0) {
			return Wilhoit{}, fmt.Errorf("wilhoit fit: point %d (T=%g K, Cp=%g J/(mol K)) must have finite positive T and Cp", i, T[i], Cp[i])
		}
	}
	if cpInf-cp0 <= 1e-12*cpInf {
		return Wilhoit{Cp0: cp0, CpInf: cpInf, B: 500}, nil
	}
	maxTerms := min(4, len(T)-1)
	for nA := maxTerms; nA >= 0; nA-- {
		if w, ok := refFitWilhoitTerms(T, Cp, cp0, cpInf, nA); ok {
			return w, nil
		}
	}
	return Wilhoit{}, errors.New("wilhoit fit: no monotone fit found") // unreachable: nA = 0 is always monotone
}

// refFitWilhoitTerms searches B for the best monotone fit with nA free A terms.
func refFitWilhoitTerms(T, Cp []float64, cp0, cpInf float64, nA int) (Wilhoit, bool) {
	const (
		bMin, bMax = 30.0, 30000.0
		nGrid      = 25
	)
	best := Wilhoit{}
	bestSSE := math.Inf(1)
	eval := func(lnB float64) float64 {
		w, sse, ok := refWilhoitAtB(T, Cp, cp0, cpInf, math.Exp(lnB), nA)
		if !ok {
			return math.Inf(1)
		}
		if sse < bestSSE {
			best, bestSSE = w, sse
		}
		return sse
	}
	step := math.Log(bMax/bMin) / (nGrid - 1)
	bestIdx := -1
	for i := range nGrid {
		before := bestSSE
		eval(math.Log(bMin) + float64(i)*step)
		if bestSSE < before {
			bestIdx = i
		}
	}
	if bestIdx < 0 {
		return Wilhoit{}, false
	}
	// Golden-section refinement between the neighbours of the best grid point.
	lo := math.Log(bMin) + float64(max(bestIdx-1, 0))*step
	hi := math.Log(bMin) + float64(min(bestIdx+1, nGrid-1))*step
	g := (math.Sqrt(5) - 1) / 2
	x1, x2 := hi-g*(hi-lo), lo+g*(hi-lo)
	f1, f2 := eval(x1), eval(x2)
	for range 25 {
		if f1 <= f2 {
			hi, x2, f2 = x2, x1, f1
			x1 = hi - g*(hi-lo)
			f1 = eval(x1)
		} else {
			lo, x1, f1 = x1, x2, f2
			x2 = lo + g*(hi-lo)
			f2 = eval(x2)
		}
	}
	return best, true
}

// refWilhoitAtB solves the least-squares problem for A0…A(nA−1) at fixed B,
// subject to the shape being non-decreasing at 51 values of y in [0, 1]
// (linear inequalities in A), and returns
// the fit, its sum of squared relative residuals and whether the result is
// usable (solved and monotone on the finer check grid).
func refWilhoitAtB(T, Cp []float64, cp0, cpInf, B float64, nA int) (Wilhoit, float64, bool) {
	w := Wilhoit{Cp0: cp0, CpInf: cpInf, B: B}
	d := cpInf - cp0
	if nA > 0 {
		a := mat.NewDense(len(T), nA, nil)
		b := make([]float64, len(T))
		for i := range T {
			y := T[i] / (T[i] + B)
			base := d * y * y * (y - 1) / Cp[i]
			yk := 1.0
			for k := range nA {
				a.Set(i, k, base*yk)
				yk *= y
			}
			b[i] = (Cp[i] - cp0 - d*y*y) / Cp[i]
		}
		// Monotone shape: d/dy of y²[1 + (y−1)ΣAᵢyⁱ] divided by y,
		// 2 + Σ Aᵢ[(i+3) y^(i+1) − (i+2) yⁱ] ≥ 0, at y = 0, 1/50, …, 1.
		const nGrid = 50
		ineq := make([]refRow, 0, nGrid+1)
		for j := 0; j <= nGrid; j++ {
			y := float64(j) / nGrid
			row := make([]float64, nA)
			for k := range nA {
				row[k] = float64(k+3)*math.Pow(y, float64(k+1)) - float64(k+2)*math.Pow(y, float64(k))
			}
			ineq = append(ineq, refRow{c: row, rhs: -2})
		}
		// The unconstrained optimum is often monotone already; only when it
		// is not is the constrained problem solved.
		x, err := refLeastSquares(a, mat.NewVecDense(len(b), b))
		if err == nil {
			copy(w.A[:], x.RawVector().Data)
		}
		if err != nil || !w.monotone() {
			xc, err := refConstrainedLSQ(a, b, nil, ineq, 1e-8)
			if err != nil {
				return w, 0, false
			}
			w.A = [4]float64{}
			copy(w.A[:], xc)
		}
	}
	if !w.monotone() {
		return w, 0, false
	}
	sse := 0.0
	for i := range T {
		r := (w.Cp(T[i]) - Cp[i]) / Cp[i]
		sse += r * r
	}
	if math.IsNaN(sse) {
		return w, 0, false
	}
	return w, sse, true
}

// refSolvePoly solves the constrained least-squares problem described on Fit for
// the given samples; cpMax ≤ 0 means no ceiling.
func refSolvePoly(hf298, s298 float64, samples []sample, opt FitOptions, monotone bool, cpMax float64) (NASA7, error) {
	const n = 10 // τ-scaled Cp/R coefficients: 0–4 low, 5–9 high
	a := mat.NewDense(len(samples), n, nil)
	b := make([]float64, len(samples))
	for i, s := range samples {
		off := 0
		if s.T >= opt.TMid {
			off = 5
		}
		tau := s.T / tauScale
		scale := s.W / (s.Cp / R)
		tk := scale
		for k := range 5 {
			a.Set(i, off+k, tk)
			tk *= tau
		}
		b[i] = s.W
	}
	tm := opt.TMid / tauScale
	cont := make([]float64, n)
	slope := make([]float64, n)
	for k := range 5 {
		cont[k] = math.Pow(tm, float64(k))
		cont[5+k] = -cont[k]
		if k > 0 {
			slope[k] = float64(k) * math.Pow(tm, float64(k-1))
			slope[5+k] = -slope[k]
		}
	}
	eq := []refRow{{c: cont}, {c: slope}}
	var ineq []refRow
	addGrid := func(lo, hi float64, m, off int) {
		for j := range m {
			t := lo + (hi-lo)*float64(j)/float64(m-1)
			tau := t / tauScale
			if monotone {
				row := make([]float64, n)
				for k := 1; k < 5; k++ {
					row[off+k] = float64(k) * math.Pow(tau, float64(k-1))
				}
				ineq = append(ineq, refRow{c: row})
			}
			if monotone && j > 0 {
				// Inner Bernstein coefficients of the cubic slope q(τ) on
				// the piece [τ₀, τ], width h: q(τ₀) + h q′(τ₀)/3 ≥ 0 and
				// q(τ) − h q′(τ)/3 ≥ 0, written in the monomial basis.
				t0 := (lo + (hi-lo)*float64(j-1)/float64(m-1)) / tauScale
				h := tau - t0
				for _, e := range []struct{ at, d float64 }{{t0, h / 3}, {tau, -h / 3}} {
					row := make([]float64, n)
					for k := 1; k < 5; k++ {
						row[off+k] = float64(k) * math.Pow(e.at, float64(k-1))
						if k > 1 {
							row[off+k] += e.d * float64(k*(k-1)) * math.Pow(e.at, float64(k-2))
						}
					}
					ineq = append(ineq, refRow{c: row})
				}
			}
			if cpMax > 0 {
				row := make([]float64, n)
				for k := range 5 {
					row[off+k] = -math.Pow(tau, float64(k))
				}
				ineq = append(ineq, refRow{c: row, rhs: -cpMax / R})
			}
		}
	}
	addGrid(opt.TLow, opt.TMid, nLowGrid, 0)
	addGrid(opt.TMid, opt.THigh, nHighGrid, 5)
	x, err := refConstrainedLSQ(a, b, eq, ineq, 1e-9)
	if err != nil {
		return NASA7{}, err
	}
	p := NASA7{TLow: opt.TLow, TMid: opt.TMid, THigh: opt.THigh}
	for k := range 5 {
		f := math.Pow(tauScale, float64(k))
		p.Low[k] = x[k] / f
		p.High[k] = x[5+k] / f
	}
	p.Low[5] = hf298/R - hIntR(&p.Low, Tref)
	p.Low[6] = s298/R - sIntR(&p.Low, Tref)
	p.High[5] = hR(&p.Low, opt.TMid) - hIntR(&p.High, opt.TMid)
	p.High[6] = sR(&p.Low, opt.TMid) - sIntR(&p.High, opt.TMid)
	if !finite(&p.Low) || !finite(&p.High) {
		return NASA7{}, errors.New("fit produced non-finite coefficients")
	}
	return p, nil
}
