package org.ritzwerk.engine.hyperfine;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.EigenDecomposition;
import org.apache.commons.math4.legacy.linear.RealMatrix;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.internal.angular.WignerSymbols;

/**
 * The Zeeman effect on hyperfine levels: the Breit-Rabi formula of a J = 1/2 level, the full
 * hyperfine-Zeeman Hamiltonian of any level (diagonalised; any field from zero to the Paschen-Back
 * regime) and the m_F-resolved components of a line in a field. Stateless and thread-safe.
 *
 * <p><b>Hamiltonian</b> of a level in the |m_J m_I> basis (common practice; E. Arimondo, M. Inguscio
 * and P. Violino, Rev. Mod. Phys. 49, 31 (1977)), as a frequency:
 * <pre>
 *   H / h = A I.J + B [3 (I.J)^2 + 3/2 I.J - I(I+1) J(J+1)] / [2 I (2I-1) J (2J-1)]
 *           + (mu_B / h) B_field (g_J J_z + g_I I_z)
 * </pre>
 * with I.J = I_z J_z + (I_+ J_- + I_- J_+)/2 (the B term only for I, J &gt;= 1). Its eigenvalues at
 * zero field are the Casimir energies of {@link HyperfineStructure}. The matrix is real and
 * symmetric and does not couple different m_F = m_J + m_I; each m_F block is diagonalised with
 * Commons Math's {@link EigenDecomposition}.
 *
 * <p><b>Breit-Rabi formula</b> (G. Breit and I. I. Rabi, Phys. Rev. 38, 2082 (1931)) for J = 1/2,
 * with the zero-field splitting dE = A (I + 1/2) and x = (g_J - g_I) mu_B B / dE:
 * <pre>
 *   E(F = I +- 1/2, m) / h = -dE / (2 (2I+1)) + g_I mu_B m B +- (dE / 2) sqrt(1 + 4 m x / (2I+1) + x^2)
 * </pre>
 * and for the two stretched states m = +-(I + 1/2): E = A I / 2 +- (g_J / 2 + g_I I) mu_B B.
 *
 * <p><b>Constants</b>: mu_B / h = e / (4 pi m_e) and the electron spin g factor 2 (1 + a_e) from
 * CODATA 2018 ({@link PhysicalConstants}); g_J of a level by the Lande formula with g_L = 1 (the
 * reduced-mass correction 1 - m_e/M of g_L, below 2e-5 here, is left out); g_I = -(mu_I / mu_N)
 * (m_e / m_p) / I from a nuclear moment (the bare nucleus': the atom's electrons shield it, and the
 * g_I measured in the atom differs by a few tenths of a per cent, a few Hz per unit of m_F at 1e-4 T).
 *
 * <p><b>Field slopes and the field's uncertainty</b>: the Hamiltonian is H_0 + B_field M, with M the Zeeman
 * operator per tesla (mu_B / h) (g_J J_z + g_I I_z), or for a whole term (mu_B / h) (L_z + g_S S_z + g_I I_z); so by
 * the Hellmann-Feynman theorem (H. Hellmann, Einfuhrung in die Quantenchemie (1937); R. P. Feynman, Phys. Rev. 56,
 * 340 (1939); common practice) each state's energy has the exact first derivative {@code dE/dB = <psi|M|psi>}
 * ({@link ZeemanState#fieldSlopeHertzPerTesla}), and a component's frequency the difference of its two states'
 * ({@link ZeemanComponent#fieldSlopeHertzPerTesla}). Given a standard uncertainty of the field u(B), the
 * methods that take one add {@code |dE/dB| u(B)} to a state's energy uncertainty and {@code |d nu/dB| u(B)} to a
 * component's frequency uncertainty, in quadrature: first order, so good while u(B) is small against the field
 * over which the slope changes (about A / (mu_B / h): a few tenths of a tesla for the Rb and Cs ground levels, 10
 * to 60 mT for those of Li, K and Na, a few mT for Rb and Cs p3/2 and below 1 mT for Li and K p3/2; near a turning
 * point, where the slope is 0, the second-order part
 * (d^2 nu/dB^2) u(B)^2 / 2 that is left out may dominate).
 * A u(B) of 0 changes nothing, to the bit.
 *
 * <p><b>Levels and terms</b>: {@link #eigenstates} and {@link #components} diagonalise each level
 * on its own, which covers the hyperfine Paschen-Back regime but leaves out the field's mixing of
 * the two fine-structure levels of a term ({@link #fineStructureMixingHertz} gives its size);
 * {@link #termComponents} diagonalises a p term as a whole, up to the fine-structure Paschen-Back
 * regime, for the lines from an s1/2 level (the D lines).
 */
public final class ZeemanStructure {

    /** Largest field accepted, tesla. */
    public static final double MAX_FIELD_TESLA = 1000;
    /**
     * Fields below this, tesla, are diagonalised as 0: their Zeeman energies (mu_B B below 1.4e-10
     * Hz) are far below the last binary digit of a level's hyperfine energies (about 1e-7 Hz at a
     * GHz), so they change no result, while entering the matrices (down to 1e-300 and below) made
     * the eigensolver fail to converge or lose components.
     */
    static final double UNRESOLVED_FIELD_TESLA = 1e-20;
    private static final double SHARE_FLOOR = 1e-12;
    /** A = 1 Hz, B = 0: {@link #hamiltonian} with it (and no field) is dH/dA. */
    private static final HyperfineConstants UNIT_A = new HyperfineConstants(1, 0, "the derivative by A");
    /** A = 0, B = 1 Hz: {@link #hamiltonian} with it (and no field) is dH/dB. */
    private static final HyperfineConstants UNIT_B = new HyperfineConstants(0, 1, "the derivative by B");
    /** A = B = 0: {@link #hamiltonian} with it at 1 T is the Zeeman operator per tesla, dH/dB_field. */
    private static final HyperfineConstants NO_HYPERFINE = new HyperfineConstants(0, 0, "the derivative by the field");

    private ZeemanStructure() {
    }

    /** @return the Bohr magneton over h, e / (4 pi m_e), Hz per tesla (CODATA 2018: about 1.3996e10) */
    public static double bohrMagnetonHertzPerTesla() {
        return PhysicalConstants.ELEMENTARY_CHARGE.value() / (4 * Math.PI * PhysicalConstants.ELECTRON_MASS.value());
    }

    /** @return the magnitude of the free electron's g factor, 2 (1 + a_e) (CODATA 2018: 2.00231930436256) */
    public static double electronSpinG() {
        return 2 * (1 + PhysicalConstants.ELECTRON_MOMENT_ANOMALY.value());
    }

