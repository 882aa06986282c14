package org.ritzwerk.cli;

import org.ritzwerk.RitzwerkException;
import picocli.CommandLine;

/**
 * Turns failures into one clear message on standard error: bad input (a {@link RitzwerkException}
 * or a refused argument) exits with 2 and no stack trace; anything else is a bug, reported with
 * exit code 1 and the stack trace only when {@code RITZWERK_DEBUG} is set.
 */
final class ErrorReporter implements CommandLine.IExecutionExceptionHandler {

    /** Exit code for bad input. */
    static final int BAD_INPUT = 2;
    /** Exit code for an internal error. */
    static final int INTERNAL = 1;

    @Override
    public int handleExecutionException(Exception ex, CommandLine commandLine, CommandLine.ParseResult parseResult) {
        String command = commandLine.getCommandSpec().qualifiedName();
        if (ex instanceof RitzwerkException || ex instanceof IllegalArgumentException) {
            commandLine.getErr().println(command + ": " + ex.getMessage());
            return BAD_INPUT;
        }
        commandLine.getErr().println(command + ": internal error: " + ex
                + " (please report it; set RITZWERK_DEBUG=1 for the stack trace)");
        if (System.getenv("RITZWERK_DEBUG") != null) {
            ex.printStackTrace(commandLine.getErr());
        }
        return INTERNAL;
    }
}
