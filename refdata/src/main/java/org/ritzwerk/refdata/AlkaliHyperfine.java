package org.ritzwerk.refdata;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.hyperfine.HyperfineComponent;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.hyperfine.HyperfineLevel;
import org.ritzwerk.engine.hyperfine.HyperfineStructure;
import org.ritzwerk.engine.hyperfine.ZeemanComponent;
import org.ritzwerk.engine.hyperfine.ZeemanStructure;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.LadderExcitation;
import org.ritzwerk.refdata.internal.BuiltInCsv;
import org.ritzwerk.refdata.internal.RydbergData;

/**
 * Ritzwerk's built-in D-line centroids and hyperfine constants of the alkali isotopes Li-6, Li-7,
 * Na-23, K-39, K-40, K-41, Rb-85, Rb-87 and Cs-133 (files {@code rydberg/d-lines.csv} and
 * {@code rydberg/hyperfine-constants.csv}, written with their checks by {@code make_d_lines.py};
 * every row names its measurement and says whether its digits were read in the source or recalled).
 *
 * <p><b>D lines.</b> Each isotope's hyperfine-free D1 and D2 centroids, stored as their source prints
 * them (text digits and unit: MHz, kHz, or cm-1), converted here exactly (decimal arithmetic, c =
 * 299 792 458 m/s) to the np 2P1/2 and np 2P3/2 levels above the ground level's centroid.
 * {@link DataContext#alkaliAtom} and {@link RydbergData#atom} put them in place of the natural
 * element's levels ({@link #withResonanceLevels}), so each isotope's first p levels are its own.
 *
 * <p><b>Hyperfine constants.</b> A and B (MHz) of the ground and first p levels, and of the levels above
 * them that have a measurement here (Cs-133 7p1/2 and 7p3/2; the low d levels Rb-85 4d3/2, Cs-133 6d3/2 and
 * 6d5/2); with the nuclear
 * spin from the nuclear data they give the F levels, the F -> F' components of the D lines
 * ({@link #components}) and, with the g factors, their Zeeman components ({@link #zeemanComponents}).
 *
 * <p>Read once, on first use; immutable and thread-safe.
 */
public final class AlkaliHyperfine {

    /** The D-line file's format name. */
    public static final String D_LINE_FORMAT = "ritzwerk-d-lines";
    /** The D-line file's columns, in order. */
    public static final List<String> D_LINE_COLUMNS = List.of("species", "line", "frequency", "uncertainty", "unit",
            "provenance", "source", "checked");
    /** The hyperfine-constant file's format name. */
    public static final String CONSTANTS_FORMAT = "ritzwerk-hyperfine";
    /** The hyperfine-constant file's columns, in order. */
    public static final List<String> CONSTANTS_COLUMNS = List.of("species", "level", "a", "a-uncertainty", "b",
            "b-uncertainty", "provenance", "source", "checked");
    /** Units a D-line centroid may be stored in. */
    public static final List<String> D_LINE_UNITS = List.of("MHz", "kHz", "GHz", "cm-1");

    private static final BigDecimal C_MHZ_PER_CM = new BigDecimal("29979.2458");
    private static final Pattern LABEL = Pattern.compile("(\\d{1,3})([spdf]) 2([SPDF])(\\d{1,2})/2");
    private static volatile AlkaliHyperfine builtIn;

    /**
     * One hyperfine-free D-line centroid as its source gives it.
     *
     * @param species          the isotope, e.g. Rb-87 I
     * @param line             {@code D1} or {@code D2}
     * @param frequencyText    the value's digits exactly as the source prints them (no spaces)
     * @param uncertaintyText  its standard uncertainty, same unit, as printed
     * @param unit             {@code MHz}, {@code kHz}, {@code GHz} or {@code cm-1}
     * @param frequencyHertz   the value in Hz (for cm-1: times c, exactly)
     * @param uncertaintyHertz the uncertainty in Hz
     * @param wavenumberPerCm  the value in cm-1 (for a frequency: divided by c, exactly), i.e. the
     *                         upper level's energy above the ground level's centroid
     * @param provenance       published (digits read in the source) or from-memory
     * @param source           the measurement
     * @param checked          how the value was checked
     */
    public record DLine(Species species, String line, String frequencyText, String uncertaintyText, String unit,
            double frequencyHertz, double uncertaintyHertz, double wavenumberPerCm, Provenance.Kind provenance,
            String source, String checked) {

        /** @return 2 J of the upper level: 1 for D1, 3 for D2 */
        public int twoJUpper() {
            return line.equals("D1") ? 1 : 3;
        }
    }

