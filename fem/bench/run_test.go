package bench

import (
	"bytes"
	"encoding/json"
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"stave/fem/band"
)

// TestQuickRun runs every part at small sizes and checks that the report
// carries what the table and the JSON promise. It checks no timing.
func TestQuickRun(t *testing.T) {
	cfg := QuickConfig()
	var progressLog bytes.Buffer
	cfg.Progress = &progressLog
	r, err := Run(cfg)
	if err != nil {
		t.Fatal(err)
	}
	if progressLog.Len() == 0 {
		t.Error("no progress was written")
	}

	var text bytes.Buffer
	if err := r.WriteText(&text); err != nil {
		t.Fatal(err)
	}
	t.Logf("\n%s", text.String())
	lines := strings.Split(text.String(), "\n")
	for _, header := range []string{"model  elements", "Pbtrf+Pbtrs", "ratio"} {
		if !strings.Contains(text.String(), header) {
			t.Errorf("the text report has no header with %q", header)
		}
	}
	// One row per model and size in each of the three main tables.
	for _, model := range []string{"bar", "beam"} {
		for _, row := range r.Rows {
			if row.Model != model {
				continue
			}
			count := 0
			for _, l := range lines {
				f := strings.Fields(l)
				if len(f) > 1 && f[0] == model && f[1] == strconv.Itoa(row.Elements) {
					count++
				}
			}
			if count != 3 {
				t.Errorf("%s model, %d elements: %d text rows, want 3 (end to end, kernel and pipeline)", model, row.Elements, count)
			}
		}
	}
	if got, want := len(r.Rows), 2*len(cfg.Elements); got != want {
		t.Errorf("%d rows, want %d (two models × %d sizes)", got, want, len(cfg.Elements))
	}

	var js bytes.Buffer
	if err := r.WriteJSON(&js); err != nil {
		t.Fatal(err)
	}
	var decoded map[string]any
	if err := json.Unmarshal(js.Bytes(), &decoded); err != nil {
		t.Fatalf("the JSON report does not parse: %v", err)
	}
	keys := map[string]int{}
	collectKeys(decoded, keys)
	for _, want := range []string{
		"ours_to_pbtrf_pbtrs_ratio", "fem_solve_to_pbtrf_pbtrs_ratio", "ours_to_band_copy_ratio", "ours_to_dense_ratio",
		"band_cholesky_to_pbtrf_ratio", "scaling_exponent", "elements", "total_seconds",
		"peak_heap_bytes_per_element", "allocated_bytes_per_element", "cpus", "go_version",
		"band_bytes", "band_in_core_cache", "core_cache_bytes", "core_cache_source",
		"post_over_solve", "keypoint_exponent", "point_loads", "comparison_seconds", "shares",
	} {
		if keys[want] == 0 {
			t.Errorf("the JSON report has no key %q", want)
		}
	}
	if keys["scaling_exponent"] != len(benchModels) {
		t.Errorf("%d scaling exponents, want one per model", keys["scaling_exponent"])
	}

	for _, row := range r.Rows {
		if row.TotalSeconds <= 0 || row.OursSeconds <= 0 || row.GonumBandSeconds <= 0 || row.BandCopySeconds <= 0 || row.AllocatedBytesPerElement <= 0 {
			t.Errorf("%s model, %d elements: a measurement is missing: %+v", row.Model, row.Elements, row)
		}
		// At these sizes the systems are well conditioned, so fem, ours and
		// Pbtrs must agree; fem's answer also checks Assemble at run time.
		if ag := row.Agreement; !ag.Meaningful || !ag.Agree {
			t.Errorf("%s model, %d elements: Pbtrs's solution differs from ours by %.2g and from fem's by %.2g (tolerance %.2g, scaled condition %.2g)", row.Model, row.Elements, ag.Difference, ag.FemDifference, ag.Tolerance, ag.Condition)
		}
	}
	// The band's size and whether it fits the (quick configuration's
	// 16 KiB) core cache, row by row.
	if r.CoreCacheBytes != cfg.CoreCacheBytes || r.CoreCacheSource == "" {
		t.Errorf("core cache %d B from %q, want the configuration's %d B", r.CoreCacheBytes, r.CoreCacheSource, cfg.CoreCacheBytes)
	}
	for _, row := range r.Rows {
		if want := int64(8 * row.Unknowns * (row.HalfBandwidth + 1)); row.BandBytes != want {
			t.Errorf("%s model, %d elements: band of %d B, want 8·%d·%d = %d", row.Model, row.Elements, row.BandBytes, row.Unknowns, row.HalfBandwidth+1, want)
		}
		if in := row.BandBytes <= cfg.CoreCacheBytes; row.BandInCoreCache != in {
			t.Errorf("%s model, %d elements: band of %d B marked in the %d B cache: %v", row.Model, row.Elements, row.BandBytes, cfg.CoreCacheBytes, row.BandInCoreCache)
		}
	}
	for _, d := range r.Dense {
		if d.Difference > 1e-9 {
			t.Errorf("%s system of %d unknowns: ours and the dense solver differ by %.2g", d.Model, d.Unknowns, d.Difference)
		}
	}
	if o := r.Oversize; o == nil || !o.Refused || !strings.Contains(o.Message, "GB") {
		t.Errorf("fem.Solve on %d elements should refuse with a memory estimate, got %+v", cfg.OversizeElements, o)
	}
	// The pipeline: one row per model and size, every stage measured, the
	// shares adding up to the whole and post/solve what its stages say.
	if got, want := len(r.Pipeline), 2*len(cfg.Elements); got != want {
		t.Errorf("%d pipeline rows, want %d", got, want)
	}
	for _, row := range r.Pipeline {
		stages := []float64{row.LoadSeconds, row.MeshSeconds, row.SolveSeconds, row.ExactSeconds, row.WalkSeconds, row.OutputSeconds}
		shares := 0.0
		for i, v := range stages {
			if v <= 0 {
				t.Errorf("%s model, %d elements: stage %s not measured", row.Model, row.Elements, pipelineStages[i])
			}
			shares += row.Shares[pipelineStages[i]]
		}
		for i, v := range []float64{row.ExtremesSeconds, row.ComparisonSeconds, row.ChecksSeconds} {
			if v <= 0 {
				t.Errorf("%s model, %d elements: part %s of the walk not measured", row.Model, row.Elements, walkParts[i])
			}
		}
		if math.Abs(shares-1) > 1e-9 {
			t.Errorf("%s model, %d elements: shares add up to %.12f", row.Model, row.Elements, shares)
		}
		post := row.ExactSeconds + row.WalkSeconds + row.OutputSeconds
		if math.Abs(row.PostOverSolve-post/row.SolveSeconds) > 1e-9*row.PostOverSolve {
			t.Errorf("%s model, %d elements: post/solve %g, its stages give %g", row.Model, row.Elements, row.PostOverSolve, post/row.SolveSeconds)
		}
	}
	if len(r.KeyPoints) != len(cfg.KeyPointLoads) {
		t.Errorf("%d key-point rows, want %d", len(r.KeyPoints), len(cfg.KeyPointLoads))
	}
	for i, row := range r.KeyPoints {
		if row.PointLoads != cfg.KeyPointLoads[i] || row.TotalSeconds <= 0 || row.Elements < cfg.KeyPointElements/2 {
			t.Errorf("key-point row %d: %+v", i, row)
		}
	}
	if r.KeyPointExponent == 0 {
		t.Error("no key-point exponent was fitted")
	}
}

