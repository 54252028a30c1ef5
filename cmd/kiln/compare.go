package main

import (
	"bytes"
	"context"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"text/tabwriter"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/internal/wording"
)

// compareJSON is the output of `kiln compare --json`; the keys are a public
// contract. Energies in kJ/mol, entropies and heat capacities in J/(mol K),
// differences are B − A.
type compareJSON struct {
	A          compareFile      `json:"a"`
	B          compareFile      `json:"b"`
	Thresholds compareThreshold `json:"thresholds"`
	Summary    compareSummary   `json:"summary"`
	Species    []compareSpecies `json:"species"`
	Renames    []compareRename  `json:"renames"`
	Clashes    []compareClash   `json:"name_clashes"`
	OnlyA      []compareRef     `json:"only_in_a"`
	OnlyB      []compareRef     `json:"only_in_b"`
	Reactions  []compareRxn     `json:"reactions"`
	RxnOnlyA   []compareRxnRef  `json:"reactions_only_in_a"`
	RxnOnlyB   []compareRxnRef  `json:"reactions_only_in_b"`
}

type compareFile struct {
	File      string `json:"file"`
	Species   int    `json:"species"`
	Reactions int    `json:"reactions"`
	Errors    int    `json:"errors"`
	// Unreadable lists species whose SMILES cannot be read: they match
	// nothing and appear among the species only in their file.
	Unreadable []string `json:"unreadable_structures"`
}

type compareThreshold struct {
	Hf298      float64 `json:"hf298_kj_mol"`
	S298       float64 `json:"s298_j_mol_k"`
	RateFactor float64 `json:"rate_factor"`
}

type compareSummary struct {
	Matched          int `json:"matched_species"`
	Renamed          int `json:"renamed_species"`
	ThermoFlagged    int `json:"thermo_flagged"`
	NameClashes      int `json:"name_clashes"`
	OnlyA            int `json:"only_in_a"`
	OnlyB            int `json:"only_in_b"`
	MatchedReactions int `json:"matched_reactions"`
	// Reactions of each file in the matched pairs: a pair holds every
	// reaction of its equation on each side (a duplicate pair is one match
	// of two reactions), so a file's reactions are these plus its
	// reactions_only_in_… (an extension).
	MatchedReactionsA int `json:"matched_reactions_a"`
	MatchedReactionsB int `json:"matched_reactions_b"`
	RateFlagged       int `json:"rate_flagged"`
	ReactionsOnlyA    int `json:"reactions_only_in_a"`
	ReactionsOnlyB    int `json:"reactions_only_in_b"`
}

type compareRef struct {
	Name   string  `json:"name"`
	File   string  `json:"file"`
	Line   int     `json:"line"`
	SMILES *string `json:"smiles"`
}

type compareValue struct {
	A    float64 `json:"a"`
	B    float64 `json:"b"`
	Diff float64 `json:"diff"`
}

// compareThermo compares a matched pair's thermo. When both sides estimate
// it from the same SMILES text with the same options, same_estimate is true
// and the values are omitted (identical on both sides, or missing on both when kiln cannot
// estimate the structure).
type compareThermo struct {
	SourceA string `json:"source_a"`
	SourceB string `json:"source_b"`
	// LibraryA and LibraryB name the reference-library entry whose data
	// an "estimate" side takes (extension, as reference_library in
	// summary and estimate --json; absent otherwise).
	LibraryA     string                    `json:"reference_library_a,omitempty"`
	LibraryB     string                    `json:"reference_library_b,omitempty"`
	SameEstimate bool                      `json:"same_estimate"`
	Hf298        *compareValue             `json:"hf298_kj_mol,omitempty"`
	S298         *compareValue             `json:"s298_j_mol_k,omitempty"`
	Cp           numericKeys[compareValue] `json:"cp_j_mol_k,omitempty"`
	G            numericKeys[compareValue] `json:"g_kj_mol,omitempty"`
}

type compareSpecies struct {
	A         string         `json:"a"`
	B         string         `json:"b"`
	LineA     int            `json:"line_a"`
	LineB     int            `json:"line_b"`
	SMILESA   *string        `json:"smiles_a"`
	SMILESB   *string        `json:"smiles_b"`
	MatchedBy string         `json:"matched_by"`
	Thermo    *compareThermo `json:"thermo"`
	Flags     []string       `json:"flags"`
}

