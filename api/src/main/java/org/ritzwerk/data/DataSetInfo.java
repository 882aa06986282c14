package org.ritzwerk.data;

import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;
import org.ritzwerk.atom.Species;

/**
 * What a data set is, before it is loaded: a stable id, its kind, a title, a version, its
 * provenance and the species it covers. Immutable.
 *
 * @param id         stable id: lower-case letters, digits, dots and dashes, e.g. {@code lamp-ne-i}
 * @param kind       the kind of data
 * @param title      one line for people
 * @param version    the version or edition of the data (e.g. the source's year)
 * @param provenance where the values come from
 * @param species    the species covered (empty for nuclear data, which covers isotopes)
 */
public record DataSetInfo(String id, DataKind kind, String title, String version, Provenance provenance,
        List<Species> species) {

    private static final Pattern ID = Pattern.compile("[a-z0-9][a-z0-9.-]{0,79}");

    /**
     * Validates the components.
     *
     * @param id         stable id: lower-case letters, digits, dots and dashes, e.g. {@code lamp-ne-i}
     * @param kind       the kind of data
     * @param title      one line for people
     * @param version    the version or edition of the data (e.g. the source's year)
     * @param provenance where the values come from
     * @param species    the species covered (empty for nuclear data, which covers isotopes)
     */
    public DataSetInfo {
        Objects.requireNonNull(id, "id");
        if (!ID.matcher(id).matches()) {
            throw new IllegalArgumentException("data set id must be 1 to 80 lower-case letters, digits, dots and "
                    + "dashes, starting with a letter or digit; got '" + id + "'");
        }
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(version, "version");
        Objects.requireNonNull(provenance, "provenance");
        species = List.copyOf(species);
    }

    /**
     * @param candidate a data set id
     * @return whether it has the form of an id
     */
    public static boolean isValidId(String candidate) {
        return ID.matcher(candidate).matches();
    }
}
