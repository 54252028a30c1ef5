package analysis

import (
	"fmt"

	"kiln.dev/kiln/speciesfile"
)

// reportSameStructure reports that sp (declared in path) has the structure
// and multiplicity of first, declared earlier under another name: on sp's
// SMILES when path is the analysed file, else on the include statement of
// the analysed file through which path is reached, so that a structure an
// included file declares under a second name is seen where the files are
// put together. Both declarations are related: the first (as before), then
// sp's. The code is duplicate-species either way (FORMAT.md §4).
func (a *analysis) reportSameStructure(path string, sp, first *Species) {
	related := []speciesfile.Related{{File: first.Loc.File, Span: first.Loc.Span, Message: first.Name + " has this structure"}}
	if path == a.res.Path {
		a.report(path, speciesfile.Diagnostic{Span: sp.Decl.SMILES.Span, Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeDuplicateSpecies,
			Message: fmt.Sprintf("%s has the same structure as %s (%s)", sp.Name, first.Name, a.where(first.Loc)),
			Related: related})
		return
	}
	inc := a.via[path]
	if inc == nil {
		return
	}
	a.report(a.res.Path, speciesfile.Diagnostic{Span: inc.Path.Span, Severity: speciesfile.SeverityWarning, Code: speciesfile.CodeDuplicateSpecies,
		Message: fmt.Sprintf("included file %s declares %s with the same structure as %s (%s); rename one to the other",
			shortPath(path), sp.Name, first.Name, a.where(first.Loc)),
		Related: append(related, speciesfile.Related{File: path, Span: sp.Loc.Span, Message: sp.Name + " has the same structure"})})
}
