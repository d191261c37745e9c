package dev.terrace.cli;

import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

import javax.imageio.ImageIO;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code terrace map} in-process on the demo campaign (invented data): output and exit codes. */
class MapCommandTest {

    @TempDir
    static Path tmp;
    static Path campaign;

    record Outcome(int code, String out, String err) {
    }

    @BeforeAll
    static void copyDemo() throws Exception {
        campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
    }

    /** Runs {@code terrace map ...} through Main's command line and error handling. */
    static Outcome run(String... args) {
        CommandLine cl = Main.commandLine();
        if (!cl.getSubcommands().containsKey("map")) {
            cl.addSubcommand("map", new MapCommand());
        }
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        String[] all = new String[args.length + 1];
        all[0] = "map";
        System.arraycopy(args, 0, all, 1, args.length);
        int code = cl.execute(all);
        return new Outcome(code, out.toString(), err.toString());
    }

    @Test
    void printsTheWindowSummaryWithTheShrinkUnderAThermocoupleError() {
        Outcome o = run(campaign.toString(), "--x", "t_drop", "--y", "t_cryst", "--grid", "15",
                "--temperature-uncertainty", "10");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("Process window of campaign ga-dots-demo: t_cryst against t_drop, 15 x 15 cells"), o.out());
        assertTrue(o.out().contains("window (yield >= 0.5):"), o.out());
        assertTrue(o.out().contains("with a thermocouple error of 10 K (sd) on t_drop and t_cryst together"), o.out());
        assertTrue(o.out().contains("best cell: t_drop"), o.out());
        assertTrue(o.out().contains("most likely shape:"), o.out());
        assertTrue(o.out().contains("breaks a campaign limit"), o.out());
        assertTrue(o.out().contains("safety officer"), "the usual caution is shown");
        assertTrue(!o.out().contains("NaN") && !o.out().contains("Infinity"), o.out());
    }

    @Test
    void writesAPngAndRefusesToOverwriteItWithoutForce() throws Exception {
        Path png = tmp.resolve("window.png");
        Outcome o = run(campaign.toString(), "--x", "ga_rate", "--y", "as_flux", "--grid", "9", "--at",
                "t_drop=250,t_cryst=270", "--out", png.toString());
        assertEquals(0, o.code(), o.err());
        assertEquals(900, ImageIO.read(png.toFile()).getWidth());
        assertTrue(o.out().contains("held: t_drop 250 degC"), o.out());
        byte[] before = Files.readAllBytes(png);
        Outcome again = run(campaign.toString(), "--x", "ga_rate", "--y", "as_flux", "--grid", "9", "--out", png.toString());
        assertEquals(2, again.code());
        assertTrue(again.err().contains("--force"), again.err());
        assertArrayEquals(before, Files.readAllBytes(png));
        Path svg = tmp.resolve("window.svg");
        Outcome s = run(campaign.toString(), "--x", "ga_rate", "--y", "as_flux", "--grid", "9", "--at", "run:D01",
                "--out", svg.toString());
        assertEquals(0, s.code(), s.err());
        assertTrue(Files.readString(svg).contains("ga_rate (ML/s), log scale"));
        assertTrue(s.out().contains("(from run D01)"), s.out());
    }

    @Test
    void badAxesGridsAndHeldSettingsAreUsageErrors() {
        Outcome typo = run(campaign.toString(), "--x", "t_dorp", "--y", "t_cryst");
        assertEquals(2, typo.code());
        assertTrue(typo.err().contains("did you mean 't_drop'"), typo.err());
        Outcome same = run(campaign.toString(), "--x", "t_drop", "--y", "t_drop");
        assertEquals(2, same.code());
        assertTrue(same.err().contains("two different settings"), same.err());
        Outcome cat = run(campaign.toString(), "--x", "as_source", "--y", "t_drop");
        assertEquals(2, cat.code());
        assertTrue(cat.err().contains("is a choice"), cat.err());
        assertEquals(2, run(campaign.toString(), "--x", "t_drop", "--y", "t_cryst", "--grid", "4").code());
        assertEquals(2, run(campaign.toString(), "--x", "t_drop", "--y", "t_cryst", "--grid", "201").code());
        assertEquals(2, run(campaign.toString(), "--x", "t_drop", "--y", "t_cryst", "--temperature-uncertainty", "-3").code());
        assertEquals(2, run(campaign.toString(), "--x", "t_drop").code(), "--y missing");
        Outcome run = run(campaign.toString(), "--x", "t_drop", "--y", "t_cryst", "--at", "run:D1");
        assertEquals(2, run.code());
        assertTrue(run.err().contains("did you mean 'D01'"), run.err());
        Outcome held = run(campaign.toString(), "--x", "t_drop", "--y", "t_cryst", "--at", "ga_amout=3");
        assertEquals(2, held.code());
        assertTrue(held.err().contains("did you mean 'ga_amount'"), held.err());
        assertEquals(2, run(campaign.toString(), "--x", "t_drop", "--y", "t_cryst", "--out", tmp.resolve("m.pdf").toString()).code());
        assertEquals(2, run(tmp.resolve("missing.yaml").toString(), "--x", "t_drop", "--y", "t_cryst").code());
    }

    @Test
    void paretoPrintsAndPlotsTheFront() throws Exception {
        Path png = tmp.resolve("front.png");
        Outcome o = run(campaign.toString(), "--pareto", "growth-time", "--out", png.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("Yield against deposition time for campaign ga-dots-demo"), o.out());
        assertTrue(o.out().contains("#1 "), o.out());
        assertTrue(Files.size(png) > 1000);
        Outcome bad = run(campaign.toString(), "--pareto", "money");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("growth-time or group-v"), bad.err());
    }
}
