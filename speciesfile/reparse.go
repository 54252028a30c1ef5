package speciesfile

import (
	"bytes"
	"cmp"
	"slices"
	"sort"
)

// Incremental reading.
//
// Reparse turns the parse of a text and an edit of that text into the parse
// of the edited text without reading the whole file again. A statement's
// syntax depends only on its own lines, the lines that follow it up to the
// next statement keyword line (the reader looks ahead to find where it
// ends), and the reader's file-level state, which only a units statement
// changes. So Reparse
//
//   - keeps the statements before the edit as they are (the same nodes: a
//     parse is never modified once returned);
//   - reads the text again from the start of the statement before the one
//     containing the edit, until a statement ends, past the edit, exactly
//     where a statement of the old parse started (the following text is the
//     same, so the following statements read the same);
//   - reuses the statements after that point, moved by the edit's length
//     change: the same nodes (a node's spans are relative to its start, and
//     only File.Starts moves), except statements with syntax diagnostics,
//     whose messages may name line numbers: those are read again.
//
// It falls back to a whole parse where the shortcut would be unsound or
// pointless: a units statement at or after the edit (it changes how every
// later number reads), an edit in the first bytes of the file (byte order
// mark), a file over the size limit, or a file without statements.
// Whatever path is taken the result equals Parse of the new text, which the
// tests check on random edits of real and generated files.

// Edit describes a change of a text: the bytes Old (a span of the previous
// text) were replaced by NewLen bytes.
type Edit struct {
	Old    Span
	NewLen int
}

// Delta returns the change in length the edit makes.
func (e Edit) Delta() int { return e.NewLen - e.Old.Len() }

// DiffEdit returns the smallest edit turning a into b: everything but their
// longest common prefix and (not overlapping it) their longest common
// suffix.
func DiffEdit(a, b []byte) Edit {
	n := min(len(a), len(b))
	p := 0
	// compare in chunks first: bytes.Equal is much faster than a byte loop
	for p+64 <= n && bytes.Equal(a[p:p+64], b[p:p+64]) {
		p += 64
	}
	for p < n && a[p] == b[p] {
		p++
	}
	s := 0
	for s+64 <= n-p && bytes.Equal(a[len(a)-s-64:len(a)-s], b[len(b)-s-64:len(b)-s]) {
		s += 64
	}
	for s < n-p && a[len(a)-1-s] == b[len(b)-1-s] {
		s++
	}
	return Edit{Old: Span{p, len(a) - s}, NewLen: len(b) - s - p}
}

