package storage

import (
	_ "embed"
	"fmt"
)

// demoJSON is the built-in demo project. It is a copy of testdata/demo.json
// (the file `make run` opens); a test keeps the two byte-identical.
//
//go:embed demo.json
var demoJSON []byte

// Demo returns a fresh copy of the built-in demo project, read by the
// normal loader so it meets every rule a project file must.
func Demo() (*Project, error) {
	p, err := Unmarshal(demoJSON)
	if err != nil {
		return nil, fmt.Errorf("the built-in demo does not load (a build problem, please report it): %w", err)
	}
	return p, nil
}
