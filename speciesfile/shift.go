package speciesfile

// Copies of statements moved by an edit elsewhere (see Reparse). A copy has
// every span moved by delta bytes and the same token texts; it shares no
// mutable storage with the original (only the immutable Formula lists and
// token strings).

// moved returns s moved by d; the zero Span (which marks a missing part:
// no statement that can be moved starts at offset 0) stays as it is.
func (s Span) moved(d int) Span {
	if s == (Span{}) {
		return s
	}
	return Span{s.Start + d, s.End + d}
}

func (t Token) moved(d int) Token { return Token{t.Span.moved(d), t.Text} }

func (n Number) moved(d int) Number {
	n.Tok = n.Tok.moved(d)
	return n
}

func (b StmtBase) moved(d int) StmtBase {
	return StmtBase{Extent: b.Extent.moved(d), BodySpan: b.BodySpan.moved(d), KeywordTok: b.KeywordTok.moved(d)}
}

func (p *parser) movedToken(t *Token, d int) *Token {
	if t == nil {
		return nil
	}
	return p.newToken(t.moved(d))
}

func (p *parser) movedNumber(n *Number, d int) *Number {
	if n == nil {
		return nil
	}
	np := p.numbers.new()
	*np = n.moved(d)
	return np
}

func (p *parser) movedIntAttr(a *IntAttr, d int) *IntAttr {
	if a == nil {
		return nil
	}
	ap := p.intAttrs.new()
	*ap = IntAttr{Key: a.Key.moved(d), Value: a.Value, Tok: a.Tok.moved(d)}
	return ap
}

func (p *parser) movedAttrs(as []Attr, d int) []Attr {
	if as == nil {
		return nil
	}
	out := p.attrs.take(len(as))
	if out == nil {
		out = []Attr{}
	}
	for _, a := range as {
		out = append(out, Attr{Key: a.Key.moved(d), Span: a.Span.moved(d)})
	}
	return out
}

func movedCp(cp []CpPoint, d int) []CpPoint {
	if cp == nil {
		return nil
	}
	out := make([]CpPoint, len(cp))
	for i, c := range cp {
		out[i] = CpPoint{T: c.T.moved(d), Cp: c.Cp.moved(d)}
	}
	return out
}

// movedRate copies r into ra (whose numbers hold r's).
func movedRate(ra *rateStore, r *Arrhenius, d int) {
	ra.r = Arrhenius{Span: r.Span.moved(d),
		A: movedInto(&ra.n[0], r.A, d), N: movedInto(&ra.n[1], r.N, d), Ea: movedInto(&ra.n[2], r.Ea, d)}
}

// movedInto stores src moved by d in dst and returns dst; nil for a nil src
// (an absent number stays absent).
func movedInto(dst, src *Number, d int) *Number {
	if src == nil {
		return nil
	}
	*dst = src.moved(d)
	return dst
}

func (p *parser) movedArrhenius(r *Arrhenius, d int) *Arrhenius {
	if r == nil {
		return nil
	}
	ra := p.rates.new()
	movedRate(ra, r, d)
	return &ra.r
}

func (p *parser) movedTerms(ts []Term, d int) []Term {
	if ts == nil {
		return nil
	}
	out := p.terms.take(len(ts))
	if out == nil {
		out = []Term{}
	}
	for _, t := range ts {
		t.CoeffTok = p.movedToken(t.CoeffTok, d)
		t.Name = t.Name.moved(d)
		out = append(out, t)
	}
	return out
}