    /**
     * The hyperfine constants of one level as the source gives them.
     *
     * @param species    the isotope
     * @param state      the level, e.g. 5p 2P3/2
     * @param aText      A in MHz as printed
     * @param aUncertaintyText its uncertainty as printed
     * @param bText      B in MHz as printed, empty for J = 1/2
     * @param bUncertaintyText its uncertainty as printed, empty for J = 1/2
     * @param constants  A and B as the engine takes them
     * @param provenance published or from-memory
     * @param source     the measurement or review
     * @param checked    how the values were checked
     */
    public record LevelConstants(Species species, State state, String aText, String aUncertaintyText, String bText,
            String bUncertaintyText, HyperfineConstants constants, Provenance.Kind provenance, String source,
            String checked) {
    }

    private final Map<Species, List<DLine>> dLines;
    private final Map<Species, Map<State, LevelConstants>> constants;

    private AlkaliHyperfine(Map<Species, List<DLine>> dLines, Map<Species, Map<State, LevelConstants>> constants) {
        this.dLines = dLines;
        this.constants = constants;
    }

    /** @return the built-in data, read on first use (thread-safe) */
    public static AlkaliHyperfine builtIn() {
        AlkaliHyperfine data = builtIn;
        if (data == null) {
            synchronized (AlkaliHyperfine.class) {
                data = builtIn;
                if (data == null) {
                    String d = "rydberg/d-lines.csv";
                    String h = "rydberg/hyperfine-constants.csv";
                    try (InputStream in = open(d); InputStream hin = open(h)) {
                        data = read(in, d, hin, h);
                    } catch (IOException e) {
                        throw new UncheckedIOException(e.getMessage(), e);
                    }
                    builtIn = data;
                }
            }
        }
        return data;
    }

    /**
     * Reads a D-line file and a hyperfine-constant file (formats {@value #D_LINE_FORMAT} 1 and
     * {@value #CONSTANTS_FORMAT} 1: a format line, {@code # key: value} header lines, the column row
     * and one row per value; see the built-in files).
     *
     * @param dLineFile        the D-line file's bytes (UTF-8)
     * @param dLineName        its name for messages
     * @param constantsFile    the hyperfine-constant file's bytes (UTF-8)
     * @param constantsName    its name for messages
     * @return the data
     * @throws ReferenceDataException naming file, line and problem
     */
    public static AlkaliHyperfine read(InputStream dLineFile, String dLineName, InputStream constantsFile,
            String constantsName) {
        Map<Species, List<DLine>> lines = new LinkedHashMap<>();
        for (BuiltInCsv.Row row : rows(dLineFile, dLineName, D_LINE_FORMAT, D_LINE_COLUMNS)) {
            try {
                Species species = Species.parse(row.f()[0]);
                String line = row.f()[1];
                if (!line.equals("D1") && !line.equals("D2")) {
                    throw new IllegalArgumentException("line must be D1 or D2, got '" + line + "'");
                }
                String unit = row.f()[4];
                if (!D_LINE_UNITS.contains(unit)) {
                    throw new IllegalArgumentException("unit must be one of " + D_LINE_UNITS + ", got '" + unit + "'");
                }
                BigDecimal value = new BigDecimal(row.f()[2]);
                BigDecimal unc = new BigDecimal(row.f()[3]);
                if (value.signum() <= 0 || unc.signum() < 0) {
                    throw new IllegalArgumentException("frequency must be positive and its uncertainty not negative");
                }
                BigDecimal mhz = toMegahertz(value, unit);
                BigDecimal perCm = unit.equals("cm-1") ? value : mhz.divide(C_MHZ_PER_CM, MathContext.DECIMAL128);
                DLine d = new DLine(species, line, row.f()[2], row.f()[3], unit, mhz.movePointRight(6).doubleValue(),
                        toMegahertz(unc, unit).movePointRight(6).doubleValue(), perCm.doubleValue(),
                        Provenance.Kind.fromId(row.f()[5]), row.f()[6], row.f()[7]);
                List<DLine> list = lines.computeIfAbsent(species, k -> new ArrayList<>());
                if (list.stream().anyMatch(x -> x.line().equals(line))) {
                    throw new IllegalArgumentException("second " + line + " of " + species.notation());
                }
                list.add(d);
            } catch (RuntimeException e) {
                throw bad(dLineName, row.number(), e.getMessage(), row.raw());
            }
        }
        Map<Species, Map<State, LevelConstants>> hfs = new LinkedHashMap<>();
        for (BuiltInCsv.Row row : rows(constantsFile, constantsName, CONSTANTS_FORMAT, CONSTANTS_COLUMNS)) {
            try {
                Species species = Species.parse(row.f()[0]);
                State state = state(row.f()[1]);
                double a = Double.parseDouble(row.f()[2]);
                double aUnc = uncertainty(row.f()[3], "a-uncertainty");
                boolean hasB = !row.f()[4].isEmpty();
                if (hasB != (state.twoJ() > 1)) {
                    throw new IllegalArgumentException("B is given exactly for J > 1/2");
                }
                double b = hasB ? Double.parseDouble(row.f()[4]) : 0;
                double bUnc = hasB ? uncertainty(row.f()[5], "b-uncertainty") : Double.NaN;
                Provenance.Kind kind = Provenance.Kind.fromId(row.f()[6]);
                LevelConstants c = new LevelConstants(species, state, row.f()[2], row.f()[3], row.f()[4], row.f()[5],
                        HyperfineConstants.ofMegahertz(a, aUnc, b, bUnc, row.f()[7] + " (" + kind.id() + ")"), kind,
                        row.f()[7], row.f()[8]);
                if (hfs.computeIfAbsent(species, k -> new LinkedHashMap<>()).put(state, c) != null) {
                    throw new IllegalArgumentException("second row for " + species.notation() + " " + row.f()[1]);
                }
            } catch (RuntimeException e) {
                throw bad(constantsName, row.number(), e.getMessage(), row.raw());
            }
        }
        Map<Species, List<DLine>> frozen = new LinkedHashMap<>();
        lines.forEach((k, v) -> frozen.put(k, List.copyOf(v)));
        Map<Species, Map<State, LevelConstants>> frozenHfs = new LinkedHashMap<>();
        hfs.forEach((k, v) -> frozenHfs.put(k, Collections.unmodifiableMap(new LinkedHashMap<>(v))));
        return new AlkaliHyperfine(Collections.unmodifiableMap(frozen), Collections.unmodifiableMap(frozenHfs));
    }

