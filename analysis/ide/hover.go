package ide

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/internal/wording"
	"kiln.dev/kiln/speciesfile"
)

// Caution is the line every species hover ends with; CautionTabulated
// replaces it when the species' values are reference-library data, which
// are no group estimate (CautionFor chooses).
const (
	Caution          = "Group additivity typically errs by 1–3 kcal/mol; check against measured data, licensed engineering practice and local codes before relying on it."
	CautionTabulated = "Tabulated reference data, as good as the source named (weak values carry the source's stated uncertainty); check against measured data, licensed engineering practice and local codes before relying on them."
)

// CautionFor returns the caution line for a species estimated as e (nil
// for a species without an estimate).
func CautionFor(e *analysis.Estimate) string {
	if e != nil && e.Library != "" {
		return CautionTabulated
	}
	return Caution
}

// T298 is the reference temperature, K.
const T298 = 298.15

// HoverResult is the text of a hover and the span it is about.
type HoverResult struct {
	Text string
	Span speciesfile.Span
}

// Hover describes what is at byte offset off of file: a species
// (declaration or use), a reaction, a user-defined group or an include. With
// markdown false the text is plain (no tables or emphasis).
func Hover(x *Index, file string, off int, s analysis.Settings, markdown bool) (HoverResult, bool) {
	o, ok := x.At(file, off)
	if !ok {
		return HoverResult{}, false
	}
	w := &writer{md: markdown, u: analysis.UnitsFor(s, x.File(file))}
	switch o.Kind {
	case KindSpeciesStmt, KindSpeciesDecl, KindSpeciesUse:
		if o.Species == nil {
			w.line(w.bold(o.Name) + " is not declared.")
		} else {
			w.species(o.Species)
		}
		if o.Kind == KindSpeciesStmt {
			// Point at the name so the editor highlights something sensible.
			o.Span = o.SpeciesDecl.Name.Span.At(o.Base)
		}
	case KindReactionStmt:
		if o.Reaction == nil {
			w.line(w.bold("reaction") + " " + w.code(o.Name))
			w.line("Open this file to see its thermochemistry (it is analysed as an included file here).")
		} else {
			w.reaction(x, o.Reaction)
		}
	case KindGroupStmt, KindGroupDecl:
		w.group(o)
	case KindIncludePath:
		if o.IncludePath == "" {
			w.line("include " + w.code(o.Name) + " (unresolved)")
		} else {
			f := x.File(o.IncludePath)
			w.line("include " + w.code(o.Name) + " → " + o.IncludePath)
			if f != nil {
				w.line(wording.CountAs(len(f.Species), "species", "species") + ", " + wording.Count(len(f.Reactions), "reaction") + ", " + wording.Count(len(f.Groups), "group"))
			}
		}
	default:
		return HoverResult{}, false
	}
	return HoverResult{Text: strings.TrimRight(w.b.String(), "\n"), Span: o.Span}, true
}

// writer builds markdown or plain text.
type writer struct {
	b  strings.Builder
	md bool
	u  analysis.Units
}

func (w *writer) line(s string) { w.b.WriteString(s); w.b.WriteString("\n\n") }

func (w *writer) bold(s string) string {
	if w.md {
		return "**" + escapeMD(s) + "**"
	}
	return s
}

func (w *writer) code(s string) string {
	if w.md {
		return "`" + strings.ReplaceAll(s, "`", "'") + "`"
	}
	return s
}

func (w *writer) italic(s string) string {
	if w.md {
		return "_" + s + "_"
	}
	return s
}

