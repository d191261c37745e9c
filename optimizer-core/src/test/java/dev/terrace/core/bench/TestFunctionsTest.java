package dev.terrace.core.bench;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * Check values: published optima from Dixon &amp; Szegő (eds), <i>Towards Global Optimization 2</i>
 * (1978), as listed by Surjanovic &amp; Bingham, <i>Virtual Library of Simulation Experiments</i>
 * (VLSE, Simon Fraser University); off-optimum values computed independently in IEEE double with
 * numpy from the same VLSE formulas and constants (marked "numpy"), each confirmed here with mpmath
 * 1.3.0 (50 digits), an independent reference library, to within double rounding. Tolerances are a
 * test design choice (a few ulp of the value, wider where the published value is printed rounded).
 */
class TestFunctionsTest {

    @Test
    void braninMinimumIsFiveOverFourPi() {
        // 5/(4 pi) = 0.3978873577297383394... (derived here: f(pi, 2.275) = 10/(8 pi); digits computed
        // with mpmath, 30 and 50 digits, an independent reference library); published as 0.397887 (VLSE)
        assertEquals(0.3978873577297383394, TestFunctions.BRANIN_MINIMUM, 1e-16, "mpmath 5/(4 pi)");
        assertEquals(0.397887, TestFunctions.BRANIN_MINIMUM, 5e-7, "VLSE published f*");
    }

    @Test
    void braninTakesItsMinimumAtAllThreePublishedMinimisers() {
        // minimisers (-pi, 12.275), (pi, 2.275), (3pi, 2.475): Dixon & Szegő 1978 / VLSE; at each
        // the squared bracket is exactly zero (12.275 - 1.275 - 5 - 6, 2.275 - 1.275 + 5 - 6,
        // 2.475 - 11.475 + 15 - 6) and cos x1 = -1, so f = 5/(4 pi) up to rounding
        double[][] m = TestFunctions.braninMinimisers();
        assertEquals(3, m.length, "three global minimisers (Dixon & Szegő 1978 / VLSE)");
        for (double[] x : m) {
            assertEquals(TestFunctions.BRANIN_MINIMUM, TestFunctions.branin(x), 1e-13,
                    "f* = 5/(4 pi) (derived above) at " + x[0] + ", " + x[1]);
            assertEquals(0.397887, TestFunctions.branin(x), 5e-7, "VLSE published f*");
        }
    }

    @Test
    void braninMatchesIndependentValuesAwayFromTheMinima() {
        // numpy (IEEE double), VLSE formula; confirmed with mpmath (50 digits), an independent
        // reference library
        assertEquals(55.602112642270264, TestFunctions.branin(0, 0), 1e-12);
        assertEquals(308.12909601160663, TestFunctions.branin(-5, 0), 1e-11);
        assertEquals(145.87219087939556, TestFunctions.branin(10, 15), 1e-11);
        assertEquals(24.129964413622268, TestFunctions.branin(2.5, 7.5), 1e-12);
        assertEquals(0.39788735775266204, TestFunctions.branin(9.42478, 2.475), 1e-14,
                "3pi printed as 9.42478 (numpy)");
    }

    @Test
    void hartmann6ReachesThePublishedMinimumAtThePublishedPoint() {
        // VLSE x*, f* = -3.32237 (Dixon & Szegő 1978 / VLSE); -3.322368011391339 at the printed x*
        // (a kriging-toolbox documentation page, reproduced with numpy and with mpmath, 50 digits)
        double f = TestFunctions.hartmann6(TestFunctions.hartmann6Minimiser());
        assertEquals(-3.322368011391339, f, 1e-13, "f at the VLSE x*: toolbox page, numpy, mpmath");
        assertEquals(TestFunctions.HARTMANN6_MINIMUM, f, 5e-6, "VLSE f* = -3.32237");
        // refined minimiser: -3.3223680114155147 (point refined with numpy + Nelder-Mead; value confirmed
        // with mpmath, 50 digits; the same toolbox page quotes -3.322368011415512)
        assertEquals(-3.3223680114155147, TestFunctions.hartmann6(new double[] {
            0.20168951, 0.15001069, 0.47687397, 0.27533243, 0.31165162, 0.65730053}), 1e-13,
                "numpy + Nelder-Mead, mpmath");
    }

    @Test
    void hartmann6MatchesIndependentValuesAwayFromTheMinimum() {
        // numpy (IEEE double), VLSE formula and constants; confirmed with mpmath (50 digits), an
        // independent reference library
        assertEquals(-0.5053149917022333,
                TestFunctions.hartmann6(new double[] {0.5, 0.5, 0.5, 0.5, 0.5, 0.5}), 1e-14);
        assertEquals(-0.00508911288366444, TestFunctions.hartmann6(new double[6]), 1e-16);
        assertEquals(-1.4069105761385297,
                TestFunctions.hartmann6(new double[] {0.1, 0.2, 0.3, 0.4, 0.5, 0.6}), 1e-14);
    }

    @Test
    void hartmann3UsesTheVlseConstantsAndReachesThePublishedMinimum() {
        // VLSE constants (P[3][0] = 0.0381): -3.8627797869493 at the printed x* (numpy; confirmed with
        // mpmath, 50 digits); published f* = -3.86278 (Dixon & Szegő 1978 / VLSE)
        double f = TestFunctions.hartmann3(TestFunctions.hartmann3Minimiser());
        assertEquals(-3.8627797869493, f, 1e-12, "f at the VLSE x*: numpy, mpmath");
        assertEquals(TestFunctions.HARTMANN3_MINIMUM, f, 5e-6, "published f* = -3.86278 (Dixon & Szegő 1978 / VLSE)");
        // refined minimum with the VLSE constants: -3.862779787332663 (point refined with numpy +
        // Nelder-Mead; value confirmed with mpmath, 50 digits)
        assertEquals(-3.862779787332663,
                TestFunctions.hartmann3(new double[] {0.1145889, 0.5556489, 0.8525470}), 1e-12,
                "numpy + Nelder-Mead, mpmath");
    }

    @Test
    void hartmann3MatchesIndependentValuesAwayFromTheMinimum() {
        // numpy (IEEE double), VLSE constants; confirmed with mpmath (50 digits), an independent
        // reference library; the first distinguishes P[3][0] = 0.0381 from 0.03815
        assertEquals(-0.6280220150705937, TestFunctions.hartmann3(new double[] {0.5, 0.5, 0.5}), 1e-14);
        assertEquals(-0.06797411659013464, TestFunctions.hartmann3(new double[3]), 1e-15);
        assertEquals(-0.3004760740554008, TestFunctions.hartmann3(new double[] {1, 1, 1}), 1e-14);
        assertEquals(-3.519074961046237, TestFunctions.hartmann3(new double[] {0.1, 0.5, 0.9}), 1e-13);
    }

    @Test
    void wrongDimensionIsRejected() {
        assertThrows(IllegalArgumentException.class, () -> TestFunctions.hartmann6(new double[5]));
        assertThrows(IllegalArgumentException.class, () -> TestFunctions.branin(new double[3]));
        assertThrows(IllegalArgumentException.class, () -> TestFunctions.hartmann3(new double[2]));
    }
}
