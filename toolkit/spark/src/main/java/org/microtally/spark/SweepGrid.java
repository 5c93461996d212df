package org.microtally.spark;

import java.io.Serializable;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Statistics;

/**
 * The Cartesian product of sweep axes: spectra x particle numbers x temperatures x statistics x
 * ensembles. Immutable and {@link Serializable}; the points are never listed on the driver: point
 * {@code id} (0 &lt;= id &lt; size) is decoded where it is evaluated, in mixed radix with the ensemble
 * varying fastest and the spectrum slowest, so a sweep of 10^6 points costs the driver only its axes.
 */
public final class SweepGrid implements Serializable {
    private static final long serialVersionUID = 1L;
    /** Largest number of points one grid may hold. */
    public static final long MAX_POINTS = 1L << 40;

    private final SpectrumSpec[] spectra;
    private final int[] particles;
    private final double[] temperatures;
    private final Statistics.Kind[] kinds;
    private final int[] maxOccupancies;
    private final Ensemble[] ensembles;

    private SweepGrid(SpectrumSpec[] spectra, int[] particles, double[] temperatures, Statistics.Kind[] kinds,
                      int[] maxOccupancies, Ensemble[] ensembles) {
        this.spectra = spectra;
        this.particles = particles;
        this.temperatures = temperatures;
        this.kinds = kinds;
        this.maxOccupancies = maxOccupancies;
        this.ensembles = ensembles;
    }

    /**
     * The grid of every combination.
     *
     * @param spectra      spectrum builder arguments, at least one
     * @param particles    particle numbers N &gt;= 1 (canonical: exactly N; grand canonical: mean N)
     * @param temperatures kT values, finite and &gt; 0, in each spectrum's energy unit
     * @param statistics   particle statistics, at least one
     * @param ensembles    ensembles, at least one
     * @throws InvalidInputException for an empty axis, N &lt; 1, kT not finite or &lt;= 0, or more than
     *                               {@link #MAX_POINTS} points
     */
    public static SweepGrid of(List<SpectrumSpec> spectra, int[] particles, double[] temperatures,
                               List<Statistics> statistics, List<Ensemble> ensembles) {
        requireNonEmpty("spectra", Objects.requireNonNull(spectra, "spectra").size());
        requireNonEmpty("particle numbers", Objects.requireNonNull(particles, "particles").length);
        requireNonEmpty("temperatures", Objects.requireNonNull(temperatures, "temperatures").length);
        requireNonEmpty("statistics", Objects.requireNonNull(statistics, "statistics").size());
        requireNonEmpty("ensembles", Objects.requireNonNull(ensembles, "ensembles").size());
        for (int n : particles) {
            if (n < 1) {
                throw InvalidInputException.of("particle number N in a sweep", n, "an integer >= 1", "");
            }
        }
        for (double kT : temperatures) {
            if (!(kT > 0) || !Double.isFinite(kT)) {
                throw InvalidInputException.of("temperature kT in a sweep", kT, "a finite number > 0", "");
            }
        }
        double size = (double) spectra.size() * particles.length * temperatures.length * statistics.size()
                * ensembles.size();
        if (size > MAX_POINTS) {
            throw InvalidInputException.of("number of sweep points", String.format("%.3g", size),
                    "at most 2^40", "Split the sweep.");
        }
        Statistics.Kind[] kinds = new Statistics.Kind[statistics.size()];
        int[] caps = new int[statistics.size()];
        for (int i = 0; i < kinds.length; i++) {
            kinds[i] = statistics.get(i).kind();
            caps[i] = statistics.get(i).maxOccupancy();
        }
        return new SweepGrid(spectra.toArray(new SpectrumSpec[0]), particles.clone(), temperatures.clone(), kinds,
                caps, ensembles.toArray(new Ensemble[0]));
    }

    private static void requireNonEmpty(String axis, int size) {
        if (size == 0) {
            throw InvalidInputException.of("number of " + axis + " in a sweep", 0, ">= 1", "Give every axis a value.");
        }
    }

    /** Number of points: the product of the axis lengths. */
    public long size() {
        return (long) spectra.length * particles.length * temperatures.length * kinds.length * ensembles.length;
    }

    /**
     * Number of consecutive points that share spectrum, N and kT (statistics x ensembles, the fastest
     * axes), so one spectrum build serves them.
     */
    long pointsPerSpectrumBuild() {
        return (long) kinds.length * ensembles.length;
    }

    /** Point {@code id}, decoded from its index. */
    public SweepPoint point(long id) {
        if (id < 0 || id >= size()) {
            throw InvalidInputException.of("sweep point id", id, "in [0, " + size() + ")", "");
        }
        long r = id;
        int e = (int) (r % ensembles.length);
        r /= ensembles.length;
        int s = (int) (r % kinds.length);
        r /= kinds.length;
        int t = (int) (r % temperatures.length);
        r /= temperatures.length;
        int n = (int) (r % particles.length);
        r /= particles.length;
        int sp = (int) r;
        return new SweepPoint(id, spectra[sp], particles[n], temperatures[t],
                new Statistics(kinds[s], maxOccupancies[s]), ensembles[e]);
    }
}
