package analysis

import (
	"errors"
	"fmt"
	"sort"
	"strings"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/speciesfile"
)

// Edit replaces the bytes of Span in File by NewText. An insertion has an
// empty span. Every edit kiln makes is a minimal insertion or replacement.
type Edit struct {
	File    string
	Span    speciesfile.Span
	NewText string
}

// blockSource is the note written into an inserted block: where the numbers
// came from (see Estimate.BlockSource).
func (r *Result) blockSource(sp *Species) string {
	return sp.Estimate.BlockSource(r.Settings.Stamp)
}

// BlockSource is the `source` line of a nasa7 block kiln writes for the
// estimate — the one wording for fill, the quick fixes and `kiln estimate
// --nasa`. stamp ("kiln 0.1.0, 2026-12-01") says which kiln wrote it; it
// may be empty. A reference-library species is tabulated data, not an
// estimate, and is named as such with the library's source.
func (e *Estimate) BlockSource(stamp string) string {
	var b strings.Builder
	if e.Library != "" {
		fmt.Fprintf(&b, "reference library %s (tabulated data): %s", e.Library, e.LibrarySource)
		if e.fit != nil {
			fmt.Fprintf(&b, "; refitted to TMID %g K, THIGH %g K", e.tMid, e.tHigh)
		}
		if stamp != "" {
			b.WriteString("; written by " + stamp)
		}
		return b.String()
	}
	b.WriteString("estimate")
	if stamp != "" {
		b.WriteString(", " + stamp)
	}
	fmt.Fprintf(&b, "; Benson group additivity (group values from: %s)", strings.Join(groupSources(e.Group.Groups), "; "))
	var approx, flagged, modelled []string
	for _, f := range e.Flags() {
		switch m := f.Missing; {
		case m.Modelled():
			modelled = append(modelled, m.Group+" by the "+m.Approximation)
		case UsedAsItStands(m):
			flagged = append(flagged, m.Approximation) // the group and what it lacks
		default:
			approx = append(approx, m.Group+"≈"+m.Approximation)
		}
	}
	if len(approx) > 0 {
		b.WriteString("; approximated groups: " + strings.Join(approx, ", "))
	}
	if len(flagged) > 0 {
		b.WriteString("; flagged groups: " + strings.Join(flagged, ", "))
	}
	if len(modelled) > 0 {
		b.WriteString("; modelled: " + strings.Join(modelled, ", "))
	}
	return b.String()
}

// groupSources lists the sources of the group terms for a block's source
// line: each distinct source once, sorted. A term's source may itself be a
// list joined by "; " (a value and the analogy its 1500 K Cp rests on):
// the list is split so that a reference two terms share is named once,
// in the order the sorted sources first give it.
func groupSources(terms []benson.Term) []string {
	var whole []string
	for _, g := range terms {
		if g.Source != "" {
			whole = append(whole, g.Source)
		}
	}
	sort.Strings(whole)
	seen := map[string]bool{}
	var out []string
	for _, s := range whole {
		for _, part := range strings.Split(s, "; ") {
			if part = strings.TrimSpace(part); part != "" && !seen[part] {
				seen[part] = true
				out = append(out, part)
			}
		}
	}
	return out
}

// InsertThermoEdit returns the insertion of an estimated nasa7 block under
// species sp, which must be declared in the analysed file and have no block.
func (r *Result) InsertThermoEdit(sp *Species) (Edit, bool) {
	if sp == nil || sp.File != r.Path || sp.Decl.NASA7 != nil || sp.Decl.Table != nil || sp.Estimate == nil {
		return Edit{}, false
	}
	if _, _, err := sp.Estimate.NASA7(); err != nil {
		return Edit{}, false
	}
	off, indent, nl := r.File.ThermoInsertion(sp.Decl)
	text := r.blockText(sp, indent, nl)
	if off > 0 && off <= len(r.File.Src) && !endsWithNewline(r.File.Src[:off]) {
		text = nl + strings.TrimSuffix(text, nl)
	}
	return Edit{File: r.Path, Span: speciesfile.Span{Start: off, End: off}, NewText: text}, true
}

func endsWithNewline(b []byte) bool {
	return len(b) > 0 && (b[len(b)-1] == '\n' || b[len(b)-1] == '\r')
}

func (r *Result) blockText(sp *Species, indent, nl string) string {
	p, _, _ := sp.Estimate.NASA7()
	return speciesfile.FormatNASA7Block(indent, p.TLow, p.TMid, p.THigh, p.Low, p.High, r.blockSource(sp), nl)
}

// ReplaceThermoEdit returns the replacement of species sp's own thermo block
// by the estimated nasa7 block.
func (r *Result) ReplaceThermoEdit(sp *Species) (Edit, bool) {
	if sp == nil || sp.File != r.Path || sp.Given == nil || sp.Estimate == nil {
		return Edit{}, false
	}
	if _, _, err := sp.Estimate.NASA7(); err != nil {
		return Edit{}, false
	}
	span := sp.Given.Span.At(r.declStart(sp))
	src := r.File.Src
	// The block span covers its lines; replace from the start of its first
	// line so that the new block carries its own indentation.
	start := span.Start
	for start > 0 && src[start-1] != '\n' && src[start-1] != '\r' {
		start--
	}
	indent := string(src[start:span.Start])
	if strings.TrimLeft(indent, " \t") != "" {
		start, indent = span.Start, ""
	}
	nl := "\n"
	if strings.Contains(string(src), "\r\n") {
		nl = "\r\n"
	}
	text := r.blockText(sp, indent, nl)
	end := span.End
	// Keep the line break that ends the block's last line in the file.
	if end >= len(src) || (src[end] != '\n' && src[end] != '\r') {
		if !endsWithNewline(src[:end]) {
			text = strings.TrimSuffix(text, nl)
		}
	} else {
		text = strings.TrimSuffix(text, nl)
	}
	if endsWithNewline(src[start:end]) {
		text += nl
	}
	return Edit{File: r.Path, Span: speciesfile.Span{Start: start, End: end}, NewText: text}, true
}

