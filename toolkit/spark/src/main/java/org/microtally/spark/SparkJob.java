package org.microtally.spark;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.apache.spark.sql.SparkSession;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.count.CountTable;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Statistics;

/**
 * Main class of the job jar ({@code toolkit/spark/target/microtally-spark-job.jar}) for
 * {@code spark-submit}; the master, executors and memory come from the submit line. Two jobs, with
 * arguments as {@code key=value} words:
 * <pre>
 *   sweep out=DIR [format=parquet|csv] ratios=4,4,1 cutoff=60 [cutoff-per-kT=15] N=500,1000,2000
 *         kT=FROM:TO:COUNT [statistics=BOSE,FERMI,DISTINGUISHABLE,GENTILE:k] [ensembles=CANONICAL,GRAND_CANONICAL]
 *         (with cutoff-per-kT the cutoff is max(cutoff, ceil(cutoff-per-kT * kT)) at each point)
 *   count-table ratios=1,1,1 cutoff=600 N=100 E=600 [statistics=BOSE] [check-local=true]
 * </pre>
 * Progress (finished tasks) goes to stderr; the result summary to stdout; exit code 1 on a failed
 * check or refused input.
 */
public final class SparkJob {
    private SparkJob() { }

    public static void main(String[] args) {
        if (args.length == 0) {
            System.err.println("usage: sweep out=DIR ratios=A,B,C cutoff=Q [cutoff-per-kT=C] N=n1,n2 kT=FROM:TO:COUNT [format=parquet|csv]"
                    + " [statistics=...] [ensembles=...]\n       count-table ratios=A,B,C cutoff=Q N=n E=e"
                    + " [statistics=BOSE] [check-local=true]");
            System.exit(2);
        }
        Map<String, String> kv = keyValues(Arrays.asList(args).subList(1, args.length));
        SparkSession spark = Clusters.submitted("microtally " + args[0]);
        int code;
        try {
            code = switch (args[0]) {
                case "sweep" -> sweep(spark, kv);
                case "count-table" -> countTable(spark, kv);
                default -> throw InvalidInputException.of("job", args[0], "sweep or count-table", "");
            };
        } catch (InvalidInputException e) {
            System.err.println("microtally: job refused: " + e.getMessage());
            code = 1;
        } finally {
            spark.stop();
        }
        System.exit(code);
    }

    static ProgressListener stderrProgress() {
        return (done, total, stage) -> System.err.printf(Locale.ROOT, "microtally: %s %d/%d%n", stage, done, total);
    }

    static int sweep(SparkSession spark, Map<String, String> kv) {
        int[] ratios = ints(req(kv, "ratios"));
        int cutoff = Integer.parseInt(req(kv, "cutoff"));
        SpectrumSpec trap = kv.containsKey("cutoff-per-kT")
                ? SpectrumSpec.oscillatorFollowingKT(ratios, cutoff, Double.parseDouble(kv.get("cutoff-per-kT")))
                : SpectrumSpec.oscillator(ratios, cutoff);
        SweepGrid grid = SweepGrid.of(List.of(trap),
                ints(req(kv, "N")), range(req(kv, "kT")), statistics(kv.getOrDefault("statistics", "BOSE")),
                ensembles(kv.getOrDefault("ensembles", "CANONICAL")));
        long t0 = System.nanoTime();
        String out = req(kv, "out");
        // the rows go from the tasks to the files: nothing is held on the driver, so any grid size fits
        if ("csv".equals(kv.getOrDefault("format", "parquet"))) {
            Sweep.writeCsv(spark, grid, out, stderrProgress());
        } else {
            Sweep.writeParquet(spark, grid, out, stderrProgress());
        }
        System.out.printf(Locale.ROOT, "sweep: %d points in %.1f s, written to %s%n", grid.size(), (System.nanoTime() - t0) / 1e9, out);
        return 0;
    }

