package main

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"
	"strconv"
	"strings"
	"unicode/utf8"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/speciesfile"
)

// estimateJSON is one element of `kiln estimate --json`; the keys are a
// public contract (SI units in the names).
type estimateJSON struct {
	Input          string           `json:"input"`
	Formula        *string          `json:"formula"`
	MolarMass      *float64         `json:"molar_mass_g_mol"`
	Hf298          *float64         `json:"hf298_kj_mol"`
	S298           *float64         `json:"s298_j_mol_k"`
	Cp             numericMap       `json:"cp_j_mol_k"`
	Groups         []groupJSON      `json:"groups"`
	Corrections    []correctionJSON `json:"corrections"`
	SymmetryNumber *json.Number     `json:"symmetry_number"` // exact integer of any size
	OpticalIsomers *int             `json:"optical_isomers"`
	// Multiplicity is the spin multiplicity 2S+1 of the data, for
	// reference-library species too (extension).
	Multiplicity *int `json:"multiplicity,omitempty"`
	// MissingGroups names the groups an estimate approximated or flagged;
	// on a refusal for want of groups, the groups missing (flag kind
	// "missing", extension).
	MissingGroups []string `json:"missing_groups"`
	// Flags words each entry of missing_groups as check, summary and hover
	// word it (extension; analysis.FlagText).
	Flags []string `json:"flags,omitempty"`
	// FlagKinds classifies each entry of missing_groups (extension):
	// "missing", "flagged", "approximated", "unphysical", or "modelled" — a
	// validated model's quantity (a radical site's S°/Cp change), which
	// check does not warn about (analysis.FlagKind).
	FlagKinds []string `json:"flag_kinds,omitempty"`
	// UncertaintyS298 is the lower bound on the standard uncertainty of
	// S°298 from approximations that change it (extension; absent when
	// none does).
	UncertaintyS298 *float64 `json:"uncertainty_s298_j_mol_k,omitempty"`
	// ResonanceForm is the canonical SMILES of the resonance structure
	// estimated, for a radical with several (engine/benson/resonance.go).
	ResonanceForm string `json:"resonance_form,omitempty"`
	// ReferenceLibrary names the reference entry whose tabulated data are
	// given instead of an estimate (extension). Its uncertainty is that of
	// the source, so uncertainty_hf298_kj_mol is null for it.
	ReferenceLibrary string   `json:"reference_library,omitempty"`
	Uncertainty      *float64 `json:"uncertainty_hf298_kj_mol"`
	// StatedUncertainty is the ± a reference-library entry's source states
	// (extension; uncertainty_hf298_kj_mol is its 1σ, half of it).
	StatedUncertainty *float64   `json:"stated_uncertainty_hf298_kj_mol,omitempty"`
	Error             *errorJSON `json:"error"`
	NASA7             *nasaJSON  `json:"nasa7,omitempty"`
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
	// hint is a line of advice for the text output (the message itself
	// is worded as check words it).
	hint string
}

type nasaJSON struct {
	TLow  float64    `json:"t_low"`
	TMid  float64    `json:"t_mid"`
	THigh float64    `json:"t_high"`
	Low   [7]float64 `json:"low"`
	High  [7]float64 `json:"high"`
	// MaxCpResidual is the fit's worst Cp residual in J/(mol K) (extension).
	MaxCpResidual float64 `json:"max_cp_residual_j_mol_k"`
	// Source is the block's source line as fill writes it (extension).
	Source string `json:"source"`
}

