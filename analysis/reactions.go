package analysis

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/speciesfile"
)

// keqTemperatures are the temperatures (K) at which Kp is reported, keyed as
// in the summary JSON.
var keqTemperatures = []struct {
	Key string
	T   float64
}{{"298", T298}, {"1000", 1000}, {"1500", 1500}}

// reactions resolves the reactions of the analysed file and finds repeated
// reactions in every file in scope.
func (a *analysis) reactions() error {
	n := 0
	for _, path := range a.order {
		n += len(a.res.Files[path].Reactions)
	}
	// First occurrences by duplicate key: the map is keyed by the key's
	// hash (made once per reaction text unit) and chains entries of
	// different keys sharing a hash.
	type occurrence = dupOccurrence
	sc := a.w.scratch()
	defer a.w.release(sc)
	seen := sc.seen
	occs := slices.Grow(sc.occs[:0], n)
	defer func() { sc.occs = occs }()
	if k := len(a.res.File.Reactions); k > 0 && a.res.Reactions == nil {
		a.res.Reactions = make([]*Reaction, 0, k) // one per reaction of the file
	}
	for _, path := range a.order {
		f := a.res.Files[path]
		for k, d := range f.Reactions {
			if err := a.ctx.Err(); err != nil {
				return err
			}
			rt := a.memo.reactionText(path, f, k)
			key := rt.dupKey
			start := f.ReactionStart(k)
			if f.ErrorIn(d.Body().At(start)) {
				// A reaction the reader could not read completely gets
				// its syntax error only: not compared with others.
				if path == a.res.Path {
					a.res.Reactions = append(a.res.Reactions, a.reaction(path, d, start, rt.equation))
				}
				continue
			}
			var first *occurrence
			head, hashed := seen[rt.dupHash]
			if hashed {
				for i := head; i >= 0; i = occs[i].next {
					if occs[i].key == key {
						first = &occs[i]
						break
					}
				}
			}
			if first != nil {
				if d.Duplicate == nil || first.d.Duplicate == nil {
					firstEq := first.d.Equation.At(first.start)
					line := a.res.Files[first.file].Lines.Position(firstEq.Start).Line + 1
					where := fmt.Sprintf("line %d", line)
					if first.file != path {
						where = fmt.Sprintf("%s:%d", shortPath(first.file), line)
					}
					a.reportNamingLine(path, speciesfile.Diagnostic{Span: d.Equation.At(start), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeDuplicateReaction,
						Message: fmt.Sprintf("this reaction repeats the one at %s; mark both with `duplicate` if both channels are intended", where),
						Related: []speciesfile.Related{{File: first.file, Span: firstEq, Message: "first occurrence"}}}, Location{File: first.file, Span: firstEq}, where)
				}
			} else {
				next := int32(-1)
				if hashed {
					next = head
				}
				seen[rt.dupHash] = int32(len(occs))
				occs = append(occs, occurrence{key: key, d: d, start: start, file: path, next: next})
			}
			if path != a.res.Path {
				continue
			}
			r := a.memo.oldReaction(a, path, f, k, rt.equation)
			if r == nil {
				r = a.reaction(path, d, start, rt.equation)
			}
			a.res.Reactions = append(a.res.Reactions, r)
		}
	}
	return a.computeReactions()
}

