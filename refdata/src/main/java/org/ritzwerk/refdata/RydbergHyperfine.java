package org.ritzwerk.refdata;

import java.io.InputStream;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.internal.BuiltInCsv;

/**
 * Hyperfine constants of alkali Rydberg states, from published measurements scaled with the
 * effective principal quantum number: {@code A(n) = A_ref (n*_ref / n*)^3} from a constant measured
 * at one level of the series, or {@code A(n) = Abar / n*^3} from a published scaled constant
 * (likewise B), with {@code n* = sqrt(R_M / (E_limit - E))} of the isotope's own levels and limit
 * (the n^-3 scaling of the valence electron's density at the nucleus; common practice). The
 * measured constants of the ground and first p levels (and of Cs-133 7p) are {@link AlkaliHyperfine}'s
 * and take precedence ({@link DataContext#hyperfineConstants}); this class serves the other levels of
 * a series from its {@code from-n} on. An isotope without a row of its own for
 * a series borrows another isotope's row of the same element, A times the ratio of the two isotopes'
 * measured ground-level A constants and B times that of their first p3/2 B constants (common
 * practice; hyperfine anomalies of a few 0.1 % neglected). The built-in file is
 * {@code rydberg/rydberg-hyperfine.csv} (format {@value #FORMAT} 1), each row with its source and
 * how it was checked. The law's own error is carried in the scaled constants' uncertainties, estimated from
 * the drift of A n*^3 between the measured levels of each series in the project's data ({@link
 * #scalingLawError}, {@link #scalingLawRelativeUncertainty}); those figures depend only on a context's data, so
 * each {@link DataContext} works them out once for this data and keeps them, however many levels ask
 * ({@link #recomputingLaw()} is the plain method, for comparisons). Immutable and thread-safe.
 */
public final class RydbergHyperfine {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-rydberg-hyperfine";
    /** The columns, in order. */
    public static final List<String> COLUMNS = List.of("species", "l", "j", "kind", "reference-n", "a", "a-uncertainty",
            "b", "b-uncertainty", "unit", "from-n", "provenance", "source", "checked");
    /** Units the constants may be stored in. */
    public static final List<String> UNITS = List.of("MHz", "GHz");

    private static volatile RydbergHyperfine builtIn;

    /**
     * One series' scaling, as its source gives it.
     *
     * @param species     the isotope
     * @param l           orbital angular momentum of the series
     * @param twoJ        2 j
     * @param kind        {@code level} (a, b measured at level {@code referenceN}) or {@code scaled}
     *                    (a, b are the published constants times n*^3)
     * @param referenceN  n of the measured level for {@code level}, 0 for {@code scaled}
     * @param measuredFromN the lowest n the constant was measured at: {@code referenceN} for {@code level}, the
     *                    lower end of the published fit's range (column reference-n, e.g. {@code 41-55}) for
     *                    {@code scaled}
     * @param measuredToN the highest such n
     * @param aText       a as printed
     * @param bText       b as printed; empty for j = 1/2, and for j > 1/2 when the source gives none
     * @param unit        {@code MHz} or {@code GHz}
     * @param aHertz      a in Hz
     * @param bHertz      b in Hz (0 when bText is empty: no quadrupole term is applied)
     * @param aUncertaintyHertz the stated standard uncertainty of a, Hz
     * @param bUncertaintyHertz that of b, Hz; NaN when bText is empty (not stated)
     * @param fromN       the lowest n the scaling serves
     * @param provenance  published (read in the source) or from-memory
     * @param source      the measurement
     * @param checked     how the value was checked
     */
    public record Series(Species species, int l, int twoJ, String kind, int referenceN, int measuredFromN,
            int measuredToN, String aText, String bText,
            String unit, double aHertz, double bHertz, double aUncertaintyHertz, double bUncertaintyHertz, int fromN,
            Provenance.Kind provenance, String source, String checked) {
    }

    private final List<Series> series;
    /** Whether the law's figures come from the context's memo ({@link DataContext#scalingLaw}) or anew per call. */
    private final boolean memo;

    private RydbergHyperfine(List<Series> series, boolean memo) {
        this.series = series;
        this.memo = memo;
    }