func runEstimate(e env, args []string) (int, error) {
	flags, inputs, err := parseArgs(args, withSettings(flagSpec{"json": false, "nasa": false, "sources": false, "multiplicity": true, "symmetry": true, "optical-isomers": true}))
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
	opts := analysis.EstimateOptions{TMid: set.TMid, THigh: set.THigh, ExplicitRange: set.ExplicitFitRange}
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
		r, est := estimateOne(ws, in, opts, withNASA, set.Stamp)
		if r.Error != nil {
			failed = true
		}
		if est != nil && est.Library != "" && (opts.Symmetry > 0 || opts.OpticalIsomers > 0) {
			// Said on stderr, so that --json stays one document.
			var given []string
			if opts.Symmetry > 0 {
				given = append(given, "--symmetry")
			}
			if opts.OpticalIsomers > 0 {
				given = append(given, "--optical-isomers")
			}
			verb := "does"
			if len(given) > 1 {
				verb = "do"
			}
			fmt.Fprintf(e.stderr, "kiln: %s: %s %s not apply to reference-library data (%s): its tabulated S°298 already holds σ and n\n", in, strings.Join(given, " and "), verb, est.Library)
		}
		if flags["json"] == "true" {
			results = append(results, r)
			continue
		}
		if i > 0 {
			fmt.Fprintln(e.stdout)
		}
		writeEstimateText(e.stdout, r, est, analysis.UnitsFor(set, nil), withNASA, flags["sources"] == "true", set.Stamp)
	}
	if flags["json"] == "true" {
		if err := writeJSON(e.stdout, results); err != nil {
			return 0, err
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
func estimateOne(ws *analysis.Workspace, in string, opts analysis.EstimateOptions, withNASA bool, stamp string) (estimateJSON, *analysis.Estimate) {
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
	r.MolarMass = ptr(jnum(m.MolarMass()))
	est, err := ws.EstimateMolecule(m, opts)
	if err != nil {
		r.Error = &errorJSON{Message: "kiln cannot estimate it: " + analysis.RefusalReason(err)}
		if ue := (*benson.UnsupportedError)(nil); errors.As(err, &ue) && ue.Element != "" {
			// Nothing kiln can do: say where the thermo has to come from.
			r.Error.hint = "a species with " + ue.Element + " needs its thermo given in a nasa7 or thermo-table block of its .kiln file"
		} else if !analysis.RefusalGivesRoute(analysis.RefusalReason(err)) {
			// The reason names what is missing; say how to go on, as
			// check does.
			r.Error.hint = "give the species a nasa7 or thermo-table block in its .kiln file"
		}
		// The groups whose absence refuses the estimate, where a tool
		// reading missing_groups of a flagged estimate looks for them.
		for _, g := range analysis.RefusalGroups(err) {
			r.MissingGroups = append(r.MissingGroups, g)
			r.Flags = append(r.Flags, analysis.RefusalGroupFlag(g))
			r.FlagKinds = append(r.FlagKinds, "missing")
		}
		return r, nil
	}
	r.Hf298 = ptr(jnum(est.Hf298 / 1000))
	r.Multiplicity = ptr(est.Multiplicity)
	r.S298 = ptr(jnum(est.S298))
	r.Cp = numericMap{}
	for i, k := range analysis.StdTempKeys {
		r.Cp[k] = ptr(est.Cp[i])
	}
	if est.Library != "" && est.Uncertainty > 0 {
		r.Uncertainty = ptr(jnum(est.Uncertainty / 1000)) // 1σ, as for an estimate
		r.StatedUncertainty = ptr(jnum(est.StatedUncertainty / 1000))
	}
	if g := est.Group; g != nil {
		r.Uncertainty = ptr(jnum(est.Uncertainty / 1000))
		for _, t := range g.Groups {
			r.Groups = append(r.Groups, groupJSON{Name: t.Name, Count: t.Count, Hf298: jnum(t.Hf298 / 1000), S298: jnum(t.S298), Source: t.Source})
		}
		for _, t := range g.Corrections {
			r.Corrections = append(r.Corrections, correctionJSON{Name: t.Name, Count: t.Count, Hf298: jnum(t.Hf298 / 1000), S298: jnum(t.S298)})
		}
		for _, ms := range est.Flags() {
			r.MissingGroups = append(r.MissingGroups, ms.Group)
			r.Flags = append(r.Flags, analysis.FlagText(ms))
			r.FlagKinds = append(r.FlagKinds, analysis.FlagKind(ms))
		}
		if g.UncertaintyS298 > 0 {
			r.UncertaintyS298 = ptr(jnum(g.UncertaintyS298))
		}
		r.SymmetryNumber = ptr(json.Number(g.Sigma()))
		r.OpticalIsomers = ptr(g.OpticalIsomers)
		r.ResonanceForm = g.Form
	} else {
		// A reference-library species: the whole value is one reference term,
		// so that the breakdown still sums to the totals. σ and n describe
		// the structure (the tabulated values already contain them).
		r.Groups = append(r.Groups, groupJSON{Name: "reference: " + est.Library, Count: 1, Hf298: jnum(est.Hf298 / 1000), S298: jnum(est.S298), Source: est.LibrarySource})
		r.ReferenceLibrary = est.Library
		// σ of a written Lewis structure describes the molecule only for a
		// closed-shell, uncharged one: for a radical or charge-separated
		// library species (NO2 and NO3 are delocalised; OH, CH3 …) σ is
		// left null (the tabulated S° contains the true one); so is σ of a
		// hypervalent centre that is not the whole molecule (molecule
		// package, hypervalent.go).
		if n := m.NeutralOxo(); n.UnpairedElectrons() == 0 && !anyCharge(n) {
			if sigma, err := n.SymmetryNumber(); err == nil {
				r.SymmetryNumber = ptr(json.Number(sigma.String()))
				r.OpticalIsomers = ptr(n.OpticalIsomers())
			}
		}
	}
	if withNASA {
		p, fit, err := est.NASA7()
		if err != nil {
			// SI in JSON, like its keys.
			r.Error = &errorJSON{Message: "NASA-7 fit failed: " + analysis.FitRefusal(err, analysis.Units{KJ: true})}
		} else {
			r.NASA7 = &nasaJSON{TLow: p.TLow, TMid: p.TMid, THigh: p.THigh, Low: p.Low, High: p.High, MaxCpResidual: jnum(fit.MaxCpResidual), Source: est.BlockSource(stamp)}
		}
	}
	return r, est
}

// writeEstimateText prints the readable breakdown of one estimate in the
// display units u (the other unit in parentheses for the totals). Group
// sources are listed with --sources, one line per group, so that the table
// stays narrow; --json always has them.
func writeEstimateText(w io.Writer, r estimateJSON, est *analysis.Estimate, u analysis.Units, withNASA, withSources bool, stamp string) {
	fmt.Fprintf(w, "%s\n", r.Input)
	if r.Error != nil && est == nil { // with an estimate, the error is its refused fit (below)
		if r.Error.Position != nil {
			fmt.Fprintf(w, "  error at position %d: %s\n", *r.Error.Position, r.Error.Message)
			fmt.Fprintf(w, "    %s\n    %s^\n", r.Input, strings.Repeat(" ", *r.Error.Position-1))
		} else {
			if r.Formula != nil && r.MolarMass != nil {
				// what the SMILES was read as (implicit hydrogens included)
				fmt.Fprintf(w, "  formula %s, molar mass %s\n", *r.Formula, analysis.FormatMolarMass(*r.MolarMass))
			}
			fmt.Fprintf(w, "  error: %s\n", r.Error.Message)
			if r.Error.hint != "" {
				fmt.Fprintf(w, "  %s\n", r.Error.hint)
			}
		}
		return
	}
	other := u.Other()
	fmt.Fprintf(w, "  formula %s, molar mass %s\n", *r.Formula, analysis.FormatMolarMass(*r.MolarMass))
	if g := est.Group; g != nil {
		var rows [][]string
		for _, t := range g.Groups {
			rows = append(rows, []string{t.Name, strconv.Itoa(t.Count), u.EnergyNumber(t.Hf298), u.EntropyNumber(t.S298)})
		}
		for _, t := range g.Corrections {
			rows = append(rows, []string{t.Name + " (correction)", strconv.Itoa(t.Count), u.EnergyNumber(t.Hf298), u.EntropyNumber(t.S298)})
		}
		writeTable(w, "  ", []string{"group", "count", "ΔHf°298 " + u.EnergyName(), "S°298 " + u.EntropyName()}, rows)
		fmt.Fprintf(w, "  symmetry number σ = %s, optical isomers n = %d, multiplicity %d\n", g.Sigma(), g.OpticalIsomers, g.Multiplicity)
		if g.Form != "" {
			fmt.Fprintf(w, "  estimated as the resonance structure %s (most stable of %d)\n", g.Form, g.ResonanceForms)
		}
		for _, ms := range est.Flags() {
			fmt.Fprintf(w, "  %s\n", analysis.FlagLine(ms))
		}
		if withSources {
			fmt.Fprintln(w, "  sources:")
			for _, t := range g.Groups {
				writeWrapped(w, "    ", t.Name+": "+t.Source)
			}
		} else {
			fmt.Fprintln(w, "  (group sources: --sources or --json)")
		}
	} else {
		span := ""
		if p, _, err := est.NASA7(); err == nil && p.THigh < 3000 {
			// Data that stop short say so (ozone: 200–2000 K); fill writes no
			// block beyond them.
			span = fmt.Sprintf("; its data cover %g–%g K only", p.TLow, p.THigh)
		}
		fmt.Fprintf(w, "  reference library: %s (tabulated data, not a group estimate%s), multiplicity %d\n", est.Library, span, est.Multiplicity)
		if r.SymmetryNumber != nil {
			fmt.Fprintf(w, "  symmetry number σ = %s, optical isomers n = %d (already contained in the tabulated S°)\n", *r.SymmetryNumber, *r.OpticalIsomers)
		} else {
			fmt.Fprintln(w, "  symmetry number: not derived from an open-shell, charge-separated or hypervalent structure (the tabulated S° contains it)")
		}
		if withSources {
			writeWrapped(w, "    ", "source: "+est.LibrarySource)
		} else {
			fmt.Fprintln(w, "  (source: --sources or --json)")
		}
	}
	if r.Uncertainty != nil && est.Library != "" {
		fmt.Fprintf(w, "  ΔHf°298 = %s (%s), tabulated, ± %s as its source gives it (read as a 95 %% bound: 1σ %s)\n", u.Energy(est.Hf298), other.Energy(est.Hf298), u.Energy(est.StatedUncertainty), u.Energy(est.Uncertainty))
	} else if r.Uncertainty != nil {
		fmt.Fprintf(w, "  ΔHf°298 = %s (%s), ± %s, 1σ: class error widened by each approximation\n", u.Energy(est.Hf298), other.Energy(est.Hf298), u.Energy(est.Uncertainty))
	} else {
		fmt.Fprintf(w, "  ΔHf°298 = %s (%s), tabulated: its uncertainty is the source's\n", u.Energy(est.Hf298), other.Energy(est.Hf298))
	}
	if g := est.Group; g != nil && g.UncertaintyS298 > 0 {
		fmt.Fprintf(w, "  S°298   = %s (%s), ± %s at least, 1σ: from the approximations that change S°\n", u.Entropy(est.S298), other.Entropy(est.S298), u.Entropy(g.UncertaintyS298))
	} else {
		fmt.Fprintf(w, "  S°298   = %s (%s)\n", u.Entropy(est.S298), other.Entropy(est.S298))
	}
	fmt.Fprintf(w, "  Cp in %s:", u.EntropyName())
	for i, T := range benson.StdTemps {
		fmt.Fprintf(w, " %gK %s", T, u.EntropyNumber(est.Cp[i]))
	}
	fmt.Fprintln(w)
	if p, fit, err := est.NASA7(); withNASA && err == nil {
		switch {
		case est.LibraryRefitted():
			fmt.Fprintf(w, "  NASA-7 polynomial (refitted to %g–%g–%g K from the library's; worst Cp residual %s):\n", p.TLow, p.TMid, p.THigh, u.Entropy(fit.MaxCpResidual))
		case est.Library != "" && fit.MaxCpResidual == 0:
			fmt.Fprintln(w, "  NASA-7 polynomial (the source's published Cp coefficients):")
		case est.Library != "":
			fmt.Fprintf(w, "  NASA-7 polynomial (the library's fit to its source's Cp; worst Cp residual %s):\n", u.Entropy(fit.MaxCpResidual))
		default:
			fmt.Fprintf(w, "  NASA-7 fit (worst Cp residual %s):\n", u.Entropy(fit.MaxCpResidual))
		}
		fmt.Fprint(w, speciesfile.FormatNASA7Block("  ", p.TLow, p.TMid, p.THigh, p.Low, p.High, est.BlockSource(stamp), "\n"))
	} else if withNASA {
		writeWrapped(w, "  ", "NASA-7 fit refused: "+analysis.FitRefusal(err, u))
	}
	writeWrapped(w, "  ", ide.CautionFor(est))
}

// anyCharge reports whether an atom of m carries a formal charge.
func anyCharge(m *molecule.Molecule) bool {
	for _, a := range m.Atoms {
		if a.Charge != 0 {
			return true
		}
	}
	return false
}
