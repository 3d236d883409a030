// Package optics is raytable's domain: the bench model that users write (elements along a beam on a
// breadboard), its decoding and validation, the unfolded optical path built from it, and the report
// types that every computation fills in.
//
// The bench file's keys are tables: the fields of every object (fields.go), the element types
// (kinds.go) and the source kinds (source_kinds.go). Decoding, validation, Diff and the edits
// (edit.go) read them, and so do clients such as the web form.
//
// It is pure computation: no files, no network, no HTTP or HTML. Sub-packages do the physics:
// material (refractive indices), paraxial (ABCD traces and cardinal points), trace (exact Snell
// trace), beam (Gaussian beams), layout (table positions, hole grid, mounts) and analysis (which
// runs them all and fills a Report).
//
// Units: lengths in millimetres, wavelengths in nanometres, angles in degrees at the interface and
// radians inside computations. Field names carry their unit (gap_mm, wavelength_nm, turn_deg).
package optics
