/**
 * Ritzwerk's computation: bulk kernels over primitive arrays (conversions now; level models,
 * rates, matching, calibration and synthesis as they land). The engine reads no files and uses
 * no global registry: it takes its parameters as values.
 */
module org.ritzwerk.engine {
    requires transitive org.ritzwerk.api;
    requires commons.math3;

    exports org.ritzwerk.engine.angular;
    exports org.ritzwerk.engine.calibrate;
    exports org.ritzwerk.engine.convert;
    exports org.ritzwerk.engine.hydrogenic;
    exports org.ritzwerk.engine.hyperfine;
    exports org.ritzwerk.engine.identify;
    exports org.ritzwerk.engine.lines;
    exports org.ritzwerk.engine.plasma;
    exports org.ritzwerk.engine.profile;
    exports org.ritzwerk.engine.rydberg;
    exports org.ritzwerk.engine.synth;
}
