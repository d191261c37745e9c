package dev.terrace.cli.plot;

import dev.terrace.core.window.ParetoFront;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.renderer.xy.XYStepRenderer;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import java.awt.BasicStroke;
import java.awt.Color;
import java.util.Locale;

import static dev.terrace.cli.plot.ChartStyle.*;

/**
 * The yield/cost front chart (see {@link Plots#pareto}).
 *
 * @since 0.1
 */
final class ParetoChart {

    private ParetoChart() {
    }

    /**
     * The yield/cost front: each recipe of the front as a numbered marker, joined by the step line
     * of the best yield reachable for a given cost.
     *
     * @param front the front
     * @return the chart; never null
     */
    public static JFreeChart pareto(ParetoFront front) {
        XYSeries s = new XYSeries("front", false, true);
        for (ParetoFront.FrontPoint p : front.points()) {
            s.add(p.cost(), p.yield());
        }
        String costLabel = front.costName().replace(" x ", " \u00d7 ") + " (" + front.costUnit().replace("Torr s", "Torr\u00b7s") + ")";
        ValueAxis xa;
        double cmin = s.getItemCount() > 0 ? s.getMinX() : 1;
        double cmax = s.getItemCount() > 0 ? s.getMaxX() : 10;
        if (cmin > 0 && cmax / cmin > 30) {
            xa = new DecadeAxis(costLabel + ", log scale");
            xa.setRange(cmin / 1.3, cmax * 1.3);
        } else {
            NumberAxis na = new NumberAxis(costLabel);
            na.setAutoRangeIncludesZero(true);
            xa = na;
            xa.setRange(0, Math.max(cmax * 1.08, 1e-12));
        }
        xa.setAutoRange(false);
        NumberAxis ya = new NumberAxis("predicted yield (probability of meeting every target)");
        ya.setRange(0, 1.02);
        XYStepRenderer step = new XYStepRenderer();
        step.setSeriesPaint(0, INK);
        step.setSeriesStroke(0, new BasicStroke(1.3f));
        XYLineAndShapeRenderer marks = markerRenderer();
        styleMarker(marks, 0, MarkerShapes.forClass(0), INK, Color.WHITE);
        XYSeriesCollection data = new XYSeriesCollection(s);
        XYPlot plot = new XYPlot(data, xa, ya, marks);
        plot.setDataset(1, data);
        plot.setRenderer(1, step);
        plot.setDatasetRenderingOrder(DatasetRenderingOrder.REVERSE); // markers over the line
        stylePlain(plot);
        int n = front.points().size();
        int every = Math.max(1, (int) Math.ceil(n / 20.0));
        for (int k = 0; k < n; k++) {
            if (k % every == 0 || k == n - 1) {
                ParetoFront.FrontPoint p = front.points().get(k);
                XYTextAnnotation t = new XYTextAnnotation(" " + (k + 1), p.cost(), p.yield());
                t.setFont(SUBTITLE_FONT);
                t.setTextAnchor(TextAnchor.TOP_LEFT);
                plot.addAnnotation(t);
            }
        }
        LegendItemCollection legend = new LegendItemCollection();
        legend.add(markerItem("recipe on the front (numbered by cost)", MarkerShapes.forClass(0), INK, Color.WHITE));
        legend.add(lineItem("best predicted yield for a given cost", new BasicStroke(1.3f)));
        plot.setFixedLegendItems(legend);
        JFreeChart chart = new JFreeChart("Yield against " + front.costName().replace(" x ", " \u00d7 "), TITLE_FONT, plot,
                false);
        chart.addSubtitle(text(String.format(Locale.ROOT, "%d recipes, none beaten on both yield and cost by another "
                        + "(NSGA-II, population %d, %d generations, seed %d). Predictions, not measurements.", n,
                front.populationSize(), front.generations(), front.seed())));
        finish(chart, plot);
        return chart;
    }
}
