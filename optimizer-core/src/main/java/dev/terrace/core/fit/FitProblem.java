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
import dev.terrace.core.fit.FitResults.RunStatus;
import dev.terrace.core.fit.FitResults.RunUse;
import dev.terrace.core.fit.FitResults.Excluded;
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
                            + ")", allRuns);
        }
        collect(defaults);
        int nRuns = used.size();
        if (nRuns < MIN_RUNS) {
            String why = nRuns == 0 ? "no usable run" : "only " + nRuns + " usable run" + (nRuns == 1 ? "" : "s");
            String msg = why + " for " + model.id() + " (needs at least " + MIN_RUNS
                    + " ok runs that measured " + String.join(" or ", outs.stream().map(OutcomeSpec::name).toList())
                    + "); every parameter is held at its default";
            List<Estimate> held = defaultsHeld(model, "too few runs (" + nRuns + ")");
            return new ModelFit(model.id(), nRuns, excluded, withShared(held), Map.of(), List.of(), List.of(),
                    List.of(), List.of(), new double[0][], values(Map.of(), List.of(), new double[0]), List.of(msg),
                    msg, statuses(null));
        }
        List<CandidateFit> cands = fitAllCandidates();
        CandidateFit best = select(cands);
        // runs outside the model at the fitted values leave, and the model is refitted without them
        for (int round = 0; round < VALIDITY_RECHECKS; round++) {
            Prediction[] preds = predictAll(values(best.combo, best.free, best.u));
            List<Integer> drop = new ArrayList<>();
            List<String> reasons = new ArrayList<>();
            for (int i = 0; i < preds.length; i++) {
                if (!preds[i].validity().valid()) {
                    drop.add(i);
                    reasons.add("outside the model at the fitted parameters: " + preds[i].validity().reason());
                }
            }
            if (drop.isEmpty() || used.size() - drop.size() < MIN_RUNS) {
                break;
            }
            dropRuns(drop, reasons);
            cands = fitAllCandidates();
            best = select(cands);
        }
        boolean aiccUsable = Double.isFinite(best.aicc);
        List<Candidate> candOut = new ArrayList<>();
        for (CandidateFit cf : cands) {
            candOut.add(new Candidate(cf.combo, cf.aicc, cf.m2ll, cf.k, cf == best));
        }
        return report(best, candOut, aiccUsable);
    }

    /** Fits every combination of discrete choices. */
    List<CandidateFit> fitAllCandidates() {
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
        return cands;
    }

    /** The candidate with the lowest AICc, or the default choices when AICc cannot be computed. */
    CandidateFit select(List<CandidateFit> cands) {
        CandidateFit best = null;
        for (CandidateFit cf : cands) {
            if (Double.isFinite(cf.aicc) && (best == null || cf.aicc < best.aicc)) {
                best = cf;
            }
        }
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
        return best;
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
        int dof = (hasClass ? obs.size() : nNum) + priorCount(best.free) - d;
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
                // a parameter with a prior: its information is mostly the prior's, whose sd is known, so the
                // normal quantile applies (Student t only widens for a noise level estimated from residuals)
                double q = prior.containsKey(best.free.get(k).name()) ? ParameterPrior.Z95 : t;
                ci[k][0] = best.u[k] - q * se;
                ci[k][1] = best.u[k] + q * se;
            }
            method = "95 % interval from the fit's covariance (Student t, " + Math.max(dof, 1) + " degrees of freedom"
                    + (prior.isEmpty() ? ")" : "; normal quantile where an earlier series gives a prior)");
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
            } else if (shared.containsKey(p.name())) {
                est.add(new Estimate(p.name(), p.unit(), shared.get(p.name()), Double.NaN, Double.NaN, true,
                        sharedReason.get(p.name()), p.source()));
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
            int nCensored = 0;
            int nMeasured = 0;
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
                    residuals.add(new Residual(runId, o.name(), Double.NaN, Double.NaN, -Math.log(pr), ob.cls(),
                            null));
                } else {
                    double f = predictedScaled(p, o);
                    double meas = o.scale() == Scale.LOG ? Math.pow(10, ob.y()) : ob.y();
                    double pred = Double.isFinite(f) ? (o.scale() == Scale.LOG ? Math.pow(10, f) : f) : Double.NaN;
                    double r = Double.isFinite(f) ? ob.y() - f : Double.NaN;
                    if (ob.isCensored()) {
                        nCensored++;
                    } else {
                        nMeasured++;
                        if (Double.isFinite(r)) {
                            ss += r * r;
                        }
                    }
                    residuals.add(new Residual(runId, o.name(), meas, pred, r, null,
                            ob.isCensored() ? ob.side().symbol() : null));
                }
            }
            if (n == 0) {
                continue;
            }
            if (o.isClass()) {
                outFits.add(new OutcomeFit(o.name(), "class", n, Double.NaN, ll / n, (double) correct / n, 0,
                        Double.NaN));
            } else {
                outFits.add(new OutcomeFit(o.name(), o.scale() == Scale.LOG ? "log10" : "linear", n,
                        nMeasured == 0 ? Double.NaN : Math.sqrt(ss / nMeasured), Double.NaN, Double.NaN, nCensored,
                        best.sigma.getOrDefault(o.name(), Double.NaN)));
            }
        }
        List<String> verdict = verdict(est, best);
        return new ModelFit(model.id(), used.size(), excluded, est, best.combo, candOut, outFits, residuals,
                corrNames, corr, values, verdict, "", statuses(preds));
    }

    /**
     * Every run of the log with what this fit did with it, in log order.
     *
     * @param preds predictions at the fitted values for the used runs, or null when nothing was fitted
     */
    List<RunStatus> statuses(Prediction[] preds) {
        Map<String, String> why = new LinkedHashMap<>();
        for (Excluded x : excluded) {
            why.putIfAbsent(x.runId(), x.reason());
        }
        Map<String, Integer> usedIndex = new LinkedHashMap<>();
        for (int i = 0; i < used.size(); i++) {
            usedIndex.put(used.get(i).runId(), i);
        }
        Map<Integer, List<String>> censoredCells = new LinkedHashMap<>();
        for (Obs o : obs) {
            if (o.isCensored()) {
                double bound = o.outcome().scale() == Scale.LOG ? Math.pow(10, o.y()) : o.y();
                censoredCells.computeIfAbsent(o.run(), k -> new ArrayList<>())
                        .add(o.outcome().name() + " " + o.side().symbol() + fmt(bound));
            }
        }
        List<RunStatus> out = new ArrayList<>();
        for (Run r : allRuns) {
            Integer i = usedIndex.get(r.runId());
            if (i == null) {
                out.add(new RunStatus(r.runId(), RunUse.EXCLUDED, why.getOrDefault(r.runId(), "not used")));
                continue;
            }
            String remark = preds != null && !preds[i].validity().valid()
                    ? "used although outside the model at the fitted parameters: " + preds[i].validity().reason() : "";
            List<String> cells = censoredCells.get(i);
            if (cells != null) {
                String c2 = String.join(", ", cells) + ", used through the Tobit likelihood";
                out.add(new RunStatus(r.runId(), RunUse.CENSORED, remark.isEmpty() ? c2 : c2 + "; " + remark));
            } else {
                out.add(new RunStatus(r.runId(), RunUse.USED, remark));
            }
        }
        return out;
    }

    /** Estimates held at defaults, with shared parameters at the value another model fitted. */
    List<Estimate> withShared(List<Estimate> held) {
        List<Estimate> out = new ArrayList<>();
        for (Estimate e : held) {
            out.add(shared.containsKey(e.name()) ? new Estimate(e.name(), e.unit(), shared.get(e.name()), Double.NaN,
                    Double.NaN, true, sharedReason.get(e.name()), e.source()) : e);
        }
        return out;
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
        long held = est.stream().filter(e -> e.held() && !isDiscrete(e.name()) && !shared.containsKey(e.name()))
                .count();
        long sharedHeld = est.stream().filter(e -> shared.containsKey(e.name())).count();
        if (sharedHeld > 0) {
            out.add(sharedHeld + " parameter" + (sharedHeld == 1 ? "" : "s")
                    + " taken from an earlier model of the chain (same meaning)");
        }
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
