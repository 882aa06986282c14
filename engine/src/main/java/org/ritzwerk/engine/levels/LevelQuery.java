package org.ritzwerk.engine.levels;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.function.Consumer;
import java.util.function.Function;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LevelTable;
import org.ritzwerk.engine.hyperfine.HyperfineLevel;
import org.ritzwerk.engine.ritz.LevelDesignation;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.Level;
import org.ritzwerk.engine.rydberg.RydbergException;

/**
 * Which levels to list, and with what: the highest principal quantum number, the highest orbital
 * quantum number of alkali atoms, radiative lifetimes (E1 decays) and black-body lifetimes, and the
 * hyperfine F levels of alkali isotopes. {@link #run(LevelSources)} asks each source in turn:
 *
 * <ul>
 *   <li>a one-electron ion gives every level n &lt;= max n of its model (every l and j, and F in
 *       the hyperfine tier), energies above its lowest level;
 *   <li>an alkali atom gives its levels n &lt;= max n, l &lt;= max l, lowest n first, from its measured
 *       levels and quantum-defect series; a level below a series' validity with no measured energy
 *       is not extrapolated but counted in {@link LevelSet#omissions()};
 *   <li>a level list gives its levels as listed (lifetimes are not known for them).
 * </ul>
 *
 * <p>Immutable and thread-safe; each {@code with} method returns a new query.
 */
public final class LevelQuery {

    /** Told how far a species has got. */
    @FunctionalInterface
    public interface Progress {
        /**
         * @param species  the species being listed
         * @param fraction the share of its work done, 0 to 1
         */
        void report(Species species, double fraction);
    }

    /** The highest n a query takes (about 4 million levels of a one-electron ion in the hyperfine tier). */
    public static final int MAX_N = AlkaliAtom.MAX_N;
    /** The highest l of alkali levels a query takes. */
    public static final int MAX_L = 50;
    /** The default highest n. */
    public static final int DEFAULT_MAX_N = 4;
    /** The default highest l of alkali levels. */
    public static final int DEFAULT_MAX_L = 3;

    private static final String OMITTED = "no measured energy below their quantum-defect series' validity";

    private final int maxN;
    private final int maxL;
    private final boolean lifetimes;
    private final double temperature;
    private final boolean hyperfine;

    private LevelQuery(int maxN, int maxL, boolean lifetimes, double temperature, boolean hyperfine) {
        this.maxN = maxN;
        this.maxL = maxL;
        this.lifetimes = lifetimes;
        this.temperature = temperature;
        this.hyperfine = hyperfine;
    }

    /** @return n &lt;= {@value #DEFAULT_MAX_N}, alkali l &lt;= {@value #DEFAULT_MAX_L}, no lifetimes, no F levels */
    public static LevelQuery defaults() {
        return new LevelQuery(DEFAULT_MAX_N, DEFAULT_MAX_L, false, Double.NaN, false);
    }

    /**
     * @param n the highest principal quantum number, 1 to {@value #MAX_N}
     * @return this query with that limit
     * @throws IllegalArgumentException outside that range
     */
    public LevelQuery withMaxN(int n) {
        if (n < 1 || n > MAX_N) {
            throw new IllegalArgumentException("the highest n must be 1 to " + MAX_N + ", got " + n);
        }
        return new LevelQuery(n, maxL, lifetimes, temperature, hyperfine);
    }

    /**
     * @param l the highest orbital quantum number of alkali levels, 0 to {@value #MAX_L} (one-electron
     *          ions give every l up to n - 1)
     * @return this query with that limit
     * @throws IllegalArgumentException outside that range
     */
    public LevelQuery withMaxL(int l) {
        if (l < 0 || l > MAX_L) {
            throw new IllegalArgumentException("the highest l must be 0 to " + MAX_L + ", got " + l);
        }
        return new LevelQuery(maxN, l, lifetimes, temperature, hyperfine);
    }

    /**
     * @param on whether each level gets its radiative lifetime from E1 decays (none for a ground
     *           level; 2s1/2 of a one-electron ion from its two-photon and magnetic-dipole decays to 1s,
     *           {@link org.ritzwerk.engine.hydrogenic.HydrogenLikeLines#metastableDecayRate})
     * @return this query so
     */
    public LevelQuery withLifetimes(boolean on) {
        return new LevelQuery(maxN, maxL, on, temperature, hyperfine);
    }

