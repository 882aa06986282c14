package org.ritzwerk.engine.synth;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.List;
import java.util.Objects;
import java.util.function.DoubleConsumer;
import java.util.function.DoubleUnaryOperator;
import java.util.function.Function;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.plasma.IonisationBalance;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.profile.Broadening;
import org.ritzwerk.engine.profile.Profiles;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.engine.ritz.RitzTransitions;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.AlkaliLines;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.Unit;

/**
 * A described scene (emitters, plasma conditions, instrument, pixel grid) that renders into a
 * {@link SyntheticSpectrum}. Build one with {@link #builder(PixelGrid)}.
 *
 * <h2>Physics</h2>
 * <ul>
 * <li>One-electron emitters ({@link Builder#hydrogenLike}): every n -&gt; n' multiplet whose
 * (shifted) position falls in or near the grid, for upper n up to {@link Builder#nMax}. Photon
 * rate of a line = N g_u A exp(-(E_u - E_1) / kT) / U (Boltzmann's law, optically thin). U does
 * not depend on nMax (which only chooses the lines drawn): with an electron density it is summed
 * over the levels still bound below the ionisation limit lowered by Debye screening
 * ({@link IonisationBalance#boundPartition}), and lines from levels above that limit are not
 * drawn (a note says so); without one it is the Planck-Larkin partition function
 * ({@link IonisationBalance#planckLarkinPartition}), which needs no cutoff. N is the emitter's
 * abundance times, when an electron density is given and the element is hydrogen or helium, its
 * stage's Saha fraction with the lowered ionisation energy ({@link IonisationBalance}); for other
 * elements N is the abundance of that ion itself.</li>
 * <li>Line lists ({@link Builder#lineList}): positions and photon rates as given, or a
 * {@link LineList}'s relative intensities (a lamp set, say) scaled so the list's strongest line
 * has the photon rate of the ions' strongest line within the list's own wavelength span (see
 * {@link Builder#lineList(LineList, Function)}): the same scale whatever the grid, so the
 * ratio of a list line to an ion line does not depend on the spectral window; broadened and
 * shifted like the rest.</li>
 * <li>Neutral alkali atoms ({@link Builder#alkali}): their lines between the quantum-defect
 * model's levels, populated by Boltzmann's law over the same levels.</li>
 * <li>Any atom with a level list ({@link Builder#levels}, He I say): its Ritz lines that carry an
 * Einstein A, populated by Boltzmann's law over the list's levels; with an electron density,
 * He I's abundance is weighted by its Saha fraction in the helium balance, as He II's is, with
 * the list's Boltzmann sum as He I's partition function in both steps (and in He II's fraction),
 * over the list's levels below the ionisation limit lowered by Debye screening (lines from
 * levels above it are not drawn).</li>
 * <li>Widths: Doppler (Gaussian, from the temperature and the emitter's mass), the
 * instrument's Gaussian response, and a Lorentzian that is the sum of a collisional FWHM given
 * by the caller, natural widths when asked ({@link Builder#naturalWidths}: each shell's total
 * decay rate averaged over its n l j states with weights 2j + 1), and Stark widths of
 * hydrogen's and deuterium's Balmer-alpha and -beta from {@link BalmerStark} when an electron
 * density is given (other lines get no Stark width). Below the Stark fit's range the Stark
 * widths are left out and a note says so.</li>
 * <li>A bulk line-of-sight velocity shifts every line by the relativistic Doppler factor.</li>
 * <li>Scale: lines are scaled so the brightest pixel of the line spectrum expects
 * {@link Builder#peakCounts} counts; a continuum is added with its brightest pixel at its own
 * given level; then Poisson and Gaussian read noise from a seed ({@link Noise}).</li>
 * </ul>
 *
 * <p>Immutable and thread-safe once built; {@link #render(int)} gives the same result for any
 * thread count, bit for bit.
 */
public final class Scene {

    /**
     * Line lists with relative intensities are scaled to the strongest one-electron line with upper
     * n up to this in the list's own wavelength span: the strong lines of a series come from its
     * lowest upper levels (their A values fall about as n^-3), so the higher shells, whose lines
     * would make the scale depend on nMax, are left out of the search.
     */
    static final int REFERENCE_N = 10;

    /** An alkali atom's partition function is summed to this n (see Builder#alkaliPartition). */
    static final int ALKALI_PARTITION_N = 500;

    /** Natural widths cost an exact decay-rate sum per shell; they are offered up to this n. */
    public static final int MAX_N_WITH_NATURAL_WIDTHS = 60;

    private final PixelGrid grid;
    private final Medium medium;
    private final Instrument instrument;
    private final double window;
    private final Renderer renderer;
    private final double peakCounts;
    private final DoubleUnaryOperator continuum;
    private final double continuumCounts;
    private final double readNoise;
    private final long seed;
    private final boolean noise;
    private final Lines lines;
    private final List<String> notes;

    private Scene(Builder b) {
        this.grid = b.grid;
        this.medium = b.medium;
        this.instrument = b.instrument;
        this.window = b.window;
        this.renderer = b.renderer;
        this.peakCounts = b.peakCounts;
        this.continuum = b.continuum;
        this.continuumCounts = b.continuumCounts;
        this.readNoise = b.readNoise;
        this.seed = b.seed;
        this.noise = b.noise;
        List<String> found = new ArrayList<>();
        this.lines = b.lines(found);
        this.notes = List.copyOf(found);
    }

    /**
     * @param grid the pixels; its axis is wavelength in nm in the medium given to the builder
     * @return a builder with: no temperature (every scene must be given one, {@link
     *         Builder#temperature}; {@link Builder#build} refuses without), no electron density,
     *         velocity 0, vacuum axis, ideal instrument, nMax 30, window
     *         {@link LineRenderer#DEFAULT_WINDOW}, 10 000 peak counts, no continuum, noise-free
     */
    public static Builder builder(PixelGrid grid) {
        return new Builder(Objects.requireNonNull(grid, "grid"));
    }

    /** @return the lines that go into the spectrum, before scaling (photon rates) */
    public Lines lines() {
        return lines;
    }

    /**
     * The lines on the grid that will carry no light whatever the scaling, told before rendering:
     * those whose photon rate is already 0, each with its cause ({@link DarkLines}: an intensity
     * of 0 in a line list, or one that became 0 in the list's scaling; a computed population that
     * underflowed). Rendering may darken more (counts that underflow once scaled to the peak
     * counts): {@link SyntheticSpectrum#darkLines()} has those too, and a refused render's
     * {@link SceneException#darkLines()} has every line on the grid.
     *
     * @return the lines on the grid (centre between the grid's ends) and the dark ones among them
     */
    public DarkLines darkLines() {
        return DarkLines.find(lines, grid, i -> lines.photons[i] == 0);
    }

    /** @return things the caller should know about the scene (approximations that applied) */
    public List<String> notes() {
        return notes;
    }

    /**
     * @param threads threads for the line rendering, 1 to 1024; the result does not depend on it
     * @return the rendered spectrum
     * @throws SceneException ({@link SceneException#NO_LIGHT}) when no line puts light into the grid
     *         and there is no continuum; its {@link SceneException#darkLines()} says which lines
     *         lie on the grid and why each is dark
     * @throws IllegalArgumentException when a continuum density is unusable
     */
    public SyntheticSpectrum render(int threads) {
        return render(threads, null);
    }

