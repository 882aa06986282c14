/**
 * Ritzwerk's computation: conversions, level models and rates, line lists, identification,
 * calibration, synthesis, plasma estimates, Ritz lines, level and series fits, and alkali Rydberg
 * quantities, as jobs over values and bulk kernels over primitive arrays. The engine reads no files
 * and uses no global registry: it takes its parameters as values.
 */
module org.ritzwerk.engine {
    requires transitive org.ritzwerk.api;
    requires org.apache.commons.math4.legacy;
    requires org.apache.commons.math4.legacy.core;
    requires org.apache.commons.math4.legacy.exception;
    requires org.apache.commons.math4.transform;
    requires org.apache.commons.numbers.gamma;
    requires dev.ludovic.netlib.lapack;

    exports org.ritzwerk.engine.calibrate;
    exports org.ritzwerk.engine.convert;
    exports org.ritzwerk.engine.hydrogenic;
    exports org.ritzwerk.engine.hyperfine;
    exports org.ritzwerk.engine.identify;
    exports org.ritzwerk.engine.levels;
    exports org.ritzwerk.engine.lines;
    exports org.ritzwerk.engine.plasma;
    exports org.ritzwerk.engine.profile;
    exports org.ritzwerk.engine.pair;
    exports org.ritzwerk.engine.ritz;
    exports org.ritzwerk.engine.rydberg;
    exports org.ritzwerk.engine.stark;
    exports org.ritzwerk.engine.synth;
}
