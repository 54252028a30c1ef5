package analysis

import (
	"context"
	"errors"
	"fmt"
	"io"
	"kiln.dev/kiln/engine/kinetics"
	"math"
	"sort"
	"strconv"
	"strings"
	"text/tabwriter"
	"unicode/utf8"

	"kiln.dev/kiln/engine/equilibrium"
	"kiln.dev/kiln/speciesfile"
)

// This file is the one home of the equilibrium question asked of a file:
// the mixture syntax, the temperature and pressure inputs, the choice of
// species, the call of engine/equilibrium and the text rendering. Both
// `kiln equilibrium` and the language server's kiln.equilibrium command use
// it, so they cannot disagree.

// MixEntry is one species of a mixture with its amount (mol, any scale).
type MixEntry struct {
	Name   string
	Amount float64
}

// InputError is a mistake in one input of an equilibrium request: Input
// names it ("mix", "temperature", "pressure"; the CLI shows it as the flag
// --mix …, the editor as written) and Msg, which follows the name (it starts
// with a blank or a colon), says what is wrong, with the column (1-based, in
// characters) of the offending mixture item.
type InputError struct {
	Input string
	Msg   string
}

func (e *InputError) Error() string { return e.Input + e.Msg }

// MixExample is the mixture shown in messages and prompts.
const MixExample = "CH4:1, O2:2, N2:7.52"

// ParseMix reads a mixture "NAME:AMOUNT, NAME:AMOUNT, …": items are
// separated by commas, blanks or both ("CH4:1 O2:2" is read as
// "CH4:1, O2:2"); blanks next to a colon do not separate ("CH4: 1"). The
// amount follows the last colon of an item, so names may contain colons;
// they cannot contain commas or blanks (a species name is one token).
// Amounts are positive numbers (mol, any scale).
func ParseMix(s string) ([]MixEntry, error) {
	if strings.TrimSpace(s) == "" {
		return nil, &InputError{"mix", fmt.Sprintf(" is required, e.g. %q", MixExample)}
	}
	var out []MixEntry
	seen := map[string]bool{}
	for item, it := range mixItems(s) {
		text := it.text
		at := fmt.Sprintf("item %d (column %d)", item+1, utf8.RuneCountInString(s[:it.at])+1)
		k := strings.LastIndexByte(text, ':')
		if k <= 0 {
			return nil, &InputError{"mix", fmt.Sprintf(" %s %q must be NAME:AMOUNT (items separated by commas or blanks, e.g. %q)", at, text, MixExample)}
		}
		name, num := text[:k], text[k+1:]
		v, err := strconv.ParseFloat(num, 64)
		if err != nil || !(v > 0) || math.IsInf(v, 0) {
			return nil, &InputError{"mix", fmt.Sprintf(" %s: amount of %s must be a positive number, not %q", at, name, num)}
		}
		if seen[name] {
			return nil, &InputError{"mix", fmt.Sprintf(" %s names %s twice", at, name)}
		}
		seen[name] = true
		out = append(out, MixEntry{name, v})
	}
	if len(out) == 0 {
		return nil, &InputError{"mix", " lists no species"}
	}
	return out, nil
}

// mixItem is one item of a mixture text without blanks, and the byte
// offset in the text where it starts.
type mixItem struct {
	text string
	at   int
}

// mixItems splits a mixture text into items: at commas, and at blanks
// except those next to a colon.
func mixItems(s string) []mixItem {
	var items []mixItem
	for start := 0; start <= len(s); {
		end := strings.IndexByte(s[start:], ',')
		if end < 0 {
			end = len(s)
		} else {
			end += start
		}
		var cur *mixItem
		for i := start; i < end; {
			if s[i] == ' ' || s[i] == '\t' {
				i++
				continue
			}
			j := i
			for j < end && s[j] != ' ' && s[j] != '\t' {
				j++
			}
			field := s[i:j]
			if cur != nil && (strings.HasSuffix(cur.text, ":") || field[0] == ':') {
				cur.text += field // "CH4: 1", "CH4 :1"
			} else {
				items = append(items, mixItem{field, i})
				cur = &items[len(items)-1]
			}
			i = j
		}
		start = end + 1
	}
	return items
}

// DefaultEquilibriumTemperature (K) and DefaultEquilibriumPressure (Pa) are
// the initial state when none is given: 298.15 K and 1 atm.
const (
	DefaultEquilibriumTemperature = 298.15
	DefaultEquilibriumPressure    = speciesfile.PascalsPerAtm
)

// ParseEquilibriumTemperature reads "298.15" or "298.15K": kelvin within
// the range engine/equilibrium searches.
func ParseEquilibriumTemperature(s string) (float64, error) {
	v, err := strconv.ParseFloat(strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(s), "K")), 64)
	if err != nil || v < equilibrium.TMin || v > equilibrium.TMax {
		return 0, &InputError{"temperature", fmt.Sprintf(" must be in K between %g and %g, not %q", equilibrium.TMin, equilibrium.TMax, s)}
	}
	return v, nil
}

