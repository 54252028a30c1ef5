package analysis

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestResonanceSpellingsAreOneStructure: two resonance structures of one
// radical declared under two names are reported as the same structure, as
// two spellings of one closed-shell molecule are; different radicals are not.
func TestResonanceSpellingsAreOneStructure(t *testing.T) {
	res := analyseWith(t, `species propargyl [CH2]C#C
species allenyl C=C=[CH]
species allyl C=C[CH2]
species allyl2 [CH2]C=C
species propyl CC[CH2]
species isopropyl C[CH]C
`, DefaultSettings())
	lines := map[int]bool{}
	for _, d := range res.Diagnostics {
		if d.Code == speciesfile.CodeDuplicateSpecies {
			lines[res.File.Lines.Position(d.Span.Start).Line+1] = true
		}
	}
	assert.Equal(t, map[int]bool{2: true, 4: true}, lines, "%v", res.Diagnostics)
}

// TestLibrarySpellingsAreOneSpecies: two spellings that the reference
// library knows as one species (its entry's SMILES and an alias, or an N–O
// unit charge-separated) are one structure for the duplicate check and for
// compare; a different species of the library is not.
func TestLibrarySpellingsAreOneSpecies(t *testing.T) {
	res := analyseWith(t, `species HCCO [CH]=C=O
species HCCO-b C#C[O]
species NO2 [O]N=O
species NO2-b O=[N+][O-]
species NCO [N]=C=O
species NCO-b N#C[O]
species HOCN N#CO
`, DefaultSettings())
	lines := map[int]bool{}
	for _, d := range res.Diagnostics {
		if d.Code == speciesfile.CodeDuplicateSpecies {
			lines[res.File.Lines.Position(d.Span.Start).Line+1] = true
		}
	}
	assert.Equal(t, map[int]bool{2: true, 4: true, 6: true}, lines, "%v", res.Diagnostics)

	files := map[string]string{
		"/w/a.kiln": "species HCCO [CH]=C=O\nspecies NO2 [O]N=O\nspecies NCO [N]=C=O\nspecies HOCN N#CO\n",
		"/w/b.kiln": "species ketenyl C#C[O]\nspecies nitrogen-dioxide O=[N+][O-]\nspecies cyanato N#C[O]\nspecies HNCO O=C=N\n",
	}
	c := compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	assert.Equal(t, map[string]string{"HCCO": "ketenyl", "NO2": "nitrogen-dioxide", "NCO": "cyanato"}, pairNames(c))
}

// TestOverrideOfLibraryDerivedGroup: a group statement replacing a built-in
// value that was derived from a library species says that the library
// species keeps its data (CHCl3 stays the library's; its radical CCl3 takes
// the new value), and a group with no library origin does not say so.
func TestOverrideOfLibraryDerivedGroup(t *testing.T) {
	res := analyseWith(t, `group C-(Cl)3(H)
  hf298 -30.0
  s298 75.0
  cp 300=15.7 400=18.0 500=19.7 600=21.0 800=22.6 1000=23.5 1500=24.5
  source test override
group C-(C)(H)3
  hf298 -10.2
  s298 30.4
  cp 300=6.2 400=7.8 500=9.4 600=10.8 800=13.0 1000=14.8 1500=17.6
  source test override
species CHCl3 ClC(Cl)Cl
species CCl3 Cl[C](Cl)Cl
`, DefaultSettings())
	var msgs []string
	for _, d := range res.Diagnostics {
		if d.Code == speciesfile.CodeGroupOverride {
			msgs = append(msgs, d.Message)
		}
	}
	if assert.Len(t, msgs, 2) {
		assert.Contains(t, msgs[0], "derived from a library species, which this statement does not change")
		assert.NotContains(t, msgs[1], "derived from a library species")
		assert.Contains(t, msgs[1], "reference-library species keep the library's data")
	}
	assert.NotEmpty(t, res.ByName["CHCl3"].Estimate.Library, "the library species keeps its data")
	assert.InDelta(t, -24.60*4184, res.ByName["CHCl3"].Estimate.Hf298, 50)
}

// TestThiylThioneOneSpecies: vinylthiyl C=C[S] and thioformylmethyl
// [CH2]C=S are one radical (S• ↔ C=S), as C=C[NH] and [CH2]C=N are: the
// second spelling is a duplicate, both get one estimate, also when the
// groups of the thione structure are supplied (its higher ΔHf° loses), and
// compare pairs them across files.
func TestThiylThioneOneSpecies(t *testing.T) {
	groups := `group CS-(C)(H)
  hf298 30.0
  s298 30.0
  cp 300=7.0 400=8.0 500=9.0 600=9.5 800=10.5 1000=11.0 1500=12.0
  source test value, not real
group C-(CS)(H)3
  hf298 -10.2
  s298 30.4
  cp 300=6.19 400=7.84 500=9.4 600=10.79 800=13.02 1000=14.77 1500=17.58
  source test value, not real
`
	for _, prefix := range []string{"", groups} {
		res := analyseWith(t, prefix+`species vts C=C[S]
species tfm [CH2]C=S
species thioacetaldehyde CC=S
`, DefaultSettings())
		first := strings.Count(prefix, "\n") + 1
		lines := map[int]bool{}
		for _, d := range res.Diagnostics {
			if d.Code == speciesfile.CodeDuplicateSpecies {
				lines[res.File.Lines.Position(d.Span.Start).Line+1-first] = true
			}
		}
		assert.Equal(t, map[int]bool{1: true}, lines, "%v", res.Diagnostics)
		hf := map[string]float64{}
		for _, sp := range res.Species {
			if sp.Name == "vts" || sp.Name == "tfm" {
				h, _, ok := sp.Hf298S298()
				require.True(t, ok, sp.Name)
				hf[sp.Name] = h
			}
		}
		require.Len(t, hf, 2)
		assert.Equal(t, hf["vts"], hf["tfm"])
	}
	c := compareTexts(t, map[string]string{
		"/w/a.kiln": "species vts C=C[S]\n",
		"/w/b.kiln": "species tfm [CH2]C=S\n",
	}, "/w/a.kiln", "/w/b.kiln")
	assert.Equal(t, map[string]string{"vts": "tfm"}, pairNames(c))
}
