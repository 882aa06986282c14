package org.ritzwerk.engine.identify;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.function.Consumer;
import java.util.function.DoubleConsumer;
import java.util.function.Function;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.AlkaliLines;

/**
 * The candidate lines for an identification in a vacuum-wavelength window, from every source the
 * engine knows: one-electron ions (their n -&gt; n' multiplets, entered as blends, or their
 * fine-structure components), alkali atoms (lines between the quantum-defect model's levels,
 * l &lt;= 3), and line lists (built-in sets or a user's own). Every source enters as a
 * {@link LineSet} (one line model), so each line's expected strength follows one rule:
 * the relative intensity where given, else g_upper A, times exp(-(E_upper - E_ground) / kT)
 * when an excitation temperature is given and the upper energy is known (Boltzmann
 * populations, common practice); else unknown.
 * For the multiplets of one-electron ions the physics a plasma estimate needs (upper energy,
 * weight, A, frequency) is kept and found by {@link #multiplet(LineCatalog, int)}.
 *
 * <p>Built with {@link #inWindow(double, double)}; the sources are read in the order they are
 * added. Immutable and thread-safe once built.
 */
public final class Candidates {

    /**
     * The physics of a one-electron n -&gt; n' multiplet.
     *
     * @param model       the ion's model
     * @param upperN      upper n
     * @param lowerN      lower n
     * @param upperEnergy upper energy above the ground state, J
     * @param weight      upper statistical weight 2 n^2
     * @param einsteinA   the multiplet's A (weight-averaged), s^-1
     * @param frequency   Hz
     */
    public record Multiplet(HydrogenLikeModel model, int upperN, int lowerN, double upperEnergy, double weight,
            double einsteinA, double frequency) {
    }

    /**
     * What a Boltzmann plot needs of a line: the energy of its upper level and the product
     * g_u A, for a line whose upper level, weight and A are known (a one-electron multiplet, a
     * level-list line with A, or an LS multiplet of such lines entered as one blend: the sum of
     * g_u A over its components at their g_u A-weighted mean upper energy, exact where the
     * components' upper levels share one energy and close where their fine structure is small
     * beside kT; common practice).
     *
     * @param upperEnergy        upper energy above the ground level, J
     * @param weightTimesEinsteinA g_u A, s^-1
     */
    public record Emission(double upperEnergy, double weightTimesEinsteinA) {
    }

    private final LineCatalog catalog;
    private final Map<String, Multiplet> multiplets;
    private final Map<String, Emission> emissions;

    private Candidates(LineCatalog catalog, Map<String, Multiplet> multiplets, Map<String, Emission> emissions) {
        this.catalog = catalog;
        this.multiplets = multiplets;
        this.emissions = emissions;
    }

    /**
     * @param lowVacuumMetres  the window's short end, vacuum metres, positive
     * @param highVacuumMetres the window's long end, vacuum metres, at least the short end
     * @return a builder
     */
    public static Builder inWindow(double lowVacuumMetres, double highVacuumMetres) {
        if (!(lowVacuumMetres > 0) || !(highVacuumMetres >= lowVacuumMetres) || Double.isInfinite(highVacuumMetres)) {
            throw new IllegalArgumentException("the window must be positive and run from short to long wavelength, got "
                    + lowVacuumMetres + " to " + highVacuumMetres + " m");
        }
        return new Builder(lowVacuumMetres, highVacuumMetres);
    }

    /** @return the candidate lines */
    public LineCatalog catalog() {
        return catalog;
    }

    /**
     * @param lines a catalog whose lines keep this one's species and labels (this catalog,
     *              or one {@link LineCatalog#shifted shifted} or {@link LineCatalog#offset offset})
     * @param j     a line of it
     * @return the multiplet physics of that line, or null when it is not a one-electron multiplet
     */
    public Multiplet multiplet(LineCatalog lines, int j) {
        return multiplets.get(key(lines.species(j), lines.label(j)));
    }