// table writes a markdown table, or aligned plain-text rows.
func (w *writer) table(header []string, rows [][]string) {
	if w.md {
		cell := func(s string) string { return strings.ReplaceAll(s, "|", "\\|") }
		w.b.WriteString("|")
		for _, h := range header {
			w.b.WriteString(" " + cell(h) + " |")
		}
		w.b.WriteString("\n|")
		for range header {
			w.b.WriteString("---|")
		}
		w.b.WriteString("\n")
		for _, r := range rows {
			w.b.WriteString("|")
			for _, c := range r {
				w.b.WriteString(" " + cell(c) + " |")
			}
			w.b.WriteString("\n")
		}
		w.b.WriteString("\n")
		return
	}
	width := make([]int, len(header))
	all := append([][]string{header}, rows...)
	for _, r := range all {
		for i, c := range r {
			if i < len(width) {
				width[i] = max(width[i], len([]rune(c)))
			}
		}
	}
	for _, r := range all {
		var parts []string
		for i, c := range r {
			parts = append(parts, c+strings.Repeat(" ", width[i]-len([]rune(c))))
		}
		w.b.WriteString(strings.TrimRight(strings.Join(parts, "  "), " ") + "\n")
	}
	w.b.WriteString("\n")
}

func escapeMD(s string) string {
	r := strings.NewReplacer("*", "\\*", "_", "\\_", "`", "\\`", "[", "\\[", "]", "\\]", "<", "&lt;", ">", "&gt;")
	return r.Replace(s)
}

// thermoValues are ΔHf°298 (J/mol), S°298 (J/(mol K)) and Cp at
// benson.StdTemps (J/(mol K); NaN where unknown) of one thermo source.
type thermoValues struct {
	hf, s float64
	cp    [7]float64
	poly  *nasa.NASA7
}

func estimateValues(e *analysis.Estimate) *thermoValues {
	if e == nil {
		return nil
	}
	v := &thermoValues{hf: e.Hf298, s: e.S298, cp: e.Cp}
	if p, _, err := e.NASA7(); err == nil {
		v.poly = &p
	}
	return v
}

func givenValues(g *analysis.GivenThermo) *thermoValues {
	if g == nil {
		return nil
	}
	v := &thermoValues{poly: g.Poly}
	switch {
	case g.Poly != nil:
		v.hf, v.s = g.Poly.H(T298), g.Poly.S(T298)
	case g.Table != nil:
		v.hf, v.s = g.Table.Hf298, g.Table.S298
	default:
		return nil
	}
	for i, T := range benson.StdTemps {
		v.cp[i] = math.NaN() // outside the block: no value (analysis.GivenThermo.CpAt)
		if c, ok := g.CpAt(T); ok {
			v.cp[i] = c
		}
	}
	return v
}

// inUse returns the values the analysis uses for sp and a word saying where
// they come from ("given" or "estimated"); nil when there are none.
func inUse(sp *analysis.Species) (*thermoValues, string) {
	switch sp.Source {
	case analysis.SourceFile:
		if v := givenValues(sp.Given); v != nil {
			return v, "given"
		}
	case analysis.SourceEstimate:
		if v := estimateValues(sp.Estimate); v != nil {
			return v, estimateWord(sp)
		}
	}
	return nil, ""
}

