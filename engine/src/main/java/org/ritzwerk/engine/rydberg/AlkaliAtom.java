package org.ritzwerk.engine.rydberg;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.CorePolarizability;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.ModelPotential;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.internal.angular.WignerSymbols;

/**
 * One alkali atom (one valence electron outside a closed core) built from a quantum-defect set,
 * measured low-lying levels and, optionally, the core polarizabilities: its levels, radial
 * wavefunctions, dipole matrix elements, decay rates, lifetimes and transition frequencies.
 * Immutable and thread-safe; computed wavefunctions are kept for reuse in a bounded concurrent map
 * (up to 512 of them), which changes no result.
 *
 * <p><b>Levels</b> ({@link #level(State)}), energies above the ground level in cm^-1:
 * <ol>
 * <li>a measured level given to {@link #of} is used as it is ({@link LevelOrigin#MEASURED});</li>
 * <li>else, where the set has a series for l and j and {@code n >= validFromN}, the modified
 * Rydberg-Ritz formula {@code E = E_limit - R_M / (n - delta)^2},
 * {@code delta = d0 + d2/(n-d0)^2 + d4/(n-d0)^4 + ...} (T. F. Gallagher, Rydberg Atoms (1994),
 * eq. 16.19) ({@link LevelOrigin#QUANTUM_DEFECT_FIT});</li>
 * <li>for l above every series of the set: the core-polarization quantum defect
 * {@code delta = n^3 (alpha_d <r^-4> / 2 + alpha_q <r^-6> / 2)} with the hydrogenic expectation
 * values {@code <r^-4> = [3n^2 - l(l+1)] / [2 n^5 (l-1/2) l (l+1/2) (l+1) (l+3/2)]} and
 * {@code <r^-6> = [35n^4 - 5n^2 (6l(l+1) - 5) + 3(l-1)l(l+1)(l+2)] / [8 n^7 (l-3/2)(l-1)(l-1/2) l
 * (l+1/2)(l+1)(l+3/2)(l+2)(l+5/2)]} (H. A. Bethe and E. E. Salpeter (1957), eq. 3.26; Gallagher
 * ch. 16; both checked against sympy's exact integrals), fine structure neglected
 * ({@link LevelOrigin#CORE_POLARIZATION}); without polarizabilities, delta = 0
 * ({@link LevelOrigin#HYDROGENIC});</li>
 * <li>anything else is refused with a {@link RydbergException}: a state below the lowest one of
 * its series ({@link RydbergException#NO_SUCH_STATE}), or below a series' validity with no
 * measured value ({@link RydbergException#NO_LEVEL}). Nothing is extrapolated silently.</li>
 * </ol>
 * The lowest n of a series l is the lowest measured level with that l, or l + 1 when none is
 * given.
 *
 * <p><b>Wavefunctions</b>: {@link RadialWavefunction} (Coulomb approximation at the level's
 * own energy, Numerov on a square-root grid, reduced-mass units), or, after
 * {@link #withModelPotential(ModelPotential)}, the Marinescu et al. (1994) core potential at the
 * same energy. Radial integrals are returned
 * in Bohr radii a0: the reduced-mass length {@code a_mu = a0 R_inf / R_M} is converted back.
 *
 * <p><b>Dipole convention</b> (A. R. Edmonds (1957) eqs. 5.4.1 and 7.1.7): Wigner-Eckart
 * {@code <j m|d_q|j' m'> = (-1)^(j-m) (j 1 j'; -m q m') <j||d||j'>},
 * {@code <l j||d||l' j'> = (-1)^(l+s+j'+1) sqrt((2j+1)(2j'+1)) {l j s; j' l' 1} <l||d||l'>},
 * {@code <l||d||l'> = (-1)^l sqrt((2l+1)(2l'+1)) (l 1 l'; 0 0 0) <n l|r|n' l'>}, in units of
 * e a0, so that {@code sum over m', q of |<j m|d_q|j' m'>|^2 = |<j||d||j'>|^2 / (2j+1)} and
 * {@code A(u -> l) = omega^3 |<l||d||u>|^2 / (3 pi eps0 hbar c^3 (2j_u + 1))}. The reduced
 * elements are symmetric up to sign, {@code |<a||d||b>| = |<b||d||a>|}. D. A. Steck's alkali
 * D-line data use {@code <J||er||J'>} with the factor {@code sqrt(2J+1)} taken out of the
 * Wigner-Eckart theorem: Steck's value is this one divided by {@code sqrt(2j_a + 1)}. Signs: every
 * radial function is positive at large r (see {@link RadialWavefunction}).
 *
 * <p><b>Dipole operator</b>: the bare r, or after {@link #withCorePolarizedDipole(ModelPotential)} the
 * core-polarized one; the best resonance-line elements here come from the model potential
 * integrated into the core with the core-polarized operator ({@code withModelPotential(p)
 * .withInnerRadius(0.01).withCorePolarizedDipole(p)}: first-p lifetimes of Na and K within 1 %, Rb
 * and Cs 2 to 2.6 % long). They are options, not the default: besides the resonance lines they
 * change every element between a Rydberg state and the lowest levels, whose channels dominate
 * Rydberg lifetimes (at 0 K, n = 30 to 60: Rb s and d 8 % shorter, p 22 % longer; Cs, K 4 to 12 %;
 * Na 2 to 18 %); that spread is what {@link #withModelSpread} states as the computed lifetimes' uncertainty.
 *
 * <p><b>Published elements</b>: {@link #withPublishedDipoles(List)} replaces the computed element of
 * chosen low-lying pairs by a published one (measured, or deduced from a measured lifetime); the
 * data context's atoms (refdata) carry the built-in table, so that there the engine uses a
 * published element wherever one exists, and first-p lifetimes of Li, Na, K, Rb and Cs come within
 * 1 % of published measurements. An atom made by {@link #of} has none.
 *
 * <p><b>Uncertainties</b> ({@link Level#energyUncertaintyPerCm()}, {@link #frequencyUncertaintyHz}): a
 * measured level carries the standard uncertainty given with it ({@link MeasuredLevel#uncertaintyPerCm()});
 * a level of the Rydberg-Ritz formula the first-order propagation of the stated uncertainties of the
 * limit and of every coefficient of its series ({@link #rydbergRitzEnergyUncertainty}), none when any
 * of them is not stated; core-polarization and hydrogenic levels have none (not estimated). A
 * transition combines its two levels' as independent, except two formula levels, whose shared
 * inputs are propagated together (the limit cancels; see {@link #frequencyUncertaintyHz}).
 * A dipole element, its Einstein A and a lifetime carry one where published elements decide them (their
 * stated uncertainties), and where computed elements do, with a second model set ({@link #withModelSpread};
 * the data context's atoms have one), the spread between the two published methods of computing them (the
 * Coulomb approximation and the model potential with the core-polarized operator): a model-spread estimate
 * ({@link #reducedDipoleUncertainty}, {@link #einsteinAUncertainty}, {@link #radiativeLifetimeUncertainty},
 * and {@link #effectiveLifetimeUncertainty} for the lifetime with black-body radiation); a black-body
 * rate alone has none (not estimated).
 *
 * <p><b>Accuracy</b> (see the tests): levels as good as the measured values and the fits (the
 * fits meet the measured levels within 0.1 cm^-1 from valid-from-n on); Rydberg-Rydberg dipole
 * integrals limited by the Coulomb approximation at the 1e-3 level or better; resonance-line
 * elements of the lowest states 1 to 6 % high with the defaults (no core potential, the bare dipole
 * operator), so lifetimes of the lowest p levels come out 3 to 11 % short (see the dipole-operator
 * paragraph above for the options that bring them within 0.6 to 2.6 %); black-body
 * rates of Rb within 5 % of the Beterov et al. (2009) fits for n = 30 to 60.
 */
public final class AlkaliAtom {

    /** The default Numerov step in x = sqrt(r / a_mu). */
    public static final double DEFAULT_STEP = 0.01;

    /** How many wavefunctions an atom keeps for reuse. */
    private static final int WAVEFUNCTION_CACHE = 512;

    private static final double H = PhysicalConstants.H;
    private static final double C = PhysicalConstants.C;
    private static final double ALPHA = PhysicalConstants.FINE_STRUCTURE.value();
    private static final double R_INF_PER_CM = PhysicalConstants.RYDBERG.value() / 100;
    private static final double BOHR = ALPHA / (4 * Math.PI * PhysicalConstants.RYDBERG.value());
    private static final double EPSILON_0 = PhysicalConstants.E * PhysicalConstants.E / (2 * ALPHA * H * C);
    private static final double HBAR = H / (2 * Math.PI);
    private static final double DIPOLE_AU = PhysicalConstants.E * BOHR;

