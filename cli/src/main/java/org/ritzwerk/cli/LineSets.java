package org.ritzwerk.cli;

import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.LineList;
import org.ritzwerk.refdata.DataContext;

/** The line lists that --lines (and --lamp) name: a user's file or a data set id. */
final class LineSets {

    private LineSets() {
    }

    /**
     * @param context the data context
     * @param set     a path to a line-list file, or a data set id such as {@code lamp-ne-i}
     * @param option  the option that named it, for messages
     * @return the line list
     * @throws IllegalArgumentException when the set is not a line list
     */
    static LineList load(DataContext context, String set, String option) {
        DataSet data = context.dataSet(set);
        if (!(data instanceof LineList)) {
            throw new IllegalArgumentException(option + " " + set + " is a " + data.info().kind().id()
                    + " set, not a line list");
        }
        return (LineList) data;
    }
}