type compareRename struct {
	A          string `json:"a"`
	B          string `json:"b"`
	Suggestion string `json:"suggestion"`
}

type compareClash struct {
	Name    string `json:"name"`
	SMILESA string `json:"smiles_a"`
	SMILESB string `json:"smiles_b"`
}

type compareRxn struct {
	EquationA string     `json:"equation_a"`
	LineA     int        `json:"line_a"`
	EquationB string     `json:"equation_b"`
	LineB     int        `json:"line_b"`
	Reversed  bool       `json:"reversed"`
	Ratio     numericMap `json:"rate_ratio"`
	Flagged   bool       `json:"flagged"`
	Note      *string    `json:"note"`
	// Every reaction of the equation on each side (line_a/line_b is the
	// first) and whether they repeat it: "" (written once), "declared"
	// (each marked duplicate) or "undeclared" (an extension).
	LinesA  []int  `json:"lines_a"`
	LinesB  []int  `json:"lines_b"`
	RepeatA string `json:"repeat_a"`
	RepeatB string `json:"repeat_b"`

	rateNote string // the note without the repeat notes, for the text table
}

type compareRxnRef struct {
	Equation string `json:"equation"`
	File     string `json:"file"`
	Line     int    `json:"line"`
}

// textRows is how many rows a text section lists without --all.
const textRows = 50

func runCompare(e env, args []string) (int, error) {
	flags, files, err := parseArgs(args, withSettings(flagSpec{"json": false, "all": false, "rate-factor": true}))
	if err != nil {
		return 0, err
	}
	if len(files) != 2 {
		return 0, usagef("compare needs two files: A.kiln B.kiln")
	}
	opts := analysis.CompareOptions{RateFactor: 2}
	if v, ok := flags["rate-factor"]; ok {
		f, err := strconv.ParseFloat(v, 64)
		if err != nil || !(f > 1) || math.IsInf(f, 0) {
			return 0, usagef("--rate-factor must be a number above 1, not %q", v)
		}
		opts.RateFactor = f
	}
	set, err := settingsFrom(e, flags)
	if err != nil {
		return 0, err
	}
	for _, f := range files {
		if _, err := os.Stat(f); err != nil {
			return 0, err
		}
	}
	root := flags["root"]
	if root == "" {
		root = commonDir(workspaceRoot(files[0]), workspaceRoot(files[1]))
	}
	root, err = filepath.Abs(root)
	if err != nil {
		return 0, fmt.Errorf("workspace root: %w", err)
	}
	absA, errA := filepath.Abs(files[0])
	absB, errB := filepath.Abs(files[1])
	if errA != nil || errB != nil {
		return 0, fmt.Errorf("resolving paths: %v %v", errA, errB)
	}
	if flags["root"] != "" {
		if err := checkRoot(flags["root"], root, absA, absB); err != nil {
			return 0, err
		}
	}
	ws := analysis.NewWorkspace(root, readFile, set)
	c, err := ws.Compare(context.Background(), absA, absB, opts)
	if err != nil {
		return 0, err
	}
	out := buildCompare(c)
	code := exitOK
	s := out.Summary
	if s.ThermoFlagged+s.Renamed+s.NameClashes+s.RateFlagged > 0 {
		code = exitProblems
	}
	if flags["json"] == "true" {
		if err := writeJSON(e.stdout, out); err != nil {
			return 0, err
		}
		return code, nil
	}
	writeCompareText(e.stdout, out, set, flags["all"] == "true")
	return code, nil
}

// commonDir returns the deepest directory holding both a and b.
func commonDir(a, b string) string {
	a, b = filepath.Clean(a), filepath.Clean(b)
	for {
		rel, err := filepath.Rel(a, b)
		if err == nil && rel != ".." && !strings.HasPrefix(rel, ".."+string(filepath.Separator)) {
			return a
		}
		parent := filepath.Dir(a)
		if parent == a {
			return a
		}
		a = parent
	}
}

func nonNil(s []string) []string {
	if s == nil {
		return []string{}
	}
	return s
}

func optString(s string) *string {
	if s == "" {
		return nil
	}
	return &s
}

