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
 * @param svg     the {@code <svg>} element, without XML prolog; its internal ids should start with the key
 * @since 0.1
 */
public record Figure(String key, String caption, String svg) {

    private static final Pattern KEY = Pattern.compile("[A-Za-z][A-Za-z0-9-]*");
    private static final Pattern ID = Pattern.compile("\\bid=[\"']([^\"']+)[\"']");
    private static final Pattern REFERENCE = Pattern.compile("(\\bid=[\"']|url\\([\"']?#|href=[\"']#)([^\"')]+)");
    private static final Pattern SIZE_W = Pattern.compile("\\swidth=[\"']([0-9.]+)(?:px)?[\"']");
    private static final Pattern SIZE_H = Pattern.compile("\\sheight=[\"']([0-9.]+)(?:px)?[\"']");
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
     * comments before the {@code <svg>} element, gives it a viewBox so it scales with the page, and
     * renames every id (and every reference to it) to the key and a running number, so several
     * drawings can sit inline in one page without their clip paths and gradients mixing, and the
     * same drawing always gives the same text.
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
        String svg = withViewBox(svgText.substring(start).trim());
        Matcher m = ID.matcher(svg);
        java.util.Map<String, String> rename = new java.util.HashMap<>();
        while (m.find()) {
            rename.putIfAbsent(m.group(1), key + "-" + rename.size());
        }
        if (!rename.isEmpty()) {
            // one pass over ids and references, so a new name can never be renamed again
            Matcher r = REFERENCE.matcher(svg);
            StringBuilder sb = new StringBuilder(svg.length() + 64);
            while (r.find()) {
                String to = rename.get(r.group(2));
                r.appendReplacement(sb, Matcher.quoteReplacement(r.group(1) + (to == null ? r.group(2) : to)));
            }
            r.appendTail(sb);
            svg = sb.toString();
        }
        return new Figure(key, caption, svg);
    }

    /**
     * Gives the root element a viewBox from its width and height when it has none, so the drawing
     * scales with the page instead of being cropped.
     */
    static String withViewBox(String svg) {
        int end = svg.indexOf('>');
        if (end < 0) {
            throw new IllegalArgumentException("unterminated <svg> element");
        }
        String root = svg.substring(0, end);
        if (root.contains("viewBox")) {
            return svg;
        }
        Matcher w = SIZE_W.matcher(root);
        Matcher h = SIZE_H.matcher(root);
        if (!w.find() || !h.find()) {
            return svg;
        }
        return root + " viewBox=\"0 0 " + w.group(1) + " " + h.group(1) + "\"" + svg.substring(end);
    }
}
