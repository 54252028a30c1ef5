package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
	"text/tabwriter"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/engine/equilibrium"
	"kiln.dev/kiln/speciesfile"
)

// equilibriumJSON is the output of `kiln equilibrium --json`; the keys are a
// public contract. Amounts are in mol for the amounts given with --mix.
type equilibriumJSON struct {
	File                string              `json:"file"`
	Adiabatic           bool                `json:"adiabatic"`
	ConstantVolume      bool                `json:"constant_volume"`
	InitialTemperature  float64             `json:"initial_temperature_k"`
	InitialPressure     float64             `json:"initial_pressure_pa"`
	Temperature         float64             `json:"temperature_k"`
	Pressure            float64             `json:"pressure_pa"`
	Volume              float64             `json:"volume_m3"`
	TotalMoles          float64             `json:"total_mol"`
	Enthalpy            float64             `json:"enthalpy_kj"`
	InternalEnergy      float64             `json:"internal_energy_kj"`
	Entropy             float64             `json:"entropy_j_k"`
	MeanMolarMass       float64             `json:"mean_molar_mass_g_mol"`
	Species             []equilibriumAmount `json:"species"`
	ElementPotentials   map[string]float64  `json:"element_potentials"`
	Excluded            []equilibriumNote   `json:"excluded"`
	OutsideThermoRange  []equilibriumNote   `json:"outside_thermo_range"`
	Iterations          int                 `json:"iterations"`
	TemperatureSearches int                 `json:"temperature_iterations"`
}

type equilibriumAmount struct {
	Name         string  `json:"name"`
	MoleFraction float64 `json:"mole_fraction"`
	Moles        float64 `json:"mol"`
}

type equilibriumNote struct {
	Name   string `json:"name"`
	Reason string `json:"reason"`
}

// displayFraction is the smallest mole fraction the text table lists.
const displayFraction = 1e-6

func runEquilibrium(e env, args []string) (int, error) {
	flags, files, err := parseArgs(args, withSettings(flagSpec{"json": false, "mix": true, "temperature": true,
		"pressure": true, "adiabatic": false, "volume": false}))
	if err != nil {
		return 0, err
	}
	if len(files) != 1 {
		return 0, usagef("equilibrium needs exactly one FILE")
	}
	mix, err := parseMix(flags["mix"])
	if err != nil {
		return 0, err
	}
	T := 298.15
	if v, ok := flags["temperature"]; ok {
		if T, err = parseTemperature(v); err != nil {
			return 0, err
		}
	}
	P := speciesfile.PascalsPerAtm
	if v, ok := flags["pressure"]; ok {
		if P, err = parsePressure(v); err != nil {
			return 0, err
		}
	}
	res, _, err := analyzeFile(e, files[0], flags)
	if err != nil {
		return 0, err
	}
	out, err := equilibriumOf(res, mix, T, P, flags["adiabatic"] == "true", flags["volume"] == "true")
	if err != nil {
		fmt.Fprintf(e.stderr, "kiln equilibrium: %v\n", err)
		return exitProblems, nil
	}
	out.File = displayPath(res.Path)
	if n := countErrorDiags(res.Diagnostics); n > 0 {
		fmt.Fprintf(e.stderr, "kiln equilibrium: %s has %d error(s) (`kiln check` lists them); broken statements were left out\n", out.File, n)
	}
	if flags["json"] == "true" {
		if err := writeJSON(e.stdout, out); err != nil {
			return 0, err
		}
		return exitOK, nil
	}
	writeEquilibriumText(e.stdout, out)
	return exitOK, nil
}

func countErrorDiags(ds []speciesfile.Diagnostic) int {
	n := 0
	for _, d := range ds {
		if d.Severity == speciesfile.SeverityError {
			n++
		}
	}
	return n
}

// mixEntry is one species of --mix with its amount (mol, any scale).
type mixEntry struct {
	Name   string
	Amount float64
}

