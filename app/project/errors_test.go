package project

import (
	"errors"
	"fmt"
	"io/fs"
	"path/filepath"
	"strings"
	"testing"
)

// A valid part and a helper to build files around a part or a throw.
const okPart = `{"shape": "box", "size": [0.2, 0.1, 0.05], "mass": 2}`

func withParts(parts ...string) string {
	return `{"format": "propflight/v1", "prop": {"parts": [` + strings.Join(parts, ", ") + `]}}`
}

func withThrow(throw string) string {
	return `{"format": "propflight/v1", "prop": {"parts": [` + okPart + `]}, "throw": ` + throw + `}`
}

func withSpin(spin string) string { return withThrow(`{"spin": ` + spin + `}`) }

// errCase is one bad file and the exact message it must give. atParse says
// whether Parse must already refuse it (structure) or Build (values).
type errCase struct {
	name    string
	file    string
	want    string
	atParse bool
}

func runErrCases(t *testing.T, cases []errCase) {
	t.Helper()
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			doc, err := Parse("pan.json", []byte(c.file))
			stage := "Parse"
			if err == nil {
				if c.atParse {
					t.Fatalf("Parse accepted it; want %q", c.want)
				}
				stage = "Build"
				_, err = doc.Build()
			} else if !c.atParse {
				t.Logf("note: refused already at Parse")
			}
			if err == nil {
				t.Fatalf("no error; want %q", c.want)
			}
			var pe *Error
			if !errors.As(err, &pe) {
				t.Fatalf("%s error %T %q is not a *project.Error", stage, err, err)
			}
			if pe.File != "pan.json" {
				t.Errorf("File = %q", pe.File)
			}
			if got := err.Error(); got != c.want {
				t.Errorf("%s error\n got %s\nwant %s", stage, got, c.want)
			}
			if strings.ContainsAny(err.Error(), "\n\r") {
				t.Errorf("message is not one line: %q", err)
			}
		})
	}
}

func TestParse_SyntaxErrors(t *testing.T) {
	multi := "{\n  \"format\": \"propflight/v1\",\n  \"prop\": {\n    \"parts\": [}\n}"
	trailing := withParts(okPart) + " x"
	col := strings.LastIndexByte(trailing, 'x') + 1
	deep := `{"format": "propflight/v1", "name": ` + strings.Repeat("[", 100) + strings.Repeat("]", 100) + `}`
	runErrCases(t, []errCase{
		{"empty", "", `pan.json: the file is empty (a project file is a JSON object starting with "format": "propflight/v1")`, true},
		{"blank", " \n\t ", `pan.json: the file is empty (a project file is a JSON object starting with "format": "propflight/v1")`, true},
		{"missing colon", `{"format" "x"}`, `pan.json: line 1, column 11: invalid character '"' after object key`, true},
		{"line 4", multi, `pan.json: line 4, column 15: invalid character '}' looking for beginning of value`, true},
		{"unclosed", `{"format": "propflight/v1"`, `pan.json: line 1, column 26: unexpected end of file (a bracket or quote is not closed)`, true},
		{"unclosed string", "{\"format\": \"propfl", `pan.json: line 1, column 18: unexpected end of file (a bracket or quote is not closed)`, true},
		{"trailing garbage", trailing, fmt.Sprintf(`pan.json: line 1, column %d: invalid character 'x' looking for beginning of value`, col), true},
		{"second object", withParts(okPart) + "\n{}", `pan.json: line 2, column 1: unexpected "{" after the end of the project object`, true},
		{"columns count characters", "{\"name\": \"héé\" \"x\"}", `pan.json: line 1, column 16: invalid character '"' after object key:value pair`, true},
		{"array", `[1, 2]`, `pan.json: a project file must hold one JSON object, not an array`, true},
		{"string", `"propflight/v1"`, `pan.json: a project file must hold one JSON object, not a string`, true},
		{"too deep", deep, `pan.json: the file nests deeper than 64 levels`, true},
		{"NaN literal", `{"format": "propflight/v1", "x": NaN}`, `pan.json: line 1, column 34: invalid character 'N' looking for beginning of value`, true},
		{"comment", "{\"format\": \"propflight/v1\" // v1\n}", `pan.json: line 1, column 28: invalid character '/' after object key:value pair`, true},
	})
}

