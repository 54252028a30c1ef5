package analysis

import (
	"errors"
	"fmt"
	"strings"

	"kiln.dev/kiln/engine/benson"
)

// RefusalReason words the estimator's refusal for a missing-thermo
// diagnostic: the atom (numbered in the written SMILES) and the reason,
// without the package prefix and without the engine's own advice, which
// the diagnostic gives once in the file's terms.
func RefusalReason(err error) string {
	var ue *benson.UnsupportedError
	if !errors.As(err, &ue) {
		return strings.TrimPrefix(err.Error(), "benson: ")
	}
	r := ue.Reason
	for _, advice := range []string{
		"; group additivity cannot estimate this species — give it a thermo block",
		" — give the species a thermo block",
		" — give it a thermo block",
	} {
		r = strings.TrimSuffix(r, advice)
	}
	if ue.Atom == 0 {
		return r
	}
	return fmt.Sprintf("atom %d %s", ue.Atom, strings.Replace(r, "): ", ") ", 1))
}
