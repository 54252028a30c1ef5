package benson

import (
	"bufio"
	"os"
	"strings"
	"testing"

	"kiln.dev/kiln/engine/molecule"
)

// FuzzEstimate: every structure the SMILES reader accepts is either
// estimated or refused with an error — never a panic — an estimate accounts
// for every heavy atom exactly once, and its breakdown sums to its totals.
func FuzzEstimate(f *testing.F) {
	if fh, err := os.Open("../../testdata/smiles/molecules.txt"); err == nil {
		sc := bufio.NewScanner(fh)
		for sc.Scan() {
			if fields := strings.Fields(sc.Text()); len(fields) > 0 && !strings.HasPrefix(fields[0], "#") {
				f.Add(fields[0])
			}
		}
		fh.Close()
	}
	for _, s := range []string{"C=C=O", "[CH2]C=O", "C=C[O]", "[CH2]CC[CH2]", "[C]", "C1CC2CCC1C2", "O=C1C=CC(=O)C=C1",
		"C[N+](=O)[O-]", "CO[N+](=O)[O-]", "CON=O", "Cc1ccccn1", "[O-][N+](=O)c1ccncc1"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, smi string) {
		m, err := molecule.ParseSMILES(smi)
		if err != nil {
			return
		}
		e, err := Estimate(m, Options{})
		if err != nil {
			return
		}
		seen := map[int]bool{}
		for _, g := range e.Groups {
			for _, a := range g.Atoms {
				if seen[a] {
					t.Fatalf("%s: atom %d in two groups", smi, a+1)
				}
				seen[a] = true
			}
		}
		heavy := len(m.Atoms) // every graph atom (explicit isotopic H included)
		if len(seen) != heavy {
			t.Fatalf("%s: groups account for %d of %d heavy atoms", smi, len(seen), heavy)
		}
		h, s := 0.0, 0.0
		for _, ts := range [][]Term{e.Groups, e.Corrections} {
			for _, x := range ts {
				h += x.Hf298
				s += x.S298
			}
		}
		if d := h - e.Hf298; d > 1e-6 || d < -1e-6 {
			t.Fatalf("%s: groups sum to %g, total %g", smi, h, e.Hf298)
		}
		if d := s - e.S298; d > 1e-6 || d < -1e-6 {
			t.Fatalf("%s: entropy terms sum to %g, total %g", smi, s, e.S298)
		}
	})
}