    /**
     * The Lande g factor of a one-electron level, g_L = 1, g_S = {@link #electronSpinG()}.
     *
     * @param l    orbital angular momentum, 0 to 50
     * @param twoJ 2 J, l +- 1/2 doubled
     * @return g_J (2.0023 for s1/2, 0.6659 for p1/2, 1.3341 for p3/2)
     */
    public static double landeG(int l, int twoJ) {
        if (l < 0 || l > 50 || twoJ != 2 * l + 1 && twoJ != 2 * l - 1) {
            throw new IllegalArgumentException("no one-electron level with l = " + l + " and 2j = " + twoJ);
        }
        double j = twoJ / 2.0;
        double jj = j * (j + 1);
        double ss = 0.75;
        double ll = l * (l + 1.0);
        return (jj - ss + ll) / (2 * jj) + electronSpinG() * (jj + ss - ll) / (2 * jj);
    }

    /**
     * The size of what treating a level on its own leaves out: a field mixes the two fine-structure
     * levels j = l -+ 1/2 of a one-electron term through the spin's anomalous moment. In second
     * order the m_j = +-1/2 states move most, by
     * {@code (g_S - g_L)^2 (mu_B B)^2 l (l + 1) / ((2l + 1)^2 dE_fs)} (common practice: the
     * off-diagonal element of S_z between the two levels; (2/9) (mu_B B)^2 / dE_fs for p). At
     * Li-6's 832 G it is about 30 MHz on the 2p levels; at 1 G on Rb 5p, below 1e-7 MHz.
     *
     * @param l                  the term's orbital angular momentum; 0 gives 0
     * @param fineStructureHertz the splitting E(l + 1/2) - E(l - 1/2), Hz; its magnitude is used
     * @param fieldTesla         the field, tesla, 0 to {@link #MAX_FIELD_TESLA}
     * @return the largest second-order shift left out, Hz (an estimate: where it nears the
     *         splitting itself, the mixing is strong and the shift is of the order of mu_B B)
     */
    public static double fineStructureMixingHertz(int l, double fineStructureHertz, double fieldTesla) {
        checkField(fieldTesla);
        if (l < 0 || !Double.isFinite(fineStructureHertz) || l > 0 && fineStructureHertz == 0) {
            throw new IllegalArgumentException("fine-structure mixing needs l >= 0 and a finite non-zero splitting, "
                    + "got l = " + l + ", " + fineStructureHertz + " Hz");
        }
        if (l == 0) {
            return 0;
        }
        double coupling = (electronSpinG() - 1) * bohrMagnetonHertzPerTesla() * fieldTesla;
        return coupling * coupling * l * (l + 1.0) / ((2 * l + 1.0) * (2 * l + 1.0) * Math.abs(fineStructureHertz));
    }

    /**
     * The diamagnetic shift that the Zeeman components leave out: the field's second-order term
     * {@code e^2 B^2 <x^2 + y^2> / (8 m_e)}, with {@code <x^2 + y^2> = (2/3) <r^2>} averaged over
     * directions (exact for an s level; for others it depends on m_l by tens of per cent) (common
     * practice: the A^2 term of the minimal-coupling Hamiltonian in the symmetric gauge), in hertz,
     * with a0 = h / (2 pi m_e c alpha) from CODATA 2018. Rb 5s ({@code <r^2>} about 30 a0^2) moves
     * about 0.3 MHz at 1 T; a line moves by the difference of its two levels' shifts.
     *
     * @param meanSquareRadiusBohr2 the level's {@code <r^2>}, a0^2 (for an alkali level,
     *                              {@code AlkaliAtom.expectationBohr(state, 2)}); finite, not negative
     * @param fieldTesla            the field, tesla, 0 to {@link #MAX_FIELD_TESLA}
     * @return the level's upward shift, Hz
     */
    public static double diamagneticShiftHertz(double meanSquareRadiusBohr2, double fieldTesla) {
        checkField(fieldTesla);
        if (!(meanSquareRadiusBohr2 >= 0) || Double.isInfinite(meanSquareRadiusBohr2)) {
            throw new IllegalArgumentException("<r^2> must be finite and not negative, got " + meanSquareRadiusBohr2);
        }
        double e = PhysicalConstants.ELEMENTARY_CHARGE.value();
        double m = PhysicalConstants.ELECTRON_MASS.value();
        double h = PhysicalConstants.PLANCK.value();
        double bohr = h / (2 * Math.PI * m * PhysicalConstants.SPEED_OF_LIGHT.value()
                * PhysicalConstants.FINE_STRUCTURE.value());
        return e * e * fieldTesla * fieldTesla * (2.0 / 3) * meanSquareRadiusBohr2 * bohr * bohr / (8 * m * h);
    }

    /**
     * @param momentNuclearMagnetons the nuclear magnetic moment mu_I / mu_N; finite
     * @param twoI                   2 I, 1 or more
     * @return g_I = -(mu_I / mu_N) (m_e / m_p) / I, in units of mu_B (negative for a positive moment)
     */
    public static double nuclearG(double momentNuclearMagnetons, int twoI) {
        if (!Double.isFinite(momentNuclearMagnetons) || twoI < 1) {
            throw new IllegalArgumentException("nuclear g factor needs a finite moment and I > 0, got "
                    + momentNuclearMagnetons + " and 2I = " + twoI);
        }
        double ratio = PhysicalConstants.ELECTRON_MASS.value() / PhysicalConstants.PROTON_MASS.value();
        return -momentNuclearMagnetons * ratio / (twoI / 2.0);
    }

    /**
     * The Breit-Rabi formula (see the class comment) for a J = 1/2 level.
     *
     * @param twoI            2 I, 1 to 40
     * @param twoF            2 F, 2I + 1 or 2I - 1 (F = I +- 1/2)
     * @param twoM            2 m_F, |m_F| &lt;= F
     * @param splittingHertz  the zero-field splitting E(F = I + 1/2) - E(F = I - 1/2), Hz; finite, not 0
     * @param gJ              the level's g_J
     * @param gI              g_I in units of mu_B
     * @param fieldTesla      the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @return the state's energy / h relative to the zero-field centroid, Hz
     */
    public static double breitRabiHertz(int twoI, int twoF, int twoM, double splittingHertz, double gJ, double gI,
            double fieldTesla) {
        checkField(fieldTesla);
        if (twoI < 1 || twoI > 40 || twoF != twoI + 1 && twoF != twoI - 1 || Math.abs(twoM) > twoF
                || ((twoM + twoF) & 1) != 0 || !Double.isFinite(splittingHertz) || splittingHertz == 0) {
            throw new IllegalArgumentException("Breit-Rabi needs I > 0, F = I +- 1/2, |m| <= F and a finite "
                    + "non-zero splitting; got 2I = " + twoI + ", 2F = " + twoF + ", 2m = " + twoM + ", "
                    + splittingHertz + " Hz");
        }
        double mub = bohrMagnetonHertzPerTesla() * fieldTesla;
        double i = twoI / 2.0;
        double m = twoM / 2.0;
        if (Math.abs(twoM) == twoI + 1) {
            double a = splittingHertz / (i + 0.5);
            return a * i / 2 + Math.signum(m) * (gJ / 2 + gI * i) * mub;
        }
        double x = (gJ - gI) * mub / splittingHertz;
        double root = Math.sqrt(1 + 4 * m * x / (twoI + 1) + x * x);
        double sign = twoF == twoI + 1 ? 1 : -1;
        return -splittingHertz / (2 * (twoI + 1)) + gI * m * mub + sign * splittingHertz / 2 * root;
    }