func (w *writer) species(sp *analysis.Species) {
	head := w.bold(sp.Name)
	if sp.Decl != nil && sp.Decl.SMILES != nil {
		head += " " + w.code(sp.Decl.SMILES.Text)
	}
	w.line(head)
	var facts []string
	if sp.Formula != "" {
		facts = append(facts, sp.Formula)
	}
	if sp.MolarMass > 0 {
		facts = append(facts, analysis.FormatMolarMass(sp.MolarMass))
	}
	if sp.Charge != 0 {
		facts = append(facts, fmt.Sprintf("charge %+d", sp.Charge))
	}
	if len(facts) > 0 {
		w.line(strings.Join(facts, " · "))
	}
	switch {
	case sp.SMILESError == analysis.ErrStructurePending:
		w.line("S" + strings.TrimPrefix(sp.SMILESError.Error(), "s")) // "Structure not given yet: …"
	case sp.SMILESError != nil:
		w.line("Structure not readable: " + sp.SMILESError.Error())
	}
	est, giv := estimateValues(sp.Estimate), givenValues(sp.Given)
	if est == nil && giv == nil {
		w.line("No thermochemistry: no thermo block in the file and no estimate for this structure.")
		if why := sp.Refusal(); why != "" {
			w.line(why + ". Give the species a nasa7 or thermo-table block (or, where a group is named, a `group` statement).")
		}
		return
	}
	cols := []string{""}
	var srcs []*thermoValues
	if giv != nil {
		cols = append(cols, "given")
		srcs = append(srcs, giv)
	}
	estWord := estimateWord(sp)
	if est != nil {
		cols = append(cols, estWord)
		srcs = append(srcs, est)
	}
	if giv != nil && est != nil {
		cols = append(cols, "given − "+estWord)
	}
	row := func(label string, f func(v *thermoValues) string, diff func(a, b *thermoValues) string) []string {
		r := []string{label}
		for _, v := range srcs {
			r = append(r, f(v))
		}
		if len(srcs) == 2 {
			r = append(r, diff(srcs[0], srcs[1]))
		}
		return r
	}
	var rows [][]string
	rows = append(rows, row("ΔHf°298",
		func(v *thermoValues) string { return w.u.Energy(v.hf) + " (" + w.u.Other().Energy(v.hf) + ")" },
		func(a, b *thermoValues) string { return w.u.Energy(a.hf - b.hf) }))
	rows = append(rows, row("S°298",
		func(v *thermoValues) string { return w.u.Entropy(v.s) },
		func(a, b *thermoValues) string { return w.u.Entropy(a.s - b.s) }))
	for i, T := range benson.StdTemps {
		i := i
		rows = append(rows, row(fmt.Sprintf("Cp %g K", T),
			func(v *thermoValues) string { return w.u.Entropy(v.cp[i]) },
			func(a, b *thermoValues) string { return w.u.Entropy(a.cp[i] - b.cp[i]) }))
	}
	w.table(cols, rows)

	if use, word := inUse(sp); use != nil && use.poly != nil {
		p := use.poly
		const n = 24
		vs := make([]float64, n)
		lo, hi := math.Inf(1), math.Inf(-1)
		for i := range vs {
			T := 300 + (p.THigh-300)*float64(i)/float64(n-1)
			vs[i] = p.Cp(T)
			lo, hi = math.Min(lo, vs[i]), math.Max(hi, vs[i])
		}
		w.line(fmt.Sprintf("Cp(T) %s K–%s K (%s polynomial): %s  %s … %s", analysis.FormatFixed(300, 0), analysis.FormatFixed(p.THigh, 0), word, sparkline(vs), w.u.Entropy(lo), w.u.Entropy(hi)))
	}
	if e := sp.Estimate; e != nil {
		w.estimateDetail(e)
	}
	w.line(w.italic(CautionFor(sp.Estimate)))
}

