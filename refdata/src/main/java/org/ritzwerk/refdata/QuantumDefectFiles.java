package org.ritzwerk.refdata;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.CorePolarizability;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.QuantumDefects;

/**
 * Ritzwerk's quantum-defect file format ({@code ritzwerk-quantum-defects}, version 1), CSV:
 * <pre>
 * # ritzwerk-quantum-defects 1
 * # id: quantum-defects-rb-87
 * # title: ...
 * # species: Rb-87 I
 * # source: the papers
 * # provenance: published
 * # version: 2011
 * # limit-per-cm: 33690.804799                    (or the next two)
 * # limit: 1010029.1646 GHz                       (the limit in its publication's unit and digits)
 * # limit-from: -4271.676631815 MHz              (optional: the level it is measured from)
 * # limit-uncertainty: 0.0003                     (optional: the limit's standard uncertainty, in its unit)
 * # limit-uncertainty-source: ...                 (optional: how it was obtained, where a paper did not state
 *                                                 it; the built-in files' from-residuals estimate; not kept
 *                                                 when a data set is written)
 * # limit-provenance: from-memory
 * # limit-source: ...
 * # limit-check: ...                              (optional: how the limit was checked)
 * # core-dipole-polarizability-au: 9.116          (optional, with the next two)
 * # core-quadrupole-polarizability-au: 38.4
 * # core-source: ...
 * # core-check: ...                               (optional: how the polarizabilities were checked)
 * # levels: levels-rb-87                          (optional: the id of the measured low levels)
 * # note: ...                                     (optional)
 * l,j,d0,d2,d4,d6,d8,valid-from-n,provenance,source,checked
 * 0,1/2,3.1311807,0.1787,0,0,0,10,from-memory,Mack et al. ...,check 1: ...
 * </pre>
 * or, stating the coefficients' standard uncertainties ({@link #COLUMNS_WITH_UNCERTAINTIES}; an
 * empty field is "not stated", and a level computed from a series with any coefficient's
 * uncertainty not stated, or from a file without {@code limit-uncertainty}, gets none):
 * <pre>
 * l,j,d0,d2,d4,d6,d8,u-d0,u-d2,u-d4,u-d6,u-d8,uncertainty-provenance,valid-from-n,provenance,source,checked
 * 0,1/2,3.1311807,0.1787,0,0,0,0.0000008,0.0002,,,,from-memory,10,from-memory,Mack et al. ...,check 1: ...
 * </pre>
 * The ionisation limit, above the hyperfine centroid of the ground level, is given either as
 * {@code limit-per-cm} (cm^-1) or as {@code limit}: a number and its unit ({@code cm-1}, {@code THz},
 * {@code GHz}, {@code MHz} or {@code kHz}), the digits and unit its publication prints, converted here exactly
 * (c = 299 792 458 m/s); {@code limit-from}, in the same units, is the energy above that centroid
 * of the level the published limit is measured from (a ground hyperfine level F; 0 when absent).
 * One row per series (l, j = l +- 1/2); trailing zero coefficients are dropped; the last two
 * columns are free text (the row's citation, and how its numbers were checked) and may contain
 * commas. The mass-corrected Rydberg constant is not in
 * the file: it is {@code R_M = R_inf / (1 + m_e / (M - m_e))} from the species' atomic mass M in
 * the nuclear data the file is read with (common practice: the core is the singly charged ion);
 * {@link DataContext#alkaliAtom(Species)} computes it again from the context's nuclear data. Every
 * problem in a file is reported at once with its line. Stateless and thread-safe.
 */
public final class QuantumDefectFiles {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-quantum-defects";
    /** The columns, in order. */
    public static final List<String> COLUMNS =
            List.of("l", "j", "d0", "d2", "d4", "d6", "d8", "valid-from-n", "provenance", "source", "checked");
    /**
     * The columns of a file that states the coefficients' standard uncertainties, in order: as
     * {@link #COLUMNS} with {@code u-d0} to {@code u-d8} (empty where not stated) and
     * {@code uncertainty-provenance} (published or from-memory, or {@link #RESIDUAL_DERIVED}; empty when the
     * row states none) after
     * {@code d8}.
     */
    public static final List<String> COLUMNS_WITH_UNCERTAINTIES = List.of("l", "j", "d0", "d2", "d4", "d6", "d8",
            "u-d0", "u-d2", "u-d4", "u-d6", "u-d8", "uncertainty-provenance", "valid-from-n", "provenance", "source",
            "checked");

