// Package static holds the page's own files: one style sheet (screen and print) and one small
// hand-written script. They are embedded in the binary and served under /static/.
package static

import "embed"

// Files holds raytable.css and raytable.js.
//
//go:embed raytable.css raytable.js
var Files embed.FS
