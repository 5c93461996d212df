package org.microtally.notebook.session;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Where a notebook's numbers came from: the toolkit version and commit, the Java runtime, the
 * front door that executed it and the random seeds its cells pass, for
 * {@code metadata.microtally.provenance} (nbformat 4 allows custom keys under a notebook's metadata).
 *
 * <p>Version and commit come from the build record {@value #BUILD_RECORD}, which the kernel module's
 * Maven build writes ({@code git describe --always --dirty --abbrev=12}; a {@code -dirty} suffix
 * means uncommitted changes were built). Without that record (classes not built by that module, for
 * example an IDE run or the notebook module's own tests) both are {@code "unknown"} and the record
 * says why in {@code build_record}. No time stamp is recorded, so that re-running an unchanged
 * notebook on the same installation writes the same metadata.
 *
 * <p>Seeds are found by reading the cells' source, not by watching the run: the argument of
 * {@code new Random(..)}, {@code new SplittableRandom(..)} and of the seed parameter of
 * {@code sampleSpeeds(n, seed)} is recorded as written (a literal, or the name of a variable); a
 * random source without a seed ({@code new Random()}, {@code Math.random()},
 * {@code ThreadLocalRandom}) is listed under {@code unseeded_random_in_cells}, since numbers drawn
 * from it differ on every run.
 *
 * @param toolkitVersion the toolkit version, or "unknown"
 * @param commit         {@code git describe} of the built checkout, or "unknown"
 * @param buildRecord    "found", or why the build record is missing
 * @param javaVersion    {@link KernelIdentity#javaVersion()}
 * @param javaRuntime    the {@code java.runtime.version} and {@code java.vendor} properties
 * @param platform       the {@code os.name} and {@code os.arch} properties
 * @param executedBy     the front door, e.g. "microtally run" or "microtally kernel"
 * @param seeds          seeds found in the cells, or null when no cells were scanned (the kernel sees cells one by one)
 * @param unseededCells  numbers (counting every cell from 1) of cells with an unseeded random source, or null as above
 */
public record Provenance(String toolkitVersion, String commit, String buildRecord, String javaVersion, String javaRuntime,
                         String platform, String executedBy, List<Seed> seeds, List<Integer> unseededCells) {
    /** The class-path resource the kernel module's build writes. */
    public static final String BUILD_RECORD = "META-INF/microtally/build.properties";

    private static final Pattern SEEDED = Pattern.compile(
            "new\\s+(?:java\\.util\\.)?(Random|SplittableRandom)\\s*\\(\\s*([^()]*?)\\s*\\)"
            + "|(sampleSpeeds)\\s*\\(\\s*[^,()]+,\\s*([^,()]+?)\\s*\\)");
    private static final Pattern UNSEEDED = Pattern.compile("Math\\s*\\.\\s*random\\s*\\(|ThreadLocalRandom");
    private static final Pattern COMMENT = Pattern.compile("//[^\\n]*|/\\*(?s:.*?)\\*/");

    /**
     * A seed found in a cell.
     *
     * @param cell the cell number, counting every cell from 1
     * @param call the call that takes it (Random, SplittableRandom, sampleSpeeds)
     * @param seed the argument as written
     */
    public record Seed(int cell, String call, String seed) { }

    public Provenance {
        seeds = seeds == null ? null : List.copyOf(seeds);
        unseededCells = unseededCells == null ? null : List.copyOf(unseededCells);
    }

    /**
     * The provenance of a run by {@code executedBy} of a notebook whose cells, in order, have the
     * sources {@code cellSources} (pass "" for markdown and raw cells so that numbers count every cell),
     * or null when there is no notebook to scan.
     */
    public static Provenance of(String executedBy, List<String> cellSources) {
        Properties build = new Properties();
        String found;
        try (InputStream in = Provenance.class.getClassLoader().getResourceAsStream(BUILD_RECORD)) {
            if (in == null) {
                found = "missing: " + BUILD_RECORD + " is not on the class path (these classes were not built by the kernel "
                        + "module's Maven build, e.g. an IDE run or the notebook module's tests)";
            } else {
                build.load(new InputStreamReader(in, StandardCharsets.UTF_8));
                found = "found";
            }
        } catch (IOException e) {
            found = "unreadable: " + e.getMessage();
        }
        List<Seed> seeds = cellSources == null ? null : new ArrayList<>();
        List<Integer> unseeded = cellSources == null ? null : new ArrayList<>();
        for (int i = 0; cellSources != null && i < cellSources.size(); i++) {
            String code = COMMENT.matcher(cellSources.get(i) == null ? "" : cellSources.get(i)).replaceAll(" ");
            boolean noSeed = UNSEEDED.matcher(code).find();
            Matcher m = SEEDED.matcher(code);
            while (m.find()) {
                String call = m.group(1) != null ? m.group(1) : m.group(3);
                String arg = m.group(1) != null ? m.group(2) : m.group(4);
                if (arg.isBlank()) {
                    noSeed = true;
                } else {
                    seeds.add(new Seed(i + 1, call, arg.strip()));
                }
            }
            if (noSeed) {
                unseeded.add(i + 1);
            }
        }
        return new Provenance(build.getProperty("version", "unknown"), build.getProperty("commit", "unknown"), found,
                KernelIdentity.javaVersion(),
                System.getProperty("java.runtime.version") + " (" + System.getProperty("java.vendor") + ")",
                System.getProperty("os.name") + " " + System.getProperty("os.arch"), executedBy, seeds, unseeded);
    }

    /** The record as nested maps and lists with snake_case keys, ready for JSON. */
    public Map<String, Object> asMap() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("toolkit_version", toolkitVersion);
        m.put("commit", commit);
        m.put("build_record", buildRecord);
        m.put("java_version", javaVersion);
        m.put("java_runtime", javaRuntime);
        m.put("platform", platform);
        m.put("executed_by", executedBy);
        if (seeds == null) {
            m.put("seeds", "not recorded: no notebook was scanned");
            return m;
        }
        List<Map<String, Object>> s = new ArrayList<>();
        for (Seed seed : seeds) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("cell", seed.cell());
            e.put("call", seed.call());
            e.put("seed", seed.seed());
            s.add(e);
        }
        m.put("seeds", s);
        m.put("unseeded_random_in_cells", unseededCells);
        return m;
    }
}