    /**
     * The plain method, for comparisons (tests and the {@code RydbergHyperfineBenchmark} baseline): the same data,
     * working out the n*^-3 law's error ({@link #scalingLawError}, and the series' {@link #driftPerN}) anew for every
     * level asked, from every series' measured levels, instead of once per data context. The same figures, bit for
     * bit.
     *
     * @return this data recomputing the law's error on every call; a new object (the contexts keep nothing for it)
     */
    public RydbergHyperfine recomputingLaw() {
        return new RydbergHyperfine(series, false);
    }

    /** @return the built-in data, read on first use (thread-safe) */
    public static RydbergHyperfine builtIn() {
        RydbergHyperfine data = builtIn;
        if (data == null) {
            synchronized (RydbergHyperfine.class) {
                data = builtIn;
                if (data == null) {
                    data = BuiltInCsv.resource(RydbergHyperfine.class, "rydberg/rydberg-hyperfine.csv",
                            RydbergHyperfine::read);
                    builtIn = data;
                }
            }
        }
        return data;
    }

    /**
     * Reads a file of format {@value #FORMAT} 1 (a format line, {@code # key: value} header lines
     * with id, source and provenance, the column row, one row per series; see the built-in file).
     *
     * @param in   the bytes (UTF-8); closed here
     * @param name the file's name, for messages
     * @return the data
     * @throws ReferenceDataException naming file, line and problem
     */
    public static RydbergHyperfine read(InputStream in, String name) {
        List<Series> out = new ArrayList<>();
        for (BuiltInCsv.Row row : BuiltInCsv.read(in, name, FORMAT, COLUMNS, true, List.of("id", "source",
                "provenance")).rows()) {
            String[] f = row.f();
            try {
                Species species = Species.parse(f[0]);
                int l = Integer.parseInt(f[1]);
                if (!f[2].matches("\\d{1,3}/2")) {
                    throw new IllegalArgumentException("j must be a half-integer like 3/2, got '" + f[2] + "'");
                }
                int twoJ = Integer.parseInt(f[2].substring(0, f[2].length() - 2));
                if (l < 0 || Math.abs(2 * l - twoJ) != 1) {
                    throw new IllegalArgumentException("j must be l +- 1/2, got l = " + l + ", j = " + f[2]);
                }
                String kind = f[3];
                int referenceN;
                int measuredFromN;
                int measuredToN;
                if (kind.equals("level")) {
                    referenceN = Integer.parseInt(f[4]);
                    if (referenceN <= l) {
                        throw new IllegalArgumentException("reference-n must exceed l, got " + f[4]);
                    }
                    measuredFromN = referenceN;
                    measuredToN = referenceN;
                } else if (kind.equals("scaled")) {
                    if (!f[4].matches("\\d{1,4}-\\d{1,4}")) {
                        throw new IllegalArgumentException("reference-n for kind 'scaled' is the range of n the "
                                + "published constant was fitted over, like 41-55, got '" + f[4] + "'");
                    }
                    referenceN = 0;
                    measuredFromN = Integer.parseInt(f[4].substring(0, f[4].indexOf('-')));
                    measuredToN = Integer.parseInt(f[4].substring(f[4].indexOf('-') + 1));
                    if (measuredFromN <= l || measuredToN < measuredFromN) {
                        throw new IllegalArgumentException("reference-n range must rise and start above l, got '"
                                + f[4] + "'");
                    }
                } else {
                    throw new IllegalArgumentException("kind must be 'level' or 'scaled', got '" + kind + "'");
                }
                String unit = f[9];
                if (!UNITS.contains(unit)) {
                    throw new IllegalArgumentException("unit must be one of " + UNITS + ", got '" + unit + "'");
                }
                double toHertz = unit.equals("GHz") ? 1e9 : 1e6;
                double a = new BigDecimal(f[5]).doubleValue() * toHertz;
                double aUnc = uncertainty(f[6], "a-uncertainty") * toHertz;
                boolean hasB = !f[7].isEmpty();
                if (hasB && twoJ == 1) {
                    throw new IllegalArgumentException("b is given only for j > 1/2 (empty for j = 1/2)");
                }
                if (hasB == f[8].isEmpty()) {
                    throw new IllegalArgumentException("b and b-uncertainty are both given or both empty");
                }
                double b = hasB ? new BigDecimal(f[7]).doubleValue() * toHertz : 0;
                double bUnc = hasB ? uncertainty(f[8], "b-uncertainty") * toHertz : Double.NaN;
                int fromN = Integer.parseInt(f[10]);
                if (fromN <= l) {
                    throw new IllegalArgumentException("from-n must exceed l, got " + f[10]);
                }
                Series s = new Series(species, l, twoJ, kind, referenceN, measuredFromN, measuredToN, f[5], f[7],
                        unit, a, b, aUnc, bUnc, fromN, Provenance.Kind.fromId(f[11]), f[12], f[13]);
                if (out.stream().anyMatch(x -> x.species().equals(species) && x.l() == l && x.twoJ() == twoJ)) {
                    throw new IllegalArgumentException("second row for " + species.notation() + " l = " + l + ", j = "
                            + f[2]);
                }
                out.add(s);
            } catch (RuntimeException e) {
                throw BuiltInCsv.bad(name, row.number(), e.getMessage(), row.raw());
            }
        }
        return new RydbergHyperfine(List.copyOf(out), true);
    }

