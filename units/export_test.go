package units

// ParseUncached exposes the uncached parse to the package's external
// tests and benchmarks only.
var ParseUncached = parseUncached