func collectKeys(v any, keys map[string]int) {
	switch v := v.(type) {
	case map[string]any:
		for k, x := range v {
			keys[k]++
			collectKeys(x, keys)
		}
	case []any:
		for _, x := range v {
			collectKeys(x, keys)
		}
	}
}

// A system band.LDL refuses (a free chain of springs: singular) is timed on
// the stand-in, its diagonal doubled, and the refusal is kept in the row;
// a system both factorize is timed as it is.
func TestKernelsFallBackToStandIn(t *testing.T) {
	cfg := QuickConfig()
	chain := func(n int, free bool) *System {
		a := band.NewSymmetric(n, 1)
		for i := range n - 1 {
			a.Data[2*i] += 1
			a.Data[2*i+2] += 1
			a.Data[2*i+1] = -1
		}
		if !free {
			a.Data[0] += 1 // one end held by a spring
		}
		b := make([]float64, n)
		b[n-1] = 1
		return &System{A: a, B: b}
	}
	for _, free := range []bool{false, true} {
		var row Row
		sys := chain(50, free)
		measureKernels(cfg, sys, nil, &row)
		wantSystem := map[bool]string{false: "model", true: "stand-in"}[free]
		if row.KernelSystem != wantSystem {
			t.Errorf("free %v: timed on %q, want %q", free, row.KernelSystem, wantSystem)
		}
		if free != (len(row.KernelFailures) > 0) {
			t.Errorf("free %v: refusals %q", free, row.KernelFailures)
		}
		if row.OursSeconds <= 0 || row.GonumBandSeconds <= 0 || row.OursToGonumRatio <= 0 {
			t.Errorf("free %v: kernels not timed: %+v", free, row)
		}
		if !row.Agreement.Agree || row.Agreement.FemCompared {
			t.Errorf("free %v: agreement %+v, want agreement without fem's answer", free, row.Agreement)
		}
	}
}

