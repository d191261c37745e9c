package dev.terrace.cli.plot;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.validate.ParityPoint;
import dev.terrace.core.window.ParetoFront;
import dev.terrace.core.window.WindowMap;
import dev.terrace.core.window.WindowMapResult;
import dev.terrace.demo.DemoCampaign;
import org.jfree.chart.ChartRenderingInfo;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import java.awt.Color;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Charts on the demo campaign (invented data) render headless to PNG and SVG and read in print. */
class PlotsTest {

    static LoadedCampaign lc;
    static CampaignSurrogate sur;
    static WindowMapResult map;
    static List<Proposal> proposals;

    @BeforeAll
    static void fit(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        lc = LoadedCampaign.open(campaign, PluginRegistry.builder().build());
        sur = CampaignSurrogate.build(lc, PluginRegistry.builder().build(), true, 7);
        Map<String, Object> at = Map.of("ga_amount", 3.0, "ga_rate", 0.1, "as_flux", 3.2e-6, "as_source", "As2");
        map = WindowMap.compute(sur, "t_drop", "t_cryst", at, 25, 5, 7);
        proposals = Proposer.propose(sur, ProposeSettings.defaults().withBatch(2).withSeed(7)).proposals();
    }

    static Document parse(String svg) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        return f.newDocumentBuilder().parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void theSameChartGivesTheSameSvgBytesTwice() throws Exception {
        // Reproducible output (common practice for build artefacts): no time-derived ids in the SVG.
        JFreeChart first = Plots.windowMap(map, lc.runLog().runs(), proposals, lc.campaign());
        String a = Plots.toSvg(first, 800, 640);
        Thread.sleep(2);
        JFreeChart second = Plots.windowMap(map, lc.runLog().runs(), proposals, lc.campaign());
        String b = Plots.toSvg(second, 800, 640);
        assertTrue(a.contains("clip-path"), "the map clips its layers, so ids are present to compare");
        assertEquals(a, b);
    }

    @Test
    void windowMapRendersToPngOfTheAskedSizeAndToSvgWithAxisLabelsAndUnits() throws Exception {
        JFreeChart chart = Plots.windowMap(map, lc.runLog().runs(), proposals, lc.campaign());
        BufferedImage png = ImageIO.read(new ByteArrayInputStream(Plots.pngBytes(chart, 800, 640)));
        assertEquals(800, png.getWidth());
        assertEquals(640, png.getHeight());
        String svg = Plots.toSvg(chart, 800, 640);
        Document d = parse(svg);
        assertEquals("svg", d.getDocumentElement().getLocalName());
        String text = d.getDocumentElement().getTextContent();
        assertTrue(text.contains("t_drop (\u00b0C)"), "x axis label with unit");
        assertTrue(text.contains("t_cryst (\u00b0C)"), "y axis label with unit");
        assertTrue(text.contains("predicted yield"), "colour scale title");
        assertTrue(text.contains("hatched: breaks a campaign limit"), "the demo's limit cuts the map");
        assertTrue(!svg.contains("<image"), "self-contained vector output, no embedded bitmaps");
        XYPlot plot = chart.getXYPlot();
        assertEquals(DatasetRenderingOrder.FORWARD, plot.getDatasetRenderingOrder());
        assertTrue(plot.getDomainAxis() instanceof NumberAxis && plot.getRangeAxis() instanceof NumberAxis);
    }

