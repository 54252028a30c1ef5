package analysis

import (
	"context"
	"fmt"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/engine/reflib"
	"kiln.dev/kiln/speciesfile"
)

func analyseWith(t *testing.T, text string, set Settings) *Result {
	t.Helper()
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, os.ErrNotExist }, set)
	ws.SetOverlay("r.kiln", []byte(text))
	res, err := ws.Analyze(context.Background(), "r.kiln")
	require.NoError(t, err)
	return res
}

// generatedSpecies returns SMILES of many different molecules and radicals
// built from chains, branches, rings and functional groups, for invariants
// that must hold whatever the structure.
func generatedSpecies() []string {
	var out []string
	seen := map[string]bool{}
	add := func(s string) {
		if !seen[s] {
			seen[s] = true
			out = append(out, s)
		}
	}
	chain := func(n int) string { return strings.Repeat("C", n) }
	for n := 1; n <= 10; n++ {
		add(chain(n))              // alkane
		add(chain(n) + "O")        // alcohol
		add(chain(n) + "[CH2]")    // primary radical
		add(chain(n) + "C=C")      // 1-alkene
		add(chain(n) + "C=O")      // aldehyde
		add(chain(n) + "OC")       // methyl ether
		add(chain(n) + "C(C)C")    // iso-branch
		add(chain(n) + "C(=O)C")   // methyl ketone
		add(chain(n) + "[O]")      // alkoxy radical
		add(chain(n) + "C#C")      // 1-alkyne
		add(chain(n) + "c1ccccc1") // alkylbenzene
		add(chain(n) + "C1CCCCC1") // alkylcyclohexane
		add(chain(n) + "C(C)(C)C") // tert-butyl end
		add(chain(n) + "OO")       // hydroperoxide
		add(chain(n) + "C(=O)O")   // acid
		add("C=C" + chain(n))      // vinyl
		add(chain(n) + "[CH]C")    // secondary radical
		add("O" + chain(n) + "O")  // diol
		add(chain(n) + "C=CC")     // 2-alkene
		add(chain(n) + "C(C)=O")   // ketone
		add(chain(n) + "CC(C)O")   // secondary alcohol
	}
	return out
}

// TestFillThenCheckIsClean (issue 14, case 2): what `fill` writes, `check`
// accepts. Every reference-library species and every estimable generated
// species gets a block inserted; the filled file then has no warning or
// error at all (no nonphysical Cp from electronic contributions, no
// discontinuity, no mismatch between the block and the estimate it came
// from). It runs with the default ranges and with explicit ones.
func TestFillThenCheckIsClean(t *testing.T) {
	var b strings.Builder
	lib := reflib.New().All()
	for i, s := range lib {
		fmt.Fprintf(&b, "species lib%d %s\n  multiplicity %d\n", i, s.SMILES, s.Multiplicity)
	}
	for i, s := range generatedSpecies() {
		fmt.Fprintf(&b, "species gen%d %s\n", i, s)
	}
	src := b.String()
	for _, set := range []Settings{DefaultSettings(), func() Settings {
		s := DefaultSettings()
		s.TMid, s.THigh, s.ExplicitFitRange = 1200, 3000, true
		return s
	}()} {
		res := analyseWith(t, src, set)
		edits := res.FillEdits()
		libFilled, genFilled := 0, 0
		for _, sp := range res.Species {
			if _, ok := res.InsertThermoEdit(sp); ok {
				if strings.HasPrefix(sp.Name, "lib") {
					libFilled++
				} else {
					genFilled++
				}
			}
		}
		t.Logf("TMid %g THigh %g: %d library and %d estimated species filled", set.TMid, set.THigh, libFilled, genFilled)
		// Every library species is filled, except under an explicit THIGH
		// above the top of its data, which kiln does not extrapolate (O3 and
		// S2Cl2, whose data stop at 2000 K, under THIGH 3000 K).
		want, short := 0, []string(nil)
		for _, s := range lib {
			if !set.ExplicitFitRange || s.Poly.THigh >= set.THigh {
				want++
			} else {
				short = append(short, s.Name)
			}
		}
		assert.Equal(t, want, libFilled, "every library species whose data reach THIGH is filled")
		if set.ExplicitFitRange {
			assert.Equal(t, []string{"O3", "S2Cl2"}, short, "library species whose data stop below THIGH %g K", set.THigh)
		}
		assert.GreaterOrEqual(t, genFilled, 200)
		out, err := ApplyEdits([]byte(src), edits)
		require.NoError(t, err)
		res2 := analyseWith(t, string(out), set)
		var blocks []speciesfile.Span
		for _, sp := range res2.Species {
			if b := sp.Decl.NASA7; b != nil {
				blocks = append(blocks, b.Span.At(res2.declStart(sp)))
				if set.ExplicitFitRange {
					assert.Equal(t, set.TMid, b.TMid.Value, sp.Name)
					assert.Equal(t, set.THigh, b.THigh.Value, sp.Name)
				}
			}
		}
		require.Len(t, blocks, len(edits))
		for _, d := range res2.Diagnostics {
			if d.Severity > speciesfile.SeverityWarning {
				continue
			}
			for _, bl := range blocks {
				if d.Span.Start >= bl.Start && d.Span.Start <= bl.End {
					pos := res2.File.Lines.Position(d.Span.Start)
					t.Errorf("line %d: %s [%s]", pos.Line+1, d.Message, d.Code)
				}
			}
		}
	}
}