// parseMix reads "NAME:AMOUNT, NAME:AMOUNT, …". The amount follows the last
// colon of an item, so names may contain colons; they cannot contain commas.
func parseMix(s string) ([]mixEntry, error) {
	if strings.TrimSpace(s) == "" {
		return nil, usagef(`--mix is required, e.g. --mix "CH4:1, O2:2, N2:7.52"`)
	}
	var out []mixEntry
	seen := map[string]bool{}
	for item := range strings.SplitSeq(s, ",") {
		item = strings.TrimSpace(item)
		if item == "" {
			continue
		}
		k := strings.LastIndexByte(item, ':')
		if k <= 0 {
			return nil, usagef("--mix item %q must be NAME:AMOUNT", item)
		}
		name := strings.TrimSpace(item[:k])
		v, err := strconv.ParseFloat(strings.TrimSpace(item[k+1:]), 64)
		if err != nil || !(v > 0) || math.IsInf(v, 0) {
			return nil, usagef("--mix amount of %s must be a positive number, not %q", name, strings.TrimSpace(item[k+1:]))
		}
		if seen[name] {
			return nil, usagef("--mix names %s twice", name)
		}
		seen[name] = true
		out = append(out, mixEntry{name, v})
	}
	if len(out) == 0 {
		return nil, usagef("--mix lists no species")
	}
	return out, nil
}

// parseTemperature reads "298.15" or "298.15K".
func parseTemperature(s string) (float64, error) {
	v, err := strconv.ParseFloat(strings.TrimSuffix(strings.TrimSpace(s), "K"), 64)
	if err != nil || v < equilibrium.TMin || v > equilibrium.TMax {
		return 0, usagef("--temperature must be in K between %g and %g, not %q", equilibrium.TMin, equilibrium.TMax, s)
	}
	return v, nil
}

