package dev.terrace.cli.plot;

import dev.terrace.core.validate.ParityPoint;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.annotations.XYLineAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Paint;
import java.awt.Shape;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static dev.terrace.cli.plot.ChartStyle.*;

/**
 * Predicted-against-measured (parity) charts (see {@link Plots#parity}).
 *
 * @since 0.1
 */
final class ParityChart {

    private ParityChart() {
    }

    /**
     * Predicted against measured values with 90 % prediction intervals and the 1:1 line, one
     * marker shape per group (for instance per surrogate: physics + GP, GP only).
     *
     * @param quantity  what is compared, with its unit, for example "dot_density (cm^-2)"
     * @param logScale  true for log axes (outcomes with {@code scale: log}; values must be &gt; 0)
     * @param groups    the group of each point (a legend entry each); never null
     * @param measured  measured values
     * @param predicted predicted values (mean or median)
     * @param lo90      lower ends of the 90 % intervals
     * @param hi90      upper ends of the 90 % intervals
     * @return the chart; never null
     * @throws IllegalArgumentException when the arrays differ in length
     */
    public static JFreeChart parity(String quantity, boolean logScale, String[] groups, double[] measured,
                                    double[] predicted, double[] lo90, double[] hi90) {
        int n = measured.length;
        if (groups.length != n || predicted.length != n || lo90.length != n || hi90.length != n) {
            throw new IllegalArgumentException("parity data arrays differ in length");
        }
        YIntervalSeriesCollection data = new YIntervalSeriesCollection();
        Map<String, YIntervalSeries> series = new LinkedHashMap<>();
        List<String> groupOrder = new ArrayList<>();
        for (String g : groups) {
            if (!groupOrder.contains(g)) {
                groupOrder.add(g);
            }
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < n; k++) {
            double m = measured[k];
            double p = predicted[k];
            if (Double.isFinite(m) && Double.isFinite(p) && (!logScale || (m > 0 && p > 0))) {
                lo = Math.min(lo, m);
                hi = Math.max(hi, m);
            }
        }
        // groups sit side by side, DODGE of the measured range apart, so their bars do not hide each other
        double dodge = groupOrder.size() < 2 || !(hi > lo) ? 0
                : DODGE * (logScale ? Math.log10(hi / lo) : hi - lo);
        lo = Double.POSITIVE_INFINITY;
        hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < n; k++) {
            double m = measured[k];
            double p = predicted[k];
            if (!Double.isFinite(m) || !Double.isFinite(p) || (logScale && (m <= 0 || p <= 0))) {
                continue;
            }
            double l = Double.isFinite(lo90[k]) ? lo90[k] : p;
            double h = Double.isFinite(hi90[k]) ? hi90[k] : p;
            if (logScale) {
                l = l > 0 ? l : p;
            }
            double shift = dodge * (groupOrder.indexOf(groups[k]) - (groupOrder.size() - 1) / 2.0);
            double xm = logScale ? m * Math.pow(10, shift) : m + shift;
            series.computeIfAbsent(groups[k], g -> new YIntervalSeries(g, false, true)).add(xm, p, l, h);
            lo = Math.min(lo, Math.min(m, l));
            hi = Math.max(hi, Math.max(m, h));
        }
        if (!(hi > lo)) {
            lo = logScale ? 1 : 0;
            hi = logScale ? 10 : 1;
        }
        double pad = logScale ? 0 : 0.05 * (hi - lo);
        double axLo = logScale ? lo / 1.25 : lo - pad;
        double axHi = logScale ? hi * 1.25 : hi + pad;
        XYErrorRenderer r = new XYErrorRenderer();
        r.setDefaultLinesVisible(false);
        r.setDrawXError(false);
        r.setDrawYError(true);
        r.setErrorPaint(INK);
        r.setErrorStroke(new BasicStroke(1.0f));
        r.setCapLength(6);
        r.setUseFillPaint(true);
        r.setUseOutlinePaint(true);
        r.setDrawOutlines(true);
        LegendItemCollection legend = new LegendItemCollection();
        int s = 0;
        for (YIntervalSeries ys : series.values()) {
            data.addSeries(ys);
            Shape shape = MarkerShapes.forClass(s);
            Paint fill = s % 2 == 0 ? INK : Color.WHITE;
            r.setSeriesShape(s, shape);
            r.setSeriesShapesFilled(s, true);
            r.setSeriesFillPaint(s, fill);
            r.setSeriesOutlinePaint(s, INK);
            r.setSeriesOutlineStroke(s, MARKER_OUTLINE);
            r.setSeriesPaint(s, INK);
            legend.add(markerItem(String.valueOf(ys.getKey()), shape, fill, INK));
            s++;
        }
        legend.add(lineItem("90 % prediction interval", new BasicStroke(1.0f)));
        legend.add(lineItem("1:1 line (prediction = measurement)", DASHED));
        ValueAxis xa = logScale ? new DecadeAxis("measured " + quantity) : new NumberAxis("measured " + quantity);
        ValueAxis ya = logScale ? new DecadeAxis("predicted " + quantity) : new NumberAxis("predicted " + quantity);
        for (ValueAxis a : new ValueAxis[] {xa, ya}) {
            a.setRange(axLo, axHi);
            a.setAutoRange(false);
        }
        XYPlot plot = new XYPlot(data, xa, ya, r);
        plot.addAnnotation(new XYLineAnnotation(axLo, axLo, axHi, axHi, DASHED, INK));
        stylePlain(plot);
        plot.setFixedLegendItems(legend);
        JFreeChart chart = new JFreeChart("Predicted against measured: " + quantity, TITLE_FONT, plot, false);
        chart.addSubtitle(text("Each prediction made without the run it is compared with; bars are 90 % intervals."
                + (dodge > 0 ? " Groups are set slightly apart along the measured axis for legibility." : "")));
        finish(chart, plot);
        return chart;
    }

    /**
     * Parity chart of held-out predictions, grouped by surrogate, with the points of one group
     * labelled with their run ids and the target band shaded (see the array form below).
     *
     * @param quantity   what is compared, with its unit
     * @param logScale   true for log axes
     * @param points     the held-out predictions; never null
     * @param labelGroup the surrogate whose points carry their run id
     * @param targetMin  lower end of the target, -infinity for none (NaN: no band)
     * @param targetMax  upper end of the target, +infinity for none (NaN: no band)
     * @return the chart; never null
     */
    public static JFreeChart parity(String quantity, boolean logScale, List<ParityPoint> points, String labelGroup,
                                    double targetMin, double targetMax) {
        int n = points.size();
        String[] g = new String[n];
        String[] ids = new String[n];
        double[] m = new double[n];
        double[] p = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        for (int k = 0; k < n; k++) {
            ParityPoint q = points.get(k);
            g[k] = q.surrogate();
            ids[k] = q.runId();
            m[k] = q.measured();
            p[k] = q.predicted();
            lo[k] = q.lo90();
            hi[k] = q.hi90();
        }
        return parity(quantity, logScale, g, m, p, lo, hi, ids, labelGroup, targetMin, targetMax);
    }

    /**
     * As {@link #parity(String, boolean, String[], double[], double[], double[], double[])}, with
     * each point of one group labelled with its run id and the target band shaded on both axes.
     *
     * @param quantity   what is compared, with its unit
     * @param logScale   true for log axes
     * @param groups     the group of each point
     * @param measured   measured values
     * @param predicted  predicted values
     * @param lo90       lower ends of the 90 % intervals
     * @param hi90       upper ends of the 90 % intervals
     * @param runIds     the run id of each point
     * @param labelGroup the group whose points carry their run id (the others would repeat the ids)
     * @param targetMin  lower end of the target, -infinity for none (NaN: no band)
     * @param targetMax  upper end of the target, +infinity for none (NaN: no band)
     * @return the chart; never null
     */
    public static JFreeChart parity(String quantity, boolean logScale, String[] groups, double[] measured,
                                    double[] predicted, double[] lo90, double[] hi90, String[] runIds,
                                    String labelGroup, double targetMin, double targetMax) {
        if (runIds.length != measured.length) {
            throw new IllegalArgumentException("parity data arrays differ in length");
        }
        JFreeChart chart = parity(quantity, logScale, groups, measured, predicted, lo90, hi90);
        XYPlot plot = chart.getXYPlot();
        boolean band = !Double.isNaN(targetMin) && !Double.isNaN(targetMax)
                && (Double.isFinite(targetMin) || Double.isFinite(targetMax));
        if (band) {
            for (boolean domain : new boolean[] {true, false}) {
                ValueAxis a = domain ? plot.getDomainAxis() : plot.getRangeAxis();
                double lo = Double.isFinite(targetMin) ? targetMin : a.getLowerBound();
                double hi = Double.isFinite(targetMax) ? targetMax : a.getUpperBound();
                org.jfree.chart.plot.IntervalMarker m = new org.jfree.chart.plot.IntervalMarker(lo, hi,
                        new Color(120, 120, 120, 40));
                m.setOutlinePaint(null);
                if (domain) {
                    plot.addDomainMarker(m, org.jfree.chart.ui.Layer.BACKGROUND);
                } else {
                    plot.addRangeMarker(m, org.jfree.chart.ui.Layer.BACKGROUND);
                }
            }
            LegendItemCollection legend = plot.getFixedLegendItems();
            legend.add(new org.jfree.chart.LegendItem("target band (grey)", null, null, null,
                    new java.awt.geom.Rectangle2D.Double(-7, -5, 14, 10), new Color(120, 120, 120, 80)));
            plot.setFixedLegendItems(legend);
        }
        for (int k = 0; k < measured.length; k++) {
            if (!groups[k].equals(labelGroup) || runIds[k] == null || !Double.isFinite(measured[k])
                    || !Double.isFinite(predicted[k]) || (logScale && (measured[k] <= 0 || predicted[k] <= 0))) {
                continue;
            }
            org.jfree.chart.annotations.XYTextAnnotation t = new org.jfree.chart.annotations.XYTextAnnotation(
                    " " + runIds[k], measured[k], predicted[k]);
            t.setFont(SUBTITLE_FONT);
            t.setPaint(INK);
            t.setTextAnchor(org.jfree.chart.ui.TextAnchor.BOTTOM_LEFT);
            plot.addAnnotation(t);
        }
        return chart;
    }

    /**
     * Horizontal offset between groups of a parity plot, as a share of the measured range (on
     * log10 for log axes); small enough not to mislead, large enough to separate the bars.
     */
    static final double DODGE = 0.012;
}
