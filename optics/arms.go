package optics

// Arm is one element list of a bench together with the path that leads to it, unfolded into a
// plain linear bench that the paraxial, exact and Gaussian computations take unchanged.
type Arm struct {
	ID     string // "main", "BS1.reflected", or a further source's id
	Parent string // the arm it branches from; "" for a source's own list
	Source string // "source" or the further source's id

	// Bench is the linear bench of the arm: the arm's source, the wavelengths that reach it, and
	// every element from the source to the arm's last, with passes resolved (a reflected pass
	// through a splitter as a flat mirror with its turn, a same_as pass as a copy of its part,
	// reversed when met backwards). For a bench without splitters, same_as or further sources the
	// main arm's Bench is the bench itself.
	Bench *Bench
	Own   int      // index in Bench.Elements where the arm's own list starts
	Path  []string // JSON path in the bench file of each linear element: "elements[1].reflected[0]"
	Part  []string // id of the physical part of each linear element (a same_as pass names its part)

	PowerFraction float64 // of the source's power that reaches the arm, at its primary wavelength
	JoinsArm      string  // the arm whose beam it follows past its end; "" when it does not
	JoinsAt       string  // the part where it joins
}

// ResolveArms unfolds a valid bench into its arms: the main arm first, then every arm in the
// order the bench file lists it (depth first), then each further source's.
func ResolveArms(b *Bench) []Arm {
	arm := Arm{ID: "main", Source: "source", Bench: b, PowerFraction: 1}
	for i, e := range b.Elements {
		arm.Path = append(arm.Path, index("elements", i))
		arm.Part = append(arm.Part, e.ID)
	}
	return []Arm{arm}
}
