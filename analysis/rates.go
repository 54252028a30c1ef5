package analysis

import (
	"fmt"
	"math"
	"strconv"

	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/speciesfile"
)

// rateModel is a reaction's rate expression as kiln evaluates it, the one
// place where the rate lines of a reaction become numbers: k_f(T, P) from
// the main Arrhenius line, a falloff (Lindemann or Troe between k0 and k∞,
// with [M] of the N2 bath gas), or a pressure table; k_r(T, P) from an
// explicit reverse line or from k_f/Kc.
type rateModel struct {
	plain    *kinetics.Arrhenius
	falloff  *kinetics.Falloff
	table    kinetics.PressureTable
	bathEff  float64 // third-body efficiency of the N2 bath gas in a falloff
	reverse  *kinetics.Arrhenius
	kc       func(T float64) (float64, bool)
	fwdOrder int // order of k_f: reactant molecules (+1 with a bare M)
	revOrder int
}

// PressureDependent reports whether k_f depends on pressure.
func (m *rateModel) PressureDependent() bool { return m.falloff != nil || len(m.table) > 0 }

// forward returns k_f(T, P) in cm, mol, s units of order fwdOrder, T in K,
// P in Pa.
func (m *rateModel) forward(T, P float64) float64 {
	switch {
	case m.falloff != nil:
		return m.falloff.Rate(T, m.bathEff*kinetics.Concentration(T, P))
	case len(m.table) > 0:
		return m.table.Rate(T, P)
	case m.plain != nil:
		return m.plain.Rate(T)
	}
	return math.NaN()
}

// reverseRate returns k_r(T, P); ok is false when it cannot be computed
// (irreversible reaction, or no thermochemistry for Kc).
func (m *rateModel) reverseRate(T, P float64) (float64, bool) {
	if m.reverse != nil {
		return m.reverse.Rate(T), true
	}
	if m.kc == nil {
		return 0, false
	}
	kc, ok := m.kc(T)
	if !ok {
		return 0, false
	}
	return kinetics.ReverseRate(m.forward(T, P), kc), true
}

// forwardAt returns k_f(T) of d's rate lines at the pressure P (Pa) where
// one number per temperature is wanted (kiln compare): a falloff with the
// N2 bath gas at the efficiency bathEff, a pressure table read at P. Built
// from the same rate model as every other rate kiln shows.
func forwardAt(d *speciesfile.Reaction, P, bathEff float64) (func(T float64) float64, bool) {
	m, ok := baseRateModel(d)
	if !ok {
		return nil, false
	}
	m.bathEff = bathEff
	return func(T float64) float64 { return m.forward(T, P) }, true
}

// baseRateModel reads the forward rate lines of d (main line, falloff,
// pressure table); ok is false without usable rate parameters.
func baseRateModel(d *speciesfile.Reaction) (*rateModel, bool) {
	m := &rateModel{bathEff: 1}
	for _, p := range d.Pressures {
		if arr, ok := arrhenius(&p.Rate); ok {
			m.table = append(m.table, kinetics.PressureRate{P: p.P.SI, Rate: arr})
		}
	}
	if len(m.table) > 0 {
		return m, true
	}
	arr, ok := arrhenius(d.Rate)
	if !ok {
		return nil, false
	}
	if low, ok := arrhenius(d.LowPressure); ok && d.Falloff != nil {
		f := &kinetics.Falloff{High: arr, Low: low}
		if tr := d.Troe; tr != nil && tr.Alpha != nil && tr.T3 != nil && tr.T1 != nil {
			f.Troe = &kinetics.Troe{Alpha: tr.Alpha.SI, T3: tr.T3.SI, T1: tr.T1.SI}
			if tr.T2 != nil {
				f.Troe.T2, f.Troe.HasT2 = tr.T2.SI, true
			}
		}
		m.falloff = f
	} else {
		m.plain = &arr
	}
	return m, true
}

