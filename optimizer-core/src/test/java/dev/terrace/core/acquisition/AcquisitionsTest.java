package dev.terrace.core.acquisition;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Check values for {@link Acquisitions}.
 *
 * <p>Sources: the closed form of expected improvement for minimisation,
 * EI = (f_min - mu - xi) Phi(z) + sigma phi(z) with z = (f_min - mu - xi)/sigma (Jones, Schonlau,
 * Welch, J. Global Optim. 13, 455 (1998); Mockus, Tiesis, Zilinskas, in Towards Global
 * Optimization 2, North-Holland (1978)), and PI = Phi(z) (Kushner, J. Basic Eng. 86, 97 (1964);
 * citation from memory). "Table" values are that formula evaluated with the reference library
 * mpmath 1.3.0 at 40 digits ({@code mp.ncdf}, {@code mp.npdf}) and rounded to double; they also
 * agree with scipy 1.17 {@code norm.cdf}/{@code norm.pdf} in IEEE double. Values marked "mpmath"
 * were computed the same way at 50 digits.
 */
class AcquisitionsTest {

    private static final double XI0 = 0.0;

    private static void assertRelative(double expected, double actual, double rel, String why) {
        assertEquals(expected, actual, Math.abs(expected) * rel, why);
    }

    @Test
    void expectedImprovementMatchesTheWorkedMinimisationTable() {
        double[][] rows = {
            // mu, sigma, fMin, EI, PI  (mpmath 1.3.0, 40 digits)
            {0, 1, 0, 0.3989422804014327, 0.5},
            {0, 1, 1, 1.0833154705876864, 0.8413447460685429},
            {1, 1, 0, 0.0833154705876863, 0.15865525393145705},
            {0, 2, 1, 1.3955931148026122, 0.6914624612740131},
            {0.5, 0.1, 0.4, 0.008331547058768635, 0.158655253931457},
            {2, 0.5, 0, 3.572629216202833e-6, 3.167124183311992e-5},
            {0, 1, -3, 3.821543170477236e-4, 1.3498980316300945e-3},
        };
        for (double[] r : rows) {
            String at = "table row mu=" + r[0] + " sigma=" + r[1] + " fMin=" + r[2];
            assertRelative(r[3], Acquisitions.expectedImprovement(r[0], r[1], r[2]), 1e-13, "EI, " + at);
            assertRelative(r[4], Acquisitions.probabilityOfImprovement(r[0], r[1], r[2], XI0), 1e-13, "PI, " + at);
            assertRelative(Math.log(r[4]), Acquisitions.logProbabilityOfImprovement(r[0], r[1], r[2], XI0), 1e-13,
                    "log PI, " + at);
        }
    }

    @Test
    void explorationOffsetLowersExpectedImprovementAsTabulated() {
        // mpmath 1.3.0: mu = 0, sigma = 1, f_min = 0, xi = 0.01 gives 0.3939622273492285 (z = -0.01)
        assertRelative(0.3939622273492285, Acquisitions.expectedImprovement(0, 1, 0, 0.01), 1e-13, "table, xi = 0.01");
        assertEquals(0.01, Acquisitions.SUGGESTED_XI, "Brochu, Cora & de Freitas 2010 suggest 0.01");
    }

    @Test
    void maximisationFormMatchesTheWorkedExample() {
        // maximisation form, z = (mu - f_max - xi)/sigma; mpmath 1.3.0: mu = 1.2, sigma = 0.5, f_max = 1.0 (z = 0.4)
        // gives EI 0.3152194184737265, PI 0.6554217416103241
        assertRelative(0.3152194184737265, Acquisitions.expectedImprovementMax(1.2, 0.5, 1.0, XI0), 1e-13, "table, max EI");
        assertRelative(0.6554217416103241, Acquisitions.probabilityOfImprovementMax(1.2, 0.5, 1.0, XI0), 1e-13,
                "table, max PI");
        assertRelative(Math.log(0.3152194184737265), Acquisitions.logExpectedImprovementMax(1.2, 0.5, 1.0, XI0), 1e-13,
                "log of the table value");
    }

