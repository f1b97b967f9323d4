// Package version holds the tool's version, printed on every check sheet.
// wasm/bridge.Version must be the same (a test there checks it).
package version

// Version is the tool's version.
const Version = "0.1.0-dev"
