package dev.terrace.core.propose;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.propose.Proposer.Reference;

import java.util.Locale;

/**
 * The reason line of a proposal in a campaign with a {@code maximize}/{@code minimize} target, in
 * plain words: what predicted yield the recipe gives up, for how much of the objective, against the
 * highest-yield recipe the search found. Example: "trades predicted yield 0.62 to 0.48 for 18 %
 * lower dot_diameter than the highest-yield recipe found (P-1a2b3c4d)".
 */
final class ObjectiveTrade {

    /** Yields closer than this count as equal (they are shown to two decimals). */
    static final double SAME_YIELD = 0.005;
    /** Relative objective changes below this many percent count as "about the same" (shown as whole percent). */
    static final double SAME_PERCENT = 0.5;

    private ObjectiveTrade() {
    }

    /**
     * @param c         the campaign (it has an objective)
     * @param ref       the highest-yield recipe found
     * @param id        the proposal's id
     * @param yield     the proposal's predicted yield
     * @param objective the proposal's predicted objective (mean, or median for a log outcome)
     * @return the head of the reason line; never null
     */
    static String reason(Campaign c, Reference ref, String id, double yield, double objective) {
        Target t = c.targets().stream().filter(Target::isObjective).findFirst().orElseThrow();
        OutcomeSpec o = c.outcome(t.outcome()).orElseThrow();
        String unit = o.unit() == null ? "" : " " + o.unit().symbol();
        if (id.equals(ref.id())) {
            return String.format(Locale.ROOT, "highest predicted yield found (%.2f), with predicted %s %s%s",
                    yield, o.name(), Proposer.num(objective), unit);
        }
        String against = "the highest-yield recipe found (" + ref.id() + ")";
        if (!Double.isFinite(objective) || !Double.isFinite(ref.objective())) {
            return String.format(Locale.ROOT, "predicted yield %.2f against %.2f for %s; no prediction of %s",
                    yield, ref.yield(), against, o.name());
        }
        double delta = objective - ref.objective();
        boolean better = t.goal() == Target.Goal.MINIMIZE ? delta < 0 : delta > 0;
        String change;
        double pct = ref.objective() != 0 ? 100 * Math.abs(delta) / Math.abs(ref.objective()) : Double.NaN;
        if (Double.isFinite(pct) && pct < SAME_PERCENT || delta == 0) {
            change = "about the same " + o.name() + " as " + against;
            better = false;
        } else if (Double.isFinite(pct)) {
            change = String.format(Locale.ROOT, "%.0f %% %s %s than %s", pct, delta < 0 ? "lower" : "higher", o.name(),
                    against);
        } else {
            change = String.format(Locale.ROOT, "%s %s by %s%s than %s", o.name(), delta < 0 ? "lower" : "higher",
                    Proposer.num(Math.abs(delta)), unit, against);
        }
        boolean lowerYield = yield < ref.yield() - SAME_YIELD;
        if (lowerYield && better) {
            return String.format(Locale.ROOT, "trades predicted yield %.2f to %.2f for %s", ref.yield(), yield, change);
        }
        if (lowerYield) {
            return String.format(Locale.ROOT, "predicted yield %.2f to %.2f with %s: explores where %s is uncertain",
                    ref.yield(), yield, change, o.name());
        }
        if (better) {
            return String.format(Locale.ROOT, "predicted yield %.2f, no less than %.2f, with %s", yield, ref.yield(),
                    change);
        }
        return String.format(Locale.ROOT, "predicted yield %.2f against %.2f, with %s", yield, ref.yield(), change);
    }
}
