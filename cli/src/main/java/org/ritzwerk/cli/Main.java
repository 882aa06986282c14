package org.ritzwerk.cli;

import java.io.PrintWriter;
import picocli.CommandLine;

/** Entry point of the {@code ritzwerk} command. */
public final class Main {

    private Main() {
    }

    /** @param args command-line arguments */
    public static void main(String[] args) {
        System.exit(run(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args));
    }

    /**
     * Runs the command line with the given streams, for tests and embedding.
     *
     * @param out  standard output
     * @param err  standard error
     * @param args arguments
     * @return the exit code: 0 success, 2 bad input or usage, 1 internal error
     */
    public static int run(PrintWriter out, PrintWriter err, String... args) {
        CommandLine commandLine = new CommandLine(new RitzwerkCommand());
        // The help texts are written for 100 columns; picocli's default of 80 broke their lines
        // mid-phrase.
        commandLine.setUsageHelpWidth(100);
        commandLine.setOut(out);
        commandLine.setErr(err);
        commandLine.setExecutionExceptionHandler(new ErrorReporter());
        int code = commandLine.execute(args);
        out.flush();
        err.flush();
        return code;
    }
}