    private final QuantumDefects defects;
    private final Map<Integer, QuantumDefects.Series> series;
    private final Map<State, MeasuredLevel> measured;
    private final List<MeasuredLevel> measuredList;
    private final CorePolarizability core;
    private final int maxSeriesL;
    private final State ground;
    private final double step;
    private final ModelPotential model;
    /** alpha_d and r_c of the core-polarized dipole operator, or null for the bare r. */
    private final ModelPotential dipoleCore;
    /** Where the inward integration stops at the latest, a0; NaN for the default alpha_d^(1/3). */
    private final double innerRadius;
    /** Published elements used instead of the computed ones, by pair of states; empty for none. */
    private final Map<List<State>, PublishedDipole> published;
    /** The model potential of the second model whose spread states computed elements' uncertainty; null for none. */
    private final ModelPotential spreadModel;
    /** The atom of the second model, made when first asked for (null until then, or without a spread model). */
    private volatile AlkaliAtom secondModel;
    /** Wavefunctions computed so far (they are immutable); cleared when it reaches its bound. */
    private final Map<State, RadialWavefunction> wavefunctions = new java.util.concurrent.ConcurrentHashMap<>();

    private AlkaliAtom(QuantumDefects defects, List<MeasuredLevel> measuredList, CorePolarizability core, double step,
            ModelPotential model, ModelPotential dipoleCore, double innerRadius,
            Map<List<State>, PublishedDipole> published, ModelPotential spreadModel) {
        this.defects = defects;
        this.published = published;
        this.spreadModel = spreadModel;
        this.innerRadius = innerRadius;
        this.model = model;
        this.dipoleCore = dipoleCore;
        this.measuredList = List.copyOf(measuredList);
        this.core = core;
        this.step = step;
        Map<Integer, QuantumDefects.Series> bySeries = new HashMap<>();
        int maxL = -1;
        for (QuantumDefects.Series s : defects.series()) {
            if (bySeries.put(key(s.l(), s.twoJ()), s) != null) {
                throw new IllegalArgumentException("two series for l = " + s.l() + ", 2j = " + s.twoJ() + " in "
                        + defects.info().id());
            }
            maxL = Math.max(maxL, s.l());
        }
        this.series = Collections.unmodifiableMap(bySeries);
        this.maxSeriesL = maxL;
        Map<State, MeasuredLevel> byState = new HashMap<>();
        for (MeasuredLevel level : measuredList) {
            if (byState.put(level.state(), level) != null) {
                throw new IllegalArgumentException("measured level " + level.state() + " given twice");
            }
            if (level.energyPerCm() >= defects.limitPerCm()) {
                throw new IllegalArgumentException("measured level " + level.state() + " at " + level.energyPerCm()
                        + " cm-1 is not below the ionisation limit " + defects.limitPerCm() + " cm-1");
            }
        }
        this.measured = Collections.unmodifiableMap(byState);
        this.ground = findGround();
    }

    /**
     * @param defects  the quantum-defect set (limit, R_M, series), with the core polarizabilities it
     *                 carries, if any ({@link QuantumDefects#corePolarizability()}); its levels id is
     *                 not looked up here (a data context does that)
     * @param measured measured levels (used instead of the formula wherever given); may be empty
     * @return the atom, with the default Numerov step
     * @throws IllegalArgumentException for duplicate series or levels, or a level above the limit
     */
    public static AlkaliAtom of(QuantumDefects defects, List<MeasuredLevel> measured) {
        Objects.requireNonNull(defects, "defects");
        return of(defects, measured, defects.corePolarizability().orElse(null));
    }

    /**
     * @param defects  the quantum-defect set (limit, R_M, series)
     * @param measured measured levels (used instead of the formula wherever given); may be empty
     * @param core     the core polarizabilities, or null when unknown (then l above the series is
     *                 hydrogenic and the Coulomb approximation integrates to the origin); these are
     *                 used whatever the set carries
     * @return the atom, with the default Numerov step
     * @throws IllegalArgumentException for duplicate series or levels, or a level above the limit
     */
    public static AlkaliAtom of(QuantumDefects defects, List<MeasuredLevel> measured, CorePolarizability core) {
        Objects.requireNonNull(defects, "defects");
        Objects.requireNonNull(measured, "measured");
        return new AlkaliAtom(defects, measured, core, DEFAULT_STEP, null, null, Double.NaN, Map.of(), null);
    }

    /**
     * @param newStep the Numerov step h in x = sqrt(r / a_mu); 1e-4 to 0.1
     * @return the same atom integrated with that step
     */
    public AlkaliAtom withStep(double newStep) {
        if (!(newStep >= 1e-4 && newStep <= 0.1)) {
            throw new IllegalArgumentException("Numerov step must be 1e-4 to 0.1, got " + newStep);
        }
        return new AlkaliAtom(defects, measuredList, core, newStep, model, dipoleCore, innerRadius,
                published, spreadModel);
    }

    /**
     * @param potential a core model potential for the wavefunctions (energies stay those of the
     *                  levels), or null for the Coulomb approximation
     * @return the same atom with radial functions integrated in that potential; the integration
     *         still stops at the core radius {@code alpha_d^(1/3)} (the inner cut-off of the Coulomb
     *         approximation, M. L. Zimmerman et al., Phys. Rev. A 20, 2251 (1979); from memory), so the
     *         potential shapes the functions between
     *         the core and the outer region, where it tends to -1/r; {@link #withInnerRadius(double)}
     *         takes the integration into the core
     */
    public AlkaliAtom withModelPotential(ModelPotential potential) {
        return new AlkaliAtom(defects, measuredList, core, step, potential, dipoleCore, innerRadius,
                published, spreadModel);
    }

    /**
     * The core-polarization correction of the dipole operator: every radial dipole integral (matrix
     * elements, Einstein A, lifetimes, black-body rates) uses
     * <pre>
     *   r  -&gt;  r [1 - (alpha_d / r^3) (1 - exp(-(r / r_c)^3))]
     * </pre>
     * instead of r: the valence electron's field polarizes the core, whose induced dipole
     * {@code -alpha_d r / r^3} opposes the electron's own (S. Hameed, A. Herzenberg and M. G. James,
     * J. Phys. B 1, 822 (1968); with l-dependent model potentials: M. Marinescu, H. R. Sadeghpour
     * and A. Dalgarno, Phys. Rev. A 49, 982 (1994)). Inside r_c the cut-off switches the correction
     * off; far outside it the factor tends to 1 as alpha_d / r^3, so integrals between Rydberg states
     * (which come from r ~ n*^2) barely move while the resonance lines, whose integrand peaks
     * at a few a0, are reduced by several per cent.
     *
     * <p>The parameters are the model potential's: alpha_d = its {@code alphaC} (a0^3), and for a
     * pair of orbital quantum numbers l, l' the cut-off {@code r_c = (r_c,l + r_c,l') / 2}, the mean
     * of its two radii (a0) (our choice: the correction is one operator between two states, and
     * the published r_c belong to single l; the mean keeps the operator symmetric). It applies to
     * Coulomb-approximation and model-potential wavefunctions alike.
     *
     * @param parameters the source of alpha_d and r_c (usually the same Marinescu et al. set as
     *                   {@link #withModelPotential(ModelPotential)} takes), or null for the bare
     *                   dipole operator r
     * @return the same atom with that dipole operator
     */
    public AlkaliAtom withCorePolarizedDipole(ModelPotential parameters) {
        return new AlkaliAtom(defects, measuredList, core, step, model, parameters, innerRadius,
                published, spreadModel);
    }

    /**
     * Where the inward Numerov integration stops at the latest (for l &gt; 0 it may stop further out,
     * where the irregular solution takes over; see {@link RadialWavefunction}). The default, the core
     * radius {@code alpha_d^(1/3)}, suits the Coulomb approximation, whose -1/r is wrong inside the
     * core. With a model potential, which holds down to the nucleus, a small radius such as 0.01 a0
     * lets the functions take their shape inside the core, which the core-polarized dipole operator
     * needs for the resonance lines (see the tests: first-p lifetimes of Na and K within 1 % of the
     * measured ones, Rb and Cs within 2.6 %). With the Coulomb approximation a small radius is not
     * sensible for s states (their -1/r solution at a non-integer n* diverges towards the origin).
     *
     * @param radiusBohr the inner radius in a0, 1e-4 to 10; or NaN for the default alpha_d^(1/3)
     * @return the same atom with that inner radius
     */
    public AlkaliAtom withInnerRadius(double radiusBohr) {
        if (!Double.isNaN(radiusBohr) && !(radiusBohr >= 1e-4 && radiusBohr <= 10)) {
            throw new IllegalArgumentException("inner radius must be 1e-4 to 10 a0 (or NaN for the default), got "
                    + radiusBohr + " a0");
        }
        return new AlkaliAtom(defects, measuredList, core, step, model, dipoleCore, radiusBohr, published, spreadModel);
    }

