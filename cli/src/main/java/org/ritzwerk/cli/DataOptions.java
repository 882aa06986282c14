package org.ritzwerk.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.refdata.DataContext;
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
}
