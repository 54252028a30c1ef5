package speciesfile

import (
	"bytes"
	"cmp"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"
)

// Limits from FORMAT.md §5.
const (
	MaxFileSize  = 64 << 20 // bytes
	MaxLineSize  = 1 << 20  // bytes, excluding the terminator
	MaxSideTerms = 64       // terms per reaction side
	// MaxCoefficient bounds a stoichiometric coefficient. Every per-molecule
	// computation (balance, collision partners) is linear in the
	// coefficients, so the bound is also a bound on their work.
	MaxCoefficient = 1000
)

// Exact unit constants (FORMAT.md §2).
const (
	JoulesPerCalorie = 4.184          // thermochemical calorie, exact by definition
	GasConstant      = 8.314462618    // R in J/(mol K), CODATA 2018 (exact product N_A k_B, truncated)
	PascalsPerAtm    = 101325.0       // exact by definition
	PascalsPerBar    = 1e5            // exact by definition
	PascalsPerTorr   = 101325.0 / 760 // exact by definition (1 atm / 760)
)

type lineKind uint8

const (
	lineBlank   lineKind = iota // only blanks
	lineComment                 // only blanks and a comment
	lineStmt                    // content starting in column 0
	lineCont                    // indented content
)

// srcLine is one physical line.
type srcLine struct {
	start   int // first byte of the line
	text    int // first non-blank byte (after a BOM on line 0)
	end     int // end of the content, before the terminator
	trimEnd int // end of the content without trailing blanks
	next    int // start of the following line (== end for the last line)
	kind    lineKind
}

type parser struct {
	f   *File
	src []byte
	s   string // src[sBase:sBase+len(s)] as a string, shared by all token texts
	// sBase is the offset of s in src (0 but when reading again part of
	// a file, see Reparse); overflow is set when a token lies outside s.
	sBase    int
	overflow bool

	checkBytes bool // src has invalid UTF-8 or NUL bytes: check each line

	lines      *LineIndex // f.Lines: the line boundaries readLine walks
	line       int        // index of the next unread line in lines
	crlf       int        // lines ending in \r\n
	lf         int        // lines ending in \n or a lone \r
	pending    srcLine
	hasPending bool

	toks    []Token // tokens of the current line (reused)
	kw      []Token // tokens of the current statement's keyword line (reused)
	comment int     // offset of the current line's comment, -1 if none

	energyFactor  float64 // J/mol per file energy unit
	entropyFactor float64 // J/(mol K) per file entropy unit
	unitsTok      *Token  // the accepted units statement
	sawDecl       bool    // a species, reaction or group statement was seen

	body    []srcLine // continuation lines of the current statement (reused)
	attrBuf []Attr    // attribute lines of the current species (reused)
	termBuf [2][]Term // reactant and product terms of the current reaction (reused)

	// Node storage: the tree's small nodes are carved out of chunks (see
	// slab) instead of being allocated one by one.
	speciesNodes  slab[speciesNode]
	reactionNodes slab[reactionNode]
	nasaBlocks    slab[NASA7Block]
	rates         slab[rateStore]
	troes         slab[troeNode]
	tokens        slab[Token]
	intAttrs      slab[IntAttr]
	numbers       slab[Number]
	terms         slab[Term]
	attrs         slab[Attr]
	effs          slab[Efficiency]
}

// speciesNode is the storage of one species statement and its SMILES token
// (one slab element); rarer optional parts come from their own slabs.
type speciesNode struct {
	sp     Species
	smiles Token
}

// reactionNode is the storage of one reaction statement and its main rate
// (one slab element); optional tokens come from the token slab.
type reactionNode struct {
	r    Reaction
	rate rateStore
}

// troeNode is the storage of one troe line.
type troeNode struct {
	t Troe
	n [4]Number
}

func newParser(name string, src []byte) *parser {
	lines := NewLineIndex(src)
	f := &File{
		Name: name, Src: src, Lines: lines,
		EnergyUnit: "kcal/mol", EntropyUnit: "cal/mol/K", Newline: "\n",
	}
	p := &parser{
		f: f, src: src, s: string(src), comment: -1, lines: lines,
		energyFactor: 4184, entropyFactor: JoulesPerCalorie,
	}
	// lines.ascii implies valid UTF-8; NUL is checked separately
	p.checkBytes = (!lines.ascii && !utf8.Valid(src)) || bytes.IndexByte(src, 0) >= 0
	if bytes.HasPrefix(src, []byte("\xef\xbb\xbf")) {
		f.BOM = true
	}
	p.presize()
	return p
}

// presize gives File.Stmts, File.Species and File.Reactions their final
// capacity up front. Every line that starts with a byte other than a blank,
// a terminator or '#' starts exactly one statement, so counting such lines
// (and those whose first word is species or reaction) costs one pass over
// the line starts and saves the repeated growth of the slices. The counts
// are bounded by the number of lines, and every counted line yields a
// statement node anyway.
func (p *parser) presize() {
	src, li := p.src, p.lines
	stmts, species, reactions := 1, 0, 0 // +1: a leading indented line or trivia
	for k, start := range li.starts {
		if k == 0 && p.f.BOM {
			start = 3
		}
		if start >= li.ends[k] {
			continue
		}
		switch src[start] {
		case ' ', '\t', '#':
			continue
		case 's':
			if hasWord(src[start:li.ends[k]], "species") {
				species++
			}
		case 'r':
			if hasWord(src[start:li.ends[k]], "reaction") {
				reactions++
			}
		}
		stmts++
	}
	p.f.Stmts = make([]Stmt, 0, stmts)
	p.f.Starts = make([]int, 0, stmts)
	if species > 0 {
		p.f.Species = make([]*Species, 0, species)
	}
	if reactions > 0 {
		p.f.Reactions = make([]*Reaction, 0, reactions)
	}
}

// hasWord reports whether line starts with word followed by a blank or the
// end of the line.
func hasWord(line []byte, word string) bool {
	return len(line) >= len(word) && string(line[:len(word)]) == word &&
		(len(line) == len(word) || line[len(word)] == ' ' || line[len(word)] == '\t')
}

// errAt records a syntax error. While a statement is read its spans hold
// absolute offsets (they are made relative when it is complete, see
// relativize), so sp is absolute.
func (p *parser) errAt(sp RelSpan, format string, args ...any) {
	p.f.Diags = append(p.f.Diags, Diagnostic{Span: sp.At(0), Severity: SeverityError, Code: CodeSyntax, Message: fmt.Sprintf(format, args...)})
}

// readLine reads the next line (the line boundaries come from the file's
// LineIndex, which uses the same terminators) and advances.
func (p *parser) readLine() (srcLine, bool) {
	li, k, src := p.lines, p.line, p.src
	if k >= len(li.starts) || li.starts[k] >= len(src) {
		return srcLine{}, false
	}
	l := srcLine{start: li.starts[k], end: li.ends[k], next: len(src)}
	if k+1 < len(li.starts) {
		l.next = li.starts[k+1]
	}
	switch l.next - l.end {
	case 2:
		p.crlf++
	case 1:
		p.lf++
	}
	p.line++
	t := l.start
	if t == 0 && p.f.BOM {
		t = 3
	}
	bodyStart := t
	for t < l.end && (src[t] == ' ' || src[t] == '\t') {
		t++
	}
	l.text = t
	e := l.end
	for e > t && (src[e-1] == ' ' || src[e-1] == '\t') {
		e--
	}
	l.trimEnd = e
	switch {
	case t == l.end:
		l.kind = lineBlank
	case src[t] == '#':
		l.kind = lineComment
	case t == bodyStart:
		l.kind = lineStmt
	default:
		l.kind = lineCont
	}
	if l.end-l.start > MaxLineSize {
		p.errAt(RelSpan{l.start, l.start + 1}, "line too long: %d bytes (limit %d)", l.end-l.start, MaxLineSize)
	}
	if p.checkBytes {
		p.checkLineBytes(l)
	}
	return l, true
}