func TestParse_TopLevelErrors(t *testing.T) {
	runErrCases(t, []errCase{
		{"format missing", `{"prop": {}}`, `pan.json: format: missing: a project file starts with "format": "propflight/v1"`, true},
		{"format number", `{"format": 1}`, `pan.json: format: must be the string "propflight/v1"`, true},
		{"format other", `{"format": "propflight/v2"}`, `pan.json: format: "propflight/v2" is not a format this version reads (it reads "propflight/v1")`, true},
		{"format case", `{"format": "Propflight/V1"}`, `pan.json: format: "Propflight/V1" is not a format this version reads (it reads "propflight/v1")`, true},
		{"typo key", `{"format": "propflight/v1", "nmae": "x"}`, `pan.json: nmae: unknown field (did you mean "name"?)`, true},
		{"unknown key", `{"format": "propflight/v1", "colour": 1}`, `pan.json: colour: unknown field`, true},
		{"odd key quoted", `{"format": "propflight/v1", "a\nb": 1}`, `pan.json: "a\nb": unknown field`, true},
		{"duplicate", `{"format": "propflight/v1", "name": "a", "name": "b"}`, `pan.json: name: given twice`, true},
		{"name type", `{"format": "propflight/v1", "name": 5}`, `pan.json: name: must be a string`, true},
		{"prop missing", `{"format": "propflight/v1"}`, `pan.json: prop: missing: a project needs a prop with its parts`, true},
		{"prop type", `{"format": "propflight/v1", "prop": []}`, `pan.json: prop: must be an object`, true},
		{"prop unknown", `{"format": "propflight/v1", "prop": {"parts": [], "mass": 1}}`, `pan.json: prop.mass: unknown field (known: parts)`, true},
		{"parts missing", `{"format": "propflight/v1", "prop": {}}`, `pan.json: prop.parts: missing: a prop needs a list of parts`, true},
		{"parts type", `{"format": "propflight/v1", "prop": {"parts": {}}}`, `pan.json: prop.parts: must be an array of parts`, true},
		{"parts null", `{"format": "propflight/v1", "prop": {"parts": null}}`, `pan.json: prop.parts: must be an array of parts`, true},
		{"parts empty", withParts(), `pan.json: prop.parts: a prop needs at least one part`, false},
		{"part type", withParts(`5`), `pan.json: prop.parts[0]: must be an object`, true},
		{"second part type", withParts(okPart, `"box"`), `pan.json: prop.parts[1]: must be an object`, true},
	})
}

