package analysis

import (
	"bytes"
	"context"
	"maps"
	"path/filepath"
	"reflect"
	"slices"
	"strconv"
	"strings"

	"kiln.dev/kiln/speciesfile"
)

// Edits that move positions only.
//
// An edit that touches only blank and comment lines between statements (a
// comment typed, changed or deleted, a blank line added) leaves every
// statement's body text as it was. Every unit then stands as it is, and so
// does every cross-statement check: the analysis of the new text is the
// last one with the positions after the edit moved by the edit's length
// change. An incremental workspace recognises such an edit against the
// last finished analysis of the file and makes the new result that way
// (movedResult) instead of running the passes: no unit is looked up, no
// name, structure or duplicate map is built, no diagnostic is assembled
// from units.
//
// The shortcut is taken only where that is certainly the analysis from
// scratch; otherwise the full (incremental) analysis runs:
//
//   - the same settings, and the files the file includes (read again)
//     have the texts read then; every include that named a file then named
//     one that could be read (includesSame);
//   - the reader reports the same problems at the same places (moved) in
//     both texts: errors decide which statements are data; its messages,
//     which may name lines, are taken from the new parse;
//   - the same statements in the same order: each one the same syntax node
//     (the reader kept it) or a node of the same kind and body text (the
//     reader read it again because the edit touched its leading comment
//     lines; broken statements excepted), and the same energy unit, newline
//     and byte order mark;
//   - the edited bytes lie outside every statement body and every
//     diagnostic span (a span ending where the edit starts stays, one
//     starting where it ends moves; an empty span at either end is
//     ambiguous and stops the shortcut);
//   - a message naming a line of the file (repeated names, structures and
//     reactions, range checks: reportNamingLine) is renumbered; one naming
//     a line of another file stops the shortcut when lines move
//     (Result.namesLines).

// lineName records a diagnostic of the analysed file whose message names
// the line of offset at as "line N": the number is Message[num:numEnd].
type lineName struct {
	start       int    // the diagnostic's Span.Start
	code, msg   string // its code and message
	at          int
	num, numEnd int
}

// reportNamingLine reports d (see report), whose message names the line of
// loc, written as where (as a.where writes it), and records where the line
// number is so that an edit that moves lines can renumber it.
func (a *analysis) reportNamingLine(file string, d speciesfile.Diagnostic, loc Location, where string) {
	a.report(file, d)
	if file != a.res.Path || a.sink != nil {
		return
	}
	k := strings.Index(d.Message, where)
	if loc.File != a.res.Path || !strings.HasPrefix(where, "line ") || k < 0 {
		a.res.namesLines = true
		return
	}
	a.res.lineNames = append(a.res.lineNames, lineName{start: d.Span.Start, code: d.Code, msg: d.Message, at: loc.Span.Start,
		num: k + len("line "), numEnd: k + len(where)})
}

// Quick returns the analysis of path when its current text differs from the
// text of its last finished analysis (in an incremental workspace) only by
// an edit that moves positions (see above), made without running the
// passes; nil when the edit needs a full analysis (Analyze) or ctx is done.
// The result is the one Analyze returns. The language server calls it
// before waiting for more typing: such an analysis costs little.
func (w *Workspace) Quick(ctx context.Context, path string) *Result {
	path = filepath.Clean(path)
	w.mu.Lock()
	on := w.incremental && w.results[path] != nil
	w.mu.Unlock()
	if !on || ctx.Err() != nil {
		return nil
	}
	text, err := w.read(path)
	if err != nil {
		return nil
	}
	f := w.parse(path, text) // kept: the analysis after the debounce reuses it
	if ctx.Err() != nil {
		return nil
	}
	return w.movedResult(path, f, w.Settings())
}

