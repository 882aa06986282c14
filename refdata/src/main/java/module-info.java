/**
 * Ritzwerk's reference data: the registry of data providers (found with ServiceLoader), the
 * built-in data sets, and the readers and writers of user data files. Every problem in a user
 * file is reported with file, line and column, all at once.
 */
module org.ritzwerk.refdata {
    requires transitive org.ritzwerk.api;
    requires transitive org.ritzwerk.engine;
    // Transitive: RitzwerkJackson.module() returns a Jackson type.
    requires transitive tools.jackson.databind;
    requires tools.jackson.dataformat.csv;

    exports org.ritzwerk.refdata;

    uses org.ritzwerk.data.ReferenceDataProvider;

    provides org.ritzwerk.data.ReferenceDataProvider with org.ritzwerk.refdata.internal.NuclearProvider,
            org.ritzwerk.refdata.internal.LampProvider, org.ritzwerk.refdata.internal.HydrogenLikeProvider,
            org.ritzwerk.refdata.internal.RydbergProvider, org.ritzwerk.refdata.internal.LevelProvider;
}
