package speciesfile

import (
	"fmt"
	"strings"
	"testing"
)

// genMechanism builds a deterministic, realistic mechanism of about size
// bytes: species with nasa7 blocks and notes, falloff reactions with Troe
// and efficiencies, third-body and plain reactions, comments.
func genMechanism(size int) []byte {
	var sb strings.Builder
	sb.Grow(size + 4096)
	sb.WriteString("# generated benchmark mechanism\nunits kcal/mol\n\nspecies H2O O\nspecies CO2 O=C=O\nspecies AR [Ar]\n\n")
	for i := 0; sb.Len() < size; i++ {
		x := float64(i%97) / 97
		fmt.Fprintf(&sb, "species S%d C%sO   # species %d\n", i, strings.Repeat("C", i%5), i)
		fmt.Fprintf(&sb, "  symmetry %d\n  note generated species %d\n", 1+i%6, i)
		sb.WriteString("  nasa7 300 1000 5000\n")
		fmt.Fprintf(&sb, "    low   %.9e %.9e %.9e %.9e %.9e %.9e %.9e\n", 3+x, 1.2e-2*x, -3.4e-6, 5.6e-9*x, -7.8e-12, -2.9e4*x, 4.8+x)
		fmt.Fprintf(&sb, "    high  %.9e %.9e %.9e %.9e %.9e %.9e %.9e\n", 6+x, 1.5e-2, -5.3e-6*x, 8.6e-10, -5.1e-14, -3.1e4, -9.4+x)
		sb.WriteString("    source generated\n\n")
		if i > 0 {
			fmt.Fprintf(&sb, "reaction S%d + S%d (+M) <=> S%d (+M)   A=%.3e n=%.2f Ea=%.2f\n", i, i-1, i/2, 1e13*(1+x), -0.5*x, 2.1*x)
			fmt.Fprintf(&sb, "  low-pressure A=%.3e n=-7.0 Ea=2.76\n", 1.27e41*(1+x))
			sb.WriteString("  troe alpha=0.62 T3=73 T1=1180 T2=5000\n")
			sb.WriteString("  efficiencies H2O=6 CO2=2 AR=0.7\n")
			fmt.Fprintf(&sb, "reaction S%d + M <=> S%d + S%d + M   A=%.3e n=-0.86 Ea=0\n", i, i/2, i/3, 2.8e18*(1+x))
			fmt.Fprintf(&sb, "reaction 2 S%d => S%d + S%d   A=%.3e n=0 Ea=%.1fkJ/mol\n\n", i, i-1, i/2, 1.3e11*(1+x), 40*x)
		}
	}
	return []byte(sb.String())
}

func TestGenMechanismIsValid(t *testing.T) {
	f := Parse("gen", genMechanism(50_000))
	if len(f.Diags) != 0 {
		t.Fatalf("generated mechanism has diagnostics: %v", f.Diags[0])
	}
}

// BenchmarkParse3MB parses a ~3 MB mechanism; MB/s via b.SetBytes.
func BenchmarkParse3MB(b *testing.B) {
	src := genMechanism(3 << 20)
	b.SetBytes(int64(len(src)))
	b.ReportAllocs()
	for b.Loop() {
		f := Parse("bench.kiln", src)
		if len(f.Diags) != 0 {
			b.Fatal(f.Diags[0].Message)
		}
	}
}
