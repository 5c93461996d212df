package org.microtally.kernel;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryUsage;
import java.util.Locale;

/**
 * After a cell ran out of memory: if the heap is still mostly full after a collection (the cell
 * kept references in session variables), the engine is replaced with a fresh one.
 */
final class HeapCheck {
    /** Heap still in use after a full GC, as a fraction of the maximum, above which the engine is reset. */
    static final double RESET_AFTER_OOM_FRACTION = 0.6;

    private HeapCheck() { }

    /** Collects, resets the engine if needed, and returns the note for the cell's stderr. */
    static String recover(EngineSlot engine) {
        System.gc();
        MemoryUsage heap = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage();
        long max = heap.getMax() > 0 ? heap.getMax() : Runtime.getRuntime().maxMemory();
        double used = (double) heap.getUsed() / max;
        String mib = String.format(Locale.ROOT, "%.0f of %.0f MiB", heap.getUsed() / 1048576.0, max / 1048576.0);
        if (used < RESET_AFTER_OOM_FRACTION) {
            return "microtally: heap recovered after the OutOfMemoryError (" + mib
                    + " in use after a collection); the kernel session goes on; " + HeapSize.HOW_TO_RAISE + ".\n";
        }
        KernelLog.LOG.warning(() -> "heap still full after OutOfMemoryError (" + mib + "): resetting the engine");
        engine.replace();
        MemoryUsage after = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage();
        return "microtally: the cell ran out of heap and the session still held " + mib
                + ", so the kernel started a fresh session (" + after.getUsed() / 1048576
                + " MiB in use now): variables and definitions from earlier cells are gone; re-run the cells you need; "
                + HeapSize.HOW_TO_RAISE + ".\n";
    }
}
