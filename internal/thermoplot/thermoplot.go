// Package thermoplot draws thermochemistry against temperature as SVG: three
// stacked panels of the dimensionless quantities Cp/R, H/(RT) and S/R for
// T in K, so that polynomials, tables and estimates can be compared by eye.
package thermoplot

import (
	"errors"
	"fmt"
	"image/color"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgsvg"

	"kiln.dev/kiln/engine/nasa"
)

// Series is one curve or set of points.
type Series struct {
	// Name labels the series in the legend.
	Name string
	// Points draws markers at the temperatures T only; otherwise a line is
	// drawn through Eval sampled at 200 temperatures across [tMin, tMax].
	Points bool
	// Eval returns Cp in J/(mol K), H in J/mol and S in J/(mol K) at T (K).
	Eval func(T float64) (cp, h, s float64)
	// T lists the temperatures (K) of a point series.
	T []float64
}

const lineSamples = 200

// Render writes an SVG of three stacked panels — Cp/R, H/(RT) and S/R against
// T (K) over [tMin, tMax] — with the given title above the first panel and a
// legend naming each series. R is nasa.R. Values that are not finite are left
// out. Errors: 0 < tMin < tMax violated, no series, a series without Eval, a
// point series without temperatures, plotting or writing failures.
func Render(w io.Writer, title string, series []Series, tMin, tMax float64) error {
	if !(tMin > 0 && tMin < tMax) || math.IsInf(tMax, 0) {
		return fmt.Errorf("thermoplot: need 0 < tMin < tMax, got %g, %g K", tMin, tMax)
	}
	if len(series) == 0 {
		return errors.New("thermoplot: no series")
	}
	panels := []struct {
		label string
		f     func(T, cp, h, s float64) float64
	}{
		{"Cp/R", func(T, cp, h, s float64) float64 { return cp / nasa.R }},
		{"H/(RT)", func(T, cp, h, s float64) float64 { return h / (nasa.R * T) }},
		{"S/R", func(T, cp, h, s float64) float64 { return s / nasa.R }},
	}
	plots := make([][]*plot.Plot, len(panels))
	for pi, panel := range panels {
		p := plot.New()
		if pi == 0 {
			p.Title.Text = title
		}
		p.Y.Label.Text = panel.label
		if pi == len(panels)-1 {
			p.X.Label.Text = "T / K"
		}
		p.X.Min, p.X.Max = tMin, tMax
		p.Add(plotter.NewGrid())
		for si, s := range series {
			if s.Eval == nil {
				return fmt.Errorf("thermoplot: series %q has no Eval", s.Name)
			}
			ts := s.T
			if !s.Points {
				ts = make([]float64, lineSamples)
				for i := range ts {
					ts[i] = tMin + (tMax-tMin)*float64(i)/(lineSamples-1)
				}
			} else if len(ts) == 0 {
				return fmt.Errorf("thermoplot: point series %q has no temperatures", s.Name)
			}
			var xy plotter.XYs
			for _, T := range ts {
				if T < tMin || T > tMax {
					continue
				}
				cp, h, sv := s.Eval(T)
				v := panel.f(T, cp, h, sv)
				if math.IsNaN(v) || math.IsInf(v, 0) {
					continue
				}
				xy = append(xy, plotter.XY{X: T, Y: v})
			}
			if len(xy) == 0 {
				continue
			}
			col := plotutil.Color(si)
			if s.Points {
				sc, err := plotter.NewScatter(xy)
				if err != nil {
					return fmt.Errorf("thermoplot: series %q: %w", s.Name, err)
				}
				sc.GlyphStyle.Color = col
				sc.GlyphStyle.Shape = plotutil.Shape(si)
				sc.GlyphStyle.Radius = vg.Points(2.5)
				p.Add(sc)
				if pi == 0 {
					p.Legend.Add(s.Name, sc)
				}
			} else {
				l, err := plotter.NewLine(xy)
				if err != nil {
					return fmt.Errorf("thermoplot: series %q: %w", s.Name, err)
				}
				l.LineStyle.Color = col
				l.LineStyle.Width = vg.Points(1.2)
				p.Add(l)
				if pi == 0 {
					p.Legend.Add(s.Name, l)
				}
			}
		}
		p.Legend.Top = true
		p.Legend.Left = true
		plots[pi] = []*plot.Plot{p}
	}
	const width, panelHeight = 6 * vg.Inch, 3 * vg.Inch
	c := vgsvg.New(width, panelHeight*vg.Length(len(panels)))
	dc := draw.New(c)
	fillWhite(dc)
	tiles := draw.Tiles{Rows: len(panels), Cols: 1, PadTop: vg.Points(4), PadBottom: vg.Points(4), PadX: vg.Points(4), PadY: vg.Points(6)}
	canvases := plot.Align(plots, tiles, dc)
	for i := range plots {
		plots[i][0].Draw(canvases[i][0])
	}
	if _, err := c.WriteTo(w); err != nil {
		return fmt.Errorf("thermoplot: writing SVG: %w", err)
	}
	return nil
}

// fillWhite paints the background so the SVG reads well on dark viewers.
func fillWhite(dc draw.Canvas) {
	dc.SetColor(color.White)
	r := dc.Rectangle
	var path vg.Path
	path.Move(r.Min)
	path.Line(vg.Point{X: r.Max.X, Y: r.Min.Y})
	path.Line(r.Max)
	path.Line(vg.Point{X: r.Min.X, Y: r.Max.Y})
	path.Close()
	dc.Fill(path)
}
