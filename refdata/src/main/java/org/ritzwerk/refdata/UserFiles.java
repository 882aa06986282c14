package org.ritzwerk.refdata;

import java.nio.file.Path;
import java.util.regex.Pattern;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;

/**
 * Reads a user's data file in either of the project's formats, telling them apart by the format
 * name the file states ({@code ritzwerk-lines} or {@code ritzwerk-levels}). Stateless.
 */
public final class UserFiles {

    private static final Pattern JSON_LEVELS = Pattern.compile("\"format\"\\s*:\\s*\"" + LevelListFiles.FORMAT + "\"");

    private UserFiles() {
    }

    /**
     * @param file a line list or level table, CSV or JSON
     * @return the data set it holds
     * @throws DataFileException with every problem found
     */
    public static DataSet read(Path file) {
        String name = file.toString();
        String text = TabularFiles.read(file);
        boolean json = TabularFiles.isJson(name, text);
        boolean levels = json ? JSON_LEVELS.matcher(text).find()
                : text.stripLeading().startsWith("# " + LevelListFiles.FORMAT);
        if (levels) {
            return json ? LevelListFiles.readJson(text, name) : LevelListFiles.readCsv(text, name);
        }
        return json ? LineListFiles.readJson(text, name, DataKind.LINES) : LineListFiles.readCsv(text, name, DataKind.LINES);
    }
}
