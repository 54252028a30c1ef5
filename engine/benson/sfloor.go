package benson

import (
	"fmt"
	"math"

	"kiln.dev/kiln/engine/molecule"
)

// A lower bound on S°298 that no estimate may fall below.
//
// Every ideal-gas molecule has at least its translational entropy (Sackur–
// Tetrode), its rotational entropy and its electronic R ln g; vibrations and
// internal rotations add to these, never subtract. A group sum that comes out
// below the sum of the first three is physically impossible, whatever the
// group values, and is flagged (entropyFloorGroup) so that it is not
// published as data (analysis refuses to write a NASA-7 block for it).
//
// The rotational part needs the moments of inertia, which kiln does not
// have (no 3-D geometry). It is bounded from below from the graph alone:
//
//  1. S_rot ≥ R ln q_rot, since the mean rotational energy above the ground
//     level is ≥ 0 (S = R ln q + U/T).
//  2. For any rigid rotor with principal moments I_A ≤ I_B ≤ I_C, each J has
//     a level no higher than (B + C)/2 · J(J+1) (the state with zero
//     projection on the a axis), so q_rot ≥ 2T/(σ(Θ_B + Θ_C)) in the
//     high-temperature limit (Θ = ħ²/(2 k I)); this also holds for a linear
//     rotor (Θ_B = Θ_C).
//  3. With Σ_i m_i r_i² = J about the centre of mass, I_A + I_B + I_C = 2J
//     and I_C ≤ I_A + I_B, so I_B ≥ J/2 and I_C ≥ 2J/3: (Θ_B + Θ_C)/2 ≤
//     1.75 ħ²/(2 k J).
//  4. J = (1/M) Σ_{i<j} m_i m_j r_ij², and every r_ij is bounded from below:
//     a bonded pair by 0.9 × the sum of the covalent radii for the bond's
//     order (conjugation shortens a single bond by less than 10 %), a
//     non-bonded pair by the sum of the single-bond radii (closer atoms
//     would be bonded: the usual rule for perceiving bonds from a
//     geometry, common practice).
//
// Covalent radii (Å): single bonds Pyykkö & Atsumi, Chem. Eur. J. 15, 186
// (2009); double bonds Pyykkö & Atsumi, Chem. Eur. J. 15, 12770 (2009);
// triple bonds Pyykkö, Riedel & Patzschke, Chem. Eur. J. 11, 3511 (2005); all
// from memory. An element without a radius here takes the smallest radius
// of the table (0.32 Å), which keeps the bound a bound.

// entropyFloorGroup names the flag of an estimate below the lower bound.
const entropyFloorGroup = "S°298 below the physical lower bound"

// covalentRadius returns the single, double and triple bond radii of el
// in Å (0: none); ok is false for an element without radii here.
func covalentRadius(el string) (r [3]float64, ok bool) {
	switch el {
	case "H":
		return [3]float64{0.32, 0, 0}, true
	case "B":
		return [3]float64{0.85, 0.78, 0.73}, true
	case "C":
		return [3]float64{0.75, 0.67, 0.60}, true
	case "N":
		return [3]float64{0.71, 0.60, 0.54}, true
	case "O":
		return [3]float64{0.63, 0.57, 0.53}, true
	case "F":
		return [3]float64{0.64, 0.59, 0.53}, true
	case "Si":
		return [3]float64{1.16, 1.07, 1.02}, true
	case "P":
		return [3]float64{1.11, 1.02, 0.94}, true
	case "S":
		return [3]float64{1.03, 0.94, 0.95}, true
	case "Cl":
		return [3]float64{0.99, 0.95, 0.93}, true
	case "Br":
		return [3]float64{1.14, 1.09, 1.10}, true
	case "I":
		return [3]float64{1.33, 1.29, 1.25}, true
	}
	return r, false
}

// minRadius is the smallest radius of covalentRadius, used for elements
// without one.
const minRadius = 0.32

func radius(el string, order int) float64 {
	r, ok := covalentRadius(el)
	if !ok {
		return minRadius
	}
	// The shortest radius up to this order: a lower bound whatever the
	// true order of a delocalised bond.
	v := r[0]
	for k := 1; k < min(order, 3); k++ {
		if r[k] > 0 {
			v = min(v, r[k])
		}
	}
	return v
}

// Physical constants (CODATA 2018, exact in the SI).
const (
	kBoltzmann = 1.380649e-23      // J/K
	hPlanck    = 6.62607015e-34    // J s
	avogadro   = 6.02214076e23     // 1/mol
	amuKg      = 1.66053906660e-27 // kg
	pStandard  = 1e5               // Pa
	t298       = 298.15            // K
)

// translationalEntropy is the Sackur–Tetrode entropy at 298.15 K and 1 bar
// of an ideal gas of molar mass M (g/mol), J/(mol K).
func translationalEntropy(M float64) float64 {
	m := M / 1000 / avogadro
	v := kBoltzmann * t298 / pStandard * math.Pow(2*math.Pi*m*kBoltzmann*t298/(hPlanck*hPlanck), 1.5)
	return R * (math.Log(v) + 2.5)
}

