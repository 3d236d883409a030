// Package diagram draws raytable's results as SVG: the side view (the unfolded optical path along z
// with the table-plane height y), the table view (the folded path on the breadboard seen from above)
// and the printable plan (the table view in millimetres, true size when printed at 100 %).
//
// It only turns computed numbers into pictures: millimetres to pixels, layout of labels, legends and
// scale bars. Every ray point, beam radius, position and warning comes from an optics.Report; the
// package never traces, refracts or propagates anything. The table view and the plan draw the
// report's board (optics.Board, laid out by optics/layout): the folded path, the beam's band, the
// element faces and the mount footprints come computed in table millimetres, and this package only
// frames them and sizes what it adds (strokes, the source arrow, labels, markers). Drawing a lens
// face as a circular arc from its radius and semi-diameter is geometry of the picture, not physics.
//
// Output is deterministic: coordinates are written with fixed decimals (one for pixel drawings, two
// for the plan), everything is drawn in slice order, never map order, and non-finite numbers are
// skipped before they reach the document. The drawings use no ids, no <style> and no script, so
// several of them can be inlined in one HTML page without clashing; the plot areas are clipped with
// nested <svg> viewports instead of clip paths.
//
// Text: the pinned svgo writes the content of <text> and <title> through encoding/xml's escaper, so
// labels (element ids, titles and warning messages are user input) are passed to it unescaped; the
// few attribute values that carry user text (aria-label) are escaped here with the same escaper
// (escapeAttr), which also replaces control characters XML forbids.
// Escaping twice would show "&lt;" to the reader, so each string is escaped exactly once.
//
// Groups carry class names (rays, paraxial, elements, beam, waists, holes, mounts, beam-path,
// beam-runs-on, warning-markers, hole-numbers, check-bar, cautions, cautions-text) so that tests
// and page CSS can find them; the drawings need no stylesheet.
//
// Shared scales: the compare page passes the larger of PathLengthMM and of SideMMPerPX of two
// reports as SideOptions.ZMaxMM and MMPerPX, and the larger TableMMPerPX as TableOptions.MMPerPX.
//
// Golden files live in testdata/golden; `go test ./web/diagram -update` rewrites them and a
// mismatch leaves a .actual file beside the golden one.
//
// Colours of wavelengths come from WavelengthColor, our own piecewise-linear approximation of the
// visible spectrum with dark tones outside it; see its comment.
package diagram
