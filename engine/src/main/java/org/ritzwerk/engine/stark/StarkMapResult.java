package org.ritzwerk.engine.stark;

import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * The energies and characters of a Stark map: at each field, every eigenvalue (ascending, cm^-1
 * above the ground level) and, unless the map was solved for energies only, the share
 * {@code |<reference|psi>|^2} of the chosen zero-field state in its eigenstate: in every eigenstate
 * (a plain {@link StarkMap#solve}), or, when the map had a share window
 * ({@link StarkMap#withShareWindowHz}), only in the eigenstates whose energy lies in that window.
 * {@link #hasShare} tells which eigenstates carry a share; {@link #share} refuses, rather than
 * giving zero, for one that does not. Immutable: the accessors return copies.
 */
public final class StarkMapResult {

    private final List<State> basis;
    private final int twoMj;
    private final State reference;
    private final double referencePerCm;
    private final double[] fields;
    private final double[][] energies;
    /** Every share, or (windowed) the shares of the eigenstates firstShared[f] onwards; null for energies only. */
    private final double[][] characters;
    /** The share window, Hz relative to the reference's zero-field energy; null when not windowed. */
    private final double[] windowHz;
    /** Windowed: the index of the first eigenstate with a share at each field; null when not windowed. */
    private final int[] firstShared;

    StarkMapResult(List<State> basis, int twoMj, State reference, double referencePerCm, double[] fields,
            double[][] energies, double[][] characters, double[] windowHz, int[] firstShared) {
        this.basis = List.copyOf(basis);
        this.twoMj = twoMj;
        this.reference = Objects.requireNonNull(reference);
        this.referencePerCm = referencePerCm;
        this.fields = fields;
        this.energies = energies;
        this.characters = characters;
        this.windowHz = windowHz;
        this.firstShared = firstShared;
    }

    /** An energy relative to the reference's zero-field energy, Hz: the scale of {@link #energiesRelativeHz}. */
    static double relativeHz(double energyPerCm, double referencePerCm) {
        return (energyPerCm - referencePerCm) * 100 * org.ritzwerk.constants.PhysicalConstants.C;
    }

    /** @return the basis states, in the matrix's order */
    public List<State> basis() {
        return basis;
    }

    /** @return twice m_j */
    public int projection() {
        return twoMj;
    }

    /** @return the zero-field state whose character is reported */
    public State reference() {
        return reference;
    }

    /** @return the reference state's zero-field energy, cm^-1 above the ground level */
    public double referenceEnergyPerCm() {
        return referencePerCm;
    }

    /** @return the fields, V/m */
    public double[] fieldsVPerM() {
        return fields.clone();
    }

    /** @return how many fields */
    public int fieldCount() {
        return fields.length;
    }

    /**
     * @param field the field's index
     * @return the eigenvalues at that field, ascending, cm^-1 above the ground level
     */
    public double[] energiesPerCm(int field) {
        return energies[field].clone();
    }

    /**
     * @param field the field's index
     * @return the eigenvalues at that field relative to the reference's zero-field energy, Hz
     */
    public double[] energiesRelativeHz(int field) {
        double[] e = energies[field].clone();
        for (int i = 0; i < e.length; i++) {
            e[i] = relativeHz(e[i], referencePerCm);
        }
        return e;
    }

    /**
     * @return whether every eigenstate's character was computed: false when the map was solved for
     *         energies only ({@link StarkMap#solveEnergies}) or with a share window (then see
     *         {@link #hasShare})
     */
    public boolean hasCharacters() {
        return characters != null && windowHz == null;
    }

    /**
     * @param field the field's index
     * @return the reference's share in each eigenstate, 0 to 1, in the order of the energies
     * @throws IllegalStateException when the map was solved for energies only or with a share window
     *                               (use {@link #share} and {@link #hasShare} then)
     */
    public double[] characters(int field) {
        if (windowHz != null) {
            throw new IllegalStateException("this Stark map was solved with a share window (" + windowText()
                    + "): only the eigenstates in it carry a share; use hasShare and share, or a map without a"
                    + " window for every character");
        }
        return requireCharacters()[field].clone();
    }

    private double[][] requireCharacters() {
        if (characters == null) {
            throw new IllegalStateException("this Stark map was solved for energies only; use StarkMap.solve for"
                    + " characters");
        }
        return characters;
    }

    /** @return whether the shares were computed only within a window ({@link StarkMap#withShareWindowHz}) */
    public boolean hasShareWindow() {
        return windowHz != null;
    }

    /**
     * @return the share window's lower edge, Hz relative to the reference's zero-field energy
     * @throws IllegalStateException when the result has no share window
     */
    public double shareWindowLowerHz() {
        return requireWindow()[0];
    }

    /**
     * @return the share window's upper edge, Hz relative to the reference's zero-field energy
     * @throws IllegalStateException when the result has no share window
     */
    public double shareWindowUpperHz() {
        return requireWindow()[1];
    }

    private double[] requireWindow() {
        if (windowHz == null) {
            throw new IllegalStateException("this Stark map was solved without a share window");
        }
        return windowHz;
    }

    private String windowText() {
        return windowHz[0] / 1e9 + " to " + windowHz[1] / 1e9 + " GHz from the reference's zero-field energy";
    }

    /**
     * @param field the field's index
     * @param state the eigenstate's index, in the order of the energies
     * @return whether the reference's share in that eigenstate was computed: always without a share
     *         window, never for energies only, with a window when its energy lies in the window
     * @throws IndexOutOfBoundsException when the field or the eigenstate does not exist
     */
    public boolean hasShare(int field, int state) {
        Objects.checkIndex(field, fields.length);
        Objects.checkIndex(state, energies[field].length);
        if (characters == null) {
            return false;
        }
        if (windowHz == null) {
            return true;
        }
        return state >= firstShared[field] && state < firstShared[field] + characters[field].length;
    }

    /**
     * @param field the field's index
     * @param state the eigenstate's index, in the order of the energies
     * @return the reference's share in that eigenstate, 0 to 1
     * @throws IllegalStateException when that share was not computed ({@link #hasShare} is false): the
     *                               map was solved for energies only, or the eigenstate lies outside the
     *                               share window
     * @throws IndexOutOfBoundsException when the field or the eigenstate does not exist
     */
    public double share(int field, int state) {
        if (!hasShare(field, state)) {
            if (characters == null) {
                requireCharacters();
            }
            throw new IllegalStateException("eigenstate " + state + " at field " + fields[field] + " V/m lies at "
                    + relativeHz(energies[field][state], referencePerCm) / 1e9 + " GHz, outside the share window ("
                    + windowText() + "): its share was not computed");
        }
        return windowHz == null ? characters[field][state] : characters[field][state - firstShared[field]];
    }

    /**
     * @param field the field's index
     * @return the indices of the eigenstates that carry a share at that field, ascending (every index
     *         without a share window, a contiguous run or none with one)
     * @throws IllegalStateException when the map was solved for energies only
     */
    public int[] sharedIndices(int field) {
        double[] c = requireCharacters()[field];
        int from = windowHz == null ? 0 : firstShared[field];
        int[] indices = new int[c.length];
        for (int i = 0; i < c.length; i++) {
            indices[i] = from + i;
        }
        return indices;
    }

    /**
     * The reference's total share in the eigenstates that carry none: 1 minus the sum of the computed
     * shares (the shares of one state over a complete orthonormal eigenbasis add up to 1), not below
     * 0. Without a share window it is 0 up to rounding; with one, it says how much of the reference
     * state lies outside the window.
     *
     * @param field the field's index
     * @return the share not accounted for, 0 to 1
     * @throws IllegalStateException when the map was solved for energies only
     */
    public double shareOutsideWindow(int field) {
        double sum = 0;
        for (double c : requireCharacters()[field]) {
            sum += c;
        }
        return Math.max(0, 1 - sum);
    }

    /**
     * The index of the eigenstate with the largest share of the reference state. With a share
     * window, the largest share in the window is the largest of all only when it is at least the
     * share left outside the window ({@link #shareOutsideWindow}, which bounds every share outside);
     * otherwise this refuses rather than guess.
     *
     * @param field the field's index
     * @return the index of the eigenstate with the largest share of the reference state
     * @throws IllegalStateException when the map was solved for energies only, or with a share window
     *                               that holds no eigenstate at that field or may miss the strongest
     */
    public int strongestIndex(int field) {
        double[] c = requireCharacters()[field];
        if (c.length == 0) {
            throw new IllegalStateException("no eigenstate at field " + fields[field] + " V/m lies in the share"
                    + " window (" + windowText() + ")");
        }
        int best = 0;
        for (int i = 1; i < c.length; i++) {
            if (c[i] > c[best]) {
                best = i;
            }
        }
        if (windowHz == null) {
            return best;
        }
        double outside = shareOutsideWindow(field);
        if (c[best] < outside) {
            throw new IllegalStateException("at field " + fields[field] + " V/m the largest share in the share"
                    + " window (" + windowText() + ") is " + c[best] + ", less than the " + outside + " left outside"
                    + " it: the strongest eigenstate may lie outside; widen the window");
        }
        return best + firstShared[field];
    }

    /**
     * @param field the field's index
     * @return the energy of the eigenstate with the largest share of the reference, relative to the
     *         reference's zero-field energy, Hz
     * @throws IllegalStateException when the map was solved for energies only, or as
     *                               {@link #strongestIndex} with a share window
     */
    public double referenceShiftHz(int field) {
        return energiesRelativeHz(field)[strongestIndex(field)];
    }
}
