package dev.terrace.core.validate;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import org.apache.commons.math3.util.CombinatoricsUtils;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * The plain-words verdict of a {@link Validation}, and its number formatting: the proposal
 * surrogate's line per outcome (coverage counts read with a one-sided exact binomial test, and
 * whether it beats the trivial predictor), then the comparisons (best surrogate, the physics prior,
 * the growth models alone, predictive densities).
 *
 * @since 0.1
 */
final class ValidationVerdict {

    private ValidationVerdict() {
    }


    /**
     * The verdict on the proposal surrogate for one outcome: whether it beats the trivial predictor
     * and, for numeric outcomes, its 90 % coverage with counts and the one-sided binomial reading
     * ({@link Validation#coverageReading}).
     *
     * @param o  the outcome
     * @param ov its scores
     * @return the line; empty when the proposal surrogate could not predict the outcome
     */
    static String proposalVerdict(OutcomeSpec o, OutcomeValidation ov) {
        Optional<Score> ps = ov.score(Validation.PROPOSAL);
        Optional<Score> ms = ov.score(Validation.MEAN);
        if (ps.isEmpty() || ms.isEmpty()) {
            return ps.isEmpty() ? Validation.PROPOSAL_LABEL + " (" + Validation.PROPOSAL + "): could not predict " + o.name()
                    + " in any fold; see the fold failures" : "";
        }
        Score p = ps.get();
        Score m = ms.get();
        boolean cls = o.isClass();
        String metric = cls ? "log loss" : "RMSE";
        String unit = cls ? " nats" : o.scale() == Scale.LOG ? " log10" : (o.unit().symbol().isEmpty() ? ""
                : " " + o.unit().symbol());
        boolean beats = error(p) < Validation.NO_BETTER_THAN_MEAN * error(m);
        String base = cls ? "the class frequencies" : "the training mean";
        StringBuilder line = new StringBuilder(Validation.PROPOSAL_LABEL + " (" + Validation.PROPOSAL + ", as terrace propose builds it)"
                + " on " + o.name() + ": ");
        if (cls) {
            line.append("most likely class right for ").append(p.hits()).append(" of ").append(p.n())
                    .append(" held-out runs; ");
        } else {
            line.append(coverageReading(p)).append("; ");
        }
        line.append(beats ? "beats " + base : "does not beat " + base).append(" (").append(metric).append(' ')
                .append(fmt(error(p))).append(" vs ").append(fmt(error(m))).append(unit).append(')');
        return line.toString();
    }

    /**
     * "90 % intervals cover k of n held-out runs", with the one-sided binomial reading of k: under
     * honest intervals k ~ Binomial(n, 0.9); a tail probability below {@link Validation#COVERAGE_TAIL} is
     * called implausibly low or high for n.
     */
    static String coverageReading(Score s) {
        int k = s.hits();
        int n = s.n();
        String line = "90 % intervals cover " + k + " of " + n + " held-out run" + (n == 1 ? "" : "s");
        double low = binomialCdf(k, n, 0.9);
        double high = k > 0 ? 1 - binomialCdf(k - 1, n, 0.9) : 1;
        if (low < Validation.COVERAGE_TAIL) {
            line += " (implausibly low for " + n + " runs: one-sided binomial P(X <= " + k + ") = " + fmt(low)
                    + " < " + fmt(Validation.COVERAGE_TAIL) + "; about " + Math.round(0.9 * n) + " expected, intervals too narrow)";
        } else if (high < Validation.COVERAGE_TAIL) {
            line += " (implausibly high for " + n + " runs: one-sided binomial P(X >= " + k + ") = " + fmt(high)
                    + " < " + fmt(Validation.COVERAGE_TAIL) + "; about " + Math.round(0.9 * n) + " expected, intervals too wide)";
        } else {
            line += " (plausible for " + n + " runs by a one-sided binomial check)";
        }
        return line;
    }

    /** The surrogate with the lowest RMSE (numeric) or log loss (classes); the first in report order on a tie. */
    static Optional<String> best(OutcomeValidation ov) {
        String best = null;
        double bestV = Double.POSITIVE_INFINITY;
        for (String s : Validation.SURROGATES) {
            Optional<Score> sc = ov.score(s);
            if (sc.isEmpty()) {
                continue;
            }
            double v = error(sc.get());
            if (v < bestV) {
                bestV = v;
                best = s;
            }
        }
        return Optional.ofNullable(best);
    }

    private static double error(Score s) {
        return s.forClasses() ? s.logLoss() : s.rmse();
    }