// The target on the multiple of a band copy covers only the rows whose band
// does not fit in a core's cache; the others are shown as "cache".
func TestCopyTargetLeavesOutBandsInCache(t *testing.T) {
	r := &Report{CoreCacheBytes: 2 << 20, CoreCacheSource: "test"}
	for _, c := range []struct {
		bytes int64
		ratio float64
	}{{1 << 20, 9}, {2 << 20, 8}, {3 << 20, 4.5}, {64 << 20, 3}} {
		r.Rows = append(r.Rows, Row{Model: "bar", Elements: int(c.bytes / 16), BandBytes: c.bytes, KernelSystem: "model",
			BandInCoreCache: c.bytes <= r.CoreCacheBytes, BandCopySeconds: 1e-3, OursToBandCopyRatio: c.ratio, OursToBandCopyPass: c.ratio <= targetBandCopyRatio})
	}
	var copyTarget *Target
	for _, tg := range targets(r, 0) {
		if strings.Contains(tg.Name, "copy of the band") {
			copyTarget = &tg
		}
	}
	// The rows of 1 and 2 MiB (ratios 9 and 8) fit; the worst of the others is 4.5.
	if copyTarget == nil || copyTarget.Measured != 4.5 || !copyTarget.Pass {
		t.Fatalf("copy target %+v, want the worst of the bands over 2 MiB, 4.5, passing", copyTarget)
	}
	// The ×copy verdict of each row of the kernel table: "cache" for the
	// two bands that fit, the ratio's own verdict for the others.
	var text bytes.Buffer
	if err := r.WriteText(&text); err != nil {
		t.Fatal(err)
	}
	want := map[string]string{"65536": "cache", "131072": "cache", "196608": "PASS", "4194304": "PASS"}
	seen := 0
	for _, l := range strings.Split(text.String(), "\n") {
		f := strings.Fields(l)
		if len(f) < 5 || f[0] != "bar" || f[4] != "model" {
			continue // not a row of the kernel table
		}
		seen++
		v := want[f[1]]
		if !slices.Contains(f, v) || v != "cache" && slices.Contains(f, "cache") {
			t.Errorf("kernel row %q: want %s as its ×copy verdict", l, v)
		}
	}
	if seen != len(want) {
		t.Errorf("found %d of the %d kernel rows in the text:\n%s", seen, len(want), text.String())
	}
}

// The sizes Linux writes under /sys/devices/system/cpu/cpu0/cache.
func TestParseCacheSize(t *testing.T) {
	for _, c := range []struct {
		in   string
		want int64
		ok   bool
	}{{"2048K\n", 2 << 20, true}, {"48K", 48 << 10, true}, {"1M", 1 << 20, true}, {"491520K", 480 << 20, true},
		{"", 0, false}, {"K", 0, false}, {"-4K", 0, false}, {"12Q", 0, false}} {
		got, ok := parseCacheSize(c.in)
		if got != c.want || ok != c.ok {
			t.Errorf("parseCacheSize(%q) = %d, %v; want %d, %v", c.in, got, ok, c.want, c.ok)
		}
	}
}

func TestMebibytes(t *testing.T) {
	for _, c := range []struct {
		n    int64
		want string
	}{{2 << 20, "2 MiB"}, {3 << 19, "1.5 MiB"}, {48 << 10, "48 KiB"}, {1000 << 10, "1000 KiB"}, {1 << 30, "1024 MiB"}, {1536, "1.5 KiB"}} {
		if got := mebibytes(c.n); got != c.want {
			t.Errorf("mebibytes(%d) = %q, want %q", c.n, got, c.want)
		}
	}
}