    @Test
    void proposalsAreDrawnOverTheHeatMap() throws Exception {
        // pitfall: JFreeChart's default rendering order hides overlays under the heat map; the + marker's
        // centre pixel must be its black fill, not a colour of the yield ramp
        JFreeChart chart = Plots.windowMap(map, List.of(), proposals, lc.campaign());
        ChartRenderingInfo info = new ChartRenderingInfo();
        BufferedImage img = chart.createBufferedImage(900, 720, info);
        Rectangle2D area = info.getPlotInfo().getDataArea();
        XYPlot plot = chart.getXYPlot();
        Proposal p = proposals.get(0);
        double px = plot.getDomainAxis().valueToJava2D((Double) p.recipe().get("t_drop"), area, plot.getDomainAxisEdge());
        double py = plot.getRangeAxis().valueToJava2D((Double) p.recipe().get("t_cryst"), area, plot.getRangeAxisEdge());
        // the + marker's strokes cross at the recipe: some pixel within 2 px of it must be its black ink
        boolean ink = false;
        Color seen = null;
        for (int dx = -2; dx <= 2 && !ink; dx++) {
            for (int dy = -2; dy <= 2 && !ink; dy++) {
                Color c = new Color(img.getRGB((int) Math.round(px) + dx, (int) Math.round(py) + dy));
                seen = c;
                ink = c.getRed() < 40 && c.getGreen() < 40 && c.getBlue() < 40;
            }
        }
        assertTrue(ink, "no marker ink at the proposal, last pixel seen: " + seen);
    }

    @Test
    void logScaleSettingsGetLogAxes() {
        WindowMapResult m = WindowMap.compute(sur, "ga_rate", "as_flux", map.at(), 9, 0, 7);
        JFreeChart chart = Plots.windowMap(m, lc.runLog().runs(), List.of(), lc.campaign());
        assertTrue(chart.getXYPlot().getDomainAxis() instanceof LogAxis);
        assertTrue(chart.getXYPlot().getRangeAxis() instanceof LogAxis);
        assertEquals(0.02, chart.getXYPlot().getDomainAxis().getLowerBound(), 1e-15, "axis spans the box");
        assertEquals(1e-4, chart.getXYPlot().getRangeAxis().getUpperBound(), 1e-18);
    }

    @Test
    void parityArrheniusAndParetoChartsRenderWithUnits() throws Exception {
        List<ParityPoint> pts = List.of(new ParityPoint("gp", "D01", 33.2, 30.0, 25.0, 35.0),
                new ParityPoint("gp", "D02", 14.8, 18.0, 12.0, 24.0),
                new ParityPoint("physics+gp", "D01", 33.2, 32.5, 29.0, 36.0));
        JFreeChart parity = Plots.parity("dot_diameter (nm)", false, pts, "physics+gp", 20, 40);
        String svg = Plots.toSvg(parity, 700, 560);
        String text = parse(svg).getDocumentElement().getTextContent();
        assertTrue(text.contains("measured dot_diameter (nm)") && text.contains("predicted dot_diameter (nm)"));
        assertTrue(text.contains("1:1 line"));
        assertTrue(text.contains("target band"), "the target band is in the legend");
        assertTrue(text.contains(" D01"), "the labelled group's points carry their run ids");
        // Arrhenius: invented densities falling with temperature, E = 0.3 eV exactly
        double[] t = {450, 500, 550, 600};
        double[] n = new double[4];
        for (int k = 0; k < 4; k++) {
            n[k] = 1e10 * Math.exp(0.3 / (8.617333262e-5 * t[k]) - 0.3 / (8.617333262e-5 * 500));
        }
        JFreeChart arr = Plots.arrhenius(t, n, Double.NaN, Double.NaN, Double.NaN);
        String atext = parse(Plots.toSvg(arr, 700, 560)).getDocumentElement().getTextContent();
        assertTrue(atext.contains("1/kT (1/eV)"), "x axis with unit");
        assertTrue(atext.contains("island density (cm\u207b\u00b2)"), "y axis with unit");
        assertTrue(atext.contains("E = 0.3 eV"), "the fit recovers the invented energy");
        ParetoFront front = ParetoFront.compute(sur, ParetoFront.GROWTH_TIME, 16, 4, 7);
        JFreeChart pc = Plots.pareto(front);
        BufferedImage png = ImageIO.read(new ByteArrayInputStream(Plots.pngBytes(pc, 640, 480)));
        assertEquals(640, png.getWidth());
        String ptext = parse(Plots.toSvg(pc, 640, 480)).getDocumentElement().getTextContent();
        assertTrue(ptext.contains("deposition time (s)"), "cost axis with unit");
    }