    /**
     * As {@link #render(int)}, telling {@code progress} (on the caller's thread) the fraction of
     * the line rendering done.
     *
     * @param threads  threads for the line rendering, 1 to 1024
     * @param progress told the fraction done, 0 to 1; null for none
     * @return the rendered spectrum
     */
    public SyntheticSpectrum render(int threads, DoubleConsumer progress) {
        int pixels = grid.pixels();
        double[] lineFlux = new double[pixels];
        boolean fast = usesFastRenderer();
        if (fast) {
            new FastLineRenderer(grid, instrument).render(lines.position, lines.photons, lines.gaussian, lines.lorentz,
                    lineFlux, threads);
            if (progress != null) {
                progress.accept(1);
            }
        } else {
            new LineRenderer(grid, instrument, window).render(lines.position, lines.photons, lines.gaussian,
                    lines.lorentz, lineFlux, threads, progress);
        }
        double brightest = 0;
        for (double v : lineFlux) {
            brightest = Math.max(brightest, v);
        }
        if (brightest == 0 && continuum == null) {
            // Nothing on the grid gives light: every line there is dark, each for its own cause.
            DarkLines dark = DarkLines.find(lines, grid, i -> true);
            int inside = dark.onGrid();
            if (inside > 0) {
                int given = inside - dark.count(DarkLines.Cause.POPULATION_UNDERFLOW);
                String populations = "at the scene's temperature the Boltzmann populations of their upper levels,"
                        + " exp(-E / kT), are below the smallest number a double holds (about 1e-308), or the"
                        + " ionisation balance leaves no emitters; raise the temperature";
                String intensities = "their line lists give them intensity 0";
                throw new SceneException(SceneException.NO_LIGHT, inside + (inside == 1 ? " line falls" : " lines fall")
                        + " on the grid from " + grid.lowest() + " to " + grid.highest() + " nm, but none"
                        + " carries any light: " + (given == 0 ? populations : given == inside ? intensities
                        : given + " of them because " + intensities + ", the others because " + populations), dark);
            }
            throw new SceneException(SceneException.NO_LIGHT, "no line falls on the grid from " + grid.lowest()
                    + " to " + grid.highest() + " nm; widen the range, raise nMax or add emitters", dark);
        }
        double scale = brightest == 0 ? 0 : peakCounts / brightest;
        if (!Double.isFinite(scale)) {
            throw new SceneException(SceneException.NO_LIGHT, "the lines give so little light (the brightest pixel "
                    + brightest + ") that it cannot be scaled to " + peakCounts + " counts; raise the abundances");
        }
        double[] expected = new double[pixels];
        for (int p = 0; p < pixels; p++) {
            expected[p] = lineFlux[p] * scale;
        }
        if (continuum != null) {
            double[] shape = new double[pixels];
            Continuum.render(grid, continuum, shape);
            double top = 0;
            for (double v : shape) {
                top = Math.max(top, v);
            }
            if (!(top > 0)) {
                throw new SceneException(SceneException.DARK_CONTINUUM, "the continuum is zero over the whole grid:"
                        + " a black body too cold to emit at these wavelengths, or a continuum table with no density"
                        + " in this range");
            }
            for (int p = 0; p < pixels; p++) {
                expected[p] += shape[p] * (continuumCounts / top);
            }
        }
        double[] counts = expected.clone();
        if (noise) {
            Noise.apply(expected, readNoise, seed, counts);
        }
        double[] lineCounts = new double[lines.size()];
        for (int i = 0; i < lineCounts.length; i++) {
            lineCounts[i] = lines.photons[i] * scale;
        }
        return new SyntheticSpectrum(grid, medium, expected, counts, lines, lineCounts,
                lineCountsInPixels(scale, fast));
    }

    /**
     * Each line's expected counts in the pixels: its photons times the scale times the share of
     * its profile (Gaussian width with the instrument's) that falls between the grid's ends, and
     * for the windowed renderer also within its window, so that a line near or beyond an end of
     * the grid gets the counts that reach the pixels, and one far beyond gets next to none.
     */
    private double[] lineCountsInPixels(double scale, boolean fast) {
        double lo = grid.lowest();
        double hi = grid.highest();
        double[] out = new double[lines.size()];
        for (int i = 0; i < out.length; i++) {
            if (lines.photons[i] == 0) {
                continue;
            }
            double c = lines.position[i];
            double g = Math.hypot(lines.gaussian[i], instrument.fwhmAt(c));
            double l = lines.lorentz[i];
            double a = lo;
            double b = hi;
            if (!fast) {
                double reach = window * Profiles.voigtFwhm(g, l);
                a = Math.max(a, c - reach);
                b = Math.min(b, c + reach);
            }
            out[i] = lines.photons[i] * scale * LineRenderer.fractionBetween(a, b, c, g, l);
        }
        return out;
    }

    /**
     * @return whether {@link #render(int)} uses {@link FastLineRenderer} (chosen, or picked by
     *         {@link Renderer#AUTO}) rather than {@link LineRenderer}
     */
    public boolean usesFastRenderer() {
        if (renderer != Renderer.AUTO) {
            return renderer == Renderer.FAST;
        }
        if ((double) lines.size() * grid.pixels() < Renderer.AUTO_THRESHOLD) {
            return false;
        }
        long[] size = new FastLineRenderer(grid, instrument).size(lines.position, lines.photons, lines.gaussian,
                lines.lorentz);
        // and only where its arrays take at most half the largest heap (a small JVM keeps the exact one)
        return size[0] <= FastLineRenderer.MAX_POINTS && size[1] <= FastLineRenderer.AUTO_MAX_PAIRS
                && FastLineRenderer.bytes(size[0], size[1], grid.pixels()) <= Runtime.getRuntime().maxMemory() / 2;
    }

    /**
     * The lines of a scene, by index: position (nm, axis medium, shifted), photon rate, Gaussian
     * (Doppler, without the instrument) and Lorentzian FWHM in nm, and a label.
     */
    public static final class Lines {
        private final double[] position;
        private final double[] photons;
        private final double[] gaussian;
        private final double[] lorentz;
        /** Where each line's label comes from: a source and the line's index in it. */
        private final LabelSource[] labelSource;
        private final int[] labelIndex;
        /** The lines whose photon rates are given intensities; never written to after construction. */
        private final BitSet given;

        Lines(double[] position, double[] photons, double[] gaussian, double[] lorentz, LabelSource[] labelSource,
                int[] labelIndex, BitSet given) {
            this.given = given;
            this.position = position;
            this.photons = photons;
            this.gaussian = gaussian;
            this.lorentz = lorentz;
            this.labelSource = labelSource;
            this.labelIndex = labelIndex;
        }

        /**
         * Lines from their columns, for instance as read back from a file; the arrays are copied.
         *
         * @param position line centres in nm (axis medium)
         * @param photons  photon rates before scaling
         * @param gaussian Doppler FWHM in nm
         * @param lorentz  Lorentzian FWHM in nm
         * @param label    labels
         * @return the lines
         * @throws IllegalArgumentException when the columns differ in length or a label is null
         */
        public static Lines of(double[] position, double[] photons, double[] gaussian, double[] lorentz,
                String[] label) {
            int n = position.length;
            if (photons.length != n || gaussian.length != n || lorentz.length != n || label.length != n) {
                throw new IllegalArgumentException("line columns differ in length: " + n + " positions, "
                        + photons.length + " photon rates, " + gaussian.length + " Doppler widths, " + lorentz.length
                        + " Lorentzian widths, " + label.length + " labels");
            }
            for (int i = 0; i < n; i++) {
                if (label[i] == null) {
                    throw new IllegalArgumentException("line " + i + " has no label");
                }
            }
            String[] copy = label.clone();
            LabelSource[] source = new LabelSource[n];
            int[] index = new int[n];
            LabelSource texts = i -> copy[i];
            for (int i = 0; i < n; i++) {
                source[i] = texts;
                index[i] = i;
            }
            return new Lines(position.clone(), photons.clone(), gaussian.clone(), lorentz.clone(), source, index,
                    new BitSet());
        }

        /** @return number of lines */
        public int size() {
            return position.length;
        }

        /**
         * @param i the line's index, 0 to {@link #size()} - 1
         * @return whether its photon rate is an intensity a line list gave (scaled as the scene
         *         scales lists), rather than a population the scene computed (Boltzmann, Saha);
         *         false for lines made by {@link #of}
         */
        public boolean intensityGiven(int i) {
            Objects.checkIndex(i, position.length);
            return given.get(i);
        }

        /**
         * @param i the line's index, 0 to {@link #size()} - 1
         * @return line centre in nm in the axis medium, Doppler-shifted
         */
        public double position(int i) {
            return position[i];
        }

        /**
         * @param i the line's index, 0 to {@link #size()} - 1
         * @return photon rate before scaling (per unit of the emitter's abundance)
         */
        public double photons(int i) {
            return photons[i];
        }

        /**
         * @param i the line's index, 0 to {@link #size()} - 1
         * @return Doppler FWHM in nm (the instrument's is added in quadrature when rendering)
         */
        public double gaussianFwhm(int i) {
            return gaussian[i];
        }

        /**
         * @param i the line's index, 0 to {@link #size()} - 1
         * @return Lorentzian FWHM in nm: collisional + natural + Stark
         */
        public double lorentzFwhm(int i) {
            return lorentz[i];
        }

        /**
         * @param i the line's index, 0 to {@link #size()} - 1
         * @return e.g. {@code H I H-alpha} or the line list's label
         */
        public String label(int i) {
            return labelSource[i].label(labelIndex[i]);
        }
    }

    /** Collects a scene's description; not thread-safe, build once and share the scene. */
    public static final class Builder {
        private final PixelGrid grid;
        private final List<HydrogenLikeEmitter> ions = new ArrayList<>();
        private final List<Object> lists = new ArrayList<>();   // ListEmitter, AlkaliEmitter, LevelEmitter, RelativeSet or RelativeColumns
        private double temperature = Double.NaN;
        private double electronDensity = Double.NaN;
        private double velocity;
        private double collisional;
        private boolean natural;
        private boolean components;
        private int nMax = 30;
        private Medium medium = Medium.vacuum();
        private Instrument instrument = Instrument.ideal();
        private double window = LineRenderer.DEFAULT_WINDOW;
        private Renderer renderer = Renderer.AUTO;
        private double peakCounts = 10_000;
        private DoubleUnaryOperator continuum;
        private double continuumCounts;
        private double readNoise;
        private long seed;
        private boolean noise;

        private Builder(PixelGrid grid) {
            if (!(grid.lowest() > 0)) {
                throw new IllegalArgumentException("the grid's axis is wavelength in nm and must start above 0, got "
                        + grid.lowest());
            }
            this.grid = grid;
        }

