package main

import (
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/reflib"
)

// libraryMechanism writes a species file that declares every species of the
// reference library by structure and multiplicity, without thermo.
func libraryMechanism(t *testing.T) string {
	t.Helper()
	var b strings.Builder
	b.WriteString("# every reference-library species, no thermo blocks (written by TestFillCheckLibrary)\n")
	for i, s := range reflib.New().All() {
		fmt.Fprintf(&b, "species lib%d %s\n  multiplicity %d\n  note %s\n", i+1, s.SMILES, s.Multiplicity, s.Name)
	}
	path := filepath.Join(t.TempDir(), "library.kiln")
	require.NoError(t, os.WriteFile(path, []byte(b.String()), 0o644))
	return path
}

// TestFillCheckLibrary: `kiln fill` then `kiln check` on a mechanism that
// uses every reference-library species reports nothing above information:
// what fill writes from the library, check accepts.
func TestFillCheckLibrary(t *testing.T) {
	path := libraryMechanism(t)
	code, _, stderr := runKiln(t, "fill", path)
	require.Equal(t, exitOK, code, stderr)
	code, stdout, stderr := runKiln(t, "check", "--format", "json", path)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags), stderr)
	for _, d := range diags {
		assert.Contains(t, []string{"information", "hint"}, d.Severity, "%+v", d)
	}
	assert.Equal(t, exitOK, code)
}

// TestDenoxExampleClean: the second shipped example (ammonia/NOx, chlorine
// and sulfur chemistry) checks with no warning and no error.
func TestDenoxExampleClean(t *testing.T) {
	code, stdout, stderr := runKiln(t, "check", "--format", "json", "../../examples/denox.kiln")
	require.Equal(t, exitOK, code, stderr)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags))
	require.NotEmpty(t, diags, "the species without thermo blocks report their estimates")
	for _, d := range diags {
		assert.Equal(t, "information", d.Severity, "%+v", d)
	}
}

// TestFillCheckCages: `kiln fill` then `kiln check` on cage and bridged
// ring systems (the tester's cage.kiln and every parent of the ring-system
// table): what fill writes, check accepts (no thermo-mismatch), and a
// species whose estimate kiln knows to be impossible (cubane's S° below the
// translational + rotational bound) is skipped with that reason, not
// written.
func TestFillCheckCages(t *testing.T) {
	src, err := os.ReadFile("../../testdata/tester3/cage.kiln")
	require.NoError(t, err)
	text := string(src) + strings.Join([]string{
		"species norbornane C1CC2CCC1C2",
		"species norbornene C1=CC2CCC1C2",
		"species norbornadiene C1=CC2C=CC1C2",
		"species bco C1CC2CCC1CC2",
		"species bcpentane C1CC2CC12",
		"species spiropentane C1CC11CC1",
		"",
	}, "\n")
	path := filepath.Join(t.TempDir(), "cage.kiln")
	require.NoError(t, os.WriteFile(path, []byte(text), 0o644))
	code, _, stderr := runKiln(t, "fill", path)
	assert.Equal(t, exitProblems, code, "cubane is skipped")
	assert.Contains(t, stderr, "skipped cubane: no NASA-7 polynomial: the estimated S°298")
	assert.Contains(t, stderr, "is below")
	assert.NotContains(t, stderr, "skipped adamantane")
	filled, err := os.ReadFile(path)
	require.NoError(t, err)
	assert.Equal(t, strings.Count(text, "species ")-1, strings.Count(string(filled), "nasa7 "), "every species but cubane gets a block")

	_, stdout, stderr := runKiln(t, "check", "--format", "json", path)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags), stderr)
	for _, d := range diags {
		assert.NotEqual(t, "thermo-mismatch", d.Code, "%+v", d)
		assert.NotEqual(t, "error", d.Severity, "%+v", d)
		if d.Severity == "warning" {
			assert.Equal(t, "missing-group", d.Code, "only the estimate's own flags: %+v", d)
		}
	}
}

// TestEstimateLibraryHalogens: species kiln refused before the bromine and
// halomethane entries of the reference library (no group C-(Br)3(H),
// C-(F)(Cl)(H)2, CO-(F)(H), …; no polyvalent atom in Br, Br2, HBr) now come
// from the library, named as tabulated data, with the compilation's ΔHf°298.
// The bromomethanes carry Active Thermochemical Tables values (Goos, Burcat &
// Ruscic 2015); CBr3•, CFCl2•, CF2Cl• and three mixed bromohalomethanes are
// not entries (TestEstimateRefusesRoundedHalomethanes).
func TestEstimateLibraryHalogens(t *testing.T) {
	for _, tc := range []struct{ smiles, name, hf string }{
		{"[Br]", "Br", "(111.9 kJ/mol)"},
		{"BrBr", "Br2", "(30.9 kJ/mol)"},
		{"Br", "HBr", "(-36.3 kJ/mol)"},
		{"BrC(Br)Br", "CHBr3", "(47.4 kJ/mol)"},
		{"BrC(Br)(Br)Br", "CBr4", "(102.0 kJ/mol)"},
		{"BrCBr", "CH2Br2", "(3.1 kJ/mol)"},
		{"FC(F)(Cl)Br", "CF2ClBr", "(-442.2 kJ/mol)"},
		{"ClC(Cl)(Cl)Br", "CCl3Br", "(-42.1 kJ/mol)"},
		{"FCCl", "CH2FCl", "(-265.7 kJ/mol)"},
		{"O=CF", "HCOF", "(-374.6 kJ/mol)"},
		{"O=C(F)Cl", "COFCl", "(-429.5 kJ/mol)"},
	} {
		assertLibraryEstimate(t, tc.smiles, tc.name, tc.hf)
	}
}