// checkLineBytes reports the first invalid UTF-8 byte and the first NUL byte
// of a line.
func (p *parser) checkLineBytes(l srcLine) {
	line := p.src[l.start:l.end]
	if i := bytes.IndexByte(line, 0); i >= 0 {
		p.errAt(RelSpan{l.start + i, l.start + i + 1}, "NUL byte in text")
	}
	for i := 0; i < len(line); {
		r, size := utf8.DecodeRune(line[i:])
		if r == utf8.RuneError && size == 1 {
			p.errAt(RelSpan{l.start + i, l.start + i + 1}, "invalid UTF-8 byte 0x%02X%s: a .kiln file is UTF-8 text; re-save it as UTF-8", line[i], latin1Guess(line[i]))
			return
		}
		i += size
	}
}

// latin1Guess says what an invalid UTF-8 byte is in Latin-1 (ISO 8859-1),
// the usual other encoding of a file with accented letters: " (é in
// Latin-1)". Bytes that are control codes there get "".
func latin1Guess(b byte) string {
	if b < 0xA0 {
		return ""
	}
	return fmt.Sprintf(" (%c in Latin-1)", rune(b))
}

// run parses the whole file.
func (p *parser) run() {
	f := p.f
	if len(p.src) > MaxFileSize {
		p.errAt(RelSpan{0, 0}, "file too large: %d bytes (limit %d)", len(p.src), MaxFileSize)
	}
	// Every statement to the end of the text (the last one owns the
	// trailing lines); a text of blank and comment lines only is one trivia
	// statement.
	p.readStmts(0, nil)
	if len(p.src) > 0 && len(f.Stmts) == 0 {
		f.Stmts = append(f.Stmts, &Trivia{StmtBase{Size: len(p.src), BodySpan: RelSpan{len(p.src), len(p.src)}}})
		f.Starts = append(f.Starts, 0)
	}
	f.finishLists()
	if p.crlf > p.lf {
		f.Newline = "\r\n"
	}
	// diagnostics in file order (stable: same-offset ones keep report order)
	slices.SortStableFunc(f.Diags, func(a, b Diagnostic) int { return cmp.Compare(a.Span.Start, b.Span.Start) })
}

// setExtentEnd makes the extent of st, a statement just read that starts
// at start, end at end.
func setExtentEnd(st Stmt, start, end int) {
	stmtBase(st).Size = end - start
}

// stmtBase returns the StmtBase of st.
func stmtBase(st Stmt) *StmtBase {
	switch s := st.(type) {
	case *Units:
		return &s.StmtBase
	case *Include:
		return &s.StmtBase
	case *Group:
		return &s.StmtBase
	case *Species:
		return &s.StmtBase
	case *Reaction:
		return &s.StmtBase
	case *BadStmt:
		return &s.StmtBase
	case *Trivia:
		return &s.StmtBase
	}
	panic("speciesfile: unknown statement type")
}

// tokenize splits the line [l.text, l.trimEnd) into p.toks at blanks and
// sets p.comment to the offset of a "#" that starts a token (-1 if none).
func (p *parser) tokenize(l srcLine) []Token {
	toks := p.toks[:0]
	p.comment = -1
	line := p.src[:l.trimEnd]
	for i := l.text; i < len(line); {
		c := line[i]
		if c == ' ' || c == '\t' {
			i++
			continue
		}
		if c == '#' {
			p.comment = i
			break
		}
		j := i + 1
		for j < len(line) && line[j] != ' ' && line[j] != '\t' {
			j++
		}
		toks = append(toks, Token{RelSpan{i, j}, p.text(i, j)})
		i = j
	}
	p.toks = toks
	return toks
}

// freeText returns the text from token k to the comment or end of line,
// without trailing blanks; ok is false when there is no text.
func (p *parser) freeText(l srcLine, toks []Token, k int) (Token, bool) {
	if k >= len(toks) {
		return Token{}, false
	}
	end := l.trimEnd
	if p.comment >= 0 {
		end = p.comment
	}
	for end > toks[k].Span.From && (p.src[end-1] == ' ' || p.src[end-1] == '\t') {
		end--
	}
	start := toks[k].Span.From
	return Token{RelSpan{start, end}, p.text(start, end)}, true
}

// text returns src[i:j] as a string sharing p.s.
func (p *parser) text(i, j int) string {
	if i < p.sBase || j-p.sBase > len(p.s) {
		p.overflow = true
		return string(p.src[i:j])
	}
	return p.s[i-p.sBase : j-p.sBase]
}

const keywordList = "species, reaction, units, include, group"

var keywords = []string{"species", "reaction", "units", "include", "group"}

// indentedKeyword reports, when the first token of an indented line is a
// statement keyword (" species X C"), that the line is read as part of the
// statement above and that statement keywords belong in column 0; it
// returns whether it did.
func (p *parser) indentedKeyword(key Token) bool {
	if !slices.Contains(keywords, key.Text) {
		return false
	}
	p.errAt(key.Span, "%q is a statement keyword, but this line is indented, so it is read as part of the statement above: a statement keyword belongs in column 0 (remove the leading blanks)", key.Text)
	return true
}

// statement dispatches on the keyword of line l.
func (p *parser) statement(l srcLine, base StmtBase) Stmt {
	// keep the keyword line's tokens apart from p.toks, which body lines reuse
	p.kw = append(p.kw[:0], p.tokenize(l)...)
	toks := p.kw
	if l.kind == lineCont {
		p.errAt(toks[0].Span, "indented line outside any statement: a statement starts in column 0 with one of %s", keywordList)
		return &BadStmt{base}
	}
	base.KeywordTok = toks[0]
	switch toks[0].Text {
	case "units":
		return p.units(toks, base)
	case "include":
		return p.include(toks, base)
	case "group":
		return p.group(toks, base)
	case "species":
		return p.species(toks, base)
	case "reaction":
		return p.reaction(toks, base)
	}
	p.errAt(toks[0].Span, "unknown keyword %q: %sexpected one of %s", toks[0].Text, didYouMean(toks[0].Text, keywords), keywordList)
	return &BadStmt{base}
}

// noBody reports continuation lines of a statement that takes none.
func (p *parser) noBody(kw string) {
	if len(p.body) > 0 {
		toks := p.tokenize(p.body[0])
		p.errAt(toks[0].Span, "unexpected indented line: %s takes no attribute lines", kw)
	}
}

// extra reports tokens after the expected ones.
func (p *parser) extra(toks []Token, after string) {
	if len(toks) > 0 {
		p.errAt(toks[0].Span, "unexpected %q after %s", toks[0].Text, after)
	}
}

// newToken returns a pointer to a copy of t (slab-allocated).
func (p *parser) newToken(t Token) *Token {
	tp := p.tokens.new()
	*tp = t
	return tp
}

// extraAfterValue is extra(toks, key.Text+" value"), building the message
// only when there is an error.
func (p *parser) extraAfterValue(toks []Token, key Token) {
	if len(toks) > 0 {
		p.extra(toks, key.Text+" value")
	}
}

// endOf returns an empty span at the end of token t (for "expected X" errors
// at the end of a line).
func endOf(t Token) RelSpan { return RelSpan{t.Span.To, t.Span.To} }

// energyUnit returns J/mol per unit u of energy per mole.
func energyUnit(u string) (float64, bool) {
	switch u {
	case "kcal/mol":
		return 4184, true
	case "kJ/mol":
		return 1000, true
	case "cal/mol":
		return JoulesPerCalorie, true
	case "J/mol":
		return 1, true
	}
	return 0, false
}

