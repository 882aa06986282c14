package org.ritzwerk.data;

/**
 * Where a data set comes from, in order of precedence: when two sets answer the same request,
 * the user's own file wins over a third party's jar, which wins over Ritzwerk's built-in data.
 */
public enum Origin {
    /** A file the user named. */
    USER,
    /** A provider jar on the class or module path that is not part of Ritzwerk. */
    THIRD_PARTY,
    /** Ritzwerk's own data. */
    BUILT_IN
}