    /**
     * Diagonalises a level's hyperfine-Zeeman Hamiltonian (see the class comment).
     *
     * <p><b>Uncertainties</b> (first order): the Hamiltonian is linear in A and B, H = A H_A + B H_B + H_Z, so
     * by the Hellmann-Feynman theorem (H. Hellmann, Einfuhrung in die Quantenchemie (1937); R. P. Feynman,
     * Phys. Rev. 56, 340 (1939); common practice) each eigenvalue's derivatives are exactly
     * {@code dE/dA = <psi|H_A|psi>} and {@code dE/dB = <psi|H_B|psi>} for its normalised eigenvector psi, and
     * {@code u(E) = sqrt((dE/dA u_A)^2 + (dE/dB u_B)^2)}, A and B taken as uncorrelated (sources state no
     * covariance; GUM, JCGM 100:2008, eq. 10, from memory). At zero field the derivatives are the Casimir
     * factors, so u(E) is {@link HyperfineStructure#shiftUncertaintyHertz}. A constant whose derivative is 0
     * (below 1e-12: B of a level without a quadrupole term, or of an F whose Casimir factor of B is 0) does
     * not enter. The g factors and the field are taken as exact (for the field's uncertainty see
     * {@link #eigenstates(int, int, HyperfineConstants, double, double, double, double)}).
     *
     * @param twoI       2 I, 0 to 40
     * @param twoJ       2 J, 1 to 40
     * @param constants  A and B of the level, with their uncertainties where stated
     * @param gJ         its g_J
     * @param gI         g_I in units of mu_B
     * @param fieldTesla the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @return all (2I+1)(2J+1) eigenstates, by m_F ascending, then energy ascending, each with its energy's
     *         standard uncertainty (NaN when an uncertainty of A or B it depends on is not stated), its
     *         largest |m_J m_I> component and its slope dE/dB (Hz per tesla)
     */
    public static List<ZeemanState> eigenstates(int twoI, int twoJ, HyperfineConstants constants, double gJ,
            double gI, double fieldTesla) {
        return eigenstates(twoI, twoJ, constants, gJ, gI, fieldTesla, 0);
    }

    /**
     * {@link #eigenstates(int, int, HyperfineConstants, double, double, double)} with the field's standard
     * uncertainty too: each state's energy uncertainty takes {@code |dE/dB| u(B)} in quadrature besides the
     * parts of A and B (first order; see the class comment). A u(B) of 0 gives the same states, to the bit.
     *
     * @param twoI                  2 I, 0 to 40
     * @param twoJ                  2 J, 1 to 40
     * @param constants             A and B of the level, with their uncertainties where stated
     * @param gJ                    its g_J
     * @param gI                    g_I in units of mu_B
     * @param fieldTesla            the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @param fieldUncertaintyTesla the field's standard uncertainty, tesla; finite, not negative
     * @return all (2I+1)(2J+1) eigenstates, by m_F ascending, then energy ascending
     */
    public static List<ZeemanState> eigenstates(int twoI, int twoJ, HyperfineConstants constants, double gJ,
            double gI, double fieldTesla, double fieldUncertaintyTesla) {
        Objects.requireNonNull(constants, "constants");
        HyperfineStructure.checkSpins(twoI, twoJ);
        checkField(fieldTesla);
        checkFieldUncertainty(fieldUncertaintyTesla);
        if (!Double.isFinite(gJ) || !Double.isFinite(gI)) {
            throw new IllegalArgumentException("g factors must be finite, got g_J = " + gJ + ", g_I = " + gI);
        }
        int nI = twoI + 1;
        int n = (twoJ + 1) * nI;
        double[][] h = hamiltonian(twoI, twoJ, constants, gJ, gI, fieldTesla);
        double[][] perA = hamiltonian(twoI, twoJ, UNIT_A, 0, 0, 0);
        double[][] perB = hasQuadrupole(twoI, twoJ) ? hamiltonian(twoI, twoJ, UNIT_B, 0, 0, 0) : null;
        double[][] perTesla = hamiltonian(twoI, twoJ, NO_HYPERFINE, gJ, gI, 1);
        List<ZeemanState> out = new ArrayList<>();
        for (int twoMF = -(twoI + twoJ); twoMF <= twoI + twoJ; twoMF += 2) {
            int mf = twoMF;
            double[][] eigen = blockEigen(h, a -> twoMJ(a, nI, twoJ) + twoMI(a, nI, twoI) == mf);
            // zero-field F labels of this block, by their Casimir energy
            List<int[]> fs = new ArrayList<>();
            for (int twoF = Math.max(Math.abs(twoI - twoJ), Math.abs(twoMF)); twoF <= twoI + twoJ; twoF += 2) {
                fs.add(new int[] {twoF});
            }
            fs.sort(Comparator.comparingDouble(f -> HyperfineStructure.shiftHertz(twoI, twoJ, f[0], constants)));
            for (int rank = 0; rank < eigen[0].length; rank++) {
                double[] full = eigen[1 + rank];
                int big = 0;
                for (int r = 0; r < n; r++) {
                    big = Math.abs(full[r]) > Math.abs(full[big]) ? r : big;
                }
                if (full[big] < 0) { // a fixed phase: the largest amplitude positive
                    for (int r = 0; r < n; r++) {
                        full[r] = -full[r];
                    }
                }
                double u = quadrature(0, expectation(perA, full, 0), constants.aUncertaintyHertz());
                if (perB != null) {
                    u = quadrature(u, expectation(perB, full, 0), constants.bUncertaintyHertz());
                }
                double slope = expectation(perTesla, full, 0);
                out.add(new ZeemanState(twoMF, fs.get(rank)[0], eigen[0][rank], full,
                        withField(u, slope, fieldUncertaintyTesla),
                        dominant(full, a -> twoJ, a -> twoMJ(a, nI, twoJ), a -> twoMI(a, nI, twoI)), slope));
            }
        }
        return List.copyOf(out);
    }