// Long: a table, one row a bad part field.
func TestParse_PartErrors(t *testing.T) {
	box := func(fields string) string {
		return withParts(`{"shape": "box", ` + fields + `}`)
	}
	runErrCases(t, []errCase{
		// shape
		{"shape missing", withParts(`{"size": [1, 1, 1], "mass": 1}`), `pan.json: prop.parts[0].shape: missing (one of box, cylinder, tube, sphere, shell, ellipsoid, cone, torus, mesh)`, true},
		{"shape type", withParts(`{"shape": 3, "mass": 1}`), `pan.json: prop.parts[0].shape: must be a string`, true},
		{"shape empty", withParts(`{"shape": "", "mass": 1}`), `pan.json: prop.parts[0].shape: must not be empty (one of box, cylinder, tube, sphere, shell, ellipsoid, cone, torus, mesh)`, true},
		{"shape unknown", withParts(`{"shape": "blob", "mass": 1}`), `pan.json: prop.parts[0].shape: "blob" is not a shape (use one of box, cylinder, tube, sphere, shell, ellipsoid, cone, torus, mesh)`, true},
		{"shape case", withParts(`{"shape": "Box", "size": [1, 1, 1], "mass": 1}`), `pan.json: prop.parts[0].shape: "Box" is not a shape (use one of box, cylinder, tube, sphere, shell, ellipsoid, cone, torus, mesh)`, true},
		// keys
		{"typo", box(`"sise": [1, 1, 1], "mass": 1`), `pan.json: prop.parts[0].sise: unknown field (did you mean "size"?)`, true},
		{"unknown", box(`"size": [1, 1, 1], "mass": 1, "colour": "red"`), `pan.json: prop.parts[0].colour: unknown field`, true},
		{"odd key", box(`"size": [1, 1, 1], "mass": 1, "a b": 1`), `pan.json: prop.parts[0]."a b": unknown field`, true},
		{"duplicate", box(`"size": [1, 1, 1], "mass": 1, "mass": 2`), `pan.json: prop.parts[0].mass: given twice`, true},
		{"name type", box(`"name": [], "size": [1, 1, 1], "mass": 1`), `pan.json: prop.parts[0].name: must be a string`, true},
		// fields of other shapes
		{"radius on box", box(`"size": [1, 1, 1], "radius": 1, "mass": 1`), `pan.json: prop.parts[0].radius: a box has no radius (it takes size)`, true},
		{"size on cylinder", withParts(okPart, `{"shape": "cylinder", "radius": 0.1, "length": 1, "size": [1, 1, 1], "mass": 1}`), `pan.json: prop.parts[1].size: a cylinder has no size (it takes radius and length)`, true},
		{"height on torus", withParts(`{"shape": "torus", "radius": 0.1, "tube_radius": 0.01, "height": 1, "mass": 1}`), `pan.json: prop.parts[0].height: a torus has no height (it takes radius and tube_radius)`, true},
		{"inner_radius on cylinder", withParts(`{"shape": "cylinder", "radius": 0.1, "inner_radius": 0.05, "length": 1, "mass": 1}`), `pan.json: prop.parts[0].inner_radius: a cylinder has no inner_radius (it takes radius and length)`, true},
		{"length on sphere", withParts(`{"shape": "sphere", "radius": 0.1, "length": 1, "mass": 1}`), `pan.json: prop.parts[0].length: a sphere has no length (it takes radius)`, true},
		{"semi_axes on shell", withParts(`{"shape": "shell", "radius": 0.1, "semi_axes": [1, 1, 1], "mass": 1}`), `pan.json: prop.parts[0].semi_axes: a shell has no semi_axes (it takes radius)`, true},
		{"tube_radius on cone", withParts(`{"shape": "cone", "radius": 0.1, "height": 0.2, "tube_radius": 0.01, "mass": 1}`), `pan.json: prop.parts[0].tube_radius: a cone has no tube_radius (it takes radius and height)`, true},
		{"radius on ellipsoid", withParts(`{"shape": "ellipsoid", "semi_axes": [1, 1, 1], "radius": 1, "mass": 1}`), `pan.json: prop.parts[0].radius: an ellipsoid has no radius (it takes semi_axes)`, true},
		// missing dimensions
		{"box size missing", box(`"mass": 1`), `pan.json: prop.parts[0].size: missing (a box needs size, in metres)`, true},
		{"cylinder length missing", withParts(`{"shape": "cylinder", "radius": 0.1, "mass": 1}`), `pan.json: prop.parts[0].length: missing (a cylinder needs radius and length, in metres)`, true},
		{"tube inner missing", withParts(`{"shape": "tube", "radius": 0.1, "length": 1, "mass": 1}`), `pan.json: prop.parts[0].inner_radius: missing (a tube needs radius, inner_radius and length, in metres)`, true},
		{"sphere radius missing", withParts(`{"shape": "sphere", "mass": 1}`), `pan.json: prop.parts[0].radius: missing (a sphere needs radius, in metres)`, true},
		{"ellipsoid missing", withParts(`{"shape": "ellipsoid", "mass": 1}`), `pan.json: prop.parts[0].semi_axes: missing (an ellipsoid needs semi_axes, in metres)`, true},
		{"cone height missing", withParts(`{"shape": "cone", "radius": 0.1, "mass": 1}`), `pan.json: prop.parts[0].height: missing (a cone needs radius and height, in metres)`, true},
		{"torus tube missing", withParts(`{"shape": "torus", "radius": 0.1, "mass": 1}`), `pan.json: prop.parts[0].tube_radius: missing (a torus needs radius and tube_radius, in metres)`, true},
		// size and semi_axes
		{"size short", box(`"size": [1, 2], "mass": 1`), `pan.json: prop.parts[0].size: must be an array of 3 numbers`, true},
		{"size long", box(`"size": [1, 2, 3, 4], "mass": 1`), `pan.json: prop.parts[0].size: must be an array of 3 numbers`, true},
		{"size string", box(`"size": "1,2,3", "mass": 1`), `pan.json: prop.parts[0].size: must be an array of 3 numbers`, true},
		{"size object", box(`"size": {"x": 1}, "mass": 1`), `pan.json: prop.parts[0].size: must be an array of 3 numbers`, true},
		{"size element string", box(`"size": [1, "2", 3], "mass": 1`), `pan.json: prop.parts[0].size[1]: must be a number`, true},
		{"size element NaN", box(`"size": [1, 1, "NaN"], "mass": 1`), `pan.json: prop.parts[0].size[2]: must be a number`, true},
		{"size element null", box(`"size": [1, null, 3], "mass": 1`), `pan.json: prop.parts[0].size[1]: must be a number`, true},
		{"size element huge", box(`"size": [1e400, 1, 1], "mass": 1`), `pan.json: prop.parts[0].size[0]: the number 1e400 is out of range`, true},
		{"size element -huge", box(`"size": [1, -1e309, 1], "mass": 1`), `pan.json: prop.parts[0].size[1]: the number -1e309 is out of range`, true},
		{"size negative", box(`"size": [0.2, 0.1, -0.05], "mass": 1`), `pan.json: prop.parts[0].size: must be positive`, false},
		{"size zero", box(`"size": [0, 0.1, 0.05], "mass": 1`), `pan.json: prop.parts[0].size: must be positive`, false},
		{"size too large", box(`"size": [1e5, 0.1, 0.05], "mass": 1`), `pan.json: prop.parts[0].size: must be at most 10000 m`, false},
		{"size too small", box(`"size": [1e-7, 0.1, 0.05], "mass": 1`), `pan.json: prop.parts[0].size: must be at least 1e-06 m`, false},
		{"size underflows", box(`"size": [1e-400, 0.1, 0.05], "mass": 1`), `pan.json: prop.parts[0].size: must be positive`, false},
		{"semi_axes short", withParts(`{"shape": "ellipsoid", "semi_axes": [1, 1], "mass": 1}`), `pan.json: prop.parts[0].semi_axes: must be an array of 3 numbers`, true},
		{"semi_axes negative", withParts(`{"shape": "ellipsoid", "semi_axes": [0.1, -0.1, 0.1], "mass": 1}`), `pan.json: prop.parts[0].semi_axes: must be positive`, false},
		// scalar dimensions
		{"radius negative", withParts(`{"shape": "sphere", "radius": -1, "mass": 1}`), `pan.json: prop.parts[0].radius: must be positive`, false},
		{"radius zero", withParts(`{"shape": "shell", "radius": 0, "mass": 1}`), `pan.json: prop.parts[0].radius: must be positive`, false},
		{"radius NaN string", withParts(`{"shape": "sphere", "radius": "NaN", "mass": 1}`), `pan.json: prop.parts[0].radius: must be a number`, true},
		{"radius Infinity string", withParts(`{"shape": "sphere", "radius": "Infinity", "mass": 1}`), `pan.json: prop.parts[0].radius: must be a number`, true},
		{"radius null", withParts(`{"shape": "sphere", "radius": null, "mass": 1}`), `pan.json: prop.parts[0].radius: must be a number`, true},
		{"radius bool", withParts(`{"shape": "sphere", "radius": true, "mass": 1}`), `pan.json: prop.parts[0].radius: must be a number`, true},
		{"radius array", withParts(`{"shape": "sphere", "radius": [1], "mass": 1}`), `pan.json: prop.parts[0].radius: must be a number`, true},
		{"radius too large", withParts(`{"shape": "sphere", "radius": 20000, "mass": 1}`), `pan.json: prop.parts[0].radius: must be at most 10000 m`, false},
		{"length zero", withParts(`{"shape": "cylinder", "radius": 0.1, "length": 0, "mass": 1}`), `pan.json: prop.parts[0].length: must be positive`, false},
		{"length string", withParts(`{"shape": "cylinder", "radius": 0.1, "length": "1m", "mass": 1}`), `pan.json: prop.parts[0].length: must be a number`, true},
		{"height negative", withParts(`{"shape": "cone", "radius": 0.1, "height": -0.1, "mass": 1}`), `pan.json: prop.parts[0].height: must be positive`, false},
		{"inner_radius negative", withParts(`{"shape": "tube", "radius": 0.05, "inner_radius": -0.01, "length": 1, "mass": 1}`), `pan.json: prop.parts[0].inner_radius: must be at least 0 and less than radius`, false},
		{"inner_radius too big", withParts(`{"shape": "tube", "radius": 0.05, "inner_radius": 0.06, "length": 1, "mass": 1}`), `pan.json: prop.parts[0].inner_radius: must be at least 0 and less than radius (0.05)`, false},
		{"inner_radius equal", withParts(`{"shape": "tube", "radius": 0.05, "inner_radius": 0.05, "length": 1, "mass": 1}`), `pan.json: prop.parts[0].inner_radius: must be at least 0 and less than radius (0.05)`, false},
		{"tube_radius too big", withParts(`{"shape": "torus", "radius": 0.1, "tube_radius": 0.2, "mass": 1}`), `pan.json: prop.parts[0].tube_radius: must be positive and at most radius (0.1)`, false},
		{"tube_radius zero", withParts(`{"shape": "torus", "radius": 0.1, "tube_radius": 0, "mass": 1}`), `pan.json: prop.parts[0].tube_radius: must be positive`, false},
		// mass and density
		{"mass negative", box(`"size": [1, 1, 1], "mass": -2`), `pan.json: prop.parts[0].mass: must be positive`, false},
		{"mass zero", box(`"size": [1, 1, 1], "mass": 0`), `pan.json: prop.parts[0].mass: must be positive`, false},
		{"mass string", box(`"size": [1, 1, 1], "mass": "2"`), `pan.json: prop.parts[0].mass: must be a number`, true},
		{"mass NaN string", box(`"size": [1, 1, 1], "mass": "NaN"`), `pan.json: prop.parts[0].mass: must be a number`, true},
		{"mass too large", box(`"size": [1, 1, 1], "mass": 1e7`), `pan.json: prop.parts[0].mass: must be at most 1e+06 kg`, false},
		{"mass too small", box(`"size": [1, 1, 1], "mass": 1e-9`), `pan.json: prop.parts[0].mass: must be at least 1e-06 kg`, false},
		{"mass huge literal", box(`"size": [1, 1, 1], "mass": 1` + strings.Repeat("0", 400)), `pan.json: prop.parts[0].mass: the number 1000000000000000000000000000000000000000... is out of range`, true},
		{"mass and density", box(`"size": [1, 1, 1], "mass": 1, "density": 1000`), `pan.json: prop.parts[0].mass: give mass or density, not both`, true},
		{"neither", box(`"size": [1, 1, 1]`), `pan.json: prop.parts[0].mass: missing: give mass (kg) or density (kg/m^3)`, true},
		{"second part neither", withParts(okPart, `{"shape": "sphere", "radius": 0.1}`), `pan.json: prop.parts[1].mass: missing: give mass (kg) or density (kg/m^3)`, true},
		{"density negative", box(`"size": [1, 1, 1], "density": -1`), `pan.json: prop.parts[0].density: must be positive`, false},
		{"density zero", box(`"size": [1, 1, 1], "density": 0`), `pan.json: prop.parts[0].density: must be positive`, false},
		{"density bool", box(`"size": [1, 1, 1], "density": false`), `pan.json: prop.parts[0].density: must be a number`, true},
		{"density too large", box(`"size": [1, 1, 1], "density": 1e6`), `pan.json: prop.parts[0].density: must be at most 100000 kg/m^3`, false},
		{"density gives too little", box(`"size": [0.01, 0.01, 0.01], "density": 0.5`), `pan.json: prop.parts[0].density: gives a mass of 5e-07 kg, outside 1e-06 to 1e+06 kg`, false},
		{"density gives too much", box(`"size": [1000, 1000, 10], "density": 1000`), `pan.json: prop.parts[0].density: gives a mass of 1e+10 kg, outside 1e-06 to 1e+06 kg`, false},
		{"density on shell", withParts(`{"shape": "shell", "radius": 0.1, "density": 100}`), `pan.json: prop.parts[0].density: a shell is thin and has no volume: give its mass instead`, false},
		// position and rotation
		{"position short", box(`"size": [1, 1, 1], "mass": 1, "position": [0, 0]`), `pan.json: prop.parts[0].position: must be an array of 3 numbers`, true},
		{"position element", box(`"size": [1, 1, 1], "mass": 1, "position": [0, 0, "up"]`), `pan.json: prop.parts[0].position[2]: must be a number`, true},
		{"position far", box(`"size": [1, 1, 1], "mass": 1, "position": [1e5, 0, 0]`), `pan.json: prop.parts[0].position: must be within +-10000 m`, false},
		{"rotation string", box(`"size": [1, 1, 1], "mass": 1, "rotation_deg": "90"`), `pan.json: prop.parts[0].rotation_deg: must be an array of 3 numbers`, true},
		{"rotation element", box(`"size": [1, 1, 1], "mass": 1, "rotation_deg": [90, 0, "x"]`), `pan.json: prop.parts[0].rotation_deg[2]: must be a number`, true},
		{"rotation long", box(`"size": [1, 1, 1], "mass": 1, "rotation_deg": [0, 0, 0, 0]`), `pan.json: prop.parts[0].rotation_deg: must be an array of 3 numbers`, true},
	})
}