    /**
     * Published reduced dipole elements for some low-lying pairs of states, used instead of the
     * computed ones for exactly those pairs (and for nothing else): every radial dipole integral
     * between the two states (matrix elements, Einstein A, lifetimes, black-body rates, and any
     * Stark or pair basis holding both) becomes {@code sign(computed) |published| / |angular|}, so
     * that the reduced element is the published one. Where a published element exists the
     * engine uses it; the Coulomb approximation (with or without the core potential or the
     * core-polarized operator) serves every other pair, Rydberg states included, unchanged.
     *
     * @param elements the published elements (an empty list restores the computed ones); two
     *                 elements for one pair are refused
     * @return the same atom with those elements
     * @throws IllegalArgumentException for two elements of one pair, or a pair whose angular factor
     *                                  vanishes
     */
    public AlkaliAtom withPublishedDipoles(List<PublishedDipole> elements) {
        Objects.requireNonNull(elements, "elements");
        Map<List<State>, PublishedDipole> byPair = new HashMap<>();
        for (PublishedDipole e : elements) {
            Objects.requireNonNull(e, "element");
            if (reducedAngular(e.lower(), e.upper()) == 0) {
                throw new IllegalArgumentException(e.lower().label() + " - " + e.upper().label()
                        + " has no dipole element (its j's do not couple)");
            }
            if (byPair.put(pair(e.lower(), e.upper()), e) != null) {
                throw new IllegalArgumentException("two published dipole elements for " + e.lower().label() + " - "
                        + e.upper().label());
            }
        }
        return new AlkaliAtom(defects, measuredList, core, step, model, dipoleCore, innerRadius,
                Collections.unmodifiableMap(byPair), spreadModel);
    }

    /**
     * The second model whose spread from this one states the uncertainty of computed dipole elements,
     * Einstein A coefficients and lifetimes ({@link #reducedDipoleUncertainty}, {@link #einsteinAUncertainty},
     * {@link #radiativeLifetimeUncertainty}). Two published methods compute the elements: the Coulomb
     * approximation with the bare dipole operator (the default) and the model potential integrated into the
     * core with the core-polarized operator ({@code withModelPotential(p).withInnerRadius(0.01)
     * .withCorePolarizedDipole(p)}). The second model is the other one: the model potential one for an atom in
     * the Coulomb approximation with the bare operator, else the Coulomb approximation with the bare operator.
     * It keeps this atom's levels, step and published elements, so published elements carry their own
     * uncertainty and the spread comes from computed ones only. Taking the whole difference of two methods as
     * a standard uncertainty is a model-spread estimate (common practice in atomic theory); the tests hold it
     * to published lifetime measurements.
     *
     * <p>The second model's wavefunctions are computed when first asked for, in an atom of their own
     * (made once per atom): asking for lifetime uncertainties costs about as much again as the lifetimes, and
     * for effective lifetimes about 1.8 times as much again (the model potential, integrated down to 0.01 a0,
     * is slower than the Coulomb approximation over the black-body neighbours up to 2n + 10).
     *
     * @param parameters the model potential and core-polarized operator of the second model (for the data
     *                   context's atoms, the built-in Marinescu et al. (1994) set of the element), or null
     *                   for none (computed elements then carry no uncertainty)
     * @return the same atom with that second model
     */
    public AlkaliAtom withModelSpread(ModelPotential parameters) {
        return new AlkaliAtom(defects, measuredList, core, step, model, dipoleCore, innerRadius, published,
                parameters);
    }

    /** @return the parameters of the second model of {@link #withModelSpread}, if set */
    public Optional<ModelPotential> modelSpread() {
        return Optional.ofNullable(spreadModel);
    }

    /**
     * @return the atom of the second model ({@link #withModelSpread}), made once; null without a spread model
     */
    private AlkaliAtom secondModel() {
        if (spreadModel == null) {
            return null;
        }
        AlkaliAtom second = secondModel;
        if (second == null) {
            boolean coulomb = model == null && dipoleCore == null;
            second = coulomb
                    ? new AlkaliAtom(defects, measuredList, core, step, spreadModel, spreadModel, 0.01, published, null)
                    : new AlkaliAtom(defects, measuredList, core, step, null, null, Double.NaN, published, null);
            secondModel = second;
        }
        return second;
    }

    /** @return the published elements this atom uses instead of computed ones (none by default) */
    public List<PublishedDipole> publishedDipoles() {
        return List.copyOf(published.values());
    }

    /**
     * @param a a state
     * @param b another state
     * @return the published element this atom uses between them, if any
     */
    public Optional<PublishedDipole> publishedDipole(State a, State b) {
        return Optional.ofNullable(published.get(pair(a, b)));
    }

    /** The key of an unordered pair of states. */
    private static List<State> pair(State a, State b) {
        int order = Integer.compare(a.n(), b.n()) != 0 ? Integer.compare(a.n(), b.n())
                : Integer.compare(a.l() * 1000 + a.twoJ(), b.l() * 1000 + b.twoJ());
        return order <= 0 ? List.of(a, b) : List.of(b, a);
    }

    /**
     * The reduced dipole element of a transition that is the only decay channel of its upper level,
     * from that level's measured lifetime: the inverse of
     * {@code A = omega^3 |d|^2 / (3 pi eps0 hbar c^3 (2j_u + 1))} with {@code A = 1 / tau}
     * (convention of the class comment).
     *
     * @param frequencyHz     the transition frequency, Hz; finite and positive
     * @param lifetimeSeconds the upper level's radiative lifetime, s; finite and positive
     * @param twoJUpper       2 j of the upper level, positive
     * @return {@code |<lower||d||upper>|} in e a0
     * @throws IllegalArgumentException for a value out of range
     */
    public static double reducedDipoleFromLifetime(double frequencyHz, double lifetimeSeconds, int twoJUpper) {
        if (!(frequencyHz > 0) || Double.isInfinite(frequencyHz)) {
            throw new IllegalArgumentException("frequency must be finite and > 0 Hz, got " + frequencyHz);
        }
        if (!(lifetimeSeconds > 0) || Double.isInfinite(lifetimeSeconds)) {
            throw new IllegalArgumentException("lifetime must be finite and > 0 s, got " + lifetimeSeconds);
        }
        if (twoJUpper < 1) {
            throw new IllegalArgumentException("2j of the upper level must be positive, got " + twoJUpper);
        }
        // the rate of a 1 e a0 element; A scales as |d|^2
        return Math.sqrt(1 / (lifetimeSeconds * rate(frequencyHz, 1, twoJUpper)));
    }

    /** @return where the integration stops at the latest, a0: the value given, else alpha_d^(1/3) (0 without one) */
    public double innerRadiusBohr() {
        if (!Double.isNaN(innerRadius)) {
            return innerRadius;
        }
        double alpha = core != null ? core.dipoleAu() : model != null ? model.alphaC() : 0;
        return Math.cbrt(alpha);
    }

    /** @return the parameters of the core-polarized dipole operator, if used (else the bare r) */
    public Optional<ModelPotential> corePolarizedDipole() {
        return Optional.ofNullable(dipoleCore);
    }

    /** @return the model potential the wavefunctions use, if any (else the Coulomb approximation) */
    public Optional<ModelPotential> modelPotential() {
        return Optional.ofNullable(model);
    }

    private static int key(int l, int twoJ) {
        return l * 1000 + twoJ;
    }

    private State findGround() {
        State best = null;
        double lowest = Double.POSITIVE_INFINITY;
        for (MeasuredLevel level : measuredList) {
            if (level.energyPerCm() < lowest) {
                lowest = level.energyPerCm();
                best = level.state();
            }
        }
        if (best != null) {
            return best;
        }
        for (QuantumDefects.Series s : defects.series()) {
            int n = Math.max(s.validFromN(), s.l() + 1);
            State candidate = new State(n, s.l(), s.twoJ());
            double e = fitEnergy(s, n);
            if (e < lowest) {
                lowest = e;
                best = candidate;
            }
        }
        if (best == null) {
            throw new IllegalArgumentException("quantum-defect set " + defects.info().id() + " has no series and no "
                    + "measured level: no ground state");
        }
        return best;
    }

    /** @return the species */
    public Species species() {
        return defects.species();
    }

    /** @return the quantum-defect set the atom was built from */
    public QuantumDefects quantumDefects() {
        return defects;
    }

    /** @return the measured levels given, in the order given; immutable */
    public List<MeasuredLevel> measuredLevels() {
        return measuredList;
    }

    /** @return the core polarizabilities, if given */
    public Optional<CorePolarizability> corePolarizability() {
        return Optional.ofNullable(core);
    }

