package ide

import (
	"strings"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// Format returns whitespace-only edits (one per changed line, in file order)
// that lay out the statements of f the same way:
//
//   - statement lines start in column 0, attribute lines are indented by two
//     spaces and the lines of a nasa7/thermo-table block by four;
//   - tokens are separated by single spaces;
//   - trailing blanks are removed, and blank lines become empty;
//   - the blanks before a trailing comment, the text of note/source lines and
//     comment-only lines are kept as written.
//
// Formatting is conservative: it never changes, joins or splits a token, and
// statements with a syntax error are left alone. Applying the edits and
// formatting again yields no edits.
func Format(f *speciesfile.File) []analysis.Edit {
	var out []analysis.Edit
	broken := func(s speciesfile.Span) bool {
		for _, d := range f.Diags {
			if d.Code == speciesfile.CodeSyntax && d.Span.Start < s.End+1 && d.Span.End >= s.Start {
				return true
			}
		}
		return false
	}
	for _, st := range f.Stmts {
		switch st.(type) {
		case *speciesfile.BadStmt, *speciesfile.Trivia:
			continue
		}
		span := st.Span()
		body := st.Body()
		if body.End <= body.Start || broken(span) {
			continue
		}
		blockLines := map[int]bool{}
		if sp, ok := st.(*speciesfile.Species); ok {
			for _, b := range []*speciesfile.Span{nasaSpan(sp), tableSpan(sp)} {
				if b != nil {
					for l := f.Lines.Line(b.Start) + 1; l <= f.Lines.Line(b.End); l++ {
						blockLines[l] = true
					}
				}
			}
		}
		first := f.Lines.Line(span.Start)
		last := f.Lines.Line(span.End)
		if span.End > span.Start && f.Lines.LineStart(last) == span.End {
			last-- // the span ends with the terminator of the line before
		}
		bodyLine := f.Lines.Line(body.Start)
		for l := first; l <= last; l++ {
			ls, le := f.Lines.LineStart(l), f.Lines.LineEnd(l)
			if ls < span.Start || le > span.End {
				continue
			}
			line := string(f.Src[ls:le])
			indent := ""
			switch {
			case l < bodyLine:
				indent = "" // leading trivia: only blank lines are touched below
			case l == bodyLine:
			case blockLines[l]:
				indent = "    "
			default:
				indent = "  "
			}
			nl, ok := formatLine(line, indent, l > bodyLine)
			if ok && nl != line {
				out = append(out, analysis.Edit{File: f.Name, Span: speciesfile.Span{Start: ls, End: le}, NewText: nl})
			}
		}
	}
	return out
}

func nasaSpan(sp *speciesfile.Species) *speciesfile.Span {
	if sp.NASA7 == nil {
		return nil
	}
	return &sp.NASA7.Span
}

func tableSpan(sp *speciesfile.Species) *speciesfile.Span {
	if sp.Table == nil {
		return nil
	}
	return &sp.Table.Span
}

// formatLine lays out one line; ok is false when the line is to be left
// alone. continuation says the line belongs to a statement's attributes.
func formatLine(line, indent string, continuation bool) (string, bool) {
	trimmed := strings.TrimLeft(line, " \t")
	if strings.TrimSpace(trimmed) == "" || strings.Trim(trimmed, " \t") == "" {
		return "", true // blank line: drop its blanks
	}
	if strings.HasPrefix(trimmed, "#") {
		return line, false // comment-only line: as written
	}
	if !continuation && len(trimmed) != len(line) {
		return line, false // an indented first line: not ours to move
	}
	if strings.ContainsAny(line, "\x00\v\f") {
		return line, false
	}
	// Split off a trailing comment (a '#' that begins a token).
	code, gap, comment := trimmed, "", ""
	for i := 0; i < len(trimmed); i++ {
		if trimmed[i] == '#' && i > 0 && (trimmed[i-1] == ' ' || trimmed[i-1] == '\t') {
			j := i
			for j > 0 && (trimmed[j-1] == ' ' || trimmed[j-1] == '\t') {
				j--
			}
			code, gap, comment = trimmed[:j], trimmed[j:i], strings.TrimRight(trimmed[i:], " \t")
			break
		}
	}
	fields := strings.FieldsFunc(code, func(r rune) bool { return r == ' ' || r == '\t' })
	if len(fields) == 0 {
		return line, false
	}
	var text string
	switch fields[0] {
	case "note", "source":
		// Free text: keep it byte for byte after the key.
		rest := strings.TrimLeft(code[len(fields[0]):], " \t")
		text = fields[0]
		if rest != "" {
			text += " " + strings.TrimRight(rest, " \t")
		}
	default:
		text = strings.Join(fields, " ")
	}
	out := indent + text
	if comment != "" {
		out += gap + comment
	}
	return out, true
}
