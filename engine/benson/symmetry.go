package benson

import (
	"context"
	"math"
	"math/big"

	"kiln.dev/kiln/engine/molecule"
)

// Symmetry number σ and optical isomers n come from the molecule package:
// one bounded computation (molecule.Molecule.SymmetryNumber documents the
// rule: σ = σ_ext·Π σ_int from the rigid fragments and tops of the graph,
// proper rotations only, cages by their rotational subgroup). This file only
// adapts it to the estimate.

// SymmetryNumber returns the total symmetry number σ of m (external ×
// internal), at least 1. It panics on nothing: when σ cannot be computed
// (work limit) or does not fit an int, it returns 0, which callers must
// treat as "unknown"; Estimate reports the error, or carries a σ beyond the
// int range exactly (Result.SymmetryExact).
func SymmetryNumber(m *molecule.Molecule) int {
	if m == nil || len(m.Atoms) == 0 {
		return 1
	}
	s := symmetryOf(context.Background(), m)
	if s.err != nil {
		return 0
	}
	return s.sigma
}

// OpticalIsomers returns n, the number of stereoisomers the structure
// stands for (molecule.Molecule.OpticalIsomers documents the rule: distinct
// configurations of the tetrahedral carbons that the rings allow, up to the
// graph's symmetry; a written @/@@ fixes its centre), or 0 when it cannot be
// computed within the work bound (Estimate reports the error).
func OpticalIsomers(m *molecule.Molecule) int {
	if m == nil || len(m.Atoms) == 0 {
		return 1
	}
	return m.OpticalIsomers()
}

// sym holds σ and n of one species for Estimate.
type sym struct {
	m     *molecule.Molecule
	sigma int      // σ; 0 when it exceeds the int range (exact holds it)
	exact *big.Int // σ, exact
	err   error
}

func symmetryOf(ctx context.Context, m *molecule.Molecule) *sym {
	s := &sym{m: m}
	sigma, err := m.SymmetryNumberContext(ctx)
	switch {
	case err != nil:
		s.err = err
	default:
		s.exact = sigma
		if sigma.IsInt64() && sigma.Int64() <= math.MaxInt {
			s.sigma = int(sigma.Int64())
		}
	}
	return s
}

// number returns σ; 0 when it could not be computed (see err) or exceeds
// the int range (see exact).
func (s *sym) number() int { return s.sigma }

// lnBig returns ln x for x ≥ 1 of any size (only R ln σ enters the
// entropy, so σ beyond float64's exact integers loses nothing that
// matters).
func lnBig(x *big.Int) float64 {
	if n := x.BitLen(); n > 60 {
		top := new(big.Int).Rsh(x, uint(n-60))
		return math.Log(float64(top.Uint64())) + float64(n-60)*math.Ln2
	}
	return math.Log(float64(x.Uint64()))
}

func (s *sym) opticalIsomers() (int, error) {
	return s.m.OpticalIsomersContext(context.Background())
}