// movedResult returns the analysis of f (the new parse of the file at
// path, analysed with settings set) made from the last finished analysis
// of path by moving positions, or nil when the shortcut does not apply. The
// result and its tables replace the last ones when no other analysis
// finished meanwhile.
func (w *Workspace) movedResult(path string, f *speciesfile.File, set Settings) *Result {
	w.mu.Lock()
	r0, t0 := w.results[path], w.memos[path]
	w.mu.Unlock()
	if r0 == nil || t0 == nil || r0.Settings != set {
		return nil
	}
	f0 := r0.File
	fm := t0.files[path]
	if fm == nil || fm.file != f0 || f0 == nil || len(f.Diags) != len(f0.Diags) ||
		len(f.Stmts) != len(f0.Stmts) || len(f.Includes) != len(f0.Includes) ||
		f.EnergyUnit != f0.EnergyUnit || f.EntropyUnit != f0.EntropyUnit || f.Newline != f0.Newline || f.BOM != f0.BOM ||
		len(f.Species) != len(f0.Species) || len(f.Reactions) != len(f0.Reactions) || len(f.Groups) != len(f0.Groups) {
		return nil
	}
	e := speciesfile.DiffEdit(f0.Src, f.Src)
	delta := e.Delta()
	newEnd := e.Old.Start + e.NewLen
	// The statements: the same nodes, or re-read ones of the same body.
	if len(r0.Reactions) != len(f0.Reactions) {
		return nil // (one value per reaction statement)
	}
	// re-read nodes, old → new, and the reactions' by index
	var spNew map[*speciesfile.Species]*speciesfile.Species
	var spIdx []int                                  // indexes in f.Species of re-read species
	var rxIdx []int                                  // indexes in f.Reactions of re-read reactions
	var reread map[speciesfile.Stmt]speciesfile.Stmt // re-read include and group statements, old → new
	nsp, nrx := 0, 0
	for i, st := range f.Stmts {
		o := f0.Stmts[i]
		switch st.(type) {
		case *speciesfile.Species:
			nsp++
		case *speciesfile.Reaction:
			nrx++
		}
		if st == o {
			continue
		}
		if !sameQuickKind(st, o) {
			return nil
		}
		ob, nb := o.Body().At(f0.Starts[i]), st.Body().At(f.Starts[i])
		if !bytes.Equal(bodyText(f0, o, f0.Starts[i]), bodyText(f, st, f.Starts[i])) ||
			(e.Old.End > ob.Start && e.Old.Start < ob.End) || (newEnd > nb.Start && e.Old.Start < nb.End) {
			return nil
		}
		switch d := st.(type) {
		case *speciesfile.Species:
			if spNew == nil {
				spNew = map[*speciesfile.Species]*speciesfile.Species{}
			}
			spNew[o.(*speciesfile.Species)] = d
			spIdx = append(spIdx, nsp-1)
		case *speciesfile.Reaction:
			rxIdx = append(rxIdx, nrx-1)
		case *speciesfile.Include, *speciesfile.Group:
			if reread == nil {
				reread = map[speciesfile.Stmt]speciesfile.Stmt{}
			}
			reread[o] = st
		}
	}
	// Lines after the edit move when it adds or removes line breaks.
	linesMoved := f.Lines.LineCount() != f0.Lines.LineCount() ||
		f.Lines.Line(e.Old.End+delta) != f0.Lines.Line(e.Old.End)
	if linesMoved && r0.namesLines {
		return nil
	}
	// Included files are compared only now, when the edit has proved to
	// move positions only: reading them (from disk when not open) for
	// every keystroke in a statement would cost more than it saves.
	if (len(r0.Files) > 1 || len(f0.Includes) > 0) && !w.includesSame(r0, path) {
		return nil
	}
	// where a span of the old text goes: kept, moved by delta, or unknown
	place := func(s speciesfile.Span) (speciesfile.Span, bool) {
		switch {
		case s.Start > s.End:
			return s, false
		case s.Start == s.End && s.Start < e.Old.Start, s.Start < s.End && s.End <= e.Old.Start:
			return s, true
		case s.Start == s.End && s.Start > e.Old.End, s.Start < s.End && s.Start >= e.Old.End:
			return shift(s, delta), true
		}
		return s, false
	}
	// The reader's diagnostics are those of the new parse; they must say
	// the same of the same places (which statements hold errors).
	for k, d := range f0.Diags {
		sp, ok := place(d.Span)
		if n := f.Diags[k]; !ok || sp != n.Span || d.Severity != n.Severity || d.Code != n.Code {
			return nil
		}
	}
	// The analysis's own diagnostics: r0's without the reader's, which
	// came first before the (stable) sort, so they lead their group of
	// equal (offset, code) and come in the order of a stable sort of their
	// own.
	var pd []speciesfile.Diagnostic
	if len(f0.Diags) > 0 {
		pd = slices.Clone(f0.Diags)
		sortDiagnostics(pd)
	}
	ds := make([]speciesfile.Diagnostic, len(f.Diags), len(r0.Diagnostics))
	copy(ds, f.Diags)
	// messages naming lines, by the diagnostic's offset
	var named map[int][]int
	var lineNames []lineName
	if len(r0.lineNames) > 0 {
		named = make(map[int][]int, len(r0.lineNames))
		for k, ln := range r0.lineNames {
			named[ln.start] = append(named[ln.start], k)
		}
		lineNames = make([]lineName, 0, len(r0.lineNames))
	}
	j := 0
	for _, d := range r0.Diagnostics {
		if j < len(pd) && pd[j].Span.Start == d.Span.Start && pd[j].Code == d.Code {
			j++
			continue
		}
		sp, ok := place(d.Span)
		if !ok {
			return nil
		}
		if ks := named[d.Span.Start]; len(ks) > 0 {
			for x, k := range ks {
				ln := r0.lineNames[k]
				if ln.code != d.Code || ln.msg != d.Message {
					continue
				}
				at, ok := place(speciesfile.Span{Start: ln.at, End: ln.at + 1})
				if !ok {
					return nil
				}
				num := strconv.Itoa(f.Lines.Line(at.Start) + 1)
				ln.msg = ln.msg[:ln.num] + num + ln.msg[ln.numEnd:]
				ln.numEnd = ln.num + len(num)
				ln.start, ln.at = sp.Start, at.Start
				d.Message = ln.msg
				lineNames = append(lineNames, ln)
				named[d.Span.Start] = append(ks[:x:x], ks[x+1:]...)
				break
			}
		}
		d.Span = sp
		if len(d.Related) > 0 {
			var rel []speciesfile.Related
			for j, r := range d.Related {
				if r.File != path {
					continue // another file, read again unchanged
				}
				sp, ok := place(r.Span)
				if !ok {
					return nil
				}
				if sp != r.Span {
					if rel == nil {
						rel = slices.Clone(d.Related)
					}
					rel[j].Span = sp
				}
			}
			if rel != nil {
				d.Related = rel
			}
		}
		ds = append(ds, d)
	}
	if j != len(pd) || len(ds) != len(r0.Diagnostics) || len(lineNames) != len(r0.lineNames) {
		return nil
	}
	if len(f.Diags) > 0 {
		sortDiagnostics(ds)
	}
	groups := r0.Groups
	if (delta != 0 || len(reread) > 0) && len(groups) > 0 {
		groups = make([]*Group, len(r0.Groups))
		for k, g := range r0.Groups {
			if g.Loc.File != path {
				groups[k] = g
				continue
			}
			sp, ok := place(g.Loc.Span)
			if !ok {
				return nil
			}
			c := *g
			c.Loc.Span = sp
			if d, ok := reread[g.Decl]; ok {
				c.Decl = d.(*speciesfile.Group)
			}
			groups[k] = &c
		}
	}
	res := &Result{
		Path:        path,
		Settings:    set,
		File:        f,
		Files:       maps.Clone(r0.Files),
		Diagnostics: ds,
		Species:     r0.Species,
		ByName:      r0.ByName,
		Reactions:   r0.Reactions,
		Groups:      groups,
		Includes:    r0.Includes,
		order:       r0.order,
		namesLines:  r0.namesLines,
		lineNames:   lineNames,
	}
	res.Files[path] = f
	if len(reread) > 0 && len(r0.Includes) > 0 {
		res.Includes = slices.Clone(r0.Includes)
		for k, ri := range res.Includes {
			if d, ok := reread[ri.Decl]; ok {
				res.Includes[k].Decl = d.(*speciesfile.Include)
			}
		}
	}
	next := &fileMemo{file: f, species: fm.species, rtext: fm.rtext, rx: fm.rx, sps: fm.sps, rxs: fm.rxs}
	// Values of re-read statements are remade for the new nodes (a value
	// names its syntax node); everything else is shared. (One pass each:
	// an edit in a file's first bytes reads the whole file again.)
	if len(spNew) > 0 {
		res.Species = slices.Clone(r0.Species)
		res.ByName = maps.Clone(r0.ByName)
		made := make(map[*Species]*Species, len(spNew))
		for j, old := range res.Species {
			d, ok := spNew[old.Decl]
			if !ok {
				continue
			}
			sp := *old
			sp.Decl = d
			if g := old.Given; g != nil {
				c := *g
				c.Span = moveRel(g.Span, d.Body().From-old.Decl.Body().From)
				sp.Given = &c
			}
			res.Species[j] = &sp
			made[old] = &sp
			if res.ByName[sp.Name] == old {
				res.ByName[sp.Name] = &sp
			}
		}
		next.sps = slices.Clone(fm.sps)
		for _, k := range spIdx {
			if k < len(next.sps) && next.sps[k] != nil {
				nv := made[next.sps[k]]
				if nv == nil || nv.Decl != f.Species[k] {
					return nil
				}
				next.sps[k] = nv
			}
		}
	}
	if len(rxIdx) > 0 {
		res.Reactions = slices.Clone(r0.Reactions)
		next.rxs = slices.Clone(fm.rxs)
		for _, x := range rxIdx {
			old := res.Reactions[x]
			if old.Decl != f0.Reactions[x] {
				return nil
			}
			r := *old
			r.Decl = f.Reactions[x]
			res.Reactions[x] = &r
			if x < len(next.rxs) && next.rxs[x] == old {
				next.rxs[x] = &r
			}
		}
	}
	w.mu.Lock()
	defer w.mu.Unlock()
	w.moved++
	if w.incremental && w.results[path] == r0 && w.memos[path] == t0 {
		w.results[path] = res
		files := maps.Clone(t0.files)
		files[path] = next
		w.memos[path] = &memoTables{key: t0.key, files: files}
	}
	return res
}

