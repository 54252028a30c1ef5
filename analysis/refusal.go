package analysis

import (
	"errors"
	"fmt"
	"strings"

	"kiln.dev/kiln/engine/benson"
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
