package org.ritzwerk.spark;

import java.io.Serializable;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * What {@link SurveyIdentification} does with every peak list: the candidate lines (engine
 * species, data-set line lists, the catalogue's window), the tolerance, the velocity and offset
 * searches, the peaks' unit and medium, and the plasma estimate. The same settings as the
 * {@code identify} command's options, with the same defaults.
 *
 * <p>The candidate lines are built from these settings once per partition, in the command's
 * order: the Ritz lines of its species with a level list (He I: E1 and LS rules, the context's
 * A values), then alkali atoms of {@code species}, then its one-electron ions (model
 * {@code model}, upper n up to {@code nMax}, multiplets unless {@code components}), then the
 * {@code lineSets}. Over a
 * fixed window ({@link #inWindow}) every spectrum meets the same catalogue (relative strengths
 * are normalised over it); {@link #perSpectrumWindow(List, List)} instead builds each spectrum's
 * catalogue over its own peaks' window, exactly as the command does for one peak file.
 *
 * <p>An immutable, serialisable value (Spark broadcasts it once per job); the canonical
 * constructor checks every field and names the one that is wrong.
 *
 * @param species               species whose lines the engine computes ("H I", "He II", "Na I",
 *                              ...); may be empty
 * @param model                 level model of the one-electron ions: bohr, dirac, qed or hyperfine
 * @param nMax                  highest upper n of their lines (and of the alkali lines' levels)
 * @param components            fine-structure components instead of n -&gt; n' multiplets
 * @param lineSets              data-set ids or line-list files (as the command's {@code --lines});
 *                              may be empty, but not together with {@code species}
 * @param dataFiles             the user's data files, first in precedence (as {@code --data}); they
 *                              must be readable at these paths on every executor
 * @param excitationTemperature weigh one-electron lines by exp(-E_upper / kT) at this temperature,
 *                              K; NaN for g A alone
 * @param windowFromNm          short end of the catalogue's window, vacuum nm; NaN for a window per
 *                              spectrum
 * @param windowToNm            long end, vacuum nm; NaN with {@code windowFromNm}
 * @param tolerance             the tolerance as the command reads it ("5 sigma", "0.02 nm",
 *                              "20 ppm", "R=20000")
 * @param searchVelocity        the largest |v| of the Doppler search, m/s; NaN for none
 * @param searchOffsetNm        the largest |offset| of the offset search, nm; NaN for none
 * @param unit                  the unit symbol of the peaks' positions, sigmas and widths ("nm",
 *                              "cm-1", "Hz", "eV", ...)
 * @param medium                the medium of wavelength positions ("air", "vacuum", or
 *                              "air(&lt;model&gt;)"); ignored for other units
 * @param plasma                whether to estimate excitation temperatures and electron densities
 * @param instrumentFwhmNm      for the plasma estimate, the spectrometer's Gaussian FWHM, nm (0 for
 *                              none)
 * @param resolvingPower        for the plasma estimate, instead: the response's lambda / FWHM; NaN
 *                              to use {@code instrumentFwhmNm}
 * @param strengthWeight        how much the lines' expected strengths count as priors, 0 to 1 (as the
 *                              command's {@code --strength-weight}; the factories give the engine's
 *                              default, {@code Identifier.DEFAULT_STRENGTH_WEIGHT})
 *
 * <p>Serialisable only to travel from the driver to the executors of the same version, so the
 * serialised form is not part of the API.
 *
 * @serial exclude
 */
public record IdentificationParameters(List<String> species, String model, int nMax, boolean components,
        List<String> lineSets, List<String> dataFiles, double excitationTemperature, double windowFromNm,
        double windowToNm, String tolerance, double searchVelocity, double searchOffsetNm, String unit, String medium,
        boolean plasma, double instrumentFwhmNm, double resolvingPower, double strengthWeight) implements Serializable {

    /**
     * Checks every field (the tolerance, model, unit and medium are read as the engine reads
     * them) and copies the lists.
     *
     * @param species               as above
     * @param model                 as above
     * @param nMax                  as above
     * @param components            as above
     * @param lineSets              as above
     * @param dataFiles             as above
     * @param excitationTemperature as above
     * @param windowFromNm          as above
     * @param windowToNm            as above
     * @param tolerance             as above
     * @param searchVelocity        as above
     * @param searchOffsetNm        as above
     * @param unit                  as above
     * @param medium                as above
     * @param plasma                as above
     * @param instrumentFwhmNm      as above
     * @param resolvingPower        as above
     * @param strengthWeight        as above
     */
    public IdentificationParameters {
        species = List.copyOf(species);
        lineSets = List.copyOf(lineSets);
        dataFiles = List.copyOf(dataFiles);
        if (species.isEmpty() && lineSets.isEmpty()) {
            throw new IllegalArgumentException("give candidate lines: species (engine lines) and/or lineSets");
        }
        Setups.requireDistinct("species", species, text -> Species.parse(text.strip()));
        Setups.requireDistinct("lineSets", lineSets, String::strip);
        Setups.requireDistinct("dataFiles", dataFiles, String::strip);
        Tier.fromId(Objects.requireNonNull(model, "model"));
        if (nMax < 1 || nMax > HydrogenLikeLines.MAX_N) {
            throw new IllegalArgumentException("nMax must be 1 to " + HydrogenLikeLines.MAX_N + ", got " + nMax);
        }
        if (!Double.isNaN(excitationTemperature) && !(excitationTemperature > 0 && excitationTemperature <= 1e9)) {
            throw new IllegalArgumentException("excitationTemperature must be above 0 and at most 1e9 K, or NaN, got "
                    + excitationTemperature);
        }
        if (Double.isNaN(windowFromNm) != Double.isNaN(windowToNm)) {
            throw new IllegalArgumentException("windowFromNm and windowToNm must both be given or both be NaN");
        }
        if (!Double.isNaN(windowFromNm) && !(windowFromNm > 0 && windowToNm > windowFromNm
                && Double.isFinite(windowToNm))) {
            throw new IllegalArgumentException("the window must run from a positive short end to a finite longer one,"
                    + " vacuum nm; got " + windowFromNm + " to " + windowToNm);
        }
        Tolerance.parse(Objects.requireNonNull(tolerance, "tolerance"));
        if (!Double.isNaN(searchVelocity) && !(searchVelocity > 0 && searchVelocity < PhysicalConstants.C / 10)) {
            throw new IllegalArgumentException("searchVelocity must be above 0 and below c / 10 m/s, or NaN, got "
                    + searchVelocity);
        }
        if (!Double.isNaN(searchOffsetNm) && !(searchOffsetNm >= 1e-290 && Double.isFinite(searchOffsetNm))) {
            throw new IllegalArgumentException("searchOffsetNm must be a positive finite width in nm (at least 1e-290),"
                    + " or NaN, got " + searchOffsetNm);
        }
        Unit.fromSymbol(Objects.requireNonNull(unit, "unit")).orElseThrow(() -> new IllegalArgumentException(
                "unknown unit '" + unit + "'; known: " + Unit.knownSymbols()));
        Medium.parse(Objects.requireNonNull(medium, "medium"));
        if (!(instrumentFwhmNm >= 0 && instrumentFwhmNm <= 1e6)) {
            throw new IllegalArgumentException("instrumentFwhmNm must be 0 to 1e6 nm, got " + instrumentFwhmNm);
        }
        if (!Double.isNaN(resolvingPower) && !(resolvingPower >= 1 && resolvingPower <= 1e9)) {
            throw new IllegalArgumentException("resolvingPower must be 1 to 1e9, or NaN, got " + resolvingPower);
        }
        if (!Double.isNaN(resolvingPower) && instrumentFwhmNm != 0) {
            throw new IllegalArgumentException("give instrumentFwhmNm or resolvingPower, not both");
        }
        if (!(strengthWeight >= 0 && strengthWeight <= 1)) {
            throw new IllegalArgumentException("strengthWeight must be 0 to 1, got " + strengthWeight);
        }
    }

    private static final long serialVersionUID = 1L;

    /**
     * @param species  species whose lines the engine computes ("H I", "Na I", ...); may be empty
     * @param lineSets data-set ids or line-list files; may be empty, but not with species
     * @param fromNm short end of the candidate lines' window, vacuum nm (the survey's range,
     *               widened by the velocity or offset searched)
     * @param toNm   long end, vacuum nm
     * @return the {@code identify} command's defaults over that window: model qed, n up to 30,
     *         multiplets, tolerance 5 sigma, peaks in nm in vacuum, no search, no plasma estimate,
     *         the given candidate lines
     */
    public static IdentificationParameters inWindow(List<String> species, List<String> lineSets, double fromNm,
            double toNm) {
        return new IdentificationParameters(species, "qed", 30, false, lineSets, List.of(), Double.NaN, fromNm,
                toNm, "5 sigma", Double.NaN, Double.NaN, "nm", "vacuum", false, 0, Double.NaN,
                Identifier.DEFAULT_STRENGTH_WEIGHT);
    }

    /**
     * @param species  species whose lines the engine computes; may be empty
     * @param lineSets data-set ids or line-list files; may be empty, but not with species
     * @return the defaults of {@link #inWindow}, but each spectrum's catalogue is built over its
     *         own peaks' window ({@code IdentificationSearch.candidateWindow}), as the
     *         {@code identify} command does: slower (a catalogue per spectrum), the command's
     *         numbers for each spectrum
     */
    public static IdentificationParameters perSpectrumWindow(List<String> species, List<String> lineSets) {
        return new IdentificationParameters(species, "qed", 30, false, lineSets, List.of(), Double.NaN, Double.NaN,
                Double.NaN, "5 sigma", Double.NaN, Double.NaN, "nm", "vacuum", false, 0, Double.NaN,
                Identifier.DEFAULT_STRENGTH_WEIGHT);
    }

    /**
     * @param list species notations
     * @return a copy with these engine species
     */
    public IdentificationParameters withSpecies(List<String> list) {
        return new IdentificationParameters(list, model, nMax, components, lineSets, dataFiles, excitationTemperature,
                windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit, medium, plasma,
                instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param id bohr, dirac, qed or hyperfine
     * @param n highest upper n
     * @return a copy
     */
    public IdentificationParameters withModel(String id, int n) {
        return new IdentificationParameters(species, id, n, components, lineSets, dataFiles, excitationTemperature,
                windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit, medium, plasma,
                instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param on fine-structure components instead of multiplets
     * @return a copy
     */
    public IdentificationParameters withComponents(boolean on) {
        return new IdentificationParameters(species, model, nMax, on, lineSets, dataFiles, excitationTemperature,
                windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit, medium, plasma,
                instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param ids data-set ids or line-list files
     * @return a copy with these line sets
     */
    public IdentificationParameters withLineSets(List<String> ids) {
        return new IdentificationParameters(species, model, nMax, components, ids, dataFiles, excitationTemperature,
                windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit, medium, plasma,
                instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param files the user's data files, readable on every executor
     * @return a copy
     */
    public IdentificationParameters withDataFiles(List<String> files) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, files, excitationTemperature,
                windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit, medium, plasma,
                instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param kelvin excitation temperature, K
     * @return a copy
     */
    public IdentificationParameters withExcitationTemperature(double kelvin) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles, kelvin,
                windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit, medium, plasma,
                instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param weight how much the lines' expected strengths count as priors, 0 to 1 (1 for a faint
     *               spectrum whose lines show about in proportion to their strength, 0 for position alone)
     * @return a copy
     */
    public IdentificationParameters withStrengthWeight(double weight) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles,
                excitationTemperature, windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit,
                medium, plasma, instrumentFwhmNm, resolvingPower, weight);
    }

    /**
     * @param text the tolerance ("5 sigma", "0.02 nm", "20 ppm", "R=20000")
     * @return a copy
     */
    public IdentificationParameters withTolerance(String text) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles,
                excitationTemperature, windowFromNm, windowToNm, text, searchVelocity, searchOffsetNm, unit, medium,
                plasma, instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param metresPerSecond largest |v| to search, m/s
     * @return a copy
     */
    public IdentificationParameters withVelocitySearch(double metresPerSecond) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles,
                excitationTemperature, windowFromNm, windowToNm, tolerance, metresPerSecond, searchOffsetNm, unit,
                medium, plasma, instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param nanometres largest |offset| to search, nm
     * @return a copy
     */
    public IdentificationParameters withOffsetSearch(double nanometres) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles,
                excitationTemperature, windowFromNm, windowToNm, tolerance, searchVelocity, nanometres, unit, medium,
                plasma, instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param symbol unit of the positions
     * @param mediumSpec their medium
     * @return a copy
     */
    public IdentificationParameters withUnit(String symbol, String mediumSpec) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles,
                excitationTemperature, windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, symbol,
                mediumSpec, plasma, instrumentFwhmNm, resolvingPower, strengthWeight);
    }

    /**
     * @param fwhmNm the spectrometer's Gaussian FWHM, nm
     * @return a copy with the plasma estimate on
     */
    public IdentificationParameters withPlasmaEstimate(double fwhmNm) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles,
                excitationTemperature, windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit,
                medium, true, fwhmNm, Double.NaN, strengthWeight);
    }

    /**
     * @param r the response's lambda / FWHM
     * @return a copy with the plasma estimate on
     */
    public IdentificationParameters withPlasmaEstimateAtResolvingPower(double r) {
        return new IdentificationParameters(species, model, nMax, components, lineSets, dataFiles,
                excitationTemperature, windowFromNm, windowToNm, tolerance, searchVelocity, searchOffsetNm, unit,
                medium, true, 0, r, strengthWeight);
    }

    /** @return the positions' unit */
    Unit positionUnit() {
        return Unit.fromSymbol(unit).orElseThrow();
    }

    /** @return the positions' medium, or null for a unit that is not a wavelength */
    Medium positionMedium() {
        return positionUnit().kind() == Kind.WAVELENGTH ? Medium.parse(medium) : null;
    }
}