        /**
         * @param species   the ion, for its label and charge
         * @param model     its level model
         * @param abundance number (or number density) of atoms of its element (of the ion
         *                  itself for elements other than H and He), positive
         * @return this builder
         */
        public Builder hydrogenLike(Species species, HydrogenLikeModel model, double abundance) {
            Objects.requireNonNull(model, "model").requireIon(species); // names a null species too
            abundance("abundance of " + species.notation(), abundance);
            ions.add(new HydrogenLikeEmitter(species, model, abundance));
            return this;
        }

        /**
         * @param label           a name for the lines, e.g. {@code Ne I}
         * @param vacuumNm        vacuum wavelengths in nm, positive
         * @param photons         photon rates, finite and not negative
         * @param emitterMassKg   the emitter's mass in kg, for the Doppler width
         * @return this builder
         */
        public Builder lineList(String label, double[] vacuumNm, double[] photons, double emitterMassKg) {
            String[] labels = new String[vacuumNm.length];
            Arrays.fill(labels, label);
            return lineList(label, vacuumNm, photons, emitterMassKg, labels);
        }

        /**
         * As {@link #lineList(String, double[], double[], double)}, with a label for each line.
         *
         * @param label         a name for the list, used in error messages
         * @param vacuumNm      vacuum wavelengths in nm, positive
         * @param photons       photon rates, finite and not negative
         * @param emitterMassKg the emitter's mass in kg, for the Doppler width
         * @param lineLabels    one label per line, e.g. {@code Ne I 585.249 nm air}
         * @return this builder
         */
        public Builder lineList(String label, double[] vacuumNm, double[] photons, double emitterMassKg,
                String[] lineLabels) {
            if (lineLabels.length != vacuumNm.length) {
                throw new IllegalArgumentException(label + ": " + vacuumNm.length + " wavelengths but "
                        + lineLabels.length + " labels");
            }
            if (vacuumNm.length != photons.length) {
                throw new IllegalArgumentException(label + ": " + vacuumNm.length + " wavelengths but "
                        + photons.length + " intensities");
            }
            for (int i = 0; i < vacuumNm.length; i++) {
                if (!(vacuumNm[i] > 0) || Double.isInfinite(vacuumNm[i])) {
                    throw new IllegalArgumentException(label + " line " + i + ": wavelength must be positive, got "
                            + vacuumNm[i] + " nm");
                }
                if (!(photons[i] >= 0) || Double.isInfinite(photons[i])) {
                    throw new IllegalArgumentException(label + " line " + i + ": intensity must be finite and not "
                            + "negative, got " + photons[i]);
                }
            }
            positive(label + " emitter mass", emitterMassKg);
            String[] labels = lineLabels.clone();
            lists.add(new ListEmitter(label, vacuumNm.clone(), photons.clone(), emitterMassKg, i -> labels[i], true));
            return this;
        }

        /**
         * A neutral alkali atom: its E1 lines between the quantum-defect model's levels (n &lt;= nMax,
         * l &lt;= 3; {@link AlkaliLines}) near the grid, each with the photon rate
         * abundance (2 j_u + 1) A exp(-E_u / kT) / U (Boltzmann's law, optically thin, as for the
         * one-electron ions; no ionisation balance). U is summed over the model's levels (l &lt;= 3)
         * as the ions' is, never to nMax: with an electron density over the levels below the
         * Debye-lowered limit (at most n = 500), whose lines alone are drawn; without one in the
         * Planck-Larkin form. Labelled {@code Rb-87 I 5p 2P3/2 - 5s 2S1/2}.
         *
         * @param atom      the atom
         * @param abundance its number (or number density) of neutral atoms, positive
         * @param nucleus   its nucleus, for the atom's mass (nucleus plus Z electrons) in the Doppler width
         * @return this builder
         */
        public Builder alkali(AlkaliAtom atom, double abundance, Nucleus nucleus) {
            Objects.requireNonNull(atom, "atom");
            Objects.requireNonNull(nucleus, "nucleus");
            abundance("abundance of " + atom.species().notation(), abundance);
            lists.add(new AlkaliEmitter(atom, abundance,
                    nucleus.massKg() + atom.species().z() * PhysicalConstants.ELECTRON_MASS.value()));
            return this;
        }

        /**
         * Any atom from its level list (He I, say): the lines the Ritz job gives between the
         * levels (E1 rules, its window if any) that carry an Einstein A, near the grid, each with
         * the photon rate abundance (2 J_u + 1) A exp(-E_u / kT) / U, U the sum of
         * (2 J + 1) exp(-E / kT) over the levels whose J is known, energies above the list's
         * lowest level (Boltzmann's law, optically thin, as for the alkali atoms). With an
         * electron density, neutral helium's abundance is weighted by its Saha fraction in the
         * helium balance ({@link IonisationBalance#helium(HydrogenLikeModel, double, double, double)},
         * the He II ion made from this nucleus, or the scene's He II model of the same nucleus), as
         * He II's is, with U as He I's partition function there too (the Saha and Boltzmann steps
         * agree; U is cut off at the list's levels, n &lt;= 10 for the built-in He I, which
         * underestimates it at the highest temperatures); other species get no
         * ionisation balance (a note says so). Lines without A are left out. Labelled
         * {@code He I 1s3d 3D3 - 1s2p 3P2}.
         *
         * @param levels    the levels (energies in cm^-1 above the ground level)
         * @param job       the Ritz job giving the lines and their A values
         *                  ({@link RitzLines#withEinsteinA})
         * @param abundance its number (or number density) of atoms of that stage, positive
         * @param nucleus   its nucleus, for the atom's mass (nucleus plus bound electrons) in the
         *                  Doppler width
         * @return this builder
         * @throws SceneException ({@link SceneException#NO_RATES}) when no line of the levels has an A
         */
        public Builder levels(RitzLevels levels, RitzLines job, double abundance, Nucleus nucleus) {
            Objects.requireNonNull(levels, "levels");
            Objects.requireNonNull(job, "job");
            return levels(job.compute(levels), abundance, nucleus);
        }

        /**
         * As {@link #levels(RitzLevels, RitzLines, double, Nucleus)} with the Ritz job's lines
         * already computed, for many scenes of one atom (the lines are computed once).
         *
         * @param lines     the lines of a level list, {@link RitzLines#compute}
         * @param abundance its number (or number density) of atoms of that stage
         * @param nucleus   its nucleus
         * @return this builder
         * @throws SceneException ({@link SceneException#NO_RATES}) when no line has an A
         */
        public Builder levels(RitzTransitions lines, double abundance, Nucleus nucleus) {
            Objects.requireNonNull(lines, "lines");
            Objects.requireNonNull(nucleus, "nucleus");
            RitzLevels levels = lines.levels();
            abundance("abundance of " + levels.species().notation(), abundance);
            boolean any = false;
            for (int i = 0; i < lines.size() && !any; i++) {
                any = lines.einsteinA(i).isPresent();
            }
            if (!any) {
                throw new SceneException(SceneException.NO_RATES, levels.species().notation() + ": no line between"
                        + " its levels has a transition probability, so it gives no light to render (give a"
                        + " companion line list with A and level labels)");
            }
            Species species = levels.species();
            lists.add(new LevelEmitter(lines, abundance,
                    nucleus.massKg() + (species.z() - species.charge()) * PhysicalConstants.ELECTRON_MASS.value(),
                    nucleus));
            return this;
        }

        /**
         * A line list with relative intensities (a lamp set, say): one emitter per species in it,
         * lines without an intensity left out. When the scene has one-electron ions the intensities
         * are scaled so the list's strongest line (over the whole list, in the grid or not) has the
         * photon rate of the ions' strongest line (upper n up to 10, with the ions' abundances,
         * partition functions and, given a density, their Saha balance) within the list's own span,
         * its shortest to its longest line with an intensity (H-alpha for a visible lamp list with
         * hydrogen), or at any wavelength (Lyman-alpha) when none lies in that span. Both scales are
         * fixed by the scene's emitters, plasma and list, not by the grid, so a list line's ratio to
         * an ion line is the same in every window (two channels of one instrument agree). Without
         * ions they are used as given.
         * Labelled {@code Ne I 640.2248 nm air}.
         *
         * @param list   the list, in any wavelength unit and medium
         * @param nuclei the nucleus of each species, for its mass (nucleus plus bound electrons) in
         *               the Doppler width
         * @return this builder
         * @throws IllegalArgumentException when no line of the list has an intensity
         */
        public Builder lineList(LineList list, Function<Species, Nucleus> nuclei) {
            Objects.requireNonNull(list, "list");
            LineSet set = LineSet.of(list);
            if (!anyIntensity(set)) {
                throw new IllegalArgumentException("line list " + list.info().id()
                        + " gives no line an intensity; a scene needs them");
            }
            Objects.requireNonNull(nuclei, "nuclei");
            lists.add(new RelativeSet(set, nuclei, "line list " + list.info().id()));
            return this;
        }

