package analysis

import (
	"bytes"
	"fmt"

	"kiln.dev/kiln/speciesfile"
)

// Incremental analysis.
//
// An analysis is a staged pipeline: parse → includes → groups → species →
// reactions → cross-statement checks (duplicate names, structures and
// reactions). The costly stages are made of small units, one per statement:
//
//   - a species unit holds a species' structure, estimate, given thermo and
//     the checks of its own statement (bad-smiles, missing-group,
//     missing-thermo, thermo-mismatch, nonphysical-thermo, …);
//   - a reaction unit holds a reaction's balance, thermochemistry and rate
//     checks;
//   - a reaction text unit holds what follows from a reaction's text alone
//     (its duplicate-detection key and equation text).
//
// A unit is a pure function of what it reads, so it is keyed by exactly
// that: the statement's text (its body, from the keyword to the end of its
// last line), the file's energy unit, the settings and user-defined groups
// (one table per setting and group set), and, for reactions, the species
// units of the species it names. Diagnostics and spans inside a unit are
// stored relative to the start of the statement, so that a unit moved by an
// edit elsewhere is reused as is: an edit to one SMILES recomputes one
// species unit and the reaction units that name that species; an edit in a
// comment between statements recomputes no unit at all, only positions
// (parsing, the cross-statement checks and the assembly of the result are
// redone on every analysis; they are linear and cheap).
//
// Each analysis reads the table left by the previous finished analysis of
// the same file and builds a new one holding only the units it used, which
// replaces the old table when it completes. Tables are never modified after
// they are published, so concurrent analyses share them without locks, and
// units of deleted statements are dropped. The result is the same as an
// analysis from scratch (tested on random edit sequences).

// memoTables are the units of one finished analysis, per file in scope.
type memoTables struct {
	key   string // settings and user groups the units were computed with
	files map[string]*fileMemo
}

// fileMemo holds the units of one file's statements, aligned with the
// file's species and reaction lists (nil where none was made), and the
// Species and Reaction values made from them. A value is reused as it is by
// the next analysis when its statement is the same syntax node (the reader
// kept it: the same text, moved by an edit elsewhere or not — values hold
// no positions) and its unit is kept; values are never modified once their
// analysis is finished.
type fileMemo struct {
	file    *speciesfile.File
	species []*speciesUnit
	rtext   []*reactionText
	rx      []*reactionUnit
	sps     []*Species  // by f.Species index; nil for repeated names
	rxs     []*Reaction // by f.Reactions index (the analysed file only)
}

// memo is the memoization state of one analysis: the tables it reads (old,
// possibly nil) and the tables it builds (next). Statements are matched
// with the old file's by alignment: the unchanged statements before and
// after the edited region are matched in order by comparing their text
// (no hashing), and the statements of the edited region by a map of the old
// region's texts.
type memo struct {
	old, next *memoTables
	align     map[string]*alignment
	changed   map[string]bool // names of the species whose unit was recomputed
	// changedList holds the names of changed when they are few (a typical
	// edit): comparing a name with one or two others is cheaper than
	// hashing it, and every term of every reaction is looked up.
	changedList []string
	namesKept   bool // the same species names are declared as in the last analysis (sameNames)
	// the alignment asked for last (file is called once per statement)
	lastPath string
	lastAl   *alignment
}

// alignment maps a file's statements to those of its last analysis.
type alignment struct {
	old                *fileMemo // nil: nothing to reuse
	species, reactions []int32   // index in the old lists, -1 for none
	// sameSpecies: every species statement matches a different old one of
	// the same text and none is left over (so the names declared are the
	// same).
	sameSpecies bool
}

// memoKey identifies the inputs shared by every unit of an analysis.
func memoKey(s Settings, userKey string) string {
	return fmt.Sprintf("%#v|%s", s, userKey)
}

// SetIncremental turns on keeping per-statement results between analyses of
// a file (see the package's incremental analysis notes). The language server
// turns it on; a one-shot run (`kiln check`) has nothing to reuse and leaves
// it off. Results are the same either way.
func (w *Workspace) SetIncremental(on bool) {
	w.mu.Lock()
	defer w.mu.Unlock()
	w.incremental = on
	if !on {
		w.memos, w.parses, w.results = nil, nil, nil
	}
}