func TestParse_ThrowErrors(t *testing.T) {
	runErrCases(t, []errCase{
		{"throw type", withThrow(`[]`), `pan.json: throw: must be an object`, true},
		{"throw unknown", withThrow(`{"velocity": [1, 2, 3]}`), `pan.json: throw.velocity: unknown field`, true},
		{"throw typo", withThrow(`{"gravty": 9.8}`), `pan.json: throw.gravty: unknown field (did you mean "gravity"?)`, true},
		{"throw duplicate", withThrow(`{"fps": 24, "fps": 25}`), `pan.json: throw.fps: given twice`, true},
		// fps
		{"fps bool", withThrow(`{"fps": true}`), `pan.json: throw.fps: must be a number or a string such as "24000/1001"`, true},
		{"fps array", withThrow(`{"fps": [24]}`), `pan.json: throw.fps: must be a number or a string such as "24000/1001"`, true},
		{"fps null", withThrow(`{"fps": null}`), `pan.json: throw.fps: must be a number or a string such as "24000/1001"`, true},
		{"fps empty", withThrow(`{"fps": ""}`), `pan.json: throw.fps: must not be empty: write a number or a string such as "24000/1001"`, true},
		{"fps huge literal", withThrow(`{"fps": 1e400}`), `pan.json: throw.fps: the number 1e400 is out of range`, true},
		{"fps negative", withThrow(`{"fps": -24}`), `pan.json: throw.fps: must be positive`, false},
		{"fps zero", withThrow(`{"fps": 0}`), `pan.json: throw.fps: must be positive`, false},
		{"fps word", withThrow(`{"fps": "abc"}`), `pan.json: throw.fps: must be a number or a ratio such as 24000/1001`, false},
		{"fps NaN string", withThrow(`{"fps": "NaN"}`), `pan.json: throw.fps: must be a number or a ratio such as 24000/1001`, false},
		{"fps Inf string", withThrow(`{"fps": "+Inf"}`), `pan.json: throw.fps: must be a number or a ratio such as 24000/1001`, false},
		{"fps zero denominator", withThrow(`{"fps": "24000/0"}`), `pan.json: throw.fps: must be positive`, false},
		{"fps negative string", withThrow(`{"fps": "-24"}`), `pan.json: throw.fps: must be positive`, false},
		{"fps too fast", withThrow(`{"fps": 20000}`), `pan.json: throw.fps: must be at most 10000 frames per second`, false},
		{"fps too slow", withThrow(`{"fps": 0.5}`), `pan.json: throw.fps: must be at least 1 frame per second`, false},
		{"fps ratio too slow", withThrow(`{"fps": "1/2"}`), `pan.json: throw.fps: must be at least 1 frame per second`, false},
		// gravity
		{"gravity negative", withThrow(`{"gravity": -9.8}`), `pan.json: throw.gravity: must be between 0.01 and 1000 m/s^2 (standard gravity is 9.80665)`, false},
		{"gravity zero", withThrow(`{"gravity": 0}`), `pan.json: throw.gravity: must be between 0.01 and 1000 m/s^2 (standard gravity is 9.80665)`, false},
		{"gravity huge", withThrow(`{"gravity": 1e5}`), `pan.json: throw.gravity: must be between 0.01 and 1000 m/s^2 (standard gravity is 9.80665)`, false},
		{"gravity string", withThrow(`{"gravity": "9.8"}`), `pan.json: throw.gravity: must be a number`, true},
		// release position and velocity
		{"position short", withThrow(`{"release_position": [0, 1]}`), `pan.json: throw.release_position: must be an array of 3 numbers`, true},
		{"position element", withThrow(`{"release_position": [0, true, 0]}`), `pan.json: throw.release_position[1]: must be a number`, true},
		{"position far", withThrow(`{"release_position": [0, 1e7, 0]}`), `pan.json: throw.release_position: must be within +-1e+06 m`, false},
		{"velocity object", withThrow(`{"release_velocity": {"x": 1}}`), `pan.json: throw.release_velocity: must be an array of 3 numbers`, true},
		{"velocity fast", withThrow(`{"release_velocity": [1e5, 0, 0]}`), `pan.json: throw.release_velocity: must be within +-10000 m/s`, false},
		{"velocity and hang", withThrow(`{"release_velocity": [1, 2, 0], "hang_time_s": 1}`), `pan.json: throw.hang_time_s: give release_velocity or hang_time_s, not both`, true},
		{"velocity and hang frames", withThrow(`{"release_velocity": [1, 2, 0], "hang_frames": 24}`), `pan.json: throw.hang_frames: give release_velocity or hang_frames, not both`, true},
		{"velocity and distance", withThrow(`{"release_velocity": [1, 2, 0], "distance": 1}`), `pan.json: throw.distance: goes with hang_time_s or hang_frames, not with release_velocity`, true},
		{"velocity and heading", withThrow(`{"release_velocity": [1, 2, 0], "heading_deg": 1}`), `pan.json: throw.heading_deg: goes with hang_time_s or hang_frames, not with release_velocity`, true},
		// hang
		{"hang both", withThrow(`{"hang_time_s": 1, "hang_frames": 24}`), `pan.json: throw.hang_frames: give hang_time_s or hang_frames, not both`, true},
		{"hang negative", withThrow(`{"hang_time_s": -1}`), `pan.json: throw.hang_time_s: must be positive and at most 600 s`, false},
		{"hang zero", withThrow(`{"hang_time_s": 0}`), `pan.json: throw.hang_time_s: must be positive and at most 600 s`, false},
		{"hang long", withThrow(`{"hang_time_s": 601}`), `pan.json: throw.hang_time_s: must be positive and at most 600 s`, false},
		{"hang string", withThrow(`{"hang_time_s": "1s"}`), `pan.json: throw.hang_time_s: must be a number`, true},
		{"hang frames zero", withThrow(`{"hang_frames": 0}`), `pan.json: throw.hang_frames: must be positive and at most 600 s of frames`, false},
		{"hang frames negative", withThrow(`{"fps": 24, "hang_frames": -3}`), `pan.json: throw.hang_frames: must be positive and at most 600 s of frames`, false},
		{"hang frames long", withThrow(`{"fps": 24, "hang_frames": 14401}`), `pan.json: throw.hang_frames: must be positive and at most 600 s of frames`, false},
		{"distance negative", withThrow(`{"hang_time_s": 1, "distance": -1}`), `pan.json: throw.distance: must be at least 0 and at most 1e+06 m`, false},
		{"distance string", withThrow(`{"hang_time_s": 1, "distance": "far"}`), `pan.json: throw.distance: must be a number`, true},
		{"distance alone", withThrow(`{"distance": 1}`), `pan.json: throw.distance: needs hang_time_s or hang_frames`, true},
		{"heading alone", withThrow(`{"heading_deg": 90}`), `pan.json: throw.heading_deg: needs hang_time_s or hang_frames`, true},
		{"heading string", withThrow(`{"hang_time_s": 1, "heading_deg": "north"}`), `pan.json: throw.heading_deg: must be a number`, true},
		{"distance too fast", withThrow(`{"hang_time_s": 0.1, "distance": 5e5}`), `pan.json: throw.distance: gives a release speed over 10000 m/s in 0.1 s`, false},
		// orientation and ground
		{"orientation short", withThrow(`{"orientation_deg": [1, 2]}`), `pan.json: throw.orientation_deg: must be an array of 3 numbers`, true},
		{"orientation element", withThrow(`{"orientation_deg": [1, 2, "3"]}`), `pan.json: throw.orientation_deg[2]: must be a number`, true},
		{"ground string", withThrow(`{"ground_y": "0"}`), `pan.json: throw.ground_y: must be a number`, true},
		{"ground far", withThrow(`{"ground_y": -1e7}`), `pan.json: throw.ground_y: must be within +-1e+06 m`, false},
	})
}

