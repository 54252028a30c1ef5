package molecule

import (
	"errors"
	"testing"
)

// FuzzParseSMILES checks that no input panics, that errors are positioned
// inside the input, and that Canonical is a fixed point: the canonical string
// parses, and its canonical string is itself (also for the stereo form).
func FuzzParseSMILES(f *testing.F) {
	for _, s := range []string{
		"CCO", "c1ccccc1", "C1=CC=CC=C1", "c1cc[nH]c1", "O=C1C=CC=CC=C1",
		"[CH3]", "C[C@H](O)N", "F/C=C/F", "[2H]C([2H])([2H])[2H]",
		"C12C3C4C1C5C2C3C45", "c1cc2ccc3cccc4ccc(c1)c2c34", "[O-][N+](=O)c1ccccc1",
		"C%12CC%12", "[nH]1cccc1.[Na+]", "C(C", "c1cccc1", "[se]1cccc1", "OO",
		"C1C2CC3CC1CC(C2)C3", "CC=C=CC", "C1=CC2CCC1C2", "CC.CC.CC", "F[C@TH1H](Cl)Br",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		if len(s) > 400 {
			return
		}
		m, err := ParseSMILES(s)
		if err != nil {
			var se *SMILESError
			if !errors.As(err, &se) {
				t.Fatalf("%q: error %v is not a *SMILESError", s, err)
			}
			if se.Pos < 0 || se.Pos > len(s) {
				t.Fatalf("%q: error position %d outside input", s, se.Pos)
			}
			return
		}
		// derived quantities never panic; σ is a number ≥ 1 or a work-limit
		// error, and the ring description covers every ring bond's atoms
		if sg, err := m.SymmetryNumber(); err != nil {
			if !errors.Is(err, ErrWorkLimit) {
				t.Fatalf("%q: symmetry number error %v", s, err)
			}
		} else if sg.Sign() <= 0 {
			t.Fatalf("%q: symmetry number %v", s, sg)
		}
		_ = m.OpticalIsomers()
		for _, r := range m.RingSystemInfo() {
			if r.Rings < 1 || len(r.BasisSizes) != r.Rings {
				t.Fatalf("%q: ring system %+v", s, r)
			}
		}
		if p := m.ClosedShellParent(); p.UnpairedElectrons() != 0 && p != m {
			t.Fatalf("%q: parent keeps radicals", s)
		}
		for _, stereo := range []bool{false, true} {
			can := m.Canonical()
			if stereo {
				can = m.CanonicalStereo()
			}
			m2, err := ParseSMILES(can)
			if err != nil {
				t.Fatalf("%q: canonical %q does not parse: %v", s, can, err)
			}
			can2 := m2.Canonical()
			if stereo {
				can2 = m2.CanonicalStereo()
			}
			if can2 != can {
				t.Fatalf("%q (stereo %v): canonical not stable: %q -> %q", s, stereo, can, can2)
			}
			if m2.Formula() != m.Formula() || m2.Charge() != m.Charge() || m2.UnpairedElectrons() != m.UnpairedElectrons() {
				t.Fatalf("%q: canonical %q changed formula/charge/spin", s, can)
			}
		}
	})
}
