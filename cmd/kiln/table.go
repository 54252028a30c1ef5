package main

import (
	"io"
	"strings"
	"unicode/utf8"
)

// maxTableWidth is the width text tables stay under (columns); longer
// content (equations, source lists) is shortened, and the full text is in
// the --json output.
const maxTableWidth = 119

// writeTable prints a header and rows as aligned columns two blanks apart,
// with no trailing blanks. Cells are measured in runes.
func writeTable(w io.Writer, indent string, header []string, rows [][]string) {
	widths := make([]int, len(header))
	all := append([][]string{header}, rows...)
	for _, r := range all {
		for i, c := range r {
			widths[i] = max(widths[i], utf8.RuneCountInString(c))
		}
	}
	for _, r := range all {
		var b strings.Builder
		b.WriteString(indent)
		for i, c := range r {
			b.WriteString(c)
			if i < len(r)-1 {
				b.WriteString(strings.Repeat(" ", widths[i]-utf8.RuneCountInString(c)+2))
			}
		}
		io.WriteString(w, strings.TrimRight(b.String(), " ")+"\n")
	}
}

// shorten cuts s to at most n runes, ending with "…" when cut.
func shorten(s string, n int) string {
	if utf8.RuneCountInString(s) <= n {
		return s
	}
	r := []rune(s)
	return string(r[:n-1]) + "…"
}

// writeWrapped prints text after indent, broken at blanks so that lines stay
// under maxTableWidth; continuation lines are indented two more blanks.
func writeWrapped(w io.Writer, indent, text string) {
	line := indent
	for i, word := range strings.Fields(text) {
		if i > 0 && utf8.RuneCountInString(line)+1+utf8.RuneCountInString(word) > maxTableWidth {
			io.WriteString(w, line+"\n")
			line = indent + "  " + word
			continue
		}
		if i > 0 {
			line += " "
		}
		line += word
	}
	io.WriteString(w, line+"\n")
}
