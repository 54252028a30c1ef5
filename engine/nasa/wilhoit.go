package nasa

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"
)

// Wilhoit is the heat-capacity form of R. C. Wilhoit (in: Thermodynamics
// Research Center Current Data News 3 (1975)); it runs from the classical
// low-temperature limit Cp0 to the high-temperature limit CpInf and so
// extrapolates estimated Cp(T) sensibly beyond the data. With y = T/(T+B),
// T in K and B > 0 in K:
//
//	Cp(T) = Cp0 + (CpInf − Cp0) y² [1 + (y − 1)(A0 + A1 y + A2 y² + A3 y³)]
//
// so Cp(0) = Cp0 and Cp(T→∞) = CpInf. Cp0, CpInf and Cp are in J/(mol K).
// H0 (J/mol) and S0 (J/(mol K)) are the integration constants of H and S
// (see the H and S methods); FitWilhoit leaves them zero.
type Wilhoit struct {
	Cp0, CpInf, B float64
	A             [4]float64
	H0, S0        float64
}

// Cp returns the Wilhoit heat capacity at T ≥ 0 K in J/(mol K) (formula on
// the type).
func (w Wilhoit) Cp(T float64) float64 {
	y := T / (T + w.B)
	return w.Cp0 + (w.CpInf-w.Cp0)*w.shape(y)
}

// shape is y²[1 + (y−1)ΣAᵢyⁱ], which rises from 0 at y = 0 to 1 at y = 1.
func (w Wilhoit) shape(y float64) float64 {
	s := w.A[0] + y*(w.A[1]+y*(w.A[2]+y*w.A[3]))
	return y * y * (1 + (y-1)*s)
}

// H returns H(T) = H0 + ∫₀ᵀ Cp dT′ in J/mol for T ≥ 0 K. In closed form, with
// P(u) = u²[1 + (u−1)ΣAᵢuⁱ] = Σ cₖ (1−u)ᵏ,
//
//	H(T) = H0 + Cp0 T + (CpInf − Cp0) B [c0 (T/B) + c1 ln((T+B)/B)
//	       + Σₖ≥₂ cₖ (1 − (1−y)^(k−1))/(k−1)]
//
// (substituting dT = B dy/(1−y)²; c0 = P(1) = 1).
func (w Wilhoit) H(T float64) float64 {
	// p holds P(u) in powers of u: u² + Σ Aᵢ (u^(i+3) − u^(i+2)).
	var p [7]float64
	p[2] = 1
	for i, a := range w.A {
		p[i+3] += a
		p[i+2] -= a
	}
	// c holds P in powers of v = 1−u: uʲ = Σₖ C(j,k) (−v)ᵏ.
	var c [7]float64
	for j := 0; j < 7; j++ {
		binom := 1.0
		for k := 0; k <= j; k++ {
			sign := 1.0
			if k%2 == 1 {
				sign = -1
			}
			c[k] += p[j] * binom * sign
			binom = binom * float64(j-k) / float64(k+1)
		}
	}
	y := T / (T + w.B)
	v := 1 - y // = B/(T+B)
	integral := c[0]*(T/w.B) + c[1]*math.Log((T+w.B)/w.B)
	vk := v // v^(k−1) for k = 2
	for k := 2; k < 7; k++ {
		integral += c[k] * (1 - vk) / float64(k-1)
		vk *= v
	}
	return w.H0 + w.Cp0*T + (w.CpInf-w.Cp0)*w.B*integral
}

// S returns S(T) in J/(mol K) for T > 0 K:
//
//	S(T) = S0 + Cp0 ln T + (CpInf − Cp0)[ln((T+B)/B) − y − Σᵢ Aᵢ y^(i+2)/(i+2)]
//
// (substituting dT/T = dy/(y(1−y))), T in K inside the logarithm.
func (w Wilhoit) S(T float64) float64 {
	y := T / (T + w.B)
	sum := 0.0
	yi := y * y
	for i, a := range w.A {
		sum += a * yi / float64(i+2)
		yi *= y
	}
	return w.S0 + w.Cp0*math.Log(T) + (w.CpInf-w.Cp0)*(math.Log((T+w.B)/w.B)-y-sum)
}

