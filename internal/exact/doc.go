// Package exact provides the exact rational arithmetic and linear algebra
// shared by pigroups and similarity: small matrices of fractions with
// int64 numerators and denominators, eliminated without any floating
// tolerance. Every operation checks for overflow and reports it as
// ErrOverflow, so a result is either exact or refused.
package exact
