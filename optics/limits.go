package optics

// Caps on every list a bench file can lengthen (README "Limits and who can see what", caps and
// budget). Validate names the JSON path and the cap of each list that is longer. The caps bound
// each list alone; MaxRayFaces bounds their product, the work of one report.
const (
	MaxElements      = 200 // most elements over all element lists of a bench
	MaxArmDepth      = 8   // deepest nesting of reflected lists: a splitter's list inside another's, ...
	MaxSources       = 8   // most further sources (more_sources entries)
	MaxElementLists  = 32  // most element lists (arms before joins): the main list, reflected lists and further sources' lists
	MaxWavelengths   = 16  // most wavelengths of the bench, and of each further source
	MaxFieldAngles   = 16  // most field angles of a collimated source
	MaxObjectHeights = 16  // most object heights of a point source
	MaxExplicitRays  = 64  // most explicit rays of a source
	MaxFanRays       = 201 // most rays in one meridional fan
)

// MaxRayFaces is the work budget of one report: the ray-faces it may trace, each exact ray (with
// its paraxial twin) through each face of its arm's path, summed over all arms, wavelengths and
// fields. Each ray-face is also a hit in the report, its JSON and the drawings, so the budget
// bounds time and memory alike; the indented report JSON, about 1 KB per ray-face, costs the
// most. Sized by BenchmarkLargestAllowedBench (server): one view of a bench at the budget (page,
// report JSON and drawings, each computed afresh) takes under a second on two cores and under
// 200 MB.
const MaxRayFaces = 25_000