// ClassicalLimits returns the classical heat-capacity limits Cp(0) and Cp(∞)
// in J/(mol K) of an ideal-gas molecule with nAtoms atoms (hydrogens
// included), as used to anchor the Wilhoit form (Wilhoit 1975; common
// practice):
//
//	atom:       Cp0 = Cp∞ = 2.5 R (translation only)
//	linear:     Cp0 = 3.5 R,  Cp∞ = (3N − 1.5) R
//	non-linear: Cp0 = 4 R,    Cp∞ = (3N − 2) R
//
// Cp0 counts translation, rotation and R for Cp − Cv; Cp∞ adds R for each of
// the 3N−5 (linear) or 3N−6 (non-linear) vibrations fully excited. Each of
// the nRotors internal rotors is treated as a free rotor (R/2) rather than a
// torsional vibration (R) at the high limit, so Cp∞ is lowered by R/2 per
// rotor. nAtoms < 1 returns (0, 0).
func ClassicalLimits(nAtoms int, linear bool, nRotors int) (cp0, cpInf float64) {
	n := float64(nAtoms)
	switch {
	case nAtoms < 1:
		return 0, 0
	case nAtoms == 1:
		return 2.5 * R, 2.5 * R
	case linear:
		cp0, cpInf = 3.5*R, (3*n-1.5)*R
	default:
		cp0, cpInf = 4*R, (3*n-2)*R
	}
	cpInf -= 0.5 * R * float64(nRotors)
	return cp0, cpInf
}

// FitWilhoit fits the Wilhoit form (see Wilhoit) to heat capacities Cp
// (J/(mol K)) at temperatures T (K, > 0) with the limits cp0 and cpInf held
// fixed (typically from ClassicalLimits; 0 < cp0 ≤ cpInf). It minimises the
// sum of squared relative residuals ((Cp_fit − Cp)/Cp)²: A0…A3 by linear least
// squares for each trial B, constrained so that Cp rises monotonically from
// cp0 to cpInf, and B (30 K to 30 000 K) by a logarithmic grid search refined
// by Brent's method (25 grid points, then to about 1e-4 in ln B; see
// fitWilhoitTerms). When no B gives
// a monotone shape with four A terms, fewer terms are used (with none, Cp =
// cp0 + (cpInf − cp0) y² is always monotone). At most d−1 A terms are fitted,
// d the number of distinct temperatures, so one point already determines a
// curve; a trial B at which the A terms are numerically undetermined (see
// wilhoitAtB) is skipped. When cp0 = cpInf (an atom) the result is the
// constant cp0 with B = 500 K.
func FitWilhoit(T, Cp []float64, cp0, cpInf float64) (Wilhoit, error) {
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
	maxTerms := min(4, distinct(T)-1)
	ws := newWilhoitWork(len(T))
	for nA := maxTerms; nA >= 0; nA-- {
		if w, ok := fitWilhoitTerms(T, Cp, cp0, cpInf, nA, ws); ok {
			return w, nil
		}
	}
	return Wilhoit{}, errors.New("wilhoit fit: no monotone fit found") // unreachable: nA = 0 is always monotone
}

// distinct counts the distinct values of x.
func distinct(x []float64) int {
	n := 0
	for i, v := range x {
		seen := false
		for _, u := range x[:i] {
			if u == v {
				seen = true
				break
			}
		}
		if !seen {
			n++
		}
	}
	return n
}

// wilhoitWork is the scratch space of one FitWilhoit call, reused across the
// trial values of B.
type wilhoitWork struct {
	a, b, colScale []float64
	fam            wilhoitIneq
	// active is the active set of the last constrained solve, the warm
	// start of the next (neighbouring B, same number of terms).
	active []int
}

func newWilhoitWork(nPts int) *wilhoitWork {
	return &wilhoitWork{a: make([]float64, nPts*4), b: make([]float64, nPts), colScale: make([]float64, 4)}
}

