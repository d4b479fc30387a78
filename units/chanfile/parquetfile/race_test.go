//go:build race

package parquetfile

func init() { raceEnabled = true }
