package dev.terrace.core;

import java.util.Collection;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;

/**
 * Suggests the known name a mistyped name was probably meant to be, for "did you mean" hints in
 * diagnostics.
 *
 * <p>Names are compared without regard to case using the optimal string alignment distance
 * (Levenshtein distance extended by adjacent transpositions, each substring edited at most once;
 * the restricted Damerau-Levenshtein distance), so {@code in_rtae} is one edit from
 * {@code in_rate} and {@code T_SUB} is zero edits from {@code t_sub}.
 *
 * @since 0.1
 */
public final class DidYouMean {

    /**
     * The largest distance at which a name is still suggested. Two edits cover the usual typing
     * slips (one wrong, missing, doubled or swapped character, or two of them) without offering
     * unrelated names; a common choice in compiler and command-line spell hints (common practice).
     */
    public static final int MAX_DISTANCE = 2;

    /**
     * Names up to this many characters long are suggested only at distance 1 or less: two edits
     * in a three-letter name leave too little of it to go on (common practice).
     */
    public static final int SHORT_NAME_LENGTH = 3;

    private DidYouMean() {
    }

    /**
     * Finds the known name closest to the given one.
     *
     * <p>Ties go to the name met first in {@code known}'s iteration order, so pass an ordered
     * collection for a stable answer. A known name equal to {@code given} (ignoring case) is
     * returned as is.
     *
     * @param given the name as written; never null
     * @param known the names that exist; never null, possibly empty, null elements are skipped
     * @return the closest known name within {@link #MAX_DISTANCE} (1 for names of at most
     *         {@link #SHORT_NAME_LENGTH} characters), or empty when none is that close
     */
    public static Optional<String> suggest(String given, Collection<String> known) {
        Objects.requireNonNull(given, "given");
        Objects.requireNonNull(known, "known");
        String g = given.strip().toLowerCase(Locale.ROOT);
        if (g.isEmpty()) {
            return Optional.empty();
        }
        int allowed = g.codePointCount(0, g.length()) <= SHORT_NAME_LENGTH ? 1 : MAX_DISTANCE;
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        for (String k : known) {
            if (k == null) {
                continue;
            }
            int d = distance(g, k.toLowerCase(Locale.ROOT));
            if (d < bestDistance) {
                best = k;
                bestDistance = d;
            }
        }
        return bestDistance <= allowed ? Optional.of(best) : Optional.empty();
    }

    /**
     * The optimal string alignment distance between two strings, counted in Unicode code points
     * and case-sensitive: the fewest insertions, deletions, substitutions and swaps of two
     * adjacent characters that turn {@code a} into {@code b}, no substring being edited twice.
     *
     * @param a a string; never null
     * @param b another string; never null
     * @return the distance, 0 when the strings are equal
     */
    public static int distance(String a, String b) {
        int[] x = a.codePoints().toArray();
        int[] y = b.codePoints().toArray();
        int n = x.length;
        int m = y.length;
        int[][] d = new int[n + 1][m + 1];
        for (int i = 0; i <= n; i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= m; j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= n; i++) {
            for (int j = 1; j <= m; j++) {
                int cost = x[i - 1] == y[j - 1] ? 0 : 1;
                int v = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && x[i - 1] == y[j - 2] && x[i - 2] == y[j - 1]) {
                    v = Math.min(v, d[i - 2][j - 2] + 1);
                }
                d[i][j] = v;
            }
        }
        return d[n][m];
    }
}