// fitWilhoitTerms searches B for the best monotone fit with nA free A terms:
// the best of 25 logarithmically spaced B from 30 K to 30 000 K, refined by
// Brent's minimisation between the grid neighbours of that point.
//
// On the grid the unconstrained residual at each B, a lower bound of the
// constrained one, is computed first (one small QR); the full fits are then
// done in increasing order of that bound and stop as soon as the bound
// reaches the best sum found, which gives the same grid minimum as fitting
// every B.
func fitWilhoitTerms(T, Cp []float64, cp0, cpInf float64, nA int, ws *wilhoitWork) (Wilhoit, bool) {
	const (
		bMin, bMax = 30.0, 30000.0
		nGrid      = 25
	)
	best := Wilhoit{}
	bestSSE := math.Inf(1)
	ws.active = nil
	eval := func(lnB float64) float64 {
		w, sse, ok := wilhoitAtB(T, Cp, cp0, cpInf, math.Exp(lnB), nA, ws)
		if !ok {
			return math.Inf(1)
		}
		if sse < bestSSE {
			best, bestSSE = w, sse
		}
		return sse
	}
	step := math.Log(bMax/bMin) / (nGrid - 1)
	lnB := func(i int) float64 { return math.Log(bMin) + float64(i)*step }
	var (
		order [nGrid]int
		bound [nGrid]float64
	)
	for i := range nGrid {
		order[i] = i
		bound[i] = math.Inf(1)
		if nA == 0 {
			bound[i] = 0
		} else if lb, ok := ws.reduce(T, Cp, cp0, cpInf, math.Exp(lnB(i)), nA); ok {
			bound[i] = lb
		}
	}
	slices.SortStableFunc(order[:], func(i, j int) int { return cmp.Compare(bound[i], bound[j]) })
	bestIdx := -1
	var (
		acts [nGrid][]int // active sets found, the warm start of neighbours
		done [nGrid]bool
	)
	for _, i := range order {
		if math.IsInf(bound[i], 1) || bound[i] >= bestSSE {
			break
		}
		ws.active = nil
		for dist := 1; dist < nGrid && ws.active == nil; dist++ {
			if j := i - dist; j >= 0 && done[j] {
				ws.active = acts[j]
			} else if j := i + dist; j < nGrid && done[j] {
				ws.active = acts[j]
			}
		}
		before := bestSSE
		eval(lnB(i))
		acts[i], done[i] = ws.active, true
		if bestSSE < before {
			bestIdx = i
		}
	}
	if bestIdx < 0 {
		return Wilhoit{}, false
	}
	lo := lnB(max(bestIdx-1, 0))
	hi := lnB(min(bestIdx+1, nGrid-1))
	ws.active = acts[bestIdx]
	brentMin(eval, lo, hi, 1e-4, 30)
	return best, true
}

// brentMin looks for a minimum of f on (a, b) by Brent's method, golden-
// section steps combined with parabolic interpolation (R. P. Brent,
// Algorithms for Minimization without Derivatives, 1973, ch. 5), until the
// bracket is about 4·tol wide or after maxEval evaluations, and returns the
// best point evaluated. f may return +Inf (no usable value); parabolic steps
// are then skipped.
func brentMin(f func(float64) float64, a, b, tol float64, maxEval int) (float64, float64) {
	const cGold = 0.3819660112501051 // (3 − √5)/2
	x := a + cGold*(b-a)
	w, v := x, x
	fx := f(x)
	fw, fv := fx, fx
	d, e := 0.0, 0.0
	for range maxEval - 1 {
		m := 0.5 * (a + b)
		tol1 := 1e-10*math.Abs(x) + tol
		tol2 := 2 * tol1
		if math.Abs(x-m) <= tol2-0.5*(b-a) {
			break
		}
		golden := true
		if math.Abs(e) > tol1 && !math.IsInf(fx, 0) && !math.IsInf(fw, 0) && !math.IsInf(fv, 0) {
			r := (x - w) * (fx - fv)
			q := (x - v) * (fx - fw)
			p := (x-v)*q - (x-w)*r
			q = 2 * (q - r)
			if q > 0 {
				p = -p
			} else {
				q = -q
			}
			if math.Abs(p) < math.Abs(0.5*q*e) && p > q*(a-x) && p < q*(b-x) {
				e = d
				d = p / q
				if u := x + d; u-a < tol2 || b-u < tol2 {
					d = math.Copysign(tol1, m-x)
				}
				golden = false
			}
		}
		if golden {
			if x < m {
				e = b - x
			} else {
				e = a - x
			}
			d = cGold * e
		}
		u := x + d
		if math.Abs(d) < tol1 {
			u = x + math.Copysign(tol1, d)
		}
		fu := f(u)
		if fu <= fx {
			if u < x {
				b = x
			} else {
				a = x
			}
			v, fv, w, fw, x, fx = w, fw, x, fx, u, fu
		} else {
			if u < x {
				a = u
			} else {
				b = u
			}
			if fu <= fw || w == x {
				v, fv, w, fw = w, fw, u, fu
			} else if fu <= fv || v == x || v == w {
				v, fv = u, fu
			}
		}
	}
	return x, fx
}

