package optics

import (
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"
)

func ptr[T any](v T) *T { return &v }

// TestValidateNonFinite sets NaN and Inf where a web form could put them; JSON cannot carry them,
// so only Validate on a struct sees them.
func TestValidateNonFinite(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	b := fixture(t)
	b.WavelengthsNM[1] = nan
	b.Table.WidthMM = inf
	b.Source.HeadingDeg = nan
	b.Source.FieldAnglesDeg[1] = -inf
	b.Source.Beam.M2 = ptr(nan)
	b.Elements[0].GapMM = nan
	b.Elements[0].FacesMM[0] = ptr(inf)
	b.Elements[2].ThicknessesMM[0] = nan
	b.Elements[3].TurnDeg = ptr(nan)
	b.Elements[5].FocalMM = ptr(-inf)
	b.Elements[7].WidthMM = ptr(nan)
	b.Materials = map[string]MaterialSpec{"gel": {Index: ptr(nan)}}

	err := Validate(b)
	want := []string{
		"wavelengths_nm[1]", "table.width_mm", "source.heading_deg", "source.field_angles_deg[1]", "source.beam.m2",
		"materials.gel.index", "elements[0].gap_mm", "elements[0].faces_mm[0]", "elements[2].thicknesses_mm[0]",
		"elements[3].turn_deg", "elements[5].focal_mm", "elements[7].width_mm",
	}
	if got := paths(err); !reflect.DeepEqual(got, want) {
		t.Errorf("problem paths\n got %q\nwant %q\n%v", got, want, err)
	}
	for _, p := range ErrorProblems(err) {
		if !strings.HasPrefix(p.Message, "must be a finite number, got ") {
			t.Errorf("%s: message %q does not say the number is not finite", p.Path, p.Message)
		}
	}
}

// TestValidateTinyLengths: a length like 1e-300 mm passes "> 0" but overflows every 1/x that
// follows (power, curvature, Rayleigh range); it is rejected like a huge one.
func TestValidateTinyLengths(t *testing.T) {
	b := fixture(t)
	b.Elements[5].FocalMM = ptr(1e-300)
	b.Source.Beam.WaistRadiusMM = 1e-320
	b.Elements[2].ThicknessesMM[0] = 5e-7
	err := Validate(b)
	want := []string{"source.beam.waist_radius_mm", "elements[2].thicknesses_mm[0]", "elements[5].focal_mm"}
	if got := paths(err); !reflect.DeepEqual(got, want) {
		t.Errorf("problem paths\n got %q\nwant %q\n%v", got, want, err)
	}
	for _, p := range ErrorProblems(err) {
		if !strings.Contains(p.Message, "too small") {
			t.Errorf("%s: message %q does not say the length is too small", p.Path, p.Message)
		}
	}
	b = fixture(t)
	b.Elements[2].ThicknessesMM[0] = MinLengthMM // exactly the floor is accepted by this rule
	for _, p := range ErrorProblems(Validate(b)) {
		if strings.Contains(p.Message, "too small") {
			t.Errorf("%s: %s", p.Path, p.Message)
		}
	}
}

func TestValidateTooManyElements(t *testing.T) {
	b := fixture(t)
	b.Elements = nil
	for i := range MaxElements + 1 {
		b.Elements = append(b.Elements, Element{ID: fmt.Sprintf("A%d", i), Type: TypeAperture, GapMM: 1})
	}
	err := Validate(b)
	if got := paths(err); !reflect.DeepEqual(got, []string{"elements"}) {
		t.Fatalf("201 elements: paths %q, want [elements]\n%v", got, err)
	}
	if msg := ErrorProblems(err)[0].Message; msg != "has 201 elements; at most 200 are allowed" {
		t.Errorf("message %q", msg)
	}
	b.Elements = b.Elements[:MaxElements]
	if err := Validate(b); err != nil {
		t.Errorf("200 elements are allowed: %v", err)
	}
}

// TestSag checks the rationalised sag form against the textbook one, R − sign(R)·√(R² − h²)
// (sphere geometry, common practice), including a hemisphere (h = |R|, sag = R). Where h ≪ |R| the
// textbook form loses digits to cancellation, so there the reference is its binomial series
// h²/(2R) + h⁴/(8R³), whose next term h⁶/(16R⁵) is far below rounding.
func TestSag(t *testing.T) {
	const tol = 1e-12 // relative; both references are exact up to rounding
	for _, c := range []struct{ r, h float64 }{{20, 12.7}, {-20, 12.7}, {51.5, 12.7}, {10, 10}, {-10, 10}} {
		want := c.r - math.Copysign(math.Sqrt(c.r*c.r-c.h*c.h), c.r)
		if got := sag(&c.r, c.h); math.Abs(got-want) > tol*math.Abs(want) {
			t.Errorf("sag(R=%g, h=%g) = %.15g, want %.15g", c.r, c.h, got, want)
		}
	}
	for _, c := range []struct{ r, h float64 }{{-1000, 0.001}, {1e5, 0.5}} {
		want := c.h*c.h/(2*c.r) + math.Pow(c.h, 4)/(8*math.Pow(c.r, 3))
		if got := sag(&c.r, c.h); math.Abs(got-want) > tol*math.Abs(want) {
			t.Errorf("sag(R=%g, h=%g) = %.15g, want series %.15g", c.r, c.h, got, want)
		}
	}
	if got := sag(nil, 5); got != 0 {
		t.Errorf("flat face sag = %g, want 0", got)
	}
}

