package dev.terrace.core.fit;

import static dev.terrace.core.fit.ModelFitter.*;

import dev.terrace.core.model.ModelChain;
import dev.terrace.spi.GrowthModel;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.Prediction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import dev.terrace.core.runlog.Censored;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/** Intervals of the fitted parameters: covariance from the curvature, or a bootstrap. */
abstract class FitUncertainty extends FitOptimizer {

    FitUncertainty(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
        super(c, runs, model, upstream, rng);
    }
    // ---------------------------------------------------------- uncertainty and report

    /** Hessian of -ln L (fixed sigma) in u space by central differences. */
    double[][] hessian(CandidateFit cf) {
        int d = cf.u.length;
        double[][] h = new double[d][d];
        double[] step = new double[d];
        for (int i = 0; i < d; i++) {
            ModelParameter p = cf.free.get(i);
            step[i] = 1e-3 * (uHi(p) - uLo(p));
        }
        double f0 = nll(cf.u, cf.combo, cf.free, cf.sigma);
        for (int i = 0; i < d; i++) {
            for (int j = i; j < d; j++) {
                double v;
                if (i == j) {
                    double[] a = cf.u.clone();
                    double[] b = cf.u.clone();
                    a[i] += step[i];
                    b[i] -= step[i];
                    v = (nll(a, cf.combo, cf.free, cf.sigma) - 2 * f0 + nll(b, cf.combo, cf.free, cf.sigma))
                            / (step[i] * step[i]);
                } else {
                    double[] pp = cf.u.clone();
                    double[] pm = cf.u.clone();
                    double[] mp = cf.u.clone();
                    double[] mm = cf.u.clone();
                    pp[i] += step[i];
                    pp[j] += step[j];
                    pm[i] += step[i];
                    pm[j] -= step[j];
                    mp[i] -= step[i];
                    mp[j] += step[j];
                    mm[i] -= step[i];
                    mm[j] -= step[j];
                    v = (nll(pp, cf.combo, cf.free, cf.sigma) - nll(pm, cf.combo, cf.free, cf.sigma)
                            - nll(mp, cf.combo, cf.free, cf.sigma) + nll(mm, cf.combo, cf.free, cf.sigma))
                            / (4 * step[i] * step[j]);
                }
                h[i][j] = v;
                h[j][i] = v;
            }
        }
        return h;
    }

    /** Gauss-Newton information J^T J (numeric-only models), better conditioned than differences. */
    double[][] gaussNewton(CandidateFit cf) {
        int d = cf.u.length;
        double[] r0 = allResiduals(cf.combo, cf.free, cf.u, cf.sigma);
        double[][] j = new double[r0.length][d];
        for (int k = 0; k < d; k++) {
            ModelParameter p = cf.free.get(k);
            double h = 1e-5 * (uHi(p) - uLo(p));
            double[] a = cf.u.clone();
            double[] b = cf.u.clone();
            a[k] = Math.min(uHi(p), cf.u[k] + h);
            b[k] = Math.max(uLo(p), cf.u[k] - h);
            double[] ra = allResiduals(cf.combo, cf.free, a, cf.sigma);
            double[] rb = allResiduals(cf.combo, cf.free, b, cf.sigma);
            for (int i = 0; i < r0.length; i++) {
                j[i][k] = (ra[i] - rb[i]) / (a[k] - b[k]);
            }
        }
        double[][] info = new double[d][d];
        for (double[] row : j) {
            for (int a = 0; a < d; a++) {
                for (int b = 0; b < d; b++) {
                    info[a][b] += row[a] * row[b];
                }
            }
        }
        return info;
    }

    /** Covariance in u space, or null when the information matrix is not positive definite. */
    double[][] covariance(CandidateFit cf) {
        // Gauss-Newton needs plain residuals; class and censored terms take the observed information
        double[][] info = hasClass || hasCensored ? hessian(cf) : gaussNewton(cf);
        // the priors' share of the information (their sd is known, not estimated from the residuals)
        double[][] priorInfo = priorInformation(cf.free);
        int k = priorCount(cf.free);
        if (!hasClass && k > 0) {
            // inflate the data's share alone for the estimated noise, then add the priors' share
            int n = numericCount();
            int dofData = n - cf.free.size() + k;
            double f = dofData > 0 ? (double) n / dofData : 1;
            for (int a = 0; a < info.length; a++) {
                for (int b = 0; b < info.length; b++) {
                    info[a][b] = (info[a][b] - priorInfo[a][b]) / f + priorInfo[a][b];
                }
            }
        }
        RealMatrix m = new Array2DRowRealMatrix(info);
        EigenDecomposition ed = new EigenDecomposition(m);
        double[] ev = ed.getRealEigenvalues();
        double max = Arrays.stream(ev).max().orElse(0);
        for (double e : ev) {
            if (!(e > 1e-12 * Math.max(max, 1e-300))) {
                return null;
            }
        }
        double[][] cov = ed.getSolver().getInverse().getData();
        // correct for the residual degrees of freedom of the estimated noise (numeric only)
        if (!hasClass && k == 0) {
            int n = numericCount();
            int dof = n - cf.free.size();
            if (dof > 0) {
                double f = (double) n / dof;
                for (double[] row : cov) {
                    for (int j = 0; j < row.length; j++) {
                        row[j] *= f;
                    }
                }
            }
        }
        return cov;
    }

