package dev.terrace.cli.plot;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.window.WindowMap;
import dev.terrace.core.window.WindowMapResult;
import dev.terrace.demo.DemoCampaign;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.plot.SeriesRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.ui.TextAnchor;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Marks on the charts: repeated recipes show their count, failed runs are drawn on top, proposal
 * labels keep clear of each other and of the plot's edges, parity plots carry run ids and the
 * target band. Uses the bundled demo campaign (invented data), where eight runs share
 * t_drop 250 degC, t_cryst 250 degC (its runs.csv) and D11 failed.
 */
class PlotMarksTest {

    static LoadedCampaign lc;
    static WindowMapResult map;

    @BeforeAll
    static void fit(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        lc = LoadedCampaign.open(campaign, PluginRegistry.builder().build());
        CampaignSurrogate sur = CampaignSurrogate.build(lc, PluginRegistry.builder().build(), false, 7);
        Map<String, Object> at = Map.of("ga_amount", 3.0, "ga_rate", 0.1, "as_flux", 3.2e-6, "as_source", "As2");
        map = WindowMap.compute(sur, "t_drop", "t_cryst", at, 9, 0, 7);
    }

    @Test
    void repeatedRecipesShowTheirCountAndFailedRunsComeOnTop() {
        long same = lc.runLog().runs().stream().filter(r -> r.number("t_drop").orElse(0) == 250
                && r.number("t_cryst").orElse(0) == 250).count();
        assertEquals(8, same, "derived from the demo's runs.csv");
        JFreeChart chart = Plots.windowMap(map, lc.runLog().runs(), List.of(), lc.campaign());
        XYPlot plot = chart.getXYPlot();
        List<String> texts = new ArrayList<>();
        for (XYAnnotation a : plot.getAnnotations()) {
            if (a instanceof XYTextAnnotation) {
                texts.add(((XYTextAnnotation) a).getText());
            }
        }
        assertTrue(texts.contains("\u00d7" + same), texts.toString());
        assertEquals(SeriesRenderingOrder.FORWARD, plot.getSeriesRenderingOrder());
        var runs = plot.getDataset(1);
        assertEquals("failed run", runs.getSeriesKey(runs.getSeriesCount() - 1), "failed runs drawn last, on top");
        assertTrue(lc.runLog().runs().stream().anyMatch(r -> !r.ok()), "the demo has a failed run");
    }

    @Test
    void runsOfDifferentKindsAtOneRecipeAreSetSideBySide() {
        JFreeChart chart = Plots.windowMap(map, lc.runLog().runs(), List.of(), lc.campaign());
        var runs = (org.jfree.data.xy.XYSeriesCollection) chart.getXYPlot().getDataset(1);
        // the markers drawn on the row t_cryst = 250 degC within a few marker widths of t_drop = 250 degC
        Map<Double, java.util.Set<String>> kindsAtX = new java.util.TreeMap<>();
        for (int s = 0; s < runs.getSeriesCount(); s++) {
            for (int k = 0; k < runs.getItemCount(s); k++) {
                double x = runs.getXValue(s, k);
                if (runs.getYValue(s, k) == 250 && Math.abs(x - 250) < 10) {
                    kindsAtX.computeIfAbsent(x, q -> new java.util.TreeSet<>()).add((String) runs.getSeriesKey(s));
                }
            }
        }
        // the demo's eight runs there (its runs.csv) are rings and dots, none of them in spec: two kinds
        assertEquals(java.util.Set.of(java.util.Set.of("dot, missed spec"), java.util.Set.of("ring, missed spec")),
                new java.util.HashSet<>(kindsAtX.values()), "one kind per position: " + kindsAtX);
        double step = map.x().fromUnit(map.x().toUnit(250) + WindowMapChart.MARKER_SPREAD_UNITS) - 250;
        Double[] xs = kindsAtX.keySet().toArray(new Double[0]);
        assertEquals(250, (xs[0] + xs[xs.length - 1]) / 2, 1e-9, "centred on the recipe");
        for (int k = 1; k < xs.length; k++) {
            assertEquals(step, xs[k] - xs[k - 1], 1e-9, "a marker's width apart");
        }
    }

    @Test
    void proposalLabelsAvoidEachOtherAndTheEdges() {
        List<double[]> taken = new ArrayList<>();
        TextAnchor a = WindowMapChart.freeAnchor(" 1 ", 0.5, 0.5, taken);
        TextAnchor b = WindowMapChart.freeAnchor(" 2 ", 0.5, 0.5, taken);
        assertNotEquals(a, b, "two proposals at one point get labels on different sides");
        double[] first = taken.get(0);
        double[] second = taken.get(1);
        boolean apart = first[2] <= second[0] || second[2] <= first[0] || first[3] <= second[1] || second[3] <= first[1];
        assertTrue(apart, "the two label boxes do not overlap");
        List<double[]> corner = new ArrayList<>();
        WindowMapChart.freeAnchor(" 3 ", 0.995, 0.995, corner);
        double[] box = corner.get(0);
        assertTrue(box[0] >= 0 && box[1] >= 0 && box[2] <= 1 && box[3] <= 1, "a label at the top right corner turns"
                + " inwards: " + java.util.Arrays.toString(box));
        // the label is drawn at the reserved box's corner, clear of the marker's arms on both axes
        List<double[]> one = new ArrayList<>();
        TextAnchor c = WindowMapChart.freeAnchor(" 4 ", 0.3, 0.6, one);
        double[] p = WindowMapChart.labelPoint(c, 0.3, 0.6);
        double[] r = one.get(0);
        boolean left = c == TextAnchor.BOTTOM_LEFT || c == TextAnchor.TOP_LEFT;
        boolean bottom = c == TextAnchor.BOTTOM_LEFT || c == TextAnchor.BOTTOM_RIGHT;
        assertEquals(left ? r[0] : r[2], p[0], 1e-12);
        assertEquals(bottom ? r[1] : r[3], p[1], 1e-12);
        assertEquals(WindowMapChart.LABEL_GAP_UNITS, Math.abs(p[0] - 0.3), 1e-12);
        assertEquals(WindowMapChart.LABEL_GAP_UNITS, Math.abs(p[1] - 0.6), 1e-12);
    }

    @Test
    void parityPlotsCarryRunIdsAndTheTargetBand() {
        String[] g = {"a", "a", "b"};
        double[] m = {1e10, 2e10, 1e10};
        double[] p = {1.2e10, 1.8e10, 0.9e10};
        double[] lo = {0.8e10, 1.2e10, 0.6e10};
        double[] hi = {1.8e10, 2.6e10, 1.4e10};
        JFreeChart chart = Plots.parity("density (cm-2)", true, g, m, p, lo, hi, new String[] {"R1", "R2", "R3"}, "a",
                5e9, 2e10);
        XYPlot plot = chart.getXYPlot();
        List<String> texts = new ArrayList<>();
        plot.getAnnotations().stream().filter(x -> x instanceof XYTextAnnotation)
                .forEach(x -> texts.add(((XYTextAnnotation) x).getText().strip()));
        assertTrue(texts.contains("R1") && texts.contains("R2") && !texts.contains("R3"), texts.toString());
        assertEquals(1, plot.getDomainMarkers(org.jfree.chart.ui.Layer.BACKGROUND).size());
        assertEquals(1, plot.getRangeMarkers(org.jfree.chart.ui.Layer.BACKGROUND).size());
    }
}
