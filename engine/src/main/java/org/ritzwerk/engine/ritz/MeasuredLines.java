package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * The problem of a level optimisation: measured line wavenumbers with their standard
 * uncertainties and their assignments to an upper and a lower level (by label), and one reference
 * level whose energy is held fixed (usually the ground level at 0). Built with {@link #builder};
 * immutable and thread-safe. Levels are numbered in the order they first appear, the reference
 * first.
 *
 * <p><b>Labels.</b> A label is compared after stripping its ends and turning every internal run of
 * white space into one blank, so {@code "1s2p  3P2"} and {@code "1s2p 3P2"} name one level; that
 * normalised form is the label reported ({@link #levels()}). Nothing else is normalised: case and
 * punctuation still tell levels apart.
 *
 * <p>Refused while building (a {@link RitzException} naming the line): blank labels, a line from a
 * level to itself, a wavenumber or uncertainty that is not finite and positive, and a pair of levels
 * given both ways (one line as A - B, another as B - A: with positive wavenumbers one of them is
 * reversed).
 */
public final class MeasuredLines {

    private static final Pattern WHITE_SPACE = Pattern.compile("\\p{javaWhitespace}+");

    private final String reference;
    private final double referencePerCm;
    private final List<String> levels;
    private final int[] upper;
    private final int[] lower;
    private final double[] wavenumber;
    private final double[] sigma;
    private final String[] name;

    private MeasuredLines(Builder b) {
        this.reference = b.reference;
        this.referencePerCm = b.referencePerCm;
        this.levels = List.copyOf(b.index.keySet());
        int m = b.upper.size();
        upper = new int[m];
        lower = new int[m];
        wavenumber = new double[m];
        sigma = new double[m];
        name = new String[m];
        for (int k = 0; k < m; k++) {
            upper[k] = b.upper.get(k);
            lower[k] = b.lower.get(k);
            wavenumber[k] = b.values.get(k)[0];
            sigma[k] = b.values.get(k)[1];
            name[k] = b.names.get(k);
        }
    }

    /**
     * @param referenceLabel the level held fixed, e.g. the ground level
     * @param perCm          its energy, cm^-1 (0 for the ground level), finite, not negative
     * @return a builder
     */
    public static Builder builder(String referenceLabel, double perCm) {
        return new Builder(referenceLabel, perCm);
    }

    /** @return the reference level's label */
    public String reference() {
        return reference;
    }

    /** @return the reference level's fixed energy, cm^-1 */
    public double referencePerCm() {
        return referencePerCm;
    }

    /** @return the level labels, the reference first, then in order of first appearance */
    public List<String> levels() {
        return levels;
    }

    /**
     * Labels that look like one level typed two ways: equal when letter case and white space are
     * ignored (for example {@code 4s4p 3P1} and {@code 4s4p 3p1}). Each is fitted as a level of its
     * own, as the labels say (case can matter: {@code 3P} and {@code 3p} may name a term and a
     * configuration), so a typo would silently weaken the real level and add a phantom one beside
     * it; the notes name them with the lines that use each.
     *
     * @return one note per group of such labels, in order of first appearance; empty when none
     */
    public List<String> lookAlikeLabelNotes() {
        Map<String, List<Integer>> groups = new LinkedHashMap<>();
        for (int i = 0; i < levels.size(); i++) {
            String key = WHITE_SPACE.matcher(levels.get(i)).replaceAll("").toLowerCase(Locale.ROOT);
            groups.computeIfAbsent(key, k -> new ArrayList<>()).add(i);
        }
        List<String> notes = new ArrayList<>();
        for (List<Integer> group : groups.values()) {
            if (group.size() < 2) {
                continue;
            }
            List<String> parts = new ArrayList<>();
            for (int level : group) {
                List<String> lines = new ArrayList<>();
                for (int k = 0; k < size(); k++) {
                    if (upper[k] == level || lower[k] == level) {
                        lines.add(name[k]);
                    }
                }
                parts.add("'" + levels.get(level) + "' (" + lines.size() + (lines.size() == 1 ? " line: " : " lines: ")
                        + String.join(", ", lines.subList(0, Math.min(3, lines.size())))
                        + (lines.size() > 3 ? ", ..." : "") + ")");
            }
            notes.add("the level labels " + String.join(" and ", parts) + " differ only in letter case or white"
                    + " space, and are fitted as " + group.size() + " levels; if they name one level, give them one"
                    + " label");
        }
        return notes;
    }

    /**
     * @param label a level label
     * @return it as this class compares labels: ends stripped, every internal run of white space one blank
     */
    static String normaliseLabel(String label) {
        return Builder.normalise(label);
    }

    /** @return the number of lines */
    public int size() {
        return wavenumber.length;
    }

    /**
     * @param k line index
     * @return its upper level's index in {@link #levels()}
     */
    public int upper(int k) {
        return upper[k];
    }

    /**
     * @param k line index
     * @return its lower level's index in {@link #levels()}
     */
    public int lower(int k) {
        return lower[k];
    }

    /**
     * @param k line index
     * @return the measured vacuum wavenumber, cm^-1
     */
    public double wavenumberPerCm(int k) {
        return wavenumber[k];
    }

    /**
     * @param k line index
     * @return its standard uncertainty, cm^-1
     */
    public double uncertaintyPerCm(int k) {
        return sigma[k];
    }

    /**
     * @param k line index
     * @return the line's name as given (e.g. where it was read: {@code lines.csv:12})
     */
    public String name(int k) {
        return name[k];
    }

    /** Collects lines; not thread-safe. */
    public static final class Builder {
        private final String reference;
        private final double referencePerCm;
        private final Map<String, Integer> index = new LinkedHashMap<>();
        private final List<Integer> upper = new ArrayList<>();
        private final List<Integer> lower = new ArrayList<>();
        private final List<double[]> values = new ArrayList<>();
        private final List<String> names = new ArrayList<>();
        private final Map<List<String>, String> pairs = new HashMap<>();

        private Builder(String referenceLabel, double perCm) {
            if (referenceLabel == null || referenceLabel.isBlank()) {
                throw new RitzException(RitzException.BAD_ASSIGNMENT, "the reference level's label must not be blank");
            }
            if (!(perCm >= 0) || Double.isInfinite(perCm)) {
                throw new RitzException(RitzException.BAD_VALUE, "the reference level's energy must be finite and not "
                        + "negative cm-1, got " + perCm);
            }
            this.reference = normalise(referenceLabel);
            this.referencePerCm = perCm;
            index.put(reference, 0);
        }

        /**
         * @param upperLabel the upper level's label
         * @param lowerLabel the lower level's label
         * @param perCm      the measured vacuum wavenumber, cm^-1, finite and positive
         * @param sigmaPerCm its standard uncertainty, cm^-1, finite and positive
         * @return this builder
         * @throws RitzException naming the line (its number from 1) and what is wrong
         */
        public Builder add(String upperLabel, String lowerLabel, double perCm, double sigmaPerCm) {
            return add(upperLabel, lowerLabel, perCm, sigmaPerCm, "line " + (values.size() + 1));
        }

        /**
         * @param upperLabel the upper level's label
         * @param lowerLabel the lower level's label
         * @param perCm      the measured vacuum wavenumber, cm^-1, finite and positive
         * @param sigmaPerCm its standard uncertainty, cm^-1, finite and positive
         * @param lineName   the line's name in messages and results (e.g. {@code file.csv:12})
         * @return this builder
         * @throws RitzException naming the line and what is wrong
         */
        public Builder add(String upperLabel, String lowerLabel, double perCm, double sigmaPerCm, String lineName) {
            Objects.requireNonNull(lineName, "lineName");
            if (upperLabel == null || upperLabel.isBlank() || lowerLabel == null || lowerLabel.isBlank()) {
                throw new RitzException(RitzException.BAD_ASSIGNMENT, lineName + ": both level labels are needed");
            }
            String up = normalise(upperLabel);
            String low = normalise(lowerLabel);
            if (up.equals(low)) {
                throw new RitzException(RitzException.BAD_ASSIGNMENT, lineName + ": upper and lower level are the "
                        + "same ('" + up + "')");
            }
            if (!(perCm > 0) || Double.isInfinite(perCm)) {
                throw new RitzException(RitzException.BAD_VALUE, lineName + ": wavenumber must be finite and positive "
                        + "cm-1, got " + perCm);
            }
            if (!(sigmaPerCm > 0) || Double.isInfinite(sigmaPerCm)) {
                throw new RitzException(RitzException.BAD_VALUE, lineName + ": uncertainty must be finite and positive "
                        + "cm-1, got " + sigmaPerCm);
            }
            String reversed = pairs.get(List.of(low, up));
            if (reversed != null) {
                throw new RitzException(RitzException.BAD_ASSIGNMENT, lineName + ": upper '" + up + "' and lower '"
                        + low + "' are the other way round in " + reversed + " (lower '" + up + "', upper '" + low
                        + "'); with positive wavenumbers one of the two is reversed");
            }
            pairs.putIfAbsent(List.of(up, low), lineName);
            upper.add(index.computeIfAbsent(up, k -> index.size()));
            lower.add(index.computeIfAbsent(low, k -> index.size()));
            values.add(new double[] {perCm, sigmaPerCm});
            names.add(lineName);
            return this;
        }

        private static String normalise(String label) {
            return WHITE_SPACE.matcher(label.strip()).replaceAll(" ");
        }

        /** @return the problem */
        public MeasuredLines build() {
            return new MeasuredLines(this);
        }
    }
}