    static List<String> verdict(Campaign c, OutcomeSpec o, OutcomeValidation ov, boolean hasModels,
                                boolean physicsCovers, int heldOut) {
        List<String> out = new ArrayList<>();
        String name = o.name();
        Optional<String> bestKey = best(ov);
        if (bestKey.isEmpty()) {
            out.add("no surrogate could predict " + name);
            return out;
        }
        String b = bestKey.get();
        Score best = ov.score(b).orElseThrow();
        Score mean = ov.score(Validation.MEAN).orElseThrow();
        boolean cls = o.isClass();
        String metric = cls ? "log loss" : "RMSE";
        String unit = cls ? " nats" : o.scale() == Scale.LOG ? " log10" : (o.unit().symbol().isEmpty() ? ""
                : " " + o.unit().symbol());
        if (cls) {
            out.add(b + " predicts " + name + " best: log loss " + fmt(best.logLoss()) + " nats, most likely class"
                    + " right for " + best.hits() + " of " + best.n() + " held-out runs");
        } else {
            out.add(b + " predicts " + name + " best: RMSE " + fmt(best.rmse()) + unit
                    + (o.scale() == Scale.LOG ? " (a factor of " + fmt(Math.pow(10, best.rmse())) + ")" : "")
                    + ", MSLL " + signed(best.msll()) + " over " + best.n() + " held-out runs");
        }
        // against the trivial predictor
        String what = (cls ? "the log loss on " : "the error on ") + name;
        if (error(best) >= Validation.NO_BETTER_THAN_MEAN * error(mean)) {
            out.add(name + " is predicted no better than " + (cls ? "from the class frequencies of the other runs"
                    : "its mean") + " (" + metric + " " + fmt(error(best)) + " vs " + fmt(error(mean)) + unit
                    + " for the " + (cls ? "frequencies" : "training mean") + ")");
        } else {
            out.add("compared with " + (cls ? "the class frequencies of the other runs" : "the training mean") + ", "
                    + b + " " + reduction(error(mean) / error(best), what) + " (" + metric + " " + fmt(error(best))
                    + " vs " + fmt(error(mean)) + unit + ")");
        }
        // the physics prior
        Optional<Score> gp = ov.score(Validation.GP);
        Optional<Score> pg = ov.score(Validation.PHYSICS_GP);
        if (hasModels && physicsCovers && gp.isPresent() && pg.isPresent()) {
            double r = error(gp.get()) / error(pg.get());
            String nums = " (" + metric + " " + fmt(error(pg.get())) + " vs " + fmt(error(gp.get())) + unit + ")";
            if (r >= Validation.CLEAR_RATIO) {
                out.add("the physics prior " + reduction(r, what) + nums);
            } else if (r <= 1 / Validation.CLEAR_RATIO) {
                out.add("the physics prior raises " + what + " by " + Math.round(100 * (1 / r - 1)) + " %" + nums
                        + "; check the growth models against these runs");
            } else {
                out.add("the physics prior makes little difference to " + what + nums);
            }
        } else if (hasModels && !physicsCovers) {
            out.add("no growth model of the campaign predicts " + name + (o.role() == null ? " (it has no role)" : ""));
        }
        // the growth models alone
        Optional<Score> ph = ov.score(Validation.PHYSICS);
        if (ph.isPresent()) {
            if (ph.get().n() < heldOut) {
                out.add("the growth models predict " + name + " for only " + ph.get().n() + " of " + heldOut
                        + " held-out runs");
            }
            if (!b.equals(Validation.PHYSICS) && error(ph.get()) >= Validation.NO_BETTER_THAN_MEAN * error(mean)) {
                out.add("the growth models alone predict " + name + " no better than "
                        + (cls ? "the class frequencies" : "its mean") + " (" + metric + " "
                        + fmt(error(ph.get())) + " vs " + fmt(error(mean)) + unit + ")");
            }
        }
        if (!cls) {
            out.add(coverage(b, best));
            List<String> worse = new ArrayList<>();
            List<String> values = new ArrayList<>();
            for (String s : Validation.SURROGATES) {
                Optional<Score> sc = ov.score(s);
                if (sc.isPresent() && sc.get().msll() > 0) {
                    worse.add(s);
                    values.add(signed(sc.get().msll()));
                }
            }
            if (!worse.isEmpty()) {
                boolean one = worse.size() == 1;
                out.add("the predictive densities of " + String.join(" and ", worse) + " for " + name
                        + " score worse than a plain Gaussian around the training mean (MSLL "
                        + String.join(", ", values) + "): " + (one ? "its" : "their")
                        + " intervals are too narrow at some held-out runs");
            }
        }
        return out;
    }

    /** "90 % intervals of X cover k of n held-out runs", with a binomial reading of k. */
    static String coverage(String surrogate, Score s) {
        int k = s.hits();
        int n = s.n();
        String line = "90 % intervals of " + surrogate + " cover " + k + " of " + n + " held-out run"
                + (n == 1 ? "" : "s");
        if (binomialCdf(k, n, 0.9) < Validation.COVERAGE_TAIL) {
            line += " (too narrow: about " + Math.round(0.9 * n) + " expected)";
        } else if (k > 0 && 1 - binomialCdf(k - 1, n, 0.9) < Validation.COVERAGE_TAIL) {
            line += " (wider than needed: about " + Math.round(0.9 * n) + " expected)";
        }
        return line;
    }

    /** P(X &le; k) for X ~ Binomial(n, p), summed in logs. */
    static double binomialCdf(int k, int n, double p) {
        if (k < 0) {
            return 0;
        }
        if (k >= n) {
            return 1;
        }
        double sum = 0;
        for (int j = 0; j <= k; j++) {
            sum += Math.exp(CombinatoricsUtils.binomialCoefficientLog(n, j) + j * Math.log(p)
                    + (n - j) * Math.log1p(-p));
        }
        return Math.min(sum, 1);
    }

    /**
     * How a ratio old/new &gt; 1 of errors reads: "halves the error on x", "cuts the error on x by 30 %".
     *
     * @param ratio old error over new error
     * @param what  the error named, for example "the error on dot_density"
     * @return the phrase
     */
    static String reduction(double ratio, String what) {
        if (!Double.isFinite(ratio)) {
            return "removes " + what;
        }
        if (ratio >= 1.8 && ratio < 2.25) {
            return "halves " + what;
        }
        if (ratio >= 2.7 && ratio < 3.4) {
            return "cuts " + what + " to a third";
        }
        if (ratio >= 3.4) {
            return "cuts " + what + " by a factor of " + fmt(ratio);
        }
        return "cuts " + what + " by " + Math.round(100 * (1 - 1 / ratio)) + " %";
    }

    static String signed(double v) {
        return (v >= 0 ? "+" : "") + fmt(v);
    }

    /** @see dev.terrace.core.NumberText#short3 */
    static String fmt(double v) {
        return dev.terrace.core.NumberText.short3(v);
    }
}
