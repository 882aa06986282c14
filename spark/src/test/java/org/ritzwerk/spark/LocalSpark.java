package org.ritzwerk.spark;

import org.apache.spark.sql.SparkSession;

/**
 * The one local Spark session of this module's tests: two cores, no UI, the driver bound to the
 * loopback interface (no network beyond it), Kryo as the serializer. Made at first use and shared by every test class,
 * so the suite pays Spark's start-up once; Spark stops it when the JVM exits.
 */
final class LocalSpark {

    private static SparkSession session;

    private LocalSpark() {
    }

    static synchronized SparkSession session() {
        if (session == null) {
            session = SparkSession.builder()
                    .master("local[2]")
                    .appName("ritzwerk-spark-tests")
                    .config("spark.ui.enabled", "false")
                    .config("spark.driver.host", "127.0.0.1")
                    .config("spark.driver.bindAddress", "127.0.0.1")
                    .config("spark.sql.shuffle.partitions", "2")
                    .config("spark.task.maxFailures", "1")
                    .config("spark.sql.debug.maxToStringFields", "200")
                    // Kryo, as many clusters are configured: the operations' broadcasts must survive it.
                    .config("spark.serializer", "org.apache.spark.serializer.KryoSerializer")
                    .getOrCreate();
        }
        return session;
    }
}
