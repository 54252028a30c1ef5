package ide

import (
	"maps"
	"strconv"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/reflib"
	"kiln.dev/kiln/speciesfile"
)

// Code action kinds (LSP CodeActionKind values).
const (
	ActionQuickFix = "quickfix"
	// ActionFillThermo is the source action that fills every missing block.
	ActionFillThermo = "source.fixAll.kiln"
)

// Action is a code action: a titled set of edits, with the diagnostics it
// resolves.
type Action struct {
	Title       string
	Kind        string
	Diagnostics []speciesfile.Diagnostic
	Edits       []analysis.Edit
	Preferred   bool
}

// Placeholder is the structure written by "Declare species NAME" for a
// name kiln does not know: `?` is not SMILES, so the new line is reported
// as bad-smiles ("structure not given yet", analysis.ErrStructurePending)
// until the user replaces it with the species' structure.
const Placeholder = analysis.StructurePlaceholder

// declaredStructure returns what "Declare species NAME" writes after the
// name: the reference library's SMILES when NAME is the name of one of its
// species (with a multiplicity line, on a new line, for an entry that is
// not the ground state of its structure, e.g. CH2(S)), or when NAME is a
// formula in another order (CF3H, ClOH) that exactly one library species
// has; else Placeholder.
func declaredStructure(name, nl string) string {
	lib := reflib.New()
	for _, sp := range lib.All() {
		if sp.Name != name {
			continue
		}
		m, err := molecule.ParseSMILES(sp.SMILES)
		if err != nil {
			return Placeholder
		}
		if ground, ok := lib.Lookup(m, 0); ok && ground.Name == sp.Name {
			return sp.SMILES
		}
		return sp.SMILES + nl + "  multiplicity " + strconv.Itoa(sp.Multiplicity)
	}
	want, ok := formulaOf(name)
	if !ok {
		return Placeholder
	}
	found := ""
	for _, sp := range lib.All() {
		m, err := molecule.ParseSMILES(sp.SMILES)
		if err != nil || !maps.Equal(m.Composition(), want) {
			continue
		}
		if found != "" {
			return Placeholder // isomers or spin states: the name does not say which
		}
		found = sp.SMILES
	}
	if found == "" {
		return Placeholder
	}
	return found
}

// formulaOf reads name as a molecular formula written in any element order
// (speciesfile.ParseFormula: CF3H, HOCl, C2H4) of elements kiln knows,
// false when it is not one.
func formulaOf(name string) (map[string]int, bool) {
	counts, err := speciesfile.ParseFormula(name)
	if err != nil {
		return nil, false
	}
	out := map[string]int{}
	for _, c := range counts {
		if _, ok := molecule.AtomicWeight(c.Symbol); !ok {
			return nil, false
		}
		out[c.Symbol] = c.Count
	}
	return out, true
}

