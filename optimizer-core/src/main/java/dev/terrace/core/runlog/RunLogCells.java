package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.DidYouMean;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.units.Unit;
import dev.terrace.core.units.Units;
import dev.terrace.spi.Quantity;

import java.math.BigDecimal;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Consumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads and checks one cell of a run log for {@link RunLogReader}: numbers in the campaign's unit
 * (with the grower's usual slips named: a decimal comma, a unit written in the cell, a typographic
 * minus), censored outcomes ({@code <X}, {@code >X}), choices and ISO 8601 dates; and quotes cell
 * text back in messages safely. Each problem is added to the caller's list at the cell's position.
 */
final class RunLogCells {

    /** Longest stretch of a cell quoted back in a message, in code points. */
    static final int SHOWN_LENGTH = 40;

    private static final Pattern NUMBER =
            Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");
    private static final Pattern NUMBER_WITH_SUFFIX =
            Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?(\\s*)([^\\d\\s.,+-].*)");
    private static final Pattern NON_FINITE =
            Pattern.compile("[+-]?(?:nan|inf|infinity|\u221e)", Pattern.CASE_INSENSITIVE);
    private static final Pattern DIGITS_AND_SEPARATORS = Pattern.compile("[+-]?[\\d.,]*\\d[\\d.,]*(?:[eE][+-]?\\d+)?");

    private RunLogCells() {
    }

    static void readChoice(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell, String name,
                                   String t, List<String> allowed, Map<String, String> into) {
        if (t.isEmpty()) {
            return;
        }
        if (allowed.contains(t)) {
            into.put(name, t);
            return;
        }
        String hint = DidYouMean.suggest(t, allowed).map(h -> "; did you mean '" + h + "'?").orElse("");
        error(diags, file, cell, "column '" + name + "' expects " + oneOf(allowed) + ", found '"
                + shown(t) + "'" + hint);
    }

    /**
     * Reads a numeric outcome cell: a plain number, or a censored value {@code <X} (below X, for
     * example below detection) or {@code >X} (above X). On a {@code scale: log} outcome a plain value
     * of zero or below cannot be used, and the message suggests the censored form instead.
     */
    static void readOutcomeNumber(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell,
                                          OutcomeSpec o, String t, Campaign campaign, Map<String, Double> numbers,
                                          Map<String, Censored> censored) {
        if (t.isEmpty()) {
            return;
        }
        char first = t.charAt(0);
        if (first == '<' || first == '>') {
            Censored.Side side = first == '<' ? Censored.Side.BELOW : Censored.Side.ABOVE;
            String rest = t.substring(1).strip();
            if (rest.startsWith("=")) {
                rest = rest.substring(1).strip(); // "<=X" reads as "<X": a bound, not an exact value
            }
            if (rest.isEmpty()) {
                error(diags, file, cell, "column '" + o.name() + "' holds '" + shown(t) + "' with no bound;"
                        + " write " + side.symbol() + "X with X a number, for example " + side.symbol() + "1e8");
                return;
            }
            Double bound = readNumber(diags, file, cell, o.name(), rest, o.unit(), campaign);
            if (bound == null) {
                return;
            }
            if (o.scale() == Scale.LOG && bound <= 0) {
                error(diags, file, cell, "column '" + o.name() + "' is on a log scale, so the bound in '"
                        + shown(t) + "' must be above zero (for example <1e8 for 'below 1e8')");
                return;
            }
            censored.put(o.name(), new Censored(side, bound));
            return;
        }
        Double v = readNumber(diags, file, cell, o.name(), t, o.unit(), campaign);
        if (v == null) {
            return;
        }
        if (o.scale() == Scale.LOG && v <= 0) {
            error(diags, file, cell, "column '" + o.name() + "' is on a log scale and cannot hold " + shown(t)
                    + "; if nothing was detected, write the detection limit as a censored value such as <1e8"
                    + " (meaning below 1e8" + unitSuffix(o.unit()) + ")");
            return;
        }
        numbers.put(o.name(), v);
    }

