package nasa

import (
	"errors"
	"math"
)

// Tail continues estimated heat capacities past their last point (T1, Cp1)
// along the Wilhoit curve W fitted to the points, the curve Fit follows
// above the points. It is W scaled to start at Cp1 and still end at W's
// classical limit Cp∞: for T ≥ T1 (K)
//
//	Cp(T) = Cp1 + k (W(T) − W(T1)),   k = (Cp∞ − Cp1)/(Cp∞ − W(T1)),
//
// so Cp is continuous at T1 and rises monotonically from Cp1 to Cp∞ (k is
// capped at maxTailScale, so a W far above Cp1 at T1 ends lower). W differs
// from the points by its fit residual at T1 (usually under 1 %), so the
// Tail and the fitted polynomial agree to about that. Cp in J/(mol K).
type Tail struct {
	T1, Cp1 float64
	W       Wilhoit
	k       float64 // scale of W
	c       float64 // Cp(T) = c + k W(T)
	h1, s1  float64 // W.H(T1), W.S(T1)
}

// maxTailScale caps the scale k of a Tail: it is about 1 when W meets the
// last point (k − 1 ≈ 4× W's relative residual there for Cp1 ≈ 0.8 Cp∞), so
// the cap binds only for a Wilhoit fit far off its own last point.
const maxTailScale = 2

// tailSlack is the fraction of Cp∞ − Cp0 by which a Tail may leave
// [Cp1, Cp∞] (TailRange): FitWilhoit's monotone test lets the shape dip by
// 1e-3 of that span, which a scale up to maxTailScale doubles; 1e-2 leaves
// a margin for the dips between the test's grid points.
const tailSlack = 1e-2

// NewTail returns the Tail that leaves (T1, Cp1) along w (T1 in K > 0, Cp1
// in J/(mol K)). When Cp1 ≥ w.CpInf (no room to rise) or w cannot be
// scaled, Cp stays at Cp1.
func NewTail(w Wilhoit, T1, Cp1 float64) Tail {
	t := Tail{T1: T1, Cp1: Cp1, W: w, c: Cp1}
	w1 := w.Cp(T1)
	if room := w.CpInf - w1; room > 0 && Cp1 < w.CpInf {
		t.k = math.Min((w.CpInf-Cp1)/room, maxTailScale)
		t.c = Cp1 - t.k*w1
		t.h1, t.s1 = w.H(T1), w.S(T1)
	}
	return t
}

// EstimateTail fits the Wilhoit curve (FitWilhoit, the same call Fit makes
// for its extrapolation) to heat capacities Cp (J/(mol K)) at temperatures T
// (K, ascending) between the classical limits cp0 and cpInf, and returns the
// Tail leaving the last point.
func EstimateTail(T, Cp []float64, cp0, cpInf float64) (Tail, error) {
	if len(T) == 0 || len(T) != len(Cp) {
		return Tail{}, errors.New("estimate tail: no points")
	}
	w, err := FitWilhoit(T, Cp, cp0, cpInf)
	if err != nil {
		return Tail{}, err
	}
	return NewTail(w, T[len(T)-1], Cp[len(Cp)-1]), nil
}

// Cp returns the tail's heat capacity at T ≥ T1 in J/(mol K).
func (t *Tail) Cp(T float64) float64 {
	if t.k == 0 {
		return t.Cp1
	}
	return t.c + t.k*t.W.Cp(T)
}

// DH returns ∫ Cp dT from T1 to T in J/mol:
// c (T − T1) + k (W.H(T) − W.H(T1)).
func (t *Tail) DH(T float64) float64 {
	if t.k == 0 {
		return t.Cp1 * (T - t.T1)
	}
	return t.c*(T-t.T1) + t.k*(t.W.H(T)-t.h1)
}

// DS returns ∫ Cp/T dT from T1 to T in J/(mol K):
// c ln(T/T1) + k (W.S(T) − W.S(T1)).
func (t *Tail) DS(T float64) float64 {
	if t.k == 0 {
		return t.Cp1 * math.Log(T/t.T1)
	}
	return t.c*math.Log(T/t.T1) + t.k*(t.W.S(T)-t.s1)
}

// TailRange returns bounds (J/(mol K)) on the Cp of any Tail leaving a last
// point Cp1 of a curve between the classical limits cp0 and cpInf, known
// before the Wilhoit fit is made: [Cp1, max(Cp1, cpInf)] widened by
// tailSlack·(cpInf − cp0). Since G(T) = H(T) − T S(T) falls as Cp rises at
// any temperature between T1 and T (∂G(T)/∂Cp(T′) = 1 − T/T′ ≤ 0), holding
// Cp at lo (hi) above T1 bounds G from above (below).
func TailRange(Cp1, cp0, cpInf float64) (lo, hi float64) {
	s := tailSlack * math.Abs(cpInf-cp0)
	return Cp1 - s, math.Max(Cp1, cpInf) + s
}
