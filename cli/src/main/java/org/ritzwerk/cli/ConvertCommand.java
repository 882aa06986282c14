package org.ritzwerk.cli;

import java.io.IOException;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.ritzwerk.medium.AirModels;
import org.ritzwerk.quantity.Quantity;
import org.ritzwerk.quantity.QuantityParseException;
import org.ritzwerk.quantity.QuantityText;
import org.ritzwerk.quantity.Target;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.refdata.QuantityListReader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/** {@code ritzwerk convert}: spectral positions and temperatures from one unit and medium to another. */
@Command(name = "convert",
        mixinStandardHelpOptions = true,
        header = "Convert wavelengths, wavenumbers, frequencies, photon energies and temperatures.",
        description = {"Convert wavelengths (vacuum or air), wavenumbers, frequencies, photon energies and "
                + "temperatures.",
                "",
                "A quantity is a number, an optional uncertainty, a unit and, for a wavelength, its "
                + "medium, given as one argument (in quotes when it has spaces): \"656.279 nm air\", "
                + "\"656.28(2) nm\", \"656.28 +- 0.02 nm vacuum\", \"1.8886 eV\". Units: nm um "
                + "Angstrom m cm-1 m-1 Hz kHz MHz GHz THz eV meV J K. A wavelength without a medium is in "
                + "vacuum. 'air' is standard air (Morton 2000); "
                + "air(ciddor1996:T=20C,p=101325Pa,RH=40%%,CO2=450ppm) is Ciddor 1996 at those conditions. "
                + "Temperatures convert through kT.",
                "",
                "Prints one result per quantity and target: for each quantity, every target."},
        footer = {"", "Examples:",
            "  ritzwerk convert \"656.279 nm air\" --to \"nm vacuum\"",
            "  ritzwerk convert \"15233.07 cm-1\" --to THz --to eV",
            "  ritzwerk convert \"1.8886 eV\" --to \"nm air\" --format json",
            "  ritzwerk convert --input peaks.txt --to cm-1"})
final class ConvertCommand implements Callable<Integer> {

    enum Format { text, json }

    @Spec
    CommandSpec spec;

    @Parameters(paramLabel = "QUANTITY", arity = "0..*", description = "Quantities to convert, e.g. \"656.279 nm air\".")
    List<String> quantities = new ArrayList<>();

    @Option(names = "--to", required = true, paramLabel = "UNIT[ MEDIUM]",
            description = "Target unit and, for wavelengths, medium (\"nm air\"; default vacuum). Repeatable.")
    List<String> targets = new ArrayList<>();

    @Option(names = "--input", paramLabel = "FILE",
            description = "Also read quantities from FILE, one per line; '#' starts a comment line.")
    Path input;

    @Option(names = "--air", paramLabel = "MODEL", defaultValue = "standard",
            description = "What a plain 'air' means: standard, ciddor1996 or ciddor1996:T=..,p=..,RH=..,CO2=.. "
                    + "(default: ${DEFAULT-VALUE}).")
    String air;

