package molecule

// CisTrans describes one stereo double bond written with / and \.
type CisTrans struct {
	Bond int  // index into Bonds of the double bond
	A, B int  // reference substituents on the Bonds[Bond].A side and the .B side
	Cis  bool // A and B lie on the same side of the double bond
}

// side returns, for substituent x of double-bond atom d joined by a bond
// with a direction mark, whether x is "up" (true) in the drawing the marks
// describe: "x/d" puts x below d, "d/x" above; '\' the reverse.
func (m *Molecule) side(b, d int) (up bool, ok bool) {
	bd := m.Bonds[b]
	if bd.Stereo == 0 {
		return false, false
	}
	up = bd.Stereo == '/'
	if bd.B == d { // written "x sym d"
		up = !up
	}
	return up, true
}

// DoubleBondStereo returns the cis/trans configuration of every non-aromatic
// double bond whose two ends each carry a substituent bond marked / or \
// (OpenSMILES: F/C=C/F is trans, F/C=C\F is cis). Each entry names one
// marked substituent per side and whether the two are cis. Marks on double
// bonds inside rings of fewer than 8 atoms are ignored: such rings force
// the configuration (common practice).
func (m *Molecule) DoubleBondStereo() []CisTrans {
	var out []CisTrans
	for k, bd := range m.Bonds {
		if bd.Order != 2 || bd.Aromatic || m.inSmallRing(bd.A, bd.B) {
			continue
		}
		ref := func(d, p int) (int, bool, bool) {
			if len(m.Adj[d]) < 2 || len(m.Adj[d]) > 3 {
				return 0, false, false
			}
			for _, b := range m.Adj[d] {
				o := m.Other(b, d)
				if o == p {
					continue
				}
				if up, ok := m.side(b, d); ok {
					return o, up, true
				}
			}
			return 0, false, false
		}
		x, ux, okx := ref(bd.A, bd.B)
		y, uy, oky := ref(bd.B, bd.A)
		if okx && oky {
			out = append(out, CisTrans{Bond: k, A: x, B: y, Cis: ux == uy})
		}
	}
	return out
}

// Stereocentres returns the atoms written with a chirality mark (@, @@ or
// another OpenSMILES class), ascending.
func (m *Molecule) Stereocentres() []int {
	var out []int
	for i, a := range m.Atoms {
		if a.Chirality != "" {
			out = append(out, i)
		}
	}
	return out
}

// PotentialStereocentres returns the atoms that are stereocentres by graph:
// sp3 atoms (no multiple or aromatic bonds) with four σ partners, at most one
// of them hydrogen, whose four neighbours lie in four different symmetry
// classes (SymmetryClasses; a hydrogen is its own class). Pseudo-asymmetric
// centres that differ only by the configuration of their ligands are not
// detected. Used for counts of optical isomers.
func (m *Molecule) PotentialStereocentres() []int {
	var classes []int
	var out []int
	for i, a := range m.Atoms {
		if a.Aromatic || a.HCount > 1 || len(m.Adj[i])+a.HCount != 4 {
			continue
		}
		sp3 := true
		for _, b := range m.Adj[i] {
			if m.Bonds[b].Order != 1 || m.Bonds[b].Aromatic {
				sp3 = false
			}
		}
		if !sp3 {
			continue
		}
		if classes == nil {
			classes = m.SymmetryClasses()
		}
		seen := map[int]bool{}
		distinct := true
		for _, o := range m.Neighbors(i) {
			if seen[classes[o]] {
				distinct = false
			}
			seen[classes[o]] = true
		}
		if distinct {
			out = append(out, i)
		}
	}
	return out
}

// inSmallRing reports whether atoms a and b (bonded) share an SSSR ring of
// fewer than 8 atoms.
func (m *Molecule) inSmallRing(a, b int) bool {
	for _, r := range m.rings {
		if len(r) >= 8 {
			continue
		}
		ha, hb := false, false
		for _, x := range r {
			ha = ha || x == a
			hb = hb || x == b
		}
		if ha && hb {
			return true
		}
	}
	return false
}
