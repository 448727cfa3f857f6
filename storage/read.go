package storage

import (
	"bytes"
	"fmt"
	"io"
	"io/fs"
	"os"
)

// MaxFileSize is the largest project file Stave reads and writes, in bytes.
// A member's file is a few kilobytes (testdata/demo.json is under 4 kB), a
// measured load profile of 100,000 points about 5 MiB; the limit keeps a
// stray large file from taking the memory of the machine (reading 8 MiB
// takes about 100 MiB and under a second), and Save refuses a project
// whose file would pass it, so Stave never writes what it will not read.
const MaxFileSize = 8 << 20

// sizeError refuses a file larger than MaxFileSize.
type sizeError struct{ size int64 }

func (e sizeError) Error() string {
	return fmt.Sprintf("the file is %s, more than the %s a Stave project file may be (a member's file is a few kilobytes)", describeSize(e.size), describeSize(MaxFileSize))
}

// problem is the refusal of a project file this large.
func (e sizeError) problem() Problem {
	return Problem{Message: e.Error() + ", so it is not a Stave project or it is damaged; open the file Stave saved, or its .bak backup"}
}

// oversize is the refusal to write a project whose file would be size
// bytes, more than MaxFileSize.
func oversize(size int) Problem {
	return Problem{Message: fmt.Sprintf("the file would be %s, more than the %s a project file may be; remove loads or load points, or shorten the notes", describeSize(int64(size)), describeSize(MaxFileSize))}
}

func describeSize(n int64) string {
	if n < 1<<20 {
		return fmt.Sprintf("%d bytes", n)
	}
	return fmt.Sprintf("%.1f MiB (%d bytes)", float64(n)/(1<<20), n)
}

// readLimited reads the file at path, or returns a sizeError without reading
// it when it is larger than MaxFileSize. The read itself stops one byte past
// the limit, for files that grow or do not tell their size. Folders, pipes
// and devices are refused before opening: reading one may never end.
func readLimited(path string) ([]byte, error) {
	info, err := os.Stat(path)
	if err != nil {
		return nil, err
	}
	if !info.Mode().IsRegular() {
		return nil, fmt.Errorf("it is %s, not a file; choose a project file", describeKind(info.Mode()))
	}
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	if info, err := f.Stat(); err == nil && info.Size() > MaxFileSize {
		return nil, sizeError{info.Size()}
	}
	data, err := io.ReadAll(io.LimitReader(f, MaxFileSize+1))
	if err != nil {
		return nil, err
	}
	if len(data) > MaxFileSize {
		return nil, sizeError{int64(len(data))}
	}
	return data, nil
}

func describeKind(mode fs.FileMode) string {
	switch {
	case mode.IsDir():
		return "a folder"
	case mode&fs.ModeNamedPipe != 0:
		return "a named pipe"
	case mode&fs.ModeSocket != 0:
		return "a socket"
	case mode&fs.ModeDevice != 0:
		return "a device"
	}
	return "something other than a file"
}

// utf8BOM is the byte-order mark some editors put at the start of UTF-8
// text. It says nothing a UTF-8 file needs, so the loader skips it.
var utf8BOM = []byte{0xef, 0xbb, 0xbf}

// textEncoding names the encoding of data when it is UTF-16 or UTF-32 text,
// which a project file must not be, from its byte-order mark or, without
// one, from the zero bytes that such text puts around the ASCII character
// every JSON text starts with (RFC 8259 §8.1 asks for UTF-8; the pattern is
// the one of RFC 4627 §3). It returns "" for anything else.
func textEncoding(data []byte) string {
	switch {
	case bytes.HasPrefix(data, []byte{0, 0, 0xfe, 0xff}), bytes.HasPrefix(data, []byte{0xff, 0xfe, 0, 0}):
		return "UTF-32"
	case bytes.HasPrefix(data, []byte{0xfe, 0xff}), bytes.HasPrefix(data, []byte{0xff, 0xfe}):
		return "UTF-16"
	case len(data) < 4:
		return ""
	case data[0] == 0 && data[1] == 0 && data[2] == 0 && data[3] != 0,
		data[0] != 0 && data[1] == 0 && data[2] == 0 && data[3] == 0:
		return "UTF-32"
	case data[0] == 0 && data[1] != 0 && data[2] == 0 && data[3] != 0,
		data[0] != 0 && data[1] == 0 && data[2] != 0 && data[3] == 0:
		return "UTF-16"
	}
	return ""
}
