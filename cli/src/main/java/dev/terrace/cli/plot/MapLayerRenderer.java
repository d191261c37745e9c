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
        // all cells are drawn at once, merged by colour, when the last item comes
        if (item != dataset.getItemCount(series) - 1) {
            return;
        }
        drawCells(g2, dataArea, plot, domainAxis, rangeAxis, (XYZDataset) dataset, series);
        drawOverlays(g2, dataArea, plot, domainAxis, rangeAxis);
    }

    /**
     * Draws the cells as one filled outline per colour: cells of a row with the same colour are
     * merged into one rectangle, and the rectangles of each colour joined into one area. The paint
     * scale has a few dozen steps, so an SVG map holds a few dozen paths instead of a filled and
     * outlined rectangle per cell (a 41 x 41 map drawn cell by cell was about 0.87 MB of SVG text),
     * and a joined area has no hairline seams inside it.
     */
    private void drawCells(Graphics2D g2, Rectangle2D dataArea, XYPlot plot, ValueAxis xa, ValueAxis ya,
                           XYZDataset dataset, int series) {
        int nx = map.nx();
        int ny = map.ny();
        java.awt.Paint[] paints = new java.awt.Paint[nx * ny];
        for (int item = 0; item < dataset.getItemCount(series) && item < paints.length; item++) {
            int i = item % nx;
            int j = item / nx;
            paints[item] = map.feasibleAt(i, j) ? getPaintScale().getPaint(dataset.getZValue(series, item))
                    : INFEASIBLE_FILL;
        }
        java.util.Map<java.awt.Paint, Area> byPaint = new java.util.LinkedHashMap<>();
        for (int j = 0; j < ny; j++) {
            int i = 0;
            while (i < nx) {
                java.awt.Paint p = paints[j * nx + i];
                int end = i;
                while (end + 1 < nx && java.util.Objects.equals(paints[j * nx + end + 1], p)) {
                    end++;
                }
                if (p != null) {
                    Rectangle2D a = cell(i, j, dataArea, plot, xa, ya);
                    Rectangle2D b = cell(end, j, dataArea, plot, xa, ya);
                    byPaint.computeIfAbsent(p, k -> new Area()).add(new Area(a.createUnion(b)));
                }
                i = end + 1;
            }
        }
        Object aa = g2.getRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING);
        // no antialiasing at the joins between colours, so no light seams show between them
        g2.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING, java.awt.RenderingHints.VALUE_ANTIALIAS_OFF);
        for (java.util.Map.Entry<java.awt.Paint, Area> e : byPaint.entrySet()) {
            g2.setPaint(e.getKey());
            g2.fill(e.getValue());
        }
        g2.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING,
                aa == null ? java.awt.RenderingHints.VALUE_ANTIALIAS_DEFAULT : aa);
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