    /**
     * The {@code uncertainty-provenance} of a row whose u-d0 to u-d8 are not a paper's but our own estimate
     * from the series' residuals against the measured levels ({@link QuantumDefects.Series#residualDerived()};
     * how the built-in files derive them: check R of {@code rydberg/fit-residuals.txt}).
     */
    public static final String RESIDUAL_DERIVED = "from-residuals";

    private static final List<String> REQUIRED = List.of("id", "title", "species", "source", "provenance", "version",
            "limit-provenance", "limit-source");
    /** The units {@code limit} and {@code limit-from} may carry. */
    public static final List<String> LIMIT_UNITS = List.of("cm-1", "THz", "GHz", "MHz", "kHz");
    private static final Set<String> KNOWN = Set.of("id", "title", "species", "source", "provenance", "version",
            "limit-per-cm", "limit", "limit-from", "limit-uncertainty", "limit-uncertainty-source", "limit-provenance",
            "limit-source", "limit-check",
            "core-dipole-polarizability-au",
            "core-quadrupole-polarizability-au", "core-source", "core-check", "levels", "note");

    /**
     * What a file holds: the quantum-defect set, whose record carries the core polarizabilities
     * and the id of the measured low levels when the file names them, and how the ionisation
     * limit was obtained.
     *
     * @param defects         the series, limit, R_M, core polarizabilities and levels id
     * @param limitProvenance how the ionisation limit was obtained
     */
    public record Content(QuantumDefects defects, Provenance limitProvenance) {
        /**
         * Validates the components.
         *
         * @param defects         the series, limit, R_M, core polarizabilities and levels id
         * @param limitProvenance how the ionisation limit was obtained
         */
        public Content {
            Objects.requireNonNull(defects, "defects");
            Objects.requireNonNull(limitProvenance, "limitProvenance");
        }
    }

    private QuantumDefectFiles() {
    }

    /**
     * @param in     the bytes (UTF-8), read to the end; not closed
     * @param source the file name, for messages
     * @return the content
     * @throws DataFileException with every problem found
     */
    public static Content read(InputStream in, String source) {
        return read(in, source, NuclearData.builtIn());
    }