func (p *parser) units(toks []Token, base StmtBase) Stmt {
	st := &Units{StmtBase: base}
	defer p.noBody("units")
	if len(toks) < 2 {
		p.errAt(endOf(toks[0]), "expected an energy unit after units: kcal/mol, kJ/mol, cal/mol or J/mol")
		return st
	}
	st.Unit = toks[1]
	p.extra(toks[2:], "the unit")
	factor, ok := energyUnit(toks[1].Text)
	switch {
	case !ok:
		p.errAt(toks[1].Span, "unknown energy unit %q: expected kcal/mol, kJ/mol, cal/mol or J/mol", toks[1].Text)
	case p.unitsTok != nil:
		p.errAt(toks[0].Span, "units declared twice (first on line %d)", p.f.Lines.Line(p.unitsTok.Span.From)+1)
	case p.sawDecl:
		p.errAt(toks[0].Span, "units must come before any species, reaction or group statement")
	default:
		u := st.Unit
		p.unitsTok = &u
		p.energyFactor = factor
		p.f.EnergyUnit = toks[1].Text
		if factor == 1000 || factor == 1 {
			p.entropyFactor = 1
			p.f.EntropyUnit = "J/mol/K"
		}
	}
	return st
}

func (p *parser) include(toks []Token, base StmtBase) Stmt {
	st := &Include{StmtBase: base}
	defer p.noBody("include")
	if len(toks) < 2 {
		p.errAt(endOf(toks[0]), "expected a file path after include")
		return st
	}
	st.Path = toks[1]
	p.extra(toks[2:], "the path (a path has no blanks)")
	return st
}

// attrSet tracks which attributes a statement has seen, for duplicate
// detection.
type attrSet struct {
	seen [16]Token
	has  uint32
}

// first records key under id; it reports false (after an error) if the
// attribute was already given.
func (p *parser) first(a *attrSet, id int, key Token) bool {
	if a.has&(1<<id) != 0 {
		p.errAt(key.Span, "duplicate attribute %q (first given on line %d)", key.Text, p.f.Lines.Line(a.seen[id].Span.From)+1)
		return false
	}
	a.has |= 1 << id
	a.seen[id] = key
	return true
}

// lineSpan is the span of an attribute line from its key to its last
// non-blank byte.
func lineSpan(l srcLine) RelSpan { return RelSpan{l.text, l.trimEnd} }

// ---- thermo lines shared by group and thermo-table ----

type thermoLines struct {
	hf, s  *Number
	cp     []CpPoint
	source *Token
	set    attrSet
}

const (
	tHf = iota
	tS
	tCp
	tSource
)

// thermoLine parses an hf298/s298/cp/source line; it reports false if the
// key is not one of these.
func (p *parser) thermoLine(l srcLine, toks []Token, t *thermoLines) bool {
	key := toks[0]
	switch key.Text {
	case "hf298", "s298":
		id, kind := tHf, kEnergy
		if key.Text == "s298" {
			id, kind = tS, kEntropy
		}
		if !p.first(&t.set, id, key) {
			return true
		}
		if len(toks) < 2 {
			p.errAt(endOf(key), "expected a number after %s", key.Text)
			return true
		}
		p.extraAfterValue(toks[2:], key)
		if n, ok := p.number(toks[1], kind); ok {
			np := p.numbers.new()
			*np = n
			if id == tHf {
				t.hf = np
			} else {
				t.s = np
			}
		}
	case "cp":
		if !p.first(&t.set, tCp, key) {
			return true
		}
		t.cp = p.cpPoints(key, toks[1:])
	case "source":
		if !p.first(&t.set, tSource, key) {
			return true
		}
		if txt, ok := p.freeText(l, toks, 1); ok {
			t.source = p.newToken(txt)
		} else {
			p.errAt(endOf(key), "expected text after source")
		}
	default:
		return false
	}
	return true
}

// cpPoints parses T=VALUE pairs.
func (p *parser) cpPoints(key Token, toks []Token) []CpPoint {
	if len(toks) == 0 {
		p.errAt(endOf(key), "expected T=VALUE pairs after cp (T in K)")
		return nil
	}
	pts := make([]CpPoint, 0, len(toks))
	for _, tk := range toks {
		ts, vs, ok := splitPair(tk)
		if !ok {
			p.errAt(tk.Span, "expected a T=VALUE pair, found %q", tk.Text)
			return nil
		}
		t, ok1 := p.number(ts, kTemp)
		v, ok2 := p.number(vs, kEntropy)
		if !ok1 || !ok2 {
			return nil
		}
		if t.SI <= 0 {
			p.errAt(ts.Span, "cp temperature must be positive, found %s", ts.Text)
			return nil
		}
		if len(pts) > 0 && t.SI <= pts[len(pts)-1].T.SI {
			p.errAt(ts.Span, "cp temperatures must increase: %s after %s", ts.Text, pts[len(pts)-1].T.Tok.Text)
			return nil
		}
		pts = append(pts, CpPoint{T: t, Cp: v})
	}
	return pts
}

// splitPair splits "K=V" at the last '=' into two tokens.
func splitPair(tk Token) (k, v Token, ok bool) {
	i := strings.LastIndexByte(tk.Text, '=')
	if i <= 0 {
		return k, v, false
	}
	s := tk.Span.From
	k = Token{RelSpan{s, s + i}, tk.Text[:i]}
	v = Token{RelSpan{s + i + 1, tk.Span.To}, tk.Text[i+1:]}
	return k, v, true
}

// linesList formats ["a"] as "its a line" and ["a","b","c"] as
// "its a, b and c lines".
func linesList(keys []string) string {
	if len(keys) == 1 {
		return "its " + keys[0] + " line"
	}
	return "its " + strings.Join(keys[:len(keys)-1], ", ") + " and " + keys[len(keys)-1] + " lines"
}

// missingThermo reports which of hf298/s298/cp are missing.
func (p *parser) missingThermo(at RelSpan, what string, t *thermoLines) {
	var miss []string
	if t.set.has&(1<<tHf) == 0 {
		miss = append(miss, "hf298")
	}
	if t.set.has&(1<<tS) == 0 {
		miss = append(miss, "s298")
	}
	if t.set.has&(1<<tCp) == 0 {
		miss = append(miss, "cp")
	}
	if len(miss) > 0 {
		p.errAt(at, "%s is missing %s", what, linesList(miss))
	}
}

func (p *parser) group(toks []Token, base StmtBase) Stmt {
	p.sawDecl = true
	st := &Group{StmtBase: base}
	if len(toks) < 2 {
		p.errAt(endOf(toks[0]), "expected a group name after group, e.g. C-(C)(H)3")
	} else {
		st.Name = toks[1]
		p.extra(toks[2:], "the group name (a group name has no blanks)")
	}
	var t thermoLines
	if len(p.body) > 0 {
		st.Attrs = p.attrs.take(len(p.body))
	}
	for _, l := range p.body {
		lt := p.tokenize(l)
		st.Attrs = append(st.Attrs, Attr{Key: lt[0], Span: lineSpan(l)})
		if !p.thermoLine(l, lt, &t) {
			if !p.indentedKeyword(lt[0]) {
				p.errAt(lt[0].Span, "unknown group attribute %q: %sexpected one of hf298, s298, cp, source", lt[0].Text, didYouMean(lt[0].Text, []string{"hf298", "s298", "cp", "source"}))
			}
		}
	}
	st.Hf298, st.S298, st.Cp, st.Source = t.hf, t.s, t.cp, t.source
	if len(toks) > 1 {
		p.missingThermo(toks[1].Span, "group "+toks[1].Text, &t)
	}
	return st
}