// computeReactions works out balance, thermochemistry and rate checks of the
// resolved reactions. Each reaction is one memoized unit reading its
// statement and the species units of its terms; units not kept from the last
// analysis are computed on all cores (the species are settled by now).
// Diagnostics are merged in file order.
func (a *analysis) computeReactions() error {
	rs := a.res.Reactions
	f := a.res.File
	units := make([]*reactionUnit, len(rs))
	var todo []int
	for i, r := range rs {
		if !r.Resolved {
			continue
		}
		u := a.memo.reaction(a, a.res.Path, f, i)
		if r.unit != nil && r.unit != u {
			// the last analysis's value, whose unit does not hold any
			// more: it is not modified, a new value is made
			r = &Reaction{Decl: r.Decl, File: r.File, Equation: r.Equation, Resolved: true, declared: r.declared}
			rs[i] = r
		}
		if u != nil {
			units[i] = u
			continue
		}
		todo = append(todo, i)
	}
	err := a.parallel(len(todo), 256, func(k int) {
		i := todo[k]
		r := rs[i]
		initKp(r)
		a.balance(r.Decl, r)
		// Thermochemistry of a reaction that does not balance means
		// nothing: it is neither shown nor used for reverse rates.
		if r.Balance != nil && r.Balance.Balanced {
			a.thermo(r.Decl, r)
		}
		a.rates(r.Decl, r, f.ReactionStart(i))
		if a.memo != nil {
			units[i] = newReactionUnit(f.EnergyUnit, a.reactionDeps(r.Decl), r, f.ReactionStart(i))
			r.diags = nil
		}
	})
	if err != nil {
		return err
	}
	n := 0
	for i, u := range units {
		if u != nil {
			n += len(u.diags)
		}
		n += len(rs[i].diags)
	}
	a.res.Diagnostics = slices.Grow(a.res.Diagnostics, n)
	for i, r := range rs {
		u := units[i]
		if u == nil {
			// Not incremental: the diagnostics were reported into r
			// (spans relative to the statement).
			a.res.Diagnostics = appendRelocated(a.res.Diagnostics, r.diags, r.File, f.ReactionStart(i))
			r.diags = nil
			continue
		}
		if r.unit != u {
			u.apply(r)
		}
		a.memo.keepReaction(a.res.Path, i, u, r)
		a.res.Diagnostics = appendRelocated(a.res.Diagnostics, u.diags, r.File, f.ReactionStart(i)+r.Decl.Body().From)
	}
	a.rangeChecks()
	return nil
}

// Temperatures (K) at which the reaction checks evaluate species thermo:
// ΔH°r, ΔS°r, ΔG°r at 298.15 K and Kp up to 1500 K for every reaction with
// thermochemistry; Kc up to 2500 K for a reverse rate derived from it (the
// collision check's range).
const (
	tmaxKp      = 1500
	tmaxReverse = 2500
	rangeSlack  = 2 // K: 298.15 K counts as inside a block starting at 300 K
)

