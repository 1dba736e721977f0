package plan

// cautions lists the hazards of the whole job, shown with the plan. They are
// the usual ones of the trade; local codes and licensed practice come first.
func (b *builder) cautions() error {
	b.p.Cautions = []string{
		"Insulation-resistance and high-voltage tests put dangerous voltages on the winding. " + cautionHV,
		cautionSpin,
		"Rotor magnets: keep them away from pacemakers and other implants, cards, phones and instruments; store the rotor on a non-magnetic surface, away from steel chips.",
		"Enamel stripping, soldering and varnish give off fumes: work with ventilation or fume extraction; solvents and varnish away from flames, with gloves.",
		"These are the usual cautions of the trade, not a safety case: follow local electrical codes and licensed practice, which come first.",
	}
	return nil
}
