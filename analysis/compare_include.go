package analysis

import (
	"fmt"

	"kiln.dev/kiln/engine/reflib"
	"kiln.dev/kiln/speciesfile"
)

// effectiveMultiplicity is the spin multiplicity a species (with a
// structure) declares, else that of the electronic ground state the analysis
// assumes for its structure: the reference library's ground state for its
// small species (O=O is triplet oxygen, [CH2] triplet methylene), otherwise
// unpaired electrons + 1. Structures are "the same species" for duplicate
// diagnostics and for compare only with equal effective multiplicities.
func effectiveMultiplicity(lib *reflib.Library, sp *Species) int {
	if m := intAttr(sp.Decl.Multiplicity); m > 0 {
		return m
	}
	if e, ok := lib.Lookup(sp.Mol, 0); ok {
		return e.Multiplicity
	}
	return sp.Mol.DefaultMultiplicity()
}

// libraryEntry names the reference-library entry whose data a species with
// a structure takes ("" for none or without a structure): the entry of its
// structure and effective multiplicity, the lookup estimate makes. Two
// spellings that find one entry are one species (HCCO as [CH]=C=O and as
// C#C[O]; NO2 as [O]N=O and as O=[N+][O-]).
func libraryEntry(lib *reflib.Library, sp *Species) string {
	if sp.Mol == nil {
		return ""
	}
	if e, ok := lib.Lookup(sp.Mol, effectiveMultiplicity(lib, sp)); ok {
		return e.Name
	}
	return ""
}

// maxIncludeDupReports bounds the same-structure warnings on one include
// statement; one more says that there are more.
const maxIncludeDupReports = 20

// reportSameStructure reports that sp (declared in path) has the structure
// and multiplicity of first, declared earlier under another name: on sp's
// SMILES when path is the analysed file, else on the include statement of
// the analysed file through which path is reached, so that a structure an
// included file declares under a second name is seen where the files are
// put together. Both declarations are related: the first (as before), then
// sp's. The code is duplicate-species either way (FORMAT.md §4).
//
// start is where sp's declaration starts in path, firstLoc the name of
// first's declaration.
func (a *analysis) reportSameStructure(path string, sp, first *Species, start int, firstLoc Location) {
	related := []speciesfile.Related{{File: firstLoc.File, Span: firstLoc.Span, Message: first.Name + " has this structure"}}
	if path == a.res.Path {
		where := a.where(firstLoc)
		a.reportNamingLine(path, speciesfile.Diagnostic{Span: sp.Decl.SMILES.Span.At(start), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeDuplicateSpecies,
			Message: fmt.Sprintf("%s has the same structure as %s (%s)", sp.Name, first.Name, where),
			Related: related}, firstLoc, where)
		return
	}
	inc := a.via[path]
	if inc == nil {
		return
	}
	if a.viaDups == nil {
		a.viaDups = map[*speciesfile.Include]int{}
	}
	a.viaDups[inc]++
	switch n := a.viaDups[inc]; {
	case n == maxIncludeDupReports+1:
		a.report(a.res.Path, speciesfile.Diagnostic{Span: a.res.File.Abs(inc, inc.Path.Span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeDuplicateSpecies,
			Message: fmt.Sprintf("more structures brought in by %s are declared under two names; `kiln compare` lists them all", inc.Path.Text)})
		return
	case n > maxIncludeDupReports:
		return
	}
	where := a.where(firstLoc)
	a.reportNamingLine(a.res.Path, speciesfile.Diagnostic{Span: a.res.File.Abs(inc, inc.Path.Span), Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeDuplicateSpecies,
		Message: fmt.Sprintf("included file %s declares %s with the same structure as %s (%s); rename one to the other",
			shortPath(path), sp.Name, first.Name, where),
		Related: append(related, speciesfile.Related{File: path, Span: sp.Decl.Name.Span.At(start), Message: sp.Name + " has the same structure"})}, firstLoc, where)
}
