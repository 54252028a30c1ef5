package speciesfile

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestFormatNumber(t *testing.T) {
	for _, v := range []float64{0, 300, 1000, 0.62, -0.97, 1.5e13, 1.27e41, 1e-300, 5e-324, math.MaxFloat64, 1.0 / 3, -123456.789} {
		s := FormatNumber(v)
		f := Parse("n", []byte("reaction A => B A=1 n="+s+" Ea=0\n"))
		require.Empty(t, f.Diags, s)
		assert.Equal(t, v, f.Reactions[0].Rate.N.Value, "round trip of %s must be exact", s)
	}
	assert.Equal(t, "300", FormatNumber(300))
	assert.Equal(t, "1.5e+13", FormatNumber(1.5e13))
}

func TestFormatNASA7Block(t *testing.T) {
	low := [7]float64{4.8586957, -3.7401726e-3, 6.9555378e-5, -8.8654796e-8, 3.5168835e-11, -28996.961, 4.8018545}
	high := [7]float64{6.5628977, 1.5204223e-2, -5.3896795e-6, 8.6225011e-10, -5.1289787e-14, -31525.621, -9.4730202}
	got := FormatNASA7Block("  ", 300, 1000, 5000, low, high, "kiln 0.1.0 estimate\n#3", "\n")
	want := "  nasa7 300 1000 5000\n" +
		"    low   4.8586957000e+00 -3.7401726000e-03  6.9555378000e-05 -8.8654796000e-08  3.5168835000e-11 -2.8996961000e+04  4.8018545000e+00\n" +
		"    high  6.5628977000e+00  1.5204223000e-02 -5.3896795000e-06  8.6225011000e-10 -5.1289787000e-14 -3.1525621000e+04 -9.4730202000e+00\n" +
		"    source kiln 0.1.0 estimate 3\n"
	assert.Equal(t, want, got)
	assert.NotContains(t, FormatNASA7Block("", 300, 1000, 5000, low, high, "  ", "\r\n"), "source")

	// Negative zero is written as zero, aligned as any non-negative value.
	negZero := math.Copysign(0, -1)
	low[4], high[4] = negZero, negZero
	got = FormatNASA7Block("", 300, 1000, 5000, low, high, "", "\n")
	assert.NotContains(t, got, "-0.0000000000e+00")
	assert.Contains(t, got, "  0.0000000000e+00")
	assert.Equal(t, "0", FormatNumber(negZero))
}

// TestThermoInsertionRoundTrip inserts a block produced by FormatNASA7Block
// at ThermoInsertion and re-parses: the numbers come back (to the 11
// significant digits written, relative 1e-10) and every original byte is kept.
func TestThermoInsertionRoundTrip(t *testing.T) {
	low := [7]float64{3.1, 1.23456789012345e-3, -4.5e-6, 7.8e-9, -2.5e-12, -12345.678901234, 5.4321}
	high := [7]float64{5.5, 6.6e-3, -7.7e-7, 8.8e-11, -9.9e-15, -13000.5, -2.25}
	cases := []struct {
		name, src, target, wantIndent, wantNL string
		wantAfter                             string // text expected right after the insertion point
	}{
		{"plain", "species A C\nspecies B CC\n", "A", "  ", "\n", "species B CC\n"},
		{"attrs+trailing comments", "species A C\n\tsymmetry 2\n\n# about B\nspecies B CC\n", "A", "\t", "\n", "\n# about B\nspecies B CC\n"},
		{"crlf", "species A C\r\n    note x\r\n\r\nspecies B CC\r\n", "A", "    ", "\r\n", "\r\nspecies B CC\r\n"},
		{"eof no newline", "species B CC\nspecies A C\n  note last", "A", "  ", "\n", ""},
		{"eof newline", "species A C\n", "A", "  ", "\n", ""},
		{"eof trailing comment", "species A C   # c\n# end", "A", "  ", "\n", "# end"},
		{"interior comment", "species A C\n  # note\n  symmetry 1\nreaction A => A\n", "A", "  ", "\n", "reaction A => A\n"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			f := Parse("w.kiln", []byte(c.src))
			var sp *Species
			for _, s := range f.Species {
				if s.Name.Text == c.target {
					sp = s
				}
			}
			require.NotNil(t, sp)
			off, indent, nl := f.ThermoInsertion(sp)
			assert.Equal(t, c.wantIndent, indent)
			assert.Equal(t, c.wantNL, nl)
			assert.Equal(t, c.wantAfter, c.src[off:])
			block := FormatNASA7Block(indent, 298.15, 1000, 3000, low, high, "test", nl)
			off2, text := f.ThermoInsertionText(sp, block)
			require.Equal(t, off, off2)
			out := c.src[:off] + text + c.src[off:]
			assert.Equal(t, c.src[:off], out[:off], "bytes before the insertion are intact")
			assert.True(t, strings.HasSuffix(out, c.src[off:]), "bytes after the insertion are intact")
			assert.Equal(t, len(c.src)+len(text), len(out), "a pure insertion")

			g := Parse("w.kiln", []byte(out))
			require.Empty(t, syntaxDiags(g), out)
			var sp2 *Species
			for _, s := range g.Species {
				if s.Name.Text == c.target {
					sp2 = s
				}
			}
			require.NotNil(t, sp2.NASA7, out)
			assert.Equal(t, 298.15, sp2.NASA7.TLow.Value)
			gl, gh := sp2.NASA7.Coeffs()
			for i := range 7 {
				assert.InEpsilon(t, low[i], gl[i], 1e-10)
				assert.InEpsilon(t, high[i], gh[i], 1e-10)
			}
			assert.Equal(t, "test", sp2.NASA7.Source.Text)
			assert.Equal(t, len(f.Stmts), len(g.Stmts), "no statement added or lost")
		})
	}
}