    /**
     * @param lines a catalog whose lines keep this one's species and labels (as for
     *              {@link #multiplet})
     * @param j     a line of it
     * @return what a Boltzmann plot needs of that line, or null when its upper level, weight or A
     *         is not known
     */
    public Emission emission(LineCatalog lines, int j) {
        Multiplet m = multiplet(lines, j);
        if (m != null) {
            return new Emission(m.upperEnergy(), m.weight() * m.einsteinA());
        }
        return emissions.get(key(lines.species(j), lines.label(j)));
    }

    /**
     * Components of one LS multiplet closer than this fraction of their wavelength are entered as
     * one blend (1e-4: 0.06 nm at 600 nm, unresolved at resolving powers below 10 000).
     */
    public static final double TERM_BLEND_RELATIVE = 1e-4;

    /** A level label: its term (configuration, multiplicity and L letter) followed by J. */
    private static final java.util.regex.Pattern TERM_AND_J =
            java.util.regex.Pattern.compile("(.*\\d[SPDFGHIKLMN])(\\d+(?:/2)?)");

    private static String key(Species species, String label) {
        return species.notation() + " " + label;
    }

    /** Builds {@link Candidates}. Not thread-safe. */
    public static final class Builder {

        private final double lo;
        private final double hi;
        private final List<Consumer<LineCatalog.Builder>> sources = new ArrayList<>();
        private final Map<String, Multiplet> multiplets = new HashMap<>();
        private final Map<String, Emission> emissions = new HashMap<>();
        private double excitationTemperature = Double.NaN;
        private int count;

        private Builder(double lo, double hi) {
            this.lo = lo;
            this.hi = hi;
        }

        /**
         * @param kelvin weigh one-electron lines by exp(-E_upper / kT) at this temperature, positive
         *               and below 1e9 K
         * @return this builder
         */
        public Builder excitationTemperature(double kelvin) {
            if (!(kelvin > 0 && kelvin < 1e9)) {
                throw new IllegalArgumentException("the excitation temperature must be a positive number of kelvin, "
                        + "got " + kelvin);
            }
            this.excitationTemperature = kelvin;
            return this;
        }

        /**
         * @param species    the ion
         * @param model      its level model
         * @param nMax       highest upper n
         * @param components true for fine-structure components, false for n -&gt; n' multiplets
         *                   (entered as blends with the span of their fine-structure components:
         *                   one may explain several peaks that lie within that span plus the
         *                   tolerance of one another)
         * @return this builder
         * @throws IllegalArgumentException when the species is not the one-electron ion of the
         *                                  model's nucleus
         */
        public Builder hydrogenLike(Species species, HydrogenLikeModel model, int nMax, boolean components) {
            Objects.requireNonNull(model, "model").requireIon(species);
            sources.add(b -> {
                HydrogenLikeLines generator = HydrogenLikeLines.of(model);
                double fromHz = PhysicalConstants.C / hi;
                double toHz = PhysicalConstants.C / lo;
                addLineSet(b, LineSet.ofHydrogenLike(species, model, components ? generator.components(nMax, fromHz, toHz)
                        : generator.multiplets(nMax, fromHz, toHz), components ? null : generator), s -> model);
            });
            return this;
        }

        /**
         * @param atom     the atom (its lines between levels with l &lt;= 3, n &lt;= nMax)
         * @param nMax     highest n of both levels
         * @param progress told the fraction done; may be a no-op
         * @return this builder
         */
        public Builder alkali(AlkaliAtom atom, int nMax, DoubleConsumer progress) {
            Objects.requireNonNull(atom, "atom");
            Objects.requireNonNull(progress, "progress");
            sources.add(b -> addLineSet(b, LineSet.ofAlkali(atom, AlkaliLines.window(atom, PhysicalConstants.C / hi,
                    PhysicalConstants.C / lo, nMax, 3, 0, progress)), s -> null));
            return this;
        }

