package dev.terrace.core.fit;

import static dev.terrace.core.fit.ModelFitter.*;

import java.util.SplittableRandom;
import dev.terrace.core.model.ModelChain;
import dev.terrace.spi.GrowthModel;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.Scale;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** Which continuous parameters the runs can determine: sensitivity, separability, degrees of freedom. */
abstract class FreeParameters extends FitLikelihood {

    FreeParameters(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
        super(c, runs, model, upstream, rng);
    }
    // ---------------------------------------------------------- choosing free parameters

    /** Sensitivity matrix: d(residual-like output)/d(u), columns scaled to the parameter's range. */
    double[][] sensitivity(Map<String, Double> combo, List<ModelParameter> cand, double[] u0) {
        int n = obs.size();
        double[][] j = new double[n][cand.size()];
        double[] base = outputs(values(combo, cand, u0));
        for (int k = 0; k < cand.size(); k++) {
            ModelParameter p = cand.get(k);
            double range = uHi(p) - uLo(p);
            double h = 1e-3 * range;
            double[] up = u0.clone();
            double[] dn = u0.clone();
            up[k] = Math.min(uHi(p), u0[k] + h);
            dn[k] = Math.max(uLo(p), u0[k] - h);
            double[] fu = outputs(values(combo, cand, up));
            double[] fd = outputs(values(combo, cand, dn));
            double step = up[k] - dn[k];
            for (int i = 0; i < n; i++) {
                double d = (fu[i] - fd[i]) / step;
                j[i][k] = Double.isFinite(d) ? d * range / 4 : 0;
            }
        }
        return j;
    }

    /** One output per observation: numeric prediction on its scale, or logit-ish of the observed class. */
    double[] outputs(ParameterValues v) {
        Prediction[] preds = predictAll(v);
        double[] out = new double[obs.size()];
        // one scale per outcome, computed once (meanAbs is a pass over every observation)
        Map<String, Double> scales = new java.util.HashMap<>();
        for (int i = 0; i < obs.size(); i++) {
            Obs o = obs.get(i);
            if (o.isClass()) {
                out[i] = Math.log(classProbability(preds[o.run()], o.outcome(), o.cls()));
            } else {
                double f = predictedScaled(preds[o.run()], o.outcome());
                double s = o.outcome().scale() == Scale.LOG ? LOG_NOISE_START
                        : scales.computeIfAbsent(o.outcome().name(), n -> LINEAR_NOISE_START * meanAbs(n));
                out[i] = Double.isFinite(f) ? f / s : 0;
            }
        }
        return out;
    }

    /**
     * Chooses the free parameters of a candidate from the sensitivities at a given point: the defaults
     * before the first fit, the fitted values when the choice is checked again. Parameters held at a
     * value another model of the chain fitted (same meaning) are never freed here.
     *
     * @param cf the candidate; its {@code free} list and held reasons are replaced
     * @param at parameter values to evaluate the sensitivities at, by name (missing ones at default)
     */
    void chooseFree(CandidateFit cf, Map<String, Double> at) {
        int nObs = obs.size();
        List<ModelParameter> free = new ArrayList<>();
        List<ModelParameter> all = new ArrayList<>();
        cf.heldReason.clear();
        for (ModelParameter p : continuous) {
            if (shared.containsKey(p.name())) {
                cf.heldReason.put(p.name(), sharedReason.get(p.name()));
            } else {
                all.add(p);
            }
        }
        double[] u0all = new double[all.size()];
        for (int i = 0; i < all.size(); i++) {
            u0all[i] = toU(all.get(i), at.getOrDefault(all.get(i).name(), all.get(i).defaultValue()));
        }
        double[][] jAll = withPriorRows(sensitivity(cf.combo, all, u0all), all);
        nObs = jAll.length;
        double maxNorm = 0;
        double[] norms = new double[all.size()];
        for (int k = 0; k < all.size(); k++) {
            double s = 0;
            for (double[] row : jAll) {
                s += row[k] * row[k];
            }
            norms[k] = Math.sqrt(s);
            maxNorm = Math.max(maxNorm, norms[k]);
        }
        int sigmas = numericOutcomes.size();
        double effective = 0;
        for (Obs o : obs) {
            // a class label or a censored value says less than a measured number
            effective += o.isClass() || o.isCensored() ? CLASS_OBSERVATION_WEIGHT : 1;
        }
        for (int k = 0; k < all.size(); k++) {
            ModelParameter p = all.get(k);
            if (!(norms[k] > MIN_SENSITIVITY * Math.max(maxNorm, 1e-300)) || norms[k] == 0) {
                cf.heldReason.put(p.name(), "these runs do not depend on it");
                continue;
            }
            // a parameter with a prior from an earlier series is determined by it whatever the runs:
            // the count of runs per parameter applies to the others only
            long freeWithoutPrior = free.stream().filter(f -> !prior.containsKey(f.name())).count();
            if (!prior.containsKey(p.name()) && (nObs - (free.size() + 1 + sigmas) < MIN_RESIDUAL_DOF
                    || effective < OBSERVATIONS_PER_PARAMETER * (freeWithoutPrior + 1))) {
                cf.heldReason.put(p.name(), "too few runs to fit it as well (" + used.size() + " runs)");
                continue;
            }
            List<Integer> cols = new ArrayList<>();
            for (ModelParameter f : free) {
                cols.add(all.indexOf(f));
            }
            cols.add(k);
            double cond = marginalCondition(jAll, cols, norms);
            if (!(cond <= MAX_CONDITION)) {
                String partner = mostCorrelated(jAll, k, free, all, norms);
                cf.heldReason.put(p.name(), "cannot be told apart from " + partner + " with these runs");
                continue;
            }
            free.add(p);
        }
        cf.free = free;
    }

