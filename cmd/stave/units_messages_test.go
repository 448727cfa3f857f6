package main

import (
	"encoding/json"
	"strings"
	"testing"
)

// A model the supports leave free is refused, by solve, influence and
// converge, with the place quoted in the display units: --units, else the file's
// view.units. The simply
// supported beam (4 m) on one pin at x = 3.048 m, 10 ft exactly (NIST SP
// 811 (2008), Appendix B: 1 ft = 0.3048 m), rotates about it. The JSON
// document's values stay SI; its messages are the findings', in the units
// of the request as every finding's (the checks' too).
func TestSolveMechanismInDisplayUnits(t *testing.T) {
	dir := t.TempDir()
	onePin := func(view string) func(m map[string]any) {
		return func(m map[string]any) {
			m["supports"] = []any{map[string]any{"x": 3.048, "kind": "pinned"}}
			m["view"].(map[string]any)["units"] = view
		}
	}
	si := variant(t, dir, "one_pin_si", onePin("SI"))
	us := variant(t, dir, "one_pin_us", onePin("US"))
	withCases := variant(t, dir, "one_pin_cases", func(m map[string]any) {
		onePin("US")(m)
		m["cases"] = []any{map[string]any{"name": "dead", "loads": m["loads"]}}
		delete(m, "loads")
	})
	const (
		inFeet   = "the member can rotate about the support at x = 10.0 ft: add a second support or fix one end"
		inMetres = "the member can rotate about the support at x = 3.048 m: add a second support or fix one end"
	)
	for _, c := range []struct {
		name string
		args []string
		want string
	}{
		{"--units US", []string{"solve", "--units", "US", si}, inFeet},
		{"view.units US", []string{"solve", us}, inFeet},
		{"view.units SI", []string{"solve", si}, inMetres},
		{"--units SI", []string{"solve", "--units", "SI", us}, inMetres},
		{"load cases, view.units US", []string{"solve", withCases}, inFeet},
		{"JSON, --units US", []string{"solve", "--json", "--units", "US", si}, inFeet},
		{"JSON, view.units SI", []string{"solve", "--json", si}, inMetres},
		{"influence, --units US", []string{"influence", "--units", "US", si, "--quantity", "M", "--at", "2"}, inFeet},
		{"influence, view.units SI", []string{"influence", si, "--quantity", "M", "--at", "2"}, inMetres},
		{"converge, --units US", []string{"converge", "--units", "US", si}, "convergence study needs the exact solution: " + inFeet},
		{"converge, view.units US", []string{"converge", us}, "convergence study needs the exact solution: " + inFeet},
		{"converge, view.units SI", []string{"converge", si}, "convergence study needs the exact solution: " + inMetres},
		{"converge --target, view.units US", []string{"converge", "--target", "0.01", us}, "convergence study needs the exact solution: " + inFeet},
	} {
		t.Run(c.name, func(t *testing.T) {
			code, out, stderr := runStave(t, c.args...)
			if code != 1 || !strings.Contains(stderr, c.want) {
				t.Errorf("exit %d, stderr %q; want exit 1 and %q", code, stderr, c.want)
			}
			if c.args[1] != "--json" {
				return
			}
			var d struct {
				Warnings []struct{ Code, Message string }
			}
			if err := json.Unmarshal([]byte(out), &d); err != nil || len(d.Warnings) != 1 || d.Warnings[0].Code != "mechanism" || d.Warnings[0].Message != c.want {
				t.Errorf("JSON warnings %+v (%v), want one mechanism saying %q", d.Warnings, err, c.want)
			}
		})
	}
}

// A train that does not fit on the member is left out of the solve's
// trains with why, its lengths in the display units. The runway's member
// is 12 m long; its end carriage's axles set 15.24 m apart, 50 ft exactly
// (NIST SP 811 (2008), Appendix B: 1 ft = 0.3048 m); 12 m = 39.3701 ft to
// six figures. The finding and the train's error in the JSON say the same.
func TestSolveTrainNotPlacedInDisplayUnits(t *testing.T) {
	dir := t.TempDir()
	long := func(view string) func(m map[string]any) {
		return func(m map[string]any) {
			m["trains"].([]any)[0].(map[string]any)["axles"].([]any)[1].(map[string]any)["spacing"] = 15.24
			m["view"].(map[string]any)["units"] = view
		}
	}
	si := variantOf(t, "../../testdata/moving/runway.json", dir, "long_si", long("SI"))
	us := variantOf(t, "../../testdata/moving/runway.json", dir, "long_us", long("US"))
	const (
		inFeet   = `train "end carriage": the train is 50 ft long and does not fit on the 39.3701 ft it runs along (x = 0 ft to 39.3701 ft): shorten the train or lengthen its run`
		inMetres = `train "end carriage": the train is 15.24 m long and does not fit on the 12 m it runs along (x = 0 m to 12 m): shorten the train or lengthen its run`
	)
	for _, c := range []struct {
		name string
		args []string
		want string
	}{
		{"view.units US", []string{"solve", us}, inFeet},
		{"--units US", []string{"solve", "--units", "US", si}, inFeet},
		{"view.units SI", []string{"solve", si}, inMetres},
		{"JSON, view.units US", []string{"solve", "--json", us}, inFeet},
		{"influence, view.units US", []string{"influence", us, "--quantity", "M", "--at", "10"}, inFeet},
	} {
		t.Run(c.name, func(t *testing.T) {
			_, out, stderr := runStave(t, c.args...)
			if c.args[1] != "--json" {
				if n := strings.Count(out, c.want); n == 0 {
					t.Errorf("stdout lacks %q (stderr %s):\n%s", c.want, stderr, out)
				}
				return
			}
			var d struct {
				Warnings []struct{ Code, Message string }
				Trains   []struct{ Train, Error string }
			}
			if err := json.Unmarshal([]byte(out), &d); err != nil {
				t.Fatalf("not JSON: %v", err)
			}
			var said []string
			for _, w := range d.Warnings {
				if w.Code == "train_not_placed" {
					said = append(said, w.Message)
				}
			}
			for _, tr := range d.Trains {
				if tr.Error != "" {
					said = append(said, tr.Error)
				}
			}
			if len(said) != 2 || !strings.Contains(said[0], c.want) || said[1] != c.want {
				t.Errorf("the finding and the train's error say %q, want %q", said, c.want)
			}
		})
	}
}
