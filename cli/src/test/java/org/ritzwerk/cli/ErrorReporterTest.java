package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.NoSuchFileException;
import java.util.concurrent.Callable;
import org.junit.jupiter.api.Test;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.engine.calibrate.CalibrationException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * The two kinds of failure a command can end with: bad input (a {@link RitzwerkException} of any
 * kind, or a file that cannot be read) exits with 2 and one line; a broken precondition (an
 * {@link IllegalArgumentException} or any other exception escaping a command, which user input
 * never reaches: {@link ContractFuzzTest} holds every command to exit 2) exits with 1 and asks
 * for a bug report. The kind is told by the exception's type, never by its message.
 */
class ErrorReporterTest {

    /** A command that throws whatever the test hands it. */
    @Command(name = "probe")
    static final class Probe implements Callable<Integer> {
        Exception failure;

        @Override
        public Integer call() throws Exception {
            throw failure;
        }
    }

    private static CliTest.Run fail(Exception failure) {
        Probe probe = new Probe();
        probe.failure = failure;
        StringWriter err = new StringWriter();
        CommandLine cmd = new CommandLine(probe).setExecutionExceptionHandler(new ErrorReporter())
                .setErr(new PrintWriter(err, true));
        int code = cmd.execute();
        return new CliTest.Run(code, "", err.toString());
    }

    @Test
    void badInputIsExitTwoOnOneLine() {
        for (Exception input : new Exception[] {new OptionException("--pixels must be 2 to 50000000, got 1"),
            new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "flat.csv: the spectrum is constant"),
            new RitzwerkException("output.refused", "--out a.csv and --truth a.csv name the same file"),
            new NoSuchFileException("missing.csv")}) {
            CliTest.Run run = fail(input);
            assertEquals(ErrorReporter.BAD_INPUT, run.code(), run.err());
            assertEquals(1, run.err().strip().lines().count(), run.err());
            assertFalse(run.err().contains("internal error") || run.err().contains("Exception"), run.err());
        }
    }

    @Test
    void aBrokenPreconditionIsABugWithExitOne() {
        // Even a message that reads like bad input is a bug when its type is IllegalArgumentException.
        CliTest.Run run = fail(new IllegalArgumentException("--pixels must be 2 to 50000000, got 1"));
        assertEquals(ErrorReporter.INTERNAL, run.code(), run.err());
        assertTrue(run.err().startsWith("probe: internal error: java.lang.IllegalArgumentException: --pixels must be")
                && run.err().contains("please report it"), run.err());
        CliTest.Run state = fail(new IllegalStateException("fit did not converge"));
        assertEquals(ErrorReporter.INTERNAL, state.code(), state.err());
    }
}