    /**
     * The m_F-resolved dipole components of the line between two levels of an isotope in a field, without
     * uncertainties (the centroid's taken as not stated, so every component's is NaN).
     *
     * @param twoI          2 I, 0 to 40
     * @param twoJLower     2 J of the lower level
     * @param lower         its A and B
     * @param gJLower       its g_J
     * @param twoJUpper     2 J' of the upper level, |J - J'| &lt;= 1
     * @param upper         its A and B
     * @param gJUpper       its g_J
     * @param gI            g_I in units of mu_B
     * @param centroidHertz the line's hyperfine-free centroid frequency, Hz
     * @param fieldTesla    the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @return every component whose share of the line strength exceeds 1e-12, by frequency
     */
    public static List<ZeemanComponent> components(int twoI, int twoJLower, HyperfineConstants lower, double gJLower,
            int twoJUpper, HyperfineConstants upper, double gJUpper, double gI, double centroidHertz,
            double fieldTesla) {
        return components(twoI, twoJLower, lower, gJLower, twoJUpper, upper, gJUpper, gI, centroidHertz, Double.NaN,
                fieldTesla);
    }

    /**
     * The m_F-resolved dipole components of the line between two levels of an isotope in a field, each with its
     * frequency's standard uncertainty on its own: the centroid's and the two states' energy uncertainties
     * ({@link #eigenstates}) in quadrature, the centroid and the two levels' constants taken as independent
     * (as {@link HyperfineStructure#components} at zero field, whose uncertainties these equal at B = 0).
     *
     * @param twoI                     2 I, 0 to 40
     * @param twoJLower                2 J of the lower level
     * @param lower                    its A and B, with their uncertainties where stated
     * @param gJLower                  its g_J
     * @param twoJUpper                2 J' of the upper level, |J - J'| &lt;= 1
     * @param upper                    its A and B, with their uncertainties where stated
     * @param gJUpper                  its g_J
     * @param gI                       g_I in units of mu_B
     * @param centroidHertz            the line's hyperfine-free centroid frequency, Hz
     * @param centroidUncertaintyHertz its standard uncertainty, Hz; not negative, or NaN when not estimated
     * @param fieldTesla               the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @return every component whose share of the line strength exceeds 1e-12, by frequency, each with its slope
     *         d nu/dB (Hz per tesla); the field taken as exact
     */
    public static List<ZeemanComponent> components(int twoI, int twoJLower, HyperfineConstants lower, double gJLower,
            int twoJUpper, HyperfineConstants upper, double gJUpper, double gI, double centroidHertz,
            double centroidUncertaintyHertz, double fieldTesla) {
        return components(twoI, twoJLower, lower, gJLower, twoJUpper, upper, gJUpper, gI, centroidHertz,
                centroidUncertaintyHertz, fieldTesla, 0);
    }

    /**
     * {@link #components(int, int, HyperfineConstants, double, int, HyperfineConstants, double, double, double,
     * double, double)} with the field's standard uncertainty too: each component's frequency uncertainty takes
     * {@code |d nu/dB| u(B)} in quadrature (first order; one field error moves both states, so the component's
     * slope enters). A u(B) of 0 gives the same components, to the bit.
     *
     * @param twoI                     2 I, 0 to 40
     * @param twoJLower                2 J of the lower level
     * @param lower                    its A and B, with their uncertainties where stated
     * @param gJLower                  its g_J
     * @param twoJUpper                2 J' of the upper level, |J - J'| &lt;= 1
     * @param upper                    its A and B, with their uncertainties where stated
     * @param gJUpper                  its g_J
     * @param gI                       g_I in units of mu_B
     * @param centroidHertz            the line's hyperfine-free centroid frequency, Hz
     * @param centroidUncertaintyHertz its standard uncertainty, Hz; not negative, or NaN when not estimated
     * @param fieldTesla               the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @param fieldUncertaintyTesla    the field's standard uncertainty, tesla; finite, not negative
     * @return every component whose share of the line strength exceeds 1e-12, by frequency
     */
    public static List<ZeemanComponent> components(int twoI, int twoJLower, HyperfineConstants lower, double gJLower,
            int twoJUpper, HyperfineConstants upper, double gJUpper, double gI, double centroidHertz,
            double centroidUncertaintyHertz, double fieldTesla, double fieldUncertaintyTesla) {
        checkFieldUncertainty(fieldUncertaintyTesla);
        if (Math.abs(twoJLower - twoJUpper) > 2 || !Double.isFinite(centroidHertz)) {
            throw new IllegalArgumentException("no dipole line from 2J = " + twoJLower + " to 2J' = " + twoJUpper
                    + " at centroid " + centroidHertz + " Hz");
        }
        HyperfineStructure.checkCentroidUncertainty(centroidUncertaintyHertz);
        List<ZeemanState> lo = eigenstates(twoI, twoJLower, lower, gJLower, gI, fieldTesla);
        List<ZeemanState> up = eigenstates(twoI, twoJUpper, upper, gJUpper, gI, fieldTesla);
        int nI = twoI + 1;
        List<ZeemanComponent> out = new ArrayList<>();
        for (ZeemanState l : lo) {
            double[] a = l.amplitudes();
            for (ZeemanState u : up) {
                int twoQ = u.twoMF() - l.twoMF();
                if (Math.abs(twoQ) > 2) {
                    continue;
                }
                double[] b = u.amplitudes();
                double amp = 0;
                for (int x = 0; x < a.length; x++) {
                    if (a[x] == 0) {
                        continue;
                    }
                    int mJ = twoMJ(x, nI, twoJLower);
                    int mI = twoMI(x, nI, twoI);
                    int mJu = mJ + twoQ;
                    if (Math.abs(mJu) > twoJUpper) {
                        continue;
                    }
                    int y = (mJu + twoJUpper) / 2 * nI + (mI + twoI) / 2;
                    double sign = (((twoJUpper - mJu) / 2) & 1) == 0 ? 1 : -1;
                    amp += b[y] * a[x] * sign * WignerSymbols.threeJ(twoJUpper, 2, twoJLower, -mJu, twoQ, mJ);
                }
                double share = amp * amp / (twoI + 1);
                if (share > SHARE_FLOOR) {
                    double slope = u.fieldSlopeHertzPerTesla() - l.fieldSlopeHertzPerTesla();
                    double uf = withField(HyperfineStructure.componentUncertainty(centroidUncertaintyHertz,
                            l.energyUncertaintyHertz(), u.energyUncertaintyHertz()), slope, fieldUncertaintyTesla);
                    out.add(new ZeemanComponent(l.twoF(), l.twoMF(), u.twoF(), u.twoMF(), twoQ / 2,
                            centroidHertz + u.energyHertz() - l.energyHertz(), share, uf, l.dominant(),
                            u.dominant(), slope));
                }
            }
        }
        out.sort(Comparator.comparingDouble(ZeemanComponent::frequencyHertz));
        return List.copyOf(out);
    }