    @Test
    void scalingRelationHoldsForTheTabulatedPair() {
        // EI(mu, sigma; f) = sigma * EI(0, 1; (f - mu)/sigma) follows from the closed form: both have z = -1,
        // so EI(0.5, 0.1, 0.4) = 0.1 * EI(1, 1, 0)
        assertRelative(0.1 * Acquisitions.expectedImprovement(1, 1, 0), Acquisitions.expectedImprovement(0.5, 0.1, 0.4),
                1e-13, "scaling relation of the closed form");
    }

    @Test
    void logExpectedImprovementStaysAccurateAtZMinusTen() {
        // mpmath 1.3.0 at 40 digits: z = -10 (sigma = 1) gives EI 7.474560254589328e-25 and log EI
        // -55.553122036122356; naive double evaluation of the closed form is off by about 8e-13 relative.
        assertRelative(7.474560254589328e-25, Acquisitions.expectedImprovement(10, 1, 0), 1e-14,
                "table, EI at z = -10 to better than the naive 8e-13");
        assertEquals(-55.553122036122356, Acquisitions.logExpectedImprovement(10, 1, 0, XI0), 1e-12,
                "table, log EI at z = -10");
    }

    @Test
    void logExpectedImprovementIsFiniteWherePlainExpectedImprovementUnderflows() {
        // mpmath 1.3.0 at 40 digits: z = -40 gives EI 9.1283447229129724e-352 (underflows in double)
        // and log EI = -808.29856835661996
        assertEquals(0.0, Acquisitions.expectedImprovement(40, 1, 0), "EI itself underflows in double");
        assertEquals(-808.29856835661996, Acquisitions.logExpectedImprovement(40, 1, 0, XI0), 1e-10,
                "table, log EI at z = -40");
        // mpmath: ln h(-1000) = -500014.73445209115845 with h(z) = phi(z) + z Phi(z)
        assertRelative(-500014.73445209115845, Acquisitions.logExpectedImprovement(1000, 1, 0, XI0), 1e-14,
                "mpmath, log EI at z = -1000");
    }

    @Test
    void logExpectedImprovementAgreesWithTheMpmathCurveAcrossTheSwitch() {
        // mpmath: ln h(z) at z = -1 and z = -3, sigma = 1 (the branch switch is at z = -1)
        assertEquals(-2.4851210257126413368, Acquisitions.logExpectedImprovement(1, 1, 0, XI0), 1e-14, "mpmath, z = -1");
        assertEquals(-2.4851210257126413368, Acquisitions.logExpectedImprovement(1 - 1e-12, 1, 0, XI0), 1e-11,
                "mpmath, just above the switch");
        assertEquals(-7.8696860596030285171, Acquisitions.logExpectedImprovement(3, 1, 0, XI0), 1e-14, "mpmath, z = -3");
        // ln sigma shifts the value: sigma = 2, same z = -3
        assertEquals(Math.log(2) - 7.8696860596030285171, Acquisitions.logExpectedImprovement(6, 2, 0, XI0), 1e-13,
                "ln EI = ln sigma + ln h(z)");
    }

    @Test
    void zeroSpreadGivesTheDeterministicLimit() {
        // Jones, Schonlau, Welch, J. Global Optim. 13, 455 (1998): EI = max(f_min - mu - xi, 0) when sigma = 0
        assertEquals(0.7, Acquisitions.expectedImprovement(0.3, 0, 1.0), 1e-15, "improvement of a sure value");
        assertEquals(0.0, Acquisitions.expectedImprovement(1.3, 0, 1.0), "no improvement");
        assertEquals(1.0, Acquisitions.probabilityOfImprovement(0.3, 0, 1.0, XI0), "sure improvement");
        assertEquals(0.0, Acquisitions.probabilityOfImprovement(1.3, 0, 1.0, XI0), "sure non-improvement");
        assertEquals(Math.log(0.7), Acquisitions.logExpectedImprovement(0.3, 0, 1.0, XI0), 1e-15, "ln 0.7");
        assertEquals(Acquisitions.LOG_ZERO, Acquisitions.logExpectedImprovement(1.3, 0, 1.0, XI0), "finite log 0");
    }

