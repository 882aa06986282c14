package org.ritzwerk.engine.pair;

import java.util.Objects;

/**
 * Pair potentials: at each distance, every eigenvalue of the pair Hamiltonian (ascending, Hz,
 * relative to the target pair's energy at infinite distance) and the target's share in each
 * eigenstate. Immutable: the accessors return copies.
 */
public final class PairPotentialResult {

    private final PairState target;
    private final int basisSize;
    private final double[] distances;
    private final double[][] energies;
    private final double[][] shares;

    PairPotentialResult(PairState target, int basisSize, double[] distances, double[][] energies, double[][] shares) {
        this.target = Objects.requireNonNull(target);
        this.basisSize = basisSize;
        this.distances = distances;
        this.energies = energies;
        this.shares = shares;
    }

    /** @return the target pair state */
    public PairState target() {
        return target;
    }

    /** @return how many pair states the basis holds */
    public int basisSize() {
        return basisSize;
    }

    /** @return the distances, m */
    public double[] distancesMetres() {
        return distances.clone();
    }

    /**
     * @param index the distance's index
     * @return the eigenvalues there, ascending, Hz relative to the target at infinite distance
     */
    public double[] energiesHz(int index) {
        return energies[index].clone();
    }

    /**
     * @param index the distance's index
     * @return the target's share in each eigenstate, in the order of the energies
     */
    public double[] shares(int index) {
        return shares[index].clone();
    }

    /**
     * @param index the distance's index
     * @return the energy of the eigenstate holding most of the target, Hz
     */
    public double targetEnergyHz(int index) {
        double[] c = shares[index];
        int best = 0;
        for (int i = 1; i < c.length; i++) {
            best = c[i] > c[best] ? i : best;
        }
        return energies[index][best];
    }
}
