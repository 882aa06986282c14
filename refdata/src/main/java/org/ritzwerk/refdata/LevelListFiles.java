package org.ritzwerk.refdata;

import java.io.InputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.ritz.LevelDesignation;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;
import tools.jackson.databind.node.ObjectNode;

/**
 * Ritzwerk's own level-table file format ({@code ritzwerk-levels}, version 1), in CSV and JSON,
 * the sibling of {@link LineListFiles} with the same header rules, strictness and exact round
 * trip:
 * <pre>
 * # ritzwerk-levels 1
 * # id: bench-he-levels
 * # title: Helium levels used by the bench software
 * # source: ...
 * # provenance: published
 * # version: 1
 * # energy-unit: cm-1
 * species,label,energy,uncertainty,j,note
 * He I,1s2 1S0,0,,0,
 * He I,1s2s 3S1,159855.9745,0.0005,1,
 * </pre>
 * Header keys {@code id}, {@code title}, {@code source}, {@code provenance}, {@code version} and
 * {@code energy-unit} (a wavenumber or energy unit: cm-1, m-1, eV, meV, J) are required,
 * {@code note} optional. Columns {@code species}, {@code label} and {@code energy} (above the
 * species' ground state, not negative) are required; {@code uncertainty}, {@code j} (an integer
 * or half-integer such as {@code 3/2}) and {@code note} are optional. In JSON the key is
 * {@code energyUnit} and the rows are under {@code levels}. A repeated species and label is
 * refused as a duplicate. Stateless and thread-safe.
 */
public final class LevelListFiles {

    /** The format name in both encodings. */
    public static final String FORMAT = "ritzwerk-levels";
    /** The format version this reader writes and reads. */
    public static final int VERSION = 1;
    /** Columns in the order they are written. */
    public static final List<String> COLUMNS = List.of("species", "label", "energy", "uncertainty", "j", "note");

    private static final TabularFiles.Spec SPEC = new TabularFiles.Spec(FORMAT, VERSION, "energy-unit",
            List.of("id", "title", "source", "provenance", "version", "energy-unit", "note"),
            List.of("id", "title", "source", "provenance", "version", "energy-unit"), COLUMNS,
            List.of("species", "label", "energy"), List.of("energy", "uncertainty"), "levels");
    private static final Pattern J = Pattern.compile("(\\d{1,4})(/2)?");

    private LevelListFiles() {
    }

