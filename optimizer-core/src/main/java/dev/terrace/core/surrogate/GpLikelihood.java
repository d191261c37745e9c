package dev.terrace.core.surrogate;

/**
 * Log marginal likelihood of standardised residuals under the {@link GpKernel} plus noise, and
 * its gradient, for the hyperparameter search.
 *
 * <p>Parameter vector θ = {@code [ln σf², ln ℓ_1..ln ℓ_d, logit ρ_1..logit ρ_c, ln σn²]}.
 * Value: log p(z|X) = −½ zᵀα − Σ ln L_ii − (n/2) ln 2π with α = (K + σn²I)⁻¹z (Rasmussen &amp;
 * Williams 2006, Algorithm 2.1 and eq. 2.30). Gradient: ∂/∂θ_q = ½ tr((ααᵀ − (K + σn²I)⁻¹)
 * ∂K/∂θ_q) (same book, eq. 5.9), summed element-wise over the pairs so that each parameter costs
 * O(n²) after one O(n³) inverse. The squared coordinate differences of all pairs are computed once.
 */
final class GpLikelihood {

    private static final double SQRT5 = Math.sqrt(5.0);
    private static final double LOG_2PI = Math.log(2 * Math.PI);

    private final int n;
    private final int d;
    private final int c;
    private final double[] z;
    /** Squared differences, dimension-major: diff2[k][pair]. */
    private final double[][] diff2;
    /** Whether the levels of setting j differ, per pair. */
    private final boolean[][] differs;
    private int evaluations;

    /**
     * @param flat flat vectors (see {@link GpKernel#encode}), all of length d + c
     * @param z    standardised residuals
     * @param d    continuous dimensions
     * @param c    categorical settings
     */
    GpLikelihood(double[][] flat, double[] z, int d, int c) {
        this.n = z.length;
        this.d = d;
        this.c = c;
        this.z = z.clone();
        int pairs = n * (n - 1) / 2;
        diff2 = new double[d][pairs];
        differs = new boolean[c][pairs];
        int p = 0;
        for (int j = 1; j < n; j++) {
            for (int i = 0; i < j; i++) {
                for (int k = 0; k < d; k++) {
                    double u = flat[i][k] - flat[j][k];
                    diff2[k][p] = u * u;
                }
                for (int q = 0; q < c; q++) {
                    differs[q][p] = flat[i][d + q] != flat[j][d + q];
                }
                p++;
            }
        }
    }

    /** @return number of parameters, d + c + 2 */
    int size() {
        return d + c + 2;
    }

    /** @return number of evaluations so far */
    int evaluations() {
        return evaluations;
    }

    /**
     * @param theta    parameters (see class comment)
     * @param gradient receives ∂ log p/∂θ when not null
     * @return log p(z|X); finite
     */
    double value(double[] theta, double[] gradient) {
        evaluations++;
        double s2 = Math.exp(theta[0]);
        double[] invL2 = new double[d];
        for (int k = 0; k < d; k++) {
            invL2[k] = Math.exp(-2 * theta[1 + k]);
        }
        double[] rho = new double[c];
        for (int q = 0; q < c; q++) {
            rho[q] = 1 / (1 + Math.exp(-theta[1 + d + q]));
        }
        double noise = Math.exp(theta[1 + d + c]);

        int pairs = n * (n - 1) / 2;
        double[] kv = new double[pairs];
        double[] h = gradient == null ? null : new double[pairs];
        double[] k = new double[n * n];
        int p = 0;
        for (int j = 1; j < n; j++) {
            for (int i = 0; i < j; i++) {
                double r2 = 0;
                for (int a = 0; a < d; a++) {
                    r2 += diff2[a][p] * invL2[a];
                }
                double cat = 1;
                for (int q = 0; q < c; q++) {
                    if (differs[q][p]) {
                        cat *= rho[q];
                    }
                }
                double r = Math.sqrt(r2);
                double e = Math.exp(-SQRT5 * r);
                double v = s2 * (1 + SQRT5 * r + 5 * r2 / 3) * e * cat;
                kv[p] = v;
                if (h != null) {
                    h[p] = s2 * cat * (5.0 / 3.0) * (1 + SQRT5 * r) * e;
                }
                k[j + i * n] = v;
                p++;
            }
        }
        for (int i = 0; i < n; i++) {
            k[i + i * n] = s2 + noise;
        }
        GpCholesky f = GpCholesky.factor(k, n, s2);
        double[] alpha = f.solve(z);
        double quad = 0;
        for (int i = 0; i < n; i++) {
            quad += z[i] * alpha[i];
        }
        double lml = -0.5 * quad - f.halfLogDet() - 0.5 * n * LOG_2PI;
        if (gradient != null) {
            double[] inv = f.inverse();
            double gs = 0;
            double[] gl = new double[d];
            double[] gr = new double[c];
            p = 0;
            for (int j = 1; j < n; j++) {
                double aj = alpha[j];
                int col = j * n;
                for (int i = 0; i < j; i++) {
                    double w = alpha[i] * aj - inv[i + col];
                    double wk = w * kv[p];
                    gs += wk;
                    double wh = w * h[p];
                    for (int a = 0; a < d; a++) {
                        gl[a] += wh * diff2[a][p];
                    }
                    for (int q = 0; q < c; q++) {
                        if (differs[q][p]) {
                            gr[q] += wk;
                        }
                    }
                    p++;
                }
            }
            double trW = 0;
            for (int i = 0; i < n; i++) {
                trW += alpha[i] * alpha[i] - inv[i + i * n];
            }
            // off-diagonal pairs count twice in the trace, the diagonal once with weight ½
            gradient[0] = gs + 0.5 * trW * s2;
            for (int a = 0; a < d; a++) {
                gradient[1 + a] = gl[a] * invL2[a];
            }
            for (int q = 0; q < c; q++) {
                gradient[1 + d + q] = gr[q] * (1 - rho[q]);
            }
            gradient[1 + d + c] = 0.5 * trW * noise;
        }
        return lml;
    }
}