    /** @return the Numerov step in x = sqrt(r / a_mu) */
    public double step() {
        return step;
    }

    /** @return the lowest level: the lowest measured one, else the lowest first member of a series */
    public State groundState() {
        return ground;
    }

    /** @return the ionisation limit above the ground level, cm^-1 */
    public double ionisationLimitPerCm() {
        return defects.limitPerCm();
    }

    /** @return the ionisation energy from the ground level, joules */
    public double ionisationLimitJoules() {
        return defects.limitPerCm() * 100 * H * C;
    }

    /** @return the mass-corrected Rydberg constant R_M of the set, cm^-1 */
    public double rydbergPerCm() {
        return defects.rydbergPerCm();
    }

    /**
     * @param l orbital quantum number, not negative
     * @return the lowest n of the series l: the lowest measured level with that l, else l + 1
     */
    public int lowestN(int l) {
        if (l < 0) {
            throw new IllegalArgumentException("l must be >= 0, got " + l);
        }
        int lowest = Integer.MAX_VALUE;
        for (State s : measured.keySet()) {
            if (s.l() == l) {
                lowest = Math.min(lowest, s.n());
            }
        }
        return lowest == Integer.MAX_VALUE ? l + 1 : lowest;
    }

    /**
     * The highest principal quantum number of a state this model is asked about, 2000: the limit
     * of the level and line queries and of the command line (their {@code MAX_N}). Black-body
     * channels out of a state reach neighbours above it, which are computed internally.
     */
    public static final int MAX_N = 2000;
    /**
     * Black-body temperatures must lie below this, 1e5 K, as in the level query
     * ({@code LevelQuery.withBlackBodyTemperature}): black-body photoionisation, which is left out,
     * grows with temperature (kT at 1e5 K is 8.6 eV, above every alkali ionisation energy).
     */
    public static final double MAX_BLACK_BODY_TEMPERATURE_K = 1e5;

    /**
     * @param n    principal quantum number
     * @param l    orbital quantum number
     * @param twoJ twice j
     * @return the level
     * @throws RydbergException when the model has no energy for it (see the class comment)
     */
    public Level level(int n, int l, int twoJ) {
        return level(new State(n, l, twoJ));
    }

    /**
     * @param state a state, n at most {@value #MAX_N}
     * @return its level: energy above the ground level in cm^-1, n*, and where the energy comes from
     * @throws RydbergException when the model has no energy for it (see the class comment)
     * @throws IllegalArgumentException for n above {@value #MAX_N}
     */
    public Level level(State state) {
        return levelOf(requireAsked(state));
    }

    /** The state, refused when its n is above {@link #MAX_N}. */
    private static State requireAsked(State state) {
        Objects.requireNonNull(state, "state");
        if (state.n() > MAX_N) {
            throw new IllegalArgumentException(state.notation() + " has n = " + state.n() + "; states are computed"
                    + " for n up to " + MAX_N + " (as the level and line queries take them)");
        }
        return state;
    }

    /**
     * A formula level this close to its series' {@code valid-from-n} (fewer than this many n above it) is
     * near the series' edge: see {@link #seriesEdge}.
     */
    public static final int SERIES_EDGE_WINDOW = 4;

    /**
     * Where a level's stated uncertainty says least. A series' {@code valid-from-n} is the lowest n from which
     * its Rydberg-Ritz formula meets the tabulated levels within 0.10 cm-1 (the built-in sets' rule), and the
     * stated uncertainty of a formula level propagates the published limit and defects only, not the formula's
     * truncation, which is largest there: Rb-87 10s misses the tabulated 31362.33 cm-1 by 0.026 cm-1 (786 MHz)
     * against a stated 0.003 cm-1 ({@code fit-residuals.txt}, check 1). Callers say so beside such a level.
     *
     * @param state a state
     * @return the series' {@code valid-from-n} when the state's energy comes from a quantum-defect formula
     *         fewer than {@value #SERIES_EDGE_WINDOW} n above it; empty for every other state (measured,
     *         further up, core-polarization or hydrogenic)
     */
    public OptionalInt seriesEdge(State state) {
        Objects.requireNonNull(state, "state");
        QuantumDefects.Series s = series.get(key(state.l(), state.twoJ()));
        if (s == null || measured.containsKey(state) || state.n() < s.validFromN()
                || state.n() >= s.validFromN() + SERIES_EDGE_WINDOW) {
            return OptionalInt.empty();
        }
        return OptionalInt.of(s.validFromN());
    }

    /**
     * Where a level's energy comes from, for a user: a measured level's source as its file gives it (for the
     * first p levels of the built-in isotopes, the D-line centroid's measurement), the quantum-defect set with
     * its provenance for a formula level, or the model otherwise.
     *
     * @param state a state, n at most {@value #MAX_N}
     * @return the source, in words
     * @throws RydbergException when the model has no energy for it (as {@link #level})
     */
    public String energySource(State state) {
        Level level = level(state);
        MeasuredLevel m = measured.get(state);
        return switch (level.origin()) {
            case MEASURED -> m.source();
            case QUANTUM_DEFECT_FIT -> "Rydberg-Ritz formula of " + defects.info().id() + " ("
                    + defects.info().provenance().render() + ")";
            case CORE_POLARIZATION -> "core-polarization formula with the core polarizabilities of "
                    + defects.info().id();
            case HYDROGENIC -> "hydrogenic formula with the limit of " + defects.info().id();
        };
    }

    /** The level of any state, n not limited (black-body neighbours of a state near MAX_N). */
    private Level levelOf(State state) {
        double r = defects.rydbergPerCm();
        double limit = defects.limitPerCm();
        MeasuredLevel m = measured.get(state);
        if (m != null) {
            return new Level(state, m.energyPerCm(), Math.sqrt(r / (limit - m.energyPerCm())), LevelOrigin.MEASURED,
                    m.uncertaintyPerCm());
        }
        int lowest = lowestN(state.l());
        if (state.n() < lowest) {
            throw new RydbergException(RydbergException.NO_SUCH_STATE, species() + " has no " + state.notation()
                    + " level: the lowest " + "spdfghik".charAt(Math.min(state.l(), 7)) + " level is n = " + lowest
                    + " (lower ones are filled by the core)");
        }
        QuantumDefects.Series s = series.get(key(state.l(), state.twoJ()));
        if (s != null) {
            if (state.n() < s.validFromN()) {
                throw new RydbergException(RydbergException.NO_LEVEL, species() + " " + state.notation()
                        + ": the quantum-defect series of " + defects.info().id() + " is valid from n = "
                        + s.validFromN() + " and no measured energy was given for this level; not extrapolated");
            }
            double e = fitEnergy(s, state.n());
            // residual-derived uncertainties count the limit's error (see QuantumDefects.Series.residualDerived)
            double uLimit = Double.isNaN(defects.limitUncertaintyPerCm()) && s.residualDerived() ? 0
                    : defects.limitUncertaintyPerCm();
            double u = s.hasAllUncertainties() ? rydbergRitzEnergyUncertainty(uLimit, r,
                    s.coefficients(), s.uncertainties(), state.n()) : Double.NaN;
            return new Level(state, e, state.n() - defect(s.coefficients(), state.n()), LevelOrigin.QUANTUM_DEFECT_FIT,
                    u);
        }
        if (state.l() <= maxSeriesL) {
            throw new RydbergException(RydbergException.NO_LEVEL, species() + " " + state.notation() + ": "
                    + defects.info().id() + " has series for l <= " + maxSeriesL + " but none for l = " + state.l()
                    + ", j = " + state.twoJ() + "/2");
        }
        double delta = core == null ? 0 : polarizationDefect(state.n(), state.l(), core);
        double nStar = state.n() - delta;
        return new Level(state, limit - r / (nStar * nStar), nStar,
                core == null ? LevelOrigin.HYDROGENIC : LevelOrigin.CORE_POLARIZATION);
    }

    private double fitEnergy(QuantumDefects.Series s, int n) {
        return rydbergRitzEnergy(defects.limitPerCm(), defects.rydbergPerCm(), s.coefficients(), n);
    }

    /**
     * The modified Rydberg-Ritz level energy of the class comment,
     * {@code E = E_limit - R_M / (n - delta(n))^2}.
     *
     * @param limitPerCm   the series limit, cm^-1
     * @param rydbergPerCm the species' mass-corrected Rydberg constant R_M, cm^-1
     * @param coefficients d0, d2, d4, ... (at least d0)
     * @param n            principal quantum number, above {@code d0}
     * @return the level energy on the scale of the limit, cm^-1
     */
    public static double rydbergRitzEnergy(double limitPerCm, double rydbergPerCm, List<Double> coefficients, int n) {
        double nStar = n - rydbergRitzDefect(coefficients, n);
        return limitPerCm - rydbergPerCm / (nStar * nStar);
    }

