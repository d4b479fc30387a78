// Package steady turns a logged time history — a lab's raw export of
// channels sampled at a fixed rate — into steady points: for each span
// where the test condition holds, each channel's mean with its standard
// uncertainty, ready to be propagated as an uncertain.Measured. It works
// on quantity.Series and knows nothing of dimensionless groups; the
// channels come from a reader such as package chanfile.
//
// A log small enough to hold in memory is read whole with
// chanfile.ReadAll; its numeric channels (chanfile.Whole.Channel) go
// into Runs, TimeWindows and Points. The steps, for a carriage log with
// a run number (0 at rest and between runs, 9 for the zero), a speed V
// and a force F (errors to be checked at each step):
//
//	f, err := os.Open("carriage.csv")
//	r, err := chanfile.NewReader(f, "carriage.csv", chanfile.Options{})
//	w, err := chanfile.ReadAll(r, 1_000_000) // the whole file, at most 10⁶ rows
//	run, err := w.Channel("run") // a column of numbers; text tags: TextRuns(w.Labels[k])
//	v, err := w.Channel("V")
//	fx, err := w.Channel("F")
//	var ws []steady.Window // the points' windows
//	var zw steady.Window   // the zero's
//	for _, r := range steady.Runs(run) { // Runs drops nothing: choose here
//		switch {
//		case r.Label == 9:
//			zw = r.Window
//		case r.Label == 0 || r.Len() < 200: // between runs, or too short
//		default:
//			ws = append(ws, r.Window)
//		}
//	}
//	set := uncertain.NewSet() // holds the sources of every point
//	chs := []steady.Channel{ // a point drifting beyond the limit is flagged
//		{Name: "V", Data: v, DriftLimit: quantity.New(0.01, quantity.Velocity)},
//		{Name: "F", Data: fx, DriftLimit: quantity.New(0.5, quantity.Force)},
//	}
//	zero, err := steady.Reduce(set, "zero", chs, zw)
//	pts, err := steady.Points(set, chs, ws) // refuses an empty ws
//	for i := range pts {
//		pts[i], err = steady.Tare(pts[i], zero, "F") // the force only
//	}
//	fv, _ := pts[0].Value("F") // fv.Mean: the tared force, with its uncertainty
//
// Tare the channels whose transducers read an offset at rest (a force,
// a torque, a pressure difference), never a temperature.
//
// Package similarity/reduction runs the whole procedure below on a file
// of any length, chunk by chunk in bounded memory, and carries the
// points on to the dimensionless groups: start there for a test's
// reduction, and use this package for a step of it on its own.
//
// The procedure, in order:
//
// 1. Read the history and bring each channel to the unit its calibration
// starts from. Channels come as quantity.Series in SI, from package
// chanfile or any reader. A raw channel whose calibration is of the
// signal itself (a tachometer voltage to a carriage speed) is carried
// sample by sample with Calibration.Apply, which refuses any sample
// outside the calibrated range with a *RangeError naming the
// calibration, the channel, the row and its time — a calibration is
// never extrapolated. A Calibration is read from a small text file
// (ParseCalibration documents the format): a polynomial whose
// coefficients carry units, or a monotone table interpolated linearly.
//
// 2. Find the steady points, as windows of samples [Start, End):
// Runs gives the runs of equal value of a label channel (a run number
// logged by the carriage), RunsWhere the runs where a condition holds,
// TimeWindows the samples inside given time spans, and Detect finds them
// by a stated criterion on chosen channels: sample i is steady when, in
// the moving window of 2h + 1 samples centred on it, every chosen
// channel's standard deviation is within its tolerance and the means of
// the window's two halves differ by no more than theirs; a point is a
// run of at least MinLen steady samples.
//
// 3. Reduce each point. Summarize gives a channel's mean, standard
// deviation s, count n, drift (the change across the window of the
// least-squares line through the samples) and the standard uncertainty
// of the mean. Samples logged at 200 Hz are not independent readings,
// and the uncertainty of their mean is not s/√n: with the autocorrelation
// estimate ρ_k it is s/√n_eff, with the effective number of independent
// samples
//
//	n_eff = n / (1 + 2 Σ_{k=1}^{K} (1 − k/n) ρ_k),
//
// the classical expression of the variance of the mean of a stationary
// correlated series (Bendat & Piersol, Random Data, the section on the
// variance of mean-value estimates; Bayley & Hammersley, J. R. Stat.
// Soc. Suppl. 8, 1946 — both from memory), with the sum truncated at K,
// the last lag before the autocorrelation estimate first falls to zero or
// below. Equivalently n_eff = n·Δt/(2 T_I) for a long window, T_I the
// integral time scale; for a first-order autoregressive series of lag-1
// correlation φ it tends to n(1 − φ)/(1 + φ). Reduce and Points do this
// for every channel of a point, flag a channel whose |drift| exceeds its
// limit, and register each mean in an uncertain.Set as a Type A source
// with n_eff − 1 degrees of freedom, so nothing downstream counts the
// samples as independent.
//
// 4. Subtract the zero. A zero (tare) is reduced like a point, with
// Reduce, from a window of the same history or from the whole of a zero
// file read the same way; Tare subtracts its mean from the point's for
// each channel named (the force, torque or pressure channels that read an
// offset at rest; never a temperature, which Tare refuses unless named),
// and the zero's Type A uncertainty combines with the point's.
//
// 5. Calibrate the means. A calibration of tared readings (a
// dynamometer's bridge output to a force) is applied to the tared mean
// with Calibration.Calibrate (or Measured), which carries the mean's
// uncertainty through the calibration's slope and refuses a mean outside
// the calibrated range; a channel calibrated sample by sample in step 1
// gets its calibration's uncertainty with Calibration.AddSource. Either
// way the calibration's standard uncertainty enters as one systematic
// Type B source, registered once per set and shared by every value the
// calibration gives, so that its errors stay correlated between points.
//
// The result is each point's channels as uncertain.Measured values, with
// their sources — the point's repeatability, the zero's, the
// calibration's — kept apart for the budget.
//
// Every error is typed and matches exactly one of the module's classes
// under errors.Is: *Error (quantity.ErrInvalid, or quantity.ErrRange for
// a missing sample in a window or a window too short for its
// correlation, or its cause's class), *ParseError (quantity.ErrParse, or
// its cause's class for a unit the parser does not know), *RangeError
// (quantity.ErrRange). Reading a calibration file is bounded and never
// panics. A Calibration is not changed after ParseCalibration returns it
// and may be used by several goroutines at once.
//
// A steady point's uncertainty as computed here is the statistical part
// of a test's uncertainty and the calibration's stated part; an
// uncertainty statement for an acceptance or a powering prediction
// follows the procedure of the facility and of the standard it works to
// (ITTC's recommended procedures for towing tanks), under the judgment of
// the engineer responsible.
package steady
