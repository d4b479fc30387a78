// Package fit holds the curve fits that test analyses share: polynomial
// least squares of a chosen order or of an order chosen by a stated
// criterion, weighted fits, a monotone fairing of curves that must not
// wiggle, the intervals of coefficients and predictions, the lack-of-fit
// test, outlier and influence flags, predictions that carry the fit's
// uncertainty as correlated sources, and nonlinear least squares.
package fit
