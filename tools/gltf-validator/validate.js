// Validates one .glb or .gltf file with the Khronos glTF validator and
// prints its report summary as JSON: {"errors": n, "warnings": n,
// "infos": n, "hints": n, "messages": [...]}. Exit code 0 when it ran.
// Usage: node validate.js FILE
const fs = require('fs');
const path = require('path');
const validator = require('gltf-validator');

const file = process.argv[2];
if (!file) {
  console.error('usage: node validate.js FILE');
  process.exit(2);
}
const data = new Uint8Array(fs.readFileSync(file));
validator.validateBytes(data, {
  uri: path.basename(file),
  maxIssues: 100,
  externalResourceFunction: (uri) => Promise.reject(new Error('external resources are not expected: ' + uri)),
}).then((report) => {
  const i = report.issues;
  console.log(JSON.stringify({
    errors: i.numErrors, warnings: i.numWarnings, infos: i.numInfos, hints: i.numHints,
    messages: i.messages.map((m) => `${m.severity} ${m.code} ${m.pointer || ''}: ${m.message}`),
  }));
}).catch((err) => {
  console.error('validator failed: ' + err);
  process.exit(1);
});
