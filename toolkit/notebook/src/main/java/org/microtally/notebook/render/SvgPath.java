package org.microtally.notebook.render;

/**
 * A polyline as compact SVG path data: coordinates rounded to a tenth of a pixel, relative steps, and
 * points dropped that would move the drawn line by at most {@value #SIMPLIFY_PX} px (Ramer-Douglas-Peucker:
 * D. H. Douglas and T. K. Peucker, The Canadian Cartographer 10 (1973) 112). Points marked not ok break
 * the line into separate runs.
 */
final class SvgPath {
    static final double SIMPLIFY_PX = 0.25;

    private SvgPath() { }

    /** The visible points as one path: absolute move at each start, relative line steps, simplified. */
    static String polyline(double[] px, double[] py, boolean[] ok) {
        StringBuilder d = new StringBuilder();
        int i = 0;
        while (i < px.length) {
            while (i < px.length && !ok[i]) {
                i++;
            }
            int start = i;
            while (i < px.length && ok[i]) {
                i++;
            }
            if (i - start == 0) {
                continue;
            }
            boolean[] keep = new boolean[i - start];
            simplify(px, py, start, i - 1, keep, start);
            keep[0] = true;
            keep[keep.length - 1] = true;
            long lastX = 0;
            long lastY = 0;
            boolean first = true;
            for (int j = start; j < i; j++) {
                if (!keep[j - start]) {
                    continue;
                }
                long x = Math.round(px[j] * 10);
                long y = Math.round(py[j] * 10);
                if (first) {
                    d.append('M').append(tenths(x)).append(' ').append(tenths(y));
                    if (i - start == 1) {
                        d.append("h0.1");
                    }
                    first = false;
                } else if (x != lastX || y != lastY) {
                    d.append('l').append(tenths(x - lastX)).append(y - lastY < 0 ? "" : " ").append(tenths(y - lastY));
                }
                lastX = x;
                lastY = y;
            }
        }
        return d.toString();
    }

    /** Ramer-Douglas-Peucker: marks the points of [a, b] that stay within {@value #SIMPLIFY_PX} px. */
    private static void simplify(double[] px, double[] py, int a, int b, boolean[] keep, int offset) {
        java.util.ArrayDeque<int[]> stack = new java.util.ArrayDeque<>();
        stack.push(new int[] {a, b});
        while (!stack.isEmpty()) {
            int[] seg = stack.pop();
            double dx = px[seg[1]] - px[seg[0]];
            double dy = py[seg[1]] - py[seg[0]];
            double len = Math.hypot(dx, dy);
            double worst = -1;
            int at = -1;
            for (int j = seg[0] + 1; j < seg[1]; j++) {
                double dist = len == 0 ? Math.hypot(px[j] - px[seg[0]], py[j] - py[seg[0]])
                        : Math.abs(dy * (px[j] - px[seg[0]]) - dx * (py[j] - py[seg[0]])) / len;
                if (dist > worst) {
                    worst = dist;
                    at = j;
                }
            }
            if (worst > SIMPLIFY_PX) {
                keep[at - offset] = true;
                stack.push(new int[] {seg[0], at});
                stack.push(new int[] {at, seg[1]});
            }
        }
    }

    /** {@code t} tenths as the shortest decimal: 12 -> "1.2", -30 -> "-3". */
    static String tenths(long t) {
        long a = Math.abs(t);
        String s = (t < 0 ? "-" : "") + a / 10;
        return a % 10 == 0 ? s : s + "." + a % 10;
    }
}
