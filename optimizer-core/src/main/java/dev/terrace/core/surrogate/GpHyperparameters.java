package dev.terrace.core.surrogate;

import java.util.Arrays;

/**
 * Hyperparameters of a {@link GaussianProcess}: variances in units of the standardised residuals
 * (see {@link GaussianProcess#residualScale()}), length scales in unit-cube units.
 *
 * @param signalVariance σf², positive
 * @param lengthScales   ARD length scale ℓ_k per continuous dimension, positive; copied
 * @param rho            correlation ρ_j in [0, 1) between different levels of each categorical
 *                       setting; copied
 * @param noiseVariance  σn², the variance of a measurement's noise, non-negative
 * @since 0.1
 */
public record GpHyperparameters(double signalVariance, double[] lengthScales, double[] rho, double noiseVariance) {

    /** Copies and checks the values. */
    public GpHyperparameters {
        if (!(signalVariance > 0) || !Double.isFinite(signalVariance)) {
            throw new IllegalArgumentException("signal variance must be positive and finite: " + signalVariance);
        }
        if (!(noiseVariance >= 0) || !Double.isFinite(noiseVariance)) {
            throw new IllegalArgumentException("noise variance must be non-negative and finite: " + noiseVariance);
        }
        lengthScales = lengthScales.clone();
        rho = rho.clone();
        for (double l : lengthScales) {
            if (!(l > 0) || !Double.isFinite(l)) {
                throw new IllegalArgumentException("length scales must be positive and finite: " + l);
            }
        }
        for (double r : rho) {
            if (!(r >= 0 && r < 1)) {
                throw new IllegalArgumentException("categorical correlation must lie in [0, 1): " + r);
            }
        }
    }

    /**
     * Default hyperparameters for data that cannot support a search (one run or no spread).
     *
     * @param dimensions continuous dimensions
     * @param settings   categorical settings
     * @param noiseFloor smallest noise variance
     * @return σf² = {@value GpSettings#DEFAULT_SIGNAL_VARIANCE}, ℓ = {@value GpSettings#DEFAULT_LENGTH_SCALE},
     *         ρ = {@value GpSettings#DEFAULT_RHO}, σn² = max({@value GpSettings#DEFAULT_NOISE_VARIANCE}, floor)
     */
    public static GpHyperparameters defaults(int dimensions, int settings, double noiseFloor) {
        double[] l = new double[dimensions];
        Arrays.fill(l, GpSettings.DEFAULT_LENGTH_SCALE);
        double[] r = new double[settings];
        Arrays.fill(r, GpSettings.DEFAULT_RHO);
        return new GpHyperparameters(GpSettings.DEFAULT_SIGNAL_VARIANCE, l,
                r, Math.max(GpSettings.DEFAULT_NOISE_VARIANCE, noiseFloor));
    }

    /** @return a copy of the length scales */
    @Override
    public double[] lengthScales() {
        return lengthScales.clone();
    }

    /** @return a copy of the categorical correlations */
    @Override
    public double[] rho() {
        return rho.clone();
    }

    /**
     * @param k a continuous dimension
     * @return its length scale
     */
    public double lengthScale(int k) {
        return lengthScales[k];
    }

    /**
     * @param j a categorical setting
     * @return its correlation between different levels
     */
    public double rho(int j) {
        return rho[j];
    }

    /** @return number of continuous dimensions */
    public int dimensions() {
        return lengthScales.length;
    }

    /** @return number of categorical settings */
    public int categoricalCount() {
        return rho.length;
    }

    @Override
    public boolean equals(Object o) {
        if (!(o instanceof GpHyperparameters)) {
            return false;
        }
        GpHyperparameters h = (GpHyperparameters) o;
        return Double.compare(signalVariance, h.signalVariance) == 0
                && Double.compare(noiseVariance, h.noiseVariance) == 0
                && Arrays.equals(lengthScales, h.lengthScales) && Arrays.equals(rho, h.rho);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(new double[] {signalVariance, noiseVariance}) * 31 * 31
                + Arrays.hashCode(lengthScales) * 31 + Arrays.hashCode(rho);
    }

    @Override
    public String toString() {
        return "GpHyperparameters[signalVariance=" + signalVariance + ", lengthScales="
                + Arrays.toString(lengthScales) + ", rho=" + Arrays.toString(rho)
                + ", noiseVariance=" + noiseVariance + "]";
    }
}
