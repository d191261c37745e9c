package dev.terrace.cli.plot;

import org.jfree.chart.axis.AxisState;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberTick;
import org.jfree.chart.axis.TickType;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.TextAnchor;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;

/**
 * A base-10 logarithmic axis with ticks where growers read them: 1, 2 and 5 times a power of ten
 * over spans of up to {@link #DENSE_DECADES} decades, powers of ten only (with unlabelled minor
 * ticks at 2..9) beyond, and plain numbers as labels (0.05, 2e-6) instead of exponents.
 */
final class DecadeAxis extends LogAxis {

    private static final long serialVersionUID = 1L;

    /** Spans up to this many decades get ticks at 1, 2 and 5 of each decade. */
    static final double DENSE_DECADES = 3.5;

    DecadeAxis(String label) {
        super(label);
        setBase(10);
        setMinorTickMarksVisible(true);
    }

    @Override
    @SuppressWarnings({"rawtypes", "unchecked"})
    public List refreshTicks(Graphics2D g2, AxisState state, Rectangle2D dataArea, RectangleEdge edge) {
        List ticks = new ArrayList();
        double lo = getLowerBound();
        double hi = getUpperBound();
        if (!(lo > 0) || !(hi > lo)) {
            return super.refreshTicks(g2, state, dataArea, edge);
        }
        boolean vertical = RectangleEdge.isLeftOrRight(edge);
        TextAnchor anchor = vertical ? (edge == RectangleEdge.LEFT ? TextAnchor.CENTER_RIGHT : TextAnchor.CENTER_LEFT)
                : (edge == RectangleEdge.TOP ? TextAnchor.BOTTOM_CENTER : TextAnchor.TOP_CENTER);
        double decades = Math.log10(hi / lo);
        boolean dense = decades <= DENSE_DECADES;
        boolean all = decades < 0.6; // too short for 1-2-5 ticks: label every integer multiple
        int e0 = (int) Math.floor(Math.log10(lo)) - 1;
        int e1 = (int) Math.ceil(Math.log10(hi)) + 1;
        for (int e = e0; e <= e1; e++) {
            double p = Math.pow(10, e);
            for (int m = 1; m <= 9; m++) {
                double v = m * p;
                if (v < lo * (1 - 1e-9) || v > hi * (1 + 1e-9)) {
                    continue;
                }
                boolean major = all || m == 1 || (dense && (m == 2 || m == 5));
                if (major) {
                    ticks.add(new NumberTick(TickType.MAJOR, v, Labels.num(v), anchor, anchor, 0.0));
                } else {
                    ticks.add(new NumberTick(TickType.MINOR, v, "", anchor, anchor, 0.0));
                }
            }
        }
        boolean anyMajor = false;
        for (Object t : ticks) {
            anyMajor |= ((NumberTick) t).getTickType() == TickType.MAJOR;
        }
        return anyMajor ? ticks : super.refreshTicks(g2, state, dataArea, edge);
    }
}
