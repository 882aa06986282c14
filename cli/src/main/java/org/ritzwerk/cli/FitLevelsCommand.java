package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.ritz.LevelOptimizer;
import org.ritzwerk.engine.ritz.LevelOptimum;
import org.ritzwerk.engine.ritz.MeasuredLines;
import org.ritzwerk.engine.ritz.RitzException;
import org.ritzwerk.engine.ritz.SystemReference;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.SpectralQuantity;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.quantity.Wavenumber;
import org.ritzwerk.refdata.LevelListFiles;
import org.ritzwerk.refdata.MeasuredLineFiles;
import org.ritzwerk.refdata.OutputFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code ritzwerk fit-levels}: level energies optimised from measured, assigned lines. */
@Command(name = "fit-levels",
        mixinStandardHelpOptions = true,
        header = "Optimise level energies from measured lines by the Ritz combination principle.",
        description = "Reads a ritzwerk-measured-lines file (position as wavelength with its medium, wavenumber, "
                + "frequency or energy, its uncertainty, and the labels of the upper and lower level) and fits "
                + "the level energies by weighted least squares, one reference level held at its energy. Lines "
                + "whose normalised residual is beyond the threshold are left out one at a time, the worst "
                + "first, and the levels fitted again. Prints the levels with their uncertainties, then every "
                + "line with its Ritz wavenumber and wavelength, residual against the final fit and flag "
                + "(fitted, outlier: left out, determines-level, unresolved); in csv the sections follow one "
                + "another, each with its header row. With --separate-systems, levels that no chain of lines "
                + "joins to the reference form systems fitted each on its own: a floating system's energies are "
                + "relative to its reference level (E = energy + xN, xN unknown, N its system number; the offset "
                + "column says +xN), an anchored one's absolute.",
        footer = {"", "Examples:",
            "  ritzwerk fit-levels lines.csv --reference \"1s2s 3S1\" --reference-energy \"159855.9743 cm-1\"",
            "  ritzwerk fit-levels lines.csv --reference \"1s2 1S0\" --medium air --format json --out fit.json",
            "  ritzwerk fit-levels lines.csv --reference \"4s 2S1/2\" --species \"Ca II\" --levels-out ca-ii.csv",
            "  ritzwerk fit-levels he.csv --reference \"1s2s 1S0\" --separate-systems",
            "  ritzwerk fit-levels he.csv --reference \"1s2s 1S0\" --system-reference \"1s2s 3S1@159855.974(1) cm-1\""})