// wilhoitGrid is the number of intervals of the y grid on which FitWilhoit
// imposes a monotone shape.
const wilhoitGrid = 50

// wilhoitIneq is the family of monotonicity constraints on A0…A(nA−1):
// d/dy of y²[1 + (y−1)ΣAᵢyⁱ] divided by y,
// q(y) = 2 + Σ Aᵢ[(i+3) y^(i+1) − (i+2) yⁱ] ≥ 0, at y = 0, 1/50, …, 1.
type wilhoitIneq struct{ nA int }

func (f *wilhoitIneq) size() int { return wilhoitGrid + 1 }

func (f *wilhoitIneq) row(j int, g []float64) float64 {
	y := float64(j) / wilhoitGrid
	yk := 1.0 // yᵏ
	for k := range f.nA {
		g[k] = (float64(k+3)*y - float64(k+2)) * yk
		yk *= y
	}
	return -2
}

func (f *wilhoitIneq) slacks(a, s []float64) {
	p := qPoly(a, f.nA)
	for j := range s {
		y := float64(j) / wilhoitGrid
		s[j] = p[0] + y*(p[1]+y*(p[2]+y*(p[3]+y*p[4])))
	}
}

// qPoly returns the monomial coefficients of q(y) (see wilhoitIneq) for the
// first nA entries of a.
func qPoly(a []float64, nA int) [5]float64 {
	var p [5]float64
	p[0] = 2
	for k := range nA {
		p[k+1] += float64(k+3) * a[k]
		p[k] -= float64(k+2) * a[k]
	}
	return p
}

