package dev.terrace.cli.plot;

import dev.terrace.core.CheckSummary;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.window.WindowMap;
import dev.terrace.core.window.WindowMapResult;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.LookupPaintScale;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.DefaultXYZDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;

import static dev.terrace.cli.plot.ChartStyle.*;

/**
 * The process-window map chart (see {@link Plots#windowMap}).
 *
 * @since 0.1
 */
final class WindowMapChart {

    private WindowMapChart() {
    }

    /**
     * A process-window map: the predicted yield as a heat map, the class regions with their
     * boundaries and names, the window's edge (yield {@value WindowMap#WINDOW_THRESHOLD}), cells
     * that break a limit hatched, measured runs and proposals on top.
     *
     * <p>Runs are drawn at their own x and y (their other settings may differ from the held ones):
     * one marker shape per class of the mapped class outcome, filled black when the run met every
     * target and hollow (white) otherwise; failed runs are crosses (×), drawn last. Where runs of
     * different kinds share a recipe on the two axes, their markers are set side by side (about a
     * marker's width apart) so that none hides another, and "×n" beside them gives the count of
     * runs there. Proposals are bold plus signs labelled with their rank.
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
        List<double[]> classEdges = classEdges(map, ux, uy);
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
        // the kinds of marker (series keys) at each recipe on the map's two axes, in legend order
        Map<List<Double>, List<String>> kindsAt = new LinkedHashMap<>();
        List<String> runKeys = new ArrayList<>();
        for (Run r : runs) {
            if (r.number(xp.name()).isEmpty() || r.number(yp.name()).isEmpty()) {
                runKeys.add(null);
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
            runKeys.add(key);
            shapes.put(key, shape);
            filled.put(key, fill);
            List<String> kinds = kindsAt.computeIfAbsent(position(r, xp, yp), q -> new ArrayList<>());
            if (!kinds.contains(key)) {
                kinds.add(key);
            }
        }
        kindsAt.values().forEach(k -> k.sort((a, b) -> Integer.compare(order(a, map), order(b, map))));
        Map<List<Double>, Double> rightmost = new LinkedHashMap<>();
        for (int n = 0; n < runs.size(); n++) {
            String key = runKeys.get(n);
            if (key == null) {
                continue;
            }
            Run r = runs.get(n);
            List<Double> at = position(r, xp, yp);
            List<String> kinds = kindsAt.get(at);
            double x = spreadX(at.get(0), kinds.indexOf(key), kinds.size(), xp);
            rightmost.put(at, spreadX(at.get(0), kinds.size() - 1, kinds.size(), xp));
            bySeries.computeIfAbsent(key, k -> new XYSeries(k, false, true)).add(x, at.get(1));
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
        // series drawn in legend order, so failed runs (the last series) come on top and are never hidden
        plot.setSeriesRenderingOrder(org.jfree.chart.plot.SeriesRenderingOrder.FORWARD);
        repeatCounts(plot, runs, xp, yp, rightmost);
        // dataset 2: proposals
        XYSeriesCollection propData = new XYSeriesCollection();
        XYSeries ps = new XYSeries("proposals", false, true);
        List<double[]> taken = new ArrayList<>();
        for (WindowMapResult.ClassRegion r : map.classRegions()) {
            if (r.fraction() >= Plots.LABEL_MIN_SHARE && r.cells() >= 3) {
                double w = LABEL_CHAR_UNITS * (r.className().length() + 2);
                double cx = xp.toUnit(r.x());
                double cy = yp.toUnit(r.y());
                taken.add(new double[] {cx - w / 2, cy - LABEL_HEIGHT_UNITS / 2, cx + w / 2, cy + LABEL_HEIGHT_UNITS / 2});
            }
        }
        for (Proposal p : proposals) {
            Object vx = p.recipe().get(xp.name());
            Object vy = p.recipe().get(yp.name());
            if (vx instanceof Double && vy instanceof Double && Double.isFinite((Double) vx) && Double.isFinite((Double) vy)) {
                ps.add((Double) vx, (Double) vy);
                int number = p.rank() > 0 ? p.rank() : ps.getItemCount();
                String label = " " + number + " ";
                double pu = xp.toUnit((Double) vx);
                double pv = yp.toUnit((Double) vy);
                TextAnchor anchor = freeAnchor(label, pu, pv, taken);
                double[] at = labelPoint(anchor, pu, pv);
                plot.addAnnotation(boxed(label, xp.fromUnit(at[0]), yp.fromUnit(at[1]), anchor));
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
            if (r.fraction() >= Plots.LABEL_MIN_SHARE && r.cells() >= 3) {
                plot.addAnnotation(boxed(r.className(), r.x(), r.y(), TextAnchor.CENTER));
            }
        }
        if (map.classOutcome() != null) {
            legend.add(lineItem("boundary between most likely " + map.classOutcome() + " classes", CLASS_LEGEND));
        }
        legend.add(lineItem(map.robust() ? String.format(Locale.ROOT, "window edge with a thermocouple error of %s K",
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

        static java.awt.image.BufferedImage hatchImage() {
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

    /** Approximate width of one label character, as a share of the plot's width (bold 12 pt on a ~700 px plot). */
    static final double LABEL_CHAR_UNITS = 0.012;
    /** Approximate height of a boxed label, as a share of the plot's height. */
    static final double LABEL_HEIGHT_UNITS = 0.04;
    /** Gap kept between a marker's centre and its label, as a share of the plot (about a marker's radius). */
    static final double LABEL_GAP_UNITS = 0.008;

