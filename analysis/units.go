package analysis

import (
	"math"
	"strconv"
	"strings"

	"kiln.dev/kiln/speciesfile"
)

// Units is how kiln shows energies and entropies to people: the one place
// that chooses the unit, names it and converts to it. Messages, hovers,
// inlay hints and the CLI's text output all go through it; JSON output and
// the analysis itself stay in SI (J/mol, J/(mol K)).
//
// The display unit is the setting (--units, the editor's `units`) when it is
// given, else the file's own energy unit: kJ/mol for `units kJ/mol` and
// `units J/mol` files, kcal/mol otherwise. Entropies and heat capacities
// follow: J/(mol·K) with kJ/mol, cal/(mol·K) with kcal/mol.
type Units struct {
	KJ bool // kJ/mol and J/(mol·K); else kcal/mol and cal/(mol·K)
	// Both adds the other unit's value in parentheses to Entropy: for texts
	// made once and shown in files of either unit (flag notes).
	Both bool
}

// JoulesPerCalorie is the thermochemical calorie (exact by definition).
const JoulesPerCalorie = 4.184

// UnitsFor returns the display units for the settings and file f (nil: no
// file, the setting or kcal/mol).
func UnitsFor(s Settings, f *speciesfile.File) Units {
	switch s.DisplayUnits {
	case "kJ/mol":
		return Units{KJ: true}
	case "kcal/mol":
		return Units{}
	}
	if f != nil && (f.EnergyUnit == "kJ/mol" || f.EnergyUnit == "J/mol") {
		return Units{KJ: true}
	}
	return Units{}
}

// Units returns the display units of the analysed file.
func (r *Result) Units() Units { return UnitsFor(r.Settings, r.File) }

// EnergyName is "kcal/mol" or "kJ/mol".
func (u Units) EnergyName() string {
	if u.KJ {
		return "kJ/mol"
	}
	return "kcal/mol"
}

// EntropyName is "cal/(mol·K)" or "J/(mol·K)".
func (u Units) EntropyName() string {
	if u.KJ {
		return "J/(mol·K)"
	}
	return "cal/(mol·K)"
}

// EnergyValue converts an energy from J/mol to the display unit.
func (u Units) EnergyValue(j float64) float64 {
	if u.KJ {
		return j / 1000
	}
	return j / (1000 * JoulesPerCalorie)
}

// EntropyValue converts an entropy or heat capacity from J/(mol K) to the
// display unit.
func (u Units) EntropyValue(v float64) float64 {
	if u.KJ {
		return v
	}
	return v / JoulesPerCalorie
}

// Other is the other pair of display units (kJ/mol for kcal/mol and back):
// totals are shown in both, the display unit first.
func (u Units) Other() Units { return Units{KJ: !u.KJ} }

// EnergyNumber writes an energy (J/mol) in the display unit without its
// name, with the unit's decimals: "-56.21" (kcal/mol, 0.01 kcal/mol = 42
// J/mol) or "-235.2" (kJ/mol, 100 J/mol). Every text that shows an energy
// to people (messages, hovers, inlay hints, text tables) takes its digits
// from here; tables name the unit once in their header.
func (u Units) EnergyNumber(j float64) string {
	if u.KJ {
		return FormatFixed(u.EnergyValue(j), 1)
	}
	return FormatFixed(u.EnergyValue(j), 2)
}

// EntropyNumber writes an entropy or heat capacity (J/(mol K)) in the
// display unit without its name: "67.54" (cal/(mol·K)) or "282.6"
// (J/(mol·K)); see EnergyNumber.
func (u Units) EntropyNumber(v float64) string {
	if u.KJ {
		return FormatFixed(u.EntropyValue(v), 1)
	}
	return FormatFixed(u.EntropyValue(v), 2)
}

// Energy writes an energy (J/mol) for people with its unit: "-56.21
// kcal/mol" or "-235.2 kJ/mol" (digits: EnergyNumber).
func (u Units) Energy(j float64) string { return u.EnergyNumber(j) + " " + u.EnergyName() }

// Entropy writes an entropy or heat capacity (J/(mol K)) for people with
// its unit: "67.54 cal/(mol·K)" or "282.6 J/(mol·K)" (digits:
// EntropyNumber).
func (u Units) Entropy(v float64) string {
	s := u.EntropyNumber(v) + " " + u.EntropyName()
	if u.Both {
		o := Units{KJ: !u.KJ}
		s += " (" + o.Entropy(v) + ")"
	}
	return s
}

// FormatMolarMass writes a molar mass (g/mol) for people: "46.069 g/mol".
func FormatMolarMass(m float64) string { return FormatFixed(m, 3) + " g/mol" }

// FormatBar writes a pressure given in bar for people, with up to six
// significant digits: "1.01325 bar", "10 bar".
func FormatBar(bar float64) string { return strconv.FormatFloat(bar, 'g', 6, 64) + " bar" }

// Number formatting for people: the one home of how kiln writes a value
// with a fixed number of decimals in messages, hovers and text tables.

// FixedLimit is the magnitude from which FormatFixed switches to
// exponent notation: a value of 1e200 written with all its digits would be
// 200 characters wide and break every table column.
const FixedLimit = 1e9

// FormatFixed writes v with prec decimals ("-56.21"), never as "-0.00" (a
// value that rounds to zero has no sign), in exponent notation with prec
// decimals ("1.00e+200") from FixedLimit up, and as "—" when v is not a
// finite number (kiln never computes with one: see analysis/finite.go).
// FormatSigned is the same with a sign on every non-zero value.
func FormatFixed(v float64, prec int) string { return formatFixed(v, prec, false) }

// FormatSigned is FormatFixed with "+" before positive values ("+3.25").
func FormatSigned(v float64, prec int) string { return formatFixed(v, prec, true) }

// FormatSig writes a rate constant or an equilibrium constant, values that
// span hundreds of decades, with three significant digits ("1.8e+13",
// "0.00123", "4.5e-07"), and as "—" when v is not a finite number.
func FormatSig(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	return strconv.FormatFloat(v, 'g', 3, 64)
}

func formatFixed(v float64, prec int, sign bool) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	format := byte('f')
	if math.Abs(v) >= FixedLimit {
		format = 'e'
	}
	s := strconv.FormatFloat(v, format, prec, 64)
	if strings.Trim(s, "-0.") == "" {
		return strings.TrimPrefix(s, "-") // zero after rounding: no sign
	}
	if sign && s[0] != '-' {
		s = "+" + s
	}
	return s
}
