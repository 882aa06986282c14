package org.ritzwerk.engine.identify;

import java.util.Objects;
import java.util.Optional;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * The identification job: optionally find the Doppler velocity ({@link ShiftSearch#redshift})
 * and then a constant wavelength offset ({@link ShiftSearch#offset}) that explain the most lines,
 * shift the candidate lines by them, and identify every peak with the configured
 * {@link Identifier}. The command line's {@code identify} runs exactly this.
 *
 * <p>Configured with {@code withX} methods that return new searches; immutable, reusable and
 * thread-safe.
 */
public final class IdentificationSearch {

    private final Identifier identifier;
    private final double maxSpeed;
    private final double maxOffset;

    private IdentificationSearch(Identifier identifier, double maxSpeed, double maxOffset) {
        this.identifier = Objects.requireNonNull(identifier, "identifier");
        this.maxSpeed = maxSpeed;
        this.maxOffset = maxOffset;
    }

    /**
     * @param identifier the identifier (tolerance, cost weights)
     * @return a search that neither shifts nor offsets the lines
     */
    public static IdentificationSearch of(Identifier identifier) {
        return new IdentificationSearch(identifier, Double.NaN, Double.NaN);
    }

    /**
     * @param metresPerSecond the largest |v| to search, m/s; positive, below c / 10
     * @return a search that first finds the Doppler velocity
     */
    public IdentificationSearch withVelocitySearch(double metresPerSecond) {
        if (!(metresPerSecond > 0) || metresPerSecond >= PhysicalConstants.C / 10) {
            throw new IllegalArgumentException("the velocity search range must be positive and below c/10, got "
                    + metresPerSecond / 1e3 + " km/s");
        }
        return new IdentificationSearch(identifier, metresPerSecond, maxOffset);
    }

    /**
     * @param metres the largest |offset| to search, metres of vacuum wavelength; finite and positive
     * @return a search that finds a constant offset (after the velocity, when both are searched)
     */
    public IdentificationSearch withOffsetSearch(double metres) {
        if (!(metres > 0) || Double.isInfinite(metres)) {
            throw new IllegalArgumentException("the offset search range must be a finite positive width, got "
                    + metres * 1e9 + " nm");
        }
        return new IdentificationSearch(identifier, maxSpeed, metres);
    }

    /** @return the identifier */
    public Identifier identifier() {
        return identifier;
    }

    /**
     * The vacuum-wavelength window the candidate lines must cover: the peaks' span widened by the
     * searched velocity and offset (an offset counted relative to 100 nm) and by 1e-3 (common
     * practice: room for the tolerance).
     *
     * @param peaks the peaks, at least one
     * @return {short end, long end}, vacuum metres
     */
    public double[] candidateWindow(PeakList peaks) {
        if (peaks.size() == 0) {
            throw new IllegalArgumentException("no peaks");
        }
        double reach = 1 + (Double.isNaN(maxSpeed) ? 0 : maxSpeed / PhysicalConstants.C) + 1e-3
                + (Double.isNaN(maxOffset) ? 0 : maxOffset / 100e-9);
        return new double[] {peaks.shortestWavelength() / reach, peaks.longestWavelength() * reach};
    }

    /**
     * @param peaks the measured peaks
     * @param lines the candidate lines at rest
     * @return the identification with the velocity and offset found and the lines as shifted
     */
    public Report run(PeakList peaks, LineCatalog lines) {
        ShiftSearch.Fit velocity = null;
        LineCatalog used = lines;
        // A search that matched no line claims no value (its densest vote is no measurement), so the
        // lines are then identified where they are, not at that vote.
        if (!Double.isNaN(maxSpeed)) {
            velocity = ShiftSearch.redshift(identifier, peaks, lines, maxSpeed);
            used = velocity.matches() == 0 ? lines : lines.shifted(velocity.value());
        }
        ShiftSearch.Fit offset = null;
        if (!Double.isNaN(maxOffset)) {
            offset = ShiftSearch.offset(identifier, peaks, used, maxOffset);
            used = offset.matches() == 0 ? used : used.offset(offset.value());
        }
        Identification identification = identifier.identify(peaks, used);
        if (velocity != null || offset != null) {
            // The spans searched, for the chance figures (the identification knows the peaks' middle).
            identification = identification.searchedOver(
                    velocity == null ? 0 : 2 * maxSpeed / org.ritzwerk.constants.PhysicalConstants.C,
                    offset == null ? 0 : 2 * maxOffset);
        }
        return new Report(identification, used, Optional.ofNullable(velocity), Optional.ofNullable(offset));
    }

    /**
     * What an identification found.
     *
     * @param identification every peak's line and status, missing strong lines, species presence
     * @param lines          the candidate lines as matched (shifted by the velocity and offset found)
     * @param velocity       the Doppler fit, when searched
     * @param offset         the offset fit (metres), when searched
     */
    public record Report(Identification identification, LineCatalog lines, Optional<ShiftSearch.Fit> velocity,
            Optional<ShiftSearch.Fit> offset) {
    }
}
