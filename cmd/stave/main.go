// Command stave is a placeholder while the build cache warms up.
package main

import (
	"fyne.io/fyne/v2/app"
	"fyne.io/fyne/v2/widget"
	_ "fyne.io/fyne/v2/test"
	_ "github.com/sqweek/dialog"
	_ "gonum.org/v1/gonum/mat"
	_ "gonum.org/v1/plot/vg/vgimg"
	_ "gonum.org/v1/plot/vg/vgpdf"
	_ "gonum.org/v1/plot/vg/vgsvg"
	_ "gonum.org/v1/plot"
)

func main() {
	a := app.New()
	w := a.NewWindow("Stave")
	w.SetContent(widget.NewLabel("Stave"))
	w.ShowAndRun()
}
