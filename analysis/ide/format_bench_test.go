package ide

import (
	"testing"

	"kiln.dev/kiln/internal/mechgen"
	"kiln.dev/kiln/speciesfile"
)

// BenchmarkFormatLarge formats the generated 10k-molecule mechanism (parsed
// once; the benchmark measures Format alone).
func BenchmarkFormatLarge(b *testing.B) {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})
	f := speciesfile.Parse("/w/big.kiln", src)
	b.SetBytes(int64(len(src)))
	b.ResetTimer()
	for range b.N {
		Format(f)
	}
}
