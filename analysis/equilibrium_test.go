package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestParseEquilibriumPressure: the pressure syntax of every kiln input
// (speciesfile.ParsePressure): a number with its unit attached.
func TestParseEquilibriumPressure(t *testing.T) {
	for in, want := range map[string]float64{"1atm": 101325, " 1atm ": 101325, "1bar": 1e5, "100kPa": 1e5, "760Torr": 101325, "101325Pa": 101325, "2.5e5Pa": 2.5e5} {
		got, err := ParseEquilibriumPressure(in)
		require.NoError(t, err, in)
		assert.InEpsilon(t, want, got, 1e-12, in)
	}
	for in, msg := range map[string]string{"1": `pressure: pressure "1" needs a unit`, "1psi": `unknown unit "psi"`,
		"-1atm": "must be positive", "atm": "is not a pressure", "1 atm": `unknown unit " atm"`} {
		_, err := ParseEquilibriumPressure(in)
		require.Error(t, err, in)
		assert.Contains(t, err.Error(), msg, in)
		assert.IsType(t, &InputError{}, err, in)
	}
}

// TestParseMix: amounts after the last colon, blanks ignored; every error
// names the item and its column (characters, 1-based) in the text typed.
func TestParseMix(t *testing.T) {
	got, err := ParseMix(" CH4:1, O2:2 ,N2:7.52,, C:weird:0.5")
	require.NoError(t, err)
	assert.Equal(t, []MixEntry{{"CH4", 1}, {"O2", 2}, {"N2", 7.52}, {"C:weird", 0.5}}, got)
	// Blanks separate items as commas do, except next to a colon.
	for _, in := range []string{"CH4:1 O2:2 N2:7.52", "CH4:1  O2:2,N2:7.52", "CH4: 1, O2 :2 N2 : 7.52", "\tCH4:1\tO2:2, N2:7.52 "} {
		got, err := ParseMix(in)
		require.NoError(t, err, in)
		assert.Equal(t, []MixEntry{{"CH4", 1}, {"O2", 2}, {"N2", 7.52}}, got, in)
	}
	for in, msg := range map[string]string{
		"CH4=1 O2=2": `mix item 1 (column 1) "CH4=1" must be NAME:AMOUNT (items separated by commas or blanks, e.g. "CH4:1, O2:2, N2:7.52")`,
		"CH4 1":      `mix item 1 (column 1) "CH4" must be NAME:AMOUNT`,
		"CH4:1 O2":   `mix item 2 (column 7) "O2" must be NAME:AMOUNT`,
	} {
		_, err := ParseMix(in)
		require.Error(t, err, in)
		assert.Contains(t, err.Error(), msg, in)
	}
	for in, msg := range map[string]string{
		"":                `mix is required, e.g. "CH4:1, O2:2, N2:7.52"`,
		" , ":             "mix lists no species",
		"CH4":             `mix item 1 (column 1) "CH4" must be NAME:AMOUNT`,
		"CH4:1,  O2":      `mix item 2 (column 9) "O2" must be NAME:AMOUNT`,
		"CH4:1, O2:-2":    `mix item 2 (column 8): amount of O2 must be a positive number, not "-2"`,
		"CH4:1, O2:x":     `not "x"`,
		"CH4:1, O2:Inf":   `not "Inf"`,
		"CH4:1, é:1, é:2": `mix item 3 (column 13) names é twice`,
		"CH4:1, :3":       `mix item 2 (column 8) ":3" must be NAME:AMOUNT`,
	} {
		_, err := ParseMix(in)
		require.Error(t, err, in)
		assert.Contains(t, err.Error(), msg, in)
		assert.IsType(t, &InputError{}, err, in)
	}
}

func TestParseEquilibriumTemperature(t *testing.T) {
	for in, want := range map[string]float64{"298.15": 298.15, "298.15K": 298.15, " 1500 K": 1500} {
		got, err := ParseEquilibriumTemperature(in)
		require.NoError(t, err, in)
		assert.Equal(t, want, got, in)
	}
	for _, in := range []string{"50", "7000", "hot", ""} {
		_, err := ParseEquilibriumTemperature(in)
		require.Error(t, err, in)
		assert.Contains(t, err.Error(), "temperature must be in K between 200 and 6000", in)
	}
}