func codesOf(res *Result, code string) []string {
	var out []string
	for _, d := range res.Diagnostics {
		if d.Code == code {
			out = append(out, d.Message)
		}
	}
	return out
}

// TestMessageUnits (case 7): messages use the file's energy unit unless the
// setting names one, rounded for people; thermo-discontinuity and
// nonphysical-thermo included.
func TestMessageUnits(t *testing.T) {
	block := `species CH4 C
  nasa7 300 1000 3000
    low   4.9167871967e+00 -1.1483891112e-02  4.2511392855e-05 -4.0608001400e-08  1.3281315423e-11 -1.0262275517e+04 -3.7460786362e+00
    high -2.6391815710e-01  1.4154495153e-02 -6.6354702565e-06  1.4933874433e-09 -1.3089122051e-13 -8.3613814741e+03  2.0295266791e+01
species propane CCC
  thermo-table
    hf298 -25.0
    s298 64.6
    cp 300=17.7 400=22.5 500=16.0 600=31.0 800=37.1 1000=41.9 1500=49.0
`
	kcal := analyseWith(t, block, DefaultSettings())
	jump := codesOf(kcal, "thermo-discontinuity")
	require.Len(t, jump, 1)
	assert.Regexp(t, `^CH4: H jumps by 1\.99 kcal/mol at 1000 K \(low block -?\d+\.\d\d kcal/mol, high block -?\d+\.\d\d kcal/mol\)$`, jump[0])
	fall := codesOf(kcal, "nonphysical-thermo")
	require.Len(t, fall, 1)
	assert.Contains(t, fall[0], "cal/(mol·K)")
	assert.NotContains(t, fall[0], "J/(mol")

	kj := analyseWith(t, "units kJ/mol\n"+strings.ReplaceAll(block, "hf298 -25.0\n    s298 64.6\n    cp 300=17.7 400=22.5 500=16.0 600=31.0 800=37.1 1000=41.9 1500=49.0",
		"hf298 -104.6\n    s298 270.3\n    cp 300=74.1 400=94.1 500=66.9 600=129.7 800=155.2 1000=175.3 1500=205.0"), DefaultSettings())
	jump = codesOf(kj, "thermo-discontinuity")
	require.Len(t, jump, 1)
	assert.Regexp(t, `^CH4: H jumps by 8\.3 kJ/mol at 1000 K \(low block -?\d+\.\d kJ/mol, high block -?\d+\.\d kJ/mol\)$`, jump[0])
	fall = codesOf(kj, "nonphysical-thermo")
	require.Len(t, fall, 1)
	assert.Contains(t, fall[0], "J/(mol·K)")
	info := codesOf(kj, "missing-thermo")
	assert.Empty(t, info)

	// The setting wins over the file.
	set := DefaultSettings()
	set.DisplayUnits = "kcal/mol"
	jump = codesOf(analyseWith(t, "units kJ/mol\n"+block, set), "thermo-discontinuity")
	require.Len(t, jump, 1)
	assert.Contains(t, jump[0], "kcal/mol")
}

