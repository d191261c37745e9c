package dev.terrace.cli.report;

import dev.terrace.cli.report.ReportContent.ArrheniusPanel;
import dev.terrace.cli.report.ReportContent.ScoreRow;
import dev.terrace.cli.report.ReportContent.ScoreTable;
import dev.terrace.cli.report.ReportContent.ValidationPanel;
import dev.terrace.cli.report.ReportContent.WindowPanel;
import dev.terrace.core.Cautions;
import dev.terrace.core.CheckSummary;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.LinearLimit;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.fit.FitResults.Candidate;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.Excluded;
import dev.terrace.core.fit.FitResults.FitReport;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.FitResults.OutcomeFit;
import dev.terrace.core.propose.Proposals.NumericPrediction;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.Run;

import java.util.List;
import java.util.Map;

/**
 * Lays out a campaign report as one self-contained HTML page: inline CSS and inline SVG figures,
 * no scripts and nothing fetched from elsewhere, black on white and sized for A4 paper. Every piece
 * of text from the campaign, the run log or the models is escaped.
 *
 * @since 0.1
 */
public final class HtmlReport {

    /** Title of the campaign-and-targets section. */
    public static final String H_SUMMARY = "Campaign and targets";
    /** Title of the run-history section. */
    public static final String H_RUNS = "Runs so far";
    /** Title of the fitted-parameters section. */
    public static final String H_PARAMETERS = "Growth-model parameters";
    /** Title of the validation section. */
    public static final String H_VALIDATION = "How well the predictions hold up";
    /** Title of the Arrhenius section. */
    public static final String H_ARRHENIUS = "Density against temperature";
    /** Title of the window-map section. */
    public static final String H_WINDOWS = "Where the targets are met";
    /** Title of the proposals section. */
    public static final String H_PROPOSALS = "Proposed next runs";
    /**
     * What the distance to a proposal's nearest run measures (the scaled distance of
     * {@code DesignSpace.distance}), in words for the table and the report.
     */
    public static final String NEAREST_DISTANCE = "each numeric setting's box scaled to 0 to 1 (log settings on"
            + " their log axis), Euclidean over the settings, plus 1 for each different choice; 0 is the same recipe,"
            + " 1 a whole box width away";

    /** Title of the track-record section. */
    public static final String H_TRACK = "How past proposals came out";
    /** Title of the safety section. */
    public static final String H_SAFETY = "Safety";
    /** Title of the explanations section. */
    public static final String H_MEANING = "What the numbers mean";

    /** Every section title in page order. */
    public static final List<String> SECTIONS = List.of(H_SUMMARY, H_RUNS, H_PARAMETERS, H_VALIDATION, H_ARRHENIUS,
            H_WINDOWS, H_TRACK, H_PROPOSALS, H_SAFETY, H_MEANING);

    private static final String MET = "\u2713\u00a0met";
    private static final String MISSED = "\u2717\u00a0missed";
    private static final String UNMEASURED = "\u2013\u00a0not measured";

    private HtmlReport() {
    }

