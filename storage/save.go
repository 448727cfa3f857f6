package storage

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
)

// Load reads the project file at path. On any problem it returns nil and an
// error; problems with the content, and a file larger than MaxFileSize, come
// as a *LoadError naming the file.
func Load(path string) (*Project, error) {
	data, err := readLimited(path)
	var tooLarge sizeError
	if errors.As(err, &tooLarge) {
		return nil, &LoadError{File: path, Problems: []Problem{tooLarge.problem()}}
	}
	if err != nil {
		return nil, fmt.Errorf("cannot open %s: %w", path, err)
	}
	p, err := Unmarshal(data)
	var le *LoadError
	if errors.As(err, &le) {
		le.File = path
	}
	return p, err
}

// Save writes p to path so that a failure at any step leaves the previous
// file as it was: the data goes to a temporary file in the same folder, which
// is synced to disk; the previous file, if any, is kept as path + ".bak"; the
// temporary file is renamed over path, and the folder is synced so that the
// rename itself survives a power cut.
func Save(path string, p *Project) error {
	data, err := Marshal(p)
	if err != nil {
		return err
	}
	return replaceFile(path, data, true)
}

// BackupPath is where Save keeps the previous version of the file at path.
func BackupPath(path string) string { return path + ".bak" }

// writeData writes the new content into the temporary file. It is a variable
// so that tests can make writing fail half way.
var writeData = func(w io.Writer, data []byte) error {
	_, err := w.Write(data)
	return err
}

// replaceFile puts data at path atomically, keeping the old file as a backup
// when asked.
func replaceFile(path string, data []byte, backup bool) (err error) {
	fail := func(step string, err error) error {
		return fmt.Errorf("cannot save %s: %s: %w; the previous file is unchanged", path, step, err)
	}
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".*.tmp")
	if err != nil {
		return fail("cannot create a temporary file in "+dir, err)
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	mode := os.FileMode(0o644)
	if info, statErr := os.Stat(path); statErr == nil {
		mode = info.Mode().Perm()
	}
	if err := writeData(tmp, data); err != nil {
		return fail("writing failed", err)
	}
	if err := tmp.Chmod(mode); err != nil {
		return fail("cannot set the file's permissions", err)
	}
	if err := tmp.Sync(); err != nil {
		return fail("cannot flush the data to disk", err)
	}
	if err := tmp.Close(); err != nil {
		return fail("cannot close the temporary file", err)
	}
	if backup {
		if err := keepBackup(path); err != nil {
			return fail("cannot keep the previous file as "+BackupPath(path), err)
		}
	}
	if err := os.Rename(tmp.Name(), path); err != nil {
		return fail("cannot move the new file into place", err)
	}
	if err := syncDir(dir); err != nil {
		return fmt.Errorf("saved %s, but the folder could not be flushed to disk (%w); the save may not survive a power cut", path, err)
	}
	return nil
}

// keepBackup makes path + ".bak" a hard link to the current file, so the file
// itself stays in place until the new one replaces it. Where links are not
// possible it copies the file instead.
func keepBackup(path string) error {
	if _, err := os.Lstat(path); errors.Is(err, os.ErrNotExist) {
		return nil // a new file has nothing to keep
	}
	bak := BackupPath(path)
	if err := os.Remove(bak); err != nil && !errors.Is(err, os.ErrNotExist) {
		return err
	}
	if os.Link(path, bak) == nil {
		return nil
	}
	old, err := os.ReadFile(path)
	if err != nil {
		return err
	}
	return replaceFile(bak, old, false)
}

func syncDir(dir string) error {
	if runtime.GOOS == "windows" {
		return nil // Windows cannot open a folder for syncing; its renames are durable once done
	}
	d, err := os.Open(dir)
	if err != nil {
		return err
	}
	defer d.Close()
	return d.Sync()
}
