package org.ritzwerk.data;

import java.util.Locale;
import java.util.Objects;

/**
 * Where the values of a data set come from.
 *
 * @param kind   published, from memory, computed, measured or supplied by the user
 * @param detail the citation (authors, year, journal or table), the model that computed the
 *               values, or the user's own statement; not blank
 */
public record Provenance(Kind kind, String detail) {

    /** How the values were obtained. */
    public enum Kind {
        /** Taken from a publication named in the detail. */
        PUBLISHED,
        /** Recalled rather than looked up; to be checked against a source. */
        FROM_MEMORY,
        /** Computed by the model named in the detail. */
        COMPUTED,
        /** Measured by whoever the detail names. */
        MEASURED;

        /** @return the lower-case name with dashes used in files, e.g. {@code from-memory} */
        public String id() {
            return name().toLowerCase(Locale.ROOT).replace('_', '-');
        }

        /**
         * @param id a kind as written in files: published, from-memory, computed, measured
         * @return the kind
         * @throws IllegalArgumentException naming the known kinds
         */
        public static Kind fromId(String id) {
            for (Kind kind : values()) {
                if (kind.id().equals(id)) {
                    return kind;
                }
            }
            throw new IllegalArgumentException("unknown provenance '" + id
                    + "'; known: published, from-memory, computed, measured");
        }
    }

    /**
     * Validates the components.
     *
     * @param kind   published, from memory, computed, measured or supplied by the user
     * @param detail the citation (authors, year, journal or table), the model that computed the
     *               values, or the user's own statement; not blank
     */
    public Provenance {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(detail, "detail");
        if (detail.isBlank()) {
            throw new IllegalArgumentException("provenance needs a citation or description, got a blank one");
        }
    }

    /**
     * @param citation authors, year, journal or table
     * @return published provenance
     */
    public static Provenance published(String citation) {
        return new Provenance(Kind.PUBLISHED, citation);
    }

    /**
     * @param what what was recalled
     * @return from-memory provenance
     */
    public static Provenance fromMemory(String what) {
        return new Provenance(Kind.FROM_MEMORY, what);
    }

    /**
     * @param model the model and its settings
     * @return computed provenance
     */
    public static Provenance computedBy(String model) {
        return new Provenance(Kind.COMPUTED, model);
    }

    /**
     * @param who who measured the values, with when and how (a lab, an instrument, a run)
     * @return measured provenance
     */
    public static Provenance measuredBy(String who) {
        return new Provenance(Kind.MEASURED, who);
    }

    /** @return e.g. {@code "published: Sansonetti & Martin 2005"}, {@code "computed by hydrogen-like qed tier"} */
    public String render() {
        switch (kind) {
            case COMPUTED:
                // a detail that already says "computed by ..." is not prefixed twice
                return detail.startsWith("computed by ") ? detail : "computed by " + detail;
            case FROM_MEMORY:
                return "from memory: " + detail;
            default:
                return kind.id() + ": " + detail;
        }
    }
}
