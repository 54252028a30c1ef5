// Package ide computes editor features — hover text, inlay hints,
// definitions, references, renames, symbols, completions, folding ranges,
// formatting and code actions — as pure functions of analysis results. It
// speaks byte offsets into file sources (speciesfile.Span) and plain Go
// values, never protocol types: converting offsets to editor positions is the
// language server's job (package lsp, through speciesfile.LineIndex).
package ide

import (
	"sort"
	"sync"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// Kind says what an Occurrence is.
type Kind int

// Occurrence kinds. Statement-level kinds cover a whole statement body; the
// others cover one token.
const (
	// KindSpeciesStmt is the body of a species statement.
	KindSpeciesStmt Kind = iota + 1
	// KindSpeciesDecl is the name token of a species declaration.
	KindSpeciesDecl
	// KindSpeciesUse is a species name used in a reaction: a term, an
	// efficiency name or the collider of a falloff token "(+AR)".
	KindSpeciesUse
	// KindReactionStmt is the body of a reaction statement.
	KindReactionStmt
	// KindGroupStmt is the body of a group statement.
	KindGroupStmt
	// KindGroupDecl is the name token of a group statement.
	KindGroupDecl
	// KindIncludePath is the path token of an include statement.
	KindIncludePath
)

func (k Kind) statement() bool {
	return k == KindSpeciesStmt || k == KindReactionStmt || k == KindGroupStmt
}

// Occurrence is a span of a file that editor features know about.
type Occurrence struct {
	Kind Kind
	File string
	Span speciesfile.Span
	// Name is the species or group name (raw text for groups), the include
	// path, or the equation text for reactions.
	Name string
	// Species is the resolved species of the name (nil when undeclared).
	Species *analysis.Species
	// SpeciesDecl is the declaration statement for KindSpeciesStmt/Decl
	// (also for duplicate declarations that the analysis ignores).
	SpeciesDecl *speciesfile.Species
	Reaction    *analysis.Reaction    // KindReactionStmt in the analysed file
	ReactionDec *speciesfile.Reaction // KindReactionStmt, any file
	Group       *analysis.Group       // KindGroup*, nil when not resolved
	GroupDecl   *speciesfile.Group    // KindGroup*
	Include     *speciesfile.Include  // KindIncludePath
	IncludePath string                // resolved path of the include ("" if unresolved)
}

// Index makes one analysis result searchable by position. Build it once per
// result (NewIndex is linear in the size of the files); lookups are
// logarithmic. An Index is immutable and safe for concurrent use.
type Index struct {
	r      *analysis.Result
	byFile map[string][]Occurrence // sorted by Span.Start, statements before their tokens

	namesOnce sync.Once
	names     []Completion // species names, sorted (built on first completion)
}

// NewIndex indexes r: every file it holds (the analysed file and its includes).
func NewIndex(r *analysis.Result) *Index {
	x := &Index{r: r, byFile: map[string][]Occurrence{}}
	reactions := map[*speciesfile.Reaction]*analysis.Reaction{}
	for _, rx := range r.Reactions {
		reactions[rx.Decl] = rx
	}
	groups := map[*speciesfile.Group]*analysis.Group{}
	for _, g := range r.Groups {
		groups[g.Decl] = g
	}
	includes := map[*speciesfile.Include]string{}
	for _, inc := range r.Includes {
		includes[inc.Decl] = inc.Path
	}
	for path, f := range r.Files {
		var occ []Occurrence
		for _, st := range f.Stmts {
			switch s := st.(type) {
			case *speciesfile.Species:
				sp := r.ByName[s.Name.Text]
				occ = append(occ,
					Occurrence{Kind: KindSpeciesStmt, File: path, Span: s.Body(), Name: s.Name.Text, Species: sp, SpeciesDecl: s},
					Occurrence{Kind: KindSpeciesDecl, File: path, Span: s.Name.Span, Name: s.Name.Text, Species: sp, SpeciesDecl: s})
			case *speciesfile.Reaction:
				occ = append(occ, Occurrence{Kind: KindReactionStmt, File: path, Span: s.Body(), Name: equationText(f, s), Reaction: reactions[s], ReactionDec: s})
				for _, u := range reactionUses(s) {
					occ = append(occ, Occurrence{Kind: KindSpeciesUse, File: path, Span: u.Span, Name: u.Text, Species: r.ByName[u.Text], ReactionDec: s, Reaction: reactions[s]})
				}
			case *speciesfile.Group:
				g := groups[s]
				occ = append(occ,
					Occurrence{Kind: KindGroupStmt, File: path, Span: s.Body(), Name: s.Name.Text, Group: g, GroupDecl: s},
					Occurrence{Kind: KindGroupDecl, File: path, Span: s.Name.Span, Name: s.Name.Text, Group: g, GroupDecl: s})
			case *speciesfile.Include:
				occ = append(occ, Occurrence{Kind: KindIncludePath, File: path, Span: s.Path.Span, Name: s.Path.Text, Include: s, IncludePath: includes[s]})
			}
		}
		sort.SliceStable(occ, func(i, j int) bool {
			if occ[i].Span.Start != occ[j].Span.Start {
				return occ[i].Span.Start < occ[j].Span.Start
			}
			return occ[i].Kind.statement() && !occ[j].Kind.statement()
		})
		x.byFile[path] = occ
	}
	return x
}

// Result returns the indexed analysis result.
func (x *Index) Result() *analysis.Result { return x.r }

// File returns the parsed file at path (nil when the result does not hold it).
func (x *Index) File(path string) *speciesfile.File { return x.r.Files[path] }

// Occurrences returns the occurrences of a file in offset order (shared; do
// not modify).
func (x *Index) Occurrences(path string) []Occurrence { return x.byFile[path] }

// At returns the innermost occurrence whose span holds off (the end offset
// of a token counts as inside it, so a cursor just after a name finds it).
func (x *Index) At(path string, off int) (Occurrence, bool) {
	occ := x.byFile[path]
	i := sort.Search(len(occ), func(i int) bool { return occ[i].Span.Start > off }) - 1
	for ; i >= 0; i-- {
		o := occ[i]
		if off >= o.Span.Start && (off < o.Span.End || (!o.Kind.statement() && off == o.Span.End)) {
			return o, true
		}
		if o.Kind.statement() {
			break // tokens never straddle statements
		}
	}
	return Occurrence{}, false
}

// use is a species name token inside a reaction.
type use = speciesfile.Token

// reactionUses lists the species names a reaction uses: terms (not the third
// body M), efficiency names and a specific falloff collider "(+AR)".
func reactionUses(r *speciesfile.Reaction) []use {
	var out []use
	for _, t := range r.Reactants {
		out = append(out, t.Name)
	}
	for _, t := range r.Products {
		out = append(out, t.Name)
	}
	if r.Falloff != nil {
		if c := r.FalloffCollider(); c != "" && c != "M" {
			st := r.Falloff.Span.Start + 2
			out = append(out, speciesfile.Token{Span: speciesfile.Span{Start: st, End: st + len(c)}, Text: c})
		}
	}
	for _, e := range r.Efficiencies {
		out = append(out, e.Name)
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Span.Start < out[j].Span.Start })
	return out
}

// equationText returns the equation as written.
func equationText(f *speciesfile.File, r *speciesfile.Reaction) string {
	e := r.Equation
	if e.Start < 0 || e.End > len(f.Src) || e.Start >= e.End {
		return "reaction"
	}
	return string(f.Src[e.Start:e.End])
}

// lineEnd returns the offset of the end of the line holding off, before its
// terminator.
func lineEnd(f *speciesfile.File, off int) int {
	return f.Lines.LineEnd(f.Lines.Line(off))
}
