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
import dev.terrace.core.runlog.Censored;
import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The objective of one model's fit: Gaussian and censored (Tobit) residuals, class log-loss, noise levels. */
abstract class FitLikelihood extends FitData {

    FitLikelihood(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
        super(c, runs, model, upstream, rng);
    }
    /**
     * Normalised residuals of the numeric observations, one per observation in order (class
     * observations skipped): {@code (y − f)/σ} for a measured value, the Tobit pseudo-residual
     * {@code sqrt(−2 log P)} for a censored one, so that half the sum of squares is the negative
     * log-likelihood (up to constants) either way.
     */
    double[] numericResiduals(Prediction[] preds, Map<String, Double> sigma) {
        double[] r = new double[numericCount()];
        int i = 0;
        for (Obs o : obs) {
            if (o.isClass()) {
                continue;
            }
            double f = predictedScaled(preds[o.run()], o.outcome());
            double s = sigma.get(o.outcome().name());
            if (!Double.isFinite(f)) {
                r[i++] = INVALID_PENALTY;
            } else if (o.isCensored()) {
                r[i++] = CensoredNormal.pseudoResidual(o.side(), o.y(), f, s);
            } else {
                r[i++] = (o.y() - f) / s;
            }
        }
        return r;
    }

    /** @return how many numeric observations (measured or censored) the fit has */
    int numericCount() {
        int n = 0;
        for (Obs o : obs) {
            if (!o.isClass()) {
                n++;
            }
        }
        return n;
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
            if (!o.isClass() && !o.isCensored() && o.outcome().name().equals(name)) {
                sum += Math.abs(o.y());
                n++;
            }
        }
        return n == 0 ? 1 : sum / n;
    }

    /**
     * ML noise per numeric outcome from the current predictions, floored. With measured values only
     * it is the root-mean-square residual; with censored values it maximises the outcome's Tobit
     * log-likelihood over σ (Brent's method on log σ, bracketed by the floor and a hundred times the
     * spread of the values).
     */
    Map<String, Double> updateSigma(Prediction[] preds) {
        Map<String, Double> s = new LinkedHashMap<>();
        for (String name : numericOutcomes) {
            OutcomeSpec o = c.outcome(name).orElseThrow();
            double floor = o.scale() == Scale.LOG ? LOG_NOISE_FLOOR : LINEAR_NOISE_FLOOR * meanAbs(name);
            double rss = 0;
            int n = 0;
            List<double[]> censored = new ArrayList<>();
            for (Obs ob : obs) {
                if (ob.isClass() || !ob.outcome().name().equals(name)) {
                    continue;
                }
                double f = predictedScaled(preds[ob.run()], o);
                if (ob.isCensored()) {
                    if (Double.isFinite(f)) {
                        censored.add(new double[] {ob.side() == Censored.Side.BELOW ? 1 : -1, ob.y() - f});
                    }
                    continue;
                }
                double d = Double.isFinite(f) ? ob.y() - f : 10;
                rss += d * d;
                n++;
            }
            double rms = Math.sqrt(rss / Math.max(n, 1));
            if (censored.isEmpty()) {
                s.put(name, Math.max(rms, floor));
                continue;
            }
            double spread = rms;
            for (double[] cz : censored) {
                spread = Math.max(spread, Math.abs(cz[1]));
            }
            final double rssF = rss;
            final int nF = n;
            UnivariateFunction negLogL = logSigma -> {
                double sg = Math.exp(logSigma);
                double v = nF * logSigma + rssF / (2 * sg * sg);
                for (double[] cz : censored) {
                    v -= CensoredNormal.logCdf(cz[0] * cz[1] / sg);
                }
                return v;
            };
            double lo = Math.log(floor);
            double hi = Math.log(Math.max(100 * Math.max(spread, floor), 2 * floor));
            double best = new BrentOptimizer(1e-8, 1e-10).optimize(new MaxEval(200),
                    new UnivariateObjectiveFunction(negLogL), GoalType.MINIMIZE,
                    new SearchInterval(lo, hi, Math.max(lo, Math.min(hi, Math.log(Math.max(rms, floor)))))).getPoint();
            s.put(name, Math.max(Math.exp(best), floor));
        }
        return s;
    }

    /** -2 ln L with sigma at its ML value (profiled); censored values enter through their Tobit terms. */
    double minus2LogL(Prediction[] preds) {
        Map<String, Double> s = updateSigma(preds);
        double m2 = 0;
        for (String name : numericOutcomes) {
            int n = 0;
            double rss = 0;
            double censoredTerms = 0;
            OutcomeSpec o = c.outcome(name).orElseThrow();
            double sg = s.get(name);
            for (Obs ob : obs) {
                if (!ob.isClass() && ob.outcome().name().equals(name)) {
                    double f = predictedScaled(preds[ob.run()], o);
                    if (ob.isCensored()) {
                        censoredTerms += Double.isFinite(f)
                                ? -2 * CensoredNormal.logProbability(ob.side(), ob.y(), f, sg)
                                : INVALID_PENALTY * INVALID_PENALTY;
                        continue;
                    }
                    double d = Double.isFinite(f) ? ob.y() - f : 10;
                    rss += d * d;
                    n++;
                }
            }
            m2 += n * Math.log(2 * Math.PI * sg * sg) + rss / (sg * sg) + censoredTerms;
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
        return 0.5 * (s + priorChi2(free, u)) + classNll(preds);
    }

    /** Normalised numeric residuals followed by the prior residuals of the free parameters. */
    double[] allResiduals(Map<String, Double> combo, List<ModelParameter> free, double[] u, Map<String, Double> sigma) {
        double[] r = numericResiduals(predictAll(values(combo, free, u)), sigma);
        double[] pr = priorResiduals(free, u);
        if (pr.length == 0) {
            return r;
        }
        double[] out = java.util.Arrays.copyOf(r, r.length + pr.length);
        System.arraycopy(pr, 0, out, r.length, pr.length);
        return out;
    }

}
