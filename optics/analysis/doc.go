// Package analysis runs every computation raytable has on one bench and fills an optics.Report:
// media, paraxial system values in both planes and at every wavelength, table positions, the exact
// ray fans, the Gaussian beam, the breadboard placement and every warning.
//
// It is the one place that knows the order in which the other optics packages are called; the
// command line and the server call Run and nothing below it.
package analysis
