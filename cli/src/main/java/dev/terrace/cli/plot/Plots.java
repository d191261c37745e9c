package dev.terrace.cli.plot;

import dev.terrace.core.CheckSummary;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.fit.Arrhenius;
import dev.terrace.core.io.SafeFiles;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.validate.ParityPoint;
import dev.terrace.core.window.ParetoFront;
import dev.terrace.core.window.WindowMap;
import dev.terrace.core.window.WindowMapResult;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.annotations.XYLineAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.LookupPaintScale;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.renderer.xy.XYStepRenderer;
import org.jfree.chart.text.TextUtils;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.DefaultXYZDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.jfree.svg.SVGGraphics2D;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;

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

    static final Font TITLE_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 16);
    static final Font SUBTITLE_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
    static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 12);
    static final Stroke MARKER_OUTLINE = new BasicStroke(1.4f);
    static final Color INK = Color.BLACK;

    private Plots() {
    }

    // ------------------------------------------------------------------ window map

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
        Objects.requireNonNull(map, "map");
        Objects.requireNonNull(runs, "runs");
        Objects.requireNonNull(proposals, "proposals");
        Objects.requireNonNull(c, "c");
        ParameterSpec xp = map.x();
        ParameterSpec yp = map.y();
        int nx = map.nx();
        int ny = map.ny();
        // dataset 0: the cells
        double[] xs = new double[nx * ny];
        double[] ys = new double[nx * ny];
        double[] zs = new double[nx * ny];
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                int k = j * nx + i;
                xs[k] = map.xAt(i);
                ys[k] = map.yAt(j);
                zs[k] = map.yieldAt(i, j);
            }
        }
        DefaultXYZDataset cells = new DefaultXYZDataset();
        cells.addSeries("predicted yield", new double[][] {xs, ys, zs});
        LookupPaintScale scale = YieldRamp.paintScale(YieldRamp.STEPS);
        // contour nodes: the cell centres plus the box edges (edge values repeated), so that the
        // window's edge runs on to the border of the box
        double[] ux = new double[nx + 2];
        double[] uy = new double[ny + 2];
        for (int i = 0; i < nx; i++) {
            ux[i + 1] = (i + 0.5) / nx;
        }
        for (int j = 0; j < ny; j++) {
            uy[j + 1] = (j + 0.5) / ny;
        }
        ux[nx + 1] = 1;
        uy[ny + 1] = 1;
        List<double[]> window = Contours.chain(toData(Contours.segments(padded(map.yield()), ux, uy,
                WindowMap.WINDOW_THRESHOLD), xp, yp));
        List<double[]> plainWindow = map.robust() ? Contours.chain(toData(Contours.segments(padded(map.plainYield()),
                ux, uy, WindowMap.WINDOW_THRESHOLD), xp, yp)) : List.of();
        List<double[]> classEdges = classEdges(map);
        MapLayerRenderer cellRenderer = new MapLayerRenderer(map, scale, classEdges, window, plainWindow);
        ValueAxis xAxis = axis(xp);
        ValueAxis yAxis = axis(yp);
        XYPlot plot = new XYPlot(cells, xAxis, yAxis, cellRenderer);
        plot.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinesVisible(false);
        plot.setRangeGridlinesVisible(false);
        plot.setAxisOffset(RectangleInsets.ZERO_INSETS);
        plot.setOutlinePaint(INK);

        LegendItemCollection legend = new LegendItemCollection();
        // dataset 1: measured runs, one series per (class, met spec)
        XYSeriesCollection runData = new XYSeriesCollection();
        XYLineAndShapeRenderer runRenderer = markerRenderer();
        Map<String, XYSeries> bySeries = new LinkedHashMap<>();
        Map<String, Shape> shapes = new LinkedHashMap<>();
        Map<String, Boolean> filled = new LinkedHashMap<>();
        for (Run r : runs) {
            if (r.number(xp.name()).isEmpty() || r.number(yp.name()).isEmpty()) {
                continue;
            }
            String key;
            Shape shape;
            boolean fill;
            if (!r.ok()) {
                key = "failed run";
                shape = MarkerShapes.failed();
                fill = true;
            } else {
                String cls = map.classOutcome() == null ? null : r.category(map.classOutcome()).orElse(null);
                boolean met = metSpec(c, r);
                String what = cls == null ? (map.classOutcome() == null ? "run" : "run, class not recorded") : cls;
                key = what + (met ? ", met spec" : ", missed spec");
                int idx = cls == null ? -1 : map.classes().indexOf(cls);
                shape = idx < 0 ? (map.classOutcome() == null ? MarkerShapes.forClass(0) : MarkerShapes.unclassified())
                        : MarkerShapes.forClass(idx);
                fill = met;
            }
            bySeries.computeIfAbsent(key, k -> new XYSeries(k, false, true)).add(r.number(xp.name()).getAsDouble(),
                    r.number(yp.name()).getAsDouble());
            shapes.put(key, shape);
            filled.put(key, fill);
        }
        List<String> keys = new ArrayList<>(bySeries.keySet());
        keys.sort((a, b) -> Integer.compare(order(a, map), order(b, map)));
        for (String k : keys) {
            int s = runData.getSeriesCount();
            runData.addSeries(bySeries.get(k));
            boolean fill = filled.get(k);
            styleMarker(runRenderer, s, shapes.get(k), fill ? INK : Color.WHITE, fill ? Color.WHITE : INK);
            legend.add(markerItem(k, shapes.get(k), fill ? INK : Color.WHITE, fill ? Color.WHITE : INK));
        }
        plot.setDataset(1, runData);
        plot.setRenderer(1, runRenderer);
        // dataset 2: proposals
        XYSeriesCollection propData = new XYSeriesCollection();
        XYSeries ps = new XYSeries("proposals", false, true);
        for (Proposal p : proposals) {
            Object vx = p.recipe().get(xp.name());
            Object vy = p.recipe().get(yp.name());
            if (vx instanceof Double && vy instanceof Double && Double.isFinite((Double) vx) && Double.isFinite((Double) vy)) {
                ps.add((Double) vx, (Double) vy);
                int number = p.rank() > 0 ? p.rank() : ps.getItemCount();
                XYTextAnnotation t = boxed(" " + number + " ", (Double) vx, (Double) vy,
                        labelAnchor(number, xp.toUnit((Double) vx), yp.toUnit((Double) vy)));
                plot.addAnnotation(t);
            }
        }
        XYLineAndShapeRenderer propRenderer = markerRenderer();
        if (ps.getItemCount() > 0) {
            propData.addSeries(ps);
            styleMarker(propRenderer, 0, MarkerShapes.proposal(), INK, Color.WHITE);
            legend.add(markerItem("proposal (number = rank)", MarkerShapes.proposal(), INK, Color.WHITE));
        }
        plot.setDataset(2, propData);
        plot.setRenderer(2, propRenderer);
        // class names at the regions
        for (WindowMapResult.ClassRegion r : map.classRegions()) {
            if (r.fraction() >= LABEL_MIN_SHARE && r.cells() >= 3) {
                plot.addAnnotation(boxed(r.className(), r.x(), r.y(), TextAnchor.CENTER));
            }
        }
        if (map.classOutcome() != null) {
            legend.add(lineItem("boundary between most likely " + map.classOutcome() + " classes", CLASS_LEGEND));
        }
        legend.add(lineItem(map.robust() ? String.format(Locale.ROOT, "window edge with a %s K thermocouple error",
                Labels.num(map.temperatureUncertaintyK())) : "window edge (yield 0.5)", WINDOW_LEGEND));
        if (map.robust()) {
            legend.add(lineItem("window edge at the set point", PLAIN_LEGEND));
        }
        boolean anyInfeasible = false;
        for (int j = 0; j < ny && !anyInfeasible; j++) {
            for (int i = 0; i < nx; i++) {
                if (!map.feasibleAt(i, j)) {
                    anyInfeasible = true;
                    break;
                }
            }
        }
        if (anyInfeasible) {
            legend.add(new LegendItem("hatched: breaks a campaign limit", null, null, null, true,
                    new Rectangle2D.Double(-6, -6, 12, 12), true, new HatchSwatch(), true, INK, new BasicStroke(1f),
                    false, new Line2D.Double(), new BasicStroke(1f), INK));
        }
        plot.setFixedLegendItems(legend);

        String title = "Process window: " + yp.name() + " against " + xp.name();
        JFreeChart chart = new JFreeChart(title, TITLE_FONT, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.addSubtitle(text("Campaign " + c.id() + ". " + held(map, c)));
        chart.addSubtitle(text(windowLine(map) + "  Predictions, not measurements."));
        NumberAxis za = new NumberAxis("predicted yield");
        za.setRange(0, 1);
        za.setTickUnit(new org.jfree.chart.axis.NumberTickUnit(0.1));
        PaintScaleLegend psl = new PaintScaleLegend(scale, za);
        psl.setPosition(RectangleEdge.RIGHT);
        psl.setAxisLocation(AxisLocation.TOP_OR_RIGHT);
        psl.setStripWidth(16);
        psl.setStripOutlineVisible(true);
        psl.setStripOutlinePaint(INK);
        psl.setSubdivisionCount(YieldRamp.STEPS);
        psl.setMargin(new RectangleInsets(10, 8, 10, 8));
        psl.setBackgroundPaint(Color.WHITE);
        chart.addSubtitle(psl);
        LegendTitle lt = new LegendTitle(plot);
        lt.setPosition(RectangleEdge.BOTTOM);
        lt.setFrame(new BlockBorder(INK));
        lt.setBackgroundPaint(Color.WHITE);
        lt.setItemFont(SUBTITLE_FONT);
        lt.setMargin(new RectangleInsets(6, 6, 6, 6));
        chart.addSubtitle(lt);
        return chart;
    }

    static final Stroke CLASS_LEGEND = new BasicStroke(1.6f);
    static final Stroke WINDOW_LEGEND = MapLayerRenderer.WINDOW_EDGE;
    static final Stroke PLAIN_LEGEND = MapLayerRenderer.PLAIN_WINDOW_EDGE;

    /** Legend swatch for hatched cells. */
    static final class HatchSwatch extends java.awt.TexturePaint {
        HatchSwatch() {
            super(hatchImage(), new Rectangle2D.Double(0, 0, 6, 6));
        }

        private static java.awt.image.BufferedImage hatchImage() {
            java.awt.image.BufferedImage im = new java.awt.image.BufferedImage(6, 6, java.awt.image.BufferedImage.TYPE_INT_RGB);
            java.awt.Graphics2D g = im.createGraphics();
            g.setColor(MapLayerRenderer.INFEASIBLE_FILL);
            g.fillRect(0, 0, 6, 6);
            g.setColor(MapLayerRenderer.HATCH_COLOR);
            g.drawLine(0, 5, 5, 0);
            g.dispose();
            return im;
        }
    }

    /**
     * Where a proposal's number goes: up and right of odd ranks, down and left of even ones (so
     * neighbours' labels do not overlap), turned inwards near the edges of the box.
     */
    static TextAnchor labelAnchor(int number, double ux, double uy) {
        boolean up = number % 2 == 1;
        boolean right = number % 2 == 1;
        if (up && uy > 0.9) {
            up = false;
        } else if (!up && uy < 0.1) {
            up = true;
        }
        if (right && ux > 0.9) {
            right = false;
        } else if (!right && ux < 0.1) {
            right = true;
        }
        if (up) {
            return right ? TextAnchor.BOTTOM_LEFT : TextAnchor.BOTTOM_RIGHT;
        }
        return right ? TextAnchor.TOP_LEFT : TextAnchor.TOP_RIGHT;
    }

    private static int order(String key, WindowMapResult map) {
        if (key.equals("failed run")) {
            return Integer.MAX_VALUE;
        }
        for (int k = 0; k < map.classes().size(); k++) {
            if (key.startsWith(map.classes().get(k) + ",")) {
                return 2 * k + (key.endsWith("met spec") && !key.endsWith("missed spec") ? 0 : 1);
            }
        }
        return Integer.MAX_VALUE - 1;
    }

    /** True when the run met every target of the campaign (a target not measured counts as missed). */
    static boolean metSpec(Campaign c, Run r) {
        if (!r.ok() || c.targets().isEmpty()) {
            return false;
        }
        for (Target t : c.targets()) {
            if (t.isObjective() && !t.hasWindow()) {
                continue;
            }
            Boolean m = CheckSummary.meets(t, r);
            if (m == null || !m) {
                return false;
            }
        }
        return true;
    }

    private static String held(WindowMapResult map, Campaign c) {
        StringBuilder sb = new StringBuilder("Held: ");
        boolean first = true;
        for (Map.Entry<String, Object> e : map.at().entrySet()) {
            if (e.getKey().equals(map.x().name()) || e.getKey().equals(map.y().name())) {
                continue;
            }
            sb.append(first ? "" : ", ").append(e.getKey()).append(' ');
            if (e.getValue() instanceof Double) {
                sb.append(Labels.num((Double) e.getValue()));
                c.parameter(e.getKey()).filter(p -> !p.isCategorical())
                        .ifPresent(p -> sb.append(' ').append(Labels.unit(p.unit().symbol())));
            } else {
                sb.append(e.getValue());
            }
            first = false;
        }
        if (first) {
            sb.append("nothing (the campaign has only these two settings)");
        }
        return sb.append('.').toString();
    }

    private static String windowLine(WindowMapResult map) {
        String s = String.format(Locale.ROOT, "Window (yield \u2265 %s): %s of the map", Labels.num(WindowMap.WINDOW_THRESHOLD),
                percent(map.windowFraction()));
        if (map.robust()) {
            s += String.format(Locale.ROOT, " with a %s K thermocouple error (sd) on %s; %s at the set point.",
                    Labels.num(map.temperatureUncertaintyK()), String.join(" and ", map.temperatureSettings()),
                    percent(map.plainWindowFraction()));
        } else {
            s += ".";
        }
        return s;
    }

    static String percent(double f) {
        return String.format(Locale.ROOT, "%.0f %%", 100 * f);
    }

    /** The field with its edge rows and columns repeated once on every side. */
    static double[][] padded(double[][] f) {
        int ny = f.length;
        int nx = f[0].length;
        double[][] out = new double[ny + 2][nx + 2];
        for (int j = 0; j < ny + 2; j++) {
            int sj = Math.max(0, Math.min(ny - 1, j - 1));
            for (int i = 0; i < nx + 2; i++) {
                out[j][i] = f[sj][Math.max(0, Math.min(nx - 1, i - 1))];
            }
        }
        return out;
    }

    /** Cell edges where the most likely class changes, as segments in data units. */
    private static List<double[]> classEdges(WindowMapResult map) {
        List<double[]> out = new ArrayList<>();
        if (map.classOutcome() == null) {
            return out;
        }
        double[] xe = map.xEdges();
        double[] ye = map.yEdges();
        for (int j = 0; j < map.ny(); j++) {
            for (int i = 0; i < map.nx(); i++) {
                String c = map.likelyClassAt(i, j);
                if (i + 1 < map.nx() && !c.equals(map.likelyClassAt(i + 1, j))) {
                    out.add(new double[] {xe[i + 1], ye[j], xe[i + 1], ye[j + 1]});
                }
                if (j + 1 < map.ny() && !c.equals(map.likelyClassAt(i, j + 1))) {
                    out.add(new double[] {xe[i], ye[j + 1], xe[i + 1], ye[j + 1]});
                }
            }
        }
        return out;
    }

    private static List<double[]> toData(List<double[]> unitSegments, ParameterSpec xp, ParameterSpec yp) {
        List<double[]> out = new ArrayList<>(unitSegments.size());
        for (double[] s : unitSegments) {
            out.add(new double[] {xp.fromUnit(s[0]), yp.fromUnit(s[1]), xp.fromUnit(s[2]), yp.fromUnit(s[3])});
        }
        return out;
    }

    /**
     * @param p a numeric setting
     * @return its axis over the box: logarithmic for {@code scale: log}, labelled with name and unit
     */
    static ValueAxis axis(ParameterSpec p) {
        ValueAxis a;
        if (p.scale() == Scale.LOG) {
            a = new DecadeAxis(Labels.axis(p) + ", log scale");
        } else {
            NumberAxis n = new NumberAxis(Labels.axis(p));
            n.setAutoRangeIncludesZero(false);
            a = n;
        }
        a.setRange(p.min(), p.max());
        a.setAutoRange(false);
        a.setLowerMargin(0);
        a.setUpperMargin(0);
        return a;
    }

    // ------------------------------------------------------------------ parity

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
     * As {@link #parity(String, boolean, String[], double[], double[], double[], double[])} for the
     * held-out predictions of a validation, grouped by surrogate.
     *
     * @param quantity what is compared, with its unit
     * @param logScale true for log axes ({@code scale: log} outcomes)
     * @param points   the held-out predictions, in the outcome's campaign unit; never null
     * @return the chart; never null
     */
    public static JFreeChart parity(String quantity, boolean logScale, List<ParityPoint> points) {
        int n = points.size();
        String[] g = new String[n];
        double[] m = new double[n];
        double[] p = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        for (int k = 0; k < n; k++) {
            ParityPoint q = points.get(k);
            g[k] = q.surrogate();
            m[k] = q.measured();
            p[k] = q.predicted();
            lo[k] = q.lo90();
            hi[k] = q.hi90();
        }
        return parity(quantity, logScale, g, m, p, lo, hi);
    }

    /**
     * Horizontal offset between groups of a parity plot, as a share of the measured range (on
     * log10 for log axes); small enough not to mislead, large enough to separate the bars.
     */
    public static final double DODGE = 0.012;

    static final Stroke DASHED = new BasicStroke(1.3f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
            new float[] {6f, 4f}, 0f);

    // ------------------------------------------------------------------ Arrhenius

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

    // ------------------------------------------------------------------ Pareto front

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

    /** Fixed prefix of the ids of an SVG's clip paths and gradients (see {@link #toSvg}). */
    private static final String SVG_DEFS_PREFIX = "terrace";

    // ------------------------------------------------------------------ output

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
        synchronized (Plots.class) {
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

    private static void checkSize(int w, int h) {
        if (w < 50 || h < 50 || w > 10000 || h > 10000) {
            throw new IllegalArgumentException("chart size must be 50 to 10000 pixels a side, found " + w + "x" + h);
        }
    }

    // ------------------------------------------------------------------ helpers

    private static XYLineAndShapeRenderer markerRenderer() {
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        r.setUseFillPaint(true);
        r.setUseOutlinePaint(true);
        r.setDrawOutlines(true);
        return r;
    }

    private static void styleMarker(XYLineAndShapeRenderer r, int s, Shape shape, Paint fill, Paint outline) {
        r.setSeriesShape(s, shape);
        r.setSeriesShapesFilled(s, true);
        r.setSeriesFillPaint(s, fill);
        r.setSeriesOutlinePaint(s, outline);
        r.setSeriesOutlineStroke(s, MARKER_OUTLINE);
        r.setSeriesPaint(s, fill);
    }

    private static LegendItem markerItem(String label, Shape shape, Paint fill, Paint outline) {
        // on the white legend a white outline would vanish: outline in black there
        Paint o = fill == INK ? INK : outline;
        return new LegendItem(label, null, null, null, true, shape, true, fill, true, o, MARKER_OUTLINE, false,
                new Line2D.Double(), new BasicStroke(1f), INK);
    }

    private static LegendItem lineItem(String label, Stroke stroke) {
        return new LegendItem(label, null, null, null, false, new Rectangle2D.Double(), false, INK, false, INK,
                stroke, true, new Line2D.Double(-14, 0, 14, 0), stroke, INK);
    }

    private static XYTextAnnotation boxed(String s, double x, double y, TextAnchor anchor) {
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

    private static TextTitle text(String s) {
        TextTitle t = new TextTitle(s, SUBTITLE_FONT);
        t.setPaint(INK);
        t.setMaximumLinesToDisplay(3);
        return t;
    }

    private static void stylePlain(XYPlot plot) {
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(200, 200, 200));
        plot.setRangeGridlinePaint(new Color(200, 200, 200));
        plot.setOutlinePaint(INK);
    }

    private static void finish(JFreeChart chart, XYPlot plot) {
        chart.setBackgroundPaint(Color.WHITE);
        LegendTitle lt = new LegendTitle(plot);
        lt.setPosition(RectangleEdge.BOTTOM);
        lt.setFrame(new BlockBorder(INK));
        lt.setItemFont(SUBTITLE_FONT);
        lt.setMargin(new RectangleInsets(6, 6, 6, 6));
        chart.addSubtitle(lt);
    }
}
