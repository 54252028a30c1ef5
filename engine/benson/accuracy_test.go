package benson

import (
	"bufio"
	"fmt"
	"math"
	"os"
	"sort"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
	"kiln.dev/kiln/engine/molecule"
)

// smallSpecies are handled by the reference library, not by group
// additivity; rows with these formulas are skipped.
var smallSpecies = map[string]bool{
	"H": true, "H2": true, "O": true, "O2": true, "HO": true, "H2O": true, "HO2": true, "H2O2": true,
	"CO": true, "CO2": true, "CH4": true, "CH3": true, "CH2": true, "CH": true, "C": true, "CHO": true,
	"CH2O": true, "N2": true, "Ar": true, "He": true, "NO": true, "NO2": true, "N2O": true, "H3N": true,
}

type refRow struct {
	name, smiles, class string
	hf, s               float64 // NaN when not entered
	cp                  [7]float64
}

func readRef(t *testing.T, path string) []refRow {
	t.Helper()
	f, err := os.Open(path)
	if os.IsNotExist(err) {
		t.Skipf("%s not present yet", path)
	}
	require.NoError(t, err)
	defer f.Close()
	var rows []refRow
	header := true
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || strings.TrimSpace(line) == "" {
			continue
		}
		if header {
			header = false
			continue
		}
		c := strings.Split(line, "\t")
		require.GreaterOrEqual(t, len(c), 12, "row %q", line)
		num := func(s string) float64 {
			if strings.TrimSpace(s) == "" {
				return math.NaN()
			}
			v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
			require.NoError(t, err, "row %q", line)
			return v
		}
		r := refRow{name: c[0], smiles: c[1], class: c[2], hf: num(c[3]), s: num(c[4])}
		for i := range r.cp {
			r.cp[i] = num(c[5+i])
		}
		rows = append(rows, r)
	}
	require.NoError(t, sc.Err())
	return rows
}

type errStat struct {
	n        int
	sum, max float64
	worst    string
}

func (e *errStat) add(err float64, name string) {
	if math.IsNaN(err) {
		return
	}
	a := math.Abs(err)
	e.n++
	e.sum += a
	if a > e.max {
		e.max, e.worst = a, name
	}
}

func (e *errStat) mae() float64 {
	if e.n == 0 {
		return 0
	}
	return e.sum / float64(e.n)
}

// TestAccuracy compares estimates with handbook values (testdata/thermo).
// Thresholds (per file): ΔHf° MAE ≤ 1.0 kcal/mol overall and ≤ 0.5 for
// alkanes, S° MAE ≤ 1.0 cal/(mol K), Cp MAE ≤ 0.6 cal/(mol K) over all
// temperatures — the accuracy a kineticist expects of second-order group
// additivity. heldout.tsv is only evaluated, never used to set any value.
func TestAccuracy(t *testing.T) {
	for _, file := range []string{"train", "heldout"} {
		t.Run(file, func(t *testing.T) {
			rows := readRef(t, "../../testdata/thermo/"+file+".tsv")
			hf := map[string]*errStat{}
			s := map[string]*errStat{}
			cp := map[string]*errStat{}
			get := func(m map[string]*errStat, k string) *errStat {
				if m[k] == nil {
					m[k] = &errStat{}
				}
				return m[k]
			}
			for _, r := range rows {
				mol, err := molecule.ParseSMILES(r.smiles)
				require.NoError(t, err, "%s %s", r.name, r.smiles)
				if smallSpecies[mol.Formula()] {
					continue
				}
				est, err := Estimate(mol, Options{})
				require.NoError(t, err, "%s %s", r.name, r.smiles)
				kcal := est.Hf298 / calorie / 1000
				cal := est.S298 / calorie
				for _, k := range []string{r.class, "all"} {
					get(hf, k).add(kcal-r.hf, r.name)
					get(s, k).add(cal-r.s, r.name)
					for i := range r.cp {
						get(cp, k).add(est.Cp[i]/calorie-r.cp[i], fmt.Sprintf("%s@%gK", r.name, StdTemps[i]))
					}
				}
				if testing.Verbose() {
					t.Logf("%-28s %-16s dHf %+6.2f  dS %+6.2f  dCp300 %+6.2f  dCp1000 %+6.2f  σ=%d n=%d class=%s", r.name, r.class,
						kcal-r.hf, cal-r.s, est.Cp[0]/calorie-r.cp[0], est.Cp[5]/calorie-r.cp[5], est.SymmetryNumber, est.OpticalIsomers, est.Class)
				}
			}
			var classes []string
			for k := range hf {
				classes = append(classes, k)
			}
			sort.Strings(classes)
			t.Logf("%s: %-16s %4s %22s %22s %22s", file, "class", "n", "ΔHf MAE/max kcal", "S MAE/max cal", "Cp MAE/max cal")
			for _, k := range classes {
				h, e, c := hf[k], get(s, k), get(cp, k)
				t.Logf("%s: %-16s %4d %10.2f %10.2f  %10.2f %10.2f  %10.2f %10.2f   worst ΔHf: %s",
					file, k, h.n, h.mae(), h.max, e.mae(), e.max, c.mae(), c.max, h.worst)
			}
			require.NotNil(t, hf["all"], "no rows evaluated")
			// Thresholds from the product brief; goal is half of each.
			if a := hf["alkane"]; a != nil {
				if a.mae() > 0.5 {
					t.Errorf("%s: alkane ΔHf MAE %.2f kcal/mol > 0.5", file, a.mae())
				}
			}
			if v := hf["all"].mae(); v > 1.0 {
				t.Errorf("%s: ΔHf MAE %.2f kcal/mol > 1.0", file, v)
			}
			if v := get(s, "all").mae(); v > 1.0 {
				t.Errorf("%s: S MAE %.2f cal/(mol K) > 1.0", file, v)
			}
			if v := get(cp, "all").mae(); v > 0.6 {
				t.Errorf("%s: Cp MAE %.2f cal/(mol K) > 0.6", file, v)
			}
		})
	}
}
