package main

import (
	"bufio"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/nasa"
)

func main() {
	for _, f := range os.Args[1:] {
		fh, _ := os.Open(f)
		sc := bufio.NewScanner(fh)
		var sum, sumW [7]float64
		var n [7]int
		for sc.Scan() {
			l := sc.Text()
			if strings.HasPrefix(l, "#") || strings.HasPrefix(l, "name") {
				continue
			}
			c := strings.Split(l, "\t")
			m, err := molecule.ParseSMILES(c[1])
			if err != nil {
				continue
			}
			e, err := benson.Estimate(m, benson.Options{})
			if err != nil {
				continue
			}
			// Wilhoit from 300..1000 group points
			h := 0
			for _, a := range m.Atoms {
				h += a.HCount
			}
			N := len(m.Atoms) + h
			rot := 0
			for _, b := range m.Bonds {
				if b.Order == 1 && len(m.Adj[b.A])+m.Atoms[b.A].HCount > 1 && len(m.Adj[b.B])+m.Atoms[b.B].HCount > 1 {
					rot++
				}
			}
			cp0, cpi := nasa.ClassicalLimits(N, false, rot)
			_, _ = cp0, cpi
			for i := 0; i < 7; i++ {
				if c[5+i] == "" {
					continue
				}
				v, _ := strconv.ParseFloat(c[5+i], 64)
				d := e.Cp[i]/4.184 - v
				sum[i] += math.Abs(d)
				n[i]++
				if i == 6 {
					fmt.Printf("%-28s grp %+.2f\n", c[0], d)
				}
			}
		}
		for i := range sum {
			fmt.Printf("%s T=%v n=%d MAE=%.2f wilhoitMAE=%.2f\n", f, benson.StdTemps[i], n[i], sum[i]/float64(n[i]), sumW[i]/float64(n[i]))
		}
	}
}
