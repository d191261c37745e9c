package dev.terrace.core.window;

import dev.terrace.core.campaign.ParameterSpec;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * A process-window map over two numeric settings, every other setting held: the predicted yield
 * on a grid of cells, the most likely class per cell and the share of the map where a run is
 * more likely than not to meet every target (the window).
 *
 * <p>The grid has {@code nx = xs.length} columns and {@code ny = ys.length} rows. Cell (i, j)
 * is column i along x and row j along y; its centre is at (xs[i], ys[j]) in campaign units. The
 * cells tile the parameter box evenly in the unit cube of the design space, so for a
 * {@code scale: log} setting they are evenly spaced in log10 and the centres are geometric
 * midpoints. Array accessors return copies; the {@code ...At} methods read single cells without
 * copying.
 *
 * @param x                       the setting along the horizontal axis; never null
 * @param y                       the setting along the vertical axis; never null
 * @param xs                      cell centres along x in campaign units, ascending
 * @param ys                      cell centres along y in campaign units, ascending
 * @param yield                   yield[j][i]: predicted yield of cell (i, j), in [0, 1]; averaged over
 *                                the thermocouple error when {@code temperatureUncertaintyK > 0};
 *                                0 where the cell breaks a campaign limit
 * @param plainYield              the same without thermocouple error (equal to {@code yield} when the
 *                                uncertainty is 0)
 * @param feasible                feasible[j][i]: false where the cell's recipe breaks a campaign limit
 * @param classOutcome            the class outcome whose most likely class is mapped (the first class
 *                                outcome with a class target), or null when the campaign has none
 * @param classes                 that outcome's classes in campaign order (empty without one)
 * @param likelyClass             likelyClass[j][i]: the most likely class at the cell's set point, or
 *                                null when {@code classOutcome} is null
 * @param classProbability        classProbability[k][j][i]: the predicted probability of class k (in
 *                                {@code classes} order) at the cell's set point, each in [0, 1]; null
 *                                when {@code classOutcome} is null. Class boundaries are drawn as
 *                                contours of these, so they follow the model rather than cell edges
 * @param at                      the full recipe the map is drawn around: every setting in campaign
 *                                order (Double for numeric, String for categorical); the entries for
 *                                x and y give the reference point (for instance the best proposal)
 * @param temperatureSettings     the settings shifted by the thermocouple error (those whose role is
 *                                a temperature); never null
 * @param temperatureUncertaintyK standard deviation of the thermocouple error in K, &ge; 0
 * @param windowFraction          share of the map's cells with yield &ge; {@link WindowMap#WINDOW_THRESHOLD}
 * @param plainWindowFraction     the same share for {@code plainYield}
 * @since 0.1
 */
