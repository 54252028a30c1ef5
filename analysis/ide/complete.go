package ide

import (
	"strings"

	"kiln.dev/kiln/speciesfile"
)

// CompletionKind classifies a completion; the values are LSP CompletionItemKind.
type CompletionKind int

// Completion kinds used by kiln.
const (
	CompletionProperty CompletionKind = 10
	CompletionKeyword  CompletionKind = 14
	CompletionConstant CompletionKind = 21
)

// Completion is one completion candidate.
type Completion struct {
	Label  string
	Detail string
	Kind   CompletionKind
}

// Statement keywords and attribute names of the format (FORMAT.md).
var (
	keywords        = []string{"species", "reaction", "units", "include", "group"}
	speciesAttrs    = []string{"multiplicity", "symmetry", "optical-isomers", "composition", "note", "nasa7", "thermo-table"}
	reactionAttrs   = []string{"low-pressure", "troe", "efficiencies", "pressure", "duplicate", "reverse", "note"}
	groupAttrs      = []string{"hf298", "s298", "cp", "source"}
	nasaBlockLines  = []string{"low", "high", "source"}
	tableBlockLines = []string{"hf298", "s298", "cp", "source"}
)

// Complete returns the candidates at byte offset off of file, decided from
// the text of the line up to off (so it works while the line is broken):
//
//   - the first word of an unindented line: statement keywords;
//   - the first word of an indented line: the attribute names of the
//     statement above (block line names inside a nasa7/thermo-table block);
//   - a word inside the equation of a reaction line, or on an efficiencies
//     line: species names (detail = formula) and M.
func Complete(x *Index, file string, off int) []Completion {
	f := x.File(file)
	if f == nil {
		return nil
	}
	return CompleteText(x, f.Src, f.Lines, off)
}

// CompleteText is Complete for a text that may be newer than the indexed
// analysis (an editor's text while the analysis catches up): the context is
// read from src (with its line index lines), the species names from x.
func CompleteText(x *Index, src []byte, lines *speciesfile.LineIndex, off int) []Completion {
	if off < 0 || off > len(src) {
		return nil
	}
	l := lines.Line(off)
	ls := lines.LineStart(l)
	prefix := string(src[ls:off])
	if strings.Contains(prefix, " #") || strings.HasPrefix(strings.TrimLeft(prefix, " \t"), "#") {
		return nil // in a comment
	}
	indented := len(prefix) > 0 && (prefix[0] == ' ' || prefix[0] == '\t')
	body := strings.TrimLeft(prefix, " \t")
	firstWord := !strings.ContainsAny(body, " \t")
	words := strings.Fields(body)
	switch {
	case !indented && firstWord:
		return words2(keywords, CompletionKeyword, "statement")
	case !indented && len(words) > 0 && words[0] == "reaction":
		cur := ""
		if !strings.HasSuffix(body, " ") && !strings.HasSuffix(body, "\t") {
			cur = words[len(words)-1]
		}
		for _, w := range words[1:] {
			if strings.Contains(w, "=") && w != "=>" && w != "<=>" && w != cur {
				return nil // past the equation: rate parameters
			}
		}
		return speciesCompletions(x, true)
	case indented && firstWord:
		return words2(attrNames(l, src, lines, len(prefix)-len(body)), CompletionProperty, "attribute")
	case indented && len(words) > 0 && words[0] == "efficiencies":
		return speciesCompletions(x, false)
	}
	return nil
}

func words2(ws []string, k CompletionKind, detail string) []Completion {
	out := make([]Completion, len(ws))
	for i, w := range ws {
		out[i] = Completion{Label: w, Detail: detail, Kind: k}
	}
	return out
}

func speciesCompletions(x *Index, thirdBody bool) []Completion {
	// One list per analysis, shared by every request (callers only read
	// it): species names in declaration order — the client sorts and
	// filters; a server cutting a long list keeps that order — then the
	// third-body words. A request neither copies nor sorts tens of
	// thousands of names.
	x.namesOnce.Do(func() {
		names := make([]Completion, 0, len(x.r.Species)+2)
		for _, sp := range x.r.Species {
			names = append(names, Completion{Label: sp.Name, Detail: sp.Formula, Kind: CompletionConstant})
		}
		names = append(names, Completion{Label: "M", Detail: "third body", Kind: CompletionKeyword},
			Completion{Label: "(+M)", Detail: "falloff third body", Kind: CompletionKeyword})
		x.names = names
	})
	if thirdBody {
		return x.names
	}
	return x.names[: len(x.names)-2 : len(x.names)-2]
}

// attrNames finds the statement (and block) above line l and returns the
// names that may start line l.
func attrNames(l int, src []byte, lines *speciesfile.LineIndex, curIndent int) []string {
	minBetween := -1 // smallest indentation of the indented lines between
	for k := l - 1; k >= 0; k-- {
		line := src[lines.LineStart(k):lines.LineEnd(k)]
		if isComment(line) || len(strings.TrimSpace(string(line))) == 0 {
			continue
		}
		ind := len(line) - len(strings.TrimLeft(string(line), " \t"))
		words := strings.Fields(string(line))
		if ind == 0 {
			switch words[0] {
			case "species":
				return speciesAttrs
			case "reaction":
				return reactionAttrs
			case "group":
				return groupAttrs
			}
			return nil
		}
		if (words[0] == "nasa7" || words[0] == "thermo-table") && ind < curIndent && (minBetween < 0 || minBetween > ind) {
			if words[0] == "nasa7" {
				return nasaBlockLines
			}
			return tableBlockLines
		}
		if minBetween < 0 || ind < minBetween {
			minBetween = ind
		}
	}
	return nil
}
