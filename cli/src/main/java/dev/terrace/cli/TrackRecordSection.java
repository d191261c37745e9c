package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.journal.Journal;
import dev.terrace.core.journal.JournalProposal;
import dev.terrace.core.journal.TrackRecord;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

/** The track-record section of {@code terrace check}: grown proposals, predicted against measured. */
final class TrackRecordSection {

    private TrackRecordSection() {
    }

    /**
     * Reads the campaign's journal, prints the track record and returns it.
     *
     * @param lc  the campaign
     * @param out where to print
     * @return the journal and the track record
     */
    static Result print(LoadedCampaign lc, PrintWriter out) throws Exception {
        Journal journal = Journal.read(lc.campaign().journal(), lc.campaign().id());
        TrackRecord tr = TrackRecord.of(lc, journal);
        out.println();
        if (tr.grown().isEmpty()) {
            out.println("Track record: no grown proposal yet (no run's proposal column names a batch in "
                    + journal.file().getFileName() + ")");
            return new Result(journal, tr);
        }
        out.println("Track record (runs that followed a proposal in " + journal.file().getFileName() + "):");
        for (TrackRecord.Grown g : tr.grown()) {
            out.println("  " + g.runId() + "  " + g.proposalId() + " (rank " + g.rank() + ", " + g.proposedAt()
                    + ")  predicted yield " + String.format(Locale.ROOT, "%.2f", g.yield()) + "  met spec: "
                    + (g.metSpec() == null ? "unknown (a targeted outcome was not measured)"
                    : g.metSpec() ? "yes" : g.ok() ? "no" : "no (the run failed)"));
            for (TrackRecord.OutcomeCheck o : g.outcomes()) {
                out.println("      " + Format.pad(o.outcome(), 14) + Format.pad(predicted(o), 36) + "measured "
                        + (o.measured() == null ? "-" : shown(o)) + verdict(o));
            }
        }
        var judged = tr.judged();
        if (judged.isEmpty()) {
            out.println("  no grown proposal has a verdict yet (measure the targeted outcomes)");
        } else {
            double p = tr.meanPredictedYield();
            long met = judged.stream().filter(TrackRecord.Grown::metSpec).count();
            out.println(String.format(Locale.ROOT, "  over %d grown proposal%s with a verdict: mean predicted yield"
                            + " %.2f, met spec %d of %d (%.2f); with so few the fraction is uncertain by about"
                            + " +/- %.2f (binomial sd, sqrt(p(1-p)/n) at p = the mean predicted yield)",
                    judged.size(), judged.size() == 1 ? "" : "s", p, met, judged.size(), tr.fractionMet(),
                    Math.sqrt(p * (1 - p) / judged.size())));
        }
        return new Result(journal, tr);
    }

    /** What {@link #print} read and computed. */
    record Result(Journal journal, TrackRecord trackRecord) {
    }

    private static String predicted(TrackRecord.OutcomeCheck o) {
        if (o.predicted() != null) {
            JournalProposal.Predicted p = o.predicted();
            return "predicted " + Format.num(p.mean()) + " (90 % " + Format.num(p.lo90()) + " to "
                    + Format.num(p.hi90()) + ")";
        }
        if (o.classes() != null && !o.classes().isEmpty()) {
            Map.Entry<String, Double> best = o.classes().entrySet().stream().max(Map.Entry.comparingByValue())
                    .orElseThrow();
            return "predicted " + best.getKey() + String.format(Locale.ROOT, " (p %.2f)", best.getValue());
        }
        return "no prediction";
    }

    private static String shown(TrackRecord.OutcomeCheck o) {
        return Double.isNaN(o.value()) ? o.measured() : Format.num(o.value());
    }

    private static String verdict(TrackRecord.OutcomeCheck o) {
        String target = o.met() == null ? "" : o.met() ? "in target" : "missed target";
        Boolean in = o.inInterval();
        String interval = in == null ? "" : in ? "inside the 90 % interval" : "outside the 90 % interval";
        String both = java.util.stream.Stream.of(target, interval).filter(s -> !s.isEmpty())
                .collect(Collectors.joining(", "));
        return both.isEmpty() ? "" : "  " + both;
    }
}
