package dev.terrace.core.propose;

import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.surrogate.GaussianProcess;
import dev.terrace.core.surrogate.GpCensoring;
import dev.terrace.core.surrogate.GpForward;
import dev.terrace.core.surrogate.GpLeaveOneOut;
import dev.terrace.core.surrogate.GpSettings;

import java.util.ArrayList;
import java.util.List;

/**
 * One numeric outcome's GP in a {@link CampaignSurrogate}: fitted on the measured runs, updated with
 * the censored ones ({@link GpCensoring}) and scored by leave-one-out over the measured runs.
 *
 * @param gp        the GP with the censored runs' sites
 * @param loo       leave-one-out summary over the measured runs
 * @param forward   one-step-ahead errors of the measured runs in log order
 * @param censoring the censored update's counters
 * @param censored  censored runs offered to the update
 */
record OutcomeGp(GaussianProcess gp, GpLeaveOneOut loo, GpForward forward, GpCensoring.Result censoring, int censored) {

    static OutcomeGp fit(List<DesignPoint> x, double[] y, double[] prior, GpSettings gs, long seed,
                         List<GpCensoring.Observation> censored) {
        GaussianProcess measured = GaussianProcess.fit(x, y, prior, gs, seed);
        GpCensoring.Result cr = GpCensoring.update(measured, censored);
        return new OutcomeGp(cr.gp(), cr.gp().leaveOneOut(x.size()), measured.forward(x.size()), cr, censored.size());
    }

    List<String> notes(String outcome) {
        List<String> out = new ArrayList<>();
        if (censored > 0) {
            out.add(String.format(java.util.Locale.ROOT, "%s: %d censored value%s (<X or >X) used as bounds on the"
                            + " true value (expectation propagation)%s", outcome, censored, censored == 1 ? "" : "s",
                    censoring.converged() ? "" : "; the bounds conflict with each other or with measured runs,"
                            + " so the update stopped after " + censoring.sweeps() + " sweeps"));
        }
        double k = loo.sdFactor();
        double lambda = forward.latentFactor(k);
        if (lambda > k * (1 + 1e-3)) {
            out.add(String.format(java.util.Locale.ROOT, "%s: the logged runs came out further from what the runs"
                            + " before them predicted than the model's spread allowed (%d one-step-ahead errors), so its"
                            + " model spread is widened %.2f times", outcome, forward.scored(), lambda));
        }
        if (!loo.hasSkill()) {
            out.add(String.format(java.util.Locale.ROOT, "%s: no skill: leave-one-out predicts the %d measured values"
                            + " no better than their mean (Q2 %.2f); a new measurement is given at least the runs' own"
                            + " scatter, so its intervals and yield factor claim no skill", outcome, loo.runs(), loo.q2()));
        }
        return out;
    }
}