// ValidName reports whether text can name a species: not empty, not a
// number and not a reserved word of the reaction syntax. A declaration
// whose name is not valid is reported by the reader and is not data.
func ValidName(text string) bool { return text != "" && nameProblem(text) == "" }

// nameProblem returns why text cannot be a species name, or "".
func nameProblem(text string) string {
	switch text {
	case "+", "=>", "<=>", "=", "M", "(+M)":
		return fmt.Sprintf("%q is reserved and cannot be a species name", text)
	}
	if strings.HasPrefix(text, "(+") && strings.HasSuffix(text, ")") {
		return fmt.Sprintf("%q is reserved (falloff collider) and cannot be a species name", text)
	}
	if n := scanNumber(text); n == len(text) {
		return fmt.Sprintf("%q is a number, not a species name", text)
	}
	return ""
}

// species attribute ids
const (
	aMult = iota
	aSym
	aOpt
	aComp
	aNote
	aNASA
	aTable
)

const speciesAttrList = "multiplicity, symmetry, optical-isomers, composition, note, nasa7, thermo-table"

func (p *parser) species(toks []Token, base StmtBase) Stmt {
	p.sawDecl = true
	sa := p.speciesNodes.new()
	st := &sa.sp
	st.StmtBase = base
	// Attribute lines are collected in a reused buffer and copied into
	// exactly sized storage at the end (p.body also holds block lines).
	attrs := p.attrBuf[:0]
	if len(toks) < 2 {
		p.errAt(endOf(toks[0]), "expected a species name after species")
	} else {
		st.Name = toks[1]
		if msg := nameProblem(toks[1].Text); msg != "" {
			p.errAt(toks[1].Span, "%s", msg)
		}
		if len(toks) > 2 {
			sa.smiles = toks[2]
			st.SMILES = &sa.smiles
			p.extra(toks[3:], "the SMILES (a SMILES has no blanks)")
		}
	}
	var set attrSet
	const (
		blockNone = iota
		blockNASA
		blockTable
	)
	block := blockNone
	var nasa *NASA7Block
	var nasaSet attrSet
	var table thermoLines
	var tableHdr Token
	blockAttr := -1
	for _, l := range p.body {
		lt := p.tokenize(l)
		key := lt[0]
		// block lines
		switch block {
		case blockNASA:
			if key.Text == "low" || key.Text == "high" || key.Text == "source" {
				p.nasaLine(l, lt, nasa, &nasaSet)
				nasa.Span.To = l.trimEnd
				attrs[blockAttr].Span.To = l.trimEnd
				continue
			}
		case blockTable:
			if p.thermoLine(l, lt, &table) {
				st.Table.Span.To = l.trimEnd
				attrs[blockAttr].Span.To = l.trimEnd
				continue
			}
		}
		block = blockNone
		attrs = append(attrs, Attr{Key: key, Span: lineSpan(l)})
		switch key.Text {
		case "multiplicity", "symmetry", "optical-isomers":
			id := aOpt
			switch key.Text {
			case "multiplicity":
				id = aMult
			case "symmetry":
				id = aSym
			}
			if !p.first(&set, id, key) {
				continue
			}
			ia, ok := p.intAttr(lt)
			if !ok {
				continue
			}
			iap := p.intAttrs.new()
			*iap = ia
			switch id {
			case aMult:
				st.Multiplicity = iap
			case aSym:
				st.Symmetry = iap
			default:
				st.OpticalIsomers = iap
			}
		case "composition":
			if !p.first(&set, aComp, key) {
				continue
			}
			if len(lt) < 2 {
				p.errAt(endOf(key), "expected an element formula after composition, e.g. C10H8")
				continue
			}
			p.extra(lt[2:], "the formula (a formula has no blanks)")
			c := lt[1]
			st.Composition = p.newToken(c)
			formula, err := ParseFormula(c.Text)
			if err != nil {
				p.errAt(c.Span, "malformed composition %q: %v", c.Text, err)
				continue
			}
			st.Formula = formula
		case "note":
			if !p.first(&set, aNote, key) {
				continue
			}
			if txt, ok := p.freeText(l, lt, 1); ok {
				st.Note = p.newToken(txt)
			} else {
				p.errAt(endOf(key), "expected text after note")
			}
		case "nasa7":
			if !p.first(&set, aNASA, key) {
				continue
			}
			if set.has&(1<<aTable) != 0 {
				p.errAt(key.Span, "a species has either a nasa7 block or a thermo-table, not both")
			}
			nasa = p.nasaBlocks.new()
			nasa.Span, nasa.Header = lineSpan(l), key
			nasaSet = attrSet{}
			p.nasaHeader(lt, nasa)
			st.NASA7 = nasa
			block, blockAttr = blockNASA, len(attrs)-1
		case "thermo-table":
			if !p.first(&set, aTable, key) {
				continue
			}
			if set.has&(1<<aNASA) != 0 {
				p.errAt(key.Span, "a species has either a nasa7 block or a thermo-table, not both")
			}
			p.extra(lt[1:], "thermo-table (its values go on the following lines)")
			st.Table = &ThermoTable{Span: lineSpan(l), Header: key}
			tableHdr = key
			block, blockAttr = blockTable, len(attrs)-1
		case "low", "high":
			p.errAt(key.Span, "%q is only valid inside a nasa7 block", key.Text)
		case "hf298", "s298", "cp":
			p.errAt(key.Span, "%q is only valid inside a thermo-table block", key.Text)
		case "source":
			p.errAt(key.Span, "\"source\" is only valid inside a nasa7 or thermo-table block")
		default:
			if p.indentedKeyword(key) {
				continue
			}
			p.errAt(key.Span, "unknown species attribute %q: %sexpected one of %s", key.Text, didYouMean(key.Text, strings.Split(speciesAttrList, ", ")), speciesAttrList)
		}
	}
	p.attrBuf = attrs[:0]
	if len(attrs) > 0 {
		st.Attrs = append(p.attrs.take(len(attrs)), attrs...)
	} else {
		st.Attrs = []Attr{} // empty, not nil (does not allocate)
	}
	if nasa != nil {
		var miss []string
		if nasaSet.has&(1<<0) == 0 {
			miss = append(miss, "low")
		}
		if nasaSet.has&(1<<1) == 0 {
			miss = append(miss, "high")
		}
		if len(miss) > 0 {
			p.errAt(nasa.Header.Span, "nasa7 block is missing %s", linesList(miss))
		}
	}
	if st.Table != nil {
		st.Table.Hf298, st.Table.S298, st.Table.Cp, st.Table.Source = table.hf, table.s, table.cp, table.source
		p.missingThermo(tableHdr.Span, "thermo-table", &table)
	}
	if len(toks) >= 2 && st.SMILES == nil && st.Composition == nil {
		p.errAt(toks[1].Span, "species %s has no SMILES, so it needs a composition line", toks[1].Text)
	}
	return st
}

func (p *parser) intAttr(lt []Token) (IntAttr, bool) {
	key := lt[0]
	if len(lt) < 2 {
		p.errAt(endOf(key), "expected a positive integer after %s", key.Text)
		return IntAttr{}, false
	}
	p.extraAfterValue(lt[2:], key)
	v, err := strconv.Atoi(lt[1].Text)
	if err != nil || v < 1 || lt[1].Text[0] == '+' || lt[1].Text[0] == '-' {
		p.errAt(lt[1].Span, "%s needs a positive integer, found %q", key.Text, lt[1].Text)
		return IntAttr{}, false
	}
	return IntAttr{Key: key, Value: v, Tok: lt[1]}, true
}

