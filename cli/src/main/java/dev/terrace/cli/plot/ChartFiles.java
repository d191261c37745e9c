package dev.terrace.cli.plot;

import dev.terrace.core.campaign.Target;
import dev.terrace.core.io.SafeFiles;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.text.TextUtils;
import org.jfree.svg.SVGGraphics2D;
import java.awt.geom.Rectangle2D;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.Locale;

import static dev.terrace.cli.plot.ChartStyle.*;

/**
 * Writing charts as PNG or self-contained SVG, always through an atomic write.
 *
 * @since 0.1
 */
final class ChartFiles {

    private ChartFiles() {
    }

    /** Fixed prefix of the ids of an SVG's clip paths and gradients (see {@link #toSvg}). */
    static final String SVG_DEFS_PREFIX = "terrace";

    /**
     * Renders a chart as a self-contained SVG document (text stays text; no external files, no
     * DOCTYPE): an XML prolog followed by the {@code <svg>} element.
     *
     * @param chart the chart
     * @param w     width in pixels
     * @param h     height in pixels
     * @return the SVG document; never null
     */
    public static String toSvg(JFreeChart chart, int w, int h) {
        checkSize(w, h);
        SVGGraphics2D g = new SVGGraphics2D(w, h);
        // JFreeSVG prefixes clip-path and gradient ids with System.nanoTime() by default, so the same
        // chart would give different bytes on every run; a fixed prefix keeps the output reproducible
        g.setDefsKeyPrefix(SVG_DEFS_PREFIX);
        synchronized (ChartFiles.class) {
            // JFreeChart's old workaround for rotated text draws it through TextLayout, which SVG
            // output turns into glyph outlines; switched off here, rotated labels stay searchable text
            boolean workaround = TextUtils.isUseDrawRotatedStringWorkaround();
            TextUtils.setUseDrawRotatedStringWorkaround(false);
            try {
                chart.draw(g, new Rectangle2D.Double(0, 0, w, h));
            } finally {
                TextUtils.setUseDrawRotatedStringWorkaround(workaround);
            }
        }
        // an XML prolog and the <svg> element, without the SVG 1.0 DOCTYPE JFreeSVG adds: a DTD on the
        // web is neither needed nor wanted by readers working offline
        return "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + g.getSVGElement() + "\n";
    }

    /**
     * Renders a chart as PNG bytes.
     *
     * @param chart the chart
     * @param w     width in pixels
     * @param h     height in pixels
     * @return the PNG file's bytes; never null
     * @throws IOException when encoding fails
     */
    public static byte[] pngBytes(JFreeChart chart, int w, int h) throws IOException {
        checkSize(w, h);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ChartUtils.writeChartAsPNG(out, chart, w, h);
        return out.toByteArray();
    }

    /**
     * Writes a chart as a new PNG file, atomically; an existing file is left alone.
     *
     * @param chart the chart
     * @param file  the file
     * @param w     width in pixels
     * @param h     height in pixels
     * @throws java.nio.file.FileAlreadyExistsException when the file exists
     * @throws IOException on other failures (no partial file is left)
     */
    public static void savePng(JFreeChart chart, Path file, int w, int h) throws IOException {
        savePng(chart, file, w, h, false);
    }

    /**
     * Writes a chart as a PNG file, atomically.
     *
     * @param chart   the chart
     * @param file    the file
     * @param w       width in pixels
     * @param h       height in pixels
     * @param replace whether an existing file may be replaced
     * @throws IOException on failures (no partial file is left)
     */
    public static void savePng(JFreeChart chart, Path file, int w, int h, boolean replace) throws IOException {
        SafeFiles.write(file, pngBytes(chart, w, h), replace);
    }

    /**
     * Writes a chart as an SVG file, atomically.
     *
     * @param chart   the chart
     * @param file    the file
     * @param w       width in pixels
     * @param h       height in pixels
     * @param replace whether an existing file may be replaced
     * @throws IOException on failures (no partial file is left)
     */
    public static void saveSvg(JFreeChart chart, Path file, int w, int h, boolean replace) throws IOException {
        SafeFiles.write(file, toSvg(chart, w, h).getBytes(StandardCharsets.UTF_8), replace);
    }

    /**
     * Writes a chart as PNG or SVG, chosen by the file name's ending (.png or .svg, any case).
     *
     * @param chart   the chart
     * @param file    the file
     * @param w       width in pixels
     * @param h       height in pixels
     * @param replace whether an existing file may be replaced
     * @throws IllegalArgumentException for another ending
     * @throws IOException              on failures
     */
    public static void save(JFreeChart chart, Path file, int w, int h, boolean replace) throws IOException {
        String name = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".png")) {
            savePng(chart, file, w, h, replace);
        } else if (name.endsWith(".svg")) {
            saveSvg(chart, file, w, h, replace);
        } else {
            throw new IllegalArgumentException("chart files end in .png or .svg, not " + file.getFileName());
        }
    }

    /**
     * Writes a chart as PNG or SVG through a checked target, chosen by the file name's ending
     * (.png or .svg, any case).
     *
     * @param chart  the chart
     * @param target where and how to write
     * @param w      width in pixels
     * @param h      height in pixels
     * @throws IllegalArgumentException for another ending
     * @throws IOException              on failures (no partial file is left)
     */
    public static void save(JFreeChart chart, SafeFiles.Target target, int w, int h) throws IOException {
        String name = target.path().getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".png")) {
            target.write(pngBytes(chart, w, h));
        } else if (name.endsWith(".svg")) {
            target.write(toSvg(chart, w, h));
        } else {
            throw new IllegalArgumentException("chart files end in .png or .svg, not " + target.path().getFileName());
        }
    }

    static void checkSize(int w, int h) {
        if (w < 50 || h < 50 || w > 10000 || h > 10000) {
            throw new IllegalArgumentException("chart size must be 50 to 10000 pixels a side, found " + w + "x" + h);
        }
    }
}
