// Package assets embeds the files Propflight ships inside its binary: the
// demo presets, project files (format "propflight/v1") of the props of our
// own slapstick kitchen scene: a frying pan, a rolling pin, a dinner plate,
// a cutting board, a loaf and a ladle. The ladle is a mesh part whose file,
// "builtin:ladle.obj", is embedded too ([Mesh]); internal/kitchen generates
// it. Their sizes and masses are invented demo data, plausible for kitchen
// objects but never check values.
package assets