    @Test
    void savingWritesAtomicallyAndNeverOverwritesWithoutBeingAsked(@TempDir Path tmp) throws Exception {
        JFreeChart chart = Plots.pareto(ParetoFront.compute(sur, ParetoFront.GROWTH_TIME, 16, 2, 3));
        Path png = tmp.resolve("front.png");
        Plots.savePng(chart, png, 400, 300);
        byte[] first = Files.readAllBytes(png);
        assertEquals(400, ImageIO.read(png.toFile()).getWidth());
        assertThrows(FileAlreadyExistsException.class, () -> Plots.savePng(chart, png, 500, 300));
        assertArrayEquals(first, Files.readAllBytes(png), "the existing file is untouched");
        Plots.save(chart, png, 500, 300, true);
        assertEquals(500, ImageIO.read(png.toFile()).getWidth());
        Path svg = tmp.resolve("front.SVG");
        Plots.save(chart, svg, 400, 300, false);
        assertEquals("svg", parse(Files.readString(svg)).getDocumentElement().getLocalName());
        assertThrows(IllegalArgumentException.class, () -> Plots.save(chart, tmp.resolve("front.pdf"), 400, 300, false));
        try (var files = Files.list(tmp)) {
            assertEquals(2, files.count(), "no temporary files left behind");
        }
    }

    @Test
    void yieldRampRisesInLuminanceSoItReadsInGrey() {
        // relative luminance by IEC 61966-2-1 / Rec. 709 weights, and the Rec. 601 luma a greyscale
        // printer driver typically uses (0.299 R + 0.587 G + 0.114 B; common practice)
        double lastY = -1;
        double lastLuma = -1;
        for (int k = 0; k <= 20; k++) {
            Color c = YieldRamp.color(k / 20.0);
            double y = YieldRamp.luminance(c);
            double luma = 0.299 * c.getRed() + 0.587 * c.getGreen() + 0.114 * c.getBlue();
            assertTrue(y > lastY, "luminance rises at step " + k);
            assertTrue(luma > lastLuma, "grey value rises at step " + k);
            lastY = y;
            lastLuma = luma;
        }
        assertTrue(YieldRamp.luminance(YieldRamp.color(1)) - YieldRamp.luminance(YieldRamp.color(0)) > 0.6,
                "the ends are far apart in grey");
        // CIELAB L* = 20 at the low end: Y = ((20 + 16) / 116)^3 = 0.02989 (CIE 15:2004), within 8-bit rounding
        assertEquals(Math.pow(36.0 / 116, 3), YieldRamp.luminance(YieldRamp.color(0)), 0.003);
    }

    @Test
    void contoursOfALinearFieldAreStraightLines() {
        // f = x on a 5 x 4 grid: the 0.5 iso-line is the vertical line x = 0.5 (exact for linear interpolation)
        double[] xs = {0, 0.25, 0.5, 0.75, 1};
        double[] ys = {0, 1, 2, 3};
        double[][] f = new double[4][5];
        for (int j = 0; j < 4; j++) {
            for (int i = 0; i < 5; i++) {
                f[j][i] = xs[i] + 0.1;
            }
        }
        List<double[]> seg = Contours.segments(f, xs, ys, 0.5);
        assertEquals(3, seg.size());
        for (double[] s : seg) {
            assertEquals(0.4, s[0], 1e-12);
            assertEquals(0.4, s[2], 1e-12);
        }
        List<double[]> lines = Contours.chain(seg);
        assertEquals(1, lines.size(), "joined into one polyline");
        assertEquals(8, lines.get(0).length, "four points from y = 0 to y = 3");
    }
}