public record WindowMapResult(ParameterSpec x, ParameterSpec y, double[] xs, double[] ys, double[][] yield,
                              double[][] plainYield, boolean[][] feasible, String classOutcome,
                              List<String> classes, String[][] likelyClass, double[][][] classProbability,
                              Map<String, Object> at,
                              List<String> temperatureSettings, double temperatureUncertaintyK,
                              double windowFraction, double plainWindowFraction) {

    /**
     * The best cell of the map.
     *
     * @param i     column
     * @param j     row
     * @param x     the x setting at the cell centre, campaign units
     * @param y     the y setting at the cell centre, campaign units
     * @param yield its predicted yield
     */
    public record Cell(int i, int j, double x, double y, double yield) {
    }

    /**
     * One connected region of cells (sharing edges) where the same class is most likely.
     *
     * @param className the class
     * @param cells     number of cells in the region
     * @param fraction  its share of the map
     * @param x         x of the region's label point (the region cell nearest the region's
     *                  centroid in the unit cube, so it lies inside even a curved region)
     * @param y         y of the label point
     */
    public record ClassRegion(String className, int cells, double fraction, double x, double y) {
    }

    /** Copies the arrays and checks the invariants. */
    public WindowMapResult {
        Objects.requireNonNull(x, "x");
        Objects.requireNonNull(y, "y");
        xs = xs.clone();
        ys = ys.clone();
        int nx = xs.length;
        int ny = ys.length;
        if (nx < 1 || ny < 1) {
            throw new IllegalArgumentException("a map needs at least one cell");
        }
        yield = copy(yield, nx, ny, "yield");
        plainYield = copy(plainYield, nx, ny, "plainYield");
        if (feasible.length != ny) {
            throw new IllegalArgumentException("feasible has " + feasible.length + " rows, expected " + ny);
        }
        boolean[][] f = new boolean[ny][];
        for (int j = 0; j < ny; j++) {
            if (feasible[j].length != nx) {
                throw new IllegalArgumentException("feasible row " + j + " has the wrong length");
            }
            f[j] = feasible[j].clone();
        }
        feasible = f;
        classes = List.copyOf(classes);
        if (classOutcome == null) {
            if (likelyClass != null || classProbability != null) {
                throw new IllegalArgumentException("likelyClass or classProbability given without a class outcome");
            }
        } else {
            Objects.requireNonNull(likelyClass, "likelyClass");
            if (likelyClass.length != ny) {
                throw new IllegalArgumentException("likelyClass has the wrong number of rows");
            }
            String[][] lc = new String[ny][];
            for (int j = 0; j < ny; j++) {
                if (likelyClass[j].length != nx) {
                    throw new IllegalArgumentException("likelyClass row " + j + " has the wrong length");
                }
                for (String s : likelyClass[j]) {
                    if (!classes.contains(s)) {
                        throw new IllegalArgumentException("unknown class " + s + " in the map");
                    }
                }
                lc[j] = likelyClass[j].clone();
            }
            likelyClass = lc;
            Objects.requireNonNull(classProbability, "classProbability");
            if (classProbability.length != classes.size()) {
                throw new IllegalArgumentException("classProbability has " + classProbability.length
                        + " classes, expected " + classes.size());
            }
            double[][][] cp = new double[classes.size()][][];
            for (int k = 0; k < cp.length; k++) {
                cp[k] = copy(classProbability[k], nx, ny, "classProbability of " + classes.get(k));
            }
            classProbability = cp;
        }
        at = Collections.unmodifiableMap(new LinkedHashMap<>(at));
        temperatureSettings = List.copyOf(temperatureSettings);
        if (!(temperatureUncertaintyK >= 0) || !Double.isFinite(temperatureUncertaintyK)) {
            throw new IllegalArgumentException("temperature uncertainty must be finite and >= 0");
        }
        if (!(windowFraction >= 0 && windowFraction <= 1) || !(plainWindowFraction >= 0 && plainWindowFraction <= 1)) {
            throw new IllegalArgumentException("window fractions must lie in [0, 1]");
        }
    }

    private static double[][] copy(double[][] a, int nx, int ny, String what) {
        if (a.length != ny) {
            throw new IllegalArgumentException(what + " has " + a.length + " rows, expected " + ny);
        }
        double[][] out = new double[ny][];
        for (int j = 0; j < ny; j++) {
            if (a[j].length != nx) {
                throw new IllegalArgumentException(what + " row " + j + " has the wrong length");
            }
            for (double v : a[j]) {
                if (!(v >= 0 && v <= 1)) {
                    throw new IllegalArgumentException(what + " must lie in [0, 1], found " + v);
                }
            }
            out[j] = a[j].clone();
        }
        return out;
    }

    private static double[][] deepCopy(double[][] a) {
        double[][] out = new double[a.length][];
        for (int j = 0; j < a.length; j++) {
            out[j] = a[j].clone();
        }
        return out;
    }

    /** @return the cell centres along x; a copy */
    @Override
    public double[] xs() {
        return xs.clone();
    }

    /** @return the cell centres along y; a copy */
    @Override
    public double[] ys() {
        return ys.clone();
    }

    /** @return yield[j][i]; a copy */
    @Override
    public double[][] yield() {
        return deepCopy(yield);
    }

    /** @return plainYield[j][i]; a copy */
    @Override
    public double[][] plainYield() {
        return deepCopy(plainYield);
    }

    /** @return feasible[j][i]; a copy */
    @Override
    public boolean[][] feasible() {
        boolean[][] out = new boolean[feasible.length][];
        for (int j = 0; j < feasible.length; j++) {
            out[j] = feasible[j].clone();
        }
        return out;
    }

    /** @return likelyClass[j][i], a copy, or null without a class outcome */
    @Override
    public String[][] likelyClass() {
        if (likelyClass == null) {
            return null;
        }
        String[][] out = new String[likelyClass.length][];
        for (int j = 0; j < likelyClass.length; j++) {
            out[j] = likelyClass[j].clone();
        }
        return out;
    }

    /** @return classProbability[k][j][i], a copy, or null without a class outcome */
    @Override
    public double[][][] classProbability() {
        if (classProbability == null) {
            return null;
        }
        double[][][] out = new double[classProbability.length][][];
        for (int k = 0; k < out.length; k++) {
            out[k] = deepCopy(classProbability[k]);
        }
        return out;
    }

    /** @return number of columns */
    public int nx() {
        return xs.length;
    }

    /** @return number of rows */
    public int ny() {
        return ys.length;
    }

    /**
     * @param i a column
     * @return its centre along x, campaign units
     */
    public double xAt(int i) {
        return xs[i];
    }

    /**
     * @param j a row
     * @return its centre along y, campaign units
     */
    public double yAt(int j) {
        return ys[j];
    }

    /**
     * @param i a column
     * @param j a row
     * @return the cell's yield (robust when an uncertainty was given)
     */
    public double yieldAt(int i, int j) {
        return yield[j][i];
    }

    /**
     * @param i a column
     * @param j a row
     * @return the cell's yield without thermocouple error
     */
    public double plainYieldAt(int i, int j) {
        return plainYield[j][i];
    }

    /**
     * @param i a column
     * @param j a row
     * @return false when the cell's recipe breaks a campaign limit
     */
    public boolean feasibleAt(int i, int j) {
        return feasible[j][i];
    }

    /**
     * @param i a column
     * @param j a row
     * @return the most likely class at the cell, or null without a class outcome
     */
    public String likelyClassAt(int i, int j) {
        return likelyClass == null ? null : likelyClass[j][i];
    }

    /** @return the cell edges along x in campaign units (nx + 1 values, from the box's min to its max) */
    public double[] xEdges() {
        return edges(x, xs.length);
    }

    /** @return the cell edges along y in campaign units (ny + 1 values) */
    public double[] yEdges() {
        return edges(y, ys.length);
    }

    private static double[] edges(ParameterSpec p, int n) {
        double[] e = new double[n + 1];
        for (int k = 0; k <= n; k++) {
            e[k] = p.fromUnit((double) k / n);
        }
        e[0] = p.min();
        e[n] = p.max();
        return e;
    }

    /** @return true when the yield is averaged over a thermocouple error */
    public boolean robust() {
        return temperatureUncertaintyK > 0 && !temperatureSettings.isEmpty();
    }

    /** @return how much of the map the window loses to the thermocouple error (plain minus robust share) */
    public double windowShrink() {
        return plainWindowFraction - windowFraction;
    }

    /** @return the feasible cell with the highest yield (first in row order on ties); never null */
    public Cell bestCell() {
        int bi = 0;
        int bj = 0;
        double best = -1;
        for (int j = 0; j < ys.length; j++) {
            for (int i = 0; i < xs.length; i++) {
                if (feasible[j][i] && yield[j][i] > best) {
                    best = yield[j][i];
                    bi = i;
                    bj = j;
                }
            }
        }
        return new Cell(bi, bj, xs[bi], ys[bj], Math.max(best, 0));
    }

    /**
     * The connected regions of the class map (4-neighbour connectivity), largest first within each
     * class, classes in campaign order.
     *
     * @return the regions; empty without a class outcome; never null
     */
    public List<ClassRegion> classRegions() {
        if (likelyClass == null) {
            return List.of();
        }
        int nx = xs.length;
        int ny = ys.length;
        int[][] label = new int[ny][nx];
        for (int[] row : label) {
            java.util.Arrays.fill(row, -1);
        }
        List<List<int[]>> comps = new ArrayList<>();
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                if (label[j][i] >= 0) {
                    continue;
                }
                String cls = likelyClass[j][i];
                List<int[]> comp = new ArrayList<>();
                ArrayDeque<int[]> queue = new ArrayDeque<>();
                queue.add(new int[] {i, j});
                label[j][i] = comps.size();
                while (!queue.isEmpty()) {
                    int[] c = queue.poll();
                    comp.add(c);
                    int[][] nb = {{c[0] + 1, c[1]}, {c[0] - 1, c[1]}, {c[0], c[1] + 1}, {c[0], c[1] - 1}};
                    for (int[] q : nb) {
                        if (q[0] >= 0 && q[0] < nx && q[1] >= 0 && q[1] < ny && label[q[1]][q[0]] < 0
                                && likelyClass[q[1]][q[0]].equals(cls)) {
                            label[q[1]][q[0]] = comps.size();
                            queue.add(q);
                        }
                    }
                }
                comps.add(comp);
            }
        }
        List<ClassRegion> out = new ArrayList<>();
        double total = (double) nx * ny;
        for (List<int[]> comp : comps) {
            double ci = 0;
            double cj = 0;
            for (int[] c : comp) {
                ci += c[0];
                cj += c[1];
            }
            ci /= comp.size();
            cj /= comp.size();
            int[] anchor = comp.get(0);
            double bestD = Double.POSITIVE_INFINITY;
            for (int[] c : comp) {
                double d = (c[0] - ci) * (c[0] - ci) / ((double) nx * nx) + (c[1] - cj) * (c[1] - cj) / ((double) ny * ny);
                if (d < bestD) {
                    bestD = d;
                    anchor = c;
                }
            }
            String cls = likelyClass[anchor[1]][anchor[0]];
            out.add(new ClassRegion(cls, comp.size(), comp.size() / total, xs[anchor[0]], ys[anchor[1]]));
        }
        out.sort((a, b) -> {
            int c = Integer.compare(classes.indexOf(a.className()), classes.indexOf(b.className()));
            return c != 0 ? c : Integer.compare(b.cells(), a.cells());
        });
        return out;
    }

    /**
     * @return the share of the map where each class is most likely, in campaign class order
     *         (classes never most likely are left out); empty without a class outcome
     */
    public Map<String, Double> classShares() {
        Map<String, Double> m = new LinkedHashMap<>();
        if (likelyClass == null) {
            return m;
        }
        int[] counts = new int[classes.size()];
        for (String[] row : likelyClass) {
            for (String s : row) {
                counts[classes.indexOf(s)]++;
            }
        }
        double total = (double) xs.length * ys.length;
        for (int k = 0; k < counts.length; k++) {
            if (counts[k] > 0) {
                m.put(classes.get(k), counts[k] / total);
            }
        }
        return m;
    }
}
