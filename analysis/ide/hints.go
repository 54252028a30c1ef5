package ide

import (
	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// Hint is an inlay hint: Label shown at byte offset Offset.
type Hint struct {
	Offset int
	Label  string
}

// InlayHints returns the hints for the statements of file that start in
// [start, end): at the end of each species line
// "ΔHf°298 -56.21 kcal/mol · S° 67.54 cal/(mol·K) (estimated|library|given)" and at the
// end of each reaction line "ΔH°r -12.30 kcal/mol", in the display units
// (analysis.Units: the digits of check, estimate and summary).
func InlayHints(x *Index, file string, start, end int, s analysis.Settings) []Hint {
	f := x.File(file)
	if f == nil {
		return nil
	}
	u := analysis.UnitsFor(s, f)
	var out []Hint
	for _, o := range x.OccurrencesIn(file, start, end) {
		if o.Span.Start < start || o.Span.Start >= end {
			continue
		}
		switch o.Kind {
		case KindSpeciesStmt:
			sp := o.Species
			if sp == nil || sp.Decl != o.SpeciesDecl {
				continue // duplicate declaration: the first one carries the hint
			}
			v, word := inUse(sp)
			if v == nil {
				continue
			}
			out = append(out, Hint{Offset: lineEnd(f, o.SpeciesDecl.Name.Span.At(o.Base).Start),
				Label: "ΔHf°298 " + u.Energy(v.hf) + " · S° " + u.Entropy(v.s) + " (" + word + ")"})
		case KindReactionStmt:
			r := o.Reaction
			if r == nil || r.DH298 == nil {
				continue
			}
			out = append(out, Hint{Offset: lineEnd(f, o.ReactionDec.Keyword().Span.At(o.Base).Start), Label: "ΔH°r " + u.Energy(*r.DH298)})
		}
	}
	return out
}

// spanOfLine returns the span of the line holding off, without terminator.
func spanOfLine(f *speciesfile.File, off int) speciesfile.Span {
	l := f.Lines.Line(off)
	return speciesfile.Span{Start: f.Lines.LineStart(l), End: f.Lines.LineEnd(l)}
}
