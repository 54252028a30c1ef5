package ide

import (
	"strings"
	"unicode/utf8"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// Layout limits: a species name or a reaction equation wider than this is
// not padded to, and does not widen, the column of its block (a long line is
// not padded beyond what its own block alignment needs).
const (
	maxNameColumn     = 32
	maxEquationColumn = 64
	equationGap       = "   " // between a reaction's equation and its rate
)

// Format returns whitespace-only edits (one per changed line, in file order)
// that lay out the statements of f the same way:
//
//   - statement lines start in column 0, attribute lines are indented by two
//     spaces and the lines of a nasa7/thermo-table block by four;
//   - tokens are separated by single spaces, except where columns are
//     aligned:
//   - consecutive species lines (a block: not separated by a blank or
//     comment-only line; attribute lines may come between) put their
//     SMILES in one column;
//   - consecutive reaction lines (a block, as for species) pad the equation
//     to the widest one of the block and align the rate parameters in
//     columns; a run of `pressure` lines is aligned the same way;
//   - the low/high lines of a nasa7 block put each coefficient in a column,
//     aligned on its decimal point (the number's text is never changed),
//     with one place before the digits kept for a sign whether or not a
//     number of the column has one: the layout speciesfile.FormatNASA7Block
//     writes (kiln fill, quick fixes, estimate --nasa), so a block kiln
//     wrote is already formatted;
//   - the hf298/s298/cp rows of a thermo-table block or a group put their
//     values in one column;
//   - trailing blanks are removed, and blank lines become empty;
//   - the blanks before a trailing comment, the text of note/source lines and
//     comment-only lines are kept as written.
//
// Formatting is conservative: it never changes, joins or splits a token, and
// statements with a syntax error are left alone. Applying the edits and
// formatting again yields no edits.
func Format(f *speciesfile.File) []analysis.Edit {
	fm := formatter{f: f, rows: make([]*row, f.Lines.LineCount()+1)}
	fm.collect()
	fm.group()
	return fm.render()
}

// row is the layout of one line that may be rewritten.
type row struct {
	ls, le int
	orig   string
	indent string
	cells  []string // the line's columns; cell i>0 is one token
	tail   string   // the blanks and trailing comment, as written
	blank  bool
	grp    *colGroup
}

// colGroup is a set of rows whose leading columns are aligned.
type colGroup struct {
	aligned  int    // how many leading columns are aligned (not counting the last cell of a row)
	decimal  bool   // columns ≥ 1 align on the decimal point
	firstSep string // separator after cell 0 ("" = one space)
	limit    int    // rows whose cell 0 is wider than this are not aligned (0: no limit)
	rows     []*row
	w        []int // widths (left parts when decimal)
	r        []int // right parts when decimal
}

type formatter struct {
	f      *speciesfile.File
	rows   []*row // by line number (nil: left alone)
	order  []int
	broken map[speciesfile.Stmt]bool
	syntax []speciesfile.Diagnostic // the file's syntax errors
}

func (fm *formatter) isBroken(s speciesfile.Span) bool {
	for _, d := range fm.syntax {
		if d.Span.Start < s.End+1 && d.Span.End >= s.Start {
			return true
		}
	}
	return false
}

// collect splits every line of a well-formed statement into cells.
func (fm *formatter) collect() {
	f := fm.f
	fm.broken = map[speciesfile.Stmt]bool{}
	for _, d := range f.Diags {
		if d.Code == speciesfile.CodeSyntax {
			fm.syntax = append(fm.syntax, d)
		}
	}
	for i, st := range f.Stmts {
		switch st.(type) {
		case *speciesfile.BadStmt, *speciesfile.Trivia:
			fm.broken[st] = true
			continue
		}
		base := f.Starts[i]
		span := f.StmtSpan(i)
		body := st.Body().At(base)
		if body.End <= body.Start || fm.isBroken(span) {
			fm.broken[st] = true
			continue
		}
		blockLines := map[int]bool{}
		if sp, ok := st.(*speciesfile.Species); ok {
			for _, rb := range []*speciesfile.RelSpan{nasaSpan(sp), tableSpan(sp)} {
				if rb != nil {
					b := rb.At(base)
					for l := f.Lines.Line(b.Start) + 1; l <= f.Lines.Line(b.End); l++ {
						blockLines[l] = true
					}
				}
			}
		}
		first := f.Lines.Line(span.Start)
		last := f.Lines.Line(span.End)
		if span.End > span.Start && f.Lines.LineStart(last) == span.End {
			last-- // the span ends with the terminator of the line before
		}
		bodyLine := f.Lines.Line(body.Start)
		for l := first; l <= last; l++ {
			ls, le := f.Lines.LineStart(l), f.Lines.LineEnd(l)
			if ls < span.Start || le > span.End {
				continue
			}
			line := string(f.Src[ls:le])
			indent := ""
			switch {
			case l <= bodyLine:
			case blockLines[l]:
				indent = "    "
			default:
				indent = "  "
			}
			r, ok := splitLine(line, indent, l > bodyLine)
			if !ok {
				continue
			}
			r.ls, r.le, r.orig = ls, le, line
			if l == bodyLine {
				switch st.(type) {
				case *speciesfile.Reaction:
					r.cells = reactionCells(r.cells)
				case *speciesfile.Species:
					r.cells = joinCells(r.cells, 2)
				}
			}
			fm.rows[l] = r
			fm.order = append(fm.order, l)
		}
	}
}

// reactionCells makes the keyword and equation one cell, followed by one
// cell per rate token.
func reactionCells(cells []string) []string {
	k := len(cells)
	for i, c := range cells {
		if i > 0 && (strings.HasPrefix(c, "A=") || strings.HasPrefix(c, "n=") || strings.HasPrefix(c, "Ea=")) {
			k = i
			break
		}
	}
	return joinCells(cells, k)
}

// joinCells joins the first n cells into one, single-spaced.
func joinCells(cells []string, n int) []string {
	if n > len(cells) {
		n = len(cells)
	}
	if n <= 1 {
		return cells
	}
	return append([]string{strings.Join(cells[:n], " ")}, cells[n:]...)
}

// separatedByTrivia reports whether a blank or comment-only line lies
// strictly between lines a and b.
func (fm *formatter) separatedByTrivia(a, b int) bool {
	for l := a + 1; l < b; l++ {
		t := strings.Trim(string(fm.f.Src[fm.f.Lines.LineStart(l):fm.f.Lines.LineEnd(l)]), " \t\r\n")
		if t == "" || strings.HasPrefix(t, "#") {
			return true
		}
	}
	return false
}

// group assigns rows to column groups.
func (fm *formatter) group() {
	f := fm.f
	add := func(g *colGroup, l int) {
		if r := fm.rows[l]; r != nil && !r.blank && r.grp == nil {
			r.grp = g
			g.rows = append(g.rows, r)
		}
	}
	// Blocks of consecutive species or reaction statements.
	var run *colGroup
	var runKind string
	prevLine := -1
	for i, st := range f.Stmts {
		kind := ""
		switch st.(type) {
		case *speciesfile.Species:
			kind = "species"
		case *speciesfile.Reaction:
			kind = "reaction"
		}
		l := f.Lines.Line(f.StmtBody(i).Start)
		if kind == "" || fm.broken[st] || fm.rows[l] == nil {
			run, runKind = nil, ""
			continue
		}
		if run == nil || runKind != kind || fm.separatedByTrivia(prevLine, l) {
			run, runKind = &colGroup{aligned: -1}, kind
			if kind == "reaction" {
				run.firstSep, run.limit = equationGap, maxEquationColumn
			} else {
				run.aligned, run.limit = 1, maxNameColumn
			}
		}
		add(run, l)
		prevLine = l
	}
	// Blocks inside statements.
	for i, st := range f.Stmts {
		if fm.broken[st] {
			continue
		}
		base := f.Starts[i]
		switch st := st.(type) {
		case *speciesfile.Species:
			if b := st.NASA7; b != nil {
				g := &colGroup{aligned: -1, decimal: true}
				add(g, f.Lines.Line(b.LowSpan.At(base).Start))
				add(g, f.Lines.Line(b.HighSpan.At(base).Start))
			}
			if b := st.Table; b != nil {
				g := &colGroup{aligned: 1}
				bs := b.Span.At(base)
				for l := f.Lines.Line(bs.Start) + 1; l <= f.Lines.Line(bs.End); l++ {
					if r := fm.rows[l]; r != nil && len(r.cells) > 0 && isThermoKey(r.cells[0]) {
						add(g, l)
					}
				}
			}
		case *speciesfile.Group:
			g := &colGroup{aligned: 1}
			for _, a := range st.Attrs {
				if isThermoKey(a.Key.Text) {
					add(g, f.Lines.Line(a.Key.Span.At(base).Start))
				}
			}
		case *speciesfile.Reaction:
			var g *colGroup
			prev := -1
			for _, a := range st.Attrs {
				l := f.Lines.Line(a.Key.Span.At(base).Start)
				if a.Key.Text != "pressure" {
					g = nil
					continue
				}
				if g == nil || fm.separatedByTrivia(prev, l) {
					g = &colGroup{aligned: -1}
				}
				add(g, l)
				prev = l
			}
		}
	}
	for _, r := range fm.rows {
		if r != nil && r.grp != nil {
			r.grp.measure()
		}
	}
}

func isThermoKey(k string) bool { return k == "hf298" || k == "s298" || k == "cp" }

// inGroup reports whether r takes part in the alignment of its group.
func (g *colGroup) inGroup(r *row) bool {
	return g.limit == 0 || width(r.cells[0]) <= g.limit
}

// cols returns how many leading cells of r are padded.
func (g *colGroup) cols(r *row) int {
	n := len(r.cells) - 1 // the last cell is never followed by blanks
	if g.aligned >= 0 && g.aligned < n {
		n = g.aligned
	}
	return n
}

func (g *colGroup) measure() {
	if g.w != nil {
		return
	}
	g.w, g.r = []int{}, []int{}
	for _, r := range g.rows {
		if !g.inGroup(r) {
			continue
		}
		n := len(r.cells)
		if g.aligned >= 0 && g.aligned < n {
			n = g.aligned
		}
		for i := 0; i < n; i++ {
			for len(g.w) <= i {
				g.w, g.r = append(g.w, 0), append(g.r, 0)
			}
			if g.decimal && i > 0 {
				left, right := splitDecimal(r.cells[i])
				g.w[i] = max(g.w[i], signedWidth(left))
				g.r[i] = max(g.r[i], width(right))
			} else if i < len(r.cells)-1 || g.decimal {
				g.w[i] = max(g.w[i], width(r.cells[i]))
			}
		}
	}
}

// splitDecimal splits a number at its decimal point (or, without one, at
// its exponent).
func splitDecimal(s string) (string, string) {
	if i := strings.IndexByte(s, '.'); i >= 0 {
		return s[:i], s[i:]
	}
	if i := strings.IndexAny(s, "eE"); i >= 0 {
		return s[:i], s[i:]
	}
	return s, ""
}

func width(s string) int { return utf8.RuneCountInString(s) }

// signedWidth is the width the integer part left of a coefficient takes in
// its column: its digits plus one place for a sign, written or not.
func signedWidth(left string) int {
	if strings.HasPrefix(left, "-") || strings.HasPrefix(left, "+") {
		return width(left)
	}
	return width(left) + 1
}

func pad(n int) string {
	if n <= 0 {
		return ""
	}
	return strings.Repeat(" ", n)
}

// text lays out one row.
func (r *row) text() string {
	if r.blank {
		return ""
	}
	g := r.grp
	var b strings.Builder
	b.WriteString(r.indent)
	for i, c := range r.cells {
		if i > 0 {
			if i == 1 && g != nil && g.firstSep != "" {
				b.WriteString(g.firstSep)
			} else {
				b.WriteByte(' ')
			}
		}
		last := i == len(r.cells)-1
		switch {
		case g == nil || !g.inGroup(r) || i >= len(g.w):
			b.WriteString(c)
		case g.decimal && i > 0:
			left, right := splitDecimal(c)
			b.WriteString(pad(g.w[i] - width(left)))
			b.WriteString(c)
			if !last {
				b.WriteString(pad(g.r[i] - width(right)))
			}
		default:
			b.WriteString(c)
			if !last && i < g.cols(r) {
				b.WriteString(pad(g.w[i] - width(c)))
			}
		}
	}
	b.WriteString(r.tail)
	return b.String()
}

func (fm *formatter) render() []analysis.Edit {
	var out []analysis.Edit
	for _, l := range fm.order {
		r := fm.rows[l]
		if nl := r.text(); nl != r.orig {
			out = append(out, analysis.Edit{File: fm.f.Name, Span: speciesfile.Span{Start: r.ls, End: r.le}, NewText: nl})
		}
	}
	return out
}

func nasaSpan(sp *speciesfile.Species) *speciesfile.RelSpan {
	if sp.NASA7 == nil {
		return nil
	}
	return &sp.NASA7.Span
}

func tableSpan(sp *speciesfile.Species) *speciesfile.RelSpan {
	if sp.Table == nil {
		return nil
	}
	return &sp.Table.Span
}

// splitLine splits one line into cells; ok is false when the line is to be
// left alone. continuation says the line belongs to a statement's
// attributes.
func splitLine(line, indent string, continuation bool) (*row, bool) {
	trimmed := strings.TrimLeft(line, " \t")
	if strings.Trim(trimmed, " \t") == "" {
		return &row{blank: true}, true // blank line: drop its blanks
	}
	if strings.HasPrefix(trimmed, "#") {
		return nil, false // comment-only line: as written
	}
	if !continuation && len(trimmed) != len(line) {
		return nil, false // an indented first line: not ours to move
	}
	if strings.ContainsAny(line, "\x00\v\f") {
		return nil, false
	}
	// Split off a trailing comment (a '#' that begins a token).
	code, tail := trimmed, ""
	for i := 0; i < len(trimmed); i++ {
		if trimmed[i] == '#' && i > 0 && (trimmed[i-1] == ' ' || trimmed[i-1] == '\t') {
			j := i
			for j > 0 && (trimmed[j-1] == ' ' || trimmed[j-1] == '\t') {
				j--
			}
			code, tail = trimmed[:j], trimmed[j:i]+strings.TrimRight(trimmed[i:], " \t")
			break
		}
	}
	fields := strings.FieldsFunc(code, func(r rune) bool { return r == ' ' || r == '\t' })
	if len(fields) == 0 {
		return nil, false
	}
	r := &row{indent: indent, tail: tail}
	switch fields[0] {
	case "note", "source":
		// Free text: keep it byte for byte after the key.
		r.cells = []string{fields[0]}
		if rest := strings.Trim(code[len(fields[0]):], " \t"); rest != "" {
			r.cells = append(r.cells, rest)
		}
	default:
		r.cells = fields
	}
	return r, true
}
