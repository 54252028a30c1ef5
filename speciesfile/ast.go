// Package speciesfile reads the kiln mechanism format (.kiln files): it turns
// the text of one file into a lossless syntax tree whose every token carries
// byte offsets (relative to its statement, whose start the File holds: see
// RelSpan and File.Starts), resolves units to SI, reports local problems as diagnostics,
// converts byte offsets to line/column positions (LineIndex), and formats the
// small pieces of text that tools insert into files (FormatNASA7Block,
// FormatNumber, File.ThermoInsertion). It does no I/O and never follows
// includes; cross-file checks belong to the analysis layer.
//
// The format itself is specified in FORMAT.md at the repository root.
package speciesfile

// Span is a half-open byte range [Start, End) into a file's source.
type Span struct{ Start, End int }

// Len returns End-Start.
func (s Span) Len() int { return s.End - s.Start }

// Contains reports whether off lies in [Start, End).
func (s Span) Contains(off int) bool { return off >= s.Start && off < s.End }

// Rel returns s relative to a statement starting at base.
func (s Span) Rel(base int) RelSpan { return RelSpan{s.Start - base, s.End - base} }

// RelSpan is a half-open byte range [From, To) relative to the start of
// the statement that holds it (the start of its extent, File.Starts). Every
// span inside a statement node is a RelSpan, so that a statement moved by
// an edit elsewhere in the file is the same node in the old and the new
// parse (see Reparse); File.Abs and RelSpan.At give the absolute span.
// (Its fields are named apart from Span's so that no relative offset is
// used as an absolute one by mistake.)
type RelSpan struct{ From, To int }

// At returns the absolute span of r in a statement starting at base.
func (r RelSpan) At(base int) Span { return Span{r.From + base, r.To + base} }

// Len returns To-From.
func (r RelSpan) Len() int { return r.To - r.From }

// IsZero reports whether r is the zero RelSpan (a missing part).
func (r RelSpan) IsZero() bool { return r == RelSpan{} }

// Severity is the severity of a diagnostic; the values match the LSP
// DiagnosticSeverity numbering (1 = error … 4 = hint).
type Severity int

// Severities, in LSP order.
const (
	SeverityError Severity = iota + 1
	SeverityWarning
	SeverityInformation
	SeverityHint
)

// String returns "error", "warning", "information" or "hint".
func (s Severity) String() string {
	switch s {
	case SeverityError:
		return "error"
	case SeverityWarning:
		return "warning"
	case SeverityInformation:
		return "information"
	case SeverityHint:
		return "hint"
	}
	return "unknown"
}

// Stable diagnostic codes. This is the full list, for the reader and the
// analysis layer alike; it is a public interface (editors and CI scripts
// filter on it): codes are only ever added, never renamed. FORMAT.md
// describes each code.
const (
	CodeSyntax              = "syntax"
	CodeUndeclaredSpecies   = "undeclared-species"
	CodeDuplicateSpecies    = "duplicate-species"
	CodeBadSMILES           = "bad-smiles"
	CodeUnbalancedReaction  = "unbalanced-reaction"
	CodeMissingGroup        = "missing-group"
	CodeMissingThermo       = "missing-thermo"
	CodeThermoDiscontinuity = "thermo-discontinuity"
	CodeThermoMismatch      = "thermo-mismatch"
	CodeNonphysicalThermo   = "nonphysical-thermo"
	CodeNoRate              = "no-rate"
	CodeCollisionLimit      = "collision-limit"
	CodeDuplicateReaction   = "duplicate-reaction"
	// Extensions of the list in FORMAT.md (reported by the analysis layer).
	CodeBadInclude          = "bad-include"
	CodeDuplicateGroup      = "duplicate-group"
	CodeThermoOutOfRange    = "thermo-out-of-range"
	CodeGroupOverride       = "group-override"
	CodeNonphysicalRate     = "nonphysical-rate"
	CodeCompositionMismatch = "composition-mismatch"
	CodeRateOutOfRange      = "rate-out-of-range"
	CodeUnusedRate          = "unused-rate"
)

// Codes lists every diagnostic code, in FORMAT.md's order: the one list
// (FORMAT.md's table is checked against it by a test).
var Codes = []string{CodeSyntax, CodeUndeclaredSpecies, CodeDuplicateSpecies, CodeBadSMILES, CodeUnbalancedReaction,
	CodeMissingGroup, CodeMissingThermo, CodeThermoDiscontinuity, CodeThermoMismatch, CodeNonphysicalThermo,
	CodeNoRate, CodeCollisionLimit, CodeDuplicateReaction, CodeBadInclude, CodeDuplicateGroup, CodeThermoOutOfRange,
	CodeGroupOverride, CodeNonphysicalRate, CodeCompositionMismatch,
	CodeRateOutOfRange, CodeUnusedRate}

// Related points at another place (possibly in another file) that explains a
// diagnostic, e.g. the first declaration of a duplicated species.
type Related struct {
	File    string
	Span    Span
	Message string
}