// CodeActions returns the actions for the byte range span of the analysed
// file (x.Result().Path): quick fixes for the species statements and the
// diagnostics the range touches, then the fill-all source action.
//
//   - "Insert estimated NASA-7 thermo for NAME": a species without a thermo
//     block whose estimate could be fitted (attached to its missing-thermo
//     diagnostic when there is one);
//   - "Replace thermo of NAME with estimate": on a thermo-mismatch diagnostic
//     (or anywhere on the statement of a species that has one);
//   - "Rename B to A" and "Rename A to B": on a duplicate-species diagnostic
//     for one structure declared under two names (here or in an included
//     file), see sameStructureRenames;
//   - "Declare species NAME": on an undeclared-species diagnostic, inserting
//     `species NAME SMILES` after the last species declaration of the file,
//     SMILES the reference library's for one of its species' names, else
//     `?` (see DeclareEdit);
//   - "Fill all missing thermo blocks": every species of the file that the
//     first quick fix applies to.
func CodeActions(x *Index, file string, span speciesfile.Span) []Action {
	r := x.r
	if file != r.Path {
		return nil
	}
	overlaps := func(s speciesfile.Span) bool {
		return s.Start <= span.End && span.Start <= s.End
	}
	var out []Action
	done := map[*analysis.Species]bool{}
	for _, o := range x.OccurrencesIn(file, span.Start-1, span.End+1) {
		if o.Kind != KindSpeciesStmt || !overlaps(o.Span) || o.Species == nil || o.Species.Decl != o.SpeciesDecl || done[o.Species] {
			continue
		}
		done[o.Species] = true
		for _, d := range r.Diagnostics {
			if d.Code == speciesfile.CodeThermoMismatch && d.Span.Start >= o.Span.Start && d.Span.Start <= o.Span.End && !overlaps(d.Span) {
				if e, ok := r.ReplaceThermoEdit(o.Species); ok {
					out = append(out, Action{Title: "Replace thermo of " + o.Name + " with estimate", Kind: ActionQuickFix,
						Diagnostics: []speciesfile.Diagnostic{d}, Edits: []analysis.Edit{e}})
				}
				break
			}
		}
		e, ok := r.InsertThermoEdit(o.Species)
		if !ok {
			continue
		}
		a := Action{Title: "Insert estimated NASA-7 thermo for " + o.Name, Kind: ActionQuickFix, Edits: []analysis.Edit{e}, Preferred: true}
		for _, d := range r.Diagnostics {
			if d.Code == speciesfile.CodeMissingThermo && d.Span.Start >= o.Span.Start && d.Span.Start <= o.Span.End {
				a.Diagnostics = append(a.Diagnostics, d)
			}
		}
		out = append(out, a)
	}
	declared := map[string]bool{}
	for _, d := range r.Diagnostics {
		if !overlaps(d.Span) {
			continue
		}
		switch d.Code {
		case speciesfile.CodeThermoMismatch:
			o, ok := x.At(file, d.Span.Start)
			if !ok || o.Species == nil {
				continue
			}
			if e, ok := r.ReplaceThermoEdit(o.Species); ok {
				out = append(out, Action{Title: "Replace thermo of " + o.Species.Name + " with estimate", Kind: ActionQuickFix,
					Diagnostics: []speciesfile.Diagnostic{d}, Edits: []analysis.Edit{e}})
			}
		case speciesfile.CodeDuplicateSpecies:
			out = append(out, sameStructureRenames(x, file, d)...)
		case speciesfile.CodeUndeclaredSpecies:
			if d.Span.Start < 0 || d.Span.End > len(r.File.Src) || d.Span.End <= d.Span.Start {
				continue
			}
			name := string(r.File.Src[d.Span.Start:d.Span.End])
			if declared[name] || ValidName(name) != nil {
				continue
			}
			declared[name] = true
			out = append(out, Action{Title: "Declare species " + name, Kind: ActionQuickFix,
				Diagnostics: []speciesfile.Diagnostic{d}, Edits: []analysis.Edit{DeclareEdit(r.File, name)}})
		}
	}
	if fill := r.FillEdits(); len(fill) > 0 {
		out = append(out, Action{Title: "Fill all missing thermo blocks", Kind: ActionFillThermo, Edits: fill})
	}
	return out
}

// DeclareEdit returns the insertion of `species NAME SMILES` on a new line
// after the last species statement of f; before the first reaction when f
// declares no species; else at the end of f. SMILES is the reference
// library's structure when NAME names one of its species (OH, HO2, CH3 …),
// else Placeholder.
func DeclareEdit(f *speciesfile.File, name string) analysis.Edit {
	nl := f.Newline
	if nl == "" {
		nl = "\n"
	}
	text := "species " + name + " " + declaredStructure(name, nl)
	if n := len(f.Species); n > 0 {
		end := f.Species[n-1].Body().At(f.SpeciesStart(n - 1)).End
		return analysis.Edit{File: f.Name, Span: speciesfile.Span{Start: end, End: end}, NewText: nl + text}
	}
	if len(f.Reactions) > 0 {
		at := f.Reactions[0].Keyword().Span.At(f.ReactionStart(0)).Start
		return analysis.Edit{File: f.Name, Span: speciesfile.Span{Start: at, End: at}, NewText: text + nl}
	}
	end := len(f.Src)
	if end > 0 && f.Src[end-1] != '\n' && f.Src[end-1] != '\r' {
		text = nl + text
	}
	return analysis.Edit{File: f.Name, Span: speciesfile.Span{Start: end, End: end}, NewText: text + nl}
}
