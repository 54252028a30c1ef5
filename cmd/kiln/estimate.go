package main

import (
	"encoding/json"
	"fmt"
	"io"
	"os"
	"strconv"
	"strings"
	"text/tabwriter"
	"unicode/utf8"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/speciesfile"
)

// estimateJSON is one element of `kiln estimate --json`; the keys are a
// public contract (SI units in the names).
type estimateJSON struct {
	Input          string             `json:"input"`
	Formula        *string            `json:"formula"`
	MolarMass      *float64           `json:"molar_mass_g_mol"`
	Hf298          *float64           `json:"hf298_kj_mol"`
	S298           *float64           `json:"s298_j_mol_k"`
	Cp             map[string]float64 `json:"cp_j_mol_k"`
	Groups         []groupJSON        `json:"groups"`
	Corrections    []correctionJSON   `json:"corrections"`
	SymmetryNumber *int               `json:"symmetry_number"`
	OpticalIsomers *int               `json:"optical_isomers"`
	MissingGroups  []string           `json:"missing_groups"`
	Uncertainty    *float64           `json:"uncertainty_hf298_kj_mol"`
	Error          *errorJSON         `json:"error"`
	NASA7          *nasaJSON          `json:"nasa7,omitempty"`
}

type groupJSON struct {
	Name   string  `json:"name"`
	Count  int     `json:"count"`
	Hf298  float64 `json:"hf298_kj_mol"`
	S298   float64 `json:"s298_j_mol_k"`
	Source string  `json:"source"`
}

type correctionJSON struct {
	Name  string  `json:"name"`
	Count int     `json:"count"`
	Hf298 float64 `json:"hf298_kj_mol"`
	S298  float64 `json:"s298_j_mol_k"`
}

// errorJSON is a failed estimate: position is the 1-based character position
// in the input of the problem, null when the problem has no position.
type errorJSON struct {
	Message  string `json:"message"`
	Position *int   `json:"position"`
}

type nasaJSON struct {
	TLow  float64    `json:"t_low"`
	TMid  float64    `json:"t_mid"`
	THigh float64    `json:"t_high"`
	Low   [7]float64 `json:"low"`
	High  [7]float64 `json:"high"`
	// MaxCpResidual is the fit's worst Cp residual in J/(mol K) (extension).
	MaxCpResidual float64 `json:"max_cp_residual_j_mol_k"`
}

func runEstimate(e env, args []string) (int, error) {
	flags, inputs, err := parseArgs(args, withSettings(flagSpec{"json": false, "nasa": false, "multiplicity": true, "symmetry": true, "optical-isomers": true}))
	if err != nil {
		return 0, err
	}
	if len(inputs) == 0 {
		return 0, usagef("estimate needs at least one SMILES")
	}
	set, err := settingsFrom(e, flags)
	if err != nil {
		return 0, err
	}
	opts := analysis.EstimateOptions{TMid: set.TMid, THigh: set.THigh}
	for name, dst := range map[string]*int{"multiplicity": &opts.Multiplicity, "symmetry": &opts.Symmetry, "optical-isomers": &opts.OpticalIsomers} {
		if v, ok := flags[name]; ok {
			n, err := strconv.Atoi(v)
			if err != nil || n < 1 {
				return 0, usagef("--%s must be a positive integer, not %q", name, v)
			}
			*dst = n
		}
	}
	wd, _ := os.Getwd()
	ws := analysis.NewWorkspace(wd, readFile, set)
	withNASA := flags["nasa"] == "true"
	failed := false
	var results []estimateJSON
	for i, in := range inputs {
		r, est := estimateOne(ws, in, opts, withNASA)
		if r.Error != nil {
			failed = true
		}
		if flags["json"] == "true" {
			results = append(results, r)
			continue
		}
		if i > 0 {
			fmt.Fprintln(e.stdout)
		}
		writeEstimateText(e.stdout, r, est, set, withNASA)
	}
	if flags["json"] == "true" {
		enc := json.NewEncoder(e.stdout)
		enc.SetIndent("", "  ")
		if err := enc.Encode(results); err != nil {
			return 0, fmt.Errorf("writing output: %w", err)
		}
	}
	if failed {
		return exitProblems, nil
	}
	return exitOK, nil
}

func ptr[T any](v T) *T { return &v }

