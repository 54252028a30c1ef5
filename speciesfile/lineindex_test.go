package speciesfile

import (
	"testing"
	"unicode/utf16"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestLineIndexPositions(t *testing.T) {
	// line 0: "a\tb" LF; line 1: "é🔥x" CRLF; line 2: "α" lone CR; line 3: "\xffz"; end
	src := []byte("a\tb\né🔥x\r\nα\r\xffz")
	li := NewLineIndex(src)
	require.Equal(t, 4, li.LineCount())
	for _, c := range []struct {
		off  int
		want Position
	}{
		{0, Position{0, 0, 0, 0}},
		{2, Position{0, 2, 2, 2}},  // a tab is one byte, one char
		{3, Position{0, 3, 3, 3}},  // end of line 0 content
		{4, Position{1, 0, 0, 0}},  // after LF
		{6, Position{1, 2, 1, 1}},  // é is 2 bytes, 1 char, 1 UTF-16 unit
		{10, Position{1, 6, 2, 3}}, // 🔥 is 4 bytes, 1 char, 2 UTF-16 units
		{11, Position{1, 7, 3, 4}}, // end of content, before CR LF
		{12, Position{1, 8, 4, 5}}, // inside CR LF: belongs to line 1
		{13, Position{2, 0, 0, 0}}, // after CR LF
		{15, Position{2, 2, 1, 1}}, // α
		{16, Position{3, 0, 0, 0}}, // after a lone CR
		{17, Position{3, 1, 1, 1}}, // an invalid byte counts 1 char, 1 unit
		{18, Position{3, 2, 2, 2}}, // end of file
		{99, Position{3, 2, 2, 2}}, // clamped
		{-5, Position{0, 0, 0, 0}}, // clamped
	} {
		assert.Equal(t, c.want, li.Position(c.off), "offset %d", c.off)
	}
	for _, c := range []struct{ line, col, want int }{
		{0, 0, 0}, {0, 3, 3}, {0, 50, 3}, // past end of line → end of content
		{1, 1, 6}, {1, 3, 10}, {1, 2, 6}, // column inside the surrogate pair → start of 🔥
		{1, 4, 11}, {1, 9, 11}, // not past the CR LF
		{2, 1, 15}, {3, 1, 17}, {3, 2, 18},
		{4, 0, 18}, {100, 3, 18}, // past last line → len(src)
		{-1, 0, 0}, {0, -3, 0},
	} {
		assert.Equal(t, c.want, li.Offset(c.line, c.col), "line %d col %d", c.line, c.col)
	}
}

// TestLineIndexRoundTrip: Offset(Position(off)) == off at every character
// boundary outside line terminators, and UTF16 agrees with unicode/utf16 on
// valid text.
func TestLineIndexRoundTrip(t *testing.T) {
	for _, s := range []string{"", "abc", "x\ny\r\nz\rw", "€uro 🔥🔥\tα\n\n", "ab\xffcd\n\xc3", "\r\r\n\n"} {
		src := []byte(s)
		li := NewLineIndex(src)
		for off := 0; off <= len(src); off++ {
			if off < len(src) && !utf8.RuneStart(src[off]) {
				continue
			}
			if off > 0 && src[off-1] == '\r' && off < len(src) && src[off] == '\n' {
				continue // inside a CR LF
			}
			p := li.Position(off)
			line := li.LineStart(p.Line)
			if off > li.LineEnd(p.Line) {
				continue
			}
			assert.Equal(t, off, li.Offset(p.Line, p.UTF16), "%q off %d", s, off)
			assert.Equal(t, off-line, p.Col)
			if utf8.Valid(src[line:off]) {
				assert.Equal(t, len(utf16.Encode([]rune(string(src[line:off])))), p.UTF16)
				assert.Equal(t, utf8.RuneCount(src[line:off]), p.Char)
			}
		}
	}
}

func BenchmarkLineIndexPosition(b *testing.B) {
	src := genMechanism(1 << 20)
	li := NewLineIndex(src)
	b.ResetTimer()
	for i := 0; b.Loop(); i++ {
		li.Position((i * 7919) % len(src))
	}
}
