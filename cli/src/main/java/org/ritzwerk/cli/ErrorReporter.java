package org.ritzwerk.cli;

import org.ritzwerk.RitzwerkException;
import picocli.CommandLine;

/**
 * Turns failures into one clear message on standard error: bad input (a {@link RitzwerkException},
 * which every reader, job and option check throws for what the user gave, or a file that cannot be
 * read or written) exits with 2 and no stack trace; anything else, an {@link IllegalArgumentException}
 * from a broken precondition included, is a bug, reported with exit code 1 and a request to report it. The stack trace is printed only with {@code --debug} (or {@code RITZWERK_DEBUG} set).
 */
final class ErrorReporter implements CommandLine.IExecutionExceptionHandler {

    /** Exit code for bad input. */
    static final int BAD_INPUT = 2;
    /** Exit code for an internal error. */
    static final int INTERNAL = 1;

    @Override
    public int handleExecutionException(Exception ex, CommandLine commandLine, CommandLine.ParseResult parseResult) {
        String command = commandLine.getCommandSpec().qualifiedName();
        boolean debug = debug(parseResult);
        if (ex instanceof java.io.IOException) {
            // A file the user named cannot be read or written: their input, not our bug.
            commandLine.getErr().println(command + ": " + describe((java.io.IOException) ex));
            if (debug) {
                ex.printStackTrace(commandLine.getErr());
            }
            return BAD_INPUT;
        }
        if (ex instanceof RitzwerkException) {
            commandLine.getErr().println(command + ": " + ex.getMessage());
            if (debug) {
                ex.printStackTrace(commandLine.getErr());
            }
            return BAD_INPUT;
        }
        commandLine.getErr().println(command + ": internal error: " + ex
                + (debug ? "" : " (please report it; run again with --debug for the stack trace)"));
        if (debug) {
            ex.printStackTrace(commandLine.getErr());
        }
        return INTERNAL;
    }

    private static boolean debug(CommandLine.ParseResult parseResult) {
        for (CommandLine.ParseResult p = parseResult; p != null; p = p.subcommand()) {
            if (p.hasMatchedOption("--debug")) {
                return true;
            }
        }
        return System.getenv("RITZWERK_DEBUG") != null;
    }

    /** @return a one-line account of a file-system failure, naming the path */
    static String describe(java.io.IOException e) {
        if (e instanceof java.nio.file.NoSuchFileException) {
            return "no such file or folder: " + e.getMessage();
        }
        if (e instanceof java.nio.file.AccessDeniedException) {
            return "permission denied: " + e.getMessage();
        }
        if (e instanceof java.nio.file.FileSystemException) {
            java.nio.file.FileSystemException f = (java.nio.file.FileSystemException) e;
            return "cannot use " + f.getFile() + (f.getReason() == null ? "" : ": " + f.getReason());
        }
        return "input/output error: " + e.getMessage();
    }
}