func buildCompare(c *analysis.Comparison) compareJSON {
	out := compareJSON{
		A:          compareFile{displayPath(c.A.Path), c.A.Species, c.A.Reactions, c.A.Errors, nonNil(c.A.UnreadableStructure)},
		B:          compareFile{displayPath(c.B.Path), c.B.Species, c.B.Reactions, c.B.Errors, nonNil(c.B.UnreadableStructure)},
		Thresholds: compareThreshold{c.Settings.MismatchHf298 / 1000, c.Settings.MismatchS298, c.RateFactor},
		Species:    []compareSpecies{}, Renames: []compareRename{}, Clashes: []compareClash{},
		OnlyA: []compareRef{}, OnlyB: []compareRef{}, Reactions: []compareRxn{}, RxnOnlyA: []compareRxnRef{}, RxnOnlyB: []compareRxnRef{},
	}
	// Tens of thousands of rows name one of a few files: each display path
	// (a working-directory look-up) is worked out once.
	shown := map[string]string{}
	shownPath := func(path string) string {
		d, ok := shown[path]
		if !ok {
			d = displayPath(path)
			shown[path] = d
		}
		return d
	}
	val := func(a, b, scale float64) compareValue { return compareValue{a / scale, b / scale, (b - a) / scale} }
	pval := func(a, b, scale float64) *compareValue { v := val(a, b, scale); return &v }
	for _, p := range c.Species {
		row := compareSpecies{A: p.A.Name, B: p.B.Name, LineA: p.A.Line, LineB: p.B.Line, SMILESA: optString(p.A.SMILES),
			SMILESB: optString(p.B.SMILES), MatchedBy: p.By, Flags: []string{}}
		if t := p.Thermo; t != nil {
			th := &compareThermo{SourceA: string(t.SourceA), SourceB: string(t.SourceB), LibraryA: t.LibraryA, LibraryB: t.LibraryB, Hf298: pval(t.Hf298A, t.Hf298B, 1000),
				S298: pval(t.S298A, t.S298B, 1), Cp: numericKeys[compareValue]{}, G: numericKeys[compareValue]{}}
			for k, tt := range analysis.CompareThermoTemps {
				th.Cp[tt.Key] = val(t.CpA[k], t.CpB[k], 1)
				th.G[tt.Key] = val(t.GA[k], t.GB[k], 1000)
			}
			row.Thermo = th
			row.Flags = append(row.Flags, t.Flags...)
			if len(t.Flags) > 0 {
				out.Summary.ThermoFlagged++
			}
		} else if p.SameEstimate {
			row.Thermo = &compareThermo{SourceA: string(analysis.SourceEstimate), SourceB: string(analysis.SourceEstimate), SameEstimate: true}
		}
		if p.Renamed() {
			out.Renames = append(out.Renames, compareRename{A: p.A.Name, B: p.B.Name,
				Suggestion: fmt.Sprintf("rename %s to %s in %s", p.B.Name, p.A.Name, filepath.Base(p.B.File))})
		}
		out.Species = append(out.Species, row)
	}
	for _, n := range c.NameClashes {
		out.Clashes = append(out.Clashes, compareClash(n))
	}
	ref := func(r analysis.SpeciesRef) compareRef {
		return compareRef{r.Name, shownPath(r.File), r.Line, optString(r.SMILES)}
	}
	for _, r := range c.OnlyA {
		out.OnlyA = append(out.OnlyA, ref(r))
	}
	for _, r := range c.OnlyB {
		out.OnlyB = append(out.OnlyB, ref(r))
	}
	for _, p := range c.Reactions {
		row := compareRxn{EquationA: p.A.Equation, LineA: p.A.Line, EquationB: p.B.Equation, LineB: p.B.Line, Reversed: p.Reversed,
			Ratio: numericMap{}, Flagged: p.Flagged(c.RateFactor), Note: optString(joinNotes(p.Note, p.RepeatNote())), rateNote: p.Note,
			LinesA: refLines(p.AllA), LinesB: refLines(p.AllB), RepeatA: string(p.RepeatA), RepeatB: string(p.RepeatB)}
		out.Summary.MatchedReactionsA += len(p.AllA)
		out.Summary.MatchedReactionsB += len(p.AllB)
		for k, tt := range analysis.CompareRateTemps {
			row.Ratio[tt.Key] = p.Ratio[k]
		}
		if row.Flagged {
			out.Summary.RateFlagged++
		}
		out.Reactions = append(out.Reactions, row)
	}
	rref := func(r analysis.ReactionRef) compareRxnRef {
		return compareRxnRef{r.Equation, shownPath(r.File), r.Line}
	}
	for _, r := range c.ReactionsOnlyA {
		out.RxnOnlyA = append(out.RxnOnlyA, rref(r))
	}
	for _, r := range c.ReactionsOnlyB {
		out.RxnOnlyB = append(out.RxnOnlyB, rref(r))
	}
	out.Summary.Matched, out.Summary.Renamed, out.Summary.NameClashes = len(out.Species), len(out.Renames), len(out.Clashes)
	out.Summary.OnlyA, out.Summary.OnlyB = len(out.OnlyA), len(out.OnlyB)
	out.Summary.MatchedReactions = len(out.Reactions)
	out.Summary.ReactionsOnlyA, out.Summary.ReactionsOnlyB = len(out.RxnOnlyA), len(out.RxnOnlyB)
	return out
}

