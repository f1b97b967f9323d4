// Package version holds the tool's version, printed on every check sheet
// and given to the page by the bridge's "version" call: its one place.
package version

// Version is the tool's version.
const Version = "0.1.0-dev"