    static int countTable(SparkSession spark, Map<String, String> kv) {
        var spectrum = Spectra.harmonicOscillator(ints(req(kv, "ratios")), Integer.parseInt(req(kv, "cutoff")));
        Statistics st = statistics(kv.getOrDefault("statistics", "BOSE")).get(0);
        int n = Integer.parseInt(req(kv, "N"));
        int e = Integer.parseInt(req(kv, "E"));
        long t0 = System.nanoTime();
        DistributedCountTable d = DistributedCountTable.of(spark, spectrum, st, n, e, stderrProgress());
        System.out.printf(Locale.ROOT, "count-table: %s in %.2f s (CRT checked against %d redundant prime); Omega(%d, %d) = %s%n",
                d, (System.nanoTime() - t0) / 1e9, d.redundantPrimes(), n, e, d.count(n, e));
        if (Boolean.parseBoolean(kv.getOrDefault("check-local", "false"))) {
            Optional<String> diff = d.firstDifference(CountTable.of(spectrum, st, n, e));
            if (diff.isPresent()) {
                System.out.println("count-table: differs from the local table: " + diff.get());
                return 1;
            }
            System.out.println("count-table: every entry equals the local table's");
        }
        return 0;
    }

    static Map<String, String> keyValues(List<String> args) {
        Map<String, String> kv = new LinkedHashMap<>();
        for (String a : args) {
            int eq = a.indexOf('=');
            if (eq < 1) {
                throw InvalidInputException.of("job argument", a, "a key=value word", "e.g. N=100");
            }
            kv.put(a.substring(0, eq), a.substring(eq + 1));
        }
        return kv;
    }

    private static String req(Map<String, String> kv, String key) {
        String v = kv.get(key);
        if (v == null || v.isBlank()) {
            throw InvalidInputException.of("job argument " + key, v, "present", "Add " + key + "=... to the job arguments.");
        }
        return v;
    }

    static int[] ints(String csv) {
        return Arrays.stream(csv.split(",")).map(String::trim).mapToInt(Integer::parseInt).toArray();
    }

    /** FROM:TO:COUNT, COUNT evenly spaced values including both ends; or a comma list. */
    static double[] range(String spec) {
        String[] p = spec.split(":");
        if (p.length != 3) {
            return Arrays.stream(spec.split(",")).map(String::trim).mapToDouble(Double::parseDouble).toArray();
        }
        double from = Double.parseDouble(p[0]);
        double to = Double.parseDouble(p[1]);
        int count = Integer.parseInt(p[2]);
        if (count < 1) {
            throw InvalidInputException.of("number of kT values", count, ">= 1", "");
        }
        double[] out = new double[count];
        for (int i = 0; i < count; i++) {
            out[i] = count == 1 ? from : from + (to - from) * i / (count - 1);
        }
        return out;
    }

    static List<Statistics> statistics(String csv) {
        List<Statistics> out = new ArrayList<>();
        for (String s : csv.split(",")) {
            String t = s.trim().toUpperCase(Locale.ROOT);
            if (t.startsWith("GENTILE:")) {
                out.add(Statistics.maxOccupancy(Integer.parseInt(t.substring("GENTILE:".length()))));
            } else {
                out.add(switch (t) {
                    case "BOSE" -> Statistics.BOSE;
                    case "FERMI" -> Statistics.FERMI;
                    case "DISTINGUISHABLE" -> Statistics.DISTINGUISHABLE;
                    default -> throw InvalidInputException.of("statistics", s, "BOSE, FERMI, DISTINGUISHABLE or GENTILE:k", "");
                });
            }
        }
        return out;
    }

    static List<Ensemble> ensembles(String csv) {
        List<Ensemble> out = new ArrayList<>();
        for (String s : csv.split(",")) {
            try {
                out.add(Ensemble.valueOf(s.trim().toUpperCase(Locale.ROOT)));
            } catch (IllegalArgumentException e) {
                throw InvalidInputException.of("ensemble", s, "CANONICAL or GRAND_CANONICAL", "");
            }
        }
        return out;
    }
}