// parse returns the syntax tree of text, the file at path. An incremental
// workspace reads only the statements that changed since the latest parse
// of the file (speciesfile.Reparse: the same tree as a parse from scratch)
// and keeps the result for the next parse.
func (w *Workspace) parse(path string, text []byte) *speciesfile.File {
	w.mu.Lock()
	on, old := w.incremental, w.parses[path]
	w.mu.Unlock()
	if !on {
		return speciesfile.Parse(path, text)
	}
	var f *speciesfile.File
	switch {
	case old == nil:
		f = speciesfile.Parse(path, text)
	case bytes.Equal(old.Src, text):
		// the same tree, but File.Src is the text given (callers compare
		// the slice to tell which text a result is of)
		same := *old
		same.Src = text
		f = &same
	default:
		f = speciesfile.Reparse(old, text, speciesfile.DiffEdit(old.Src, text))
	}
	w.mu.Lock()
	defer w.mu.Unlock()
	if w.incremental {
		if w.parses == nil {
			w.parses = map[string]*speciesfile.File{}
		}
		w.parses[path] = f
	}
	return f
}

// startMemo returns the memo state for an analysis of path with the given
// settings and user groups (and whatever else every unit reads, such as the
// display units, in userKey); nil when the workspace is not incremental.
func (w *Workspace) startMemo(path string, s Settings, userKey string) *memo {
	w.mu.Lock()
	defer w.mu.Unlock()
	if !w.incremental {
		return nil
	}
	key := memoKey(s, userKey)
	m := &memo{next: &memoTables{key: key, files: map[string]*fileMemo{}}, align: map[string]*alignment{}}
	if old := w.memos[path]; old != nil && old.key == key {
		m.old = old
	}
	return m
}

// finishMemo publishes the tables of a completed analysis of path and its
// result.
func (w *Workspace) finishMemo(path string, m *memo, res *Result) {
	if m == nil {
		return
	}
	w.mu.Lock()
	defer w.mu.Unlock()
	if !w.incremental {
		return
	}
	if w.memos == nil {
		w.memos = map[string]*memoTables{}
	}
	w.memos[path] = m.next
	if w.results == nil {
		w.results = map[string]*Result{}
	}
	w.results[path] = res
}

// ForgetFile drops the units kept for analyses of path (a closed document).
func (w *Workspace) ForgetFile(path string) {
	w.mu.Lock()
	defer w.mu.Unlock()
	delete(w.memos, path)
	delete(w.parses, path)
	delete(w.results, path)
}

// file returns the alignment of file f (at path) with its last analysis,
// creating its next tables on first use.
func (m *memo) file(path string, f *speciesfile.File) *alignment {
	if m.lastAl != nil && m.lastPath == path {
		return m.lastAl
	}
	if al := m.align[path]; al != nil {
		m.lastPath, m.lastAl = path, al
		return al
	}
	m.next.files[path] = &fileMemo{
		file:    f,
		species: make([]*speciesUnit, len(f.Species)),
		rtext:   make([]*reactionText, len(f.Reactions)),
		rx:      make([]*reactionUnit, len(f.Reactions)),
		sps:     make([]*Species, len(f.Species)),
		rxs:     make([]*Reaction, len(f.Reactions)),
	}
	al := &alignment{}
	if m.old != nil {
		if old := m.old.files[path]; old != nil && old.file.EnergyUnit == f.EnergyUnit {
			of := old.file
			al.old = old
			al.species = alignLists(of, f, of.Species, f.Species, of.SpeciesStart, f.SpeciesStart)
			al.sameSpecies = bijective(al.species, len(of.Species))
			al.reactions = alignLists(of, f, of.Reactions, f.Reactions, of.ReactionStart, f.ReactionStart)
		}
	}
	m.align[path] = al
	m.lastPath, m.lastAl = path, al
	return al
}

