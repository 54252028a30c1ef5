package lsp

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// symmetricFile holds structures whose symmetry numbers and canonical forms
// once took minutes (automorphisms counted one by one): cages, a highly
// branched C40 alkane, a 121-carbon dendrimer-like alkane and disconnected
// copies of ethane, beside an ordinary species.
const symmetricFile = `species methane C
species C60 c12c3c4c5c1c1c6c7c2c2c8c3c3c9c4c4c%10c5c5c1c1c6c6c%11c7c2c2c7c8c3c3c8c9c4c4c9c%10c5c5c1c1c6c6c%11c2c2c7c3c3c8c4c4c9c5c1c1c6c2c3c41
species dodecahedrane C12C3C4C5C1C6C7C8C2C9C3C%10C4C%11C5C6C%12C7C%13C8C9C%10C%11C%12%13
species C40 C(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C
species ethanes CC.CC.CC.CC.CC.CC.CC.CC.CC.CC
species dendrimer ` + "C(C(C(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)C(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)(C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C)" + `
`

// TestSymmetricSpeciesKeepServerAnswering: a file full of highly symmetric
// structures is analysed (each one estimated or refused with a reason, never
// a hang), hover on an ordinary species is answered, and shutdown + exit
// still stop the server. The fake editor's 30 s call deadline is the hang
// detector; how fast these are is BENCHMARKS.md's business.
func TestSymmetricSpeciesKeepServerAnswering(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"sym.kiln": symmetricFile}, fakeOptions{})
	e.open("sym.kiln")
	diags := e.waitDiagnostics("sym.kiln")
	text := e.text("sym.kiln")
	for _, name := range []string{"C60", "dodecahedrane", "C40", "ethanes", "dendrimer"} {
		line := strings.Count(text[:strings.Index(text, "species "+name+" ")], "\n")
		found := false
		for _, d := range diags {
			if int(d.Range.Start.Line) == line {
				found = true
			}
		}
		assert.True(t, found, "%s: estimated (information) or refused (error) with a diagnostic on its line", name)
	}
	h := e.hover("sym.kiln", strings.Index(text, "methane"))
	assert.Contains(t, h, "ΔHf")
	require.NoError(t, e.shutdown())
}
