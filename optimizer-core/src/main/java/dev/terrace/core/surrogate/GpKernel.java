package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import smile.math.kernel.MercerKernel;

/**
 * The covariance of the Terrace surrogate: an ARD Matérn-5/2 kernel over the continuous
 * coordinates times a correlation factor per categorical setting,
 * <pre>
 *   k(x, x') = σf² (1 + √5 r + 5r²/3) exp(−√5 r) · Π_j (1 if c_j = c'_j else ρ_j),
 *   r² = Σ_k (x_k − x'_k)² / ℓ_k²
 * </pre>
 * (Matérn form: Rasmussen &amp; Williams 2006, <i>Gaussian Processes for Machine Learning</i>,
 * eq. 4.17; the factor for qualitative settings with one correlation per setting follows Qian, Wu
 * &amp; Wu 2008, <i>Technometrics</i> 50:383). Each factor is a compound-symmetry correlation,
 * positive semi-definite for ρ_j in [0, 1), so the product is a valid Mercer kernel.
 *
 * <p>It works on flat vectors {@code [x_1..x_d, level_1..level_c]} (levels as doubles, see
 * {@link #encode(DesignPoint)}). As a Smile {@link MercerKernel} its hyperparameters are
 * {@code [ln σf², ln ℓ_1..ln ℓ_d, logit ρ_1..logit ρ_c]} and {@link #kg} returns the value and
 * the derivatives with respect to them. Immutable.
 *
 * @since 0.1
 */
public final class GpKernel implements MercerKernel<double[]> {

    private static final long serialVersionUID = 1L;
    private static final double SQRT5 = Math.sqrt(5.0);

    private final double signalVariance;
    private final double[] lengthScales;
    private final double[] rho;
    private final double lengthScaleMin;
    private final double lengthScaleMax;

    private GpKernel(double signalVariance, double[] lengthScales, double[] rho, double lengthScaleMin,
            double lengthScaleMax) {
        this.signalVariance = signalVariance;
        this.lengthScales = lengthScales.clone();
        this.rho = rho.clone();
        this.lengthScaleMin = lengthScaleMin;
        this.lengthScaleMax = lengthScaleMax;
    }

    /**
     * A kernel with the given hyperparameters and the default length-scale bounds for
     * {@link #lo()} and {@link #hi()}.
     *
     * @param h hyperparameters (the noise variance is not part of the kernel)
     * @return the kernel; never null
     */
    public static GpKernel of(GpHyperparameters h) {
        return of(h, GpSettings.defaults());
    }

    /**
     * A kernel with the given hyperparameters and the length-scale bounds of {@code settings}.
     *
     * @param h        hyperparameters (the noise variance is not part of the kernel)
     * @param settings bounds used by {@link #lo()} and {@link #hi()}
     * @return the kernel; never null
     */
    public static GpKernel of(GpHyperparameters h, GpSettings settings) {
        return new GpKernel(h.signalVariance(), h.lengthScales(), h.rho(), settings.lengthScaleMin(),
                settings.lengthScaleMax());
    }

    /**
     * The flat vector the kernel works on.
     *
     * @param p a design point
     * @return {@code [x_1..x_d, level_1..level_c]}; never null
     */
    public static double[] encode(DesignPoint p) {
        int d = p.dimensions();
        double[] v = new double[d + p.levelCount()];
        for (int k = 0; k < d; k++) {
            v[k] = p.x(k);
        }
        for (int j = 0; j < p.levelCount(); j++) {
            v[d + j] = p.level(j);
        }
        return v;
    }

    /**
     * The Matérn-5/2 correlation as a function of the scaled distance.
     *
     * @param r scaled distance, non-negative
     * @return (1 + √5 r + 5r²/3) exp(−√5 r)
     */
    public static double matern52(double r) {
        return (1 + SQRT5 * r + 5 * r * r / 3) * Math.exp(-SQRT5 * r);
    }

    /**
     * @param x a flat vector
     * @param y another flat vector
     * @return the scaled distance r over the continuous coordinates
     */
    public double scaledDistance(double[] x, double[] y) {
        double r2 = 0;
        for (int k = 0; k < lengthScales.length; k++) {
            double u = (x[k] - y[k]) / lengthScales[k];
            r2 += u * u;
        }
        return Math.sqrt(r2);
    }

    private double categoricalFactor(double[] x, double[] y) {
        int d = lengthScales.length;
        double f = 1;
        for (int j = 0; j < rho.length; j++) {
            if (x[d + j] != y[d + j]) {
                f *= rho[j];
            }
        }
        return f;
    }

