package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.function.DoubleConsumer;

/**
 * Progress of long work on standard error, shown only when standard error is a terminal (a
 * pipe or a file gets nothing, so logs stay clean). Updates at most ten times a second.
 */
final class Progress implements DoubleConsumer {

    private final PrintWriter err;
    private final String what;
    private final boolean shown;
    private final long start = System.nanoTime();
    private long lastShown;

    private Progress(PrintWriter err, String what, boolean shown) {
        this.err = err;
        this.what = what;
        this.shown = shown;
    }

    /**
     * @param err  standard error
     * @param what what is being done, e.g. {@code rendering 4000 lines}
     * @return a progress line on a terminal, or one that shows nothing
     */
    static Progress on(PrintWriter err, String what) {
        return new Progress(err, what, System.console() != null);
    }

    @Override
    public void accept(double fraction) {
        if (!shown) {
            return;
        }
        long now = System.nanoTime();
        if (fraction < 1 && now - lastShown < 100_000_000L) {
            return;
        }
        lastShown = now;
        err.print(String.format(Locale.ROOT, "\r%s: %3.0f %% (%.1f s)", what, 100 * fraction, (now - start) / 1e9));
        if (fraction >= 1) {
            err.println();
        }
        err.flush();
    }
}
