package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.Unit;

/**
 * The reference lines of a calibration lamp, assembled from one or more line lists (built-in lamp
 * sets or a user's own): wavelengths in nm in one medium, relative intensities, standard
 * uncertainties where every list gives them, and for each line its species and a label naming
 * the line as listed ({@code "Ne I 640.2248 nm air"}).
 *
 * <p>Positions are converted from each list's unit and medium to nm in the requested medium with
 * {@link SpectralArrays#convert}; an uncertainty is scaled by the same factor. A line list with no
 * intensity for a line counts that line as intensity 1.
 *
 * <p>Immutable and thread-safe.
 */
public final class LampSet {

    private final LampLines lines;
    private final List<String> labels;
    private final Species[] species;
    private final List<String> setIds;
    /** Per line, its list's strength class, or null when the list gives none. */
    private final StrengthClass[] strength;

    private LampSet(LampLines lines, List<String> labels, Species[] species, List<String> setIds,
            StrengthClass[] strength) {
        this.lines = lines;
        this.labels = labels;
        this.species = species;
        this.setIds = setIds;
        this.strength = strength;
    }

    /**
     * @param lists  the lamp's line lists, at least one, each with a wavelength-like unit
     * @param medium the medium the calibration's wavelengths are to be in (air for the usual lamp tables)
     * @return the lines of all lists together, in list order
     * @throws IllegalArgumentException when no list or no line is given, or a position cannot be
     *         converted (the message names the set)
     */
    public static LampSet of(List<LineList> lists, Medium medium) {
        Objects.requireNonNull(medium, "medium");
        if (lists.isEmpty()) {
            throw new IllegalArgumentException("a lamp needs at least one line list");
        }
        int total = 0;
        for (LineList list : lists) {
            total += list.size();
        }
        double[] nm = new double[total];
        double[] intensity = new double[total];
        double[] sigma = new double[total];
        boolean allSigmas = true;
        List<String> labels = new ArrayList<>(total);
        Species[] species = new Species[total];
        StrengthClass[] strength = new StrengthClass[total];
        List<String> ids = new ArrayList<>();
        int k = 0;
        for (LineList list : lists) {
            ids.add(list.info().id());
            double[] converted = SpectralArrays.wavelengths(list, Unit.NANOMETRE, medium);
            for (int i = 0; i < converted.length; i++, k++) {
                double listed = list.position(i);
                nm[k] = converted[i];
                intensity[k] = list.intensity(i).orElse(1);
                double u = list.uncertainty(i).orElse(Double.NaN);
                allSigmas &= !Double.isNaN(u);
                sigma[k] = Math.abs(converted[i] / listed) * u;
                species[k] = list.species(i);
                strength[k] = list.strength(i);
                labels.add(list.species(i).notation() + " " + listed + " " + list.unit().symbol()
                        + (list.medium() == null ? "" : " " + list.medium().label()));
            }
        }
        if (total == 0) {
            throw new IllegalArgumentException("the lamp's line lists " + ids + " hold no lines");
        }
        return new LampSet(LampLines.of(nm, intensity, allSigmas ? sigma : null, medium), List.copyOf(labels),
                species, List.copyOf(ids), strength);
    }