    /**
     * The m_F-resolved components of one fine-structure line from an s1/2 level to a term of
     * orbital momentum {@code lUpper} (the D1 or D2 line for p), with the upper term diagonalised as
     * a whole: both of its J levels in one |J m_J m_I> basis, their splitting, each level's hyperfine
     * operator, and the Zeeman operator mu_B B (L_z + g_S S_z) + g_I mu_B B I_z, whose S_z couples the
     * two J (from the Clebsch-Gordan coefficients of l and s = 1/2; common practice). The hyperfine
     * coupling between the two J is left out (a few MHz against splittings of GHz to THz). This
     * covers the field's mixing of the two J that {@link #components} leaves out
     * ({@link #fineStructureMixingHertz}), up to the fine-structure Paschen-Back regime. Each upper
     * state belongs to the J level it connects to at zero field (by energy order within its m_F);
     * a component's share is of that line's strength, and each line's shares sum to 1 at any field
     * (from the whole s1/2 level every p state takes the same strength). The dipole amplitudes
     * come from the orbital 3j symbols in the uncoupled basis, the same Clebsch-Gordan phases as the
     * Zeeman operator.
     *
     * @param twoI               2 I, 0 to 40
     * @param lower              A (and B) of the s1/2 level
     * @param lUpper             the upper term's l: 1 (an s1/2 level reaches p terms only)
     * @param upperLow           A and B of its J = l - 1/2 level
     * @param upperHigh          A and B of its J = l + 1/2 level
     * @param fineStructureHertz E(l + 1/2) - E(l - 1/2), Hz; finite (negative for an inverted term)
     * @param twoJUpper          which line: 2J of its upper level, 1 (D1) or 3 (D2)
     * @param gI                 g_I in units of mu_B
     * @param centroidHertz      that line's hyperfine-free centroid frequency, Hz
     * @param fieldTesla         the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @return every component of the line whose share exceeds 1e-12, by frequency (uncertainties NaN: the
     *         centroid's is taken as not stated)
     */
    public static List<ZeemanComponent> termComponents(int twoI, HyperfineConstants lower, int lUpper,
            HyperfineConstants upperLow, HyperfineConstants upperHigh, double fineStructureHertz, int twoJUpper,
            double gI, double centroidHertz, double fieldTesla) {
        return termComponents(twoI, lower, lUpper, upperLow, upperHigh, fineStructureHertz, twoJUpper, gI,
                centroidHertz, Double.NaN, fieldTesla);
    }

    /**
     * {@link #termComponents(int, HyperfineConstants, int, HyperfineConstants, HyperfineConstants, double, int,
     * double, double, double)} with each component's frequency uncertainty on its own: the centroid's and the
     * two states' energy uncertainties in quadrature. The lower state's is {@link #eigenstates}'; the upper
     * state's, by the Hellmann-Feynman theorem on the term's Hamiltonian (linear in the A and B of both J
     * levels), {@code sqrt(sum_X (<psi|H_X|psi> u_X)^2)} over A and B of p1/2 and p3/2, a constant with a
     * derivative below 1e-12 not entering (at zero field the other level's, so it equals
     * {@link HyperfineStructure#components}' uncertainty there). Left out: the uncertainty of the
     * fine-structure splitting, which enters only through the field's mixing of the two J (the derivative of
     * a component by it is the weight of the other J level in the upper state, about 1e-6 for Rb at 1 T), and
     * that of the g factors and the field (for the field's, see the overload with {@code fieldUncertaintyTesla}).
     *
     * @param twoI                     2 I, 0 to 40
     * @param lower                    A (and B) of the s1/2 level, with uncertainties where stated
     * @param lUpper                   the upper term's l: 1
     * @param upperLow                 A and B of its J = l - 1/2 level, with uncertainties where stated
     * @param upperHigh                A and B of its J = l + 1/2 level, with uncertainties where stated
     * @param fineStructureHertz       E(l + 1/2) - E(l - 1/2), Hz; finite (negative for an inverted term)
     * @param twoJUpper                which line: 2J of its upper level, 1 (D1) or 3 (D2)
     * @param gI                       g_I in units of mu_B
     * @param centroidHertz            that line's hyperfine-free centroid frequency, Hz
     * @param centroidUncertaintyHertz its standard uncertainty, Hz; not negative, or NaN when not estimated
     * @param fieldTesla               the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @return every component of the line whose share exceeds 1e-12, by frequency, each with its slope d nu/dB
     *         (Hz per tesla; the upper state's by the Hellmann-Feynman theorem on the term's Zeeman operator
     *         (mu_B / h) (L_z + g_S S_z + g_I I_z)); the field taken as exact
     */
    public static List<ZeemanComponent> termComponents(int twoI, HyperfineConstants lower, int lUpper,
            HyperfineConstants upperLow, HyperfineConstants upperHigh, double fineStructureHertz, int twoJUpper,
            double gI, double centroidHertz, double centroidUncertaintyHertz, double fieldTesla) {
        return termComponents(twoI, lower, lUpper, upperLow, upperHigh, fineStructureHertz, twoJUpper, gI,
                centroidHertz, centroidUncertaintyHertz, fieldTesla, 0);
    }

