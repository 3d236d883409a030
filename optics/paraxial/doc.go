// Package paraxial computes first-order (paraxial) optics of an unfolded path: ray traces in the
// reduced-angle convention, the system (ABCD) matrix, cardinal points, the aperture stop, pupils,
// f-number, image-side numerical aperture and the Lagrange invariant.
//
// A paraxial ray is (y, n·u): its height in mm and its slope u = dy/dz multiplied by the index of
// the medium it travels in. Each surface is one matrix [1 0; -P 1] of power P at its vertex, each
// gap one transfer [1 d/n; 0 1], so every matrix and every product has determinant 1 and the
// Lagrange invariant is conserved exactly in exact arithmetic. Mirrors are unfolded: heights
// continue across a mirror and a concave mirror acts as a positive lens.
//
// The tangential plane is the table plane; the sagittal plane is vertical. They differ only at
// tilted curved mirrors (Coddington), so every function takes the plane to compute in.
//
// Signs follow the report conventions: distances are signed along the unfolded path, positive
// downstream; C = -power; the EFL is 1/power; the BFL runs from the last vertex to the rear focal
// point; the FFL from the front focal point to the first vertex (positive when the focus is
// upstream); principal and nodal points are measured from the first vertex (front) and the last
// vertex (rear).
package paraxial