// rateModelOf builds the rate model of a resolved reaction; ok is false
// without usable rate parameters.
func (a *analysis) rateModelOf(d *speciesfile.Reaction, r *Reaction) (*rateModel, bool) {
	m, ok := baseRateModel(d)
	if !ok {
		return nil, false
	}
	if m.falloff != nil {
		m.bathEff = a.bathEfficiency(d)
	}
	third := 0
	if d.ThirdBody {
		third = 1
	}
	m.fwdOrder = molecularity(d.Reactants) + third
	m.revOrder = molecularity(d.Products) + third
	if d.Reversible {
		if arr, ok := arrhenius(d.Reverse); ok {
			m.reverse = &arr
		} else if r.reactants != nil {
			m.kc = r.Kc
		}
	}
	return m, true
}

// bathEfficiency is the third-body efficiency of the N2 bath gas: the value
// listed for the species whose composition is N2, else 1. A falloff with a
// named collider (+AR) has that collider as its bath, efficiency 1.
func (a *analysis) bathEfficiency(d *speciesfile.Reaction) float64 {
	return bathEfficiency(d, func(name string) *Species { return a.res.ByName[name] })
}

// bathEfficiency finds the N2 efficiency of d with the species named as
// species(name) resolves them.
func bathEfficiency(d *speciesfile.Reaction, species func(name string) *Species) float64 {
	if falloffCollider(d) != nil {
		return 1
	}
	for _, e := range d.Efficiencies {
		if sp := species(e.Name.Text); sp != nil && len(sp.Composition) == 1 && sp.Composition["N"] == 2 {
			return e.Value.SI
		}
	}
	return 1
}

// worstCollision runs the collision check of rate (k(T, P)) at each
// pressure and returns the worst violation, with its pressure when the rate
// depends on it.
func worstCollision(order int, masses []float64, heavy []int, rate func(T, P float64) float64, pressures []float64, dependent bool, set kinetics.CollisionSettings) *kinetics.Violation {
	var worst *kinetics.Violation
	for _, P := range pressures {
		v := kinetics.CollisionCheck(order, masses, heavy, func(T float64) float64 { return rate(T, P) }, set)
		if v != nil && (worst == nil || v.Ratio() > worst.Ratio()) {
			if dependent {
				v.P = P
			}
			worst = v
		}
	}
	return worst
}

// rateTMin (K) is the lowest temperature kiln evaluates rate constants at;
// the highest is tmaxReverse.
const rateTMin = 300

// rateGrid is the one temperature grid of the rate checks (nonphysicalRate,
// the collision test), with the collision factor factor: 20 temperatures
// evenly spaced in ln T over rateTMin–tmaxReverse, 300–2500 K
// (kinetics.CollisionSettings.Temperatures).
func rateGrid(factor float64) kinetics.CollisionSettings {
	return kinetics.CollisionSettings{Factor: factor, TMin: rateTMin, TMax: tmaxReverse}
}

