package org.ritzwerk.engine.internal.radial;

import java.math.BigInteger;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;

/**
 * Nonrelativistic hydrogen radial dipole integrals
 * {@code <n l | r | n' l'> = integral R_nl(r) R_n'l'(r) r^3 dr} for {@code l' = l +- 1}, in units of
 * the Bohr radius for Z = 1 and an infinite nuclear mass (divide by Z and by the reduced-mass
 * ratio m_r/m_e for other ions). The radial functions are positive near the origin (the
 * convention of sympy.physics.hydrogen.R_nl).
 *
 * <p>Method: W. Gordon, Ann. Phys. (Leipzig) 2, 1031 (1929), in the form of Bethe &amp; Salpeter,
 * Quantum Mechanics of One- and Two-Electron Atoms (1957), eq. (63.2):
 * <pre>
 *   R(n,l; n',l-1) = (-1)^(n'-l) / (4 (2l-1)!) sqrt[(n+l)! (n'+l-1)! / ((n-l-1)! (n'-l)!)]
 *       (4 n n')^(l+1) (n-n')^(n+n'-2l-2) / (n+n')^(n+n')
 *       [ F(-n+l+1, -n'+l; 2l; x) - ((n-n')/(n+n'))^2 F(-n+l-1, -n'+l; 2l; x) ],
 *   x = -4 n n' / (n-n')^2,
 * </pre>
 * with F the terminating hypergeometric series; for {@code n = n'} the limit
 * {@code R(n,l; n,l-1) = -(3/2) n sqrt(n^2 - l^2)}. The alternating series cancel catastrophically
 * in floating point at large n, so the square of the integral, a rational number, is computed
 * exactly in integer arithmetic and only its square root is taken in double precision: every
 * result is correct to the last bit or two for any n (checked against sympy's exact integrals and
 * mpmath at 60+ digits up to n = 600 in {@code RadialIntegralsTest}). Cost grows roughly as n^3
 * bit operations: about a millisecond near n = 500.
 *
 * <p>Stateless and thread-safe.
 */
public final class RadialIntegrals {

    private RadialIntegrals() {
    }

    /**
     * @param n  principal quantum number of the first state, at least 1
     * @param l  orbital quantum number of the first state, 0 to n - 1
     * @param n2 principal quantum number of the second state, at least 1
     * @param l2 orbital quantum number of the second state, 0 to n2 - 1, and l +- 1
     * @return the radial dipole integral in Bohr radii (Z = 1, infinite nuclear mass)
     * @throws IllegalArgumentException naming the quantum number that is out of range
     */
    public static double dipole(int n, int l, int n2, int l2) {
        checkState(n, l, "first");
        checkState(n2, l2, "second");
        if (Math.abs(l - l2) != 1) {
            throw new IllegalArgumentException("a dipole integral needs l' = l +- 1, got l = " + l + ", l' = " + l2);
        }
        // Gordon's formula is written for (n, l) and (n', l - 1); the integral is symmetric.
        return l2 == l - 1 ? gordon(n, l, n2) : gordon(n2, l2, n);
    }

    /** Refuses a state outside 1 <= n <= {@link HydrogenLikeLines#MAX_N}, 0 <= l < n, naming {@code which} state. */
    public static void checkState(int n, int l, String which) {
        String of = which.isEmpty() ? "" : " of the " + which + " state";
        if (n < 1) {
            throw new IllegalArgumentException("principal quantum number n" + of + " must be >= 1, got " + n);
        }
        if (l < 0 || l >= n) {
            throw new IllegalArgumentException("orbital quantum number l" + of + " must be 0 to n - 1 = " + (n - 1)
                    + ", got " + l);
        }
    }

