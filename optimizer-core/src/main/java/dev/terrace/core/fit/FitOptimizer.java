package dev.terrace.core.fit;

import static dev.terrace.core.fit.ModelFitter.*;

import dev.terrace.core.model.ModelChain;
import dev.terrace.spi.GrowthModel;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.Prediction;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.SimpleBounds;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.BOBYQAOptimizer;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.util.Pair;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/** Fits one combination of discrete choices: multi-start, reweighting, Levenberg-Marquardt or BOBYQA/Brent. */
abstract class FitOptimizer extends FreeParameters {

    FitOptimizer(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
        super(c, runs, model, upstream, rng);
    }
    /**
     * Fits one combination of discrete choices. The free parameters are chosen at the defaults, fitted,
     * chosen again at the fitted values and, when the choice changed, refitted from there (at most
     * {@link ModelFitter#FREE_SET_RECHECKS} times), so what is free does not hinge on defaults the runs
     * contradict.
     */
    CandidateFit fitCandidate(Map<String, Double> combo, SplittableRandom rng) {
        CandidateFit cf = new CandidateFit();
        cf.combo = combo;
        chooseFree(cf, Map.of());
        fitFree(cf, Map.of(), rng, intervals ? 2 : 0);
        for (int round = 0; round < FREE_SET_RECHECKS && !cf.free.isEmpty(); round++) {
            Map<String, Double> fitted = new LinkedHashMap<>();
            for (int i = 0; i < cf.free.size(); i++) {
                fitted.put(cf.free.get(i).name(), fromU(cf.free.get(i), cf.u[i]));
            }
            List<ModelParameter> before = new ArrayList<>(cf.free);
            Map<String, String> heldBefore = new LinkedHashMap<>(cf.heldReason);
            chooseFree(cf, fitted);
            if (cf.free.equals(before)) {
                cf.heldReason.clear();
                cf.heldReason.putAll(heldBefore);
                break;
            }
            cf.freeSetChanged = true;
            fitFree(cf, fitted, rng, 0);
        }
        Prediction[] preds = predictAll(values(combo, cf.free, cf.u));
        cf.m2ll = minus2LogL(preds) + priorChi2(cf.free, cf.u);
        cf.k = cf.free.size() + numericOutcomes.size();
        int n = obs.size();
        cf.aicc = n - cf.k - 1 > 0 ? cf.m2ll + 2.0 * cf.k + 2.0 * cf.k * (cf.k + 1) / (n - cf.k - 1) : Double.NaN;
        return cf;
    }

    /**
     * Fits the candidate's current free parameters by reweighted minimisation from a start point and
     * {@code extraStarts} random starts around it; sets {@code cf.u} and {@code cf.sigma}.
     *
     * @param at start values by name (missing ones at default)
     */
    void fitFree(CandidateFit cf, Map<String, Double> at, SplittableRandom rng, int extraStarts) {
        Map<String, Double> combo = cf.combo;
        double[] start = new double[cf.free.size()];
        for (int i = 0; i < start.length; i++) {
            ModelParameter p = cf.free.get(i);
            start[i] = toU(p, at.getOrDefault(p.name(), p.defaultValue()));
        }
        double[] u = start;
        Map<String, Double> sigma;
        if (!cf.free.isEmpty()) {
            List<double[]> starts = new ArrayList<>();
            starts.add(start);
            for (int s = 0; s < extraStarts; s++) {
                double[] r = new double[start.length];
                for (int i = 0; i < r.length; i++) {
                    ModelParameter p = cf.free.get(i);
                    double lo = uLo(p);
                    double hi = uHi(p);
                    // random start in the middle half of the range around the default
                    r[i] = Math.max(lo, Math.min(hi, start[i] + (rng.nextDouble() - 0.5) * (hi - lo) * 0.25));
                }
                starts.add(r);
            }
            double bestVal = Double.POSITIVE_INFINITY;
            double[] bestU = start;
            sigma = startSigma();
            Map<String, Double> warmSigma = null;
            if (used.size() > SCREEN_RUNS) {
                // long logs: fit from every start on a thinned log, then refine only the best on every
                // run from there (a small trust region and the thinned log's noise levels)
                Object[] best = screenStarts(starts, combo, cf.free);
                starts = List.of((double[]) best[0]);
                @SuppressWarnings("unchecked")
                Map<String, Double> thinSigma = (Map<String, Double>) best[1];
                Map<String, Double> ws = startSigma();
                thinSigma.forEach(ws::replace);
                warmSigma = ws;
            }
            for (double[] s0 : starts) {
                Object[] res = warmSigma != null ? reweighted(s0, combo, cf.free, warmSigma, WARM_RADIUS_FRACTION)
                        : reweighted(s0, combo, cf.free, startSigma(), COLD_RADIUS_FRACTION);
                double[] uu = (double[]) res[0];
                double val = minus2LogL(predictAll(values(combo, cf.free, uu))) + priorChi2(cf.free, uu);
                if (val < bestVal) {
                    bestVal = val;
                    bestU = uu;
                    @SuppressWarnings("unchecked")
                    Map<String, Double> sg = (Map<String, Double>) res[1];
                    sigma = sg;
                }
            }
            u = bestU;
        } else {
            sigma = updateSigma(predictAll(values(combo, cf.free, u)));
        }
        cf.u = u;
        cf.sigma = sigma;
    }

