package dev.terrace.cli.report;

import java.util.Objects;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * One figure of the report: an SVG drawing ready to be placed inline, with its caption.
 *
 * @param key     a short name unique within the report (letters, digits, '-'); used to keep the
 *                drawing's internal ids apart from those of other drawings
 * @param caption what the figure shows, in plain words; never null
 * @param svg     the {@code <svg>} element, without XML prolog, its internal ids prefixed with the key
 * @since 0.1
 */
public record Figure(String key, String caption, String svg) {

    private static final Pattern KEY = Pattern.compile("[A-Za-z][A-Za-z0-9-]*");
    private static final Pattern ID = Pattern.compile("\\bid=\"([^\"]+)\"");
    private static final Pattern UNDEFINED = Pattern.compile("NaN|Infinity");

    /** Checks the invariants. */
    public Figure {
        Objects.requireNonNull(caption, "caption");
        Objects.requireNonNull(svg, "svg");
        if (key == null || !KEY.matcher(key).matches()) {
            throw new IllegalArgumentException("bad figure key " + key);
        }
        if (!svg.startsWith("<svg")) {
            throw new IllegalArgumentException("figure " + key + " is not an <svg> element");
        }
        if (UNDEFINED.matcher(svg).find()) {
            throw new IllegalArgumentException("figure " + key + " holds undefined numbers (NaN or infinity)");
        }
    }

    /**
     * Makes a figure from an SVG document as a drawing library writes it: drops any XML prolog and
     * comments before the {@code <svg>} element, and prefixes every id (and every reference to it)
     * with the key, so several drawings can sit inline in one page without their clip paths and
     * gradients mixing.
     *
     * @param key     the figure's key
     * @param caption its caption
     * @param svgText the SVG text
     * @return the figure; never null
     * @throws IllegalArgumentException when the text holds no {@code <svg>} element or holds NaN or infinity
     */
    public static Figure of(String key, String caption, String svgText) {
        Objects.requireNonNull(svgText, "svgText");
        int start = svgText.indexOf("<svg");
        if (start < 0) {
            throw new IllegalArgumentException("figure " + key + " has no <svg> element");
        }
        String svg = svgText.substring(start).trim();
        Matcher m = ID.matcher(svg);
        java.util.Set<String> ids = new java.util.LinkedHashSet<>();
        while (m.find()) {
            ids.add(m.group(1));
        }
        for (String id : ids) {
            String q = Pattern.quote(id);
            String to = Matcher.quoteReplacement(key + "-" + id);
            svg = svg.replaceAll("\\bid=\"" + q + "\"", "id=\"" + to + "\"")
                    .replaceAll("url\\(#" + q + "\\)", "url(#" + to + ")")
                    .replaceAll("url\\('#" + q + "'\\)", "url(#" + to + ")")
                    .replaceAll("href=\"#" + q + "\"", "href=\"#" + to + "\"");
        }
        return new Figure(key, caption, svg);
    }
}
