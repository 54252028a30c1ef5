package speciesfile

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// checkNumberPrefix asserts that parseNumber agrees with the reference
// scanner (scanNumber) on the prefix length and with strconv.ParseFloat on
// the value, bit for bit: the fast path claims correct rounding, so the
// tolerance is zero (NaN cannot occur, the grammar has no NaN).
func checkNumberPrefix(t *testing.T, s string) {
	t.Helper()
	n, v, err := parseNumber(s)
	require.Equal(t, scanNumber(s), n, "prefix length of %q", s)
	if n == 0 {
		return
	}
	want, wantErr := strconv.ParseFloat(s[:n], 64)
	require.Equal(t, wantErr == nil, err == nil, "error for %q: got %v, strconv %v", s, err, wantErr)
	require.Equal(t, math.Float64bits(want), math.Float64bits(v), "value of %q: got %v, strconv %v", s, v, want)
}

func TestParseNumberMatchesStrconv(t *testing.T) {
	for _, s := range []string{
		"0", "-0", "+0", "0.0", "-0.0", "00", "007", "1", "-1", "+1", "1.", ".5", "-.5", "1.5e3", "1.5E+3",
		"1e", "1e+", "1e-", "1ex", "e5", ".", "-", "+", "", "abc", "1.2.3",
		"69.5kJ/mol", "0.1atm", "40.6J/mol/K", "300K", "1.3e11", "-7.8e-12", "2.76", "1.27e41",
		"9007199254740992", "9007199254740993", "18446744073709551615", "123456789012345678901234567890",
		"1e22", "1e23", "1e-22", "1e-23", "4.9e-324", "1e-400", "1e400", "-1e400", "1.7976931348623157e308",
		"0.000000000000000000000000001", "0e999999999999", "1e999999999999", "1e-999999999999",
		"3.000000000e+00", "1.234567890e-12", "0.1", "0.2", "0.3", "2.2250738585072014e-308",
		"1d5", "1D-3", "12e", "5.e3",
	} {
		checkNumberPrefix(t, s)
	}
}

// TestParseNumberRandom compares against strconv on random decimal strings
// shaped like mechanism numbers (up to 20 significant digits, exponents up
// to ±40, so that both the fast path and the fallback are exercised).
func TestParseNumberRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	fast := 0
	for range 200_000 {
		var s string
		switch rng.IntN(3) {
		case 0:
			s = strconv.FormatFloat((rng.Float64()-0.5)*math.Pow(10, float64(rng.IntN(60)-30)), 'e', rng.IntN(18), 64)
		case 1:
			s = fmt.Sprintf("%d.%0*d", rng.Int64N(1e12)-5e11, rng.IntN(9)+1, rng.Int64N(1e8))
		default:
			s = fmt.Sprintf("%de%d", rng.Uint64N(1<<56), rng.IntN(81)-40)
		}
		checkNumberPrefix(t, s)
		if _, _, exact := parseNumberPrefix(s); exact {
			fast++
		}
	}
	// If no conversion took the fast path the test would only be testing
	// strconv against itself.
	assert.Positive(t, fast, "fast-path conversions")
}

// TestParseNumberFastPathCoverage pins which inputs take the fast path:
// typical mechanism numbers do, inputs outside Clinger's conditions
// (exponent beyond ±22, significand above 2^53 or longer than 19 digits)
// do not.
func TestParseNumberFastPathCoverage(t *testing.T) {
	for _, s := range []string{"3.000000000e+00", "-7.8e-12", "1.3e11", "2.76", "0", "-0.86", "1180",
		"9007199254740992", "1e22", "1e-22", "0e400"} {
		_, _, exact := parseNumberPrefix(s)
		assert.True(t, exact, "%q should take the fast path", s)
	}
	for _, s := range []string{"1.27e41", "9007199254740993", "1e23", "1e-23", "12345678901234567890"} {
		_, _, exact := parseNumberPrefix(s)
		assert.False(t, exact, "%q should fall back to strconv", s)
	}
}

// FuzzParseNumber checks parseNumber against scanNumber and strconv on any
// input.
func FuzzParseNumber(f *testing.F) {
	for _, s := range []string{"1.5e3", "-7.8e-12", "9007199254740993", "0.1atm", "1e23", ".5"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) { checkNumberPrefix(t, s) })
}

func BenchmarkParseNumber(b *testing.B) {
	nums := []string{"3.012345678e+00", "-7.800000000e-12", "1.300e+11", "2.76", "0", "-0.86", "1180"}
	for b.Loop() {
		for _, s := range nums {
			parseNumber(s)
		}
	}
}