    /**
     * The sensitivity matrix with one row per parameter that has a prior: the derivative of its prior
     * residual, {@code 1/sd}, scaled to the parameter's range like the other rows.
     */
    double[][] withPriorRows(double[][] j, List<ModelParameter> cand) {
        int extra = priorCount(cand);
        if (extra == 0) {
            return j;
        }
        double[][] out = java.util.Arrays.copyOf(j, j.length + extra);
        int row = j.length;
        for (int k = 0; k < cand.size(); k++) {
            double[] ps = prior.get(cand.get(k).name());
            if (ps != null) {
                out[row] = new double[cand.size()];
                out[row][k] = (uHi(cand.get(k)) - uLo(cand.get(k))) / 4 / ps[1];
                row++;
            }
        }
        return out;
    }

    /**
     * 1 / sin(angle) between the last column and the span of the others (all normalised): how
     * much freeing the last parameter inflates its own variance (the square root of its variance
     * inflation factor).
     */
    double marginalCondition(double[][] j, List<Integer> cols, double[] norms) {
        int last = cols.get(cols.size() - 1);
        int n = j.length;
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = j[i][last] / norms[last];
        }
        if (cols.size() == 1) {
            return 1;
        }
        double[][] a = new double[n][cols.size() - 1];
        for (int i = 0; i < n; i++) {
            for (int c2 = 0; c2 < cols.size() - 1; c2++) {
                a[i][c2] = j[i][cols.get(c2)] / norms[cols.get(c2)];
            }
        }
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(a, false));
        RealVector coef = svd.getSolver().solve(new ArrayRealVector(v, false));
        RealVector proj = new Array2DRowRealMatrix(a, false).operate(coef);
        double res = 0;
        for (int i = 0; i < n; i++) {
            double d = v[i] - proj.getEntry(i);
            res += d * d;
        }
        double sin = Math.sqrt(Math.max(res, 0));
        return sin <= 0 ? Double.POSITIVE_INFINITY : 1 / sin;
    }

    double condition(double[][] j, List<Integer> cols, double[] norms) {
        double[][] m = new double[j.length][cols.size()];
        for (int i = 0; i < j.length; i++) {
            for (int c2 = 0; c2 < cols.size(); c2++) {
                m[i][c2] = j[i][cols.get(c2)] / norms[cols.get(c2)];
            }
        }
        if (j.length < cols.size()) {
            return Double.POSITIVE_INFINITY;
        }
        double[] s = new SingularValueDecomposition(new Array2DRowRealMatrix(m, false)).getSingularValues();
        double min = s[s.length - 1];
        return min <= 0 ? Double.POSITIVE_INFINITY : s[0] / min;
    }

    String mostCorrelated(double[][] j, int k, List<ModelParameter> free, List<ModelParameter> all, double[] norms) {
        String best = free.isEmpty() ? "the other parameters" : free.get(0).name().replace('_', ' ');
        double bestCos = -1;
        for (ModelParameter f : free) {
            int q = all.indexOf(f);
            double dot = 0;
            for (double[] row : j) {
                dot += row[k] * row[q];
            }
            double cos = Math.abs(dot) / (norms[k] * norms[q]);
            if (cos > bestCos) {
                bestCos = cos;
                best = f.name().replace('_', ' ');
            }
        }
        return best;
    }

}
