package fem

import (
	"encoding/json"
	"strings"
	"testing"
)

// TestQuantityTable checks that every quantity has a complete entry, that
// JSON writes it by its snake_case Key and that each of its names parses back.
func TestQuantityTable(t *testing.T) {
	for _, q := range Quantities() {
		info := q.Info()
		if info.Field == "" || info.Name == "" || info.Label == "" || info.Column == "" || info.SI == "" {
			t.Errorf("quantity %d has an incomplete entry %+v", int(q), info)
		}
		got, err := json.Marshal(Extreme{Quantity: q})
		if err != nil {
			t.Fatalf("%s: %v", q, err)
		}
		var back struct{ Quantity string }
		if err := json.Unmarshal(got, &back); err != nil || back.Quantity != q.Key() || strings.ContainsAny(back.Quantity, " ABCDEFGHIJKLMNOPQRSTUVWXYZ") {
			t.Errorf("%s is written as %q in %s, want %q in snake_case", q, back.Quantity, got, q.Key())
		}
		for _, name := range []string{info.Field, info.Name, q.Key(), info.Column} {
			if p, ok := ParseQuantity(name); !ok || p != q {
				t.Errorf("ParseQuantity(%q) = %v, %v; want %v", name, p, ok, q)
			}
		}
	}
	if _, err := json.Marshal(Extreme{Quantity: quantityCount}); err == nil {
		t.Error("a quantity outside the table was written to JSON")
	}
}
