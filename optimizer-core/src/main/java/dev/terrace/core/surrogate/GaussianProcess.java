package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * A fitted Gaussian-process surrogate of one outcome over a design space: ARD Matérn-5/2 over the
 * continuous settings times a fitted correlation per categorical setting ({@link GpKernel}), plus
 * Gaussian measurement noise, around a prior mean.
 *
 * <p>The GP models the residual y − m(x), where m is the caller's prior mean (for example a
 * physics model's prediction on the same scale) or, when none is given, zero. The residuals are
 * centred on their mean (a constant offset the GP learns) and divided by their sample standard
 * deviation; predictions undo both. The hyperparameters are fitted by maximising the log marginal
 * likelihood (type-II maximum likelihood, Rasmussen &amp; Williams 2006, <i>Gaussian Processes for
 * Machine Learning</i>, ch. 5) from several seeded starts; see {@link GpSettings} for the bounds
 * and for the subset rule on large data sets. The posterior (same book, Algorithm 2.1) is
 * evaluated here on a Cholesky factor with progressive jitter, through the process's
 * {@link dev.terrace.core.linalg.Algebra} backend (native LAPACK or pure Java).
 *
 * <p>Degenerate data never produce NaN: with one run the hyperparameters are the defaults of
 * {@link GpHyperparameters#defaults} and the residual scale is
 * {@value #SINGLE_RUN_SCALE_FRACTION} of the outcome's magnitude; with identical residuals
 * (no spread) the model is the constant offset with a residual scale of
 * {@value #FLAT_SCALE_FRACTION} of the magnitude.
 *
 * <p>Instances are immutable and safe to share between threads.
 *
 * @since 0.1
 */
public final class GaussianProcess {

    /** Points per batched prediction; bounds the n×m cross-covariance built per chunk. */
    public static final int PREDICT_CHUNK = 256;

    /**
     * Residual scale for identical outcomes, as a fraction of the largest |y| or |m| (1 when those
     * are all 0): the data show no spread, so the model stays near-constant with a small but
     * nonzero uncertainty. Own choice.
     */
    public static final double FLAT_SCALE_FRACTION = 1e-3;

    /**
     * Residual scale for a single run, as a fraction of the largest |y| or |m| (1 when those are
     * 0): one run says nothing about the spread, so a tenth of the magnitude is assumed. Own choice.
     */
    public static final double SINGLE_RUN_SCALE_FRACTION = 0.1;

    /** Residual spread below this fraction of the magnitude counts as none (rounding level). */
    static final double FLAT_TOLERANCE = 1e-12;

    /** Smallest latent variance reported (standardised units), so that an sd is never exactly 0. */
    static final double MIN_LATENT_VARIANCE = 1e-12;

    private static final double LOG_2PI = Math.log(2 * Math.PI);

    private final List<DesignPoint> points;
    private final double[][] flat;
    private final double[] z;
    private final double[] prior;
    private final double offset;
    private final double scale;
    private final GpHyperparameters hyper;
    private final GpKernel kernel;
    private final GpSettings settings;
    private final GpCholesky factor;
    /** (K + σn²I)⁻¹ z, the posterior weights (Rasmussen &amp; Williams 2006, Algorithm 2.1). */
    private final double[] alpha;
    private final double standardisedLml;
    private final int evaluations;
    /**
     * Per-run noise variance in standardised units that replaces the fitted noise variance on the
     * diagonal (censoring sites of {@link GpCensoring}), NaN where the fitted noise applies; null
     * when every run uses the fitted noise.
     */
    private final double[] siteNoise;

    private GaussianProcess(List<DesignPoint> points, double[][] flat, double[] z, double[] prior, double offset,
            double scale, GpHyperparameters hyper, GpSettings settings, GpCholesky factor, int evaluations,
            double[] siteNoise) {
        this.siteNoise = siteNoise;
        this.points = List.copyOf(points);
        this.flat = flat;
        this.z = z;
        this.prior = prior;
        this.offset = offset;
        this.scale = scale;
        this.hyper = hyper;
        this.settings = settings;
        this.kernel = GpKernel.of(hyper, settings);
        this.factor = factor;
        this.evaluations = evaluations;
        double[] alpha = factor.solve(z);
        double quad = 0;
        for (int i = 0; i < z.length; i++) {
            quad += z[i] * alpha[i];
        }
        this.standardisedLml = -0.5 * quad - factor.halfLogDet() - 0.5 * z.length * LOG_2PI;
        this.alpha = alpha;
        if (!Double.isFinite(standardisedLml)) {
            throw new IllegalStateException("log marginal likelihood is not finite");
        }
    }

    /**
     * Fits a GP to runs: standardises the residuals, searches the hyperparameters and builds the
     * posterior.
     *
     * @param x         design points of the runs, all with the same numbers of coordinates and levels
     * @param y         outcomes on the fitting scale (for example log10 of a log outcome), finite
     * @param priorMean prior mean m(x_i) on the same scale, finite at every run; or null or all NaN
     *                  for a constant mean
     * @param settings  search settings
     * @param seed      seed of the random starts and of the subset for large data sets
     * @return the fitted GP; never null
     * @throws IllegalArgumentException on empty, mismatched or non-finite input
     */
    public static GaussianProcess fit(List<DesignPoint> x, double[] y, double[] priorMean, GpSettings settings,
            long seed) {
        Objects.requireNonNull(settings, "settings");
        int n = GpInputs.checkRuns(x, y);
        double[] m = GpInputs.priorAtRuns(priorMean, n);
        int d = x.get(0).dimensions();
        int c = x.get(0).levelCount();
        double[] r = GpInputs.residuals(y, m);
        double offset = GpInputs.mean(r);
        double spread = n > 1 ? GpInputs.sampleSd(r, offset) : 0;
        double magnitude = GpInputs.magnitude(y, m);
        boolean noSpread = n == 1 || !(spread > FLAT_TOLERANCE * magnitude);
        double scale = n == 1 ? SINGLE_RUN_SCALE_FRACTION * magnitude
                : noSpread ? FLAT_SCALE_FRACTION * magnitude : spread;
        double[] z = new double[n];
        for (int i = 0; i < n; i++) {
            z[i] = (r[i] - offset) / scale;
        }
        double[][] flat = GpInputs.encode(x);
        GpHyperparameters h;
        int evaluations = 0;
        if (noSpread) {
            h = GpHyperparameters.defaults(d, c, settings.noiseFloor());
        } else {
            SplittableRandom rng = new SplittableRandom(seed);
            GpHyperparameterSearch.Result best;
            if (n <= settings.hpoSubsetSize()) {
                GpLikelihood lik = new GpLikelihood(flat, z, d, c);
                best = GpHyperparameterSearch.search(lik, d, c, settings, settings.hpoStarts(),
                        settings.maxIterations(), null, rng);
                evaluations = best.evaluations();
            } else {
                int[] idx = GpInputs.subset(n, settings.hpoSubsetSize(), rng);
                double[][] fs = new double[idx.length][];
                double[] zs = new double[idx.length];
                for (int i = 0; i < idx.length; i++) {
                    fs[i] = flat[idx[i]];
                    zs[i] = z[idx[i]];
                }
                GpLikelihood lik = new GpLikelihood(fs, zs, d, c);
                best = GpHyperparameterSearch.search(lik, d, c, settings,
                        Math.min(settings.hpoStarts(), settings.largeDataStarts()), settings.maxIterations(), null, rng);
                evaluations = best.evaluations();
                if (settings.polishIterations() > 0) {
                    GpLikelihood all = new GpLikelihood(flat, z, d, c);
                    best = GpHyperparameterSearch.search(all, d, c, settings, 1, settings.polishIterations(),
                            best.theta(), rng);
                    evaluations += best.evaluations();
                }
            }
            h = GpHyperparameterSearch.hyperparameters(best.theta(), d, c);
        }
        return build(x, flat, z, m, offset, scale, h, settings, evaluations, null);
    }

    /**
     * Builds a GP with given hyperparameters, without any search (for reusing fitted
     * hyperparameters and for checks against worked examples).
     *
     * @param x           design points of the runs
     * @param y           outcomes on the fitting scale, finite
     * @param priorMean   prior mean at the runs, or null / all NaN for none
     * @param h           hyperparameters (variances in standardised units when {@code standardise})
     * @param standardise true to centre and scale the residuals as {@link #fit} does; false to
     *                    model y − m directly (m = 0 without a prior mean), so that variances are
     *                    in the units of y
     * @return the GP; never null
     * @throws IllegalArgumentException on mismatched or non-finite input
     */
    public static GaussianProcess withHyperparameters(List<DesignPoint> x, double[] y, double[] priorMean,
            GpHyperparameters h, boolean standardise) {
        int n = GpInputs.checkRuns(x, y);
        if (h.dimensions() != x.get(0).dimensions() || h.categoricalCount() != x.get(0).levelCount()) {
            throw new IllegalArgumentException("hyperparameters do not match the design points");
        }
        double[] m = GpInputs.priorAtRuns(priorMean, n);
        double[] r = GpInputs.residuals(y, m);
        double offset = 0;
        double scale = 1;
        if (standardise) {
            offset = GpInputs.mean(r);
            double spread = n > 1 ? GpInputs.sampleSd(r, offset) : 0;
            double magnitude = GpInputs.magnitude(y, m);
            boolean noSpread = n == 1 || !(spread > FLAT_TOLERANCE * magnitude);
            scale = n == 1 ? SINGLE_RUN_SCALE_FRACTION * magnitude
                    : noSpread ? FLAT_SCALE_FRACTION * magnitude : spread;
        }
        double[] z = new double[n];
        for (int i = 0; i < n; i++) {
            z[i] = (r[i] - offset) / scale;
        }
        return build(x, GpInputs.encode(x), z, m, offset, scale, h, GpSettings.defaults(), 0, null);
    }

    private static GaussianProcess build(List<DesignPoint> x, double[][] flat, double[] z, double[] prior,
            double offset, double scale, GpHyperparameters h, GpSettings settings, int evaluations,
            double[] siteNoise) {
        GpKernel k = GpKernel.of(h, settings);
        int n = z.length;
        double[] a = new double[n * n];
        for (int j = 0; j < n; j++) {
            double noise = siteNoise != null && !Double.isNaN(siteNoise[j]) ? siteNoise[j] : h.noiseVariance();
            a[j + j * n] = k.k(flat[j], flat[j]) + noise;
            for (int i = j + 1; i < n; i++) {
                a[i + j * n] = k.k(flat[i], flat[j]);
            }
        }
        GpCholesky f = GpCholesky.factor(a, n, h.signalVariance());
        return new GaussianProcess(x, flat, z, prior, offset, scale, h, settings, f, evaluations, siteNoise);
    }

    /**
     * This GP's hyperparameters, centring and scaling with more runs given in standardised units,
     * each with its own noise variance: the Gaussian sites by which {@link GpCensoring} stands in for
     * censored runs (Rasmussen &amp; Williams 2006, section 3.6: a site is an unnormalised Gaussian in
     * the latent value, equivalent to an observation with its own noise).
     *
     * @param x        the extra runs' design points
     * @param z        their site means in standardised units
     * @param prior    their prior means (fitting scale), finite when this GP uses a prior mean; else ignored
     * @param variance their site variances in standardised units, each &gt; 0 and finite
     * @return the new GP; never null. This GP is unchanged.
     */
    GaussianProcess withSites(List<DesignPoint> x, double[] z, double[] prior, double[] variance) {
        int n = this.z.length;
        int m = x.size();
        if (z.length != m || variance.length != m || (this.prior != null && prior.length != m)) {
            throw new IllegalArgumentException("site arrays differ in length");
        }
        double[][] f2 = java.util.Arrays.copyOf(flat, n + m);
        double[] z2 = java.util.Arrays.copyOf(this.z, n + m);
        double[] noise = new double[n + m];
        java.util.Arrays.fill(noise, Double.NaN);
        if (siteNoise != null) {
            System.arraycopy(siteNoise, 0, noise, 0, n);
        }
        double[] p2 = this.prior == null ? null : java.util.Arrays.copyOf(this.prior, n + m);
        List<DesignPoint> pts = new ArrayList<>(points);
        for (int j = 0; j < m; j++) {
            f2[n + j] = encodeChecked(x.get(j));
            if (!Double.isFinite(z[j]) || !(variance[j] > 0) || !Double.isFinite(variance[j])) {
                throw new IllegalArgumentException("site " + j + " is not finite or has no positive variance");
            }
            z2[n + j] = z[j];
            noise[n + j] = variance[j];
            if (p2 != null) {
                if (!Double.isFinite(prior[j])) {
                    throw new IllegalArgumentException("this GP uses a prior mean: give a finite prior mean at site " + j);
                }
                p2[n + j] = prior[j];
            }
            pts.add(x.get(j));
        }
        return build(pts, f2, z2, p2, offset, scale, hyper, settings, evaluations, noise);
    }

    /**
     * Closed-form leave-one-out predictions of the first {@code rows} runs (Rasmussen &amp; Williams
     * 2006, eqs. 5.10-5.12): with K the covariance of the runs plus noise and &alpha; = K⁻¹z, the
     * prediction of run i from all others has mean z_i &minus; &alpha;_i/[K⁻¹]_ii and variance
     * 1/[K⁻¹]_ii, at the same hyperparameters. [K⁻¹]_ii = &Vert;L⁻¹e_i&Vert;&sup2; costs one
     * triangular solve per run; above {@value #LOO_MAX_ROWS} runs an evenly spaced subset of that
     * many is used.
     *
     * @param rows how many leading runs to score (the measured runs; sites appended by
     *             {@link #withSites} come after them), 1 to {@link #n()}
     * @return the leave-one-out summary on the fitting scale; never null
     */
    public GpLeaveOneOut leaveOneOut(int rows) {
        int n = z.length;
        if (rows < 1 || rows > n) {
            throw new IllegalArgumentException("rows must be 1 to " + n + ": " + rows);
        }
        int m = Math.min(rows, LOO_MAX_ROWS);
        int[] pick = new int[m];
        for (int j = 0; j < m; j++) {
            pick[j] = (int) ((long) j * rows / m);
        }
        double[] e = new double[n * m];
        for (int j = 0; j < m; j++) {
            e[pick[j] + j * n] = 1;
        }
        factor.lowerSolveInPlace(e, m);
        double[] y = new double[m];
        double[] err = new double[m];
        double[] var = new double[m];
        for (int j = 0; j < m; j++) {
            double d = 0;
            for (int r = 0; r < n; r++) {
                double v = e[r + j * n];
                d += v * v;
            }
            int i = pick[j];
            y[j] = (prior == null ? 0 : prior[i]) + offset + scale * z[i];
            err[j] = scale * alpha[i] / d;
            var[j] = scale * scale / d;
        }
        return GpLeaveOneOut.of(y, err, var);
    }

    /**
     * The one-step-ahead errors of the first {@code rows} runs in the order they were given (the log
     * order), each predicted from the runs before it at this GP's hyperparameters, from the Cholesky
     * factor already held ({@link GpForward}). Runs with fewer than {@link GpForward#FIRST_SCORED}
     * runs before them are not scored.
     *
     * @param rows how many leading runs to consider (the measured runs), 1 to {@link #n()}
     * @return the check on the fitting scale; never null
     */
    public GpForward forward(int rows) {
        int n = z.length;
        if (rows < 1 || rows > n) {
            throw new IllegalArgumentException("rows must be 1 to " + n + ": " + rows);
        }
        double[] w = z.clone();
        factor.lowerSolveInPlace(w, 1);
        double noise = hyper.noiseVariance() + factor.jitter();
        int m = Math.max(0, rows - GpForward.FIRST_SCORED);
        double[] err = new double[m];
        double[] lat = new double[m];
        for (int j = GpForward.FIRST_SCORED; j < rows; j++) {
            double d = factor.lower()[j + j * n];
            err[j - GpForward.FIRST_SCORED] = scale * w[j] * d;
            lat[j - GpForward.FIRST_SCORED] = scale * scale * Math.max(0, d * d - noise);
        }
        return GpForward.of(err, lat, scale * scale * noise);
    }

    /** Most runs scored by {@link #leaveOneOut}: 200 triangular solves keep it well under a fit's cost. */
    public static final int LOO_MAX_ROWS = 200;

    /**
     * Posterior predictions at a batch of points, evaluated in chunks of {@value #PREDICT_CHUNK}:
     * mean k*ᵀα and latent variance k(x, x) − ‖L⁻¹k*‖² (Rasmussen &amp; Williams 2006,
     * Algorithm 2.1).
     *
     * @param x         points, with the same numbers of coordinates and levels as the runs
     * @param priorMean prior mean at each point when the GP was fitted with one (finite, same
     *                  length as x); ignored (may be null) for a constant-mean GP
     * @return means, latent sds and the noise sd on the fitting scale; never null, all finite
     * @throws IllegalArgumentException on mismatched or non-finite input
     */
    public Predictive predict(List<DesignPoint> x, double[] priorMean) {
        return predict(x, priorMean, null);
    }

    /**
     * Prior-mean coefficients that are themselves uncertain: the prior mean is the fitted physics,
     * and its parameters carry a covariance B. To first order the physics at x moves by h(x)&#7488;&beta;
     * with h the derivative with respect to the parameters and &beta; ~ N(0, B); the GP then has
     * explicit basis functions h with a Gaussian prior on their coefficients (Rasmussen and
     * Williams 2006, sec. 2.7, eqs. 2.41-2.42; O'Hagan 1978), and the predictive variance gains
     * r&#7488;(B&#8315;&sup1; + HK&#8315;&sup1;H&#7488;)&#8315;&sup1;r with r = h(x*) &minus; HK&#8315;&sup1;k*: large where the runs
     * do not tie the physics down, small near them. The mean is left at the fitted physics (the
     * coefficients' posterior mean is about 0 because the parameters were fitted to these runs).
     *
     * @param hTrain derivatives at the training rows, in the outcome's fitting units (rows beyond
     *               its length, such as censored sites or fantasies, count as 0: no information)
     * @param hQuery derivatives at the query points, one row per point
     * @param b      the parameters' covariance, d &times; d, symmetric positive semi-definite
     */
    public record Basis(double[][] hTrain, double[][] hQuery, double[][] b) {
        /** Checks the shapes. */
        public Basis {
            java.util.Objects.requireNonNull(hTrain, "hTrain");
            java.util.Objects.requireNonNull(hQuery, "hQuery");
            java.util.Objects.requireNonNull(b, "b");
        }
    }

    /**
     * As {@link #predict(List, double[])}, with the variance of uncertain prior-mean coefficients
     * ({@link Basis}) added to the latent variance.
     *
     * @param x         the query points
     * @param priorMean prior mean at the query points when the GP uses one; ignored otherwise
     * @param basis     the uncertain coefficients, or null for none
     * @return the predictions; never null
     */
    public Predictive predict(List<DesignPoint> x, double[] priorMean, Basis basis) {
        int m = x.size();
        int d = basis == null ? 0 : basis.b().length;
        double[] g = null;          // L^-1 H^T, n x d column-major, standardised units
        double[][] cMat = null;     // (B^-1 + H K^-1 H^T)^-1 = S (I + S M S)^-1 S, S = B^(1/2)
        if (d > 0) {
            if (basis.hQuery().length != m) {
                throw new IllegalArgumentException(m + " query points but " + basis.hQuery().length + " basis rows");
            }
            int n0 = z.length;
            g = new double[n0 * d];
            for (int r = 0; r < Math.min(n0, basis.hTrain().length); r++) {
                for (int k = 0; k < d; k++) {
                    g[r + k * n0] = basis.hTrain()[r][k] / scale;
                }
            }
            factor.lowerSolveInPlace(g, d);
            double[][] mm = new double[d][d];
            for (int a = 0; a < d; a++) {
                for (int c = a; c < d; c++) {
                    double s = 0;
                    for (int r = 0; r < n0; r++) {
                        s += g[r + a * n0] * g[r + c * n0];
                    }
                    mm[a][c] = s;
                    mm[c][a] = s;
                }
            }
            org.apache.commons.math3.linear.EigenDecomposition eb = new org.apache.commons.math3.linear.EigenDecomposition(
                    new org.apache.commons.math3.linear.Array2DRowRealMatrix(basis.b()));
            double[] lam = eb.getRealEigenvalues();
            org.apache.commons.math3.linear.RealMatrix v = eb.getV();
            double[] sq = new double[d];
            for (int k = 0; k < d; k++) {
                sq[k] = Math.sqrt(Math.max(lam[k], 0));
            }
            org.apache.commons.math3.linear.RealMatrix sRoot = v.multiply(
                    new org.apache.commons.math3.linear.DiagonalMatrix(sq)).multiply(v.transpose());
            org.apache.commons.math3.linear.RealMatrix inner = sRoot.multiply(
                    new org.apache.commons.math3.linear.Array2DRowRealMatrix(mm)).multiply(sRoot);
            inner = inner.add(org.apache.commons.math3.linear.MatrixUtils.createRealIdentityMatrix(d));
            org.apache.commons.math3.linear.RealMatrix inv = new org.apache.commons.math3.linear.LUDecomposition(inner)
                    .getSolver().getInverse();
            cMat = sRoot.multiply(inv).multiply(sRoot).getData();
        }
        double[] pm = priorAtQueries(priorMean, m);
        double[] mean = new double[m];
        double[] sd = new double[m];
        for (int start = 0; start < m; start += PREDICT_CHUNK) {
            int len = Math.min(PREDICT_CHUNK, m - start);
            double[][] q = new double[len][];
            for (int i = 0; i < len; i++) {
                q[i] = encodeChecked(x.get(start + i));
            }
            int n = z.length;
            double[] ks = new double[n * len];
            double[] mus = new double[len];
            for (int j = 0; j < len; j++) {
                double s = 0;
                for (int i = 0; i < n; i++) {
                    double kv = kernel.k(flat[i], q[j]);
                    ks[i + j * n] = kv;
                    s += kv * alpha[i];
                }
                mus[j] = s;
            }
            factor.lowerSolveInPlace(ks, len);
            for (int i = 0; i < len; i++) {
                double mu = mus[i];
                double var = kernel.k(q[i], q[i]);
                for (int r = 0; r < n; r++) {
                    double v = ks[r + i * n];
                    var -= v * v;
                }
                if (!Double.isFinite(mu) || Double.isNaN(var)) {
                    throw new IllegalStateException("GP prediction is not finite");
                }
                if (d > 0) {
                    double[] rr = new double[d];
                    double[] hq = basis.hQuery()[start + i];
                    for (int k = 0; k < d; k++) {
                        double s = hq[k] / scale;
                        for (int r = 0; r < n; r++) {
                            s -= g[r + k * n] * ks[r + i * n];
                        }
                        rr[k] = s;
                    }
                    double extra = 0;
                    for (int a = 0; a < d; a++) {
                        double row = 0;
                        for (int c = 0; c < d; c++) {
                            row += cMat[a][c] * rr[c];
                        }
                        extra += rr[a] * row;
                    }
                    if (extra > 0 && Double.isFinite(extra)) {
                        var += extra;
                    }
                }
                mean[start + i] = (pm == null ? 0 : pm[start + i]) + offset + scale * mu;
                sd[start + i] = scale * Math.sqrt(Math.max(var, MIN_LATENT_VARIANCE));
            }
        }
        return new Predictive(mean, sd, noiseSd());
    }

    /**
     * A GP with the same hyperparameters, the same centring and scaling and one more observation:
     * a fantasy run for Kriging-believer batches (Ginsbourger, Le Riche &amp; Carraro 2010,
     * "Kriging is well-suited to parallelize optimization"). The Cholesky factor is extended by
     * one row in O(n²).
     *
     * @param x         the point
     * @param y         the (fantasy) outcome on the fitting scale, finite
     * @param priorMean prior mean at x when the GP uses one (finite); ignored otherwise
     * @return the conditioned GP; never null. This GP is unchanged.
     * @throws IllegalArgumentException on mismatched or non-finite input
     */
    public GaussianProcess condition(DesignPoint x, double y, double priorMean) {
        Objects.requireNonNull(x, "x");
        double[] v = encodeChecked(x);
        if (!Double.isFinite(y)) {
            throw new IllegalArgumentException("outcome must be finite: " + y);
        }
        if (prior != null && !Double.isFinite(priorMean)) {
            throw new IllegalArgumentException("this GP uses a prior mean: give a finite prior mean at the new run");
        }
        int n = z.length;
        double[][] f2 = new double[n + 1][];
        System.arraycopy(flat, 0, f2, 0, n);
        f2[n] = v;
        double[] z2 = java.util.Arrays.copyOf(z, n + 1);
        z2[n] = (y - (prior == null ? 0 : priorMean) - offset) / scale;
        double[] p2 = null;
        if (prior != null) {
            p2 = java.util.Arrays.copyOf(prior, n + 1);
            p2[n] = priorMean;
        }
        List<DesignPoint> pts = new ArrayList<>(points);
        pts.add(x);
        double[] noise2 = siteNoise == null ? null : java.util.Arrays.copyOf(siteNoise, n + 1);
        if (noise2 != null) {
            noise2[n] = Double.NaN;
        }
        GpCholesky extended = extend(v);
        if (extended == null) {
            return build(pts, f2, z2, p2, offset, scale, hyper, settings, evaluations, noise2);
        }
        return new GaussianProcess(pts, f2, z2, p2, offset, scale, hyper, settings, extended, evaluations, noise2);
    }

    /** Extends L by one row, or returns null when the new pivot is not positive. */
    private GpCholesky extend(double[] v) {
        int n = z.length;
        double[] lower = factor.lower();
        double[] l = new double[n];
        for (int i = 0; i < n; i++) {
            l[i] = kernel.k(flat[i], v);
        }
        // forward substitution L l = k
        for (int i = 0; i < n; i++) {
            double s = l[i];
            for (int j = 0; j < i; j++) {
                s -= lower[i + j * n] * l[j];
            }
            l[i] = s / lower[i + i * n];
        }
        double pivot = kernel.k(v, v) + hyper.noiseVariance() + factor.jitter();
        for (int i = 0; i < n; i++) {
            pivot -= l[i] * l[i];
        }
        if (!(pivot > 1e-12 * hyper.signalVariance()) || !Double.isFinite(pivot)) {
            return null;
        }
        int n1 = n + 1;
        double[] a = new double[n1 * n1];
        for (int j = 0; j < n; j++) {
            System.arraycopy(lower, j * n + j, a, j * n1 + j, n - j);
            a[n + j * n1] = l[j];
        }
        a[n + n * n1] = Math.sqrt(pivot);
        return new GpCholesky(a, n1, factor.jitter());
    }

    /** @return the hyperparameters (variances in standardised units); never null */
    public GpHyperparameters hyperparameters() {
        return hyper;
    }

    /**
     * The log marginal likelihood of the residuals on the fitting scale: Rasmussen &amp; Williams
     * 2006 eq. 2.30 on the standardised residuals minus n·ln {@link #residualScale()}.
     *
     * @return log p(y | X, hyperparameters); finite
     */
    public double logMarginalLikelihood() {
        return standardisedLml - z.length * Math.log(scale);
    }

    /** @return number of runs (including fantasy runs added by {@link #condition}) */
    public int n() {
        return z.length;
    }

    /** @return the runs' design points; never null, unmodifiable */
    public List<DesignPoint> points() {
        return points;
    }

    /** @return the constant offset added to the prior mean (the residuals' mean) */
    public double residualMean() {
        return offset;
    }

    /** @return the scale dividing the residuals (their sample sd, or the fallbacks above); positive */
    public double residualScale() {
        return scale;
    }

    /** @return true when the GP was fitted around a caller's prior mean, false for a constant mean */
    public boolean usesPriorMean() {
        return prior != null;
    }

    /** @return standard deviation of a measurement's noise on the fitting scale */
    public double noiseSd() {
        return scale * Math.sqrt(hyper.noiseVariance());
    }

    /** @return the settings used for the fit; never null */
    public GpSettings settings() {
        return settings;
    }

    /** @return the diagonal jitter that the Cholesky factor needed (standardised units), 0 if none */
    double jitter() {
        return factor.jitter();
    }

    /** @return likelihood evaluations spent in the hyperparameter search */
    int evaluations() {
        return evaluations;
    }

    @Override
    public String toString() {
        return "GaussianProcess[n=" + n() + ", " + hyper + ", offset=" + offset + ", scale=" + scale + "]";
    }

    // ---------------------------------------------------------------- input handling

    private double[] priorAtQueries(double[] priorMean, int m) {
        if (prior == null) {
            return null;
        }
        if (priorMean == null || priorMean.length != m) {
            throw new IllegalArgumentException("this GP uses a prior mean: give one finite value per point");
        }
        for (double v : priorMean) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("prior mean must be finite at every point");
            }
        }
        return priorMean;
    }

    private double[] encodeChecked(DesignPoint p) {
        if (p.dimensions() != hyper.dimensions() || p.levelCount() != hyper.categoricalCount()) {
            throw new IllegalArgumentException("point has another number of settings than the runs: " + p);
        }
        return GpKernel.encode(p);
    }
}
