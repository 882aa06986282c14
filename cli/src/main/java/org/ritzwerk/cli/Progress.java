package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.function.DoubleConsumer;

/**
 * Progress of long work on standard error, shown only on a terminal (a pipe or a file gets
 * nothing, so logs stay clean), from one second on (quick work shows nothing). Updates at most ten
 * times a second, with the time taken and, once a few per cent are done, an estimate of the time
 * left (from the rate so far). Work whose share
 * done is unknown gets a {@link #ticking} line with the time taken. Ctrl-C stops the work: the
 * output files of a command are written under temporary names and removed (see the refdata
 * OutputFiles), so nothing half-written is left.
 */
final class Progress implements DoubleConsumer {

    /** Whether standard error is a terminal, found once. */
    private static final boolean TERMINAL = standardErrorIsTerminal();

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
        return new Progress(err, what, TERMINAL);
    }

    @Override
    public void accept(double fraction) {
        if (!shown) {
            return;
        }
        long now = System.nanoTime();
        if (lastShown == 0 && (fraction >= 1 || now - start < 1_000_000_000L)) {
            return;     // work done within a second shows nothing
        }
        if (fraction < 1 && now - lastShown < 100_000_000L) {
            return;
        }
        lastShown = now;
        err.print("\r" + line(what, fraction, (now - start) / 1e9));
        if (fraction >= 1) {
            err.println();
        }
        err.flush();
    }

    /**
     * @return whether standard error is a terminal: on Linux from what file descriptor 2 is (so
     *         that {@code ritzwerk lines ... > lines.csv} still shows progress), elsewhere whether
     *         the JVM has a console (standard input and output both terminals)
     */
    private static boolean standardErrorIsTerminal() {
        try {
            String target = java.nio.file.Files.readSymbolicLink(java.nio.file.Path.of("/proc/self/fd/2")).toString();
            return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty");
        } catch (java.io.IOException | UnsupportedOperationException | SecurityException e) {
            return System.console() != null;
        }
    }

    /**
     * @param what    what is being done
     * @param fraction the share done, 0 to 1
     * @param seconds the time taken so far
     * @return the progress line: share done, time taken and, from 2 % done and 2 s on, the time
     *         left at the rate so far
     */
    static String line(String what, double fraction, double seconds) {
        String text = String.format(Locale.ROOT, "%s: %3.0f %% (%.1f s", what, 100 * fraction, seconds);
        if (fraction >= 0.02 && fraction < 1 && seconds >= 2) {
            text += ", about " + duration(seconds * (1 - fraction) / fraction) + " left";
        }
        return text + ")   ";
    }

    /**
     * @param seconds a time, not negative
     * @return it in words a person reads at a glance: {@code 40 s}, {@code 12 min}, {@code 3.5 h},
     *         {@code 2.0 days}
     */
    static String duration(double seconds) {
        if (seconds < 90) {
            return String.format(Locale.ROOT, "%.0f s", seconds);
        }
        if (seconds < 90 * 60) {
            return String.format(Locale.ROOT, "%.0f min", seconds / 60);
        }
        if (seconds < 48 * 3600) {
            return String.format(Locale.ROOT, "%.1f h", seconds / 3600);
        }
        return String.format(Locale.ROOT, "%.1f days", seconds / 86400);
    }

    /** A {@link #ticking} line; closing it ends the line (again: nothing). */
    interface Running extends AutoCloseable {
        @Override
        void close();
    }

    /**
     * A line that shows the time taken, once a second, while work whose share done is unknown
     * runs (a daemon thread); closing it ends the line. Nothing is shown off a terminal.
     *
     * @param err  standard error
     * @param what what is being done
     * @return the running line, to close when the work is done
     */
    static Running ticking(PrintWriter err, String what) {
        if (!TERMINAL) {
            return () -> { };
        }
        long begin = System.nanoTime();
        Thread ticker = new Thread(() -> {
            try {
                while (true) {
                    Thread.sleep(1000);
                    synchronized (err) {
                        err.print(String.format(Locale.ROOT, "\r%s (%.0f s)", what, (System.nanoTime() - begin) / 1e9));
                        err.flush();
                    }
                }
            } catch (InterruptedException e) {
                // closed
            }
        }, "ritzwerk-progress");
        ticker.setDaemon(true);
        ticker.start();
        java.util.concurrent.atomic.AtomicBoolean closed = new java.util.concurrent.atomic.AtomicBoolean();
        return () -> {
            if (closed.getAndSet(true)) {
                return;
            }
            ticker.interrupt();
            try {
                ticker.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            if (System.nanoTime() - begin >= 1_000_000_000L) {
                synchronized (err) {
                    err.println();
                    err.flush();
                }
            }
        };
    }
}