// FillEdits returns an insertion for every species of the analysed file that
// lacks a thermo block and can be estimated, in file order.
func (r *Result) FillEdits() []Edit {
	out, _ := r.FillPlan()
	return out
}

// Skip is a species of the analysed file that lacks a usable thermo block
// and gets none from fill, with the reason.
type Skip struct {
	Species *Species
	Reason  string
}

// FillPlan returns the insertions of FillEdits and every species declared in
// the analysed file that still has no usable thermo block after them, with
// the reason: nothing is skipped silently.
func (r *Result) FillPlan() ([]Edit, []Skip) {
	var out []Edit
	var skips []Skip
	for _, sp := range r.Species {
		if sp.File != r.Path || sp.Given != nil {
			continue
		}
		if e, ok := r.InsertThermoEdit(sp); ok {
			out = append(out, e)
			continue
		}
		skips = append(skips, Skip{Species: sp, Reason: skipReason(sp, r.Units())})
	}
	return out, skips
}

// IncludedWithoutThermo returns the species declared in included files (not
// the analysed file) that have no usable thermo block, in analysis order,
// with what fill on their own file would do: fill writes only the file it is
// given, so these stay without a block.
func (r *Result) IncludedWithoutThermo() []Skip {
	var out []Skip
	for _, sp := range r.Species {
		if sp.File == r.Path || sp.Given != nil {
			continue
		}
		reason := "declared in an included file: fill writes only the file it is given; run kiln fill on that file to insert its block"
		if !fillable(sp) {
			reason = "declared in an included file (fill writes only the file it is given), and it cannot be filled there either: " + skipReason(sp, r.Units())
		}
		out = append(out, Skip{Species: sp, Reason: reason})
	}
	return out
}

// fillable reports whether an estimated nasa7 block can be written for sp.
func fillable(sp *Species) bool {
	if sp.Estimate == nil || sp.brokenBlock || sp.SMILESError != nil || sp.Decl.SMILES == nil || sp.estimateErr != nil {
		return false
	}
	_, _, err := sp.Estimate.NASA7()
	return err == nil
}

// skipReason says why no block can be inserted for sp, with numbers in the
// display units u.
func skipReason(sp *Species, u Units) string {
	switch {
	case sp.brokenBlock:
		return "its thermo block has " + sp.blockFault() + "; fix or delete the block"
	case sp.SMILESError != nil:
		if sp.SMILESError == ErrStructurePending {
			return ErrStructurePending.Error()
		}
		return "bad SMILES: " + smilesReason(sp.SMILESError)
	case sp.Decl.SMILES == nil:
		return "no structure (SMILES) to estimate from; add a nasa7 or thermo-table block"
	case sp.estimateErr != nil:
		return sp.Refusal() // as check and estimate word it
	case sp.Estimate == nil:
		return "no estimate"
	}
	if _, _, err := sp.Estimate.NASA7(); err != nil {
		return "no NASA-7 polynomial: " + FitRefusal(err, u)
	}
	return "no block can be inserted here"
}

// ErrOverlappingEdits is returned by ApplyEdits for edits that overlap.
var ErrOverlappingEdits = errors.New("overlapping edits")

// ApplyEdits applies edits (all for the same file) to src and returns the
// new text. Edits at the same offset are applied in the order given.
func ApplyEdits(src []byte, edits []Edit) ([]byte, error) {
	es := append([]Edit(nil), edits...)
	sort.SliceStable(es, func(i, j int) bool { return es[i].Span.Start < es[j].Span.Start })
	var out []byte
	last := 0
	for _, e := range es {
		if e.Span.Start < last || e.Span.End < e.Span.Start || e.Span.End > len(src) {
			return nil, fmt.Errorf("applying edit at byte %d: %w", e.Span.Start, ErrOverlappingEdits)
		}
		out = append(out, src[last:e.Span.Start]...)
		out = append(out, e.NewText...)
		last = e.Span.End
	}
	return append(out, src[last:]...), nil
}

// StdTempKeys are the JSON keys of the standard temperatures.
var StdTempKeys = func() [7]string {
	var k [7]string
	for i, T := range benson.StdTemps {
		k[i] = fmt.Sprintf("%g", T)
	}
	return k
}()

// Refusal words why kiln could not estimate sp's structure, as check,
// estimate and fill word it ("kiln cannot estimate it: …"); "" when it was
// estimated or has no structure.
func (sp *Species) Refusal() string {
	if sp.estimateErr == nil {
		return ""
	}
	return "kiln cannot estimate it: " + RefusalReason(sp.estimateErr)
}
