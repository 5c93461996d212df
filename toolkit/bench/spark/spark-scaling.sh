#!/usr/bin/env bash
# Measured script for the Spark module (the README performance rows): distributed CountTable vs the
# local multi-modular path (9 alternating pairs after 5 warm-up pairs), local[1] vs local[2] beside the plain-thread ceiling of
# the same work, a light and a work-dominated 2,000-point trap sweep, all in one JVM run; a plain table,
# load average first.
#   toolkit/bench/spark/spark-scaling.sh [N E REPEATS LATTICE_SIDE]      (default 100 600 3 8)
# Builds toolkit/spark first (mvn -pl toolkit/spark -am package -DskipTests).
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd -P)"
root="$(cd "$here/../../.." && pwd -P)"
(cd "$root" && mvn -B -q -DskipTests package -pl toolkit/spark -am)
cp="$root/toolkit/spark/target/microtally-spark-job.jar:$(cat "$root/toolkit/spark/target/spark-classpath.txt")"
SPARK_LOCAL_IP=127.0.0.1 exec java @"$root/toolkit/spark/jvm.options" -Xmx3g -XX:+UseSerialGC \
  -Dlog4j2.configurationFile=classpath:org/microtally/spark/log4j2-quiet.properties \
  -cp "$cp" "$here/SparkScaling.java" "${1:-100}" "${2:-600}" "${3:-3}" "${4:-8}"
