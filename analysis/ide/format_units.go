package ide

import (
	"math"
	"strconv"
	"strings"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// Unit conversions (exact): 1 cal = 4.184 J (thermochemical calorie).
const (
	jPerKcal = 4184.0
	jPerCal  = 4.184
)

// units describes how energies and entropies are displayed.
type units struct {
	kcal bool // kcal/mol and cal/(mol·K); else kJ/mol and J/(mol·K)
}

// displayUnits takes the unit choice from analysis.UnitsFor, the one rule
// for every output (f: the file the text is about, may be nil).
func displayUnits(s analysis.Settings, f *speciesfile.File) units {
	return units{kcal: !analysis.UnitsFor(s, f).KJ}
}

func (u units) energyName() string {
	if u.kcal {
		return "kcal/mol"
	}
	return "kJ/mol"
}

func (u units) entropyName() string {
	if u.kcal {
		return "cal/(mol·K)"
	}
	return "J/(mol·K)"
}

// energy formats an energy given in J/mol in the display unit with one decimal.
func (u units) energy(j float64) string {
	if u.kcal {
		return num(j/jPerKcal, 1) + " kcal/mol"
	}
	return num(j/1000, 1) + " kJ/mol"
}

// entropy formats an entropy or heat capacity given in J/(mol K).
func (u units) entropy(v float64) string {
	if u.kcal {
		return num(v/jPerCal, 1) + " cal/(mol·K)"
	}
	return num(v, 1) + " J/(mol·K)"
}

// entropyValue is entropy without the unit.
func (u units) entropyValue(v float64) string {
	if u.kcal {
		return num(v/jPerCal, 2)
	}
	return num(v, 2)
}

// num formats v with prec decimals, using the Unicode minus sign U+2212
// (typographic convention for displayed numbers) and never "-0.0".
// analysis.FormatFixed decides the digits (and exponent notation for huge
// values).
func num(v float64, prec int) string {
	return strings.Replace(analysis.FormatFixed(v, prec), "-", "−", 1)
}

// sci formats v with 3 significant digits in scientific notation ("1.23e+13").
func sci(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	return strings.Replace(strconv.FormatFloat(v, 'e', 2, 64), "-", "−", 1)
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
