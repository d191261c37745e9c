package dev.terrace.core.window;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.junit.jupiter.api.Test;

import java.util.Arrays;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class GaussHermiteTest {

    @Test
    void weightsSumToOneAndSecondMomentIsSigmaSquared() {
        GaussHermite g = GaussHermite.standardNormal(7);
        assertEquals(1.0, Arrays.stream(g.weights()).sum(), 1e-14, "a probability rule has total weight 1");
        double sigma = 4.5;
        // E[X^2] = sigma^2 and E[X^4] = 3 sigma^4 for X ~ N(0, sigma^2) (normal moments)
        assertEquals(sigma * sigma, g.expectation(x -> x * x, sigma), 1e-12);
        assertEquals(3 * Math.pow(sigma, 4), g.expectation(x -> Math.pow(x, 4), sigma), 1e-9);
        // degree 12 <= 2n - 1 = 13 is still exact: E[Z^12] = 11!! = 10395 (normal moments)
        assertEquals(10395.0, g.expectation(x -> Math.pow(x, 12), 1), 1e-8);
        assertEquals(0.0, g.expectation(x -> x * x * x, sigma), 1e-12, "odd moments vanish by symmetry");
    }

    @Test
    void threePointRuleIsRootsOfHe3WithWeightsOneSixthAndTwoThirds() {
        // He_3(x) = x^3 - 3x has roots 0 and +-sqrt(3); w_i = n! / (n He_{n-1}(x_i))^2 with He_2 = x^2 - 1
        // gives 2/3 at 0 and 1/6 at +-sqrt(3) (Abramowitz & Stegun 25.4.46 rescaled to the normal density)
        GaussHermite g = GaussHermite.standardNormal(3);
        assertEquals(-Math.sqrt(3), g.node(0), 1e-14);
        assertEquals(0.0, g.node(1), 0.0);
        assertEquals(Math.sqrt(3), g.node(2), 1e-14);
        assertEquals(1.0 / 6, g.weight(0), 1e-14);
        assertEquals(2.0 / 3, g.weight(1), 1e-14);
        assertEquals(1.0 / 6, g.weight(2), 1e-14);
        assertEquals(1, g.centreIndex());
    }

    @Test
    void sevenPointRuleMatchesCommonsMathAndTheHandbookTable() {
        // Reference library: Commons Math 3.6.1 Hermite rule for the weight exp(-x^2); node t maps to
        // z = sqrt(2) t and weight w to w / sqrt(pi) for the standard normal density
        GaussIntegrator ref = new GaussIntegratorFactory().hermite(7);
        GaussHermite g = GaussHermite.standardNormal(7);
        for (int k = 0; k < 7; k++) {
            assertEquals(Math.sqrt(2) * ref.getPoint(k), g.node(k), 1e-12, "node " + k);
            assertEquals(ref.getWeight(k) / Math.sqrt(Math.PI), g.weight(k), 1e-12, "weight " + k);
        }
        // Abramowitz & Stegun Table 25.10, n = 7 (values from memory, confirmed by the library above):
        // largest physicists' node 2.651961356835, its weight 0.000971781245
        assertEquals(2.651961356835, g.node(6) / Math.sqrt(2), 1e-11);
        assertEquals(0.000971781245, g.weight(6) * Math.sqrt(Math.PI), 1e-12);
        assertEquals(0.810264617557, g.weight(3) * Math.sqrt(Math.PI), 1e-11);
    }

    @Test
    void rejectsSizesOutsideTheSupportedRange() {
        assertThrows(IllegalArgumentException.class, () -> GaussHermite.standardNormal(0));
        assertThrows(IllegalArgumentException.class, () -> GaussHermite.standardNormal(GaussHermite.MAX_NODES + 1));
        assertEquals(1.0, GaussHermite.standardNormal(1).weight(0), 0.0);
    }
}
