package locale

import (
	"os"
	"testing"
)

func TestFix(t *testing.T) {
	for _, tc := range []struct{ in, want string }{
		{"C", "en_US.UTF-8"}, {"C.UTF-8", "en_US.UTF-8"}, {"POSIX", "en_US.UTF-8"},
		{"de_DE.UTF-8", "de_DE.UTF-8"}, {"", ""},
	} {
		t.Setenv("LANG", tc.in)
		os.Unsetenv("LC_ALL")
		os.Unsetenv("LC_MESSAGES")
		Fix()
		if got := os.Getenv("LANG"); got != tc.want {
			t.Errorf("LANG=%q -> %q, want %q", tc.in, got, tc.want)
		}
	}
}
