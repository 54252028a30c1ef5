package kinetics

import "math"

// Arrhenius is a modified Arrhenius expression
//
//	k(T) = A · T^N · exp(−Ea/(R T))
//
// with T in K, Ea in J/mol and A in the mechanism units for the reaction's
// order: s⁻¹ (first order), cm3/(mol s) (second), cm6/(mol² s) (third).
// T^N is taken with T in kelvin (no reference temperature).
type Arrhenius struct {
	A, N, Ea float64
}

// Rate returns k(T) = A T^N exp(−Ea/(R T)) for T > 0 K. For T ≤ 0 the result
// is not meaningful (Inf or NaN).
func (a Arrhenius) Rate(T float64) float64 {
	k := a.A * math.Exp(-a.Ea/(R*T))
	if a.N != 0 {
		k *= math.Pow(T, a.N)
	}
	return k
}

// Troe holds the four parameters of the Troe broadening factor. With
// log = log10 and Pr the reduced pressure (see Falloff):
//
//	Fcent = (1−α) exp(−T/T3) + α exp(−T/T1) + exp(−T2/T)   (last term only if HasT2)
//	c     = −0.4 − 0.67 log Fcent
//	n     = 0.75 − 1.27 log Fcent
//	f1    = (log Pr + c) / (n − 0.14 (log Pr + c))
//	log F = log Fcent / (1 + f1²)
//
// T3 and T1 are in K and positive; a zero T3 or T1 makes its term vanish
// (exp(−T/0) = 0, common practice). T2 is in K.
type Troe struct {
	Alpha, T3, T1, T2 float64
	HasT2             bool
}

// Fcent returns the centre broadening factor Fcent(T) (see Troe). It is
// positive for 0 ≤ Alpha ≤ 1 and positive T3, T1; other parameters may give
// Fcent ≤ 0, for which F is undefined.
func (t Troe) Fcent(T float64) float64 {
	f := (1-t.Alpha)*math.Exp(-T/t.T3) + t.Alpha*math.Exp(-T/t.T1)
	if t.HasT2 {
		f += math.Exp(-t.T2 / T)
	}
	return f
}

// F returns the Troe broadening factor F(T, Pr) (see Troe) for a reduced
// pressure Pr ≥ 0. At Pr = 0 and Pr = +Inf the limits of f1 are used
// (f1 → −1/0.14). F is NaN when Fcent(T) ≤ 0.
func (t Troe) F(T, Pr float64) float64 {
	fc := t.Fcent(T)
	if !(fc > 0) {
		return math.NaN()
	}
	lfc := math.Log10(fc)
	c := -0.4 - 0.67*lfc
	n := 0.75 - 1.27*lfc
	var f1 float64
	if Pr <= 0 || math.IsInf(Pr, 1) {
		f1 = -1 / 0.14
	} else {
		x := math.Log10(Pr) + c
		f1 = x / (n - 0.14*x)
	}
	return math.Pow(10, lfc/(1+f1*f1))
}

// Falloff is a pressure-dependent rate between a low-pressure limit Low
// (k0, one order higher than the reaction: cm3 more per mol) and a
// high-pressure limit High (k∞). With M the third-body concentration:
//
//	Pr = k0 [M] / k∞
//	k  = k∞ · Pr/(1 + Pr) · F
//
// where F = 1 (Lindemann) when Troe is nil and the Troe factor otherwise.
type Falloff struct {
	High, Low Arrhenius
	Troe      *Troe
}

// Pr returns the reduced pressure k0(T)·M/k∞(T), M in mol/cm3.
func (f Falloff) Pr(T, M float64) float64 {
	return f.Low.Rate(T) * M / f.High.Rate(T)
}

// Rate returns the falloff rate constant at temperature T (K) and third-body
// concentration M (mol/cm3), in the units of High. Limits: M → 0 gives
// k0·M, M → ∞ gives k∞·F(Pr→∞) (k∞ for Lindemann). A zero k∞ or M gives 0.
func (f Falloff) Rate(T, M float64) float64 {
	kinf := f.High.Rate(T)
	if kinf == 0 || M == 0 {
		return 0
	}
	pr := f.Low.Rate(T) * M / kinf
	if pr == 0 {
		return 0
	}
	k := kinf / (1 + 1/pr) // = k∞ Pr/(1+Pr), finite for Pr = +Inf
	if f.Troe != nil {
		k *= f.Troe.F(T, pr)
	}
	return k
}

// PressureRate is one row of a PressureTable: an Arrhenius expression
// valid at pressure P (Pa).
type PressureRate struct {
	P    float64 // Pa
	Rate Arrhenius
}

// PressureTable is a rate tabulated against pressure. Rows may come in any
// order; rows that share a pressure are summed there (common practice for
// tables whose single-pressure fits need more than one Arrhenius term).
type PressureTable []PressureRate

// Rate returns k(T, P) with P in Pa. Between the two tabulated pressures
// P1 ≤ P ≤ P2 that bracket P it interpolates linearly in ln k against ln P:
//
//	ln k = ln k1 + (ln k2 − ln k1) (ln P − ln P1)/(ln P2 − ln P1)
//
// Outside the tabulated range it clamps to the nearest end pressure. It
// returns NaN for an empty table, and when interpolation needs the logarithm
// of a summed rate that is not positive.
func (p PressureTable) Rate(T, P float64) float64 {
	if len(p) == 0 {
		return math.NaN()
	}
	lo, hi := math.Inf(-1), math.Inf(1) // largest P ≤ target, smallest P ≥ target
	pmin, pmax := math.Inf(1), math.Inf(-1)
	for _, r := range p {
		pmin = math.Min(pmin, r.P)
		pmax = math.Max(pmax, r.P)
		if r.P <= P && r.P > lo {
			lo = r.P
		}
		if r.P >= P && r.P < hi {
			hi = r.P
		}
	}
	switch {
	case P <= pmin:
		return p.rateAt(pmin, T)
	case P >= pmax:
		return p.rateAt(pmax, T)
	case lo == hi:
		return p.rateAt(lo, T)
	}
	k1, k2 := p.rateAt(lo, T), p.rateAt(hi, T)
	if !(k1 > 0 && k2 > 0) {
		return math.NaN()
	}
	w := math.Log(P/lo) / math.Log(hi/lo)
	return math.Exp(math.Log(k1) + w*(math.Log(k2)-math.Log(k1)))
}

// rateAt sums the rows tabulated at exactly pressure P.
func (p PressureTable) rateAt(P, T float64) float64 {
	var k float64
	for _, r := range p {
		if r.P == P {
			k += r.Rate.Rate(T)
		}
	}
	return k
}
