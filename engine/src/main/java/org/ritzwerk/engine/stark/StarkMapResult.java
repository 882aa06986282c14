package org.ritzwerk.engine.stark;

import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * The energies and characters of a Stark map: at each field, every eigenvalue (ascending, cm^-1
 * above the ground level) and, unless the map was solved for energies only, the share
 * {@code |<reference|psi>|^2} of the chosen zero-field state in its eigenstate. Immutable: the
 * accessors return copies.
 */
public final class StarkMapResult {

    private final List<State> basis;
    private final int twoMj;
    private final State reference;
    private final double referencePerCm;
    private final double[] fields;
    private final double[][] energies;
    private final double[][] characters;

    StarkMapResult(List<State> basis, int twoMj, State reference, double referencePerCm, double[] fields,
            double[][] energies, double[][] characters) {
        this.basis = List.copyOf(basis);
        this.twoMj = twoMj;
        this.reference = Objects.requireNonNull(reference);
        this.referencePerCm = referencePerCm;
        this.fields = fields;
        this.energies = energies;
        this.characters = characters;
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
            e[i] = (e[i] - referencePerCm) * 100 * org.ritzwerk.constants.PhysicalConstants.C;
        }
        return e;
    }

    /**
     * @return whether the characters were computed ({@link StarkMap#solveEnergies} computes none)
     */
    public boolean hasCharacters() {
        return characters != null;
    }

    /**
     * @param field the field's index
     * @return the reference's share in each eigenstate, 0 to 1, in the order of the energies
     * @throws IllegalStateException when the map was solved for energies only
     */
    public double[] characters(int field) {
        return requireCharacters()[field].clone();
    }

    private double[][] requireCharacters() {
        if (characters == null) {
            throw new IllegalStateException("this Stark map was solved for energies only; use StarkMap.solve for"
                    + " characters");
        }
        return characters;
    }

    /**
     * @param field the field's index
     * @return the index of the eigenstate with the largest share of the reference state
     * @throws IllegalStateException when the map was solved for energies only
     */
    public int strongestIndex(int field) {
        double[] c = requireCharacters()[field];
        int best = 0;
        for (int i = 1; i < c.length; i++) {
            if (c[i] > c[best]) {
                best = i;
            }
        }
        return best;
    }

    /**
     * @param field the field's index
     * @return the energy of the eigenstate with the largest share of the reference, relative to the
     *         reference's zero-field energy, Hz
     * @throws IllegalStateException when the map was solved for energies only
     */
    public double referenceShiftHz(int field) {
        return energiesRelativeHz(field)[strongestIndex(field)];
    }
}
