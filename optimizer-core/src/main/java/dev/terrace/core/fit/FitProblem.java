package dev.terrace.core.fit;

import static dev.terrace.core.fit.ModelFitter.*;

import dev.terrace.core.model.ModelChain;
import dev.terrace.spi.GrowthModel;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.fit.FitResults.Candidate;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.FitResults.OutcomeFit;
import dev.terrace.core.fit.FitResults.Residual;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import org.apache.commons.math3.distribution.TDistribution;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/** One model's fit from start to report: every discrete combination, the best by AICc, the report. */
final class FitProblem extends FitUncertainty {

    FitProblem(Campaign c, List<Run> runs, GrowthModel model, ModelChain upstream, SplittableRandom rng) {
        super(c, runs, model, upstream, rng);
    }
    ModelFit solve() {
        ParameterValues defaults = ParameterValues.defaults(params);
        if (outs.isEmpty()) {
            return emptyFit(model.id(), defaults, defaultsHeld(model, "the campaign measures nothing this model predicts"),
                    "the campaign has no outcome with a role this model predicts ("
                            + String.join(", ", model.predictedOutcomes().stream().map(Role::key).sorted().toList())
                            + ")");
        }
        collect(defaults);
        int nRuns = used.size();
        if (nRuns < MIN_RUNS) {
            String why = nRuns == 0 ? "no usable run" : "only " + nRuns + " usable run" + (nRuns == 1 ? "" : "s");
            String msg = why + " for " + model.id() + " (needs at least " + MIN_RUNS
                    + " ok runs that measured " + String.join(" or ", outs.stream().map(OutcomeSpec::name).toList())
                    + "); every parameter is held at its default";
            List<Estimate> held = defaultsHeld(model, "too few runs (" + nRuns + ")");
            return new ModelFit(model.id(), nRuns, excluded, held, Map.of(), List.of(), List.of(), List.of(),
                    List.of(), new double[0][], defaults, List.of(msg), msg);
        }
        // every combination of discrete choices
        List<Map<String, Double>> combos = combos();
        List<CandidateFit> cands = new ArrayList<>();
        // candidates are independent: fit them on up to CANDIDATE_THREADS threads, each with its own
        // random stream split off in a fixed order, so the result does not depend on scheduling
        List<SplittableRandom> streams = new ArrayList<>();
        for (int k = 0; k < combos.size(); k++) {
            streams.add(rng.split());
        }
        if (combos.size() == 1) {
            cands.add(fitCandidate(combos.get(0), streams.get(0)));
        } else {
            java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(
                    Math.min(CANDIDATE_THREADS, combos.size()));
            try {
                List<java.util.concurrent.Future<CandidateFit>> fs = new ArrayList<>();
                for (int k = 0; k < combos.size(); k++) {
                    final int kk = k;
                    fs.add(pool.submit(() -> fitCandidate(combos.get(kk), streams.get(kk))));
                }
                for (java.util.concurrent.Future<CandidateFit> f : fs) {
                    try {
                        cands.add(f.get());
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                        throw new IllegalStateException("fit interrupted", e);
                    } catch (java.util.concurrent.ExecutionException e) {
                        Throwable cause = e.getCause();
                        throw cause instanceof RuntimeException ? (RuntimeException) cause
                                : new IllegalStateException(cause);
                    }
                }
            } finally {
                pool.shutdownNow();
            }
        }
        CandidateFit best = null;
        for (CandidateFit cf : cands) {
            if (Double.isFinite(cf.aicc) && (best == null || cf.aicc < best.aicc)) {
                best = cf;
            }
        }
        boolean aiccUsable = best != null;
        if (best == null) {
            // too few runs for AICc: keep the default discrete choices
            for (CandidateFit cf : cands) {
                if (isDefaultCombo(cf.combo)) {
                    best = cf;
                }
            }
            if (best == null) {
                best = cands.get(0);
            }
        }
        List<Candidate> candOut = new ArrayList<>();
        for (CandidateFit cf : cands) {
            candOut.add(new Candidate(cf.combo, cf.aicc, cf.m2ll, cf.k, cf == best));
        }
        return report(best, candOut, aiccUsable);
    }