// alignLists matches the statements of news (of file nf) with those of olds
// (of file of) that have the same text: it returns, per new statement, the
// index of an old one or -1. ostart and nstart give where each statement
// starts. A statement the reader kept (the same node, moved or not) has
// the same text without comparing it.
func alignLists[T comparable](of, nf *speciesfile.File, olds, news []T, ostart, nstart func(int) int) []int32 {
	out := make([]int32, len(news))
	for i := range out {
		out[i] = -1
	}
	text := func(f *speciesfile.File, st T, start int) []byte {
		return bodyText(f, any(st).(speciesfile.Stmt), start)
	}
	same := func(i, j int) bool {
		return olds[i] == news[j] || bytes.Equal(text(of, olds[i], ostart(i)), text(nf, news[j], nstart(j)))
	}
	p := 0
	for p < len(olds) && p < len(news) && same(p, p) {
		out[p] = int32(p)
		p++
	}
	q := 0
	for q < len(olds)-p && q < len(news)-p && same(len(olds)-1-q, len(news)-1-q) {
		out[len(news)-1-q] = int32(len(olds) - 1 - q)
		q++
	}
	if len(olds)-p-q == 0 || len(news)-p-q == 0 {
		return out
	}
	region := make(map[string]int32, len(olds)-p-q)
	for i := p; i < len(olds)-q; i++ {
		region[string(text(of, olds[i], ostart(i)))] = int32(i)
	}
	for j := p; j < len(news)-q; j++ {
		if i, ok := region[string(text(nf, news[j], nstart(j)))]; ok {
			out[j] = i
		}
	}
	return out
}

// bijective reports whether match (an alignment with n old statements)
// pairs every new statement with a different old one and leaves none over.
func bijective(match []int32, n int) bool {
	if len(match) != n {
		return false
	}
	used := make([]bool, n)
	for _, i := range match {
		if i < 0 || used[i] {
			return false
		}
		used[i] = true
	}
	return true
}

// sameNames reports whether the analysis declares the same species names
// as the last one: every file in scope (order) that declares species is
// aligned one to one with that file's species in the last analysis, and
// the last analysis had no other file declaring species. (Aligned
// statements have the same text, so the same names.) Called after the
// species pass, which aligned every file declaring species.
func (m *memo) sameNames(order []string, files map[string]*speciesfile.File) bool {
	if m == nil || m.old == nil {
		return false
	}
	n := 0
	for _, path := range order {
		f := files[path]
		if len(f.Species) == 0 {
			continue
		}
		n++
		al := m.align[path]
		if al == nil || al.old == nil || !al.sameSpecies {
			return false
		}
	}
	for _, fm := range m.old.files {
		if len(fm.file.Species) > 0 {
			n--
		}
	}
	return n == 0
}

// bodyText returns the text of the body of statement st, which starts at
// start (shared with the source).
func bodyText(f *speciesfile.File, st speciesfile.Stmt, start int) []byte {
	b := st.Body().At(start)
	if b.Start < 0 || b.End > len(f.Src) || b.Start > b.End {
		return nil
	}
	return f.Src[b.Start:b.End]
}

// shift returns sp moved by delta bytes.
func shift(sp speciesfile.Span, delta int) speciesfile.Span {
	return speciesfile.Span{Start: sp.Start + delta, End: sp.End + delta}
}

// inStmt returns r, a span of a statement, as a diagnostic span relative
// to the statement (appendRelocated moves it to the statement's place).
func inStmt(r speciesfile.RelSpan) speciesfile.Span { return r.At(0) }

// pinned reports whether a diagnostic of ds (spans relative to the
// statement's body) lies outside the body [0, n]: such a unit cannot be
// moved and is reused only in place.
func pinned(ds []speciesfile.Diagnostic, n int) bool {
	start, end := 0, n
	for _, d := range ds {
		if d.Span.Start < start || d.Span.End > end {
			return true
		}
		for _, r := range d.Related {
			if r.Span.Start < start || r.Span.End > end {
				return true
			}
		}
	}
	return false
}

// appendRelocated appends ds to dst with spans (and related spans in file)
// moved by delta bytes.
func appendRelocated(dst, ds []speciesfile.Diagnostic, file string, delta int) []speciesfile.Diagnostic {
	for _, d := range ds {
		d.Span = shift(d.Span, delta)
		if len(d.Related) > 0 {
			rel := make([]speciesfile.Related, len(d.Related))
			for k, r := range d.Related {
				if r.File == file {
					r.Span = shift(r.Span, delta)
				}
				rel[k] = r
			}
			d.Related = rel
		}
		dst = append(dst, d)
	}
	return dst
}

