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
// Thermochemistry from the file's own blocks and from the reference library
// counts as exact. Entropy errors are not carried (group additivity's S°298
// error, ~0.2 cal/(mol K), adds ≲ 0.2 kcal/mol to ΔG°r at 1000 K).
type ReverseUncertainty struct {
	T      float64 // K
	Sigma  float64 // σ(ΔG°r), J/mol
	Factor float64 // exp(σ/(R T)), ≥ 1
	// Estimated lists the species whose estimates contribute, by name.
	Estimated []string
	// Unmeasured lists estimated species without an uncertainty (a class
	// with no measured error): the factor is then a lower bound.
	Unmeasured []string
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
		if sp == nil || nu[n] == 0 || sp.Source != SourceEstimate || sp.Estimate.Library != "" {
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