    @Option(names = "--digits", paramLabel = "N", defaultValue = "0",
            description = "Round values without uncertainty to N significant digits (1-17); 0 prints the "
                    + "shortest exact value (default).")
    int digits;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "Output: text (value, unit, medium) or json (one object per line). Default: ${DEFAULT-VALUE}.")
    Format format;

    @Override
    public Integer call() throws IOException {
        if (digits < 0 || digits > 17) {
            throw new OptionException("--digits must be 0 to 17, got " + digits);
        }
        QuantityText text = QuantityText.standard().withAir(AirModels.parse(air));
        List<Target> parsedTargets = new ArrayList<>();
        for (String target : targets) {
            parsedTargets.add(text.parseTarget(target));
        }
        List<String> inputs = new ArrayList<>();
        List<Quantity> values = new ArrayList<>();
        for (int i = 0; i < quantities.size(); i++) {
            inputs.add(quantities.get(i));
            values.add(parseArgument(text, i));
        }
        if (input != null) {
            for (QuantityListReader.Entry entry : readList(text, input)) {
                inputs.add(entry.raw().strip());
                values.add(entry.quantity());
            }
        }
        if (values.isEmpty()) {
            throw new OptionException("nothing to convert: give a QUANTITY or --input FILE");
        }
        boolean air = false;
        for (String given : inputs) {
            air |= given.toLowerCase(java.util.Locale.ROOT).contains("air");
        }
        for (String target : targets) {
            air |= target.toLowerCase(java.util.Locale.ROOT).contains("air");
        }
        new OptionRules(spec).refuseUnless("--air", air, "when no quantity and no --to is in air (it says what a plain"
                + " 'air' means)");
        JsonMapper json = format == Format.json ? JsonMapper.builder().build() : null;
        for (int i = 0; i < values.size(); i++) {
            for (Target target : parsedTargets) {
                Quantity result = target.convert(values.get(i));
                spec.commandLine().getOut().println(json == null
                        ? text.format(result, target.unit(), digits)
                        : json.writeValueAsString(jsonOf(json, text, inputs.get(i), result, target)));
            }
        }
        return 0;
    }

    /**
     * The i-th QUANTITY argument; a refusal of a bare number or of a bare unit or medium word (the shell split
     * {@code 656.28 nm} or {@code --to nm air} at the space) says to quote the whole quantity or target.
     */
    private Quantity parseArgument(QuantityText text, int i) {
        String given = quantities.get(i);
        try {
            return text.parse(given);
        } catch (QuantityParseException e) {
            String word = given.strip();
            boolean bareNumber = e.code().equals(QuantityParseException.MISSING_UNIT);
            boolean bareWord = e.code().equals(QuantityParseException.NO_NUMBER) && !word.contains(" ")
                    && isTargetWord(text, word);
            if (!bareNumber && !bareWord) {
                throw e;
            }
            String unit = i + 1 < quantities.size() && isTargetWord(text, quantities.get(i + 1).strip())
                    ? quantities.get(i + 1).strip() : "nm";
            throw new OptionException(e.getMessage() + (bareNumber
                    ? "; give the number and its unit as one argument, in quotes: \"" + word + " " + unit + "\""
                    : "; '" + word + "' reads as a unit or medium: quote a quantity or a --to target that has a"
                            + " space, as in \"656.28 nm air\" or --to \"nm air\""), e);
        }
    }

    private static boolean isTargetWord(QuantityText text, String word) {
        if (word.toLowerCase(java.util.Locale.ROOT).startsWith("air") || word.equalsIgnoreCase("vacuum")) {
            return true;
        }
        try {
            text.parseTarget(word);
            return true;
        } catch (QuantityParseException e) {
            return false;
        }
    }

    private static List<QuantityListReader.Entry> readList(QuantityText text, Path file) {
        return new QuantityListReader(text).read(file);
    }

    private ObjectNode jsonOf(JsonMapper json, QuantityText text, String inputText, Quantity result, Target target) {
        ObjectNode node = json.createObjectNode();
        node.put("input", inputText);
        node.put("value", result.hasUncertainty() || digits == 0
                ? BigDecimal.valueOf(result.valueIn(target.unit()))
                : new BigDecimal(text.formatNumber(result, target.unit(), digits)));
        node.put("unit", target.unit().symbol());
        if (result instanceof Wavelength) {
            Wavelength wavelength = (Wavelength) result;
            node.put("medium", wavelength.medium().label());
            if (wavelength.medium() instanceof org.ritzwerk.medium.Medium.Air) {
                node.put("airModel", ((org.ritzwerk.medium.Medium.Air) wavelength.medium()).model().spec());
            }
        }
        if (result.hasUncertainty()) {
            node.put("uncertainty", result.uncertaintyIn(target.unit()).getAsDouble());
        } else {
            node.putNull("uncertainty");
        }
        return node;
    }
}
