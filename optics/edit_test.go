package optics

import (
	"reflect"
	"slices"
	"strings"
	"testing"
)

func ids(b *Bench) []string {
	var out []string
	for _, e := range b.Elements {
		out = append(out, e.ID)
	}
	return out
}

// TestAddElementOfEveryType: a new element of each type, with its defaults, keeps the bench valid
// and gets the first free id of its type's prefix.
func TestAddElementOfEveryType(t *testing.T) {
	for _, k := range Kinds {
		b := fixture(t)
		want := UniqueID(b, k.Type)
		id, err := AddElement(b, k.Type, 3)
		if err != nil {
			t.Fatalf("add %s: %v", k.Type, err)
		}
		if e := b.Elements[3]; e.Type != k.Type || e.ID != id || id != want || !strings.HasPrefix(id, k.IDPrefix) {
			t.Errorf("add %s at 3: got %s %q, want id %q", k.Type, e.Type, id, want)
		}
		if err := Validate(b); err != nil {
			t.Errorf("bench after adding a default %s is invalid: %v", k.Type, err)
		}
	}
	b := fixture(t)
	if _, err := AddElement(b, "prism", 0); ErrorCode(err) != EInvalid || len(b.Elements) != 8 {
		t.Errorf("adding a prism: %v, %d elements", err, len(b.Elements))
	}
}

func TestUniqueID(t *testing.T) {
	b := fixture(t) // M1 and M2 are taken; so is CAM, which is no S-number
	for _, c := range []struct{ typ, want string }{
		{TypeMirror, "M3"}, {TypeScreen, "S1"}, {TypeThinLens, "F2"}, {TypeDump, "D1"}, {"prism", "E1"},
	} {
		if got := UniqueID(b, c.typ); got != c.want {
			t.Errorf("UniqueID(%s) = %q, want %q", c.typ, got, c.want)
		}
	}
	for _, at := range []int{-1, 99} {
		b := fixture(t)
		if _, err := AddElement(b, TypeScreen, at); err != nil || b.Elements[8].ID != "S1" {
			t.Errorf("add at %d: %v, elements %v (want it at the end)", at, err, ids(b))
		}
	}
}

func TestDeleteAndMoveElements(t *testing.T) {
	all := []string{"L1", "PH", "L2", "M1", "IR", "F1", "M2", "CAM"}
	for _, c := range []struct {
		name string
		edit func(b *Bench) error
		want []string // nil: refused, the bench unchanged
	}{
		{"delete", func(b *Bench) error { return DeleteElement(b, 1) }, []string{"L1", "L2", "M1", "IR", "F1", "M2", "CAM"}},
		{"delete the last", func(b *Bench) error { return DeleteElement(b, 7) }, all[:7]},
		{"delete a missing one", func(b *Bench) error { return DeleteElement(b, 8) }, nil},
		{"move down by one", func(b *Bench) error { return MoveElement(b, 0, 1) }, []string{"PH", "L1", "L2", "M1", "IR", "F1", "M2", "CAM"}},
		{"move up by one", func(b *Bench) error { return MoveElement(b, 2, 1) }, []string{"L1", "L2", "PH", "M1", "IR", "F1", "M2", "CAM"}},
		{"move to the front", func(b *Bench) error { return MoveElement(b, 6, 0) }, []string{"M2", "L1", "PH", "L2", "M1", "IR", "F1", "CAM"}},
		{"move the first up", func(b *Bench) error { return MoveElement(b, 0, -1) }, nil},
		{"move the last down", func(b *Bench) error { return MoveElement(b, 7, 8) }, nil},
	} {
		t.Run(c.name, func(t *testing.T) {
			b := fixture(t)
			err := c.edit(b)
			want := c.want
			if want == nil {
				want = all
				if ErrorCode(err) != EInvalid {
					t.Errorf("error %v, want an %s one", err, EInvalid)
				}
			} else if err != nil {
				t.Fatal(err)
			}
			if got := ids(b); !slices.Equal(got, want) {
				t.Errorf("elements %v, want %v", got, want)
			}
		})
	}
}

func TestRays(t *testing.T) {
	b := fixture(t)
	AddRay(b)
	if n := len(b.Source.Rays); n != 2 || b.Source.Rays[1] != (ExplicitRay{}) {
		t.Fatalf("after AddRay: %v", b.Source.Rays)
	}
	if err := DeleteRay(b, 0); err != nil || len(b.Source.Rays) != 1 || b.Source.Rays[0] != (ExplicitRay{}) {
		t.Errorf("DeleteRay(0): %v, rays %v", err, b.Source.Rays)
	}
	if err := DeleteRay(b, 1); ErrorCode(err) != EInvalid || len(b.Source.Rays) != 1 {
		t.Errorf("DeleteRay(1) of one ray: %v", err)
	}
}

// TestChangeType: an element keeps its id, gap and mount and what both types have (a clear
// diameter), and takes the rest from the new type's defaults.
func TestChangeType(t *testing.T) {
	b := fixture(t)
	m1 := b.Elements[3] // a flat mirror turning 90°, diameter 25.4
	m1.Mount = &Mount{WidthMM: 50, DepthMM: 30}
	ap := ChangeType(m1, TypeAperture)
	want := Element{ID: "M1", Type: TypeAperture, GapMM: 100, DiameterMM: new(25.4), Mount: m1.Mount}
	if !reflect.DeepEqual(ap, want) {
		t.Errorf("mirror -> aperture\n got %+v\nwant %+v", ap, want)
	}
	cam := b.Elements[7]
	if d := ChangeType(cam, TypeDump); !reflect.DeepEqual(d, Element{ID: "CAM", Type: TypeDump, GapMM: 130}) {
		t.Errorf("screen -> dump gave %+v", d)
	}
	lens := ChangeType(cam, TypeLens)
	if def := DefaultElement(TypeLens); !reflect.DeepEqual(lens.FacesMM, def.FacesMM) || *lens.DiameterMM != 25.4 || lens.WidthMM != nil {
		t.Errorf("screen -> lens gave %+v", lens)
	}
	if p := ChangeType(cam, "prism"); !reflect.DeepEqual(p, Element{ID: "CAM", Type: "prism", GapMM: 130}) {
		t.Errorf("screen -> unknown type gave %+v", p)
	}
	b.Elements[3] = ap
	b.Elements[7] = ChangeType(cam, TypeDump)
	if err := Validate(b); err != nil {
		t.Errorf("converted bench is invalid: %v", err)
	}
}

func TestChangeSourceKind(t *testing.T) {
	b := fixture(t)
	s := ChangeSourceKind(b.Source, SourcePoint)
	if s.Kind != SourcePoint || s.NA == nil || *s.NA != 0.1 || s.SemiDiameterMM != nil || s.FieldAnglesDeg != nil ||
		s.XMM != 50 || len(s.Rays) != 1 || s.Beam == nil {
		t.Errorf("collimated -> point gave %+v", s)
	}
	back := ChangeSourceKind(s, SourceCollimated)
	if back.NA != nil || back.ObjectHeightsMM != nil || *back.SemiDiameterMM != 2 {
		t.Errorf("point -> collimated gave %+v", back)
	}
	b.Source = s
	if err := Validate(b); err != nil {
		t.Errorf("converted bench is invalid: %v", err)
	}
}
