package storage

import "bytes"

// indentJSON writes the compact JSON src to dst indented by two spaces, like
// json.Indent, except that an array holding only numbers, strings, booleans
// or nulls stays on one line: a load's points read as [x, intensity] pairs.
// src must be valid compact JSON, as json.Marshal produces.
func indentJSON(dst *bytes.Buffer, src []byte) {
	indentValue(dst, src, 0, 0)
}

// indentValue writes the value starting at src[i] and returns the index just past it.
func indentValue(dst *bytes.Buffer, src []byte, i, depth int) int {
	switch src[i] {
	case '{', '[':
		return indentContainer(dst, src, i, depth)
	case '"':
		end := stringEnd(src, i)
		dst.Write(src[i:end])
		return end
	}
	end := i
	for end < len(src) && !bytes.ContainsRune([]byte(",]}:"), rune(src[end])) {
		end++
	}
	dst.Write(src[i:end])
	return end
}

func indentContainer(dst *bytes.Buffer, src []byte, i, depth int) int {
	open, close := src[i], byte('}')
	if open == '[' {
		close = ']'
	}
	if src[i+1] == close {
		dst.Write(src[i : i+2])
		return i + 2
	}
	if open == '[' && scalarsOnly(src, i) {
		dst.WriteByte('[')
		i++
		for {
			i = indentValue(dst, src, i, depth)
			if src[i] == ']' {
				dst.WriteByte(']')
				return i + 1
			}
			dst.WriteString(", ")
			i++
		}
	}
	dst.WriteByte(open)
	i++
	for {
		newline(dst, depth+1)
		if open == '{' {
			i = indentValue(dst, src, i, depth+1) // the key
			dst.WriteString(": ")
			i++ // past ':'
		}
		i = indentValue(dst, src, i, depth+1)
		if src[i] == close {
			newline(dst, depth)
			dst.WriteByte(close)
			return i + 1
		}
		dst.WriteByte(',')
		i++
	}
}

// scalarsOnly reports whether the array at src[i] holds no arrays or objects.
func scalarsOnly(src []byte, i int) bool {
	for i++; src[i] != ']'; i++ {
		switch src[i] {
		case '[', '{':
			return false
		case '"':
			i = stringEnd(src, i) - 1
		}
	}
	return true
}

// stringEnd returns the index just past the string literal starting at src[i].
func stringEnd(src []byte, i int) int {
	for i++; src[i] != '"'; i++ {
		if src[i] == '\\' {
			i++
		}
	}
	return i + 1
}

func newline(dst *bytes.Buffer, depth int) {
	dst.WriteByte('\n')
	for range depth {
		dst.WriteString("  ")
	}
}
