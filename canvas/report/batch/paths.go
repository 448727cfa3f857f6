package batch

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
)

// Paths lists the model files args name, in order: a file as given (one
// that does not exist is reported in its line), a folder as the .json
// files directly in it, sorted by name, hidden ones left out. A folder that
// cannot be listed or holds no .json file is an error.
func Paths(args []string) ([]string, error) {
	var out []string
	for _, arg := range args {
		info, err := os.Stat(arg)
		if err != nil || !info.IsDir() {
			out = append(out, arg)
			continue
		}
		entries, err := os.ReadDir(arg) // sorted by name
		if err != nil {
			return nil, fmt.Errorf("cannot list the folder %s: %w", arg, err)
		}
		found := 0
		for _, e := range entries {
			name := e.Name()
			if e.IsDir() || strings.HasPrefix(name, ".") || !strings.EqualFold(filepath.Ext(name), ".json") {
				continue
			}
			out = append(out, filepath.Join(arg, name))
			found++
		}
		if found == 0 {
			return nil, fmt.Errorf("the folder %s holds no .json model file: name the files, or a folder that holds them", arg)
		}
	}
	return out, nil
}
