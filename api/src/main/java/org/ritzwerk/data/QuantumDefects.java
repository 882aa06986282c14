package org.ritzwerk.data;

import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.Species;

/**
 * Quantum-defect parameters of one alkali-like species in the modified Rydberg-Ritz form
 * {@code delta(n) = d0 + d2 / (n - d0)^2 + d4 / (n - d0)^4 + ...}, per series l j, with the
 * ionization limit and the species' Rydberg constant they belong to (T. F. Gallagher, Rydberg
 * Atoms, Cambridge University Press (1994); common practice). The level energy above the ground state is then
 * {@code E = E_limit - R_M / (n - delta(n))^2}. Immutable and thread-safe.
 *
 * @param info            what the set is (kind {@link DataKind#QUANTUM_DEFECTS})
 * @param species         the atom or ion
 * @param limitPerCm      ionization limit above the ground state, cm^-1; finite, positive
 * @param rydbergPerCm    the mass-corrected Rydberg constant R_M of the species, cm^-1; positive
 * @param series          the series, one per l and j
 */
public record QuantumDefects(DataSetInfo info, Species species, double limitPerCm, double rydbergPerCm,
        List<Series> series) implements DataSet {

    /**
     * One series' parameters.
     *
     * @param l            orbital quantum number
     * @param twoJ         twice j
     * @param coefficients d0, d2, d4, ... (at least d0); finite
     * @param validFromN   the lowest n the parameters are meant for
     */
    public record Series(int l, int twoJ, List<Double> coefficients, int validFromN) {

        /** Validates the parameters. */
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
        }
    }

    /** Validates the set. */
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
    }

    @Override
    public int size() {
        return series.size();
    }
}
