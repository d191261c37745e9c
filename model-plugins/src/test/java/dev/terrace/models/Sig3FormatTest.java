package dev.terrace.models;

import org.junit.jupiter.api.Test;

import java.util.Locale;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The models' three-significant-digit formatter writes exactly what the JDK's
 * {@link java.util.Formatter} writes for {@code "%.3g"} (the reference: its specification of the
 * general conversion, half-up rounding of the shortest decimal, plain notation for 1e-4 to 1e3),
 * so that replacing the formatter (it cost half the time of a fit) changes no printed note.
 */
class Sig3FormatTest {

    @Test
    void agreesWithTheJdkFormatterAtTheRoundingAndNotationEdges() {
        double[] edges = {999.5, 999.4999, 9.995e-5, 9.9949e-5, 1e-4, 0.00099951, 1e3, 999.0, 99.95, 9.995, 0.9995,
            1.005, 2.675, 1e22, 1.2345e-300, Double.MIN_VALUE, -0.5, -999.5, 123456789, 0.5, 1.0, 10.0, 100.0,
            0.0, -0.0, Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.MAX_VALUE};
        for (double v : edges) {
            assertEquals(String.format(Locale.ROOT, "%.3g", v), ModelSupport.sig3(v), "value " + v);
        }
    }

    @Test
    void agreesWithTheJdkFormatterOnRandomValuesOverThirtySevenDecades() {
        SplittableRandom r = new SplittableRandom(20261203);
        for (int i = 0; i < 200_000; i++) {
            double v = Math.pow(10, r.nextDouble(-12, 25)) * (r.nextBoolean() ? 1 : -1);
            if (i % 3 == 0) {
                v = Math.round(v * 1000) / 1000.0;   // short decimals sit on rounding ties more often
            }
            assertEquals(String.format(Locale.ROOT, "%.3g", v), ModelSupport.sig3(v), "value " + v);
        }
    }
}
