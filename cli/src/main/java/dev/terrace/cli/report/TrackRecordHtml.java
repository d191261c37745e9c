package dev.terrace.cli.report;

import dev.terrace.core.journal.JournalProposal;
import dev.terrace.core.journal.TrackRecord;

import java.util.List;
import java.util.Map;

/**
 * The report's track-record section: each grown proposal, what was predicted when it was proposed
 * against what was measured, whether it met spec, and over all of them the mean predicted yield
 * against the fraction that met spec (the same content as {@code terrace check}'s track record).
 *
 * @since 0.4
 */
final class TrackRecordHtml {

    private TrackRecordHtml() {
    }

    static void render(Html h, ReportContent c) {
        HtmlReport.section(h, HtmlReport.H_TRACK, "break");
        HtmlReport.problem(h, c, ReportContent.TRACK_RECORD);
        ReportContent.TrackRecordPanel panel = c.trackRecord();
        if (panel == null) {
            HtmlReport.endSection(h);
            return;
        }
        TrackRecord tr = panel.record();
        if (tr.grown().isEmpty()) {
            h.el("p", null, "No grown proposal yet: no run's proposal column names a proposal in " + panel.journal()
                    + ". Write the proposal's id in that column when you grow it (terrace record --proposal does "
                    + "this), and this section will compare what was predicted with what was measured.").nl();
            HtmlReport.endSection(h);
            return;
        }
        h.el("p", null, "Runs that followed a proposal in " + panel.journal() + ": what was predicted when it was "
                + "proposed, against what was measured.").nl();
        h.open("table", "grid runs").open("thead", null).open("tr", null);
        for (String s : List.of("Run", "Proposal", "Rank", "Predicted yield", "Met spec")) {
            h.open("th", null, "scope", "col").text(s).close("th");
        }
        h.close("tr").close("thead").open("tbody", null).nl();
        for (TrackRecord.Grown g : tr.grown()) {
            h.open("tr", null).open("th", null, "scope", "row").text(g.runId()).close("th")
                    .open("td", null).el("code", null, g.proposalId()).close("td")
                    .el("td", "n", String.valueOf(g.rank())).el("td", "n", Html.percent(g.yield()))
                    .el("td", null, g.metSpec() == null ? "unknown (a targeted outcome was not measured)"
                            : g.metSpec() ? "\u2713\u00a0yes" : g.ok() ? "\u2717\u00a0no" : "\u2717\u00a0no (the run failed)")
                    .close("tr").nl();
        }
        h.close("tbody").close("table").nl();
        for (TrackRecord.Grown g : tr.grown()) {
            h.open("div", "proposal").open("h3", null).text(g.runId() + " \u2013 ").el("code", null, g.proposalId())
                    .close("h3").nl().open("ul", "predictions");
            for (TrackRecord.OutcomeCheck o : g.outcomes()) {
                h.open("li", null).el("code", null, o.outcome()).text(": " + predicted(o) + "; measured "
                        + (o.measured() == null ? "nothing" : Double.isNaN(o.value()) ? o.measured() : Html.num(o.value()))
                        + verdict(o)).close("li");
            }
            h.close("ul").close("div").nl();
        }
        var judged = tr.judged();
        if (judged.isEmpty()) {
            h.el("p", "note", "No grown proposal has a verdict yet: measure the targeted outcomes.").nl();
        } else {
            double p = tr.meanPredictedYield();
            long met = judged.stream().filter(TrackRecord.Grown::metSpec).count();
            h.el("p", null, "Over " + judged.size() + " grown proposal" + (judged.size() == 1 ? "" : "s")
                    + " with a verdict: mean predicted yield " + Html.percent(p) + ", met spec " + met + " of "
                    + judged.size() + " (" + Html.percent(tr.fractionMet()) + "). With so few the fraction is "
                    + "uncertain by about \u00b1" + Html.percent(Math.sqrt(p * (1 - p) / judged.size()))
                    + " (binomial standard deviation, \u221a(p(1\u2212p)/n) at p = the mean predicted yield).").nl();
        }
        HtmlReport.figures(h, panel.figures(), "single");
        HtmlReport.endSection(h);
    }

    private static String predicted(TrackRecord.OutcomeCheck o) {
        if (o.predicted() != null) {
            JournalProposal.Predicted p = o.predicted();
            return "predicted " + Html.num(p.mean()) + " (90 % interval " + Html.num(p.lo90()) + " to "
                    + Html.num(p.hi90()) + ")";
        }
        if (o.classes() != null && !o.classes().isEmpty()) {
            Map.Entry<String, Double> best = o.classes().entrySet().stream().max(Map.Entry.comparingByValue())
                    .orElseThrow();
            return "predicted " + best.getKey() + " (" + Html.percent(best.getValue()) + ")";
        }
        return "no prediction";
    }

    private static String verdict(TrackRecord.OutcomeCheck o) {
        String target = o.met() == null ? "" : o.met() ? "in target" : "missed target";
        Boolean in = o.inInterval();
        String interval = in == null ? "" : in ? "inside the 90 % interval" : "outside the 90 % interval";
        String both = java.util.stream.Stream.of(target, interval).filter(s -> !s.isEmpty())
                .collect(java.util.stream.Collectors.joining(", "));
        return both.isEmpty() ? "" : " \u2013 " + both;
    }
}