// Diagnostic is one problem found in a file.
type Diagnostic struct {
	Span     Span
	Severity Severity
	Code     string
	Message  string
	Related  []Related
}

// Token is a run of source bytes. Span is relative to the start of the
// statement holding the token; Text is the source bytes of the span (shared
// with a string of the source, not a copy per token).
type Token struct {
	Span RelSpan
	Text string
}

// Number is a numeric token, optionally with an attached unit
// ("69.5kJ/mol", "0.1atm", "40.6J/mol/K").
//
//   - Value is the number as written (in the attached unit, or in the file's
//     unit when none is attached).
//   - Unit is the attached unit as written, "" if none.
//   - SI is Value resolved to SI: energies in J/mol, entropies and heat
//     capacities in J/(mol K), pressures in Pa, temperatures in K, activation
//     energies in J/mol (an Ea given in K is multiplied by R = 8.314462618
//     J/(mol K)). Dimensionless numbers (n, NASA coefficients, efficiencies,
//     Troe alpha) and the pre-exponential factor A (kept in cm3, mol, s units,
//     because its dimension depends on the reaction order) have SI == Value.
type Number struct {
	Tok   Token
	Value float64
	Unit  string
	SI    float64
}

// File is the parse result for one .kiln file.
//
// Statement nodes hold positions relative to their own start (RelSpan), and
// the file holds where each statement starts (Starts): a statement moved by
// an edit elsewhere is shared, unchanged, by the parses before and after the
// edit. A File and its nodes are never modified once returned.
type File struct {
	Name  string // as passed to Parse (used in messages only)
	Src   []byte // the source, unmodified
	Stmts []Stmt // every statement in order; their extents tile Src exactly
	// Starts[i] is the offset in Src where the extent of Stmts[i] begins.
	Starts []int
	Diags  []Diagnostic
	Lines  *LineIndex

	// EnergyUnit is the file's energy unit: "kcal/mol" (default), "kJ/mol",
	// "cal/mol" or "J/mol". EntropyUnit follows from it: "cal/mol/K" for
	// kcal/cal files, "J/mol/K" for kJ/J files.
	EnergyUnit  string
	EntropyUnit string

	// Newline is the file's prevailing line terminator, "\n" or "\r\n"
	// ("\n" when the file has no line terminator or mostly lone CRs).
	Newline string
	// BOM reports whether Src starts with a UTF-8 byte order mark (which is
	// skipped by the lexer and belongs to the first statement's span).
	BOM bool

	// Convenience views of Stmts, in file order.
	Species   []*Species
	Reactions []*Reaction
	Includes  []*Include
	Groups    []*Group

	// speciesAt, reactionsAt, includesAt and groupsAt give the index in
	// Stmts of each element of the lists above.
	speciesAt, reactionsAt, includesAt, groupsAt []int32
	// index maps a statement node to its index in Stmts (made on first
	// use by Start; shared by shallow copies of the File).
	index *stmtIndex
}

// Stmt is one top-level statement: *Units, *Include, *Group, *Species,
// *Reaction, *BadStmt or *Trivia. Its positions are relative to its start
// (see File.Starts, File.Start, File.Abs).
type Stmt interface {
	// Len is the length of the statement's full extent: its leading
	// blank/comment lines, its keyword line, its continuation lines and the
	// final line terminator (the last statement also owns trailing trivia
	// up to end of file). The extents of File.Stmts tile File.Src.
	Len() int
	// Keyword is the statement keyword token (empty for *Trivia).
	Keyword() Token
	// Body is the statement without leading trivia: from the keyword to the
	// end of its last own line, excluding the line terminator and trailing
	// comment/blank lines.
	Body() RelSpan
}

// StmtBase holds the fields every statement has.
type StmtBase struct {
	Size       int     // see Stmt.Len
	BodySpan   RelSpan // see Stmt.Body
	KeywordTok Token   // see Stmt.Keyword
}

// Len implements Stmt.
func (b *StmtBase) Len() int { return b.Size }

// Keyword implements Stmt.
func (b *StmtBase) Keyword() Token { return b.KeywordTok }

// Body implements Stmt.
func (b *StmtBase) Body() RelSpan { return b.BodySpan }

// Units is `units UNIT`.
type Units struct {
	StmtBase
	Unit Token
}

// Include is `include PATH`.
type Include struct {
	StmtBase
	Path Token // raw path text, relative to the including file
}

// Species is `species NAME [SMILES]` with its attribute lines.
type Species struct {
	StmtBase
	Name           Token
	SMILES         *Token // nil if absent (lumped species)
	Multiplicity   *IntAttr
	Symmetry       *IntAttr
	OpticalIsomers *IntAttr
	Composition    *Token
	// Formula is Composition parsed into element counts, in written order
	// (nil when there is no valid composition line).
	Formula []ElementCount
	Note    *Token
	NASA7   *NASA7Block
	Table   *ThermoTable
	Attrs   []Attr // every attribute line in order, for folding/formatting
}

// ElementCount is one element of a composition formula ("C10H8" → C:10, H:8).
type ElementCount struct {
	Symbol string
	Count  int
}

