package ide

import (
	"errors"
	"fmt"
	"sort"
	"strconv"
	"strings"
	"unicode"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// Definition returns where the name at off is defined: the first declaration
// of a species (possibly in an included file), a group statement, or the
// start of an included file.
func Definition(x *Index, file string, off int) []analysis.Location {
	o, ok := x.At(file, off)
	if !ok {
		return nil
	}
	switch o.Kind {
	case KindSpeciesDecl, KindSpeciesUse:
		if o.Species != nil {
			return []analysis.Location{x.r.SpeciesLoc(o.Species)}
		}
	case KindGroupDecl:
		if o.Group != nil {
			return []analysis.Location{o.Group.Loc}
		}
	case KindIncludePath:
		if o.IncludePath != "" {
			return []analysis.Location{{File: o.IncludePath}}
		}
	}
	return nil
}

// References returns every place the species named at off appears in the
// files of x (declarations when includeDecl), in file and offset order.
func References(x *Index, file string, off int, includeDecl bool) []analysis.Location {
	o, ok := x.At(file, off)
	if !ok || (o.Kind != KindSpeciesDecl && o.Kind != KindSpeciesUse) {
		return nil
	}
	return NameReferences(x, o.Name, includeDecl)
}

// NameReferences returns the uses (and declarations when includeDecl) of the
// species called name in every file of x, in file and offset order.
func NameReferences(x *Index, name string, includeDecl bool) []analysis.Location {
	var out []analysis.Location
	for _, p := range x.files() {
		for _, o := range x.Occurrences(p) {
			if o.Name != name {
				continue
			}
			if o.Kind == KindSpeciesUse || (includeDecl && o.Kind == KindSpeciesDecl) {
				out = append(out, analysis.Location{File: p, Span: o.Span})
			}
		}
	}
	return out
}

// ErrNotRenamable is returned by PrepareRename for anything but a species name.
var ErrNotRenamable = errors.New("only species names can be renamed")

// PrepareRename returns the span and text of the species name at off.
func PrepareRename(x *Index, file string, off int) (speciesfile.Span, string, error) {
	o, ok := x.At(file, off)
	if !ok || (o.Kind != KindSpeciesDecl && o.Kind != KindSpeciesUse) {
		return speciesfile.Span{}, "", ErrNotRenamable
	}
	return o.Span, o.Name, nil
}

// reserved are the tokens a species name cannot be (FORMAT.md).
var reserved = map[string]bool{"+": true, "=>": true, "<=>": true, "=": true, "M": true, "(+M)": true}

// ValidName reports why name cannot be a species name, or nil. Besides the
// format's rules (no blanks, not a bare number, not a reserved token) it
// rejects names that would change how reaction lines read: a leading '#'
// (comment), '=' (efficiency and rate syntax) and a leading "(+" (falloff).
func ValidName(name string) error {
	switch {
	case name == "":
		return errors.New("a species name cannot be empty")
	case strings.IndexFunc(name, unicode.IsSpace) >= 0:
		return fmt.Errorf("species name %q contains a blank", name)
	case reserved[name]:
		return fmt.Errorf("%q is reserved in equations", name)
	case strings.HasPrefix(name, "#"):
		return fmt.Errorf("species name %q would start a comment", name)
	case strings.Contains(name, "="):
		return fmt.Errorf("species name %q contains '='", name)
	case strings.HasPrefix(name, "(+"):
		return fmt.Errorf("species name %q looks like a falloff marker", name)
	}
	if _, err := strconv.ParseFloat(name, 64); err == nil {
		return fmt.Errorf("species name %q is a bare number", name)
	}
	return nil
}

// Rename returns the edits that rename species oldName to newName in every
// file of every index (the open documents and the files they include),
// without duplicates, sorted by file and offset. It fails when newName is
// not a valid name or is already a species in one of the indexes.
func Rename(xs []*Index, oldName, newName string) ([]analysis.Edit, error) {
	if err := ValidName(newName); err != nil {
		return nil, err
	}
	if newName == oldName {
		return nil, nil
	}
	seen := map[analysis.Location]bool{}
	var out []analysis.Edit
	for _, x := range xs {
		if sp := x.r.ByName[newName]; sp != nil {
			return nil, fmt.Errorf("species %s already exists (%s)", newName, sp.File)
		}
		for _, l := range NameReferences(x, oldName, true) {
			if !seen[l] {
				seen[l] = true
				out = append(out, analysis.Edit{File: l.File, Span: l.Span, NewText: newName})
			}
		}
	}
	sort.Slice(out, func(i, j int) bool {
		if out[i].File != out[j].File {
			return out[i].File < out[j].File
		}
		return out[i].Span.Start < out[j].Span.Start
	})
	return out, nil
}

// SymbolKind classifies a symbol; the values are those of LSP SymbolKind.
type SymbolKind int

// Symbol kinds used by kiln.
const (
	SymbolFile     SymbolKind = 1
	SymbolClass    SymbolKind = 5  // group
	SymbolEvent    SymbolKind = 24 // reaction
	SymbolConstant SymbolKind = 14 // species
)

// Symbol is a named statement of a file.
type Symbol struct {
	Name      string
	Detail    string
	Kind      SymbolKind
	File      string
	Span      speciesfile.Span // the statement body
	Selection speciesfile.Span // the name (or equation)
}

// DocumentSymbols lists the species, reactions and groups of file in order.
func DocumentSymbols(x *Index, file string) []Symbol {
	var out []Symbol
	for _, o := range x.Occurrences(file) {
		switch o.Kind {
		case KindSpeciesStmt:
			detail := ""
			if o.SpeciesDecl.SMILES != nil {
				detail = o.SpeciesDecl.SMILES.Text
			}
			if o.Species != nil && o.Species.Formula != "" {
				detail = strings.TrimSpace(detail + " " + o.Species.Formula)
			}
			out = append(out, Symbol{Name: o.Name, Detail: detail, Kind: SymbolConstant, File: file, Span: o.Span, Selection: o.SpeciesDecl.Name.Span.At(o.Base)})
		case KindReactionStmt:
			sel := o.ReactionDec.Equation.At(o.Base)
			if sel.End <= sel.Start {
				sel = o.ReactionDec.Keyword().Span.At(o.Base)
			}
			out = append(out, Symbol{Name: o.Name, Detail: "reaction", Kind: SymbolEvent, File: file, Span: o.Span, Selection: sel})
		case KindGroupStmt:
			out = append(out, Symbol{Name: o.Name, Detail: "group", Kind: SymbolClass, File: file, Span: o.Span, Selection: o.GroupDecl.Name.Span.At(o.Base)})
		}
	}
	return out
}

// WorkspaceSymbols lists the symbols of every file of every index whose name
// contains query (case-insensitive; "" matches all), without duplicates,
// at most limit of them (limit ≤ 0: no limit).
func WorkspaceSymbols(xs []*Index, query string, limit int) []Symbol {
	q := strings.ToLower(query)
	seen := map[string]bool{}
	var out []Symbol
	for _, x := range xs {
		for _, p := range x.files() {
			if seen[p] {
				continue
			}
			seen[p] = true
			for _, s := range DocumentSymbols(x, p) {
				if q == "" || strings.Contains(strings.ToLower(s.Name), q) {
					out = append(out, s)
					if limit > 0 && len(out) >= limit {
						return out
					}
				}
			}
		}
	}
	return out
}
