package speciesfile

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestSlabNewIsZeroAndDistinct(t *testing.T) {
	var s slab[[2]int]
	seen := map[*[2]int]bool{}
	for i := range 1000 {
		x := s.new()
		require.Equal(t, [2]int{}, *x, "value %d is not zero", i)
		require.False(t, seen[x], "value %d handed out twice", i)
		seen[x] = true
		x[0], x[1] = i, -i
	}
	assert.LessOrEqual(t, s.chunk, slabMaxChunk)
}

// An append past the requested capacity must not overwrite the next slice
// handed out from the same chunk.
func TestSlabTakeIsCapped(t *testing.T) {
	var s slab[int]
	a := s.take(3)
	b := s.take(2)
	require.Equal(t, 0, len(a))
	require.Equal(t, 3, cap(a))
	b = append(b, 7, 8)
	a = append(a, 1, 2, 3, 4) // exceeds cap: reallocates
	assert.Equal(t, []int{7, 8}, b)
	assert.Equal(t, []int{1, 2, 3, 4}, a)
	assert.Nil(t, s.take(0))
	big := s.take(slabMaxChunk)
	assert.Equal(t, slabMaxChunk, cap(big))
}

// Slices of a parsed file share slab chunks; appending to one must not
// change another statement.
func TestParsedSlicesDoNotAlias(t *testing.T) {
	src := []byte("species A [H]\n  note a\n  symmetry 2\nspecies B [H][H]\n  note b\n" +
		"reaction A + B <=> 2 A A=1 n=0 Ea=0\nreaction B <=> A + A A=1 n=0 Ea=0\n")
	f := Parse("alias.kiln", src)
	require.Empty(t, f.Diags)
	require.Len(t, f.Species, 2)
	require.Len(t, f.Reactions, 2)
	bAttrs := append([]Attr(nil), f.Species[1].Attrs...)
	f.Species[0].Attrs = append(f.Species[0].Attrs, Attr{Key: Token{Text: "x"}})
	assert.Equal(t, bAttrs, f.Species[1].Attrs)

	r0, r1 := f.Reactions[0], f.Reactions[1]
	prod0 := append([]Term(nil), r0.Products...)
	react1 := append([]Term(nil), r1.Reactants...)
	r0.Reactants = append(r0.Reactants, Term{Coeff: 9})
	r0.Products = append(r0.Products, Term{Coeff: 9})
	assert.Equal(t, prod0, r0.Products[:len(prod0)])
	assert.Equal(t, react1, r1.Reactants)
	assert.Equal(t, 2.0, r0.Products[0].Coeff, "coefficient of 2 A")
}