// TestValidateEdgeThickness puts the centre thickness just above and just below the value at which
// the two faces of a lens meet at the rim of the clear aperture: t0 = s1(h) − s2(h), the difference
// of the face sags at the clear-aperture radius (sphere geometry, common practice).
func TestValidateEdgeThickness(t *testing.T) {
	const margin = 1e-6 // relative step around the limit
	cases := []struct {
		name   string
		r1, r2 *float64
		semi   float64
	}{
		{"equi-convex R 20 at D 25.4", ptr(20.0), ptr(-20.0), 12.7},
		{"plano-convex R 11.4 at D 12.7", ptr(11.4), nil, 6.35},
		{"meniscus R 30 / R 60 at D 40", ptr(30.0), ptr(60.0), 20},
	}
	for _, c := range cases {
		sagAt := func(r *float64) float64 {
			if r == nil {
				return 0
			}
			return *r - math.Copysign(math.Sqrt(*r**r-c.semi*c.semi), *r)
		}
		t0 := sagAt(c.r1) - sagAt(c.r2)
		for _, tc := range []struct {
			t  float64
			ok bool
		}{{t0 * (1 + margin), true}, {t0 * (1 - margin), false}} {
			b := fixture(t)
			b.Elements = []Element{{ID: "L1", Type: TypeLens, GapMM: 10, FacesMM: []*float64{c.r1, c.r2},
				ThicknessesMM: []float64{tc.t}, Materials: []string{"fused-silica"}, DiameterMM: ptr(2 * c.semi)}}
			err := Validate(b)
			if (err == nil) != tc.ok {
				t.Errorf("%s, thickness %.9g (limit %.9g): error %v, want ok=%v", c.name, tc.t, t0, err, tc.ok)
			}
			if !tc.ok && !reflect.DeepEqual(paths(err), []string{"elements[0].thicknesses_mm[0]"}) {
				t.Errorf("%s: paths %q", c.name, paths(err))
			}
		}
	}
}

// TestValidateNoDiameterIntersection: without a clear aperture, two spheres that cross before the
// smaller one ends are rejected. A biconvex lens R 10 / -10 has sags 10 and -10 at h = 10, so its
// faces meet there unless the centre is thicker than 2R = 20 mm (sphere geometry, common practice).
func TestValidateNoDiameterIntersection(t *testing.T) {
	for _, c := range []struct {
		t  float64
		ok bool
	}{{19.99, false}, {20.01, true}} {
		b := fixture(t)
		b.Elements = []Element{{ID: "B1", Type: TypeLens, FacesMM: []*float64{ptr(10.0), ptr(-10.0)},
			ThicknessesMM: []float64{c.t}, Materials: []string{"sapphire-o"}}}
		if err := Validate(b); (err == nil) != c.ok {
			t.Errorf("thickness %g: error %v, want ok=%v", c.t, err, c.ok)
		}
	}
	// A biconcave lens never meets itself, however thin.
	b := fixture(t)
	b.Elements = []Element{{ID: "N1", Type: TypeLens, FacesMM: []*float64{ptr(-10.0), ptr(10.0)},
		ThicknessesMM: []float64{0.1}, Materials: []string{"fused-silica"}}}
	if err := Validate(b); err != nil {
		t.Errorf("biconcave lens: %v", err)
	}
}

// TestValidateStrayFields: fields of another type or kind set on a struct are rejected, so that
// Encode never writes a file Decode would refuse.
func TestValidateStrayFields(t *testing.T) {
	b := fixture(t)
	b.Elements[1].FocalMM = ptr(100.0) // aperture
	b.Elements[3].WidthMM = ptr(5.0)   // mirror
	b.Source.NA = ptr(0.1)             // collimated source
	want := []string{"source.na", "elements[1].focal_mm", "elements[3].width_mm"}
	if got := paths(Validate(b)); !reflect.DeepEqual(got, want) {
		t.Errorf("paths %q, want %q", got, want)
	}
}

