package org.ritzwerk.data;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Species;

/**
 * Quantum-defect parameters of one alkali-like species in the modified Rydberg-Ritz form
 * {@code delta(n) = d0 + d2 / (n - d0)^2 + d4 / (n - d0)^4 + ...}, per series l j, with the
 * ionization limit and the species' Rydberg constant they belong to (T. F. Gallagher, Rydberg
 * Atoms, Cambridge University Press (1994); common practice). The level energy above the ground state is then
 * {@code E = E_limit - R_M / (n - delta(n))^2}.
 *
 * <p>A set may also carry what completes the atom beyond its series, so that any provider (a
 * third party's included) can supply a whole alkali atom: the static polarizabilities of the ionic
 * core (for the series of higher l and the Coulomb approximation's inner cut-off) and the id of the
 * {@link DataKind#LEVELS} set of measured low levels (energies in cm^-1, labels like
 * {@code 5p 2P3/2}) that the model uses below the series' validity. A data context resolves that
 * id in its own registry. Immutable and thread-safe.
 *
 * @param info               what the set is (kind {@link DataKind#QUANTUM_DEFECTS})
 * @param species            the atom or ion
 * @param limitPerCm         ionization limit above the ground state, cm^-1; finite, positive
 * @param rydbergPerCm       the mass-corrected Rydberg constant R_M of the species, cm^-1; positive
 * @param series             the series, one per l and j
 * @param corePolarizability the core's dipole and quadrupole polarizabilities (atomic units), if
 *                           the set gives them
 * @param levelsId           the id of the set of measured low levels that goes with this one, if
 *                           any; a valid data set id ({@link DataSetInfo#isValidId(String)})
 * @param limitUncertaintyPerCm the limit's standard uncertainty, cm^-1: finite and not negative, or
 *                           NaN when none is stated (NaN policy: only here and in
 *                           {@link Series#uncertainties()} does NaN mean "not stated"; every other
 *                           NaN is refused)
 */
