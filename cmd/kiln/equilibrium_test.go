package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// airFile declares the reference library's C/H/O/N species (their thermo
// comes from engine/reflib: NIST-JANAF formation data, GRI-Mech 3.0 Cp) plus
// one estimated hydrocarbon and one species that cannot take part.
const airFile = `# methane flame products, equilibrium test
species CH4 C
species O2 O=O
species N2 N#N
species H2O O
species CO2 O=C=O
species CO [C-]#[O+]
species OH [OH]
species H [H]
species O [O]
species H2 [H][H]
species HO2 [O]O
species H2O2 OO
species NO [N]=O
species CH2O C=O
species ethane CC
species soot-lump
  composition C20H10
`

func writeTemp(t *testing.T, name, text string) string {
	t.Helper()
	dir := t.TempDir()
	require.NoError(t, os.MkdirAll(filepath.Join(dir, ".git"), 0o755))
	p := filepath.Join(dir, name)
	require.NoError(t, os.WriteFile(p, []byte(text), 0o644))
	return p
}

func equilibriumJSONOf(t *testing.T, args ...string) map[string]any {
	t.Helper()
	code, stdout, stderr := runKiln(t, append([]string{"equilibrium", "--json"}, args...)...)
	require.Equal(t, exitOK, code, stderr)
	var o map[string]any
	require.NoError(t, json.Unmarshal([]byte(stdout), &o))
	return o
}

func fractions(o map[string]any) map[string]float64 {
	out := map[string]float64{}
	for _, s := range o["species"].([]any) {
		m := s.(map[string]any)
		out[m["name"].(string)] = m["mole_fraction"].(float64)
	}
	return out
}

// TestEquilibriumFlameTemperature: stoichiometric methane–air at 1 atm from
// 298.15 K burns at ≈ 2225 K (common practice); the library's data sets
// agree on it within about ±5 K, so 10 K is allowed.
func TestEquilibriumFlameTemperature(t *testing.T) {
	f := writeTemp(t, "air.kiln", airFile)
	o := equilibriumJSONOf(t, f, "--mix", "CH4:1, O2:2, N2:7.52", "--temperature", "298.15", "--pressure", "1atm", "--adiabatic")
	assert.Equal(t, []string{"adiabatic", "constant_volume", "element_potentials", "enthalpy_kj", "entropy_j_k", "excluded", "file",
		"initial_pressure_pa", "initial_temperature_k", "internal_energy_kj", "iterations", "mean_molar_mass_g_mol", "outside_thermo_range",
		"pressure_pa", "species", "temperature_iterations", "temperature_k", "total_mol", "volume_m3"}, keysOf(o))
	T := o["temperature_k"].(float64)
	t.Logf("flame temperature %.1f K", T)
	assert.InDelta(t, 2225, T, 10)
	assert.Equal(t, 101325.0, o["pressure_pa"])
	x := fractions(o)
	assert.InDelta(t, 0.183, x["H2O"], 0.005)
	assert.Less(t, x["ethane"], 1e-12)
	// The lump without structure is listed, never silently dropped.
	ex := o["excluded"].([]any)
	require.Len(t, ex, 1)
	assert.Equal(t, "soot-lump", ex[0].(map[string]any)["name"])
	assert.Contains(t, ex[0].(map[string]any)["reason"], "no thermochemistry")

	// Constant volume: hotter, and the pressure rises about ninefold.
	v := equilibriumJSONOf(t, f, "--mix", "CH4:1, O2:2, N2:7.52", "--adiabatic", "--volume")
	assert.Greater(t, v["temperature_k"].(float64), T+300)
	assert.InDelta(t, 8.8, v["pressure_pa"].(float64)/101325, 0.3)

	code, stdout, _ := runKiln(t, "equilibrium", f, "--mix", "CH4:1, O2:2, N2:7.52", "--adiabatic")
	require.Equal(t, exitOK, code)
	assert.Contains(t, stdout, "final    T = 22")
	assert.Contains(t, stdout, "not included: soot-lump")
}

// TestEquilibriumWaterDissociation: water at 3000 K and 1 bar over
// {H2O, H2, O2} dissociates as NIST-JANAF's log10 Kf(H2O, 3000 K) = 1.343
// implies (testdata/janaf/H2O.tsv; Chase 1998, from memory): α solves
// α (α/2)^½ / ((1 − α)(1 + α/2)^½) = 10^−1.343. 2 % on α is ~3 % on K, the
// agreement of the library's polynomial with JANAF at 3000 K.
func TestEquilibriumWaterDissociation(t *testing.T) {
	f := writeTemp(t, "w.kiln", "species H2O O\nspecies H2 [H][H]\nspecies O2 O=O\n")
	o := equilibriumJSONOf(t, f, "--mix", "H2O:1", "--temperature", "3000", "--pressure", "1bar")
	var got float64
	for _, s := range o["species"].([]any) {
		if m := s.(map[string]any); m["name"] == "H2" {
			got = m["mol"].(float64)
		}
	}
	K := math.Pow(10, -1.343)
	lo, hi := 0.0, 1.0
	for range 100 {
		a := (lo + hi) / 2
		if a*math.Sqrt(a/2)/((1-a)*math.Sqrt(1+a/2)) < K {
			lo = a
		} else {
			hi = a
		}
	}
	t.Logf("α = %.5f, JANAF %.5f", got, lo)
	assert.InEpsilon(t, lo, got, 0.02)
}