    @Override
    public double k(double[] x, double[] y) {
        return signalVariance * matern52(scaledDistance(x, y)) * categoricalFactor(x, y);
    }

    /**
     * {@inheritDoc}
     *
     * @return {@code [k, ∂k/∂ln σf², ∂k/∂ln ℓ_1.., ∂k/∂logit ρ_1..]}
     */
    @Override
    public double[] kg(double[] x, double[] y) {
        int d = lengthScales.length;
        int c = rho.length;
        double[] g = new double[2 + d + c];
        double r2 = 0;
        double[] u2 = new double[d];
        for (int k = 0; k < d; k++) {
            double u = (x[k] - y[k]) / lengthScales[k];
            u2[k] = u * u;
            r2 += u2[k];
        }
        double r = Math.sqrt(r2);
        double e = Math.exp(-SQRT5 * r);
        double cat = categoricalFactor(x, y);
        double kv = signalVariance * (1 + SQRT5 * r + 5 * r2 / 3) * e * cat;
        g[0] = kv;
        g[1] = kv;
        // ∂k/∂ln ℓ_k = σf² cat (5/3)(1 + √5 r) e^{−√5 r} (x_k − x'_k)²/ℓ_k²
        double h = signalVariance * cat * (5.0 / 3.0) * (1 + SQRT5 * r) * e;
        for (int k = 0; k < d; k++) {
            g[2 + k] = h * u2[k];
        }
        // ∂ρ/∂logit ρ = ρ(1 − ρ), so ∂k/∂logit ρ_j = k (1 − ρ_j) where the levels differ
        for (int j = 0; j < c; j++) {
            g[2 + d + j] = x[d + j] != y[d + j] ? kv * (1 - rho[j]) : 0;
        }
        return g;
    }

    /**
     * {@inheritDoc}
     *
     * <p>Reads only the first {@code 1 + d + c} values (Smile appends the noise variance).
     */
    @Override
    public GpKernel of(double[] params) {
        int d = lengthScales.length;
        int c = rho.length;
        double[] l = new double[d];
        for (int k = 0; k < d; k++) {
            l[k] = Math.exp(params[1 + k]);
        }
        double[] r = new double[c];
        for (int j = 0; j < c; j++) {
            r[j] = Math.min(GpSettings.RHO_MAX, 1 / (1 + Math.exp(-params[1 + d + j])));
        }
        return new GpKernel(Math.exp(params[0]), l, r, lengthScaleMin, lengthScaleMax);
    }

    @Override
    public double[] hyperparameters() {
        int d = lengthScales.length;
        int c = rho.length;
        double[] p = new double[1 + d + c];
        p[0] = Math.log(signalVariance);
        for (int k = 0; k < d; k++) {
            p[1 + k] = Math.log(lengthScales[k]);
        }
        for (int j = 0; j < c; j++) {
            double r = Math.max(GpSettings.RHO_MIN, Math.min(GpSettings.RHO_MAX, rho[j]));
            p[1 + d + j] = Math.log(r / (1 - r));
        }
        return p;
    }

    @Override
    public double[] lo() {
        return bounds(Math.log(GpSettings.SIGNAL_VARIANCE_MIN), Math.log(lengthScaleMin),
                logit(GpSettings.RHO_MIN));
    }

    @Override
    public double[] hi() {
        return bounds(Math.log(GpSettings.SIGNAL_VARIANCE_MAX), Math.log(lengthScaleMax),
                logit(GpSettings.RHO_MAX));
    }

    private double[] bounds(double s, double l, double r) {
        int d = lengthScales.length;
        double[] b = new double[1 + d + rho.length];
        b[0] = s;
        for (int k = 0; k < d; k++) {
            b[1 + k] = l;
        }
        for (int j = 0; j < rho.length; j++) {
            b[1 + d + j] = r;
        }
        return b;
    }

    static double logit(double p) {
        return Math.log(p / (1 - p));
    }

    /** @return σf² */
    public double signalVariance() {
        return signalVariance;
    }

    /** @return a copy of the length scales */
    public double[] lengthScales() {
        return lengthScales.clone();
    }

    /** @return a copy of the categorical correlations */
    public double[] rho() {
        return rho.clone();
    }

    @Override
    public String toString() {
        return "GpKernel[signalVariance=" + signalVariance + ", lengthScales="
                + java.util.Arrays.toString(lengthScales) + ", rho=" + java.util.Arrays.toString(rho) + "]";
    }
}
