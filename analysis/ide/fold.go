package ide

import "kiln.dev/kiln/speciesfile"

// Fold is a foldable region of a file, from the line holding Start to the
// line holding End (byte offsets). Kind is "comment" or "region".
type Fold struct {
	Start, End int
	Kind       string
}

// FoldingRanges returns a fold for every statement that spans several lines,
// for every multi-line nasa7/thermo-table block, and for every run of two or
// more comment lines that lead a statement.
func FoldingRanges(f *speciesfile.File) []Fold {
	var out []Fold
	multi := func(s speciesfile.Span) bool {
		return s.End > s.Start && f.Lines.Line(s.Start) != f.Lines.Line(s.End)
	}
	add := func(s speciesfile.Span, kind string) {
		if multi(s) {
			out = append(out, Fold{Start: s.Start, End: s.End, Kind: kind})
		}
	}
	for i, st := range f.Stmts {
		base := f.Starts[i]
		body := st.Body().At(base)
		// Leading comment lines: the part of the statement span before its body.
		if lead := (speciesfile.Span{Start: base, End: body.Start}); lead.End > lead.Start {
			first, last := -1, -1
			for l := f.Lines.Line(lead.Start); l <= f.Lines.Line(lead.End) && l < f.Lines.LineCount(); l++ {
				ls, le := f.Lines.LineStart(l), f.Lines.LineEnd(l)
				if le > lead.End {
					le = lead.End
				}
				if isComment(f.Src[ls:le]) {
					if first < 0 {
						first = ls
					}
					last = le
				} else if first >= 0 {
					add(speciesfile.Span{Start: first, End: last}, "comment")
					first = -1
				}
			}
			if first >= 0 {
				add(speciesfile.Span{Start: first, End: last}, "comment")
			}
		}
		if _, bad := st.(*speciesfile.BadStmt); bad {
			continue
		}
		add(body, "region")
		if sp, ok := st.(*speciesfile.Species); ok {
			if sp.NASA7 != nil {
				add(sp.NASA7.Span.At(base), "region")
			}
			if sp.Table != nil {
				add(sp.Table.Span.At(base), "region")
			}
		}
	}
	return out
}

// isComment reports whether a line holds only blanks and a comment.
func isComment(line []byte) bool {
	for _, c := range line {
		switch c {
		case ' ', '\t':
			continue
		case '#':
			return true
		default:
			return false
		}
	}
	return false
}
