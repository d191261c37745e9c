package dev.terrace.cli.plot;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.fit.Arrhenius;
import dev.terrace.core.io.SafeFiles;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.validate.ParityPoint;
import dev.terrace.core.window.ParetoFront;
import dev.terrace.core.window.WindowMap;
import dev.terrace.core.window.WindowMapResult;
import org.jfree.chart.JFreeChart;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

/**
 * Terrace's charts, built with JFreeChart and written as PNG or as self-contained SVG (JFreeSVG).
 *
 * <p>Every chart is meant to survive a black-and-white printer: the yield colour ramp
 * ({@link YieldRamp}) rises monotonically in lightness, categories are told apart by marker shape
 * and line style rather than colour, both axes carry their units, and settings with
 * {@code scale: log} get logarithmic axes.
 *
 * <p>Charts render headless (no display needed); text needs a font, for instance Debian's
 * fonts-dejavu-core.
 *
 * @since 0.1
 */
public final class Plots {

    /** Default width of a written chart in pixels. */
    public static final int DEFAULT_WIDTH = 900;
    /** Default height of a written chart in pixels. */
    public static final int DEFAULT_HEIGHT = 720;
    /**
     * Class regions smaller than this share of the map get no name label (too small to hold
     * one legibly; a choice for Terrace). Their boundaries are still drawn.
     */
    public static final double LABEL_MIN_SHARE = 0.02;

    /**
     * Horizontal offset between groups of a parity plot, as a share of the measured range (on
     * log10 for log axes); small enough not to mislead, large enough to separate the bars.
     */
    public static final double DODGE = ParityChart.DODGE;

    private Plots() {
    }

    /**
     * A process-window map: the predicted yield as a heat map, the class regions with their
     * boundaries and names, the window's edge (yield {@value WindowMap#WINDOW_THRESHOLD}), cells
     * that break a limit hatched, measured runs and proposals on top.
     *
     * <p>Runs are drawn at their own x and y (their other settings may differ from the held ones):
     * one marker shape per class of the mapped class outcome, filled black when the run met every
     * target and hollow (white) otherwise; failed runs are crosses (×). Proposals are bold plus
     * signs labelled with their rank.
     *
     * @param map       the map
     * @param runs      measured runs to overlay; may be empty, never null
     * @param proposals proposals to overlay; may be empty, never null
     * @param c         the campaign (targets, for "met spec")
     * @return the chart; never null
     */
    public static JFreeChart windowMap(WindowMapResult map, List<Run> runs, List<Proposal> proposals, Campaign c) {
        return WindowMapChart.windowMap(map, runs, proposals, c);
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
        return ParityChart.parity(quantity, logScale, groups, measured, predicted, lo90, hi90);
    }

    /**
     * As {@link #parity(String, boolean, String[], double[], double[], double[], double[])}, with
     * each point of one group labelled with its run id and the target band shaded on both axes.
     *
     * @param quantity   what is compared, with its unit
     * @param logScale   true for log axes ({@code scale: log} outcomes)
     * @param groups     the group of each point
     * @param measured   measured values
     * @param predicted  predicted values
     * @param lo90       lower ends of the 90 % intervals
     * @param hi90       upper ends of the 90 % intervals
     * @param runIds     the run id of each point
     * @param labelGroup the group whose points carry their run id
     * @param targetMin  lower end of the target, -infinity for none (NaN: no band)
     * @param targetMax  upper end of the target, +infinity for none (NaN: no band)
     * @return the chart; never null
     */
    public static JFreeChart parity(String quantity, boolean logScale, String[] groups, double[] measured,
                                    double[] predicted, double[] lo90, double[] hi90, String[] runIds,
                                    String labelGroup, double targetMin, double targetMax) {
        return ParityChart.parity(quantity, logScale, groups, measured, predicted, lo90, hi90, runIds, labelGroup,
                targetMin, targetMax);
    }

    /**
     * Parity chart of held-out predictions, grouped by surrogate, the points of {@code labelGroup}
     * labelled with their run ids and the target band shaded on both axes.
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
        return ParityChart.parity(quantity, logScale, points, labelGroup, targetMin, targetMax);
    }

    /**
     * The track record of past proposals for one numeric outcome: per grown proposal (labelled with
     * its run id), the mean and 90 % interval predicted when it was proposed, the value measured,
     * and the target band.
     *
     * @param quantity  the outcome with its unit
     * @param logScale  true for a log axis ({@code scale: log} outcomes; values must be &gt; 0)
     * @param labels    run id of each grown proposal
     * @param predicted predicted means (NaN when there was no prediction)
     * @param lo90      lower ends of the 90 % intervals
     * @param hi90      upper ends of the 90 % intervals
     * @param measured  measured values (NaN when not measured)
     * @param targetMin lower end of the target band, or -infinity (NaN for none)
     * @param targetMax upper end of the target band, or +infinity (NaN for none)
     * @return the chart; never null
     * @throws IllegalArgumentException when the arrays differ in length or are empty
     */
    public static JFreeChart trackRecord(String quantity, boolean logScale, String[] labels, double[] predicted,
                                         double[] lo90, double[] hi90, double[] measured, double targetMin,
                                         double targetMax) {
        return TrackRecordChart.chart(quantity, logScale, labels, predicted, lo90, hi90, measured, targetMin,
                targetMax);
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
        return ArrheniusChart.arrhenius(temperaturesK, densities, energyEv, lo, hi);
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
        return ArrheniusChart.arrhenius(temperaturesK, densities, energyEv, lo, hi, densityLabel);
    }

    /**
     * The yield/cost front: each recipe of the front as a numbered marker, joined by the step line
     * of the best yield reachable for a given cost.
     *
     * @param front the front
     * @return the chart; never null
     */
    public static JFreeChart pareto(ParetoFront front) {
        return ParetoChart.pareto(front);
    }

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
        return ChartFiles.toSvg(chart, w, h);
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
        return ChartFiles.pngBytes(chart, w, h);
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
        ChartFiles.savePng(chart, file, w, h);
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
        ChartFiles.savePng(chart, file, w, h, replace);
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
        ChartFiles.saveSvg(chart, file, w, h, replace);
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
        ChartFiles.save(chart, file, w, h, replace);
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
        ChartFiles.save(chart, target, w, h);
    }
}