    /**
     * @param in      the bytes (UTF-8), read to the end; not closed
     * @param source  the file name, for messages
     * @param nuclear the nuclear data whose atomic mass of the species gives R_M
     * @return the content
     * @throws DataFileException with every problem found (an isotope missing from {@code nuclear}
     *                           is one, {@code qd.no-mass})
     */
    public static Content read(InputStream in, String source, NuclearData nuclear) {
        Objects.requireNonNull(nuclear, "nuclear");
        List<DataProblem> problems = new ArrayList<>();
        Map<String, String> header = new LinkedHashMap<>();
        Map<String, Integer> headerLine = new LinkedHashMap<>();
        List<QuantumDefects.Series> series = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        boolean formatSeen = false;
        boolean columnsSeen = false;
        boolean withUncertainties = false;
        int number = 0;
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                number++;
                if (line.isBlank()) {
                    continue;
                }
                if (line.startsWith("#")) {
                    String text = line.substring(1).strip();
                    if (number == 1) {
                        if (!text.equals(FORMAT + " 1")) {
                            problems.add(new DataProblem(source, number, 1, "qd.format",
                                    "first line must be '# " + FORMAT + " 1'", line));
                        }
                        formatSeen = true;
                        continue;
                    }
                    int colon = text.indexOf(':');
                    if (colon < 0) {
                        continue; // a plain comment
                    }
                    String key = text.substring(0, colon).strip();
                    if (!KNOWN.contains(key)) {
                        problems.add(new DataProblem(source, number, 3, "qd.unknown-key", "unknown header key '" + key
                                + "'; known: " + String.join(", ", KNOWN.stream().sorted().toList()), line));
                    } else if (header.put(key, text.substring(colon + 1).strip()) != null) {
                        problems.add(new DataProblem(source, number, 3, "qd.duplicate-key", "header key '" + key
                                + "' given twice", line));
                    }
                    headerLine.put(key, number);
                    continue;
                }
                if (!columnsSeen) {
                    columnsSeen = true;
                    withUncertainties = line.strip().equals(String.join(",", COLUMNS_WITH_UNCERTAINTIES));
                    if (!withUncertainties && !line.strip().equals(String.join(",", COLUMNS))) {
                        problems.add(new DataProblem(source, number, 1, "qd.columns", "columns must be "
                                + String.join(",", COLUMNS) + " or " + String.join(",", COLUMNS_WITH_UNCERTAINTIES),
                                line));
                        break;
                    }
                    continue;
                }
                row(line, number, source, series, seen, problems, withUncertainties);
            }
        } catch (IOException e) {
            throw new DataFileException(DataFileException.UNREADABLE, source, List.of(), e.getMessage());
        }
        if (!formatSeen) {
            problems.add(new DataProblem(source, 1, 0, "qd.format", "empty file; expected '# " + FORMAT + " 1'", ""));
        }
        for (String key : REQUIRED) {
            if (!header.containsKey(key) || header.get(key).isEmpty()) {
                problems.add(new DataProblem(source, Math.max(1, number), 0, "qd.missing-key", "header key '" + key
                        + "' is missing", ""));
            }
        }
        boolean perCm = header.containsKey("limit-per-cm");
        boolean published = header.containsKey("limit");
        if (!perCm && !published) {
            problems.add(new DataProblem(source, Math.max(1, number), 0, "qd.missing-key", "header key 'limit-per-cm' "
                    + "(or 'limit' with its unit) is missing", ""));
        } else if (perCm && published) {
            problems.add(new DataProblem(source, headerLine.get("limit"), 3, "qd.two-limits", "give the limit once: "
                    + "'limit-per-cm' or 'limit', not both", header.get("limit")));
        } else if (perCm && header.containsKey("limit-from")) {
            problems.add(new DataProblem(source, headerLine.get("limit-from"), 3, "qd.bad-limit", "'limit-from' "
                    + "goes with 'limit' (a published limit in its own unit), not with 'limit-per-cm'",
                    header.get("limit-from")));
        }
        if (series.isEmpty() && problems.isEmpty()) {
            problems.add(new DataProblem(source, Math.max(1, number), 0, "qd.no-series", "no series rows", ""));
        }
        Content content = null;
        if (problems.isEmpty()) {
            content = build(header, headerLine, series, source, problems, nuclear);
        }
        if (!problems.isEmpty()) {
            throw new DataFileException(DataFileException.INVALID, source, problems, "");
        }
        return content;
    }

    /**
     * Writes a quantum-defect set in this format, so that {@link #read(InputStream, String, NuclearData)}
     * reads it back to an equal set when given nuclear data with the same atomic mass of the
     * species (R_M is not in the file; it is computed again on reading). What the format requires
     * but a data set does not keep is written as what it is: the limit's provenance is the set's,
     * its source and each row's source and check say that the data set does not keep them.
     *
     * @param defects the set
     * @return the file's text
     * @throws ReferenceDataException ({@link ReferenceDataException#NOT_WRITABLE}) naming what the
     *         format cannot hold: a species that is not a neutral isotope, a series of more than
     *         five coefficients or with a trailing zero, a header value with a line break or
     *         surrounding spaces, info species other than the set's species
     */
    public static String writeCsv(QuantumDefects defects) {
        DataSetInfo info = defects.info();
        Species species = defects.species();
        if (species.massNumber() == 0 || species.charge() != 0) {
            throw notWritable(info, "the species must be a neutral isotope such as Rb-87 I, got " + species);
        }
        if (!info.species().equals(List.of(species))) {
            throw notWritable(info, "the set's info names the species " + info.species() + ", the file can hold only "
                    + species.notation());
        }
        String kind = info.provenance().kind().id();
        StringBuilder out = new StringBuilder("# " + FORMAT + " 1\n");
        header(out, info, "id", info.id());
        header(out, info, "title", info.title());
        header(out, info, "species", species.notation());
        header(out, info, "source", info.provenance().detail());
        header(out, info, "provenance", kind);
        header(out, info, "version", info.version());
        header(out, info, "limit-per-cm", Double.toString(defects.limitPerCm()));
        if (defects.statedLimitUncertaintyPerCm().isPresent()) {
            header(out, info, "limit-uncertainty", Double.toString(defects.limitUncertaintyPerCm()));
        }
        header(out, info, "limit-provenance", kind);
        header(out, info, "limit-source", "not kept in the data set; see source");
        if (defects.corePolarizability().isPresent()) {
            CorePolarizability core = defects.corePolarizability().get();
            header(out, info, "core-dipole-polarizability-au", Double.toString(core.dipoleAu()));
            header(out, info, "core-quadrupole-polarizability-au", Double.toString(core.quadrupoleAu()));
            if (!core.source().isEmpty()) {
                header(out, info, "core-source", core.source());
            }
        }
        if (defects.levelsId().isPresent()) {
            header(out, info, "levels", defects.levelsId().get());
        }
        out.append("# Written from the data set ").append(info.id()).append(" by ritzwerk. A data set keeps neither")
                .append(" the source and check of each series nor the limit's own source\n");
        out.append("# (the original file has them). R_M is computed on reading from the atomic mass in the")
                .append(" nuclear data in use\n");
        boolean stated = defects.series().stream().anyMatch(x -> !x.uncertainties().isEmpty());
        out.append(String.join(",", stated ? COLUMNS_WITH_UNCERTAINTIES : COLUMNS)).append('\n');
        for (QuantumDefects.Series series : defects.series()) {
            List<Double> d = series.coefficients();
            if (d.size() > 5 || (d.size() > 1 && d.get(d.size() - 1) == 0)) {
                throw notWritable(info, "series l = " + series.l() + ", j = " + series.twoJ() + "/2 has the"
                        + " coefficients " + d + "; the file holds d0 to d8 with no trailing zero");
            }
            out.append(series.l()).append(',').append(series.twoJ()).append("/2");
            for (int i = 0; i < 5; i++) {
                out.append(',').append(Double.toString(i < d.size() ? d.get(i) : 0.0));
            }
            if (stated) {
                List<Double> u = series.uncertainties();
                for (int i = 0; i < 5; i++) {
                    boolean given = i < u.size() && !Double.isNaN(u.get(i));
                    out.append(',').append(given ? Double.toString(u.get(i)) : "");
                }
                out.append(',').append(u.isEmpty() ? "" : series.residualDerived() ? RESIDUAL_DERIVED : kind);
            }
            out.append(',').append(series.validFromN()).append(',').append(kind)
                    .append(",see the header source,not kept in the data set\n");
        }
        return out.toString();
    }

    private static void header(StringBuilder out, DataSetInfo info, String key, String value) {
        if (value.isEmpty() || !value.equals(value.strip()) || value.indexOf('\n') >= 0 || value.indexOf('\r') >= 0) {
            throw notWritable(info, "header '# " + key + ": ...' cannot hold '" + value
                    + "' (it must be one line, not empty, without surrounding spaces)");
        }
        out.append("# ").append(key).append(": ").append(value).append('\n');
    }

    private static ReferenceDataException notWritable(DataSetInfo info, String reason) {
        return new ReferenceDataException(ReferenceDataException.NOT_WRITABLE, "quantum-defect set '" + info.id()
                + "' cannot be written as a " + FORMAT + " file: " + reason);
    }

    private static void row(String line, int number, String source, List<QuantumDefects.Series> series,
            Set<String> seen, List<DataProblem> problems, boolean withUncertainties) {
        List<String> columns = withUncertainties ? COLUMNS_WITH_UNCERTAINTIES : COLUMNS;
        String[] all = line.split(",", columns.size());
        if (all.length < columns.size()) {
            problems.add(new DataProblem(source, number, 0, "qd.short-row", "a series row needs " + columns.size()
                    + " fields, got " + all.length, line));
            return;
        }
        List<Double> uncertainties = new ArrayList<>();
        String[] f = all;
        boolean residualDerived = withUncertainties && all[12].strip().equals(RESIDUAL_DERIVED);
        if (withUncertainties) {
            uncertainties = uncertainties(all, line, number, source, problems);
            f = new String[COLUMNS.size()];
            System.arraycopy(all, 0, f, 0, 7);
            System.arraycopy(all, 13, f, 7, COLUMNS.size() - 7);
        }
        int before = problems.size();
        int l = integer(f[0], "l", line, number, source, problems);
        int twoJ = -1;
        String j = f[1].strip();
        if (j.matches("\\d{1,3}/2")) {
            twoJ = Integer.parseInt(j.substring(0, j.length() - 2));
        } else {
            problems.add(new DataProblem(source, number, 0, "qd.bad-j", "j must be a half-integer like 3/2, got '"
                    + j + "'", line));
        }
        List<Double> coefficients = new ArrayList<>();
        for (int i = 2; i <= 6; i++) {
            try {
                double value = Double.parseDouble(f[i].strip());
                if (!Double.isFinite(value)) {
                    throw new NumberFormatException();
                }
                coefficients.add(value);
            } catch (NumberFormatException e) {
                problems.add(new DataProblem(source, number, 0, "qd.bad-number", COLUMNS.get(i)
                        + " is not a finite number: '" + f[i] + "'", line));
            }
        }
        int validFrom = integer(f[7], "valid-from-n", line, number, source, problems);
        try {
            Provenance.Kind.fromId(f[8].strip());
        } catch (IllegalArgumentException e) {
            problems.add(new DataProblem(source, number, 0, "qd.bad-provenance", e.getMessage(), line));
        }
        if (problems.size() > before) {
            return;
        }
        while (coefficients.size() > 1 && coefficients.get(coefficients.size() - 1) == 0) {
            if (!uncertainties.isEmpty() && !Double.isNaN(uncertainties.get(coefficients.size() - 1))) {
                problems.add(new DataProblem(source, number, 0, "qd.bad-uncertainty", "u-"
                        + COLUMNS.get(coefficients.size() + 1) + " is given for a coefficient that is 0 (not in the"
                        + " series)", line));
                return;
            }
            coefficients.remove(coefficients.size() - 1);
        }
        if (!uncertainties.isEmpty()) {
            uncertainties = uncertainties.subList(0, coefficients.size());
            if (uncertainties.stream().allMatch(u -> Double.isNaN(u))) {
                uncertainties = List.of();
            }
        }
        if (!seen.add(l + "," + twoJ)) {
            problems.add(new DataProblem(source, number, 0, "qd.duplicate-series", "series l = " + l + ", j = "
                    + twoJ + "/2 given twice", line));
            return;
        }
        try {
            series.add(new QuantumDefects.Series(l, twoJ, coefficients, validFrom, uncertainties,
                    residualDerived && !uncertainties.isEmpty()));
        } catch (IllegalArgumentException e) {
            problems.add(new DataProblem(source, number, 0, "qd.bad-series", e.getMessage(), line));
        }
    }

    /**
     * The fields u-d0 to u-d8 (NaN where empty) and the check of uncertainty-provenance: needed when
     * a u field is given, empty otherwise.
     */
    private static List<Double> uncertainties(String[] f, String line, int number, String source,
            List<DataProblem> problems) {
        List<Double> out = new ArrayList<>();
        boolean any = false;
        for (int i = 7; i <= 11; i++) {
            String text = f[i].strip();
            if (text.isEmpty()) {
                out.add(Double.NaN);
                continue;
            }
            any = true;
            try {
                double value = Double.parseDouble(text);
                if (!Double.isFinite(value) || value < 0) {
                    throw new NumberFormatException();
                }
                out.add(value);
            } catch (NumberFormatException e) {
                problems.add(new DataProblem(source, number, 0, "qd.bad-uncertainty", COLUMNS_WITH_UNCERTAINTIES.get(i)
                        + " must be empty (not stated) or a finite number >= 0, got '" + f[i] + "'", line));
                out.add(Double.NaN);
            }
        }
        String kind = f[12].strip();
        if (any && kind.isEmpty()) {
            problems.add(new DataProblem(source, number, 0, "qd.bad-uncertainty", "uncertainty-provenance is empty;"
                    + " a row that states uncertainties says how they were obtained (published, from-memory or"
                    + " from-residuals)", line));
        } else if (!any && !kind.isEmpty()) {
            problems.add(new DataProblem(source, number, 0, "qd.bad-uncertainty", "uncertainty-provenance '" + kind
                    + "' is given but no u-d0 to u-d8", line));
        } else if (any && !kind.equals(RESIDUAL_DERIVED)) {
            try {
                Provenance.Kind.fromId(kind);
            } catch (IllegalArgumentException e) {
                problems.add(new DataProblem(source, number, 0, "qd.bad-provenance", e.getMessage(), line));
            }
        }
        return out;
    }

    private static int integer(String text, String field, String line, int number, String source,
            List<DataProblem> problems) {
        try {
            return Integer.parseInt(text.strip());
        } catch (NumberFormatException e) {
            problems.add(new DataProblem(source, number, 0, "qd.bad-integer", field + " is not an integer: '" + text
                    + "'", line));
            return -1;
        }
    }

    private static Content build(Map<String, String> header, Map<String, Integer> headerLine,
            List<QuantumDefects.Series> series, String source, List<DataProblem> problems, NuclearData nuclear) {
        Species species;
        try {
            species = Species.parse(header.get("species"));
        } catch (RuntimeException e) {
            problems.add(new DataProblem(source, headerLine.get("species"), 0, "qd.bad-species", e.getMessage(),
                    header.get("species")));
            return null;
        }
        if (species.massNumber() == 0 || species.charge() != 0) {
            problems.add(new DataProblem(source, headerLine.get("species"), 0, "qd.bad-species",
                    "species must be a neutral isotope such as Rb-87 I, got " + species, header.get("species")));
            return null;
        }
        double limit = header.containsKey("limit-per-cm") ? number(header, headerLine, "limit-per-cm", source, problems)
                : wavenumber(header, headerLine, "limit", source, problems)
                        + (header.containsKey("limit-from")
                                ? wavenumber(header, headerLine, "limit-from", source, problems) : 0.0);
        double limitUncertainty = Double.NaN;
        if (header.containsKey("limit-uncertainty")) {
            String unit = header.containsKey("limit") ? header.get("limit").strip().replaceAll(".*\\s", "") : "cm-1";
            double u = number(header, headerLine, "limit-uncertainty", source, problems);
            if (u < 0) {
                problems.add(new DataProblem(source, headerLine.get("limit-uncertainty"), 0, "qd.bad-limit",
                        "limit-uncertainty must be >= 0 (in the limit's unit), got " + u,
                        header.get("limit-uncertainty")));
            } else if (!Double.isNaN(u) && LIMIT_UNITS.contains(unit)) {
                limitUncertainty = perCm(u, unit);
            }
        }
        Provenance.Kind provenanceKind = kind(header, headerLine, "provenance", source, problems);
        Provenance.Kind limitKind = kind(header, headerLine, "limit-provenance", source, problems);
        CorePolarizability core = null;
        boolean hasCore = header.containsKey("core-dipole-polarizability-au");
        if (hasCore || header.containsKey("core-quadrupole-polarizability-au") || header.containsKey("core-source")) {
            double dipole = number(header, headerLine, "core-dipole-polarizability-au", source, problems);
            double quadrupole = number(header, headerLine, "core-quadrupole-polarizability-au", source, problems);
            String coreSource = header.getOrDefault("core-source", "");
            // A number already reported as unreadable is not reported again as out of range.
            try {
                core = Double.isNaN(dipole) || Double.isNaN(quadrupole) ? null
                        : new CorePolarizability(dipole, quadrupole, coreSource);
            } catch (IllegalArgumentException e) {
                problems.add(new DataProblem(source, headerLine.getOrDefault("core-dipole-polarizability-au", 1), 0,
                        "qd.bad-core", e.getMessage(), ""));
            }
        }
        String levels = header.getOrDefault("levels", "");
        if (!levels.isEmpty() && !DataSetInfo.isValidId(levels)) {
            problems.add(new DataProblem(source, headerLine.get("levels"), 0, "qd.bad-levels", "levels must be the id "
                    + "of a level set (lower-case letters, digits, dots and dashes), got '" + levels + "'", levels));
        }
        if (!problems.isEmpty()) {
            return null;
        }
        double rydberg;
        try {
            rydberg = rydbergPerCm(nuclear.isotope(species).atomicMass());
        } catch (ReferenceDataException e) {
            problems.add(new DataProblem(source, headerLine.get("species"), 0, "qd.no-mass", e.getMessage(),
                    header.get("species")));
            return null;
        }
        try {
            DataSetInfo info = new DataSetInfo(header.get("id"), DataKind.QUANTUM_DEFECTS, header.get("title"),
                    header.get("version"), new Provenance(provenanceKind, header.get("source")), List.of(species));
            QuantumDefects defects = new QuantumDefects(info, species, limit, rydberg, series,
                    Optional.ofNullable(core), levels.isEmpty() ? Optional.empty() : Optional.of(levels),
                    limitUncertainty);
            return new Content(defects, new Provenance(limitKind, header.get("limit-source")));
        } catch (IllegalArgumentException e) {
            problems.add(new DataProblem(source, headerLine.getOrDefault("id", 1), 0, "qd.bad-set", e.getMessage(), ""));
            return null;
        }
    }

    /**
     * @param species a neutral isotope in the built-in nuclear data
     * @return {@code R_M = R_inf / (1 + m_e / (M - m_e))} in cm^-1, M the atomic mass in the
     *         built-in nuclear data (the built-in default, for compatibility; a context's value is
     *         {@link #rydbergPerCm(double)} of {@link DataContext#isotope(Species)})
     * @throws ReferenceDataException when the isotope is not in the nuclear data
     */
    public static double rydbergPerCm(Species species) {
        return rydbergPerCm(NuclearData.builtIn().isotope(species).atomicMass());
    }

    /**
     * @param massU the atomic mass M of the neutral atom, u; finite, above the electron mass
     * @return the mass-corrected Rydberg constant {@code R_M = R_inf / (1 + m_e / (M - m_e))} of
     *         its singly charged core, cm^-1 (common practice)
     * @throws IllegalArgumentException for a mass that is not finite or not above m_e
     */
    public static double rydbergPerCm(double massU) {
        double electronU = PhysicalConstants.ELECTRON_MASS.value() / PhysicalConstants.ATOMIC_MASS_CONSTANT.value();
        if (!(massU > electronU) || Double.isInfinite(massU)) {
            throw new IllegalArgumentException("atomic mass must be finite and above the electron mass (u), got "
                    + massU);
        }
        return PhysicalConstants.RYDBERG.value() / 100 / (1 + electronU / (massU - electronU));
    }

    private static double number(Map<String, String> header, Map<String, Integer> lines, String key, String source,
            List<DataProblem> problems) {
        String text = header.get(key);
        try {
            double value = Double.parseDouble(text == null ? "" : text);
            if (Double.isFinite(value)) {
                return value;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        problems.add(new DataProblem(source, lines.getOrDefault(key, 1), 0, "qd.bad-number", text == null
                ? "header '" + key + "' is missing" : key + " is not a finite number: '" + text + "'",
                text == null ? "" : text));
        return Double.NaN;
    }

    /**
     * A header value "number unit" (one of {@link #LIMIT_UNITS}) in cm^-1: frequencies divided by
     * 100 c exactly, as the D-line file does.
     */
    private static double wavenumber(Map<String, String> header, Map<String, Integer> lines, String key,
            String source, List<DataProblem> problems) {
        String text = header.get(key);
        String[] parts = text.strip().split("\\s+");
        if (parts.length == 2 && LIMIT_UNITS.contains(parts[1])) {
            try {
                double value = Double.parseDouble(parts[0]);
                if (Double.isFinite(value) && parts[0].matches("[-+]?\\d+(\\.\\d+)?")) {
                    return perCm(value, parts[1]);
                }
            } catch (NumberFormatException e) {
                // reported below
            }
        }
        problems.add(new DataProblem(source, lines.getOrDefault(key, 1), 3, "qd.bad-limit", key + " must be a decimal "
                + "number and one of the units " + String.join(", ", LIMIT_UNITS) + ", such as '1010029.1646 GHz'; got '"
                + text + "'", text));
        return Double.NaN;
    }

    /** A value in one of {@link #LIMIT_UNITS} in cm^-1: frequencies divided by 100 c exactly. */
    private static double perCm(double value, String unit) {
        return switch (unit) {
            case "cm-1" -> value;
            case "THz" -> value * 1e12 / (PhysicalConstants.C * 100);
            case "GHz" -> value * 1e9 / (PhysicalConstants.C * 100);
            case "MHz" -> value * 1e6 / (PhysicalConstants.C * 100);
            default -> value * 1e3 / (PhysicalConstants.C * 100);
        };
    }

    private static Provenance.Kind kind(Map<String, String> header, Map<String, Integer> lines, String key,
            String source, List<DataProblem> problems) {
        try {
            return Provenance.Kind.fromId(header.get(key));
        } catch (IllegalArgumentException e) {
            problems.add(new DataProblem(source, lines.getOrDefault(key, 1), 0, "qd.bad-provenance", e.getMessage(),
                    header.get(key)));
            return Provenance.Kind.PUBLISHED;
        }
    }
}
