package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * The help reads well at its width of 100 columns: every description is whole paragraphs (one
 * array element per paragraph, so picocli wraps it; an element that stops mid-sentence was
 * printed as a line of its own and cut the text), and every example stands on one line that fits
 * the width, so it can be copied as it is.
 */
class HelpTextTest {

    private static final int WIDTH = 100;

    @Test
    void descriptionsAreWholeParagraphsAndExamplesFitOnOneLine() {
        List<String> findings = new ArrayList<>();
        List<CommandSpec> commands = new ArrayList<>();
        collect(new CommandLine(new RitzwerkCommand()).getCommandSpec(), commands);
        assertTrue(commands.size() >= 9, "found the commands: " + commands.size());
        for (CommandSpec command : commands) {
            String name = command.qualifiedName();
            paragraphs(findings, name, command.usageMessage().description());
            for (ArgSpec arg : command.args()) {
                paragraphs(findings, name + " " + (arg.isOption() ? ((CommandLine.Model.OptionSpec) arg).longestName()
                        : arg.paramLabel()), arg.description());
            }
            for (String line : command.usageMessage().footer()) {
                if (line.startsWith("  ritzwerk ")) {
                    if (line.endsWith("\\")) {
                        findings.add(name + ": example continued on the next line: " + line);
                    }
                    if (line.length() > WIDTH) {
                        findings.add(name + ": example longer than " + WIDTH + " columns: " + line);
                    }
                }
            }
        }
        assertTrue(findings.isEmpty(), String.join("\n", findings));
    }

    /**
     * picocli formats every help text as a format string: a bare '%' (as in "8 % for s") made it print
     * "[picocli WARN] Could not format ..." three times on every {@code levels --help} and show the
     * text unformatted. Every command's help renders without a warning.
     */
    @Test
    void everyHelpRendersWithoutAPicocliWarning() {
        List<CommandSpec> commands = new ArrayList<>();
        collect(new CommandLine(new RitzwerkCommand()).getCommandSpec(), commands);
        java.io.PrintStream err = System.err;
        java.io.ByteArrayOutputStream captured = new java.io.ByteArrayOutputStream();
        List<String> findings = new ArrayList<>();
        try {
            System.setErr(new java.io.PrintStream(captured, true, java.nio.charset.StandardCharsets.UTF_8));
            for (CommandSpec command : commands) {
                captured.reset();
                String help = command.commandLine().getUsageMessage();
                String warned = captured.toString(java.nio.charset.StandardCharsets.UTF_8);
                if (warned.contains("WARN") || help.contains("%n")) {
                    findings.add(command.qualifiedName() + ": " + warned.lines().findFirst().orElse("%n in the text"));
                }
            }
        } finally {
            System.setErr(err);
        }
        assertTrue(commands.size() >= 9, "found the commands: " + commands.size());
        assertTrue(findings.isEmpty(), String.join("\n", findings));
    }

    @Test
    void theCheckFindsACutSentence() {
        List<String> findings = new ArrayList<>();
        paragraphs(findings, "x", new String[] {"Highest upper n; also the cutoff of the partition",
            "function. Default: 30."});
        paragraphs(findings, "y", new String[] {"One paragraph.", "", "Another one (with a note)."});
        assertTrue(findings.size() == 1 && findings.get(0).startsWith("x:"), findings.toString());

    }

    private static void collect(CommandSpec spec, List<CommandSpec> into) {
        into.add(spec);
        for (CommandLine sub : spec.subcommands().values()) {
            if (!into.contains(sub.getCommandSpec())) {
                collect(sub.getCommandSpec(), into);
            }
        }
    }

    /** Each non-empty element must end a sentence (or a parenthesis, a colon before a list). */
    private static void paragraphs(List<String> findings, String where, String[] description) {
        for (String element : description) {
            String text = element.strip().replaceAll("(%n)+$", "");
            if (!text.isEmpty() && !text.matches("(?s).*[.):?!]$")) {
                findings.add(where + ": description element stops mid-sentence: '" + element + "'");
            }
        }
    }
}
