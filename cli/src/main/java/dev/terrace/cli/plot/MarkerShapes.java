package dev.terrace.cli.plot;

import java.awt.Shape;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

/**
 * Marker shapes of Terrace's charts, centred on (0, 0) in pixels. Measured runs take one shape per
 * class in campaign class order (circle, square, up-triangle, diamond, down-triangle, pentagon,
 * then repeating); a run with no class recorded is a hexagon, a failed run an ×, a proposal a
 * bold +.
 */
final class MarkerShapes {

    /** Half the size of a run marker in pixels. */
    static final double R = 5.0;

    private MarkerShapes() {
    }

    /**
     * @param k a class index (0-based)
     * @return the marker of that class; never null
     */
    static Shape forClass(int k) {
        switch (Math.floorMod(k, 6)) {
            case 0:
                return new Ellipse2D.Double(-R, -R, 2 * R, 2 * R);
            case 1:
                return new Rectangle2D.Double(-0.9 * R, -0.9 * R, 1.8 * R, 1.8 * R);
            case 2:
                return polygon(new double[] {0, 1.15 * R, -1.15 * R}, new double[] {-1.2 * R, 0.85 * R, 0.85 * R});
            case 3:
                return polygon(new double[] {0, 1.2 * R, 0, -1.2 * R}, new double[] {-1.2 * R, 0, 1.2 * R, 0});
            case 4:
                return polygon(new double[] {0, 1.15 * R, -1.15 * R}, new double[] {1.2 * R, -0.85 * R, -0.85 * R});
            default:
                return regular(5, 1.1 * R, -Math.PI / 2);
        }
    }

    /** @return the marker of a run with no class recorded (a hexagon) */
    static Shape unclassified() {
        return regular(6, 1.05 * R, 0);
    }

    /** @return the marker of a failed run (an ×) */
    static Shape failed() {
        return cross(1.1 * R, 0.32 * R, Math.PI / 4);
    }

    /** @return the marker of a proposal (a bold +) */
    static Shape proposal() {
        return cross(1.6 * R, 0.42 * R, 0);
    }

    private static Shape cross(double arm, double half, double angle) {
        double[] xs = {half, half, arm, arm, half, half, -half, -half, -arm, -arm, -half, -half};
        double[] ys = {-arm, -half, -half, half, half, arm, arm, half, half, -half, -half, -arm};
        double c = Math.cos(angle);
        double s = Math.sin(angle);
        double[] rx = new double[xs.length];
        double[] ry = new double[xs.length];
        for (int k = 0; k < xs.length; k++) {
            rx[k] = c * xs[k] - s * ys[k];
            ry[k] = s * xs[k] + c * ys[k];
        }
        return polygon(rx, ry);
    }

    private static Shape regular(int n, double r, double start) {
        double[] xs = new double[n];
        double[] ys = new double[n];
        for (int k = 0; k < n; k++) {
            xs[k] = r * Math.cos(start + 2 * Math.PI * k / n);
            ys[k] = r * Math.sin(start + 2 * Math.PI * k / n);
        }
        return polygon(xs, ys);
    }

    private static Shape polygon(double[] xs, double[] ys) {
        Path2D.Double p = new Path2D.Double();
        p.moveTo(xs[0], ys[0]);
        for (int k = 1; k < xs.length; k++) {
            p.lineTo(xs[k], ys[k]);
        }
        p.closePath();
        return p;
    }
}