// ParseEquilibriumPressure reads a number with its pressure unit attached,
// "1atm", "10bar", "101.325kPa", "760Torr", "101325Pa", as every pressure
// kiln reads (speciesfile.ParsePressure, FORMAT.md §2 units), and returns Pa.
func ParseEquilibriumPressure(s string) (float64, error) {
	p, err := speciesfile.ParsePressure(strings.TrimSpace(s), "")
	if err != nil {
		return 0, &InputError{"pressure", ": " + err.Error()}
	}
	return p, nil
}

// EquilibriumRequest is one equilibrium question: the mixture, its initial
// temperature T (K) and pressure P (Pa), and the constraint.
type EquilibriumRequest struct {
	Mix []MixEntry
	T   float64
	P   float64
	// Adiabatic: find the temperature at which the products hold the
	// mixture's enthalpy (constant pressure) or internal energy (constant
	// volume); else T is held.
	Adiabatic bool
	// ConstantVolume holds the mixture's volume at T and P instead of P.
	ConstantVolume bool
	// Display names a file in messages and in the result (nil: the path).
	Display func(path string) string
}

// Equilibrium is the answer to an EquilibriumRequest. Its JSON form is the
// output of `kiln equilibrium --json` and the result of the editor command;
// the keys are a public contract. Amounts are in mol for the amounts of the
// mixture, energies in kJ and J/K for those amounts.
type Equilibrium struct {
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
	Species             []EquilibriumAmount `json:"species"`
	ElementPotentials   map[string]float64  `json:"element_potentials"`
	Excluded            []EquilibriumNote   `json:"excluded"`
	OutsideThermoRange  []EquilibriumNote   `json:"outside_thermo_range"`
	Iterations          int                 `json:"iterations"`
	TemperatureSearches int                 `json:"temperature_iterations"`
}

// EquilibriumAmount is one species of the products.
type EquilibriumAmount struct {
	Name         string  `json:"name"`
	MoleFraction float64 `json:"mole_fraction"`
	Moles        float64 `json:"mol"`
}

// EquilibriumNote says why a species was left out or is flagged.
type EquilibriumNote struct {
	Name   string `json:"name"`
	Reason string `json:"reason"`
}

// EquilibriumDisplayFraction is the smallest mole fraction the text lists.
const EquilibriumDisplayFraction = 1e-6

// Equilibrium computes the equilibrium of req's mixture over every usable
// species of the analysed file and its includes (neutral, with a
// composition and thermochemistry). An error names the mixture species
// that cannot take part, with where it is declared, or says why the
// solve failed (*equilibrium.ConvergenceError when it did not converge);
// the work is bounded by engine/equilibrium's iteration limits and stops
// when ctx is done.
func (r *Result) Equilibrium(ctx context.Context, req EquilibriumRequest) (*Equilibrium, error) {
	display := req.Display
	if display == nil {
		display = func(p string) string { return p }
	}
	out := &Equilibrium{File: display(r.Path), Adiabatic: req.Adiabatic, ConstantVolume: req.ConstantVolume,
		InitialTemperature: req.T, InitialPressure: req.P,
		Species: []EquilibriumAmount{}, Excluded: []EquilibriumNote{}, OutsideThermoRange: []EquilibriumNote{}}
	if len(req.Mix) == 0 {
		return nil, &InputError{"mix", fmt.Sprintf(" is required, e.g. %q", MixExample)}
	}
	var species []equilibrium.Species
	used := map[string]*Species{}
	reasons := map[string]string{}
	for _, sp := range r.Species {
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
			out.Excluded = append(out.Excluded, EquilibriumNote{sp.Name, reason})
			reasons[sp.Name] = reason
			continue
		}
		used[sp.Name] = sp
		species = append(species, equilibrium.Species{Name: sp.Name, Composition: sp.Composition, Thermo: equilibriumThermo(sp)})
	}
	for _, m := range req.Mix {
		sp, ok := r.ByName[m.Name]
		if !ok {
			return nil, fmt.Errorf("mix species %s is not declared in %s", m.Name, out.File)
		}
		if used[m.Name] == nil {
			return nil, fmt.Errorf("mix species %s cannot take part: %s (declared at %s)", m.Name, reasons[m.Name], r.position(r.SpeciesLoc(sp), display))
		}
	}
	if len(species) == 0 {
		return nil, errors.New("no species of the file can take part (none has both a composition and thermochemistry)")
	}
	sys, err := equilibrium.NewSystem(species)
	if err != nil {
		return nil, err
	}
	feed := make([]float64, len(species))
	for _, m := range req.Mix {
		feed[sys.Index(m.Name)] = m.Amount
	}
	res, err := sys.Solve(ctx, equilibrium.Problem{Feed: feed, T: req.T, P: req.P, Adiabatic: req.Adiabatic, ConstantVolume: req.ConstantVolume})
	if err != nil {
		return nil, err
	}
	out.Temperature, out.Pressure, out.Volume, out.TotalMoles = res.T, res.P, res.V, res.N
	out.Enthalpy, out.InternalEnergy, out.Entropy = res.H/1000, res.U/1000, res.S
	out.ElementPotentials = res.ElementPotentials
	out.Iterations, out.TemperatureSearches = res.Iterations, res.TemperatureIterations
	excluded := map[string]bool{}
	for _, name := range res.Excluded {
		excluded[name] = true
	}
	mass := 0.0
	for j, s := range sys.Species() {
		if excluded[s.Name] {
			continue
		}
		x := res.MoleFractions[j]
		out.Species = append(out.Species, EquilibriumAmount{Name: s.Name, MoleFraction: x, Moles: res.Moles[j]})
		mass += x * used[s.Name].MolarMass
		if x >= EquilibriumDisplayFraction {
			// 298.15 K, where ΔHf°298 and S°298 are defined (and kiln's fits
			// exact), counts as inside a range that starts at 300 K.
			if lo, hi, what := thermoRange(used[s.Name]); res.T < math.Min(lo, 298.15) || res.T > hi {
				out.OutsideThermoRange = append(out.OutsideThermoRange, EquilibriumNote{s.Name,
					fmt.Sprintf("%s valid %g–%g K, used at %.0f K", what, lo, hi, res.T)})
			}
		}
	}
	out.MeanMolarMass = mass
	sort.SliceStable(out.Species, func(i, j int) bool { return out.Species[i].MoleFraction > out.Species[j].MoleFraction })
	return out, nil
}

