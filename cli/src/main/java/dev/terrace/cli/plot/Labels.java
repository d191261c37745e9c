package dev.terrace.cli.plot;

import dev.terrace.core.campaign.ParameterSpec;

import java.math.BigDecimal;
import java.util.Locale;

/** Text for chart labels: units as printed and numbers as a grower writes them. */
final class Labels {

    private Labels() {
    }

    /**
     * @param symbol a campaign unit symbol
     * @return the symbol as printed on a chart (degC as °C, um as µm, ^-2 as a superscript)
     */
    static String unit(String symbol) {
        if (symbol == null) {
            return "";
        }
        return symbol.replace("degC", "\u00b0C").replace("um", "\u00b5m").replace("^-2", "\u207b\u00b2")
                .replace("^-1", "\u207b\u00b9");
    }

    /**
     * @param p a numeric setting
     * @return its axis label, name and unit, for example "t_drop (°C)"
     */
    static String axis(ParameterSpec p) {
        return p.name() + " (" + unit(p.unit().symbol()) + ")";
    }

    /**
     * A setting as a grower writes it: the shortest decimal that reads back as the same double
     * (253, 0.0732, 3.3e-6), so a held value reads exactly as the proposal's rounded recipe.
     *
     * @param v a setting
     * @return the text; "-" for NaN or infinity
     */
    static String setting(double v) {
        if (!Double.isFinite(v)) {
            return "-";
        }
        BigDecimal b = new BigDecimal(Double.toString(v)).stripTrailingZeros();
        double a = Math.abs(v);
        if (a != 0 && (a < 1e-3 || a >= 1e6)) {
            int exp = b.precision() - b.scale() - 1;
            return b.movePointLeft(exp).stripTrailingZeros().toPlainString() + "e" + exp;
        }
        return b.toPlainString();
    }

    /**
     * @param v a number
     * @return up to 3 significant digits, scientific below 1e-3 and from 1e5; "-" for NaN
     */
    static String num(double v) {
        if (!Double.isFinite(v)) {
            return "-";
        }
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        if (a < 1e-3 || a >= 1e5) {
            String s = String.format(Locale.ROOT, "%.2e", v);
            String mant = s.substring(0, s.indexOf('e')).replaceAll("0+$", "").replaceAll("\\.$", "");
            int exp = Integer.parseInt(s.substring(s.indexOf('e') + 1));
            return mant + "e" + exp;
        }
        BigDecimal b = new BigDecimal(v).round(new java.math.MathContext(3)).stripTrailingZeros();
        return b.toPlainString();
    }
}