        /**
         * Lines of a {@link LineSet} with relative intensities (a lamp list through a
         * {@link org.ritzwerk.engine.lines.LineQuery}, say), treated as
         * {@link #lineList(LineList, Function)} treats a list: one emitter per species, lines
         * without an intensity left out, intensities scaled to the strongest ion line when the
         * scene has one-electron ions. Labelled {@code "<species> <name>"}.
         *
         * @param set    the lines
         * @param nuclei the nucleus of each species, for its mass in the Doppler width
         * @return this builder
         * @throws IllegalArgumentException when no line of the set has an intensity
         */
        public Builder lineSet(LineSet set, Function<Species, Nucleus> nuclei) {
            Objects.requireNonNull(set, "set");
            Objects.requireNonNull(nuclei, "nuclei");
            if (!anyIntensity(set)) {
                throw new IllegalArgumentException("the line set " + set + " gives no line an intensity; a scene needs"
                        + " them");
            }
            lists.add(new RelativeSet(set, nuclei, "the line set"));
            return this;
        }

        private static boolean anyIntensity(LineSet set) {
            for (int i = 0; i < set.size(); i++) {
                if (set.relativeIntensity(i).orElse(0) > 0) {
                    return true;
                }
            }
            return false;
        }

        /**
         * A line list held as primitive columns (millions of lines read from a file, say), treated
         * exactly as {@link #lineList(LineList, Function)} treats a {@link LineList} with the same
         * rows: one emitter per species, lines without an intensity left out, intensities scaled to
         * the strongest ion line when the scene has one-electron ions, the same photon rates,
         * widths and labels ({@code Ne I 640.2248 nm air}). No object is made per line: the labels
         * are made when asked for. The columns are kept, not copied (they are immutable).
         *
         * @param columns the lines
         * @param nuclei  the nucleus of each species, for its mass in the Doppler width
         * @return this builder
         * @throws IllegalArgumentException when no line has an intensity
         */
        public Builder lineColumns(LineColumns columns, Function<Species, Nucleus> nuclei) {
            Objects.requireNonNull(columns, "columns");
            Objects.requireNonNull(nuclei, "nuclei");
            boolean any = false;
            for (int i = 0; i < columns.size() && !any; i++) {
                any = columns.intensity(i) > 0;
            }
            if (!any) {
                throw new IllegalArgumentException("line list " + columns.id() + " gives no line an intensity; a scene"
                        + " needs them");
            }
            lists.add(new RelativeColumns(columns, nuclei));
            return this;
        }

        /**
         * @param kelvin excitation and kinetic temperature in K, positive, below 1e9 K
         * @return this builder
         */
        public Builder temperature(double kelvin) {
            if (!(kelvin > 0 && kelvin < 1e9)) {
                throw new IllegalArgumentException("temperature must be positive and below 1e9 K, got " + kelvin);
            }
            this.temperature = kelvin;
            return this;
        }

        /**
         * @param perCubicMetre electron density in m^-3, positive, up to {@link BalmerStark#MAX_DENSITY}
         * @return this builder
         */
        public Builder electronDensity(double perCubicMetre) {
            if (!(perCubicMetre > 0 && perCubicMetre <= BalmerStark.MAX_DENSITY)) {
                throw new IllegalArgumentException("electron density must be positive and at most "
                        + BalmerStark.MAX_DENSITY + " m^-3 (the Stark fit's range), got " + perCubicMetre);
            }
            this.electronDensity = perCubicMetre;
            return this;
        }

        /**
         * @param metresPerSecond line-of-sight velocity in m/s, positive away, below c / 10
         * @return this builder
         */
        public Builder velocity(double metresPerSecond) {
            if (!(Math.abs(metresPerSecond) < 0.1 * PhysicalConstants.C)) {
                throw new IllegalArgumentException("velocity must be below a tenth of the speed of light, got "
                        + metresPerSecond + " m/s");
            }
            this.velocity = metresPerSecond;
            return this;
        }

        /**
         * @param nanometres Lorentzian FWHM in nm given to every line, not negative
         * @return this builder
         */
        public Builder collisionalFwhm(double nanometres) {
            if (!(nanometres >= 0) || Double.isInfinite(nanometres)) {
                throw new IllegalArgumentException("collisional FWHM must be finite and not negative, got "
                        + nanometres + " nm");
            }
            this.collisional = nanometres;
            return this;
        }

        /**
         * @param on add natural widths of the one-electron emitters' lines
         * @return this builder
         */
        public Builder naturalWidths(boolean on) {
            this.natural = on;
            return this;
        }

        /**
         * @param on draw the one-electron emitters' fine-structure components (n l j -&gt; n' l' j',
         *           each with its own position, upper weight 2j + 1 and A, populated by Boltzmann's
         *           law at its level's energy) instead of one line per n -&gt; n' multiplet at the
         *           multiplet's centroid; resolved at a resolving power of a few 1e5 and up, or in a
         *           cold scene (hyperfine structure is not drawn either way). Natural and Stark
         *           widths stay those of the multiplet's shells.
         * @return this builder
         */
        public Builder components(boolean on) {
            this.components = on;
            return this;
        }

        /**
         * @param n highest upper n of the one-electron lines drawn, 2 .. {@link HydrogenLikeLines#MAX_N}
         *          (the partition functions do not depend on it; with an electron density no line
         *          is drawn from above the lowered ionisation limit, whatever n); also the highest n
         *          of the alkali atoms' levels and lines
         * @return this builder
         */
        public Builder nMax(int n) {
            if (n < 2 || n > HydrogenLikeLines.MAX_N) {
                throw new IllegalArgumentException("nMax must be 2 to " + HydrogenLikeLines.MAX_N + ", got " + n);
            }
            this.nMax = n;
            return this;
        }

        /**
         * @param axisMedium the medium of the grid's wavelengths
         * @return this builder
         */
        public Builder medium(Medium axisMedium) {
            this.medium = Objects.requireNonNull(axisMedium, "axis medium");
            return this;
        }

        /**
         * @param response the spectrometer's Gaussian response
         * @return this builder
         */
        public Builder instrument(Instrument response) {
            this.instrument = Objects.requireNonNull(response, "instrument");
            return this;
        }

        /**
         * @param fwhms rendering window half-width in Voigt FWHMs, see {@link LineRenderer}
         * @return this builder
         */
        public Builder window(double fwhms) {
            this.window = fwhms;
            return this;
        }

        /**
         * @param choice the renderer: {@link Renderer#EXACT}, {@link Renderer#FAST}, or
         *               {@link Renderer#AUTO} (the default) to choose by problem size
         * @return this builder
         */
        public Builder renderer(Renderer choice) {
            this.renderer = Objects.requireNonNull(choice, "renderer");
            return this;
        }

        /**
         * @param counts expected counts in the brightest pixel of the line spectrum, positive
         * @return this builder
         */
        public Builder peakCounts(double counts) {
            positive("peak counts", counts);
            this.peakCounts = counts;
            return this;
        }

        /**
         * @param density             continuum per nm as a function of the axis wavelength in nm,
         *                            in photons like the lines, e.g.
         *                            {@code nm -> Continuum.planckPhotonsPerWavelength(...)}
         * @param brightestPixelCounts expected counts of its brightest pixel, positive
         * @return this builder
         */
        public Builder continuum(DoubleUnaryOperator density, double brightestPixelCounts) {
            Objects.requireNonNull(density, "continuum density");
            positive("continuum counts", brightestPixelCounts);
            this.continuum = density;
            this.continuumCounts = brightestPixelCounts;
            return this;
        }

        /**
         * @param readNoiseCounts Gaussian read noise, standard deviation in counts, not negative
         * @param noiseSeed       the seed; the same seed gives the same counts
         * @return this builder
         */
        public Builder noise(double readNoiseCounts, long noiseSeed) {
            if (!(readNoiseCounts >= 0) || Double.isInfinite(readNoiseCounts)) {
                throw new IllegalArgumentException("read noise must be finite and not negative, got " + readNoiseCounts);
            }
            this.readNoise = readNoiseCounts;
            this.seed = noiseSeed;
            this.noise = true;
            return this;
        }

        /**
         * @return the scene, its lines computed
         * @throws IllegalArgumentException when there are no emitters, no temperature was given
         *         (every scene needs one: populations and Doppler widths), or natural widths are
         *         asked for beyond {@link #MAX_N_WITH_NATURAL_WIDTHS}
         */
        public Scene build() {
            if (ions.isEmpty() && lists.isEmpty()) {
                throw new IllegalArgumentException("the scene has no emitters: add a one-electron ion or a line list");
            }
            if (Double.isNaN(temperature)) {
                throw new IllegalArgumentException("the scene has no temperature: call temperature(kelvin) (the"
                        + " excitation and kinetic temperature in K, for the populations and Doppler widths);"
                        + " there is no default");
            }
            if (natural && nMax > MAX_N_WITH_NATURAL_WIDTHS && !ions.isEmpty()) {
                throw new IllegalArgumentException("natural widths are computed up to n = " + MAX_N_WITH_NATURAL_WIDTHS
                        + "; lower nMax (" + nMax + ") or leave natural widths out");
            }
            return new Scene(this);
        }

        /** @return the relativistic Doppler factor of the scene's velocity */
        private double doppler() {
            return Math.sqrt((1 + velocity / PhysicalConstants.C) / (1 - velocity / PhysicalConstants.C));
        }

        /** @return whether Balmer-alpha and -beta get Stark widths (a density within the fits' range) */
        private boolean stark() {
            return !Double.isNaN(electronDensity) && electronDensity >= BalmerStark.MIN_DENSITY;
        }