func TestParse_SpinErrors(t *testing.T) {
	runErrCases(t, []errCase{
		{"spin type", withThrow(`{"spin": "fast"}`), `pan.json: throw.spin: must be an object`, true},
		{"spin empty", withSpin(`{}`), `pan.json: throw.spin.turns_per_second: missing: give turns_per_second or frames_per_turn (leave out spin for none)`, true},
		{"spin unknown", withSpin(`{"rate": 2}`), `pan.json: throw.spin.rate: unknown field`, true},
		{"spin typo", withSpin(`{"axis": "least", "turns_per_secnd": 2}`), `pan.json: throw.spin.turns_per_secnd: unknown field (did you mean "turns_per_second"?)`, true},
		// axis
		{"axis name", withSpin(`{"axis": "diagonal", "turns_per_second": 2}`), `pan.json: throw.spin.axis: "diagonal" is not an axis (use least, middle, greatest or a vector [x, y, z])`, true},
		{"axis empty", withSpin(`{"axis": "", "turns_per_second": 2}`), `pan.json: throw.spin.axis: "" is not an axis (use least, middle, greatest or a vector [x, y, z])`, true},
		{"axis number", withSpin(`{"axis": 2, "turns_per_second": 2}`), `pan.json: throw.spin.axis: must be "least", "middle", "greatest" or a vector [x, y, z]`, true},
		{"axis short", withSpin(`{"axis": [1, 0], "turns_per_second": 2}`), `pan.json: throw.spin.axis: must be an array of 3 numbers`, true},
		{"axis element", withSpin(`{"axis": [1, 0, null], "turns_per_second": 2}`), `pan.json: throw.spin.axis[2]: must be a number`, true},
		{"axis zero", withSpin(`{"axis": [0, 0, 0], "turns_per_second": 2}`), `pan.json: throw.spin.axis: a vector axis must not be zero`, false},
		{"axis vector with tilt", withSpin(`{"axis": [1, 0, 0], "tilt_deg": 2, "turns_per_second": 2}`), `pan.json: throw.spin.tilt_deg: applies only to a named axis; tilt the vector itself instead`, true},
		{"axis vector with toward", withSpin(`{"axis": [1, 0, 0], "tilt_toward": "least", "turns_per_second": 2}`), `pan.json: throw.spin.tilt_toward: applies only to a named axis`, true},
		// tilt
		{"tilt range", withSpin(`{"axis": "middle", "tilt_deg": 200, "turns_per_second": 2}`), `pan.json: throw.spin.tilt_deg: must be between -180 and 180 degrees`, false},
		{"tilt range negative", withSpin(`{"axis": "middle", "tilt_deg": -181, "turns_per_second": 2}`), `pan.json: throw.spin.tilt_deg: must be between -180 and 180 degrees`, false},
		{"tilt string", withSpin(`{"axis": "middle", "tilt_deg": "2", "turns_per_second": 2}`), `pan.json: throw.spin.tilt_deg: must be a number`, true},
		{"toward name", withSpin(`{"axis": "middle", "tilt_toward": "up", "turns_per_second": 2}`), `pan.json: throw.spin.tilt_toward: "up" is not an axis (use least, middle or greatest)`, true},
		{"toward type", withSpin(`{"axis": "middle", "tilt_toward": 1, "turns_per_second": 2}`), `pan.json: throw.spin.tilt_toward: must be a string`, true},
		{"toward is axis", withSpin(`{"axis": "middle", "tilt_deg": 2, "tilt_toward": "middle", "turns_per_second": 2}`), `pan.json: throw.spin.tilt_toward: must name an axis other than the spin axis (middle)`, false},
		{"toward is default axis", withSpin(`{"tilt_toward": "greatest", "turns_per_second": 2}`), `pan.json: throw.spin.tilt_toward: must name an axis other than the spin axis (greatest)`, false},
		// rate
		{"turns negative", withSpin(`{"turns_per_second": -1}`), `pan.json: throw.spin.turns_per_second: must be zero or positive (reverse the axis to spin the other way)`, false},
		{"turns fast", withSpin(`{"turns_per_second": 2000}`), `pan.json: throw.spin.turns_per_second: must be at most 1000 turns per second`, false},
		{"turns string", withSpin(`{"turns_per_second": "2"}`), `pan.json: throw.spin.turns_per_second: must be a number`, true},
		{"turns huge literal", withSpin(`{"turns_per_second": -2e308}`), `pan.json: throw.spin.turns_per_second: the number -2e308 is out of range`, true},
		{"frames per turn zero", withSpin(`{"frames_per_turn": 0}`), `pan.json: throw.spin.frames_per_turn: must be positive`, false},
		{"frames per turn negative", withSpin(`{"frames_per_turn": -12}`), `pan.json: throw.spin.frames_per_turn: must be positive`, false},
		{"frames per turn fast", withSpin(`{"frames_per_turn": 0.01}`), `pan.json: throw.spin.frames_per_turn: gives 2400 turns per second at 24 fps, more than 1000`, false},
		{"frames per turn string", withSpin(`{"frames_per_turn": "12"}`), `pan.json: throw.spin.frames_per_turn: must be a number`, true},
		{"both rates", withSpin(`{"turns_per_second": 2, "frames_per_turn": 12}`), `pan.json: throw.spin.frames_per_turn: give turns_per_second or frames_per_turn, not both`, true},
	})
}