        /**
         * @param list a line list in any unit and medium; its lines in the window are candidates,
         *             labelled "upper - lower" where the list names both levels, else by set id and position
         * @return this builder
         */
        public Builder lineList(LineList list) {
            Objects.requireNonNull(list, "list");
            sources.add(b -> addLineSet(b, LineSet.of(list), s -> null));
            return this;
        }

        /**
         * Any line set ({@link LineSet}, e.g. a {@link org.ritzwerk.engine.lines.LineQuery}'s
         * result): its lines whose vacuum wavelength lies in the window are candidates. A
         * multiplet enters as a blend spanning its components' vacuum wavelengths (0 when it has
         * none). Expected strength: the relative intensity where given, else g_upper A (or A
         * alone without weights), else unknown; times exp(-E_upper / kT) where an excitation
         * temperature is set and the upper energy is known. Label: a multiplet's name, else
         * {@code "upper - lower"} where both labels are known, else the species and name.
         * Multiplets from a line set carry no {@link Multiplet} physics (use
         * {@link #hydrogenLike} for the plasma estimate).
         *
         * @param lines the lines
         * @return this builder
         */
        public Builder lineSet(LineSet lines) {
            Objects.requireNonNull(lines, "lines");
            sources.add(b -> addLineSet(b, lines, s -> null));
            return this;
        }

        /**
         * As {@link #lineSet(LineSet)}, with the level models of the set's one-electron ions:
         * their n -&gt; n' multiplets then keep the physics a plasma estimate needs
         * ({@link #multiplet}), and their fine-structure components carry the series name after
         * the levels, exactly as {@link #hydrogenLike} enters them.
         *
         * @param lines  the lines
         * @param models the level model of each one-electron species of the set (the one the set
         *               was computed with), or null for a species without one
         * @return this builder
         */
        public Builder lineSet(LineSet lines, Function<Species, HydrogenLikeModel> models) {
            Objects.requireNonNull(lines, "lines");
            Objects.requireNonNull(models, "models");
            sources.add(b -> addLineSet(b, lines, models));
            return this;
        }

        /**
         * @return the candidates
         * @throws IdentificationException when no candidate line lies in the window
         */
        public Candidates build() {
            LineCatalog.Builder builder = LineCatalog.builder();
            count = 0;
            multiplets.clear();
            emissions.clear();
            for (Consumer<LineCatalog.Builder> source : sources) {
                source.accept(builder);
            }
            if (count == 0) {
                throw new IdentificationException(IdentificationException.NO_CANDIDATES, "no candidate line lies in the range of the peaks ("
                        + String.format(Locale.ROOT, "%.6g to %.6g nm in vacuum", lo * 1e9, hi * 1e9) + ")");
            }
            return new Candidates(builder.build(), Map.copyOf(multiplets), Map.copyOf(emissions));
        }

