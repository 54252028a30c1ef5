package ide

import (
	"testing"

	"github.com/stretchr/testify/assert"

	"kiln.dev/kiln/speciesfile"
)

func TestEquilibriumLens(t *testing.T) {
	for _, c := range []struct {
		src  string
		want string // the text of the line the lens sits on ("" for none)
	}{
		{"# header\nunits kJ/mol\n\nspecies H2 [H][H]\nspecies O2 O=O\n", "species H2 [H][H]"},
		{"include \"base.kiln\"\nreaction H + O2 <=> OH + O  A=1e14 n=0 Ea=16\n", "include \"base.kiln\""},
		{"include \"base.kiln\"\nspecies X C\n", "species X C"},
		{"# nothing but a comment\n", ""},
		{"", ""},
	} {
		f := speciesfile.Parse("t.kiln", []byte(c.src))
		sp, ok := EquilibriumLens(f)
		if c.want == "" {
			assert.False(t, ok, c.src)
			continue
		}
		if assert.True(t, ok, c.src) {
			line := f.Lines.Line(sp.Start)
			start := f.Lines.Offset(line, 0)
			end := start
			for end < len(f.Src) && f.Src[end] != '\n' {
				end++
			}
			assert.Equal(t, c.want, string(f.Src[start:end]), c.src)
			assert.Equal(t, sp.Start, start, "the lens starts at the keyword")
		}
	}
}
