package optics

import (
	"math"
	"reflect"
	"strings"
	"testing"
)

// TestValidatePower: power_mw and pulse are finite and positive, not both; coatings are named,
// reflectances lie in 0..1 and damage thresholds are positive, each problem at its JSON path
// (README "Power"); a further source is checked alike.
func TestValidatePower(t *testing.T) {
	for _, tc := range []struct {
		name  string
		edit  func(b *Bench)
		paths []string
		text  string
	}{
		{"both power and pulse", func(b *Bench) {
			b.Source.PowerMW = ptr(5.0)
			b.Source.Pulse = &Pulse{EnergyUJ: 1, DurationNS: 5, RateHz: 10}
		}, []string{"source.pulse"}, "not both"},
		{"negative power", func(b *Bench) { b.Source.PowerMW = ptr(-1.0) }, []string{"source.power_mw"}, "greater than 0 mW"},
		{"pulse not finite, zero rate", func(b *Bench) {
			b.Source.Pulse = &Pulse{EnergyUJ: math.NaN(), DurationNS: 5, RateHz: 0}
		}, []string{"source.pulse.energy_uj", "source.pulse.rate_hz"}, "finite"},
		{"unknown coating", func(b *Bench) { b.Elements[0].Coating = "v-coat" }, []string{"elements[0].coating"}, `"ar" or "uncoated"`},
		{"face reflectance above 1", func(b *Bench) { b.Elements[0].FaceReflectance = ptr(1.5) }, []string{"elements[0].face_reflectance"}, "between 0 and 1"},
		{"mirror reflectance below 0", func(b *Bench) { b.Elements[3].Reflectance = ptr(-0.1) }, []string{"elements[3].reflectance"}, "between 0 and 1"},
		{"reflectance on a lens", func(b *Bench) { b.Elements[0].Reflectance = ptr(0.5) }, []string{"elements[0].reflectance"}, "unknown field"},
		{"coating on a mirror", func(b *Bench) { b.Elements[3].Coating = CoatingAR }, []string{"elements[3].coating"}, "unknown field"},
		{"damage threshold zero", func(b *Bench) { b.Elements[1].DamageWCM2 = ptr(0.0) }, []string{"elements[1].damage_w_cm2"}, "greater than 0 W/cm²"},
		{"further source", func(b *Bench) {
			b.MoreSources = []MoreSource{{ID: "green", Source: b.Source, Elements: []Element{{ID: "D9", Type: TypeDump, GapMM: 50}}}}
			b.MoreSources[0].YMM += 100
			b.MoreSources[0].PowerMW = ptr(math.Inf(1))
		}, []string{"more_sources[0].power_mw"}, "finite"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			b := fixture(t)
			tc.edit(b)
			err := Validate(b)
			if got := paths(err); !reflect.DeepEqual(got, tc.paths) {
				t.Fatalf("problem paths %q, want %q: %v", got, tc.paths, err)
			}
			if !strings.Contains(err.Error(), tc.text) {
				t.Errorf("%v lacks %q", err, tc.text)
			}
		})
	}
	ok := fixture(t)
	ok.Source.Pulse = &Pulse{EnergyUJ: 1, DurationNS: 5, RateHz: 10}
	ok.Elements[0].Coating, ok.Elements[3].Reflectance, ok.Elements[1].DamageJCM2 = CoatingNone, ptr(0.999), ptr(2.0)
	if err := Validate(ok); err != nil {
		t.Errorf("a valid pulsed bench: %v", err)
	}
}

// TestDecodePulse: a pulse is an object with three required numbers; a missing one is named.
func TestDecodePulse(t *testing.T) {
	src := `{"x_mm": 50, "y_mm": 100, "heading_deg": 0, "kind": "collimated", "semi_diameter_mm": 1, "pulse": %s}`
	b, err := Decode([]byte(validBench(strings.Replace(src, "%s", `{"energy_uj": 2, "duration_ns": 8, "rate_hz": 20}`, 1), `{"id": "D", "type": "dump", "gap_mm": 10}`)))
	if err != nil || b.Source.Pulse == nil || *b.Source.Pulse != (Pulse{EnergyUJ: 2, DurationNS: 8, RateHz: 20}) {
		t.Fatalf("decoded %+v, %v", b, err)
	}
	_, err = Decode([]byte(validBench(strings.Replace(src, "%s", `{"energy_uj": 2, "rate_hz": 20}`, 1), `{"id": "D", "type": "dump", "gap_mm": 10}`)))
	if got := paths(err); !reflect.DeepEqual(got, []string{"source.pulse.duration_ns"}) {
		t.Errorf("problem paths %q, want source.pulse.duration_ns: %v", got, err)
	}
}
