package org.ritzwerk.engine.lines;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.function.DoubleConsumer;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.engine.rydberg.AlkaliLines;
import org.ritzwerk.quantity.SpectralQuantity;

/**
 * Which lines to take from {@link LineSources}: a species set, a window in any unit and medium,
 * limits on n and l, the one-electron tier, multiplets or components, strength thresholds, a
 * series (lower n) and a transition by its two levels. {@link #run(LineSources)} returns one
 * {@link LineSet}.
 *
 * <p>Configured with {@code withX} methods, each returning a new query (Hipparchus style):
 * <pre>{@code
 * LineSet balmer = LineQuery.defaults()
 *         .withWindow(Wavelength.ofNanometres(360, Medium.air()), Wavelength.ofNanometres(700, Medium.air()))
 *         .withMultiplets(true).withLowerN(2)
 *         .run(LineSources.none().withHydrogenLike(hydrogen, model));
 * }</pre>
 *
 * <h2>What each setting does</h2>
 * <ul>
 * <li>Computed sources (one-electron ions, alkali atoms) are computed in the window (or for the
 *     one transition) with upper n at most {@link #withMaxN maxN} (alkali atoms: both levels, and
 *     l at most {@link #withMaxL maxL}, 3 unless set). A window is needed unless a transition is
 *     given; for line lists and line sets without one, every line is taken. Levels of any species
 *     give their Ritz lines ({@link RitzLines}) in the window, or all of them without one.</li>
 * <li>Limits ({@code maxN}, {@code maxL}), when set, leave out only lines known to exceed them; a
 *     list line without quantum numbers stays. Unset, they leave out nothing (a transition asked
 *     for by its levels is computed whatever its n).</li>
 * <li>Selections (species, window, series, transition, strength thresholds above 0) keep only
 *     lines known to pass: a line that does not state the quantity a threshold is on is left out
 *     (a threshold of 0 keeps every line).</li>
 * </ul>
 * The result lists the lines by falling frequency (rising vacuum wavelength); equal frequencies
 * keep the order of the sources, then each source's own order.
 *
 * <p>Immutable and thread-safe; the sources are read only during {@link #run}.
 */
public final class LineQuery {

    /** Told how far the computation of one species' lines has got. */
    @FunctionalInterface
    public interface Progress {
        /**
         * @param species  the species being computed
         * @param fraction the share done, 0 to 1
         */
        void report(Species species, double fraction);
    }

    /** The default highest upper n of computed sources. */
    public static final int DEFAULT_MAX_N = 30;
    /** The default highest l of an alkali atom's levels. */
    public static final int DEFAULT_ALKALI_MAX_L = 3;

    private static final LineQuery DEFAULTS = new LineQuery(List.of(), Double.NaN, Double.NaN, -1, -1,
            null, false, false, 0, 0, 0, null, new int[0], null, null);

    private final List<Species> species;
    private final double lowHz;
    private final double highHz;
    private final int maxN;
    private final int maxL;
    private final Tier tier;
    private final boolean multiplets;
    private final boolean components;
    private final double minA;
    private final double minF;
    private final double minIntensity;
    private final StrengthClass weakest;
    private final int[] lowerN;
    private final State first;
    private final State second;

    private LineQuery(List<Species> species, double lowHz, double highHz, int maxN, int maxL, Tier tier,
            boolean multiplets, boolean components, double minA, double minF, double minIntensity,
            StrengthClass weakest, int[] lowerN, State first, State second) {
        this.species = species;
        this.lowHz = lowHz;
        this.highHz = highHz;
        this.maxN = maxN;
        this.maxL = maxL;
        this.tier = tier;
        this.multiplets = multiplets;
        this.components = components;
        this.minA = minA;
        this.minF = minF;
        this.minIntensity = minIntensity;
        this.weakest = weakest;
        this.lowerN = lowerN;
        this.first = first;
        this.second = second;
    }

