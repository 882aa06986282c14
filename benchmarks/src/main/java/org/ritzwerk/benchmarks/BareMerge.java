package org.ritzwerk.benchmarks;

/** The floor of any identification: one walk over sorted peaks and lines counting close pairs. */
final class BareMerge {

    private BareMerge() {
    }

    static long pairs(double[] peaks, double[] lines, double tolerance) {
        long count = 0;
        int lo = 0;
        for (double x : peaks) {
            while (lo < lines.length && lines[lo] < x - tolerance) {
                lo++;
            }
            for (int j = lo; j < lines.length && lines[j] <= x + tolerance; j++) {
                count++;
            }
        }
        return count;
    }

    /** The naive baseline: every peak against every line, keeping the nearest within tolerance. */
    static long allPairs(double[] peaks, double[] lines, double tolerance) {
        long matched = 0;
        for (double x : peaks) {
            double best = Double.POSITIVE_INFINITY;
            for (double line : lines) {
                best = Math.min(best, Math.abs(x - line));
            }
            matched += best <= tolerance ? 1 : 0;
        }
        return matched;
    }
}
