package dev.terrace.core.fit;

import static dev.terrace.core.fit.ModelFitter.*;

import java.util.SplittableRandom;
import dev.terrace.core.model.ModelChain;
import dev.terrace.spi.GrowthModel;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.Prediction;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The objective of one model's fit: Gaussian and censored (Tobit) residuals, class log-loss, noise levels. */
abstract class FitLikelihood extends FitData {

    FitLikelihood(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
        super(c, runs, model, upstream, rng);
    }
    /** Normalised residuals (numeric: (y - f)/sigma; class observations skipped). */
    double[] numericResiduals(Prediction[] preds, Map<String, Double> sigma) {
        List<Double> r = new ArrayList<>();
        for (Obs o : obs) {
            if (o.isClass()) {
                continue;
            }
            double f = predictedScaled(preds[o.run()], o.outcome());
            double s = sigma.get(o.outcome().name());
            r.add(Double.isFinite(f) ? (o.y() - f) / s : INVALID_PENALTY);
        }
        return r.stream().mapToDouble(Double::doubleValue).toArray();
    }

    double classNll(Prediction[] preds) {
        double nll = 0;
        for (Obs o : obs) {
            if (o.isClass()) {
                nll -= Math.log(classProbability(preds[o.run()], o.outcome(), o.cls()));
            }
        }
        return nll;
    }

    Map<String, Double> startSigma() {
        Map<String, Double> s = new LinkedHashMap<>();
        for (String name : numericOutcomes) {
            OutcomeSpec o = c.outcome(name).orElseThrow();
            if (o.scale() == Scale.LOG) {
                s.put(name, LOG_NOISE_START);
            } else {
                s.put(name, Math.max(LINEAR_NOISE_START * meanAbs(name), 1e-12));
            }
        }
        return s;
    }

    double meanAbs(String name) {
        double sum = 0;
        int n = 0;
        for (Obs o : obs) {
            if (!o.isClass() && o.outcome().name().equals(name)) {
                sum += Math.abs(o.y());
                n++;
            }
        }
        return n == 0 ? 1 : sum / n;
    }

    /** ML noise per numeric outcome from the current residuals, floored. */
    Map<String, Double> updateSigma(Prediction[] preds) {
        Map<String, Double> s = new LinkedHashMap<>();
        for (String name : numericOutcomes) {
            OutcomeSpec o = c.outcome(name).orElseThrow();
            double rss = 0;
            int n = 0;
            for (Obs ob : obs) {
                if (!ob.isClass() && ob.outcome().name().equals(name)) {
                    double f = predictedScaled(preds[ob.run()], o);
                    double d = Double.isFinite(f) ? ob.y() - f : 10;
                    rss += d * d;
                    n++;
                }
            }
            double floor = o.scale() == Scale.LOG ? LOG_NOISE_FLOOR : LINEAR_NOISE_FLOOR * meanAbs(name);
            s.put(name, Math.max(Math.sqrt(rss / Math.max(n, 1)), floor));
        }
        return s;
    }

    /** -2 ln L with sigma at its ML value (profiled). */
    double minus2LogL(Prediction[] preds) {
        Map<String, Double> s = updateSigma(preds);
        double m2 = 0;
        for (String name : numericOutcomes) {
            int n = 0;
            double rss = 0;
            OutcomeSpec o = c.outcome(name).orElseThrow();
            for (Obs ob : obs) {
                if (!ob.isClass() && ob.outcome().name().equals(name)) {
                    double f = predictedScaled(preds[ob.run()], o);
                    double d = Double.isFinite(f) ? ob.y() - f : 10;
                    rss += d * d;
                    n++;
                }
            }
            double sg = s.get(name);
            m2 += n * Math.log(2 * Math.PI * sg * sg) + rss / (sg * sg);
        }
        return m2 + 2 * classNll(preds);
    }

    /** Objective for the direct minimiser: -ln L with fixed sigma. */
    double nll(double[] u, Map<String, Double> combo, List<ModelParameter> free, Map<String, Double> sigma) {
        Prediction[] preds = predictAll(values(combo, free, u));
        double[] r = numericResiduals(preds, sigma);
        double s = 0;
        for (double x : r) {
            s += x * x;
        }
        return 0.5 * s + classNll(preds);
    }

}
