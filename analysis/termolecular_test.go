package analysis

import (
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestTermolecularCollisionCheck: tester3's coll.kiln has a three-molecule
// forward rate (H + H + O2, 1e25 cm6/(mol2 s)) and a bimolecular step whose
// thermochemistry implies an absurd three-molecule reverse rate (CH3 + HCN
// + O); both get a collision-limit warning that says what the bound is and
// names the colliding pair. Sound three-body rates of the usual size stay
// silent (kinetics.TestTermolecularBound has the numbers).
func TestTermolecularCollisionCheck(t *testing.T) {
	src, err := os.ReadFile("../testdata/tester3/coll.kiln")
	require.NoError(t, err)
	res := analyseText(t, string(src))
	got := map[int]string{}
	for _, d := range res.Diagnostics {
		if d.Code == "collision-limit" {
			got[res.File.Lines.Position(d.Span.Start).Line+1] = d.Message
		}
	}
	require.Contains(t, got, 14)
	assert.Contains(t, got[14], "forward rate 1e+25 exceeds the collision limit 2.68e+19 (cm⁶/(mol²·s)) at 300 K")
	assert.Contains(t, got[14], "termolecular sanity bound: at 1 bar, k·[M] would outrun the H + H collision rate")
	require.Contains(t, got, 11)
	assert.Contains(t, got[11], "reverse rate implied by thermochemistry")
	assert.Contains(t, got[11], "(cm⁶/(mol²·s))")
	assert.Contains(t, got[11], "CH3 + HCN collision rate")

	sound := `species H [H]
species O [O]
species OH [OH]
species O2 O=O
species HO2 [O]O
species H2O O
species CO [C-]#[O+]
species HCO [CH]=O
reaction H + O2 + M <=> HO2 + M   A=2.8e18 n=-0.86 Ea=0
reaction H + OH + M <=> H2O + M   A=3.8e22 n=-2 Ea=0
reaction O + O + M <=> O2 + M   A=6.2e15 n=-0.5 Ea=0
reaction H + O + M <=> OH + M   A=4.7e18 n=-1 Ea=0
reaction HCO + M <=> H + CO + M   A=1.87e17 n=-1 Ea=17.0
`
	for _, d := range analyseText(t, sound).Diagnostics {
		assert.False(t, d.Code == "collision-limit" && strings.Contains(d.Message, "termolecular"), d.Message)
	}
}
