package molecule

import (
	"fmt"
	"testing"
)

func TestQuickDump(t *testing.T) {
	for _, s := range []string{"CCO", "OCC", "CC(C)C", "C(C)(C)C", "c1ccccc1", "C1=CC=CC=C1", "c1cc[nH]c1", "c1ccc2ccccc2c1", "C1=CC2=CC=CC=C2C=C1", "O=C1C=CC=CC=C1", "[CH3]", "C[C@H](O)N", "N[C@@H](C)O", "F/C=C/F", "F/C=C\\F", "F\\C=C\\F", "C(/F)=C/F", "[2H]C([2H])([2H])[2H]", "C12C3C4C1C5C2C3C45", "c1cc2ccc3cccc4ccc(c1)c2c34", "C", "CC", "CC(C)(C)C", "C1CC2CCC1C2", "C[n+]1ccccc1", "[O-][N+](=O)c1ccccc1", "c1ccc(cc1)-c1ccccc1"} {
		m, err := ParseSMILES(s)
		if err != nil {
			fmt.Println(s, "ERR", err)
			continue
		}
		n, ex := m.AutomorphismCount(100000)
		fmt.Println(s, m.Canonical(), m.CanonicalStereo(), m.SymmetryClasses(), n, ex, m.PotentialStereocentres())
	}
}
