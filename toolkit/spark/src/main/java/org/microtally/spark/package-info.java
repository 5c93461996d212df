/**
 * Distributed exact count tables, parameter sweeps and brute-force enumerations on Apache Spark.
 * Local mode ({@code local[*]}) is the default, so the same code runs on a laptop, in the tests and on
 * a cluster.
 */
package org.microtally.spark;