    /** A stated standard uncertainty: a number, not negative. */
    private static double uncertainty(String text, String column) {
        double u = Double.parseDouble(text);
        if (!(u >= 0 && u < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(column + " must be a finite number, not negative, got '" + text + "'");
        }
        return u;
    }

    private static BigDecimal toMegahertz(BigDecimal value, String unit) {
        return switch (unit) {
            case "MHz" -> value;
            case "kHz" -> value.movePointLeft(3);
            case "GHz" -> value.movePointRight(3);
            case "cm-1" -> value.multiply(C_MHZ_PER_CM);
            default -> throw new IllegalArgumentException("unit " + unit);
        };
    }

    private static State state(String label) {
        Matcher m = LABEL.matcher(label);
        if (!m.matches() || !m.group(3).equals(m.group(2).toUpperCase(Locale.ROOT))) {
            throw new IllegalArgumentException("level '" + label + "' does not read as n, l and j (e.g. 5p 2P3/2)");
        }
        return State.of(Integer.parseInt(m.group(1)), "spdf".indexOf(m.group(2).charAt(0)), Integer.parseInt(m.group(4)));
    }

    /** @return the isotopes with D-line data, in file order; immutable */
    public List<Species> species() {
        return List.copyOf(dLines.keySet());
    }

    /** @return every D line, in file order; immutable */
    public List<DLine> dLines() {
        List<DLine> all = new ArrayList<>();
        dLines.values().forEach(all::addAll);
        return List.copyOf(all);
    }

    /**
     * @param species an isotope (a mass number is needed: Rb-87 I)
     * @return its D1 and D2 lines; empty when it has none here
     */
    public List<DLine> dLines(Species species) {
        return dLines.getOrDefault(Objects.requireNonNull(species, "species"), List.of());
    }

    /**
     * @param species an isotope
     * @param state   a level, e.g. 5p 2P3/2
     * @return its hyperfine constants as tabulated, if any
     */
    public Optional<LevelConstants> constants(Species species, State state) {
        return Optional.ofNullable(constants.getOrDefault(species, Map.of()).get(state));
    }

    /**
     * @param species an isotope
     * @return the levels with hyperfine constants, in file order; immutable
     */
    public List<LevelConstants> constants(Species species) {
        return List.copyOf(constants.getOrDefault(species, Map.of()).values());
    }

    /**
     * Puts the isotope's own D-line centroids in place of the first p levels of a level list.
     *
     * @param species  an isotope
     * @param measured measured levels whose ground level (energy 0, l = 0) fixes n
     * @return the list with the n p1/2 and n p3/2 energies replaced (added where missing) by this
     *         isotope's D-line centroids, each naming its measurement; the list unchanged when the
     *         isotope has no D lines here
     */
    public List<MeasuredLevel> withResonanceLevels(Species species, List<MeasuredLevel> measured) {
        List<DLine> lines = dLines(species);
        Optional<MeasuredLevel> ground = measured.stream().filter(m -> m.energyPerCm() == 0 && m.state().l() == 0)
                .findFirst();
        if (lines.isEmpty() || ground.isEmpty()) {
            return measured;
        }
        int n = ground.get().state().n();
        List<MeasuredLevel> out = new ArrayList<>(measured);
        for (DLine d : lines) {
            State p = State.of(n, 1, d.twoJUpper());
            MeasuredLevel level = new MeasuredLevel(p, d.wavenumberPerCm(), "d-lines: " + d.line() + " centroid "
                    + d.frequencyText() + "(" + d.uncertaintyText() + ") " + d.unit() + ", " + d.source() + " ("
                    + d.provenance().id() + ")", d.uncertaintyHertz() / (PhysicalConstants.C * 100));
            int at = -1;
            for (int i = 0; i < out.size(); i++) {
                if (out.get(i).state().equals(p)) {
                    at = i;
                }
            }
            if (at >= 0) {
                out.set(at, level);
            } else {
                out.add(level);
            }
        }
        return List.copyOf(out);
    }

    /**
     * One F level of a level with hyperfine constants.
     *
     * @param twoF        2 F
     * @param energyPerCm its energy above the ground level's hyperfine-free centroid, cm^-1: the
     *                    level's hyperfine-free energy plus its Casimir shift
     */
    public record FLevel(int twoF, double energyPerCm) {
    }

    /**
     * The F levels of a level with hyperfine constants (Casimir formula with its A and B).
     *
     * @param context the data context (nuclear spin, the atom's hyperfine-free level)
     * @param species an isotope
     * @param state   a level, e.g. 5p 2P3/2
     * @return its F levels by rising F, or empty when this level has no measured constants here, as for
     *         every Rydberg level (their scaled constants are in {@link RydbergHyperfine#fLevels});
     *         {@link DataContext#hyperfineLevels} asks both
     */
    public List<FLevel> fLevels(DataContext context, Species species, State state) {
        Objects.requireNonNull(context, "context");
        Optional<LevelConstants> own = constants(species, state);
        return own.isEmpty() ? List.of() : fLevels(context, species, state, own.get().constants());
    }

    /**
     * The F levels of a level from given constants (Casimir formula), on the context's
     * hyperfine-free level; shared by the measured and the n*^-3-scaled constants.
     *
     * @return the F levels by rising F, energies above the ground level's hyperfine-free centroid
     *         in cm^-1
     */
    static List<FLevel> fLevels(DataContext context, Species species, State state, HyperfineConstants constants) {
        int twoI = context.nucleus(species).twiceSpin();
        double centroid = context.alkaliAtom(species).level(state).energyPerCm();
        List<FLevel> out = new ArrayList<>();
        for (HyperfineLevel f : HyperfineStructure.levels(twoI, state.twoJ(), constants)) {
            out.add(new FLevel(f.twoF(), centroid + f.shiftHertz() / (PhysicalConstants.C * 100)));
        }
        return List.copyOf(out);
    }

    /**
     * The F -> F' components of a line between two levels with hyperfine constants.
     *
     * @param context the data context (nuclear spin, the atom's hyperfine-free levels)
     * @param species an isotope with constants for both levels
     * @param lower   the lower level, e.g. 5s 2S1/2
     * @param upper   the upper level, e.g. 5p 2P3/2
     * @return the components with frequencies (Hz), their standard uncertainties (Hz; each component's own:
     *         the centroid's, {@link AlkaliAtom#frequencyUncertaintyHz}, and the two F levels' shifts' from the
     *         stated uncertainties of A and B, in quadrature, {@link HyperfineStructure#components}; NaN when the
     *         centroid has none) and shares of the line strength
     * @throws ReferenceDataException when either level has no hyperfine constants here
     */
    public List<HyperfineComponent> components(DataContext context, Species species, State lower, State upper) {
        Pair p = pair(context, species, lower, upper);
        return HyperfineStructure.components(p.twoI, lower.twoJ(), p.lower, upper.twoJ(), p.upper, p.centroid,
                p.centroidUncertainty);
    }

    /**
     * The m_F-resolved components of a line in a magnetic field, from the diagonalised
     * hyperfine-Zeeman Hamiltonians of both levels; g_J by the Lande formula (CODATA 2018 electron g
     * factor), g_I from the nuclear moment of the context's nuclear data. For a line from an s1/2
     * level to a p level whose fine-structure partner has constants too (the D lines), the p term is
     * diagonalised as a whole ({@link ZeemanStructure#termComponents}), so the field's mixing of
     * p1/2 and p3/2 is in; otherwise each level on its own ({@link ZeemanStructure#components}).
     *
     * @param context    the data context
     * @param species    an isotope with constants for both levels
     * @param lower      the lower level
     * @param upper      the upper level
     * @param fieldTesla the field, tesla, 0 to {@link ZeemanStructure#MAX_FIELD_TESLA}
     * @return the components by frequency, each with its frequency's standard uncertainty on its own (the
     *         centroid's, {@link AlkaliAtom#frequencyUncertaintyHz}, and the two states' energy uncertainties from
     *         the stated u(A), u(B) of the levels, first order by the Hellmann-Feynman theorem, in quadrature; at
     *         zero field equal to {@link #components}'; NaN when the centroid has none) and the largest
     *         |m_J m_I> component of each state with its weight, and its slope d nu/dB (Hz per tesla,
     *         {@link ZeemanComponent#fieldSlopeHertzPerTesla}); the field taken as exact
     * @throws ReferenceDataException when either level has no constants or the nucleus no moment
     */
    public List<ZeemanComponent> zeemanComponents(DataContext context, Species species, State lower, State upper,
            double fieldTesla) {
        return zeemanComponents(context, species, lower, upper, fieldTesla, 0);
    }

    /**
     * {@link #zeemanComponents(DataContext, Species, State, State, double)} with the field's standard uncertainty:
     * each component's frequency uncertainty takes {@code |d nu/dB| u(B)} in quadrature, first order (one field
     * error moves both states, so the component's own slope enters; see {@link ZeemanStructure}). A u(B) of 0
     * gives the same components, to the bit.
     *
     * @param context               the data context
     * @param species               an isotope with constants for both levels
     * @param lower                 the lower level
     * @param upper                 the upper level
     * @param fieldTesla            the field, tesla, 0 to {@link ZeemanStructure#MAX_FIELD_TESLA}
     * @param fieldUncertaintyTesla the field's standard uncertainty, tesla; finite, not negative
     * @return the components by frequency
     * @throws ReferenceDataException when either level has no constants or the nucleus no moment
     */
    public List<ZeemanComponent> zeemanComponents(DataContext context, Species species, State lower, State upper,
            double fieldTesla, double fieldUncertaintyTesla) {
        Pair p = pair(context, species, lower, upper);
        double gI = nuclearG(context, species);
        if (lower.l() == 0 && upper.l() == 1) {
            State p12 = State.of(upper.n(), 1, 1);
            State p32 = State.of(upper.n(), 1, 3);
            Optional<LevelConstants> low = constants(species, p12);
            Optional<LevelConstants> high = constants(species, p32);
            if (low.isPresent() && high.isPresent()) {
                AlkaliAtom atom = context.alkaliAtom(species);
                return ZeemanStructure.termComponents(p.twoI, p.lower, 1, low.get().constants(), high.get().constants(),
                        atom.frequencyHz(p12, p32), upper.twoJ(), gI, p.centroid, p.centroidUncertainty,
                        fieldTesla, fieldUncertaintyTesla);
            }
        }
        return ZeemanStructure.components(p.twoI, lower.twoJ(), p.lower, ZeemanStructure.landeG(lower.l(), lower.twoJ()),
                upper.twoJ(), p.upper, ZeemanStructure.landeG(upper.l(), upper.twoJ()), gI, p.centroid,
                p.centroidUncertainty, fieldTesla, fieldUncertaintyTesla);
    }

    /**
     * How far the diamagnetic (B^2) term that {@link #zeemanComponents} leaves out moves a line: the upper
     * level's {@link ZeemanStructure#diamagneticShiftHertz} minus the lower's, each from the atom's model
     * {@code <r^2>} ({@link AlkaliAtom#expectationBohr}), direction-averaged. Rb-87 D2: about 0.29 MHz at 1 T.
     *
     * @param atom       the atom
     * @param lower      the line's lower level
     * @param upper      its upper level
     * @param fieldTesla the field, tesla, 0 to {@link ZeemanStructure#MAX_FIELD_TESLA}
     * @return the line's shift, Hz (positive: the upper level moves more)
     */
    public static double diamagneticLineShiftHertz(AlkaliAtom atom, State lower, State upper, double fieldTesla) {
        return ZeemanStructure.diamagneticShiftHertz(atom.expectationBohr(upper, 2), fieldTesla)
                - ZeemanStructure.diamagneticShiftHertz(atom.expectationBohr(lower, 2), fieldTesla);
    }

    /**
     * The largest shift that diagonalising one level on its own leaves out in a field
     * ({@link DataContext#zeemanStates}): the field's mixing with its fine-structure partner,
     * {@link ZeemanStructure#fineStructureMixingHertz} with the atom's splitting of the two J levels.
     *
     * @param atom       the atom
     * @param state      a level with l > 0
     * @param fieldTesla the field, tesla
     * @return the shift, Hz (second order)
     * @throws org.ritzwerk.engine.rydberg.RydbergException when the atom has no level for the partner
     */
    public static double fineStructureMixingHertz(AlkaliAtom atom, State state, double fieldTesla) {
        double splitting = atom.frequencyHz(State.of(state.n(), state.l(), 2 * state.l() - 1),
                State.of(state.n(), state.l(), 2 * state.l() + 1));
        return ZeemanStructure.fineStructureMixingHertz(state.l(), splitting, fieldTesla);
    }

    /**
     * One F-resolved path of a two-step (ladder) excitation, F -> F' -> F''.
     *
     * <p>NaN policy: an uncertainty is NaN when not estimated (a step's centroid has none: a level of the step
     * has no stated energy uncertainty).
     *
     * @param twoFLower              2 F of the lower level
     * @param twoFIntermediate       2 F' of the intermediate level
     * @param twoFUpper              2 F'' of the upper level
     * @param firstHertz             the first step's frequency, F -> F', Hz
     * @param secondHertz            the second step's frequency, F' -> F'', Hz
     * @param firstUncertaintyHertz  the first step's frequency's standard uncertainty on its own, Hz, or NaN
     *                               (see {@link #ladderComponents})
     * @param secondUncertaintyHertz the second step's, Hz, or NaN
     */
    public record LadderComponent(int twoFLower, int twoFIntermediate, int twoFUpper, double firstHertz,
            double secondHertz, double firstUncertaintyHertz, double secondUncertaintyHertz) {

        /**
         * A path without uncertainties.
         *
         * @param twoFLower        2 F of the lower level
         * @param twoFIntermediate 2 F' of the intermediate level
         * @param twoFUpper        2 F'' of the upper level
         * @param firstHertz       the first step's frequency, F -> F', Hz
         * @param secondHertz      the second step's frequency, F' -> F'', Hz
         */
        public LadderComponent(int twoFLower, int twoFIntermediate, int twoFUpper, double firstHertz,
                double secondHertz) {
            this(twoFLower, twoFIntermediate, twoFUpper, firstHertz, secondHertz, Double.NaN, Double.NaN);
        }

        /** @return the first step's frequency uncertainty, Hz, or empty when not estimated */
        public OptionalDouble firstUncertainty() {
            return Double.isNaN(firstUncertaintyHertz) ? OptionalDouble.empty()
                    : OptionalDouble.of(firstUncertaintyHertz);
        }

        /** @return the second step's frequency uncertainty, Hz, or empty when not estimated */
        public OptionalDouble secondUncertainty() {
            return Double.isNaN(secondUncertaintyHertz) ? OptionalDouble.empty()
                    : OptionalDouble.of(secondUncertaintyHertz);
        }
    }

    /**
     * The F-resolved paths of a ladder lower -> intermediate -> upper: every F -> F' -> F'' whose two steps
     * are electric-dipole hyperfine components (Delta F = 0, +-1, not 0 -> 0; common practice). Each step's
     * frequency is the fine-structure centroids' ({@link AlkaliAtom#frequencyHz}) plus the Casimir shifts of
     * its two F levels, from {@link DataContext#hyperfineConstants}: the measured constants of the low levels,
     * and a Rydberg level's scaled with n* ({@link RydbergHyperfine}). The two frequencies of a path add up to
     * the F -> F'' two-photon frequency whatever F'.
     *
     * <p><b>Uncertainties.</b> Each step's standard uncertainty is that step's own: its centroid's, as the plain
     * ladder states it ({@link AlkaliAtom#frequencyUncertaintyHz}: the two levels' energy uncertainties), and
     * the shift uncertainties of its two F levels ({@link HyperfineStructure#shiftUncertaintyHertz}: the stated
     * uncertainties of A and B, uncorrelated), in quadrature; the centroid and the constants of different
     * levels are taken as independent, since no source states a covariance. Correlations are real and left to
     * the user: every component of a level carries the same error of its A and B (so offsets between two
     * components sharing a level are known better than their two uncertainties suggest), the intermediate
     * level's energy and constants enter both steps with opposite signs, and where a centroid and a level's
     * constants come from one measurement (Rb-87 D2 and 5p3/2, Ye et al. 1996) their errors are correlated.
     * For a level whose constants come from {@link RydbergHyperfine} (a Rydberg series scaled as n*^-3), only
     * the stated uncertainty of the series' constant enters, scaled like the constant itself; the scaling's own
     * error (a few per cent along a series, as each row's check says), a borrowed isotope ratio's hyperfine
     * anomaly and a quadrupole term the source does not give are left out, not estimated.
     *
     * @param context      the data context (constants, nuclear spin, the atom's levels)
     * @param species      an isotope
     * @param lower        the lower level, e.g. 5s 2S1/2
     * @param intermediate the intermediate level, e.g. 5p 2P3/2
     * @param upper        the upper level, e.g. 60s 2S1/2
     * @return the paths by F, F', F''
     * @throws ReferenceDataException when a level has no hyperfine constants here (named)
     * @throws IllegalArgumentException when a step is not an electric-dipole line (as {@link AlkaliAtom#ladder})
     */
    public static List<LadderComponent> ladderComponents(DataContext context, Species species, State lower,
            State intermediate, State upper) {
        Objects.requireNonNull(context, "context");
        AlkaliAtom atom = context.alkaliAtom(species);
        LadderExcitation centroids = atom.ladder(lower, intermediate, upper); // refuses non-dipole steps
        int twoI = context.nucleus(species).twiceSpin();
        State[] states = {lower, intermediate, upper};
        List<List<HyperfineLevel>> levels = new ArrayList<>();
        List<double[]> shiftUncertainties = new ArrayList<>();
        for (State state : states) {
            HyperfineConstants c = context.hyperfineConstants(species, state).orElseThrow(() ->
                    new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no hyperfine constants for "
                            + species.notation() + " " + state.label() + " (neither measured nor scaled for a "
                            + "Rydberg level); the ladder cannot be resolved into F levels"));
            // a Rydberg series' constants: only the stated uncertainties enter (see above)
            HyperfineConstants forU = context.alkaliHyperfine().constants(species, state).isPresent() ? c
                    : c.withStatedUncertaintiesOnly();
            List<HyperfineLevel> fs = HyperfineStructure.levels(twoI, state.twoJ(), c);
            double[] u = new double[fs.size()];
            for (int k = 0; k < u.length; k++) {
                u[k] = HyperfineStructure.shiftUncertaintyHertz(twoI, state.twoJ(), fs.get(k).twoF(), forU);
            }
            levels.add(fs);
            shiftUncertainties.add(u);
        }
        double first = centroids.firstHz();
        double second = centroids.secondHz();
        double uFirst = centroids.firstUncertaintyHz();
        double uSecond = centroids.secondUncertaintyHz();
        List<LadderComponent> out = new ArrayList<>();
        for (int i = 0; i < levels.get(0).size(); i++) {
            HyperfineLevel f = levels.get(0).get(i);
            double uf = shiftUncertainties.get(0)[i];
            for (int j = 0; j < levels.get(1).size(); j++) {
                HyperfineLevel f1 = levels.get(1).get(j);
                double uf1 = shiftUncertainties.get(1)[j];
                if (!dipoleAllowed(f.twoF(), f1.twoF())) {
                    continue;
                }
                for (int k = 0; k < levels.get(2).size(); k++) {
                    HyperfineLevel f2 = levels.get(2).get(k);
                    double uf2 = shiftUncertainties.get(2)[k];
                    if (dipoleAllowed(f1.twoF(), f2.twoF())) {
                        out.add(new LadderComponent(f.twoF(), f1.twoF(), f2.twoF(),
                                first + f1.shiftHertz() - f.shiftHertz(), second + f2.shiftHertz() - f1.shiftHertz(),
                                Math.sqrt(uFirst * uFirst + uf * uf + uf1 * uf1),
                                Math.sqrt(uSecond * uSecond + uf1 * uf1 + uf2 * uf2)));
                    }
                }
            }
        }
        return List.copyOf(out);
    }

