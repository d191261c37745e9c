package dev.terrace.demo;

import java.util.SplittableRandom;

/**
 * A smooth, seeded random function of a few scaled coordinates: a sum of random cosines
 * (random Fourier features of a squared-exponential kernel with unit length scale, Rahimi and
 * Recht, NIPS 2007). Its values have standard deviation {@code amplitude} over random seeds. It
 * gives the invented truth a reproducible lumpiness that no growth model captures.
 */
final class SmoothField {

    /** Number of cosines; enough for a smooth field, few enough to stay cheap. */
    static final int FEATURES = 16;

    private final double amplitude;
    private final double[][] w;
    private final double[] b;

    SmoothField(int dimension, double amplitude, long seed) {
        this.amplitude = amplitude;
        SplittableRandom rng = new SplittableRandom(seed);
        w = new double[FEATURES][dimension];
        b = new double[FEATURES];
        for (int k = 0; k < FEATURES; k++) {
            for (int j = 0; j < dimension; j++) {
                w[k][j] = VirtualChamber.gaussian(rng);
            }
            b[k] = 2 * StrictMath.PI * rng.nextDouble();
        }
    }

    /**
     * @param x scaled coordinates, one per dimension, each of order one
     * @return the field's value; finite for finite input
     */
    double value(double[] x) {
        if (amplitude == 0) {
            return 0;
        }
        double sum = 0;
        for (int k = 0; k < FEATURES; k++) {
            double dot = b[k];
            for (int j = 0; j < x.length; j++) {
                dot += w[k][j] * x[j];
            }
            sum += StrictMath.cos(dot);
        }
        return amplitude * StrictMath.sqrt(2.0 / FEATURES) * sum;
    }
}
