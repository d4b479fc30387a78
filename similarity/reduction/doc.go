// Package reduction turns a lab's raw export — channels logged at a
// fixed rate — into steady points and their dimensionless groups, each
// with its uncertainty: the data-reduction pipeline of a test, as a
// library. A harness command, an example program or an outside
// data-parallel engine calls it; it reads through the chanfile.Source of
// the channel-file layer and reduces with packages steady, formula and
// pigroups, knowing no file format of its own.
//
// A harness reduces a towing-carriage log — a run number (0 at rest and
// between runs), the time t, the speed V, the resistance F and the water
// temperature T_w — to the drag groups of each run with their
// uncertainty in these steps (each err to be checked):
//
//	problem, err := pigroups.NewProblem(
//		pigroups.Variable{Symbol: "F", Dim: quantity.Force, Role: pigroups.Dependent},
//		pigroups.Variable{Symbol: "rho", Dim: quantity.Density},
//		pigroups.Variable{Symbol: "V", Dim: quantity.Velocity},
//		pigroups.Variable{Symbol: "L", Dim: quantity.Length},
//		pigroups.Variable{Symbol: "nu", Dim: quantity.KinematicViscosity},
//	)
//	set, err := problem.PiSet("rho", "V", "L") // the repeating variables
//	rest := steady.Span{From: quantity.New(0.5, quantity.Time), To: quantity.New(2, quantity.Time)}
//	zero := reduction.Spans("t", rest) // the carriage at rest: the zero
//	spec := &reduction.Spec{
//		Derive: "rho = rho_water(T_w); nu = nu_water(T_w); L = 2 {m}",
//		Funcs:  fluids.FormulaFuncs(),
//		Points: reduction.Runs("run", 200, 0), // runs of 200 samples or more, but not label 0
//		Zero:   &zero,
//		Tare:   []string{"F"}, // the channels to tare: never a temperature
//		Also:   []string{"T_w"},
//		Set:    set.WithConventional(), // Re, C_T, … where a group is one
//	}
//	res, err := spec.Reduce(reduction.File("carriage.csv", reduction.FileOptions{}))
//	for _, p := range res.Points {
//		f, _ := p.Value("F") // f.Mean: the tared resistance with its uncertainty
//		for g, m := range p.Groups {
//			fmt.Println(p.Tag, f.Mean, res.Groups[g].Column, m) // "run 1 … Re …"
//		}
//	}
//	err = reduction.SavePoints(filepath.Join(dir, "points.csv"), res, reduction.WriteOptions{})
//
// The procedure, in order, as Spec.Reduce runs it on one file:
//
// 1. Read the channels. An Input gives a chanfile.Source: a CSV or TSV
// file (chanfile.Reader), a Parquet file (parquetfile.Reader) — File
// opens either by its name — or Series held in memory
// (chanfile.NewSeriesSource). Only the columns the spec needs are asked
// for (chanfile.Select): the variables', the derived channels' inputs,
// the label or time channel of the points, the tared, calibrated and
// Also channels. Both file readers are chanfile.Selectors: they choose
// the columns after the header (or schema) is read and before any data
// row is parsed, so a text column, a bad value or a Parquet column of a
// type not read, in a column the spec does not use, never fails the
// file. Values arrive in SI, chunk by chunk.
//
// 2. Calibrate samples. A Calibration with Samples set carries its
// channel sample by sample from the raw reading to the engineering value
// (steady.Calibration.Apply), refusing a reading outside the calibrated
// range with its row: a calibration is never extrapolated.
//
// 3. Derive channels. Spec.Derive is formula text evaluated row by row
// over the channels ("rho = rho_water(T_w); L = 2 {m}"); Spec.Funcs
// supplies the functions it may call, each with its declared dimensions,
// wired in by the caller (fluids.FormulaFuncs() for the fluid
// properties). A value that is not
// finite where every channel is present is an error naming the row (and
// the line of a text file), or with NonfiniteMissing a counted missing
// value.
//
// 4. Find the points. Spec.Points chooses the spans: AllRows (each row
// its own result, the row-by-row reduction), Runs of a label channel
// (the run number a carriage logs), Spans of a time channel, or Detected
// steady windows by a stated moving-window criterion (steady.Detect).
// Every channel the spec reads must hold numbers: a text column (a
// chanfile.Label, as a run tag "Lauf 1" or an operator's note) named as
// the run label, a variable or any other channel is refused before any
// row is read, with an *Error of Op "plan" naming the column; a run
// label must be logged as a number. A text column the spec does not
// name is never read.
// AllRows, Runs and Spans read the file once in bounded memory: the
// windows of Runs and Spans (and of a zero of either kind) are found row
// by row, each window's statistics are computed as soon as its last row
// is read, and only the rows of the windows still open are kept (8 bytes
// a value and reduced channel: the longest run or span, not the file).
// Detected judges each sample on the samples around it and reads the
// needed columns whole (8 bytes a value and column of the file). The
// result's points and their uncertainty sources stay in memory: one
// uncertain.Set holds fewer than 65 535 sources, one per reduced channel
// and point.
//
// 5. Reduce each point. Each channel's mean gets its standard
// uncertainty of the mean, s/√n_eff with n_eff from the window's
// autocorrelation (steady.Summarize): samples at 200 Hz are not
// independent readings. The mean is registered in the result's
// uncertain.Set as a Type A source with n_eff − 1 degrees of freedom.
// A channel drifting more than its Spec.Drift limit across the point is
// flagged.
//
// 6. Subtract the zero. Spec.Zero (a window of the same history) or
// Input.Zero (a zero file, reduced whole) is reduced the same way and
// its mean subtracted from each channel of Spec.Tare, its uncertainty
// combined with the point's.
//
// 7. Calibrate the means. A Calibration without Samples carries the
// tared mean through the calibration with its slope; either kind adds
// the calibration's standard uncertainty as one systematic Type B source
// shared by every point, so its errors stay correlated between points.
//
// 8. Evaluate the groups. Each variable of the Pi set (Spec.Set) is the
// channel, or derived channel, of its symbol's name; a variable held in
// revolutions takes a channel's rad/s divided by 2π (Spec.Units). The
// groups of each point are uncertain.Measured values carrying every
// source above to first order (pigroups.Evaluator.RowMeasured); in the
// AllRows mode each row's groups are plain numbers, streamed to
// Input.Rows or kept in Result.RowGroups.
//
// 9. Write the results. SavePoints writes a file whole or not at all
// (WriteFile: a temporary file in the destination's directory, renamed
// on success), as CSV, TSV or Parquet; a text file's comment lines carry
// each point's span and each group's definition, which ReadDefinitions
// reads back, a Parquet file's key-value metadata carries the
// definitions under ParquetKey + column (ParquetMetadata), which
// ReadDefinitionsParquet reads back, and the columns carry the trade's
// symbol where a group is exactly a named one (Re, Fr, K_T).
// WriteOptions.BOM makes a file a spreadsheet reads as UTF-8. A
// RowsWriter writes the AllRows groups the same way.
//
// One file's reduction is a pure function of its spec and its input, so
// Spec.Campaign runs many files on every core, one file per worker, with
// the outcomes in input order.
//
// Every error is an *Error naming the file and, where there is one, the
// line of a text file (or the row of a Parquet file), the point and the
// channel; it keeps its cause and matches exactly one class of package
// quantity under errors.Is, the cause's class or quantity.ErrInvalid.
//
// A steady point's uncertainty as computed here is the statistical part
// of a test's uncertainty and the calibrations' stated part; an
// uncertainty statement for an acceptance, a powering prediction or a
// design follows the procedure of the facility and of the standard it
// works to (ITTC's recommended procedures for towing tanks, for one),
// under the judgment of the engineer responsible.
package reduction
