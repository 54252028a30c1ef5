package analysis

import "kiln.dev/kiln/speciesfile"

// DeclaredByIncluder reports, for diagnostic d of res (a file analysed in
// its own scope: itself and what it includes), whether d is an
// undeclared-species error for a name that includer — a file that includes
// res's file — declares, and where. A file does not see the declarations of
// the files that include it (FORMAT.md §3.2), so such a name is undeclared
// when the included file is checked although the mechanism as a whole
// declares it; the caller says so beside the error.
func DeclaredByIncluder(res, includer *Result, d speciesfile.Diagnostic) (Location, bool) {
	if includer == nil || d.Code != speciesfile.CodeUndeclaredSpecies || d.Span.Start < 0 || d.Span.End > len(res.File.Src) || d.Span.Start >= d.Span.End {
		return Location{}, false
	}
	sp, ok := includer.ByName[string(res.File.Src[d.Span.Start:d.Span.End])]
	if !ok {
		return Location{}, false
	}
	return includer.SpeciesLoc(sp), true
}