final class FitLevelsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(paramLabel = "FILE", description = "The ritzwerk-measured-lines file (.csv or .json).")
    Path file;

    @Option(names = "--reference", paramLabel = "LABEL", required = true,
            description = "The level held at --reference-energy, e.g. the ground level.")
    String reference;

    @Option(names = "--reference-energy", paramLabel = "QUANTITY", defaultValue = "0 cm-1",
            description = "Its energy above the ground level: a wavenumber, energy or frequency such as "
                    + "\"159855.9743 cm-1\" or \"19.82 eV\" (default: ${DEFAULT-VALUE}).")
    String referenceEnergy;

    @Option(names = "--separate-systems",
            description = "Accept levels that no chain of lines joins to --reference: each such system is fitted "
                    + "on its own, its energies relative to its lowest level (or its --system-reference), marked "
                    + "+xN in the offset column, N the system's number. Without it such levels are refused.")
    boolean separateSystems;

    @Option(names = "--system-reference", paramLabel = "LABEL[@ENERGY]",
            description = "The level held in its system (one per system no line joins to --reference; repeatable; "
                    + "implies --separate-systems): LABEL alone floats the system on that level; LABEL@ENERGY gives "
                    + "its energy above the ground level with its standard uncertainty (\"159855.9743(5) cm-1\", "
                    + "\"19.82 +- 0.001 eV\"; +- 0 for an exact value), making the system's energies absolute. A value "
                    + "that is a level's label whole is that label, even with an '@' in it.")
    List<String> systemReferences;

    @Option(names = "--threshold", paramLabel = "N", defaultValue = "3",
            description = "The normalised residual beyond which the worst line is left out (default: "
                    + "${DEFAULT-VALUE}).")
    double threshold;

    @Option(names = "--medium", paramLabel = "MEDIUM", defaultValue = "vacuum",
            description = "Medium of the Ritz wavelength column: vacuum or air (default: ${DEFAULT-VALUE}).")
    String medium;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "text (aligned tables), csv or json (one object per line, with a 'kind' field). "
                    + "Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Option(names = "--out", paramLabel = "FILE",
            description = "Write the result here (a temporary file renamed into place) instead of to the output.")
    Path out;

    @Option(names = "--levels-out", paramLabel = "FILE",
            description = "Also write the fitted levels with their correlations as a ritzwerk-levels file (.json: "
                    + "JSON, else CSV; a temporary file renamed into place), for --data of lines, identify and the "
                    + "other commands. Needs --species.")
    Path levelsOut;

    @Option(names = "--species", paramLabel = "SPECIES",
            description = "The species of the levels in --levels-out, e.g. \"Ca II\".")
    String species;

    @Override
    public Integer call() throws IOException {
        if (!(threshold > 0) || Double.isInfinite(threshold)) {
            throw new OptionException("--threshold must be a finite number above 0, got " + threshold);
        }
        if (reference.isBlank()) {
            throw new OptionException("--reference needs a level label");
        }
        Medium shown = AxisMedium.of(medium);
        double referencePerCm = referencePerCm();
        Species levelSpecies = levelSpecies();
        if (out != null || levelsOut != null) {
            OutputFiles.check(List.of(new OutputFiles.Named("--out", out),
                    new OutputFiles.Named("--levels-out", levelsOut)), List.of(new OutputFiles.Named("FILE", file)));
        }
        MeasuredLineFiles.Contents contents = MeasuredLineFiles.read(file);
        MeasuredLines problem = contents.problem(reference, referencePerCm);
        List<SystemReference> anchors = systemReferences(problem.levels());
        boolean touched = false;
        for (int k = 0; k < problem.size(); k++) {
            touched |= problem.upper(k) == 0 || problem.lower(k) == 0;
        }
        if (!touched) {
            throw new OptionException("--reference: no line of " + file + " has the level '" + problem.reference()
                    + "'");
        }
        LevelOptimum fit;
        // thousands of levels take minutes (each fit a QR of lines x levels): a sign of life on a terminal
        Progress.Running running = Progress.ticking(spec.commandLine().getErr(), String.format(Locale.ROOT,
                "fit-levels: %d levels from %d lines", problem.levels().size(), problem.size()));
        try {
            LevelOptimizer optimizer = LevelOptimizer.defaults().withOutlierThreshold(threshold);
            fit = (anchors == null ? optimizer : optimizer.withSeparateSystems(anchors)).optimize(problem);
        } catch (RitzException e) {
            if (RitzException.BAD_REFERENCE.equals(e.code())) {
                throw new OptionException("--system-reference: " + e.getMessage() + " (lines of " + file + ")");
            }
            String hint = RitzException.UNCONNECTED.equals(e.code()) && anchors == null ? "; on the command line, "
                    + "--separate-systems fits each system on its own (--system-reference LABEL@ENERGY to anchor one)"
                    : "";
            throw new RitzException(e.code(), file + ": " + e.getMessage() + hint);
        } finally {
            running.close();
        }
        for (String note : problem.lookAlikeLabelNotes()) {
            spec.commandLine().getErr().println("note: " + note);
        }
        for (String note : systemNotes(fit)) {
            spec.commandLine().getErr().println("note: " + note);
        }
        if (levelsOut != null) {
            String levels;
            try {
                // a floating system's energies are relative: left out (named in a note), never written as absolute
                LevelList list = fit.absoluteLevels(levelSpecies).toLevelList(levelListInfo(levelSpecies, fit));
                levels = levelsOut.toString().toLowerCase(Locale.ROOT).endsWith(".json")
                        ? LevelListFiles.writeJson(list) : LevelListFiles.writeCsv(list);
            } catch (RitzException e) {
                throw new RitzException(e.code(), "--levels-out: " + e.getMessage());
            }
            OutputFiles.writeString(levelsOut, levels);
            for (LevelOptimum.LevelSystem s : fit.systems()) {
                if (!s.isAbsolute()) {
                    spec.commandLine().getErr().printf(Locale.ROOT, "note: --levels-out leaves out system %d (%d "
                            + "levels relative to '%s'): give its reference an energy with --system-reference "
                            + "\"%s@ENERGY\" to write them%n", s.index() + 1, s.levels().size(), s.reference(),
                            s.reference());
                }
            }
        }
        if (out == null) {
            PrintWriter writer = spec.commandLine().getOut();
            print(fit, shown, writer);
            writer.flush();
        } else {
            OutputFiles.writeText(out, w -> {
                PrintWriter writer = new PrintWriter(w);
                print(fit, shown, writer);
                writer.flush();
            });
        }
        return 0;
    }

    /** @return the species of --levels-out, null without it; --species alone is refused */
    private Species levelSpecies() {
        if (levelsOut == null) {
            if (species != null) {
                throw new OptionException("--species names the species of --levels-out; give --levels-out FILE too");
            }
            return null;
        }
        if (species == null || species.isBlank()) {
            throw new OptionException("--levels-out needs --species, the species of the levels (e.g. \"Ca II\")");
        }
        try {
            return Species.parse(species);
        } catch (RitzwerkException e) {
            throw new OptionException("--species: " + e.getMessage());
        }
    }

    /**
     * What the written level list is: its id from the file name (lower case; other characters than
     * letters, digits, dots and dashes become dashes), computed by this command from the measured
     * lines, with the fit's settings and chi2 as its version.
     */
    private DataSetInfo levelListInfo(Species s, LevelOptimum fit) {
        String name = levelsOut.getFileName().toString();
        int dot = name.lastIndexOf('.');
        String id = (dot > 0 ? name.substring(0, dot) : name).toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9.-]", "-")
                .replaceAll("^[^a-z0-9]+", "");
        if (!DataSetInfo.isValidId(id)) {
            id = "fitted-levels";
        }
        MeasuredLines problem = fit.problem();
        String version = String.format(Locale.ROOT, "reference '%s' held at %s cm-1; threshold %s; %d of %d lines; "
                + "chi2 %.6g for %d degrees of freedom", problem.reference(), problem.referencePerCm(),
                fit.outlierThreshold(), problem.size() - fit.leftOut().size(), problem.size(), fit.chiSquare(),
                fit.degreesOfFreedom());
        return new DataSetInfo(id, DataKind.LEVELS,
                s.notation() + " levels fitted to the lines of " + file.getFileName(),
                version, Provenance.computedBy("ritzwerk fit-levels from " + file.getFileName()
                        + " (weighted least squares of the level energies; correlations from their covariance)"),
                List.of(s));
    }

    /**
     * @param labels the problem's level labels: a value that is one of them whole is a label, even with an '@'
     * @return the --system-reference values as references (LABEL, or LABEL@ENERGY split at the last '@'),
     *         an empty list for --separate-systems alone, null for neither
     */
    private List<SystemReference> systemReferences(List<String> labels) {
        if (systemReferences == null || systemReferences.isEmpty()) {
            return separateSystems ? List.of() : null;
        }
        List<SystemReference> out = new ArrayList<>();
        for (String value : systemReferences) {
            int at = labels.contains(value.strip().replaceAll("\\s+", " ")) ? -1 : value.lastIndexOf('@');
            String label = (at < 0 ? value : value.substring(0, at)).strip();
            if (label.isEmpty()) {
                throw new OptionException("--system-reference '" + value + "': needs a level label (LABEL or "
                        + "LABEL@ENERGY)");
            }
            if (at < 0) {
                out.add(SystemReference.floating(label));
                continue;
            }
            String energy = value.substring(at + 1).strip();
            SpectralQuantity q = AxisMedium.spectral("--system-reference '" + value + "'", energy);
            if (q instanceof Wavelength) {
                throw new OptionException("--system-reference '" + value + "': the energy after '@' is an energy "
                        + "above the ground level: give a wavenumber, energy or frequency, not a wavelength");
            }
            Wavenumber w = q.toWavenumber();
            if (w.uncertaintyIn(Unit.PER_CENTIMETRE).isEmpty()) {
                throw new OptionException("--system-reference '" + value + "': give the energy's standard "
                        + "uncertainty, concise or after +-, e.g. '" + label + "@159855.9743(5) cm-1' or '" + label
                        + "@159855.9743 +- 0.0005 cm-1' (+- 0 for an exact value)");
            }
            out.add(SystemReference.at(label, w.inPerCentimetre(), w.uncertaintyIn(Unit.PER_CENTIMETRE).getAsDouble()));
        }
        return out;
    }

    /** @return one note per floating system, naming its number, reference and the '+xN' form of its energies */
    private static List<String> systemNotes(LevelOptimum fit) {
        List<String> notes = new ArrayList<>();
        for (LevelOptimum.LevelSystem s : fit.systems()) {
            if (s.index() == 0) {
                continue;
            }
            int n = s.index() + 1;
            if (s.isAbsolute()) {
                notes.add(String.format(Locale.ROOT, "system %d (%d levels, no line to '%s') is anchored: '%s' held "
                        + "at %.6f +- %.2g cm-1, its uncertainty included in every level of the system", n,
                        s.levels().size(), fit.problem().reference(), s.reference(), s.referencePerCm(),
                        s.referenceUncertaintyPerCm()));
            } else {
                notes.add(String.format(Locale.ROOT, "system %d (%d levels, no line to '%s') floats: its energies are "
                        + "relative to '%s'%s, E = energy + x%d with x%d unknown, and so are their uncertainties; "
                        + "no line between it and another system can be predicted", n, s.levels().size(),
                        fit.problem().reference(), s.reference(), s.named() ? "" : " (its lowest level)", n, n));
            }
        }
        return notes;
    }

    /** @return the '+xN' offset of a level of a floating system, null for an absolute one */
    private static String offset(LevelOptimum fit, int level) {
        return fit.isAbsolute(level) ? null : offset(fit.systemOf(level));
    }

    /** @return the '+xN' offset of the energies of floating system {@code index} (N = index + 1) */
    private static String offset(int index) {
        return "+x" + (index + 1);
    }

    /** @return --reference-energy in cm^-1, refusing wavelengths and values below 0 */
    private double referencePerCm() {
        SpectralQuantity q = AxisMedium.spectral("--reference-energy", referenceEnergy);
        if (q instanceof Wavelength) {
            throw new OptionException("--reference-energy is an energy above the ground level: give a wavenumber, "
                    + "energy or frequency, not a wavelength ('" + referenceEnergy + "')");
        }
        return q.toWavenumber().inPerCentimetre();
    }

    private void print(LevelOptimum fit, Medium shown, PrintWriter writer) {
        MeasuredLines problem = fit.problem();
        boolean text = format == Table.Format.text;
        int lines = problem.size();
        if (text) {
            writer.printf(Locale.ROOT, "%d levels from %d of %d lines (%d left out); chi2 = %.4g for %d degrees of "
                    + "freedom; '%s' held at %.6f cm-1%s%n%n", fit.levelLabels().size(), lines - fit.leftOut().size(),
                    lines, fit.leftOut().size(), fit.chiSquare(), fit.degreesOfFreedom(), problem.reference(),
                    problem.referencePerCm(), fit.systems().size() == 1 ? "" : "; " + fit.systems().size()
                    + " systems of levels that no line joins, each fitted on its own (below)");
        } else {
            Table summary = new Table(List.of(Table.Column.text("kind", "kind"),
                    Table.Column.number("levels", "levels", "%d"), Table.Column.number("lines", "lines", "%d"),
                    Table.Column.number("left_out", "left out", "%d"),
                    Table.Column.number("chi_square", "chi2", "%.6g"),
                    Table.Column.number("degrees_of_freedom", "dof", "%d"), Table.Column.text("reference", "reference"),
                    Table.Column.number("reference_per_cm", "reference cm-1", "%.6f"),
                    Table.Column.number("threshold", "threshold", "%.6g"),
                    Table.Column.number("systems", "systems", "%d")), writer, format);
            summary.add("fit", fit.levelLabels().size(), lines, fit.leftOut().size(), fit.chiSquare(),
                    fit.degreesOfFreedom(), problem.reference(), problem.referencePerCm(), fit.outlierThreshold(),
                    fit.systems().size());
            summary.finish();
        }
        if (fit.systems().size() > 1) {
            Table systems = new Table(List.of(Table.Column.text("kind", "kind"),
                    Table.Column.number("system", "system", "%d"), Table.Column.text("reference", "reference"),
                    Table.Column.text("standing", "standing"),
                    Table.Column.number("reference_per_cm", "reference cm-1", "%.6f"),
                    Table.Column.number("reference_uncertainty_per_cm", "u cm-1", "%.2g"),
                    Table.Column.text("offset", "offset"), Table.Column.number("levels", "levels", "%d"),
                    Table.Column.number("lines", "lines", "%d"), Table.Column.number("chi_square", "chi2", "%.4g"),
                    Table.Column.number("degrees_of_freedom", "dof", "%d")), writer, format);
            for (LevelOptimum.LevelSystem s : fit.systems()) {
                systems.add("system", s.index() + 1, s.reference(), s.standing().name().toLowerCase(Locale.ROOT),
                        s.isAbsolute() ? s.referencePerCm() : null, s.referenceUncertaintyPerCm(),
                        s.isAbsolute() ? null : offset(s.index()), s.levels().size(), s.lines(), s.chiSquare(),
                        s.degreesOfFreedom());
            }
            systems.finish();
            section(writer, "levels (offset +xN: relative to system N's reference, E = energy + xN, xN unknown)");
        }
        Table levels = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("level", "level"),
                Table.Column.number("energy_per_cm", "energy cm-1", "%.6f"), Table.Column.text("offset", "offset"),
                Table.Column.number("uncertainty_per_cm", "u cm-1", "%.2g"),
                Table.Column.number("system", "system", "%d")), writer, format);
        for (int i = 0; i < fit.levelLabels().size(); i++) {
            levels.add("level", fit.levelLabels().get(i), fit.energyPerCm(i), offset(fit, i), fit.uncertaintyPerCm(i),
                    fit.systemOf(i) + 1);
        }
        levels.finish();
        section(writer, "lines (residual = measured - Ritz, against the levels above; wavelengths in "
                + medium + ", none for air outside its model's range)");
        String nm = medium + " nm";
        Table table = new Table(List.of(Table.Column.text("kind", "kind"), Table.Column.text("where", "where"),
                Table.Column.text("upper", "upper"), Table.Column.text("lower", "lower"),
                Table.Column.number("measured_per_cm", "measured cm-1", "%.6f"),
                Table.Column.number("uncertainty_per_cm", "u cm-1", "%.2g"),
                Table.Column.number("ritz_per_cm", "Ritz cm-1", "%.6f"),
                Table.Column.number("ritz_uncertainty_per_cm", "u Ritz cm-1", "%.2g"),
                Table.Column.number("ritz_nm", "Ritz " + nm, "%.7f"),
                Table.Column.number("ritz_uncertainty_nm", "u Ritz nm", "%.2g"),
                Table.Column.number("residual_per_cm", "residual cm-1", "%.3g"),
                Table.Column.number("normalised_residual", "res/sigma", "%.2f"),
                Table.Column.text("flag", "flag"), Table.Column.number("left_out", "left out", "%d"),
                Table.Column.text("unresolved_with", "unresolved with"),
                Table.Column.number("system", "system", "%d")), writer, format);
        for (int k = 0; k < lines; k++) {
            double ritz = fit.ritzPerCm(k);
            double u = fit.ritzUncertaintyPerCm(k);
            Double wavelength = null;           // none outside the air model's range
            Double wavelengthU = null;
            try {
                Wavelength w = Wavenumber.of(ritz, u, Unit.PER_CENTIMETRE).toWavelength(shown);
                wavelength = w.valueIn(Unit.NANOMETRE);
                wavelengthU = w.uncertaintyIn(Unit.NANOMETRE).orElse(Double.NaN);
            } catch (MediumException e) {
                // left empty
            }
            int order = fit.leftOut().indexOf(k);
            table.add("line", problem.name(k), problem.levels().get(problem.upper(k)),
                    problem.levels().get(problem.lower(k)), problem.wavenumberPerCm(k), problem.uncertaintyPerCm(k),
                    ritz, u, wavelength, wavelengthU, fit.residualPerCm(k),
                    fit.standardisedResidual(k).isPresent() ? fit.standardisedResidual(k).getAsDouble() : null,
                    fit.flag(k).name().toLowerCase(Locale.ROOT).replace('_', '-'), order < 0 ? null : order + 1,
                    fit.unresolvedWith(k).isPresent() ? problem.name(fit.unresolvedWith(k).getAsInt()) : null,
                    fit.systemOf(problem.upper(k)) + 1);
        }
        table.finish();
    }

    private void section(PrintWriter writer, String title) {
        if (format == Table.Format.text) {
            writer.println();
            writer.println(title);
        } else if (format == Table.Format.csv) {
            writer.println();
        }
    }
}
