package batch

// Summary counts the members of a batch by status and names the members
// that govern it.
type Summary struct {
	Members int `json:"members"`
	OK      int `json:"ok"`
	Caution int `json:"caution"`
	Failed  int `json:"fail"`
	Refused int `json:"refused"`
	// Worst is the worst status of any member (OK for an empty batch).
	Worst Status `json:"worst_status"`
	// Highest is the member with the design check of largest utilisation
	// (as governs orders them: an infinite one first, then an undefined one);
	// nil when no member has one.
	Highest *GoverningMember `json:"highest_utilisation"`
	// Deflection is the member with the deflection check of largest
	// utilisation; nil when no member has one.
	Deflection *DeflectionMember `json:"largest_deflection"`
}

// Who names a member in the summary.
type Who struct {
	File string `json:"file"`
	Mark string `json:"member"`
}

// String names the member: its file and, when it has one, its mark.
func (w Who) String() string {
	if w.Mark == "" {
		return w.File
	}
	return w.File + " (" + w.Mark + ")"
}

// GoverningMember is a member's governing check.
type GoverningMember struct {
	Who
	Check
}

// DeflectionMember is a member's deflection check.
type DeflectionMember struct {
	Who
	Deflection
}

// add counts m; the first of equal utilisations stays.
func (s *Summary) add(m *Member) {
	s.Members++
	switch m.Status {
	case OK:
		s.OK++
	case Caution:
		s.Caution++
	case Failed:
		s.Failed++
	case Refused:
		s.Refused++
	}
	s.Worst = max(s.Worst, m.Status)
	who := Who{m.File, m.Mark}
	if g := m.Governing; g != nil && (s.Highest == nil || governs(g.Utilisation, s.Highest.Utilisation)) {
		s.Highest = &GoverningMember{who, *g}
	}
	if d := m.Deflection; d != nil && (s.Deflection == nil || governs(d.Utilisation, s.Deflection.Utilisation)) {
		s.Deflection = &DeflectionMember{who, *d}
	}
}
