package org.ritzwerk.engine.plasma;

import java.util.HashSet;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.medium.Medium;

/**
 * The lines of two isotopes of one element seen together (H I and D I, say): where a transition's
 * two isotope lines are resolved, the flux ratio of the pair gives the isotope ratio and the
 * separation of the pair the isotope shift; where they lie closer than the instrument resolves,
 * the pair shows as one peak at the flux-weighted mean position
 * <pre>  lambda_blend = (lambda_light + r lambda_heavy) / (1 + r)</pre>
 * with r the heavy isotope's flux per light isotope's flux (the centroid of two profiles of one
 * shape; common practice). {@link #merge} replaces such pairs in a candidate catalog by one line
 * at that position, so that an identification explains the unresolved peaks.
 *
 * <p>Lines of the two isotopes are paired by their label: a catalog from
 * {@link org.ritzwerk.engine.identify.Candidates} labels the multiplets of every one-electron
 * species alike ("Balmer beta"), so the same label marks the same transition.
 *
 * <p>Configured with {@code withX}; immutable and thread-safe.
 */
public final class IsotopePairs {

    /**
     * A pair whose two lines were both matched to peaks.
     *
     * @param lightPeak          the light isotope's peak (index in the identification)
     * @param heavyPeak          the heavy isotope's peak
     * @param heavyPerLight      the heavy line's flux over the light line's, the isotope ratio of
     *                           the emitting atoms where both lines have the same A and upper
     *                           population per atom (to the reduced-mass correction)
     * @param heavyPerLightSigma its standard uncertainty from the flux uncertainties (first-order
     *                           propagation, fluxes independent); NaN when they were not given
     * @param measuredShift      light peak's position minus heavy peak's, in the positions' unit
     * @param predictedShift     the same for the catalog's lines, nm in the given medium
     */
    public record Resolved(int lightPeak, int heavyPeak, double heavyPerLight, double heavyPerLightSigma,
            double measuredShift, double predictedShift) {
    }

    /**
     * A catalog with the unresolved pairs merged.
     *
     * @param lines  the catalog: a merged pair keeps the light isotope's species and label
     * @param merged the labels of the merged pairs
     * @param light  the light isotope
     * @param heavy  the heavy isotope
     */
    public record Merged(LineCatalog lines, Set<String> merged, Species light, Species heavy) {

        /**
         * Copies the set.
         *
         * @param lines  the catalog: a merged pair keeps the light isotope's species and label
         * @param merged the labels of the merged pairs
         * @param light  the light isotope
         * @param heavy  the heavy isotope
         */
        public Merged {
            merged = Set.copyOf(merged);
        }

        /**
         * @param catalog this catalog, or one {@link LineCatalog#shifted shifted} or
         *                {@link LineCatalog#offset offset} from it
         * @param j       a line of it
         * @return whether the line is a merged pair
         */
        public boolean isPair(LineCatalog catalog, int j) {
            return catalog.species(j).equals(light) && merged.contains(catalog.label(j));
        }

        /**
         * @param catalog this catalog, or one shifted or offset from it
         * @param j       a line of it
         * @return the line's name: "H I+D I Balmer beta" for a merged pair, else species and label
         */
        public String name(LineCatalog catalog, int j) {
            String species = isPair(catalog, j) ? light.notation() + "+" + heavy.notation()
                    : catalog.species(j).notation();
            return catalog.label(j) == null ? species : species + " " + catalog.label(j);
        }
    }

    private final Species light;
    private final Species heavy;
    private final double ratio;
    private final double within;
    private final Set<String> resolved;

    private IsotopePairs(Species light, Species heavy, double ratio, double within, Set<String> resolved) {
        this.light = light;
        this.heavy = heavy;
        this.ratio = ratio;
        this.within = within;
        this.resolved = Set.copyOf(resolved);
    }

    /**
     * @param light the light isotope (H I)
     * @param heavy the heavy isotope (D I); not the light one
     * @return pairs with isotope ratio 0 and no blending
     */
    public static IsotopePairs of(Species light, Species heavy) {
        Objects.requireNonNull(light, "light");
        Objects.requireNonNull(heavy, "heavy");
        if (light.equals(heavy)) {
            throw new IllegalArgumentException("an isotope pair needs two species, got " + light.notation() + " twice");
        }
        return new IsotopePairs(light, heavy, 0, 0, Set.of());
    }

    /**
     * @param heavyPerLight the heavy isotope's line flux per light isotope's, finite and &gt;= 0
     * @return pairs with that ratio
     */
    public IsotopePairs withRatio(double heavyPerLight) {
        if (!(heavyPerLight >= 0) || Double.isInfinite(heavyPerLight)) {
            throw new IllegalArgumentException("the isotope ratio must be finite and >= 0, got " + heavyPerLight);
        }
        return new IsotopePairs(light, heavy, heavyPerLight, within, resolved);
    }

    /**
     * @param metres pairs closer than this (vacuum wavelength) are merged; finite and &gt;= 0
     *               (about the instrument's FWHM; 0 merges none)
     * @return pairs with that limit
     */
    public IsotopePairs withBlendWithin(double metres) {
        if (!(metres >= 0) || Double.isInfinite(metres)) {
            throw new IllegalArgumentException("the blend width must be a finite width >= 0 m, got " + metres);
        }
        return new IsotopePairs(light, heavy, ratio, metres, resolved);
    }