// Reparse returns the parse of src, which must be old.Src with e applied
// (old.Src[:e.Old.Start] + NewLen new bytes + old.Src[e.Old.End:]), reusing
// what it can of old (see the notes above). The result is the same as
// Parse(old.Name, src). When src does not have the length e implies, it is
// parsed from scratch; its unchanged parts are trusted, not compared (use
// DiffEdit to make an edit from two texts). A nil old parses src from
// scratch under the name "".
func Reparse(old *File, src []byte, e Edit) *File {
	if old == nil {
		return Parse("", src)
	}
	delta := e.Delta()
	if e.Old.Start < 4 || e.Old.Start > e.Old.End || e.Old.End > len(old.Src) || e.NewLen < 0 ||
		len(src) != len(old.Src)+delta || len(src) > MaxFileSize || len(old.Src) > MaxFileSize || len(old.Stmts) < 2 {
		return Parse(old.Name, src)
	}
	stmts, starts := old.Stmts, old.Starts
	n := len(stmts)
	end := func(i int) int { return starts[i] + stmts[i].Len() }
	k := sort.Search(n, func(i int) bool { return end(i) > e.Old.Start })
	k = min(k, n-1)
	i0 := max(k-1, 0)
	for _, st := range stmts[i0:] {
		switch st.(type) {
		case *Units, *Trivia:
			return Parse(old.Name, src)
		}
	}
	// which old statements have syntax diagnostics (conservatively: a
	// diagnostic at a statement's first byte marks the one before too)
	diagAt := map[int]bool{}
	for _, d := range old.Diags {
		s := d.Span.Start
		i := sort.Search(n, func(i int) bool { return end(i) > s })
		i = min(i, n-1)
		diagAt[i] = true
		if i > 0 && s <= starts[i] {
			diagAt[i-1] = true
		}
	}

	lines := old.Lines.edited(src, e)
	f := &File{
		Name: old.Name, Src: src, Lines: lines,
		EnergyUnit: old.EnergyUnit, EntropyUnit: old.EntropyUnit,
		Newline: lines.newline(), BOM: old.BOM,
		Stmts:  make([]Stmt, 0, n+8),
		Starts: make([]int, 0, n+8),
		// the lists keep their capacity through finishLists
		Species:   make([]*Species, 0, len(old.Species)+4),
		Reactions: make([]*Reaction, 0, len(old.Reactions)+4),
	}
	factor, _ := energyUnit(old.EnergyUnit)
	p := &parser{
		f: f, src: src, comment: -1, lines: lines, checkBytes: true,
		energyFactor: factor, entropyFactor: JoulesPerCalorie, sawDecl: true,
	}
	if factor == 1000 || factor == 1 {
		p.entropyFactor = 1
	}
	b0 := starts[i0]
	f.Stmts = append(f.Stmts, stmts[:i0]...)
	f.Starts = append(f.Starts, starts[:i0]...)
	nd := sort.Search(len(old.Diags), func(i int) bool { return old.Diags[i].Span.Start >= b0 })
	f.Diags = append(f.Diags, old.Diags[:nd]...)

	newEnd := e.Old.Start + e.NewLen
	// resync reports the index of the old statement that starts where the
	// new text's statement boundary end lies, when end is past the edit.
	resync := func(end int) (int, bool) {
		if end < newEnd {
			return 0, false
		}
		o := end - delta
		j := sort.Search(n, func(i int) bool { return starts[i] >= o })
		return j, j < n && starts[j] == o
	}
	j, ok := p.readFrom(b0, newEnd, resync)
	if !ok && len(f.Stmts) == i0 {
		return Parse(old.Name, src) // the edited region holds no statement
	}
	for ok && j < n {
		if diagAt[j] {
			start := starts[j] + delta
			j, ok = p.readFrom(start, start, resync)
			continue
		}
		// a moved statement is the same node: its spans are relative
		f.Stmts = append(f.Stmts, stmts[j])
		f.Starts = append(f.Starts, starts[j]+delta)
		j++
	}
	for _, st := range f.Stmts[i0:] {
		if _, units := st.(*Units); units {
			return Parse(old.Name, src)
		}
	}
	f.finishLists()
	slices.SortStableFunc(f.Diags, func(a, b Diagnostic) int { return cmp.Compare(a.Span.Start, b.Span.Start) })
	return f
}

// readFrom reads statements from offset start (a line start where a
// statement's extent begins) and appends them to the file, until a
// statement ends at an offset where stop says the old parse can take over
// (it returns that old statement's index and true), or the text ends
// (false; the last statement then owns the trailing lines, as in run).
//
// Token texts share one string holding the text read, not the whole file:
// a statement read again must not keep the whole text of its version alive
// once later versions replace the rest. The string covers a window from
// start to some way past from; a statement reaching beyond it is read again
// with a wider window.
func (p *parser) readFrom(start, from int, stop func(end int) (int, bool)) (int, bool) {
	f := p.f
	nStmts, nDiags := len(f.Stmts), len(f.Diags)
	for size := 4 << 10; ; size *= 4 {
		hi := min(len(p.src), max(start, from)+size)
		p.s, p.sBase, p.overflow = string(p.src[start:hi]), start, false
		j, ok := p.readStmts(start, stop)
		if !p.overflow || hi == len(p.src) {
			return j, ok
		}
		f.Stmts, f.Starts, f.Diags = f.Stmts[:nStmts], f.Starts[:nStmts], f.Diags[:nDiags]
	}
}

// readStmts is readFrom with the token window set; with stop nil it reads
// to the end of the text (a whole parse: run).
func (p *parser) readStmts(start int, stop func(end int) (int, bool)) (int, bool) {
	f := p.f
	p.line = p.lines.Line(start)
	p.hasPending = false
	extentStart := start
	var last Stmt
	for {
		iter := len(f.Diags)
		st, next, ok := p.nextStatement(extentStart)
		if !ok {
			break
		}
		f.Stmts = append(f.Stmts, st)
		f.Starts = append(f.Starts, extentStart)
		extentStart = next
		last = st
		if stop == nil {
			continue
		}
		if j, ok := stop(extentStart); ok && p.hasPending {
			// Reading ahead checked the lines of the statement that
			// follows (too long, bad bytes): those diagnostics belong to
			// it and are made again when it is read (it has diagnostics,
			// so it is read again).
			tail := slices.DeleteFunc(f.Diags[iter:], func(d Diagnostic) bool { return d.Span.Start >= extentStart })
			f.Diags = f.Diags[:iter+len(tail)]
			return j, true
		}
	}
	if last != nil {
		setExtentEnd(last, f.Starts[len(f.Starts)-1], len(p.src))
	}
	return 0, false
}
