package main

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
)

// Ketene-type carbons kiln refuses (isocyanates, cumulated chains ending in
// C=O other than the reference library's carbon suboxide, ketene ends
// carrying a heteroatom) are refused by estimate and check
// alike, naming the kind of carbon and the route (a thermo block, as no
// group statement can name the carbon); substituted ketenes and butatriene
// are estimated with their flag.
func TestKeteneRefusalRouteInCommands(t *testing.T) {
	refused := []struct{ name, smiles, kind string }{
		{"MNCO", "CN=C=O", "atom 3 (C) is an isocyanate carbon"},
		// carbon suboxide O=C=C=C=O itself comes from the reference library
		{"C4O2", "O=C=C=C=C=O", "is a cumulated carbon of C=C=O"},
		{"C3H2O", "C=C=C=O", "is a cumulated carbon of C=C=O"},
		{"MEOKET", "COC=C=O", "is the CR2 end of a ketene"},
	}
	const route = "no `group` statement can name this carbon: give the species a thermo block"
	var file strings.Builder
	for _, r := range refused {
		_, stdout, stderr := runKiln(t, "estimate", r.smiles)
		out := stdout + stderr
		assert.Contains(t, out, r.kind, r.smiles)
		assert.Contains(t, out, route, r.smiles)
		assert.NotContains(t, out, "ketene carbon", r.smiles)
		file.WriteString("species " + r.name + " " + r.smiles + "\n")
	}
	file.WriteString("species VIKET C=CC=C=O\nspecies C4H4 C=C=C=C\n")
	_, stdout, stderr := runKiln(t, "check", writeTemp(t, "ketenes.kiln", file.String()))
	out := stdout + stderr
	for _, r := range refused {
		for _, line := range strings.Split(out, "\n") {
			if strings.Contains(line, " "+r.name+" has no thermo block") {
				assert.Contains(t, line, r.kind, r.name)
				assert.Contains(t, line, route+" [missing-thermo]", r.name) // the route once, at the end
				assert.NotContains(t, line, "add a nasa7", r.name)
			}
		}
		assert.Contains(t, out, " "+r.name+" has no thermo block and kiln cannot estimate it", r.name)
	}
	assert.Contains(t, out, "VIKET: estimated with an approximation kiln has no data for: 1 unsaturated carbon substituent on the CR2 end of a ketene (approximated by Cd-(Cd)(H)")
	assert.Contains(t, out, "C4H4: estimated with an approximation kiln has no data for: 2 adjacent allene centres")
}