// rates computes k_f and k_r at 1000 K and the settings' pressure, and
// checks both against the collision limit over rateGrid and, for
// pressure-dependent rates, over kinetics.CheckPressures (N2 bath gas).
// The diagnostics go to r.diags with spans relative to the statement, which
// starts at start.
func (a *analysis) rates(d *speciesfile.Reaction, r *Reaction, start int) {
	if a.res.Files[r.File].ErrorIn(d.Body().At(start)) {
		return // rate parameters with a syntax error are not data
	}
	m, ok := a.rateModelOf(d, r)
	if !ok {
		return
	}
	if span, why := nonphysicalRate(d, m); why != "" {
		// A rate no reaction can have is not used: no k_f, no k_r, no
		// collision check built on it.
		r.diags = append(r.diags, speciesfile.Diagnostic{Span: inStmt(span), Severity: speciesfile.SeverityError, Code: speciesfile.CodeNonphysicalRate, Message: why})
		return
	}
	r.model = m
	r.ForwardOrder, r.ReverseOrder = m.fwdOrder, m.revOrder
	P := a.set.pressure()
	if len(m.table) > 0 {
		lo, hi := m.table[0].P, m.table[0].P
		for _, row := range m.table {
			lo, hi = math.Min(lo, row.P), math.Max(hi, row.P)
		}
		if P < lo*(1-1e-9) || P > hi*(1+1e-9) {
			edge := lo
			if P > hi {
				edge = hi
			}
			r.RateTableEdge = edge
			r.diags = append(r.diags, speciesfile.Diagnostic{Span: inStmt(d.Pressures[0].P.Tok.Span), Severity: speciesfile.SeverityInformation, Code: speciesfile.CodeRateOutOfRange,
				Message: fmt.Sprintf("rates are shown at %g bar, outside this table's pressures (%g–%g bar): the rate at %g bar is used there (no extrapolation)", P/1e5, lo/1e5, hi/1e5, edge/1e5)})
		}
	}
	if v := m.forward(1000, P); finite(v) {
		r.ForwardRate1000 = &v
	}
	if v, ok := m.reverseRate(1000, P); ok && finite(v) {
		r.ReverseRate1000 = &v
	}
	pressures := []float64{P}
	if m.PressureDependent() {
		pressures = kinetics.CheckPressures()
	}
	set := rateGrid(a.set.CollisionFactor)
	span := d.Equation
	if d.Rate != nil {
		span = d.Rate.Span
	}
	ms, hs := a.sizes(d.Reactants)
	if v := worstCollision(m.fwdOrder, ms, hs, m.forward, pressures, m.PressureDependent(), set); v != nil {
		r.Collision = v
		r.diags = append(r.diags, speciesfile.Diagnostic{Span: inStmt(span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeCollisionLimit,
			Message: fmt.Sprintf("forward rate %.3g exceeds the collision limit %.3g (%s) at %.0f K%s%s", v.Rate, v.Limit, RateUnits(v.Order), v.T, atPressure(v), termolecularNote(v, d.Reactants))})
		return
	}
	if !d.Reversible || (m.reverse == nil && m.kc == nil) {
		return
	}
	kr := func(T, P float64) float64 {
		k, ok := m.reverseRate(T, P)
		if !ok {
			return math.NaN()
		}
		return k
	}
	ms, hs = a.sizes(d.Products)
	dependent := m.PressureDependent() && m.reverse == nil
	// Screened first with an upper bound of k_r that needs no Wilhoit fit
	// (reverseBound): the answer stands when the bound finds no violation,
	// or its worst at a temperature where it is exact.
	var v *kinetics.Violation
	krHi, exactTo, screened := reverseBound(m, r)
	if screened {
		v = worstCollision(m.revOrder, ms, hs, krHi, pressures, dependent, set)
	}
	if !screened || (v != nil && v.T > exactTo) {
		v = worstCollision(m.revOrder, ms, hs, kr, pressures, dependent, set)
	}
	if v != nil {
		v.Reverse = true
		r.Collision = v
		what := "reverse rate implied by thermochemistry"
		if m.reverse != nil {
			what = "reverse rate"
		}
		r.diags = append(r.diags, speciesfile.Diagnostic{Span: inStmt(span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeCollisionLimit,
			Message: fmt.Sprintf("%s, %.3g, exceeds the collision limit %.3g (%s) at %.0f K%s%s", what, v.Rate, v.Limit, RateUnits(v.Order), v.T, atPressure(v), termolecularNote(v, d.Products))})
	}
}

// reverseBound returns an upper bound of m's k_r(T, P) derived from the
// thermochemistry of r that needs no Wilhoit fit, equal to k_r up to
// exactTo (K), when some species of r is an estimate whose Kc above its
// last group temperature would need one (tailFrom): k_r = k_f/Kc with ΔG°r
// bounded from above by the products' upper and the reactants' lower G
// (gBound). ok is false when k_r is not derived from Kc or needs no fit.
func reverseBound(m *rateModel, r *Reaction) (kr func(T, P float64) float64, exactTo float64, ok bool) {
	if m.reverse != nil || m.kc == nil || r.reactants == nil {
		return nil, 0, false
	}
	exactTo = math.Inf(1)
	for _, side := range []kinetics.Side{r.reactants, r.products} {
		for _, t := range side {
			exactTo = math.Min(exactTo, tailFrom(t.Thermo))
		}
	}
	if math.IsInf(exactTo, 1) {
		return nil, 0, false
	}
	re, pr, to := r.reactants, r.products, exactTo
	dn := kinetics.DeltaN(re, pr)
	return func(T, P float64) float64 {
		if T <= to {
			if k, ok := m.reverseRate(T, P); ok {
				return k
			}
			return math.NaN()
		}
		dg := 0.0
		for _, t := range pr {
			dg += t.Coeff * gBound(t.Thermo, T, true)
		}
		for _, t := range re {
			dg -= t.Coeff * gBound(t.Thermo, T, false)
		}
		return kinetics.ReverseRate(m.forward(T, P), kinetics.Kc(kinetics.Kp(dg, T), dn, T))
	}, exactTo, true
}

// atPressure is ", 0.1 bar (N2 bath)" for a pressure-dependent violation.
// termolecularNote explains a termolecular bound (kinetics.CollisionLimit)
// in a message, naming the two molecules of ts (the side checked, as
// sizes expands it) whose collision rate bounds it; "" for other orders.
func termolecularNote(v *kinetics.Violation, ts []speciesfile.Term) string {
	if v.Order != 3 {
		return ""
	}
	var names []string
	for _, t := range ts {
		for k := 0; k < int(math.Round(t.Coeff)); k++ {
			names = append(names, t.Name.Text)
		}
	}
	pair := ""
	if v.Pair[0] < len(names) && v.Pair[1] < len(names) {
		pair = names[v.Pair[0]] + " + " + names[v.Pair[1]]
	}
	return " (" + kinetics.TermolecularBasis(pair) + "; use a falloff form if the rate is a low-pressure limit)"
}

func atPressure(v *kinetics.Violation) string {
	if v.P == 0 {
		return ""
	}
	return fmt.Sprintf(" and %g bar (N2 bath gas)", v.P/1e5)
}

// RatesAt returns k_f and k_r of the reaction at T (K) and P (Pa), in cm,
// mol, s units of orders ForwardOrder and ReverseOrder; an ok is false when
// that rate cannot be computed.
func (r *Reaction) RatesAt(T, P float64) (kf, kr float64, okF, okR bool) {
	if r.model == nil {
		return 0, 0, false, false
	}
	kf = r.model.forward(T, P)
	okF = finite(kf)
	kr, okR = r.model.reverseRate(T, P)
	return kf, kr, okF, okR && finite(kr)
}

// PressureDependent reports whether the reaction's k_f depends on pressure
// (falloff or pressure table): its rates are then shown at
// Settings.Pressure.
func (r *Reaction) PressureDependent() bool { return r.model != nil && r.model.PressureDependent() }

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// nonphysicalRate returns where and why the rate lines of d describe no
// possible reaction ("" when they are usable): a Troe centre Fcent(T) that
// is not positive and finite, or k_f(T) that is not a positive finite
// number, at any temperature of rateGrid (pressure-dependent rates at
// 1 atm). A negative Troe temperature alone is not an error (published sets
// carry a small negative T2, harmless there), and one reaction of a
// `duplicate` pair may have a negative rate (pairs fitted with a negative
// A): only a non-finite value is reported for those.
func nonphysicalRate(d *speciesfile.Reaction, m *rateModel) (speciesfile.RelSpan, string) {
	span := d.Equation
	if d.Rate != nil {
		span = d.Rate.Span
	}
	grid := rateGrid(0).Temperatures()
	if tr := d.Troe; tr != nil && m.falloff != nil && m.falloff.Troe != nil {
		for _, T := range grid {
			if fc := m.falloff.Troe.Fcent(T); !(fc > 0) || math.IsInf(fc, 0) {
				return tr.Span, fmt.Sprintf("troe parameters give Fcent = %s at %.0f K: the broadening centre must be positive and finite, so the falloff rate cannot be evaluated and is not used", rateText(fc), T)
			}
		}
	}
	at := ""
	if m.PressureDependent() {
		at = " (1 atm)"
	}
	for _, T := range grid {
		k := m.forward(T, 101325)
		if d.Duplicate != nil && !math.IsNaN(k) && !math.IsInf(k, 0) {
			continue
		}
		if !(k > 0) || math.IsInf(k, 0) {
			return span, fmt.Sprintf("the forward rate constant is %s at %.0f K%s: a rate constant must be a positive finite number, so this rate is not used", rateText(k), T, at)
		}
	}
	return span, ""
}

// rateText writes a rate constant or falloff parameter in a message with 3
// significant digits, and words one that is not a finite number ("+Inf" is
// not for people).
func rateText(v float64) string {
	switch {
	case math.IsInf(v, 0):
		return "too large for a 64-bit float (it overflows)"
	case math.IsNaN(v):
		return "not a number (its parameters overflow)"
	}
	return strconv.FormatFloat(v, 'g', 3, 64)
}