// IntAttr is an integer attribute such as `symmetry 3`.
type IntAttr struct {
	Key   Token
	Value int
	Tok   Token
}

// NASA7Block is a `nasa7 TLOW TMID THIGH` block with its low/high/source
// lines. Cp/R = a1 + a2 T + a3 T^2 + a4 T^3 + a5 T^4;
// H/(RT) = a1 + a2 T/2 + a3 T^2/3 + a4 T^3/4 + a5 T^4/5 + a6/T;
// S/R = a1 ln T + a2 T + a3 T^2/2 + a4 T^3/3 + a5 T^4/4 + a7.
// Low applies on [TLow, TMid], High on [TMid, THigh] (T in K).
type NASA7Block struct {
	Span              RelSpan // header line through last block line (no terminator)
	Header            Token
	TLow, TMid, THigh Number
	Low, High         [7]Number
	LowSpan, HighSpan RelSpan // the low/high lines (empty when missing)
	Source            *Token
}

// Coeffs returns the low and high coefficients as plain numbers.
func (b *NASA7Block) Coeffs() (low, high [7]float64) {
	for i := range 7 {
		low[i] = b.Low[i].Value
		high[i] = b.High[i].Value
	}
	return low, high
}

// ThermoTable is a `thermo-table` block: tabulated ΔHf°298, S°298 and Cp(T).
type ThermoTable struct {
	Span   RelSpan // header line through last block line (no terminator)
	Header Token
	Hf298  *Number // SI J/mol
	S298   *Number // SI J/(mol K)
	Cp     []CpPoint
	Source *Token
}

// CpPoint is one `T=value` pair: T in K, Cp in SI J/(mol K).
type CpPoint struct {
	T  Number
	Cp Number
}

// Group is `group NAME` with hf298/s298/cp/source lines: a user-supplied
// Benson group value.
type Group struct {
	StmtBase
	Name   Token
	Hf298  *Number // SI J/mol
	S298   *Number // SI J/(mol K)
	Cp     []CpPoint
	Source *Token
	Attrs  []Attr
}

// Term is one reactant or product: `NAME` or `COEFF NAME`.
type Term struct {
	Coeff    float64 // 1 when no coefficient is written
	CoeffTok *Token
	Name     Token
}

// Arrhenius is a set of modified-Arrhenius parameters, k = A T^n exp(-Ea/RT).
// A is in cm3, mol, s units (SI == Value), n is dimensionless and Ea.SI is
// in J/mol. A field is nil when absent (only possible after a syntax error).
type Arrhenius struct {
	Span     RelSpan // from the first parameter to the last
	A, N, Ea *Number
}

// Troe holds `troe alpha=… T3=… T1=… [T2=…]`; T3, T1, T2 in K.
type Troe struct {
	Span              RelSpan
	Alpha, T3, T1, T2 *Number
}

// Efficiency is one `NAME=value` third-body efficiency.
type Efficiency struct {
	Name  Token
	Value Number
}

// PressureRate is one `pressure P A=… n=… Ea=…` line.
type PressureRate struct {
	P    Number // SI Pa
	Rate Arrhenius
}

// Reaction is `reaction EQUATION [A=… n=… Ea=…]` with its attribute lines.
type Reaction struct {
	StmtBase
	Equation            RelSpan // the equation text, from the first term to the last
	Reactants, Products []Term
	Reversible          bool
	Arrow               Token
	ThirdBody           bool   // a bare M term on both sides
	Falloff             *Token // the "(+M)" or "(+AR)" token on the reactant side
	Rate                *Arrhenius
	LowPressure         *Arrhenius
	Troe                *Troe
	Efficiencies        []Efficiency
	Pressures           []PressureRate
	Duplicate           *Token
	Reverse             *Arrhenius
	Note                *Token
	Attrs               []Attr
}

// FalloffCollider returns the collider named in the falloff token: "M" for
// "(+M)", "AR" for "(+AR)", "" when the reaction is not a falloff reaction.
func (r *Reaction) FalloffCollider() string {
	if r.Falloff == nil || len(r.Falloff.Text) < 3 {
		return ""
	}
	return r.Falloff.Text[2 : len(r.Falloff.Text)-1]
}

// Attr is one attribute line of a statement (a block attribute includes its
// block lines).
type Attr struct {
	Key  Token
	Span RelSpan // the whole attribute line(s) incl. block, excluding the final terminator
}

// BadStmt is a statement that could not be parsed (unknown keyword, or
// indented lines with no statement above them). Its lines are skipped.
type BadStmt struct {
	StmtBase
}

// Trivia holds a file's blank and comment lines when the file has no
// statement at all, so that Stmts still tiles Src.
type Trivia struct {
	StmtBase
}

// Position is a 0-based line/column position. Col counts bytes, Char counts
// Unicode code points and UTF16 counts UTF-16 code units from the start of
// the line (an invalid UTF-8 byte counts as one code point and one unit).
type Position struct {
	Line, Col, Char, UTF16 int
}