    @Test
    void constrainedExpectedImprovementMatchesTheWorkedExample() {
        // Constrained EI = EI * prod_k Pr(c_k <= 0) (Gardner et al., ICML 2014, PMLR 32, 937; Schonlau,
        // Welch, Jones 1998; citations from memory). mpmath 1.3.0: f_min = 0, mu = -0.5, sigma = 1 gives
        // EI 0.6977965574013061; g <= 0 with mu_g = 0.5, sigma_g = 1 has PoF Phi(-0.5) = 0.3085375387259869;
        // cEI = 0.6977965574013061 * 0.3085375387259869 = 0.2152964323520658
        assertRelative(0.6977965574013061, Acquisitions.expectedImprovement(-0.5, 1, 0), 1e-13, "table EI");
        double pof = Acquisitions.probabilityFeasible(0.5, 1, 0);
        assertRelative(0.3085375387259869, pof, 1e-13, "table PoF");
        assertRelative(0.2152964323520658, Acquisitions.constrainedExpectedImprovement(-0.5, 1, 0, XI0, pof), 1e-13,
                "table cEI");
        assertEquals(Math.log(0.2152964323520658), Acquisitions.logConstrainedExpectedImprovement(-0.5, 1, 0, XI0, pof),
                1e-13, "log of the table cEI");
        assertRelative(0.6977965574013061, Acquisitions.constrainedExpectedImprovement(-0.5, 1, 0, XI0), 1e-13,
                "no constraints leaves EI unchanged");
        assertEquals(Acquisitions.LOG_ZERO, Acquisitions.logConstrainedExpectedImprovement(-0.5, 1, 0, XI0, 0.3, 0.0),
                "a sure violation gives the finite log 0");
    }

    @Test
    void windowProbabilityFarInTheUpperTailMatchesTheTailDifference() {
        // mpmath: Phi(-10) - Phi(-11) = 7.6196619582030761984e-24
        double p = Acquisitions.windowProbability(0, 1, 10, 11);
        assertTrue(p > 0, "positive far in the tail");
        assertRelative(7.6196619582030761984e-24, p, 1e-10, "mpmath, P(10 <= Y <= 11)");
        assertRelative(7.6196619582030761984e-24, Acquisitions.windowProbability(0, 1, -11, -10), 1e-10,
                "mpmath, mirrored window");
        assertRelative(7.6196619582030761984e-24, Acquisitions.windowProbability(3, 2, 23, 25), 1e-10,
                "mpmath, the same standardised window for N(3, 2^2)");
    }

    @Test
    void logWindowProbabilityIsFiniteWhereTheProbabilityUnderflows() {
        // mpmath: ln(Phi(-40) - Phi(-41)) = -804.60844201375378817, ln(Phi(-40) - Phi(-40.001)) = -807.84662731141354925
        assertEquals(0.0, Acquisitions.windowProbability(0, 1, 40, 41), "underflows in double");
        assertRelative(-804.60844201375378817, Acquisitions.logWindowProbability(0, 1, 40, 41), 1e-13, "mpmath");
        assertRelative(-807.84662731141354925, Acquisitions.logWindowProbability(0, 1, 40, 40.001), 1e-11,
                "mpmath, narrow window");
        assertRelative(-804.60844201375378817, Acquisitions.logWindowProbability(0, 1, -41, -40), 1e-13,
                "mpmath, mirrored");
        // mpmath: ln Phi(-40) = -804.60844201375378817 (agrees with the window above to 20 digits)
        assertRelative(-804.60844201375378817, Acquisitions.logWindowProbability(0, 1, 40, Double.NaN), 1e-13,
                "mpmath, open above");
    }

    @Test
    void openEndsAreUnbounded() {
        // mpmath: Phi(-5) = 2.8665157187919391167e-7; Phi(-1) = 0.15865525393145705141
        assertRelative(2.8665157187919391167e-7, Acquisitions.windowProbability(0, 1, 5, Double.NaN), 1e-14,
                "mpmath, P(Y >= 5)");
        assertRelative(2.8665157187919391167e-7, Acquisitions.windowProbability(0, 1, Double.NaN, -5), 1e-14,
                "mpmath, P(Y <= -5)");
        assertRelative(1 - 2 * 0.15865525393145705141, Acquisitions.windowProbability(0, 1, -1, 1), 1e-14,
                "mpmath, P(|Y| <= 1)");
        assertEquals(1.0, Acquisitions.windowProbability(0, 1, Double.NaN, Double.NaN), "no bounds");
        assertEquals(1.0, Acquisitions.windowProbability(2, 0, 1, 3), "sure value inside");
        assertEquals(0.0, Acquisitions.windowProbability(4, 0, 1, 3), "sure value outside");
        assertEquals(1.0, Acquisitions.windowProbability(0, 1, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY),
                "infinite bounds count as open");
    }

