package org.ritzwerk.data;

import java.util.Locale;

/** A coarse relative strength of a line within its list, as lamp tables give it. */
public enum StrengthClass {
    /** Among the strongest lines of the list. */
    STRONG,
    /** Clearly present. */
    MEDIUM,
    /** Faint. */
    WEAK;

    /** @return the lower-case name used in files */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * @param id strong, medium or weak
     * @return the class
     * @throws IllegalArgumentException for anything else
     */
    public static StrengthClass fromId(String id) {
        for (StrengthClass value : values()) {
            if (value.id().equals(id)) {
                return value;
            }
        }
        throw new IllegalArgumentException("unknown strength '" + id + "'; known: strong, medium, weak");
    }
}
