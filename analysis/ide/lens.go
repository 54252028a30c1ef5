package ide

import "kiln.dev/kiln/speciesfile"

// EquilibriumLensTitle is the title of the code lens that offers the
// equilibrium / flame-temperature calculation on a file.
const EquilibriumLensTitle = "Equilibrium / flame temperature…"

// EquilibriumLens returns where the equilibrium code lens of f goes: the
// keyword of its first species statement, else of its first include (whose
// file may declare the species); ok is false for a file with neither.
func EquilibriumLens(f *speciesfile.File) (speciesfile.Span, bool) {
	if f == nil {
		return speciesfile.Span{}, false
	}
	if len(f.Species) > 0 {
		return f.Species[0].Keyword().Span.At(f.SpeciesStart(0)), true
	}
	if len(f.Includes) > 0 {
		return f.Includes[0].Keyword().Span.At(f.IncludeStart(0)), true
	}
	return speciesfile.Span{}, false
}
