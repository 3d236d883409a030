// Package trace follows exact rays through the unfolded optical path (optics.Path): real
// ray-sphere intersections, the vector form of Snell's law at lens faces, reflection off flat,
// spherical and tilted mirrors, ideal thin lenses, and clipping at every clear aperture.
//
// Every surface has its own frame with the origin at its vertex and z along the axis the light
// leaves on; x is up and y lies in the table plane. Between surfaces the axis is straight. A
// mirror reflects all three axes (the usual unfolding), so heights stay continuous across it and
// the unfolded path always runs along +z; the real 3D reflection is computed in the incoming frame
// and then mapped into the leaving one.
//
// Each traced ray ends with a status from the optics package (ok, clipped, tir, missed), the
// surface where it stopped and a sentence that says why. Trace allocates nothing per ray when the
// caller's buffer is large enough, so a report can trace thousands of rays cheaply.
package trace
