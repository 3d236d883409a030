// Package view renders raytable's HTML pages with templ and builds what they show. The plain Go
// files beside the templates turn computed results into view models: the numbers panel
// (numbers.go), the rows of the compare table (compare_rows.go), the sizes and vertical
// exaggeration of the drawings (result.go, exaggeration.go). The templates receive those models
// (strings, rows and ready SVG) and hold no arithmetic and no physics. Every component carries a
// data-testid attribute that the tests select by.
package view
