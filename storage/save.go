package storage

import (
	"bufio"
	"errors"
	"fmt"
	"hash/fnv"
	"io"
	"io/fs"
	"math/rand/v2"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"syscall"
	"time"
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

// Save writes p to path so that a failure at any step, or the program
// stopping between two steps, leaves the previous file as it was: the data
// goes to a temporary file in the same folder, which is synced to disk; the
// previous file, if any, is kept as path + ".bak"; the temporary file is
// renamed over path, and the folder is synced so that the rename itself
// survives a power cut. When path is a symbolic link, the file it points to
// is replaced and the link kept.
func Save(path string, p *Project) error {
	data, err := Marshal(p)
	if err != nil {
		return err
	}
	if len(data) > MaxFileSize {
		return &SaveError{Problems: []Problem{oversize(len(data))}}
	}
	return replaceData(path, data, true)
}

// WriteFile puts at path what write writes, the way Save puts a project
// there but keeping no backup: the bytes go through a buffer to a temporary
// file in the same folder, so a product of any size is never held in
// memory, and that file is renamed over path only once write has returned
// without error, so a failure at any step leaves the previous file, if
// any, as it was and no other file behind.
func WriteFile(path string, write func(io.Writer) error) error {
	return replaceFile(path, func(w io.Writer) error {
		buf := bufio.NewWriterSize(w, 1<<20)
		if err := write(buf); err != nil {
			return err
		}
		return buf.Flush()
	}, false)
}

// BackupPath is where Save keeps the previous version of the file at path
// (of the file it points to, when path is a symbolic link).
func BackupPath(path string) string { return path + ".bak" }

// writeData writes the new content into the temporary file. It is a variable
// so that tests can make writing fail half way.
var writeData = func(w io.Writer, data []byte) error {
	_, err := w.Write(data)
	return err
}

// replaceData puts data at path atomically, keeping the old file as a
// backup when asked.
func replaceData(path string, data []byte, backup bool) error {
	return replaceFile(path, func(w io.Writer) error { return writeData(w, data) }, backup)
}

// replaceFile puts what write writes at path atomically, keeping the old
// file as a backup when asked.
func replaceFile(path string, write func(io.Writer) error, backup bool) (err error) {
	target, err := followLinks(path)
	if err != nil {
		return fmt.Errorf("cannot save %s: %w; the previous file is unchanged", path, err)
	}
	shown := path
	if target != path {
		shown = fmt.Sprintf("%s (the file the link %s points to)", target, path)
	}
	fail := func(step string, err error) error {
		return fmt.Errorf("cannot save %s: %s: %w; the previous file is unchanged", shown, step, err)
	}
	// Renaming over a pipe, a device or a folder would put a file in its
	// place: run by root, an export to a link to /dev/full replaced the
	// device with a regular file.
	if info, err := os.Stat(target); err == nil && !info.Mode().IsRegular() {
		return fmt.Errorf("cannot save %s: it is %s, not a file, and is left as it is: choose a file name", shown, describeKind(info.Mode()))
	}
	dir, base := filepath.Dir(target), filepath.Base(target)
	removeStaleTemporaries(dir, base)
	var tmp *os.File
	tmpName, err := newTemporary(dir, base, func(name string) (err error) {
		// 0666 lets the umask decide the permissions of a new file.
		tmp, err = os.OpenFile(name, os.O_RDWR|os.O_CREATE|os.O_EXCL, 0o666)
		return err
	})
	if err != nil {
		return fail("cannot create a temporary file in "+dir, err)
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmpName)
		}
	}()
	if err := write(tmp); err != nil {
		return fail("writing failed", err)
	}
	if info, statErr := os.Stat(target); statErr == nil {
		if err := tmp.Chmod(info.Mode().Perm()); err != nil {
			return fail("cannot give the new file the permissions of the previous one", err)
		}
	}
	if err := tmp.Sync(); err != nil {
		return fail("cannot flush the data to disk", err)
	}
	if err := tmp.Close(); err != nil {
		return fail("cannot close the temporary file", err)
	}
	if backup {
		if err := keepBackup(target); err != nil {
			return fail("cannot keep the previous file as "+BackupPath(target), err)
		}
	}
	if err := os.Rename(tmpName, target); err != nil {
		return fail("cannot move the new file into place", err)
	}
	if err := syncDir(dir); err != nil {
		return fmt.Errorf("saved %s, but the folder could not be flushed to disk (%w); the save may not survive a power cut", shown, err)
	}
	return nil
}

// maxLinks is how many symbolic links followLinks follows, as many as Linux does.
const maxLinks = 40

