package analysis

import (
	"errors"
	"fmt"
	"strings"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/engine/reflib"
)

// RefusalReason words the estimator's refusal for the user: the atom
// (numbered in the written SMILES) and the reason, without the package
// prefix; each caller adds what to do in its own terms.
func RefusalReason(err error) string {
	var ue *benson.UnsupportedError
	if !errors.As(err, &ue) {
		return strings.TrimPrefix(err.Error(), "benson: ")
	}
	if ue.Atom == 0 {
		return ue.Reason
	}
	return fmt.Sprintf("atom %d %s", ue.Atom, ue.Reason)
}

// RefusalGroups names the groups whose absence refused an estimate (the
// one the engine names and any further ones), nil when err is not such a
// refusal.
func RefusalGroups(err error) []string {
	var me *benson.MissingGroupError
	if !errors.As(err, &me) {
		return nil
	}
	return append([]string{me.Group}, me.Also...)
}

// RefusalGroupFlag words one group of RefusalGroups as a flag, for the
// JSON outputs that list a refused species' missing groups (kind
// "missing").
func RefusalGroupFlag(group string) string {
	return group + ": no value and no approximation (the estimate is refused)"
}

// RefusalGroups names the groups whose absence refused the species'
// estimate; nil when it was estimated or refused for another reason.
func (s *Species) RefusalGroups() []string { return RefusalGroups(s.estimateErr) }

// RefusalGivesRoute reports whether a refusal's reason (RefusalReason)
// already tells the user to give a thermo block, so that callers adding
// that route (check, estimate, hover) do not say it twice.
func RefusalGivesRoute(reason string) bool {
	return strings.Contains(reason, "thermo block")
}

// FitRefusal words a refused NASA-7 fit (the error of Estimate.NASA7) for
// the user in the display units u, with the temperature of the defect and
// what to do, without the engine's package prefix. Every caller that shows
// a fit refusal to people (fill's skip list, hover, estimate) uses it.
func FitRefusal(err error, u Units) string {
	const block = "give the species a nasa7 or thermo-table block"
	var fe *cpFloorError
	if errors.As(err, &fe) {
		return fe.words(u) + "; " + block
	}
	var se *nasa.ShapeError
	if errors.As(err, &se) {
		switch se.Test {
		case nasa.ShapeFalls:
			drop := u.EntropyValue(se.Other - se.Cp)
			return fmt.Sprintf("the fitted Cp falls with temperature, by %.2g %s from %s at %.0f K to %s at %.0f K; "+
				"try another TMID or THIGH (--tmid/--thigh, or tMid/tHigh in the editor's settings), or "+block,
				drop, u.EntropyName(), u.Entropy(se.Other), se.OtherT, u.Entropy(se.Cp), se.T)
		case nasa.ShapeAboveLimit:
			return "the estimated " + aboveLimitWords(u, se.T, se.Cp, se.Other) + ", so no sound polynomial " +
				"follows it; check the structure and any approximated or user-supplied group values, or " + block
		}
	}
	msg := err.Error()
	for _, prefix := range []string{"nasa fit: ", "nasa fit poly: ", "nasa: "} {
		msg = strings.TrimPrefix(msg, prefix)
	}
	return msg + "; " + block
}

// withReading adds to the estimator's refusal err of m a note on how the
// SMILES was read when a structure one hydrogen away is a radical of the
// reference library: N(=O)=O, the usual mistaken spelling of NO2, reads as
// HNO2 (the N takes an implicit H), and the note says so and how to write
// the radical. Errors without such a neighbour are returned as they are.
func withReading(lib *reflib.Library, m *molecule.Molecule, err error) error {
	note := libraryNeighbour(lib, m)
	if note == "" {
		return err
	}
	var mg *benson.MissingGroupError
	if errors.As(err, &mg) {
		out := *mg
		out.Reading = note
		return &out
	}
	var ue *benson.UnsupportedError
	if errors.As(err, &ue) {
		out := *ue
		out.Reason += "; " + note
		return &out
	}
	return fmt.Errorf("%w; %s", err, note)
}

// libraryNeighbour returns a note naming the radicals of the reference
// library whose structure is m with one hydrogen taken from an atom (the
// hydrogen may be one the SMILES implied), when m is a closed shell, or
// given to a radical site, when m is a radical, with how to write them; ""
// when there is none.
func libraryNeighbour(lib *reflib.Library, m *molecule.Molecule) string {
	if m == nil || len(m.Atoms) == 0 || m.HeavyAtoms() > 4 {
		return "" // the library holds small species only
	}
	// A closed shell may be a radical written without brackets (the
	// implicit H); a radical may lack an H a library radical has ([N]=[N]
	// for NNH). A radical one H fewer than a radical is another species.
	minus := m.UnpairedElectrons() == 0
	seen := map[string]bool{}
	var notes []string
	for i, a := range m.Atoms {
		if a.Element == "H" {
			continue
		}
		var alt *molecule.Molecule
		var err error
		if minus {
			alt, err = m.WithHydrogenRemoved(i)
		} else {
			alt, err = m.WithHydrogenAdded(i)
		}
		if err != nil {
			continue
		}
		sp, ok := lib.Lookup(alt, 0)
		if !ok || sp.Multiplicity < 2 || seen[sp.Name] {
			continue
		}
		seen[sp.Name] = true
		spell := alt.Canonical()
		if sp.SMILES != spell {
			spell = sp.SMILES + " or " + spell
		}
		if !minus {
			notes = append(notes, fmt.Sprintf("the radical with one more H on its %s, %s, is in the reference library: write it %s", a.Element, sp.Name, spell))
			continue
		}
		how := fmt.Sprintf("its %s carries %d H", a.Element, a.HCount)
		if m.ImplicitHydrogens(i) {
			how = fmt.Sprintf("its %s takes %d implicit H, as an atom outside brackets takes the hydrogens its ordinary valence leaves", a.Element, a.HCount)
		}
		notes = append(notes, fmt.Sprintf("%s is read as %s: %s; the radical with one H fewer, %s, is in the reference library: write it %s",
			m.SMILES, m.Formula(), how, sp.Name, spell))
	}
	return strings.Join(notes, "; ")
}