    /** Delta F = 0, +-1, not 0 -> 0. */
    private static boolean dipoleAllowed(int twoF, int twoF2) {
        return Math.abs(twoF - twoF2) <= 2 && !(twoF == 0 && twoF2 == 0);
    }

    /**
     * The ionisation limit measured from one hyperfine level F of the ground level: the limit above
     * the ground level's hyperfine-free centroid (the atom's, from its quantum-defect set) minus
     * that F level's Casimir shift. The singly charged core of an alkali atom is a closed shell
     * (J = 0) without hyperfine structure, so the limit itself is one level.
     *
     * @param context the data context (the atom's limit, the nuclear spin)
     * @param species an isotope with constants for its ground level
     * @param twoF    2 F of a ground hyperfine level, e.g. 2 for Rb-87 F = 1
     * @return the limit above that level, Hz
     * @throws ReferenceDataException when the ground level has no hyperfine constants here
     * @throws IllegalArgumentException when the ground level has no level with that F
     */
    public double ionisationLimitHertz(DataContext context, Species species, int twoF) {
        Objects.requireNonNull(context, "context");
        AlkaliAtom atom = context.alkaliAtom(species);
        State ground = atom.groundState();
        LevelConstants c = constants(species, ground).orElseThrow(() -> missing(species, ground));
        for (HyperfineLevel f : HyperfineStructure.levels(context.nucleus(species).twiceSpin(), ground.twoJ(),
                c.constants())) {
            if (f.twoF() == twoF) {
                return atom.ionisationLimitPerCm() * PhysicalConstants.C * 100 - f.shiftHertz();
            }
        }
        throw new IllegalArgumentException("the ground level " + ground.label() + " of " + species.notation()
                + " has no level with 2F = " + twoF);
    }

