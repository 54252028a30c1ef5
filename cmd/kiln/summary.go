package main

import (
	"fmt"
	"io"
	"sort"
	"strconv"
	"strings"

	"kiln.dev/kiln/analysis"
)

// summaryJSON is the output of `kiln summary --json`; the keys are a public
// contract (SI units in the names; later keys are extensions). Values that
// cannot be computed are null.
type summaryJSON struct {
	Species   []summarySpecies  `json:"species"`
	Reactions []summaryReaction `json:"reactions"`
}

type summarySpecies struct {
	Name         string  `json:"name"`
	SMILES       *string `json:"smiles"`
	Formula      *string `json:"formula"`
	ThermoSource string  `json:"thermo_source"`
	// ReferenceLibrary names the reference entry whose tabulated data an
	// "estimate" species takes instead of groups (extension): it refines
	// thermo_source, whose values the contract fixes
	// (analysis.Species.ReferenceLibrary).
	ReferenceLibrary string `json:"reference_library,omitempty"`
	// word is the source as the text table shows it (analysis.Species.ThermoWord).
	word  string
	Hf298 *float64   `json:"hf298_kj_mol"`
	S298  *float64   `json:"s298_j_mol_k"`
	Cp    numericMap `json:"cp_j_mol_k"` // null where the block does not reach
	// Flags are the approximations of an estimated species, worded as
	// check, estimate and hover word them (extension; absent when none or
	// when the thermo comes from the file); for a species refused for want
	// of groups and given no thermo, those groups (kind "missing").
	Flags []string `json:"flags,omitempty"`
	// FlagKinds classifies each entry of flags as estimate --json does
	// (extension; analysis.FlagKind).
	FlagKinds []string `json:"flag_kinds,omitempty"`
	// flags are the approximations Flags words, for the text output
	// (analysis.FlagLine: heading and words together).
	flags []analysis.Flag
}

type summaryReaction struct {
	Line int `json:"line"`
	// File is the included file that declares the reaction (extension;
	// absent for the summarised file's own reactions).
	File        string     `json:"file,omitempty"`
	Equation    string     `json:"equation"`
	Balanced    *bool      `json:"balanced"`
	DH298       *float64   `json:"dh298_kj_mol"`
	DS298       *float64   `json:"ds298_j_mol_k"`
	DG298       *float64   `json:"dg298_kj_mol"`
	Keq         numericMap `json:"keq"`
	ReverseRate numericMap `json:"reverse_rate"`
	// Extensions: k_f at 1000 K, the pressure both rates are taken at
	// (bar), and the units of each rate.
	ForwardRate        numericMap `json:"forward_rate"`
	RatePressure       float64    `json:"rate_pressure_bar"`
	ForwardRateUnits   string     `json:"forward_rate_units"`
	ReverseRateUnits   string     `json:"reverse_rate_units"`
	CollisionViolation *string    `json:"collision_limit"`
	// ReverseFactor is the factor k_r inherits from estimated thermo,
	// exp(σ(ΔG°r)/RT) at 1000 K (null when k_r does not come from thermo).
	ReverseFactor numericMap `json:"reverse_rate_factor"`
	// ReverseGiven names the species whose thermo is the file's own block
	// with no stated uncertainty (extension; absent when none): the factor
	// covers only the estimates and is then a lower bound, and with no
	// estimate involved it is 1 by construction, not a measured certainty.
	ReverseGiven []string `json:"reverse_rate_given,omitempty"`
	// ReverseLowerBound is true when the factor is a lower bound: some
	// species' uncertainty is unknown (given blocks or classes without a
	// measured error; extension, absent when false).
	ReverseLowerBound bool `json:"reverse_rate_factor_lower_bound,omitempty"`
	// RateTableEdge is the tabulated pressure (bar) whose rate is shown
	// when rate_pressure_bar lies outside the reaction's pressure table
	// (extension; absent otherwise).
	RateTableEdge *float64 `json:"rate_table_edge_bar,omitempty"`
}

func runSummary(e env, args []string) (int, error) {
	flags, files, err := parseArgs(args, withSettings(flagSpec{"json": false, "uncertain": false}))
	if err != nil {
		return 0, err
	}
	if len(files) != 1 {
		return 0, usagef("summary needs exactly one FILE")
	}
	results, _, err := analyzeFileScope(e, files[0], flags)
	if err != nil {
		return 0, err
	}
	res := results[0]
	s := buildSummary(results)
	if flags["uncertain"] == "true" {
		sortByReverseFactor(s.Reactions)
	}
	if flags["json"] == "true" {
		if err := writeJSON(e.stdout, s); err != nil {
			return 0, err
		}
	} else {
		writeSummaryText(e.stdout, s, res.Units())
	}
	// Values of a file with errors are incomplete: say so in the exit code,
	// as check does.
	if n := scopeErrors(results); n > 0 {
		fmt.Fprintf(e.stderr, "kiln summary: %s has %d error(s); values that depend on them are missing (run kiln check)\n", files[0], n)
		return exitProblems, nil
	}
	return exitOK, nil
}

