package org.ritzwerk.cli;

import org.ritzwerk.data.LineList;
import org.ritzwerk.refdata.DataContext;
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
            throw e;
        }
    }
}
