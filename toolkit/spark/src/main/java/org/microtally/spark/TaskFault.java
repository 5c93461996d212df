package org.microtally.spark;

import java.io.Serializable;

/**
 * Test hook run after each prime's result is computed, inside its Spark task (or on the driver for a
 * prime {@link PrimeTasks} keeps there, with attempt 0): may throw (to exercise Spark's retries) or alter
 * the result (to exercise the consistency checks). Package-private; production code passes {@link #NONE}.
 */
@FunctionalInterface
interface TaskFault extends Serializable {
    TaskFault NONE = (task, attempt, result) -> result;

    /** The result the task returns, given its index, its attempt number (0 first) and its true result. */
    long[] apply(int task, int attempt, long[] result);
}