// massMoment returns a lower bound on J = Σ m_i r_i² about the centre of
// mass (amu Å²) of m with its hydrogens, by rule 4 above, and the total
// mass (amu).
//
// J·M = Σ_{i<k} m_i m_k d_ik² with d_ik the bound of the pair. Every pair
// first takes the non-bonded bound (s_i + s_k)², s the single-bond radius,
// which sums in closed form from Σm, Σms and Σms²; the bonded pairs (a bond
// of the graph, an implicit H and its atom) are then corrected one by one.
// The work is linear in the atoms and bonds, not quadratic.
func massMoment(m *molecule.Molecule) (j, total float64) {
	hw, _ := molecule.AtomicWeight("H")
	hs := radius("H", 1)
	mass := make([]float64, len(m.Atoms))
	var s0, s1, s2, self float64 // Σm, Σms, Σms², Σm²s²
	add := func(w, r float64, k int) {
		fk := float64(k)
		s0 += fk * w
		s1 += fk * w * r
		s2 += fk * w * r * r
		self += fk * w * w * r * r
	}
	for i, a := range m.Atoms {
		w, ok := molecule.AtomicWeight(a.Element)
		if !ok {
			w = 1
		}
		mass[i] = w
		add(w, radius(a.Element, 1), 1)
		add(hw, hs, a.HCount)
	}
	total = s0
	// Σ_{i<k} m_i m_k (s_i+s_k)² = (Σ_{i,k} … − Σ_i m_i² (2 s_i)²) / 2.
	jm := s0*s2 + s1*s1 - 2*self
	pair := func(wa, wb, bonded, free float64) {
		jm += wa * wb * (bonded*bonded - free*free)
	}
	for i, a := range m.Atoms {
		if a.HCount > 0 {
			r := radius(a.Element, 1)
			pair(mass[i]*float64(a.HCount), hw, 0.9*(r+hs), r+hs)
		}
	}
	for _, b := range m.Bonds {
		o := b.Order
		if b.Aromatic {
			o = 2 // between single and double: the double radius bounds it
		}
		ea, eb := m.Atoms[b.A].Element, m.Atoms[b.B].Element
		pair(mass[b.A], mass[b.B], 0.9*(radius(ea, o)+radius(eb, o)), radius(ea, 1)+radius(eb, 1))
	}
	return jm / total, total
}

// entropyFloor returns the lower bound on S°298 (J/(mol K)) of m with
// symmetry number exp(lnSigma) and spin multiplicity mult.
func entropyFloor(m *molecule.Molecule, lnSigma float64, mult int) float64 {
	j, M := massMoment(m)
	s := translationalEntropy(M)
	if mult > 1 {
		s += R * math.Log(float64(mult))
	}
	atoms := len(m.Atoms)
	for _, a := range m.Atoms {
		atoms += a.HCount
	}
	if atoms > 1 { // a bare atom does not rotate
		// Θ for I = 1 amu Å²: ħ²/(2 k I).
		hbar := hPlanck / (2 * math.Pi)
		theta1 := hbar * hbar / (2 * kBoltzmann * amuKg * 1e-20)
		if q := t298 * j / (1.75 * theta1); q > 0 {
			if lnq := math.Log(q) - lnSigma; lnq > 0 {
				s += R * lnq
			}
		}
	}
	return s
}

// entropyFloorFlag returns the flag of an estimate whose S°298 lies below
// its lower bound e.sFloor.
func entropyFloorFlag(e *Result) (Missing, bool) {
	// 0.01 J/(mol K): the bound is attained by a bare atom, whose sum of
	// rounded constants may differ in the last digits.
	if e.sFloor <= 0 || e.S298 >= e.sFloor-0.01 {
		return Missing{}, false
	}
	return Missing{
		Group:         entropyFloorGroup,
		Approximation: "the group sum as it stands",
		Note: fmt.Sprintf("S°298 = %.1f J/(mol K) is below %.1f J/(mol K), the translational (Sackur–Tetrode) plus the least rotational and electronic entropy any structure of this mass and connectivity has; the group values do not add up for this structure (give it a thermo block)",
			e.S298, e.sFloor),
	}, true
}

// EntropyFloor returns the lower bound on S°298 (J/(mol K)) below which the
// estimate is physically impossible, and whether S298 lies below it (the
// estimate then carries the flag named by EntropyFloorGroup).
func (e *Result) EntropyFloor() (floor float64, below bool) {
	_, below = entropyFloorFlag(e)
	return e.sFloor, below
}

// EntropyFloorGroup is the Missing.Group of an estimate whose S°298 lies
// below its physical lower bound.
const EntropyFloorGroup = entropyFloorGroup