// followLinks returns the file path names once symbolic links are followed;
// the file need not exist. Only the last element of a path needs following:
// a rename inside a linked folder happens in the folder linked to.
func followLinks(path string) (string, error) {
	for range maxLinks {
		info, err := os.Lstat(path)
		if err != nil || info.Mode()&fs.ModeSymlink == 0 {
			return path, nil // a missing file is created; other errors show when writing
		}
		to, err := os.Readlink(path)
		if err != nil {
			return "", err
		}
		if !filepath.IsAbs(to) {
			// Relative to the link's real folder, where ".." leads.
			dir, err := filepath.EvalSymlinks(filepath.Dir(path))
			if err != nil {
				return "", err
			}
			to = filepath.Join(dir, to)
		}
		path = to
	}
	return "", fmt.Errorf("it leads through more than %d symbolic links; make the link point straight at the file", maxLinks)
}

// keepBackup makes path + ".bak" a hard link to the current file, so the file
// itself stays in place until the new one replaces it. The link is made
// under a temporary name and renamed over the old backup, so that there is
// a backup at every instant. Where links are not possible it copies the
// file instead, just as atomically.
func keepBackup(path string) error {
	current, err := os.Lstat(path)
	if errors.Is(err, fs.ErrNotExist) {
		return nil // a new file has nothing to keep
	}
	bak := BackupPath(path)
	if kept, err := os.Lstat(bak); err == nil && os.SameFile(current, kept) {
		// A save stopped after keeping the backup. Renaming another link of
		// the same file over it would do nothing and leave the link behind.
		return nil
	}
	dir, base := filepath.Dir(bak), filepath.Base(bak)
	removeStaleTemporaries(dir, base)
	link, err := newTemporary(dir, base, func(name string) error { return os.Link(path, name) })
	if err == nil {
		if err := os.Rename(link, bak); err != nil {
			os.Remove(link)
			return err
		}
		return nil
	}
	old, err := os.ReadFile(path)
	if err != nil {
		return err
	}
	return replaceData(bak, old, false)
}

// Temporary files are named ".NAME.HOST-PID-RANDOM.tmp": the file they will
// become, a hash of the machine's name, the process writing them and a
// random number. Stave versions before this naming used ".NAME.RANDOM.tmp".
const temporarySuffix = ".tmp"

// staleAfter is how long after its last write any temporary file of Stave's
// is taken as abandoned. Writing one takes well under a second.
const staleAfter = 15 * time.Minute

var (
	// hostTag tells this machine's temporary files from those other
	// machines write into a shared folder.
	hostTag = func() string {
		name, _ := os.Hostname()
		h := fnv.New32a()
		h.Write([]byte(name))
		return fmt.Sprintf("%08x", h.Sum32())
	}()
	ownTag = hostTag + "-" + strconv.Itoa(os.Getpid()) + "-"
)

// newTemporary calls create with a fresh temporary name in dir for the file
// base until create no longer finds that name taken; it returns that name.
func newTemporary(dir, base string, create func(name string) error) (string, error) {
	for {
		name := filepath.Join(dir, "."+base+"."+ownTag+strconv.FormatUint(uint64(rand.Uint32()), 10)+temporarySuffix)
		err := create(name)
		if !errors.Is(err, fs.ErrExist) {
			return name, err
		}
	}
}

// removeStaleTemporaries removes the temporary files that saves of the file
// base in dir left behind when they were stopped: those untouched for
// staleAfter, and those whose writing process on this machine has ended.
// Another Stave's temporary file in the middle of a save is left alone.
func removeStaleTemporaries(dir, base string) {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return // the save itself reports an unreadable folder
	}
	for _, e := range entries {
		pid, ok := temporaryOf(e.Name(), base)
		if !ok || !e.Type().IsRegular() {
			continue
		}
		info, err := e.Info()
		if err != nil {
			continue
		}
		if time.Since(info.ModTime()) > staleAfter || pid > 0 && processEnded(pid) {
			os.Remove(filepath.Join(dir, e.Name()))
		}
	}
}

// temporaryOf reports whether name is a temporary file of a save of the file
// base, and the process that wrote it when that process ran on this machine
// (otherwise 0).
func temporaryOf(name, base string) (pid int, ok bool) {
	middle, found := strings.CutPrefix(name, "."+base+".")
	if middle, found = strings.CutSuffix(middle, temporarySuffix); !found {
		return 0, false
	}
	parts := strings.Split(middle, "-")
	if len(parts) == 1 { // the older naming, ".NAME.RANDOM.tmp"
		return 0, digitsOnly(parts[0])
	}
	if len(parts) != 3 || len(parts[0]) != len(hostTag) || strings.Trim(parts[0], "0123456789abcdef") != "" || !digitsOnly(parts[1]) || !digitsOnly(parts[2]) {
		return 0, false
	}
	if parts[0] != hostTag {
		return 0, true
	}
	pid, err := strconv.Atoi(parts[1])
	return pid, err == nil
}

func digitsOnly(s string) bool {
	return s != "" && strings.Trim(s, "0123456789") == ""
}

// processEnded reports whether the process pid is known to have ended. Where
// the system cannot tell (Windows), it reports false and only age counts.
func processEnded(pid int) bool {
	p, err := os.FindProcess(pid)
	if err != nil {
		return false
	}
	defer p.Release()
	return errors.Is(p.Signal(syscall.Signal(0)), os.ErrProcessDone)
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
