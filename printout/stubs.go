package printout

func (b *builder) connections() {}
func (b *builder) cutList()     {}
func (b *builder) checklist()   {}
func (b *builder) testRecord()  {}
