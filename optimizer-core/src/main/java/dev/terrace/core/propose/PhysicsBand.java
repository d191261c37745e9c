package dev.terrace.core.propose;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.model.ModelChain;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * How uncertain the fitted growth models' own prediction is at a recipe, from the uncertainty of
 * their fitted parameters: the delta method (first-order propagation of the parameters'
 * covariance, e.g. Seber and Wild, <i>Nonlinear Regression</i>, Wiley 1989, sec. 5.1; from memory),
 * var f(x) = J&Sigma;J&#7488; with J the derivative of the prediction (on the outcome's fitting
 * scale) with respect to the fitted parameters on their fitting scale (log for log-scale
 * parameters), taken by a forward difference, and &Sigma; from each fitted parameter's 95 %
 * interval and the fit's correlations.
 *
 * <p>Why: the Gaussian process of an outcome models what the physics misses around the fitted
 * parameters. Near the runs both are tied down by the data; far from them a physics model
 * extrapolated with barely determined parameters (a dozen runs) is much less certain than the
 * plug-in fit says, and a yield that ignored this was over-confident exactly at the recipes the
 * search likes best. The band is added to the latent variance of each prediction.
 *
 * <p>The sd of a fitted parameter is taken as its interval's width on the fitting scale over
 * 2 &times; 1.96 (a normal reading of the printed 95 % interval). A parameter whose interval was
 * not computed (the fit's curvature was unreliable) or reaches its physical bounds contributes its
 * interval as it is: the physics then says little there, which is the honest reading.
 *
 * @since 0.3
 */
final class PhysicsBand {

    /** Forward-difference step on the fitting scale, as a fraction of the parameter's sd. */
    static final double STEP_FRACTION = 0.1;
    /** Normal 97.5 % quantile: a 95 % interval spans 2 &times; 1.96 sd. */
    static final double Z_975 = 1.959963984540054;

    /** One perturbed chain: the parameter moved by {@code h} on its fitting scale. */
    private record Direction(ModelChain chain, double h) {
    }

    private final List<Direction> directions;
    /** Covariance of the directions' parameters on their fitting scales (block per model). */
    private final double[][] sigma;

    private PhysicsBand(List<Direction> directions, double[][] sigma) {
        this.directions = directions;
        this.sigma = sigma;
    }

    /** A band that adds nothing (no fitted parameters). */
    static PhysicsBand none() {
        return new PhysicsBand(List.of(), new double[0][0]);
    }

    /**
     * @param chain the fitted chain the proposals predict with
     * @param fit   its fit report, or null when nothing was fitted
     * @return the band; never null
     */
    static PhysicsBand of(ModelChain chain, FitReport fit) {
        Objects.requireNonNull(chain, "chain");
        if (fit == null) {
            return none();
        }
        List<Direction> dirs = new ArrayList<>();
        List<double[]> blocks = new ArrayList<>();   // {start, size}
        List<double[]> sds = new ArrayList<>();
        List<double[][]> cors = new ArrayList<>();
        for (ModelFit mf : fit.models()) {
            ModelChain.Step step = chain.steps().stream().filter(s -> s.model().id().equals(mf.id())).findFirst()
                    .orElse(null);
            if (step == null || mf.correlationNames().isEmpty()) {
                continue;
            }
            List<String> names = mf.correlationNames();
            double[] sd = new double[names.size()];
            List<Direction> mine = new ArrayList<>();
            boolean ok = true;
            for (int k = 0; k < names.size(); k++) {
                String name = names.get(k);
                ModelParameter p = step.model().parameters().stream().filter(q -> q.name().equals(name)).findFirst()
                        .orElse(null);
                Estimate e = mf.estimates().stream().filter(q -> q.name().equals(name)).findFirst().orElse(null);
                if (p == null || e == null || e.held() || !Double.isFinite(e.lo()) || !Double.isFinite(e.hi())) {
                    ok = false;
                    break;
                }
                double u = toU(p, e.value());
                double s = (toU(p, e.hi()) - toU(p, e.lo())) / (2 * Z_975);
                if (!(s > 0) || !Double.isFinite(s)) {
                    s = 0;
                }
                sd[k] = s;
                double h = s > 0 ? STEP_FRACTION * s : 1;
                double moved = fromU(p, u + h);
                if (moved > p.max()) {
                    h = -h;
                    moved = fromU(p, u + h);
                }
                mine.add(new Direction(moved(chain, name, e.value(), moved), h));
            }
            if (!ok) {
                continue;
            }
            double[][] r = mf.correlations();
            if (r.length != names.size()) {
                continue;
            }
            blocks.add(new double[] {dirs.size(), names.size()});
            dirs.addAll(mine);
            sds.add(sd);
            cors.add(r);
        }
        int d = dirs.size();
        double[][] sigma = new double[d][d];
        for (int b = 0; b < blocks.size(); b++) {
            int start = (int) blocks.get(b)[0];
            int size = (int) blocks.get(b)[1];
            double[] sd = sds.get(b);
            double[][] r = cors.get(b);
            for (int i = 0; i < size; i++) {
                for (int j = 0; j < size; j++) {
                    double rij = i == j ? 1 : (Double.isFinite(r[i][j]) ? r[i][j] : 0);
                    sigma[start + i][start + j] = rij * sd[i] * sd[j];
                }
            }
        }
        return new PhysicsBand(List.copyOf(dirs), sigma);
    }

    /** @return true when the band adds nothing */
    boolean isEmpty() {
        return directions.isEmpty();
    }

    /** @return the covariance of the fitted parameters on their fitting scales, d &times; d; a copy */
    double[][] sigma() {
        double[][] out = new double[sigma.length][];
        for (int i = 0; i < sigma.length; i++) {
            out[i] = sigma[i].clone();
        }
        return out;
    }

    /** @return how many fitted parameters the band spans */
    int dimension() {
        return directions.size();
    }

    /**
     * The derivative of one outcome's physics prediction (its fitting scale) with respect to each
     * fitted parameter (its fitting scale) at each recipe; 0 where the physics predicts nothing or
     * a perturbed chain does not apply.
     *
     * @param c          the campaign
     * @param o          a numeric outcome
     * @param conditions the recipes as model conditions
     * @param base       the fitted chain's prediction at each recipe
     * @return one row of {@link #dimension()} derivatives per recipe; never null
     */
    double[][] jacobian(Campaign c, OutcomeSpec o, List<Conditions> conditions, List<ModelChain.Result> base) {
        int n = conditions.size();
        int d = directions.size();
        double[][] jac = new double[n][d];
        double[] f0 = new double[n];
        for (int i = 0; i < n; i++) {
            f0[i] = PhysicsPriors.priorValue(c, o, base.get(i));
        }
        for (int k = 0; k < d; k++) {
            Direction dir = directions.get(k);
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(f0[i])) {
                    continue;
                }
                double f1 = PhysicsPriors.priorValue(c, o, dir.chain().predict(conditions.get(i)));
                double j = (f1 - f0[i]) / dir.h();
                jac[i][k] = Double.isFinite(j) ? j : 0;
            }
        }
        return jac;
    }

    /** The chain with one parameter moved in every step that holds it at the fitted value (shared ones). */
    private static ModelChain moved(ModelChain chain, String name, double fitted, double value) {
        List<ModelChain.Step> steps = new ArrayList<>();
        for (ModelChain.Step s : chain.steps()) {
            ParameterValues pv = s.values();
            if (pv.values().containsKey(name) && pv.values().get(name) == fitted) {
                pv = pv.with(name, value);
            }
            steps.add(new ModelChain.Step(s.model(), pv));
        }
        return ModelChain.of(steps, chain.surface());
    }

    private static double toU(ModelParameter p, double v) {
        return p.logScale() ? Math.log(v) : v;
    }

    private static double fromU(ModelParameter p, double u) {
        return p.logScale() ? Math.exp(u) : u;
    }
}
