package app

import (
	"image/color"

	"fyne.io/fyne/v2"
	"fyne.io/fyne/v2/container"
	"fyne.io/fyne/v2/theme"
	"fyne.io/fyne/v2/widget"
)

// compactTheme is fyne's default theme, the app's, with less padding, for the tool strip:
// with fyne's padding its tools and load cases run some 230 px below a
// laptop's 1280 × 720 screen. The text keeps its size.
type compactTheme struct{}

func (compactTheme) Color(n fyne.ThemeColorName, v fyne.ThemeVariant) color.Color {
	return theme.DefaultTheme().Color(n, v)
}
func (compactTheme) Font(s fyne.TextStyle) fyne.Resource     { return theme.DefaultTheme().Font(s) }
func (compactTheme) Icon(n fyne.ThemeIconName) fyne.Resource { return theme.DefaultTheme().Icon(n) }

func (compactTheme) Size(n fyne.ThemeSizeName) float32 {
	switch n {
	case theme.SizeNamePadding:
		return 2
	case theme.SizeNameInnerPadding:
		return 4
	}
	return theme.DefaultTheme().Size(n)
}

// compact shows o in the compact theme.
func compact(o fyne.CanvasObject) fyne.CanvasObject {
	return container.NewThemeOverride(o, compactTheme{})
}

// wideSelect lays a select out as wide as its widest option, up to most
// px, so the choice shown is not cut short: a select of fyne measures
// only its placeholder.
type wideSelect struct {
	sel  *widget.Select
	most float32
}

// fitOptions is s in a container as wide as its widest option, up to most px.
func fitOptions(s *escSelect, most float32) *fyne.Container {
	return container.New(wideSelect{&s.Select, most}, s)
}

func (l wideSelect) MinSize([]fyne.CanvasObject) fyne.Size {
	size := l.sel.MinSize()
	measure := func(s string) float32 { return fyne.MeasureText(s, theme.TextSize(), fyne.TextStyle{}).Width }
	chrome := size.Width - measure(l.sel.PlaceHolder)
	for _, o := range l.sel.Options {
		size.Width = max(size.Width, min(chrome+measure(o), l.most))
	}
	return size
}

func (l wideSelect) Layout(objects []fyne.CanvasObject, size fyne.Size) {
	objects[0].Resize(size)
}
