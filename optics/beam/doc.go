// Package beam propagates a Gaussian laser beam (source.beam of the bench) along the unfolded
// optical path and checks the bench for laser-safety hazards.
//
// # Method
//
// The beam is described by its complex beam parameter q, 1/q = 1/R - i M²λ/(π w²), and carried
// through every gap and surface with the ABCD law q' = (Aq + B)/(Cq + D) (Kogelnik and Li, "Laser
// beams and resonators", Applied Optics 5, 1550 (1966)). Two choices make this fit the rest of
// raytable:
//
//   - Reduced form. The paraxial package writes its matrices for the ray (y, n·u). For those
//     reduced matrices the law holds for the reduced parameter q̂ = q/n, whose inverse is
//     1/q̂ = n/R - i M²λ₀/(π w²) with λ₀ the vacuum wavelength: the imaginary part does not
//     depend on the medium, so w follows from q̂ alone and R = n / Re(1/q̂). Inside a medium of
//     index n the beam's physical Rayleigh range is n·Im(q̂) at a waist. Every surface matrix is a
//     pure power and every gap a transfer d/n, taken from package paraxial unchanged.
//   - Embedded Gaussian. A real beam of quality M² behaves as a fundamental Gaussian whose
//     wavelength is M²λ (Siegman, Lasers, 1986, ch. 17). The law runs with M²λ, so every radius it
//     gives (w, waist radius) is the real beam's 1/e² radius; the Rayleigh range is π w0²/(M²λ).
//
// The tangential (table) and sagittal planes are propagated separately with their own q; they
// differ only behind tilted curved mirrors (Coddington powers, see paraxial.Power). The primary
// wavelength (the first of the bench) is used.
//
// # What Propagate reports
//
//   - One row per element (screens, apertures and dumps too): the beam arriving at its first face
//     and leaving its last, R per the formula above (nil at a waist), and the fraction its clear
//     apertures pass (the product over a lens's faces; 1 without a clear aperture). Rows after a
//     dump are still computed, as if the beam went on, but give no warnings.
//   - Every real waist in air from the source (a waist on the source plane included) to the last
//     element's last vertex. A waist on an element's plane belongs to the gap ending there; `after`
//     names the element before that gap. Waists inside an element's glass, virtual ones, those
//     upstream of the source and those beyond the last element are left out.
//   - The envelope at SampleCount+1 even steps plus every vertex, from the source to the last
//     vertex plus a tail of a tenth of the path (at least 10 mm; none after a final dump).
//
// Clipping does not change the beam downstream: the Gaussian model continues unchanged, and the
// beam-clipped warning says so.
//
// # Clipping
//
// The fraction of a Gaussian beam with 1/e² radii wx, wy that a centred circle of radius a passes
// is 1 - (2/π) ∫₀^{π/2} exp(-2a² / (wx² cos²φ + wy² sin²φ)) dφ; for a round beam this is
// 1 - exp(-2a²/w²). The integrand is smooth and periodic, so the trapezoidal rule converges
// exponentially (Trefethen and Weideman, "The exponentially convergent trapezoidal rule", SIAM
// Review 56, 385 (2014)); FractionInCircle doubles the node count until two estimates agree to
// 1e-12. A tilted mirror sees the footprint w_t / cos i in the tangential direction.
//
// # Safety
//
// SafetyWarnings works from the paraxial ray bundle of the source and needs no beam: ghost foci of
// the Fresnel back-reflections off every refracting face, and foci inside or next to glass.
// Propagate adds the same focus checks for the beam's own waists (a waist counts as a focus when
// the beam converges into it, so the source's own waist at the source plane does not), and
// clipping warnings (below PassFraction = 99 %, common practice), each with the clear diameter
// that would pass 99 %.
package beam
