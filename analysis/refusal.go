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
	// "(O): is a terminal atom…" reads "atom 4 (O) is a terminal atom…";
	// only the colon right after the element is dropped.
	if strings.HasPrefix(r, "(") {
		if i := strings.Index(r, ")"); i > 0 && strings.HasPrefix(r[i:], "): ") {
			r = r[:i+1] + r[i+2:]
		}
	}
	return fmt.Sprintf("atom %d %s", ue.Atom, r)
}
