package org.microtally;

/**
 * One overflow-safe size check before a large allocation: the number of entries is formed in double
 * (so sizes near {@code Integer.MAX_VALUE} cannot wrap around), compared with the largest Java array
 * and with half the maximum heap, and a refusal states the estimated memory and what to do.
 */
public final class MemoryEstimate {
    /** Largest array length every JVM accepts. */
    public static final double MAX_ARRAY = Integer.MAX_VALUE - 16.0;
    private static final double HEAP_FRACTION = 0.5;

    private MemoryEstimate() { }

    /** Half the maximum heap, in bytes: the budget of one result. */
    public static double budgetBytes() {
        return Runtime.getRuntime().maxMemory() * HEAP_FRACTION;
    }

    /**
     * Throws unless {@code entries} entries of about {@code bytesPerEntry} bytes each fit one array and
     * the budget.
     *
     * @param what   the input that decides the size, e.g. {@code "cutoff (max quanta)"}
     * @param value  its value
     * @param sizeInWords how the size follows from it, e.g. {@code "maxQuanta + 1 levels"}
     * @param entries number of entries, computed in double by the caller
     * @param bytesPerEntry estimated bytes per entry
     * @param remedy what to do instead
     * @throws InvalidInputException when the allocation would not fit
     */
    public static void require(String what, Object value, String sizeInWords, double entries, double bytesPerEntry,
                               String remedy) {
        check(what, value, sizeInWords, entries, bytesPerEntry, remedy, true);
    }

    /** As {@link #require}, for entries spread over many arrays: only the heap budget applies. */
    public static void requireHeap(String what, Object value, String sizeInWords, double entries,
                                   double bytesPerEntry, String remedy) {
        check(what, value, sizeInWords, entries, bytesPerEntry, remedy, false);
    }

    private static void check(String what, Object value, String sizeInWords, double entries, double bytesPerEntry,
                              String remedy, boolean oneArray) {
        double bytes = entries * bytesPerEntry;
        double budget = budgetBytes();
        if ((oneArray && entries > MAX_ARRAY) || bytes > budget) {
            throw InvalidInputException.of(what, value, String.format("small enough that %s (%.3g entries, about %s) "
                    + "fit %shalf the maximum heap (%s)", sizeInWords, entries, human(bytes),
                    oneArray ? "one array (at most 2^31 - 17 entries) and " : "", human(budget)), remedy);
        }
    }

    /** Bytes in MiB, three significant digits (one unit everywhere, so messages compare at a glance). */
    public static String human(double bytes) {
        return String.format("%.3g MiB", bytes / (1 << 20));
    }
}