func (w *writer) estimateDetail(e *analysis.Estimate) {
	if e.Library != "" {
		w.line(fmt.Sprintf("Tabulated data from the reference library (not a group estimate): %s (%s).", e.Library, e.LibrarySource))
	}
	g := e.Group
	if g != nil {
		terms := func(ts []benson.Term) [][]string {
			var rows [][]string
			for _, t := range ts {
				rows = append(rows, []string{t.Name, fmt.Sprint(t.Count), w.u.Energy(t.Hf298), w.u.Entropy(t.S298), t.Source})
			}
			return rows
		}
		if len(g.Groups) > 0 {
			w.line(w.bold("Groups"))
			w.table([]string{"group", "count", "ΔHf°298", "S°298", "source"}, terms(g.Groups))
		}
		if len(g.Corrections) > 0 {
			w.line(w.bold("Corrections"))
			w.table([]string{"correction", "count", "ΔHf°298", "S°298", "source"}, terms(g.Corrections))
		}
		facts := []string{"σ = " + g.Sigma(), fmt.Sprintf("optical isomers = %d", g.OpticalIsomers)}
		if g.Multiplicity > 0 {
			facts = append(facts, fmt.Sprintf("multiplicity = %d", g.Multiplicity))
		}
		w.line(strings.Join(facts, " · "))
		for _, m := range e.Flags() {
			// The words of estimate and summary (analysis.FlagLine), styled.
			w.line(w.bold(analysis.FlagHeading(m)) + " " + w.code(analysis.FlagText(m)))
		}
	}
	if e.Uncertainty > 0 {
		unc := "Uncertainty ±" + w.u.Energy(e.Uncertainty)
		if g != nil && g.Class != "" {
			unc += " (class " + g.Class + ")"
		} else if e.Library != "" {
			unc += " (1σ: half the ±" + w.u.Energy(e.StatedUncertainty) + " its source gives, read as a 95 % bound)"
		}
		w.line(unc)
	}
	if g != nil && g.UncertaintyS298 > 0 {
		w.line("S°298 uncertainty at least ±" + w.u.Entropy(g.UncertaintyS298) + " (approximations that change S°)")
	}
	if _, fit, err := e.NASA7(); err != nil {
		w.line("NASA-7 fit failed: " + analysis.FitRefusal(err, w.u))
	} else if fit.MaxCpResidual > 0 && e.LibraryRefitted() {
		w.line("NASA-7 polynomial: refitted to the fit temperatures from the library's, worst Cp residual " + w.u.Entropy(fit.MaxCpResidual))
	} else if fit.MaxCpResidual > 0 && e.Library != "" {
		w.line("NASA-7 polynomial: the library's fit to its source's Cp, worst residual " + w.u.Entropy(fit.MaxCpResidual))
	} else if fit.MaxCpResidual > 0 {
		w.line("NASA-7 fit: worst Cp residual " + w.u.Entropy(fit.MaxCpResidual))
	}
}

func (w *writer) reaction(x *Index, r *analysis.Reaction) {
	w.line(w.bold("reaction") + " " + w.code(r.Equation))
	switch {
	case r.Balance == nil:
		w.line("Balance: not checked (a species lacks a composition).")
	case r.Balance.Balanced:
		w.line("Balance: balanced ✓")
	default:
		w.line("Balance: unbalanced — " + r.Balance.Message())
	}
	if !r.Resolved {
		w.line("Some species are not declared; thermochemistry is not computed.")
	}
	var rows [][]string
	if r.DH298 != nil {
		rows = append(rows, []string{"ΔH°r(298 K)", w.u.Energy(*r.DH298)})
	}
	if r.DS298 != nil {
		rows = append(rows, []string{"ΔS°r(298 K)", w.u.Entropy(*r.DS298)})
	}
	if r.DG298 != nil {
		rows = append(rows, []string{"ΔG°r(298 K)", w.u.Energy(*r.DG298)})
	}
	keys := make([]string, 0, len(r.Kp))
	for k := range r.Kp {
		keys = append(keys, k)
	}
	sort.Slice(keys, func(i, j int) bool {
		var a, b float64
		fmt.Sscan(keys[i], &a)
		fmt.Sscan(keys[j], &b)
		return a < b
	})
	for _, k := range keys {
		v := "—"
		if p := r.Kp[k]; p != nil {
			v = analysis.FormatSig(*p)
		}
		rows = append(rows, []string{"Kp(" + k + " K)", v})
	}
	at := ""
	if r.PressureDependent() {
		p := x.r.Settings.Pressure
		if p == 0 {
			p = 101325
		}
		at = " at " + analysis.FormatBar(p/1e5)
	}
	if r.ForwardRate1000 != nil {
		rows = append(rows, []string{"k_f(1000 K)", analysis.FormatSig(*r.ForwardRate1000) + " " + analysis.RateUnits(r.ForwardOrder) + at})
	}
	if r.ReverseRate1000 != nil {
		rows = append(rows, []string{"k_r(1000 K)", analysis.FormatSig(*r.ReverseRate1000) + " " + analysis.RateUnits(r.ReverseOrder) + at})
	}
	if u, ok := x.Result().ReverseRateUncertainty(r, 1000); ok {
		rows = append(rows, []string{"k_r uncertainty (1000 K)", reverseFactorText(u, w.u)})
	}
	if len(rows) > 0 {
		w.table([]string{"quantity", "value"}, rows)
	}
	switch {
	case r.Collision != nil:
		w.line("Collision limit: exceeded — " + r.Collision.Message())
	case r.Decl != nil && r.Decl.Rate != nil && (r.ForwardOrder > 3 || (r.Decl.Reversible && r.ReverseOrder > 3)):
		w.line("Collision limit: not checked (no bound for steps of more than three molecules).")
	case r.Decl != nil && r.Decl.Rate != nil:
		w.line("Collision limit: within the bound at 300–2500 K.")
	default:
		w.line("Collision limit: not checked (no rate parameters).")
	}
}

