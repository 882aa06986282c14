package org.ritzwerk.refdata;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.Objects;
import java.util.Optional;
import java.util.function.Supplier;
import java.util.regex.Pattern;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;

/**
 * Reads a user's data file in any of the project's formats, telling them apart by what the file
 * states: a line list ({@code ritzwerk-lines}, CSV or JSON), a level table
 * ({@code ritzwerk-levels}, CSV or JSON), a quantum-defect set (first line
 * {@code # ritzwerk-quantum-defects 1}, see {@link QuantumDefectFiles}) or an isotope table (the
 * column row of {@link NuclearData#ISOTOPE_COLUMNS}, see {@link NuclearData#read}). Stateless.
 */
public final class UserFiles {

    private static final Pattern JSON_LEVELS = Pattern.compile("\"format\"\\s*:\\s*\"" + LevelListFiles.FORMAT + "\"");

    /**
     * A user's file as read: its data set and, for an isotope table, the nuclear data behind the
     * record (named after the file in messages).
     */
    record UserFile(DataSet set, Optional<NuclearData> nuclear) {
        UserFile {
            Objects.requireNonNull(set, "set");
        }
    }

    private UserFiles() {
    }

    /**
     * @param file a line list, level table, quantum-defect set or isotope table
     * @return the data set it holds (a quantum-defect set's R_M from the built-in nuclear data)
     * @throws DataFileException with every problem found
     */
    public static DataSet read(Path file) {
        return read(file, NuclearData::builtIn).set();
    }

    /**
     * @param file    a user's file in any of the formats
     * @param nuclear the nuclear data a quantum-defect set's R_M comes from (asked only for such a set)
     * @return what it holds
     * @throws DataFileException with every problem found
     */
    static UserFile read(Path file, Supplier<NuclearData> nuclear) {
        String name = file.toString();
        String text = TabularFiles.read(file);
        if (text.stripLeading().startsWith("# " + QuantumDefectFiles.FORMAT)) {
            QuantumDefectFiles.Content content = QuantumDefectFiles.read(
                    new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), name, nuclear.get());
            return new UserFile(content.defects(), Optional.empty());
        }
        boolean json = TabularFiles.isJson(name, text);
        for (String[] other : new String[][] {{PeakFiles.FORMAT, "a peak list (identify reads it)"},
            {SeriesFiles.FORMAT, "a Rydberg series (series reads it)"},
            {SpectrumFiles.FORMAT, "a spectrum (calibrate reads it)"},
            {CalibrationFiles.FORMAT, "a calibration (calibrate --apply reads it)"}}) {
            if (text.stripLeading().startsWith("# " + other[0]) || json && text.contains("\"" + other[0] + "\"")) {
                throw new ReferenceDataException(ReferenceDataException.WRONG_KIND, name + ": this is a " + other[0]
                        + " file, " + other[1] + "; a data file is a line list, level table, quantum-defect set or"
                        + " isotope table");
            }
        }
        if (!json && NuclearData.looksLikeIsotopes(text)) {
            NuclearData data = NuclearData.readUser(text, name);
            return new UserFile(data.table(), Optional.of(data));
        }
        boolean levels = json ? JSON_LEVELS.matcher(text).find()
                : text.stripLeading().startsWith("# " + LevelListFiles.FORMAT);
        DataSet set;
        if (levels) {
            set = json ? LevelListFiles.readJson(text, name) : LevelListFiles.readCsv(text, name);
        } else {
            set = json ? LineListFiles.readJson(text, name, DataKind.LINES) : LineListFiles.readCsv(text, name, DataKind.LINES);
        }
        return new UserFile(set, Optional.empty());
    }
}