        /**
         * @return how far beyond the grid a line can still put light into it, nm: the window times a
         *         generous width (instrument, collisional, Doppler of hydrogen at 1e5 K, Stark)
         */
        private double reach() {
            double hi = grid.highest();
            double widest = instrument.fwhmAt(hi) + collisional + 2.5e-4 * hi
                    + (stark() ? BalmerStark.fwhmNanometres(BalmerStark.Line.BETA, electronDensity) : 0);
            return window * widest;
        }

        /**
         * The work {@link #build} spends on the one-electron ions' lines, in the units of
         * {@link HydrogenLikeLines#workUnits} summed over the ions, over the same window: for an
         * estimate of the time before a long build (the exact radial integrals grow about as
         * n^3.6 at high nMax). With a temperature and an electron density given, up to the n the
         * build draws (the last bound level, when below nMax).
         *
         * @return the work units; 0 without one-electron ions
         */
        public double ionLineWorkUnits() {
            double[] hertz = ionRestHertz(ionWindowNm(), doppler());
            double units = 0;
            for (HydrogenLikeEmitter ion : ions) {
                int upper = Double.isNaN(temperature) ? nMax : drawnN(ion.model());
                if (upper >= 2) {
                    units += HydrogenLikeLines.of(ion.model()).workUnits(upper, hertz[0], hertz[1], components);
                }
            }
            return units;
        }

        /**
         * @return the axis window, nm, whose one-electron lines the build draws: the grid widened by
         *         {@link #reach()} (below, at most to half its lowest edge)
         */
        private double[] ionWindowNm() {
            double reach = reach();
            return new double[] {Math.max(grid.lowest() - reach, grid.lowest() / 2), grid.highest() + reach};
        }

        /**
         * @param windowNm the axis window, nm
         * @param doppler  the Doppler factor of the scene's velocity
         * @return the rest frequencies, Hz, whose lines can land in it: {lowest, highest} (air
         *         wavelengths are shorter than vacuum ones by less than 0.1 %: a safe search range)
         */
        private static double[] ionRestHertz(double[] windowNm, double doppler) {
            return new double[] {PhysicalConstants.C / (windowNm[1] * 1.001e-9 / doppler),
                PhysicalConstants.C / (windowNm[0] * 1e-9 / doppler)};
        }

        private Lines lines(List<String> notes) {
            double doppler = doppler();
            double lo = grid.lowest();
            double hi = grid.highest();
            boolean stark = stark();
            double reach = reach();
            if (!Double.isNaN(electronDensity) && !stark) {
                notes.add("electron density " + electronDensity + " m^-3 is below the Balmer Stark fit's range ("
                        + BalmerStark.MIN_DENSITY + " m^-3); Stark widths are left out (under 0.005 nm there)");
            }
            if (stark && ions.stream().anyMatch(ion -> ion.model().nucleus().z() <= 2)) {
                boolean heliumIon = ions.stream().anyMatch(ion -> ion.model().nucleus().z() == 2);
                notes.add("Stark widths are drawn for H-alpha and H-beta of hydrogen and deuterium only (the fits"
                        + " cover those); H-gamma and higher" + (heliumIon ? " and the He II lines" : "")
                        + " are drawn without");
                // Inglis and Teller (1939): log10 Ne[cm^-3] = 23.26 - 7.5 log10 n_max (from memory).
                double merged = Math.pow(10, (23.26 - Math.log10(electronDensity * 1e-6)) / 7.5);
                int drawnH = ions.stream().filter(ion -> ion.model().nucleus().z() == 1)
                        .mapToInt(ion -> drawnN(ion.model())).max().orElse(0);
                if (drawnH > merged) {
                    notes.add(String.format(java.util.Locale.ROOT, "at this density the Balmer lines above n = %.0f"
                            + " merge into a continuum (Inglis-Teller); they are drawn as separate lines up to"
                            + " n = %d", Math.floor(merged), drawnH));
                }
            }
            Collected out = new Collected(lo, hi);
            for (HydrogenLikeEmitter ion : ions) {
                addIon(ion, out, doppler, ionWindowNm(), stark, notes);
            }
            for (ListEmitter list : resolvedLists(notes)) {
                boolean fromIntensity = list.givenIntensities();
                out.reserve(list.vacuumNm.length);
                for (int i = 0; i < list.vacuumNm.length; i++) {
                    double vacuumShifted = list.vacuumNm[i] * doppler;
                    if (vacuumShifted < lo - reach || vacuumShifted > (hi + reach) * 1.001) {
                        continue;
                    }
                    double axis = toAxis(vacuumShifted, lo, hi, out);
                    if (Double.isNaN(axis) || axis < lo - reach || axis > hi + reach) {
                        continue;
                    }
                    double nu = PhysicalConstants.C / (list.vacuumNm[i] * 1e-9);
                    double gauss = axis * Broadening.dopplerFwhm(nu, temperature, list.massKg) / nu;
                    out.add(axis, list.photons[i], gauss, collisional, list.labels, i);
                    if (fromIntensity) {
                        out.given.set(out.size - 1);
                    }
                }
            }
            notes.addAll(linesWithoutIntensity(doppler));
            if (out.outsideMedium > 0) {
                notes.add(out.outsideMedium + " line(s) just beyond the grid's ends lie outside the air model's range "
                        + "and were left out; only their far wings would have reached the grid");
            }
            return out.lines();
        }

        /**
         * The line lists as fixed photon rates, in the order they were added; each says whether its
         * rates are given intensities (not populations the scene computes).
         */
        private List<ListEmitter> resolvedLists(List<String> notes) {
            List<ListEmitter> out = new ArrayList<>();
            for (Object entry : lists) {
                if (entry instanceof ListEmitter fixed) {
                    out.add(fixed);
                } else if (entry instanceof AlkaliEmitter alkali) {
                    out.add(alkaliLines(alkali));
                } else if (entry instanceof LevelEmitter levels) {
                    out.add(levelLines(levels, notes));
                } else if (entry instanceof RelativeColumns columns) {
                    out.addAll(relativeColumnLines(columns));
                } else {
                    out.addAll(relativeSetLines((RelativeSet) entry));
                }
            }
            return out;
        }

        /**
         * One note per line list with lines between the grid's ends that give no intensity (and
         * so are left out), naming how many and the first three.
         */
        private List<String> linesWithoutIntensity(double doppler) {
            List<String> notes = new ArrayList<>();
            for (Object entry : lists) {
                List<String> left = new ArrayList<>();
                int count = 0;
                String name;
                if (entry instanceof RelativeSet r) {
                    name = r.name();
                    LineSet set = r.set();
                    for (int i = 0; i < set.size(); i++) {
                        if (set.relativeIntensity(i).isEmpty() && onGrid(set.vacuumWavelengthNm(i) * doppler)) {
                            count++;
                            if (left.size() < 3) {
                                left.add(set.species(i).notation() + " " + set.name(i));
                            }
                        }
                    }
                } else if (entry instanceof RelativeColumns r) {
                    LineColumns columns = r.columns();
                    name = "line list " + columns.id();
                    double[] one = new double[1];
                    for (int i = 0; i < columns.size(); i++) {
                        if (!Double.isNaN(columns.intensity(i))) {
                            continue;
                        }
                        SpectralArrays.convert(new double[] {columns.position(i)}, columns.unit(), columns.medium(),
                                Unit.METRE, Medium.vacuum(), one);
                        if (onGrid(one[0] * 1e9 * doppler)) {
                            count++;
                            if (left.size() < 3) {
                                left.add(columns.coveredSpecies().get(columns.speciesNumber(i)).notation() + " "
                                        + columns.position(i) + " " + columns.unit().symbol()
                                        + (columns.medium() == null ? "" : " " + columns.medium().label()));
                            }
                        }
                    }
                } else {
                    continue;
                }
                if (count > 0) {
                    notes.add(name + ": " + count + (count == 1 ? " line" : " lines") + " between the grid's ends"
                            + (count == 1 ? " gives" : " give") + " no intensity and " + (count == 1 ? "is" : "are")
                            + " left out (" + String.join(", ", left) + (count > left.size() ? ", ..." : "") + ")");
                }
            }
            return notes;
        }

        /** Whether a shifted vacuum wavelength, nm, lies between the grid's ends on the axis. */
        private boolean onGrid(double vacuumNm) {
            try {
                double axis = medium.fromVacuum(vacuumNm * 1e-9) * 1e9;
                return axis >= grid.lowest() && axis <= grid.highest();
            } catch (MediumException e) {
                return false;
            }
        }

