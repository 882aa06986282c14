package org.ritzwerk.cli;

import java.util.Locale;
import java.util.Optional;

/**
 * Up-front estimates of runs that take long, so that a command says so before it starts (with the
 * time it expects and how to stop it) or refuses a run past its documented limit. The figures are
 * rough: they were measured on a 2-core build machine under load and scale with the machine; the
 * progress line's time left, measured as the run goes, is the better figure once it shows.
 * Stateless.
 */
final class WorkEstimate {

    /** Runs expected to take at least this long (seconds) are announced. */
    static final double NOTICE_SECONDS = 10;

    /** The highest --n-max of {@code levels --lifetimes} for one-electron ions. */
    static final int HYDROGEN_LIFETIMES_N_MAX = 300;

    /**
     * Seconds for the E1 lifetimes of every level n &lt;= 100 of one ion: 14 s measured (qed
     * model, exact radial integrals), with the time growing about as n^3.5 between n = 30 and 100.
     */
    private static final double HYDROGEN_LIFETIMES_AT_100 = 14;
    private static final double HYDROGEN_LIFETIMES_EXPONENT = 3.5;

    private WorkEstimate() {
    }

    /**
     * @param nMax highest n, at least 1
     * @param ions how many one-electron ions
     * @return the expected seconds for the lifetimes of every level n &lt;= nMax of those ions
     */
    static double hydrogenLifetimesSeconds(int nMax, int ions) {
        return ions * HYDROGEN_LIFETIMES_AT_100 * Math.pow(nMax / 100.0, HYDROGEN_LIFETIMES_EXPONENT);
    }

    /**
     * @param nMax highest n asked for
     * @param ions how many one-electron ions
     * @return a notice to print before the run when it is expected to take long, else empty
     * @throws OptionException past {@link #HYDROGEN_LIFETIMES_N_MAX}, with the limit and the
     *         time the run would take
     */
    static Optional<String> hydrogenLifetimes(int nMax, int ions) {
        if (ions == 0) {
            return Optional.empty();
        }
        if (nMax > HYDROGEN_LIFETIMES_N_MAX) {
            throw new OptionException(String.format(Locale.ROOT, "--lifetimes of one-electron ions goes up to"
                    + " --n-max %d (about %s); --n-max %d would take about %s; leave out --lifetimes or lower --n-max",
                    HYDROGEN_LIFETIMES_N_MAX, Progress.duration(hydrogenLifetimesSeconds(HYDROGEN_LIFETIMES_N_MAX, 1)),
                    nMax, Progress.duration(hydrogenLifetimesSeconds(nMax, ions))));
        }
        return notice("levels: the lifetimes of every level up to n = " + nMax,
                hydrogenLifetimesSeconds(nMax, ions));
    }

    /**
     * Seconds per work unit of one-electron lines ({@code HydrogenLikeLines.workUnits}): 13 s for
     * 1.47e9 units (H, 4.9-5.1 GHz, n &lt;= 300) and 11 min of processor time for 9.5e10 units (n
     * &lt;= 600), measured on the 2-core build machine under load.
     */
    private static final double HYDROGEN_LINES_SECONDS_PER_UNIT = 1e-8;

    /** The longest run of one-electron lines {@code lines} and {@code identify} start, seconds. */
    static final double HYDROGEN_LINES_LIMIT_SECONDS = 3600;

    /**
     * @param command the command, e.g. "lines"
     * @param what    its job, e.g. "the one-electron lines up to n = 400 in the window"
     * @param units the work units of the run ({@code HydrogenLikeLines.workUnits}, summed over ions)
     * @return a notice to print before the run when it is expected to take long, else empty
     * @throws OptionException when the run would take longer than {@link #HYDROGEN_LINES_LIMIT_SECONDS},
     *         with the time it would take and what to change
     */
    static Optional<String> hydrogenLines(String command, String what, double units) {
        double seconds = units * HYDROGEN_LINES_SECONDS_PER_UNIT;
        if (seconds > HYDROGEN_LINES_LIMIT_SECONDS) {
            throw new OptionException(String.format(Locale.ROOT, "%s would take about %s (a rough estimate: the"
                    + " exact radial integrals of every pair of shells with lines in the window); runs up to about"
                    + " %s are started; lower --n-max or narrow the window", what, Progress.duration(seconds),
                    Progress.duration(HYDROGEN_LINES_LIMIT_SECONDS)));
        }
        return notice(command + ": " + what, seconds);
    }

    /**
     * @param what    what will be done
     * @param seconds the expected time
     * @return a notice when the time reaches {@link #NOTICE_SECONDS}, else empty
     */
    static Optional<String> notice(String what, double seconds) {
        if (!(seconds >= NOTICE_SECONDS)) {
            return Optional.empty();
        }
        return Optional.of("note: " + what + " will take about " + Progress.duration(seconds)
                + " (a rough estimate); Ctrl-C stops it");
    }
}
