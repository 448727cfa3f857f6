package plainlocale

import "testing"

func TestPlain(t *testing.T) {
	for _, c := range []struct {
		env  map[string]string
		want bool
	}{
		{map[string]string{"LANG": "C.UTF-8"}, true},
		{map[string]string{"LANG": "POSIX.utf8"}, true},
		{map[string]string{"LC_ALL": "C.UTF-8", "LANG": "de_DE.UTF-8"}, true},
		{map[string]string{"LC_MESSAGES": "C@euro"}, true},
		{map[string]string{"LANG": "C"}, false}, // understood as it is
		{map[string]string{"LANG": "en_GB.UTF-8"}, false},
		{map[string]string{"LC_ALL": "fr_FR.UTF-8", "LANG": "C.UTF-8"}, false},
		{map[string]string{}, false},
	} {
		got := plain(effective(func(k string) string { return c.env[k] }))
		if got != c.want {
			t.Errorf("%v: plain = %v, want %v", c.env, got, c.want)
		}
	}
}
