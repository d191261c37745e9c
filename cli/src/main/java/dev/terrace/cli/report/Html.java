package dev.terrace.cli.report;

import java.math.BigDecimal;
import java.util.Locale;

/**
 * A small writer of HTML text: every piece of text goes through {@link #escape(String)} unless it
 * is added with {@link #raw(String)}, and numbers are written without NaN or infinities.
 *
 * @since 0.1
 */
public final class Html {

    /** What a number that is not finite is written as. */
    public static final String NO_VALUE = "\u2013";

    private static final java.util.regex.Pattern POWER = java.util.regex.Pattern.compile("\\^(-?[0-9]+)");

    private final StringBuilder sb = new StringBuilder(64 * 1024);

    private Html() {
    }

    /** @return an empty writer; never null */
    public static Html create() {
        return new Html();
    }

    /**
     * Escapes text for HTML element content and quoted attribute values.
     *
     * @param s text, may be null (written as nothing)
     * @return the escaped text; never null
     */
    public static String escape(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&':
                    b.append("&amp;");
                    break;
                case '<':
                    b.append("&lt;");
                    break;
                case '>':
                    b.append("&gt;");
                    break;
                case '"':
                    b.append("&quot;");
                    break;
                case '\'':
                    b.append("&#39;");
                    break;
                default:
                    if (c < 0x20 && c != '\n' && c != '\t' && c != '\r') {
                        b.append(' ');
                    } else {
                        b.append(c);
                    }
            }
        }
        return b.toString();
    }

    /**
     * Formats a number with up to 4 significant digits: plain for moderate magnitudes, otherwise as
     * mantissa and power of ten ({@code 2.32e10}); never NaN or infinity.
     *
     * @param v the number
     * @return the text, or {@link #NO_VALUE} when {@code v} is not finite
     */
    public static String num(double v) {
        if (!Double.isFinite(v)) {
            return NO_VALUE;
        }
        double a = Math.abs(v);
        if (a != 0 && (a >= 1e5 || a < 1e-3)) {
            String s = String.format(Locale.ROOT, "%.3e", v);
            int e = s.indexOf('e');
            String mant = trimZeros(s.substring(0, e));
            int exp = Integer.parseInt(s.substring(e + 1));
            return mant + "e" + exp;
        }
        return trimZeros(String.format(Locale.ROOT, "%.4g", v));
    }

    /**
     * Formats a setting as a grower writes it: the shortest decimal that round-trips (253, 0.1, 3.2e-6).
     *
     * @param v the setting
     * @return the text, or {@link #NO_VALUE} when not finite
     */
    public static String setting(double v) {
        if (!Double.isFinite(v)) {
            return NO_VALUE;
        }
        BigDecimal b = new BigDecimal(Double.toString(v)).stripTrailingZeros();
        double a = Math.abs(v);
        if (a != 0 && (a < 1e-3 || a >= 1e6)) {
            int exp = b.precision() - b.scale() - 1;
            BigDecimal mant = b.movePointLeft(exp).stripTrailingZeros();
            return mant.toPlainString() + "e" + exp;
        }
        return b.toPlainString();
    }

    /**
     * Formats a probability as a whole percentage.
     *
     * @param p a probability
     * @return for example "42 %", or {@link #NO_VALUE}
     */
    public static String percent(double p) {
        if (!Double.isFinite(p)) {
            return NO_VALUE;
        }
        return Math.round(100 * p) + "\u00a0%";
    }

    private static String trimZeros(String s) {
        if (s.contains(".") && !s.contains("e")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }

    /**
     * Writes a number as HTML, with powers of ten as superscripts (2.32 × 10<sup>10</sup>).
     *
     * @param text a number formatted by {@link #num(double)} or {@link #setting(double)}
     * @return this writer
     */
    public Html number(String text) {
        int e = text.indexOf('e');
        if (e <= 0) {
            return text(text);
        }
        String mant = text.substring(0, e);
        String exp = text.substring(e + 1).replace("-", "\u2212");
        if (!mant.equals("1")) {
            text(mant + "\u00a0\u00d7\u00a0");
        }
        return text("10").raw("<sup>").text(exp).raw("</sup>");
    }

    /**
     * Writes a unit symbol as a reader expects it: powers as superscripts (cm^-2 as cm<sup>−2</sup>)
     * and degC as °C.
     *
     * @param symbol a unit symbol as campaign files spell it; may be empty
     * @return this writer
     */
    public Html unit(String symbol) {
        if (symbol == null || symbol.isEmpty()) {
            return this;
        }
        String s = symbol.replace("degC", "\u00b0C");
        java.util.regex.Matcher m = POWER.matcher(s);
        int last = 0;
        while (m.find()) {
            text(s.substring(last, m.start())).raw("<sup>").text(m.group(1).replace("-", "\u2212")).raw("</sup>");
            last = m.end();
        }
        return text(s.substring(last));
    }

    /**
     * @param s text to write escaped
     * @return this writer
     */
    public Html text(String s) {
        sb.append(escape(s));
        return this;
    }

    /**
     * @param markup markup written as is (only for markup this package made itself)
     * @return this writer
     */
    public Html raw(String markup) {
        sb.append(markup);
        return this;
    }

    /**
     * Opens an element.
     *
     * @param tag      the element name
     * @param cssClass a class attribute, or null for none
     * @return this writer
     */
    public Html open(String tag, String cssClass) {
        sb.append('<').append(tag);
        if (cssClass != null) {
            sb.append(" class=\"").append(escape(cssClass)).append('"');
        }
        sb.append('>');
        return this;
    }

    /**
     * Opens an element with one more attribute.
     *
     * @param tag      the element name
     * @param cssClass a class attribute, or null
     * @param attr     the attribute name
     * @param value    its value (escaped)
     * @return this writer
     */
    public Html open(String tag, String cssClass, String attr, String value) {
        sb.append('<').append(tag);
        if (cssClass != null) {
            sb.append(" class=\"").append(escape(cssClass)).append('"');
        }
        sb.append(' ').append(attr).append("=\"").append(escape(value)).append('"');
        sb.append('>');
        return this;
    }

    /**
     * @param tag the element to close
     * @return this writer
     */
    public Html close(String tag) {
        sb.append("</").append(tag).append('>');
        return this;
    }

    /**
     * Writes an element holding escaped text.
     *
     * @param tag      element name
     * @param cssClass class, or null
     * @param text     content
     * @return this writer
     */
    public Html el(String tag, String cssClass, String text) {
        return open(tag, cssClass).text(text).close(tag);
    }

    /**
     * Writes a table header row.
     *
     * @param headings the column headings
     * @return this writer
     */
    public Html headRow(String... headings) {
        open("thead", null).open("tr", null);
        for (String h : headings) {
            open("th", null, "scope", "col").text(h).close("th");
        }
        return close("tr").close("thead");
    }

    /**
     * Writes a line break in the markup (readability of the file only).
     *
     * @return this writer
     */
    public Html nl() {
        sb.append('\n');
        return this;
    }

    /** @return the HTML written so far */
    @Override
    public String toString() {
        return sb.toString();
    }
}
