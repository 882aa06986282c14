package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.medium.Medium;
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

    private LampSet(LampLines lines, List<String> labels, Species[] species, List<String> setIds) {
        this.lines = lines;
        this.labels = labels;
        this.species = species;
        this.setIds = setIds;
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
                labels.add(list.species(i).notation() + " " + listed + " " + list.unit().symbol()
                        + (list.medium() == null ? "" : " " + list.medium().label()));
            }
        }
        if (total == 0) {
            throw new IllegalArgumentException("the lamp's line lists " + ids + " hold no lines");
        }
        return new LampSet(LampLines.of(nm, intensity, allSigmas ? sigma : null, medium), List.copyOf(labels),
                species, List.copyOf(ids));
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
