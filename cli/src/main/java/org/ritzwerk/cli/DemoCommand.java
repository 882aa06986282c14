package org.ritzwerk.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code ritzwerk demo}: the invented scenario of {@link DemoScenario}, run end to end on data
 * the library generates with fixed seeds.
 */
@Command(name = "demo",
        mixinStandardHelpOptions = true,
        header = "Run the built-in example scenario and write its report, files and plots.",
        description = "Run the built-in example scenario (invented; all data generated with fixed seeds): a lab "
                + "calibrates its spectrometer with a neon lamp, identifies the lines of a H-D-He discharge "
                + "(velocity, isotope shift), estimates its temperature and density, and plans a rubidium "
                + "Rydberg sensor's lasers and microwaves. Prints a report and writes the spectra, the "
                + "calibration and PNG plots into a folder.",
        footer = {"", "Examples:",
            "  ritzwerk demo",
            "  ritzwerk demo --out-dir /tmp/wrenfield"})
final class DemoCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = "--out-dir", paramLabel = "FOLDER", defaultValue = "ritzwerk-demo",
            description = "Where the files go (created if needed). Default: ${DEFAULT-VALUE}.")
    Path folder;

    @Override
    public Integer call() throws IOException {
        new DemoScenario(folder, spec.commandLine().getOut(), Runtime.getRuntime().availableProcessors(),
                DataOptions.context(List.of())).run();
        return 0;
    }
}