    /**
     * @param kelvin a black-body temperature from 0 to below 1e5 K: alkali levels also get their
     *               effective lifetime with black-body stimulated decays and excitation to bound
     *               levels (photoionisation left out; at 0 K there is no black-body radiation and it
     *               is the spontaneous lifetime, as {@link AlkaliAtom#effectiveLifetime} gives); needs
     *               {@link #withLifetimes lifetimes}
     * @return this query so
     * @throws IllegalArgumentException outside that range
     */
    public LevelQuery withBlackBodyTemperature(double kelvin) {
        if (!(kelvin >= 0 && kelvin < AlkaliAtom.MAX_BLACK_BODY_TEMPERATURE_K)) {
            throw new IllegalArgumentException("the black-body temperature must be 0 to below 1e5 K, got "
                    + kelvin);
        }
        return new LevelQuery(maxN, maxL, lifetimes, kelvin, hyperfine);
    }

    /**
     * @param on whether alkali levels with hyperfine structure in their source are given as their F
     *           levels (the Casimir formula with their A and B) instead of the hyperfine-free level
     * @return this query so
     */
    public LevelQuery withHyperfine(boolean on) {
        return new LevelQuery(maxN, maxL, lifetimes, temperature, on);
    }

    /** @return the highest n */
    public int maxN() {
        return maxN;
    }

    /** @return the highest l of alkali levels */
    public int maxL() {
        return maxL;
    }

    /**
     * @param sources where the levels come from, asked in order
     * @return their levels, in the sources' order
     * @throws RydbergException when an alkali lifetime cannot be computed
     */
    public LevelSet run(LevelSources sources) {
        return run(sources, (species, fraction) -> { });
    }

    /**
     * As {@link #run(LevelSources)}, telling {@code progress} how far each species has got.
     *
     * @param sources  where the levels come from
     * @param progress told the share done per species
     * @return their levels
     */
    public LevelSet run(LevelSources sources, Progress progress) {
        List<LevelSet> parts = new ArrayList<>();
        run(sources, progress, parts::add);
        return LevelSet.concat(parts);
    }

    /**
     * As {@link #run(LevelSources, Progress)}, handing the levels over in parts as they are found
     * (a shell of an ion, an n of an alkali atom, a whole level list), so that memory does not grow
     * with max n: about 4 million levels of a one-electron ion at n = 2000 pass through a few
     * thousand at a time.
     *
     * @param sources  where the levels come from
     * @param progress told the share done per species
     * @param parts    given each part, in order; a part's {@link LevelSet#omissions()} name levels
     *                 left out of that species
     */
    public void run(LevelSources sources, Progress progress, Consumer<LevelSet> parts) {
        Objects.requireNonNull(sources, "sources");
        Objects.requireNonNull(progress, "progress");
        Objects.requireNonNull(parts, "parts");
        for (LevelSources.Entry entry : sources.entries()) {
            if (entry.model() != null) {
                hydrogenLike(entry.species(), entry.model(), progress, parts);
            } else if (entry.atom() != null) {
                alkali(entry.atom(), entry.hyperfine(), entry.hyperfineModel(), progress, parts);
            } else {
                parts.accept(listed(entry.levels()));
            }
        }
    }

    private void hydrogenLike(Species species, HydrogenLikeModel model, Progress progress, Consumer<LevelSet> parts) {
        double hcPerCm = PhysicalConstants.H * PhysicalConstants.C * 100;
        // One shell at a time; the ground level lies in shell 1.
        LevelTable shell = model.levels(1, 1);
        double ground = Double.POSITIVE_INFINITY;
        for (int i = 0; i < shell.size(); i++) {
            ground = Math.min(ground, shell.energy(i));
        }
        HydrogenLikeLines lines = lifetimes ? HydrogenLikeLines.of(model) : null;
        String tier = model.tier().id();
        int none = LevelSet.none();
        for (int n = 1; n <= maxN; n++) {
            LevelTable levels = n == 1 ? shell : model.levels(n, n);
            LevelSet.Builder part = new LevelSet.Builder();
            for (int i = 0; i < levels.size(); i++) {
                double lifetime = lifetimes ? lines.lifetime(levels.n(i), levels.l(i), levels.twoJ(i)) : Double.NaN;
                part.add(species, levels.label(i), levels.n(i), levels.l(i), levels.twoJ(i),
                        levels.twoF(i) < 0 ? none : levels.twoF(i), levels.statisticalWeight(i),
                        (levels.energy(i) - ground) / hcPerCm, Double.NaN, tier, lifetime, Double.NaN, Double.NaN,
                        Double.NaN);
            }
            parts.accept(part.build());
            progress.report(species, lifetimes ? Math.pow((double) n / maxN, 4) : (double) n * n / ((double) maxN * maxN));
        }
    }

