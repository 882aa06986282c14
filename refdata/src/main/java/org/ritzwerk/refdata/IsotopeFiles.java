package org.ritzwerk.refdata;

import java.io.InputStream;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Elements;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.data.IsotopeTable;

/**
 * The isotope file format (the format of the built-in {@code nuclear/isotopes.csv}, described at
 * {@link NuclearData#read(InputStream, String)}): its writer, beside the reader in
 * {@link NuclearData}. Stateless and thread-safe.
 */
public final class IsotopeFiles {

    private IsotopeFiles() {
    }

    /**
     * @param in     the bytes (UTF-8) of an isotope file, read to the end; not closed
     * @param source the file name, for messages
     * @return its isotope table
     * @throws DataFileException with every problem found, each with file, line and field
     */
    public static IsotopeTable read(InputStream in, String source) {
        return NuclearData.read(in, source).table();
    }

    /**
     * Writes an isotope table in the isotope file format that {@link NuclearData#read(InputStream, String)}
     * reads back to an equal table: the standard header keys from the table's info, the column row
     * {@link NuclearData#ISOTOPE_COLUMNS} and one row per isotope, numbers as {@link Double#toString(double)}
     * gives them (exact), empty fields for values not given.
     *
     * @param table an isotope table whose isotopes carry their source keys (as every isotope read
     *              from an isotope file does)
     * @return the file's text
     * @throws ReferenceDataException ({@link ReferenceDataException#NOT_WRITABLE}) naming the first
     *         isotope or header value the format cannot hold: an isotope with a free-text source and
     *         no source keys, a header value with a line break or surrounding spaces
     */
    public static String writeCsv(IsotopeTable table) {
        DataSetInfo info = table.info();
        StringBuilder out = new StringBuilder();
        header(out, "id", info.id());
        header(out, "title", info.title());
        header(out, "source", info.provenance().detail());
        header(out, "provenance", info.provenance().kind().id());
        header(out, "version", info.version());
        out.append(String.join(",", NuclearData.ISOTOPE_COLUMNS)).append('\n');
        for (Isotope isotope : table.isotopes()) {
            Isotope.SourceKeys keys = isotope.sourceKeys().orElseThrow(() -> new ReferenceDataException(
                    ReferenceDataException.NOT_WRITABLE, "isotope " + Elements.symbol(isotope.z()) + "-"
                            + isotope.massNumber() + " of '" + info.id() + "' has a free-text source ('"
                            + isotope.source() + "') and no source keys; the isotope file format holds only keys"));
            out.append(isotope.z()).append(',').append(isotope.massNumber()).append(',')
                    .append(Elements.symbol(isotope.z())).append(',').append(Double.toString(isotope.atomicMass()))
                    .append(',').append(Double.toString(isotope.atomicMassUncertainty())).append(',')
                    .append(keys.mass()).append(',').append(spin(isotope.twiceSpin())).append(',')
                    .append(optional(isotope.magneticMoment())).append(',')
                    .append(optional(isotope.magneticMomentUncertainty())).append(',').append(keys.moment())
                    .append(',').append(optional(isotope.chargeRadiusFm())).append(',')
                    .append(optional(isotope.chargeRadiusUncertaintyFm())).append(',').append(keys.radius())
                    .append('\n');
        }
        return out.toString();
    }

    private static void header(StringBuilder out, String key, String value) {
        if (value.isBlank() || !value.equals(value.strip()) || value.indexOf('\n') >= 0 || value.indexOf('\r') >= 0) {
            throw new ReferenceDataException(ReferenceDataException.NOT_WRITABLE, "the isotope file header '# " + key
                    + ": ...' cannot hold '" + value + "' (it must be one line, not blank, without surrounding spaces)");
        }
        out.append("# ").append(key).append(": ").append(value).append('\n');
    }

    private static String optional(OptionalDouble value) {
        return value.isPresent() ? Double.toString(value.getAsDouble()) : "";
    }

    private static String spin(int twiceSpin) {
        return twiceSpin % 2 == 0 ? Integer.toString(twiceSpin / 2) : twiceSpin + "/2";
    }
}
