//go:build windows

package main

import (
	"os"
	"syscall"
	"unsafe"
)

// stave.exe is a console program so that cmd.exe and PowerShell wait for its
// headless commands and show their output and exit status. Opened from
// Explorer, Windows gives it a console window of its own as well; that window
// is let go before the drawing window opens, so a double-click shows Stave
// alone (the console may flash for a moment).
func init() {
	args := os.Args[1:]
	if len(args) > 1 || len(args) == 1 && !isFile(args[0]) {
		return // a headless command: keep its console
	}
	kernel32 := syscall.NewLazyDLL("kernel32.dll")
	var processes [2]uint32
	attached, _, _ := kernel32.NewProc("GetConsoleProcessList").Call(
		uintptr(unsafe.Pointer(&processes[0])), uintptr(len(processes)))
	if attached == 1 { // no terminal shares the console: it was made for Stave alone
		kernel32.NewProc("FreeConsole").Call()
	}
}

// isFile reports whether path names an existing file (a model dropped on
// stave.exe or opened with it).
func isFile(path string) bool {
	info, err := os.Stat(path)
	return err == nil && info.Mode().IsRegular()
}
