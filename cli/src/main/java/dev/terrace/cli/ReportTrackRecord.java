package dev.terrace.cli;

import dev.terrace.cli.plot.Plots;
import dev.terrace.cli.report.Figure;
import dev.terrace.cli.report.ReportContent;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.journal.Journal;
import dev.terrace.core.journal.TrackRecord;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The report's track record: the campaign's journal read as {@code terrace check} reads it, and a
 * plot per numeric outcome of what was predicted (mean and 90 % interval) against what was measured.
 *
 * @since 0.4
 */
final class ReportTrackRecord {

    private ReportTrackRecord() {
    }

    /**
     * @param lc       the campaign
     * @param problems where a plot that cannot be drawn is explained
     * @return the panel; never null
     * @throws IllegalStateException when the journal cannot be read (the part is then left out with the reason)
     */
    static ReportContent.TrackRecordPanel panel(LoadedCampaign lc, Map<String, String> problems) {
        Journal journal;
        try {
            journal = Journal.read(lc.campaign().journal(), lc.campaign().id());
        } catch (dev.terrace.core.InputException e) {
            throw new IllegalStateException("the proposal journal cannot be read: " + e.diagnostics().get(0), e);
        } catch (java.io.IOException e) {
            throw new IllegalStateException("the proposal journal cannot be read: " + e.getMessage(), e);
        }
        TrackRecord tr = TrackRecord.of(lc, journal);
        List<Figure> figs = new ArrayList<>();
        if (!tr.grown().isEmpty()) {
            for (OutcomeSpec o : lc.campaign().outcomes()) {
                if (o.isClass()) {
                    continue;
                }
                Figure f = figure(lc, tr, o, problems);
                if (f != null) {
                    figs.add(f);
                }
            }
        }
        return new ReportContent.TrackRecordPanel(String.valueOf(journal.file().getFileName()), tr, figs);
    }

    private static Figure figure(LoadedCampaign lc, TrackRecord tr, OutcomeSpec o, Map<String, String> problems) {
        int n = tr.grown().size();
        String[] labels = new String[n];
        double[] mean = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        double[] measured = new double[n];
        boolean any = false;
        for (int k = 0; k < n; k++) {
            TrackRecord.Grown g = tr.grown().get(k);
            labels[k] = g.runId();
            TrackRecord.OutcomeCheck check = g.outcomes().stream().filter(c -> c.outcome().equals(o.name()))
                    .findFirst().orElse(null);
            boolean has = check != null && check.predicted() != null;
            mean[k] = has ? check.predicted().mean() : Double.NaN;
            lo[k] = has ? check.predicted().lo90() : Double.NaN;
            hi[k] = has ? check.predicted().hi90() : Double.NaN;
            measured[k] = check == null ? Double.NaN : check.value();
            any |= has;
        }
        if (!any) {
            return null;
        }
        double tMin = Double.NaN;
        double tMax = Double.NaN;
        for (Target t : lc.campaign().targets()) {
            if (t.outcome().equals(o.name()) && t.hasWindow()) {
                tMin = t.min();
                tMax = t.max();
            }
        }
        String quantity = o.name() + " (" + ReportCommand.chartUnit(o.unit().symbol()) + ")";
        boolean log = o.scale() == Scale.LOG;
        try {
            return Figure.of("track-" + ReportCommand.key(o.name()), "Each grown proposal's " + o.name()
                    + ": the mean (dot) and 90 % interval predicted when it was proposed, the value measured"
                    + " (open marker) and the target band (grey).", Plots.toSvg(Plots.trackRecord(quantity, log,
                    labels, mean, lo, hi, measured, tMin, tMax), ReportCommand.FIGURE_WIDTH, ReportCommand.FIGURE_HEIGHT));
        } catch (RuntimeException e) {
            problems.merge(ReportContent.TRACK_RECORD, "The track-record plot of " + o.name() + " was left out: "
                    + e.getMessage(), (a, b) -> a + " " + b);
            return null;
        }
    }
}
