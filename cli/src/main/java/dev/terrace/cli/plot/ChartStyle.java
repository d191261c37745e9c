package dev.terrace.cli.plot;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;

/**
 * The shared look of Terrace's charts: fonts, ink, markers, legends and titles.
 *
 * @since 0.1
 */
final class ChartStyle {

    private ChartStyle() {
    }

    /** Chart title font. */
    static final Font TITLE_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 16);
    static final Font SUBTITLE_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
    static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 12);
    static final Stroke MARKER_OUTLINE = new BasicStroke(1.4f);
    static final Color INK = Color.BLACK;

    /** Dashed line, for the 1:1 line and reference lines. */
    static final Stroke DASHED = new BasicStroke(1.3f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
            new float[] {6f, 4f}, 0f);

    static XYLineAndShapeRenderer markerRenderer() {
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        r.setUseFillPaint(true);
        r.setUseOutlinePaint(true);
        r.setDrawOutlines(true);
        return r;
    }

    static void styleMarker(XYLineAndShapeRenderer r, int s, Shape shape, Paint fill, Paint outline) {
        r.setSeriesShape(s, shape);
        r.setSeriesShapesFilled(s, true);
        r.setSeriesFillPaint(s, fill);
        r.setSeriesOutlinePaint(s, outline);
        r.setSeriesOutlineStroke(s, MARKER_OUTLINE);
        r.setSeriesPaint(s, fill);
    }

    static LegendItem markerItem(String label, Shape shape, Paint fill, Paint outline) {
        // on the white legend a white outline would vanish: outline in black there
        Paint o = fill == INK ? INK : outline;
        return new LegendItem(label, null, null, null, true, shape, true, fill, true, o, MARKER_OUTLINE, false,
                new Line2D.Double(), new BasicStroke(1f), INK);
    }

    static LegendItem lineItem(String label, Stroke stroke) {
        return new LegendItem(label, null, null, null, false, new Rectangle2D.Double(), false, INK, false, INK,
                stroke, true, new Line2D.Double(-14, 0, 14, 0), stroke, INK);
    }

    static XYTextAnnotation boxed(String s, double x, double y, TextAnchor anchor) {
        XYTextAnnotation t = new XYTextAnnotation(s, x, y);
        t.setFont(LABEL_FONT);
        t.setPaint(INK);
        t.setTextAnchor(anchor);
        t.setBackgroundPaint(Color.WHITE);
        t.setOutlineVisible(true);
        t.setOutlinePaint(INK);
        t.setOutlineStroke(new BasicStroke(0.8f));
        return t;
    }

    static TextTitle text(String s) {
        TextTitle t = new TextTitle(s, SUBTITLE_FONT);
        t.setPaint(INK);
        t.setMaximumLinesToDisplay(3);
        return t;
    }

    static void stylePlain(XYPlot plot) {
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(200, 200, 200));
        plot.setRangeGridlinePaint(new Color(200, 200, 200));
        plot.setOutlinePaint(INK);
    }

    static void finish(JFreeChart chart, XYPlot plot) {
        chart.setBackgroundPaint(Color.WHITE);
        LegendTitle lt = new LegendTitle(plot);
        lt.setPosition(RectangleEdge.BOTTOM);
        lt.setFrame(new BlockBorder(INK));
        lt.setItemFont(SUBTITLE_FONT);
        lt.setMargin(new RectangleInsets(6, 6, 6, 6));
        chart.addSubtitle(lt);
    }
}
