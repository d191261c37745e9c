package dev.terrace.cli.plot;

import java.util.ArrayList;
import java.util.List;

/**
 * Iso-lines of a gridded field by marching squares (Lorensen &amp; Cline's marching cubes reduced
 * to two dimensions; common practice), with linear interpolation along cell edges and saddle
 * cells resolved by the mean of their four corners.
 */
final class Contours {

    private Contours() {
    }

    /**
     * @param f     field values f[j][i] at grid nodes (xs[i], ys[j])
     * @param xs    node positions along x (any monotone coordinate)
     * @param ys    node positions along y
     * @param level the iso-level
     * @return segments {x0, y0, x1, y1} in the coordinates of xs and ys; never null
     */
    static List<double[]> segments(double[][] f, double[] xs, double[] ys, double level) {
        List<double[]> out = new ArrayList<>();
        march(f, xs, ys, level, (i, j, seg) -> out.add(seg));
        return out;
    }

    /**
     * Boundaries between the regions where each class is most likely, from gridded class
     * probabilities. For each class k the margin {@code p_k - max(p_m, m != k)} is contoured at 0
     * (the level where k ties with its strongest rival); of the two copies of each boundary (one
     * from each side) only the one from the class earlier in order is kept, judged by the rival
     * at the segment's midpoint (bilinear interpolation in its cell).
     *
     * @param p  p[k][j][i]: probability of class k at node (xs[i], ys[j]); at least two classes
     *           give any boundary
     * @param xs node positions along x
     * @param ys node positions along y
     * @return segments {x0, y0, x1, y1} in the coordinates of xs and ys; never null
     */
    static List<double[]> classBoundaries(double[][][] p, double[] xs, double[] ys) {
        List<double[]> out = new ArrayList<>();
        int classes = p.length;
        if (classes < 2) {
            return out;
        }
        for (int k = 0; k < classes; k++) {
            final int self = k;
            double[][] margin = new double[ys.length][xs.length];
            for (int j = 0; j < ys.length; j++) {
                for (int i = 0; i < xs.length; i++) {
                    double rival = Double.NEGATIVE_INFINITY;
                    for (int m = 0; m < classes; m++) {
                        if (m != k) {
                            rival = Math.max(rival, p[m][j][i]);
                        }
                    }
                    margin[j][i] = p[k][j][i] - rival;
                }
            }
            march(margin, xs, ys, 0, (i, j, seg) -> {
                if (rivalAt(p, self, xs, ys, i, j, (seg[0] + seg[2]) / 2, (seg[1] + seg[3]) / 2) > self) {
                    out.add(seg);
                }
            });
        }
        return out;
    }

    /** The most probable class other than {@code self} at (x, y) inside cell (i, j), bilinearly interpolated. */
    private static int rivalAt(double[][][] p, int self, double[] xs, double[] ys, int i, int j, double x, double y) {
        double tx = xs[i + 1] == xs[i] ? 0.5 : (x - xs[i]) / (xs[i + 1] - xs[i]);
        double ty = ys[j + 1] == ys[j] ? 0.5 : (y - ys[j]) / (ys[j + 1] - ys[j]);
        int best = -1;
        double bestP = Double.NEGATIVE_INFINITY;
        for (int m = 0; m < p.length; m++) {
            if (m == self) {
                continue;
            }
            double v = (1 - tx) * (1 - ty) * p[m][j][i] + tx * (1 - ty) * p[m][j][i + 1]
                    + tx * ty * p[m][j + 1][i + 1] + (1 - tx) * ty * p[m][j + 1][i];
            if (v > bestP) {
                bestP = v;
                best = m;
            }
        }
        return best;
    }

    /** Receives each segment with the cell (i, j) it lies in. */
    @FunctionalInterface
    private interface CellSink {
        void accept(int i, int j, double[] segment);
    }