// rangeChecks reports, once per species, a thermo block of the analysed file
// that the reaction checks evaluate outside its temperature range (an
// extrapolation kiln would otherwise do silently): thermo-out-of-range on
// the block header, naming the first reaction that needs it.
func (a *analysis) rangeChecks() {
	type need struct {
		tmax float64
		line int
		at   int              // where that reaction's keyword is (its line)
		eq   speciesfile.Span // the equation of that reaction (analysed file)
	}
	given := false // nothing to check without a given block or short library data
	for _, sp := range a.res.Species {
		if sp.Source == SourceFile || shortLibrary(sp) {
			given = true
			break
		}
	}
	if !given {
		return
	}
	needs := map[*Species]need{}
	for i, r := range a.res.Reactions {
		if r.reactants == nil {
			continue // no thermochemistry computed
		}
		tmax := float64(tmaxKp)
		if r.model != nil && r.model.kc != nil && r.model.reverse == nil {
			tmax = tmaxReverse
		}
		for _, ts := range [][]speciesfile.Term{r.Decl.Reactants, r.Decl.Products} {
			for _, t := range ts {
				sp := a.res.ByName[t.Name.Text]
				if sp == nil || (sp.Source != SourceFile && !shortLibrary(sp)) {
					continue
				}
				if n, ok := needs[sp]; !ok || tmax > n.tmax {
					start := a.res.File.ReactionStart(i)
					needs[sp] = need{tmax, stmtLineAt(a.res.File, r.Decl, start), r.Decl.Keyword().Span.At(start).Start, r.Decl.Equation.At(start)}
				}
			}
		}
	}
	for i, sp := range a.res.Species {
		n, ok := needs[sp]
		if !ok {
			continue
		}
		start := a.spStart[i]
		if sp.Source != SourceFile {
			// Reference-library data that stop short (ozone: 2000 K): said
			// on the species' declaration, as for a block of the file.
			lib := sp.Estimate.libPoly
			if lib.THigh >= n.tmax-rangeSlack {
				continue
			}
			if sp.File != a.res.Path {
				// Declared in an included file: said on the reaction of
				// this file that needs it, as for a block there.
				loc := Location{File: sp.File, Span: sp.Decl.Keyword().Span.At(start)}
				where := a.where(loc)
				a.reportNamingLine(a.res.Path, speciesfile.Diagnostic{Span: n.eq, Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoOutOfRange,
					Message: fmt.Sprintf("%s (%s): the reference library's data for it cover %g–%g K, but this reaction needs them from 298 K to %g K; values outside are extrapolated",
						sp.Name, where, lib.TLow, lib.THigh, n.tmax)}, loc, where)
				continue
			}
			a.reportNamingLine(sp.File, speciesfile.Diagnostic{Span: sp.Decl.Keyword().Span.At(start), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoOutOfRange,
				Message: fmt.Sprintf("%s: the reference library's data for it cover %g–%g K, but the reaction on line %d needs them from 298 K to %g K; values outside are extrapolated",
					sp.Name, lib.TLow, lib.THigh, n.line, n.tmax)}, Location{File: a.res.Path, Span: speciesfile.Span{Start: n.at, End: n.at}}, fmt.Sprintf("line %d", n.line))
			continue
		}
		lo, hi := sp.Given.Range()
		if lo <= T298+rangeSlack && hi >= n.tmax-rangeSlack {
			continue
		}
		if sp.File != a.res.Path {
			// The block is in an included file: say it on the reaction
			// of this file that needs it.
			loc := Location{File: sp.File, Span: sp.Given.Span.At(start)}
			where := a.where(loc)
			a.reportNamingLine(a.res.Path, speciesfile.Diagnostic{Span: n.eq, Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoOutOfRange,
				Message: fmt.Sprintf("%s: its thermo block (%s) covers %g–%g K, but this reaction needs it from 298 K to %g K; values outside the block are extrapolated",
					sp.Name, where, lo, hi, n.tmax)}, loc, where)
			continue
		}
		span := sp.Given.Span
		if d := sp.Decl.NASA7; d != nil {
			span = d.Header.Span
		} else if d := sp.Decl.Table; d != nil {
			span = d.Header.Span
		}
		where := fmt.Sprintf("line %d", n.line)
		a.reportNamingLine(sp.File, speciesfile.Diagnostic{Span: span.At(start), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeThermoOutOfRange,
			Message: fmt.Sprintf("%s: the block covers %g–%g K, but the reaction on %s needs it from 298 K to %g K; values outside the block are extrapolated",
				sp.Name, lo, hi, where, n.tmax)}, Location{File: a.res.Path, Span: speciesfile.Span{Start: n.at, End: n.at}}, where)
	}
}

func recordUses(uses map[string][]Location, path string, d *speciesfile.Reaction, start int) {
	add := func(t speciesfile.Token) {
		uses[t.Text] = append(uses[t.Text], Location{File: path, Span: t.Span.At(start)})
	}
	for _, t := range d.Reactants {
		add(t.Name)
	}
	for _, t := range d.Products {
		add(t.Name)
	}
	for _, e := range d.Efficiencies {
		add(e.Name)
	}
	if c := falloffCollider(d); c != nil {
		add(*c)
	}
}

// falloffCollider returns the specific collider of a falloff "(+AR)" as a
// token spanning the name, or nil for "(+M)" or no falloff.
func falloffCollider(d *speciesfile.Reaction) *speciesfile.Token {
	if d.Falloff == nil {
		return nil
	}
	t := d.Falloff.Text
	if !strings.HasPrefix(t, "(+") || !strings.HasSuffix(t, ")") {
		return nil
	}
	name := t[2 : len(t)-1]
	if name == "M" || name == "" {
		return nil
	}
	start := d.Falloff.Span.From + 2
	return &speciesfile.Token{Span: speciesfile.RelSpan{From: start, To: start + len(name)}, Text: name}
}

