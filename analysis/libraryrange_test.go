package analysis

import (
	"context"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestLibraryRangeWarned: a reference-library species whose data stop
// short (ozone, to 2000 K) warns on its declaration when a reaction needs it
// hotter, as the block fill writes for it then does: check says the same
// before and after fill (tester12). Without such a reaction, nothing.
func TestLibraryRangeWarned(t *testing.T) {
	const species = "units kJ/mol\nspecies O [O]\n  multiplicity 3\nspecies O2 O=O\n  multiplicity 3\nspecies O3 O=[O+][O-]\n"
	count := func(res *Result) (n int, msg string) {
		for _, d := range res.Diagnostics {
			if d.Code == speciesfile.CodeThermoOutOfRange {
				n++
				msg = d.Message
			}
		}
		return n, msg
	}
	n, msg := count(analyzeText(t, species+"reaction O + O2 <=> O3   A=1.0e12 n=0 Ea=0\n"))
	assert.Equal(t, 1, n, msg)
	assert.True(t, strings.HasPrefix(msg, "O3: the reference library's data for it cover 200–2000 K"), msg)
	n, _ = count(analyzeText(t, species))
	assert.Zero(t, n)
}

// TestLibraryRangeWarnedInclude: declared in an included file, the species
// is warned about on the reaction of the analysed file that needs it, naming
// where it is declared, as a short block there is.
func TestLibraryRangeWarnedInclude(t *testing.T) {
	files := map[string]string{
		"/w/main.kiln": "units kJ/mol\ninclude sp.kiln\nreaction O + O2 <=> O3   A=1.0e12 n=0 Ea=0\n",
		"/w/sp.kiln":   "species O [O]\n  multiplicity 3\nspecies O2 O=O\n  multiplicity 3\nspecies O3 O=[O+][O-]\n",
	}
	ws := NewWorkspace("/w", func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, os.ErrNotExist
	}, DefaultSettings())
	res, err := ws.Analyze(context.Background(), "/w/main.kiln")
	require.NoError(t, err)
	msgs := messagesWithCode(res, speciesfile.CodeThermoOutOfRange)
	require.Len(t, msgs, 1, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "O3 (sp.kiln:5): the reference library's data for it cover 200–2000 K")
}