    /**
     * Above this many runs a fit first runs from each start on a thinned log (every k-th run, at
     * most this many) and then refines only the best result on every run: with hundreds of runs the
     * ranking of starts and the rough optimum are already settled on a few hundred, while each
     * evaluation on the whole log costs time in proportion to the runs. The estimate reported is the
     * refinement on every run. Own choice (speed, issue #11), not a published value.
     */
    static final int SCREEN_RUNS = 150;

    /**
     * Initial trust-region radius of the direct search from a cold start, as a fraction of each
     * parameter's range: a quarter, so the first steps explore the range.
     */
    static final double COLD_RADIUS_FRACTION = 0.25;

    /**
     * Initial trust-region radius when the start is the optimum of the thinned log ({@link #screenStarts})
     * and only refined on every run: a fortieth of the range, ten times smaller than from a cold start,
     * since the thinned optimum already lies close (BOBYQA's trust region still grows if it must).
     * Own choice (speed, issue #11).
     */
    static final double WARM_RADIUS_FRACTION = 0.025;

    /** The reweighted minimisation from one start: {u, sigma}. */
    Object[] reweighted(double[] s0, Map<String, Double> combo, List<ModelParameter> free,
                        Map<String, Double> sigma0, double radiusFraction) {
        double[] uu = s0;
        Map<String, Double> sg = sigma0;
        // censored terms tie the fitted values to the scatter: iterate to the joint maximum
        int passes = hasCensored ? REWEIGHT_ITERATIONS_CENSORED : REWEIGHT_ITERATIONS;
        double tol = hasCensored ? SETTLED_SIGMA_CHANGE_CENSORED : SETTLED_SIGMA_CHANGE;
        for (int iter = 0; iter < passes; iter++) {
            uu = minimise(uu, combo, free, sg, radiusFraction);
            Map<String, Double> next = updateSigma(predictAll(values(combo, free, uu)));
            boolean settled = true;
            for (String k : next.keySet()) {
                if (Math.abs(next.get(k) / sg.get(k) - 1) > tol) {
                    settled = false;
                }
            }
            sg = next;
            if (settled && iter > 0) {
                break;
            }
        }
        return new Object[] {uu, sg};
    }

    /**
     * Runs every start on every k-th used run (k chosen so that at most {@link #SCREEN_RUNS} remain)
     * and returns the fitted point of the start with the lowest −2 ln L there with its noise levels
     * ({u, sigma}). The thinned log is a fit problem of its own, so candidates fitted in parallel never
     * see each other's data.
     */
    Object[] screenStarts(List<double[]> starts, Map<String, Double> combo, List<ModelParameter> free) {
        int k = (used.size() + SCREEN_RUNS - 1) / SCREEN_RUNS;
        List<Run> thinRuns = new ArrayList<>();
        for (int i = 0; i < used.size(); i += k) {
            thinRuns.add(used.get(i));
        }
        FitProblem thin = new FitProblem(c, thinRuns, model, upstream, new SplittableRandom(0));
        thin.shared.putAll(shared);
        thin.sharedReason.putAll(sharedReason);
        thin.maxEvaluations = maxEvaluations;
        thin.intervals = intervals;
        thin.prior.putAll(prior);
        thin.collect(dev.terrace.spi.ParameterValues.defaults(params));
        if (thin.used.size() < MIN_RUNS || thin.numericOutcomes.isEmpty() && !thin.hasClass) {
            return new Object[] {starts.get(0), startSigma()};
        }
        Object[] best = {starts.get(0), startSigma()};
        double bestVal = Double.POSITIVE_INFINITY;
        for (double[] s0 : starts) {
            Object[] res = thin.reweighted(s0, combo, free, thin.startSigma(), COLD_RADIUS_FRACTION);
            double val = thin.minus2LogL(thin.predictAll(thin.values(combo, free, (double[]) res[0])))
                    + thin.priorChi2(free, (double[]) res[0]);
            if (val < bestVal) {
                bestVal = val;
                best = res;
            }
        }
        return best;
    }

