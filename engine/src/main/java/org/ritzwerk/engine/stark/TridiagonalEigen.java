package org.ritzwerk.engine.stark;

import dev.ludovic.netlib.lapack.JavaLAPACK;
import dev.ludovic.netlib.lapack.LAPACK;
import java.lang.invoke.MethodHandle;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.MethodType;

/**
 * The symmetric tridiagonal eigenproblem of a Stark map, solved by reference LAPACK in its pure-Java
 * translation ({@code dev.ludovic.netlib:lapack}'s {@link JavaLAPACK}; no native code is loaded):
 * <ul>
 * <li>eigenvalues only: {@code DSTERF}, the root-free QL/QR iteration of Pal, Walker and Kahan
 * (as LAPACK's routine documentation names it; E. Anderson et al., LAPACK Users' Guide, 3rd ed.,
 * SIAM (1999)), O(n^2);</li>
 * <li>eigenvalues and eigenvectors: {@code DSTEMR}, the multiple relatively robust representations
 * algorithm (I. S. Dhillon, B. N. Parlett and C. Voemel, ACM Trans. Math. Softw. 32, 533 (2006)),
 * O(n^2) for all n vectors, where the implicit QL with accumulated rotations costs O(n^3); with
 * {@code RANGE = 'I'} only the vectors of an index range of eigenvalues, O(n k) for k of them;</li>
 * <li>the eigenvectors of a few known eigenvalues: {@code DSTEIN}, inverse iteration (see
 * {@link #sharesByInverseIteration}).</li>
 * </ul>
 * Of the eigenvectors only one number each is kept: the squared projection of a tracked vector
 * (the reference state carried through the band reduction). LAPACK's saved machine constants
 * ({@code DLAMCH}) are set by a first call in this class's initialiser, so that every thread that
 * uses the class sees them; afterwards every call works on its own arrays, so the class is
 * thread-safe.
 *
 * <p>The routines take LAPACK's output holders ({@code org.netlib.util.intW}, {@code booleanW}),
 * which live in the translation's jar; that jar declares no module name, so the engine never names
 * its types: they are reached through method handles (reflection reads every module), and the
 * engine's module descriptor requires only {@code dev.ludovic.netlib.lapack}, a declared name.
 */
final class TridiagonalEigen {

    private static final LAPACK LAPACK = JavaLAPACK.getInstance();
    private static final MethodHandle NEW_INT;
    private static final MethodHandle INT_VALUE;
    private static final MethodHandle NEW_BOOLEAN;
    private static final MethodHandle DSTERF;
    private static final MethodHandle DSTEMR;
    private static final MethodHandle DSTEIN;
    /**
     * The most eigenvectors {@link #sharesByInverseIteration} computes: DSTEIN orthogonalises each vector
     * against the earlier ones of its cluster, O(n k^2), which passes DSTEMR's O(n k) with a large
     * constant at about this many (a timing of the two calls at n = 1,008 outside JMH, 2026-12-04: 106
     * vectors in 15 ms against 32 ms; StarkMapOneCoreBenchmark times the whole solve).
     */
    static final int MAX_INVERSE_ITERATION_VECTORS = 150;

    static {
        try {
            ClassLoader loader = LAPACK.class.getClassLoader();
            Class<?> intW = Class.forName("org.netlib.util.intW", true, loader);
            Class<?> booleanW = Class.forName("org.netlib.util.booleanW", true, loader);
            MethodHandles.Lookup lookup = MethodHandles.publicLookup();
            NEW_INT = lookup.findConstructor(intW, MethodType.methodType(void.class, int.class));
            INT_VALUE = lookup.findGetter(intW, "val", int.class);
            NEW_BOOLEAN = lookup.findConstructor(booleanW, MethodType.methodType(void.class, boolean.class));
            DSTERF = lookup.findVirtual(LAPACK.class, "dsterf", MethodType.methodType(void.class, int.class,
                    double[].class, double[].class, intW));
            DSTEMR = lookup.findVirtual(LAPACK.class, "dstemr", MethodType.methodType(void.class, String.class,
                    String.class, int.class, double[].class, double[].class, double.class, double.class, int.class,
                    int.class, intW, double[].class, double[].class, int.class, int.class, int[].class, booleanW,
                    double[].class, int.class, int[].class, int.class, intW));
            DSTEIN = lookup.findVirtual(LAPACK.class, "dstein", MethodType.methodType(void.class, int.class,
                    double[].class, double[].class, int.class, double[].class, int[].class, int[].class,
                    double[].class, int.class, double[].class, int[].class, int[].class, intW));
        } catch (ReflectiveOperationException e) {
            throw new ExceptionInInitializerError(e);
        }
        eigenvalues(new double[] {1, 2}, new double[] {0.5});
    }