public record QuantumDefects(DataSetInfo info, Species species, double limitPerCm, double rydbergPerCm,
        List<Series> series, Optional<CorePolarizability> corePolarizability, Optional<String> levelsId,
        double limitUncertaintyPerCm) implements DataSet {

    /**
     * One series' parameters.
     *
     * @param l            orbital quantum number
     * @param twoJ         twice j
     * @param coefficients d0, d2, d4, ... (at least d0); finite
     * @param validFromN   the lowest n the parameters are meant for
     * @param uncertainties the published standard uncertainties of d0, d2, d4, ...: empty when none is
     *                     stated, else one per coefficient, each finite and not negative or NaN for
     *                     a coefficient whose uncertainty is not stated
     * @param residualDerived whether the uncertainties are not a paper's but our own estimate from the
     *                     series' residuals against measured levels (file value {@code from-residuals}):
     *                     those residuals compare absolute energies, so the limit's error at the checked
     *                     levels is counted in them, and a level from this series gets an uncertainty even
     *                     where the limit states none (that limit term taken as 0); false for the
     *                     published (or recalled) uncertainties of a paper
     */
    public record Series(int l, int twoJ, List<Double> coefficients, int validFromN, List<Double> uncertainties,
            boolean residualDerived) {

        /**
         * A series with a paper's stated (or recalled) uncertainties, not residual-derived ones.
         *
         * @param l             orbital quantum number
         * @param twoJ          twice j
         * @param coefficients  d0, d2, d4, ... (at least d0); finite
         * @param validFromN    the lowest n the parameters are meant for
         * @param uncertainties empty, or one standard uncertainty per coefficient (NaN where not stated)
         */
        public Series(int l, int twoJ, List<Double> coefficients, int validFromN, List<Double> uncertainties) {
            this(l, twoJ, coefficients, validFromN, uncertainties, false);
        }

        /**
         * A series without stated uncertainties.
         *
         * @param l            orbital quantum number
         * @param twoJ         twice j
         * @param coefficients d0, d2, d4, ... (at least d0); finite
         * @param validFromN   the lowest n the parameters are meant for
         */
        public Series(int l, int twoJ, List<Double> coefficients, int validFromN) {
            this(l, twoJ, coefficients, validFromN, List.of(), false);
        }

        /**
         * @return whether every coefficient has a stated uncertainty (so that an energy from the
         *         series can be given one)
         */
        public boolean hasAllUncertainties() {
            return !uncertainties.isEmpty() && uncertainties.stream().noneMatch(u -> Double.isNaN(u));
        }

        /**
         * Validates the parameters.
         *
         * @param l            orbital quantum number
         * @param twoJ         twice j
         * @param coefficients d0, d2, d4, ... (at least d0); finite
         * @param validFromN   the lowest n the parameters are meant for
         * @param uncertainties empty, or one standard uncertainty per coefficient (finite, not
         *                     negative, or NaN where not stated)
         * @param residualDerived whether they are our estimate from the series' residuals (needs
         *                     every coefficient's uncertainty)
         */
        public Series {
            if (l < 0 || twoJ < 0 || Math.abs(twoJ - 2 * l) != 1) {
                throw new IllegalArgumentException("series needs l >= 0 and j = l +- 1/2, got l = " + l + ", 2j = " + twoJ);
            }
            coefficients = List.copyOf(coefficients);
            if (coefficients.isEmpty() || coefficients.stream().anyMatch(c -> !Double.isFinite(c))) {
                throw new IllegalArgumentException("quantum-defect coefficients must be finite and at least d0, got "
                        + coefficients);
            }
            if (validFromN < 1) {
                throw new IllegalArgumentException("validFromN must be >= 1, got " + validFromN);
            }
            uncertainties = List.copyOf(uncertainties);
            if (!uncertainties.isEmpty() && uncertainties.size() != coefficients.size()) {
                throw new IllegalArgumentException("give one uncertainty per quantum-defect coefficient (or none), got "
                        + uncertainties.size() + " for " + coefficients.size() + " coefficients");
            }
            if (residualDerived
                    && (uncertainties.isEmpty() || uncertainties.stream().anyMatch(u -> Double.isNaN(u)))) {
                throw new IllegalArgumentException("residual-derived uncertainties must be given for every coefficient,"
                        + " got " + uncertainties);
            }
            for (double u : uncertainties) {
                if (!Double.isNaN(u) && !(u >= 0 && u < Double.POSITIVE_INFINITY)) {
                    throw new IllegalArgumentException("quantum-defect uncertainties must be finite and >= 0 (NaN for"
                            + " not stated), got " + uncertainties);
                }
            }
        }
    }

    /**
     * Validates the set.
     *
     * @param info               what the set is (kind {@link DataKind#QUANTUM_DEFECTS})
     * @param species            the atom or ion
     * @param limitPerCm         ionization limit above the ground state, cm^-1; finite, positive
     * @param rydbergPerCm       the mass-corrected Rydberg constant R_M of the species, cm^-1; positive
     * @param series             the series, one per l and j
     * @param corePolarizability the core's dipole and quadrupole polarizabilities (atomic units), if
     *                           the set gives them
     * @param levelsId           the id of the set of measured low levels that goes with this one, if
     *                           any; a valid data set id ({@link DataSetInfo#isValidId(String)})
     * @param limitUncertaintyPerCm the limit's standard uncertainty, cm^-1 (finite, not negative), or
     *                           NaN when none is stated
     */
    public QuantumDefects {
        Objects.requireNonNull(info, "info");
        Objects.requireNonNull(species, "species");
        if (info.kind() != DataKind.QUANTUM_DEFECTS) {
            throw new IllegalArgumentException("quantum defects need kind quantum-defects, got " + info.kind().id());
        }
        if (!(limitPerCm > 0) || Double.isInfinite(limitPerCm) || !(rydbergPerCm > 0) || Double.isInfinite(rydbergPerCm)) {
            throw new IllegalArgumentException("limit and Rydberg constant must be finite and positive cm-1, got "
                    + limitPerCm + " and " + rydbergPerCm);
        }
        series = List.copyOf(series);
        Objects.requireNonNull(corePolarizability, "corePolarizability");
        Objects.requireNonNull(levelsId, "levelsId");
        if (levelsId.isPresent() && !DataSetInfo.isValidId(levelsId.get())) {
            throw new IllegalArgumentException("levels id must be a data set id (1 to 80 lower-case letters, digits, "
                    + "dots and dashes), got '" + levelsId.get() + "'");
        }
        if (!Double.isNaN(limitUncertaintyPerCm)
                && !(limitUncertaintyPerCm >= 0 && limitUncertaintyPerCm < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("limit uncertainty must be finite and >= 0 cm-1 (NaN for not stated),"
                    + " got " + limitUncertaintyPerCm);
        }
    }

    /**
     * A set whose limit has no stated uncertainty.
     *
     * @param info               what the set is (kind {@link DataKind#QUANTUM_DEFECTS})
     * @param species            the atom or ion
     * @param limitPerCm         ionization limit above the ground state, cm^-1; finite, positive
     * @param rydbergPerCm       the mass-corrected Rydberg constant R_M of the species, cm^-1; positive
     * @param series             the series, one per l and j
     * @param corePolarizability the core's dipole and quadrupole polarizabilities, if given
     * @param levelsId           the id of the set of measured low levels that goes with this one, if any
     */
    public QuantumDefects(DataSetInfo info, Species species, double limitPerCm, double rydbergPerCm,
            List<Series> series, Optional<CorePolarizability> corePolarizability, Optional<String> levelsId) {
        this(info, species, limitPerCm, rydbergPerCm, series, corePolarizability, levelsId, Double.NaN);
    }

    /** @return the limit's standard uncertainty in cm^-1, or empty when none is stated */
    public OptionalDouble statedLimitUncertaintyPerCm() {
        return Double.isNaN(limitUncertaintyPerCm) ? OptionalDouble.empty()
                : OptionalDouble.of(limitUncertaintyPerCm);
    }

    /**
     * @param uncertainty the limit's standard uncertainty, cm^-1 (finite, not negative), or NaN for none
     * @return this set with it
     */
    public QuantumDefects withLimitUncertaintyPerCm(double uncertainty) {
        return new QuantumDefects(info, species, limitPerCm, rydbergPerCm, series, corePolarizability, levelsId,
                uncertainty);
    }

    /**
     * A set of series only, without core polarizabilities or measured levels.
     *
     * @param info         what the set is (kind {@link DataKind#QUANTUM_DEFECTS})
     * @param species      the atom or ion
     * @param limitPerCm   ionization limit above the ground state, cm^-1; finite, positive
     * @param rydbergPerCm the mass-corrected Rydberg constant R_M of the species, cm^-1; positive
     * @param series       the series, one per l and j
     */
    public QuantumDefects(DataSetInfo info, Species species, double limitPerCm, double rydbergPerCm,
            List<Series> series) {
        this(info, species, limitPerCm, rydbergPerCm, series, Optional.empty(), Optional.empty());
    }

    /**
     * @param rydberg the mass-corrected Rydberg constant R_M, cm^-1; finite, positive
     * @return this set with R_M replaced (e.g. by one computed from another table's atomic mass)
     */
    public QuantumDefects withRydbergPerCm(double rydberg) {
        return new QuantumDefects(info, species, limitPerCm, rydberg, series, corePolarizability, levelsId,
                limitUncertaintyPerCm);
    }

    /**
     * @param core the core's polarizabilities
     * @return this set with them
     */
    public QuantumDefects withCorePolarizability(CorePolarizability core) {
        return new QuantumDefects(info, species, limitPerCm, rydbergPerCm, series, Optional.of(core), levelsId,
                limitUncertaintyPerCm);
    }

    /**
     * @param id the id of the set of measured low levels that goes with this one
     * @return this set naming it
     * @throws IllegalArgumentException when {@code id} is not a valid data set id
     */
    public QuantumDefects withLevelsId(String id) {
        return new QuantumDefects(info, species, limitPerCm, rydbergPerCm, series, corePolarizability,
                Optional.of(id), limitUncertaintyPerCm);
    }

    @Override
    public int size() {
        return series.size();
    }
}