// relocate returns copies of ds with spans (and related spans in file) moved
// by delta bytes.
func relocate(ds []speciesfile.Diagnostic, file string, delta int) []speciesfile.Diagnostic {
	if len(ds) == 0 {
		return nil
	}
	return appendRelocated(make([]speciesfile.Diagnostic, 0, len(ds)), ds, file, delta)
}

// speciesUnit is the result of the per-statement rules of one species
// declaration: everything in Species but its name, location and syntax
// node, and its diagnostics with spans relative to the start of the
// statement's body (a statement's leading comment lines may change while
// the unit is kept).
type speciesUnit struct {
	energyUnit string // the file's energy unit the statement was read with
	pinned     int    // body start the unit is bound to, -1 when it can move
	tmpl       Species
	diags      []speciesfile.Diagnostic
}

// newSpeciesUnit makes the unit of sp, a declaration whose body starts at
// bodyStart and whose rules reported diags (spans relative to the body).
func newSpeciesUnit(energyUnit string, sp *Species, diags []speciesfile.Diagnostic, bodyStart int) *speciesUnit {
	u := &speciesUnit{energyUnit: energyUnit, pinned: -1, tmpl: *sp, diags: diags}
	if pinned(diags, sp.Decl.Body().Len()) {
		u.pinned = bodyStart
	}
	u.tmpl.Name, u.tmpl.File, u.tmpl.Decl, u.tmpl.unit = "", "", nil, nil
	if g := sp.Given; g != nil {
		// kept relative to the body: the unit may stand for the same text
		// after other leading comment lines
		c := *g
		c.Span = moveRel(c.Span, -sp.Decl.Body().From)
		u.tmpl.Given = &c
	}
	return u
}

// moveRel returns r moved by d bytes.
func moveRel(r speciesfile.RelSpan, d int) speciesfile.RelSpan {
	return speciesfile.RelSpan{From: r.From + d, To: r.To + d}
}

// fits reports whether u can stand for a declaration of file f whose body
// starts at bodyStart.
func (u *speciesUnit) fits(f *speciesfile.File, bodyStart int) bool {
	return u != nil && u.energyUnit == f.EnergyUnit && (u.pinned < 0 || u.pinned == bodyStart)
}

// apply fills sp (whose Name, File and Decl are set) from the unit; keep
// records the unit in sp (incremental analyses compare units).
func (u *speciesUnit) apply(sp *Species, keep bool) {
	name, file, decl := sp.Name, sp.File, sp.Decl
	*sp = u.tmpl
	sp.Name, sp.File, sp.Decl = name, file, decl
	if keep {
		sp.unit = u
	}
	if g := u.tmpl.Given; g != nil {
		c := *g
		c.Span = moveRel(c.Span, decl.Body().From)
		sp.Given = &c
	}
}

// species returns the unit of species declaration k of file f (at path)
// kept from the last analysis, or nil. The returned unit is recorded for
// the next analysis.
func (m *memo) species(path string, f *speciesfile.File, k int) *speciesUnit {
	if m == nil {
		return nil
	}
	al := m.file(path, f)
	if al.old == nil || al.species[k] < 0 {
		return nil
	}
	u := al.old.species[al.species[k]]
	if !u.fits(f, f.SpeciesStart(k)+f.Species[k].Body().From) {
		return nil
	}
	m.next.files[path].species[k] = u
	return u
}

// keepSpecies records the unit of species declaration k of the file at
// path and the Species made from it.
func (m *memo) keepSpecies(path string, k int, u *speciesUnit, sp *Species) {
	if m != nil {
		m.next.files[path].species[k] = u
		m.next.files[path].sps[k] = sp
	}
}