    private TridiagonalEigen() {
    }

    /**
     * @param diagonal    the diagonal, n values, destroyed
     * @param offDiagonal the first off-diagonal, n - 1 values, destroyed
     * @return the eigenvalues, ascending
     * @throws ArithmeticException when the iteration does not converge (LAPACK's INFO &gt; 0)
     */
    static double[] eigenvalues(double[] diagonal, double[] offDiagonal) {
        int n = diagonal.length;
        double[] e = offDiagonal.length == 0 ? new double[1] : offDiagonal;
        Object info = holder(0);
        try {
            DSTERF.invoke(LAPACK, n, diagonal, e, info);
        } catch (Throwable t) {
            throw rethrow("DSTERF", t);
        }
        check("DSTERF", value(info));
        return diagonal;
    }

    /**
     * @param diagonal    the diagonal, n values, destroyed
     * @param offDiagonal the first off-diagonal, n - 1 values, not changed
     * @param tracked     a vector of n values in the tridiagonal basis
     * @param shares      filled with {@code (tracked . v_i)^2} for each eigenvector v_i, in the order of
     *                    the eigenvalues
     * @return the eigenvalues, ascending
     * @throws ArithmeticException when the algorithm fails (LAPACK's INFO &ne; 0)
     */
    static double[] eigenvaluesAndShares(double[] diagonal, double[] offDiagonal, double[] tracked, double[] shares) {
        return dstemr(diagonal, offDiagonal, tracked, -1, -1, shares);
    }

    /**
     * The shares of a contiguous run of eigenstates: {@code DSTEMR} with {@code RANGE = 'I'} computes
     * the eigenvectors of the eigenvalues with (0-based, ascending) indices {@code first} to
     * {@code last} only, O(n k) for k vectors after the representation tree is built.
     *
     * @param diagonal    the diagonal, n values, not changed
     * @param offDiagonal the first off-diagonal, n - 1 values, not changed
     * @param tracked     a vector of n values in the tridiagonal basis
     * @param first       the index of the lowest eigenvalue wanted, 0 &le; first &le; last
     * @param last        the index of the highest eigenvalue wanted, last &lt; n
     * @return {@code (tracked . v_i)^2} for i = first to last, in that order
     * @throws ArithmeticException when the algorithm fails (LAPACK's INFO &ne; 0) or finds another
     *                             number of eigenvalues
     */
    static double[] sharesOfIndexRange(double[] diagonal, double[] offDiagonal, double[] tracked, int first,
            int last) {
        int n = diagonal.length;
        if (first < 0 || last < first || last >= n) {
            throw new IllegalArgumentException("eigenvalue indices must satisfy 0 <= first <= last < " + n + ", got "
                    + first + " to " + last);
        }
        double[] shares = new double[last - first + 1];
        dstemr(diagonal.clone(), offDiagonal, tracked, first, last, shares);
        return shares;
    }

    /**
     * DSTEMR with eigenvectors, every eigenpair ({@code RANGE = 'A'}, first and last -1) or those of
     * the indices first to last ({@code RANGE = 'I'}), and each vector's share of tracked.
     *
     * @param d           the diagonal, n values, destroyed
     * @param offDiagonal the first off-diagonal, n - 1 values, not changed
     * @param tracked     a vector of n values in the tridiagonal basis
     * @param first       the lowest index wanted (0-based), or -1 for all
     * @param last        the highest index wanted, or -1 for all
     * @param shares      filled with {@code (tracked . v_i)^2} for the vectors found, in order
     * @return the eigenvalues, ascending (the first {@code shares.length} are those found)
     */
    private static double[] dstemr(double[] d, double[] offDiagonal, double[] tracked, int first, int last,
            double[] shares) {
        int n = d.length;
        boolean all = first < 0;
        int k = all ? n : last - first + 1;
        double[] e = new double[n];
        System.arraycopy(offDiagonal, 0, e, 0, n - 1);
        double[] w = new double[n];
        double[] z = new double[n * k];
        int[] support = new int[2 * k];
        double[] work = new double[18 * n];
        int[] iwork = new int[10 * n];
        Object found = holder(0);
        Object info = holder(0);
        try {
            DSTEMR.invoke(LAPACK, "V", all ? "A" : "I", n, d, e, 0.0, 0.0, all ? 0 : first + 1, all ? 0 : last + 1,
                    found, w, z, n, k, support, NEW_BOOLEAN.invoke(true), work, work.length, iwork, iwork.length,
                    info);
        } catch (Throwable t) {
            throw rethrow("DSTEMR", t);
        }
        check("DSTEMR", value(info));
        if (value(found) != k) {
            throw new ArithmeticException(all ? "DSTEMR found " + value(found) + " of " + n + " eigenvalues"
                    : "DSTEMR found " + value(found) + " of the " + k + " eigenvalues " + (first + 1) + " to "
                    + (last + 1));
        }
        for (int i = 0; i < k; i++) {
            double overlap = 0;
            int column = i * n;
            for (int j = 0; j < n; j++) {
                overlap += z[column + j] * tracked[j];
            }
            shares[i] = overlap * overlap;
        }
        return w;
    }

