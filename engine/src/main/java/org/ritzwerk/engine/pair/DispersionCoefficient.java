package org.ritzwerk.engine.pair;

import java.util.Objects;
import org.ritzwerk.engine.internal.units.AtomicUnits;

/**
 * The van der Waals coefficient of a pair state, {@code dE = C6 / R^6} (positive: repulsive), from
 * second-order perturbation theory, with what went into it. Immutable.
 *
 * @param pair              the pair state
 * @param c6Au              C6 in atomic units, E_h a0^6
 * @param angleRadians      the angle between the interatomic axis and the quantisation axis
 * @param neighbourRange    the n' range of each atom's intermediate states: n - range to n + range
 * @param pairStatesSummed  how many intermediate pair states (with their projections) entered the sum
 * @param strongest         the intermediate pair state with the largest contribution
 * @param strongestDefectHz its Foerster defect {@code (E_k1 + E_k2 - E_1 - E_2) / h}, Hz
 * @param strongestShare    its contribution over C6 (may exceed 1 when others cancel)
 */
public record DispersionCoefficient(PairState pair, double c6Au, double angleRadians, int neighbourRange,
        int pairStatesSummed, PairState strongest, double strongestDefectHz, double strongestShare) {

    /** One atomic unit of C6 over h, in Hz m^6. */
    static final double AU_HZ_M6 = AtomicUnits.HARTREE_HZ * Math.pow(AtomicUnits.BOHR_METRES, 6);

    /**
     * Validates the components.
     *
     * @param pair              the pair state
     * @param c6Au              C6 in atomic units, finite
     * @param angleRadians      the angle, radians
     * @param neighbourRange    the n' range
     * @param pairStatesSummed  how many pair states entered the sum
     * @param strongest         the strongest channel
     * @param strongestDefectHz its Foerster defect, Hz
     * @param strongestShare    its share of C6
     */
    public DispersionCoefficient {
        Objects.requireNonNull(pair, "pair");
        Objects.requireNonNull(strongest, "strongest");
        if (!Double.isFinite(c6Au)) {
            throw new IllegalArgumentException("C6 of " + pair.label() + " must be finite, got " + c6Au);
        }
    }

    /** @return C6 / h in Hz m^6 */
    public double c6HzM6() {
        return c6Au * AU_HZ_M6;
    }

    /** @return C6 / h in GHz um^6, the unit experiments quote */
    public double c6GHzUm6() {
        return c6HzM6() * 1e36 / 1e9;
    }

    /**
     * @param rabiRadPerS the Rabi frequency Omega of the excitation, rad/s, positive and finite
     * @return the blockade radius {@code (|C6| / (hbar Omega))^(1/6)}, m
     */
    public double blockadeRadiusMetres(double rabiRadPerS) {
        return PairInteractions.blockadeRadiusMetres(c6HzM6(), rabiRadPerS);
    }
}