    /**
     * @return every species, no window, no n limit (computed sources: upper n at most
     *         {@value #DEFAULT_MAX_N}), no l limit (alkali atoms computed up to l = 3), each ion's own tier, fine-structure components, no thresholds, any
     *         series, no transition
     */
    public static LineQuery defaults() {
        return DEFAULTS;
    }

    /**
     * Keeps the lines of some species only. A species without a mass number ({@code Cs I}) stands
     * for its element: it keeps the lines of every isotope of that element and charge, as the
     * sources resolve it ({@code Cs I} from a data context is computed as {@code Cs-133 I}); a
     * species with a mass number ({@code Rb-87 I}) keeps that isotope's lines only. A species that
     * none of the sources offers is refused when the query runs, not silently left without lines.
     *
     * @param only the species to keep, at least one (a query takes every species unless this is
     *             called; {@link #withAllSpecies()} goes back to that)
     * @return this query for those species only
     * @throws IllegalArgumentException for an empty list (which would read as "no species")
     */
    public LineQuery withSpecies(List<Species> only) {
        List<Species> copy = List.copyOf(Objects.requireNonNull(only, "species"));
        if (copy.isEmpty()) {
            throw new IllegalArgumentException("withSpecies needs at least one species; a query takes every species"
                    + " unless withSpecies is called (withAllSpecies() goes back to every species)");
        }
        return new LineQuery(copy, lowHz, highHz, maxN, maxL, tier, multiplets, components, minA, minF, minIntensity,
                weakest, lowerN, first, second);
    }

    /** @return this query for the lines of every species the sources offer (the default) */
    public LineQuery withAllSpecies() {
        return new LineQuery(List.of(), lowHz, highHz, maxN, maxL, tier, multiplets, components, minA, minF,
                minIntensity, weakest, lowerN, first, second);
    }

    /**
     * @param wanted a species asked for with {@link #withSpecies}
     * @param offered a species a source offers
     * @return whether {@code wanted} covers {@code offered}: the same species, or {@code wanted}
     *         names no mass number and {@code offered} is an isotope of the same element and charge
     */
    static boolean covers(Species wanted, Species offered) {
        return wanted.equals(offered) || wanted.massNumber() == 0 && wanted.z() == offered.z()
                && wanted.charge() == offered.charge();
    }

    private boolean wanted(Species offered) {
        return species.isEmpty() || species.stream().anyMatch(w -> covers(w, offered));
    }

    /**
     * @param one   one end of the window, in any unit and medium: a wavelength in vacuum or air
     *              (its air model converts it), a wavenumber, a frequency or an energy
     * @param other the other end
     * @return this query for lines whose vacuum frequency lies between the two, ends included
     * @throws IllegalArgumentException when the ends are the same position
     */
    public LineQuery withWindow(SpectralQuantity one, SpectralQuantity other) {
        double a = one.toFrequency().inHertz();
        double b = other.toFrequency().inHertz();
        return withWindowHz(Math.min(a, b), Math.max(a, b));
    }