// reaction resolves the names of one reaction (equation is its text with
// blanks collapsed); computeReactions works out the rest.
func (a *analysis) reaction(path string, d *speciesfile.Reaction, start int, equation string) *Reaction {
	f := a.res.Files[path]
	r := &Reaction{Decl: d, File: path, Equation: equation, Resolved: true}
	if len(d.Reactants) == 0 || len(d.Products) == 0 || f.ErrorIn(d.Body().At(start)) {
		// A reaction the reader could not read (equation or rate lines)
		// is not data: the syntax error is the one diagnostic.
		r.Resolved = false
		r.Kp = map[string]*float64{}
		return r
	}
	r.declared = true
	undeclared := func(t speciesfile.Token, what string) {
		r.declared = false
		msg := fmt.Sprintf("%s %s is not declared; add a `species %s SMILES` line", what, t.Text, t.Text)
		if parts := strings.Split(t.Text, "+"); len(parts) > 1 && !strings.HasPrefix(t.Text, "(+") {
			msg = fmt.Sprintf("%s %s is not declared; if you meant %s, put blanks around each +", what, t.Text, strings.Join(parts, " + "))
		}
		a.report(path, speciesfile.Diagnostic{Span: t.Span.At(start), Severity: speciesfile.SeverityError, Code: speciesfile.CodeUndeclaredSpecies, Message: msg})
	}
	for _, ts := range [][]speciesfile.Term{d.Reactants, d.Products} {
		for _, t := range ts {
			if _, ok := a.res.ByName[t.Name.Text]; !ok {
				undeclared(t.Name, "species")
				r.Resolved = false
			}
		}
	}
	if !r.Resolved {
		initKp(r)
	} // else computeReactions makes Kp (or takes it from a kept unit)
	for _, e := range d.Efficiencies {
		if _, ok := a.res.ByName[e.Name.Text]; !ok {
			undeclared(e.Name, "third-body efficiency for")
		}
	}
	if c := falloffCollider(d); c != nil {
		if _, ok := a.res.ByName[c.Text]; !ok {
			undeclared(*c, "falloff collider")
		}
	}
	if !r.Resolved {
		a.forwardOnly(d, r)
	}
	return r
}

// forwardOnly gives a reaction that names an undeclared species its k_f at
// 1000 K and the settings' pressure, which needs only the rate parameters
// (and the bath gas's efficiency, 1 for an undeclared one). Balance,
// thermochemistry, k_r and the collision check need the species and are
// not computed; a rate no reaction can have (nonphysicalRate) gives no k_f.
func (a *analysis) forwardOnly(d *speciesfile.Reaction, r *Reaction) {
	m, ok := a.rateModelOf(d, r)
	if !ok {
		return
	}
	if _, why := nonphysicalRate(d, m); why != "" {
		return
	}
	if v := m.forward(1000, a.set.pressure()); finite(v) {
		r.ForwardRate1000, r.ForwardOrder = &v, m.fwdOrder
	}
}

// initKp gives r the Kp entries of every reported temperature, unknown
// (nil) until the thermochemistry is worked out.
func initKp(r *Reaction) {
	r.Kp = make(map[string]*float64, len(keqTemperatures))
	for _, k := range keqTemperatures {
		r.Kp[k.Key] = nil
	}
}

// StmtLine returns the 1-based line of a statement as every command shows
// it: the line of its keyword, not of the comment and blank lines that
// precede it (they belong to the statement's span).
func StmtLine(f *speciesfile.File, st speciesfile.Stmt) int {
	return stmtLineAt(f, st, f.Start(st))
}

// stmtLineAt is StmtLine for a statement known to start at start.
func stmtLineAt(f *speciesfile.File, st speciesfile.Stmt, start int) int {
	return f.Lines.Line(st.Keyword().Span.At(start).Start) + 1
}

// equationText is the equation as written with runs of blanks collapsed;
// d starts at start in f.
func equationText(f *speciesfile.File, d *speciesfile.Reaction, start int) string {
	eq := d.Equation.At(start)
	return strings.Join(strings.Fields(string(f.Src[eq.Start:eq.End])), " ")
}

func (a *analysis) weighted(ts []speciesfile.Term) ([]kinetics.Weighted, bool) {
	var out []kinetics.Weighted
	for _, t := range ts {
		sp := a.res.ByName[t.Name.Text]
		if len(sp.Composition) == 0 {
			return nil, false
		}
		out = append(out, kinetics.Weighted{Coeff: t.Coeff, Composition: sp.Composition, Charge: sp.Charge})
	}
	return out, true
}