    /**
     * {@link #termComponents(int, HyperfineConstants, int, HyperfineConstants, HyperfineConstants, double, int,
     * double, double, double, double)} with the field's standard uncertainty too: each component's frequency
     * uncertainty takes {@code |d nu/dB| u(B)} in quadrature (first order; one field error moves both states, so
     * the component's slope enters). A u(B) of 0 gives the same components, to the bit.
     *
     * @param twoI                     2 I, 0 to 40
     * @param lower                    A (and B) of the s1/2 level, with uncertainties where stated
     * @param lUpper                   the upper term's l: 1
     * @param upperLow                 A and B of its J = l - 1/2 level, with uncertainties where stated
     * @param upperHigh                A and B of its J = l + 1/2 level, with uncertainties where stated
     * @param fineStructureHertz       E(l + 1/2) - E(l - 1/2), Hz; finite (negative for an inverted term)
     * @param twoJUpper                which line: 2J of its upper level, 1 (D1) or 3 (D2)
     * @param gI                       g_I in units of mu_B
     * @param centroidHertz            that line's hyperfine-free centroid frequency, Hz
     * @param centroidUncertaintyHertz its standard uncertainty, Hz; not negative, or NaN when not estimated
     * @param fieldTesla               the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @param fieldUncertaintyTesla    the field's standard uncertainty, tesla; finite, not negative
     * @return every component of the line whose share exceeds 1e-12, by frequency
     */
    public static List<ZeemanComponent> termComponents(int twoI, HyperfineConstants lower, int lUpper,
            HyperfineConstants upperLow, HyperfineConstants upperHigh, double fineStructureHertz, int twoJUpper,
            double gI, double centroidHertz, double centroidUncertaintyHertz, double fieldTesla,
            double fieldUncertaintyTesla) {
        HyperfineStructure.checkCentroidUncertainty(centroidUncertaintyHertz);
        checkFieldUncertainty(fieldUncertaintyTesla);
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(upperLow, "upperLow");
        Objects.requireNonNull(upperHigh, "upperHigh");
        checkField(fieldTesla);
        if (lUpper != 1) {
            throw new IllegalArgumentException("an s1/2 level has electric-dipole lines to p terms only, got l = "
                    + lUpper);
        }
        if (twoJUpper != 1 && twoJUpper != 3 || !Double.isFinite(fineStructureHertz)
                || !Double.isFinite(centroidHertz) || !Double.isFinite(gI)) {
            throw new IllegalArgumentException("a p-term component needs 2J' = 1 or 3 and finite frequencies; got "
                    + "2J' = " + twoJUpper + ", " + fineStructureHertz + " Hz, " + centroidHertz + " Hz, g_I = " + gI);
        }
        HyperfineStructure.checkSpins(twoI, 1);
        List<ZeemanState> lo = eigenstates(twoI, 1, lower, electronSpinG(), gI, fieldTesla);
        Term term = new Term(twoI, lUpper, upperLow, upperHigh, fineStructureHertz, gI, fieldTesla);
        double lowCentroid = twoJUpper == 2 * lUpper - 1 ? centroidHertz : centroidHertz - fineStructureHertz;
        int nI = twoI + 1;
        // the total strength of the s -> p multiplet, which no field changes; the line's zero-field part
        double lineShare = (twoJUpper + 1.0) / (2 * (2 * lUpper + 1));
        List<ZeemanComponent> out = new ArrayList<>();
        double total = 0;
        List<double[]> found = new ArrayList<>();
        List<UncoupledLabel[]> labels = new ArrayList<>();
        for (ZeemanState l : lo) {
            double[] a = l.amplitudes();
            for (int u = 0; u < term.size(); u++) {
                int twoQ = term.twoMF(u) - l.twoMF();
                if (Math.abs(twoQ) > 2) {
                    continue;
                }
                double amp = 0;
                for (int x = 0; x < a.length; x++) {
                    if (a[x] == 0) {
                        continue;
                    }
                    amp += a[x] * term.dipole(u, twoMJ(x, nI, 1), twoMI(x, nI, twoI), twoQ);
                }
                double strength = amp * amp;
                total += strength;
                if (term.twoJ(u) == twoJUpper) {
                    double slope = term.fieldSlopeHertzPerTesla(u) - l.fieldSlopeHertzPerTesla();
                    double uf = withField(HyperfineStructure.componentUncertainty(centroidUncertaintyHertz,
                            l.energyUncertaintyHertz(), term.energyUncertaintyHertz(u)), slope, fieldUncertaintyTesla);
                    found.add(new double[] {l.twoF(), l.twoMF(), term.twoF(u), term.twoMF(u), twoQ / 2.0,
                        lowCentroid + term.energyHertz(u) - l.energyHertz(), strength, uf, slope});
                    labels.add(new UncoupledLabel[] {l.dominant(), term.dominant(u)});
                }
            }
        }
        for (int k = 0; k < found.size(); k++) {
            double[] f = found.get(k);
            double share = f[6] / (total * lineShare);
            if (share > SHARE_FLOOR) {
                out.add(new ZeemanComponent((int) f[0], (int) f[1], (int) f[2], (int) f[3], (int) f[4], f[5], share,
                        f[7], labels.get(k)[0], labels.get(k)[1], f[8]));
            }
        }
        out.sort(Comparator.comparingDouble(ZeemanComponent::frequencyHertz));
        return List.copyOf(out);
    }

    /**
     * A one-electron term l (s = 1/2) with both J levels, diagonalised in a field: basis |J m_J m_I>,
     * J = l - 1/2 first, then l + 1/2; eigenstates labelled by their zero-field J and F.
     */
    private static final class Term {
        private final int l;
        private final int[] twoJOf;
        private final int[] twoMJOf;
        private final int[] twoMIOf;
        private final double[] energy;
        private final int[] twoMF;
        private final int[] twoJ;
        private final int[] twoF;
        private final double[][] vectors;
        private final double[] energyUncertainty;
        private final double[] fieldSlope;
        private final UncoupledLabel[] dominant;