    double[] minimise(double[] start, Map<String, Double> combo, List<ModelParameter> free,
                      Map<String, Double> sigma) {
        return minimise(start, combo, free, sigma, COLD_RADIUS_FRACTION);
    }

    double[] minimise(double[] start, Map<String, Double> combo, List<ModelParameter> free,
                      Map<String, Double> sigma, double radiusFraction) {
        int d = start.length;
        double[] lo = new double[d];
        double[] hi = new double[d];
        for (int i = 0; i < d; i++) {
            lo[i] = uLo(free.get(i));
            hi[i] = uHi(free.get(i));
        }
        if (!hasClass) {
            return levenbergMarquardt(start, lo, hi, combo, free, sigma);
        }
        if (d == 1) {
            UnivariateObjectiveFunction f = new UnivariateObjectiveFunction(
                    x -> nll(new double[] {x}, combo, free, sigma));
            double span = hi[0] - lo[0];
            var r = new BrentOptimizer(1e-10, 1e-8 * span).optimize(new MaxEval(500), f, GoalType.MINIMIZE,
                    new SearchInterval(lo[0], hi[0], Math.max(lo[0], Math.min(hi[0], start[0]))));
            double best = nll(start, combo, free, sigma);
            return r.getValue() <= best ? new double[] {r.getPoint()} : start;
        }
        double[] x0 = start.clone();
        for (int i = 0; i < d; i++) {
            x0[i] = Math.max(lo[i] + 1e-9 * (hi[i] - lo[i]), Math.min(hi[i] - 1e-9 * (hi[i] - lo[i]), x0[i]));
        }
        double radius = Double.POSITIVE_INFINITY;
        for (int i = 0; i < d; i++) {
            radius = Math.min(radius, (hi[i] - lo[i]) * radiusFraction);
        }
        double[] bestX = start.clone();
        double[] bestF = {nll(start, combo, free, sigma)};
        try {
            BOBYQAOptimizer opt = new BOBYQAOptimizer(2 * d + 1, radius, 1e-6 * radius);
            PointValuePair p = opt.optimize(new MaxEval(maxEvaluations),
                    new ObjectiveFunction(x -> {
                        double f = nll(x, combo, free, sigma);
                        if (f < bestF[0]) {
                            bestF[0] = f;
                            System.arraycopy(x, 0, bestX, 0, d);
                        }
                        return f;
                    }), GoalType.MINIMIZE,
                    new InitialGuess(x0), new SimpleBounds(lo, hi));
            return p.getValue() <= bestF[0] ? p.getPoint() : bestX;
        } catch (RuntimeException e) {
            return bestX; // evaluation budget spent: keep the best point seen
        }
    }

    double[] levenbergMarquardt(double[] start, double[] lo, double[] hi, Map<String, Double> combo,
                                List<ModelParameter> free, Map<String, Double> sigma) {
        int nRes = numericCount() + priorCount(free);
        MultivariateJacobianFunction f = point -> {
            double[] u = clamp(point.toArray(), lo, hi);
            double[] r0 = allResiduals(combo, free, u, sigma);
            double[][] j = new double[nRes][u.length];
            for (int k = 0; k < u.length; k++) {
                double h = 1e-6 * Math.max(1, Math.abs(u[k])) + 1e-7 * (hi[k] - lo[k]);
                double[] up = u.clone();
                up[k] = u[k] + h <= hi[k] ? u[k] + h : u[k] - h;
                double step = up[k] - u[k];
                double[] r1 = allResiduals(combo, free, up, sigma);
                for (int i = 0; i < nRes; i++) {
                    // residual = (y - f)/s, model value = -residual
                    j[i][k] = -(r1[i] - r0[i]) / step;
                }
            }
            double[] model = new double[nRes];
            for (int i = 0; i < nRes; i++) {
                model[i] = -r0[i];
            }
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(model, false),
                    new Array2DRowRealMatrix(j, false));
        };
        try {
            LeastSquaresOptimizer.Optimum opt = new LevenbergMarquardtOptimizer().optimize(new LeastSquaresBuilder()
                    .start(start).model(f).target(new double[nRes])
                    .parameterValidator(v -> new ArrayRealVector(clamp(v.toArray(), lo, hi), false))
                    .maxEvaluations(2000).maxIterations(500).lazyEvaluation(false).build());
            return clamp(opt.getPoint().toArray(), lo, hi);
        } catch (RuntimeException e) {
            return start;
        }
    }

    double[] clamp(double[] u, double[] lo, double[] hi) {
        double[] out = u.clone();
        for (int i = 0; i < out.length; i++) {
            if (!Double.isFinite(out[i])) {
                out[i] = (lo[i] + hi[i]) / 2;
            }
            out[i] = Math.max(lo[i], Math.min(hi[i], out[i]));
        }
        return out;
    }

}
