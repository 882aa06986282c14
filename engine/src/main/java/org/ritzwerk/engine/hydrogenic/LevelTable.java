package org.ritzwerk.engine.hydrogenic;

/**
 * Levels of one ion in columns: quantum numbers and binding energy (J, negative, relative to the
 * ionization limit), in the order n, l, j, F. Immutable and thread-safe; the accessors copy
 * nothing, and no object is made per level.
 */
public final class LevelTable {

    private final int[] n;
    private final int[] l;
    private final int[] twoJ;
    private final int[] twoF;
    private final double[] energy;

    LevelTable(int[] n, int[] l, int[] twoJ, int[] twoF, double[] energy) {
        this.n = n;
        this.l = l;
        this.twoJ = twoJ;
        this.twoF = twoF;
        this.energy = energy;
    }

    /** @return the number of levels */
    public int size() {
        return energy.length;
    }

    /**
     * @param i the level's index, 0 to {@link #size()} - 1
     * @return principal quantum number
     */
    public int n(int i) {
        return n[i];
    }

    /**
     * @param i the level's index, 0 to {@link #size()} - 1
     * @return orbital quantum number
     */
    public int l(int i) {
        return l[i];
    }

    /**
     * @param i the level's index, 0 to {@link #size()} - 1
     * @return twice j
     */
    public int twoJ(int i) {
        return twoJ[i];
    }

    /**
     * @param i the level's index, 0 to {@link #size()} - 1
     * @return twice F, or -1 when the hyperfine structure is not resolved
     */
    public int twoF(int i) {
        return twoF[i];
    }

    /**
     * @param i the level's index, 0 to {@link #size()} - 1
     * @return binding energy in J (negative)
     */
    public double energy(int i) {
        return energy[i];
    }

    /**
     * @param i the level's index, 0 to {@link #size()} - 1
     * @return statistical weight 2F + 1, or 2j + 1 when F is not resolved
     */
    public int statisticalWeight(int i) {
        return twoF[i] >= 0 ? twoF[i] + 1 : twoJ[i] + 1;
    }

    /**
     * @param i the level's index, 0 to {@link #size()} - 1
     * @return the label, e.g. {@code "2p 2P3/2"} or {@code "1s 2S1/2 F=1"}
     */
    public String label(int i) {
        return Notation.level(n[i], l[i], twoJ[i], twoF[i]);
    }

    /**
     * @param out array of at least {@link #size()} elements, filled with the binding energies in J
     */
    public void copyEnergies(double[] out) {
        System.arraycopy(energy, 0, out, 0, energy.length);
    }
}