func (p *parser) nasaHeader(lt []Token, b *NASA7Block) {
	if len(lt) < 4 {
		p.errAt(endOf(lt[len(lt)-1]), "expected three temperatures after nasa7: TLOW TMID THIGH (K)")
		return
	}
	p.extra(lt[4:], "the three nasa7 temperatures")
	var ts [3]Number
	for i := range 3 {
		n, ok := p.number(lt[1+i], kTemp)
		if !ok {
			return
		}
		ts[i] = n
	}
	b.TLow, b.TMid, b.THigh = ts[0], ts[1], ts[2]
	if !(ts[0].SI > 0 && ts[0].SI < ts[1].SI && ts[1].SI < ts[2].SI) {
		p.errAt(RelSpan{lt[1].Span.From, lt[3].Span.To}, "nasa7 temperatures must satisfy 0 < TLOW < TMID < THIGH")
	}
}

func (p *parser) nasaLine(l srcLine, lt []Token, b *NASA7Block, set *attrSet) {
	key := lt[0]
	switch key.Text {
	case "source":
		if !p.first(set, 2, key) {
			return
		}
		if txt, ok := p.freeText(l, lt, 1); ok {
			b.Source = p.newToken(txt)
		} else {
			p.errAt(endOf(key), "expected text after source")
		}
		return
	}
	id := 0
	dst := &b.Low
	if key.Text == "high" {
		id, dst = 1, &b.High
	}
	if !p.first(set, id, key) {
		return
	}
	nums := lt[1:]
	if len(nums) != 7 {
		at := endOf(lt[len(lt)-1])
		if len(nums) > 7 {
			at = nums[7].Span
		}
		p.errAt(at, "expected 7 coefficients after %s, found %d", key.Text, len(nums))
		return
	}
	var out [7]Number
	for i, tk := range nums {
		n, ok := p.number(tk, kDimless)
		if !ok {
			return
		}
		out[i] = n
	}
	*dst = out
	if id == 0 {
		b.LowSpan = lineSpan(l)
	} else {
		b.HighSpan = lineSpan(l)
	}
}

// reaction attribute ids
const (
	rLow = iota
	rTroe
	rEff
	rDup
	rRev
	rNote
)

const reactionAttrList = "low-pressure, troe, efficiencies, pressure, duplicate, reverse, note"

func isRateToken(s string) bool {
	return strings.HasPrefix(s, "A=") || strings.HasPrefix(s, "n=") || strings.HasPrefix(s, "Ea=")
}

func (p *parser) reaction(toks []Token, base StmtBase) Stmt {
	p.sawDecl = true
	ra := p.reactionNodes.new()
	st := &ra.r
	st.StmtBase = base
	if len(p.body) > 0 {
		st.Attrs = p.attrs.take(len(p.body))
	}
	eqEnd := len(toks)
	for i := 1; i < len(toks); i++ {
		if isRateToken(toks[i].Text) {
			eqEnd = i
			break
		}
	}
	eq := toks[1:eqEnd]
	diagsBefore := len(p.f.Diags)
	if len(eq) == 0 {
		p.errAt(endOf(toks[0]), "expected a reaction equation after reaction, e.g. H + O2 <=> O + OH")
	} else {
		st.Equation = RelSpan{eq[0].Span.From, eq[len(eq)-1].Span.To}
		if fall, ok := p.equation(eq, st); ok {
			st.Falloff = p.newToken(fall)
		}
	}
	if eqEnd < len(toks) {
		st.Rate = p.rateInto(&ra.rate, toks[0], toks[eqEnd:], "")
	}
	var set attrSet
	sawPressure := false
	for _, bl := range p.body {
		lt := p.tokenize(bl)
		key := lt[0]
		st.Attrs = append(st.Attrs, Attr{Key: key, Span: lineSpan(bl)})
		switch key.Text {
		case "low-pressure":
			if !p.first(&set, rLow, key) {
				continue
			}
			if st.Falloff == nil {
				p.errAt(key.Span, "low-pressure needs a falloff reaction marked with (+M) on both sides")
			}
			st.LowPressure = p.rate(key, lt[1:], "low-pressure")
		case "troe":
			if !p.first(&set, rTroe, key) {
				continue
			}
			st.Troe = p.troe(lt)
		case "efficiencies":
			if !p.first(&set, rEff, key) {
				continue
			}
			if !st.ThirdBody && st.Falloff == nil {
				p.errAt(key.Span, "efficiencies need a third body: M or (+M) in the equation")
			}
			st.Efficiencies = p.efficiencies(lt)
		case "pressure":
			sawPressure = true
			p.pressure(lt, st)
		case "duplicate":
			if !p.first(&set, rDup, key) {
				continue
			}
			p.extra(lt[1:], "duplicate")
			st.Duplicate = p.newToken(key)
		case "reverse":
			if !p.first(&set, rRev, key) {
				continue
			}
			if len(eq) > 0 && st.Arrow.Text == "=>" {
				p.errAt(key.Span, "reverse needs a reversible (<=>) reaction")
			}
			st.Reverse = p.rate(key, lt[1:], "reverse")
		case "note":
			if !p.first(&set, rNote, key) {
				continue
			}
			if txt, ok := p.freeText(bl, lt, 1); ok {
				st.Note = p.newToken(txt)
			} else {
				p.errAt(endOf(key), "expected text after note")
			}
		default:
			if p.indentedKeyword(key) {
				continue
			}
			if rateParamLike(key.Text) {
				p.errAt(key.Span, "%q on a line of its own: the forward rate parameters (A=, n=, Ea=) belong on the reaction line, after the equation", key.Text)
				continue
			}
			p.errAt(key.Span, "unknown reaction attribute %q: %sexpected one of %s", key.Text, didYouMean(key.Text, strings.Split(reactionAttrList, ", ")), reactionAttrList)
		}
	}
	if st.Troe != nil && st.LowPressure == nil {
		p.errAt(st.Troe.Span, "troe needs a low-pressure line")
	}
	if len(st.Pressures) > 0 {
		// A pressure table is the whole forward rate: another rate form
		// beside it would be silently ignored, so it is refused.
		first := st.Pressures[0]
		table := RelSpan{From: first.P.Tok.Span.From, To: max(first.P.Tok.Span.To, first.Rate.Span.To)}
		switch {
		case st.ThirdBody:
			p.errAt(table, "pressure lines give the rate at each pressure and do not combine with a third body M: remove M from the equation or the pressure lines")
		case st.Falloff != nil:
			p.errAt(table, "pressure lines give the rate at each pressure and do not combine with a falloff %s: use either the falloff form (low-pressure, troe) or the pressure lines", st.Falloff.Text)
		}
		if st.Rate != nil {
			p.f.Diags = append(p.f.Diags, Diagnostic{Span: st.Rate.Span.At(0), Severity: SeverityWarning, Code: CodeUnusedRate,
				Message: "these rate parameters are not used: with pressure lines the rate comes from them (remove these, or the pressure lines)"})
		}
	}
	eqBroken := false
	for _, d := range p.f.Diags[diagsBefore:] {
		if d.Span.Start >= st.Equation.From && d.Span.Start <= st.Equation.To {
			eqBroken = true
		}
	}
	if eqEnd == len(toks) && !sawPressure && len(eq) > 0 && !eqBroken {
		// (An equation with a syntax error gets that error only.)
		p.f.Diags = append(p.f.Diags, Diagnostic{Span: st.Equation.At(0), Severity: SeverityWarning, Code: CodeNoRate,
			Message: "reaction has no rate parameters (A=, n=, Ea=)"})
	}
	return st
}

func isArrowLike(s string) bool {
	switch s {
	case "=", "->", "<->", "<=", "<-", "==", "<==>", "==>":
		return true
	}
	return false
}

