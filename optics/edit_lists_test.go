package optics_test

import (
	"reflect"
	"testing"

	"raytable/optics"
	"raytable/optics/benchtest"
)

// ids lists the ids of an element list.
func ids(els []optics.Element) []string {
	out := []string{}
	for _, e := range els {
		out = append(out, e.ID)
	}
	return out
}

// TestListEdits makes each list-aware edit on the demo Michelson and reads the list it changed.
func TestListEdits(t *testing.T) {
	tests := []struct {
		name    string
		edit    func(b *optics.Bench) error
		list    func(b *optics.Bench) []optics.Element
		want    []string
		wantErr bool
	}{
		{"add in a reflected list", func(b *optics.Bench) error {
			_, err := optics.AddElementIn(b, "elements[0].reflected", "aperture", 1)
			return err
		}, func(b *optics.Bench) []optics.Element { return b.Elements[0].Reflected }, []string{"M2", "A1", "BS1b"}, false},
		{"add opens an empty reflected list", func(b *optics.Bench) error {
			_, err := optics.AddElementIn(b, "elements[0].reflected[1].reflected", "dump", 0)
			return err
		}, func(b *optics.Bench) []optics.Element { return b.Elements[0].Reflected[1].Reflected }, []string{"D1"}, false},
		{"new id is unique over the tree", func(b *optics.Bench) error {
			_, err := optics.AddElementIn(b, "elements", "mirror", -1)
			return err
		}, func(b *optics.Bench) []optics.Element { return b.Elements }, []string{"BS1", "M1", "BS1a", "M3"}, false},
		{"delete in a nested list", func(b *optics.Bench) error { return optics.DeleteElementAt(b, "elements[2].reflected[0]") },
			func(b *optics.Bench) []optics.Element { return b.Elements[2].Reflected }, []string{}, false},
		{"move in a reflected list", func(b *optics.Bench) error { return optics.MoveElementAt(b, "elements[0].reflected[1]", 0) },
			func(b *optics.Bench) []optics.Element { return b.Elements[0].Reflected }, []string{"BS1b", "M2"}, false},
		{"no reflected list on a mirror", func(b *optics.Bench) error {
			_, err := optics.AddElementIn(b, "elements[1].reflected", "dump", 0)
			return err
		}, nil, nil, true},
		{"no such element", func(b *optics.Bench) error { return optics.DeleteElementAt(b, "elements[7]") }, nil, nil, true},
		{"not a path", func(b *optics.Bench) error { return optics.MoveElementAt(b, "elements", 0) }, nil, nil, true},
		{"add a source", func(b *optics.Bench) error {
			if id := optics.AddSource(b); id != "laser1" {
				t.Errorf("AddSource gave %q, want laser1", id)
			}
			_, err := optics.AddElementIn(b, "more_sources[0].elements", "screen", 0)
			return err
		}, func(b *optics.Bench) []optics.Element { return b.MoreSources[0].Elements }, []string{"S1"}, false},
	}
	for _, tc := range tests {
		b := benchtest.Load(t, "michelson-bench.json")
		err := tc.edit(b)
		if (err != nil) != tc.wantErr {
			t.Errorf("%s: error %v, want error %v", tc.name, err, tc.wantErr)
			continue
		}
		if tc.list != nil {
			if got := ids(tc.list(b)); !reflect.DeepEqual(got, tc.want) {
				t.Errorf("%s: list %q, want %q", tc.name, got, tc.want)
			}
		}
	}
	b := benchtest.Load(t, "michelson-bench.json")
	if got, want := optics.Parts(b), []string{"BS1", "M1", "M2", "CAM"}; !reflect.DeepEqual(got, want) {
		t.Errorf("Parts %q, want %q", got, want)
	}
	if e, ok := optics.ElementAt(b, "elements[2].reflected[0]"); !ok || e.ID != "CAM" {
		t.Errorf("ElementAt gave %v, %v", e, ok)
	}
}
