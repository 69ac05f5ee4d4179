package cli

import (
	"strings"
	"testing"
)

// TestRun_FitExtremeOptionsRefused: an option so large or small that the
// fit's derived numbers overflow, underflow or leave physical ranges is
// refused with exit 2 naming the flag the user gave, never printed as
// +Inf, NaN or 0 fps.
func TestRun_FitExtremeOptionsRefused(t *testing.T) {
	p := writeRef6Marks(t, t.TempDir())
	for _, tt := range []struct {
		args []string
		flag string
	}{
		{[]string{"--fps", "24", "--scale", "1e308"}, "--scale"},
		{[]string{"--fps", "24", "--scale", "1e-320"}, "--scale"},
		{[]string{"--gravity", "9.8", "--scale", "1e308"}, "--scale"},
		{[]string{"--gravity", "9.8", "--scale", "1e308", "--json"}, "--scale"},
		{[]string{"--fps", "24", "--gravity", "1e308"}, "--gravity"},
		{[]string{"--fps", "24", "--gravity", "5e-324"}, "--gravity"},
		{[]string{"--fps", "1e300", "--gravity", "9.8"}, "--fps"},
	} {
		code, out, errs := run(t, append([]string{"fit", p}, tt.args...)...)
		if code != ExitInput || out != "" || !strings.Contains(errs, tt.flag) {
			t.Errorf("%v: exit %d, stderr %q, stdout:\n%s", tt.args, code, errs, out)
		}
		for _, bad := range []string{"Inf", "NaN"} {
			if strings.Contains(out+errs, bad) {
				t.Errorf("%v prints %s:\n%s%s", tt.args, bad, out, errs)
			}
		}
	}
	// Ordinary values still work.
	if code, _, errs := run(t, "fit", p, "--fps", "24", "--scale", "0.002"); code != ExitOK {
		t.Errorf("ordinary scale: exit %d: %s", code, errs)
	}
}