// TestFalloffCollision (case 15): falloff and pressure-table rates are
// evaluated at 0.01–100 bar (N2 bath gas) for the collision check, not
// read as k∞ or at 1 atm only.
func TestFalloffCollision(t *testing.T) {
	head := "species CH3 [CH3]\nspecies H [H]\nspecies CH4 C\nspecies N2 N#N\nspecies C2H5 C[CH2]\nspecies C2H4 C=C\n"
	// k∞ = 1e17 cm3/(mol s) is far above the bimolecular limit, but k0 is
	// so small that over 0.01–100 bar the falloff rate stays below it.
	res := analyseWith(t, head+`reaction CH3 + H (+M) => CH4 (+M)   A=1e17 n=0 Ea=0
  low-pressure A=1e16 n=0 Ea=0
  troe alpha=0.6 T3=100 T1=1000
`, DefaultSettings())
	assert.Empty(t, codesOf(res, "collision-limit"))
	r := res.Reactions[0]
	kf, _, ok, _ := r.RatesAt(1000, 1e5)
	require.True(t, ok)
	// k ≈ k0 [M] in the low-pressure limit: 1e16 × 1.2e-5 mol/cm3 at 1 bar,
	// 1000 K, times F ≤ 1.
	assert.Less(t, kf, 1e16*kineticsConc(1000, 1e5)*1.0001)
	assert.Greater(t, kf, 1e16*kineticsConc(1000, 1e5)*0.1)
	kf100, _, _, _ := r.RatesAt(1000, 1e7)
	assert.Greater(t, kf100, kf, "k rises with pressure")

	// With a large k0 the rate reaches k∞ at high pressure: warned, with
	// the pressure in the message.
	res = analyseWith(t, head+`reaction CH3 + H (+M) => CH4 (+M)   A=1e17 n=0 Ea=0
  low-pressure A=1e30 n=0 Ea=0
`, DefaultSettings())
	msgs := codesOf(res, "collision-limit")
	require.Len(t, msgs, 1)
	assert.Contains(t, msgs[0], "bar (N2 bath gas)")

	// A pressure table is scanned over its pressures, not read at 1 atm: the
	// 10 atm row is far too fast.
	res = analyseWith(t, head+`reaction C2H5 => C2H4 + H
  pressure 1atm A=1e13 n=0 Ea=40
  pressure 10atm A=1e18 n=0 Ea=0
`, DefaultSettings())
	msgs = codesOf(res, "collision-limit")
	require.Len(t, msgs, 1)
	assert.Contains(t, msgs[0], "bar")
}

func kineticsConc(T, P float64) float64 { return kinetics.Concentration(T, P) }

// TestCompareLines (case 1): compare reports a reaction on its keyword's
// line, like every other command, whatever comments precede it.
func TestCompareLines(t *testing.T) {
	a := "species H [H]\nspecies H2 [H][H]\n\n# a comment\n\nreaction H + H <=> H2  A=1e13 n=0 Ea=0\n"
	b := "species H [H]\nspecies H2 [H][H]\nreaction H + H <=> H2  A=2e13 n=0 Ea=0\n"
	c := compareTexts(t, map[string]string{"/w/a.kiln": a, "/w/b.kiln": b}, "/w/a.kiln", "/w/b.kiln")
	require.Len(t, c.Reactions, 1)
	assert.Equal(t, 6, c.Reactions[0].A.Line)
	assert.Equal(t, 3, c.Reactions[0].B.Line)
}
