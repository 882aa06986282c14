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
 * <p><b>Limit</b>: each level is diagonalised on its own, so the field's mixing of the two
 * fine-structure levels of a term (the fine-structure Paschen-Back effect) is left out;
 * {@link #fineStructureMixingHertz} gives its size. The hyperfine Paschen-Back regime is covered.
 */
public final class ZeemanStructure {

    /** Largest field accepted, tesla. */
    public static final double MAX_FIELD_TESLA = 1000;
    private static final double SHARE_FLOOR = 1e-12;

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
     * @param twoI       2 I, 0 to 40
     * @param twoJ       2 J, 1 to 40
     * @param constants  A and B of the level
     * @param gJ         its g_J
     * @param gI         g_I in units of mu_B
     * @param fieldTesla the field, tesla; 0 to {@link #MAX_FIELD_TESLA}
     * @return all (2I+1)(2J+1) eigenstates, by m_F ascending, then energy ascending
     */
    public static List<ZeemanState> eigenstates(int twoI, int twoJ, HyperfineConstants constants, double gJ,
            double gI, double fieldTesla) {
        Objects.requireNonNull(constants, "constants");
        HyperfineStructure.checkSpins(twoI, twoJ);
        checkField(fieldTesla);
        if (!Double.isFinite(gJ) || !Double.isFinite(gI)) {
            throw new IllegalArgumentException("g factors must be finite, got g_J = " + gJ + ", g_I = " + gI);
        }
        int nI = twoI + 1;
        int n = (twoJ + 1) * nI;
        double[][] h = hamiltonian(twoI, twoJ, constants, gJ, gI, fieldTesla);
        List<ZeemanState> out = new ArrayList<>();
        for (int twoMF = -(twoI + twoJ); twoMF <= twoI + twoJ; twoMF += 2) {
            List<Integer> block = new ArrayList<>();
            for (int a = 0; a < n; a++) {
                if (twoMJ(a, nI, twoJ) + twoMI(a, nI, twoI) == twoMF) {
                    block.add(a);
                }
            }
            int size = block.size();
            double[][] sub = new double[size][size];
            for (int r = 0; r < size; r++) {
                for (int c = 0; c < size; c++) {
                    sub[r][c] = h[block.get(r)][block.get(c)];
                }
            }
            EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(sub, false));
            // zero-field F labels of this block, by their Casimir energy
            List<int[]> fs = new ArrayList<>();
            for (int twoF = Math.max(Math.abs(twoI - twoJ), Math.abs(twoMF)); twoF <= twoI + twoJ; twoF += 2) {
                fs.add(new int[] {twoF});
            }
            fs.sort(Comparator.comparingDouble(f -> HyperfineStructure.shiftHertz(twoI, twoJ, f[0], constants)));
            Integer[] order = new Integer[size];
            for (int k = 0; k < size; k++) {
                order[k] = k;
            }
            double[] values = eigen.getRealEigenvalues();
            java.util.Arrays.sort(order, Comparator.comparingDouble(k -> values[k]));
            for (int rank = 0; rank < size; rank++) {
                int k = order[rank];
                double[] v = eigen.getEigenvector(k).toArray();
                double[] full = new double[n];
                int big = 0;
                for (int r = 0; r < size; r++) {
                    full[block.get(r)] = v[r];
                    big = Math.abs(v[r]) > Math.abs(v[big]) ? r : big;
                }
                if (v[big] < 0) { // a fixed phase: the largest amplitude positive
                    for (int r = 0; r < n; r++) {
                        full[r] = -full[r];
                    }
                }
                out.add(new ZeemanState(twoMF, fs.get(rank)[0], values[k], full));
            }
        }
        return List.copyOf(out);
    }

    /**
     * The m_F-resolved dipole components of the line between two levels of an isotope in a field.
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
        if (Math.abs(twoJLower - twoJUpper) > 2 || !Double.isFinite(centroidHertz)) {
            throw new IllegalArgumentException("no dipole line from 2J = " + twoJLower + " to 2J' = " + twoJUpper
                    + " at centroid " + centroidHertz + " Hz");
        }
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
                    out.add(new ZeemanComponent(l.twoF(), l.twoMF(), u.twoF(), u.twoMF(), twoQ / 2,
                            centroidHertz + u.energyHertz() - l.energyHertz(), share));
                }
            }
        }
        out.sort(Comparator.comparingDouble(ZeemanComponent::frequencyHertz));
        return List.copyOf(out);
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
        double mub = bohrMagnetonHertzPerTesla() * tesla;
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

    private static void checkField(double fieldTesla) {
        if (!(fieldTesla >= 0) || fieldTesla > MAX_FIELD_TESLA) {
            throw new IllegalArgumentException("magnetic field must be 0 to " + MAX_FIELD_TESLA + " T, got " + fieldTesla);
        }
    }
}
