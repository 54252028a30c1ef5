package main

import (
	"bytes"
	"fmt"
	"math"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/internal/thermoplot"
)

func runPlot(e env, args []string) (int, error) {
	flags, names, err := parseArgs(args, withSettings(flagSpec{"file": true, "o": true, "output": true}))
	if err != nil {
		return 0, err
	}
	if len(names) != 1 {
		return 0, usagef("plot needs exactly one SPECIES name")
	}
	file := flags["file"]
	if file == "" {
		return 0, usagef("plot needs --file FILE")
	}
	out := flags["o"]
	if out == "" {
		out = flags["output"]
	}
	if out == "" {
		return 0, usagef("plot needs -o OUT.svg")
	}
	res, set, err := analyzeFile(e, file, flags)
	if err != nil {
		return 0, err
	}
	sp, ok := res.ByName[names[0]]
	if !ok {
		return 0, fmt.Errorf("%s: no species named %q", file, names[0])
	}
	var series []thermoplot.Series
	tMax := set.THigh
	if est := sp.Estimate; est != nil {
		poly, _, err := est.NASA7()
		if err != nil {
			return 0, fmt.Errorf("%s: no NASA-7 polynomial for %s: %s", file, sp.Name, analysis.FitRefusal(err, res.Units()))
		}
		cp := est.Cp
		if est.Library != "" {
			// Reference-library data: its polynomial over its own range (a
			// gap beyond, as for a file block), not a group estimate.
			s := blockSeries(poly)
			s.Name = fmt.Sprintf("reference library %s (%g–%g K)", est.Library, poly.TLow, poly.THigh)
			series = append(series, s)
		} else {
			series = append(series,
				thermoplot.Series{Name: "group estimate", Points: true, T: benson.StdTemps[:], Eval: func(T float64) (float64, float64, float64) {
					for i, t := range benson.StdTemps {
						if t == T {
							return cp[i], poly.H(T), poly.S(T)
						}
					}
					return poly.Cp(T), poly.H(T), poly.S(T)
				}},
				thermoplot.Series{Name: "fitted NASA-7", Eval: func(T float64) (float64, float64, float64) { return poly.Cp(T), poly.H(T), poly.S(T) }},
			)
		}
	}
	if g := sp.Given; g != nil && g.Poly != nil {
		series = append(series, blockSeries(*g.Poly))
		tMax = max(tMax, g.Poly.THigh)
	}
	if g := sp.Given; g != nil && g.Table != nil && len(g.Table.T) > 0 {
		th := sp.Thermo()
		tab := g.Table
		series = append(series, thermoplot.Series{Name: "file table", Points: true, T: tab.T, Eval: func(T float64) (float64, float64, float64) {
			cp := math.NaN() // a points series is evaluated at its own temperatures only
			for i, t := range tab.T {
				if t == T {
					cp = tab.Cp[i]
				}
			}
			return cp, th.H(T), th.S(T)
		}})
	}
	if len(series) == 0 {
		return 0, fmt.Errorf("%s has neither a thermo block nor an estimate to plot", sp.Name)
	}
	var buf bytes.Buffer
	if err := thermoplot.Render(&buf, fmt.Sprintf("%s (%s)", sp.Name, sp.Formula), series, 300, tMax); err != nil {
		return 0, fmt.Errorf("drawing %s: %w", sp.Name, err)
	}
	if err := writeNew(out, buf.Bytes()); err != nil {
		return 0, err
	}
	return exitOK, nil
}

// blockSeries draws a file's polynomial over its own range only: no value
// (a gap in the line) outside [TLow, THigh], so the plot shows where the
// block ends; the legend gives the range.
func blockSeries(p nasa.NASA7) thermoplot.Series {
	return thermoplot.Series{Name: fmt.Sprintf("file block (%g–%g K)", p.TLow, p.THigh), Eval: func(T float64) (float64, float64, float64) {
		if !p.InRange(T) {
			return math.NaN(), math.NaN(), math.NaN()
		}
		return p.Cp(T), p.H(T), p.S(T)
	}}
}

// writeNew writes data to path atomically, creating it if needed.
func writeNew(path string, data []byte) error {
	if err := createIfMissing(path); err != nil {
		return err
	}
	return writeAtomic(path, data)
}