    /**
     * The standard uncertainty of {@link #rydbergRitzEnergy} from the stated uncertainties of the limit
     * and of the coefficients, to first order (GUM, JCGM 100:2008, eq. 10; common practice), every input
     * taken as uncorrelated with every other:
     * {@code u(E)^2 = u(E_limit)^2 + (2 R_M / n*^3)^2 sum_k (d delta / d c_k)^2 u(c_k)^2}, since
     * {@code dE / d delta = -2 R_M / (n - delta)^3}; {@code d delta / d d0 = 1 + sum_(k>=1) 2 k c_k x^(k-1)
     * / (n - d0)^3} and {@code d delta / d c_k = x^k} for the others, {@code x = 1 / (n - d0)^2}. The
     * correlations of a published fit (limit with d0, d0 with d2) are not known from the papers'
     * abstracts; a least-squares fit usually correlates them so that they partly cancel in E, so
     * leaving them out tends to overstate u(E). R_M is taken as exact (its relative uncertainty,
     * below 1e-9, moves nothing at these digits), and so is the formula: its own truncation error,
     * largest near the series' validity edge, is not included.
     *
     * @param limitUncertaintyPerCm the limit's standard uncertainty, cm^-1; NaN gives NaN
     * @param rydbergPerCm          the species' mass-corrected Rydberg constant R_M, cm^-1
     * @param coefficients          d0, d2, d4, ... (at least d0)
     * @param uncertainties         their standard uncertainties, one per coefficient; a NaN gives NaN
     * @param n                     principal quantum number, above {@code d0}
     * @return u(E) in cm^-1, not negative, or NaN when an input's uncertainty is not stated
     */
    public static double rydbergRitzEnergyUncertainty(double limitUncertaintyPerCm, double rydbergPerCm,
            List<Double> coefficients, List<Double> uncertainties, int n) {
        if (uncertainties.size() != coefficients.size()) {
            throw new IllegalArgumentException("one uncertainty per coefficient is needed, got " + uncertainties.size()
                    + " for " + coefficients.size());
        }
        double[] partials = rydbergRitzPartials(rydbergPerCm, coefficients, n);
        double variance = limitUncertaintyPerCm * limitUncertaintyPerCm;
        for (int k = 0; k < partials.length; k++) {
            double partial = partials[k] * uncertainties.get(k);
            variance += partial * partial;
        }
        return Math.sqrt(variance);
    }

    /**
     * The partial derivatives of {@link #rydbergRitzEnergy} with respect to its coefficients, up to
     * one common sign (that of {@code -dE / d delta}): {@code (d delta / d c_k) 2 R_M / n*^3} (see
     * {@link #rydbergRitzEnergyUncertainty}).
     */
    private static double[] rydbergRitzPartials(double rydbergPerCm, List<Double> coefficients, int n) {
        double d0 = coefficients.get(0);
        double x = 1 / ((n - d0) * (n - d0));
        double dxdd0 = 2 / ((n - d0) * (n - d0) * (n - d0));
        double nStar = n - defect(coefficients, n);
        double dEdDelta = 2 * rydbergPerCm / (nStar * nStar * nStar);
        double ddelta0 = 1;
        double power = 1;
        for (int k = 1; k < coefficients.size(); k++) {
            ddelta0 += k * coefficients.get(k) * power * dxdd0;
            power *= x;
        }
        double[] partials = new double[coefficients.size()];
        power = 1;
        for (int k = 0; k < partials.length; k++) {
            partials[k] = (k == 0 ? ddelta0 : power) * dEdDelta;
            power *= x;
        }
        return partials;
    }

    /**
     * The quantum defect of the modified Rydberg-Ritz formula of the class comment,
     * {@code delta(n) = d0 + d2 / (n - d0)^2 + d4 / (n - d0)^4 + ...}.
     *
     * @param coefficients d0, d2, d4, ... (at least d0)
     * @param n            principal quantum number, above {@code d0}
     * @return delta(n), dimensionless
     */
    public static double rydbergRitzDefect(List<Double> coefficients, int n) {
        return defect(coefficients, n);
    }

    /**
     * {@link #rydbergRitzDefect(List, int)} at a real n (to draw delta(n) as a smooth curve).
     *
     * @param coefficients d0, d2, d4, ... (at least d0)
     * @param n            a real n above {@code d0}
     * @return delta(n), dimensionless
     */
    public static double rydbergRitzDefect(List<Double> coefficients, double n) {
        return defect(coefficients, n);
    }

    private static double defect(List<Double> coefficients, double n) {
        double d0 = coefficients.get(0);
        double x = 1 / ((n - d0) * (n - d0));
        double sum = 0;
        double power = 1;
        for (double c : coefficients) {
            sum += c * power;
            power *= x;
        }
        return sum;
    }

    /**
     * The core-polarization quantum defect of a non-penetrating state (see the class comment).
     *
     * @param n    principal quantum number
     * @param l    orbital quantum number, at least 2
     * @param core the core polarizabilities
     * @return delta, dimensionless
     */
    public static double polarizationDefect(int n, int l, CorePolarizability core) {
        if (l < 2 || n <= l) {
            throw new IllegalArgumentException("the polarization formula needs l >= 2 and n > l, got n = " + n
                    + ", l = " + l);
        }
        double nn = n;
        double ll = l;
        double lsq = ll * (ll + 1);
        double rm4 = (3 * nn * nn - lsq) / (2 * Math.pow(nn, 5) * (ll - 0.5) * ll * (ll + 0.5) * (ll + 1) * (ll + 1.5));
        double rm6 = (35 * Math.pow(nn, 4) - 5 * nn * nn * (6 * lsq - 5) + 3 * (ll - 1) * ll * (ll + 1) * (ll + 2))
                / (8 * Math.pow(nn, 7) * (ll - 1.5) * (ll - 1) * (ll - 0.5) * ll * (ll + 0.5) * (ll + 1) * (ll + 1.5)
                        * (ll + 2) * (ll + 2.5));
        return nn * nn * nn * (core.dipoleAu() * rm4 / 2 + core.quadrupoleAu() * rm6 / 2);
    }

    /**
     * @param state a state
     * @return its energy above the ground level, cm^-1
     * @throws RydbergException when the model has no energy for it
     */
    public double energyPerCm(State state) {
        return level(state).energyPerCm();
    }

    /**
     * @param state a state
     * @return its energy above the ground level, joules
     * @throws RydbergException when the model has no energy for it
     */
    public double energyJoules(State state) {
        return level(state).energyJoules();
    }

    /**
     * @param from the first state
     * @param to   the second state
     * @return {@code (E_to - E_from) / h} in Hz: positive when {@code to} lies above {@code from}
     * @throws RydbergException when the model has no energy for either
     */
    public double frequencyHz(State from, State to) {
        return (energyPerCm(to) - energyPerCm(from)) * 100 * C;
    }

    /**
     * The standard uncertainty of {@link #frequencyHz}. Every energy is measured from the same
     * ground level, whose energy is 0 by definition (exact), so that shared zero adds nothing.
     * <ul>
     * <li>Two levels of the Rydberg-Ritz formula (a microwave line between Rydberg states) share
     * their inputs: the limit, which cancels exactly in their difference, and, in one series, the
     * coefficients. The difference is propagated from those inputs to first order, each taken as
     * uncorrelated with the others as for one level ({@link #rydbergRitzEnergyUncertainty}):
     * {@code u^2 = sum_k (dE_to / dc_k - dE_from / dc_k)^2 u(c_k)^2} over the coefficients of both
     * series (a series' own derivative 0 for the other series' coefficients). Combining the two
     * levels' uncertainties as independent would count the limit twice: Rb-87 50d5/2 - 51p3/2 read
     * 0.43 MHz that way, most of it the limit's 0.3 MHz.</li>
     * <li>Otherwise {@code c sqrt(u(E_from)^2 + u(E_to)^2)}, the two levels taken as independent
     * (a measured level's uncertainty is its own; a formula level's shares nothing with it).</li>
     * </ul>
     *
     * @param from the first state
     * @param to   the second state
     * @return the uncertainty in Hz, or empty when either level's is not estimated
     * @throws RydbergException when the model has no energy for either
     */
    public OptionalDouble frequencyUncertaintyHz(State from, State to) {
        Level a = level(from);
        Level b = level(to);
        if (a.origin() == LevelOrigin.QUANTUM_DEFECT_FIT && b.origin() == LevelOrigin.QUANTUM_DEFECT_FIT
                && a.energyUncertaintyPerCm().isPresent() && b.energyUncertaintyPerCm().isPresent()) {
            QuantumDefects.Series sa = series.get(key(from.l(), from.twoJ()));
            QuantumDefects.Series sb = series.get(key(to.l(), to.twoJ()));
            double r = defects.rydbergPerCm();
            double[] pa = rydbergRitzPartials(r, sa.coefficients(), from.n());
            double[] pb = rydbergRitzPartials(r, sb.coefficients(), to.n());
            double variance = 0;
            if (key(from.l(), from.twoJ()) == key(to.l(), to.twoJ())) {
                for (int k = 0; k < pa.length; k++) {
                    double partial = (pb[k] - pa[k]) * sa.uncertainties().get(k);
                    variance += partial * partial;
                }
            } else {
                for (int k = 0; k < pa.length; k++) {
                    double partial = pa[k] * sa.uncertainties().get(k);
                    variance += partial * partial;
                }
                for (int k = 0; k < pb.length; k++) {
                    double partial = pb[k] * sb.uncertainties().get(k);
                    variance += partial * partial;
                }
            }
            return OptionalDouble.of(Math.sqrt(variance) * 100 * C);
        }
        return combinedHz(a, b);
    }

