package storage

import (
	"cmp"
	"reflect"
	"slices"
	"strconv"
	"strings"
)

// topKeys ranks the keys at the top of a file in the order Stave writes
// them (fileProject's fields).
var topKeys = func() map[string]int {
	t := reflect.TypeFor[fileProject]()
	rank := make(map[string]int, t.NumField())
	for i := range t.NumField() {
		name, _, _ := strings.Cut(t.Field(i).Tag.Get("json"), ",")
		rank[name] = i
	}
	return rank
}()

// inFileOrder sorts problems into the order of their places in the file, so
// that a user reads them top to bottom beside it: by top-level key, in the
// order Stave writes them (an unknown key after the known ones, the file
// as a whole last), then by the first two list positions on the path
// (loads[3] after loads[1] whatever their kinds; cases[1].loads[0] after
// cases[1].name). Problems at one place keep the order they were found in.
func inFileOrder(problems []Problem) {
	slices.SortStableFunc(problems, func(a, b Problem) int {
		ka, kb := placeKey(a.Path), placeKey(b.Path)
		return cmp.Or(cmp.Compare(ka[0], kb[0]), cmp.Compare(ka[1], kb[1]), cmp.Compare(ka[2], kb[2]))
	})
}

// placeKey is the rank of path's top-level key and its first two list
// positions (-1 where it has fewer).
func placeKey(path string) [3]int {
	if path == "" {
		return [3]int{len(topKeys) + 1, -1, -1}
	}
	key := [3]int{len(topKeys), -1, -1}
	top := path[:strings.IndexAny(path+".", ".[")]
	if r, ok := topKeys[top]; ok {
		key[0] = r
	}
	rest := path[len(top):]
	for i := 1; i < len(key); i++ {
		open := strings.IndexByte(rest, '[')
		if open < 0 {
			break
		}
		n, after, ok := strings.Cut(rest[open+1:], "]")
		index, err := strconv.Atoi(n)
		if !ok || err != nil {
			break
		}
		key[i], rest = index, after
	}
	return key
}