    boolean isDefaultCombo(Map<String, Double> combo) {
        for (ModelParameter p : discrete) {
            if (combo.get(p.name()) != p.defaultValue()) {
                return false;
            }
        }
        return true;
    }

    List<Map<String, Double>> combos() {
        List<Map<String, Double>> out = new ArrayList<>();
        out.add(new LinkedHashMap<>());
        for (ModelParameter p : discrete) {
            List<Map<String, Double>> next = new ArrayList<>();
            for (Map<String, Double> m : out) {
                for (double v : p.choices()) {
                    Map<String, Double> n = new LinkedHashMap<>(m);
                    n.put(p.name(), v);
                    next.add(n);
                }
            }
            out = next;
        }
        return out;
    }


    ModelFit report(CandidateFit best, List<Candidate> candOut, boolean aiccUsable) {
        int d = best.free.size();
        double[][] cov = d == 0 ? new double[0][0] : covariance(best);
        int nNum = (int) obs.stream().filter(o -> !o.isClass()).count();
        int dof = (hasClass ? obs.size() : nNum) - d;
        boolean useBootstrap = intervals && d > 0 && (cov == null || dof < MIN_DOF_FOR_COVARIANCE);
        double[][] ci = new double[d][2];
        String method;
        if (useBootstrap) {
            ci = bootstrap(best);
            method = "95 % interval from " + (hasClass ? BOOTSTRAP_REPLICATES_CLASSES : BOOTSTRAP_REPLICATES)
                    + " bootstrap refits"
                    + (cov == null ? " (the curvature of the fit is not reliable)" : " (small sample)");
        } else if (cov == null) {
            for (int k = 0; k < d; k++) {
                ci[k][0] = uLo(best.free.get(k));
                ci[k][1] = uHi(best.free.get(k));
            }
            method = "interval not computed (the curvature of the fit is not reliable; run terrace fit for a bootstrap)";
        } else {
            double t = new TDistribution(Math.max(dof, 1)).inverseCumulativeProbability(0.975);
            for (int k = 0; k < d; k++) {
                double se = Math.sqrt(Math.max(cov[k][k], 0));
                ci[k][0] = best.u[k] - t * se;
                ci[k][1] = best.u[k] + t * se;
            }
            method = "95 % interval from the fit's covariance (Student t, " + Math.max(dof, 1) + " degrees of freedom)";
        }
        ParameterValues values = values(best.combo, best.free, best.u);
        List<Estimate> est = new ArrayList<>();
        for (ModelParameter p : params) {
            int k = best.free.indexOf(p);
            if (k >= 0) {
                double lo = fromU(p, Math.max(uLo(p), Math.min(ci[k][0], ci[k][1])));
                double hi = fromU(p, Math.min(uHi(p), Math.max(ci[k][0], ci[k][1])));
                double v = values.get(p.name());
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
                String reason = method;
                if (lo <= p.min() || hi >= p.max()) {
                    reason += "; the interval reaches the parameter's physical bound";
                }
                est.add(new Estimate(p.name(), p.unit(), v, lo, hi, false, reason, p.source()));
            } else if (p.isDiscrete()) {
                String why = discrete.size() > 0 && aiccUsable ? "chosen by AICc among "
                        + p.choices().stream().map(ModelFitter::fmt).toList()
                        : "too few runs to compare the choices by AICc; default kept";
                est.add(new Estimate(p.name(), p.unit(), best.combo.get(p.name()), Double.NaN, Double.NaN,
                        true, why, p.source()));
            } else {
                est.add(new Estimate(p.name(), p.unit(), p.defaultValue(), Double.NaN, Double.NaN, true,
                        "held at its default: " + best.heldReason.getOrDefault(p.name(), "not fitted"), p.source()));
            }
        }
        // correlations
        List<String> corrNames = best.free.stream().map(ModelParameter::name).toList();
        double[][] corr = new double[d][d];
        if (cov != null && d > 0) {
            for (int a = 0; a < d; a++) {
                for (int b = 0; b < d; b++) {
                    double den = Math.sqrt(cov[a][a] * cov[b][b]);
                    corr[a][b] = den > 0 ? Math.max(-1, Math.min(1, cov[a][b] / den)) : (a == b ? 1 : 0);
                }
            }
        } else {
            for (int a = 0; a < d; a++) {
                corr[a][a] = 1;
            }
        }
        // residuals and per-outcome quality
        Prediction[] preds = predictAll(values);
        List<Residual> residuals = new ArrayList<>();
        List<OutcomeFit> outFits = new ArrayList<>();
        for (OutcomeSpec o : outs) {
            int n = 0;
            double ss = 0;
            double ll = 0;
            int correct = 0;
            for (Obs ob : obs) {
                if (ob.outcome() != o) {
                    continue;
                }
                n++;
                Prediction p = preds[ob.run()];
                String runId = used.get(ob.run()).runId();
                if (ob.isClass()) {
                    double pr = classProbability(p, o, ob.cls());
                    ll -= Math.log(pr);
                    String top = null;
                    double topP = -1;
                    for (String k : o.classes()) {
                        double q = classProbability(p, o, k);
                        if (q > topP) {
                            topP = q;
                            top = k;
                        }
                    }
                    if (ob.cls().equals(top)) {
                        correct++;
                    }
                    residuals.add(new Residual(runId, o.name(), Double.NaN, Double.NaN, -Math.log(pr), ob.cls()));
                } else {
                    double f = predictedScaled(p, o);
                    double meas = o.scale() == Scale.LOG ? Math.pow(10, ob.y()) : ob.y();
                    double pred = Double.isFinite(f) ? (o.scale() == Scale.LOG ? Math.pow(10, f) : f) : Double.NaN;
                    double r = Double.isFinite(f) ? ob.y() - f : Double.NaN;
                    if (Double.isFinite(r)) {
                        ss += r * r;
                    }
                    residuals.add(new Residual(runId, o.name(), meas, pred, r, null));
                }
            }
            if (n == 0) {
                continue;
            }
            if (o.isClass()) {
                outFits.add(new OutcomeFit(o.name(), "class", n, Double.NaN, ll / n, (double) correct / n));
            } else {
                outFits.add(new OutcomeFit(o.name(), o.scale() == Scale.LOG ? "log10" : "linear", n,
                        Math.sqrt(ss / n), Double.NaN, Double.NaN));
            }
        }
        List<String> verdict = verdict(est, best);
        return new ModelFit(model.id(), used.size(), excluded, est, best.combo, candOut, outFits, residuals,
                corrNames, corr, values, verdict, "");
    }