        /**
         * Enters the lines of a set in the window. Where {@code models} gives a one-electron
         * ion's model, its multiplets keep the physics a plasma estimate needs, and its
         * components carry the series name after the levels.
         */
        private void addLineSet(LineCatalog.Builder b, LineSet lines, Function<Species, HydrogenLikeModel> models) {
            boolean[] inGroup = addTermBlends(b, lines);
            for (int i = 0; i < lines.size(); i++) {
                double vacuum = lines.vacuumWavelengthMetres(i);
                if (vacuum < lo || vacuum > hi || inGroup[i]) {
                    continue;
                }
                double sigma = lines.vacuumWavelengthUncertaintyMetres(i).orElse(0);
                double strength = expectedStrength(lines, i);
                HydrogenLikeModel model = lines.species(i).isHydrogenLike() ? models.apply(lines.species(i)) : null;
                String label = label(lines, i, model != null);
                if (lines.isMultiplet(i)) {
                    LineSet parts = lines.components(i);
                    double[] components = new double[parts.size()];
                    double[] weights = new double[parts.size()];
                    for (int k = 0; k < parts.size(); k++) {
                        components[k] = parts.vacuumWavelengthMetres(k);
                        weights[k] = expectedStrength(parts, k);
                    }
                    if (model != null && lines.upperN(i).isPresent() && lines.lowerN(i).isPresent()
                            && lines.upperEnergyJoules(i).isPresent() && lines.upperWeight(i).isPresent()
                            && lines.einsteinA(i).isPresent()) {
                        multiplets.put(key(lines.species(i), label), new Multiplet(model, lines.upperN(i).getAsInt(),
                                lines.lowerN(i).getAsInt(), lines.upperEnergyJoules(i).getAsDouble(),
                                lines.upperWeight(i).getAsInt(), lines.einsteinA(i).getAsDouble(),
                                lines.frequencyHz(i)));
                    }
                    // A multiplet blends its fine-structure components: it may explain each of
                    // them where the instrument resolves them, within their spread.
                    b.addBlend(lines.species(i), vacuum, sigma, strength, label, components, weights);
                } else {
                    b.add(lines.species(i), vacuum, sigma, strength, label);
                    if (lines.upperEnergyJoules(i).isPresent() && lines.upperWeight(i).isPresent()
                            && lines.einsteinA(i).isPresent()) {
                        emissions.put(key(lines.species(i), label), new Emission(
                                lines.upperEnergyJoules(i).getAsDouble(),
                                lines.upperWeight(i).getAsInt() * lines.einsteinA(i).getAsDouble()));
                    }
                }
                count++;
            }
        }

        /**
         * The fine-structure components of one LS multiplet of a level list (labels that differ
         * only in J, e.g. {@code 1s3d 3D3 - 1s2p 3P2} and {@code 1s3d 3D2 - 1s2p 3P2}) that lie
         * within {@link #TERM_BLEND_RELATIVE} of one another in wavelength are entered as one blend,
         * as a one-electron ion's n -&gt; n' multiplet is: at the strength-weighted centroid, with
         * their wavelengths, the summed strength and the label of the two terms
         * ({@code 1s3d 3D - 1s2p 3P}). A peak then matches the multiplet instead of being called
         * ambiguous between components no spectrometer of that resolution separates, and where a
         * spectrometer does separate them (as the J = 0 component of a 3D - 3P multiplet at
         * resolving powers above about 20 000), each peak matches the multiplet at the group of
         * components nearest to it ({@link LineCatalog#nearestPosition}). Components further apart stay
         * separate lines.
         *
         * @return which lines were entered in a blend
         */
        private boolean[] addTermBlends(LineCatalog.Builder b, LineSet lines) {
            boolean[] grouped = new boolean[lines.size()];
            Map<String, List<Integer>> byTerms = new java.util.LinkedHashMap<>();
            for (int i = 0; i < lines.size(); i++) {
                double vacuum = lines.vacuumWavelengthMetres(i);
                // one-electron ions have their own multiplets (and components when asked for)
                if (vacuum < lo || vacuum > hi || lines.isMultiplet(i) || lines.species(i).isHydrogenLike()
                        || lines.upperLabel(i).isEmpty() || lines.lowerLabel(i).isEmpty()) {
                    continue;
                }
                String upper = term(lines.upperLabel(i).get());
                String lower = term(lines.lowerLabel(i).get());
                if (upper != null && lower != null) {
                    byTerms.computeIfAbsent(lines.species(i).notation() + "|" + upper + " - " + lower,
                            k -> new ArrayList<>()).add(i);
                }
            }
            for (Map.Entry<String, List<Integer>> entry : byTerms.entrySet()) {
                List<Integer> members = new ArrayList<>(entry.getValue());
                members.sort(java.util.Comparator.comparingDouble(lines::vacuumWavelengthMetres));
                int start = 0;
                for (int k = 1; k <= members.size(); k++) {
                    boolean gap = k == members.size() || lines.vacuumWavelengthMetres(members.get(k))
                            - lines.vacuumWavelengthMetres(members.get(k - 1))
                            > TERM_BLEND_RELATIVE * lines.vacuumWavelengthMetres(members.get(k));
                    if (gap) {
                        if (k - start >= 2) {
                            addBlendOf(b, lines, members.subList(start, k), entry.getKey().split("\\|", 2)[1]);
                            for (int m = start; m < k; m++) {
                                grouped[members.get(m)] = true;
                            }
                        }
                        start = k;
                    }
                }
            }
            return grouped;
        }