// includesSame reports whether the files r0 (the analysis of path) read
// besides path still have the texts it read, and whether every include
// statement in scope that resolved to a file then resolved to one that
// could be read (a file that could not be read then may be readable now).
// The include statements of path are those of r0 (movedResult checks
// that they are the same nodes). Includes are walked as analysis.includes
// walks them, so that each is resolved with the same chain of files.
func (w *Workspace) includesSame(r0 *Result, path string) bool {
	for p, g := range r0.Files {
		if p == path {
			continue
		}
		text, err := w.read(p)
		if err != nil || !bytes.Equal(text, g.Src) {
			return false
		}
	}
	a := &analysis{w: w, res: r0}
	seen := map[string]bool{path: true}
	var walk func(p string, g *speciesfile.File, stack []string, depth int) bool
	walk = func(p string, g *speciesfile.File, stack []string, depth int) bool {
		for _, inc := range g.Includes {
			target, msg := a.resolveInclude(p, inc, stack, depth)
			if msg != "" || seen[target] {
				continue
			}
			h, ok := r0.Files[target]
			if !ok {
				return false
			}
			seen[target] = true
			if !walk(target, h, append(stack[:len(stack):len(stack)], target), depth+1) {
				return false
			}
		}
		return true
	}
	return walk(path, r0.File, []string{path}, 0) && len(seen) == len(r0.Files)
}

// sameQuickKind reports whether statement st, re-read, is of the kind of
// o, the node it replaces, and of a kind the quick path takes: species,
// reaction, trivia, include, group or units (read only for the file's
// units, compared with the whole file). Broken statements are not shortcut.
func sameQuickKind(st, o speciesfile.Stmt) bool {
	switch st.(type) {
	case *speciesfile.Species, *speciesfile.Reaction, *speciesfile.Trivia,
		*speciesfile.Include, *speciesfile.Group, *speciesfile.Units:
		return reflect.TypeOf(st) == reflect.TypeOf(o)
	}
	return false
}