// isRateKey reports whether text is the name of a rate parameter (A, n, Ea).
func isRateKey(text string) bool { return text == "A" || text == "n" || text == "Ea" }

// equation parses the equation tokens into st; it returns the falloff token
// (ok true) for a well-formed falloff reaction.
func (p *parser) equation(eq []Token, st *Reaction) (fall Token, isFalloff bool) {
	arrow := -1
	for i, t := range eq {
		switch {
		case t.Text == "<=>" || t.Text == "=>":
			if arrow >= 0 {
				p.errAt(t.Span, "second arrow %q: a reaction has exactly one arrow", t.Text)
				return fall, false
			}
			arrow = i
		case isArrowLike(t.Text):
			if t.Text == "=" && i > 0 && i+1 < len(eq) && isRateKey(eq[i-1].Text) && scanNumber(eq[i+1].Text) == len(eq[i+1].Text) {
				p.errAt(t.Span, "%q between %s and %s: rate parameters are written without blanks around =, e.g. A=1e13 n=0 Ea=0", t.Text, eq[i-1].Text, eq[i+1].Text)
				return fall, false
			}
			p.errAt(t.Span, "%q is not an arrow: use <=> (reversible) or => (irreversible)", t.Text)
			return fall, false
		}
	}
	if arrow < 0 {
		for _, t := range eq {
			if strings.Contains(t.Text, "=>") {
				p.errAt(t.Span, "missing arrow: %q holds one; put blanks around the arrow and around each +, e.g. H + O2 <=> O + OH", t.Text)
				return fall, false
			}
		}
		p.errAt(st.Equation, "missing arrow: expected <=> or => between reactants and products")
		return fall, false
	}
	st.Arrow = eq[arrow]
	st.Reversible = eq[arrow].Text == "<=>"
	// The sides are parsed into reused buffers, then copied into one exactly
	// sized backing array (capped so that they cannot overlap).
	rs, m1, f1, ok1 := p.side(eq[:arrow], eq[arrow], "reactant", p.termBuf[0][:0])
	ps, m2, f2, ok2 := p.side(eq[arrow+1:], eq[arrow], "product", p.termBuf[1][:0])
	if rs != nil {
		p.termBuf[0] = rs[:0]
	}
	if ps != nil {
		p.termBuf[1] = ps[:0]
	}
	nr, np := len(rs), len(ps)
	buf := p.terms.take(nr + np)
	st.Reactants = copyTerms(buf[:0:nr], rs)
	st.Products = copyTerms(buf[nr:nr:nr+np], ps)
	if !ok1 || !ok2 {
		return fall, false
	}
	switch {
	case m1 != nil && m2 == nil:
		p.errAt(m1.Span, "M (third body) must appear on both sides")
	case m2 != nil && m1 == nil:
		p.errAt(m2.Span, "M (third body) must appear on both sides")
	case m1 != nil && (f1 != nil || f2 != nil):
		p.errAt(m1.Span, "a reaction cannot have both M and a (+M) falloff collider")
	case f1 != nil && f2 == nil:
		p.errAt(f1.Span, "%s must appear on both sides", f1.Text)
	case f2 != nil && f1 == nil:
		p.errAt(f2.Span, "%s must appear on both sides", f2.Text)
	case f1 != nil && f1.Text != f2.Text:
		p.errAt(f2.Span, "falloff collider %s differs from %s on the reactant side", f2.Text, f1.Text)
	default:
		st.ThirdBody = m1 != nil
		if f1 != nil {
			return *f1, true
		}
	}
	return fall, false
}

// copyTerms appends src to dst (which has room for it); it returns nil for
// an empty src (whether the reused buffer src comes from was used before
// must not show in the tree: a statement reads the same in any file).
func copyTerms(dst, src []Term) []Term {
	if len(src) == 0 {
		return nil
	}
	return append(dst, src...)
}

func isFalloffToken(s string) bool {
	return len(s) > 3 && strings.HasPrefix(s, "(+") && strings.HasSuffix(s, ")")
}

// side parses one side of an equation. It returns the terms, the M token,
// the falloff token and whether the side was well formed.
func (p *parser) side(toks []Token, arrow Token, which string, terms []Term) (_ []Term, m, fall *Token, ok bool) {
	if len(toks) == 0 {
		if which == "reactant" {
			p.errAt(arrow.Span, "empty reactant side: expected a species before %s", arrow.Text)
		} else {
			p.errAt(arrow.Span, "empty product side: expected a species after %s", arrow.Text)
		}
		return nil, nil, nil, false
	}
	expectTerm := true
	var prev Token
	for i := 0; i < len(toks); i++ {
		t := toks[i]
		if fall != nil {
			p.errAt(t.Span, "unexpected %q after %s: the falloff collider ends the %s side", t.Text, fall.Text, which)
			return terms, m, fall, false
		}
		if !expectTerm {
			switch {
			case t.Text == "+":
				expectTerm = true
				prev = t
			case isFalloffToken(t.Text):
				fall = &toks[i]
			default:
				p.errAt(t.Span, "expected \"+\" between %q and %q", prev.Text, t.Text)
				return terms, m, fall, false
			}
			continue
		}
		// expecting a term
		switch {
		case t.Text == "+":
			p.errAt(t.Span, "expected a species name, found \"+\"")
			return terms, m, fall, false
		case isFalloffToken(t.Text):
			if len(terms) == 0 && m == nil {
				p.errAt(t.Span, "expected a species before %s", t.Text)
			} else {
				p.errAt(t.Span, "expected a species name after \"+\", found %s", t.Text)
			}
			return terms, m, fall, false
		case t.Text == "M":
			if m != nil {
				p.errAt(t.Span, "M (third body) appears twice on the %s side", which)
				return terms, m, fall, false
			}
			m = &toks[i]
		default:
			term := Term{Coeff: 1, Name: t}
			if n, v, err := parseNumber(t.Text); n == len(t.Text) {
				// a coefficient
				if err != nil {
					p.errAt(t.Span, "number out of range: %q", t.Text)
					return terms, m, fall, false
				}
				if !(v > 0) {
					p.errAt(t.Span, "bad coefficient %q: must be a positive number", t.Text)
					return terms, m, fall, false
				}
				if v > MaxCoefficient {
					p.errAt(t.Span, "coefficient %q is too large: at most %d", t.Text, MaxCoefficient)
					return terms, m, fall, false
				}
				if i+1 >= len(toks) || toks[i+1].Text == "+" || isFalloffToken(toks[i+1].Text) {
					p.errAt(t.Span, "expected a species name after coefficient %q", t.Text)
					return terms, m, fall, false
				}
				next := toks[i+1]
				if next.Text == "M" {
					p.errAt(t.Span, "M (third body) cannot have a coefficient")
					return terms, m, fall, false
				}
				if scanNumber(next.Text) == len(next.Text) {
					p.errAt(next.Span, "expected a species name after coefficient %q, found %q", t.Text, next.Text)
					return terms, m, fall, false
				}
				term = Term{Coeff: v, CoeffTok: p.newToken(t), Name: next}
				i++
				t = next
			}
			if j := strings.Index(t.Text, "(+"); j > 0 && strings.HasSuffix(t.Text, ")") {
				p.errAt(t.Span, "write %q as a separate token: %s %s", t.Text[j:], t.Text[:j], t.Text[j:])
				return terms, m, fall, false
			}
			if msg := nameProblem(t.Text); msg != "" {
				p.errAt(t.Span, "%s", msg)
				return terms, m, fall, false
			}
			if len(terms) == MaxSideTerms {
				p.errAt(t.Span, "too many terms: at most %d per side", MaxSideTerms)
				return terms, m, fall, false
			}
			terms = append(terms, term)
		}
		expectTerm = false
		prev = t
	}
	if expectTerm {
		p.errAt(prev.Span, "expected a species name after \"+\"")
		return terms, m, fall, false
	}
	if len(terms) == 0 {
		p.errAt(m.Span, "the %s side has only a third body M: expected a species", which)
		return terms, m, fall, false
	}
	return terms, m, fall, true
}