func kilo(p *float64) *float64 {
	if p == nil {
		return nil
	}
	return ptr(jnum(*p / 1000))
}

// buildSummary summarises results[0]: its species (those of its includes
// among them) and the reactions of every file in results.
func buildSummary(results []*analysis.Result) summaryJSON {
	res := results[0]
	s := summaryJSON{Species: []summarySpecies{}, Reactions: []summaryReaction{}}
	for _, sp := range res.Species {
		row := summarySpecies{Name: sp.Name, ThermoSource: string(sp.Source), ReferenceLibrary: sp.ReferenceLibrary(), word: sp.ThermoWord()}
		// The estimate's flags whenever kiln estimated the species, as
		// check reports them (its missing-group diagnostic).
		for _, m := range sp.Estimate.Flags() {
			row.Flags = append(row.Flags, analysis.FlagText(m))
			row.FlagKinds = append(row.FlagKinds, analysis.FlagKind(m))
			row.flags = append(row.flags, m)
		}
		if sp.Estimate == nil && sp.Given == nil {
			// Refused for want of groups: name them, as estimate --json does.
			for _, g := range sp.RefusalGroups() {
				row.Flags = append(row.Flags, analysis.RefusalGroupFlag(g))
				row.FlagKinds = append(row.FlagKinds, "missing")
			}
		}
		if sp.Decl.SMILES != nil {
			row.SMILES = ptr(sp.Decl.SMILES.Text)
		}
		if sp.Formula != "" {
			row.Formula = ptr(sp.Formula)
		}
		if hf, s298, ok := sp.Hf298S298(); ok {
			row.Hf298, row.S298 = kilo(&hf), ptr(jnum(s298))
		}
		if sp.Source != analysis.SourceNone {
			cp, ok := sp.CpAt()
			row.Cp = numericMap{}
			for i, k := range analysis.StdTempKeys {
				row.Cp[k] = nil
				if ok[i] {
					row.Cp[k] = ptr(cp[i])
				}
			}
		}
		s.Species = append(s.Species, row)
	}
	P := res.Settings.Pressure
	if P == 0 {
		P = 101325
	}
	for _, rr := range results {
		for _, r := range rr.Reactions {
			row := summaryReactionOf(rr, r, P)
			if rr != res {
				row.File = displayPath(rr.Path)
			}
			s.Reactions = append(s.Reactions, row)
		}
	}
	return s
}

// summaryReactionOf describes reaction r of the analysis res.
func summaryReactionOf(res *analysis.Result, r *analysis.Reaction, P float64) summaryReaction {
	row := summaryReaction{Line: res.ReactionLine(r), Equation: r.Equation, DH298: kilo(r.DH298), DS298: jptr(r.DS298), DG298: kilo(r.DG298),
		Keq: numericMap(r.Kp), RatePressure: jnum(P / 1e5)}
	if r.Balance != nil {
		row.Balanced = ptr(r.Balance.Balanced)
	}
	if r.ForwardRate1000 != nil {
		row.ForwardRate = numericMap{"1000": r.ForwardRate1000}
		row.ForwardRateUnits = analysis.RateUnits(r.ForwardOrder)
	}
	if r.ReverseRate1000 != nil {
		row.ReverseRate = numericMap{"1000": r.ReverseRate1000}
		row.ReverseRateUnits = analysis.RateUnits(r.ReverseOrder)
	}
	if v := r.Collision; v != nil {
		row.CollisionViolation = ptr(v.Message())
	}
	if u, ok := res.ReverseRateUncertainty(r, 1000); ok {
		row.ReverseFactor = numericMap{"1000": ptr(u.Factor)}
		row.ReverseGiven = u.Given
		row.ReverseLowerBound = len(u.Given) > 0 || len(u.Unmeasured) > 0
	}
	if r.RateTableEdge > 0 {
		row.RateTableEdge = ptr(jnum(r.RateTableEdge / 1e5))
	}
	return row
}

// sciText writes a value with 3 significant digits ("—" for none, and
// for a value that is not a finite number, as FormatFixed does).
func sciText(p *float64) string {
	if p == nil {
		return "—"
	}
	return analysis.FormatSig(*p)
}

