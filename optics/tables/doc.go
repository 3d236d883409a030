// Package tables lays a report out once as tables of numbers: sections with a title, columns
// with a head and a unit, and rows of cells that carry a value and its named precision. The
// command line writes them as aligned text, the bench page as HTML tables and the compare page
// pairs the cells of two reports by name; none of them builds rows of its own.
//
// Layouts differ in wording and in a few rows, and the model says so where it happens instead of
// keeping three lists: a Words value holds the page's, the text report's and the compare page's
// wording side by side, a Layout set on a row or column says where it appears, and each layout
// has a profile that writes a cell's precision (Cell.In). Arrangement gives each layout's order of
// sections.
//
// Like the rest of optics it is pure computation: no I/O, nothing about HTML or terminals.
package tables