    /** Parses and checks a numeric cell; returns null when empty or wrong (the error is added). */
    static Double readNumber(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell, String name,
                                     String t, Unit unit, Campaign campaign) {
        if (t.isEmpty()) {
            return null;
        }
        String expects = "column '" + name + "' expects a number" + (isDimensionless(unit) ? "" : " in " + unit.symbol());
        if (NUMBER.matcher(t).matches()) {
            double v = Double.parseDouble(t);
            double canonical = unit.toCanonical(v, campaign.surface().monolayerHeightNm());
            if (!Double.isFinite(v) || !Double.isFinite(canonical)) {
                error(diags, file, cell, expects + ", found '" + shown(t) + "', which is too large to use");
                return null;
            }
            Quantity q = unit.quantity();
            if (q == Quantity.TEMPERATURE && canonical < 0) {
                error(diags, file, cell, "column '" + name + "' is a temperature in " + unit.symbol() + "; "
                        + shown(t) + " " + unit.symbol() + " is below absolute zero ("
                        + fmt(unit.fromCanonical(0, campaign.surface().monolayerHeightNm())) + " "
                        + unit.symbol() + ")");
                return null;
            }
            String noun = nonNegativeNoun(q);
            if (noun != null && canonical < 0) {
                error(diags, file, cell, "column '" + name + "' is " + noun + " and cannot be negative, found "
                        + shown(t) + unitSuffix(unit));
                return null;
            }
            return v;
        }
        if (NON_FINITE.matcher(t).matches()) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "'; NaN and infinity are not"
                    + " measurements (leave the cell empty if the value was not measured)");
        } else if (t.indexOf(',') >= 0 && DIGITS_AND_SEPARATORS.matcher(t).matches()) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "' (use a decimal point"
                    + (t.indexOf('.') >= 0 ? " and no thousands separator)" : ")"));
        } else if (NUMBER.matcher(t.replace('\u2212', '-')).matches()) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "' (use the plain minus sign '-')");
        } else if (hasUnitAttached(t)) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "' (write the number alone;"
                    + " the campaign sets the unit" + (isDimensionless(unit) ? ")" : ", " + unit.symbol() + ")"));
        } else if (t.codePoints().noneMatch(Character::isDigit)) {
            error(diags, file, cell, "column '" + name + "' is numeric"
                    + (isDimensionless(unit) ? "" : " (" + unit.symbol() + ")") + " but holds the text '" + shown(t)
                    + "'; write a number, or leave the cell empty if it was not measured");
        } else {
            error(diags, file, cell, expects + ", found '" + shown(t) + "'");
        }
        return null;
    }

    /** True for a number followed by a unit: {@code 150 degC}, {@code 150degC}, {@code 150°C}, not {@code 15O}. */
    private static boolean hasUnitAttached(String t) {
        Matcher m = NUMBER_WITH_SUFFIX.matcher(t);
        if (!m.matches()) {
            return false;
        }
        String suffix = m.group(2).strip();
        return !m.group(1).isEmpty() || suffix.startsWith("\u00b0") || Units.bySymbol(suffix).isPresent();
    }

    private static String nonNegativeNoun(Quantity q) {
        switch (q) {
            case DEPOSITION_RATE:
                return "a deposition rate";
            case PRESSURE:
                return "a pressure";
            case COVERAGE:
                return "a coverage";
            case TIME:
                return "a time";
            case AREAL_DENSITY:
                return "a density";
            case LENGTH:
                return "a length";
            case PARTICLE_FLUX:
                return "a flux";
            default:
                return null;
        }
    }

    private static boolean isDimensionless(Unit unit) {
        return unit.quantity() == Quantity.DIMENSIONLESS;
    }

    /** @return {@code " degC"}, or empty for a dimensionless unit */
    static String unitSuffix(Unit unit) {
        return isDimensionless(unit) ? "" : " " + unit.symbol();
    }

    /**
     * Accepts ISO 8601 calendar dates (extended {@code 2024-05-17} or basic {@code 20240517}) and
     * date-times with or without an offset; a space may stand for the {@code T}, as RFC 3339 allows.
     */
    static boolean isIsoDate(String t) {
        String u = t.length() > 10 && t.charAt(10) == ' ' ? t.substring(0, 10) + 'T' + t.substring(11) : t;
        List<Consumer<String>> forms = List.of(
                x -> LocalDate.parse(x, DateTimeFormatter.ISO_LOCAL_DATE),
                x -> LocalDate.parse(x, DateTimeFormatter.BASIC_ISO_DATE),
                x -> LocalDateTime.parse(x, DateTimeFormatter.ISO_LOCAL_DATE_TIME),
                x -> OffsetDateTime.parse(x, DateTimeFormatter.ISO_OFFSET_DATE_TIME));
        for (Consumer<String> form : forms) {
            try {
                form.accept(u);
                return true;
            } catch (DateTimeParseException e) {
                // not this form; try the next
            }
        }
        return false;
    }

    private static String oneOf(List<String> allowed) {
        if (allowed.size() == 1) {
            return "'" + allowed.get(0) + "'";
        }
        StringBuilder sb = new StringBuilder("one of ");
        for (int k = 0; k < allowed.size(); k++) {
            sb.append(k == 0 ? "" : ", ").append('\'').append(allowed.get(k)).append('\'');
        }
        return sb.toString();
    }

    static void error(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell, String message) {
        diags.add(Diagnostic.error(file, cell.line(), cell.column(), message));
    }

    static int errorCount(List<Diagnostic> diags) {
        int n = 0;
        for (Diagnostic d : diags) {
            if (d.isError()) {
                n++;
            }
        }
        return n;
    }

    /** A number as a grower would write it: no trailing zeros, plain notation for everyday sizes. */
    static String fmt(double v) {
        BigDecimal b = new BigDecimal(Double.toString(v)).stripTrailingZeros();
        double a = Math.abs(v);
        return a == 0 || (a >= 1e-4 && a < 1e7) ? b.toPlainString() : b.toString();
    }

    /**
     * The first control character of a cell (C0, DEL or C1), or -1. Tab, carriage return and line
     * feed are allowed in notes, where quoted text may span lines.
     */
    static int controlCharacter(String text, boolean notes) {
        for (int k = 0; k < text.length(); k++) {
            char c = text.charAt(k);
            if (Character.isISOControl(c) && !(notes && (c == '\t' || c == '\n' || c == '\r'))) {
                return c;
            }
        }
        return -1;
    }

    /** At most {@value #EXCERPT_LENGTH} characters of a line from a file that may not be ours, escaped. */
    static String excerpt(String text) {
        String t = text.length() > EXCERPT_LENGTH ? text.substring(0, EXCERPT_LENGTH) + "\u2026" : text;
        return shown(t);
    }

    /** Characters of a foreign first line shown in an error (a project choice: enough to recognise it). */
    private static final int EXCERPT_LENGTH = 24;

    /** A cell's text made safe to quote in a one-line message: control characters escaped, long text cut. */
    static String shown(String text) {
        StringBuilder sb = new StringBuilder();
        int count = 0;
        for (int k = 0; k < text.length(); ) {
            int cp = text.codePointAt(k);
            k += Character.charCount(cp);
            if (++count > SHOWN_LENGTH) {
                sb.append('\u2026');
                break;
            }
            if (cp == '\n') {
                sb.append("\\n");
            } else if (Character.isISOControl(cp) || cp == '\u2028' || cp == '\u2029') {
                sb.append(String.format(Locale.ROOT, "\\u%04x", cp));
            } else {
                sb.appendCodePoint(cp);
            }
        }
        return sb.toString();
    }
}
