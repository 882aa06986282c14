package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.ritzwerk.engine.ritz.RitzException;
import org.ritzwerk.engine.ritz.RydbergSeries;
import org.ritzwerk.engine.ritz.SeriesFit;
import org.ritzwerk.engine.ritz.SeriesFitter;
import org.ritzwerk.refdata.OutputFiles;
import org.ritzwerk.refdata.ReferenceDataException;
import org.ritzwerk.refdata.SeriesFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code ritzwerk series}: a Rydberg-Ritz fit of measured series members (limit, quantum defects). */
@Command(name = "series",
        mixinStandardHelpOptions = true,
        header = "Fit measured Rydberg series: the series limit and the quantum defects.",
        description = "Reads a ritzwerk-series file (members: series name, n, energy above the ground level and "
                + "its uncertainty) and fits the modified Rydberg-Ritz formula E = E_limit - R_M / (n - delta)^2, "
                + "delta = d0 + d2/(n-d0)^2 + ..., with the isotope's reduced-mass Rydberg constant R_M; all "
                + "series in the file share one limit. The number of defect terms of each series is chosen by "
                + "the Bayesian information criterion (chi^2 + p ln N) unless --terms fixes it. Prints the "
                + "limit and defects with their uncertainties (and, when the criterion chose, the limit and "
                + "defects averaged over the models tried with BIC weights, whose uncertainties include the "
                + "choice of terms), the chosen model's covariance, each member's residual and the "
                + "models tried; in csv the sections follow one another, each with its header row. The fit's "
                + "chi-square probability is given; below 0.001 the fit is called improbable and a note says the "
                + "stated uncertainties assume the model and the data right (column u x S scales them by "
                + "S = max(1, sqrt(chi^2/dof))). Members with |residual/u| > 3 are flagged (column flag) and named "
                + "in a note. A level measured more than once (one n on several rows) counts once per row: each "
                + "measurement has its own residual row, named by its file line; two of one n whose difference "
                + "exceeds 3 of its standard uncertainties sqrt(u1^2 + u2^2) are flagged 'repeat disagrees' and "
                + "named in a note, and so are rows repeating the same energy and uncertainty.",
        footer = {"", "Examples:",
            "  ritzwerk series members.csv",
            "  ritzwerk series members.csv --terms 2 --predict 40,60 --format json",
            "  ritzwerk series members.csv --plot defects.png"})
