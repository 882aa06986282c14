package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.function.IntToDoubleFunction;
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
 * intensity for a line counts that line as intensity 1. A line that the medium's model cannot
 * take (in air, below 200 nm or beyond 2500 nm in vacuum, where no spectrometer working in air
 * sees it: the far-ultraviolet resonance lines and the far-infrared lines between high levels of
 * a set computed from levels) is left out and counted in {@link #outsideMedium()}, so that a
 * caller can say so.
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
    /** Lines of the lists left out because the medium's model cannot take their wavelength. */
    private final int outsideMedium;
    /** Lines left out of a lamp ranked by rate ({@link #ofRates}) because they carry none. */
    private final int withoutRate;
    /** Lines left out because an earlier list has the same species' line at the same wavelength. */
    private final int duplicates;

    private LampSet(LampLines lines, List<String> labels, Species[] species, List<String> setIds,
            StrengthClass[] strength, int outsideMedium, int withoutRate) {
        this(lines, labels, species, setIds, strength, outsideMedium, withoutRate, 0);
    }

    private LampSet(LampLines lines, List<String> labels, Species[] species, List<String> setIds,
            StrengthClass[] strength, int outsideMedium, int withoutRate, int duplicates) {
        this.lines = lines;
        this.labels = labels;
        this.species = species;
        this.setIds = setIds;
        this.strength = strength;
        this.outsideMedium = outsideMedium;
        this.withoutRate = withoutRate;
        this.duplicates = duplicates;
    }

    /**
     * @param lists  the lamp's line lists, at least one, each with a wavelength-like unit
     * @param medium the medium the calibration's wavelengths are to be in (air for the usual lamp tables)
     * @return the lines of all lists together, in list order; a line of a later list within 1e-4 nm
     *         of an earlier list's line of the same species is used once ({@link #duplicatesMerged()})
     * @throws IllegalArgumentException when no list or no line is given, a list (by its id) is given
     *         twice, no line lies within the medium's range, or a position cannot be converted (the
     *         message names the set)
     */
    public static LampSet of(List<LineList> lists, Medium medium) {
        Objects.requireNonNull(lists, "lists");
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
        int duplicates = 0;
        MediumException firstOutside = null;
        for (LineList list : lists) {
            if (ids.contains(list.info().id())) {
                throw new IllegalArgumentException("the line list " + list.info().id() + " is given twice; its lines "
                        + "would each have a twin no peak could choose between");
            }
            ids.add(list.info().id());
            double[] converted = new double[list.size()];
            MediumException outside = convert(list, medium, converted);
            firstOutside = firstOutside == null ? outside : firstOutside;
            int before = k;
            for (int i = 0; i < converted.length; i++) {
                if (Double.isNaN(converted[i])) {
                    continue;
                }
                if (sameLineEarlier(nm, species, before, converted[i], list.species(i))) {
                    duplicates++; // another list's line of the same species at this wavelength: kept once
                    continue;
                }
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
                k++;
            }
        }
        if (total == 0) {
            throw new IllegalArgumentException("the lamp's line lists " + ids + " hold no lines");
        }
        if (k == 0) {
            throw new IllegalArgumentException("no line of the lamp's line lists " + ids + " lies within the range of "
                    + medium.label() + " wavelengths (" + firstOutside.getMessage() + ")", firstOutside);
        }
        return new LampSet(LampLines.of(Arrays.copyOf(nm, k), Arrays.copyOf(intensity, k),
                allSigmas ? Arrays.copyOf(sigma, k) : null, medium), List.copyOf(labels), Arrays.copyOf(species, k),
                List.copyOf(ids), Arrays.copyOf(strength, k), total - k - duplicates, 0, duplicates);
    }

    /** Whether one of the first {@code count} lines is of this species within 1e-4 nm of this wavelength. */
    private static boolean sameLineEarlier(double[] nm, Species[] species, int count, double wavelength,
            Species of) {
        for (int j = 0; j < count; j++) {
            if (Math.abs(nm[j] - wavelength) <= 1e-4 && of.equals(species[j])) {
                return true;
            }
        }
        return false;
    }

    /**
     * Converts a list's positions to nm in {@code medium}, the whole list at once; when the
     * medium's model refuses some line, line by line (the same arithmetic per element), with NaN
     * for each line it refuses.
     *
     * @return the first refusal, or null when every line converted
     */
    private static MediumException convert(LineList list, Medium medium, double[] out) {
        try {
            double[] all = SpectralArrays.wavelengths(list, Unit.NANOMETRE, medium);
            System.arraycopy(all, 0, out, 0, out.length);
            return null;
        } catch (MediumException e) {
            MediumException first = null;
            double[] one = new double[1];
            for (int i = 0; i < out.length; i++) {
                one[0] = list.position(i);
                try {
                    SpectralArrays.convert(one, list.unit(), list.medium(), Unit.NANOMETRE, medium, one);
                    out[i] = one[0];
                } catch (MediumException refused) {
                    out[i] = Double.NaN;
                    first = first == null ? refused : first;
                }
            }
            return first;
        }
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
     * @throws IllegalArgumentException when the set is empty or no line lies within the medium's
     *         range (lines outside it are left out and counted in {@link #outsideMedium()})
     */
    public static LampSet of(LineSet lines, Medium medium) {
        Objects.requireNonNull(lines, "lines");
        return of(lines, medium, i -> lines.relativeIntensity(i).orElse(1), 0);
    }

    /**
     * A lamp from lines that carry transition rates but no measured intensities, such as the Ritz
     * lines of a level list with the A values of its companion list: each line's relative
     * intensity is g_u A_ul, the photon rate from equally populated upper states (common
     * practice for ranking the lines of a hot discharge; a real lamp's ratios depend on its gas
     * pressure and current, so check them against your own lamp). Lines with no A or no upper
     * weight (intercombination lines the rate model leaves out) are left out and counted in
     * {@link #withoutRate()}; lines outside the medium's range as in {@link #of(LineSet, Medium)}.
     *
     * @param lines  the lines, at least one with an A value and an upper weight
     * @param medium the medium the calibration's wavelengths are to be in
     * @return the lamp set, in the set's order
     * @throws IllegalArgumentException when no line has a rate, or none of those lies within the
     *         medium's range
     */
    public static LampSet ofRates(LineSet lines, Medium medium) {
        Objects.requireNonNull(lines, "lines");
        LineSet rated = lines.filter(i -> rated(lines, i));
        if (rated.isEmpty()) {
            throw new IllegalArgumentException("no line of the " + lines.size() + " lines has an Einstein A and an upper"
                    + " statistical weight, which a lamp without intensities needs");
        }
        return of(rated, medium, i -> rated.upperWeight(i).getAsInt() * rated.einsteinA(i).getAsDouble(),
                lines.size() - rated.size());
    }

    /**
     * @param lines lines
     * @return whether {@link #ofRates} can rank them: at least one has an A value and an upper weight
     */
    public static boolean anyRated(LineSet lines) {
        Objects.requireNonNull(lines, "lines");
        for (int i = 0; i < lines.size(); i++) {
            if (rated(lines, i)) {
                return true;
            }
        }
        return false;
    }

    private static boolean rated(LineSet lines, int i) {
        return lines.einsteinA(i).isPresent() && lines.upperWeight(i).isPresent();
    }

    private static LampSet of(LineSet lines, Medium medium, IntToDoubleFunction intensityOf, int withoutRate) {
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
        int k = 0;
        MediumException firstOutside = null;
        for (int i = 0; i < n; i++) {
            double vacuum = lines.vacuumWavelengthMetres(i);
            LineSet.Source source = lines.source(i);
            String id = source.dataSet().map(DataSetInfo::id).orElse(source.model());
            if (!ids.contains(id)) {
                ids.add(id);
            }
            try {
                nm[k] = medium.fromVacuum(vacuum) * 1e9;
            } catch (MediumException e) {
                firstOutside = firstOutside == null ? e : firstOutside;
                continue;
            }
            labels.add(lines.species(i).notation() + " " + lines.name(i));
            intensity[k] = intensityOf.applyAsDouble(i);
            allSigmas &= lines.vacuumWavelengthUncertaintyMetres(i).isPresent();
            sigma[k] = lines.vacuumWavelengthUncertaintyMetres(i).orElse(0) * medium.slopeFromVacuum(vacuum) * 1e9;
            species[k] = lines.species(i);
            strength[k] = lines.strengthClass(i).orElse(null);
            k++;
        }
        if (k == 0) {
            throw new IllegalArgumentException("no line of the lamp's line set " + ids + " lies within the range of "
                    + medium.label() + " wavelengths (" + firstOutside.getMessage() + ")", firstOutside);
        }
        return new LampSet(LampLines.of(Arrays.copyOf(nm, k), Arrays.copyOf(intensity, k),
                allSigmas ? Arrays.copyOf(sigma, k) : null, medium), List.copyOf(labels), Arrays.copyOf(species, k),
                List.copyOf(ids), Arrays.copyOf(strength, k), n - k, withoutRate);
    }

    /**
     * The lines as a spectrometer of resolving power R sees them: lines of one species closer than
     * half the instrument's FWHM (lambda / 2R, from the first line of a group) become one blend at
     * their intensity-weighted centroid, with the summed intensity, the weighted uncertainty
     * (sqrt(sum (w_i sigma_i)^2) / sum w_i) widened by the weighted spread of the components, the
     * strongest class among them, and the label of the strongest component followed by
     * {@code (+k blended)}. For sets computed from levels, which list every fine-structure
     * component (He I 587.6 nm is six), so that the matcher finds one line where the spectrum
     * shows one peak. Lines come out in rising wavelength.
     *
     * @param resolvingPower lambda / FWHM of the spectrometer, 1 to 1e7
     * @return the blended set (this set's counts of lines left out are kept)
     */
    public LampSet blendedAt(double resolvingPower) {
        if (!(resolvingPower >= 1 && resolvingPower <= 1e7)) {
            throw new IllegalArgumentException("resolving power must be 1 to 1e7, got " + resolvingPower);
        }
        int n = size();
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(lines.wavelength(a), lines.wavelength(b)));
        double[] nm = new double[n];
        double[] intensity = new double[n];
        double[] sigma = new double[n];
        List<String> outLabels = new ArrayList<>(n);
        Species[] outSpecies = new Species[n];
        StrengthClass[] outStrength = new StrengthClass[n];
        int k = 0;
        for (int start = 0; start < n;) {
            int first = order[start];
            double reach = lines.wavelength(first) * (1 + 0.5 / resolvingPower);
            int end = start + 1;
            while (end < n && lines.wavelength(order[end]) < reach && species[order[end]].equals(species[first])) {
                end++;
            }
            double weight = 0;
            double centroid = 0;
            int strongest = first;
            StrengthClass strength = this.strength[first];
            for (int g = start; g < end; g++) {
                int i = order[g];
                // Equal weights where the lines carry no intensity (all zero): a plain mean.
                double w = lines.intensity(i) > 0 ? lines.intensity(i) : 1e-300;
                weight += w;
                centroid += w * lines.wavelength(i);
                strongest = lines.intensity(i) > lines.intensity(strongest) ? i : strongest;
                StrengthClass c = this.strength[i];
                strength = strength == null || (c != null && c.ordinal() < strength.ordinal()) ? c : strength;
            }
            centroid /= weight;
            double variance = 0;
            double spread = 0;
            for (int g = start; g < end; g++) {
                int i = order[g];
                double w = (lines.intensity(i) > 0 ? lines.intensity(i) : 1e-300) / weight;
                variance += w * w * lines.sigma(i) * lines.sigma(i);
                double d = lines.wavelength(i) - centroid;
                spread += w * d * d;
            }
            nm[k] = centroid;
            double summed = 0;
            for (int g = start; g < end; g++) {
                summed += lines.intensity(order[g]);
            }
            intensity[k] = summed;
            sigma[k] = Math.sqrt(variance + spread);
            outLabels.add(end - start == 1 ? labels.get(first)
                    : labels.get(strongest) + " (+" + (end - start - 1) + " blended)");
            outSpecies[k] = species[first];
            outStrength[k] = strength;
            k++;
            start = end;
        }
        return new LampSet(LampLines.of(Arrays.copyOf(nm, k), Arrays.copyOf(intensity, k),
                lines.sigmasGiven() ? Arrays.copyOf(sigma, k) : null, lines.medium()), List.copyOf(outLabels),
                Arrays.copyOf(outSpecies, k), setIds, Arrays.copyOf(outStrength, k), outsideMedium, withoutRate,
                duplicates);
    }

    /**
     * This lamp's lines followed by another's (for a lamp of several gases whose sets were made
     * differently: a handbook list and Ritz lines ranked by rate). Uncertainties are kept only when
     * both give them; the counts of lines left out add up.
     *
     * @param other lines in the same medium
     * @return both together, this lamp's first
     * @throws IllegalArgumentException when the media differ
     */
    public LampSet plus(LampSet other) {
        Objects.requireNonNull(other, "other");
        if (!lines.medium().equals(other.lines.medium())) {
            throw new IllegalArgumentException("lamp sets in different media: " + lines.medium().label() + " and "
                    + other.lines.medium().label());
        }
        int n = size();
        int m = other.size();
        double[] nm = new double[n + m];
        double[] intensity = new double[n + m];
        double[] sigma = new double[n + m];
        for (int i = 0; i < n + m; i++) {
            LampLines from = i < n ? lines : other.lines;
            int j = i < n ? i : i - n;
            nm[i] = from.wavelength(j);
            intensity[i] = from.intensity(j);
            sigma[i] = from.sigma(j);
        }
        boolean sigmas = lines.sigmasGiven() && other.lines.sigmasGiven();
        List<String> allLabels = new ArrayList<>(labels);
        allLabels.addAll(other.labels);
        Species[] allSpecies = Arrays.copyOf(species, n + m);
        System.arraycopy(other.species, 0, allSpecies, n, m);
        StrengthClass[] allStrength = Arrays.copyOf(strength, n + m);
        System.arraycopy(other.strength, 0, allStrength, n, m);
        List<String> ids = new ArrayList<>(setIds);
        other.setIds.stream().filter(id -> !ids.contains(id)).forEach(ids::add);
        return new LampSet(LampLines.of(nm, intensity, sigmas ? sigma : null, lines.medium()), List.copyOf(allLabels),
                allSpecies, List.copyOf(ids), allStrength, outsideMedium + other.outsideMedium,
                withoutRate + other.withoutRate, duplicates + other.duplicates);
    }

    /**
     * @return how many lines have no strength class (a lamp from a level list, or a line list without the
     *         strength column): {@link #atLeast} keeps them whatever the class asked for
     */
    public int unclassifiedLines() {
        int n = 0;
        for (StrengthClass s : strength) {
            n += s == null ? 1 : 0;
        }
        return n;
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
                setIds, keptStrength, outsideMedium, withoutRate, duplicates);
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

    /**
     * @return how many lines of later lists were left out because an earlier list has a line of the
     *         same species within 1e-4 nm (a user's list repeating built-in lines): kept once, so
     *         that no peak has two lines it cannot choose between
     */
    public int duplicatesMerged() {
        return duplicates;
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

    /**
     * @return how many lines of the lists were left out because the medium's model cannot take
     *         their wavelength (in air: below 200 nm or beyond 2500 nm in vacuum); 0 in vacuum
     */
    public int outsideMedium() {
        return outsideMedium;
    }

    /** @return how many lines {@link #ofRates} left out for want of an A value or an upper weight */
    public int withoutRate() {
        return withoutRate;
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
