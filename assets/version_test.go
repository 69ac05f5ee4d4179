package assets

import (
	"bytes"
	"image/png"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"testing"
)

// TestVersion_OnePlace: assets/VERSION is a Debian-valid upstream version
// (digits and dots; Debian Policy §5.6.12 allows more, we need no more) and
// FyneApp.toml, which fyne package reads, says the same.
func TestVersion_OnePlace(t *testing.T) {
	if !regexp.MustCompile(`^[0-9]+\.[0-9]+\.[0-9]+$`).MatchString(Version) {
		t.Fatalf("VERSION %q is not MAJOR.MINOR.PATCH", Version)
	}
	toml, err := os.ReadFile(filepath.Join("..", "FyneApp.toml"))
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`(?m)^Version\s*=\s*"([^"]*)"`).FindSubmatch(toml)
	if m == nil || string(m[1]) != Version {
		t.Errorf("FyneApp.toml Version %q, assets/VERSION %q: make them agree", m, Version)
	}
	icon := regexp.MustCompile(`(?m)^Icon\s*=\s*"([^"]*)"`).FindSubmatch(toml)
	if icon == nil {
		t.Fatal("FyneApp.toml has no Icon (fyne package needs one)")
	}
	if _, err := os.Stat(filepath.Join("..", string(icon[1]))); err != nil {
		t.Errorf("FyneApp.toml Icon: %v", err)
	}
}

// TestIcon_HicolorSizes: every PNG under icon/png is a square image of the
// size its name says (the freedesktop Icon Theme Specification's
// NNxNN/apps folders), and Icon is the 256 one.
func TestIcon_HicolorSizes(t *testing.T) {
	for _, s := range []int{16, 22, 24, 32, 48, 64, 128, 256, 512} {
		data, err := os.ReadFile(filepath.Join("icon", "png", strconv.Itoa(s)+".png"))
		if err != nil {
			t.Fatal(err)
		}
		cfg, err := png.DecodeConfig(bytes.NewReader(data))
		if err != nil || cfg.Width != s || cfg.Height != s {
			t.Errorf("%d.png: %dx%d, %v", s, cfg.Width, cfg.Height, err)
		}
		if s == 256 && !bytes.Equal(data, Icon) {
			t.Error("Icon is not icon/png/256.png")
		}
	}
}