    /**
     * @param label a transition seen resolved (the pair whose ratio was measured, say); it is never
     *              merged, whatever the blend width
     * @return pairs that keep that transition's two lines apart
     */
    public IsotopePairs withResolved(String label) {
        Objects.requireNonNull(label, "label");
        Set<String> labels = new HashSet<>(resolved);
        labels.add(label);
        return new IsotopePairs(light, heavy, ratio, within, labels);
    }

    /**
     * @param lightMetres   the light isotope's line, any wavelength unit
     * @param heavyMetres   the heavy isotope's line, same unit
     * @param heavyPerLight the flux ratio, &gt;= 0
     * @return the flux-weighted mean position (lambda_l + r lambda_h) / (1 + r)
     */
    public static double blendWavelength(double lightMetres, double heavyMetres, double heavyPerLight) {
        return (lightMetres + heavyPerLight * heavyMetres) / (1 + heavyPerLight);
    }

    /**
     * Replaces each pair of lines of the two isotopes with the same label that lie closer than
     * {@link #withBlendWithin the blend width} by one line at {@link #blendWavelength}: the light
     * isotope's species, label, strength and blend flag, the larger of the two uncertainties.
     * Every other line is kept as it is. With ratio 0 or blend width 0 nothing is merged, nor is
     * a transition declared {@link #withResolved resolved}.
     *
     * @param lines candidate lines
     * @return the catalog with the pairs merged
     */
    public Merged merge(LineCatalog lines) {
        LineCatalog.Builder builder = LineCatalog.builder();
        Set<String> merged = new HashSet<>();
        Set<Integer> dropped = new HashSet<>();
        for (int j = 0; j < lines.size(); j++) {
            int h = ratio > 0 && within > 0 && lines.label(j) != null && !resolved.contains(lines.label(j))
                    && lines.species(j).equals(light)
                    ? partner(lines, j) : -1;
            if (h >= 0 && Math.abs(lines.wavelength(h) - lines.wavelength(j)) < within) {
                merged.add(lines.label(j));
                dropped.add(h);
                add(builder, lines, j, blendWavelength(lines.wavelength(j), lines.wavelength(h), ratio),
                        Math.max(lines.sigma(j), lines.sigma(h)));
            }
        }
        for (int j = 0; j < lines.size(); j++) {
            boolean isMerged = lines.species(j).equals(light) && merged.contains(lines.label(j));
            if (!isMerged && !dropped.contains(j)) {
                add(builder, lines, j, lines.wavelength(j), lines.sigma(j));
            }
        }
        return new Merged(builder.build(), merged, light, heavy);
    }

    /**
     * Finds the pair of the given label among the matched peaks.
     *
     * @param identification the peaks' identification
     * @param lines          the catalog it matched against (as shifted)
     * @param label          the transition, e.g. "Balmer alpha"
     * @param positions      the peaks' positions in nm of {@code medium}
     * @param fluxes         the peaks' fluxes, positive
     * @param fluxSigmas     their standard uncertainties, or null
     * @param medium         the positions' medium, for the predicted shift
     * @return the resolved pair, or empty when either line was not matched
     */
    public Optional<Resolved> resolved(Identification identification, LineCatalog lines, String label,
            double[] positions, double[] fluxes, double[] fluxSigmas, Medium medium) {
        Objects.requireNonNull(medium, "medium");
        int l = matched(identification, lines, light, label);
        int h = matched(identification, lines, heavy, label);
        if (l < 0 || h < 0) {
            return Optional.empty();
        }
        if (!(fluxes[l] > 0) || !(fluxes[h] > 0)) {
            throw new IllegalArgumentException("the fluxes of the " + label + " peaks must be positive, got "
                    + fluxes[l] + " and " + fluxes[h]);
        }
        double r = fluxes[h] / fluxes[l];
        double rSigma = fluxSigmas == null ? Double.NaN
                : r * Math.hypot(fluxSigmas[h] / fluxes[h], fluxSigmas[l] / fluxes[l]);
        int jl = identification.line(l);
        int jh = identification.line(h);
        double predicted = (medium.fromVacuum(lines.wavelength(jl)) - medium.fromVacuum(lines.wavelength(jh))) * 1e9;
        return Optional.of(new Resolved(l, h, r, rSigma, positions[l] - positions[h], predicted));
    }

    private static int matched(Identification identification, LineCatalog lines, Species species, String label) {
        for (int k = 0; k < identification.peaks().size(); k++) {
            int j = identification.line(k);
            if (identification.status(k) == Identification.MATCHED && j >= 0 && lines.species(j).equals(species)
                    && label.equals(lines.label(j))) {
                return k;
            }
        }
        return -1;
    }

    private int partner(LineCatalog lines, int j) {
        for (int h = 0; h < lines.size(); h++) {
            if (lines.species(h).equals(heavy) && lines.label(j).equals(lines.label(h))) {
                return h;
            }
        }
        return -1;
    }

    private static void add(LineCatalog.Builder builder, LineCatalog lines, int j, double at, double sigma) {
        if (lines.isBlend(j)) {
            builder.addBlend(lines.species(j), at, sigma, lines.strength(j), lines.label(j));
        } else {
            builder.add(lines.species(j), at, sigma, lines.strength(j), lines.label(j));
        }
    }
}