// estimateOne estimates one SMILES and fills the JSON record; on failure the
// record carries the error and null values.
func estimateOne(ws *analysis.Workspace, in string, opts analysis.EstimateOptions, withNASA bool) (estimateJSON, *analysis.Estimate) {
	r := estimateJSON{Input: in, Groups: []groupJSON{}, Corrections: []correctionJSON{}, MissingGroups: []string{}}
	m, err := molecule.ParseSMILES(in)
	if err != nil {
		r.Error = &errorJSON{Message: err.Error()}
		if se, ok := err.(*molecule.SMILESError); ok {
			// 1-based character position, like the columns of `kiln check`.
			r.Error = &errorJSON{Message: se.Msg, Position: ptr(utf8.RuneCountInString(in[:min(se.Pos, len(in))]) + 1)}
		}
		return r, nil
	}
	r.Formula = ptr(m.Formula())
	r.MolarMass = ptr(m.MolarMass())
	est, err := ws.EstimateMolecule(m, opts)
	if err != nil {
		r.Error = &errorJSON{Message: err.Error()}
		return r, nil
	}
	r.Hf298 = ptr(est.Hf298 / 1000)
	r.S298 = ptr(est.S298)
	r.Cp = map[string]float64{}
	for i, k := range analysis.StdTempKeys {
		r.Cp[k] = est.Cp[i]
	}
	r.Uncertainty = ptr(est.Uncertainty / 1000)
	if g := est.Group; g != nil {
		for _, t := range g.Groups {
			r.Groups = append(r.Groups, groupJSON{Name: t.Name, Count: t.Count, Hf298: t.Hf298 / 1000, S298: t.S298, Source: t.Source})
		}
		for _, t := range g.Corrections {
			r.Corrections = append(r.Corrections, correctionJSON{Name: t.Name, Count: t.Count, Hf298: t.Hf298 / 1000, S298: t.S298})
		}
		for _, ms := range g.Missing {
			r.MissingGroups = append(r.MissingGroups, ms.Group)
		}
		r.SymmetryNumber = ptr(g.SymmetryNumber)
		r.OpticalIsomers = ptr(g.OpticalIsomers)
	} else {
		// A reference-library species: the whole value is one reference term,
		// so that the breakdown still sums to the totals.
		r.Groups = append(r.Groups, groupJSON{Name: "reference: " + est.Library, Count: 1, Hf298: est.Hf298 / 1000, S298: est.S298, Source: est.LibrarySource})
	}
	if withNASA {
		p, fit, err := est.NASA7()
		if err != nil {
			r.Error = &errorJSON{Message: "NASA-7 fit failed: " + err.Error()}
		} else {
			r.NASA7 = &nasaJSON{TLow: p.TLow, TMid: p.TMid, THigh: p.THigh, Low: p.Low, High: p.High, MaxCpResidual: fit.MaxCpResidual}
		}
	}
	return r, est
}

// writeEstimateText prints the readable breakdown of one estimate.
func writeEstimateText(w io.Writer, r estimateJSON, est *analysis.Estimate, set analysis.Settings, withNASA bool) {
	fmt.Fprintf(w, "%s\n", r.Input)
	if r.Error != nil {
		if r.Error.Position != nil {
			fmt.Fprintf(w, "  error at position %d: %s\n", *r.Error.Position, r.Error.Message)
			fmt.Fprintf(w, "    %s\n    %s^\n", r.Input, strings.Repeat(" ", *r.Error.Position-1))
		} else {
			fmt.Fprintf(w, "  error: %s\n", r.Error.Message)
		}
		return
	}
	fmt.Fprintf(w, "  formula %s, molar mass %.3f g/mol\n", *r.Formula, *r.MolarMass)
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	const kcal = 4184.0
	if g := est.Group; g != nil {
		fmt.Fprintln(tw, "  group\tcount\tΔHf°298 kcal/mol\tS°298 cal/(mol·K)\tsource\t")
		for _, t := range g.Groups {
			fmt.Fprintf(tw, "  %s\t%d\t%.2f\t%.2f\t%s\t\n", t.Name, t.Count, t.Hf298/kcal, t.S298/4.184, t.Source)
		}
		for _, t := range g.Corrections {
			fmt.Fprintf(tw, "  %s\t%d\t%.2f\t%.2f\t(correction)\t\n", t.Name, t.Count, t.Hf298/kcal, t.S298/4.184)
		}
		tw.Flush()
		fmt.Fprintf(w, "  symmetry number σ = %d, optical isomers n = %d, multiplicity %d\n", g.SymmetryNumber, g.OpticalIsomers, g.Multiplicity)
		for _, ms := range g.Missing {
			fmt.Fprintf(w, "  MISSING group %s: approximated by %s (%s)\n", ms.Group, ms.Approximation, ms.Note)
		}
	} else {
		fmt.Fprintf(w, "  reference library: %s (%s)\n", est.Library, est.LibrarySource)
	}
	fmt.Fprintf(w, "  ΔHf°298 = %.2f kcal/mol = %.1f kJ/mol (± %.1f kcal/mol, 1σ: class error widened by each approximation)\n", est.Hf298/kcal, est.Hf298/1000, est.Uncertainty/kcal)
	fmt.Fprintf(w, "  S°298   = %.2f cal/(mol·K) = %.2f J/(mol·K)\n", est.S298/4.184, est.S298)
	fmt.Fprintf(w, "  Cp      ")
	for i, T := range benson.StdTemps {
		fmt.Fprintf(w, " %gK:%.2f", T, est.Cp[i]/4.184)
	}
	fmt.Fprintf(w, "  cal/(mol·K)\n")
	if p, fit, err := est.NASA7(); withNASA && err == nil {
		fmt.Fprintf(w, "  NASA-7 fit (worst Cp residual %.3f J/(mol·K)):\n", fit.MaxCpResidual)
		fmt.Fprint(w, speciesfile.FormatNASA7Block("  ", p.TLow, p.TMid, p.THigh, p.Low, p.High, "kiln "+Version+" estimate", "\n"))
	}
	fmt.Fprintln(w, "  Group additivity typically errs by 1–3 kcal/mol; check against measured data before relying on it.")
	_ = set
}
