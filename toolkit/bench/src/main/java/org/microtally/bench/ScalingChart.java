package org.microtally.bench;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.File;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import javax.imageio.ImageIO;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Runs {@link ScalingBenchmark}, fits time = a work^b by least squares on log-log axes for each
 * computation, prints the table and the exponents, and draws them into a small PNG:
 * {@code java -Djava.awt.headless=true -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.ScalingChart OUT.png}.
 */
public final class ScalingChart {
    private ScalingChart() { }

    private static final String[] NAMES = {"countTable", "canonicalBosons", "muSolve", "transferMatrix"};
    private static final String[] LABELS = {"count table (N x E x levels)", "canonical bosons (N x states)",
        "mu solve (levels x temperatures)", "transfer matrix, free L x L Ising, L = 6..12 (updates, ~2^L per row)"};
    private static final Color[] COLOURS = {new Color(0x1b6f8a), new Color(0xc0522b), new Color(0x5a8f29),
        new Color(0x7a3f9a)};

    public static void main(String[] args) throws RunnerException, IOException {
        String out = args.length > 0 ? args[0] : "scaling.png";
        Collection<RunResult> results = new Runner(new OptionsBuilder()
                .include(ScalingBenchmark.class.getSimpleName())
                .warmupTime(org.openjdk.jmh.runner.options.TimeValue.seconds(1))
                .measurementTime(org.openjdk.jmh.runner.options.TimeValue.seconds(1)).build()).run();
        Map<String, TreeMap<Double, Double>> series = new TreeMap<>();
        for (RunResult r : results) {
            String name = r.getParams().getBenchmark();
            name = name.substring(name.lastIndexOf('.') + 1);
            int scale = Integer.parseInt(r.getParams().getParam("scale"));
            series.computeIfAbsent(name, k -> new TreeMap<>())
                    .put(ScalingBenchmark.work(name, scale), r.getPrimaryResult().getScore());
        }
        double[] exponent = new double[NAMES.length];
        for (int i = 0; i < NAMES.length; i++) {
            TreeMap<Double, Double> s = series.get(NAMES[i]);
            exponent[i] = slope(s);
            System.out.printf("%s: exponent %.2f%n", LABELS[i], exponent[i]);
            for (Map.Entry<Double, Double> e : s.entrySet()) {
                System.out.printf("    work %.3g  time %.3g ms  (%.3g ns per unit of work)%n", e.getKey(), e.getValue(),
                        1e6 * e.getValue() / e.getKey());
            }
        }
        widthFit(series.get("transferMatrix"));
        draw(series, exponent, new File(out));
        System.out.println("wrote " + out);
    }

    /**
     * Prints the transfer matrix's time against the lattice width L: the least-squares slope of ln(time)
     * against L gives the growth factor per unit of width (2^L states times the growing number of sites
     * and table entries, so somewhat above 2).
     */
    private static void widthFit(TreeMap<Double, Double> byWork) {
        Map<Double, Double> byWidth = new TreeMap<>();
        int i = 0;
        for (double time : byWork.values()) {                  // work grows with L, so the order is the size order
            byWidth.put(Math.exp(ScalingBenchmark.LATTICE_WIDTH[i++]), time);   // slope() takes ln of the key: L
        }
        double perWidth = Math.exp(slope(byWidth));
        System.out.printf("lattice transfer matrix: time x %.2f per unit of width L (ln time against L)%n", perWidth);
    }

    /** Least-squares slope of ln(time) against ln(work). */
    static double slope(Map<Double, Double> s) {
        double n = 0;
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (Map.Entry<Double, Double> e : s.entrySet()) {
            double x = Math.log(e.getKey());
            double y = Math.log(e.getValue());
            n++;
            sx += x;
            sy += y;
            sxx += x * x;
            sxy += x * y;
        }
        return (n * sxy - sx * sy) / (n * sxx - sx * sx);
    }

    private static void draw(Map<String, TreeMap<Double, Double>> series, double[] exponent, File file) throws IOException {
        int w = 640;
        int h = 438;
        int left = 70;
        int right = 20;
        int top = 20;
        int bottom = 128;
        double x0 = Double.POSITIVE_INFINITY;
        double x1 = Double.NEGATIVE_INFINITY;
        double y0 = Double.POSITIVE_INFINITY;
        double y1 = Double.NEGATIVE_INFINITY;
        for (TreeMap<Double, Double> s : series.values()) {
            for (Map.Entry<Double, Double> e : s.entrySet()) {
                x0 = Math.min(x0, Math.floor(Math.log10(e.getKey())));
                x1 = Math.max(x1, Math.ceil(Math.log10(e.getKey())));
                y0 = Math.min(y0, Math.floor(Math.log10(e.getValue())));
                y1 = Math.max(y1, Math.ceil(Math.log10(e.getValue())));
            }
        }
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, w, h);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
        int pw = w - left - right;
        int ph = h - top - bottom;
        g.setColor(new Color(0xdddddd));
        for (double d = x0; d <= x1; d++) {
            int x = left + (int) Math.round((d - x0) / (x1 - x0) * pw);
            g.drawLine(x, top, x, top + ph);
        }
        for (double d = y0; d <= y1; d++) {
            int y = top + ph - (int) Math.round((d - y0) / (y1 - y0) * ph);
            g.drawLine(left, y, left + pw, y);
        }
        g.setColor(Color.DARK_GRAY);
        g.drawRect(left, top, pw, ph);
        for (double d = x0; d <= x1; d++) {
            int x = left + (int) Math.round((d - x0) / (x1 - x0) * pw);
            g.drawString("1e" + (int) d, x - 12, top + ph + 16);
        }
        for (double d = y0; d <= y1; d++) {
            int y = top + ph - (int) Math.round((d - y0) / (y1 - y0) * ph);
            g.drawString("1e" + (int) d, left - 40, y + 4);
        }
        g.drawString("work (units per curve)", left + pw / 2 - 60, top + ph + 32);
        g.drawString("ms", 10, top + ph / 2);
        g.setStroke(new BasicStroke(2f));
        for (int i = 0; i < NAMES.length; i++) {
            TreeMap<Double, Double> s = series.get(NAMES[i]);
            g.setColor(COLOURS[i]);
            List<int[]> pts = new ArrayList<>();
            for (Map.Entry<Double, Double> e : s.entrySet()) {
                int x = left + (int) Math.round((Math.log10(e.getKey()) - x0) / (x1 - x0) * pw);
                int y = top + ph - (int) Math.round((Math.log10(e.getValue()) - y0) / (y1 - y0) * ph);
                pts.add(new int[] {x, y});
                g.fillOval(x - 4, y - 4, 8, 8);
            }
            for (int k = 1; k < pts.size(); k++) {
                g.drawLine(pts.get(k - 1)[0], pts.get(k - 1)[1], pts.get(k)[0], pts.get(k)[1]);
            }
            int ly = top + ph + 52 + 18 * i;
            g.fillRect(left, ly - 9, 14, 10);
            g.setColor(Color.DARK_GRAY);
            g.drawString(String.format("%s: time ~ work^%.2f", LABELS[i], exponent[i]), left + 22, ly);
        }
        g.dispose();
        ImageIO.write(img, "png", file);
    }
}