// joinNotes joins the non-empty notes with "; ".
func joinNotes(a, b string) string {
	switch {
	case a == "":
		return b
	case b == "":
		return a
	}
	return a + "; " + b
}

// refLines lists the lines of reactions.
func refLines(rs []analysis.ReactionRef) []int {
	out := make([]int, len(rs))
	for i, r := range rs {
		out[i] = r.Line
	}
	return out
}

// repeatedMatches counts the matched equations written more than once on
// a side, e.g. "1 duplicate pair in A, 1 in B"; "" when there are none.
func repeatedMatches(rs []compareRxn) string {
	var declA, declB, undA, undB int
	for _, r := range rs {
		switch r.RepeatA {
		case string(analysis.RepeatDeclared):
			declA++
		case string(analysis.RepeatUndeclared):
			undA++
		}
		switch r.RepeatB {
		case string(analysis.RepeatDeclared):
			declB++
		case string(analysis.RepeatUndeclared):
			undB++
		}
	}
	var parts []string
	if declA+declB > 0 {
		parts = append(parts, fmt.Sprintf("%d equation(s) declared duplicate in A, %d in B", declA, declB))
	}
	if undA+undB > 0 {
		parts = append(parts, fmt.Sprintf("%d equation(s) repeated without `duplicate` in A, %d in B", undA, undB))
	}
	return strings.Join(parts, "; ")
}

// table is a tabwriter whose output reaches w, on flush, without the
// blanks tabwriter leaves before line ends.
type table struct {
	*tabwriter.Writer
	buf bytes.Buffer
	w   io.Writer
}

func newTable(w io.Writer, padding int, flags uint) *table {
	t := &table{w: w}
	t.Writer = tabwriter.NewWriter(&t.buf, 2, 4, padding, ' ', flags)
	return t
}

func (t *table) Flush() {
	t.Writer.Flush()
	lines := strings.Split(t.buf.String(), "\n")
	for i := range lines {
		lines[i] = strings.TrimRight(lines[i], " ")
	}
	io.WriteString(t.w, strings.Join(lines, "\n"))
	t.buf.Reset()
}

