package speciesfile

import (
	"bytes"
	"encoding/binary"
	"sort"
	"unicode/utf8"
)

// LineIndex converts between byte offsets and line/column positions for one
// source text. Lines end at "\n", "\r\n" or a lone "\r"; the terminator
// belongs to the line it ends. A text with k terminators has k+1 lines (the
// last possibly empty). A UTF-8 byte order mark is an ordinary character
// (U+FEFF, one code point, one UTF-16 unit) for column purposes.
//
// It is the one offset/position converter of the project; it is immutable
// after construction and safe for concurrent use.
type LineIndex struct {
	src    []byte
	starts []int // byte offset of the start of each line
	ends   []int // byte offset of the end of each line's content (before its terminator)
	ascii  bool  // src is pure ASCII: Char == UTF16 == Col
}

// NewLineIndex indexes src. src must not be modified afterwards.
func NewLineIndex(src []byte) *LineIndex {
	li := &LineIndex{src: src, ascii: isASCII(src)}
	if bytes.IndexByte(src, '\r') < 0 {
		// fast path: lines end only at '\n'
		n := bytes.Count(src, []byte{'\n'}) + 1
		li.starts = make([]int, 0, n)
		li.ends = make([]int, 0, n)
		start := 0
		for {
			i := bytes.IndexByte(src[start:], '\n')
			if i < 0 {
				break
			}
			li.starts = append(li.starts, start)
			li.ends = append(li.ends, start+i)
			start += i + 1
		}
		li.starts = append(li.starts, start)
		li.ends = append(li.ends, len(src))
		return li
	}
	start := li.scan(src, 0, len(src))
	li.starts = append(li.starts, start)
	li.ends = append(li.ends, len(src))
	return li
}

// scan appends the lines of src that end (at a "\n", "\r" or "\r\n") in
// [from, to), the first one starting at from, and returns where the line
// after them starts.
func (li *LineIndex) scan(src []byte, from, to int) int {
	start := from
	for i := from; i < to; i++ {
		switch src[i] {
		case '\n':
			li.starts = append(li.starts, start)
			li.ends = append(li.ends, i)
			start = i + 1
		case '\r':
			li.starts = append(li.starts, start)
			li.ends = append(li.ends, i)
			if i+1 < len(src) && src[i+1] == '\n' {
				i++
			}
			start = i + 1
		}
	}
	return start
}

// isASCII reports whether b has no byte >= 0x80 (eight bytes at a time).
func isASCII(b []byte) bool {
	for len(b) >= 8 {
		if binary.LittleEndian.Uint64(b)&0x8080808080808080 != 0 {
			return false
		}
		b = b[8:]
	}
	for _, c := range b {
		if c >= 0x80 {
			return false
		}
	}
	return true
}

// LineCount returns the number of lines (terminators + 1).
func (li *LineIndex) LineCount() int { return len(li.starts) }

// LineStart returns the byte offset of the start of line (0-based), clamped
// to [0, len(src)].
func (li *LineIndex) LineStart(line int) int {
	if line < 0 {
		return 0
	}
	if line >= len(li.starts) {
		return len(li.src)
	}
	return li.starts[line]
}

// LineEnd returns the byte offset of the end of line's content, before its
// terminator, clamped like LineStart.
func (li *LineIndex) LineEnd(line int) int {
	if line < 0 {
		return li.ends[0]
	}
	if line >= len(li.ends) {
		return len(li.src)
	}
	return li.ends[line]
}

// Line returns the 0-based line containing byte offset off (clamped to
// [0, len(src)]). An offset inside a terminator belongs to the line it ends.
func (li *LineIndex) Line(off int) int {
	off = clamp(off, 0, len(li.src))
	// last line whose start <= off
	return sort.Search(len(li.starts), func(i int) bool { return li.starts[i] > off }) - 1
}

