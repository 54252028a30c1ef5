package speciesfile

// Relative positions. While a statement is read its spans hold absolute
// offsets (the reader checks them against the text and reports diagnostics
// at them); relativize then moves every span of the new node, in place, to
// be relative to the start of the statement's extent. A node is never
// changed after that, so parses share moved statements (see Reparse).

// rel moves s by -base in place; the zero span (which marks a missing part)
// stays as it is.
func (s *RelSpan) rel(base int) {
	if *s != (RelSpan{}) {
		s.From -= base
		s.To -= base
	}
}

func (t *Token) rel(base int) { t.Span.rel(base) }

func (n *Number) rel(base int) { n.Tok.rel(base) }

func tokenRel(t *Token, base int) {
	if t != nil {
		t.rel(base)
	}
}

func numberRel(n *Number, base int) {
	if n != nil {
		n.rel(base)
	}
}

func intAttrRel(a *IntAttr, base int) {
	if a != nil {
		a.Key.rel(base)
		a.Tok.rel(base)
	}
}

func attrsRel(as []Attr, base int) {
	for i := range as {
		as[i].Key.rel(base)
		as[i].Span.rel(base)
	}
}

func cpRel(cp []CpPoint, base int) {
	for i := range cp {
		cp[i].T.rel(base)
		cp[i].Cp.rel(base)
	}
}

func arrheniusRel(r *Arrhenius, base int) {
	if r != nil {
		r.Span.rel(base)
		numberRel(r.A, base)
		numberRel(r.N, base)
		numberRel(r.Ea, base)
	}
}

func termsRel(ts []Term, base int) {
	for i := range ts {
		tokenRel(ts[i].CoeffTok, base)
		ts[i].Name.rel(base)
	}
}

// relativize makes every span of st, a statement just read whose extent
// starts at base, relative to base. Every part of a new node is its own
// storage (no token or number is reachable twice), so each moves once.
func relativize(st Stmt, base int) {
	if base == 0 {
		return
	}
	b := stmtBase(st)
	b.BodySpan.rel(base)
	b.KeywordTok.rel(base)
	switch s := st.(type) {
	case *Species:
		s.Name.rel(base)
		tokenRel(s.SMILES, base)
		intAttrRel(s.Multiplicity, base)
		intAttrRel(s.Symmetry, base)
		intAttrRel(s.OpticalIsomers, base)
		tokenRel(s.Composition, base)
		tokenRel(s.Note, base)
		if nb := s.NASA7; nb != nil {
			nb.Span.rel(base)
			nb.Header.rel(base)
			nb.TLow.rel(base)
			nb.TMid.rel(base)
			nb.THigh.rel(base)
			nb.LowSpan.rel(base)
			nb.HighSpan.rel(base)
			tokenRel(nb.Source, base)
			for i := range 7 {
				nb.Low[i].rel(base)
				nb.High[i].rel(base)
			}
		}
		if t := s.Table; t != nil {
			t.Span.rel(base)
			t.Header.rel(base)
			numberRel(t.Hf298, base)
			numberRel(t.S298, base)
			cpRel(t.Cp, base)
			tokenRel(t.Source, base)
		}
		attrsRel(s.Attrs, base)
	case *Reaction:
		s.Equation.rel(base)
		termsRel(s.Reactants, base)
		termsRel(s.Products, base)
		s.Arrow.rel(base)
		tokenRel(s.Falloff, base)
		arrheniusRel(s.Rate, base)
		arrheniusRel(s.LowPressure, base)
		if t := s.Troe; t != nil {
			t.Span.rel(base)
			numberRel(t.Alpha, base)
			numberRel(t.T3, base)
			numberRel(t.T1, base)
			numberRel(t.T2, base)
		}
		for i := range s.Efficiencies {
			s.Efficiencies[i].Name.rel(base)
			s.Efficiencies[i].Value.rel(base)
		}
		for i := range s.Pressures {
			s.Pressures[i].P.rel(base)
			arrheniusRel(&s.Pressures[i].Rate, base)
		}
		tokenRel(s.Duplicate, base)
		arrheniusRel(s.Reverse, base)
		tokenRel(s.Note, base)
		attrsRel(s.Attrs, base)
	case *Group:
		s.Name.rel(base)
		numberRel(s.Hf298, base)
		numberRel(s.S298, base)
		cpRel(s.Cp, base)
		tokenRel(s.Source, base)
		attrsRel(s.Attrs, base)
	case *Include:
		s.Path.rel(base)
	case *Units:
		s.Unit.rel(base)
	}
}
