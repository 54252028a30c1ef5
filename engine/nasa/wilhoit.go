package nasa

import (
	"errors"
	"fmt"
	"math"
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
// by golden-section search (25 grid points, 25 golden steps). When no B gives
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
}

func newWilhoitWork(nPts int) *wilhoitWork {
	return &wilhoitWork{a: make([]float64, nPts*4), b: make([]float64, nPts), colScale: make([]float64, 4)}
}

// fitWilhoitTerms searches B for the best monotone fit with nA free A terms.
func fitWilhoitTerms(T, Cp []float64, cp0, cpInf float64, nA int, ws *wilhoitWork) (Wilhoit, bool) {
	const (
		bMin, bMax = 30.0, 30000.0
		nGrid      = 25
	)
	best := Wilhoit{}
	bestSSE := math.Inf(1)
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
	d := cpInf - cp0
	if nA > 0 {
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
		// Scale the columns to unit length: the rank test then measures
		// collinearity rather than the size of yᵏ.
		for k := range nA {
			if !(cs[k] > 0) || math.IsInf(cs[k], 0) {
				return w, 0, false
			}
			cs[k] = 1 / math.Sqrt(cs[k])
		}
		for i := range m {
			for k := range nA {
				a[i*nA+k] *= cs[k]
			}
		}
		householderQR(a, m, nA, b)
		if !triRank(a, nA, nA, 1e-10) {
			return w, 0, false
		}
		x := w.A[:nA]
		backSolve(a, nA, nA, b[:nA], x)
		for k := range nA {
			x[k] *= cs[k]
		}
		if !w.exactlyMonotone(nA) && !w.monotone() {
			// Constrained solve in the scaled unknowns v = A/scale.
			ws.fam = wilhoitIneq{nA: nA}
			fam := scaledFamily{inner: &ws.fam, scale: cs}
			var v [4]float64
			if err := lsi(a, nA, nA, b[:nA], &fam, 1e-8, v[:nA]); err != nil {
				return w, 0, false
			}
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
	peak := 0.0
	for i := 1; i <= n; i++ {
		s := w.shape(float64(i) / n)
		if s < peak-1e-3 || math.IsNaN(s) {
			return false
		}
		peak = math.Max(peak, s)
	}
	return true
}