    /**
     * The shares of a contiguous run of eigenstates by inverse iteration: LAPACK's {@code DSTEIN}
     * (inverse iteration with the tridiagonal LU factorisation, each vector orthogonalised against
     * the earlier ones whose eigenvalues lie within 1e-3 of the matrix's norm; LAPACK Users' Guide,
     * 3rd ed., SIAM (1999)) from eigenvalues already computed ({@code DSTERF}), so no eigenvalue is
     * searched for again. O(n k) for the solves and O(n k^2) for the orthogonalisation of k vectors in
     * one cluster. Declines, returning null, where DSTEIN is not the safe choice: when the run holds
     * more than {@link #MAX_INVERSE_ITERATION_VECTORS} vectors, when an off-diagonal element is
     * negligible (the matrix splits, as at zero field, where the eigenvalues of the blocks interleave
     * and DSTEIN would need them block by block) or when a vector does not converge (LAPACK's INFO
     * &gt; 0); {@link #sharesOfIndexRange} ({@code DSTEMR}) then gives them.
     *
     * @param diagonal    the diagonal, n values, not changed
     * @param offDiagonal the first off-diagonal, n - 1 values, not changed
     * @param tracked     a vector of n values in the tridiagonal basis
     * @param eigenvalues every eigenvalue of the matrix, ascending (DSTERF's), not changed
     * @param first       the index of the lowest eigenvalue wanted, 0 &le; first &le; last
     * @param last        the index of the highest eigenvalue wanted, last &lt; n
     * @return {@code (tracked . v_i)^2} for i = first to last, in that order; null when declined
     */
    static double[] sharesByInverseIteration(double[] diagonal, double[] offDiagonal, double[] tracked,
            double[] eigenvalues, int first, int last) {
        int n = diagonal.length;
        if (first < 0 || last < first || last >= n) {
            throw new IllegalArgumentException("eigenvalue indices must satisfy 0 <= first <= last < " + n + ", got "
                    + first + " to " + last);
        }
        int k = last - first + 1;
        if (k > MAX_INVERSE_ITERATION_VECTORS || n < 2) {
            return null;
        }
        double ulp = Math.ulp(1.0);
        for (int i = 0; i < n - 1; i++) {
            double scale = Math.max(Math.abs(diagonal[i]), Math.abs(diagonal[i + 1]));
            if (!(Math.abs(offDiagonal[i]) > 4 * ulp * scale)) {
                return null;
            }
        }
        double[] d = diagonal.clone();
        double[] e = new double[n];
        System.arraycopy(offDiagonal, 0, e, 0, n - 1);
        double[] w = java.util.Arrays.copyOfRange(eigenvalues, first, last + 1);
        int[] block = new int[k];
        java.util.Arrays.fill(block, 1);
        int[] split = new int[n];
        split[0] = n;
        double[] z = new double[n * k];
        double[] work = new double[5 * n];
        int[] iwork = new int[n];
        int[] failed = new int[k];
        Object info = holder(0);
        try {
            DSTEIN.invoke(LAPACK, n, d, e, k, w, block, split, z, n, work, iwork, failed, info);
        } catch (Throwable t) {
            throw rethrow("DSTEIN", t);
        }
        int status = value(info);
        if (status > 0) {
            return null;
        }
        check("DSTEIN", status);
        double[] shares = new double[k];
        for (int i = 0; i < k; i++) {
            double overlap = 0;
            int column = i * n;
            for (int j = 0; j < n; j++) {
                overlap += z[column + j] * tracked[j];
            }
            shares[i] = overlap * overlap;
        }
        return shares;
    }

    private static Object holder(int initial) {
        try {
            return NEW_INT.invoke(initial);
        } catch (Throwable t) {
            throw rethrow("intW", t);
        }
    }

    private static int value(Object holder) {
        try {
            return (int) INT_VALUE.invoke(holder);
        } catch (Throwable t) {
            throw rethrow("intW", t);
        }
    }

    private static RuntimeException rethrow(String routine, Throwable t) {
        if (t instanceof RuntimeException) {
            return (RuntimeException) t;
        }
        if (t instanceof Error) {
            throw (Error) t;
        }
        return new IllegalStateException("LAPACK " + routine + " could not be called", t);
    }

    private static void check(String routine, int info) {
        if (info != 0) {
            throw new ArithmeticException("LAPACK " + routine + " failed (INFO = " + info + ")");
        }
    }
}