// writeSummaryText prints three tables (species; reaction thermochemistry;
// rates), each under 120 columns and without trailing blanks. Energies are
// in the display units; long equations are shortened (--json has them
// whole).
func writeSummaryText(w io.Writer, s summaryJSON, u analysis.Units) {
	energy := func(kj *float64) string {
		if kj == nil {
			return "—"
		}
		return u.EnergyNumber(*kj * 1000)
	}
	entropy := func(p *float64) string {
		if p == nil {
			return "—"
		}
		return u.EntropyNumber(*p)
	}
	fmt.Fprintf(w, "Species (%d); ΔHf°298 in %s, S°298 and Cp in %s\n", len(s.Species), u.EnergyName(), u.EntropyName())
	var rows [][]string
	for _, sp := range s.Species {
		formula := "—"
		if sp.Formula != nil {
			formula = *sp.Formula
		}
		rows = append(rows, []string{shorten(sp.Name, 24), formula, sp.word, energy(sp.Hf298), entropy(sp.S298),
			entropy(sp.Cp["300"]), entropy(sp.Cp["1000"]), entropy(sp.Cp["1500"])})
	}
	writeTable(w, "", []string{"name", "formula", "thermo", "ΔHf°298", "S°298", "Cp(300)", "Cp(1000)", "Cp(1500)"}, rows)
	for _, sp := range s.Species {
		for _, m := range sp.flags {
			writeWrapped(w, "  ", sp.Name+": "+analysis.FlagLine(m))
		}
	}

	fmt.Fprintf(w, "\nReactions (%d); ΔH°r and ΔG°r at 298 K in %s, Kp at 1 bar\n", len(s.Reactions), u.EnergyName())
	rows = rows[:0]
	for _, r := range s.Reactions {
		bal := "—"
		if r.Balanced != nil {
			bal = map[bool]string{true: "yes", false: "NO"}[*r.Balanced]
		}
		rows = append(rows, []string{reactionLine(r), shorten(r.Equation, 44), bal, energy(r.DH298), energy(r.DG298),
			sciText(r.Keq["298"]), sciText(r.Keq["1000"]), sciText(r.Keq["1500"])})
	}
	writeTable(w, "", []string{"line", "equation", "balanced", "ΔH°r", "ΔG°r", "Kp(298)", "Kp(1000)", "Kp(1500)"}, rows)

	P := 1.01325
	if len(s.Reactions) > 0 {
		P = s.Reactions[0].RatePressure
	}
	fmt.Fprintf(w, "\nRates at 1000 K and %s (cm, mol, s units; k_r from k_f/Kc unless given)\n", analysis.FormatBar(P))
	rows = rows[:0]
	for _, r := range s.Reactions {
		kf, kr := sciText(r.ForwardRate["1000"]), sciText(r.ReverseRate["1000"])
		if r.ForwardRateUnits != "" {
			kf += " " + r.ForwardRateUnits
		}
		if r.ReverseRateUnits != "" {
			kr += " " + r.ReverseRateUnits
		}
		limit := ""
		if r.CollisionViolation != nil {
			limit = "above collision limit"
		}
		if r.RateTableEdge != nil {
			limit = strings.TrimPrefix(limit+"; table's "+analysis.FormatBar(*r.RateTableEdge)+" rate", "; ")
		}
		factor := ""
		if f := reverseFactor(r); f != nil {
			factor = analysis.FormatFixed(*f, 2)
			switch {
			case len(r.ReverseGiven) > 0 && *f == 1:
				factor = "given" // only given blocks: no uncertainty stated
			case r.ReverseLowerBound:
				factor = "≥" + factor
			}
		}
		rows = append(rows, []string{reactionLine(r), shorten(r.Equation, 44), kf, kr, factor, limit})
	}
	writeTable(w, "", []string{"line", "equation", "k_f", "k_r", "k_r ×/÷", "check"}, rows)
}

// reactionLine is a reaction's line, FILE:LINE when an included file
// declares it.
func reactionLine(r summaryReaction) string {
	if r.File != "" {
		f := []rune(r.File)
		if len(f) > 24 { // keep the file name: cut the directories
			f = append([]rune("…"), f[len(f)-23:]...)
		}
		return string(f) + ":" + strconv.Itoa(r.Line)
	}
	return strconv.Itoa(r.Line)
}

// reverseFactor is a reaction's k_r factor at 1000 K, nil when none.
func reverseFactor(r summaryReaction) *float64 {
	if r.ReverseFactor == nil {
		return nil
	}
	return r.ReverseFactor["1000"]
}

// sortByReverseFactor puts the reactions whose reverse rates rest on the
// weakest thermo first (largest factor; reactions without one last).
func sortByReverseFactor(rs []summaryReaction) {
	sort.SliceStable(rs, func(i, j int) bool {
		a, b := reverseFactor(rs[i]), reverseFactor(rs[j])
		if a == nil || b == nil {
			return a != nil && b == nil
		}
		return *a > *b
	})
}