    /**
     * The prior information matrix in free-parameter order: the inverse prior covariance of the free
     * parameters that have a prior ({@code L⁻ᵀL⁻¹}), zero elsewhere.
     */
    double[][] priorInformation(List<ModelParameter> free) {
        int d = free.size();
        double[][] out = new double[d][d];
        List<Integer> idx = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (int i = 0; i < d; i++) {
            if (prior.containsKey(free.get(i).name())) {
                idx.add(i);
                names.add(free.get(i).name());
            }
        }
        if (names.isEmpty()) {
            return out;
        }
        double[][] l = priorCholesky(names);
        RealMatrix lm = new Array2DRowRealMatrix(l);
        RealMatrix cov = lm.multiply(lm.transpose());
        double[][] inv = new org.apache.commons.math3.linear.LUDecomposition(cov).getSolver().getInverse().getData();
        for (int a = 0; a < idx.size(); a++) {
            for (int b = 0; b < idx.size(); b++) {
                out[idx.get(a)][idx.get(b)] = inv[a][b];
            }
        }
        return out;
    }

    double[][] bootstrap(CandidateFit cf) {
        int d = cf.u.length;
        Prediction[] fittedPreds = predictAll(values(cf.combo, cf.free, cf.u));
        List<Double> resid = new ArrayList<>();
        List<Integer> residIdx = new ArrayList<>();
        for (int i = 0; i < obs.size(); i++) {
            Obs o = obs.get(i);
            if (!o.isClass() && !o.isCensored()) {
                double f = predictedScaled(fittedPreds[o.run()], o.outcome());
                resid.add(Double.isFinite(f) ? (o.y() - f) / cf.sigma.get(o.outcome().name()) : 0);
                residIdx.add(i);
            }
        }
        int nNum = resid.size();
        double inflate = nNum - d > 0 ? Math.sqrt((double) nNum / (nNum - d)) : 1;
        List<Obs> original = new ArrayList<>(obs);
        int reps = hasClass ? BOOTSTRAP_REPLICATES_CLASSES : BOOTSTRAP_REPLICATES;
        double[][] samples = new double[reps][];
        int savedMax = maxEvaluations;
        maxEvaluations = 800;
        SplittableRandom r = rng.split();
        Map<String, double[]> priorMeans = new java.util.LinkedHashMap<>(prior);
        try {
            for (int b = 0; b < reps; b++) {
                // the prior is one more observation: draw its mean afresh, as the data are redrawn,
                // so the spread of the refits is that of the combined estimate, not the data's share alone
                List<String> names = new ArrayList<>(priorMeans.keySet());
                double[][] l = priorCholesky(names);
                double[] z = new double[names.size()];
                for (int i = 0; i < z.length; i++) {
                    z[i] = r.nextGaussian();
                }
                for (int i = 0; i < z.length; i++) {
                    double[] ps = priorMeans.get(names.get(i));
                    double shift = 0;
                    for (int j = 0; j <= i; j++) {
                        shift += l[i][j] * z[j];
                    }
                    prior.put(names.get(i), new double[] {ps[0] + shift, ps[1]});
                }
                List<Obs> synth = new ArrayList<>();
                for (Obs o : original) {
                    if (o.isClass()) {
                        synth.add(Obs.exact(o.run(), o.outcome(), Double.NaN,
                                sampleClass(fittedPreds[o.run()], o.outcome(), r)));
                        continue;
                    }
                    double f = predictedScaled(fittedPreds[o.run()], o.outcome());
                    double s = cf.sigma.get(o.outcome().name());
                    // resample the measured residuals; with none measured, draw from the fitted normal
                    double e = (nNum > 0 ? resid.get(r.nextInt(nNum)) * inflate : r.nextGaussian()) * s;
                    double y = (Double.isFinite(f) ? f : o.y()) + e;
                    if (!o.isCensored()) {
                        synth.add(Obs.exact(o.run(), o.outcome(), y, null));
                    } else if (o.side() == Censored.Side.BELOW ? y < o.y() : y > o.y()) {
                        synth.add(o); // the replicate falls beyond the same bound: censored again
                    } else {
                        synth.add(Obs.exact(o.run(), o.outcome(), y, null));
                    }
                }
                obs.clear();
                obs.addAll(synth);
                double[] u = cf.u;
                Map<String, Double> sg = cf.sigma;
                for (int iter = 0; iter < 2; iter++) {
                    u = minimise(u, cf.combo, cf.free, sg);
                    sg = updateSigma(predictAll(values(cf.combo, cf.free, u)));
                }
                samples[b] = u;
            }
        } finally {
            prior.putAll(priorMeans);
            obs.clear();
            obs.addAll(original);
            maxEvaluations = savedMax;
        }
        double[][] ci = new double[d][2];
        for (int k = 0; k < d; k++) {
            double[] col = new double[reps];
            for (int b = 0; b < reps; b++) {
                col[b] = samples[b][k];
            }
            Arrays.sort(col);
            ci[k][0] = col[(int) Math.floor(0.025 * (reps - 1))];
            ci[k][1] = col[(int) Math.ceil(0.975 * (reps - 1))];
        }
        return ci;
    }

    String sampleClass(Prediction p, OutcomeSpec o, SplittableRandom r) {
        double x = r.nextDouble();
        double acc = 0;
        for (String k : o.classes()) {
            acc += classProbability(p, o, k);
            if (x <= acc) {
                return k;
            }
        }
        return o.classes().get(o.classes().size() - 1);
    }

}