    /** {@code c sqrt(u_a^2 + u_b^2)} in Hz, or empty when either is not estimated. */
    static OptionalDouble combinedHz(Level a, Level b) {
        if (a.energyUncertaintyPerCm().isEmpty() || b.energyUncertaintyPerCm().isEmpty()) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(Math.hypot(a.uncertaintyPerCm(), b.uncertaintyPerCm()) * 100 * C);
    }

    /**
     * @param lower        the start, e.g. the ground state
     * @param intermediate the intermediate state, above {@code lower}
     * @param upper        the Rydberg state, above {@code intermediate}
     * @return the two resonant photon frequencies and wavelengths
     * @throws IllegalArgumentException when a step is not an electric-dipole line (Delta l = 1,
     *                                  Delta j &lt;= 1) or the three are not in ascending energy
     * @throws RydbergException         when the model has no energy for one of them
     */
    public LadderExcitation ladder(State lower, State intermediate, State upper) {
        State[][] steps = {{lower, intermediate}, {intermediate, upper}};
        for (State[] step : steps) {
            if (!AlkaliLines.isElectricDipole(step[0], step[1])) {
                throw new IllegalArgumentException("the step " + step[0].notation() + " -> " + step[1].notation()
                        + " is not an electric-dipole line (needs Delta l = 1, Delta j <= 1)");
            }
        }
        double first = frequencyHz(lower, intermediate);
        double second = frequencyHz(intermediate, upper);
        if (!(first > 0) || !(second > 0)) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "a ladder needs ascending "
                    + "energies: %s -> %s -> %s has steps of %.6f GHz and %.6f GHz", lower.notation(),
                    intermediate.notation(), upper.notation(), first * 1e-9, second * 1e-9));
        }
        return new LadderExcitation(lower, intermediate, upper, first, second,
                frequencyUncertaintyHz(lower, intermediate).orElse(Double.NaN),
                frequencyUncertaintyHz(intermediate, upper).orElse(Double.NaN));
    }

    /**
     * @param state a state
     * @return its normalised radial wavefunction in the Coulomb approximation
     * @throws RydbergException when the model has no energy for it
     */
    public RadialWavefunction wavefunction(State state) {
        return wavefunctionOf(requireAsked(state));
    }

    private RadialWavefunction wavefunctionOf(State state) {
        RadialWavefunction known = wavefunctions.get(state);
        if (known != null) {
            return known;
        }
        Level level = levelOf(state);
        double inner = innerRadiusBohr() / lengthScale();
        RadialWavefunction computed = RadialWavefunction.integrate(state, level.effectiveN(), inner, step,
                lengthScale(), model);
        // Lifetimes and line lists ask for the same lower states again and again; keep a bounded
        // number (a wavefunction near n = 100 holds about 15,000 points).
        if (wavefunctions.size() >= WAVEFUNCTION_CACHE) {
            wavefunctions.clear();
        }
        wavefunctions.put(state, computed);
        return computed;
    }

    /** a_mu / a0 = R_inf / R_M. */
    private double lengthScale() {
        return R_INF_PER_CM / defects.rydbergPerCm();
    }

    /**
     * @param a     first state
     * @param b     second state
     * @param power k, from -2 up
     * @return {@code <a| r^k |b> = integral R_a R_b r^(2+k) dr} in a0^k
     */
    public double radialIntegralBohr(State a, State b, int power) {
        return RadialWavefunction.overlap(wavefunction(a), wavefunction(b), power) * Math.pow(lengthScale(), power);
    }

    /**
     * @param state a state
     * @param power k, from -2 up
     * @return {@code <r^k>} in a0^k
     */
    public double expectationBohr(State state, int power) {
        return wavefunction(state).expectationBohr(power);
    }

    /**
     * @param a first state
     * @param b second state
     * @return the radial dipole integral {@code <a|r|b>} in a0, with the core-polarized operator
     *         when {@link #withCorePolarizedDipole(ModelPotential)} set one (else the bare r, the same
     *         as {@code radialIntegralBohr(a, b, 1)}); for a pair with a published element
     *         ({@link #withPublishedDipoles(List)}) the radial value that gives that element
     */
    public double radialDipoleBohr(State a, State b) {
        return dipoleBohr(wavefunction(a), wavefunction(b));
    }

    /**
     * The radial dipole integral of two wavefunctions already at hand, so that a caller holding
     * many of them (a Stark-map basis, a pair basis) need not go through the bounded cache.
     *
     * @param a the first function, from {@link #wavefunction(State)} of this atom
     * @param b the second function, from {@link #wavefunction(State)} of this atom
     * @return {@code <a|r|b>} in a0, with the dipole operator of the atom (as
     *         {@link #radialDipoleBohr(State, State)})
     */
    public double radialDipoleBohr(RadialWavefunction a, RadialWavefunction b) {
        Objects.requireNonNull(a, "a");
        Objects.requireNonNull(b, "b");
        return dipoleBohr(a, b);
    }

    /** The radial dipole integral of two wavefunctions in a0, with the dipole operator of the atom. */
    private double dipoleBohr(RadialWavefunction a, RadialWavefunction b) {
        if (!published.isEmpty()) {
            PublishedDipole given = published.get(pair(a.state(), b.state()));
            if (given != null) {
                double computed = computedDipoleBohr(a, b);
                return (computed < 0 ? -1 : 1) * given.reducedBohr() / Math.abs(reducedAngular(a.state(), b.state()));
            }
        }
        return computedDipoleBohr(a, b);
    }

    /** The computed radial dipole integral in a0 (the atom's wavefunctions and dipole operator). */
    private double computedDipoleBohr(RadialWavefunction a, RadialWavefunction b) {
        double scale = lengthScale();
        if (dipoleCore == null) {
            return RadialWavefunction.overlap(a, b, 1) * scale;
        }
        int la = a.state().l();
        int lb = b.state().l();
        double cutoff = (dipoleCore.parametersFor(la).rc() + dipoleCore.parametersFor(lb).rc()) / 2;
        return RadialWavefunction.polarizedDipoleOverlap(a, b, dipoleCore.alphaC() / (scale * scale * scale),
                cutoff / scale) * scale;
    }

    /**
     * @param a first state
     * @param b second state, with l differing by one
     * @return the reduced matrix element {@code <a||d||b>} in e a0 (convention in the class comment);
     *         0 when j and j' differ by more than one
     * @throws RydbergException when l and l' do not differ by one, or a level is refused
     */
    public double reducedDipole(State a, State b) {
        checkDipole(a, b);
        double angular = reducedAngular(a, b);
        return angular == 0 ? 0 : angular * radialDipoleBohr(a, b);
    }

    private static void checkDipole(State a, State b) {
        if (Math.abs(a.l() - b.l()) != 1) {
            throw new RydbergException(RydbergException.NOT_DIPOLE, a + " and " + b
                    + " are not connected by an electric-dipole transition (l must change by one)");
        }
    }

    /**
     * The angular factor of the reduced dipole element, so that
     * {@code reducedDipole(a, b) = reducedDipoleAngular(a, b) * radialDipoleBohr(a, b)}.
     *
     * @param a first state
     * @param b second state, with l differing by one
     * @return {@code (-1)^(l+s+j'+1) sqrt((2j+1)(2j'+1)) {l j s; j' l' 1} (-1)^l sqrt((2l+1)(2l'+1)) (l 1 l'; 0 0 0)}
     *         (class comment), dimensionless; 0 when the j's do not couple
     * @throws RydbergException when l and l' do not differ by one
     */
    public static double reducedDipoleAngular(State a, State b) {
        checkDipole(a, b);
        return reducedAngular(a, b);
    }

    /** The angular part of {@code <l j||d||l' j'>} in the class comment's convention. */
    static double reducedAngular(State a, State b) {
        int l = a.l();
        int l2 = b.l();
        double sixJ = WignerSymbols.sixJ(2 * l, a.twoJ(), 1, b.twoJ(), 2 * l2, 2);
        if (sixJ == 0) {
            return 0;
        }
        int phaseJ = (2 * l + 1 + b.twoJ() + 2) / 2; // l + s + j' + 1
        double fine = ((phaseJ & 1) == 0 ? 1 : -1) * Math.sqrt((a.twoJ() + 1.0) * (b.twoJ() + 1.0)) * sixJ;
        double orbital = ((l & 1) == 0 ? 1 : -1) * Math.sqrt((2 * l + 1.0) * (2 * l2 + 1.0))
                * WignerSymbols.threeJ(2 * l, 2, 2 * l2, 0, 0, 0);
        return fine * orbital;
    }

    /**
     * @param a    first state
     * @param twoM twice m_j of the first state
     * @param b    second state
     * @param twoM2 twice m_j' of the second state
     * @param q    spherical component of the dipole operator, -1, 0 or +1
     * @return {@code <a m| d_q |b m'>} in e a0; 0 unless {@code m = q + m'}
     * @throws IllegalArgumentException for impossible m or q
     * @throws RydbergException         when l and l' do not differ by one, or a level is refused
     */
    public double dipole(State a, int twoM, State b, int twoM2, int q) {
        if (q < -1 || q > 1) {
            throw new IllegalArgumentException("dipole component q must be -1, 0 or +1, got " + q);
        }
        checkM(a, twoM);
        checkM(b, twoM2);
        double threeJ = WignerSymbols.threeJ(a.twoJ(), 2, b.twoJ(), -twoM, 2 * q, twoM2);
        if (threeJ == 0) {
            checkDipole(a, b);
            return 0;
        }
        int phase = (a.twoJ() - twoM) / 2;
        return ((phase & 1) == 0 ? 1 : -1) * threeJ * reducedDipole(a, b);
    }

    private static void checkM(State s, int twoM) {
        if (Math.abs(twoM) > s.twoJ() || ((twoM + s.twoJ()) & 1) != 0) {
            throw new IllegalArgumentException("2m = " + twoM + " is not a projection of j = " + s.twoJ() + "/2 of " + s);
        }
    }

    /**
     * @param upper the upper state
     * @param lower a lower state, with l differing by one
     * @return the Einstein A coefficient of {@code upper -> lower}, s^-1 (0 when the j's do not couple)
     * @throws IllegalArgumentException when {@code lower} is not below {@code upper}
     * @throws RydbergException         when l and l' do not differ by one, or a level is refused
     */
    public double einsteinA(State upper, State lower) {
        checkDipole(upper, lower);
        double nu = frequencyHz(lower, upper);
        if (!(nu > 0)) {
            throw new IllegalArgumentException(lower + " is not below " + upper);
        }
        double angular = reducedAngular(lower, upper);
        if (angular == 0) {
            return 0;
        }
        double d = angular * radialDipoleBohr(lower, upper);
        return rate(nu, d, upper.twoJ());
    }

    /** A = omega^3 |d|^2 / (3 pi eps0 hbar c^3 (2j_u+1)), d in e a0. */
    private static double rate(double frequencyHz, double reducedEa0, int twoJUpper) {
        double omega = 2 * Math.PI * frequencyHz;
        double d = reducedEa0 * DIPOLE_AU;
        return omega * omega * omega * d * d / (3 * Math.PI * EPSILON_0 * HBAR * C * C * C * (twoJUpper + 1));
    }

    /**
     * Every electric-dipole decay channel of a state to the levels below it (l' = l +- 1, all n'
     * from the lowest of each series, measured low-lying levels included).
     *
     * @param state the decaying state
     * @return the channels with their Einstein A, s^-1, in order of l', j', n'
     * @throws RydbergException when a level on the way is refused (a gap in the data)
     */
    public List<DecayChannel> spontaneousChannels(State state) {
        double e = energyPerCm(state);
        RadialWavefunction upper = wavefunction(state);
        List<DecayChannel> channels = new ArrayList<>();
        for (State lower : neighbours(state, state.n() + 1)) {
            Level level = levelOf(lower);
            if (level.energyPerCm() >= e) {
                continue;
            }
            double angular = reducedAngular(lower, state);
            if (angular == 0) {
                continue;
            }
            double nu = (e - level.energyPerCm()) * 100 * C;
            double d = angular * dipoleBohr(wavefunctionOf(lower), upper);
            channels.add(new DecayChannel(state, lower, nu, rate(nu, d, state.twoJ())));
        }
        return channels;
    }

    /** States with l' = l +- 1 (and j' coupled to j) from the lowest n' up to nMax inclusive. */
    private List<State> neighbours(State state, int nMax) {
        List<State> out = new ArrayList<>();
        for (int l2 = state.l() - 1; l2 <= state.l() + 1; l2 += 2) {
            if (l2 < 0) {
                continue;
            }
            for (int twoJ2 = 2 * l2 - 1; twoJ2 <= 2 * l2 + 1; twoJ2 += 2) {
                if (twoJ2 < 1 || Math.abs(twoJ2 - state.twoJ()) > 2) {
                    continue;
                }
                for (int n2 = Math.max(lowestN(l2), l2 + 1); n2 <= nMax; n2++) {
                    out.add(new State(n2, l2, twoJ2));
                }
            }
        }
        return out;
    }

    /**
     * @param state a state
     * @return the total spontaneous decay rate (sum of {@link #spontaneousChannels}), s^-1
     */
    public double spontaneousRate(State state) {
        double sum = 0;
        for (DecayChannel c : spontaneousChannels(state)) {
            sum += c.ratePerSecond();
        }
        return sum;
    }

    /**
     * @param state a state above the ground level
     * @return the radiative lifetime at 0 K, {@code 1 / sum A}, seconds
     */
    public double radiativeLifetime(State state) {
        return lifetime(state, spontaneousRate(state));
    }

    /** @return {@code 1 / rate}, refused for a state whose decay rate is not positive */
    private static double lifetime(State state, double rate) {
        if (!(rate > 0)) {
            throw new IllegalArgumentException(state + " has no dipole decay channel (is it the ground state?)");
        }
        return 1 / rate;
    }

    /**
     * The standard uncertainty of {@link #reducedDipole}: for a published element
     * ({@link #withPublishedDipoles(List)}) the element's stated uncertainty; for a computed one the
     * spread of the two models ({@link #withModelSpread}), {@code |d - d'|}, d' the second model's element.
     *
     * @param a first state
     * @param b second state, with l differing by one
     * @return {@code u(|<a||d||b>|)} in e a0, or empty for a computed element of an atom without a second
     *         model (not estimated)
     * @throws RydbergException when l and l' do not differ by one, or a level is refused
     */
    public OptionalDouble reducedDipoleUncertainty(State a, State b) {
        checkDipole(a, b);
        PublishedDipole given = published.get(pair(a, b));
        if (given != null) {
            return OptionalDouble.of(given.uncertaintyBohr());
        }
        AlkaliAtom second = secondModel();
        if (second == null) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(Math.abs(Math.abs(reducedDipole(a, b)) - Math.abs(second.reducedDipole(a, b))));
    }

    /**
     * The standard uncertainty of {@link #einsteinA}: where a published element gives it, to first order
     * (GUM, JCGM 100:2008, eq. 10): A grows as |d|^2, so {@code u(A) = 2 A u(d) / |d|}; for a computed
     * element the spread of the two models ({@link #withModelSpread}), {@code |A - A'|}. The frequency's
     * uncertainty (parts in 1e9 and below) is left out.
     *
     * @param upper the upper state
     * @param lower a lower state, with l differing by one
     * @return u(A) in s^-1, or empty for a computed element of an atom without a second model (not estimated)
     * @throws IllegalArgumentException when {@code lower} is not below {@code upper}
     * @throws RydbergException         when l and l' do not differ by one, or a level is refused
     */
    public OptionalDouble einsteinAUncertainty(State upper, State lower) {
        PublishedDipole given = published.get(pair(upper, lower));
        double a = einsteinA(upper, lower);
        if (given != null) {
            return OptionalDouble.of(2 * a * given.uncertaintyBohr() / given.reducedBohr());
        }
        AlkaliAtom second = secondModel();
        return second == null ? OptionalDouble.empty()
                : OptionalDouble.of(Math.abs(a - second.einsteinA(upper, lower)));
    }

    /**
     * The standard uncertainty of {@link #radiativeLifetime}, from two parts taken as independent and
     * added in quadrature (GUM, JCGM 100:2008, eq. 10):
     * <ul>
     * <li>the published elements' ({@link #withPublishedDipoles(List)}): {@code tau = 1 / sum A_i}, so to first
     * order {@code u(tau) = tau^2 sum u(A_i)} over the channels they decide ({@link #einsteinAUncertainty}),
     * taken as fully correlated: the elements of one multiplet often share their source (the built-in Cs
     * 5d3/2 pair is one element scaled by LS line strengths), and the linear sum bounds any correlation from
     * above. A single channel taken from a measured lifetime gives that measurement's uncertainty back;</li>
     * <li>the computed elements': the spread of the two models ({@link #withModelSpread}),
     * {@code |tau - tau'|}, tau' the lifetime of the second model, which shares the published elements (a
     * model-spread estimate, common practice in atomic theory). The lifetime's spread, not the channels'
     * added up: most channels of a Rydberg state move the same way between the models and their changes
     * add, while a channel whose share is small does not count beyond it.</li>
     * </ul>
     * A state whose channels are all published has only the first part; one with computed channels in an
     * atom without a second model has none (empty), and a state no published element involves is then
     * answered without computing its channels. Held to published lifetime measurements in the tests
     * (low-lying states of Na, K, Rb and Cs, and Rydberg states of Rb).
     *
     * @param state a state above the ground level
     * @return u(tau) in seconds, or empty when a channel's element is computed and the atom has no second
     *         model (not estimated)
     * @throws IllegalArgumentException for a state without a decay channel
     * @throws RydbergException         when a level on the way is refused
     */
    public OptionalDouble radiativeLifetimeUncertainty(State state) {
        Objects.requireNonNull(state, "state");
        if (notEstimated(state)) {
            return OptionalDouble.empty();
        }
        return lifetimeUncertainty(state, spontaneousChannels(state), other -> other.radiativeLifetime(state));
    }

    /**
     * Whether a lifetime of this state surely has no uncertainty, known without computing its channels: the
     * atom has no second model and no published element involves the state (every Rydberg state then).
     */
    private boolean notEstimated(State state) {
        return secondModel() == null && published.keySet().stream().noneMatch(pair -> pair.contains(state));
    }

    /**
     * Black-body-induced transition rates out of a state, to every bound neighbour up and down
     * (l' = l +- 1, n' up to 2n + 10): stimulated emission {@code A(u -> k) nbar} and absorption
     * {@code A(k -> u) nbar (2j_k + 1) / (2j_u + 1)}, with the Planck occupation
     * {@code nbar = 1 / (exp(h nu / k T) - 1)} (T. F. Gallagher, Rydberg Atoms (1994), ch. 4;
     * I. I. Beterov et al., Phys. Rev. A 79, 052504 (2009), eq. 2). Black-body photoionisation
     * (the continuum) is not included.
     *
     * @param state        the state
     * @param temperatureK the radiation temperature, K; 0 (no channels) to below
     *                     {@value #MAX_BLACK_BODY_TEMPERATURE_K}
     * @return the channels with their rates, s^-1
     */
    public List<DecayChannel> blackbodyChannels(State state, double temperatureK) {
        checkBlackBodyTemperature(temperatureK);
        List<DecayChannel> channels = new ArrayList<>();
        if (temperatureK == 0) {
            return channels;
        }
        double e = energyPerCm(state);
        RadialWavefunction self = wavefunction(state);
        for (State other : neighbours(state, 2 * state.n() + 10)) {
            double angular = reducedAngular(state, other);
            if (angular == 0) {
                continue;
            }
            Level level = levelOf(other);
            double nu = Math.abs(level.energyPerCm() - e) * 100 * C;
            if (nu == 0) {
                continue;
            }
            double d = angular * dipoleBohr(self, wavefunctionOf(other));
            double occupation = 1 / Math.expm1(H * nu / (PhysicalConstants.K * temperatureK));
            double rate = level.energyPerCm() < e ? rate(nu, d, state.twoJ()) * occupation
                    : rate(nu, d, other.twoJ()) * occupation * (other.twoJ() + 1.0) / (state.twoJ() + 1.0);
            channels.add(new DecayChannel(state, other, nu, rate));
        }
        return channels;
    }

    /** Refuses a black-body temperature outside 0 to below {@link #MAX_BLACK_BODY_TEMPERATURE_K}. */
    private static void checkBlackBodyTemperature(double temperatureK) {
        if (!(temperatureK >= 0 && temperatureK < MAX_BLACK_BODY_TEMPERATURE_K)) {
            throw new IllegalArgumentException("the black-body temperature must be 0 to below "
                    + MAX_BLACK_BODY_TEMPERATURE_K + " K (black-body photoionisation is left out), got " + temperatureK
                    + " K");
        }
    }

    /**
     * @param state        the state
     * @param temperatureK the radiation temperature, K
     * @return the total black-body-induced rate to bound states, s^-1
     */
    public double blackbodyRate(State state, double temperatureK) {
        double sum = 0;
        for (DecayChannel c : blackbodyChannels(state, temperatureK)) {
            sum += c.ratePerSecond();
        }
        return sum;
    }

    /**
     * @param state        a state above the ground level
     * @param temperatureK the radiation temperature, K
     * @return {@code 1 / (sum A + black-body rate)}, seconds (black-body photoionisation not included)
     */
    public double effectiveLifetime(State state, double temperatureK) {
        double blackBody = blackbodyRate(state, temperatureK);     // checks the temperature first
        return 1 / (spontaneousRate(state) + blackBody);
    }

    /**
     * The standard uncertainty of {@link #effectiveLifetime}, made as for {@link #radiativeLifetimeUncertainty}
     * with the black-body channels added to the spontaneous ones: {@code tau^2 sum u(R_i)} over the channels
     * published elements decide (u(R) = 2 R u(d) / |d| for a rate R proportional to |d|^2), fully correlated,
     * and in quadrature the model spread {@code |tau - tau'|} of the second model's effective lifetime
     * ({@link #withModelSpread}). The Planck occupation and the temperature are taken as exact; black-body
     * photoionisation, which {@link #effectiveLifetime} leaves out, is not counted in either. At 0 K it is
     * {@link #radiativeLifetimeUncertainty}. Costs the second model's black-body channels too (n' up to 2n + 10).
     *
     * @param state        a state above the ground level
     * @param temperatureK the radiation temperature, K (as {@link #blackbodyChannels})
     * @return u(tau_eff) in seconds, or empty when a channel's element is computed and the atom has no second
     *         model (not estimated)
     * @throws IllegalArgumentException for a temperature out of range, or a state without a decay channel
     * @throws RydbergException         when a level on the way is refused
     */
    public OptionalDouble effectiveLifetimeUncertainty(State state, double temperatureK) {
        Objects.requireNonNull(state, "state");
        checkBlackBodyTemperature(temperatureK);
        if (notEstimated(state)) {
            return OptionalDouble.empty();
        }
        List<DecayChannel> channels = new ArrayList<>(blackbodyChannels(state, temperatureK));
        channels.addAll(spontaneousChannels(state));
        return lifetimeUncertainty(state, channels, other -> other.effectiveLifetime(state, temperatureK));
    }

    /**
     * The two parts of a lifetime's uncertainty over its channels (see {@link #radiativeLifetimeUncertainty}):
     * the published elements' {@code tau^2 sum u(R_i)}, fully correlated, and in quadrature the second model's
     * spread {@code |tau - tau'|} where a channel is computed; empty where one is and there is no second model.
     */
    private OptionalDouble lifetimeUncertainty(State state, List<DecayChannel> channels,
            java.util.function.ToDoubleFunction<AlkaliAtom> secondLifetime) {
        double rate = 0;
        double publishedRateUncertainty = 0;
        boolean computed = false;
        for (DecayChannel c : channels) {
            if (c.ratePerSecond() == 0) {
                continue;
            }
            rate += c.ratePerSecond();
            PublishedDipole given = published.get(pair(c.from(), c.to()));
            if (given == null) {
                computed = true;
            } else {
                publishedRateUncertainty += 2 * c.ratePerSecond() * given.uncertaintyBohr() / given.reducedBohr();
            }
        }
        double tau = lifetime(state, rate);
        double fromPublished = tau * tau * publishedRateUncertainty;
        if (!computed) {
            return OptionalDouble.of(fromPublished);
        }
        AlkaliAtom second = secondModel();
        if (second == null) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(Math.hypot(fromPublished, tau - secondLifetime.applyAsDouble(second)));
    }

    @Override
    public String toString() {
        return "AlkaliAtom[" + species() + ", " + defects.info().id() + ", " + measuredList.size() + " measured levels"
                + (model == null ? ", Coulomb approximation" : ", model potential")
                + (dipoleCore == null ? "" : ", core-polarized dipole")
                + (published.isEmpty() ? "]" : ", " + published.size() + " published dipole elements]");
    }
}
