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

    static String pad(String s, int w) {
        if (s.length() >= w) {
            return s + " ";
        }
        return s + " ".repeat(w - s.length());
    }
}
