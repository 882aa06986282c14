/**
 * An example project that uses Ritzwerk as a library on the module path: it names the three
 * published modules it needs, as any modular JVM program would.
 */
module example.consumer {
    requires org.ritzwerk.api;
    requires org.ritzwerk.engine;
    requires org.ritzwerk.refdata;

    exports example.consumer;
}
