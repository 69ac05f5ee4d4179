// Package project reads, checks and writes Propflight project files
// (format "propflight/v1", DESIGN.md "Contracts") and turns them into the
// physics package's prop and throw.
//
// A [Document] mirrors the file in the user's own units and choices:
// degrees, turns per second or frames per turn, a frame rate written as a
// number or as a string such as "24000/1001", mass or density, a release
// velocity or a hang time with a distance and heading, a named spin axis
// or a vector. Optional fields are pointers, nil when the file leaves them
// out, so that [Load] then [Save] writes back what the user wrote and no
// defaults they never chose.
//
// [Document.Build] applies the defaults, converts to SI units and radians
// (world +Y up, metres, kilograms, seconds) and validates everything,
// giving a [Scene] ready for physics.Judge and physics.Simulate.
//
// The optional top-level "footage" object ([Footage]) names reference
// footage and holds the user's marks on it, in the footage's image pixels
// (origin top left, y down). Its path is relative to the project file's
// folder ([Document.FootageDir], [Document.SetFootagePath]); Build checks
// its values but the scene does not use it. Files without it load and save
// exactly as before.
//
// Every problem is an [*Error] naming the file and the field as written in
// the project file, for example
//
//	pan.json: prop.parts[1].size: must be positive
//	pan.json: line 4, column 17: invalid character '}' after object key
//
// Parse checks the file's syntax, types, keys and required fields; Build
// checks the values. Files larger than [MaxFileSize] are refused.
package project
