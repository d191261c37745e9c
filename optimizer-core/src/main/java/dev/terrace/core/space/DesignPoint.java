package dev.terrace.core.space;

import java.util.Arrays;

/**
 * A point of a {@link DesignSpace}: continuous coordinates in the unit cube (log-mapped for
 * {@code scale: log} settings) and a level index per categorical setting.
 *
 * @param x      continuous coordinates, each in [0, 1]; copied
 * @param levels categorical level indices; copied
 * @since 0.1
 */
public record DesignPoint(double[] x, int[] levels) {

    /** Copies and checks the arrays. */
    public DesignPoint {
        x = x.clone();
        levels = levels.clone();
        for (double v : x) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("design coordinate is not finite");
            }
        }
    }

    /** @return a copy of the continuous coordinates */
    @Override
    public double[] x() {
        return x.clone();
    }

    /** @return a copy of the level indices */
    @Override
    public int[] levels() {
        return levels.clone();
    }

    /**
     * @param i a continuous dimension
     * @return its coordinate
     */
    public double x(int i) {
        return x[i];
    }

    /** @return number of continuous coordinates */
    public int dimensions() {
        return x.length;
    }

    /** @return number of categorical levels held */
    public int levelCount() {
        return levels.length;
    }

    /**
     * @param j a categorical dimension
     * @return its level index
     */
    public int level(int j) {
        return levels[j];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof DesignPoint && Arrays.equals(x, ((DesignPoint) o).x)
                && Arrays.equals(levels, ((DesignPoint) o).levels);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(x) + Arrays.hashCode(levels);
    }

    @Override
    public String toString() {
        return "DesignPoint" + Arrays.toString(x) + Arrays.toString(levels);
    }
}
