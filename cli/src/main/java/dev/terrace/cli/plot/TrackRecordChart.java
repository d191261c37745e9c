package dev.terrace.cli.plot;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

import java.awt.BasicStroke;
import java.awt.Color;

import static dev.terrace.cli.plot.ChartStyle.*;

/**
 * The track record of past proposals for one outcome (see {@link Plots#trackRecord}): per grown
 * proposal, the 90 % interval and mean that were predicted, and what was measured.
 *
 * @since 0.4
 */
final class TrackRecordChart {

    /** Fill of the target band: a light grey that every marker reads on. */
    static final Color TARGET_BAND = new Color(225, 225, 225);

    private TrackRecordChart() {
    }

    static JFreeChart chart(String quantity, boolean logScale, String[] labels, double[] predicted, double[] lo90,
                            double[] hi90, double[] measured, double targetMin, double targetMax) {
        int n = labels.length;
        if (predicted.length != n || lo90.length != n || hi90.length != n || measured.length != n) {
            throw new IllegalArgumentException("track-record data arrays differ in length");
        }
        if (n == 0) {
            throw new IllegalArgumentException("no grown proposal to draw");
        }
        YIntervalSeries pred = new YIntervalSeries("predicted (dot) with its 90 % interval", false, true);
        XYSeries meas = new XYSeries("measured", false, true);
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < n; k++) {
            if (usable(predicted[k], logScale) && usable(lo90[k], logScale) && usable(hi90[k], logScale)) {
                pred.add(k, predicted[k], lo90[k], hi90[k]);
                lo = Math.min(lo, lo90[k]);
                hi = Math.max(hi, hi90[k]);
            }
            if (usable(measured[k], logScale)) {
                meas.add(k, measured[k]);
                lo = Math.min(lo, measured[k]);
                hi = Math.max(hi, measured[k]);
            }
        }
        boolean band = Double.isFinite(targetMin) || Double.isFinite(targetMax);
        // the axis shows the band's finite edges, so the band reads as a band and not as the background
        for (double t : new double[] {targetMin, targetMax}) {
            if (usable(t, logScale)) {
                lo = Math.min(lo, t);
                hi = Math.max(hi, t);
            }
        }
        if (!(hi > lo)) {
            lo = logScale ? (lo > 0 && Double.isFinite(lo) ? lo / 2 : 1) : (Double.isFinite(lo) ? lo - 1 : 0);
            hi = logScale ? lo * 4 : lo + 2;
        }
        double axLo = logScale ? lo / 1.25 : lo - 0.08 * (hi - lo);
        double axHi = logScale ? hi * 1.25 : hi + 0.08 * (hi - lo);
        XYErrorRenderer er = new XYErrorRenderer();
        er.setDefaultLinesVisible(false);
        er.setDrawXError(false);
        er.setDrawYError(true);
        er.setErrorPaint(INK);
        er.setErrorStroke(new BasicStroke(1.2f));
        er.setCapLength(8);
        er.setSeriesShape(0, new java.awt.geom.Ellipse2D.Double(-2.5, -2.5, 5, 5));
        er.setSeriesPaint(0, INK);
        ValueAxis ya = logScale ? new DecadeAxis(quantity + ", log scale") : new NumberAxis(quantity);
        ya.setRange(axLo, axHi);
        ya.setAutoRange(false);
        SymbolAxis xa = new SymbolAxis("grown proposal (run id)", labels);
        xa.setRange(-0.6, n - 0.4);
        xa.setGridBandsVisible(false);
        XYPlot plot = new XYPlot(new YIntervalSeriesCollection(), xa, ya, er);
        YIntervalSeriesCollection pc = new YIntervalSeriesCollection();
        pc.addSeries(pred);
        plot.setDataset(0, pc);
        XYLineAndShapeRenderer mr = markerRenderer();
        styleMarker(mr, 0, MarkerShapes.forClass(1), Color.WHITE, INK);
        plot.setDataset(1, new XYSeriesCollection(meas));
        plot.setRenderer(1, mr);
        // measured markers on top of the intervals
        plot.setDatasetRenderingOrder(org.jfree.chart.plot.DatasetRenderingOrder.FORWARD);
        if (band) {
            double bLo = Double.isFinite(targetMin) ? targetMin : axLo;
            double bHi = Double.isFinite(targetMax) ? targetMax : axHi;
            IntervalMarker m = new IntervalMarker(bLo, bHi, TARGET_BAND);
            m.setOutlinePaint(null);
            plot.addRangeMarker(m, Layer.BACKGROUND);
        }
        stylePlain(plot);
        LegendItemCollection legend = new LegendItemCollection();
        legend.add(lineItem("predicted mean (dot) and 90 % interval when proposed", new BasicStroke(1.2f)));
        legend.add(markerItem("measured", MarkerShapes.forClass(1), Color.WHITE, INK));
        if (band) {
            legend.add(new org.jfree.chart.LegendItem("target band", null, null, null,
                    new java.awt.geom.Rectangle2D.Double(-7, -5, 14, 10), TARGET_BAND));
        }
        plot.setFixedLegendItems(legend);
        JFreeChart chart = new JFreeChart("Track record: " + quantity, TITLE_FONT, plot, false);
        chart.addSubtitle(text("Each grown proposal: what was predicted when it was proposed, and what was measured."));
        finish(chart, plot);
        return chart;
    }

    private static boolean usable(double v, boolean logScale) {
        return Double.isFinite(v) && (!logScale || v > 0);
    }
}
