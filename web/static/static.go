// Package static holds the page's own files: one style sheet (screen and print), one small
// hand-written script and the page icon. They are embedded in the binary and served under /static/.
package static

import "embed"

// Files holds raytable.css, raytable.js and icon.svg, the page icon.
//
//go:embed raytable.css raytable.js icon.svg
var Files embed.FS