// rate parses A=, n=, Ea= tokens. what names the line for messages ("" for
// the reaction line itself).
// rateStore is the storage of one Arrhenius set (one allocation).
type rateStore struct {
	r Arrhenius
	n [3]Number
}

func (p *parser) rate(key Token, toks []Token, what string) *Arrhenius {
	return p.rateInto(p.rates.new(), key, toks, what)
}

func (p *parser) rateInto(ra *rateStore, key Token, toks []Token, what string) *Arrhenius {
	if len(toks) == 0 {
		p.errAt(endOf(key), "expected A=, n= and Ea= after %s", key.Text)
		return nil
	}
	r := &ra.r
	r.Span = RelSpan{toks[0].Span.From, toks[len(toks)-1].Span.To}
	for _, tk := range toks {
		k, v, ok := splitPair(tk)
		var dst **Number
		var slot *Number
		kind := kDimless
		if ok {
			switch k.Text {
			case "A":
				dst, slot = &r.A, &ra.n[0]
			case "n":
				dst, slot = &r.N, &ra.n[1]
			case "Ea":
				dst, slot, kind = &r.Ea, &ra.n[2], kEa
			}
		}
		if dst == nil {
			p.errAt(tk.Span, "unexpected %q in %s: expected A=, n= or Ea=", tk.Text, rateContext(what))
			continue
		}
		if *dst != nil {
			p.errAt(tk.Span, "duplicate %s= in %s", k.Text, rateContext(what))
			continue
		}
		if v.Text == "" {
			p.errAt(tk.Span, "expected a number after %s=", k.Text)
			continue
		}
		if n, ok := p.number(v, kind); ok {
			*slot = n
			*dst = slot
		}
	}
	var miss []string
	if r.A == nil {
		miss = append(miss, "A=")
	}
	if r.N == nil {
		miss = append(miss, "n=")
	}
	if r.Ea == nil {
		miss = append(miss, "Ea=")
	}
	if len(miss) > 0 {
		p.missingRate(r, miss, rateContext(what))
	}
	return r
}

// rateContext names a set of rate parameters in messages: "rate
// parameters" for the reaction line, else e.g. "low-pressure rate
// parameters".
func rateContext(what string) string {
	if what == "" {
		return "rate parameters"
	}
	return what + " rate parameters"
}

func (p *parser) missingRate(r *Arrhenius, miss []string, ctx string) {
	// Do not pile a "missing" error on a token that already has an error.
	for i := len(p.f.Diags) - 1; i >= 0; i-- {
		d := p.f.Diags[i]
		if d.Span.Start < r.Span.From {
			break
		}
		if d.Span.End <= r.Span.To {
			return
		}
	}
	p.errAt(r.Span, "incomplete %s: missing %s (A=, n= and Ea= are all required)", ctx, strings.Join(miss, ", "))
}

func (p *parser) troe(lt []Token) *Troe {
	key := lt[0]
	if len(lt) < 2 {
		p.errAt(endOf(key), "expected alpha=, T3=, T1= and optionally T2= after troe")
		return nil
	}
	ta := p.troes.new()
	tr := &ta.t
	tr.Span = RelSpan{lt[1].Span.From, lt[len(lt)-1].Span.To}
	for _, tk := range lt[1:] {
		k, v, ok := splitPair(tk)
		var dst **Number
		var slot *Number
		kind := kTemp
		if ok {
			switch k.Text {
			case "alpha":
				dst, slot, kind = &tr.Alpha, &ta.n[0], kDimless
			case "T3":
				dst, slot = &tr.T3, &ta.n[1]
			case "T1":
				dst, slot = &tr.T1, &ta.n[2]
			case "T2":
				dst, slot = &tr.T2, &ta.n[3]
			}
		}
		if dst == nil {
			p.errAt(tk.Span, "unexpected %q in troe: expected alpha=, T3=, T1= or T2=", tk.Text)
			continue
		}
		if *dst != nil {
			p.errAt(tk.Span, "duplicate %s= in troe", k.Text)
			continue
		}
		if n, ok := p.number(v, kind); ok {
			*slot = n
			*dst = slot
		}
	}
	var miss []string
	if tr.Alpha == nil {
		miss = append(miss, "alpha=")
	}
	if tr.T3 == nil {
		miss = append(miss, "T3=")
	}
	if tr.T1 == nil {
		miss = append(miss, "T1=")
	}
	if len(miss) > 0 {
		p.missingTroe(tr, miss)
	}
	return tr
}

func (p *parser) missingTroe(tr *Troe, miss []string) {
	for i := len(p.f.Diags) - 1; i >= 0; i-- {
		d := p.f.Diags[i]
		if d.Span.Start < tr.Span.From {
			break
		}
		if d.Span.End <= tr.Span.To {
			return
		}
	}
	p.errAt(tr.Span, "incomplete troe parameters: missing %s", strings.Join(miss, ", "))
}

func (p *parser) efficiencies(lt []Token) []Efficiency {
	key := lt[0]
	if len(lt) < 2 {
		p.errAt(endOf(key), "expected NAME=VALUE pairs after efficiencies")
		return nil
	}
	out := p.effs.take(len(lt) - 1)
	for _, tk := range lt[1:] {
		k, v, ok := splitPair(tk)
		if !ok {
			p.errAt(tk.Span, "expected a NAME=VALUE pair, found %q", tk.Text)
			continue
		}
		if msg := nameProblem(k.Text); msg != "" {
			p.errAt(k.Span, "%s", msg)
			continue
		}
		n, ok := p.number(v, kDimless)
		if !ok {
			continue
		}
		if n.Value < 0 {
			p.errAt(v.Span, "efficiency must be >= 0, found %s", v.Text)
			continue
		}
		dup := false
		for _, e := range out {
			if e.Name.Text == k.Text {
				p.errAt(k.Span, "duplicate efficiency for %s", k.Text)
				dup = true
				break
			}
		}
		if !dup {
			out = append(out, Efficiency{Name: k, Value: n})
		}
	}
	return out
}

func (p *parser) pressure(lt []Token, st *Reaction) {
	key := lt[0]
	if len(lt) < 2 {
		p.errAt(endOf(key), "expected a pressure with a unit after pressure, e.g. 1atm")
		return
	}
	pn, ok := p.number(lt[1], kPressure)
	if !ok {
		return
	}
	if !(pn.SI > 0) {
		p.errAt(lt[1].Span, "pressure must be positive, found %s", lt[1].Text)
		return
	}
	if n := len(st.Pressures); n > 0 && pn.SI <= st.Pressures[n-1].P.SI {
		p.errAt(lt[1].Span, "pressures must increase: %s after %s", lt[1].Text, st.Pressures[n-1].P.Tok.Text)
		return
	}
	if len(lt) < 3 {
		p.errAt(endOf(lt[1]), "expected A=, n= and Ea= after the pressure")
		return
	}
	r := p.rate(lt[1], lt[2:], "pressure")
	st.Pressures = append(st.Pressures, PressureRate{P: pn, Rate: *r})
}

// ---- numbers ----

type unitKind uint8

const (
	kDimless  unitKind = iota // no unit allowed
	kEnergy                   // energy per mole
	kEa                       // activation energy: energy units or K
	kEntropy                  // entropy / heat capacity
	kTemp                     // temperature: K or nothing
	kPressure                 // pressure: unit required
)