func TestError_Format(t *testing.T) {
	for _, c := range []struct {
		e    Error
		want string
	}{
		{Error{File: "pan.json", Field: "prop.parts[1].size", Msg: "must be positive"}, "pan.json: prop.parts[1].size: must be positive"},
		{Error{File: "pan.json", Line: 3, Column: 7, Msg: "bad"}, "pan.json: line 3, column 7: bad"},
		{Error{File: "pan.json", Msg: "no such file"}, "pan.json: no such file"},
		{Error{Field: "throw.fps", Msg: "must be positive"}, "throw.fps: must be positive"},
		{Error{Msg: "plain"}, "plain"},
	} {
		if got := c.e.Error(); got != c.want {
			t.Errorf("got %q, want %q", got, c.want)
		}
	}
}

func TestLoad_MissingFileKeepsErrNotExist(t *testing.T) {
	_, err := Load(filepath.Join(t.TempDir(), "nothing.json"))
	var pe *Error
	if !errors.As(err, &pe) {
		t.Fatalf("err = %v (%T), want *Error", err, err)
	}
	if !errors.Is(err, fs.ErrNotExist) {
		t.Errorf("errors.Is(%v, fs.ErrNotExist) = false", err)
	}
}

// TestBuild_ExtremeNumbersNamed: values whose derived numbers would print
// as +Inf (frames per turn of a denormal spin) or that break the velocity
// from a hang time (a heading of 1e308 degrees) are refused naming the
// field the file has.
func TestBuild_ExtremeNumbersNamed(t *testing.T) {
	for _, tt := range []struct{ throw, field string }{
		{`{"spin": {"turns_per_second": 5e-324}}`, "throw.spin.turns_per_second"},
		{`{"spin": {"turns_per_second": 1e-300}}`, "throw.spin.turns_per_second"},
		{`{"spin": {"frames_per_turn": 1e308}}`, "throw.spin.frames_per_turn"},
		{`{"hang_time_s": 1, "distance": 2, "heading_deg": 1e308}`, "throw.heading_deg"},
		{`{"hang_time_s": 1, "distance": 2, "heading_deg": -1e20}`, "throw.heading_deg"},
	} {
		doc, err := Parse("x.json", []byte(withThrow(tt.throw)))
		if err != nil {
			t.Fatalf("%s: %v", tt.throw, err)
		}
		_, err = doc.Build()
		var pe *Error
		if !errors.As(err, &pe) || pe.Field != tt.field {
			t.Errorf("%s: %v, want an error on %s", tt.throw, err, tt.field)
		}
	}
	// Ordinary slow spins and headings still build.
	for _, throw := range []string{`{"spin": {"turns_per_second": 0.01}}`, `{"spin": {"turns_per_second": 0}}`,
		`{"hang_time_s": 1, "distance": 2, "heading_deg": -270}`} {
		doc, err := Parse("x.json", []byte(withThrow(throw)))
		if err == nil {
			_, err = doc.Build()
		}
		if err != nil {
			t.Errorf("%s: %v", throw, err)
		}
	}
}