final class SeriesCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DataOptions data;

    @Parameters(paramLabel = "FILE", description = "The ritzwerk-series file (.csv or .json).")
    Path file;

    @Option(names = "--terms", paramLabel = "K[,K...]", split = ",",
            description = "Fix the number of defect terms (1: d0 alone), one per series in file order; default: "
                    + "chosen by the information criterion.")
    List<Integer> terms = new ArrayList<>();

    @Option(names = "--max-terms", paramLabel = "K", defaultValue = "3",
            description = "The most defect terms per series the criterion may choose, 1 to 6 (default: "
                    + "${DEFAULT-VALUE}).")
    int maxTerms;

    @Option(names = "--limit", paramLabel = "CM,U", split = ",",
            description = "A known series limit (e.g. a published ionisation energy) and its standard uncertainty, "
                    + "cm-1 above the ground level, taken as one more datum of the fit; with --terms the fit may "
                    + "then pass exactly through as many data as it has parameters.")
    List<Double> limit = new ArrayList<>();

    @Option(names = "--predict", paramLabel = "N[,N...]", split = ",",
            description = "Also give these members of every series (energy, uncertainty, defect). Where a series "
                    + "is not physically ordered from the n up through its members (n - delta(n) not positive, "
                    + "energy not rising, at or above the limit, or below the ground level) the prediction is "
                    + "withheld with a note and the other series are still predicted; below a series' lowest "
                    + "member the uncertainty includes the defect expansion's truncation (noted). Columns "
                    + "'averaged' and 'u avg' give the member averaged over the models tried (BIC weights, the "
                    + "spread between the models included), withheld where the chosen model's is or where models "
                    + "with 0.1 %% of the weight or more give none.")
    List<Integer> predict = new ArrayList<>();

    @Option(names = "--plot", paramLabel = "FILE.png",
            description = "Write a PNG of one series' quantum defects against n (--plot-series): each member's "
                    + "defect with a bar from its energy's uncertainty, flagged members apart, and the fitted "
                    + "delta(n); the axis spans the unflagged members and the curve.")
    Path plot;

    @Option(names = "--plot-series", paramLabel = "NAME",
            description = "The series --plot draws (default: the first in the file).")
    String plotSeries;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "text (aligned tables), csv or json (one object per line, with a 'kind' field). "
                    + "Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Override
    public Integer call() throws IOException {
        OptionRules rules = new OptionRules(spec);
        rules.refuseUnless("--max-terms", terms.isEmpty(), "with --terms (it bounds the terms the criterion chooses)");
        rules.refuseUnless("--plot-series", plot != null, "without --plot");
        if (maxTerms < 1 || maxTerms > 6) {
            throw new OptionException("--max-terms must be 1 to 6, got " + maxTerms);
        }
        for (int k : terms) {
            if (k < 1 || k > 6) {
                throw new OptionException("--terms: each number of terms must be 1 to 6, got " + k);
            }
        }
        if (!limit.isEmpty() && (limit.size() != 2 || !(limit.get(0) > 0) || limit.get(0).isInfinite()
                || !(limit.get(1) > 0) || limit.get(1).isInfinite())) {
            throw new OptionException("--limit takes two numbers, the limit and its standard uncertainty in cm-1, "
                    + "both finite and above 0, e.g. --limit 33690.80,0.01; got " + limitText());
        }
        for (int n : predict) {
            if (n < 1 || n > 10000) {
                throw new OptionException("--predict: n must be 1 to 10000, got " + n);
            }
        }
        OptionRules.png("--plot", plot);
        if (plot != null) {
            // Before any work: the plot may not be an input, and its folder must exist and be writable.
            List<OutputFiles.Named> inputs = data.inputs(List.of());
            inputs.add(new OutputFiles.Named("FILE", file));
            OutputFiles.check(List.of(new OutputFiles.Named("--plot", plot)), inputs);
        }
        SeriesFiles.Contents contents = SeriesFiles.read(file);
        List<RydbergSeries> series = contents.series();
        if (!terms.isEmpty() && terms.size() != series.size()) {
            throw new OptionException("--terms gives " + terms.size() + (terms.size() == 1 ? " count" : " counts")
                    + " for the " + series.size()
                    + " series of " + file + " (" + String.join(", ", series.stream().map(RydbergSeries::name).toList())
                    + ")");
        }
        int plotted = 0;
        if (plotSeries != null) {
            plotted = series.stream().map(RydbergSeries::name).toList().indexOf(plotSeries.strip());
            if (plotted < 0) {
                throw new OptionException("--plot-series: no series '" + plotSeries + "' in " + file + "; it has "
                        + String.join(", ", series.stream().map(RydbergSeries::name).toList()));
            }
        }
        double rydberg;
        try {
            rydberg = SeriesFiles.rydbergPerCm(data.context(), contents.species());
        } catch (ReferenceDataException e) {
            if (!ReferenceDataException.UNKNOWN_ISOTOPE.equals(e.code())) {
                throw e;
            }
            throw new ReferenceDataException(e.code(), file + ": '# species: " + contents.species().notation()
                    + "': " + e.getMessage() + ". R_M needs the isotope's mass: name a listed isotope, or give an "
                    + "isotope table of your own with --data (the columns of 'ritzwerk data show nuclear-isotopes "
                    + "--format csv')");
        }
        SeriesFitter fitter = terms.isEmpty() ? SeriesFitter.defaults().withMaxTerms(maxTerms)
                : SeriesFitter.defaults().withTerms(terms.stream().mapToInt(Integer::intValue).toArray());
        if (!limit.isEmpty()) {
            fitter = fitter.withLimit(limit.get(0), limit.get(1));
        }
        SeriesFit fit;
        try {
            fit = fitter.fit(rydberg, series);
        } catch (RitzException e) {
            throw new RitzException(e.code(), file + ": " + e.getMessage());
        }
        List<SeriesFit.Prediction> predictions = fit.predictions(predict.stream().mapToInt(Integer::intValue)
                .toArray());
        List<SeriesFit.AveragedPrediction> averaged = fit.modelAveragedPredictions(predict.stream()
                .mapToInt(Integer::intValue).toArray());
        // the tables first, flushed and ending in a newline, then the notes: where both streams go to one
        // terminal or file, a note never runs into the last table row
        print(fit, contents, predictions, averaged);
        PrintWriter err = spec.commandLine().getErr();
        for (int i = 0; i < predictions.size(); i++) {
            SeriesFit.Prediction p = predictions.get(i);
            p.note().ifPresent(note -> err.println("note: --predict " + p.n() + ": " + note));
            // the average's own note where it says more (models left out, or withheld though the chosen model predicts)
            String mine = p.note().orElse("");
            averaged.get(i).note().filter(note -> !note.equals(mine))
                    .map(note -> !mine.isEmpty() && note.startsWith(mine + "; ") ? note.substring(mine.length() + 2)
                            : note)
                    .ifPresent(note -> err.println("note: --predict " + p.n() + ": " + note));
        }
        for (String note : fit.notes()) {
            err.println("note: " + note);
        }
        noteKnownLimit(fit);
        err.flush();
        if (plot != null) {
            try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
                Plots.writeChart(batch, plot, defectChart(fit, plotted, contents));
                batch.commit();
            }
        }
        return 0;
    }

    /**
     * The defect chart of one series: members in order of n with their defects and uncertainties (a
     * member at or above the fitted limit, which has no defect, left out and counted in the title),
     * the fit's outliers flagged, and the fitted delta(n) over the members' n.
     */
    private static org.jfree.chart.JFreeChart defectChart(SeriesFit fit, int s, SeriesFiles.Contents contents) {
        RydbergSeries one = fit.series().get(s);
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < one.size(); i++) {
            if (fit.measuredDefectUncertainty(s, i).isPresent()) {
                order.add(i);
            }
        }
        order.sort((a, b) -> Integer.compare(one.n(a), one.n(b)));
        double[] x = new double[order.size()];
        double[] y = new double[order.size()];
        double[] u = new double[order.size()];
        boolean[] flagged = new boolean[order.size()];
        for (int k = 0; k < x.length; k++) {
            int i = order.get(k);
            x[k] = one.n(i);
            y[k] = fit.measuredDefect(s, i);
            u[k] = fit.measuredDefectUncertainty(s, i).getAsDouble();
            flagged[k] = fit.isOutlier(s, i);
        }
        int lowest = Integer.MAX_VALUE;
        int highest = Integer.MIN_VALUE;
        for (int i = 0; i < one.size(); i++) {
            lowest = Math.min(lowest, one.n(i));
            highest = Math.max(highest, one.n(i));
        }
        // the fitted delta(n) over the members' n (where n lies above d0, as the formula needs)
        double d0 = fit.defects(s)[0];
        int points = 200;
        List<double[]> line = new ArrayList<>();
        for (int k = 0; k <= points; k++) {
            double at = lowest + (highest - lowest) * (double) k / points;
            if (at > d0) {
                line.add(new double[] {at, fit.fittedDefect(s, at)});
            }
        }
        double[] curveN = line.stream().mapToDouble(v -> v[0]).toArray();
        double[] curve = line.stream().mapToDouble(v -> v[1]).toArray();
        int left = one.size() - order.size();
        String title = contents.species().notation() + " " + one.name() + ": quantum defect n - n* against n, "
                + "measured (bars: u of the level) and fitted"
                + (left == 0 ? "" : " (" + left + " at or above the fitted limit not drawn)");
        return Plots.defectChart(title, x, y, u, flagged, curveN, curve);
    }

    /** Notes a known limit that the members put elsewhere (residual beyond 3 of its uncertainties). */
    private void noteKnownLimit(SeriesFit fit) {
        double r = fit.knownLimitResidualSigma().orElse(0);
        if (Math.abs(r) > 3) {
            spec.commandLine().getErr().println(String.format(java.util.Locale.ROOT, "note: --limit %s: the fitted "
                    + "limit %.6f cm-1 lies %.1f of its standard uncertainties from it; the members put the limit "
                    + "elsewhere, so check the limit, its uncertainty and the members' n (the fit without --limit "
                    + "shows where)", limitText(), fit.limitPerCm(), r));
        }
    }

    private String limitText() {
        return String.join(",", limit.stream().map(String::valueOf).toList());
    }

    private void print(SeriesFit fit, SeriesFiles.Contents contents, List<SeriesFit.Prediction> predictions,
            List<SeriesFit.AveragedPrediction> averaged) {
        PrintWriter out = spec.commandLine().getOut();
        boolean text = format == Table.Format.text;
        if (text) {
            int members = fit.series().stream().mapToInt(RydbergSeries::size).sum();
            out.printf(java.util.Locale.ROOT, "%s: %d series, %d members%s, R_M = %.6f cm-1; chi2 = %.4g for %d "
                    + "degrees of freedom%s%s%n%n", contents.species().notation(), fit.series().size(), members,
                    fit.levelsMeasured() == members ? "" : " (measurements of " + fit.levelsMeasured() + " levels)",
                    fit.rydbergPerCm(), fit.chiSquare(),
                    fit.degreesOfFreedom(), quality(fit), fit.unsettledTerms().isPresent()
                            ? "; the choice of terms is UNSETTLED: see the notes for what to quote" : "");
            if (!limit.isEmpty()) {
                out.printf(java.util.Locale.ROOT, "Known limit %s +- %s cm-1 taken as a datum%n%n", limit.get(0),
                        limit.get(1));
            }
        } else {
            // the text's first line, as a row of its own for scripts
            Table summary = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("species", "species"),
                    Table.Column.number("series", "series", "%d"), Table.Column.number("members", "members", "%d"),
                    Table.Column.number("rydberg_per_cm", "R_M cm-1", "%.9g"),
                    Table.Column.number("chi_square", "chi2", "%.6g"),
                    Table.Column.number("degrees_of_freedom", "dof", "%d"),
                    Table.Column.text("known_limit", "known limit"),
                    Table.Column.number("chi_square_probability", "P(chi2)", "%.3g"),
                    Table.Column.text("fit_quality", "quality"),
                    Table.Column.number("uncertainty_scale", "S", "%.4g"),
                    Table.Column.text("term_choice", "terms"), Table.Column.number("levels", "levels", "%d")), out,
                    format);
            summary.add("fit", contents.species().notation(), fit.series().size(),
                    fit.series().stream().mapToInt(RydbergSeries::size).sum(), fit.rydbergPerCm(), fit.chiSquare(),
                    fit.degreesOfFreedom(), limit.isEmpty() ? null : limit.get(0) + " +- " + limit.get(1) + " cm-1",
                    fit.chiSquareProbability().isPresent() ? fit.chiSquareProbability().getAsDouble() : null,
                    fit.chiSquareProbability().isEmpty() ? "no degrees of freedom"
                            : fit.isImprobable() ? "improbable" : fit.isTooGood() ? "too-good" : "consistent",
                    fit.uncertaintyScale(), fit.candidates().size() == 1 ? "one-model"
                            : fit.unsettledTerms().isPresent() ? "unsettled" : "settled", fit.levelsMeasured());
            summary.finish();
        }
        Table parameters = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("parameter", "parameter"),
                Table.Column.number("value", "value", "%.11g"), Table.Column.number("uncertainty", "uncertainty", "%.3g"),
                Table.Column.number("scaled_uncertainty", "u x S", "%.3g"), Table.Column.text("unit", "unit")), out,
                format);
        List<String> names = fit.parameterNames();
        double scale = fit.uncertaintyScale();
        parameters.add("parameter", "limit", fit.limitPerCm(), fit.limitUncertaintyPerCm(),
                scale * fit.limitUncertaintyPerCm(), "cm-1");
        int at = 1;
        for (int s = 0; s < fit.series().size(); s++) {
            double[] d = fit.defects(s);
            double[] u = fit.defectUncertainties(s);
            for (int k = 0; k < d.length; k++) {
                parameters.add("parameter", names.get(at++), d[k], u[k], scale * u[k], "");
            }
        }
        if (fit.candidates().size() > 1) {
            // the limit and defects over the models tried, BIC-weighted, with the uncertainty of the choice of terms
            SeriesFit.ModelAverage average = fit.modelAveragedLimit();
            parameters.add("parameter", "limit, model-averaged", average.limitPerCm(), average.uncertaintyPerCm(),
                    null, "cm-1");
            for (int s = 0; s < fit.series().size(); s++) {
                SeriesFit.DefectAverage defects = fit.modelAveragedDefectsWithUncertainties(s);
                double[] d = defects.defects();
                double[] u = defects.uncertainties();
                for (int k = 0; k < d.length; k++) {
                    parameters.add("parameter", fit.series().get(s).name() + " d" + 2 * k + ", model-averaged", d[k],
                            u[k], null, "");
                }
            }
        }
        parameters.finish();
        section(text, "covariance (limit in cm-1, defects dimensionless)");
        Table covariance = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("row", "row"),
                Table.Column.text("column", "column"), Table.Column.number("covariance", "covariance", "%.4e"),
                Table.Column.number("correlation", "correlation", "%.4f")), out, format);
        double[][] c = fit.covariance();
        for (int i = 0; i < c.length; i++) {
            for (int j = 0; j <= i; j++) {
                covariance.add("covariance", names.get(i), names.get(j), c[i][j], c[i][j] / Math.sqrt(c[i][i] * c[j][j]));
            }
        }
        covariance.finish();
        section(text, "members");
        Table members = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("series", "series"),
                Table.Column.text("n", "n"), Table.Column.number("energy_per_cm", "energy cm-1", "%.6f"),
                Table.Column.number("uncertainty_per_cm", "u cm-1", "%.3g"),
                Table.Column.number("fitted_per_cm", "fitted cm-1", "%.6f"),
                Table.Column.number("residual_per_cm", "residual cm-1", "%.3g"),
                Table.Column.number("normalised_residual", "residual/u", "%.2f"),
                Table.Column.number("quantum_defect", "defect", "%.6f"), Table.Column.text("flag", "flag"),
                Table.Column.text("where", "where")), out, format);
        // members of a level measured more than once: disagreeing (or identical) pairs are flagged on both rows
        java.util.Set<String> disagree = new java.util.HashSet<>();
        java.util.Set<String> identical = new java.util.HashSet<>();
        for (SeriesFit.Repeat r : fit.repeatedMeasurements()) {
            if (r.disagrees()) {
                disagree.add(r.series() + ":" + r.first());
                disagree.add(r.series() + ":" + r.second());
            }
            if (r.identical()) {
                identical.add(r.series() + ":" + r.first());
                identical.add(r.series() + ":" + r.second());
            }
        }
        for (int s = 0; s < fit.series().size(); s++) {
            RydbergSeries one = fit.series().get(s);
            for (int i = 0; i < one.size(); i++) {
                double r = fit.residualPerCm(s, i);
                boolean above = fit.measuredDefectUncertainty(s, i).isEmpty();
                List<String> flags = new ArrayList<>();
                if (fit.isOutlier(s, i)) {
                    flags.add("outlier");
                }
                if (above) {
                    flags.add("above limit");
                }
                if (disagree.contains(s + ":" + i)) {
                    flags.add("repeat disagrees");
                }
                if (identical.contains(s + ":" + i)) {
                    flags.add("identical repeat");
                }
                String flag = flags.isEmpty() ? null : String.join(", ", flags);
                members.add("member", one.name(), one.n(i), one.energyPerCm(i), one.uncertaintyPerCm(i),
                        one.energyPerCm(i) - r, r, fit.normalisedResidual(s, i),
                        above ? null : fit.measuredDefect(s, i), flag, one.where(i));
            }
        }
        members.finish();
        if (!predict.isEmpty()) {
            section(text, "predicted members");
            Table predicted = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("series", "series"),
                    Table.Column.text("n", "n"), Table.Column.number("energy_per_cm", "energy cm-1", "%.6f"),
                    Table.Column.number("uncertainty_per_cm", "u cm-1", "%.3g"),
                    Table.Column.number("scaled_uncertainty_per_cm", "u x S cm-1", "%.3g"),
                    Table.Column.number("truncation_per_cm", "trunc. cm-1", "%.3g"),
                    Table.Column.number("quantum_defect", "defect", "%.6f"),
                    Table.Column.number("averaged_energy_per_cm", "averaged cm-1", "%.6f"),
                    Table.Column.number("averaged_uncertainty_per_cm", "u avg cm-1", "%.3g"),
                    Table.Column.text("note", "note")),
                    out, format);
            for (int i = 0; i < predictions.size(); i++) {
                SeriesFit.Prediction p = predictions.get(i);
                SeriesFit.AveragedPrediction a = averaged.get(i);
                String name = fit.series().get(p.series()).name();
                Double mean = a.energyPerCm().isPresent() ? a.energyPerCm().getAsDouble() : null;
                Double u = mean == null ? null : a.uncertaintyPerCm().getAsDouble();
                if (p.member().isEmpty()) {
                    predicted.add("prediction", name, p.n(), null, null, null, null, null, mean, u,
                            "withheld (see note)");
                    continue;
                }
                SeriesFit.Member m = p.member().get();
                predicted.add("prediction", name, p.n(), m.energyPerCm(), m.uncertaintyPerCm(),
                        m.uncertaintyPerCm(scale), m.truncationPerCm(), m.quantumDefect(), mean, u,
                        mean == null ? "averaged withheld (see note)"
                                : p.note().isPresent() ? "below the measured members" : null);
            }
            predicted.finish();
        }
        section(text, "models tried (BIC = chi2 + p ln N; the lowest is used; weight exp(-BIC/2) for the average)");
        Table candidates = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("terms", "terms"),
                Table.Column.number("chi2", "chi2", "%.4g"), Table.Column.number("bic", "BIC", "%.4g"),
                Table.Column.number("limit_per_cm", "limit cm-1", "%.6f"),
                Table.Column.number("limit_uncertainty_per_cm", "u cm-1", "%.3g"),
                Table.Column.number("weight", "weight", "%.3g")), out, format);
        List<Double> weights = fit.modelAveragedLimit().weights();
        for (int k = 0; k < fit.candidates().size(); k++) {
            SeriesFit.Candidate candidate = fit.candidates().get(k);
            candidates.add("model", candidate.terms().toString().replace(" ", ""), candidate.chiSquare(),
                    candidate.bic(), candidate.limitPerCm(), candidate.limitUncertaintyPerCm(), weights.get(k));
        }
        candidates.finish();
        out.flush();
    }

    /** @return the text summary's account of the fit's chi-square probability */
    private static String quality(SeriesFit fit) {
        if (fit.chiSquareProbability().isEmpty()) {
            return "";
        }
        double p = fit.chiSquareProbability().getAsDouble();
        return fit.isImprobable() ? String.format(java.util.Locale.ROOT, " (probability %s: IMPROBABLE, see the "
                + "notes; u x S scales the uncertainties by S = %.4g)", SeriesFit.probabilityText(p),
                fit.uncertaintyScale()) : fit.isTooGood() ? " (probability " + digits(p)
                + ": TOO GOOD, the uncertainties look overstated; see the notes)" : " (probability " + digits(p) + ")";
    }

    /** @return a probability with three digits (0.996, not 1.0), or "above 0.999" where those round to 1 */
    private static String digits(double p) {
        return p >= 0.9995 ? "above 0.999" : String.format(java.util.Locale.ROOT, "%.3g", p);
    }

    private void section(boolean text, String title) {
        PrintWriter out = spec.commandLine().getOut();
        if (text) {
            out.println();
            out.println(title);
        } else if (format == Table.Format.csv) {
            out.println();
        }
    }
}
