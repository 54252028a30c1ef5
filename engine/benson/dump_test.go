package benson

import (
	"fmt"
	"os"
	"testing"

	"kiln.dev/kiln/engine/molecule"
)

func TestDumpGroups(t *testing.T) {
	if os.Getenv("DUMP") == "" {
		t.Skip()
	}
	for _, s := range []string{"CC", "CCC", "CC(C)C", "CC(C)(C)C", "C=C", "CC=C", "C=CC=C", "C=C=C", "C#C", "CC#C", "c1ccccc1", "Cc1ccccc1", "c1ccc2ccccc2c1", "c1ccc2cc3ccccc3cc2c1", "C=Cc1ccccc1", "C#Cc1ccccc1", "CO", "CCO", "COC", "CC=O", "CC(C)=O", "CC(=O)O", "CC(=O)OC", "O=CO", "COO", "COOC", "Oc1ccccc1", "COc1ccccc1", "c1ccoc1", "C1CC1", "C1CCCCC1", "C1CCOC1", "C1CO1", "OCc1ccccc1", "CC(=O)c1ccccc1", "O=Cc1ccccc1", "C=CO", "C=COC", "C1CCC2CCCCC2C1", "CC(O)CC", "c1ccc(cc1)-c1ccccc1", "C[CH2]", "CO[O]", "[CH2]C=C", "CC(C)(C)C(C)(C)C", "C/C=C\\C", "Cc1ccccc1C", "C1=CCCCC1", "C1=CC=CCC1", "C1=CCC=CC1","C12CCC(CC1)C2","C[C]=O","C[O]", "OCC(O)CO", "C1OCOC1"} {
		m, err := molecule.ParseSMILES(s)
		if err != nil {
			t.Fatal(s, err)
		}
		e, err := Estimate(m, Options{})
		if err != nil {
			fmt.Println(s, "ERR", err)
			continue
		}
		fmt.Printf("%-24s", s)
		for _, g := range e.Groups {
			fmt.Printf(" %s×%d", g.Name, g.Count)
		}
		fmt.Print(" |")
		for _, g := range e.Corrections {
			fmt.Printf(" %s×%d", g.Name, g.Count)
		}
		fmt.Printf(" | σ=%d n=%d mult=%d %s %s", e.SymmetryNumber, e.OpticalIsomers, e.Multiplicity, e.Class, e.Formula)
		for _, x := range e.Missing {
			fmt.Printf(" MISSING[%s≈%s]", x.Group, x.Approximation)
		}
		fmt.Println()
	}
}