    /**
     * @param fromHz the window's low end, vacuum frequency in Hz, not negative
     * @param toHz   its high end, Hz, above {@code fromHz} and finite
     * @return this query for lines whose frequency lies between the two, ends included
     */
    public LineQuery withWindowHz(double fromHz, double toHz) {
        if (!(fromHz >= 0) || !(toHz > fromHz) || Double.isInfinite(toHz)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "a window needs 0 <= from < to (finite, Hz), got %s to %s Hz", fromHz, toHz));
        }
        return new LineQuery(species, fromHz, toHz, maxN, maxL, tier, multiplets, components, minA, minF, minIntensity,
                weakest, lowerN, first, second);
    }

    /**
     * @param n the highest upper principal quantum number, 1 to {@link HydrogenLikeLines#MAX_N}
     * @return this query with that limit
     */
    public LineQuery withMaxN(int n) {
        if (n < 1 || n > HydrogenLikeLines.MAX_N) {
            throw new IllegalArgumentException("the highest n must be 1 to " + HydrogenLikeLines.MAX_N + ", got " + n);
        }
        return new LineQuery(species, lowHz, highHz, n, maxL, tier, multiplets, components, minA, minF, minIntensity,
                weakest, lowerN, first, second);
    }

    /**
     * @param l the highest orbital quantum number of both levels, 0 to 50
     * @return this query with that limit (alkali atoms are computed up to it)
     */
    public LineQuery withMaxL(int l) {
        if (l < 0 || l > 50) {
            throw new IllegalArgumentException("the highest l must be 0 to 50, got " + l);
        }
        return new LineQuery(species, lowHz, highHz, maxN, l, tier, multiplets, components, minA, minF, minIntensity,
                weakest, lowerN, first, second);
    }

    /**
     * @param level the one-electron tier to compute ions in (their nucleus kept), instead of each
     *              model's own
     * @return this query in that tier
     */
    public LineQuery withTier(Tier level) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, Objects.requireNonNull(level, "tier"), multiplets,
                components, minA, minF, minIntensity, weakest, lowerN, first, second);
    }

    /**
     * @param blend true for one-electron n -&gt; n' multiplets, false for fine-structure components
     * @return this query so
     */
    public LineQuery withMultiplets(boolean blend) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, blend, components, minA, minF, minIntensity,
                weakest, lowerN, first, second);
    }

    /**
     * @param attach whether each one-electron multiplet carries its fine-structure components
     *               ({@link LineSet#components(int)}; computing them about doubles the work)
     * @return this query so
     */
    public LineQuery withMultipletComponents(boolean attach) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, multiplets, attach, minA, minF, minIntensity,
                weakest, lowerN, first, second);
    }

    /**
     * @param perSecond the smallest Einstein A kept, s^-1, finite, not negative (0 keeps every line)
     * @return this query with that threshold
     */
    public LineQuery withMinEinsteinA(double perSecond) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, multiplets, components,
                threshold("Einstein A (s^-1)", perSecond), minF, minIntensity, weakest, lowerN, first, second);
    }

    /**
     * @param f the smallest absorption oscillator strength kept, finite, not negative
     * @return this query with that threshold
     */
    public LineQuery withMinOscillatorStrength(double f) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, multiplets, components, minA,
                threshold("oscillator strength", f), minIntensity, weakest, lowerN, first, second);
    }

    /**
     * @param relative the smallest relative intensity kept (lists that give one), finite, not negative
     * @return this query with that threshold
     */
    public LineQuery withMinRelativeIntensity(double relative) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, multiplets, components, minA, minF,
                threshold("relative intensity", relative), weakest, lowerN, first, second);
    }

    /**
     * @param weakestKept the weakest strength class kept (lines whose list gives no class are left out)
     * @return this query with that threshold
     */
    public LineQuery withMinStrengthClass(StrengthClass weakestKept) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, multiplets, components, minA, minF,
                minIntensity, Objects.requireNonNull(weakestKept, "weakestKept"), lowerN, first, second);
    }

    /**
     * @param n the lower principal quantum numbers of the series kept, each at least 1 (2 for
     *          Balmer); none for every series
     * @return this query for those series
     */
    public LineQuery withLowerN(int... n) {
        for (int value : n) {
            if (value < 1) {
                throw new IllegalArgumentException("a series' lower n must be at least 1, got " + value);
            }
        }
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, multiplets, components, minA, minF,
                minIntensity, weakest, n.clone(), first, second);
    }

    /**
     * @param one   one level of the transition, n l j (either order: the higher in each model is the upper)
     * @param other the other level
     * @return this query for that one transition: computed sources compute it alone (no window
     *         needed), lists keep the lines whose two labels read as these states
     */
    public LineQuery withTransition(State one, State other) {
        return new LineQuery(species, lowHz, highHz, maxN, maxL, tier, multiplets, components, minA, minF,
                minIntensity, weakest, lowerN, Objects.requireNonNull(one, "one"), Objects.requireNonNull(other, "other"));
    }

    /**
     * @param sources where the lines come from
     * @return the lines that pass, by falling frequency
     * @throws IllegalStateException when a computed source is asked without a window or a transition
     * @throws IllegalArgumentException from a source: a transition that is not electric-dipole, a
     *         list position that cannot be converted
     */
    public LineSet run(LineSources sources) {
        return run(sources, (s, f) -> { });
    }

    /**
     * As {@link #run(LineSources)}, telling {@code progress} how far each computed species has got.
     *
     * @param sources  where the lines come from
     * @param progress told the share done per species; may be a no-op
     * @return the lines that pass, by falling frequency
     */
    public LineSet run(LineSources sources, Progress progress) {
        Objects.requireNonNull(sources, "sources");
        Objects.requireNonNull(progress, "progress");
        requireOffered(sources);
        List<LineSet> found = new ArrayList<>();
        for (LineSources.Entry entry : sources.entries()) {
            if (entry.species() != null && !wanted(entry.species())) {
                continue;
            }
            LineSet lines;
            if (entry.model() != null) {
                lines = hydrogenLike(entry.species(), entry.model(), f -> progress.report(entry.species(), f));
            } else if (entry.atom() != null) {
                DoubleConsumer told = f -> progress.report(entry.species(), f);
                List<AlkaliLines.Line> computed = first != null ? List.of(AlkaliLines.between(entry.atom(), first, second))
                        : AlkaliLines.window(entry.atom(), window()[0], window()[1], generatedMaxN(),
                                maxL < 0 ? DEFAULT_ALKALI_MAX_L : maxL, minA, told);
                lines = LineSet.ofAlkali(entry.atom(), computed);
            } else if (entry.levels() != null) {
                RitzLines job = entry.job();
                if (!Double.isNaN(lowHz)) {
                    // a hair wider than the query's window, which keep() applies exactly in Hz
                    job = job.withWindowPerCm(lowHz / PhysicalConstants.C / 100 * (1 - 1e-12),
                            highHz / PhysicalConstants.C / 100 * (1 + 1e-12));
                }
                lines = LineSet.ofRitz(job.compute(entry.levels()));
            } else if (entry.list() != null) {
                lines = LineSet.of(entry.list());
            } else {
                lines = entry.set();
            }
            LineSet all = lines;
            found.add(lines.filter(i -> keep(all, i)));
        }
        return LineSet.concat(found).sortedByFallingFrequency();
    }

    /** Refuses a species of {@link #withSpecies} that no source offers, naming those they do. */
    private void requireOffered(LineSources sources) {
        if (species.isEmpty()) {
            return;
        }
        java.util.Set<Species> offered = new java.util.LinkedHashSet<>();
        for (LineSources.Entry entry : sources.entries()) {
            if (entry.species() != null) {
                offered.add(entry.species());
            } else if (entry.list() != null) {
                for (int i = 0; i < entry.list().size(); i++) {
                    offered.add(entry.list().species(i));
                }
            } else {
                offered.addAll(entry.set().speciesList());
            }
        }
        List<String> missing = species.stream().filter(w -> offered.stream().noneMatch(o -> covers(w, o)))
                .map(Species::notation).toList();
        if (!missing.isEmpty()) {
            throw new IllegalArgumentException("withSpecies: " + String.join(", ", missing) + (missing.size() == 1
                    ? " is" : " are") + " offered by none of the sources, which offer "
                    + offered.stream().map(Species::notation).toList()
                    + "; add a source for it or leave it out of withSpecies");
        }
    }

    private LineSet hydrogenLike(Species ion, HydrogenLikeModel own, DoubleConsumer told) {
        HydrogenLikeModel model = tier == null || tier == own.tier() ? own
                : HydrogenLikeModel.of(own.nucleus(), tier.forZ(own.nucleus().z()));
        HydrogenLikeLines generator = HydrogenLikeLines.of(model);
        LineTable table;
        if (first != null) {
            boolean firstAbove = model.energy(first.n(), first.l(), first.twoJ())
                    > model.energy(second.n(), second.l(), second.twoJ());
            State upper = firstAbove ? first : second;
            State lower = firstAbove ? second : first;
            table = generator.line(upper.n(), upper.l(), upper.twoJ(), lower.n(), lower.l(), lower.twoJ());
        } else {
            double[] window = window();
            table = multiplets ? generator.multiplets(generatedMaxN(), window[0], window[1], told)
                    : generator.components(generatedMaxN(), window[0], window[1], told);
        }
        return LineSet.ofHydrogenLike(ion, model, table, components ? generator : null);
    }

    private int generatedMaxN() {
        return maxN < 0 ? DEFAULT_MAX_N : maxN;
    }

    private double[] window() {
        if (Double.isNaN(lowHz)) {
            throw new IllegalStateException("computed lines (one-electron ions, alkali atoms) need a window or a "
                    + "transition: give withWindow or withTransition");
        }
        return new double[] {lowHz, highHz};
    }

    private boolean keep(LineSet set, int i) {
        if (!wanted(set.species(i))) {
            return false;
        }
        double hz = set.frequencyHz(i);
        if (!Double.isNaN(lowHz) && !(hz >= lowHz && hz <= highHz)) {
            return false;
        }
        if (maxN >= 0 && set.upperN(i).orElse(0) > maxN || maxL >= 0 && (set.upperL(i).orElse(0) > maxL
                || set.lowerL(i).orElse(0) > maxL)) {
            return false;
        }
        if (minA > 0 && !(set.einsteinA(i).orElse(-1) >= minA)
                || minF > 0 && !(set.oscillatorStrength(i).orElse(-1) >= minF)
                || minIntensity > 0 && !(set.relativeIntensity(i).orElse(-1) >= minIntensity)) {
            return false;
        }
        if (weakest != null && !set.strengthClass(i).map(c -> c.ordinal() <= weakest.ordinal()).orElse(false)) {
            return false;
        }
        if (lowerN.length > 0 && (set.lowerN(i).isEmpty()
                || Arrays.stream(lowerN).noneMatch(n -> n == set.lowerN(i).getAsInt()))) {
            return false;
        }
        if (first != null) {
            State u = set.upperState(i).orElse(null);
            State l = set.lowerState(i).orElse(null);
            return u != null && l != null && (u.equals(first) && l.equals(second) || u.equals(second) && l.equals(first));
        }
        return true;
    }

    @Override
    public String toString() {
        return "LineQuery[species " + (species.isEmpty() ? "all" : species.stream().map(Species::notation).toList())
                + (Double.isNaN(lowHz) ? ", no window" : ", " + lowHz + " to " + highHz + " Hz")
                + (maxN < 0 ? "" : ", n <= " + maxN) + (maxL < 0 ? "" : ", l <= " + maxL)
                + (tier == null ? "" : ", tier " + tier.id()) + (multiplets ? ", multiplets" : "")
                + (components ? " with components" : "") + (minA > 0 ? ", A >= " + minA + " s^-1" : "")
                + (minF > 0 ? ", f >= " + minF : "") + (minIntensity > 0 ? ", intensity >= " + minIntensity : "")
                + (weakest == null ? "" : ", class " + weakest.id() + " or stronger")
                + (lowerN.length == 0 ? "" : ", lower n " + Arrays.toString(lowerN))
                + (first == null ? "" : ", transition " + first.label() + " - " + second.label()) + "]";
    }

    private static double threshold(String what, double value) {
        if (!(value >= 0) || Double.isInfinite(value)) {
            throw new IllegalArgumentException("the smallest " + what + " must be finite and not negative, got " + value);
        }
        return value;
    }
}