func TestValidateMaterials(t *testing.T) {
	cases := []struct {
		name  string
		spec  MaterialSpec
		paths []string
	}{
		{"none of the models", MaterialSpec{}, []string{"materials.m"}},
		{"sellmeier and index", MaterialSpec{Sellmeier: &SellmeierSpec{B: []float64{1}, CUM2: []float64{0.01}}, Index: ptr(1.5)}, []string{"materials.m"}},
		{"vd alone", MaterialSpec{VD: ptr(40.0)}, []string{"materials.m.nd"}},
		{"index below 1", MaterialSpec{Index: ptr(0.9)}, []string{"materials.m.index"}},
		{"vd not positive", MaterialSpec{ND: ptr(1.6), VD: ptr(0.0)}, []string{"materials.m.vd"}},
		{"nd above 5", MaterialSpec{ND: ptr(5.5), VD: ptr(40.0)}, []string{"materials.m.nd"}},
		{"range without sellmeier", MaterialSpec{Index: ptr(1.5), RangeNM: []float64{400, 700}}, []string{"materials.m.range_nm"}},
		{"seven terms", MaterialSpec{Sellmeier: &SellmeierSpec{B: make([]float64, 7), CUM2: make([]float64, 7)}}, []string{"materials.m.sellmeier.b"}},
		{"no terms", MaterialSpec{Sellmeier: &SellmeierSpec{}}, []string{"materials.m.sellmeier.b"}},
		{"range of three values", MaterialSpec{Sellmeier: &SellmeierSpec{B: []float64{1}, CUM2: []float64{0.01}}, RangeNM: []float64{1, 2, 3}},
			[]string{"materials.m.range_nm"}},
		{"resonance inside the range", MaterialSpec{Sellmeier: &SellmeierSpec{B: []float64{1}, CUM2: []float64{0.25}}, RangeNM: []float64{400, 1000}},
			[]string{"materials.m.sellmeier.c_um2[0]"}},
		{"a valid glass", MaterialSpec{ND: ptr(1.6), VD: ptr(40.0)}, nil},
	}
	for _, c := range cases {
		b := fixture(t)
		b.Materials = map[string]MaterialSpec{"m": c.spec}
		if got := paths(Validate(b)); !reflect.DeepEqual(got, c.paths) {
			t.Errorf("%s: paths %q, want %q\n%v", c.name, got, c.paths, Validate(b))
		}
	}

	// Names: not a built-in, not a glass code. A lens using a broken user material is reported
	// once, under materials.
	b := fixture(t)
	b.Materials = map[string]MaterialSpec{"water": {Index: ptr(1.33)}, "code:x": {Index: ptr(1.4)}, "bad": {}}
	b.Elements[0].Materials = []string{"bad"}
	want := []string{"materials.bad", `materials["code:x"]`, "materials.water"}
	if got := paths(Validate(b)); !reflect.DeepEqual(got, want) {
		t.Errorf("names: paths %q, want %q", got, want)
	}

	// A user Sellmeier fit with no range that has no real index at a bench wavelength: n² < 0.
	b = fixture(t)
	b.Materials = map[string]MaterialSpec{"odd": {Sellmeier: &SellmeierSpec{B: []float64{-3}, CUM2: []float64{0}}}}
	b.Elements[0].Materials = []string{"odd"}
	if got := paths(Validate(b)); !reflect.DeepEqual(got, []string{"elements[0].materials[0]"}) {
		t.Errorf("imaginary index: paths %q\n%v", got, Validate(b))
	}
}

func TestValidateNil(t *testing.T) {
	if ErrorCode(Validate(nil)) != EInvalid {
		t.Error("Validate(nil) must be an invalid-input error")
	}
}

// TestValidateText: titles and notes are plain text of bounded length; a control character (a
// NUL, an escape) makes drawings and downloads invalid XML, so it is refused with its code point.
func TestValidateText(t *testing.T) {
	tests := []struct {
		name, title, notes string
		want               []string
	}{
		{"plain", "Relay for the slit", "first line\nsecond\tline", nil},
		{"NUL in title", "a\x00b", "", []string{"title"}},
		{"line break in title", "two\nlines", "", []string{"title"}},
		{"escape in notes", "", "colour \x1b[31m", []string{"notes"}},
		{"title too long", strings.Repeat("x", MaxTitleLength+1), "", []string{"title"}},
		{"notes too long", "", strings.Repeat("y", MaxNotesLength+1), []string{"notes"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			b := fixture(t)
			b.Title, b.Notes = tt.title, tt.notes
			if got := paths(Validate(b)); !reflect.DeepEqual(got, tt.want) {
				t.Errorf("problem paths %q, want %q", got, tt.want)
			}
		})
	}
}

// TestValidateBeamQualityBound: M² runs from 1 (an ideal Gaussian, Siegman 1986) to MaxM2.
func TestValidateBeamQualityBound(t *testing.T) {
	for _, tt := range []struct {
		m2   float64
		want []string
	}{{1, nil}, {MaxM2, nil}, {0.9, []string{"source.beam.m2"}}, {1e12, []string{"source.beam.m2"}}} {
		b := fixture(t)
		b.Source.Beam.M2 = ptr(tt.m2)
		if got := paths(Validate(b)); !reflect.DeepEqual(got, tt.want) {
			t.Errorf("m2 %g: problem paths %q, want %q", tt.m2, got, tt.want)
		}
	}
}
