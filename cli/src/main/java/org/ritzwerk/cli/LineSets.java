package org.ritzwerk.cli;

import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.Optional;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.synth.LineColumns;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataFileException;
import org.ritzwerk.refdata.LineListFiles;
import org.ritzwerk.refdata.ReferenceDataException;

/** The line lists that --lines (and --lamp) name: a user's file or a data set id. */
final class LineSets {

    private LineSets() {
    }

    /**
     * The typed load of {@link DataContext#lineList}, with the option named when the set is of
     * another kind.
     *
     * @param context the data context
     * @param set     a path to a line-list file, or a data set id such as {@code lamp-ne-i}
     * @param option  the option that named it, for messages
     * @return the line list
     * @throws OptionException when the set is not a line list
     */
    static LineList load(DataContext context, String set, String option) {
        try {
            return context.lineList(set);
        } catch (ReferenceDataException e) {
            if (ReferenceDataException.WRONG_KIND.equals(e.code())) {
                throw new OptionException(option + " " + e.getMessage(), e);
            }
            // A name that looks like a file is a missing file (the context says so): name the option.
            if (ReferenceDataException.NO_SUCH_FILE.equals(e.code())) {
                throw new OptionException(option + " " + e.getMessage(), e);
            }
            throw e;
        }
    }

    /**
     * A --lines file beyond the whole-file reader's limits (64 MiB, a million rows) read as
     * columns instead, streaming from the disk ({@link LineListFiles#readColumns}); or empty when
     * the whole-file reader refused the set for another reason, which then stands.
     *
     * @param set     what --lines named
     * @param refusal the whole-file reader's refusal
     * @return the columns, when the refusal was only the file's size
     * @throws DataFileException with every problem the streaming reader finds
     */
    static Optional<LineColumns> streamedWhenTooLarge(String set, DataFileException refusal) {
        boolean tooLarge = DataFileException.TOO_LARGE.equals(refusal.code()) || refusal.problems().stream()
                .anyMatch(p -> DataFileException.TOO_LARGE.equals(p.code()));
        Path path;
        try {
            path = Path.of(set);
        } catch (InvalidPathException e) {
            return Optional.empty();
        }
        if (!tooLarge || !Files.isRegularFile(path)) {
            return Optional.empty();
        }
        return Optional.of(LineListFiles.readColumns(path, DataKind.LINES));
    }
}
