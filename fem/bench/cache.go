package bench

import (
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
)

// assumedCoreCache stands in for a core's private cache where the operating
// system does not report it: 2 MiB, the second-level cache of a core of the
// development machine.
const assumedCoreCache = 2 << 20

// coreCache returns the size in bytes of the second-level (data or unified)
// cache of the first CPU, as Linux reports it under
// /sys/devices/system/cpu/cpu0/cache, and where the number came from;
// elsewhere it returns assumedCoreCache.
func coreCache() (int64, string) {
	const dir = "/sys/devices/system/cpu/cpu0/cache"
	entries, _ := filepath.Glob(filepath.Join(dir, "index*"))
	for _, e := range entries {
		level, errL := os.ReadFile(filepath.Join(e, "level"))
		kind, errT := os.ReadFile(filepath.Join(e, "type"))
		size, errS := os.ReadFile(filepath.Join(e, "size"))
		if errL != nil || errT != nil || errS != nil || strings.TrimSpace(string(level)) != "2" ||
			strings.TrimSpace(string(kind)) == "Instruction" {
			continue
		}
		if n, ok := parseCacheSize(string(size)); ok {
			return n, "level-2 cache of cpu0, " + dir
		}
	}
	return assumedCoreCache, "assumed; the operating system did not report it"
}

// parseCacheSize reads sysfs's cache size notation: "2048K", "48K", "1M".
func parseCacheSize(s string) (int64, bool) {
	s = strings.TrimSpace(s)
	unit := int64(1)
	switch {
	case strings.HasSuffix(s, "K"):
		unit, s = 1<<10, strings.TrimSuffix(s, "K")
	case strings.HasSuffix(s, "M"):
		unit, s = 1<<20, strings.TrimSuffix(s, "M")
	case strings.HasSuffix(s, "G"):
		unit, s = 1<<30, strings.TrimSuffix(s, "G")
	}
	n, err := strconv.ParseInt(s, 10, 64)
	if err != nil || n <= 0 {
		return 0, false
	}
	return n * unit, true
}

// mebibytes formats a byte count for the report: "2 MiB", "1.5 MiB", "48 KiB".
func mebibytes(n int64) string {
	unit, name := int64(1<<10), "KiB"
	if n >= 1<<20 {
		unit, name = 1<<20, "MiB"
	}
	if n%unit == 0 {
		return fmt.Sprintf("%d %s", n/unit, name)
	}
	return fmt.Sprintf("%.1f %s", float64(n)/float64(unit), name)
}