    /** The four corners a proposal label may sit at, in the order they are tried. */
    private static final TextAnchor[] CORNERS = {TextAnchor.BOTTOM_LEFT, TextAnchor.TOP_LEFT, TextAnchor.BOTTOM_RIGHT,
        TextAnchor.TOP_RIGHT};

    /**
     * Picks the corner for a proposal's label whose box stays inside the plot and overlaps no label
     * placed before (class names, earlier proposals), or failing that the one that overlaps least;
     * the chosen box is added to {@code taken}. Boxes are in axis units (0 to 1 across the plot).
     *
     * @param label the label text
     * @param ux    the proposal's x, 0 to 1 across the plot
     * @param uy    the proposal's y, 0 to 1 up the plot
     * @param taken the boxes already placed, {x0, y0, x1, y1}; the chosen one is added
     * @return the anchor; never null
     */
    static TextAnchor freeAnchor(String label, double ux, double uy, List<double[]> taken) {
        double w = LABEL_CHAR_UNITS * label.length() + 0.01;
        double h = LABEL_HEIGHT_UNITS;
        TextAnchor best = null;
        double bestCost = Double.POSITIVE_INFINITY;
        double[] bestBox = null;
        for (TextAnchor a : CORNERS) {
            boolean left = a == TextAnchor.BOTTOM_LEFT || a == TextAnchor.TOP_LEFT; // text starts at the point
            boolean bottom = a == TextAnchor.BOTTOM_LEFT || a == TextAnchor.BOTTOM_RIGHT; // text sits above it
            double x0 = left ? ux + LABEL_GAP_UNITS : ux - LABEL_GAP_UNITS - w;
            double y0 = bottom ? uy + LABEL_GAP_UNITS : uy - LABEL_GAP_UNITS - h;
            double[] box = {x0, y0, x0 + w, y0 + h};
            double cost = 0;
            for (double[] t : taken) {
                cost += overlap(box, t);
            }
            // leaving the plot costs more than any overlap: a clipped label cannot be read
            cost += 10 * (Math.max(0, -box[0]) + Math.max(0, box[2] - 1) + Math.max(0, -box[1]) + Math.max(0, box[3] - 1));
            if (cost < bestCost - 1e-12) {
                bestCost = cost;
                best = a;
                bestBox = box;
            }
        }
        taken.add(bestBox);
        return best;
    }

    /**
     * The corner point of a proposal's label: {@link #LABEL_GAP_UNITS} from the marker's centre
     * along both axes, on the side the anchor puts the label, so the label box keeps clear of the
     * marker's arms (the box {@link #freeAnchor} reserved).
     *
     * @return {x, y} in axis units (0 to 1 across the plot)
     */
    static double[] labelPoint(TextAnchor anchor, double ux, double uy) {
        boolean left = anchor == TextAnchor.BOTTOM_LEFT || anchor == TextAnchor.TOP_LEFT;
        boolean bottom = anchor == TextAnchor.BOTTOM_LEFT || anchor == TextAnchor.BOTTOM_RIGHT;
        return new double[] {ux + (left ? LABEL_GAP_UNITS : -LABEL_GAP_UNITS),
            uy + (bottom ? LABEL_GAP_UNITS : -LABEL_GAP_UNITS)};
    }

    private static double overlap(double[] a, double[] b) {
        double w = Math.min(a[2], b[2]) - Math.max(a[0], b[0]);
        double h = Math.min(a[3], b[3]) - Math.max(a[1], b[1]);
        return w > 0 && h > 0 ? w * h : 0;
    }

