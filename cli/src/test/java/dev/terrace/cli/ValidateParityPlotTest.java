package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.validate.OutcomeValidation;
import dev.terrace.core.validate.ParityPoint;
import dev.terrace.core.validate.Validation;
import dev.terrace.demo.DemoCampaign;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.ui.Layer;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code validate --plots} draws its parity charts as the report does: run ids on the proposal
 * surrogate's points and the campaign's target band. Uses the bundled demo campaign (invented
 * data), whose target on dot_diameter is 30 to 45 nm (its campaign.yaml); the points are invented.
 */
class ValidateParityPlotTest {

    @Test
    void parityChartsCarryRunIdsAndTheTargetBand(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        LoadedCampaign lc = LoadedCampaign.open(campaign, PluginRegistry.builder().build());
        OutcomeValidation o = new OutcomeValidation("dot_diameter", "linear", Map.of(), List.of(
                new ParityPoint(Validation.PHYSICS_GP, "D01", 33.2, 32.5, 29.0, 36.0),
                new ParityPoint(Validation.PHYSICS_GP, "D02", 14.8, 18.0, 12.0, 24.0),
                new ParityPoint(Validation.GP, "D01", 33.2, 30.0, 25.0, 35.0)));
        JFreeChart chart = ValidateCommand.parityChart(lc.campaign(), o);
        XYPlot plot = chart.getXYPlot();
        List<String> ids = plot.getAnnotations().stream().filter(a -> a instanceof XYTextAnnotation)
                .map(a -> ((XYTextAnnotation) a).getText().strip()).toList();
        assertEquals(List.of("D01", "D02"), ids, "only the proposal surrogate's points are labelled, once each");
        var band = (IntervalMarker) plot.getDomainMarkers(Layer.BACKGROUND).iterator().next();
        assertEquals(30, band.getStartValue(), 0.0);
        assertEquals(45, band.getEndValue(), 0.0);
        assertEquals(1, plot.getRangeMarkers(Layer.BACKGROUND).size(), "the band is shaded on both axes");
        assertTrue(chart.getXYPlot().getFixedLegendItems().getItemCount() > 0);
    }
}
