package assets

import (
	_ "embed"
	"strings"
)

//go:embed VERSION
var versionFile string

// Version is Propflight's version, the one place it is written
// (assets/VERSION): "propflight --version", the About box, FyneApp.toml
// (checked by a test), the Debian archive and "make install" all read it.
var Version = strings.TrimSpace(versionFile)

// Icon is the program's icon, 256 x 256 pixels (PNG), rendered from
// assets/icon/propflight.svg by scripts/render-icons.sh.
//
//go:embed icon/png/256.png
var Icon []byte