        private ListEmitter alkaliLines(AlkaliEmitter e) {
            AlkaliAtom atom = e.atom();
            double beta = Math.abs(velocity) / PhysicalConstants.C;
            double lowHz = PhysicalConstants.C / (grid.highest() * 1.02e-9 * (1 + beta));
            double highHz = PhysicalConstants.C / (grid.lowest() * 0.98e-9 * (1 - beta));
            double kT = PhysicalConstants.K * temperature;
            double hcPerCm = PhysicalConstants.H * PhysicalConstants.C * 100;
            double partition = alkaliPartition(atom);
            // With a density, levels above the Debye-lowered limit have merged into the continuum.
            double bound = Double.isNaN(electronDensity) ? Double.POSITIVE_INFINITY : atom.ionisationLimitPerCm()
                    - IonisationBalance.ionisationLowering(temperature, electronDensity, 1) / hcPerCm;
            List<AlkaliLines.Line> found = AlkaliLines.window(atom, lowHz, highHz, nMax, 3, 0, f -> { });
            double[] nm = new double[found.size()];
            double[] photons = new double[found.size()];
            String[] labels = new String[found.size()];
            int n = 0;
            for (AlkaliLines.Line line : found) {
                double upper = atom.energyPerCm(line.upper());
                if (upper >= bound) {
                    continue;
                }
                nm[n] = PhysicalConstants.C / line.frequency() * 1e9;
                photons[n] = e.abundance() * (line.upper().twoJ() + 1) * line.einsteinA()
                        * Math.exp(-upper * hcPerCm / kT) / partition;
                labels[n] = atom.species().notation() + " " + line.label();
                n++;
            }
            String[] kept = Arrays.copyOf(labels, n);
            return new ListEmitter(atom.species().notation(), Arrays.copyOf(nm, n), Arrays.copyOf(photons, n),
                    e.massKg(), i -> kept[i], false);
        }

        /**
         * An alkali atom's partition function over the model's levels (l &lt;= 3), as for the
         * one-electron ions never cut at nMax: with an electron density, the sum of (2j + 1)
         * exp(-E / kT) over the levels bound by more than the Debye lowering (z = 1,
         * {@link IonisationBalance#ionisationLowering}); without one, the Planck-Larkin form
         * exp(-chi / kT) sum (2j + 1) (exp(I / kT) - 1 - I / kT) over the levels, I their binding
         * energies (the form of {@link IonisationBalance#planckLarkinPartition} carried over to a
         * quantum-defect atom, whose divergent part is its hydrogen-like Rydberg tail; our
         * extension), summed to n = 500, beyond which the terms, falling
         * as n^-4, add below 1e-9 of it. With a density the sum ends where the s level, the most
         * bound of its n, is no longer bound, or at n = 500 (densities below about 1e17 m^-3).
         */
        private double alkaliPartition(AlkaliAtom atom) {
            double hcPerCmOverKt = PhysicalConstants.H * PhysicalConstants.C * 100
                    / (PhysicalConstants.K * temperature);
            double limit = atom.ionisationLimitPerCm();
            boolean dense = !Double.isNaN(electronDensity);
            double lowered = dense ? IonisationBalance.ionisationLowering(temperature, electronDensity, 1)
                    / (PhysicalConstants.H * PhysicalConstants.C * 100) : 0;
            double a = limit * hcPerCmOverKt;
            double partition = 0;
            for (int n = 1; n <= ALKALI_PARTITION_N; n++) {
                boolean anyBound = false;
                for (int l = 0; l <= Math.min(3, n - 1); l++) {
                    for (int twoJ = Math.max(1, 2 * l - 1); twoJ <= 2 * l + 1; twoJ += 2) {
                        if (n < atom.lowestN(l)) {
                            continue;
                        }
                        double energy;
                        try {
                            energy = atom.energyPerCm(State.of(n, l, twoJ));
                        } catch (RydbergException ex) {
                            continue;   // no energy for it: not in the model, not in the sum
                        }
                        double binding = limit - energy;
                        if (dense) {
                            if (binding > lowered) {
                                anyBound = true;
                                partition += (twoJ + 1) * Math.exp(-energy * hcPerCmOverKt);
                            }
                        } else {
                            anyBound = true;
                            partition += (twoJ + 1) * IonisationBalance.planckLarkinTerm(binding * hcPerCmOverKt, a);
                        }
                    }
                }
                if (dense && !anyBound && n > atom.lowestN(0)) {
                    break;   // the s level, the most bound of its n, is unbound: so is everything above
                }
            }
            return partition;
        }

        /**
         * A level list's lines with A as fixed photon rates (Boltzmann populations over its levels,
         * He I's weighted by its Saha fraction when there is a density).
         */
        private ListEmitter levelLines(LevelEmitter e, List<String> notes) {
            RitzTransitions lines = e.lines();
            RitzLevels levels = lines.levels();
            double hcPerCmOverKt = PhysicalConstants.H * PhysicalConstants.C * 100 / (PhysicalConstants.K * temperature);
            double lowest = lowest(levels);
            double partition = levelPartition(levels);
            double number = e.abundance() * levelStageFraction(e, partition, notes);
            double limit = boundLimitPerCm(levels.species());
            int dissolved = 0;
            double beta = Math.abs(velocity) / PhysicalConstants.C;
            double loNm = grid.lowest() * 0.98 * (1 - beta);
            double hiNm = grid.highest() * 1.02 * (1 + beta);
            int n = 0;
            double[] nm = new double[lines.size()];
            double[] photons = new double[lines.size()];
            String[] labels = new String[lines.size()];
            String prefix = levels.species().notation() + " ";
            for (int i = 0; i < lines.size(); i++) {
                double vacuumNm = lines.vacuumWavelengthNm(i);
                if (lines.einsteinA(i).isEmpty() || vacuumNm < loNm || vacuumNm > hiNm) {
                    continue;
                }
                int u = lines.upper(i);
                if (levels.energyPerCm(u) - lowest >= limit) {
                    dissolved++;
                    continue;
                }
                nm[n] = vacuumNm;
                photons[n] = number * (levels.designation(u).twoJ() + 1) * lines.einsteinA(i).getAsDouble()
                        * Math.exp(-(levels.energyPerCm(u) - lowest) * hcPerCmOverKt) / partition;
                labels[n] = prefix + levels.label(u) + " - " + levels.label(lines.lower(i));
                n++;
            }
            if (dissolved > 0) {
                notes.add(String.format(java.util.Locale.ROOT, "%s: %d line(s) from levels above the ionisation"
                        + " limit lowered by the plasma (Debye screening, to %.1f cm^-1) are not drawn",
                        levels.species().notation(), dissolved, limit));
            }
            String[] kept = Arrays.copyOf(labels, n);
            return new ListEmitter(levels.species().notation(), Arrays.copyOf(nm, n), Arrays.copyOf(photons, n),
                    e.massKg(), i -> kept[i], false);
        }

        /** The lowest energy of a level list, cm^-1. */
        private static double lowest(RitzLevels levels) {
            double lowest = Double.POSITIVE_INFINITY;
            for (int i = 0; i < levels.size(); i++) {
                lowest = Math.min(lowest, levels.energyPerCm(i));
            }
            return lowest;
        }

        /**
         * The energy above the lowest level, cm^-1, from which a level list's levels have merged
         * into the continuum: for neutral helium with an electron density, its ionisation energy
         * lowered by Debye screening ({@link IonisationBalance#ionisationLowering}, z = 1);
         * otherwise no limit (infinity), as no ionisation energy is known for the list.
         */
        private double boundLimitPerCm(Species species) {
            if (Double.isNaN(electronDensity) || species.z() != 2 || species.charge() != 0) {
                return Double.POSITIVE_INFINITY;
            }
            return (IonisationBalance.HELIUM_I_IONISATION_ENERGY
                    - IonisationBalance.ionisationLowering(temperature, electronDensity, 1))
                    / (PhysicalConstants.H * PhysicalConstants.C * 100);
        }

        /**
         * The partition function of a level list at the scene's temperature: the sum of
         * (2J + 1) exp(-(E - E_lowest) / kT) over the levels whose J is known (Boltzmann's law,
         * common practice), up to the list's last level and, for He I with an electron density,
         * below the lowered ionisation limit ({@link #boundLimitPerCm}).
         */
        private double levelPartition(RitzLevels levels) {
            double hcPerCmOverKt = PhysicalConstants.H * PhysicalConstants.C * 100
                    / (PhysicalConstants.K * temperature);
            double lowest = lowest(levels);
            double limit = boundLimitPerCm(levels.species());
            double partition = 0;
            for (int i = 0; i < levels.size(); i++) {
                if (levels.designation(i).hasJ() && levels.energyPerCm(i) - lowest < limit) {
                    partition += (levels.designation(i).twoJ() + 1)
                            * Math.exp(-(levels.energyPerCm(i) - lowest) * hcPerCmOverKt);
                }
            }
            return partition;
        }

        /**
         * He I's partition function for the helium balance of this nucleus: the Boltzmann sum over
         * the scene's He I level list of the same nucleus (the one its lines are populated with),
         * or 1, the ground level alone, when the scene has none.
         */
        private double heliumNeutralPartition(Nucleus nucleus) {
            for (Object entry : lists) {
                if (entry instanceof LevelEmitter e && e.nucleus().equals(nucleus)) {
                    Species species = e.lines().levels().species();
                    if (species.z() == 2 && species.charge() == 0) {
                        return Math.max(1, levelPartition(e.lines().levels()));
                    }
                }
            }
            return 1;
        }

