package ide

import (
	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// sameStructureRenames returns the quick fixes for a duplicate-species
// diagnostic that reports one structure under two names: "Rename SECOND to
// FIRST" (preferred) and "Rename FIRST to SECOND". Each renames every
// declaration and use of one name, in every file of the index, to the other;
// the renamed declaration then repeats a name and is reported as an ignored
// duplicate, which the user removes after choosing which thermo to keep
// (kiln deletes nothing). The first declaration is the diagnostic's first
// related location; the second is its second related location (a
// diagnostic on an include statement) or the statement the diagnostic is on.
// Diagnostics for a name declared twice offer nothing.
func sameStructureRenames(x *Index, file string, d speciesfile.Diagnostic) []Action {
	if len(d.Related) == 0 {
		return nil
	}
	name := func(f string, off int) string {
		o, ok := x.At(f, off)
		if !ok || (o.Kind != KindSpeciesDecl && o.Kind != KindSpeciesStmt) || o.SpeciesDecl == nil {
			return ""
		}
		return o.SpeciesDecl.Name.Text
	}
	first := name(d.Related[0].File, d.Related[0].Span.Start)
	second := name(file, d.Span.Start)
	if len(d.Related) > 1 {
		second = name(d.Related[1].File, d.Related[1].Span.Start)
	}
	r := x.Result()
	if first == "" || second == "" || first == second || r.ByName[first] == nil || r.ByName[second] == nil {
		return nil
	}
	rename := func(from, to string, preferred bool) Action {
		var edits []analysis.Edit
		for _, l := range NameReferences(x, from, true) {
			edits = append(edits, analysis.Edit{File: l.File, Span: l.Span, NewText: to})
		}
		return Action{Title: "Rename " + from + " to " + to + " (same structure)", Kind: ActionQuickFix,
			Diagnostics: []speciesfile.Diagnostic{d}, Edits: edits, Preferred: preferred}
	}
	return []Action{rename(second, first, true), rename(first, second, false)}
}
