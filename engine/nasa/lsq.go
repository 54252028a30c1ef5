package nasa

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// linearRow is one linear constraint row c·x (op) rhs.
type linearRow struct {
	c   []float64
	rhs float64
}

// constrainedLSQ minimises ½‖A x − b‖₂² subject to the equalities eq (c·x =
// rhs, always enforced) and the inequalities ineq (c·x ≥ rhs).
//
// Each equality-constrained subproblem is solved by null-space elimination:
// with the SVD of the stacked constraint matrix C, x = x_p + Z z where x_p is
// the minimum-norm solution of C x = d and the columns of Z span the null
// space of C; z then solves the unconstrained problem min ‖A Z z − (b − A
// x_p)‖ by SVD, so the normal equations are never formed. Inequalities are
// handled by an active-set loop: the most violated inequality is added to the
// equalities, and once all are satisfied an active inequality whose Lagrange
// multiplier has the wrong sign (the objective would fall by leaving it) is
// released. The loop stops after 100 changes; the result is then checked for
// feasibility and an error is returned if any inequality is still violated by
// more than tolIneq.
func constrainedLSQ(a *mat.Dense, b []float64, eq, ineq []linearRow, tolIneq float64) ([]float64, error) {
	active := make([]bool, len(ineq))
	var x []float64
	for range 100 {
		rows := append([]linearRow(nil), eq...)
		var idx []int // ineq index of each appended row
		for j, on := range active {
			if on {
				rows = append(rows, ineq[j])
				idx = append(idx, j)
			}
		}
		var lambda []float64
		var err error
		x, lambda, err = equalityLSQ(a, b, rows)
		if err != nil {
			return nil, err
		}
		worst, worstJ := -tolIneq, -1
		for j, r := range ineq {
			if active[j] {
				continue
			}
			if v := dot(r.c, x) - r.rhs; v < worst {
				worst, worstJ = v, j
			}
		}
		if worstJ >= 0 {
			active[worstJ] = true
			continue
		}
		// Feasible: release the active inequality with the most wrong-signed
		// multiplier. With ∇f + Cᵀλ = 0, an active c·x ≥ rhs needs λ ≤ 0.
		drop, dropJ := 1e-10, -1
		for k, j := range idx {
			if l := lambda[len(eq)+k]; l > drop {
				drop, dropJ = l, j
			}
		}
		if dropJ < 0 {
			return x, nil
		}
		active[dropJ] = false
	}
	for j, r := range ineq {
		if v := dot(r.c, x) - r.rhs; v < -tolIneq {
			return nil, fmt.Errorf("constrained least squares: inequality %d still violated by %g after 100 active-set steps", j, -v)
		}
	}
	return x, nil
}

// equalityLSQ minimises ½‖A x − b‖² subject to c·x = rhs for every row, and
// returns x and the Lagrange multipliers λ with Aᵀ(A x − b) + Cᵀλ = 0
// (least-squares estimate when the rows are dependent).
func equalityLSQ(a *mat.Dense, b []float64, rows []linearRow) (x, lambda []float64, err error) {
	_, n := a.Dims()
	bv := mat.NewVecDense(len(b), append([]float64(nil), b...))
	if len(rows) == 0 {
		xv, err := leastSquares(a, bv)
		if err != nil {
			return nil, nil, err
		}
		return xv.RawVector().Data, nil, nil
	}
	m := len(rows)
	c := mat.NewDense(m, n, nil)
	d := mat.NewVecDense(m, nil)
	for i, r := range rows {
		c.SetRow(i, r.c)
		d.SetVec(i, r.rhs)
	}
	var svd mat.SVD
	if !svd.Factorize(c, mat.SVDFull) {
		return nil, nil, errors.New("constrained least squares: SVD of the constraints did not converge")
	}
	rank := svd.Rank(1e-12)
	if rank == 0 {
		return nil, nil, errors.New("constrained least squares: zero constraint matrix")
	}
	xp := mat.NewVecDense(n, nil)
	svd.SolveVecTo(xp, d, rank)
	// The constraints must be consistent: dependent rows with different
	// right-hand sides cannot all hold.
	var chk mat.VecDense
	chk.MulVec(c, xp)
	for i := range m {
		if diff := math.Abs(chk.AtVec(i) - d.AtVec(i)); diff > 1e-8*(1+math.Abs(d.AtVec(i))) {
			return nil, nil, fmt.Errorf("constrained least squares: inconsistent constraints (row %d misses by %g)", i, diff)
		}
	}
	xv := mat.NewVecDense(n, nil)
	xv.CopyVec(xp)
	if rank < n {
		var v mat.Dense
		svd.VTo(&v)
		z := v.Slice(0, n, rank, n)
		var az mat.Dense
		az.Mul(a, z)
		var r mat.VecDense
		r.MulVec(a, xp)
		r.SubVec(bv, &r)
		zz, err := leastSquares(&az, &r)
		if err != nil {
			return nil, nil, fmt.Errorf("constrained least squares: %w", err)
		}
		var step mat.VecDense
		step.MulVec(z, zz)
		xv.AddVec(xv, &step)
	}
	// Multipliers: Cᵀλ = −Aᵀ(A x − b).
	var res mat.VecDense
	res.MulVec(a, xv)
	res.SubVec(&res, bv)
	var grad mat.VecDense
	grad.MulVec(a.T(), &res)
	grad.ScaleVec(-1, &grad)
	var ct mat.Dense
	ct.CloneFrom(c.T())
	lv, err := leastSquares(&ct, &grad)
	if err != nil {
		return nil, nil, fmt.Errorf("constrained least squares: multipliers: %w", err)
	}
	return xv.RawVector().Data, lv.RawVector().Data, nil
}

func dot(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}
