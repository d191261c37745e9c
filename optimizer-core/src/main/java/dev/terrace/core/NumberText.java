package dev.terrace.core;

import java.util.Locale;

/**
 * Numbers as a grower reads them in Terrace's text output: the one formatter behind the fit
 * report, the validation verdict and other core messages, so the same value prints the same way
 * everywhere.
 *
 * @since 0.3
 */
public final class NumberText {

    private NumberText() {
    }

    /**
     * Two to three significant digits: plain from 0.01 to below 1e5 (trailing zeros dropped),
     * otherwise scientific with two decimals ({@code 1.23e+10}); "n/a" for a non-finite value.
     *
     * @param v any number
     * @return the text; never null
     */
    public static String short3(double v) {
        if (!Double.isFinite(v)) {
            return "n/a";
        }
        double a = Math.abs(v);
        if (a != 0 && (a >= 1e5 || a < 1e-2)) {
            return String.format(Locale.ROOT, "%.2e", v);
        }
        String s = String.format(Locale.ROOT, "%.3g", v);
        if (s.contains(".")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }
}
