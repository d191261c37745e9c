package dev.terrace.core.surrogate;

import dev.terrace.core.acquisition.StandardNormal;
import dev.terrace.core.space.DesignPoint;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Adds censored runs ({@code <X}, {@code >X}) to a Gaussian process fitted on the measured runs, by
 * expectation propagation (EP; Minka 2001, UAI; for GP regression with censored outputs, Groot &amp;
 * Lucas 2012, PGM; both from memory).
 *
 * <p>Each censored run i contributes the likelihood 1[f_i &lt; c_i] (or 1[f_i &gt; c_i]) on the
 * latent value f_i at its recipe: the bound is read as a bound on the run's true value, so a prior
 * (a growth model, say) that puts the value far beyond the bound is overruled at that recipe rather
 * than traded off against the run. EP replaces each such factor by a Gaussian site N(f_i; &mu;&#771;_i,
 * 1/&tau;&#771;_i) chosen so that the approximate posterior marginal of f_i matches the mean and
 * variance of the tilted distribution cavity &times; factor, a truncated normal (Johnson, Kotz &amp;
 * Balakrishnan 1994, <i>Continuous Univariate Distributions</i> 1, 2nd ed., section 13.10; from
 * memory): for the cavity N(&mu;, v), s = &minus;1 below and +1 above the bound, z = s(&mu; &minus;
 * c)/&radic;v and &lambda; = &phi;(z)/&Phi;(z), the tilted mean is &mu; + s&radic;v&middot;&lambda; and the
 * tilted variance v(1 &minus; &lambda;(z + &lambda;)); the site follows from Rasmussen &amp; Williams
 * 2006, eqs. 3.56-3.59. Sites are updated in parallel sweeps with damping {@value #DAMPING} after
 * the first, until no site's natural parameters move by more than {@value #TOLERANCE}, for at most
 * {@value #MAX_SWEEPS} sweeps.
 *
 * <p>The hyperparameters, centring and scale stay those of the measured runs; a bound that the
 * measured runs already make certain (&Phi;(z) close to 1) gives a site of vanishing precision and is
 * dropped as uninformative.
 *
 * @since 0.2
 */
public final class GpCensoring {

    /** Damping of the parallel site updates after the first sweep, 0.5 (common practice for parallel EP). */
    public static final double DAMPING = 0.5;
    /** Convergence tolerance on the sites' natural parameters, standardised units. */
    public static final double TOLERANCE = 1e-6;
    /** Most EP sweeps. */
    public static final int MAX_SWEEPS = 30;
    /**
     * Site precision below which a censored run is taken as uninformative, 1e-8 in standardised
     * units (a site variance 1e8 times the residuals' variance).
     */
    static final double MIN_SITE_PRECISION = 1e-8;
    /** Smallest site variance kept, relative to the signal variance, so the covariance stays factorable. */
    static final double MIN_SITE_VARIANCE = 1e-10;

    private GpCensoring() {
    }

    /**
     * One censored run.
     *
     * @param x         its recipe; never null
     * @param bound     the bound on the outcome's fitting scale, finite
     * @param above     true for {@code >bound}, false for {@code <bound}
     * @param priorMean the prior mean at the run on the fitting scale (finite when the GP uses a
     *                  prior mean, else ignored)
     */
    public record Observation(DesignPoint x, double bound, boolean above, double priorMean) {
        /** Checks the invariants. */
        public Observation {
            Objects.requireNonNull(x, "x");
            if (!Double.isFinite(bound)) {
                throw new IllegalArgumentException("bound must be finite: " + bound);
            }
        }
    }

    /**
     * The result of the update.
     *
     * @param gp          the GP with the informative censored runs as sites (the measured GP when none is)
     * @param informative censored runs that carry information (their site was kept)
     * @param sweeps      EP sweeps run
     * @param converged   whether the sites settled within {@link #MAX_SWEEPS}
     */
    public record Result(GaussianProcess gp, int informative, int sweeps, boolean converged) {
    }

    /**
     * Runs EP.
     *
     * @param measured the GP fitted on the measured runs; never null
     * @param censored the censored runs; never null, may be empty
     * @return the updated GP and counters; never null
     */
    public static Result update(GaussianProcess measured, List<Observation> censored) {
        Objects.requireNonNull(measured, "measured");
        Objects.requireNonNull(censored, "censored");
        int m = censored.size();
        if (m == 0) {
            return new Result(measured, 0, 0, true);
        }
        double offset = measured.residualMean();
        double scale = measured.residualScale();
        boolean usesPrior = measured.usesPriorMean();
        double minVariance = MIN_SITE_VARIANCE * measured.hyperparameters().signalVariance();
        List<DesignPoint> xs = new ArrayList<>(m);
        double[] prior = new double[m];
        double[] c = new double[m];
        double[] s = new double[m];
        for (int j = 0; j < m; j++) {
            Observation o = censored.get(j);
            xs.add(o.x());
            prior[j] = usesPrior ? o.priorMean() : 0;
            if (usesPrior && !Double.isFinite(prior[j])) {
                throw new IllegalArgumentException("censored run " + j + " needs a finite prior mean");
            }
            c[j] = (o.bound() - prior[j] - offset) / scale;
            s[j] = o.above() ? 1 : -1;
        }
        double[] tau = new double[m];
        double[] nu = new double[m];
        GaussianProcess gp = measured;
        int sweeps = 0;
        boolean converged = false;
        while (sweeps < MAX_SWEEPS && !converged) {
            Predictive pr = gp.predict(xs, usesPrior ? prior : null);
            double delta = 0;
            double damping = sweeps == 0 ? 1 : DAMPING;
            for (int j = 0; j < m; j++) {
                double mean = (pr.mean(j) - prior[j] - offset) / scale;
                double var = Math.pow(pr.sdLatent(j) / scale, 2);
                // cavity (Rasmussen & Williams 2006, eq. 3.56)
                double cavPrecision = 1 / var - tau[j];
                if (!(cavPrecision > 0)) {
                    continue; // numerically degenerate: keep the site
                }
                double vc = 1 / cavPrecision;
                double mc = vc * (mean / var - nu[j]);
                double sd = Math.sqrt(vc);
                double z = s[j] * (mc - c[j]) / sd;
                double lambda = Math.exp(StandardNormal.logPdf(z) - StandardNormal.logCdf(z));
                double shrink = Math.min(Math.max(lambda * (z + lambda), 0), 1 - 1e-12);
                double mt = mc + s[j] * sd * lambda;
                double vt = vc * (1 - shrink);
                double newTau = Math.max(1 / vt - 1 / vc, 0);
                double newNu = mt / vt - mc / vc;
                newTau = (1 - damping) * tau[j] + damping * newTau;
                newNu = (1 - damping) * nu[j] + damping * newNu;
                delta = Math.max(delta, Math.max(Math.abs(newTau - tau[j]), Math.abs(newNu - nu[j])));
                tau[j] = newTau;
                nu[j] = newNu;
            }
            sweeps++;
            converged = delta < TOLERANCE;
            gp = withActiveSites(measured, xs, prior, tau, nu, minVariance);
        }
        int informative = 0;
        for (double t : tau) {
            informative += t > MIN_SITE_PRECISION ? 1 : 0;
        }
        return new Result(gp, informative, sweeps, converged);
    }

    private static GaussianProcess withActiveSites(GaussianProcess measured, List<DesignPoint> xs, double[] prior,
                                                   double[] tau, double[] nu, double minVariance) {
        List<DesignPoint> x = new ArrayList<>();
        List<double[]> site = new ArrayList<>();
        for (int j = 0; j < tau.length; j++) {
            if (tau[j] > MIN_SITE_PRECISION) {
                x.add(xs.get(j));
                site.add(new double[] {nu[j] / tau[j], prior[j], Math.max(1 / tau[j], minVariance)});
            }
        }
        if (x.isEmpty()) {
            return measured;
        }
        double[] z = new double[x.size()];
        double[] p = new double[x.size()];
        double[] v = new double[x.size()];
        for (int j = 0; j < z.length; j++) {
            z[j] = site.get(j)[0];
            p[j] = site.get(j)[1];
            v[j] = site.get(j)[2];
        }
        return measured.withSites(x, z, p, v);
    }
}
