// Command kitchen-meshes writes the demo's generated mesh props under
// assets/presets (run from the repository root: go run ./tools/kitchen-meshes).
package main

import (
	"fmt"
	"io"
	"os"

	"propflight/app/fsutil"
	"propflight/internal/kitchen"
)

func main() {
	const out = "assets/presets/ladle.obj"
	err := fsutil.WriteAtomic(out, func(w io.Writer) error {
		_, err := w.Write(kitchen.LadleOBJ())
		return err
	})
	if err != nil {
		fmt.Fprintln(os.Stderr, "kitchen-meshes:", err)
		os.Exit(1)
	}
	fmt.Println("wrote", out)
}