    /** A stated standard uncertainty: a number, not negative. */
    private static double uncertainty(String text, String column) {
        BigDecimal u = new BigDecimal(text);
        if (u.signum() < 0) {
            throw new IllegalArgumentException(column + " must not be negative, got '" + text + "'");
        }
        return u.doubleValue();
    }

    /** @return every series, in file order; immutable */
    public List<Series> series() {
        return series;
    }

    /**
     * @param species an isotope
     * @param l       orbital angular momentum
     * @param twoJ    2 j
     * @return the series' scaling, or empty when none is published here
     */
    public Optional<Series> series(Species species, int l, int twoJ) {
        return series.stream().filter(s -> s.species().equals(species) && s.l() == l && s.twoJ() == twoJ).findFirst();
    }

    /**
     * The scaled constants of one level.
     *
     * @param context the data context (the isotope's levels and limit give n*)
     * @param species an isotope
     * @param state   a level, e.g. 60s 2S1/2
     * @return A and B in Hz, with standard uncertainties that combine in quadrature the stated uncertainty of the
     *         series' constant, scaled the same way, and the n*^-3 law's own error ({@link
     *         #scalingLawRelativeUncertainty} times |A|, likewise |B|; zero at the level the constant was measured
     *         at); B's is NaN where the row gives no B; a borrowed isotope ratio's hyperfine anomaly is not in
     *         them. Empty when the
     *         series has no scaling here or n is below its from-n; an isotope without a row of its own uses
     *         another isotope's row of the element, scaled by the ratio of the two isotopes' measured
     *         ground-level A (and first p3/2 B) constants
     */
    public Optional<HyperfineConstants> constants(DataContext context, Species species, State state) {
        return resolve(context, species, state).map(r -> r.constants(context, species, state,
                lawRelative(context, r.row(), state.n())));
    }

    /**
     * Where one level's constants come from, in words for a table's model column.
     *
     * @param context the data context
     * @param species an isotope
     * @param state   a level, e.g. 60s 2S1/2
     * @return {@code measured} for the level a row was measured at (its own isotope's row of kind
     *         {@code level}), otherwise {@code scaled as n*^-3 from} the reference level (e.g. {@code 7s 2S1/2}) or
     *         {@code from a published scaled constant}, with {@code of} the other isotope and {@code times the
     *         isotope ratio} for a borrowed row; empty when {@link #constants} is
     */
    public Optional<String> origin(DataContext context, Species species, State state) {
        return resolve(context, species, state).map(r -> r.origin(species, state));
    }

    /**
     * One level of a series with a measured A in the project's data, and A n*^3 there.
     *
     * @param state            the level
     * @param aHertz           its measured A, Hz
     * @param nStar            its effective principal quantum number (the isotope's own levels and limit)
     * @param aNStarCubedHertz A n*^3, Hz: constant along the series if the n*^-3 law held exactly
     * @param source           where A comes from ({@code rydberg-hyperfine.csv} or {@code hyperfine-constants.csv})
     */
    public record MeasuredLevel(State state, double aHertz, double nStar, double aNStarCubedHertz, String source) {
    }