    private void alkali(AlkaliAtom atom, Function<State, List<HyperfineLevel>> split,
            Function<State, String> splitModel, Progress progress, Consumer<LevelSet> parts) {
        int skipped = 0;
        String firstSkipped = null;
        int none = LevelSet.none();
        boolean effective = lifetimes && !Double.isNaN(temperature);
        for (int n = 1; n <= maxN; n++) {
            LevelSet.Builder part = new LevelSet.Builder();
            List<State> states = new ArrayList<>();
            for (int l = 0; l <= Math.min(maxL, n - 1); l++) {
                for (int twoJ = Math.max(1, 2 * l - 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    if (n >= atom.lowestN(l)) {
                        states.add(State.of(n, l, twoJ)); // below: filled by the core, no such level
                    }
                }
            }
            // the rates of one n's states are independent (the atom's caches are concurrent): with lifetimes they
            // take most of the time, so they are computed side by side, and used in the order of the states
            List<AlkaliRow> rows = (lifetimes && states.size() > 1 ? states.parallelStream() : states.stream())
                    .map(state -> alkaliRow(atom, state, effective)).toList();
            for (AlkaliRow row : rows) {
                State state = row.state();
                Level level = row.level();
                if (level == null) {
                    skipped++;
                    firstSkipped = firstSkipped == null ? state.notation() : firstSkipped;
                    continue;
                }
                int l = state.l();
                int twoJ = state.twoJ();
                String origin = level.origin().name().toLowerCase(Locale.ROOT).replace('_', '-');
                List<HyperfineLevel> fLevels = hyperfine ? split.apply(state) : List.of();
                if (fLevels.isEmpty()) {
                    part.add(atom.species(), state.notation(), n, l, twoJ, none, twoJ + 1, level.energyPerCm(),
                            level.uncertaintyPerCm(), origin, row.lifetime(), row.lifetimeSigma(),
                            row.withBlackBody(), row.withBlackBodySigma());
                }
                String fModel = fLevels.isEmpty() ? null : origin + ", " + splitModel.apply(state);
                for (HyperfineLevel f : fLevels) {
                    part.add(atom.species(), state.notation(), n, l, twoJ, f.twoF(), f.twoF() + 1,
                            level.energyPerCm() + f.shiftHertz() / (PhysicalConstants.C * 100), Double.NaN,
                            fModel, row.lifetime(), row.lifetimeSigma(), row.withBlackBody(),
                            row.withBlackBodySigma());
                }
            }
            if (n == maxN && skipped > 0) {
                part.omit(new LevelSet.Omission(atom.species(), skipped, firstSkipped, OMITTED));
            }
            parts.accept(part.build());
            progress.report(atom.species(), (double) n / maxN);
        }
    }

    /** One alkali state's level (null when the model has none) and rates, NaN where not asked for. */
    private record AlkaliRow(State state, Level level, double lifetime, double lifetimeSigma, double withBlackBody,
            double withBlackBodySigma) {
    }

    private AlkaliRow alkaliRow(AlkaliAtom atom, State state, boolean effective) {
        Level level;
        try {
            level = atom.level(state);
        } catch (RydbergException e) {
            return new AlkaliRow(state, null, Double.NaN, Double.NaN, Double.NaN, Double.NaN);
        }
        boolean ground = state.equals(atom.groundState());
        double lifetime = lifetimes && !ground ? atom.radiativeLifetime(state) : Double.NaN;
        double lifetimeSigma = lifetimes && !ground
                ? atom.radiativeLifetimeUncertainty(state).orElse(Double.NaN) : Double.NaN;
        double withBlackBody = effective && !ground ? atom.effectiveLifetime(state, temperature) : Double.NaN;
        double withBlackBodySigma = effective && !ground
                ? atom.effectiveLifetimeUncertainty(state, temperature).orElse(Double.NaN) : Double.NaN;
        return new AlkaliRow(state, level, lifetime, lifetimeSigma, withBlackBody, withBlackBodySigma);
    }

    private static LevelSet listed(RitzLevels set) {
        String model = "level list" + set.info().map(i -> " " + i.id()).orElse("");
        int none = LevelSet.none();
        LevelSet.Builder part = new LevelSet.Builder();
        for (int i = 0; i < set.size(); i++) {
            LevelDesignation d = set.designation(i);
            part.add(set.species(), set.label(i), none, none, d.hasJ() ? d.twoJ() : none, none,
                    d.hasJ() ? d.twoJ() + 1 : none, set.energyPerCm(i), set.uncertaintyPerCm(i).orElse(Double.NaN),
                    model, Double.NaN, Double.NaN, Double.NaN, Double.NaN);
        }
        return part.build();
    }

    @Override
    public String toString() {
        return "LevelQuery[n <= " + maxN + ", alkali l <= " + maxL + (lifetimes ? ", lifetimes" : "")
                + (Double.isNaN(temperature) ? "" : ", black body " + temperature + " K")
                + (hyperfine ? ", hyperfine" : "") + "]";
    }
}
