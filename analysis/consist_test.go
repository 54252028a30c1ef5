package analysis

import (
	"context"
	"fmt"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

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
		assert.Equal(t, len(lib), libFilled, "every library species is filled")
		assert.GreaterOrEqual(t, genFilled, 200)
		out, err := ApplyEdits([]byte(src), edits)
		require.NoError(t, err)
		res2 := analyseWith(t, string(out), set)
		var blocks []speciesfile.Span
		for _, sp := range res2.Species {
			if b := sp.Decl.NASA7; b != nil {
				blocks = append(blocks, b.Span)
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