// parsePressure reads a number with a pressure unit, attached or not:
// "1atm", "1 bar", "101.325kPa", "760 Torr", "101325Pa" (FORMAT.md §2 units).
func parsePressure(s string) (float64, error) {
	t := strings.TrimSpace(s)
	k := len(t)
	for k > 0 && (t[k-1] >= 'a' && t[k-1] <= 'z' || t[k-1] >= 'A' && t[k-1] <= 'Z') {
		k--
	}
	num, unit := strings.TrimSpace(t[:k]), t[k:]
	if unit == "" {
		return 0, usagef("--pressure %q needs a unit: atm, bar, Pa, kPa or Torr", s)
	}
	f, ok := speciesfile.PressureUnit(unit)
	if !ok {
		return 0, usagef("--pressure unit %q is not one of atm, bar, Pa, kPa, Torr", unit)
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || !(v > 0) || math.IsInf(v, 0) {
		return 0, usagef("--pressure must be a positive number with a unit, not %q", s)
	}
	return v * f, nil
}

// equilibriumOf computes the equilibrium of the mix over every usable
// species of the analysed file and its includes.
func equilibriumOf(res *analysis.Result, mix []mixEntry, T, P float64, adiabatic, constV bool) (equilibriumJSON, error) {
	out := equilibriumJSON{Adiabatic: adiabatic, ConstantVolume: constV, InitialTemperature: T, InitialPressure: P,
		Species: []equilibriumAmount{}, Excluded: []equilibriumNote{}, OutsideThermoRange: []equilibriumNote{}}
	var species []equilibrium.Species
	used := map[string]*analysis.Species{}
	for _, sp := range res.Species {
		reason := ""
		switch {
		case len(sp.Composition) == 0:
			reason = "no structure or composition"
		case sp.Charge != 0:
			reason = "an ion (only neutral species are treated)"
		case sp.Thermo() == nil:
			reason = "no thermochemistry (no block and no estimate)"
		}
		if reason != "" {
			out.Excluded = append(out.Excluded, equilibriumNote{sp.Name, reason})
			continue
		}
		used[sp.Name] = sp
		species = append(species, equilibrium.Species{Name: sp.Name, Composition: sp.Composition, Thermo: sp.Thermo()})
	}
	for _, m := range mix {
		sp, ok := res.ByName[m.Name]
		if !ok {
			return out, fmt.Errorf("--mix species %s is not declared in %s", m.Name, displayPath(res.Path))
		}
		if used[m.Name] == nil {
			for _, x := range out.Excluded {
				if x.Name == sp.Name {
					return out, fmt.Errorf("--mix species %s cannot take part: %s", m.Name, x.Reason)
				}
			}
		}
	}
	if len(species) == 0 {
		return out, errors.New("no species of the file can take part (none has both a composition and thermochemistry)")
	}
	sys, err := equilibrium.NewSystem(species)
	if err != nil {
		return out, err
	}
	feed := make([]float64, len(species))
	for _, m := range mix {
		feed[sys.Index(m.Name)] = m.Amount
	}
	r, err := sys.Solve(context.Background(), equilibrium.Problem{Feed: feed, T: T, P: P, Adiabatic: adiabatic, ConstantVolume: constV})
	if err != nil {
		return out, err
	}
	out.Temperature, out.Pressure, out.Volume, out.TotalMoles = r.T, r.P, r.V, r.N
	out.Enthalpy, out.InternalEnergy, out.Entropy = r.H/1000, r.U/1000, r.S
	out.ElementPotentials = r.ElementPotentials
	out.Iterations, out.TemperatureSearches = r.Iterations, r.TemperatureIterations
	excluded := map[string]bool{}
	for _, name := range r.Excluded {
		excluded[name] = true
	}
	mass := 0.0
	for j, s := range sys.Species() {
		if excluded[s.Name] {
			continue
		}
		x := r.MoleFractions[j]
		out.Species = append(out.Species, equilibriumAmount{Name: s.Name, MoleFraction: x, Moles: r.Moles[j]})
		mass += x * used[s.Name].MolarMass
		if x >= displayFraction {
			if lo, hi, what := thermoRange(used[s.Name]); r.T < lo || r.T > hi {
				out.OutsideThermoRange = append(out.OutsideThermoRange, equilibriumNote{s.Name,
					fmt.Sprintf("%s valid %g–%g K, used at %.0f K", what, lo, hi, r.T)})
			}
		}
	}
	out.MeanMolarMass = mass
	sort.SliceStable(out.Species, func(i, j int) bool { return out.Species[i].MoleFraction > out.Species[j].MoleFraction })
	return out, nil
}

// thermoRange returns the temperatures (K) over which the thermochemistry
// the analysis uses for sp rests on data, and what that thermochemistry is.
func thermoRange(sp *analysis.Species) (lo, hi float64, what string) {
	switch sp.Source {
	case analysis.SourceFile:
		if p := sp.Given.Poly; p != nil {
			return p.TLow, p.THigh, "the file's nasa7 block is"
		}
		t := sp.Given.Table.T
		if len(t) == 0 {
			return 0, 0, "the file's thermo-table has no Cp; it is"
		}
		return math.Min(t[0], 298.15), t[len(t)-1], "the file's thermo-table (Cp held beyond its last point) is"
	case analysis.SourceEstimate:
		if sp.Estimate.Library != "" {
			p, _, _ := sp.Estimate.NASA7()
			return p.TLow, p.THigh, "the reference-library polynomial is"
		}
		return 298.15, 1500, "the group-additivity estimate (Cp held at its 1500 K value above) is"
	}
	return 0, 0, "no thermochemistry"
}

func writeEquilibriumText(w io.Writer, o equilibriumJSON) {
	mode := "at constant temperature and pressure"
	switch {
	case o.Adiabatic && o.ConstantVolume:
		mode = "adiabatic at constant volume (internal energy of the mix)"
	case o.Adiabatic:
		mode = "adiabatic at constant pressure (enthalpy of the mix)"
	case o.ConstantVolume:
		mode = "at constant temperature and volume"
	}
	fmt.Fprintf(w, "Equilibrium of %s, %s\n", o.File, mode)
	fmt.Fprintf(w, "initial  T = %.2f K  P = %s\n", o.InitialTemperature, pressureText(o.InitialPressure))
	fmt.Fprintf(w, "final    T = %.2f K  P = %s\n", o.Temperature, pressureText(o.Pressure))
	fmt.Fprintf(w, "mean molar mass %.3f g/mol, %.6g mol for the amounts given\n", o.MeanMolarMass, o.TotalMoles)
	fmt.Fprintf(w, "(ideal gas over the file's neutral species only: no condensed phases such as soot)\n\n")
	tw := tabwriter.NewWriter(w, 2, 4, 2, ' ', 0)
	fmt.Fprintf(tw, "species\tmole fraction\tmol\n")
	hidden := 0
	for _, s := range o.Species {
		if s.MoleFraction < displayFraction {
			hidden++
			continue
		}
		fmt.Fprintf(tw, "%s\t%.6f\t%.6g\n", s.Name, s.MoleFraction, s.Moles)
	}
	tw.Flush()
	if hidden > 0 {
		fmt.Fprintf(w, "(%d species below mole fraction %g not shown; --json lists all)\n", hidden, displayFraction)
	}
	for _, n := range o.Excluded {
		fmt.Fprintf(w, "not included: %s: %s\n", n.Name, n.Reason)
	}
	for _, n := range o.OutsideThermoRange {
		fmt.Fprintf(w, "warning: %s: %s\n", n.Name, n.Reason)
	}
}

func pressureText(p float64) string {
	return fmt.Sprintf("%.5g atm (%.6g Pa)", p/speciesfile.PascalsPerAtm, p)
}
