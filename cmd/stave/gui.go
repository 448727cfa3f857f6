package main

import "stave/app"

// openWindow opens the sketch-and-solve window on path, or on the demo model
// when path is empty, and returns when the window closes.
func openWindow(path string) error {
	return app.Run(path)
}