    /** R(n, l; np, l - 1) for l >= 1. */
    private static double gordon(int n, int l, int np) {
        if (n == np) {
            return -1.5 * n * Math.sqrt((double) n * n - (double) l * l);
        }
        BigInteger bn = BigInteger.valueOf(n);
        BigInteger bnp = BigInteger.valueOf(np);
        BigInteger difference = bn.subtract(bnp);
        BigInteger sum = bn.add(bnp);
        BigInteger fourNn = bn.multiply(bnp).shiftLeft(2);
        // x = -p / q with p = 4 n n', q = (n - n')^2.
        BigInteger p = fourNn;
        BigInteger q = difference.multiply(difference);
        // bracket = F1 - (d/s)^2 F2 = [F1num/F1den] - d^2/s^2 [F2num/F2den]
        BigInteger[] f1 = hypergeometric(n - l - 1, np - l, 2 * l, p, q);
        BigInteger[] f2 = hypergeometric(n - l + 1, np - l, 2 * l, p, q);
        BigInteger d2 = difference.multiply(difference);
        BigInteger s2 = sum.multiply(sum);
        BigInteger bracketNum = f1[0].multiply(f2[1]).multiply(s2).subtract(d2.multiply(f2[0]).multiply(f1[1]));
        BigInteger bracketDen = f1[1].multiply(f2[1]).multiply(s2);
        // rational part: (4nn')^(l+1) |n-n'|^(n+n'-2l-2) / (n+n')^(n+n') / (4 (2l-1)!)
        int power = n + np - 2 * l - 2;
        // (n - n')^power with power >= -1; a negative power moves to the denominator.
        BigInteger distance = difference.abs();
        BigInteger rationalNum = fourNn.pow(l + 1).multiply(distance.pow(Math.max(power, 0))).multiply(bracketNum);
        BigInteger rationalDen = sum.pow(n + np).multiply(factorial(2 * l - 1).shiftLeft(2)).multiply(bracketDen)
                .multiply(distance.pow(Math.max(-power, 0)));
        // square of the integral = rational^2 (n+l)! (n'+l-1)! / ((n-l-1)! (n'-l)!)
        BigInteger squareNum = rationalNum.multiply(rationalNum).multiply(factorial(n + l)).multiply(factorial(np + l - 1));
        BigInteger squareDen = rationalDen.multiply(rationalDen).multiply(factorial(n - l - 1)).multiply(factorial(np - l));
        double magnitude = Math.sqrt(ratio(squareNum.abs(), squareDen.abs()));
        int sign = rationalNum.signum() * rationalDen.signum();
        if (((np - l) & 1) == 1) {
            sign = -sign;
        }
        if (difference.signum() < 0 && (power & 1) == 1) {
            sign = -sign;
        }
        return sign * magnitude;
    }

    /**
     * The terminating series F(-a, -b; c; -p/q) = sum_k (-a)_k (-b)_k / ((c)_k k!) (-p/q)^k as an
     * exact fraction {numerator, denominator}.
     */
    private static BigInteger[] hypergeometric(int a, int b, int c, BigInteger p, BigInteger q) {
        int terms = Math.min(a, b);
        // term_k = T_k / D_k with T_0 = D_0 = 1 and
        // term_{k+1} / term_k = (-a+k)(-b+k) / ((c+k)(k+1)) (-p/q) = -(a-k)(b-k) p / ((c+k)(k+1) q).
        BigInteger numerator = BigInteger.ONE;
        BigInteger denominator = BigInteger.ONE;
        BigInteger termNum = BigInteger.ONE;
        for (int k = 0; k < terms; k++) {
            // Each term's denominator is the previous one times (c+k)(k+1) q, so the running sum
            // keeps the last denominator: sum' = sum * step + term.
            BigInteger step = BigInteger.valueOf((long) (c + k) * (k + 1)).multiply(q);
            termNum = termNum.multiply(BigInteger.valueOf((long) (a - k) * (b - k))).multiply(p).negate();
            numerator = numerator.multiply(step).add(termNum);
            denominator = denominator.multiply(step);
        }
        return new BigInteger[] {numerator, denominator};
    }

    private static BigInteger factorial(int k) {
        return FACTORIALS.get(k);
    }

    /** Factorials 0! to 4001!, computed once on first use (enough for n up to 2000). */
    private static final class FACTORIALS {
        private static final BigInteger[] TABLE = new BigInteger[2 * HydrogenLikeLines.MAX_N + 2];

        static {
            TABLE[0] = BigInteger.ONE;
            for (int i = 1; i < TABLE.length; i++) {
                TABLE[i] = TABLE[i - 1].multiply(BigInteger.valueOf(i));
            }
        }

        static BigInteger get(int k) {
            return TABLE[k];
        }
    }

    /** num / den as a double, for positive integers of any size, correctly rounded to ~1 ulp. */
    static double ratio(BigInteger num, BigInteger den) {
        if (num.signum() == 0) {
            return 0;
        }
        int shift = num.bitLength() - den.bitLength() - 64;
        BigInteger quotient = shift >= 0 ? num.divide(den.shiftLeft(shift)) : num.shiftLeft(-shift).divide(den);
        return Math.scalb(quotient.doubleValue(), shift);
    }
}
