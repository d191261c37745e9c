package dev.terrace.cli.plot;

import org.jfree.chart.renderer.LookupPaintScale;

import java.awt.Color;

/**
 * Terrace's colour ramp for yields and other quantities on [0, 1]: built in CIE L*C*h (the polar
 * form of CIELAB) with lightness rising linearly from {@link #L_LOW} to {@link #L_HIGH} while the
 * hue turns from blue-violet through teal and green to yellow, so the ramp reads in order in
 * colour, in grey and for the common colour-vision deficiencies. Colours out of the sRGB gamut
 * keep their lightness and lose chroma until they fit.
 *
 * <p>Conversions: CIELAB to XYZ with the D65 white point (CIE 15:2004), XYZ to sRGB by
 * IEC 61966-2-1 (matrix and transfer curve).
 *
 * @since 0.1
 */
public final class YieldRamp {

    /** Lightness L* of the low end (dark enough for white text and lines to stand out). */
    public static final double L_LOW = 20;
    /** Lightness L* of the high end (light, but still distinct from the white page). */
    public static final double L_HIGH = 93;
    /** Hue angle in degrees at the low end (blue-violet). */
    public static final double HUE_LOW = 290;
    /** Hue angle in degrees at the high end (yellow). */
    public static final double HUE_HIGH = 95;
    /** Chroma asked for along the ramp, before gamut clipping. */
    public static final double CHROMA = 48;
    /** Steps of the lookup scale used by the heat maps. */
    public static final int STEPS = 100;

    private YieldRamp() {
    }

    /**
     * @param t a position on the ramp, 0 to 1 (clamped)
     * @return its colour; never null
     */
    public static Color color(double t) {
        double u = Double.isFinite(t) ? Math.max(0, Math.min(1, t)) : 0;
        double l = L_LOW + (L_HIGH - L_LOW) * u;
        double h = Math.toRadians(HUE_LOW + (HUE_HIGH - HUE_LOW) * u);
        double c = CHROMA;
        for (int k = 0; k < 60; k++) {
            double[] rgb = labToLinearRgb(l, c * Math.cos(h), c * Math.sin(h));
            if (inGamut(rgb)) {
                return new Color(encode(rgb[0]), encode(rgb[1]), encode(rgb[2]));
            }
            c *= 0.95;
        }
        double[] rgb = labToLinearRgb(l, 0, 0);
        return new Color(encode(rgb[0]), encode(rgb[1]), encode(rgb[2]));
    }

    /**
     * @param steps number of colour steps, &ge; 2
     * @return a paint scale over [0, 1] with that many steps of the ramp; never null
     */
    public static LookupPaintScale paintScale(int steps) {
        LookupPaintScale s = new LookupPaintScale(0, 1, color(0));
        for (int k = 0; k < steps; k++) {
            s.add((double) k / steps, color((k + 0.5) / steps));
        }
        s.add(1.0, color(1));
        return s;
    }

    /**
     * Relative luminance of an sRGB colour (IEC 61966-2-1 linearisation, Rec. 709 weights).
     *
     * @param c a colour
     * @return the luminance Y, 0 (black) to 1 (white)
     */
    public static double luminance(Color c) {
        return 0.2126 * decode(c.getRed()) + 0.7152 * decode(c.getGreen()) + 0.0722 * decode(c.getBlue());
    }

    private static double[] labToLinearRgb(double l, double a, double b) {
        double fy = (l + 16) / 116;
        double fx = fy + a / 500;
        double fz = fy - b / 200;
        double x = 0.95047 * finv(fx);
        double y = finv(fy);
        double z = 1.08883 * finv(fz);
        return new double[] {
            3.2406 * x - 1.5372 * y - 0.4986 * z,
            -0.9689 * x + 1.8758 * y + 0.0415 * z,
            0.0557 * x - 0.2040 * y + 1.0570 * z};
    }

    private static double finv(double t) {
        double d = 6.0 / 29;
        return t > d ? t * t * t : 3 * d * d * (t - 4.0 / 29);
    }

    private static boolean inGamut(double[] rgb) {
        for (double v : rgb) {
            if (v < -1e-9 || v > 1 + 1e-9) {
                return false;
            }
        }
        return true;
    }

    private static int encode(double linear) {
        double v = Math.max(0, Math.min(1, linear));
        double s = v <= 0.0031308 ? 12.92 * v : 1.055 * Math.pow(v, 1 / 2.4) - 0.055;
        return (int) Math.round(255 * s);
    }

    private static double decode(int channel) {
        double s = channel / 255.0;
        return s <= 0.04045 ? s / 12.92 : Math.pow((s + 0.055) / 1.055, 2.4);
    }
}
