package main

import (
	"fmt"
	"math"
	"slices"
	"strings"
	"unicode"

	"similis.dev/similis/units/formula"
)

// selectSource is a channel file whose columns can be selected before
// reading, so that a column nobody uses is not parsed.
type selectSource interface {
	channelSource
	Select(idx []int) error
}

// gaugeSampleRows bounds the rows read to check that the gauge channels
// cancel.
const gaugeSampleRows = 4096

// gaugeShift is the change of the ambient pressure the check tries, in
// Pa: some 10 % of an atmosphere, more than a day's barometer moves.
const gaugeShift = 1e4

// gaugeCancels decides whether a file's gauge channels may be read
// without the ambient pressure: rd reads the file with a provisional
// reference. They may when no variable is a gauge channel itself and
// every derived channel a variable uses reads the gauge channels only
// so that the ambient cancels (P2 − P1, all of a file's gauge channels
// being read against its one ambient). That is checked on the file's
// first rows: each such derived value must be the same, to 1e-9, with
// every gauge channel raised by 10 kPa. It returns the gauge channels
// used and the derived channels they enter, and a reason when they may
// not be used so.
func gaugeCancels(rd selectSource, vars []string, derive string, funcs []formula.Func) (gauges, derived []string, rows int, why string) {
	cols := rd.Columns()
	isGauge := map[string]bool{}
	for _, c := range cols {
		if c.Gauge && c.Fault == nil {
			isGauge[c.Name] = true
		}
	}
	for _, v := range vars {
		if isGauge[v] {
			return nil, nil, 0, fmt.Sprintf("variable %s is the gauge channel itself", v)
		}
	}
	if derive == "" {
		return nil, nil, 0, "" // no gauge channel is read
	}
	words := map[string]bool{}
	for _, w := range strings.FieldsFunc(derive, func(r rune) bool { return r != '_' && !unicode.IsLetter(r) && !unicode.IsDigit(r) }) {
		words[w] = true
	}
	var inputs []formula.Input
	var idx, gaugeIn []int
	for j, c := range cols {
		if !words[c.Name] {
			continue
		}
		if c.Fault != nil {
			return nil, nil, 0, fmt.Sprintf("channel %s cannot be read", c.Name)
		}
		if c.Gauge {
			gaugeIn = append(gaugeIn, len(inputs))
			gauges = append(gauges, c.Name)
		}
		inputs = append(inputs, formula.Input{Name: c.Name, Dim: c.Unit.Dim()})
		idx = append(idx, j)
	}
	if len(gaugeIn) == 0 {
		return nil, nil, 0, ""
	}
	prog, err := formula.Options{Funcs: funcs}.Compile(derive, inputs...)
	if err != nil {
		return nil, nil, 0, "the derived channels do not compile"
	}
	var outs []int // the derived channels the variables use
	for i, name := range prog.Outputs() {
		if slices.Contains(vars, name) {
			outs = append(outs, i)
		}
	}
	if err := rd.Select(idx); err != nil {
		return nil, nil, 0, err.Error()
	}
	data, n, err := rd.Read(nil, gaugeSampleRows)
	if err != nil || n == 0 {
		return nil, nil, 0, "its first rows cannot be read"
	}
	ev := prog.Evaluator()
	ev.SetCheck(formula.Unchecked)
	in := make([]float64, len(inputs))
	out0 := make([]float64, len(prog.Outputs()))
	out1 := make([]float64, len(prog.Outputs()))
	uses := make([]bool, len(outs)) // a derived channel that one gauge channel moves
	checked := 0
	for row := range n {
		for k, j := range idx {
			in[k] = data[j].At(row).Value()
		}
		if _, err := ev.Row(in, out0); err != nil {
			continue
		}
		for _, k := range gaugeIn {
			in[k] += gaugeShift
		}
		if _, err := ev.Row(in, out1); err != nil {
			continue
		}
		for _, i := range outs {
			a, b := out0[i], out1[i]
			if math.IsNaN(a) && math.IsNaN(b) {
				continue
			}
			if !same(a, b) {
				return nil, nil, 0, fmt.Sprintf("the derived %s changes with the ambient pressure (data row %d)", prog.Outputs()[i], row+1)
			}
			checked++
		}
		// Which derived channels the gauge channels enter: those one of
		// them moves alone.
		for _, k := range gaugeIn {
			for _, g := range gaugeIn {
				in[g] -= gaugeShift
			}
			in[k] += gaugeShift
			if _, err := ev.Row(in, out1); err == nil {
				for m, i := range outs {
					if !math.IsNaN(out0[i]) && !same(out0[i], out1[i]) {
						uses[m] = true
					}
				}
			}
			in[k] -= gaugeShift
			for _, g := range gaugeIn {
				in[g] += gaugeShift
			}
		}
	}
	if checked == 0 && len(outs) > 0 {
		return nil, nil, 0, "no row of the first ones gives the derived channels a value to check"
	}
	for m, i := range outs {
		if uses[m] {
			derived = append(derived, prog.Outputs()[i])
		}
	}
	return gauges, derived, n, ""
}

// same reports whether a and b agree to 1e-9 of the larger.
func same(a, b float64) bool { return math.Abs(a-b) <= 1e-9*math.Max(math.Abs(a), math.Abs(b)) }

// gaugeNote is the line that says why the gauge channels were read
// without the ambient pressure.
func gaugeNote(gauges, derived []string, rows int) string {
	if len(gauges) == 0 {
		return "pisets: the file's gauge channels are not used, so no ambient pressure is needed"
	}
	d := "no variable"
	if len(derived) > 0 {
		d = strings.Join(derived, ", ")
	}
	return fmt.Sprintf("pisets: gauge channels %s enter only %s, in which the ambient pressure cancels (checked on the first %d rows with it raised by %g kPa): read without -baro; a derived difference of gauge pressures is a pressure difference, not an absolute pressure",
		strings.Join(gauges, ", "), d, rows, gaugeShift/1000)
}
