package dev.terrace.core.journal;

import dev.terrace.core.CheckSummary;
import dev.terrace.core.Diagnostic;
import dev.terrace.core.DidYouMean;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.runlog.Censored;
import dev.terrace.core.runlog.Run;

import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;

/**
 * How the proposals that were grown came out: for each run whose {@code proposal} column names a
 * journal batch, what was predicted against what was measured, and over all of them the mean
 * predicted yield against the fraction that met spec. A well-calibrated yield makes the two
 * agree within the sampling error of a fraction, about sqrt(p(1-p)/n).
 *
 * @param grown    runs that followed a proposal found in the journal, in run-log order; never null
 * @param warnings run-log lines whose proposal id is not in the journal; never null
 * @since 0.2
 */
public record TrackRecord(List<Grown> grown, List<Diagnostic> warnings) {

    /** Copies the lists. */
    public TrackRecord {
        grown = List.copyOf(grown);
        warnings = List.copyOf(warnings);
    }

    /**
     * One outcome of a grown proposal: predicted against measured.
     *
     * @param outcome   the outcome name; never null
     * @param predicted the numeric prediction, or null for class outcomes or when none was made
     * @param classes   the class probabilities, or null for numeric outcomes; never both null and
     *                  {@code predicted} null unless nothing was predicted
     * @param measured  what the run log holds, as written ({@code <X} for a censored value), or null
     *                  when not measured
     * @param value     the measured number, NaN for classes, censored or missing values
     * @param met       whether the measurement met the outcome's target; null when the outcome has no
     *                  target or the measurement cannot tell
     */
    public record OutcomeCheck(String outcome, JournalProposal.Predicted predicted, Map<String, Double> classes,
                               String measured, double value, Boolean met) {
        /** Checks the invariants. */
        public OutcomeCheck {
            Objects.requireNonNull(outcome, "outcome");
            classes = classes == null ? null : Map.copyOf(classes);
        }

        /** @return whether the measured number lies in the 90 % interval, or null when that cannot be told */
        public Boolean inInterval() {
            return predicted == null || Double.isNaN(value) ? null : predicted.covers(value);
        }
    }

    /**
     * A run that followed a proposal.
     *
     * @param runId      the run; never null
     * @param line       its run-log line
     * @param proposalId the proposal; never null
     * @param proposedAt when the batch holding it was made; never null
     * @param rank       its rank in that batch
     * @param yield      the predicted yield
     * @param ok         whether the run's status is ok
     * @param outcomes   each campaign outcome, in campaign order; never null
     * @param metSpec    whether the run met every target (a failed run did not); null when a targeted
     *                   outcome was not measured and no other target was missed
     */
    public record Grown(String runId, int line, String proposalId, Instant proposedAt, int rank, double yield,
                        boolean ok, List<OutcomeCheck> outcomes, Boolean metSpec) {
        /** Checks the invariants and copies the list. */
        public Grown {
            Objects.requireNonNull(runId, "runId");
            Objects.requireNonNull(proposalId, "proposalId");
            Objects.requireNonNull(proposedAt, "proposedAt");
            outcomes = List.copyOf(outcomes);
        }
    }

    /** @return grown proposals whose spec verdict is known (met or missed) */
    public List<Grown> judged() {
        return grown.stream().filter(g -> g.metSpec() != null).toList();
    }

    /** @return the mean predicted yield of the judged proposals, NaN when there is none */
    public double meanPredictedYield() {
        return judged().stream().mapToDouble(Grown::yield).average().orElse(Double.NaN);
    }

    /** @return the fraction of judged proposals that met spec, NaN when there is none */
    public double fractionMet() {
        List<Grown> j = judged();
        return j.isEmpty() ? Double.NaN : j.stream().filter(Grown::metSpec).count() / (double) j.size();
    }