// entropyUnit returns J/(mol K) per unit u of entropy or heat capacity.
func entropyUnit(u string) (float64, bool) {
	switch u {
	case "cal/mol/K":
		return JoulesPerCalorie, true
	case "J/mol/K":
		return 1, true
	case "kcal/mol/K":
		return 4184, true
	case "kJ/mol/K":
		return 1000, true
	}
	return 0, false
}

// PressureUnit returns Pa per unit u of pressure (atm, bar, Pa, kPa, Torr:
// the units FORMAT.md §2 accepts), so that command-line flags read
// pressures exactly as files do.
func PressureUnit(u string) (float64, bool) { return pressureUnit(u) }

// pressureUnit returns Pa per unit u of pressure.
func pressureUnit(u string) (float64, bool) {
	switch u {
	case "atm":
		return PascalsPerAtm, true
	case "bar":
		return PascalsPerBar, true
	case "Pa":
		return 1, true
	case "kPa":
		return 1000, true
	case "Torr":
		return PascalsPerTorr, true
	}
	return 0, false
}

var unitLists = [...]string{
	kEnergy:   "kcal/mol, kJ/mol, cal/mol or J/mol",
	kEa:       "kcal/mol, kJ/mol, cal/mol, J/mol or K",
	kEntropy:  "cal/mol/K, J/mol/K, kcal/mol/K or kJ/mol/K",
	kTemp:     "K",
	kPressure: "atm, bar, Pa, kPa or Torr",
}

// scanNumber returns the length of the longest prefix of s that is a number
// per FORMAT.md §1.1, or 0.
func scanNumber(s string) int {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	d := 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i++
		d++
	}
	if i < len(s) && s[i] == '.' {
		i++
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i++
			d++
		}
	}
	if d == 0 {
		return 0
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		if k > j {
			i = k
		}
	}
	return i
}

// number parses tok as a number of the given kind, reporting errors.
func (p *parser) number(tok Token, kind unitKind) (Number, bool) {
	s := tok.Text
	n, v, err := parseNumber(s)
	if n == 0 {
		if s == "" {
			p.errAt(tok.Span, "expected a number")
		} else {
			p.errAt(tok.Span, "expected a number, found %q", s)
		}
		return Number{}, false
	}
	if unit := s[n:]; len(unit) > 0 && (unit[0] == 'd' || unit[0] == 'D') && scanNumber("1e"+unit[1:]) == len(unit)+1 {
		p.errAt(tok.Span, "malformed number %q: the exponent letter is e, not %c (write %se%s)", s, unit[0], s[:n], unit[1:])
		return Number{}, false
	}
	if err != nil {
		p.errAt(tok.Span, "number out of range: %q", s)
		return Number{}, false
	}
	num := Number{Tok: tok, Value: v}
	if n < len(s) {
		num.Unit = s[n:] // else leave the nil string: one pointer less for the GC
	}
	factor := 1.0
	var ok bool
	switch kind {
	case kDimless:
		ok = num.Unit == ""
		if !ok {
			p.errAt(tok.Span, "malformed number %q", s)
			return Number{}, false
		}
	case kEnergy, kEa:
		if num.Unit == "" {
			factor, ok = p.energyFactor, true
		} else if kind == kEa && num.Unit == "K" {
			factor, ok = GasConstant, true
		} else {
			factor, ok = energyUnit(num.Unit)
		}
	case kEntropy:
		if num.Unit == "" {
			factor, ok = p.entropyFactor, true
		} else {
			factor, ok = entropyUnit(num.Unit)
		}
	case kTemp:
		ok = num.Unit == "" || num.Unit == "K"
	case kPressure:
		if num.Unit == "" {
			p.errAt(tok.Span, "pressure %q needs a unit: %s", s, unitLists[kPressure])
			return Number{}, false
		}
		factor, ok = pressureUnit(num.Unit)
	}
	if !ok {
		p.errAt(tok.Span, "unknown unit %q in %q: expected %s", num.Unit, s, unitLists[kind])
		return Number{}, false
	}
	num.SI = v * factor
	if math.IsInf(num.SI, 0) || math.IsNaN(num.SI) {
		// 1e306 kcal/mol is a float64, its value in J/mol is not: a
		// number kiln cannot compute with is refused here, where its
		// token is, and never reaches the analysis as infinity.
		p.errAt(tok.Span, "number out of range: %q overflows when converted to %s", s, siNames[kind])
		return Number{}, false
	}
	return num, true
}

// siNames names the SI unit each kind of number is converted to.
var siNames = [...]string{
	kDimless:  "a plain number",
	kEnergy:   "J/mol",
	kEa:       "J/mol",
	kEntropy:  "J/(mol K)",
	kTemp:     "K",
	kPressure: "Pa",
}

// ParseFormula parses an element formula such as "C10H8" or "CH3O" into
// element counts in written order (a repeated element is summed into its
// first occurrence). Symbols are a capital letter optionally followed by a
// lower-case letter; counts are positive integers, default 1.
func ParseFormula(s string) ([]ElementCount, error) {
	if s == "" {
		return nil, fmt.Errorf("empty formula")
	}
	var out []ElementCount
	for i := 0; i < len(s); {
		if s[i] < 'A' || s[i] > 'Z' {
			return nil, fmt.Errorf("expected an element symbol at %q", s[i:])
		}
		j := i + 1
		if j < len(s) && s[j] >= 'a' && s[j] <= 'z' {
			j++
		}
		sym := s[i:j]
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		count := 1
		if k > j {
			c, err := strconv.Atoi(s[j:k])
			if err != nil || c < 1 {
				return nil, fmt.Errorf("bad count %q for %s", s[j:k], sym)
			}
			count = c
		}
		found := false
		for x := range out {
			if out[x].Symbol == sym {
				out[x].Count += count
				found = true
			}
		}
		if !found {
			out = append(out, ElementCount{Symbol: sym, Count: count})
		}
		i = k
	}
	return out, nil
}

// Parse parses one .kiln file. It never fails or panics: problems are
// reported in File.Diags (codes "syntax" and "no-rate") and the tree holds
// whatever could be recognised. The statements' spans tile src exactly.
func Parse(name string, src []byte) *File {
	p := newParser(name, src)
	p.run()
	return p.f
}

// nextStatement reads the next statement, skipping blank and comment lines:
// its first line (or a stray indented line) and its continuation lines up
// to the next column-0 line, which is kept pending. Its extent starts at
// extentStart; next is where the following statement's extent starts. ok is
// false at the end of the text.
func (p *parser) nextStatement(extentStart int) (st Stmt, next int, ok bool) {
	for {
		var l srcLine
		if p.hasPending {
			l, p.hasPending = p.pending, false
		} else if l, ok = p.readLine(); !ok {
			return nil, extentStart, false
		}
		if l.kind == lineBlank || l.kind == lineComment {
			continue
		}
		p.body = p.body[:0]
		lastOwn := l
		for {
			m, more := p.readLine()
			if !more {
				break
			}
			if m.kind == lineStmt {
				p.pending, p.hasPending = m, true
				break
			}
			if m.kind == lineCont {
				p.body = append(p.body, m)
				lastOwn = m
			}
		}
		base := StmtBase{
			Size:     lastOwn.next - extentStart,
			BodySpan: RelSpan{l.text, lastOwn.end},
		}
		st := p.statement(l, base)
		relativize(st, extentStart)
		return st, lastOwn.next, true
	}
}

// rateParamLike reports whether word starts like a forward rate parameter
// (A=…, n=…, Ea=…), which is written on the reaction line itself.
func rateParamLike(word string) bool {
	key, _, ok := strings.Cut(word, "=")
	return ok && isRateKey(key)
}
