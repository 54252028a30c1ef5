package analysis

import (
	"strconv"

	"kiln.dev/kiln/engine/molecule"
)

// matchResonance pairs radicals that matchSpecies left unmatched when they
// are two resonance structures of one delocalised radical (allyl written
// [CH2]C=C on one side and C=C[CH2]… is the same graph; propargyl written
// [CH2]C#C and C=C=[CH] is not). Such structures share their σ skeleton —
// atoms, hydrogen counts and connectivity, bond orders and radical sites
// aside — so only radicals with the same skeleton and multiplicity on both
// sides are estimated, and they pair when the estimator picks the same
// representative structure (engine/benson/resonance.go), the rule the
// within-file duplicate check uses (species.go, resonanceKeyPrefix).
func matchResonance(a, b *compareSide, matchA, matchB []int) {
	key := func(s *compareSide, sp *Species) string {
		if sp.Mol == nil || !hasRadicalSite(sp.Mol) {
			return ""
		}
		return fingerprint(sp.Mol, true) + "|m" + strconv.Itoa(effectiveMultiplicity(s.a.w.cache.lib, sp))
	}
	pairUnmatched(a, b, matchA, matchB, key, func(x, y *Species) bool {
		fa := a.resonanceForm(x)
		return fa != "" && b.resonanceForm(y) == fa
	})
}

// pairUnmatched pairs species left unmatched on both sides whose key (""
// for none) is equal and, when same is not nil, for which same holds: each
// species of a with the first such species of b still free.
func pairUnmatched(a, b *compareSide, matchA, matchB []int, key func(*compareSide, *Species) string, same func(x, y *Species) bool) {
	buckets := map[string][]int{}
	for j, sp := range b.species {
		if matchB[j] < 0 {
			if k := key(b, sp); k != "" {
				buckets[k] = append(buckets[k], j)
			}
		}
	}
	if len(buckets) == 0 {
		return
	}
	for i, sp := range a.species {
		if matchA[i] >= 0 {
			continue
		}
		k := key(a, sp)
		if k == "" {
			continue
		}
		for _, j := range buckets[k] {
			if matchB[j] < 0 && (same == nil || same(sp, b.species[j])) {
				matchA[i], matchB[j] = j, i
				break
			}
		}
	}
}

// resonanceForm is the representative resonance structure the estimate of
// sp chose ("" when it has a single structure or cannot be estimated).
func (s *compareSide) resonanceForm(sp *Species) string {
	e, err := s.a.w.cache.get(sp.ident, sp.Mol, s.a.estimateOptions(sp.Decl, s.user))
	if err != nil || e == nil || e.Group == nil {
		return ""
	}
	return e.Group.Form
}

func hasRadicalSite(m *molecule.Molecule) bool {
	for _, at := range m.Atoms {
		if at.Radical > 0 {
			return true
		}
	}
	return false
}

// matchLibrary pairs species that matchSpecies and matchResonance left
// unmatched when both take their thermochemistry from the same
// reference-library entry: two spellings the library knows as one species
// (HCCO written [CH]=C=O and C#C[O], NO2 written [O]N=O and O=[N+][O-]),
// the rule the within-file duplicate check uses (species.go,
// libraryKeyPrefix).
func matchLibrary(a, b *compareSide, matchA, matchB []int) {
	pairUnmatched(a, b, matchA, matchB, func(s *compareSide, sp *Species) string {
		return libraryEntry(s.a.w.cache.lib, sp)
	}, nil)
}
