package dev.terrace.core.fit;

import org.apache.commons.math3.distribution.TDistribution;

/**
 * Straight-line fit of ln(density) against 1/(k_B T): the effective activation energy of island
 * or droplet densities, with its 95 % interval when there are more than two points.
 *
 * <p>For complete condensation the slope relates to the nucleation parameters as
 * E = (E_i + i E_d)/(i + alpha) (Venables, Spiller, Hanbücken, Rep. Prog. Phys. 47, 399 (1984));
 * {@link #impliedDiffusionBarrier} inverts that relation.
 *
 * @param energyEv effective activation energy E in eV (density ∝ exp(E/kT), so E > 0 when the
 *                 density falls with temperature)
 * @param lo       lower end of the 95 % interval (NaN with two points)
 * @param hi       upper end of the 95 % interval (NaN with two points)
 * @param n        number of points
 * @since 0.1
 */
public record Arrhenius(double energyEv, double lo, double hi, int n) {

    /** Boltzmann constant in eV/K (CODATA 2018, exact in SI). */
    public static final double BOLTZMANN_EV_PER_K = 8.617333262e-5;

    /**
     * @param temperaturesK temperatures in K
     * @param densities     densities (any unit; only ratios matter)
     * @return the fit
     * @throws IllegalArgumentException with fewer than two distinct temperatures or non-positive densities
     */
    public static Arrhenius fit(double[] temperaturesK, double[] densities) {
        int n = temperaturesK.length;
        if (n != densities.length || n < 2) {
            throw new IllegalArgumentException("need at least two temperature-density pairs");
        }
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            if (!(temperaturesK[i] > 0) || !(densities[i] > 0)) {
                throw new IllegalArgumentException("temperatures and densities must be positive");
            }
            x[i] = 1.0 / (BOLTZMANN_EV_PER_K * temperaturesK[i]);
            y[i] = Math.log(densities[i]);
        }
        double mx = 0;
        double my = 0;
        for (int i = 0; i < n; i++) {
            mx += x[i] / n;
            my += y[i] / n;
        }
        double sxx = 0;
        double sxy = 0;
        for (int i = 0; i < n; i++) {
            sxx += (x[i] - mx) * (x[i] - mx);
            sxy += (x[i] - mx) * (y[i] - my);
        }
        if (!(sxx > 0)) {
            throw new IllegalArgumentException("need at least two distinct temperatures");
        }
        double slope = sxy / sxx;
        if (n == 2) {
            return new Arrhenius(slope, Double.NaN, Double.NaN, n);
        }
        double rss = 0;
        for (int i = 0; i < n; i++) {
            double r = y[i] - (my + slope * (x[i] - mx));
            rss += r * r;
        }
        double se = Math.sqrt(rss / (n - 2) / sxx);
        double t = new TDistribution(n - 2).inverseCumulativeProbability(0.975);
        return new Arrhenius(slope, slope - t * se, slope + t * se, n);
    }

    /**
     * Inverts E = (E_i + i E_d)/(i + alpha) for E_d.
     *
     * @param criticalSize  i
     * @param alpha         2 for 2D islands, 2.5 for 3D islands and droplets
     * @param bindingEnergy E_i in eV (0 for i = 1)
     * @return E_d in eV
     */
    public double impliedDiffusionBarrier(int criticalSize, double alpha, double bindingEnergy) {
        return (energyEv * (criticalSize + alpha) - bindingEnergy) / criticalSize;
    }
}
