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
	// Base is where the statement holding the occurrence starts in File
	// (the relative spans of the syntax nodes below are read from it).
	Base int
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

// Index makes one analysis result searchable by position. NewIndex is cheap
// (it keeps no per-statement data); lookups binary-search the statements of
// a file and build the occurrences of the one statement they land in. An
// Index is immutable and safe for concurrent use.
type Index struct {
	r        *analysis.Result
	groups   map[*speciesfile.Group]*analysis.Group
	includes map[*speciesfile.Include]string

	namesOnce sync.Once
	names     []Completion // species names in declaration order, then M and (+M) (built on first completion; read-only)
}

// NewIndex indexes r: every file it holds (the analysed file and its includes).
func NewIndex(r *analysis.Result) *Index {
	x := &Index{r: r, groups: map[*speciesfile.Group]*analysis.Group{}, includes: map[*speciesfile.Include]string{}}
	for _, g := range r.Groups {
		x.groups[g.Decl] = g
	}
	for _, inc := range r.Includes {
		x.includes[inc.Decl] = inc.Path
	}
	return x
}

// reaction returns the resolved reaction of statement d, which starts at
// start (analysed file only).
func (x *Index) reaction(path string, d *speciesfile.Reaction, start int) *analysis.Reaction {
	if path != x.r.Path {
		return nil
	}
	rs := x.r.Reactions // in file order, one per reaction statement
	f := x.r.File
	if len(rs) != len(f.Reactions) {
		return nil
	}
	i := sort.Search(len(rs), func(i int) bool { return f.ReactionStart(i) >= start })
	if i < len(rs) && rs[i].Decl == d {
		return rs[i]
	}
	return nil
}

// stmtOccurrences appends the occurrences of statement i of file f (at
// path) to out: the statement, then its tokens in offset order.
func (x *Index) stmtOccurrences(out []Occurrence, path string, f *speciesfile.File, i int) []Occurrence {
	r := x.r
	base := f.Starts[i]
	at := func(s speciesfile.RelSpan) speciesfile.Span { return s.At(base) }
	switch s := f.Stmts[i].(type) {
	case *speciesfile.Species:
		sp := r.ByName[s.Name.Text]
		out = append(out,
			Occurrence{Kind: KindSpeciesStmt, File: path, Base: base, Span: at(s.Body()), Name: s.Name.Text, Species: sp, SpeciesDecl: s},
			Occurrence{Kind: KindSpeciesDecl, File: path, Base: base, Span: at(s.Name.Span), Name: s.Name.Text, Species: sp, SpeciesDecl: s})
	case *speciesfile.Reaction:
		rx := x.reaction(path, s, base)
		out = append(out, Occurrence{Kind: KindReactionStmt, File: path, Base: base, Span: at(s.Body()), Name: equationText(f, s, base), Reaction: rx, ReactionDec: s})
		for _, u := range reactionUses(s) {
			out = append(out, Occurrence{Kind: KindSpeciesUse, File: path, Base: base, Span: at(u.Span), Name: u.Text, Species: r.ByName[u.Text], ReactionDec: s, Reaction: rx})
		}
	case *speciesfile.Group:
		g := x.groups[s]
		out = append(out,
			Occurrence{Kind: KindGroupStmt, File: path, Base: base, Span: at(s.Body()), Name: s.Name.Text, Group: g, GroupDecl: s},
			Occurrence{Kind: KindGroupDecl, File: path, Base: base, Span: at(s.Name.Span), Name: s.Name.Text, Group: g, GroupDecl: s})
	case *speciesfile.Include:
		out = append(out, Occurrence{Kind: KindIncludePath, File: path, Base: base, Span: at(s.Path.Span), Name: s.Path.Text, Include: s, IncludePath: x.includes[s]})
	}
	return out
}

// Result returns the indexed analysis result.
func (x *Index) Result() *analysis.Result { return x.r }

// File returns the parsed file at path (nil when the result does not hold it).
func (x *Index) File(path string) *speciesfile.File { return x.r.Files[path] }

// files returns the paths of the files of the index, sorted.
func (x *Index) files() []string {
	out := make([]string, 0, len(x.r.Files))
	for p := range x.r.Files {
		out = append(out, p)
	}
	sort.Strings(out)
	return out
}

// Occurrences returns the occurrences of a file in offset order (built on
// each call: linear in the size of the file).
func (x *Index) Occurrences(path string) []Occurrence {
	f := x.File(path)
	if f == nil {
		return nil
	}
	var out []Occurrence
	for i := range f.Stmts {
		out = x.stmtOccurrences(out, path, f, i)
	}
	return out
}

// OccurrencesIn returns the occurrences of the statements of a file whose
// extent meets [start, end], in offset order.
func (x *Index) OccurrencesIn(path string, start, end int) []Occurrence {
	f := x.File(path)
	if f == nil {
		return nil
	}
	st := f.Stmts
	i := sort.Search(len(st), func(i int) bool { return f.Starts[i]+st[i].Len() >= start })
	var out []Occurrence
	for ; i < len(st) && f.Starts[i] <= end; i++ {
		out = x.stmtOccurrences(out, path, f, i)
	}
	return out
}

// At returns the innermost occurrence whose span holds off (the end offset
// of a token counts as inside it, so a cursor just after a name finds it).
func (x *Index) At(path string, off int) (Occurrence, bool) {
	f := x.File(path)
	if f == nil {
		return Occurrence{}, false
	}
	st := f.Stmts
	// The statement whose extent holds off, and the one before it (a token
	// may end exactly where the next statement's extent begins).
	k := sort.Search(len(st), func(i int) bool { return f.Starts[i] > off }) - 1
	var buf [16]Occurrence
	for _, j := range [2]int{k, k - 1} {
		if j < 0 || j >= len(st) {
			continue
		}
		occ := x.stmtOccurrences(buf[:0], path, f, j)
		i := sort.Search(len(occ), func(i int) bool { return occ[i].Span.Start > off }) - 1
		for ; i >= 0; i-- {
			o := occ[i]
			if off >= o.Span.Start && (off < o.Span.End || (!o.Kind.statement() && off == o.Span.End)) {
				// Prefer the innermost: a token after its statement in order.
				return o, true
			}
		}
	}
	return Occurrence{}, false
}

// use is a species name token inside a reaction.
type use = speciesfile.Token

// reactionUses lists the species names a reaction uses: terms (not the third
// body M), efficiency names and a specific falloff collider "(+AR)"; spans
// relative to the statement.
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
			st := r.Falloff.Span.From + 2
			out = append(out, speciesfile.Token{Span: speciesfile.RelSpan{From: st, To: st + len(c)}, Text: c})
		}
	}
	for _, e := range r.Efficiencies {
		out = append(out, e.Name)
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Span.From < out[j].Span.From })
	return out
}

// equationText returns the equation as written (r starts at start).
func equationText(f *speciesfile.File, r *speciesfile.Reaction, start int) string {
	e := r.Equation.At(start)
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