        /**
         * Neutral helium's Saha fraction in the helium balance, or 1 when there is no density or
         * no balance for the species (noted). The He II ion of the balance is the scene's He II
         * model of the same nucleus, so that both stages share one balance, or else one made from
         * the nucleus; He I's partition function in it is the one its lines are populated with.
         */
        private double levelStageFraction(LevelEmitter e, double partition, List<String> notes) {
            if (Double.isNaN(electronDensity)) {
                return 1;
            }
            Species species = e.lines().levels().species();
            if (species.z() != 2 || species.charge() != 0) {
                notes.add(species.notation() + ": no ionisation balance for its level list; its abundance is taken"
                        + " as that stage's own");
                return 1;
            }
            HydrogenLikeModel ion = null;
            for (HydrogenLikeEmitter emitter : ions) {
                if (emitter.model().nucleus().equals(e.nucleus())) {
                    ion = emitter.model();
                }
            }
            if (ion == null) {
                ion = HydrogenLikeModel.of(e.nucleus(), Tier.DIRAC);
            }
            return IonisationBalance.helium(ion, temperature, electronDensity, Math.max(1, partition))[0];
        }

        /**
         * The photon rate a list's strongest line gets, {@link #strongestIonLine(double, double)} for
         * the list's span of wavelengths, or NaN without ions (or without their light): the list
         * then keeps its own intensities.
         */
        private double listReference(double loNm, double hiNm) {
            double ionScale = ions.isEmpty() ? 0 : strongestIonLine(loNm, hiNm);
            return ionScale > 0 ? ionScale : Double.NaN;
        }

        /**
         * A list line's photon rate: its intensity, or with a reference its share of the list's
         * strongest times the reference (the ratio taken first, so a faint reference, Lyman-alpha at
         * a few hundred kelvin, does not underflow beside large intensities).
         */
        private static double photons(double intensity, double strongest, double reference) {
            return Double.isNaN(reference) ? intensity : intensity / strongest * reference;
        }

        /**
         * The reference photon rate for a line list with relative intensities whose lines (with an
         * intensity) span the vacuum wavelengths loNm to hiNm: the strongest one-electron line at
         * rest in that span (the list's own, not the grid's), upper n up to REFERENCE_N, 10 (and the
         * drawn n), with the ions' abundances, partition functions and, given a density, their Saha
         * balance; when no such line lies in the span, the strongest at any wavelength (in practice
         * Lyman-alpha of the brightest ion). It does not depend on the grid, so a list line's ratio to
         * an ion line is the same in every window. 0 without ions.
         */
        private double strongestIonLine(double loNm, double hiNm) {
            double inSpan = strongestIonLineInHertz(PhysicalConstants.C / (hiNm * 1e-9),
                    PhysicalConstants.C / (loNm * 1e-9));
            return inSpan > 0 ? inSpan : strongestIonLineInHertz(0, Double.MAX_VALUE);
        }

        /** The strongest one-electron line between two frequencies (see {@link #strongestIonLine}). */
        private double strongestIonLineInHertz(double loHertz, double hiHertz) {
            double strongest = 0;
            double kT = PhysicalConstants.K * temperature;
            List<String> ignored = new ArrayList<>();   // the same notes come again from the ions' own lines
            for (HydrogenLikeEmitter ion : ions) {
                HydrogenLikeModel model = ion.model();
                int upper = Math.min(REFERENCE_N, drawnN(model));
                if (upper < 2) {
                    continue;
                }
                double number = ion.abundance() * stageFraction(ion, ignored) / ionPartition(model);
                double ground = model.energy(1, 0, 1);
                LineTable table = HydrogenLikeLines.of(model).multiplets(upper, loHertz, hiHertz);
                for (int i = 0; i < table.size(); i++) {
                    double photons = number * table.upperWeight(i) * table.einsteinA(i)
                            * Math.exp(-(model.energy(table.upperN(i), 0, 1) - ground) / kT);
                    strongest = Math.max(strongest, photons);
                }
            }
            return strongest;
        }

        /**
         * As {@link #relativeSetLines} for the same list as a {@link LineSet}, for columns: the
         * same vacuum wavelengths (converted through metres, as {@link LineSet#of(LineList)}
         * does), photon rates and labels, in the same order; each species' lines are kept as
         * indices into the columns and their labels made on demand.
         */
        private List<ListEmitter> relativeColumnLines(RelativeColumns r) {
            LineColumns columns = r.columns();
            int size = columns.size();
            double[] vacuum = new double[size];
            try {
                SpectralArrays.convert(columns.positions(), columns.unit(), columns.medium(), Unit.METRE,
                        Medium.vacuum(), vacuum);
            } catch (IllegalArgumentException e) {
                throw new IllegalArgumentException("line list " + columns.id() + ": " + e.getMessage(), e);
            }
            double strongest = 0;
            double lo = Double.POSITIVE_INFINITY;
            double hi = 0;
            for (int i = 0; i < size; i++) {
                double intensity = columns.intensity(i);
                if (intensity > strongest) {
                    strongest = intensity;
                }
                if (intensity > 0) {
                    lo = Math.min(lo, vacuum[i] * 1e9);
                    hi = Math.max(hi, vacuum[i] * 1e9);
                }
            }
            double reference = listReference(lo, hi);
            String suffix = " " + columns.unit().symbol() + (columns.medium() == null ? "" : " "
                    + columns.medium().label());
            int[] count = new int[columns.coveredSpecies().size()];
            for (int i = 0; i < size; i++) {
                if (!Double.isNaN(columns.intensity(i))) {
                    count[columns.speciesNumber(i)]++;
                }
            }
            List<ListEmitter> out = new ArrayList<>();
            for (int number = 0; number < count.length; number++) {
                Species species = columns.coveredSpecies().get(number);
                int n = count[number];
                double[] nm = new double[n];
                double[] photons = new double[n];
                int[] row = new int[n];
                int k = 0;
                for (int i = 0; i < size && k < n; i++) {
                    if (columns.speciesNumber(i) == number && !Double.isNaN(columns.intensity(i))) {
                        nm[k] = vacuum[i] * 1e9;
                        photons[k] = photons(columns.intensity(i), strongest, reference);
                        row[k] = i;
                        k++;
                    }
                }
                String prefix = species.notation() + " ";
                Nucleus nucleus = Objects.requireNonNull(r.nuclei().apply(species), "nucleus of " + species.notation());
                double mass = nucleus.massKg() + (species.z() - species.charge()) * PhysicalConstants.ELECTRON_MASS.value();
                out.add(new ListEmitter(species.notation(), nm, photons, mass,
                        i -> prefix + columns.position(row[i]) + suffix, true));
            }
            return out;
        }

        /** A line set with relative intensities: one emitter per species, lines with an intensity, scaled. */
        private List<ListEmitter> relativeSetLines(RelativeSet r) {
            LineSet set = r.set();
            double strongest = 0;
            double lo = Double.POSITIVE_INFINITY;
            double hi = 0;
            for (int i = 0; i < set.size(); i++) {
                double intensity = set.relativeIntensity(i).orElse(0);
                strongest = Math.max(strongest, intensity);
                if (intensity > 0) {
                    lo = Math.min(lo, set.vacuumWavelengthNm(i));
                    hi = Math.max(hi, set.vacuumWavelengthNm(i));
                }
            }
            double reference = listReference(lo, hi);
            List<ListEmitter> out = new ArrayList<>();
            for (Species species : set.speciesList()) {
                double[] nm = new double[set.size()];
                double[] photons = new double[set.size()];
                String[] labels = new String[set.size()];
                int n = 0;
                for (int i = 0; i < set.size(); i++) {
                    if (set.species(i).equals(species) && set.relativeIntensity(i).isPresent()) {
                        nm[n] = set.vacuumWavelengthNm(i);
                        photons[n] = photons(set.relativeIntensity(i).getAsDouble(), strongest, reference);
                        labels[n] = species.notation() + " " + set.name(i);
                        n++;
                    }
                }
                if (n == 0) {
                    continue;
                }
                Nucleus nucleus = Objects.requireNonNull(r.nuclei().apply(species), "nucleus of " + species.notation());
                double mass = nucleus.massKg() + (species.z() - species.charge()) * PhysicalConstants.ELECTRON_MASS.value();
                String[] kept = Arrays.copyOf(labels, n);
                out.add(new ListEmitter(species.notation(), Arrays.copyOf(nm, n), Arrays.copyOf(photons, n), mass,
                        i -> kept[i], true));
            }
            return out;
        }

        /**
         * A shifted vacuum wavelength in nm as an axis wavelength in nm; NaN (counted) for a line
         * beyond the grid's ends that the air model cannot convert.
         */
        private double toAxis(double vacuumNm, double lo, double hi, Collected out) {
            try {
                return medium.fromVacuum(vacuumNm * 1e-9) * 1e9;
            } catch (MediumException e) {
                if (vacuumNm * 1.001 >= lo && vacuumNm <= hi * 1.001) {
                    throw e;
                }
                out.outsideMedium++;
                return Double.NaN;
            }
        }

