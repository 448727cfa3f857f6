package main

import (
	"fmt"
	"strings"

	"stave/fem"
	"stave/fem/analysis"
)

// showFlag reads --show NAME for model m: a combination or a load case by
// name, or "envelope"; "" shows the first combination of a model with
// load cases (its envelope is printed beside it), the model itself
// otherwise.
func showFlag(m *fem.Model, name string) (analysis.Show, error) {
	if name == "" {
		if len(m.Cases) > 0 {
			return analysis.Show{Kind: analysis.ShowEnvelope}, nil
		}
		return analysis.Show{}, nil
	}
	if len(m.Cases) == 0 {
		return analysis.Show{}, usageError{fmt.Sprintf("--show %q: the model has no load cases; leave --show out", name)}
	}
	s, ok := analysis.ShowNamed(m, name)
	if !ok {
		var names []string
		for _, c := range m.EnvelopeCombinations() {
			names = append(names, fmt.Sprintf("%q", c.Name))
		}
		for k := range m.LoadSetCount() {
			names = append(names, fmt.Sprintf("%q", m.LoadSetName(k)))
		}
		return s, usageError{fmt.Sprintf("--show %q: no load case or combination has that name; use one of %s, or \"envelope\"", name, strings.Join(names, ", "))}
	}
	return s, nil
}
