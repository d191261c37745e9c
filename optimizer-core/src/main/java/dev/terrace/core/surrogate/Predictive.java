package dev.terrace.core.surrogate;

/**
 * Posterior predictions of a {@link GaussianProcess} at a batch of points, on the outcome's
 * fitting scale.
 *
 * @param mean     posterior mean per point (prior mean included); copied, finite
 * @param sdLatent posterior standard deviation of the latent function per point; copied, finite,
 *                 non-negative
 * @param noiseSd  standard deviation of a new measurement's noise; finite, non-negative
 * @since 0.1
 */
public record Predictive(double[] mean, double[] sdLatent, double noiseSd) {

    /** Copies and checks the values. */
    public Predictive {
        if (mean.length != sdLatent.length) {
            throw new IllegalArgumentException("mean and sd lengths differ");
        }
        if (!(noiseSd >= 0) || !Double.isFinite(noiseSd)) {
            throw new IllegalArgumentException("noise sd must be finite and non-negative: " + noiseSd);
        }
        mean = mean.clone();
        sdLatent = sdLatent.clone();
        for (int i = 0; i < mean.length; i++) {
            if (!Double.isFinite(mean[i]) || !(sdLatent[i] >= 0) || !Double.isFinite(sdLatent[i])) {
                throw new IllegalArgumentException("prediction " + i + " is not finite");
            }
        }
    }

    /** @return a copy of the means */
    @Override
    public double[] mean() {
        return mean.clone();
    }

    /** @return a copy of the latent standard deviations */
    @Override
    public double[] sdLatent() {
        return sdLatent.clone();
    }

    /** @return number of points */
    public int size() {
        return mean.length;
    }

    /**
     * @param i a point index
     * @return its posterior mean
     */
    public double mean(int i) {
        return mean[i];
    }

    /**
     * @param i a point index
     * @return the standard deviation of the latent function there
     */
    public double sdLatent(int i) {
        return sdLatent[i];
    }

    /**
     * The standard deviation of a new measurement at point i: latent uncertainty plus noise
     * (Rasmussen &amp; Williams 2006, eq. 2.26 plus σn²).
     *
     * @param i a point index
     * @return sqrt(sdLatent² + noiseSd²)
     */
    public double sdNew(int i) {
        return Math.hypot(sdLatent[i], noiseSd);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Predictive && java.util.Arrays.equals(mean, ((Predictive) o).mean)
                && java.util.Arrays.equals(sdLatent, ((Predictive) o).sdLatent)
                && Double.compare(noiseSd, ((Predictive) o).noiseSd) == 0;
    }

    @Override
    public int hashCode() {
        return 31 * (31 * java.util.Arrays.hashCode(mean) + java.util.Arrays.hashCode(sdLatent))
                + Double.hashCode(noiseSd);
    }

    @Override
    public String toString() {
        return "Predictive[n=" + mean.length + ", noiseSd=" + noiseSd + "]";
    }
}