    /**
     * How far the n*^-3 law is off, as the measured levels in the project's data show it.
     *
     * @param driftPerN the largest |ln(X_b / X_a)| / |n_b - n_a| over every pair of measured levels of one series
     *                  (X = A n*^3), the figure a series with only one measured level takes when no series of its l
     *                  has two ({@link #seriesLaw})
     * @param cap       the largest |ln(X_b / X_a)| over those pairs: the largest change of A n*^3 the data show
     *                  along any series (each series takes its own l's, {@link #seriesLaw})
     * @param pair      the two levels that give the largest drift per n, e.g. {@code Cs-133 I 6s 2S1/2 - 7s 2S1/2}
     */
    public record ScalingLawError(double driftPerN, double cap, String pair) {
    }

    /**
     * The measured levels of one row's series: the row's own reference level (kind {@code level}), or for kind
     * {@code scaled} its published constant taken as measured at the lowest n of the range it was fitted over
     * (A n*^3 there is the constant itself: the range's levels are what it was measured on), and every level of the
     * row's isotope with the same l and j in {@code hyperfine-constants.csv} ({@link AlkaliHyperfine}), by rising n
     * (a level in both counts once, the row's).
     *
     * @param context the data context (n* from the isotope's levels and limit; the measured constants)
     * @param row     a row of this file
     * @return its measured levels; one or more
     */
    public List<MeasuredLevel> measuredLevels(DataContext context, Series row) {
        Objects.requireNonNull(context, "context");
        AlkaliAtom atom = context.alkaliAtom(row.species());
        java.util.TreeMap<Integer, MeasuredLevel> out = new java.util.TreeMap<>();
        for (AlkaliHyperfine.LevelConstants c : context.alkaliHyperfine().constants(row.species())) {
            if (c.state().l() == row.l() && c.state().twoJ() == row.twoJ()) {
                out.put(c.state().n(), point(atom, c.state(), c.constants().aHertz(), "hyperfine-constants.csv"));
            }
        }
        if (row.kind().equals("level")) {
            State ref = State.of(row.referenceN(), row.l(), row.twoJ());
            out.put(row.referenceN(), point(atom, ref, row.aHertz(), "rydberg-hyperfine.csv"));
        } else {
            State from = State.of(row.measuredFromN(), row.l(), row.twoJ());
            double nStar = atom.level(from).effectiveN();
            out.put(row.measuredFromN(), new MeasuredLevel(from, row.aHertz() / (nStar * nStar * nStar), nStar,
                    row.aHertz(), "rydberg-hyperfine.csv (scaled constant fitted over n = " + row.measuredFromN()
                    + "-" + row.measuredToN() + ")"));
        }
        return List.copyOf(out.values());
    }

    private static MeasuredLevel point(AlkaliAtom atom, State state, double aHertz, String source) {
        double nStar = atom.level(state).effectiveN();
        return new MeasuredLevel(state, aHertz, nStar, aHertz * nStar * nStar * nStar, source);
    }

    /**
     * The drift of A n*^3 per unit of n along one row's series: the largest |ln(X_b / X_a)| / |n_b - n_a| over
     * every pair of its {@link #measuredLevels} (X = A n*^3).
     *
     * @param context the data context
     * @param row     a row of this file
     * @return the drift per n, or empty when the series has fewer than two measured levels here
     */
    public Optional<Double> driftPerN(DataContext context, Series row) {
        SeriesFigures f = SeriesFigures.of(row, measuredLevels(context, row));
        return f.drift() < 0 ? Optional.empty() : Optional.of(f.drift());
    }

    /**
     * One series' pairs of measured levels, read once: the largest drift per n (and the pair that gives it) and
     * the largest change; both -1 (and no pair) when it has fewer than two measured levels.
     */
    private record SeriesFigures(double drift, double change, String pair) {

        static SeriesFigures of(Series row, List<MeasuredLevel> levels) {
            double drift = -1;
            double change = -1;
            String pair = "";
            for (int i = 0; i < levels.size(); i++) {
                for (int k = i + 1; k < levels.size(); k++) {
                    MeasuredLevel a = levels.get(i);
                    MeasuredLevel b = levels.get(k);
                    double c = logRatio(a, b);
                    double perN = c / (b.state().n() - a.state().n());
                    change = Math.max(change, c);
                    if (perN > drift) {
                        drift = perN;
                        pair = row.species().notation() + " " + a.state().notation() + " - " + b.state().notation();
                    }
                }
            }
            return new SeriesFigures(drift, change, pair);
        }
    }

