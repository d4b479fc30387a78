package parquetfile

// raceEnabled reports a build with the race detector.
var raceEnabled bool