// wilhoitAtB solves the least-squares problem for A0…A(nA−1) at fixed B,
// subject to the shape being non-decreasing at 51 values of y in [0, 1]
// (linear inequalities in A), and returns the fit, its sum of squared
// relative residuals and whether the result is usable: the A terms are
// determined (after scaling the columns to unit length, every diagonal entry
// of the triangular factor exceeds 1e-10 of the largest) and the shape is
// monotone (see monotone).
//
// The unconstrained optimum is often monotone already, which a sufficient
// test on the Bernstein coefficients of q shows at once; only when it is not
// is the constrained problem solved (lsi).
func wilhoitAtB(T, Cp []float64, cp0, cpInf, B float64, nA int, ws *wilhoitWork) (Wilhoit, float64, bool) {
	w := Wilhoit{Cp0: cp0, CpInf: cpInf, B: B}
	if nA > 0 {
		if _, ok := ws.reduce(T, Cp, cp0, cpInf, B, nA); !ok {
			return w, 0, false
		}
		a, b, cs := ws.a[:nA*nA], ws.b[:nA], ws.colScale[:nA]
		x := w.A[:nA]
		backSolve(a, nA, nA, b, x)
		for k := range nA {
			x[k] *= cs[k]
		}
		if !w.exactlyMonotone(nA) && !w.monotone() {
			// Constrained solve in the scaled unknowns v = A/scale.
			ws.fam = wilhoitIneq{nA: nA}
			fam := scaledFamily{inner: &ws.fam, scale: cs}
			var v [4]float64
			act, err := lsi(a, nA, nA, b, &fam, 1e-8, v[:nA], ws.active)
			if err != nil {
				return w, 0, false
			}
			ws.active = act
			w.A = [4]float64{}
			for k := range nA {
				w.A[k] = v[k] * cs[k]
			}
			if !w.exactlyMonotone(nA) && !w.monotone() {
				return w, 0, false
			}
		}
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

// reduce sets up the linear least-squares problem for A0…A(nA−1) at B
// (nA ≥ 1): row i is the relative residual (Cp_fit − Cpᵢ)/Cpᵢ, linear in A,
// with columns scaled to unit length (ws.colScale holds the factors), and
// reduces it by Householder QR, leaving R in ws.a (stride nA) and Qᵀb in
// ws.b. It returns the residual sum of squares of the unconstrained optimum,
// a lower bound of the sum wilhoitAtB reports at this B (constraints can only
// raise it), and false when the A terms are not determined (see wilhoitAtB).
func (ws *wilhoitWork) reduce(T, Cp []float64, cp0, cpInf, B float64, nA int) (float64, bool) {
	d := cpInf - cp0
	m := len(T)
	a, b, cs := ws.a[:m*nA], ws.b[:m], ws.colScale[:nA]
	clear(cs)
	for i := range T {
		y := T[i] / (T[i] + B)
		base := d * y * y * (y - 1) / Cp[i]
		yk := 1.0
		for k := range nA {
			v := base * yk
			a[i*nA+k] = v
			cs[k] += v * v
			yk *= y
		}
		b[i] = (Cp[i] - cp0 - d*y*y) / Cp[i]
	}
	// Unit-length columns: the rank test then measures collinearity rather
	// than the size of yᵏ. R is the upper triangle of the first nA rows
	// (stride nA): contiguous.
	if !scaledQR(a, m, nA, b, cs, 1e-10) {
		return 0, false
	}
	rss := 0.0
	for _, v := range b[nA:] {
		rss += v * v
	}
	return rss, !math.IsNaN(rss)
}

// scaledFamily presents the inequalities of inner in scaled unknowns
// v = u/scale (u = scale ⊙ v, elementwise).
type scaledFamily struct {
	inner ineqFamily
	scale []float64
}

func (f *scaledFamily) size() int { return f.inner.size() }

func (f *scaledFamily) row(i int, g []float64) float64 {
	h := f.inner.row(i, g)
	for k := range g {
		g[k] *= f.scale[k]
	}
	return h
}

func (f *scaledFamily) slacks(v, s []float64) {
	var buf [nPoly]float64
	u := buf[:len(v)]
	for k := range v {
		u[k] = v[k] * f.scale[k]
	}
	f.inner.slacks(u, s)
}

// exactlyMonotone is a sufficient test that the shape is non-decreasing on
// y ∈ [0, 1]: the shape's derivative is y q(y) (see wilhoitIneq), and q ≥ 0
// on [0, 1] when all Bernstein coefficients of q are non-negative (Farouki &
// Rajan, Comput. Aided Geom. Des. 5 (1988), the convex-hull property). Only
// the first nA terms of A are used. A false result proves nothing.
func (w Wilhoit) exactlyMonotone(nA int) bool {
	p := qPoly(w.A[:], nA)
	// bᵢ = Σ_{j≤i} C(i,j)/C(4,j) pⱼ for degree 4.
	var binom4 = [5]float64{1, 4, 6, 4, 1}
	for i := range 5 {
		c := 1.0 // C(i, j)
		s := 0.0
		for j := 0; j <= i; j++ {
			s += c / binom4[j] * p[j]
			c = c * float64(i-j) / float64(j+1)
		}
		if !(s >= 0) {
			return false
		}
	}
	return true
}

// monotone reports whether the Wilhoit shape never falls more than 1e-3
// (i.e. 0.1 % of CpInf − Cp0) below its running maximum on a grid of 400
// points over y ∈ [0, 1]; since y increases with T this is Cp(T) monotone to
// that tolerance, with cp0 ≤ Cp ≤ cpInf. The small allowance covers dips
// between the points where FitWilhoit imposes monotonicity.
func (w Wilhoit) monotone() bool {
	const n = 400
	// shape(y) = y²[1 + (y−1)ΣAᵢyⁱ] as Σ cₖ yᵏ (k ≤ 6), evaluated by Horner.
	var c [7]float64
	c[2] = 1
	for i, a := range w.A {
		c[i+3] += a
		c[i+2] -= a
	}
	peak := 0.0
	for i := 1; i <= n; i++ {
		y := float64(i) / n
		s := y * y * (c[2] + y*(c[3]+y*(c[4]+y*(c[5]+y*c[6]))))
		if !(s >= peak-1e-3) { // also false for NaN
			return false
		}
		if s > peak {
			peak = s
		}
	}
	return true
}