    @Test
    void optimisticWindowProbabilityMovesTheMeanTowardsTheWindow() {
        // mu = 0, sigma_latent = 1, sigma_new = 0.5, window [2, 3], beta = 1: the best mean is the band edge 1,
        // mpmath: Phi((3-1)/0.5) - Phi((2-1)/0.5) = 0.022718460706346087279
        assertEquals(1.0, Acquisitions.optimisticMean(0, 1, 2, 3, 1), 0.0, "centre 2.5 clamped to the band [-1, 1]");
        assertRelative(0.022718460706346087279, Acquisitions.optimisticWindowProbability(0, 1, 0.5, 2, 3, 1), 1e-13,
                "mpmath");
        assertEquals(2.5, Acquisitions.optimisticMean(0, 1, 2, 3, 4), 0.0, "centre inside the band");
        // half-open window [2, inf): the best mean is the upper band edge; mpmath: Phi(-2) = 0.0227501319481792072
        assertRelative(0.0227501319481792072, Acquisitions.optimisticWindowProbability(0, 1, 0.5, 2, Double.NaN, 1), 1e-13,
                "mpmath, half-open");
        assertEquals(-1.0, Acquisitions.optimisticMean(0, 1, Double.NaN, -3, 1), 0.0, "open below: lower edge");
        assertEquals(Acquisitions.windowProbability(0, 0.5, 2, 3), Acquisitions.optimisticWindowProbability(0, 1, 0.5, 2, 3, 0),
                0.0, "beta = 0 is the plain window probability");
        assertRelative(Math.log(0.022718460706346087279), Acquisitions.logOptimisticWindowProbability(0, 1, 0.5, 2, 3, 1),
                1e-13, "log form, mpmath");
    }

    @Test
    void badArgumentsAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> Acquisitions.expectedImprovement(Double.NaN, 1, 0));
        assertThrows(IllegalArgumentException.class, () -> Acquisitions.expectedImprovement(0, -1, 0));
        assertThrows(IllegalArgumentException.class, () -> Acquisitions.expectedImprovement(0, 1, 0, -0.1));
        assertThrows(IllegalArgumentException.class, () -> Acquisitions.windowProbability(0, 1, 2, 1));
        assertThrows(IllegalArgumentException.class, () -> Acquisitions.windowProbability(0, 1, Double.POSITIVE_INFINITY, 1));
        assertThrows(IllegalArgumentException.class, () -> Acquisitions.optimisticWindowProbability(0, 1, 1, 0, 1, -1));
        assertThrows(IllegalArgumentException.class, () -> Acquisitions.constrainedExpectedImprovement(0, 1, 0, 0, 1.5));
    }

    @Test
    void extremeArgumentsStayFinite() {
        double[] vs = {
            Acquisitions.expectedImprovement(0, Double.MIN_VALUE, 1e300),
            Acquisitions.expectedImprovement(1e300, Double.MIN_VALUE, -1e300),
            Acquisitions.logExpectedImprovement(1e300, 1e-300, -1e300, 0),
            Acquisitions.logExpectedImprovement(0, Double.MIN_VALUE, Double.MIN_VALUE, 0),
            Acquisitions.logWindowProbability(0, Double.MIN_VALUE, 1, 2),
            Acquisitions.logOptimisticWindowProbability(0, 1e300, 1e-300, 1, 2, 1e10),
            Acquisitions.windowProbability(-1e308, 1e-308, 1e308, Double.NaN),
        };
        for (double v : vs) {
            assertTrue(Double.isFinite(v), "finite: " + v);
            assertTrue(v >= Acquisitions.LOG_ZERO, "not below the log floor: " + v);
        }
    }
}