// TestEquilibriumThermoRange: a species that matters at the answer but
// whose thermo does not reach that temperature is flagged with its range;
// fixed T and V gives the pressure from the amounts.
func TestEquilibriumThermoRange(t *testing.T) {
	f := writeTemp(t, "r.kiln", `species H2O O
  nasa7 300 1000 1500
    low  4.198640560e+00 -2.036434100e-03  6.520402110e-06 -5.487970620e-09  1.771978170e-12 -3.029372670e+04 -8.490322080e-01
    high 4.198640560e+00 -2.036434100e-03  6.520402110e-06 -5.487970620e-09  1.771978170e-12 -3.029372670e+04 -8.490322080e-01
    source test block: the low-range water coefficients reused for both ranges, valid to 1500 K only
species H2 [H][H]
species O2 O=O
`)
	o := equilibriumJSONOf(t, f, "--mix", "H2O:1", "--temperature", "2500", "--pressure", "1bar", "--volume")
	out := o["outside_thermo_range"].([]any)
	require.Len(t, out, 1)
	assert.Equal(t, "H2O", out[0].(map[string]any)["name"])
	assert.Contains(t, out[0].(map[string]any)["reason"], "valid 300–1500 K, used at 2500 K")
	assert.Equal(t, true, o["constant_volume"])
	assert.Equal(t, 2500.0, o["temperature_k"])
	// Fixed volume of 1 mol at 2500 K and 1 bar: P = n R T / V.
	assert.InEpsilon(t, o["total_mol"].(float64)*1e5, o["pressure_pa"].(float64), 1e-9)
	code, stdout, _ := runKiln(t, "equilibrium", f, "--mix", "H2O:1", "--temperature", "2500")
	require.Equal(t, exitOK, code)
	assert.Contains(t, stdout, "warning: H2O: the file's nasa7 block is valid 300–1500 K, used at 2500 K")
}

func TestEquilibriumErrors(t *testing.T) {
	f := writeTemp(t, "air.kiln", airFile)
	for _, c := range []struct {
		args []string
		code int
		msg  string
	}{
		{[]string{f}, exitUsage, "--mix is required"},
		{[]string{f, "--mix", "CH4"}, exitUsage, "NAME:AMOUNT"},
		{[]string{f, "--mix", "CH4:-1"}, exitUsage, "positive number"},
		{[]string{f, "--mix", "CH4:1, CH4:2"}, exitUsage, "twice"},
		{[]string{f, "--mix", "CH4:1", "--pressure", "1"}, exitUsage, "needs a unit"},
		{[]string{f, "--mix", "CH4:1", "--pressure", "1psi"}, exitUsage, `unknown unit "psi"`},
		{[]string{f, "--mix", "CH4:1", "--temperature", "50"}, exitUsage, "--temperature"},
		{[]string{f, "--mix", "C3H8:1, O2:5"}, exitProblems, "C3H8 is not declared"},
		{[]string{f, "--mix", "soot-lump:1, O2:20"}, exitProblems, "soot-lump cannot take part"},
		{[]string{filepath.Join(t.TempDir(), "missing.kiln"), "--mix", "CH4:1"}, exitUsage, "missing.kiln"},
	} {
		code, _, stderr := runKiln(t, append([]string{"equilibrium"}, c.args...)...)
		assert.Equal(t, c.code, code, "%v: %s", c.args, stderr)
		assert.Contains(t, stderr, c.msg, "%v", c.args)
	}
}

// TestEquilibriumAt298NotFlagged: a nasa7 block from 300 K (as kiln fill
// writes them) is not flagged at 298.15 K, where its ΔHf°298 and S°298 are
// defined; nothing reacts, so the answer is the feed at its temperature.
func TestEquilibriumAt298NotFlagged(t *testing.T) {
	f := writeTemp(t, "e.kiln", `species ethanol CCO
  nasa7 300 1000 5000
    low   2.0805476184e-01  3.1539801723e-02 -2.5225516602e-05  1.6004279208e-08 -5.5541263436e-12 -2.9207914546e+04  2.7202689437e+01
    high  5.7895732305e+00  1.6441737845e-02 -6.2929249280e-06  1.1072136207e-09 -7.3107020228e-14 -3.0999541016e+04 -3.1402546104e+00
    source test block
species ethane CC
`)
	o := equilibriumJSONOf(t, f, "--mix", "ethanol:1, ethane:1", "--adiabatic")
	assert.InDelta(t, 298.15, o["temperature_k"].(float64), 1e-6)
	assert.Empty(t, o["outside_thermo_range"])
}
