package org.ritzwerk.cli;

import java.math.BigDecimal;
import java.util.List;
import java.util.Locale;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;

/**
 * The checks every command runs on its options before any work: numbers inside the range the
 * option allows (said in the user's words and units, never echoing a NaN or an infinity the
 * program made), and options that would have no effect in the given combination, which are
 * refused naming both options instead of being silently ignored.
 */
final class OptionRules {

    private final CommandSpec spec;

    /** @param spec the command whose options are checked (its parse result tells which were given) */
    OptionRules(CommandSpec spec) {
        this.spec = spec;
    }

    /**
     * @param option an option name, e.g. {@code --l-max}
     * @return whether the user gave it on the command line, to this command or (an inherited option)
     *         to a parent (a default value does not count)
     */
    boolean given(String option) {
        // An inherited option may be given before the subcommand's name, on the parent.
        for (CommandSpec command = spec; command != null; command = command.parent()) {
            CommandLine.ParseResult result = command.commandLine().getParseResult();
            if (result != null && result.hasMatchedOption(option)) {
                return true;
            }
        }
        return false;
    }

    /**
     * Refuses an option the user gave that has no effect in this combination.
     *
     * @param option the option
     * @param useful whether it has an effect
     * @param why    the rest of the sentence after "OPTION has no effect ", naming the other option,
     *               e.g. "without --lifetimes"
     */
    void refuseUnless(String option, boolean useful, String why) {
        if (!useful && given(option)) {
            throw new OptionException(option + " has no effect " + why);
        }
    }

    /**
     * @param option  the option, for the message
     * @param value   its value
     * @param min     smallest allowed value (inclusive when {@code minInclusive})
     * @param minInclusive whether {@code min} itself is allowed
     * @param max     largest allowed value, inclusive
     * @param allowed the allowed range in the user's words and units, e.g. "a temperature above 0 and
     *                at most 1e9 K"
     * @return the value
     * @throws OptionException naming the option and the allowed range
     */
    /**
     * Refuses a PNG output whose name does not end in .png (the file would be a PNG under another
     * name).
     *
     * @param option the option, for the message
     * @param file   the file, or null when not given
     * @throws OptionException naming the option and the file
     */
    static void png(String option, java.nio.file.Path file) {
        // a device or pipe (/dev/stdout) takes the PNG under any name
        boolean special = file != null && java.nio.file.Files.exists(file) && !java.nio.file.Files.isRegularFile(file);
        if (file != null && !special && !file.toString().toLowerCase(Locale.ROOT).endsWith(".png")) {
            throw new OptionException(option + " must name a .png file, got " + file);
        }
    }

    /**
     * Refuses a repeatable option that names one value twice (a line list given twice would be
     * counted twice).
     *
     * @param option the option, for the message
     * @param values its values
     * @throws OptionException naming the value given twice
     */
    static void distinct(String option, List<String> values) {
        java.util.Set<String> seen = new java.util.HashSet<>();
        for (String v : values) {
            if (!seen.add(v.strip())) {
                throw new OptionException(option + " names '" + v.strip() + "' twice; give each once");
            }
        }
    }

    static double range(String option, double value, double min, boolean minInclusive, double max, String allowed) {
        boolean ok = (minInclusive ? value >= min : value > min) && value <= max;
        if (!ok) {
            throw new OptionException(option + " must be " + allowed + ", got " + show(value));
        }
        return value;
    }

    /**
     * A number for a message: plain when it is plain, and words instead of "NaN" or "Infinity".
     *
     * @param value a value the user gave
     * @return the text
     */
    static String show(double value) {
        if (Double.isNaN(value)) {
            return "a value that is not a number";
        }
        if (Double.isInfinite(value)) {
            return value > 0 ? "an infinite value" : "a negative infinite value";
        }
        double magnitude = Math.abs(value);
        if (magnitude == 0 || (magnitude >= 1e-4 && magnitude < 1e9)) {
            return BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
        }
        // 1e+09 reads 1e9, 2.50000e-07 reads 2.5e-7
        return String.format(Locale.ROOT, "%.6g", value).replaceFirst("\\.?0+e", "e").replace("e+", "e")
                .replaceFirst("e(-?)0+(\\d)", "e$1$2");
    }
}
