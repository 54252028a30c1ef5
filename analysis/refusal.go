package analysis

import (
	"errors"
	"fmt"
	"strings"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/nasa"
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