        private void addIon(HydrogenLikeEmitter ion, Collected out, double doppler, double[] windowNm,
                boolean stark, List<String> notes) {
            double loNm = windowNm[0];
            double hiNm = windowNm[1];
            HydrogenLikeModel model = ion.model;
            double kT = PhysicalConstants.K * temperature;
            double ground = model.energy(1, 0, 1);
            double partition = ionPartition(model);
            if (Double.isNaN(electronDensity) && partition < 2) {
                notes.add(String.format(java.util.Locale.ROOT, "%s: without an electron density its partition"
                        + " function (Planck-Larkin) is %.4g at %.0f K, below its ground level's weight 2: so hot a"
                        + " gas keeps this stage bound only where a density holds it; give an electron density",
                        ion.species.notation(), partition, temperature));
            }
            double number = ion.abundance * stageFraction(ion, notes);
            double[] hertz = ionRestHertz(windowNm, doppler);
            HydrogenLikeLines source = HydrogenLikeLines.of(model);
            int drawn = drawnN(model);
            if (drawn < nMax) {
                notes.add(String.format(java.util.Locale.ROOT, "%s: levels above n = %d lie above the ionisation"
                        + " limit lowered by the plasma (Debye screening, by %.3g eV); their lines are not drawn"
                        + " (nMax %d)", ion.species.notation(), drawn,
                        IonisationBalance.ionisationLowering(temperature, electronDensity, model.nucleus().z())
                                / PhysicalConstants.E, nMax));
            }
            if (drawn < 2) {
                return;
            }
            LineTable table = components ? source.components(drawn, hertz[0], hertz[1])
                    : source.multiplets(drawn, hertz[0], hertz[1]);
            double mass = model.nucleus().massKg() + PhysicalConstants.ELECTRON_MASS.value();
            double[] shellRate = natural ? new double[nMax + 1] : null;
            for (int i = 0; i < table.size(); i++) {
                int upperN = table.upperN(i);
                double upper = components ? model.energy(upperN, table.upperL(i), table.upperTwoJ(i))
                        : model.energy(upperN, 0, 1);
                double photons = number * table.upperWeight(i) * table.einsteinA(i)
                        * Math.exp(-(upper - ground) / kT) / partition;
                double nu = table.frequency(i);
                double vacuum = PhysicalConstants.C / nu;
                double axis = toAxis(doppler * vacuum * 1e9, out.lo, out.hi, out);
                if (Double.isNaN(axis) || axis < loNm || axis > hiNm) {
                    continue;
                }
                double nmPerHertz = axis / nu;
                double gauss = nmPerHertz * Broadening.dopplerFwhm(nu, temperature, mass);
                double lorentz = collisional;
                if (natural) {
                    lorentz += nmPerHertz * Broadening.naturalFwhm(shellDecayRate(model, upperN, shellRate),
                            shellDecayRate(model, table.lowerN(i), shellRate));
                }
                BalmerStark.Line balmer = BalmerStark.Line.of(upperN, table.lowerN(i));
                if (stark && balmer != null && model.nucleus().z() == 1) {
                    lorentz += BalmerStark.fwhmNanometres(balmer, electronDensity) * axis / (vacuum * 1e9);
                }
                out.add(axis, photons, gauss, lorentz, ion.species.notation() + " " + (components
                        ? table.upperLabel(i) + " - " + table.lowerLabel(i) : table.lineName(i)));
            }
        }

        /**
         * A one-electron ion's partition function: over its levels below the lowered ionisation
         * limit with an electron density, Planck-Larkin's without; never nMax's.
         */
        private double ionPartition(HydrogenLikeModel model) {
            return Double.isNaN(electronDensity) ? IonisationBalance.planckLarkinPartition(model, temperature)
                    : IonisationBalance.boundPartition(model, temperature, electronDensity);
        }

        /** The highest upper n drawn: nMax, or lower where the plasma's lowered limit ends the levels. */
        private int drawnN(HydrogenLikeModel model) {
            if (Double.isNaN(electronDensity)) {
                return nMax;
            }
            return Math.min(nMax, IonisationBalance.highestBoundN(model, temperature, electronDensity));
        }

        /** The Saha fraction of the ion's stage, or 1 when there is no density or no balance for it. */
        private double stageFraction(HydrogenLikeEmitter ion, List<String> notes) {
            if (Double.isNaN(electronDensity)) {
                return 1;
            }
            return switch (ion.model.nucleus().z()) {
                case 1 -> IonisationBalance.hydrogen(ion.model, temperature, electronDensity)[0];
                case 2 -> IonisationBalance.helium(ion.model, temperature, electronDensity,
                        heliumNeutralPartition(ion.model.nucleus()))[1];
                default -> {
                    notes.add(ion.species.notation() + ": no ionisation balance for Z = " + ion.model.nucleus().z()
                            + "; its abundance is taken as the ion's own");
                    yield 1;
                }
            };
        }

        /** Total decay rate of shell n, averaged over its n l j states with weights 2j + 1; cached. */
        private static double shellDecayRate(HydrogenLikeModel model, int n, double[] cache) {
            if (n == 1) {
                return 0;
            }
            if (cache[n] == 0) {
                HydrogenLikeLines lines = HydrogenLikeLines.of(model);
                double sum = 0;
                for (int l = 0; l < n; l++) {
                    for (int twoJ = 2 * l - 1; twoJ <= 2 * l + 1; twoJ += 2) {
                        if (twoJ > 0) {
                            sum += (twoJ + 1) / lines.lifetime(n, l, twoJ);
                        }
                    }
                }
                cache[n] = sum / (2.0 * n * n);
            }
            return cache[n];
        }

        private static void positive(String what, double value) {
            if (!(value > 0) || Double.isInfinite(value)) {
                throw new IllegalArgumentException(what + " must be finite and positive, got " + value);
            }
        }

        /**
         * An abundance: a relative number or a number density in m^-3 both lie well inside
         * 1e-100 to 1e100; beyond, the photon rates under- or overflow a double.
         */
        private static void abundance(String what, double value) {
            if (!(value >= 1e-100 && value <= 1e100)) {
                throw new IllegalArgumentException(what + " must be 1e-100 to 1e100 (a relative number or a number"
                        + " density), got " + value);
            }
        }
    }

    private record HydrogenLikeEmitter(Species species, HydrogenLikeModel model, double abundance) {
    }

    /** Line i's label; lets a list of millions of lines make its labels on demand. */
    @FunctionalInterface
    interface LabelSource {
        String label(int i);
    }

    /** Fixed photon rates; {@code givenIntensities}: they come from given intensities, not computed populations. */
    private record ListEmitter(String label, double[] vacuumNm, double[] photons, double massKg, LabelSource labels,
            boolean givenIntensities) {
    }

    private record AlkaliEmitter(AlkaliAtom atom, double abundance, double massKg) {
    }

    private record LevelEmitter(RitzTransitions lines, double abundance, double massKg, Nucleus nucleus) {
    }


    /** A line set with relative intensities; {@code name} names it in notes ("line list lamp-ne-i"). */
    private record RelativeSet(LineSet set, Function<Species, Nucleus> nuclei, String name) {
    }

    private record RelativeColumns(LineColumns columns, Function<Species, Nucleus> nuclei) {
    }

    /** Growable columns of lines. */
    private static final class Collected {
        private final double lo;
        private final double hi;
        private int outsideMedium;
        private int size;
        private double[] position = new double[64];
        private double[] photons = new double[64];
        private double[] gaussian = new double[64];
        private double[] lorentz = new double[64];
        private LabelSource[] labelSource = new LabelSource[64];
        private int[] labelIndex = new int[64];
        /** The lines whose photon rates are given intensities (line lists), not computed populations. */
        private final BitSet given = new BitSet();
        /** The labels given as text, one by one (the ions' lines). */
        private final List<String> texts = new ArrayList<>();
        private final LabelSource textSource = texts::get;

        Collected(double lo, double hi) {
            this.lo = lo;
            this.hi = hi;
        }

        void add(double at, double rate, double gauss, double lorentzFwhm, String text) {
            texts.add(text);
            add(at, rate, gauss, lorentzFwhm, textSource, texts.size() - 1);
        }

        /** Makes room for n more lines at once (a list's), so a big list is not copied while it grows. */
        void reserve(int n) {
            if (position.length - size < n) {
                grow(size + n);
            }
        }

        private void grow(int capacity) {
            position = Arrays.copyOf(position, capacity);
            photons = Arrays.copyOf(photons, capacity);
            gaussian = Arrays.copyOf(gaussian, capacity);
            lorentz = Arrays.copyOf(lorentz, capacity);
            labelSource = Arrays.copyOf(labelSource, capacity);
            labelIndex = Arrays.copyOf(labelIndex, capacity);
        }

        void add(double at, double rate, double gauss, double lorentzFwhm, LabelSource source, int index) {
            if (size == position.length) {
                grow(2 * size);
            }
            position[size] = at;
            photons[size] = rate;
            gaussian[size] = gauss;
            lorentz[size] = lorentzFwhm;
            labelSource[size] = source;
            labelIndex[size] = index;
            size++;
        }

        Lines lines() {
            if (size == position.length) {
                return new Lines(position, photons, gaussian, lorentz, labelSource, labelIndex, given);
            }
            return new Lines(Arrays.copyOf(position, size), Arrays.copyOf(photons, size), Arrays.copyOf(gaussian, size),
                    Arrays.copyOf(lorentz, size), Arrays.copyOf(labelSource, size), Arrays.copyOf(labelIndex, size),
                    given);
        }
    }
}
