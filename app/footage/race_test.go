//go:build race

package footage

// raceDetector is true in a test binary built with -race, whose shadow
// memory makes the resident size no measure of the program's own.
const raceDetector = true