// assertLibraryEstimate checks that kiln estimate gives smiles as the
// reference-library entry name, with ΔHf°298 text hf, and no estimate flag.
func assertLibraryEstimate(t *testing.T, smiles, name, hf string) {
	t.Helper()
	code, out, stderr := runKiln(t, "estimate", smiles)
	require.Equal(t, exitOK, code, "%s: %s%s", smiles, out, stderr)
	assert.Contains(t, out, "reference library: "+name+" (tabulated data", smiles)
	assert.Contains(t, out, hf, smiles)
	assert.NotContains(t, out, "cannot estimate", smiles)
	assert.NotContains(t, out, "approximation", smiles)
}

// TestEstimateRefusesRoundedHalomethanes: the CBr3, CFCl2 and CF2Cl
// radicals (published values spread by 30 kJ/mol or more) are not
// reference-library entries (engine/reflib/data_nsx.go), and no group of
// theirs is entered, so kiln estimate refuses each, exits 1 and names the
// missing group (for a radical, its parent's).
func TestEstimateRefusesRoundedHalomethanes(t *testing.T) {
	for _, tc := range []struct{ smiles, group string }{
		{"Br[C](Br)Br", "C-(Br)3(H)"},
		{"F[C](Cl)Cl", "C-(F)(Cl)2(H)"},
		{"F[C](F)Cl", "C-(F)2(Cl)(H)"},
	} {
		code, out, stderr := runKiln(t, "estimate", tc.smiles)
		assert.Equal(t, exitProblems, code, "%s: %s%s", tc.smiles, out, stderr)
		assert.Contains(t, out, "error: kiln cannot estimate it: no value and no approximation for group "+tc.group+":", tc.smiles)
		assert.NotContains(t, out, "reference library", tc.smiles)
	}
	// the ATcT bromides beside them are library data
	for _, smiles := range []string{"BrC(Br)Br", "ClC(Br)Br", "FC(F)(Br)Br", "ClC(Cl)Br", "FC(F)Br", "FC(Cl)Br"} {
		code, out, stderr := runKiln(t, "estimate", smiles)
		require.Equal(t, exitOK, code, out+stderr)
		assert.Contains(t, out, "reference library: ", smiles)
	}
}

// TestEstimateLibraryHaloethylenes: the haloacetylenes, their ethynyl
// radicals and carbon suboxide, which kiln refused (no group Ct-(F),
// Ct-(Cl), Cd-(F)(Cl); no group for a cumulated C=C=C=O chain), and
// trifluoroethylene and the trifluorovinyl radical, which it estimated with
// flags, come from the reference library with their source's ΔHf°298
// (NASA/TP-2002-211556; Active Thermochemical Tables for the haloacetylenes)
// and no estimate flag. The trichlorovinyl radical, whose record
// is not entered, stays a group estimate.
func TestEstimateLibraryHaloethylenes(t *testing.T) {
	for _, tc := range []struct{ smiles, name, hf string }{
		{"FC=C(F)F", "C2HF3", "(-491.0 kJ/mol)"},
		{"FC(F)=C(F)Cl", "C2F3Cl", "(-515.2 kJ/mol)"},
		{"FC(Cl)=C(Cl)Cl", "C2FCl3", "(-166.0 kJ/mol)"},
		{"C#CCl", "C2HCl", "(229.0 kJ/mol)"},
		{"ClC#CCl", "C2Cl2", "(233.8 kJ/mol)"},
		{"C#CF", "C2HF", "(104.4 kJ/mol)"},
		{"FC#CF", "C2F2", "(2.9 kJ/mol)"},
		{"C#CBr", "C2HBr", "(275.9 kJ/mol)"},
		{"ClC#[C]", "C2Cl", "(534.1 kJ/mol)"},
		{"F[C]=C(F)F", "C2F3", "(-228.2 kJ/mol)"},
		{"O=C=C=C=O", "C3O2", "(-93.6 kJ/mol)"},
	} {
		assertLibraryEstimate(t, tc.smiles, tc.name, tc.hf)
	}
	code, out, stderr := runKiln(t, "estimate", "Cl[C]=C(Cl)Cl")
	require.Equal(t, exitOK, code, stderr)
	assert.NotContains(t, out, "reference library")
	assert.Contains(t, out, "HBI: vinylic")
}
