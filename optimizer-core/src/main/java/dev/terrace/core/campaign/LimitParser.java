package dev.terrace.core.campaign;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Parses a linear limit such as {@code anneal_temp >= substrate_temp + 20} or
 * {@code 2*in_dose - in_rate*10 <= 8} into a {@link LinearLimit}.
 *
 * <p>Grammar: {@code side (">=" | "<=" | ">" | "<") side}; a side is a sum of terms
 * {@code [+|-] (number ["*" name] | name ["*" number] | number)}. Strict and non-strict
 * relations mean the same for continuous settings.
 *
 * @since 0.1
 */
final class LimitParser {

    /** A parse failure with the 0-based offset of the offending character. */
    static final class LimitSyntaxException extends Exception {
        private static final long serialVersionUID = 1L;
        final int offset;

        LimitSyntaxException(String message, int offset) {
            super(message);
            this.offset = offset;
        }
    }

    private final String text;
    private int pos;

    private LimitParser(String text) {
        this.text = text;
    }

    /**
     * Parses a limit; names are not checked here.
     *
     * @param text     the limit as written
     * @param position where it is written
     * @return the limit in the form {@code sum + constant >= 0}
     * @throws LimitSyntaxException when the text is not a linear inequality
     */
    static LinearLimit parse(String text, SourcePosition position) throws LimitSyntaxException {
        LimitParser p = new LimitParser(text);
        Map<String, Double> left = new LinkedHashMap<>();
        double[] leftConst = {0};
        p.side(left, leftConst);
        p.skipSpace();
        int relAt = p.pos;
        boolean greater;
        if (p.peek(">=")) {
            greater = true;
            p.pos += 2;
        } else if (p.peek("<=")) {
            greater = false;
            p.pos += 2;
        } else if (p.peek(">")) {
            greater = true;
            p.pos += 1;
        } else if (p.peek("<")) {
            greater = false;
            p.pos += 1;
        } else {
            throw new LimitSyntaxException("expected one of >=, <=, >, < here", relAt);
        }
        Map<String, Double> right = new LinkedHashMap<>();
        double[] rightConst = {0};
        p.side(right, rightConst);
        p.skipSpace();
        if (p.pos < text.length()) {
            throw new LimitSyntaxException("unexpected '" + text.charAt(p.pos) + "'", p.pos);
        }
        // left - right >= 0 (or right - left >= 0 for <=)
        double sign = greater ? 1 : -1;
        Map<String, Double> coef = new LinkedHashMap<>();
        left.forEach((k, v) -> coef.merge(k, sign * v, Double::sum));
        right.forEach((k, v) -> coef.merge(k, -sign * v, Double::sum));
        coef.values().removeIf(v -> v == 0.0);
        double constant = sign * (leftConst[0] - rightConst[0]);
        if (coef.isEmpty()) {
            throw new LimitSyntaxException("the limit names no parameter (or its terms cancel)", 0);
        }
        return new LinearLimit(text, coef, constant, position);
    }

    private void side(Map<String, Double> coef, double[] constant) throws LimitSyntaxException {
        boolean first = true;
        while (true) {
            skipSpace();
            double sign = 1;
            if (pos < text.length() && (text.charAt(pos) == '+' || text.charAt(pos) == '-')) {
                sign = text.charAt(pos) == '-' ? -1 : 1;
                pos++;
                skipSpace();
            } else if (!first) {
                return;
            }
            term(coef, constant, sign);
            first = false;
            skipSpace();
            if (pos >= text.length() || (text.charAt(pos) != '+' && text.charAt(pos) != '-')) {
                return;
            }
        }
    }

    private void term(Map<String, Double> coef, double[] constant, double sign) throws LimitSyntaxException {
        skipSpace();
        if (pos >= text.length()) {
            throw new LimitSyntaxException("expected a number or a parameter name", pos);
        }
        char c = text.charAt(pos);
        if (isNumberStart(c)) {
            double n = number();
            skipSpace();
            if (pos < text.length() && text.charAt(pos) == '*') {
                pos++;
                skipSpace();
                String name = name();
                rejectProduct(name);
                coef.merge(name, sign * n, Double::sum);
            } else {
                constant[0] += sign * n;
            }
        } else if (Character.isLetter(c) || c == '_') {
            String name = name();
            skipSpace();
            double n = 1;
            if (pos < text.length() && text.charAt(pos) == '*') {
                pos++;
                skipSpace();
                if (pos < text.length() && (Character.isLetter(text.charAt(pos)) || text.charAt(pos) == '_')) {
                    int at = pos;
                    throw new LimitSyntaxException("limits must be linear: '" + name + " * " + name()
                            + "' multiplies two settings; write each setting times a number", at);
                }
                n = number();
                rejectProduct(name);
            }
            coef.merge(name, sign * n, Double::sum);
        } else {
            throw new LimitSyntaxException("expected a number or a parameter name, found '" + c + "'", pos);
        }
    }

    /** Refuses a second {@code *} after a term that already names a setting. */
    private void rejectProduct(String name) throws LimitSyntaxException {
        skipSpace();
        if (pos < text.length() && text.charAt(pos) == '*') {
            throw new LimitSyntaxException("limits must be linear: '" + name + "' is multiplied again;"
                    + " write each setting times one number", pos);
        }
    }

    private static boolean isNumberStart(char c) {
        return Character.isDigit(c) || c == '.';
    }

    private double number() throws LimitSyntaxException {
        int start = pos;
        while (pos < text.length()) {
            char c = text.charAt(pos);
            boolean exp = (c == 'e' || c == 'E') && pos > start;
            boolean expSign = (c == '+' || c == '-') && pos > start
                    && (text.charAt(pos - 1) == 'e' || text.charAt(pos - 1) == 'E');
            if (Character.isDigit(c) || c == '.' || exp || expSign) {
                pos++;
            } else {
                break;
            }
        }
        try {
            double v = Double.parseDouble(text.substring(start, pos));
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new LimitSyntaxException("'" + text.substring(start, pos) + "' is not a number", start);
        }
    }

    private String name() throws LimitSyntaxException {
        int start = pos;
        while (pos < text.length() && (Character.isLetterOrDigit(text.charAt(pos)) || text.charAt(pos) == '_')) {
            pos++;
        }
        if (start == pos) {
            throw new LimitSyntaxException("expected a parameter name", pos);
        }
        return text.substring(start, pos);
    }

    private boolean peek(String s) {
        return text.startsWith(s, pos);
    }

    private void skipSpace() {
        while (pos < text.length() && Character.isWhitespace(text.charAt(pos))) {
            pos++;
        }
    }
}
