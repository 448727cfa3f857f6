package storage

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"time"
)

// Recovery is autosaved work found after Stave stopped without saving it.
type Recovery struct {
	Project *Project
	// Source is the project file the work belongs to; empty for a project
	// never saved.
	Source string
	// Written is when the autosave was made.
	Written time.Time
}

// recoveryFormat names the autosave wrapper; it holds a project file under "project".
const recoveryFormat = "stave-recovery"

type recoveryFile struct {
	Format  string          `json:"format"`
	Version int             `json:"version"`
	Source  string          `json:"source"`
	Written time.Time       `json:"written"`
	Project json.RawMessage `json:"project"`
}

// RecoveryPath is the autosave file in dir, the folder the application keeps
// its own state in.
func RecoveryPath(dir string) string { return filepath.Join(dir, "recovery.json") }

// WriteRecovery autosaves p into dir (creating dir if needed), noting the file
// it belongs to (source, "" if none) and the time. It replaces any earlier
// autosave atomically, so a crash while writing leaves the earlier one.
func WriteRecovery(dir string, p *Project, source string) error {
	project, err := Marshal(p)
	if err != nil {
		return err
	}
	var compact bytes.Buffer
	if err := json.Compact(&compact, project); err != nil {
		return fmt.Errorf("storage: cannot autosave: %w", err)
	}
	data, err := json.Marshal(recoveryFile{
		Format:  recoveryFormat,
		Version: Version,
		Source:  source,
		Written: time.Now().UTC(),
		Project: compact.Bytes(),
	})
	if err != nil {
		return fmt.Errorf("storage: cannot autosave: %w", err)
	}
	var out bytes.Buffer
	indentJSON(&out, data)
	out.WriteByte('\n')
	if err := os.MkdirAll(dir, 0o700); err != nil {
		return fmt.Errorf("cannot autosave: cannot create the folder %s: %w", dir, err)
	}
	return replaceData(RecoveryPath(dir), out.Bytes(), false)
}

// FindRecovery returns the autosave in dir, or nil if there is none. An
// autosave that cannot be read gives an error saying why; ClearRecovery
// removes it.
func FindRecovery(dir string) (*Recovery, error) {
	path := RecoveryPath(dir)
	data, err := readLimited(path)
	var tooLarge sizeError
	switch {
	case errors.Is(err, os.ErrNotExist):
		return nil, nil
	case errors.As(err, &tooLarge):
		return nil, fmt.Errorf("the autosave %s cannot be recovered: %w", path, err)
	case err != nil:
		return nil, fmt.Errorf("cannot read the autosave %s: %w", path, err)
	}
	var f recoveryFile
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&f); err != nil {
		return nil, fmt.Errorf("the autosave %s is damaged (%v); it cannot be recovered", path, err)
	}
	if f.Format != recoveryFormat {
		return nil, fmt.Errorf("%s is not a Stave autosave (format %q)", path, f.Format)
	}
	p, err := Unmarshal(f.Project)
	var le *LoadError
	if errors.As(err, &le) {
		le.File = path
	}
	if err != nil {
		return nil, err
	}
	return &Recovery{Project: p, Source: f.Source, Written: f.Written}, nil
}

// ClearRecovery removes the autosave in dir, if there is one.
func ClearRecovery(dir string) error {
	if err := os.Remove(RecoveryPath(dir)); err != nil && !errors.Is(err, os.ErrNotExist) {
		return fmt.Errorf("cannot remove the autosave: %w", err)
	}
	return nil
}
