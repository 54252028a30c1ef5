package analysis

import (
	"math"
	"sort"

	"kiln.dev/kiln/engine/kinetics"
)

// ReverseUncertainty is the uncertainty a reaction's reverse rate
// k_r = k_f/Kc inherits from estimated thermochemistry. With ν_j the net
// stoichiometric coefficient of species j (products minus reactants) and
// σ_j the standard uncertainty of its estimated ΔHf°298 (Estimate.Uncertainty:
// the error kiln measured for its compound class, widened for every
// approximation the estimate made), errors of different species taken as
// independent:
//
//	σ(ΔG°r) = sqrt(Σ_j (ν_j σ_j)²)        J/mol
//	factor  = exp(σ(ΔG°r)/(R T))         (k_r is uncertain by ×/÷ factor)
//
// Thermochemistry from the reference library counts as exact, except where
// its source states an uncertainty of ΔHf°298 of 4 kJ/mol or more
// (reflib.Species.Hf298Unc: an old estimate, a computed value, a poorly
// determined molecule): that ± is read as a 95 % bound, and its half enters
// as an estimate's 1σ does (Estimate.Uncertainty). A species
// whose thermochemistry comes from the file's own block (nasa7 or
// thermo-table) is treated by what the block holds, since neither block
// states an uncertainty (FORMAT.md §3.3):
//
//   - a block whose ΔHf°298 and S°298 are those of the species' own
//     estimate (to the rounding of written coefficients, givenIsEstimate:
//     as `kiln fill` wrote it and nobody changed it) carries that
//     estimate's uncertainty, or none for reference-library data: the
//     numbers are the estimate's, and so are their errors;
//   - any other block is listed in Given: its uncertainty is unknown, the
//     factor covers only the estimates and is a lower bound, and a
//     reaction whose species are all given has no factor to show (summary
//     says "given" rather than 1.00).
//
// Entropy errors are not carried (group additivity's S°298 error,
// ~0.2 cal/(mol K), adds ≲ 0.2 kcal/mol to ΔG°r at 1000 K).
type ReverseUncertainty struct {
	T      float64 // K
	Sigma  float64 // σ(ΔG°r), J/mol
	Factor float64 // exp(σ/(R T)), ≥ 1
	// Estimated lists the species whose estimates contribute, by name
	// (including file blocks that hold their estimate's numbers, and
	// reference-library species whose source states a large uncertainty).
	Estimated []string
	// Unmeasured lists estimated species without an uncertainty (a class
	// with no measured error): the factor is then a lower bound.
	Unmeasured []string
	// Given lists the species whose thermochemistry is the file's own
	// block with no stated uncertainty: the factor is then a lower bound,
	// and with no Estimated species it says nothing (1 by construction).
	Given []string
}

// Tolerances of givenIsEstimate: far below any difference a person would
// type (0.001 kcal/mol is 4.2 J/mol), far above the rounding of a nasa7
// block written with 11 significant digits (about 1e-4 J/mol in H(298.15)
// and 1e-8 J/(mol K) in S(298.15) for |a6| ≲ 1e6, |a7| ≲ 1e3).
const (
	givenSameHf = 0.5  // J/mol
	givenSameS  = 1e-3 // J/(mol K)
)

// givenIsEstimate reports whether sp's own thermo block holds its estimate's
// ΔHf°298 and S°298 (within givenSameHf and givenSameS), as a block written
// by `kiln fill` from that estimate does.
func (sp *Species) givenIsEstimate() bool {
	hf, s, ok := sp.givenAt298()
	if !ok || sp.Estimate == nil {
		return false
	}
	return math.Abs(hf-sp.Estimate.Hf298) <= givenSameHf && math.Abs(s-sp.Estimate.S298) <= givenSameS
}

// ReverseRateUncertainty returns the uncertainty of r's reverse rate at T
// (K). ok is false when the reverse rate does not come from the
// thermochemistry: an irreversible reaction, an explicit `reverse` rate, an
// unresolved species or thermochemistry kiln does not have.
func (res *Result) ReverseRateUncertainty(r *Reaction, T float64) (ReverseUncertainty, bool) {
	out := ReverseUncertainty{T: T, Factor: 1}
	d := r.Decl
	if d == nil || !r.Resolved || !d.Reversible || d.Reverse != nil || r.reactants == nil {
		return out, false
	}
	nu := map[string]float64{}
	for _, t := range d.Reactants {
		nu[t.Name.Text] -= t.Coeff
	}
	for _, t := range d.Products {
		nu[t.Name.Text] += t.Coeff
	}
	names := make([]string, 0, len(nu))
	for n := range nu {
		names = append(names, n)
	}
	sort.Strings(names)
	var v float64
	for _, n := range names {
		sp := res.ByName[n]
		if sp == nil || nu[n] == 0 {
			continue
		}
		if sp.Source == SourceFile && !sp.givenIsEstimate() {
			out.Given = append(out.Given, n)
			continue
		}
		if sp.Source != SourceFile && sp.Source != SourceEstimate || sp.Estimate.Library != "" && sp.Estimate.Uncertainty <= 0 {
			continue
		}
		out.Estimated = append(out.Estimated, n)
		if sp.Estimate.Uncertainty <= 0 {
			out.Unmeasured = append(out.Unmeasured, n)
			continue
		}
		s := nu[n] * sp.Estimate.Uncertainty
		v += s * s
	}
	out.Sigma = math.Sqrt(v)
	out.Factor = math.Exp(out.Sigma / (kinetics.R * T))
	return out, true
}
