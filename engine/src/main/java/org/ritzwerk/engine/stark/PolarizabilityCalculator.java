package org.ritzwerk.engine.stark;

import java.util.Objects;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.internal.angular.WignerSymbols;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.engine.internal.units.AtomicUnits;

/**
 * Static polarizabilities of an alkali atom's states by second-order perturbation theory over the
 * dipole-coupled states {@code |k> = |n' l' j'>}, {@code l' = l +- 1}, {@code |j' - j| <= 1},
 * {@code n - range <= n' <= n + range}:
 * <pre>
 *   alpha_0 = 2 / (3 (2j + 1)) sum_k |&lt;a||d||k&gt;|^2 / (E_k - E_a)
 *   alpha_2 = 4 C sum_k (-1)^(j + j') {j 1 j'; 1 j 2} |&lt;a||d||k&gt;|^2 / (E_k - E_a),
 *   C = [5 j (2j - 1) / (6 (j + 1)(2j + 1)(2j + 3))]^(1/2)
 * </pre>
 * (the form of J. Mitroy, M. S. Safronova and C. W. Clark, J. Phys. B 43, 202001 (2010), from
 * memory; the phase of alpha_2 is fixed by the tests against the definition
 * {@code alpha(m_j) = 2 sum_k |<a m|d_0|k m>|^2 / (E_k - E_a)} summed term by term with
 * {@link AlkaliAtom#dipole}: with this package's reduced elements it is {@code (-1)^(j + j')}, not the
 * {@code (-1)^(j + j' + 1)} recalled first, which gave alpha_2 with the wrong sign), with the reduced elements of
 * {@link AlkaliAtom#reducedDipole} (e a0) and energies in hartree. The core polarizability is not
 * added (it is below 10 a.u. for the alkalis, far below Rydberg values).
 *
 * <p>States for which the model has no level (below a series' validity, inside the core) are
 * left out of the sum and not counted in {@link Polarizability#statesSummed()}; they lie far from a
 * Rydberg state and weigh little (the convergence test shows it). A coupled state at the same
 * energy as the state asked for is refused ({@link StarkException#DEGENERATE}): second order does
 * not hold there (hydrogenic high-l manifolds); diagonalise with {@link StarkMap}.
 *
 * <p>Immutable and thread-safe.
 */
public final class PolarizabilityCalculator {

    /** The default n' range, n - 20 to n + 20 (the tests show nS, nP, nD converged to 1e-4 there). */
    public static final int DEFAULT_RANGE = 20;

    private final AlkaliAtom atom;
    private final int range;

    private PolarizabilityCalculator(AlkaliAtom atom, int range) {
        this.atom = atom;
        this.range = range;
    }

    /**
     * @param atom the atom
     * @return a calculator with the default n' range
     */
    public static PolarizabilityCalculator of(AlkaliAtom atom) {
        return new PolarizabilityCalculator(Objects.requireNonNull(atom, "atom"), DEFAULT_RANGE);
    }

    /**
     * @param newRange n' runs from n - range to n + range; 1 to 200
     * @return the same calculator with that range
     */
    public PolarizabilityCalculator withNeighbourRange(int newRange) {
        if (newRange < 1 || newRange > 200) {
            throw new IllegalArgumentException("neighbour range must be 1 to 200, got " + newRange);
        }
        return new PolarizabilityCalculator(atom, newRange);
    }

    /** @return the n' range */
    public int neighbourRange() {
        return range;
    }

    /**
     * @param state the state
     * @return its scalar and tensor polarizabilities
     * @throws RydbergException when the model has no level for the state itself
     * @throws StarkException   ({@link StarkException#DEGENERATE}) when a coupled state is degenerate with it
     */
    public Polarizability compute(State state) {
        Objects.requireNonNull(state, "state");
        double ea = atom.energyPerCm(state);
        int twoJ = state.twoJ();
        double j = state.j();
        double scalar = 0;
        double tensor = 0;
        int count = 0;
        for (int l2 = state.l() - 1; l2 <= state.l() + 1; l2 += 2) {
            if (l2 < 0) {
                continue;
            }
            for (int twoJ2 = 2 * l2 - 1; twoJ2 <= 2 * l2 + 1; twoJ2 += 2) {
                if (twoJ2 < 1 || Math.abs(twoJ2 - twoJ) > 2) {
                    continue;
                }
                double sixJ = WignerSymbols.sixJ(twoJ, 2, twoJ2, 2, twoJ, 4);
                int phase = (twoJ + twoJ2) / 2;
                double tensorAngular = ((phase & 1) == 0 ? 1 : -1) * sixJ;
                for (int n2 = Math.max(l2 + 1, state.n() - range); n2 <= state.n() + range; n2++) {
                    State k = new State(n2, l2, twoJ2);
                    double ek;
                    try {
                        ek = atom.energyPerCm(k);
                    } catch (RydbergException noLevel) {
                        continue; // outside the model (see the class comment)
                    }
                    double gap = AtomicUnits.hartreeFromPerCm(ek - ea);
                    double d = atom.reducedDipole(state, k);
                    if (d == 0) {
                        continue;
                    }
                    if (Math.abs(gap) < 1e-12) {
                        throw new StarkException(StarkException.DEGENERATE, state.label() + " and " + k.label()
                                + " have the same energy (" + ea + " cm-1) in this model; second-order "
                                + "perturbation theory does not hold, use a Stark map");
                    }
                    double weight = d * d / gap;
                    scalar += weight;
                    tensor += tensorAngular * weight;
                    count++;
                }
            }
        }
        scalar *= 2.0 / (3 * (twoJ + 1));
        if (twoJ > 1) {
            double c = Math.sqrt(5 * j * (2 * j - 1) / (6 * (j + 1) * (2 * j + 1) * (2 * j + 3)));
            tensor *= 4 * c;
        } else {
            tensor = 0;
        }
        return new Polarizability(state, scalar, tensor, count, range);
    }
}
