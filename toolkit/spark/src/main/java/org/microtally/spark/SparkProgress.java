package org.microtally.spark;

import java.util.HashSet;
import java.util.Objects;
import java.util.Set;
import java.util.UUID;
import java.util.function.Supplier;
import org.apache.spark.SparkContext;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerJobStart;
import org.apache.spark.scheduler.SparkListenerTaskEnd;
import org.microtally.ProgressListener;

/**
 * Forwards the finished tasks of one Spark job to a {@link ProgressListener}: Spark's listener bus
 * reports every successful task end; a task that failed and is retried counts once, when an attempt
 * succeeds. Calls are serialised and monotone (done never goes down), at most about 200 per job, and
 * a final {@code (total, total)} is always delivered when the job returns.
 */
final class SparkProgress {
    private SparkProgress() { }

    /**
     * Runs {@code job} (which must start its Spark jobs on the calling thread) under a fresh job group,
     * reporting its {@code totalTasks} task completions as stage {@code stage}.
     */
    static <T> T run(SparkContext sc, ProgressListener listener, long totalTasks, String stage, Supplier<T> job) {
        Objects.requireNonNull(listener, "listener");
        if (listener == ProgressListener.NONE) {
            return job.get();
        }
        String group = "microtally-" + UUID.randomUUID();
        Bridge bridge = new Bridge(group, listener, Math.max(1, totalTasks), stage);
        sc.addSparkListener(bridge);
        sc.setJobGroup(group, stage, false);
        try {
            T result = job.get();
            bridge.finish();
            return result;
        } finally {
            sc.clearJobGroup();
            sc.removeSparkListener(bridge);
        }
    }

    private static final class Bridge extends SparkListener {
        private final String group;
        private final ProgressListener listener;
        private final long total;
        private final String stage;
        private final Set<Integer> stages = new HashSet<>();
        private long done;
        private long reported = -1;

        Bridge(String group, ProgressListener listener, long total, String stage) {
            this.group = group;
            this.listener = listener;
            this.total = total;
            this.stage = stage;
        }

        @Override
        public synchronized void onJobStart(SparkListenerJobStart jobStart) {
            String g = jobStart.properties() == null ? null : jobStart.properties().getProperty("spark.jobGroup.id");
            if (group.equals(g)) {
                scala.collection.Iterator<Object> it = jobStart.stageIds().iterator();
                while (it.hasNext()) {
                    stages.add((Integer) it.next());
                }
            }
        }

        @Override
        public synchronized void onTaskEnd(SparkListenerTaskEnd taskEnd) {
            if (!stages.contains(taskEnd.stageId()) || taskEnd.taskInfo() == null || !taskEnd.taskInfo().successful()) {
                return;
            }
            done = Math.min(total, done + 1);
            if (done * 200 / total != reported * 200 / total) {
                report(done);
            }
        }

        synchronized void finish() {
            done = total;
            if (reported != total) {
                report(total);
            }
        }

        private void report(long value) {
            reported = value;
            listener.progress(value, total, stage);
        }
    }
}
