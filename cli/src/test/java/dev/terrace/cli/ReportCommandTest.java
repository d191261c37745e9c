package dev.terrace.cli;

import dev.terrace.cli.report.HtmlReport;
import dev.terrace.core.CheckSummary;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.runlog.Run;
import dev.terrace.demo.DemoCampaign;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Runs {@code terrace report} on the bundled demo campaign (invented data) in-process and reads the
 * page back with jsoup, an HTML parser from Maven Central that follows the WHATWG HTML standard's
 * parsing rules, so the checks see the page as a browser would.
 */
class ReportCommandTest {

    /** Inline figures the demo report must hold: a parity plot per numeric outcome (2), the Arrhenius plot, 2 window maps. */
    static final int MIN_FIGURES = 5;

    @TempDir
    static Path tmp;

    static Path campaign;
    static Path report;
    static String html;
    static Document doc;
    static LoadedCampaign loaded;

    record Outcome(int code, String out, String err) {
    }

    static Outcome run(String... args) {
        if (System.getProperty("org.slf4j.simpleLogger.defaultLogLevel") == null) {
            System.setProperty("org.slf4j.simpleLogger.defaultLogLevel", "error");
        }
        CommandLine cl = Main.commandLine();
        if (!cl.getSubcommands().containsKey("report")) {
            cl.addSubcommand("report", new ReportCommand());
        }
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute(args);
        return new Outcome(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void writeTheDemoReport() throws Exception {
        campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        loaded = LoadedCampaign.open(campaign, null);
        report = tmp.resolve("report.html");
        byte[] logBefore = Files.readAllBytes(loaded.runLog().file());
        Outcome o = run("report", campaign.toString(), "--out", report.toString(), "--seed", "7");
        assertEquals(0, o.code(), o.err());
        assertArrayEquals(logBefore, Files.readAllBytes(loaded.runLog().file()), "the run log is never changed");
        html = Files.readString(report, StandardCharsets.UTF_8);
        doc = Jsoup.parse(html);
    }

    @Test
    void titleIsTheCampaignTitleAndTheDataIsLabelled() {
        String title = loaded.campaign().title();
        assertTrue(title.contains("invented"), "the demo's own title labels its data as invented: " + title);
        assertEquals(title, doc.selectFirst("h1").text());
        assertTrue(doc.title().startsWith(title), doc.title());
        assertTrue(doc.text().contains("Data as given in the run log"), "data provenance note");
    }

    @Test
    void everySectionHeadingIsPresentInOrder() {
        List<String> h2 = doc.select("section > h2").eachText();
        assertEquals(HtmlReport.SECTIONS, h2);
    }

    @Test
    void runTableHasOneRowPerRunWithMetAndMissedMarks() {
        Element table = doc.getElementById("run-table");
        assertNotNull(table, "run table");
        Elements rows = table.select("tbody > tr");
        List<Run> runs = loaded.runLog().runs();
        assertEquals(runs.size(), rows.size(), "one row per run in the log");
        List<Target> targets = loaded.campaign().targets();
        int met = 0;
        int missed = 0;
        for (int i = 0; i < runs.size(); i++) {
            Run r = runs.get(i);
            Element row = rows.get(i);
            assertEquals(r.runId(), row.selectFirst("th .run-id").text(), "rows in log order");
            // expected marks from CheckSummary.meets, the same rule as 'terrace check'
            for (Target t : targets) {
                Boolean m = r.ok() ? CheckSummary.meets(t, r) : null;
                if (Boolean.TRUE.equals(m)) {
                    met++;
                } else if (Boolean.FALSE.equals(m)) {
                    missed++;
                }
            }
            assertEquals(countMarks(row, "met", targets.size()), expectedCount(r, targets, Boolean.TRUE), r.runId());
            assertEquals(countMarks(row, "missed", targets.size()), expectedCount(r, targets, Boolean.FALSE), r.runId());
        }
        assertTrue(met > 0 && missed > 0, "the demo log has both met and missed targets");
        for (Element mark : table.select("span.mark.met")) {
            assertTrue(mark.text().startsWith("\u2713"), "met marks carry a text tick, not only a class");
        }
        for (Element mark : table.select("span.mark.missed")) {
            assertTrue(mark.text().startsWith("\u2717"), "missed marks carry a text cross, not only a class");
        }
    }

    /** Marks of a kind in the first {@code n} target cells of a row (the "every target" column is left out). */
    static int countMarks(Element row, String kind, int n) {
        Elements cells = row.select("td.mark-cell");
        int k = 0;
        for (int i = 0; i < n && i < cells.size(); i++) {
            k += cells.get(i).select("span.mark." + kind).size();
        }
        return k;
    }

    static int expectedCount(Run r, List<Target> targets, Boolean want) {
        if (!r.ok()) {
            return 0;
        }
        int k = 0;
        for (Target t : targets) {
            if (want.equals(CheckSummary.meets(t, r))) {
                k++;
            }
        }
        return k;
    }

    @Test
    void parameterTableListsTheDiffusionBarrierWithAnIntervalAndASource() {
        Element row = null;
        for (Element tr : doc.select("table.params tbody tr")) {
            if (tr.selectFirst("td").text().equals("diffusion_barrier")) {
                row = tr;
            }
        }
        assertNotNull(row, "diffusion_barrier row");
        Elements td = row.select("td");
        assertTrue(row.hasClass("fitted"), "the demo runs span enough temperatures to fit the barrier");
        assertTrue(Pattern.compile("\\d.* to .*\\d").matcher(td.get(2).text()).find(), "interval: " + td.get(2).text());
        Element source = row.selectFirst("td.source");
        assertNotNull(source, "source column");
        assertFalse(source.text().isBlank(), "source of the default");
    }

    @Test
    void holdsEnoughInlineFiguresAndNothingExternal() {
        Elements svgs = doc.select("figure svg");
        assertTrue(svgs.size() >= MIN_FIGURES, "inline figures: " + svgs.size());
        for (Element e : doc.select("[src], [href], [xlink:href]")) {
            for (String attr : List.of("src", "href", "xlink:href")) {
                String v = e.attr(attr);
                assertFalse(v.matches("(?i)\\s*(https?:|//|file:|ftp:).*"), "external resource: " + e.outerHtml());
            }
        }
        assertTrue(doc.select("script, link, iframe, img[src], object, embed").isEmpty(), "no scripts or linked files");
        assertFalse(html.contains("@import"), "no imported style sheets");
    }

    @Test
    void windowMapsAreOverTheSubstrateTemperatureAndTheGroupVPressure() {
        // the demo's t_drop has role substrate_temperature and as_flux role group_v_bep (its campaign.yaml)
        assertEquals(List.of("t_drop", "as_flux"), ReportCommand.mapAxes(loaded.campaign()));
        Element windows = doc.getElementById(HtmlReport.anchor(HtmlReport.H_WINDOWS));
        assertEquals(2, windows.select("figure svg").size(), "plain map and map with 5 K temperature error");
        assertTrue(windows.text().contains("5 K"), windows.text());
    }

    @Test
    void noUndefinedNumbersAnywhere() {
        assertFalse(html.contains("NaN"), "NaN in the page");
        assertFalse(html.contains("Infinity"), "Infinity in the page");
    }

    @Test
    void refusesToOverwriteWithoutForce() throws Exception {
        Path existing = tmp.resolve("existing.html");
        Files.writeString(existing, "keep me");
        Outcome o = run("report", campaign.toString(), "--out", existing.toString());
        assertEquals(2, o.code(), o.err());
        assertEquals("keep me", Files.readString(existing), "an existing file is left alone");
        assertTrue(o.err().contains("--force"), o.err());
    }

    @Test
    void aNewCampaignWithoutRunsStillGivesACompleteReport() throws Exception {
        Path dir = tmp.resolve("fresh");
        assertEquals(0, run("init", dir.toString()).code());
        Path out = tmp.resolve("fresh.html");
        Outcome o = run("report", dir.resolve("campaign.yaml").toString(), "--out", out.toString());
        assertEquals(0, o.code(), o.err());
        String page = Files.readString(out, StandardCharsets.UTF_8);
        Document d = Jsoup.parse(page);
        assertEquals(HtmlReport.SECTIONS, d.select("section > h2").eachText());
        assertTrue(d.text().contains("The run log holds no runs yet."), "says the log is empty");
        assertNotNull(d.getElementById(HtmlReport.anchor(HtmlReport.H_VALIDATION)).selectFirst(".note"),
                "the validation section says why it is empty");
        assertFalse(page.contains("NaN") || page.contains("Infinity"));
    }

    @Test
    void neverWritesOverTheRunLog() throws Exception {
        Path log = loaded.runLog().file();
        byte[] before = Files.readAllBytes(log);
        Outcome o = run("report", campaign.toString(), "--out", log.toString(), "--force");
        assertEquals(2, o.code(), o.err());
        assertArrayEquals(before, Files.readAllBytes(log));
    }
}
