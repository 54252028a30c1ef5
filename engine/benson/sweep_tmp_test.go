package benson

import (
	"bufio"
	"fmt"
	"os"
	"sort"
	"strings"
	"testing"

	"kiln.dev/kiln/engine/molecule"
)

func TestTmpSweep(t *testing.T) {
	miss := map[string][]string{}
	var smis []string
	for _, f := range []string{"../../testdata/thermo/train.tsv", "../../testdata/smiles/molecules.txt"} {
		fh, _ := os.Open(f)
		sc := bufio.NewScanner(fh)
		for sc.Scan() {
			l := sc.Text()
			if strings.HasPrefix(l, "#") || l == "" {
				continue
			}
			c := strings.Split(l, "\t")
			s := c[0]
			if strings.HasSuffix(f, "train.tsv") {
				if len(c) < 2 || c[1] == "smiles" {
					continue
				}
				s = c[1]
			}
			smis = append(smis, s)
		}
		fh.Close()
	}
	for _, s := range smis {
		m, err := molecule.ParseSMILES(s)
		if err != nil {
			continue
		}
		ok := true
		for _, a := range m.Atoms {
			if a.Element != "C" && a.Element != "O" && a.Element != "H" || a.Charge != 0 {
				ok = false
			}
		}
		if !ok {
			continue
		}
		e, err := Estimate(m, Options{})
		if err != nil {
			miss["ERROR "+err.Error()] = append(miss["ERROR "+err.Error()], s)
			continue
		}
		for _, x := range e.Missing {
			k := x.Group + " ≈ " + x.Approximation
			miss[k] = append(miss[k], s)
		}
		if os.Getenv("SHOW") == s {
			for _, g := range append(e.Groups, e.Corrections...) {
				fmt.Printf("%-40s %d %8.2f %8.2f\n", g.Name, g.Count, g.Hf298/4184, g.S298/4.184)
			}
			fmt.Printf("total %.2f %.2f\n", e.Hf298/4184, e.S298/4.184)
		}
	}
	var keys []string
	for k := range miss {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		fmt.Printf("%-60s %d %v\n", k, len(miss[k]), miss[k][:min(4, len(miss[k]))])
	}
}