    private static double logRatio(MeasuredLevel a, MeasuredLevel b) {
        return Math.abs(Math.log(b.aNStarCubedHertz() / a.aNStarCubedHertz()));
    }

    /**
     * The n*^-3 law's error as every series' measured levels in the project's data show it: the largest drift of
     * A n*^3 per n and the largest change of A n*^3 between two measured levels of one series (see
     * {@link #constants} for how they are used). Worked out once per context and kept there (the same object on
     * every call with that context), except by {@link #recomputingLaw()}'s data.
     *
     * @param context the data context
     * @return the two figures and the pair of levels that gives the drift
     * @throws IllegalStateException when no series has two measured levels (a file without them gives no basis)
     */
    public ScalingLawError scalingLawError(DataContext context) {
        Objects.requireNonNull(context, "context");
        return (memo ? context.scalingLaw(this) : workOutLaw(context)).error();
    }

    /**
     * The figures one series' scaled constants take ({@link #scalingLawRelativeUncertainty}).
     *
     * @param driftPerN the series' own {@link #driftPerN}; for a series with one measured level the largest drift
     *                  per n of the series of the same l with two or more (of any isotope), or of any series when
     *                  no series of that l has two
     * @param cap       the largest change of A n*^3 between two measured levels of one series of the same l (of any
     *                  isotope), or of any series when no series of that l has two measured levels
     */
    public record SeriesLaw(double driftPerN, double cap) {
    }

    /**
     * @param context the data context
     * @param row     a row of this file
     * @return the drift and cap its scaled constants take (kept per context, as {@link #scalingLawError})
     * @throws IllegalStateException as {@link #scalingLawError} does
     */
    public SeriesLaw seriesLaw(DataContext context, Series row) {
        Objects.requireNonNull(context, "context");
        return (memo ? context.scalingLaw(this) : workOutLaw(context)).of(row);
    }

    /**
     * The n*^-3 law's figures of this data in one context, worked out together once ({@link DataContext#scalingLaw}
     * keeps them): {@link #scalingLawError} and each series' {@link #seriesLaw}. Immutable.
     */
    static final class Law {

        private final ScalingLawError error;
        private final Map<Series, SeriesLaw> series;

        private Law(ScalingLawError error, Map<Series, SeriesLaw> series) {
            this.error = error;
            this.series = series;
        }

        ScalingLawError error() {
            return error;
        }

        /** @return the figures of a row of the data this law was worked out for (by identity) */
        SeriesLaw of(Series row) {
            SeriesLaw law = series.get(row);
            if (law == null) {
                throw new IllegalArgumentException("not a row of the data this law was worked out for: " + row);
            }
            return law;
        }
    }

    /**
     * Works out the law's figures of this data in a context: what {@link DataContext#scalingLaw} keeps. The cap,
     * and the drift of a series with one measured level, are taken over the series of the same l: how far A n*^3
     * strays from constant at low n depends on how deep the valence orbital reaches into the core (s and p far,
     * d less but its A is turned by core polarisation, Cs nd5/2 changing sign below the Rydberg range; common
     * practice), so a d series' change does not stand for an s series' or the other way round.
     *
     * @throws IllegalStateException as {@link #scalingLawError} does
     */
    Law workOutLaw(DataContext context) {
        // each series' measured levels read once, for its own figures, its l's and the overall ones
        Map<Series, SeriesFigures> figures = new IdentityHashMap<>();
        Map<Integer, Double> driftOfL = new java.util.HashMap<>();
        Map<Integer, Double> capOfL = new java.util.HashMap<>();
        double drift = -1;
        double cap = -1;
        String pair = "";
        for (Series row : series) {
            SeriesFigures f = SeriesFigures.of(row, measuredLevels(context, row));
            figures.put(row, f);
            if (f.drift() >= 0) {
                driftOfL.merge(row.l(), f.drift(), Math::max);
                capOfL.merge(row.l(), f.change(), Math::max);
                cap = Math.max(cap, f.change());
                if (f.drift() > drift) {
                    drift = f.drift();
                    pair = f.pair();
                }
            }
        }
        if (drift < 0) {
            throw new IllegalStateException("no series of the Rydberg hyperfine data has two measured levels: the "
                    + "n*^-3 law's error cannot be estimated");
        }
        ScalingLawError error = new ScalingLawError(drift, cap, pair);
        Map<Series, SeriesLaw> out = new IdentityHashMap<>();
        for (Series row : series) {
            double own = figures.get(row).drift();
            out.put(row, new SeriesLaw(own >= 0 ? own : driftOfL.getOrDefault(row.l(), error.driftPerN()),
                    capOfL.getOrDefault(row.l(), error.cap())));
        }
        return new Law(error, Collections.unmodifiableMap(out));
    }