        Term(int twoI, int l, HyperfineConstants low, HyperfineConstants high, double fineStructure, double gI,
                double tesla) {
            this.l = l;
            int nI = twoI + 1;
            int nLow = 2 * l * nI;
            int n = (4 * l + 2) * nI;
            twoJOf = new int[n];
            twoMJOf = new int[n];
            twoMIOf = new int[n];
            double[][] h = new double[n][n];
            for (int block = 0; block < 2; block++) {
                int tj = block == 0 ? 2 * l - 1 : 2 * l + 1;
                int offset = block == 0 ? 0 : nLow;
                double[][] hf = hamiltonian(twoI, tj, block == 0 ? low : high, 0, 0, 0);
                for (int a = 0; a < hf.length; a++) {
                    twoJOf[offset + a] = tj;
                    twoMJOf[offset + a] = ZeemanStructure.twoMJ(a, nI, tj);
                    twoMIOf[offset + a] = ZeemanStructure.twoMI(a, nI, twoI);
                    for (int b = 0; b < hf.length; b++) {
                        h[offset + a][offset + b] = hf[a][b];
                    }
                    h[offset + a][offset + a] += block == 0 ? 0 : fineStructure;
                }
            }
            double mub = bohrMagnetonHertzPerTesla() * resolved(tesla);
            double gS = electronSpinG();
            // the Zeeman operator per tesla, dH/dB_field, for the states' slopes (Hellmann-Feynman)
            double[][] perTesla = new double[n][n];
            for (int a = 0; a < n; a++) {
                for (int b = 0; b < n; b++) {
                    if (twoMJOf[a] != twoMJOf[b] || twoMIOf[a] != twoMIOf[b]) {
                        continue;
                    }
                    double orbitalAndSpin = 0;
                    for (int twoMs = -1; twoMs <= 1; twoMs += 2) {
                        int twoMl = twoMJOf[a] - twoMs;
                        if (Math.abs(twoMl) > 2 * l) {
                            continue;
                        }
                        orbitalAndSpin += clebsch(l, twoMl, twoMs, twoJOf[a], twoMJOf[a])
                                * clebsch(l, twoMl, twoMs, twoJOf[b], twoMJOf[b]) * (twoMl / 2.0 + gS * twoMs / 2.0);
                    }
                    h[a][b] += mub * orbitalAndSpin;
                    perTesla[a][b] = bohrMagnetonHertzPerTesla() * orbitalAndSpin;
                    if (a == b) {
                        h[a][a] += mub * gI * twoMIOf[a] / 2.0;
                        perTesla[a][a] += bohrMagnetonHertzPerTesla() * gI * twoMIOf[a] / 2.0;
                    }
                }
            }
            energy = new double[n];
            twoMF = new int[n];
            twoJ = new int[n];
            twoF = new int[n];
            vectors = new double[n][];
            energyUncertainty = new double[n];
            fieldSlope = new double[n];
            dominant = new UncoupledLabel[n];
            // the derivatives of H by A and B of each J level (Hellmann-Feynman), as matrices of the J block
            double[][][] perX = new double[4][][];
            double[] uX = new double[4];
            for (int block = 0; block < 2; block++) {
                int tj = block == 0 ? 2 * l - 1 : 2 * l + 1;
                HyperfineConstants c = block == 0 ? low : high;
                perX[2 * block] = hamiltonian(twoI, tj, UNIT_A, 0, 0, 0);
                uX[2 * block] = c.aUncertaintyHertz();
                perX[2 * block + 1] = hasQuadrupole(twoI, tj) ? hamiltonian(twoI, tj, UNIT_B, 0, 0, 0) : null;
                uX[2 * block + 1] = c.bUncertaintyHertz();
            }
            int k = 0;
            for (int mf = -(twoI + 2 * l + 1); mf <= twoI + 2 * l + 1; mf += 2) {
                int twoMFBlock = mf;
                double[][] eigen = blockEigen(h, a -> twoMJOf[a] + twoMIOf[a] == twoMFBlock);
                // zero-field labels (J, F) of this block, by their zero-field energy
                List<int[]> labels = new ArrayList<>();
                for (int tj : new int[] {2 * l - 1, 2 * l + 1}) {
                    for (int tf = Math.max(Math.abs(twoI - tj), Math.abs(mf)); tf <= twoI + tj; tf += 2) {
                        labels.add(new int[] {tj, tf});
                    }
                }
                labels.sort(Comparator.comparingDouble(jf -> (jf[0] == 2 * l + 1 ? fineStructure : 0)
                        + HyperfineStructure.shiftHertz(twoI, jf[0], jf[1], jf[0] == 2 * l + 1 ? high : low)));
                for (int rank = 0; rank < eigen[0].length; rank++) {
                    energy[k] = eigen[0][rank];
                    twoMF[k] = mf;
                    twoJ[k] = labels.get(rank)[0];
                    twoF[k] = labels.get(rank)[1];
                    vectors[k] = eigen[1 + rank];
                    double u = 0;
                    for (int x = 0; x < 4; x++) {
                        if (perX[x] != null) {
                            u = quadrature(u, expectation(perX[x], vectors[k], x < 2 ? 0 : nLow), uX[x]);
                        }
                    }
                    energyUncertainty[k] = u;
                    fieldSlope[k] = expectation(perTesla, vectors[k], 0);
                    dominant[k] = ZeemanStructure.dominant(vectors[k], a -> twoJOf[a], a -> twoMJOf[a],
                            a -> twoMIOf[a]);
                    k++;
                }
            }
        }

        int size() {
            return energy.length;
        }

        int twoMF(int u) {
            return twoMF[u];
        }

        int twoJ(int u) {
            return twoJ[u];
        }

        int twoF(int u) {
            return twoF[u];
        }

        double energyHertz(int u) {
            return energy[u];
        }

        double energyUncertaintyHertz(int u) {
            return energyUncertainty[u];
        }

        /** dE/dB of eigenstate u, Hz per tesla: {@code <psi|M|psi>} with the term's Zeeman operator per tesla. */
        double fieldSlopeHertzPerTesla(int u) {
            return fieldSlope[u];
        }

        UncoupledLabel dominant(int u) {
            return dominant[u];
        }

        /**
         * The amplitude of d_q from the s1/2 state |m_J, m_I> to eigenstate u, the orbital reduced
         * element taken as 1: sum over the basis of the Clebsch-Gordan decomposition into |m_l m_s>
         * times (-1)^(l - m_l) (l 1 0; -m_l q 0) (Wigner-Eckart in the orbital space).
         */
        double dipole(int u, int twoMJLower, int twoMILower, int twoQ) {
            double amp = 0;
            double[] v = vectors[u];
            for (int b = 0; b < v.length; b++) {
                if (v[b] == 0 || twoMIOf[b] != twoMILower || twoMJOf[b] != twoMJLower + twoQ) {
                    continue;
                }
                // the s1/2 state is |m_l = 0, m_s = m_J>; the p state's part with that m_s
                int twoMl = twoMJOf[b] - twoMJLower;
                if (Math.abs(twoMl) > 2 * l) {
                    continue;
                }
                double cg = clebsch(l, twoMl, twoMJLower, twoJOf[b], twoMJOf[b]);
                double sign = (((2 * l - twoMl) / 2) & 1) == 0 ? 1 : -1;
                amp += v[b] * cg * sign * WignerSymbols.threeJ(2 * l, 2, 0, -twoMl, twoQ, 0);
            }
            return amp;
        }

        /** <l m_l, 1/2 m_s | J m_J>, by the 3j symbol (Condon-Shortley phases). */
        private static double clebsch(int l, int twoMl, int twoMs, int twoJ, int twoMJ) {
            if (twoMl + twoMs != twoMJ) {
                return 0;
            }
            int phase = (2 * l - 1 + twoMJ) / 2;
            double sign = (phase & 1) == 0 ? 1 : -1;
            return sign * Math.sqrt(twoJ + 1.0) * WignerSymbols.threeJ(2 * l, 1, twoJ, twoMl, twoMs, -twoMJ);
        }
    }

