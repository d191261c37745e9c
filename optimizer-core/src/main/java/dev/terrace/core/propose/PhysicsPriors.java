package dev.terrace.core.propose;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.model.ModelChain;
import dev.terrace.core.surrogate.ClassModel;

import java.util.Map;

/**
 * The growth models' predictions as the surrogates' priors: a numeric outcome's value on its
 * fitting scale, and a class outcome's probabilities in the outcome's class order. Shared by
 * {@link CampaignSurrogate} and validation, so both read the physics the same way.
 *
 * @since 0.3
 */
public final class PhysicsPriors {

    private PhysicsPriors() {
    }

    /**
     * The growth models' prediction of a numeric outcome on its fitting scale (log10 for log
     * outcomes), in the outcome's unit.
     *
     * @param c the campaign
     * @param o a numeric outcome
     * @param r the model chain's predictions at a recipe
     * @return the value, or NaN when no model predicts it validly
     */
    public static double priorValue(Campaign c, OutcomeSpec o, ModelChain.Result r) {
        if (o.role() == null) {
            return Double.NaN;
        }
        Double v = r.values().get(o.role());
        if (v == null) {
            return Double.NaN;
        }
        double inUnit = o.unit().fromCanonical(v, c.surface().monolayerHeightNm());
        if (!Double.isFinite(inUnit) || (o.scale() == Scale.LOG && inUnit <= 0)) {
            return Double.NaN;
        }
        return o.scale() == Scale.LOG ? Math.log10(inUnit) : inUnit;
    }

    /** Class probabilities from the physics in the campaign's class order, or null (uniform). */
    static double[] classPrior(OutcomeSpec o, ModelChain.Result r) {
        double[] p = physicsClassProbabilities(o, r);
        return p == null ? uniform(o.classes().size()) : p;
    }

    /**
     * The growth models' probabilities of a class outcome's classes, in the outcome's class order,
     * each floored at {@link ClassModel#PROBABILITY_FLOOR} (a missing or non-finite value counts as
     * 0 before the floor) and renormalised.
     *
     * @param o a class outcome
     * @param r the model chain's predictions at a recipe
     * @return the probabilities, or null when no model predicts the outcome's role
     */
    public static double[] physicsClassProbabilities(OutcomeSpec o, ModelChain.Result r) {
        if (o.role() == null) {
            return null;
        }
        Map<String, Double> m = r.probabilities().get(o.role());
        if (m == null) {
            return null;
        }
        double[] p = new double[o.classes().size()];
        double sum = 0;
        for (int k = 0; k < p.length; k++) {
            Double v = m.get(o.classes().get(k));
            p[k] = Math.max(v == null || !Double.isFinite(v) ? 0 : v, ClassModel.PROBABILITY_FLOOR);
            sum += p[k];
        }
        for (int k = 0; k < p.length; k++) {
            p[k] /= sum;
        }
        return p;
    }

    static double[] uniform(int k) {
        double[] p = new double[k];
        java.util.Arrays.fill(p, 1.0 / k);
        return p;
    }
}
