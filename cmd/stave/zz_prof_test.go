package main

import (
	"io"
	"testing"
)

func TestZZProfSolve(t *testing.T) {
	if code := run([]string{"solve", "--json", "/tmp/lead/sup40k.json"}, io.Discard, io.Discard); code != 0 {
		t.Log("exit", code)
	}
}