    /**
     * The eigenstates of one block of a Hamiltonian (the basis states {@code inBlock} picks: one
     * m_F, which the field conserves), by rising energy.
     *
     * @return row 0 the energies; row 1 + k the k-th eigenvector over the whole basis (zero outside
     *         the block); only row 0, empty, for an empty block
     */
    private static double[][] blockEigen(double[][] h, java.util.function.IntPredicate inBlock) {
        int n = h.length;
        List<Integer> block = new ArrayList<>();
        for (int a = 0; a < n; a++) {
            if (inBlock.test(a)) {
                block.add(a);
            }
        }
        int size = block.size();
        double[][] out = new double[1 + size][];
        out[0] = new double[size];
        if (size == 0) {
            return out;
        }
        double[][] sub = new double[size][size];
        for (int r = 0; r < size; r++) {
            for (int c = 0; c < size; c++) {
                sub[r][c] = h[block.get(r)][block.get(c)];
            }
        }
        EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(sub, false));
        double[] values = eigen.getRealEigenvalues();
        Integer[] order = new Integer[size];
        for (int k = 0; k < size; k++) {
            order[k] = k;
        }
        java.util.Arrays.sort(order, Comparator.comparingDouble(k -> values[k]));
        for (int rank = 0; rank < size; rank++) {
            double[] v = eigen.getEigenvector(order[rank]).toArray();
            double[] full = new double[n];
            for (int r = 0; r < size; r++) {
                full[block.get(r)] = v[r];
            }
            out[0][rank] = values[order[rank]];
            out[1 + rank] = full;
        }
        return out;
    }

    /**
     * {@code <v|m|v>} over the block of v that starts at {@code offset} (m the size of that block).
     */
    private static double expectation(double[][] m, double[] v, int offset) {
        double sum = 0;
        for (int r = 0; r < m.length; r++) {
            if (v[offset + r] == 0) {
                continue;
            }
            double row = 0;
            for (int c = 0; c < m.length; c++) {
                row += m[r][c] * v[offset + c];
            }
            sum += v[offset + r] * row;
        }
        return sum;
    }

    /**
     * Adds {@code (derivative * u)^2} to a standard uncertainty in quadrature; a derivative below 1e-12 (a
     * constant the energy does not depend on) adds nothing, even where u is not stated (NaN).
     */
    private static double quadrature(double soFar, double derivative, double u) {
        if (Math.abs(derivative) < 1e-12) {
            return soFar;
        }
        return Math.hypot(soFar, derivative * u);
    }

    /**
     * Adds the field's part {@code |slope| u(B)} to a standard uncertainty in quadrature; a u(B) of 0 returns it
     * unchanged (to the bit), and a NaN (not estimated) stays NaN.
     */
    private static double withField(double soFar, double slopeHertzPerTesla, double fieldUncertaintyTesla) {
        if (fieldUncertaintyTesla == 0) {
            return soFar;
        }
        return Math.hypot(soFar, slopeHertzPerTesla * fieldUncertaintyTesla);
    }

    /**
     * The largest component of v and its weight: the first index whose weight is within
     * {@link UncoupledLabel#TIE} of the largest.
     */
    private static UncoupledLabel dominant(double[] v, java.util.function.IntUnaryOperator twoJ,
            java.util.function.IntUnaryOperator twoMJ, java.util.function.IntUnaryOperator twoMI) {
        double largest = 0;
        for (double x : v) {
            largest = Math.max(largest, x * x);
        }
        int big = 0;
        while (v[big] * v[big] < largest - UncoupledLabel.TIE) {
            big++;
        }
        return new UncoupledLabel(twoJ.applyAsInt(big), twoMJ.applyAsInt(big), twoMI.applyAsInt(big), v[big] * v[big]);
    }

    private static boolean hasQuadrupole(int twoI, int twoJ) {
        return twoI >= 2 && twoJ >= 2;
    }

    /** The Hamiltonian matrix in the |m_J m_I> basis, Hz. */
    static double[][] hamiltonian(int twoI, int twoJ, HyperfineConstants c, double gJ, double gI, double tesla) {
        int nI = twoI + 1;
        int n = (twoJ + 1) * nI;
        double i = twoI / 2.0;
        double j = twoJ / 2.0;
        RealMatrix ij = new Array2DRowRealMatrix(n, n);
        for (int a = 0; a < n; a++) {
            double mj = twoMJ(a, nI, twoJ) / 2.0;
            double mi = twoMI(a, nI, twoI) / 2.0;
            ij.setEntry(a, a, mi * mj);
            // I+ J-: |mj, mi> -> |mj - 1, mi + 1>
            if (mj > -j && mi < i) {
                int b = a - nI + 1;
                double v = 0.5 * Math.sqrt(i * (i + 1) - mi * (mi + 1)) * Math.sqrt(j * (j + 1) - mj * (mj - 1));
                ij.setEntry(b, a, v);
                ij.setEntry(a, b, v);
            }
        }
        RealMatrix h = ij.scalarMultiply(c.aHertz());
        if (twoI >= 2 && twoJ >= 2 && c.bHertz() != 0) {
            RealMatrix q = ij.multiply(ij).scalarMultiply(3).add(ij.scalarMultiply(1.5));
            for (int a = 0; a < n; a++) {
                q.addToEntry(a, a, -i * (i + 1) * j * (j + 1));
            }
            h = h.add(q.scalarMultiply(c.bHertz() / (2 * i * (2 * i - 1) * j * (2 * j - 1))));
        }
        double mub = bohrMagnetonHertzPerTesla() * resolved(tesla);
        for (int a = 0; a < n; a++) {
            h.addToEntry(a, a, mub * (gJ * twoMJ(a, nI, twoJ) / 2.0 + gI * twoMI(a, nI, twoI) / 2.0));
        }
        return h.getData();
    }

    private static int twoMJ(int index, int nI, int twoJ) {
        return 2 * (index / nI) - twoJ;
    }

    private static int twoMI(int index, int nI, int twoI) {
        return 2 * (index % nI) - twoI;
    }

    /** @return the field as the matrices take it: 0 below {@link #UNRESOLVED_FIELD_TESLA} */
    private static double resolved(double tesla) {
        return tesla < UNRESOLVED_FIELD_TESLA ? 0 : tesla;
    }

    private static void checkFieldUncertainty(double fieldUncertaintyTesla) {
        if (!(fieldUncertaintyTesla >= 0) || fieldUncertaintyTesla == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("the field's standard uncertainty must be finite and not negative, "
                    + "tesla, got " + fieldUncertaintyTesla);
        }
    }

    private static void checkField(double fieldTesla) {
        if (!(fieldTesla >= 0) || fieldTesla > MAX_FIELD_TESLA) {
            throw new IllegalArgumentException("magnetic field must be 0 to " + MAX_FIELD_TESLA + " T, got " + fieldTesla);
        }
    }
}