func (a *analysis) balance(d *speciesfile.Reaction, r *Reaction) {
	re, ok1 := a.weighted(d.Reactants)
	pr, ok2 := a.weighted(d.Products)
	if !ok1 || !ok2 {
		return // a species without structure or composition: nothing to balance against
	}
	b := kinetics.CheckBalance(re, pr)
	r.Balance = &b
	if !b.Balanced {
		r.diags = append(r.diags, speciesfile.Diagnostic{Span: inStmt(d.Equation), Severity: speciesfile.SeverityError, Code: speciesfile.CodeUnbalancedReaction,
			Message: "unbalanced reaction: " + b.Message()})
	}
}

func (a *analysis) side(ts []speciesfile.Term) (kinetics.Side, bool) {
	var out kinetics.Side
	for _, t := range ts {
		th := a.res.ByName[t.Name.Text].Thermo()
		if th == nil {
			return nil, false
		}
		out = append(out, kinetics.Term{Coeff: t.Coeff, Thermo: th})
	}
	return out, true
}

func (a *analysis) thermo(d *speciesfile.Reaction, r *Reaction) {
	re, ok1 := a.side(d.Reactants)
	pr, ok2 := a.side(d.Products)
	if !ok1 || !ok2 {
		return
	}
	dh, ds, dg := kinetics.Delta(re, pr, T298)
	r.DH298, r.DS298, r.DG298 = &dh, &ds, &dg
	r.reactants, r.products = re, pr
	for _, k := range keqTemperatures {
		_, _, g := kinetics.Delta(re, pr, k.T)
		kp := kinetics.Kp(g, k.T)
		if !math.IsInf(kp, 0) && !math.IsNaN(kp) {
			r.Kp[k.Key] = &kp
		}
	}
}

// KpAt returns the dimensionless equilibrium constant Kp (1 bar) at T, if
// the reaction's thermochemistry is known.
func (r *Reaction) KpAt(T float64) (float64, bool) {
	if r.reactants == nil {
		return 0, false
	}
	_, _, g := kinetics.Delta(r.reactants, r.products, T)
	return kinetics.Kp(g, T), true
}

// Kc returns the equilibrium constant in (mol/cm3)^Δn at T, if the reaction's
// thermochemistry is known.
func (r *Reaction) Kc(T float64) (float64, bool) {
	if r.reactants == nil {
		return 0, false
	}
	_, _, g := kinetics.Delta(r.reactants, r.products, T)
	return kinetics.Kc(kinetics.Kp(g, T), kinetics.DeltaN(r.reactants, r.products), T), true
}

func arrhenius(r *speciesfile.Arrhenius) (kinetics.Arrhenius, bool) {
	if r == nil || r.A == nil {
		return kinetics.Arrhenius{}, false
	}
	out := kinetics.Arrhenius{A: r.A.SI}
	if r.N != nil {
		out.N = r.N.SI
	}
	if r.Ea != nil {
		out.Ea = r.Ea.SI
	}
	return out, true
}

func molecularity(ts []speciesfile.Term) int {
	n := 0.0
	for _, t := range ts {
		n += t.Coeff
	}
	return int(math.Round(n))
}

func (a *analysis) sizes(ts []speciesfile.Term) (masses []float64, heavy []int) {
	for _, t := range ts {
		sp := a.res.ByName[t.Name.Text]
		h := 0
		for el, c := range sp.Composition {
			if el != "H" {
				h += c
			}
		}
		for k := 0; k < int(math.Round(t.Coeff)); k++ {
			masses = append(masses, sp.MolarMass)
			heavy = append(heavy, h)
		}
	}
	return masses, heavy
}

// RateUnits names the units of a rate constant of the given order (see
// kinetics.RateUnits, the one formatter).
func RateUnits(order int) string { return kinetics.RateUnits(order) }

// shortLibrary reports whether sp takes reference-library data whose
// polynomial stops below the usual 3000 K (rangeChecks warns when a
// reaction needs more).
func shortLibrary(sp *Species) bool {
	return sp.Source == SourceEstimate && sp.Estimate != nil && sp.Estimate.Library != "" && sp.Estimate.libPoly.THigh < 3000-rangeSlack
}
