package main

import (
	"encoding/json"
	"fmt"
	"io"
	"sort"
	"text/tabwriter"

	"kiln.dev/kiln/analysis"
)

// summaryJSON is the output of `kiln summary --json`; the keys are a public
// contract. Values that cannot be computed are null.
type summaryJSON struct {
	Species   []summarySpecies  `json:"species"`
	Reactions []summaryReaction `json:"reactions"`
}

type summarySpecies struct {
	Name         string             `json:"name"`
	SMILES       *string            `json:"smiles"`
	Formula      *string            `json:"formula"`
	ThermoSource string             `json:"thermo_source"`
	Hf298        *float64           `json:"hf298_kj_mol"`
	S298         *float64           `json:"s298_j_mol_k"`
	Cp           map[string]float64 `json:"cp_j_mol_k"`
}

type summaryReaction struct {
	Line        int                 `json:"line"`
	Equation    string              `json:"equation"`
	Balanced    *bool               `json:"balanced"`
	DH298       *float64            `json:"dh298_kj_mol"`
	DS298       *float64            `json:"ds298_j_mol_k"`
	DG298       *float64            `json:"dg298_kj_mol"`
	Keq         map[string]*float64 `json:"keq"`
	ReverseRate map[string]*float64 `json:"reverse_rate"`
	// ReverseFactor is the factor k_r inherits from estimated thermo,
	// exp(σ(ΔG°r)/RT) at 1000 K (null when k_r does not come from thermo).
	ReverseFactor map[string]*float64 `json:"reverse_rate_factor"`
}

func runSummary(e env, args []string) (int, error) {
	flags, files, err := parseArgs(args, withSettings(flagSpec{"json": false, "uncertain": false}))
	if err != nil {
		return 0, err
	}
	if len(files) != 1 {
		return 0, usagef("summary needs exactly one FILE")
	}
	res, set, err := analyzeFile(e, files[0], flags)
	if err != nil {
		return 0, err
	}
	s := buildSummary(res)
	if flags["uncertain"] == "true" {
		sortByReverseFactor(s.Reactions)
	}
	if flags["json"] == "true" {
		enc := json.NewEncoder(e.stdout)
		enc.SetIndent("", "  ")
		if err := enc.Encode(s); err != nil {
			return 0, fmt.Errorf("writing output: %w", err)
		}
		return exitOK, nil
	}
	writeSummaryText(e.stdout, s, set)
	return exitOK, nil
}

func kilo(p *float64) *float64 {
	if p == nil {
		return nil
	}
	return ptr(*p / 1000)
}

func buildSummary(res *analysis.Result) summaryJSON {
	s := summaryJSON{Species: []summarySpecies{}, Reactions: []summaryReaction{}}
	for _, sp := range res.Species {
		row := summarySpecies{Name: sp.Name, ThermoSource: string(sp.Source)}
		if sp.Decl.SMILES != nil {
			row.SMILES = ptr(sp.Decl.SMILES.Text)
		}
		if sp.Formula != "" {
			row.Formula = ptr(sp.Formula)
		}
		if hf, s298, ok := sp.Hf298S298(); ok {
			row.Hf298, row.S298 = ptr(hf/1000), ptr(s298)
		}
		if cp, ok := sp.CpAt(); ok {
			row.Cp = map[string]float64{}
			for i, k := range analysis.StdTempKeys {
				row.Cp[k] = cp[i]
			}
		}
		s.Species = append(s.Species, row)
	}
	for _, r := range res.Reactions {
		row := summaryReaction{Line: r.Line, Equation: r.Equation, DH298: kilo(r.DH298), DS298: r.DS298, DG298: kilo(r.DG298), Keq: r.Kp}
		if r.Balance != nil {
			row.Balanced = ptr(r.Balance.Balanced)
		}
		if r.ReverseRate1000 != nil {
			row.ReverseRate = map[string]*float64{"1000": r.ReverseRate1000}
		}
		if u, ok := res.ReverseRateUncertainty(r, 1000); ok {
			row.ReverseFactor = map[string]*float64{"1000": ptr(u.Factor)}
		}
		s.Reactions = append(s.Reactions, row)
	}
	return s
}

func writeSummaryText(w io.Writer, s summaryJSON, set analysis.Settings) {
	eu, su, ef, sf := "kcal/mol", "cal/(mol·K)", 4.184, 4.184
	if set.DisplayUnits == "kJ/mol" {
		eu, su, ef, sf = "kJ/mol", "J/(mol·K)", 1, 1
	}
	num := func(p *float64, f float64, prec int) string {
		if p == nil {
			return "—"
		}
		return fmt.Sprintf("%.*f", prec, *p/f)
	}
	sci := func(p *float64) string {
		if p == nil {
			return "—"
		}
		return fmt.Sprintf("%.3g", *p)
	}
	fmt.Fprintf(w, "Species (%d)\n", len(s.Species))
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	fmt.Fprintf(tw, "name\tformula\tthermo\tΔHf°298 %s\tS°298 %s\tCp300 %s\n", eu, su, su)
	for _, sp := range s.Species {
		formula := "—"
		if sp.Formula != nil {
			formula = *sp.Formula
		}
		var cp *float64
		if v, ok := sp.Cp["300"]; ok {
			cp = ptr(v)
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\n", sp.Name, formula, sp.ThermoSource, num(sp.Hf298, ef, 2), num(sp.S298, sf, 2), num(cp, sf, 2))
	}
	tw.Flush()
	fmt.Fprintf(w, "\nReactions (%d)\n", len(s.Reactions))
	tw = tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	fmt.Fprintf(tw, "line\tequation\tbalanced\tΔH°r %s\tΔG°r %s\tKp(298)\tKp(1000)\tKp(1500)\tk_r(1000 K)\tk_r ×/÷\n", eu, eu)
	for _, r := range s.Reactions {
		bal := "—"
		if r.Balanced != nil {
			bal = map[bool]string{true: "yes", false: "NO"}[*r.Balanced]
		}
		var kr *float64
		if r.ReverseRate != nil {
			kr = r.ReverseRate["1000"]
		}
		fmt.Fprintf(tw, "%d\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", r.Line, r.Equation, bal, num(r.DH298, ef, 2), num(r.DG298, ef, 2),
			sci(r.Keq["298"]), sci(r.Keq["1000"]), sci(r.Keq["1500"]), sci(kr), num(reverseFactor(r), 1, 2))
	}
	tw.Flush()
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