    /**
     * Matches the run log's {@code proposal} column against the journal.
     *
     * @param lc      the campaign; never null
     * @param journal its journal; never null
     * @return the track record; never null
     */
    public static TrackRecord of(LoadedCampaign lc, Journal journal) {
        Objects.requireNonNull(lc, "lc");
        Objects.requireNonNull(journal, "journal");
        Campaign c = lc.campaign();
        Set<String> known = new LinkedHashSet<>();
        journal.entries().forEach(e -> e.proposals().forEach(p -> known.add(p.id())));
        List<Grown> grown = new ArrayList<>();
        List<Diagnostic> warnings = new ArrayList<>();
        for (Run r : lc.runLog().runs()) {
            if (r.proposal() == null || r.proposal().isBlank()) {
                continue;
            }
            Optional<Journal.Found> f = journal.find(r.proposal(), date(r.date()));
            if (f.isEmpty()) {
                String hint = DidYouMean.suggest(r.proposal(), known).map(h -> "; did you mean " + h + "?")
                        .orElse(known.isEmpty() ? "; the journal holds no batch yet" : "");
                warnings.add(Diagnostic.warning(lc.runLog().file(), r.line(), 0, "run " + r.runId()
                        + " names proposal " + r.proposal() + ", which is not in the proposal journal "
                        + journal.file() + " (proposed with --no-journal, for another campaign, or mistyped?)"
                        + hint + "; the run is kept but left out of the track record"));
                continue;
            }
            grown.add(grown(c, r, f.get()));
        }
        return new TrackRecord(grown, warnings);
    }

    private static Grown grown(Campaign c, Run r, Journal.Found f) {
        List<OutcomeCheck> checks = new ArrayList<>();
        for (OutcomeSpec o : c.outcomes()) {
            Optional<Target> t = c.target(o.name());
            if (o.isClass()) {
                String m = r.category(o.name()).orElse(null);
                Boolean met = t.isPresent() && m != null && r.ok() ? (Boolean) t.get().accepts(m) : null;
                checks.add(new OutcomeCheck(o.name(), null, f.proposal().classes().get(o.name()), m, Double.NaN, met));
                continue;
            }
            JournalProposal.Predicted p = f.proposal().predicted().get(o.name());
            var v = r.number(o.name());
            Optional<Censored> cens = r.censored(o.name());
            String shown = v.isPresent() ? format(v.getAsDouble()) : cens.map(x -> x.side().symbol() + format(x.bound()))
                    .orElse(null);
            Boolean met = null;
            if (t.isPresent() && t.get().hasWindow() && r.ok()) {
                met = v.isPresent() ? (Boolean) t.get().accepts(v.getAsDouble())
                        : cens.map(x -> missed(t.get(), x) ? Boolean.FALSE : null).orElse(null);
            }
            checks.add(new OutcomeCheck(o.name(), p, null, shown, v.isPresent() ? v.getAsDouble() : Double.NaN, met));
        }
        return new Grown(r.runId(), r.line(), f.proposal().id(), f.entry().time(), f.proposal().rank(),
                f.proposal().yield(), r.ok(), checks, metSpec(c, r, checks));
    }

    /** Every target met: true; any missed (or the run failed): false; otherwise unknown. */
    private static Boolean metSpec(Campaign c, Run r, List<OutcomeCheck> checks) {
        if (!r.ok()) {
            return false;
        }
        if (c.targets().isEmpty()) {
            return null;
        }
        boolean unknown = false;
        for (Target t : c.targets()) {
            if (!t.isClassTarget() && !t.hasWindow()) {
                continue; // a pure maximise/minimise goal has no pass mark
            }
            Boolean m = checks.stream().filter(k -> k.outcome().equals(t.outcome())).findFirst()
                    .map(OutcomeCheck::met).orElse(CheckSummary.meets(t, r));
            if (m == null) {
                unknown = true;
            } else if (!m) {
                return false;
            }
        }
        return unknown ? null : true;
    }

    /** Whether a censored value misses a window for certain. */
    static boolean missed(Target t, Censored x) {
        if (x.side() == Censored.Side.BELOW) {
            return !Double.isNaN(t.min()) && x.bound() <= t.min();
        }
        return !Double.isNaN(t.max()) && x.bound() >= t.max();
    }

    private static LocalDate date(String text) {
        if (text == null || text.length() < 10) {
            return null;
        }
        try {
            return LocalDate.parse(text.substring(0, 10));
        } catch (DateTimeParseException e) {
            return null;
        }
    }

    private static String format(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? String.valueOf((long) v) : String.valueOf(v);
    }
}
