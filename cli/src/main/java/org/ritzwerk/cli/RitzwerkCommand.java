package org.ritzwerk.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;
import org.ritzwerk.constants.PhysicalConstants;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The top-level {@code ritzwerk} command; its work is in the subcommands. */
@Command(name = "ritzwerk",
        mixinStandardHelpOptions = true,
        versionProvider = RitzwerkCommand.Version.class,
        description = "Atomic energy levels and spectral lines for instrument, sensor and simulation work.",
        footer = {"", "Safety: lamps, discharge tubes, plasma sources and lasers can hurt. Read the",
            "Safety section of README.md and follow your local rules before using them."},
        subcommands = {ConvertCommand.class, LevelsCommand.class, LinesCommand.class, IdentifyCommand.class,
            DataCommand.class, SynthCommand.class, CalibrateCommand.class, SeriesCommand.class, RydbergCommand.class,
            FitLevelsCommand.class, DemoCommand.class, CommandLine.HelpCommand.class})
final class RitzwerkCommand implements Runnable {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @CommandLine.Option(names = "--debug", scope = CommandLine.ScopeType.INHERIT,
            description = "On failure, also print the stack trace (for bug reports).")
    boolean debug;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /** Reads the version Maven wrote into the jar. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            Properties properties = new Properties();
            try (InputStream in = RitzwerkCommand.class.getResourceAsStream("version.properties")) {
                if (in != null) {
                    properties.load(in);
                }
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            return new String[] {
                "ritzwerk " + properties.getProperty("version", "(unknown version)"),
                "constants: " + PhysicalConstants.EDITION,
                "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vendor") + ")"
            };
        }
    }
}
