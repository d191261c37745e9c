package dev.terrace.core.validate;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.ModelFitter;
import dev.terrace.core.model.ModelChain;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.PhysicsPriors;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.surrogate.ClassModel;
import dev.terrace.spi.GrowthModel;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The pieces of one {@link Validation} fold that do not fit anything: which runs measured an
 * outcome, the fitting scale (log10 for {@code scale: log}), the trivial predictor (training mean
 * and sample sd, Laplace-smoothed class frequencies), the growth-model chain's prediction and its
 * residual standard error as a predictive spread, and the Gaussian log density of a held-out value.
 */
final class FoldPredictions {

    private FoldPredictions() {
    }

    /** True when the run holds a usable measurement of the outcome. */
    static boolean measured(OutcomeSpec o, Run r) {
        if (o.isClass()) {
            return r.category(o.name()).map(v -> o.classes().contains(v)).orElse(false);
        }
        var v = r.number(o.name());
        return v.isPresent() && Double.isFinite(v.getAsDouble()) && (o.scale() != Scale.LOG || v.getAsDouble() > 0);
    }

    static double scaled(OutcomeSpec o, double v) {
        return o.scale() == Scale.LOG ? Math.log10(v) : v;
    }

    static double unscaled(OutcomeSpec o, double v) {
        return o.scale() == Scale.LOG ? Math.pow(10, v) : v;
    }

    static String scaleName(OutcomeSpec o) {
        if (o.isClass()) {
            return "class";
        }
        return o.scale() == Scale.LOG ? "log10" : "linear";
    }

    /** {mean, sample sd floored, mean magnitude} of the ok training runs' values on the fitting scale. */
    static double[] trivialGaussian(OutcomeSpec o, List<Run> train) {
        double sum = 0;
        double sumAbs = 0;
        int n = 0;
        List<Double> ys = new ArrayList<>();
        for (Run r : train) {
            if (r.ok() && measured(o, r)) {
                double y = scaled(o, r.number(o.name()).getAsDouble());
                ys.add(y);
                sum += y;
                sumAbs += Math.abs(y);
                n++;
            }
        }
        double mean = sum / n;
        double ss = 0;
        for (double y : ys) {
            ss += (y - mean) * (y - mean);
        }
        double meanAbs = sumAbs / n;
        double sd = n > 1 ? Math.sqrt(ss / (n - 1)) : 0;
        return new double[] {mean, Math.max(sd, sdFloor(o, meanAbs)), meanAbs};
    }

    /** The smallest predictive sd allowed, from the fitter's noise floors. */
    static double sdFloor(OutcomeSpec o, double meanAbs) {
        if (o.scale() == Scale.LOG) {
            return ModelFitter.LOG_NOISE_FLOOR;
        }
        return Math.max(ModelFitter.LINEAR_NOISE_FLOOR * meanAbs, Double.MIN_NORMAL);
    }

    /** Laplace-smoothed class frequencies of the ok training runs, in campaign class order. */
    static double[] frequencies(OutcomeSpec o, List<Run> train) {
        int k = o.classes().size();
        double[] p = new double[k];
        java.util.Arrays.fill(p, 1);
        double total = k;
        for (Run r : train) {
            if (r.ok() && measured(o, r)) {
                p[o.classes().indexOf(r.category(o.name()).get())] += 1;
                total += 1;
            }
        }
        for (int j = 0; j < k; j++) {
            p[j] /= total;
        }
        return p;
    }

    /** The chain's prediction of a numeric outcome on its fitting scale, or NaN. */
    static double priorValue(Campaign c, OutcomeSpec o, ModelChain.Result r) {
        return PhysicsPriors.priorValue(c, o, r);
    }

    /** The chain's class probabilities in campaign order, floored and renormalised, or null. */
    static double[] physicsProbabilities(OutcomeSpec o, ModelChain.Result r) {
        return PhysicsPriors.physicsClassProbabilities(o, r);
    }

    /**
     * Residual standard error of the chain on the training runs: sqrt(SSE / max(n - p, 1)) with p
     * the fitted parameters of the models that predict the outcome; NaN when no training run has a
     * valid prediction.
     */
    static double physicsSd(Campaign c, OutcomeSpec o, List<Run> train, List<ModelChain.Result> atTrain,
                            FitReport fit, PluginRegistry reg) {
        double sse = 0;
        int n = 0;
        for (int i = 0; i < train.size(); i++) {
            Run r = train.get(i);
            if (!r.ok() || !measured(o, r) || atTrain.get(i) == null) {
                continue;
            }
            double f = priorValue(c, o, atTrain.get(i));
            if (!Double.isFinite(f)) {
                continue;
            }
            double e = scaled(o, r.number(o.name()).getAsDouble()) - f;
            sse += e * e;
            n++;
        }
        if (n == 0) {
            return Double.NaN;
        }
        int p = 0;
        if (fit != null && o.role() != null) {
            for (ModelFit mf : fit.models()) {
                Optional<GrowthModel> gm = reg.model(mf.id());
                if (gm.isPresent() && gm.get().predictedOutcomes().contains(o.role())) {
                    for (Estimate e : mf.estimates()) {
                        if (!e.held()) {
                            p++;
                        }
                    }
                }
            }
        }
        return Math.sqrt(sse / Math.max(n - p, 1));
    }

    static double sdNew(CampaignSurrogate.Evaluation ev, String outcome) {
        return Math.hypot(ev.sdLatent().get(outcome)[0], ev.noiseSd().get(outcome));
    }

    static String failure(Run held, String surrogate, RuntimeException e) {
        return "with run " + held.runId() + " held out, " + surrogate + " could not be fitted ("
                + e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage())
                + "); that fold is not scored for it";
    }

    /** Negative log density of y under N(mu, sd²). */
    static double nlpd(double y, double mu, double sd) {
        double z = (y - mu) / sd;
        return 0.5 * Math.log(2 * Math.PI * sd * sd) + 0.5 * z * z;
    }
}
