package nasa

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// linearRow is one linear constraint row c·x (= or ≥) rhs.
type linearRow struct {
	c   []float64
	rhs float64
}

// constrainedLSQ minimises ‖A x − b‖₂ subject to the equalities eq (c·x =
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
func constrainedLSQ(a *mat.Dense, b []float64, eq, ineq []linearRow, tolIneq float64) ([]float64, error) {
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
			return checkIneq(xp, ineq, tolIneq)
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
		zz, err := leastDistance(&e, h)
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
	return checkIneq(x, ineq, tolIneq)
}

// checkIneq returns x if every inequality holds within tol.
func checkIneq(x []float64, ineq []linearRow, tol float64) ([]float64, error) {
	for j, r := range ineq {
		if v := dot(r.c, x) - r.rhs; v < -tol || math.IsNaN(v) {
			return nil, fmt.Errorf("constrained least squares: inequality %d violated by %g", j, -v)
		}
	}
	return x, nil
}

// leastDistance solves min ‖z‖ subject to G z ≥ h (Lawson & Hanson 1974,
// ch. 23): with E = [Gᵀ; hᵀ] and f = (0,…,0,1), solve the non-negative least
// squares min ‖E u − f‖, u ≥ 0; the residual r = E u − f gives
// z = −r[:n]/r[n]. A zero residual means the inequalities are infeasible.
func leastDistance(g *mat.Dense, h []float64) ([]float64, error) {
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
	u, err := nnls(e, f)
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
func nnls(e *mat.Dense, f []float64) ([]float64, error) {
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
		sv, err := leastSquares(sub, fv)
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

// leastSquares solves min ‖A x − b‖₂ by SVD, truncating singular values below
// 1e-12 of the largest (minimum-norm solution for rank-deficient A).
//
// A well-conditioned A (the usual case) is solved by QR, which is faster.
func leastSquares(a *mat.Dense, b *mat.VecDense) (*mat.VecDense, error) {
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

func dot(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}
