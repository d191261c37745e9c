package dev.terrace.cli.plot;

import dev.terrace.core.fit.Arrhenius;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;
import java.util.Locale;

import static dev.terrace.cli.plot.ChartStyle.*;

/**
 * Arrhenius plots of densities (see {@link Plots#arrhenius}).
 *
 * @since 0.1
 */
final class ArrheniusChart {

    private ArrheniusChart() {
    }

    /**
     * An Arrhenius plot of island or droplet densities: density (log axis) against 1/kT with the
     * line of slope {@code energyEv} through the points' centroid and, when the interval is given,
     * the band swept by slopes from {@code lo} to {@code hi} pivoting there (the 95 % interval of
     * {@link Arrhenius}).
     *
     * @param temperaturesK temperatures in K
     * @param densities     densities in cm^-2, &gt; 0
     * @param energyEv      fitted activation energy E in eV (density ∝ exp(E/kT)); NaN to fit here
     *                      with {@link Arrhenius#fit}
     * @param lo            lower end of E's interval, or NaN
     * @param hi            upper end of E's interval, or NaN
     * @return the chart; never null
     * @throws IllegalArgumentException with fewer than two usable points
     */
    public static JFreeChart arrhenius(double[] temperaturesK, double[] densities, double energyEv, double lo,
                                       double hi) {
        return arrhenius(temperaturesK, densities, energyEv, lo, hi, "island density (" + Labels.unit("cm^-2") + ")");
    }

    /**
     * As {@link #arrhenius(double[], double[], double, double, double)} with a label for the
     * density axis.
     *
     * @param temperaturesK temperatures in K
     * @param densities     densities, &gt; 0
     * @param energyEv      fitted activation energy in eV, or NaN to fit here
     * @param lo            lower end of its interval, or NaN
     * @param hi            upper end of its interval, or NaN
     * @param densityLabel  label of the density axis, with its unit
     * @return the chart; never null
     */
    public static JFreeChart arrhenius(double[] temperaturesK, double[] densities, double energyEv, double lo,
                                       double hi, String densityLabel) {
        if (temperaturesK.length != densities.length) {
            throw new IllegalArgumentException("temperatures and densities differ in length");
        }
        double e = energyEv;
        double elo = lo;
        double ehi = hi;
        if (!Double.isFinite(e)) {
            Arrhenius a = Arrhenius.fit(temperaturesK, densities);
            e = a.energyEv();
            elo = a.lo();
            ehi = a.hi();
        }
        int n = temperaturesK.length;
        double[] x = new double[n];
        double mx = 0;
        double my = 0;
        int used = 0;
        XYSeries pts = new XYSeries("measured", false, true);
        for (int k = 0; k < n; k++) {
            if (!(temperaturesK[k] > 0) || !(densities[k] > 0)) {
                continue;
            }
            x[k] = 1 / (Arrhenius.BOLTZMANN_EV_PER_K * temperaturesK[k]);
            pts.add(x[k], densities[k]);
            mx += x[k];
            my += Math.log(densities[k]);
            used++;
        }
        if (used < 2) {
            throw new IllegalArgumentException("an Arrhenius plot needs at least two positive points");
        }
        mx /= used;
        my /= used;
        double xmin = pts.getMinX();
        double xmax = pts.getMaxX();
        double span = Math.max(xmax - xmin, 1e-9 * Math.abs(xmax));
        double x0 = xmin - 0.05 * span;
        double x1 = xmax + 0.05 * span;
        YIntervalSeries fit = new YIntervalSeries("fit, E = " + Labels.num(e) + " eV", false, true);
        boolean band = Double.isFinite(elo) && Double.isFinite(ehi);
        int steps = 40;
        double ymin = pts.getMinY();
        double ymax = pts.getMaxY();
        for (int k = 0; k <= steps; k++) {
            double xv = x0 + (x1 - x0) * k / steps;
            double y = Math.exp(my + e * (xv - mx));
            double ya = band ? Math.exp(my + elo * (xv - mx)) : y;
            double yb = band ? Math.exp(my + ehi * (xv - mx)) : y;
            fit.add(xv, y, Math.min(ya, yb), Math.max(ya, yb));
            ymin = Math.min(ymin, Math.min(ya, yb));
            ymax = Math.max(ymax, Math.max(ya, yb));
        }
        YIntervalSeriesCollection fitData = new YIntervalSeriesCollection();
        fitData.addSeries(fit);
        DeviationRenderer dr = new DeviationRenderer(true, false);
        dr.setSeriesPaint(0, INK);
        dr.setSeriesStroke(0, new BasicStroke(1.6f));
        dr.setSeriesFillPaint(0, new Color(190, 190, 190));
        dr.setAlpha(0.6f);
        XYSeriesCollection pointData = new XYSeriesCollection(pts);
        XYLineAndShapeRenderer pr = markerRenderer();
        styleMarker(pr, 0, MarkerShapes.forClass(0), INK, Color.WHITE);
        NumberAxis xa = new NumberAxis("1/kT (1/eV)");
        xa.setAutoRangeIncludesZero(false);
        xa.setRange(x0, x1);
        DecadeAxis ya = new DecadeAxis(densityLabel + ", log scale");
        ya.setRange(ymin / 1.3, ymax * 1.3);
        ya.setAutoRange(false);
        XYPlot plot = new XYPlot(pointData, xa, ya, pr);
        plot.setDataset(1, fitData);
        plot.setRenderer(1, dr);
        plot.setDatasetRenderingOrder(DatasetRenderingOrder.REVERSE); // band under the points
        stylePlain(plot);
        LegendItemCollection legend = new LegendItemCollection();
        legend.add(markerItem("measured", MarkerShapes.forClass(0), INK, Color.WHITE));
        legend.add(lineItem("fit, E = " + Labels.num(e) + " eV", new BasicStroke(1.6f)));
        if (band) {
            legend.add(new LegendItem("95 % interval of E: " + Labels.num(elo) + " to " + Labels.num(ehi) + " eV", null,
                    null, null, true, new Rectangle2D.Double(-7, -5, 14, 10), true, new Color(190, 190, 190), true, INK,
                    new BasicStroke(0.8f), false, new Line2D.Double(), new BasicStroke(1f), INK));
        }
        plot.setFixedLegendItems(legend);
        JFreeChart chart = new JFreeChart("Arrhenius plot: density against 1/kT", TITLE_FONT, plot, false);
        double tLo = Double.POSITIVE_INFINITY;
        double tHi = 0;
        for (double t : temperaturesK) {
            if (t > 0) {
                tLo = Math.min(tLo, t);
                tHi = Math.max(tHi, t);
            }
        }
        chart.addSubtitle(text(String.format(Locale.ROOT, "%d points from %s K to %s K (%s to %s \u00b0C); "
                        + "density \u221d exp(E/kT), so E > 0 when the density falls with temperature.", used,
                Labels.num(tLo), Labels.num(tHi), Labels.num(tLo - 273.15), Labels.num(tHi - 273.15))));
        finish(chart, plot);
        return chart;
    }
}