    /**
     * Horizontal step between markers of different kinds at one recipe, as a share of the plot's
     * width (about one marker's width on a ~700 px plot), so that no kind hides another.
     */
    static final double MARKER_SPREAD_UNITS = 0.016;

    static List<Double> position(Run r, ParameterSpec xp, ParameterSpec yp) {
        return List.of(r.number(xp.name()).getAsDouble(), r.number(yp.name()).getAsDouble());
    }

    /**
     * The x at which the k-th of n marker kinds at one recipe is drawn: side by side, centred on the
     * recipe, {@link #MARKER_SPREAD_UNITS} apart, kept inside the box.
     */
    static double spreadX(double x, int k, int n, ParameterSpec xp) {
        if (n < 2) {
            return x;
        }
        double u = xp.toUnit(x) + MARKER_SPREAD_UNITS * (k - (n - 1) / 2.0);
        return xp.fromUnit(Math.max(0, Math.min(1, u)));
    }

    /**
     * Writes "x3" beside the rightmost marker where several runs share one recipe on the map's two
     * axes, so the count is visible though the markers coincide.
     *
     * @param rightmost for each recipe, the x of its rightmost marker (markers of different kinds
     *                  are set side by side)
     */
    static void repeatCounts(XYPlot plot, List<Run> runs, ParameterSpec xp, ParameterSpec yp,
                             Map<List<Double>, Double> rightmost) {
        Map<List<Double>, Integer> counts = new LinkedHashMap<>();
        for (Run r : runs) {
            if (r.number(xp.name()).isPresent() && r.number(yp.name()).isPresent()) {
                counts.merge(position(r, xp, yp), 1, Integer::sum);
            }
        }
        for (Map.Entry<List<Double>, Integer> e : counts.entrySet()) {
            if (e.getValue() < 2) {
                continue;
            }
            org.jfree.chart.annotations.XYPointerAnnotation a = new org.jfree.chart.annotations.XYPointerAnnotation(
                    "\u00d7" + e.getValue(), rightmost.getOrDefault(e.getKey(), e.getKey().get(0)), e.getKey().get(1),
                    -Math.PI / 4);
            a.setTipRadius(7);
            a.setBaseRadius(7);
            a.setArrowLength(0);
            a.setArrowWidth(0);
            a.setArrowPaint(new Color(0, 0, 0, 0));
            a.setLabelOffset(1);
            a.setFont(SUBTITLE_FONT.deriveFont(java.awt.Font.BOLD));
            a.setPaint(INK);
            a.setBackgroundPaint(Color.WHITE);
            a.setTextAnchor(TextAnchor.BOTTOM_LEFT);
            plot.addAnnotation(a);
        }
    }

    static int order(String key, WindowMapResult map) {
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

    static String held(WindowMapResult map, Campaign c) {
        StringBuilder sb = new StringBuilder("Held: ");
        boolean first = true;
        for (Map.Entry<String, Object> e : map.at().entrySet()) {
            if (e.getKey().equals(map.x().name()) || e.getKey().equals(map.y().name())) {
                continue;
            }
            sb.append(first ? "" : ", ").append(e.getKey()).append(' ');
            if (e.getValue() instanceof Double) {
                sb.append(Labels.setting((Double) e.getValue()));
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

    static String windowLine(WindowMapResult map) {
        String s = String.format(Locale.ROOT, "Window (yield \u2265 %s): %s of the map", Labels.num(WindowMap.WINDOW_THRESHOLD),
                percent(map.windowFraction()));
        if (map.robust()) {
            s += String.format(Locale.ROOT, " with a thermocouple error of %s K (sd) on %s; %s at the set point.",
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

    /**
     * Boundaries between the most likely classes as smooth contours: marching squares over the
     * predicted class probabilities (see {@link Contours#classBoundaries}) on the cell centres,
     * padded like the window's edge so a boundary runs on to the box's border; polylines in data units.
     */
    static List<double[]> classEdges(WindowMapResult map, double[] ux, double[] uy) {
        double[][][] p = map.classProbability();
        if (map.classOutcome() == null || p == null) {
            return new ArrayList<>();
        }
        double[][][] padded = new double[p.length][][];
        for (int k = 0; k < p.length; k++) {
            padded[k] = padded(p[k]);
        }
        return Contours.chain(toData(Contours.classBoundaries(padded, ux, uy), map.x(), map.y()));
    }

    static List<double[]> toData(List<double[]> unitSegments, ParameterSpec xp, ParameterSpec yp) {
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
}
