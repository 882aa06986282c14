package org.ritzwerk.engine.hydrogenic;

import org.ritzwerk.engine.internal.angular.WignerSymbols;

/**
 * The fine-structure shares of one-electron line strengths, from the Wigner 6j symbols of
 * {@link WignerSymbols} (shared with the Rydberg package since both need them). Stateless and
 * thread-safe.
 */
final class AngularFactors {

    private AngularFactors() {
    }

    /**
     * @return {j1 j2 j3; j4 j5 j6} with every argument given doubled; 0 when a triangle fails
     */
    static double sixJ(int a, int b, int c, int d, int e, int f) {
        return WignerSymbols.sixJ(a, b, c, d, e, f);
    }

    /**
     * The share of a one-electron line strength carried by the fine-structure component
     * {@code l j -> l' j'}: {@code (2j+1)(2j'+1) {l j 1/2; j' l' 1}^2}; the shares of all
     * components of {@code l -> l'} add up to 2 = 2s + 1 (Edmonds eq. 7.1.8 with the
     * orthogonality of 6j symbols).
     */
    static double fineStructureShare(int l, int twoJ, int l2, int twoJ2) {
        double sixJ = sixJ(2 * l, twoJ, 1, twoJ2, 2 * l2, 2);
        return (twoJ + 1) * (twoJ2 + 1) * sixJ * sixJ;
    }
}
