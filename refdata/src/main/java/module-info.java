/**
 * Ritzwerk's reference data and the readers of user data files. Every problem in a user file is
 * reported with file, line and column, all at once.
 */
module org.ritzwerk.refdata {
    requires transitive org.ritzwerk.api;

    exports org.ritzwerk.refdata;
}