    List<String> verdict(List<Estimate> est, CandidateFit best) {
        List<String> out = new ArrayList<>();
        for (Estimate e : est) {
            if (!e.held()) {
                out.add(words(e.name()) + " " + fmt(e.value()) + unit(e.unit()) + " (" + fmt(e.lo()) + " to "
                        + fmt(e.hi()) + "), from " + used.size() + " runs");
            }
        }
        if (!best.combo.isEmpty()) {
            List<String> parts = new ArrayList<>();
            best.combo.forEach((k, v) -> parts.add(words(k) + " " + fmt(v)));
            out.add(String.join(", ", parts) + (candOut(best) ? " (best AICc)" : " (default; too few runs to choose)"));
        }
        long held = est.stream().filter(e -> e.held() && !isDiscrete(e.name())).count();
        if (held > 0) {
            out.add(held + " parameter" + (held == 1 ? "" : "s") + " held at default"
                    + (held == 1 ? "" : "s") + " (see reasons)");
        }
        if (out.isEmpty()) {
            out.add("nothing could be fitted from these runs");
        }
        return out;
    }

    boolean candOut(CandidateFit best) {
        return Double.isFinite(best.aicc);
    }

    boolean isDiscrete(String name) {
        return discrete.stream().anyMatch(p -> p.name().equals(name));
    }
}