    /**
     * Renders a report.
     *
     * @param c everything the report shows
     * @return the HTML page; never null
     */
    public static String render(ReportContent c) {
        Campaign camp = c.loaded().campaign();
        String title = camp.title().isBlank() ? "Campaign " + camp.id() : camp.title();
        Html h = Html.create();
        h.raw("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .raw("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .raw("<meta name=\"generator\" content=\"").text(c.generator()).raw("\">\n")
                .el("title", null, title + " \u2013 campaign report").nl()
                .raw("<style>\n").raw(Style.CSS).raw("</style>\n</head>\n<body>\n");
        header(h, c, title);
        contents(h);
        summary(h, c);
        runs(h, c.loaded());
        parameters(h, c);
        validation(h, c);
        arrhenius(h, c);
        windows(h, c);
        TrackRecordHtml.render(h, c);
        proposals(h, c);
        safety(h, camp);
        meaning(h, c);
        h.open("footer", null).open("p", "small")
                .text("Made by " + c.generator() + " on " + c.date() + " with seed " + c.seed()
                        + ". The same files and seed give the same numbers. The run log was read, not changed.")
                .close("p").close("footer").nl();
        h.raw("</body>\n</html>\n");
        return h.toString();
    }

    // ------------------------------------------------------------------ header

    private static void header(Html h, ReportContent c, String title) {
        Campaign camp = c.loaded().campaign();
        h.open("header", null).el("h1", null, title).nl();
        h.open("p", "meta").text("Campaign ").el("code", null, camp.id()).text(" \u00b7 run log ")
                .el("code", null, String.valueOf(camp.runs().getFileName())).text(" \u00b7 "
                        + c.loaded().runLog().runs().size() + " runs \u00b7 report of " + c.date())
                .close("p").nl();
        h.el("p", "note", "Data as given in the run log; the predictions below are the models' estimates, "
                + "not measurements.").nl();
        h.close("header").nl();
    }

    private static void contents(Html h) {
        h.open("nav", null, "aria-label", "Contents").open("ol", "toc");
        for (String s : SECTIONS) {
            h.open("li", null).open("a", null, "href", "#" + anchor(s)).text(s).close("a").close("li");
        }
        h.close("ol").close("nav").nl();
    }

    /**
     * @param heading a section title
     * @return the id of its section in the page (lower case, words joined by '-')
     */
    public static String anchor(String heading) {
        return heading.toLowerCase(java.util.Locale.ROOT).replaceAll("[^a-z0-9]+", "-").replaceAll("(^-|-$)", "");
    }

    static void section(Html h, String heading, String cssClass) {
        h.open("section", cssClass, "id", anchor(heading)).nl().el("h2", null, heading).nl();
    }

    static void endSection(Html h) {
        h.close("section").nl();
    }

    static void problem(Html h, ReportContent c, String key) {
        String p = c.problems().get(key);
        if (p != null && !p.isBlank()) {
            h.el("p", "note", p).nl();
        }
    }

    // ------------------------------------------------------------------ summary

    private static void summary(Html h, ReportContent c) {
        LoadedCampaign lc = c.loaded();
        Campaign camp = lc.campaign();
        CheckSummary s = CheckSummary.of(lc);
        section(h, H_SUMMARY, null);
        h.open("table", "facts").open("tbody", null);
        fact(h, "Material", camp.material().substrate()
                + (camp.material().deposit() == null ? "" : ", deposit " + camp.material().deposit())
                + (camp.surface().groupV() == null ? "" : ", group V " + camp.surface().groupV()));
        h.open("tr", null).el("th", null, "Surface").open("td", null)
                .text("1 ML = " + Html.num(camp.surface().monolayerHeightNm()) + " nm, ")
                .number(Html.num(camp.surface().sitesPerCm2())).text(" sites/cm\u00b2").close("td").close("tr");
        fact(h, "Growth models", camp.models().isEmpty() ? "none (data only)" : String.join(", ", camp.models()));
        fact(h, "Runs", s.runs() + " (" + s.ok() + " ok, " + s.failed() + " failed)");
        fact(h, "Runs meeting every target", s.runsMeetingAll().isEmpty() ? "none yet"
                : s.runsMeetingAll().size() + ": " + String.join(", ", s.runsMeetingAll()));
        h.close("tbody").close("table").nl();
        if (!lc.warnings().isEmpty()) {
            h.el("p", null, "Warnings from reading the campaign and its run log:").nl().open("ul", "warnings");
            for (var d : lc.warnings()) {
                h.el("li", null, d.toString());
            }
            h.close("ul").nl();
        }

        h.el("h3", null, "Settings").nl();
        h.open("table", "grid").headRow("Setting", "Unit or choices", "Box", "Scale", "Role", "Range in the log");
        h.open("tbody", null);
        for (ParameterSpec p : camp.parameters()) {
            CheckSummary.ColumnSummary col = column(s, p.name());
            h.open("tr", null).open("td", null).el("code", null, p.name()).close("td");
            if (p.isCategorical()) {
                h.el("td", null, String.join(", ", p.choices())).el("td", null, "").el("td", null, "");
            } else {
                h.open("td", null).unit(p.unit().symbol()).close("td");
                h.open("td", "n").number(Html.setting(p.min())).text(" to ").number(Html.setting(p.max())).close("td");
                h.el("td", null, p.scale() == Scale.LOG ? "log" : "linear");
            }
            h.el("td", null, p.role() == null ? "" : p.role().key());
            rangeCell(h, col);
            h.close("tr").nl();
        }
        h.close("tbody").close("table").nl();

        h.el("h3", null, "Outcomes and targets").nl();
        h.open("table", "grid").headRow("Outcome", "Unit or classes", "Role", "Target", "Met so far");
        h.open("tbody", null);
        for (OutcomeSpec o : camp.outcomes()) {
            h.open("tr", null).open("td", null).el("code", null, o.name()).close("td");
            if (o.isClass()) {
                h.el("td", null, String.join(", ", o.classes()));
            } else {
                h.open("td", null).unit(o.unit().symbol()).text(o.scale() == Scale.LOG ? " (log scale)" : "").close("td");
            }
            h.el("td", null, o.role() == null ? "" : o.role().key());
            Target t = camp.target(o.name()).orElse(null);
            h.open("td", null);
            if (t == null) {
                h.text("none");
            } else {
                describe(h, t, camp);
            }
            h.close("td");
            CheckSummary.TargetSummary ts = t == null ? null
                    : s.targets().stream().filter(x -> x.target().equals(t)).findFirst().orElse(null);
            h.el("td", "n", ts == null ? "" : ts.met() + " of " + ts.measured() + " measured");
            h.close("tr").nl();
        }
        h.close("tbody").close("table").nl();
        if (!camp.limits().isEmpty()) {
            h.el("h3", null, "Limits every recipe must keep").nl().open("ul", null);
            for (LinearLimit l : camp.limits()) {
                h.open("li", null).el("code", null, l.text()).close("li");
            }
            h.close("ul").nl();
        }
        endSection(h);
    }

    private static void fact(Html h, String name, String value) {
        h.open("tr", null).el("th", null, name).el("td", null, value).close("tr");
    }

    private static CheckSummary.ColumnSummary column(CheckSummary s, String name) {
        return s.columns().stream().filter(x -> x.name().equals(name)).findFirst().orElse(null);
    }

    private static void rangeCell(Html h, CheckSummary.ColumnSummary col) {
        h.open("td", null);
        if (col == null || col.count() == 0) {
            h.text("not recorded");
        } else if (!col.counts().isEmpty()) {
            StringBuilder sb = new StringBuilder();
            col.counts().forEach((k, v) -> sb.append(sb.length() == 0 ? "" : ", ").append(k).append(" \u00d7").append(v));
            h.text(sb.toString());
        } else {
            h.number(Html.setting(col.min())).text(" to ").number(Html.setting(col.max()));
        }
        h.close("td");
    }

    /** Writes a target in words, e.g. "5 × 10^9 to 2 × 10^10 cm^-2". */
    static void describe(Html h, Target t, Campaign c) {
        if (t.isClassTarget()) {
            h.text("is " + t.is());
            return;
        }
        String unit = c.outcome(t.outcome()).map(o -> o.unit() == null ? "" : o.unit().symbol()).orElse("");
        if (t.hasWindow()) {
            if (Double.isNaN(t.min())) {
                h.text("at most ").number(Html.num(t.max()));
            } else if (Double.isNaN(t.max())) {
                h.text("at least ").number(Html.num(t.min()));
            } else {
                h.number(Html.num(t.min())).text(" to ").number(Html.num(t.max()));
            }
            h.text(" ").unit(unit);
        }
        if (t.goal() == Target.Goal.MAXIMIZE) {
            h.text(t.hasWindow() ? ", as large as possible" : "as large as possible");
        } else if (t.goal() == Target.Goal.MINIMIZE) {
            h.text(t.hasWindow() ? ", as small as possible" : "as small as possible");
        }
    }

    // ------------------------------------------------------------------ runs

    private static void runs(Html h, LoadedCampaign lc) {
        Campaign c = lc.campaign();
        section(h, H_RUNS, null);
        List<Run> runs = lc.runLog().runs();
        if (runs.isEmpty()) {
            h.el("p", null, "The run log holds no runs yet.").nl();
            endSection(h);
            return;
        }
        h.open("p", null).text("Marks: ").el("span", "mark met", MET).text(" the run met the target, ")
                .el("span", "mark missed", MISSED).text(" it did not, ").el("span", "mark unmeasured", UNMEASURED)
                .text(" the outcome was not recorded. Failed runs (in italics) produced no sample and carry no marks.")
                .close("p").nl();
        h.open("table", "grid runs", "id", "run-table").open("thead", null).open("tr", null);
        h.open("th", null, "scope", "col").text("Run").raw("<br>").el("span", "unit", "date").close("th");
        for (ParameterSpec p : c.parameters()) {
            h.open("th", null, "scope", "col").el("code", null, p.name());
            if (!p.isCategorical()) {
                h.raw("<br>").open("span", "unit").unit(p.unit().symbol()).close("span");
            }
            h.close("th");
        }
        for (OutcomeSpec o : c.outcomes()) {
            h.open("th", "outcome", "scope", "col").el("code", null, o.name());
            if (!o.isClass()) {
                h.raw("<br>").open("span", "unit").unit(o.unit().symbol()).close("span");
            }
            h.close("th");
        }
        for (Target t : c.targets()) {
            h.open("th", "target", "scope", "col").text("target ").el("code", null, t.outcome()).close("th");
        }
        if (c.targets().size() > 1) {
            h.open("th", "target", "scope", "col").text("every target").close("th");
        }
        h.close("tr").close("thead").open("tbody", null).nl();
        boolean anyNotes = false;
        for (Run r : runs) {
            h.open("tr", r.ok() ? "run ok" : "run failed", "id", "run-" + anchor(r.runId()));
            h.open("th", null, "scope", "row").el("span", "run-id", r.runId());
            if (r.date() != null) {
                h.raw("<br>").el("span", "date", r.date());
            }
            h.close("th");
            for (ParameterSpec p : c.parameters()) {
                valueCell(h, r, p.name(), p.isCategorical(), true);
            }
            for (OutcomeSpec o : c.outcomes()) {
                valueCell(h, r, o.name(), o.isClass(), false);
            }
            int markColumns = c.targets().size() + (c.targets().size() > 1 ? 1 : 0);
            if (!r.ok()) {
                if (markColumns > 0) {
                    h.open("td", "failed-note", "colspan", String.valueOf(markColumns))
                            .text("run failed: no sample, no marks").close("td");
                }
            } else {
                boolean allMet = true;
                boolean anyMissed = false;
                for (Target t : c.targets()) {
                    Boolean m = CheckSummary.meets(t, r);
                    markCell(h, m);
                    allMet &= Boolean.TRUE.equals(m);
                    anyMissed |= Boolean.FALSE.equals(m);
                }
                if (c.targets().size() > 1) {
                    markCell(h, allMet ? Boolean.TRUE : anyMissed ? Boolean.FALSE : null);
                }
            }
            h.close("tr").nl();
            anyNotes |= r.notes() != null && !r.notes().isBlank();
        }
        h.close("tbody").close("table").nl();
        if (anyNotes) {
            h.el("h3", null, "Notes in the run log").nl().open("table", "notes").open("tbody", null);
            for (Run r : runs) {
                if (r.notes() != null && !r.notes().isBlank()) {
                    h.open("tr", null).el("th", null, r.runId()).el("td", null, r.notes()).close("tr");
                }
            }
            h.close("tbody").close("table").nl();
        }
        endSection(h);
    }

    private static void valueCell(Html h, Run r, String name, boolean categorical, boolean setting) {
        if (categorical) {
            h.el("td", null, r.category(name).orElse(""));
            return;
        }
        var v = r.number(name);
        h.open("td", "n");
        if (v.isPresent()) {
            h.number(setting ? Html.setting(v.getAsDouble()) : Html.num(v.getAsDouble()));
        }
        h.close("td");
    }

    private static void markCell(Html h, Boolean met) {
        if (met == null) {
            h.open("td", "mark-cell").el("span", "mark unmeasured", UNMEASURED).close("td");
        } else if (met) {
            h.open("td", "mark-cell").el("span", "mark met", MET).close("td");
        } else {
            h.open("td", "mark-cell").el("span", "mark missed", MISSED).close("td");
        }
    }

    // ------------------------------------------------------------------ parameters

    private static void parameters(Html h, ReportContent c) {
        section(h, H_PARAMETERS, "break");
        problem(h, c, ReportContent.FIT);
        FitReport r = c.fit();
        if (r == null) {
            endSection(h);
            return;
        }
        h.el("p", null, "Each growth model is fitted to the ok runs (" + (r.runs() - r.failedRuns()) + " of "
                + r.runs() + "; failed runs are not used). A parameter the runs cannot pin down is held at its "
                + "default, and the table says why and where the default comes from.").nl();
        for (ModelFit f : r.models()) {
            h.open("h3", null).text("Model ").el("code", null, f.id())
                    .text(" (" + f.runsUsed() + " runs used)").close("h3").nl();
            if (!f.message().isEmpty()) {
                h.el("p", "note", f.message()).nl();
            }
            if (!f.verdict().isEmpty()) {
                h.open("ul", "verdict");
                for (String v : f.verdict()) {
                    h.el("li", null, v);
                }
                h.close("ul").nl();
            }
            if (!f.estimates().isEmpty()) {
                h.open("table", "grid params").raw("<colgroup><col class=\"c-name\"><col class=\"c-value\">"
                        + "<col class=\"c-interval\"><col class=\"c-how\"><col class=\"c-source\"></colgroup>")
                        .headRow("Parameter", "Value", "95 % interval", "How it was set", "Default from");
                h.open("tbody", null);
                for (Estimate e : f.estimates()) {
                    String unit = e.unit();
                    h.open("tr", e.held() ? "held" : "fitted").open("td", null).el("code", null, e.name()).close("td");
                    h.open("td", "n").number(Html.num(e.value())).text(unit.isEmpty() ? "" : " ").unit(unit).close("td");
                    h.open("td", "n");
                    if (e.held() || !Double.isFinite(e.lo()) || !Double.isFinite(e.hi())) {
                        h.text(e.held() ? "none (held)" : "not available");
                    } else {
                        h.number(Html.num(e.lo())).text(" to ").number(Html.num(e.hi()));
                    }
                    h.close("td");
                    h.open("td", null).el("strong", "status", e.held() ? "held" : "fitted").text(": " + e.reason())
                            .close("td");
                    h.el("td", "source", e.source());
                    h.close("tr").nl();
                }
                h.close("tbody").close("table").nl();
            }
            if (f.candidates().size() > 1) {
                h.el("p", null, "Discrete choices compared by AICc (lower is better):").nl();
                h.open("ul", "choices");
                for (Candidate k : f.candidates()) {
                    StringBuilder sb = new StringBuilder();
                    k.choices().entrySet().stream().sorted(Map.Entry.comparingByKey()).forEach(e ->
                            sb.append(sb.length() == 0 ? "" : ", ").append(e.getKey()).append(' ')
                                    .append(Html.num(e.getValue())));
                    h.open("li", k.selected() ? "selected" : null).text(sb + ": AICc "
                            + (Double.isFinite(k.aicc()) ? Html.num(k.aicc()) : "not available (too few runs)")
                            + (k.selected() ? " \u2190 chosen" : "")).close("li");
                }
                h.close("ul").nl();
            }
            if (!f.outcomes().isEmpty()) {
                h.open("ul", "quality");
                for (OutcomeFit o : f.outcomes()) {
                    h.open("li", null).el("code", null, o.outcome()).text(": ");
                    if (o.scale().equals("class")) {
                        h.text("log loss " + Html.num(o.logLoss()) + ", most likely class right in "
                                + Html.percent(o.accuracy()) + " of " + o.n() + " runs");
                    } else if (o.scale().equals("log10")) {
                        h.text("typical error " + Html.num(o.rmse()) + " in log10 (a factor of "
                                + Html.num(Math.pow(10, o.rmse())) + ") over " + o.n() + " runs");
                    } else {
                        h.text("typical error (RMSE) " + Html.num(o.rmse()) + " over " + o.n() + " runs");
                    }
                    h.close("li");
                }
                h.close("ul").nl();
            }
            if (!f.excluded().isEmpty()) {
                h.el("p", null, "Runs not used by this model:").open("ul", null);
                for (Excluded x : f.excluded()) {
                    h.el("li", null, x.runId() + ": " + x.reason());
                }
                h.close("ul").nl();
            }
        }
        endSection(h);
    }

    // ------------------------------------------------------------------ validation

    private static void validation(Html h, ReportContent c) {
        section(h, H_VALIDATION, "break");
        problem(h, c, ReportContent.VALIDATION);
        ValidationPanel v = c.validation();
        if (v == null) {
            endSection(h);
            return;
        }
        h.el("p", null, v.method()).nl();
        if (!v.verdict().isEmpty()) {
            h.open("ul", "verdict");
            for (String s : v.verdict()) {
                h.el("li", null, s);
            }
            h.close("ul").nl();
        }
        for (ScoreTable t : v.tables()) {
            h.open("h3", null).el("code", null, t.outcome()).text(t.scale().equals("log10") ? " (scored in log10)"
                    : t.scale().equals("class") ? " (a class)" : "").close("h3").nl();
            h.open("table", "grid scores");
            if (t.scale().equals("class")) {
                h.headRow("Predictor", "Runs", "Log loss", "Most likely class right");
            } else {
                h.headRow("Predictor", "Runs", "RMSE", "Inside the 90 % interval", "MSLL");
            }
            h.open("tbody", null);
            for (ScoreRow r : t.rows()) {
                h.open("tr", null).el("td", null, predictorName(r.surrogate())).el("td", "n", String.valueOf(r.n()));
                if (t.scale().equals("class")) {
                    h.el("td", "n", Html.num(r.logLoss())).el("td", "n", Html.percent(r.accuracy()));
                } else {
                    h.el("td", "n", Html.num(r.rmse())).el("td", "n", Html.percent(r.coverage90()))
                            .el("td", "n", Html.num(r.msll()));
                }
                h.close("tr").nl();
            }
            h.close("tbody").close("table").nl();
        }
        figures(h, v.parity(), "single");
        endSection(h);
    }

    static String predictorName(String surrogate) {
        switch (surrogate) {
            case "physics":
                return "growth models alone";
            case "gp":
                return "Gaussian process alone";
            case "physics+gp":
                return "growth models + Gaussian process (used for proposals)";
            case "mean":
                return "mean of the other runs (a baseline)";
            default:
                return surrogate;
        }
    }

    static void figures(Html h, List<Figure> figs, String cssClass) {
        if (figs.isEmpty()) {
            return;
        }
        h.open("div", cssClass).nl();
        for (Figure f : figs) {
            h.open("figure", null, "id", "fig-" + f.key()).nl().raw(f.svg()).nl()
                    .el("figcaption", null, f.caption()).close("figure").nl();
        }
        h.close("div").nl();
    }

    // ------------------------------------------------------------------ arrhenius

    private static void arrhenius(Html h, ReportContent c) {
        section(h, H_ARRHENIUS, "break");
        problem(h, c, ReportContent.ARRHENIUS);
        ArrheniusPanel a = c.arrhenius();
        if (a == null) {
            endSection(h);
            return;
        }
        h.open("p", null).text("A straight line through ln(").el("code", null, a.density()).text(") against 1/kT, with T from ")
                .el("code", null, a.temperature()).text(", over " + a.fit().n() + " ok runs, gives an effective "
                        + "activation energy of " + Html.num(a.fit().energyEv()) + " eV");
        if (Double.isFinite(a.fit().lo()) && Double.isFinite(a.fit().hi())) {
            h.text(" (95 % interval " + Html.num(a.fit().lo()) + " to " + Html.num(a.fit().hi()) + " eV)");
        }
        h.text(". The other settings vary between these runs too, so this is a summary of the whole log, not a "
                + "controlled temperature series; the growth-model fit above is the better estimate of the barriers.")
                .close("p").nl();
        if (a.figure() != null) {
            figures(h, List.of(a.figure()), "single");
        }
        endSection(h);
    }

    // ------------------------------------------------------------------ windows

    private static void windows(Html h, ReportContent c) {
        section(h, H_WINDOWS, "break");
        problem(h, c, ReportContent.WINDOWS);
        List<WindowPanel> panels = c.windows();
        if (panels == null) {
            endSection(h);
            return;
        }
        for (WindowPanel w : panels) {
            if (panels.size() > 1) {
                h.open("h3", null).el("code", null, w.y()).text(" against ").el("code", null, w.x()).close("h3").nl();
            }
            h.open("p", null).text("Predicted yield over ").el("code", null, w.x()).text(" and ").el("code", null, w.y())
                    .text(", the other settings held at " + w.atSource() + ": " + String.join(", ", w.at()) + ".")
                    .close("p").nl();
            for (String n : w.notes()) {
                h.el("p", null, n).nl();
            }
            figures(h, w.figures(), "single");
        }
        endSection(h);
    }

    // ------------------------------------------------------------------ proposals

    private static void proposals(Html h, ReportContent c) {
        section(h, H_PROPOSALS, "break");
        problem(h, c, ReportContent.PROPOSALS);
        ProposalSet set = c.proposals();
        if (set == null) {
            endSection(h);
            return;
        }
        Campaign camp = c.loaded().campaign();
        h.el("p", null, "Made by " + (set.mode().equals("search") ? "searching the campaign's box"
                : "a " + set.mode() + " design") + " from " + set.runsUsed() + " runs, with exploration weight "
                + Html.num(set.explore()) + " and seed " + set.seed() + ". Write a proposal's id in the run log's "
                + "proposal column when you grow it.").nl();
        for (String n : set.notes()) {
            h.el("p", "note", n).nl();
        }
        if (set.proposals().isEmpty()) {
            h.el("p", null, "No recipe could be proposed.").nl();
            endSection(h);
            return;
        }
        h.open("table", "grid runs").open("thead", null).open("tr", null);
        for (String s : List.of("Rank", "Proposal", "Yield", "Run succeeds")) {
            h.open("th", null, "scope", "col").text(s).close("th");
        }
        for (ParameterSpec p : camp.parameters()) {
            h.open("th", null, "scope", "col").el("code", null, p.name());
            if (!p.isCategorical()) {
                h.raw("<br>").open("span", "unit").unit(p.unit().symbol()).close("span");
            }
            h.close("th");
        }
        h.close("tr").close("thead").open("tbody", null).nl();
        for (Proposal p : set.proposals()) {
            h.open("tr", null).el("td", "n", String.valueOf(p.rank())).open("td", null).el("code", null, p.id()).close("td")
                    .el("td", "n", Html.percent(p.yield())).el("td", "n", Html.percent(p.success()));
            for (ParameterSpec ps : camp.parameters()) {
                Object v = p.recipe().get(ps.name());
                if (v instanceof Double) {
                    h.open("td", "n").number(Html.setting((Double) v)).close("td");
                } else {
                    h.el("td", null, v == null ? "" : v.toString());
                }
            }
            h.close("tr").nl();
        }
        h.close("tbody").close("table").nl();
        for (Proposal p : set.proposals()) {
            h.open("div", "proposal").open("h3", null).text("#" + p.rank() + " ").el("code", null, p.id())
                    .text(" \u2013 yield " + Html.percent(p.yield())).close("h3").nl();
            h.open("p", null).el("strong", null, "Why: ").text(p.reason()).close("p").nl();
            h.open("ul", "predictions");
            for (OutcomeSpec o : camp.outcomes()) {
                h.open("li", null).el("code", null, o.name()).text(": ");
                if (o.isClass()) {
                    Map<String, Double> m = p.classes().getOrDefault(o.name(), Map.of());
                    StringBuilder sb = new StringBuilder();
                    m.forEach((k, val) -> sb.append(sb.length() == 0 ? "" : ", ").append(k).append(' ')
                            .append(Html.percent(val)));
                    h.text(sb.length() == 0 ? "no prediction" : sb.toString());
                } else {
                    NumericPrediction np = p.numeric().get(o.name());
                    if (np == null) {
                        h.text("no prediction (never measured, and no growth model predicts it)");
                    } else {
                        h.number(Html.num(np.mean())).text(" ").unit(o.unit().symbol()).text(", 90 % interval ")
                                .number(Html.num(np.lo90())).text(" to ").number(Html.num(np.hi90()));
                        if (np.hasWindow()) {
                            h.text("; chance of landing in the target " + Html.percent(np.inWindow()));
                        }
                    }
                }
                h.close("li");
            }
            h.close("ul").nl();
            if (p.nearestRun() != null) {
                h.el("p", "small", "Closest logged run: " + p.nearestRun() + " (distance "
                        + Html.num(p.nearestDistance()) + ", with " + NEAREST_DISTANCE
                        + ").").nl();
            }
            if (!p.flags().isEmpty()) {
                h.open("ul", "flags");
                for (String f : p.flags()) {
                    h.open("li", null).el("strong", null, "Check: ").text(f).close("li");
                }
                h.close("ul").nl();
            }
            h.close("div").nl();
        }
        endSection(h);
    }

    // ------------------------------------------------------------------ safety and meaning

    private static void safety(Html h, Campaign c) {
        section(h, H_SAFETY, null);
        h.open("ul", "cautions");
        for (String s : Cautions.forCampaign(c)) {
            h.el("li", null, s);
        }
        h.close("ul").nl();
        h.el("p", "defer", Cautions.DEFER).nl();
        endSection(h);
    }

    private static void meaning(Html h, ReportContent c) {
        section(h, H_MEANING, null);
        h.open("dl", "meaning");
        h.el("dt", null, "Yield").el("dd", null, "The chance that the next run with a recipe meets every target at "
                + "once, as the models see it: the chances for each target multiplied together, times the chance "
                + "that the run succeeds at all. A yield of 40 % means about four runs in ten would be in spec; it "
                + "is an estimate from your own runs and is only as good as they are.");
        h.el("dt", null, "90 % interval").el("dd", null, "The range a new measurement is expected to fall in nine "
                + "times out of ten. It includes the scatter seen between your runs, so it does not shrink to "
                + "nothing even where the models are sure. The validation section checks how often real runs "
                + "did fall inside it; close to 90 % is right, much lower means the models are over-confident.");
        h.el("dt", null, "95 % interval of a parameter").el("dd", null, "The range of values of a growth-model "
                + "parameter that fit your runs about as well as the best one. A wide interval means the runs say "
                + "little about that parameter.");
        h.el("dt", null, "Held parameter").el("dd", null, "A parameter your runs cannot determine (they do not "
                + "depend on it, or cannot tell it apart from another one, or there are too few runs). It keeps "
                + "its default, whose source is given, and has no interval. Runs that vary the setting it "
                + "depends on will free it.");
        h.el("dt", null, "Explore").el("dd", null, "How much the proposals favour recipes whose outcome is still "
                + "uncertain but could be in spec, over recipes already predicted to work. At 0 they go for the "
                + "highest predicted yield; larger values try more unexplored recipes, which teaches the models "
                + "more per run. This report used " + (c.proposals() == null ? "the default"
                : Html.num(c.proposals().explore())) + ".");
        h.el("dt", null, "Growth models and Gaussian process").el("dd", null, "The growth models are general "
                + "published laws (for example nucleation scaling) with parameters fitted to your runs. The "
                + "Gaussian process learns what the laws miss, from the same runs. Far from any run it falls back "
                + "on the laws and its intervals widen.");
        h.el("dt", null, "RMSE and MSLL").el("dd", null, "RMSE is the typical size of a prediction error, on the "
                + "outcome's scale (in log10 for densities: 0.3 is a factor of 2). MSLL (mean standardised log "
                + "loss) compares a predictor with simply guessing the mean of the runs: below 0 is better than "
                + "that guess, and it also penalises intervals that are too narrow or too wide.");
        h.el("dt", null, "Not measurements").el("dd", null, "Everything predicted here is an estimate. Grow the "
                + "proposals, measure them, add them to the run log and run the report again.");
        h.close("dl").nl();
        endSection(h);
    }
}