// oldSpecies returns the Species the last analysis made from unit u for
// declaration k of file f (at path), when the declaration is the same
// syntax node, moved by an edit elsewhere or not (a Species holds no
// position); nil otherwise.
func (m *memo) oldSpecies(path string, f *speciesfile.File, k int, u *speciesUnit) *Species {
	if m == nil || u == nil {
		return nil
	}
	al := m.file(path, f)
	if al.old == nil || al.species[k] < 0 {
		return nil
	}
	o := al.old.sps[al.species[k]]
	if o == nil || o.Decl != f.Species[k] || o.unit != u || o.File != path {
		return nil
	}
	return o
}

// oldReaction returns the Reaction the last analysis made for reaction k of
// file f (at path), when the statement is the same syntax node (moved or
// not), fully resolved then and now (every name it uses is declared), and
// was made from a unit (computeReactions checks that the unit still holds).
func (m *memo) oldReaction(a *analysis, path string, f *speciesfile.File, k int, equation string) *Reaction {
	if m == nil {
		return nil
	}
	al := m.file(path, f)
	if al.old == nil || al.reactions[k] < 0 {
		return nil
	}
	d := f.Reactions[k]
	o := al.old.rxs[al.reactions[k]]
	if o == nil || o.Decl != d || !o.Resolved || o.unit == nil || o.Equation != equation || o.File != path {
		return nil
	}
	if !m.namesKept || !o.declared {
		// (With the same names declared as when o was made with every
		// name it uses declared, they still are.)
		for _, ts := range [2][]speciesfile.Term{d.Reactants, d.Products} {
			for _, t := range ts {
				if _, ok := a.res.ByName[t.Name.Text]; !ok {
					return nil
				}
			}
		}
		for _, e := range d.Efficiencies {
			if _, ok := a.res.ByName[e.Name.Text]; !ok {
				return nil
			}
		}
		if c := falloffCollider(d); c != nil {
			if _, ok := a.res.ByName[c.Text]; !ok {
				return nil
			}
		}
	}
	if f.ErrorIn(d.Body().At(f.ReactionStart(k))) {
		return nil
	}
	return o
}

// reactionText is what follows from a reaction statement's text alone.
type reactionText struct {
	dupKey   string // reactionKey
	dupHash  uint64 // hashKey(dupKey)
	equation string // equationText
}

func newReactionText(f *speciesfile.File, d *speciesfile.Reaction, start int) *reactionText {
	key := reactionKey(d)
	return &reactionText{dupKey: key, dupHash: hashKey(key), equation: equationText(f, d, start)}
}

// reactionText returns the text unit of reaction k of file f (at path),
// computing it when it is not kept.
func (m *memo) reactionText(path string, f *speciesfile.File, k int) *reactionText {
	d := f.Reactions[k]
	if m == nil {
		return newReactionText(f, d, f.ReactionStart(k))
	}
	al := m.file(path, f)
	var u *reactionText
	if al.old != nil && al.reactions[k] >= 0 {
		u = al.old.rtext[al.reactions[k]]
	}
	if u == nil {
		u = newReactionText(f, d, f.ReactionStart(k))
	}
	m.next.files[path].rtext[k] = u
	return u
}

// reactionUnit is the balance, thermochemistry and rate checks of one
// reaction, computed from its statement and the species units of its
// reactants and products.
type reactionUnit struct {
	energyUnit string
	pinned     int            // as in speciesUnit
	deps       []*speciesUnit // species units of the reactants, then the products
	tmpl       Reaction       // computed fields only
	diags      []speciesfile.Diagnostic
}

// reactionDeps returns the species units a reaction's checks read, in term
// order (reactants, then products).
func (a *analysis) reactionDeps(d *speciesfile.Reaction) []*speciesUnit {
	out := make([]*speciesUnit, 0, len(d.Reactants)+len(d.Products))
	for _, ts := range [2][]speciesfile.Term{d.Reactants, d.Products} {
		for _, t := range ts {
			out = append(out, a.res.ByName[t.Name.Text].unit)
		}
	}
	return out
}

// depsMatch reports whether the species units named by d are deps (only
// called in incremental analyses, where species keep their units).
func (a *analysis) depsMatch(d *speciesfile.Reaction, deps []*speciesUnit) bool {
	if len(deps) != len(d.Reactants)+len(d.Products) {
		return false
	}
	i := 0
	for _, ts := range [2][]speciesfile.Term{d.Reactants, d.Products} {
		for _, t := range ts {
			sp := a.res.ByName[t.Name.Text]
			if sp == nil || sp.unit == nil || sp.unit != deps[i] {
				return false
			}
			i++
		}
	}
	return true
}

