// Package storage reads and writes Stave project files.
//
// A project file is UTF-8 JSON in Stave's own "stave-member" format. It holds
// one Project: the notes that identify the work, the member model (fem.Model,
// in SI base units) and the display settings (View). Every value in a file is
// in SI base units, and the file says so in its "units" declaration, which the
// loader checks; conversion to other units happens only for display.
//
// The pieces fit together as follows:
//
//   - Marshal writes a Project as canonical JSON: keys in a fixed order, two
//     spaces of indentation, optional empty values left out, a trailing
//     newline. Reading and writing again gives the same bytes.
//   - Unmarshal parses strictly (unknown keys, wrong types, duplicate keys are
//     problems), migrates files of older format versions, refuses newer ones,
//     and checks the whole model. It reports every problem at once in a
//     *LoadError whose entries name the place in the file ("loads[3].points[1]").
//     A failed read returns no Project. Files beyond the limits of
//     docs/format.md (size, nesting, encoding, texts) are refused the same
//     way, before they can take the memory or the stack. Validate runs the
//     same checks on a Project in memory, so the application can warn
//     before a save.
//   - Save writes atomically: a temporary file in the same folder, synced,
//     then the previous file kept as NAME.bak and the new one renamed into
//     place. A failure at any step, or a kill between two, leaves the
//     previous file as it was and a backup in place. Saving through a
//     symbolic link replaces the file it points to; temporary files that
//     killed saves left behind are removed by later saves.
//   - WriteRecovery, FindRecovery and ClearRecovery keep an autosaved copy of
//     unsaved work in a folder chosen by the application.
//
// docs/format.md describes the format for people.
package storage
