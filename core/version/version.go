// Package version holds the tool's version, printed on every check sheet
// and given to the page by the bridge's "version" call: its one place.
// The README's "Release" line names the same release.
package version

// Version is the release of the tool.
const Version = "0.9.0"