    /**
     * The lamp lines of a line set (for instance a {@link org.ritzwerk.engine.lines.LineQuery}
     * over lamp lists): vacuum wavelengths converted to nm in {@code medium}, uncertainties scaled
     * by the medium's slope d lambda_medium / d lambda_vac (first order) where every line has one,
     * relative intensities (1 where none is given), strength classes, and labels
     * {@code "<species> <name>"} ({@code Ne I 640.2248 nm air} for a list line). The set ids are
     * the lines' data set ids, else their source model labels, in order of first appearance.
     *
     * @param lines  the lines, at least one
     * @param medium the medium the calibration's wavelengths are to be in
     * @return the lamp set, in the set's order
     * @throws IllegalArgumentException when the set is empty or a line lies outside the medium's
     *         range (naming the line)
     */
    public static LampSet of(LineSet lines, Medium medium) {
        Objects.requireNonNull(lines, "lines");
        Objects.requireNonNull(medium, "medium");
        int n = lines.size();
        if (n == 0) {
            throw new IllegalArgumentException("the lamp's line set holds no lines");
        }
        double[] nm = new double[n];
        double[] intensity = new double[n];
        double[] sigma = new double[n];
        boolean allSigmas = true;
        List<String> labels = new ArrayList<>(n);
        Species[] species = new Species[n];
        StrengthClass[] strength = new StrengthClass[n];
        List<String> ids = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double vacuum = lines.vacuumWavelengthMetres(i);
            labels.add(lines.species(i).notation() + " " + lines.name(i));
            try {
                nm[i] = medium.fromVacuum(vacuum) * 1e9;
            } catch (MediumException e) {
                throw new IllegalArgumentException("lamp line " + labels.get(i) + ": " + e.getMessage(), e);
            }
            intensity[i] = lines.relativeIntensity(i).orElse(1);
            allSigmas &= lines.vacuumWavelengthUncertaintyMetres(i).isPresent();
            sigma[i] = lines.vacuumWavelengthUncertaintyMetres(i).orElse(0) * medium.slopeFromVacuum(vacuum) * 1e9;
            species[i] = lines.species(i);
            strength[i] = lines.strengthClass(i).orElse(null);
            LineSet.Source source = lines.source(i);
            String id = source.dataSet().map(DataSetInfo::id).orElse(source.model());
            if (!ids.contains(id)) {
                ids.add(id);
            }
        }
        return new LampSet(LampLines.of(nm, intensity, allSigmas ? sigma : null, medium), List.copyOf(labels),
                species, List.copyOf(ids), strength);
    }

    /**
     * The lines whose list classes them at least as strong as {@code weakest} (strong, then
     * medium, then weak), for a lamp whose weak lines are not seen or not wanted. Lines whose list
     * gives no class are kept (nothing says they are weak).
     *
     * @param weakest the weakest class kept
     * @return the selection
     * @throws IllegalArgumentException when no line is left (naming the sets and the class)
     */
    public LampSet atLeast(StrengthClass weakest) {
        Objects.requireNonNull(weakest, "weakest");
        boolean[] keep = new boolean[size()];
        int kept = 0;
        for (int i = 0; i < keep.length; i++) {
            keep[i] = strength[i] == null || strength[i].ordinal() <= weakest.ordinal();
            kept += keep[i] ? 1 : 0;
        }
        if (kept == 0) {
            throw new IllegalArgumentException("no line of the lamp sets " + setIds + " is " + weakest.id()
                    + (weakest == StrengthClass.STRONG ? "" : " or stronger"));
        }
        double[] nm = new double[kept];
        double[] intensity = new double[kept];
        double[] sigma = lines.sigmasGiven() ? new double[kept] : null;
        List<String> keptLabels = new ArrayList<>(kept);
        Species[] keptSpecies = new Species[kept];
        StrengthClass[] keptStrength = new StrengthClass[kept];
        int k = 0;
        for (int i = 0; i < keep.length; i++) {
            if (keep[i]) {
                nm[k] = lines.wavelength(i);
                intensity[k] = lines.intensity(i);
                if (sigma != null) {
                    sigma[k] = lines.sigma(i);
                }
                keptLabels.add(labels.get(i));
                keptSpecies[k] = species[i];
                keptStrength[k] = strength[i];
                k++;
            }
        }
        return new LampSet(LampLines.of(nm, intensity, sigma, lines.medium()), List.copyOf(keptLabels), keptSpecies,
                setIds, keptStrength);
    }

    /**
     * @param i a line index, 0 to {@link #size()} - 1
     * @return the strength class its list gives, or null when none
     */
    public StrengthClass strength(int i) {
        return strength[i];
    }

    /** @return the lines as the matcher and the fit take them */
    public LampLines lines() {
        return lines;
    }

    /** @return the number of lines */
    public int size() {
        return labels.size();
    }

    /**
     * @param i a line index, 0 to {@link #size()} - 1
     * @return the line as listed: species, position, unit and medium of its list
     */
    public String label(int i) {
        return labels.get(i);
    }

    /**
     * @param i a line index, 0 to {@link #size()} - 1
     * @return the species the list gives for the line
     */
    public Species species(int i) {
        return species[i];
    }

    /** @return the ids of the line lists, in order */
    public List<String> setIds() {
        return setIds;
    }

    /** The species of every line, for the identifier (a copy). */
    Species[] speciesArray() {
        return species.clone();
    }

    @Override
    public String toString() {
        return "LampSet" + setIds + " (" + size() + " lines, " + lines.medium().label() + ")";
    }
}
