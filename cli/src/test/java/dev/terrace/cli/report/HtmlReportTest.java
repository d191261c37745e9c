package dev.terrace.cli.report;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.demo.DemoCampaign;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Lays out reports of the demo campaign (invented data) with hostile text and with missing parts. */
class HtmlReportTest {

    static final String TITLE = "<script>alert('t')</script> & <b>bold</b> \"q\"";
    static final String NOTE = "<img src=http://example.invalid/x.png> & more";

    static LoadedCampaign hostileDemo(Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        String yaml = Files.readString(campaign);
        String title = yaml.lines().filter(l -> l.startsWith("title:")).findFirst().orElseThrow();
        Files.writeString(campaign, yaml.replace(title, "title: \"" + TITLE.replace("\"", "\\\"") + "\""));
        Path runs = campaign.resolveSibling("runs.csv");
        Files.writeString(runs, Files.readString(runs).replace("start recipe, middle of the box", NOTE));
        return LoadedCampaign.open(campaign, null);
    }

    static ReportContent bare(LoadedCampaign lc, Map<String, String> problems) {
        return new ReportContent(lc, "terrace test", 7, LocalDate.of(2026, 2, 27), null, null, null, null, null,
                problems);
    }

    @Test
    void textFromTheCampaignAndTheRunLogIsEscaped(@TempDir Path tmp) throws Exception {
        LoadedCampaign lc = hostileDemo(tmp);
        assertEquals(TITLE, lc.campaign().title(), "the hostile title reached the campaign");
        Document d = Jsoup.parse(HtmlReport.render(bare(lc, Map.of())));
        assertEquals(TITLE, d.selectFirst("h1").text());
        assertTrue(d.select("script, img, b").isEmpty(), "no element made from user text");
        assertTrue(d.text().contains(NOTE), "the note is shown as text");
    }

    @Test
    void missingPartsSayWhyAndEverySectionIsStillThere(@TempDir Path tmp) throws Exception {
        LoadedCampaign lc = LoadedCampaign.open(DemoCampaign.copyTo(tmp.resolve("demo")), null);
        String why = "This part could not be computed: <too few runs>";
        String html = HtmlReport.render(bare(lc, Map.of(ReportContent.VALIDATION, why)));
        Document d = Jsoup.parse(html);
        assertEquals(HtmlReport.SECTIONS, d.select("section > h2").eachText());
        assertTrue(d.getElementById(HtmlReport.anchor(HtmlReport.H_VALIDATION)).text().contains(why));
        assertFalse(html.contains("NaN") || html.contains("Infinity"));
        for (String s : HtmlReport.SECTIONS) {
            assertEquals(1, d.select("nav a[href=#" + HtmlReport.anchor(s) + "]").size(), "contents link to " + s);
        }
    }
}
