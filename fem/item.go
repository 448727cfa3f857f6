package fem

// ItemKind says which list of a Model an Item is in.
type ItemKind int

// Kinds of model item.
const (
	ModelItem           ItemKind = iota // the model as a whole (Index −1)
	SegmentItem                         // Model.Segments[Index]
	SupportItem                         // Model.Supports[Index]
	PointLoadItem                       // Model.PointLoads[Index]
	DistributedLoadItem                 // Model.DistributedLoad[Index]
	MeshItem                            // Model.Mesh (Index −1)
	CaseItem                            // Model.Cases[Index]
	CombinationItem                     // Model.Combinations[Index]
	HingeItem                           // Model.Hinges[Index]
	FoundationItem                      // Model.Foundations[Index]
)

var itemKindNames = [...]string{"model", "segment", "support", "point load", "distributed load", "mesh", "load case", "combination", "hinge", "foundation"}

// String names the kind as messages do.
func (k ItemKind) String() string {
	if k < 0 || int(k) >= len(itemKindNames) {
		return "unknown"
	}
	return itemKindNames[k]
}

// Item names one thing in a model: its kind and its 0-based index in that
// kind's list (−1 for the model and the mesh). A load may belong to a load
// case: Case is 0 for the model's own loads and k for Model.Cases[k−1].
type Item struct {
	Kind  ItemKind
	Index int
	Case  int
}

// Feature is a point of the member where results may jump or kink, and the
// item that puts it there: an end or break of a segment, a support, a point
// load or a vertex of a distributed load.
type Feature struct {
	X      float64 // m
	Item   Item
	Vertex int // for a distributed load, the index of its vertex; for a segment or a foundation, 0 at its start and 1 at its end
}

// Features lists every feature of m in model order (not sorted, not merged).
func Features(m *Model) []Feature {
	out := make([]Feature, 0, featureCount(m))
	for i, s := range m.Segments {
		out = append(out, Feature{s.Start, Item{Kind: SegmentItem, Index: i}, 0}, Feature{s.End, Item{Kind: SegmentItem, Index: i}, 1})
	}
	for i, s := range m.Supports {
		out = append(out, Feature{X: s.X, Item: Item{Kind: SupportItem, Index: i}})
	}
	for i, h := range m.Hinges {
		out = append(out, Feature{X: h.X, Item: Item{Kind: HingeItem, Index: i}})
	}
	for i, f := range m.Foundations {
		out = append(out, Feature{f.Start, Item{Kind: FoundationItem, Index: i}, 0}, Feature{f.End, Item{Kind: FoundationItem, Index: i}, 1})
	}
	out = loadFeatures(out, m.PointLoads, m.DistributedLoad, 0)
	for c := range m.Cases {
		out = loadFeatures(out, m.Cases[c].PointLoads, m.Cases[c].DistributedLoad, c+1)
	}
	return out
}

// Property names one property of a model item, as the Go field that holds
// it: Problem places its message with it, and storage maps it to the file's
// key. Properties that hold one value per motion or per load point take the
// motion (Place.Dof) or the point (Place.Vertex) as well.
type Property int

// Properties of model items, by the item they belong to.
const (
	NoProperty Property = iota // the item as a whole

	StartProperty                 // Segment.Start or Foundation.Start
	EndProperty                   // Segment.End or Foundation.End
	AreaProperty                  // Segment.Section.Area
	SecondMomentProperty          // Segment.Section.SecondMoment
	FibreDistanceProperty         // Segment.Section.FibreDistance
	ElasticProperty               // Segment.Material.Elastic
	DensityProperty               // Segment.Material.Density
	ThermalExpansionProperty      // Segment.Material.ThermalExpansion
	AllowableProperty             // Segment.Material.Allowable
	DepthProperty                 // Segment.Section.Depth
	TemperatureDifferenceProperty // Segment.TemperatureDifference
	ShearAreaProperty             // Segment.Section.ShearArea
	ShearCoefficientProperty      // Segment.Section.ShearCoefficient
	ShearModulusProperty          // Segment.Material.ShearModulus
	PoissonProperty               // Segment.Material.Poisson

	PositionProperty        // Support.X or PointLoad.X
	KindProperty            // Support.Kind
	StiffnessProperty       // Support.Stiffness as a whole, or Hinge.Stiffness
	MotionStiffnessProperty // Support.Stiffness[Dof]
	SettlementProperty      // Support.Settlement[Dof]

	AxialForceProperty      // PointLoad.Axial
	TransverseForceProperty // PointLoad.Transverse
	MomentProperty          // PointLoad.Moment

	DirectionProperty      // DistributedLoad.Direction
	PointsProperty         // DistributedLoad.Points as a whole
	PointXProperty         // DistributedLoad.Points[Vertex].X
	PointIntensityProperty // DistributedLoad.Points[Vertex].Intensity

	ElementsProperty         // MeshSettings.Elements
	MaxElementLengthProperty // MeshSettings.MaxElementLength
	BarOrderProperty         // MeshSettings.BarOrder

	SegmentsProperty          // Model.Segments as a whole
	GravityProperty           // Model.Gravity[Dof]: Axial for x, Transverse for y
	TemperatureChangeProperty // Model.TemperatureChange, or LoadCase.TemperatureChange of a CaseItem

	NameProperty            // LoadCase.Name or Combination.Name
	FactorsProperty         // Combination.Factors as a whole
	FactorCaseProperty      // Combination.Factors[Vertex].Case
	FactorProperty          // Combination.Factors[Vertex].Factor
	CombinationKindProperty // Combination.Kind

	ModulusProperty      // Foundation.Modulus
	AxialModulusProperty // Foundation.AxialModulus
)

// Place says where in a model something lies: an item, one of its
// properties (NoProperty for the item as a whole) and, for the properties
// that need it, the motion or the load point. Dof and Vertex are zero where
// the property takes neither, so places compare with ==.
type Place struct {
	Item     Item
	Property Property
	Dof      Dof // for MotionStiffnessProperty, SettlementProperty and GravityProperty
	Vertex   int // for PointXProperty and PointIntensityProperty: the 0-based index of the load point; for FactorCaseProperty and FactorProperty, of the factor
}

// featureCount is len(Features(m)), counted without listing them.
func featureCount(m *Model) int {
	n := 2*len(m.Segments) + len(m.Supports) + len(m.Hinges) + 2*len(m.Foundations)
	loads := func(points []PointLoad, lines []DistributedLoad) {
		n += len(points)
		for _, d := range lines {
			n += len(d.Points)
		}
	}
	loads(m.PointLoads, m.DistributedLoad)
	for c := range m.Cases {
		loads(m.Cases[c].PointLoads, m.Cases[c].DistributedLoad)
	}
	return n
}

// loadFeatures appends the features of one set of loads, of case c (see Item).
func loadFeatures(out []Feature, points []PointLoad, lines []DistributedLoad, c int) []Feature {
	for i, p := range points {
		out = append(out, Feature{X: p.X, Item: Item{Kind: PointLoadItem, Index: i, Case: c}})
	}
	for i, d := range lines {
		for k, p := range d.Points {
			out = append(out, Feature{p.X, Item{Kind: DistributedLoadItem, Index: i, Case: c}, k})
		}
	}
	return out
}