// TestBuild_Limits: the documented limits on the part count and on name
// lengths are refused naming the field, and the limits themselves pass.
func TestBuild_Limits(t *testing.T) {
	parts := func(n int) string {
		p := make([]string, n)
		for i := range p {
			p[i] = okPart
		}
		return withParts(p...)
	}
	named := func(name, partName string) string {
		return `{"format": "propflight/v1", "name": "` + name + `", "prop": {"parts": [{"name": "` + partName + `", "shape": "box", "size": [0.2, 0.1, 0.05], "mass": 2}]}}`
	}
	long := strings.Repeat("é", MaxNameLength+1)
	for _, tt := range []struct{ src, field string }{
		{parts(MaxParts + 1), "prop.parts"},
		{named(long, "head"), "name"},
		{named("pan", long), "prop.parts[0].name"},
	} {
		doc, err := Parse("x.json", []byte(tt.src))
		if err == nil {
			_, err = doc.Build()
		}
		var pe *Error
		if !errors.As(err, &pe) || pe.Field != tt.field || !strings.Contains(pe.Msg, "at most") {
			t.Errorf("%.60s...: %v, want a limit error on %s", tt.src, err, tt.field)
		}
	}
	for _, src := range []string{parts(MaxParts), named(strings.Repeat("é", MaxNameLength), strings.Repeat("é", MaxNameLength))} {
		doc, err := Parse("x.json", []byte(src))
		if err == nil {
			_, err = doc.Build()
		}
		if err != nil {
			t.Errorf("at the limit: %v", err)
		}
	}
}
