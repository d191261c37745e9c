package dev.terrace.core.acquisition;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * Check values for {@link StandardNormal}: every expected value was computed with mpmath 1.3.0
 * (50 digits), an independent reference library ({@code mp.ncdf}, {@code mp.npdf}, {@code mp.log}).
 * Tolerances (a few ulp, {@code 4e-16} relative) are a test design choice.
 */
class StandardNormalTest {

    /**
     * {z, Phi(z), ln Phi(z), phi(z)}, computed with mpmath 1.3.0 (50 digits), an independent reference
     * library; the z values are a test design choice spanning both tails and the -37 underflow edge.
     */
    private static final double[][] MPMATH = {
        {-0.5, 0.30853753872598689636, -1.1759117615936186089, 0.35206532676429947777},
        {-1, 0.15865525393145705141, -1.8410216450092635058, 0.2419707245191433498},
        {-1.2, 0.11506967022170827665, -2.1622175060437393286, 0.19418605498321295076},
        {-2, 0.0227501319481792072, -3.7831843336820319488, 0.053990966513188051951},
        {-5, 2.8665157187919391167e-7, -15.064998393988725736, 1.4867195147342977079e-6},
        {-10, 7.619853024160526066e-24, -53.231285150512470578, 7.6945986267064193463e-23},
        {-20, 2.7536241186062336951e-89, -203.91715537109726394, 5.5209483621597631896e-88},
        {-37, 5.7255712225245768227e-300, -689.0305855768905936, 2.1200065515246056269e-298},
        {0.7, 0.75803634777692697138, -0.277023942277131263, 0.31225393336676126681},
        {3, 0.99865010196836990547, -0.0013508099647481937988, 0.0044318484119380071756},
        {8, 0.9999999999999993779, -6.2209605742717860585e-16, 5.052271083536892288e-15},
    };

    @Test
    void distributionFunctionMatchesMpmathToAFewUlpInBothTails() {
        for (double[] r : MPMATH) {
            // expected values: mpmath (50 digits) table above; tolerances: test design choice
            assertEquals(r[1], StandardNormal.cdf(r[0]), 4e-16 * r[1], "mpmath Phi(" + r[0] + ")");
            assertEquals(r[2], StandardNormal.logCdf(r[0]), 4e-16 * Math.abs(r[2]) + 1e-30,
                    "mpmath ln Phi(" + r[0] + ")");
            assertEquals(r[3], StandardNormal.pdf(r[0]), 4e-16 * r[3], "mpmath phi(" + r[0] + ")");
            // derived here: 1 - Phi(-z) = Phi(z) by symmetry, so the same mpmath Phi column applies
            assertEquals(r[1], StandardNormal.upperTail(-r[0]), 4e-16 * r[1], "upper tail mirrors");
        }
    }

    @Test
    void logDistributionFunctionIsFiniteFarBelowUnderflow() {
        // computed with mpmath 1.3.0 (50 digits), an independent reference library:
        // ln Phi(-40) = -804.60844201375378817, ln Phi(-1000) = -500007.82669481218431.
        // Tolerances 1e-12 and 1e-9 (about 1e-15 relative) are a test design choice.
        // derived here: Phi(-40) = exp(-804.6) = 3.7e-350 (mpmath) lies below the smallest double
        // subnormal 4.9e-324 (IEEE 754), so the double result is exactly 0
        assertEquals(0.0, StandardNormal.cdf(-40), "Phi(-40) underflows");
        assertEquals(-804.60844201375378817, StandardNormal.logCdf(-40), 1e-12, "mpmath (50 digits)");
        assertEquals(-500007.82669481218431, StandardNormal.logCdf(-1000), 1e-9, "mpmath (50 digits)");
        // Acquisitions.LOG_ZERO is Terrace's own finite stand-in for log 0 (design choice, no NaN or
        // infinity reaches an output); z = -1e200 is a test design choice
        assertEquals(Acquisitions.LOG_ZERO, StandardNormal.logCdf(-1e200), "clamped at the finite log 0");
    }

    @Test
    void millsRatioContinuedFractionIsAccurateAtTheSwitchPoint() {
        // computed with mpmath 1.3.0 (50 digits), an independent reference library:
        // Phi(-1)/phi(1) = 0.65567954241879847154 (Mills' ratio at 1, where the fraction converges
        // slowest); tolerance 3e-16 is a test design choice
        assertEquals(0.65567954241879847154, StandardNormal.millsRatio(1.0), 3e-16, "mpmath (50 digits) R(1)");
    }

    @Test
    void nonFiniteArgumentsAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> StandardNormal.cdf(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> StandardNormal.pdf(Double.POSITIVE_INFINITY));
    }
}
