package units

// ParseUncached exposes the uncached parse to the package's external
// tests and benchmarks only.
var ParseUncached = parseUncached

// SpellingsInUse reports how many unit spellings are interned.
func SpellingsInUse() int64 { return spellingsLen.Load() }
