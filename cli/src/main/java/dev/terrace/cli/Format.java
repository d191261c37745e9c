package dev.terrace.cli;

import java.util.Locale;

/** Number formatting for tables. */
final class Format {
    private Format() {
    }

    /** Up to 4 significant digits, plain for moderate magnitudes, scientific otherwise. */
    static String num(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        double a = Math.abs(v);
        if (a != 0 && (a >= 1e5 || a < 1e-3)) {
            return String.format(Locale.ROOT, "%.3e", v).replace("e+0", "e").replace("e-0", "e-").replace("e+", "e");
        }
        String s = String.format(Locale.ROOT, "%.4g", v);
        if (s.contains(".") && !s.contains("e")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }

    /** A setting as a grower writes it: the shortest decimal that round-trips, e.g. 253, 0.0278, 1e-4, 2.5e-6. */
    static String setting(double v) {
        if (!Double.isFinite(v)) {
            return "-";
        }
        java.math.BigDecimal b = new java.math.BigDecimal(Double.toString(v)).stripTrailingZeros();
        double a = Math.abs(v);
        if (a != 0 && (a < 1e-3 || a >= 1e6)) {
            int exp = b.precision() - b.scale() - 1;
            java.math.BigDecimal mant = b.movePointLeft(exp).stripTrailingZeros();
            return mant.toPlainString() + "e" + exp;
        }
        return b.toPlainString();
    }

    static String pad(String s, int w) {
        if (s.length() >= w) {
            return s + " ";
        }
        return s + " ".repeat(w - s.length());
    }
}