// shifted returns a copy of st with every span moved by d bytes.
func (p *parser) shifted(st Stmt, d int) Stmt {
	switch s := st.(type) {
	case *Species:
		n := p.speciesNodes.new()
		c := &n.sp
		*c = *s
		c.StmtBase = s.StmtBase.moved(d)
		c.Name = s.Name.moved(d)
		if s.SMILES != nil {
			n.smiles = s.SMILES.moved(d)
			c.SMILES = &n.smiles
		}
		c.Multiplicity = p.movedIntAttr(s.Multiplicity, d)
		c.Symmetry = p.movedIntAttr(s.Symmetry, d)
		c.OpticalIsomers = p.movedIntAttr(s.OpticalIsomers, d)
		c.Composition = p.movedToken(s.Composition, d)
		c.Note = p.movedToken(s.Note, d)
		if b := s.NASA7; b != nil {
			nb := p.nasaBlocks.new()
			*nb = NASA7Block{
				Span: b.Span.moved(d), Header: b.Header.moved(d),
				TLow: b.TLow.moved(d), TMid: b.TMid.moved(d), THigh: b.THigh.moved(d),
				LowSpan: b.LowSpan.moved(d), HighSpan: b.HighSpan.moved(d),
				Source: p.movedToken(b.Source, d),
			}
			for i := range 7 {
				nb.Low[i], nb.High[i] = b.Low[i].moved(d), b.High[i].moved(d)
			}
			c.NASA7 = nb
		}
		if t := s.Table; t != nil {
			c.Table = &ThermoTable{
				Span: t.Span.moved(d), Header: t.Header.moved(d),
				Hf298: p.movedNumber(t.Hf298, d), S298: p.movedNumber(t.S298, d),
				Cp: movedCp(t.Cp, d), Source: p.movedToken(t.Source, d),
			}
		}
		c.Attrs = p.movedAttrs(s.Attrs, d)
		return c
	case *Reaction:
		n := p.reactionNodes.new()
		c := &n.r
		*c = *s
		c.StmtBase = s.StmtBase.moved(d)
		c.Equation = s.Equation.moved(d)
		c.Reactants = p.movedTerms(s.Reactants, d)
		c.Products = p.movedTerms(s.Products, d)
		c.Arrow = s.Arrow.moved(d)
		c.Falloff = p.movedToken(s.Falloff, d)
		if s.Rate != nil {
			movedRate(&n.rate, s.Rate, d)
			c.Rate = &n.rate.r
		}
		c.LowPressure = p.movedArrhenius(s.LowPressure, d)
		if t := s.Troe; t != nil {
			tn := p.troes.new()
			tn.t = Troe{Span: t.Span.moved(d),
				Alpha: movedInto(&tn.n[0], t.Alpha, d), T3: movedInto(&tn.n[1], t.T3, d),
				T1: movedInto(&tn.n[2], t.T1, d), T2: movedInto(&tn.n[3], t.T2, d)}
			c.Troe = &tn.t
		}
		if s.Efficiencies != nil {
			c.Efficiencies = p.effs.take(len(s.Efficiencies))
			if c.Efficiencies == nil {
				c.Efficiencies = []Efficiency{}
			}
			for _, e := range s.Efficiencies {
				c.Efficiencies = append(c.Efficiencies, Efficiency{Name: e.Name.moved(d), Value: e.Value.moved(d)})
			}
		}
		if s.Pressures != nil {
			c.Pressures = make([]PressureRate, len(s.Pressures))
			for i, pr := range s.Pressures {
				ra := p.rates.new()
				movedRate(ra, &pr.Rate, d)
				c.Pressures[i] = PressureRate{P: pr.P.moved(d), Rate: ra.r}
			}
		}
		c.Duplicate = p.movedToken(s.Duplicate, d)
		c.Reverse = p.movedArrhenius(s.Reverse, d)
		c.Note = p.movedToken(s.Note, d)
		c.Attrs = p.movedAttrs(s.Attrs, d)
		return c
	case *Group:
		c := *s
		c.StmtBase = s.StmtBase.moved(d)
		c.Name = s.Name.moved(d)
		c.Hf298 = p.movedNumber(s.Hf298, d)
		c.S298 = p.movedNumber(s.S298, d)
		c.Cp = movedCp(s.Cp, d)
		c.Source = p.movedToken(s.Source, d)
		c.Attrs = p.movedAttrs(s.Attrs, d)
		return &c
	case *Include:
		return &Include{StmtBase: s.StmtBase.moved(d), Path: s.Path.moved(d)}
	case *Units:
		return &Units{StmtBase: s.StmtBase.moved(d), Unit: s.Unit.moved(d)}
	case *BadStmt:
		return &BadStmt{s.StmtBase.moved(d)}
	case *Trivia:
		return &Trivia{s.StmtBase.moved(d)}
	}
	panic("speciesfile: unknown statement type")
}