    /**
     * The relative standard uncertainty the n*^-3 law itself adds to one level's scaled A and B: {@code
     * min(d |n - n_m|, cap)}, d the drift of A n*^3 per n of the series' own measured levels ({@link #driftPerN};
     * for a series with one measured level the largest drift per n of the series of the same l), n_m the nearest n
     * the series' constant was measured at (the reference level; for a published scaled constant the nearest end of
     * the range it was fitted over, 0 inside it), cap the largest change of A n*^3 along any series of the same l in
     * the data ({@link #seriesLaw}). Zero at the measured level itself.
     *
     * @param context the data context
     * @param species an isotope
     * @param state   a level, e.g. 60s 2S1/2
     * @return the relative uncertainty, or empty when {@link #constants} is
     */
    public Optional<Double> scalingLawRelativeUncertainty(DataContext context, Species species, State state) {
        return resolve(context, species, state).map(r -> lawRelative(context, r.row(), state.n()));
    }

    /**
     * Linear in the distance in n from the measured level: the drift per n is measured between the lowest levels,
     * where the law is worst (the core penetration of the valence electron changes most there), so carrying it
     * up the series one n at a time overstates the error as A n*^3 levels off towards the Rydberg range; the cap
     * keeps it from exceeding the largest change of A n*^3 the data show along a whole series.
     */
    private double lawRelative(DataContext context, Series row, int n) {
        int distance = n < row.measuredFromN() ? row.measuredFromN() - n
                : n > row.measuredToN() ? n - row.measuredToN() : 0;
        if (distance == 0) {
            return 0;
        }
        SeriesLaw law = seriesLaw(context, row);
        return Math.min(law.driftPerN() * distance, law.cap());
    }

    /** A series' row as it serves one level: the row, and the ratios for a borrowed isotope (1 for its own). */
    private record Resolved(Series row, double aRatio, double bRatio, String how) {

        HyperfineConstants constants(DataContext context, Species species, State state, double law) {
            AlkaliAtom atom = context.alkaliAtom(species);
            double nStar = atom.level(state).effectiveN();
            double scale = row.kind().equals("level")
                    ? Math.pow(atom.level(State.of(row.referenceN(), row.l(), row.twoJ())).effectiveN() / nStar, 3)
                    : Math.pow(nStar, -3);
            boolean measuredHere = origin(species, state).equals("measured");
            double a = row.aHertz() * scale * aRatio;
            double b = row.bHertz() * scale * bRatio;
            return new HyperfineConstants(a, b,
                    row.source() + " (" + row.provenance().id() + ")" + how
                            + (measuredHere ? ", measured at this level" : ", scaled as n*^-3"),
                    Math.hypot(row.aUncertaintyHertz() * scale * Math.abs(aRatio), law * Math.abs(a)),
                    Math.hypot(row.bUncertaintyHertz() * scale * Math.abs(bRatio), law * Math.abs(b)));
        }

        String origin(Species species, State state) {
            boolean own = row.species().equals(species);
            if (own && row.kind().equals("level") && state.n() == row.referenceN()) {
                return "measured";
            }
            return "scaled as n*^-3 " + (row.kind().equals("level")
                    ? "from " + State.of(row.referenceN(), row.l(), row.twoJ()).notation()
                    : "from a published scaled constant")
                    + (own ? "" : " of " + row.species().notation() + " times the isotope ratio");
        }
    }