// ErrorCount is the number of error diagnostics of the analysed file.
func (r *Result) ErrorCount() int { return countErrors(r.Diagnostics) }

// position writes l as FILE:LINE:COL (1-based; columns in characters, as
// `kiln check` writes them).
func (r *Result) position(l Location, display func(string) string) string {
	f := r.Files[l.File]
	if f == nil {
		return display(l.File)
	}
	p := f.Lines.Position(l.Span.Start)
	return fmt.Sprintf("%s:%d:%d", display(l.File), p.Line+1, p.Char+1)
}

// thermoRange returns the temperatures (K) over which the thermochemistry
// the analysis uses for sp rests on data, and what that thermochemistry is.
func thermoRange(sp *Species) (lo, hi float64, what string) {
	switch sp.Source {
	case SourceFile:
		if p := sp.Given.Poly; p != nil {
			return p.TLow, p.THigh, "the file's nasa7 block is"
		}
		t := sp.Given.Table.T
		if len(t) == 0 {
			return 0, 0, "the file's thermo-table has no Cp; it is"
		}
		return math.Min(t[0], 298.15), t[len(t)-1], "the file's thermo-table (Cp held beyond its last point) is"
	case SourceEstimate:
		if sp.Estimate.Library != "" {
			p, _, _ := sp.Estimate.NASA7()
			return p.TLow, p.THigh, "the reference-library polynomial is"
		}
		return 298.15, 1500, "the group-additivity estimate (its NASA-7 fit, as `kiln fill` writes it, extrapolated past the group values' 1500 K) is"
	}
	return 0, 0, "no thermochemistry"
}

// WriteText writes the equilibrium as `kiln equilibrium` prints it (and the
// editor command shows it).
func (o *Equilibrium) WriteText(w io.Writer) {
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
		if s.MoleFraction < EquilibriumDisplayFraction {
			hidden++
			continue
		}
		fmt.Fprintf(tw, "%s\t%.6f\t%.6g\n", s.Name, s.MoleFraction, s.Moles)
	}
	tw.Flush()
	if hidden > 0 {
		fmt.Fprintf(w, "(%d species below mole fraction %g not shown; the JSON lists all)\n", hidden, EquilibriumDisplayFraction)
	}
	for _, n := range o.Excluded {
		fmt.Fprintf(w, "not included: %s: %s\n", n.Name, n.Reason)
	}
	for _, n := range o.OutsideThermoRange {
		fmt.Fprintf(w, "warning: %s: %s\n", n.Name, n.Reason)
	}
}

// Text is WriteText into a string.
func (o *Equilibrium) Text() string {
	var b strings.Builder
	o.WriteText(&b)
	return b.String()
}

func pressureText(p float64) string {
	return fmt.Sprintf("%.5g atm (%.6g Pa)", p/speciesfile.PascalsPerAtm, p)
}

// equilibriumThermo is the thermochemistry an equilibrium uses for sp: the
// file's block, a library polynomial as tabulated, or a group estimate as
// kiln writes it (Estimate.written), so that a file and its fill output
// give the same equilibrium (the reaction checks' model of an estimate,
// groupThermo, agrees with the fit to within its residuals).
func equilibriumThermo(sp *Species) kinetics.Thermo {
	if e := sp.Estimate; sp.Source == SourceEstimate && e != nil && e.Library == "" {
		return e.written()
	}
	return sp.Thermo()
}
