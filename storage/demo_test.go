package storage

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"
)

// TestDemoMatchesTestdata: the built-in demo and the file the README's
// `make run` opens must not drift apart.
func TestDemoMatchesTestdata(t *testing.T) {
	outside, err := os.ReadFile(filepath.Join("..", "testdata", "demo.json"))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(outside, demoJSON) {
		t.Fatal("storage/demo.json differs from testdata/demo.json: copy testdata/demo.json over storage/demo.json")
	}
}

// TestDemoLoads: the demo decodes, holds a loaded, supported member, and
// each call gives a copy the caller may change.
func TestDemoLoads(t *testing.T) {
	p, err := Demo()
	if err != nil {
		t.Fatal(err)
	}
	m := p.Model
	if len(m.Segments) == 0 || len(m.Supports) == 0 || len(m.PointLoads)+len(m.DistributedLoad) == 0 {
		t.Fatalf("demo has %d segments, %d supports, %d point and %d distributed loads; want some of each",
			len(m.Segments), len(m.Supports), len(m.PointLoads), len(m.DistributedLoad))
	}
	p.Model.Supports[0].X = -99
	q, err := Demo()
	if err != nil {
		t.Fatal(err)
	}
	if q.Model.Supports[0].X == -99 {
		t.Error("a change to one Demo() result reached the next one")
	}
}
