package org.ritzwerk.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.OutputFiles;
import picocli.CommandLine.Option;

/**
 * The --data option of every command that uses reference data (a picocli mixin), and the one way
 * the command line builds its {@link DataContext}: every provider on the class path (built-in and
 * third-party jars) with the user's files added, which take precedence over both (the registry's
 * order: user file, third party, built-in).
 */
final class DataOptions {

    @Option(names = "--data", paramLabel = "FILE",
            description = "Use a data file of your own before the built-in and provider data: a line list, level "
                    + "table, quantum-defect set or isotope table (`ritzwerk data check FILE` checks one). Repeatable.")
    List<Path> files = new ArrayList<>();

    private DataContext context;

    /** @return the context of the providers on the class path and the --data files, built once per command */
    DataContext context() {
        if (context == null) {
            context = context(files);
        }
        return context;
    }

    /**
     * @param files the user's files, in the order given
     * @return the context of every provider on the class path with those files added
     * @throws org.ritzwerk.refdata.DataFileException when a file does not read
     */
    static DataContext context(List<Path> files) {
        DataContext context = DataContext.discoverDefault();
        for (Path file : files) {
            context = context.withUserFile(file);
        }
        return context;
    }

    /**
     * The files a command reads besides its own positional ones, for the output checks: every
     * {@code --lines} value that is a path (an id such as {@code lamp-ne-i} is not) and every
     * {@code --data} file.
     *
     * @param lineSets the command's --lines values
     * @return the inputs, named by their options
     */
    List<OutputFiles.Named> inputs(List<String> lineSets) {
        List<OutputFiles.Named> inputs = new ArrayList<>();
        for (String set : lineSets) {
            try {
                inputs.add(new OutputFiles.Named("--lines", Path.of(set)));
            } catch (java.nio.file.InvalidPathException e) {
                // a data set id, not a file
            }
        }
        for (Path file : files) {
            inputs.add(new OutputFiles.Named("--data", file));
        }
        return inputs;
    }
}