// depsValid reports whether a kept reaction unit with deps still reads the
// species units named by d: certainly when d names no species whose unit
// was recomputed, else when every name's unit is still its dependency.
func (m *memo) depsValid(a *analysis, d *speciesfile.Reaction, deps []*speciesUnit) bool {
	if len(deps) != len(d.Reactants)+len(d.Products) {
		return false
	}
	if len(m.changed) > 0 {
		for _, ts := range [2][]speciesfile.Term{d.Reactants, d.Products} {
			for _, t := range ts {
				if m.isChanged(t.Name.Text) {
					return a.depsMatch(d, deps)
				}
			}
		}
	}
	return true
}

// isChanged reports whether the unit of species name was recomputed.
func (m *memo) isChanged(name string) bool {
	if m.changedList != nil {
		for _, c := range m.changedList {
			if c == name {
				return true
			}
		}
		return false
	}
	return m.changed[name]
}

// maxChangedList bounds memo.changedList.
const maxChangedList = 8

// reaction returns the kept unit of resolved reaction k of file f (at
// path), or nil.
func (m *memo) reaction(a *analysis, path string, f *speciesfile.File, k int) *reactionUnit {
	if m == nil {
		return nil
	}
	al := m.file(path, f)
	if al.old == nil || al.reactions[k] < 0 {
		return nil
	}
	d := f.Reactions[k]
	u := al.old.rx[al.reactions[k]]
	if u == nil || u.energyUnit != f.EnergyUnit || (u.pinned >= 0 && u.pinned != f.ReactionStart(k)+d.Body().From) || !m.depsValid(a, d, u.deps) {
		return nil
	}
	m.next.files[path].rx[k] = u
	return u
}

// newReactionUnit makes the unit of r, a reaction starting at start whose
// rules reported r.diags (spans relative to the statement); the unit keeps
// them relative to the statement's body.
func newReactionUnit(energyUnit string, deps []*speciesUnit, r *Reaction, start int) *reactionUnit {
	body := r.Decl.Body()
	diags := relocate(r.diags, r.File, -body.From)
	u := &reactionUnit{energyUnit: energyUnit, pinned: -1, deps: deps, diags: diags, tmpl: *r}
	if pinned(diags, body.Len()) {
		u.pinned = start + body.From
	}
	u.tmpl.Decl, u.tmpl.File, u.tmpl.Equation, u.tmpl.diags = nil, "", "", nil
	if r.model != nil && r.model.kc != nil {
		// The model's Kc is bound to r, which holds its syntax node (and
		// through it the whole parse of its file): bind it to a reaction
		// holding only the thermochemistry Kc reads, so that a kept unit
		// keeps no old parse alive.
		m := *r.model
		m.kc = (&Reaction{reactants: r.reactants, products: r.products}).Kc
		u.tmpl.model = &m
	}
	return u
}

// apply copies the unit's computed fields into r (everything but what r
// was made with: its statement, file, line, equation and resolution) and
// records the unit in r.
func (u *reactionUnit) apply(r *Reaction) {
	decl, file, eq, resolved, declared := r.Decl, r.File, r.Equation, r.Resolved, r.declared
	*r = u.tmpl
	r.Decl, r.File, r.Equation, r.Resolved, r.declared = decl, file, eq, resolved, declared
	r.unit = u
}

// keepReaction records the unit of reaction k of the file at path and the
// Reaction made from it.
func (m *memo) keepReaction(path string, k int, u *reactionUnit, r *Reaction) {
	if m != nil {
		m.next.files[path].rx[k] = u
		m.next.files[path].rxs[k] = r
	}
}

// SameUnit reports whether sp and prev (a species of an earlier analysis by
// the same incremental workspace) were made from the same unit: the same
// declaration text read with the same settings, so the same results.
func (sp *Species) SameUnit(prev *Species) bool {
	return prev != nil && sp.unit != nil && sp.unit == prev.unit
}