// Position converts a byte offset (clamped to [0, len(src)]) to a Position.
// An offset inside a multi-byte character counts that character as passed.
func (li *LineIndex) Position(off int) Position {
	off = clamp(off, 0, len(li.src))
	line := li.Line(off)
	start := li.starts[line]
	p := Position{Line: line, Col: off - start}
	if li.ascii {
		p.Char, p.UTF16 = p.Col, p.Col
		return p
	}
	end := min(off, li.ends[line])
	for i := start; i < end; {
		r, size := utf8.DecodeRune(li.src[i:])
		p.Char++
		if r >= 0x10000 && size == 4 {
			p.UTF16 += 2
		} else {
			p.UTF16++
		}
		i += size
	}
	if off > end { // inside the terminator: bytes count as single units
		p.Char += off - end
		p.UTF16 += off - end
	}
	return p
}

// Offset converts a 0-based line and UTF-16 column to a byte offset. It is
// the inverse of Position for valid positions and clamps otherwise: a line
// < 0 is line 0, a column < 0 is column 0, a column past the end of the line
// gives the end of the line (before the terminator), a line past the last
// gives len(src). A column inside a surrogate pair gives the start of that
// character.
func (li *LineIndex) Offset(line, utf16Col int) int {
	if line < 0 {
		line = 0
	}
	if line >= len(li.starts) {
		return len(li.src)
	}
	start, end := li.starts[line], li.ends[line]
	if utf16Col <= 0 {
		return start
	}
	if li.ascii {
		return min(start+utf16Col, end)
	}
	units := 0
	for i := start; i < end; {
		r, size := utf8.DecodeRune(li.src[i:])
		w := 1
		if r >= 0x10000 && size == 4 {
			w = 2
		}
		if units+w > utf16Col {
			return i
		}
		units += w
		i += size
		if units == utf16Col {
			return i
		}
	}
	return end
}

func clamp(v, lo, hi int) int {
	if v < lo {
		return lo
	}
	if v > hi {
		return hi
	}
	return v
}

// Edited returns the index of src, which must be li's text with e applied:
// the lines before and after the edit are taken from li (those after moved
// by the edit's length change), the lines around it are found again. The
// result is the same as NewLineIndex(src); when src does not have the
// length e implies, it is NewLineIndex(src).
func (li *LineIndex) Edited(src []byte, e Edit) *LineIndex {
	if e.Old.Start < 0 || e.Old.Start > e.Old.End || e.Old.End > len(li.src) || e.NewLen < 0 || len(src) != len(li.src)+e.Delta() {
		return NewLineIndex(src)
	}
	return li.edited(src, e)
}

// edited is Edited for a consistent edit.
func (li *LineIndex) edited(src []byte, e Edit) *LineIndex {
	delta := e.Delta()
	// Lines a-1 and b+1 around the edit are scanned again too: an edit next
	// to a line terminator can join or split a "\r\n".
	a := max(li.Line(e.Old.Start)-1, 0)
	b := li.Line(e.Old.End) + 2
	from := li.starts[a]
	to := len(src)
	if b < len(li.starts) {
		to = li.starts[b] + delta
	}
	out := &LineIndex{src: src, ascii: isASCII(src)}
	out.starts = make([]int, a, len(li.starts)+8)
	out.ends = make([]int, a, len(li.starts)+8)
	copy(out.starts, li.starts[:a])
	copy(out.ends, li.ends[:a])
	start := out.scan(src, from, to)
	if b < len(li.starts) {
		for k := b; k < len(li.starts); k++ {
			out.starts = append(out.starts, li.starts[k]+delta)
			out.ends = append(out.ends, li.ends[k]+delta)
		}
	} else {
		out.starts = append(out.starts, start)
		out.ends = append(out.ends, len(src))
	}
	return out
}

// newline returns the prevailing line terminator of the text, as File.Newline.
func (li *LineIndex) newline() string {
	crlf, lf := 0, 0
	for k := 0; k+1 < len(li.starts); k++ {
		if li.starts[k+1]-li.ends[k] == 2 {
			crlf++
		} else {
			lf++
		}
	}
	if crlf > lf {
		return "\r\n"
	}
	return "\n"
}
