package dev.terrace.cli.plot;

import dev.terrace.core.window.WindowMapResult;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CrosshairState;
import org.jfree.chart.plot.PlotRenderingInfo;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.PaintScale;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.renderer.xy.XYItemRendererState;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.Range;
import org.jfree.data.xy.XYDataset;
import org.jfree.data.xy.XYZDataset;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Area;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.util.List;

/**
 * Draws a {@link WindowMapResult}'s cells and, right after the last cell and so beneath every
 * marker dataset, its overlays: hatching over cells that break a limit, the class boundaries and
 * the window's edge. Overlays are polylines in data units, flattened as {x0, y0, x1, y1, ...}.
 *
 * <p>Unlike its parent, which draws blocks of one fixed width in data units, each cell is drawn
 * between its own edges, so cells on a {@code scale: log} axis are evenly spaced in log10.
 */
final class MapLayerRenderer extends XYBlockRenderer {

    private static final long serialVersionUID = 1L;

    /** Line casing: a wide white line under a narrow black one reads on dark and light cells alike. */
    static final Stroke CASING = new BasicStroke(4.2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    /** Class boundary: solid. */
    static final Stroke CLASS_EDGE = new BasicStroke(1.6f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    /** Window edge: dashed. */
    static final Stroke WINDOW_EDGE = new BasicStroke(2.0f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
            new float[] {7f, 4f}, 0f);
    /** Window edge at the set point, when a thermocouple error was averaged over: dotted. */
    static final Stroke PLAIN_WINDOW_EDGE = new BasicStroke(1.6f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 10f,
            new float[] {0.5f, 4f}, 0f);
    /** Casing of the dotted line: thinner. */
    static final Stroke THIN_CASING = new BasicStroke(3.2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    /** Hatching of limit-breaking cells. */
    static final Stroke HATCH = new BasicStroke(1.0f);
    /** Fill under the hatching. */
    static final Color INFEASIBLE_FILL = new Color(250, 250, 250);
    /** Colour of the hatching. */
    static final Color HATCH_COLOR = new Color(70, 70, 70);
    /** Spacing of the hatch lines in pixels. */
    static final double HATCH_SPACING = 7;

    /**
     * Raster pixels per chart pixel for the cells: 3, so a 640-pixel-wide figure printed 17 cm wide
     * (96 chart pixels per inch) has about 290 image pixels per inch, print resolution.
     */
    static final int RASTER_SCALE = 3;

    private final transient WindowMapResult map;
    private final double[] xe;
    private final double[] ye;
    private final transient List<double[]> classEdges;
    private final transient List<double[]> window;
    private final transient List<double[]> plainWindow;

    MapLayerRenderer(WindowMapResult map, PaintScale scale, List<double[]> classEdges, List<double[]> window,
                     List<double[]> plainWindow) {
        this.map = map;
        this.xe = map.xEdges();
        this.ye = map.yEdges();
        this.classEdges = classEdges;
        this.window = window;
        this.plainWindow = plainWindow;
        setPaintScale(scale);
    }

    @Override
    public Range findDomainBounds(XYDataset dataset) {
        return new Range(xe[0], xe[xe.length - 1]);
    }

    @Override
    public Range findRangeBounds(XYDataset dataset) {
        return new Range(ye[0], ye[ye.length - 1]);
    }

    @Override
    public void drawItem(Graphics2D g2, XYItemRendererState state, Rectangle2D dataArea, PlotRenderingInfo info,
                         XYPlot plot, ValueAxis domainAxis, ValueAxis rangeAxis, XYDataset dataset, int series,
                         int item, CrosshairState crosshairState, int pass) {
        // all cells are drawn at once, as one raster image, when the last item comes
        if (item != dataset.getItemCount(series) - 1) {
            return;
        }
        drawCells(g2, dataArea, plot, domainAxis, rangeAxis, (XYZDataset) dataset, series);
        drawOverlays(g2, dataArea, plot, domainAxis, rangeAxis);
    }

    /**
     * Draws every cell into one raster image of {@value #RASTER_SCALE} pixels per chart pixel and
     * places it over the data area. One embedded image instead of a filled and outlined rectangle
     * per cell keeps an SVG map small (a 41 x 41 map drawn as vectors was about 0.87 MB of SVG
     * text); the cells are flat colours, so the image compresses well and stays sharp in print.
     */
    private void drawCells(Graphics2D g2, Rectangle2D dataArea, XYPlot plot, ValueAxis xa, ValueAxis ya,
                           XYZDataset dataset, int series) {
        int w = (int) Math.ceil(dataArea.getWidth() * RASTER_SCALE);
        int h = (int) Math.ceil(dataArea.getHeight() * RASTER_SCALE);
        if (w <= 0 || h <= 0) {
            return;
        }
        java.awt.image.BufferedImage img = new java.awt.image.BufferedImage(w, h, java.awt.image.BufferedImage.TYPE_INT_ARGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING, java.awt.RenderingHints.VALUE_ANTIALIAS_OFF);
            int nx = map.nx();
            for (int item = 0; item < dataset.getItemCount(series); item++) {
                int i = item % nx;
                int j = item / nx;
                Rectangle2D b = cell(i, j, dataArea, plot, xa, ya);
                int x0 = (int) Math.round((b.getMinX() - dataArea.getMinX()) * RASTER_SCALE);
                int x1 = (int) Math.round((b.getMaxX() - dataArea.getMinX()) * RASTER_SCALE);
                int y0 = (int) Math.round((b.getMinY() - dataArea.getMinY()) * RASTER_SCALE);
                int y1 = (int) Math.round((b.getMaxY() - dataArea.getMinY()) * RASTER_SCALE);
                double z = dataset.getZValue(series, item);
                g.setPaint(map.feasibleAt(i, j) ? getPaintScale().getPaint(z) : INFEASIBLE_FILL);
                g.fillRect(x0, y0, Math.max(1, x1 - x0), Math.max(1, y1 - y0));
            }
        } finally {
            g.dispose();
        }
        java.awt.geom.AffineTransform at = java.awt.geom.AffineTransform.getTranslateInstance(dataArea.getMinX(),
                dataArea.getMinY());
        at.scale(1.0 / RASTER_SCALE, 1.0 / RASTER_SCALE);
        g2.drawImage(img, at, null);
    }

    private Rectangle2D cell(int i, int j, Rectangle2D dataArea, XYPlot plot, ValueAxis xa, ValueAxis ya) {
        RectangleEdge xEdge = plot.getDomainAxisEdge();
        RectangleEdge yEdge = plot.getRangeAxisEdge();
        double x0 = xa.valueToJava2D(xe[i], dataArea, xEdge);
        double x1 = xa.valueToJava2D(xe[i + 1], dataArea, xEdge);
        double y0 = ya.valueToJava2D(ye[j], dataArea, yEdge);
        double y1 = ya.valueToJava2D(ye[j + 1], dataArea, yEdge);
        return new Rectangle2D.Double(Math.min(x0, x1), Math.min(y0, y1), Math.abs(x1 - x0), Math.abs(y1 - y0));
    }

    private void drawOverlays(Graphics2D g2, Rectangle2D dataArea, XYPlot plot, ValueAxis xa, ValueAxis ya) {
        Area infeasible = new Area();
        for (int j = 0; j < map.ny(); j++) {
            for (int i = 0; i < map.nx(); i++) {
                if (!map.feasibleAt(i, j)) {
                    infeasible.add(new Area(cell(i, j, dataArea, plot, xa, ya)));
                }
            }
        }
        if (!infeasible.isEmpty()) {
            Shape oldClip = g2.getClip();
            g2.clip(infeasible);
            Rectangle2D b = infeasible.getBounds2D();
            g2.setPaint(HATCH_COLOR);
            g2.setStroke(HATCH);
            for (double s = -b.getHeight(); s < b.getWidth(); s += HATCH_SPACING) {
                g2.draw(new Line2D.Double(b.getMinX() + s, b.getMaxY(), b.getMinX() + s + b.getHeight(), b.getMinY()));
            }
            g2.setClip(oldClip);
        }
        Path2D classes = path(classEdges, dataArea, plot, xa, ya);
        Path2D win = path(window, dataArea, plot, xa, ya);
        Path2D plain = path(plainWindow, dataArea, plot, xa, ya);
        Shape oldClip = g2.getClip();
        g2.clip(dataArea);
        g2.setPaint(Color.WHITE);
        g2.setStroke(THIN_CASING);
        g2.draw(plain);
        g2.setStroke(CASING);
        g2.draw(classes);
        g2.draw(win);
        g2.setPaint(Color.BLACK);
        g2.setStroke(PLAIN_WINDOW_EDGE);
        g2.draw(plain);
        g2.setStroke(CLASS_EDGE);
        g2.draw(classes);
        g2.setStroke(WINDOW_EDGE);
        g2.draw(win);
        g2.setClip(oldClip);
    }

    private static Path2D path(List<double[]> segments, Rectangle2D dataArea, XYPlot plot, ValueAxis xa, ValueAxis ya) {
        Path2D.Double p = new Path2D.Double();
        RectangleEdge xEdge = plot.getDomainAxisEdge();
        RectangleEdge yEdge = plot.getRangeAxisEdge();
        for (double[] s : segments) {
            p.moveTo(xa.valueToJava2D(s[0], dataArea, xEdge), ya.valueToJava2D(s[1], dataArea, yEdge));
            for (int k = 2; k + 1 < s.length; k += 2) {
                p.lineTo(xa.valueToJava2D(s[k], dataArea, xEdge), ya.valueToJava2D(s[k + 1], dataArea, yEdge));
            }
        }
        return p;
    }
}
