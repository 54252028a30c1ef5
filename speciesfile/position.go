package speciesfile

import (
	"sort"
	"sync"
	"sync/atomic"
)

// Positions of statements.
//
// A statement node holds spans relative to the start of its extent
// (RelSpan); the File holds where each statement starts. These methods turn
// relative spans into absolute ones. Callers that walk File.Species or
// File.Reactions by index use SpeciesStart and ReactionStart (an array
// read); callers holding only a node use Start, which looks the node up in
// an index made on first use.

// stmtIndex maps each statement node of a File to its index in Stmts. The
// first lookups scan Stmts (tens of microseconds for 50,000 statements,
// where making the map costs milliseconds: a request after an edit asks for
// one or two); the map is made when more come.
type stmtIndex struct {
	scans atomic.Int32
	once  sync.Once
	m     map[Stmt]int32
}

// scansBeforeMap is how many lookups scan before StmtIndex makes its map.
const scansBeforeMap = 32

// StmtSpan returns the absolute extent of statement i of Stmts.
func (f *File) StmtSpan(i int) Span {
	return Span{f.Starts[i], f.Starts[i] + f.Stmts[i].Len()}
}

// StmtBody returns the absolute body span of statement i of Stmts.
func (f *File) StmtBody(i int) Span {
	return f.Stmts[i].Body().At(f.Starts[i])
}

// SpeciesStart returns the start of the extent of f.Species[k].
func (f *File) SpeciesStart(k int) int { return f.Starts[f.speciesAt[k]] }

// ReactionStart returns the start of the extent of f.Reactions[k].
func (f *File) ReactionStart(k int) int { return f.Starts[f.reactionsAt[k]] }

// IncludeStart returns the start of the extent of f.Includes[k].
func (f *File) IncludeStart(k int) int { return f.Starts[f.includesAt[k]] }

// GroupStart returns the start of the extent of f.Groups[k].
func (f *File) GroupStart(k int) int { return f.Starts[f.groupsAt[k]] }

// SpeciesStmt returns the index in Stmts of f.Species[k].
func (f *File) SpeciesStmt(k int) int { return int(f.speciesAt[k]) }

// ReactionStmt returns the index in Stmts of f.Reactions[k].
func (f *File) ReactionStmt(k int) int { return int(f.reactionsAt[k]) }

// StmtIndex returns the index in Stmts of the statement node st, or -1 when
// st is not a statement of f.
func (f *File) StmtIndex(st Stmt) int {
	x := f.index
	if x == nil || x.scans.Add(1) <= scansBeforeMap {
		return f.scanIndex(st)
	}
	x.once.Do(func() {
		x.m = make(map[Stmt]int32, len(f.Stmts))
		for i, s := range f.Stmts {
			x.m[s] = int32(i)
		}
	})
	if i, ok := x.m[st]; ok {
		return int(i)
	}
	return -1
}

// scanIndex is StmtIndex by a linear scan.
func (f *File) scanIndex(st Stmt) int {
	for i, s := range f.Stmts {
		if s == st {
			return i
		}
	}
	return -1
}

// Start returns where the extent of statement node st begins in f. It
// panics when st is not a statement of f: a relative span read with the
// wrong file's start would point at the wrong text.
func (f *File) Start(st Stmt) int {
	i := f.StmtIndex(st)
	if i < 0 {
		panic("speciesfile: statement is not part of this file")
	}
	return f.Starts[i]
}

// Abs returns the absolute span of r, a span of statement node st.
func (f *File) Abs(st Stmt, r RelSpan) Span { return r.At(f.Start(st)) }

// Extent returns the absolute extent of statement node st.
func (f *File) Extent(st Stmt) Span {
	s := f.Start(st)
	return Span{s, s + st.Len()}
}

// BodyOf returns the absolute body span of statement node st.
func (f *File) BodyOf(st Stmt) Span { return st.Body().At(f.Start(st)) }

// StmtAt returns the index of the statement whose extent contains off (the
// last statement for off at the end of the text), or -1 for a file without
// statements.
func (f *File) StmtAt(off int) int {
	n := len(f.Stmts)
	if n == 0 {
		return -1
	}
	i := sort.Search(n, func(i int) bool { return f.Starts[i]+f.Stmts[i].Len() > off })
	return min(i, n-1)
}

// finishLists makes the convenience views of Stmts and the index.
func (f *File) finishLists() {
	f.Species, f.Reactions, f.Includes, f.Groups = f.Species[:0], f.Reactions[:0], nil, nil
	f.includesAt, f.groupsAt = nil, nil
	f.speciesAt, f.reactionsAt = make([]int32, 0, cap(f.Species)), make([]int32, 0, cap(f.Reactions))
	for i, st := range f.Stmts {
		switch s := st.(type) {
		case *Species:
			f.Species = append(f.Species, s)
			f.speciesAt = append(f.speciesAt, int32(i))
		case *Reaction:
			f.Reactions = append(f.Reactions, s)
			f.reactionsAt = append(f.reactionsAt, int32(i))
		case *Include:
			if s.Path != (Token{}) { // as in include: only with a path
				f.Includes = append(f.Includes, s)
				f.includesAt = append(f.includesAt, int32(i))
			}
		case *Group:
			f.Groups = append(f.Groups, s)
			f.groupsAt = append(f.groupsAt, int32(i))
		}
	}
	if len(f.Species) == 0 {
		f.Species, f.speciesAt = nil, nil
	}
	if len(f.Reactions) == 0 {
		f.Reactions, f.reactionsAt = nil, nil
	}
	f.index = &stmtIndex{}
}