func (w *writer) group(o Occurrence) {
	name := o.Name
	if o.Group != nil {
		name = o.Group.Name
	}
	w.line(w.bold("group") + " " + w.code(name) + " (user-defined)")
	d := o.GroupDecl
	if d == nil {
		return
	}
	var rows [][]string
	if d.Hf298 != nil {
		rows = append(rows, []string{"ΔHf°298", w.u.Energy(d.Hf298.SI)})
	}
	if d.S298 != nil {
		rows = append(rows, []string{"S°298", w.u.Entropy(d.S298.SI)})
	}
	for _, p := range d.Cp {
		rows = append(rows, []string{"Cp " + analysis.FormatFixed(p.T.SI, 0) + " K", w.u.Entropy(p.Cp.SI)})
	}
	if len(rows) > 0 {
		w.table([]string{"quantity", "value"}, rows)
	}
	if d.Source != nil {
		w.line("Source: " + d.Source.Text)
	}
	switch {
	case o.Group == nil:
		w.line("This group is not in effect (bad name or a duplicate definition).")
	case len(o.Group.UsedBy) == 0:
		w.line("Used by no species.")
	default:
		w.line("Used by: " + strings.Join(o.Group.UsedBy, ", "))
	}
}

// reverseFactorText describes the factor a reverse rate inherits from
// estimated thermochemistry, e.g. "×/÷ 1.50 (σ(ΔG°r) = 0.81 kcal/mol from the
// estimates of propane, propyl)".
func reverseFactorText(u analysis.ReverseUncertainty, un analysis.Units) string {
	given := ""
	if len(u.Given) > 0 {
		given = strings.Join(u.Given, ", ") + " from the file's own thermo blocks, which state no uncertainty"
	}
	if len(u.Estimated) == 0 {
		if given != "" {
			return "not known (" + given + ")"
		}
		return "×/÷ 1 (no estimated thermo: all from the reference library)"
	}
	ge := ""
	if len(u.Unmeasured) > 0 || len(u.Given) > 0 {
		ge = "≥ "
	}
	s := fmt.Sprintf("%s×/÷ %.2f (σ(ΔG°r) = %s from the estimates of %s", ge, u.Factor, un.Energy(u.Sigma), strings.Join(u.Estimated, ", "))
	if len(u.Unmeasured) > 0 {
		s += "; no measured error for " + strings.Join(u.Unmeasured, ", ")
	}
	if given != "" {
		s += "; " + given
	}
	return s + ")"
}

// sparkline draws values as one line of the eight block characters ▁…█,
// scaled from the smallest to the largest value (all the same → "▄…").
func sparkline(vs []float64) string {
	const bars = "▁▂▃▄▅▆▇█"
	runes := []rune(bars)
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	var b strings.Builder
	for _, v := range vs {
		i := 3
		if hi > lo {
			i = int(math.Round((v - lo) / (hi - lo) * 7))
		}
		b.WriteRune(runes[max(0, min(7, i))])
	}
	return b.String()
}

// estimateWord heads sp's estimate where hover shows it: "estimated", or
// the library word for reference-library data (tabulated, not a group
// estimate).
func estimateWord(sp *analysis.Species) string {
	if sp.ReferenceLibrary() != "" {
		return sp.ThermoWord()
	}
	return "estimated"
}