    private record Pair(int twoI, HyperfineConstants lower, HyperfineConstants upper, double centroid,
            double centroidUncertainty) {
    }

    private Pair pair(DataContext context, Species species, State lower, State upper) {
        Objects.requireNonNull(context, "context");
        LevelConstants lo = constants(species, lower).orElseThrow(() -> missing(species, lower));
        LevelConstants up = constants(species, upper).orElseThrow(() -> missing(species, upper));
        AlkaliAtom atom = context.alkaliAtom(species);
        return new Pair(context.nucleus(species).twiceSpin(), lo.constants(), up.constants(),
                atom.frequencyHz(lower, upper), atom.frequencyUncertaintyHz(lower, upper).orElse(Double.NaN));
    }

    /**
     * @return g_I of the isotope's nucleus in units of mu_B ({@link ZeemanStructure#nuclearG}), 0 for a nucleus
     *         without spin
     * @throws ReferenceDataException when the nucleus has a spin but the nuclear data give no magnetic moment
     */
    static double nuclearG(DataContext context, Species species) {
        Nucleus nucleus = context.nucleus(species);
        int twoI = nucleus.twiceSpin();
        if (twoI == 0) {
            return 0;
        }
        if (nucleus.magneticMoment().isEmpty()) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no magnetic moment for the "
                    + "nucleus of " + species.notation() + " in the nuclear data: its Zeeman states need g_I");
        }
        return ZeemanStructure.nuclearG(nucleus.magneticMoment().getAsDouble(), twoI);
    }

    private ReferenceDataException missing(Species species, State state) {
        return new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no hyperfine constants for "
                + species.notation() + " " + state.label() + "; levels with constants: "
                + String.join(", ", constants(species).stream().map(c -> c.state().label()).toList()));
    }

    private static List<BuiltInCsv.Row> rows(InputStream in, String name, String format, List<String> columns) {
        return BuiltInCsv.read(in, name, format, columns, false, List.of("id", "source", "provenance")).rows();
    }

    private static ReferenceDataException bad(String name, int number, String reason, String line) {
        return BuiltInCsv.bad(name, number, reason, line);
    }

    private static InputStream open(String resource) {
        InputStream in = AlkaliHyperfine.class.getResourceAsStream(resource);
        if (in == null) {
            throw new IllegalStateException("built-in data file missing from the jar: " + resource);
        }
        return in;
    }
}
