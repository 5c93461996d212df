package org.microtally.spark;

import org.apache.spark.sql.SparkSession;

/**
 * One local Spark session for every test class of this module (starting Spark costs seconds): two
 * worker threads and two attempts per task ({@code local[2,2]}), so the fault tests can watch a task
 * fail once and be retried. Stopped when the test JVM exits.
 */
final class SharedSpark {
    private SharedSpark() { }

    private static SparkSession session;

    static synchronized SparkSession get() {
        if (session == null) {
            session = Clusters.localWithRetries(2, 2);
            SparkSession s = session;
            Runtime.getRuntime().addShutdownHook(new Thread(s::stop));
        }
        return session;
    }
}