        private void addBlendOf(LineCatalog.Builder b, LineSet lines, List<Integer> members, String label) {
            double weight = 0;
            double weighted = 0;
            double sigma = 0;
            double[] components = new double[members.size()];
            double[] weights = new double[members.size()];
            boolean allKnown = true;
            double total = 0;
            for (int k = 0; k < components.length; k++) {
                int i = members.get(k);
                double vacuum = lines.vacuumWavelengthMetres(i);
                components[k] = vacuum;
                double strength = expectedStrength(lines, i);
                allKnown &= !Double.isNaN(strength);
                double w = Double.isNaN(strength) ? 1 : strength;
                weights[k] = w;
                total += Double.isNaN(strength) ? 0 : strength;
                weight += w;
                weighted += w * vacuum;
                sigma = Math.max(sigma, lines.vacuumWavelengthUncertaintyMetres(i).orElse(0));
            }
            String name = label + " (" + members.size() + " components)";
            b.addBlend(lines.species(members.get(0)), weighted / weight, sigma, allKnown ? total : Double.NaN, name,
                    components, weights);
            double gA = 0;
            double energy = 0;
            for (int i : members) {
                if (lines.upperEnergyJoules(i).isEmpty() || lines.upperWeight(i).isEmpty()
                        || lines.einsteinA(i).isEmpty()) {
                    gA = Double.NaN;
                    break;
                }
                double each = lines.upperWeight(i).getAsInt() * lines.einsteinA(i).getAsDouble();
                gA += each;
                energy += each * lines.upperEnergyJoules(i).getAsDouble();
            }
            if (gA > 0) {
                emissions.put(key(lines.species(members.get(0)), name), new Emission(energy / gA, gA));
            }
            count++;
        }

        /**
         * A line's expected strength: its relative intensity, else g_upper A (or A alone), else NaN;
         * times exp(-E_upper / kT) where an excitation temperature is set and E_upper is known.
         */
        private double expectedStrength(LineSet lines, int i) {
            double strength = lines.relativeIntensity(i).orElse(Double.NaN);
            if (Double.isNaN(strength) && lines.einsteinA(i).isPresent()) {
                strength = lines.upperWeight(i).orElse(1) * lines.einsteinA(i).getAsDouble();
            }
            if (!Double.isNaN(excitationTemperature) && lines.upperEnergyJoules(i).isPresent()) {
                strength *= Math.exp(-lines.upperEnergyJoules(i).getAsDouble()
                        / (PhysicalConstants.K * excitationTemperature));
            }
            return strength;
        }

        /** A level label's term without its J ({@code 1s3d 3D3} gives {@code 1s3d 3D}), or null. */
        private static String term(String label) {
            java.util.regex.Matcher m = TERM_AND_J.matcher(label.strip());
            return m.matches() ? m.group(1) : null;
        }

        /**
         * A line's catalogue label: a multiplet's name; else {@code "upper - lower"} where both
         * levels are named (a one-electron component followed by its series name, e.g.
         * {@code 3p3/2 - 2s1/2 H-alpha}); else the list's id and the position as listed; else the
         * species and name.
         */
        private static String label(LineSet lines, int i, boolean seriesName) {
            if (lines.isMultiplet(i)) {
                return lines.name(i);
            }
            if (lines.upperLabel(i).isPresent() && lines.lowerLabel(i).isPresent()) {
                return lines.upperLabel(i).get() + " - " + lines.lowerLabel(i).get()
                        + (seriesName ? " " + lines.name(i) : "");
            }
            return lines.source(i).dataSet().map(set -> set.id()).orElse(lines.species(i).notation()) + " "
                    + lines.name(i);
        }
    }
}
