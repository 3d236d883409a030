// Package view renders raytable's HTML pages with templ. It receives plain view models (strings,
// rows and ready SVG) built by the server, so the templates hold no arithmetic and no physics.
// Every component carries a data-testid attribute that the tests select by.
package view