    /**
     * @param file a {@code .csv} or {@code .json} file
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList read(Path file) {
        String name = file.toString();
        String text = TabularFiles.read(file);
        return TabularFiles.isJson(name, text) ? readJson(text, name) : readCsv(text, name);
    }

    /**
     * @param in     the bytes (UTF-8), read to the end; not closed
     * @param source file name for messages; its extension picks the encoding
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList read(InputStream in, String source) {
        String text = TabularFiles.decode(in, source);
        return TabularFiles.isJson(source, text) ? readJson(text, source) : readCsv(text, source);
    }

    /**
     * @param text   the whole file
     * @param source file name for messages
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList readCsv(String text, String source) {
        return build(TabularFiles.parseCsv(SPEC, text, source));
    }

    /**
     * @param text   the whole file
     * @param source file name for messages
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList readJson(String text, String source) {
        return build(TabularFiles.parseJson(SPEC, text, source));
    }

    private static LevelList build(TabularFiles.Parsed p) {
        boolean sound = p.checkHeader();
        int before = p.problems.size();
        Provenance.Kind provenance = p.provenance();
        Unit unit = p.unit(EnumSet.of(Kind.WAVENUMBER, Kind.ENERGY));
        sound &= p.problems.size() == before;
        LevelList.Builder builder = LevelList.builder(TabularFiles.info(p, DataKind.LEVELS, provenance, sound),
                unit == null ? Unit.PER_CENTIMETRE : unit, p.header.getOrDefault("note", ""));
        Map<String, Species> speciesCache = new HashMap<>();
        Map<String, Integer> seen = new HashMap<>();
        List<Species> covered = new ArrayList<>();
        for (TabularFiles.Row row : p.rows) {
            int rowBefore = p.problems.size();
            Species species = p.species(row, speciesCache);
            String label = p.text(row, "label");
            if (label == null && row.values().get("label") == null) {
                p.rowProblem(row, "label", "data.missing-value", "label is required");
            }
            double energy = p.number(row, "energy", true);
            double uncertainty = p.number(row, "uncertainty", false);
            int twoJ = -1;
            String j = p.text(row, "j");
            if (j != null) {
                Matcher m = J.matcher(j.strip());
                if (!m.matches() || m.group(2) != null && Integer.parseInt(m.group(1)) % 2 == 0) {
                    p.rowProblem(row, "j", "data.bad-j", "j must be an integer or an odd number over 2 (e.g. 3/2), got '"
                            + j + "'");
                } else {
                    twoJ = m.group(2) != null ? Integer.parseInt(m.group(1)) : 2 * Integer.parseInt(m.group(1));
                }
            }
            String note = p.text(row, "note");
            if (label != null && twoJ >= 0) {
                try {
                    LevelDesignation.parse(label, twoJ); // a J in the label must agree with the j column
                } catch (IllegalArgumentException e) {
                    p.rowProblem(row, "j", "data.bad-j", e.getMessage());
                }
            }
            if (p.problems.size() != rowBefore) {
                continue;
            }
            Integer first = seen.putIfAbsent(species.notation() + "|" + label, row.line());
            if (first != null) {
                p.rowProblem(row, "label", "data.duplicate", "duplicate of the level on line " + first
                        + " (same species and label)");
                continue;
            }
            if (!covered.contains(species)) {
                covered.add(species);
            }
            builder.add(species, label, energy, uncertainty, twoJ, note);
        }
        p.throwIfAny();
        LevelList table = builder.build();
        var info = table.info();
        return table.withInfo(new org.ritzwerk.data.DataSetInfo(info.id(), info.kind(), info.title(), info.version(),
                info.provenance(), covered));
    }

    /**
     * @param table a level table
     * @return the table in the CSV encoding, reading back equal
     */
    public static String writeCsv(LevelList table) {
        List<String[]> rows = new ArrayList<>();
        for (int i = 0; i < table.size(); i++) {
            rows.add(new String[] {table.species(i).notation(), table.label(i), Double.toString(table.energy(i)),
                TabularFiles.csv(table.uncertainty(i)), j(table.twoJ(i)), TabularFiles.csv(table.rowNote(i))});
        }
        return TabularFiles.writeCsv(SPEC, headerOf(table), rows);
    }

    /**
     * @param table a level table
     * @return the table in the JSON encoding, reading back equal
     */
    public static String writeJson(LevelList table) {
        List<ObjectNode> rows = new ArrayList<>();
        for (int i = 0; i < table.size(); i++) {
            ObjectNode row = TabularFiles.newRow();
            row.put("species", table.species(i).notation());
            row.put("label", table.label(i));
            row.put("energy", table.energy(i));
            TabularFiles.put(row, "uncertainty", table.uncertainty(i));
            TabularFiles.put(row, "j", table.twoJ(i) < 0 ? null : j(table.twoJ(i)));
            TabularFiles.put(row, "note", table.rowNote(i));
            rows.add(row);
        }
        return TabularFiles.writeJson(SPEC, headerOf(table), rows);
    }

    /** @return j as the file writes it: {@code 3/2} for a half-integer, {@code 2} for an integer, empty for none */
    private static String j(int twoJ) {
        if (twoJ < 0) {
            return "";
        }
        return (twoJ & 1) == 0 ? Integer.toString(twoJ / 2) : twoJ + "/2";
    }

    private static Map<String, String> headerOf(LevelList table) {
        Map<String, String> header = TabularFiles.header(table.info(), false);
        header.put("energy-unit", table.unit().symbol());
        if (!table.note().isEmpty()) {
            header.put("note", table.note());
        }
        return header;
    }
}