    private static void march(double[][] f, double[] xs, double[] ys, double level, CellSink out) {
        for (int j = 0; j + 1 < ys.length; j++) {
            for (int i = 0; i + 1 < xs.length; i++) {
                double a = f[j][i];         // bottom-left
                double b = f[j][i + 1];     // bottom-right
                double c = f[j + 1][i + 1]; // top-right
                double d = f[j + 1][i];     // top-left
                int code = (a >= level ? 1 : 0) | (b >= level ? 2 : 0) | (c >= level ? 4 : 0) | (d >= level ? 8 : 0);
                if (code == 0 || code == 15) {
                    continue;
                }
                double[] bottom = {lerp(xs[i], xs[i + 1], a, b, level), ys[j]};
                double[] right = {xs[i + 1], lerp(ys[j], ys[j + 1], b, c, level)};
                double[] top = {lerp(xs[i], xs[i + 1], d, c, level), ys[j + 1]};
                double[] left = {xs[i], lerp(ys[j], ys[j + 1], a, d, level)};
                boolean centreIn = (a + b + c + d) / 4 >= level;
                switch (code) {
                    case 1: case 14: add(out, i, j, left, bottom); break;
                    case 2: case 13: add(out, i, j, bottom, right); break;
                    case 3: case 12: add(out, i, j, left, right); break;
                    case 4: case 11: add(out, i, j, right, top); break;
                    case 6: case 9: add(out, i, j, bottom, top); break;
                    case 7: case 8: add(out, i, j, left, top); break;
                    case 5:
                        if (centreIn) {
                            add(out, i, j, left, top);
                            add(out, i, j, bottom, right);
                        } else {
                            add(out, i, j, left, bottom);
                            add(out, i, j, right, top);
                        }
                        break;
                    case 10:
                        if (centreIn) {
                            add(out, i, j, left, bottom);
                            add(out, i, j, right, top);
                        } else {
                            add(out, i, j, left, top);
                            add(out, i, j, bottom, right);
                        }
                        break;
                    default:
                        break;
                }
            }
        }
    }

    /**
     * Joins segments that share end points into polylines, so that dashed strokes run on.
     *
     * @param segments segments {x0, y0, x1, y1}
     * @return polylines {x0, y0, x1, y1, x2, y2, ...}; never null
     */
    static List<double[]> chain(List<double[]> segments) {
        java.util.Map<String, List<Integer>> at = new java.util.HashMap<>();
        for (int k = 0; k < segments.size(); k++) {
            double[] s = segments.get(k);
            at.computeIfAbsent(key(s[0], s[1]), q -> new ArrayList<>()).add(k);
            at.computeIfAbsent(key(s[2], s[3]), q -> new ArrayList<>()).add(k);
        }
        boolean[] used = new boolean[segments.size()];
        List<double[]> out = new ArrayList<>();
        for (int k = 0; k < segments.size(); k++) {
            if (used[k]) {
                continue;
            }
            used[k] = true;
            double[] s = segments.get(k);
            java.util.ArrayDeque<double[]> line = new java.util.ArrayDeque<>();
            line.add(new double[] {s[0], s[1]});
            line.add(new double[] {s[2], s[3]});
            for (boolean forward : new boolean[] {true, false}) {
                while (true) {
                    double[] end = forward ? line.peekLast() : line.peekFirst();
                    Integer next = null;
                    for (int q : at.getOrDefault(key(end[0], end[1]), List.of())) {
                        if (!used[q]) {
                            next = q;
                            break;
                        }
                    }
                    if (next == null) {
                        break;
                    }
                    used[next] = true;
                    double[] t = segments.get(next);
                    double[] other = key(t[0], t[1]).equals(key(end[0], end[1])) ? new double[] {t[2], t[3]}
                            : new double[] {t[0], t[1]};
                    if (forward) {
                        line.addLast(other);
                    } else {
                        line.addFirst(other);
                    }
                }
            }
            double[] flat = new double[line.size() * 2];
            int n = 0;
            for (double[] p : line) {
                flat[n++] = p[0];
                flat[n++] = p[1];
            }
            out.add(flat);
        }
        return out;
    }

    private static String key(double x, double y) {
        return x + "," + y;
    }

    private static double lerp(double p0, double p1, double v0, double v1, double level) {
        if (v1 == v0) {
            return (p0 + p1) / 2;
        }
        double t = (level - v0) / (v1 - v0);
        return p0 + Math.max(0, Math.min(1, t)) * (p1 - p0);
    }

    private static void add(CellSink out, int i, int j, double[] p, double[] q) {
        out.accept(i, j, new double[] {p[0], p[1], q[0], q[1]});
    }
}