func writeCompareText(w io.Writer, o compareJSON, set analysis.Settings, all bool) {
	// The two files may state different units: the setting, else kcal/mol.
	u := analysis.UnitsFor(set, nil)
	eu, su := u.EnergyName(), u.EntropyName()
	limit := func(n int) int {
		if all {
			return n
		}
		return min(n, textRows)
	}
	more := func(shown, n int) {
		if shown < n {
			fmt.Fprintf(w, "  … %d more (--all or --json lists them)\n", n-shown)
		}
	}
	s := o.Summary
	fmt.Fprintf(w, "A: %s (%d species, %s)\n", o.A.File, o.A.Species, wording.Count(o.A.Reactions, "reaction"))
	fmt.Fprintf(w, "B: %s (%d species, %s)\n", o.B.File, o.B.Species, wording.Count(o.B.Reactions, "reaction"))
	for _, f := range []compareFile{o.A, o.B} {
		if f.Errors > 0 {
			fmt.Fprintf(w, "note: %s has %d syntax or structure error(s); broken statements were left out (`kiln check` lists every problem)\n", shorten(filepath.Base(f.File), 40), f.Errors)
		}
		if n := len(f.Unreadable); n > 0 {
			fmt.Fprintf(w, "note: %s: %d species with an unreadable SMILES match nothing (%s)\n", f.File, n, shorten(strings.Join(f.Unreadable, ", "), 50))
		}
	}
	fmt.Fprintf(w, "Species: %d matched by structure (%d under different names), %d only in A, %d only in B, %d name clash(es)\n",
		s.Matched, s.Renamed, s.OnlyA, s.OnlyB, s.NameClashes)
	fmt.Fprintf(w, "Reactions: %d matched (%d of A's %d reactions, %d of B's %d), %d only in A, %d only in B\n", s.MatchedReactions,
		s.MatchedReactionsA, o.A.Reactions, s.MatchedReactionsB, o.B.Reactions, s.ReactionsOnlyA, s.ReactionsOnlyB)
	if n := repeatedMatches(o.Reactions); n != "" {
		fmt.Fprintf(w, "  %s: each is one match, its rates summed\n", n)
	}

	if len(o.Renames) > 0 {
		fmt.Fprintf(w, "\nSame structure under different names (%d)\n", len(o.Renames))
		tw := newTable(w, 2, 0)
		fmt.Fprintf(tw, "  A\tB\tsuggestion\n")
		for _, r := range o.Renames[:limit(len(o.Renames))] {
			fmt.Fprintf(tw, "  %s\t%s\t%s\n", shorten(r.A, 24), shorten(r.B, 24), shorten(r.Suggestion, 64))
		}
		tw.Flush()
		more(limit(len(o.Renames)), len(o.Renames))
	}
	if len(o.Clashes) > 0 {
		fmt.Fprintf(w, "\nSame name, different structure (%d)\n", len(o.Clashes))
		tw := newTable(w, 2, 0)
		fmt.Fprintf(tw, "  name\tSMILES in A\tSMILES in B\n")
		for _, c := range o.Clashes[:limit(len(o.Clashes))] {
			fmt.Fprintf(tw, "  %s\t%s\t%s\n", shorten(c.Name, 24), shorten(c.SMILESA, 40), shorten(c.SMILESB, 40))
		}
		tw.Flush()
		more(limit(len(o.Clashes)), len(o.Clashes))
	}

	// Thermo: pairs that differ at all, flagged ones first.
	var differ []compareSpecies
	for _, flaggedPass := range []bool{true, false} {
		for _, p := range o.Species {
			t := p.Thermo
			if t == nil || t.SameEstimate || (len(p.Flags) > 0) != flaggedPass {
				continue
			}
			// Differences below 1e-6 (kJ/mol, J/(mol K)) are rounding noise.
			noise := func(v float64) bool { return math.Abs(v) < 1e-6 }
			if flaggedPass || !noise(t.Hf298.Diff) || !noise(t.S298.Diff) || !noise(t.G["1000"].Diff) || !noise(t.Cp["1000"].Diff) {
				differ = append(differ, p)
			}
		}
	}
	if len(differ) > 0 {
		fmt.Fprintf(w, "\nThermo differences B − A in %s and %s; * beyond the thresholds (%.2f %s, %.2f %s)\n",
			eu, su, u.EnergyValue(o.Thresholds.Hf298*1000), eu, u.EntropyValue(o.Thresholds.S298), su)
		tw := newTable(w, 1, tabwriter.AlignRight)
		fmt.Fprintf(tw, "species\tΔHf°298\tS°298\tCp300\tCp1000\tCp2000\tG300\tG1000\tG2000\t\n")
		for _, p := range differ[:limit(len(differ))] {
			t := p.Thermo
			flagged := map[string]bool{}
			for _, f := range p.Flags {
				flagged[f] = true
			}
			cell := func(v float64, key string) string {
				c := analysis.FormatSigned(v, 2)
				if flagged[key] {
					c += "*"
				} else {
					c += " "
				}
				return c
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t\n", shorten(p.A, 18),
				cell(u.EnergyValue(t.Hf298.Diff*1000), "hf298"), cell(u.EntropyValue(t.S298.Diff), "s298"),
				cell(u.EntropyValue(t.Cp["300"].Diff), "cp300"), cell(u.EntropyValue(t.Cp["1000"].Diff), "cp1000"), cell(u.EntropyValue(t.Cp["2000"].Diff), "cp2000"),
				cell(u.EnergyValue(t.G["300"].Diff*1000), "g300"), cell(u.EnergyValue(t.G["1000"].Diff*1000), "g1000"), cell(u.EnergyValue(t.G["2000"].Diff*1000), "g2000"))
		}
		tw.Flush()
		more(limit(len(differ)), len(differ))
	}
	if n := len(o.Species) - len(differ); n > 0 {
		fmt.Fprintf(w, "(%d matched species have the same thermo on both sides or none to compare)\n", n)
	}
	refs := func(title string, rs []compareRef) {
		if len(rs) == 0 {
			return
		}
		fmt.Fprintf(w, "\n%s (%d)\n", title, len(rs))
		for _, r := range rs[:limit(len(rs))] {
			smi := ""
			if r.SMILES != nil {
				smi = "  " + shorten(*r.SMILES, 60)
			}
			fmt.Fprintf(w, "  %s:%d  %s%s\n", filepath.Base(r.File), r.Line, shorten(r.Name, 30), smi)
		}
		more(limit(len(rs)), len(rs))
	}
	refs("Species only in A", o.OnlyA)
	refs("Species only in B", o.OnlyB)

	var rx []compareRxn
	for _, flaggedPass := range []bool{true, false} {
		for _, r := range o.Reactions {
			if r.Flagged != flaggedPass {
				continue
			}
			same := true
			for _, v := range r.Ratio {
				if v == nil || math.Abs(*v-1) > 1e-9 {
					same = false
				}
			}
			if !same || r.Reversed {
				rx = append(rx, r)
			}
		}
	}
	if len(rx) > 0 {
		fmt.Fprintf(w, "\nRate ratios k_B/k_A (equations in A's names); * outside %g–%g\n", 1/o.Thresholds.RateFactor, o.Thresholds.RateFactor)
		tw := newTable(w, 2, 0)
		fmt.Fprintf(tw, "line A\tequation\t500 K\t1000 K\t2000 K\tnote\n")
		for _, r := range rx[:limit(len(rx))] {
			cells := make([]string, 0, 3)
			for _, k := range []string{"500", "1000", "2000"} {
				c := "—"
				if v := r.Ratio[k]; v != nil {
					c = fmt.Sprintf("%.3g", *v)
					if *v > o.Thresholds.RateFactor || *v < 1/o.Thresholds.RateFactor {
						c += "*"
					}
				}
				cells = append(cells, c)
			}
			note := ""
			if r.Reversed {
				note = "B writes it reversed"
			}
			// Reactions of one equation on a side (their lines in the
			// first column) are summed; the JSON note says more.
			repeats := []struct{ side, how string }{{"A: ", r.RepeatA}, {"B: ", r.RepeatB}}
			if r.RepeatA == r.RepeatB {
				repeats = repeats[:1]
				repeats[0].side = ""
			}
			for _, rep := range repeats {
				switch rep.how {
				case string(analysis.RepeatDeclared):
					note = joinNotes(note, rep.side+"duplicates summed")
				case string(analysis.RepeatUndeclared):
					note = joinNotes(note, rep.side+"repeats summed")
				}
			}
			note = joinNotes(note, r.rateNote)
			lines := strconv.Itoa(r.LineA)
			if len(r.LinesA) > 1 {
				ls := make([]string, len(r.LinesA))
				for i, l := range r.LinesA {
					ls[i] = strconv.Itoa(l)
				}
				lines = shorten(strings.Join(ls, ","), 16)
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\n", lines, shorten(r.EquationA, 44), cells[0], cells[1], cells[2], note)
		}
		tw.Flush()
		more(limit(len(rx)), len(rx))
	}
	if n := len(o.Reactions) - len(rx); n > 0 {
		fmt.Fprintf(w, "(%d matched reactions have the same rate on both sides)\n", n)
	}
	rrefs := func(title string, rs []compareRxnRef) {
		if len(rs) == 0 {
			return
		}
		fmt.Fprintf(w, "\n%s (%d)\n", title, len(rs))
		for _, r := range rs[:limit(len(rs))] {
			fmt.Fprintf(w, "  %s:%d  %s\n", filepath.Base(r.File), r.Line, shorten(r.Equation, 90))
		}
		more(limit(len(rs)), len(rs))
	}
	rrefs("Reactions only in A", o.RxnOnlyA)
	rrefs("Reactions only in B", o.RxnOnlyB)
}
