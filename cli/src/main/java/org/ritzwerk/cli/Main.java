package org.ritzwerk.cli;

import java.io.BufferedWriter;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.util.List;
import picocli.CommandLine;

/** Entry point of the {@code ritzwerk} command. */
public final class Main {

    private Main() {
    }

    /**
     * The LAPACK binding logs a warning through java.util.logging each time it falls back from a
     * native library to its Java implementation (the usual case on a machine without one): the
     * same numbers, so the command line keeps it off the user's standard error. Held here so the
     * logger, and its level, are not collected.
     */
    private static final java.util.logging.Logger NETLIB = java.util.logging.Logger.getLogger("dev.ludovic.netlib");

    /** @param args command-line arguments */
    public static void main(String[] args) {
        NETLIB.setLevel(java.util.logging.Level.SEVERE);
        // Standard output into a file or pipe is buffered and flushed at the end, not after every
        // line: a table of millions of rows would otherwise cost a system call a row. On a terminal
        // each line shows at once, as a person reads along.
        PrintWriter out = new PrintWriter(new BufferedWriter(new OutputStreamWriter(System.out), 1 << 16),
                System.console() != null);
        System.exit(run(out, new PrintWriter(System.err, true), args));
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
        commandLine.setParameterExceptionHandler(Main::usageError);
        int code;
        try {
            code = commandLine.execute(args);
        } catch (OutOfMemoryError e) {
            // Not the user's input and not a bug to report with a stack trace: the job needs more
            // memory than this JVM was given.
            out.flush();
            err.println("ritzwerk: out of memory: the job needs more than the " + Runtime.getRuntime().maxMemory()
                    / (1024 * 1024) + " MiB of heap this Java was given; give more (for example "
                    + "JAVA_TOOL_OPTIONS=-Xmx4g) or make the job smaller");
            code = ErrorReporter.INTERNAL;
        }
        out.flush();
        err.flush();
        return code;
    }

    /**
     * A mistyped command line: the one-line error, suggestions for a misspelt option or command,
     * and where the help is; never the whole usage text. Exit code 2.
     */
    private static int usageError(CommandLine.ParameterException ex, String[] args) {
        CommandLine cmd = ex.getCommandLine();
        PrintWriter err = cmd.getErr();
        err.println(cmd.getCommandSpec().qualifiedName() + ": " + ex.getMessage());
        if (ex instanceof CommandLine.UnmatchedArgumentException unmatched) {
            for (String arg : unmatched.getUnmatched()) {
                if (arg.matches("-\\.?\\d.*")) {
                    err.println("  '" + arg + "' starts with '-', which is read as an option; quantities are not"
                            + " negative (wavelengths, wavenumbers, frequencies and energies are positive)");
                }
            }
            List<String> suggestions = unmatched.getSuggestions();
            if (!suggestions.isEmpty()) {
                err.println("  did you mean: " + String.join(", ", suggestions) + "?");
            }
        }
        err.println("  see '" + cmd.getCommandSpec().qualifiedName() + " --help'");
        err.flush();
        return ErrorReporter.BAD_INPUT;
    }
}