    private Optional<Resolved> resolve(DataContext context, Species species, State state) {
        Objects.requireNonNull(context, "context");
        Objects.requireNonNull(state, "state");
        Optional<Series> row = series(species, state.l(), state.twoJ());
        if (row.isPresent()) {
            return state.n() < row.get().fromN() ? Optional.empty() : Optional.of(new Resolved(row.get(), 1, 1, ""));
        }
        return fromOtherIsotope(context, species, state);
    }

    /**
     * An isotope without a row of its own borrows another isotope's row of the same element: A times
     * the ratio of the two isotopes' measured ground-level A constants (the ratio of the nuclear
     * moments mu/I; hyperfine anomalies of a few 0.1 % are neglected, common practice), B times the
     * ratio of their measured first p3/2 B constants (B is proportional to the nuclear quadrupole
     * moment; common practice). Empty when the ratio needed is not measured, or n is below the row's
     * from-n.
     */
    private Optional<Resolved> fromOtherIsotope(DataContext context, Species species, State state) {
        AlkaliHyperfine measured = context.alkaliHyperfine();
        for (Series s : series) {
            Species other = s.species();
            if (other.z() != species.z() || other.charge() != species.charge() || other.equals(species)
                    || s.l() != state.l() || s.twoJ() != state.twoJ() || state.n() < s.fromN()) {
                continue;
            }
            Optional<Double> aRatio = ratio(measured, species, other, 0, 1, true);
            Optional<Double> bRatio = s.bText().isEmpty() ? Optional.of(1.0) : ratio(measured, species, other, 1, 3, false);
            if (aRatio.isEmpty() || bRatio.isEmpty()) {
                return Optional.empty();
            }
            String how = "; the " + other.notation() + " row times the ratio of the ground-level A constants "
                    + String.format(java.util.Locale.ROOT, "%.6f", aRatio.get())
                    + (s.bText().isEmpty() ? "" : " (B: of the first p3/2 B constants "
                            + String.format(java.util.Locale.ROOT, "%.6f", bRatio.get()) + ")");
            return Optional.of(new Resolved(s, aRatio.get(), bRatio.get(), how));
        }
        return Optional.empty();
    }

    /** A (or B) of the lowest measured level with this l and j of {@code species} over that of {@code other}. */
    private static Optional<Double> ratio(AlkaliHyperfine measured, Species species, Species other, int l, int twoJ,
            boolean a) {
        Optional<HyperfineConstants> mine = lowest(measured, species, l, twoJ);
        Optional<HyperfineConstants> theirs = lowest(measured, other, l, twoJ);
        if (mine.isEmpty() || theirs.isEmpty()) {
            return Optional.empty();
        }
        double num = a ? mine.get().aHertz() : mine.get().bHertz();
        double den = a ? theirs.get().aHertz() : theirs.get().bHertz();
        return den == 0 || num == 0 ? Optional.empty() : Optional.of(num / den);
    }

    private static Optional<HyperfineConstants> lowest(AlkaliHyperfine measured, Species species, int l, int twoJ) {
        return measured.constants(species).stream()
                .filter(c -> c.state().l() == l && c.state().twoJ() == twoJ)
                .min(java.util.Comparator.comparingInt(c -> c.state().n()))
                .map(AlkaliHyperfine.LevelConstants::constants);
    }

    /**
     * The F levels of a Rydberg level from its scaled constants (Casimir formula).
     *
     * @param context the data context (nuclear spin, the atom's hyperfine-free level)
     * @param species an isotope
     * @param state   a level, e.g. 60s 2S1/2
     * @return its F levels by rising F, energies above the ground level's hyperfine-free centroid
     *         in cm^-1; empty when {@link #constants} is, as for the low levels with measured constants
     *         ({@link AlkaliHyperfine#fLevels}): {@link DataContext#hyperfineLevels} asks both
     */
    public List<AlkaliHyperfine.FLevel> fLevels(DataContext context, Species species, State state) {
        Optional<HyperfineConstants> c = constants(context, species, state);
        return c.isEmpty() ? List.of() : AlkaliHyperfine.fLevels(context, species, state, c.get());
    }
}
