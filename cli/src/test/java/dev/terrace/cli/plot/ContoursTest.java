package dev.terrace.cli.plot;

import org.junit.jupiter.api.Test;

import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Class boundaries by marching squares (Lorensen &amp; Cline 1987, reduced to two dimensions;
 * common practice) checked against fields whose true boundary is known in closed form. Positions
 * are in grid cells (node spacing 1), so the tolerance reads directly as a share of a cell.
 */
class ContoursTest {

    /**
     * Tolerance on each contour vertex, in cells. Linear interpolation along an edge of a smooth
     * field errs by about h^2 f'' / (8 |f'|) (the remainder of linear interpolation; common
     * practice), which for the fields below is below 0.02 cells; 0.05 cells is a quarter of a
     * pixel on a 41-cell map 800 px wide.
     */
    static final double TOLERANCE_CELLS = 0.05;

    /** Where the three classes of the second field meet, in cells. */
    static final double X0 = 15.4;
    static final double Y0 = 12.3;

    /**
     * Within this many cells of a point where three classes meet, the margin has a kink that linear
     * interpolation inside one cell cannot follow; there the vertices are held to
     * {@link #JUNCTION_TOLERANCE_CELLS} instead.
     */
    static final double JUNCTION_CELLS = 1.5;
    /** Tolerance near a three-class junction: the corner is cut by at most a fifth of a cell. */
    static final double JUNCTION_TOLERANCE_CELLS = 0.2;

    static double[] nodes(int n) {
        double[] v = new double[n];
        for (int k = 0; k < n; k++) {
            v[k] = k;
        }
        return v;
    }

    static double logistic(double t) {
        return 1 / (1 + Math.exp(-t));
    }

    @Test
    void twoClassesSplitByACircleGiveOneClosedContourOnTheCircle() {
        // p(inside) = logistic((R - r) / w): the classes tie exactly on the circle r = R
        int n = 41;
        double cx = 20.3;
        double cy = 19.6;
        double radius = 11.7;
        double width = 2.5;
        double[][][] p = new double[2][n][n];
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < n; i++) {
                double r = Math.hypot(i - cx, j - cy);
                p[0][j][i] = logistic((radius - r) / width);
                p[1][j][i] = 1 - p[0][j][i];
            }
        }
        List<double[]> seg = Contours.classBoundaries(p, nodes(n), nodes(n));
        assertTrue(seg.size() > 50, "a circle of radius 11.7 cells crosses many cells: " + seg.size());
        double worst = 0;
        for (double[] s : seg) {
            worst = Math.max(worst, Math.abs(Math.hypot(s[0] - cx, s[1] - cy) - radius));
            worst = Math.max(worst, Math.abs(Math.hypot(s[2] - cx, s[3] - cy) - radius));
        }
        assertTrue(worst < TOLERANCE_CELLS, String.format(Locale.ROOT, "worst vertex %.4f cells off the circle", worst));
        List<double[]> lines = Contours.chain(seg);
        assertEquals(1, lines.size(), "the circle is drawn as one continuous line, each boundary once");
        double[] line = lines.get(0);
        assertEquals(line[0], line[line.length - 2], 0.0, "closed: it ends where it starts");
        assertEquals(line[1], line[line.length - 1], 0.0, "closed: it ends where it starts");
        assertEquals(seg.size() + 1, line.length / 2, "every segment used once");
        // no staircase: most segments run neither along x nor along y
        long oblique = seg.stream().filter(s -> Math.abs(s[2] - s[0]) > 1e-9 && Math.abs(s[3] - s[1]) > 1e-9).count();
        assertTrue(oblique > 0.8 * seg.size(), oblique + " of " + seg.size() + " segments are oblique");
    }

    @Test
    void threeClassesWithLinearLogitsMeetOnTheirTieLinesEachDrawnOnce() {
        // softmax of logits 0, s (x - X0), s (y - Y0): the class regions meet at (X0, Y0) along the
        // rays x = X0 (y < Y0, A|B), y = Y0 (x < X0, A|C) and y - Y0 = x - X0 (x > X0, B|C);
        // X0 and Y0 lie between nodes so that no node sits exactly on a tie
        int n = 31;
        double s = 0.8;
        double[][][] p = new double[3][n][n];
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < n; i++) {
                double[] l = {0, s * (i - X0), s * (j - Y0)};
                double max = Math.max(l[0], Math.max(l[1], l[2]));
                double z = 0;
                for (double v : l) {
                    z += Math.exp(v - max);
                }
                for (int k = 0; k < 3; k++) {
                    p[k][j][i] = Math.exp(l[k] - max) / z;
                }
            }
        }
        List<double[]> seg = Contours.classBoundaries(p, nodes(n), nodes(n));
        double worst = 0;
        double worstNearJunction = 0;
        Set<String> seen = new HashSet<>();
        for (double[] q : seg) {
            for (int v = 0; v < 4; v += 2) {
                double d = distanceToRays(q[v], q[v + 1]);
                if (Math.hypot(q[v] - X0, q[v + 1] - Y0) < JUNCTION_CELLS) {
                    worstNearJunction = Math.max(worstNearJunction, d);
                } else {
                    worst = Math.max(worst, d);
                }
            }
            String a = String.format(Locale.ROOT, "%.9f,%.9f", q[0], q[1]);
            String b = String.format(Locale.ROOT, "%.9f,%.9f", q[2], q[3]);
            String key = a.compareTo(b) < 0 ? a + ";" + b : b + ";" + a;
            assertTrue(seen.add(key), "segment " + key + " drawn twice");
        }
        assertTrue(worst < TOLERANCE_CELLS, String.format(Locale.ROOT, "worst vertex %.4f cells off the tie lines", worst));
        assertTrue(worstNearJunction < JUNCTION_TOLERANCE_CELLS,
                String.format(Locale.ROOT, "worst vertex %.4f cells off near the junction", worstNearJunction));
        // each ray reaches the grid's border: x = X0 at y = 0, y = Y0 at x = 0, the diagonal at x = 30
        assertTrue(seg.stream().anyMatch(q -> q[1] == 0 || q[3] == 0), "A|B reaches the bottom");
        assertTrue(seg.stream().anyMatch(q -> q[0] == 0 || q[2] == 0), "A|C reaches the left");
        assertTrue(seg.stream().anyMatch(q -> q[0] == n - 1 || q[2] == n - 1), "B|C reaches the right");
        // continuous: the three rays chain into at most three polylines
        assertTrue(Contours.chain(seg).size() <= 3, "polylines: " + Contours.chain(seg).size());
    }

    /** Distance from (x, y) to the nearest of the three tie rays of the three-class field. */
    static double distanceToRays(double x, double y) {
        double corner = Math.hypot(x - X0, y - Y0);
        double ab = y <= Y0 ? Math.abs(x - X0) : corner;
        double ac = x <= X0 ? Math.abs(y - Y0) : corner;
        double bc = x >= X0 && y >= Y0 ? Math.abs((y - Y0) - (x - X0)) / Math.sqrt(2) : corner;
        return Math.min(ab, Math.min(ac, bc));
    }
}
