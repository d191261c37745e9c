package dev.terrace.core.acquisition;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Properties of {@link Acquisitions} that follow from the closed form of expected improvement
 * (Jones, Schonlau, Welch, J. Global Optim. 13, 455 (1998)) by differentiation: EI is at least
 * max(f_min - mu, 0), dEI/dmu = -Phi(z), dEI/dsigma = phi(z) > 0, and
 * EI(mu, sigma; f) = sigma EI(0, 1; (f - mu)/sigma); plus consistency properties of the window
 * probabilities that follow from the axioms of probability.
 */
class AcquisitionsPropertyTest {

    @Property
    void expectedImprovementIsAtLeastThePlainImprovement(
            @ForAll @DoubleRange(min = -10, max = 10) double mu,
            @ForAll @DoubleRange(min = 0, max = 10) double sigma,
            @ForAll @DoubleRange(min = -10, max = 10) double fMin) {
        // From the closed form: EI >= max(f_min - mu, 0) (Jensen's inequality on the convex max(., 0))
        double ei = Acquisitions.expectedImprovement(mu, sigma, fMin);
        assertTrue(ei >= Math.max(fMin - mu, 0) - 1e-12 * (1 + Math.abs(fMin - mu)), "EI " + ei);
    }

    @Property
    void expectedImprovementScalesWithSigma(
            @ForAll @DoubleRange(min = -10, max = 10) double mu,
            @ForAll @DoubleRange(min = 0.01, max = 10) double sigma,
            @ForAll @DoubleRange(min = -10, max = 10) double fMin) {
        // From the closed form: EI(mu, sigma; f) = sigma * EI(0, 1; (f - mu)/sigma)
        double lhs = Acquisitions.expectedImprovement(mu, sigma, fMin);
        double rhs = sigma * Acquisitions.expectedImprovement(0, 1, (fMin - mu) / sigma);
        assertEquals(rhs, lhs, 1e-12 * Math.max(1e-300, Math.abs(rhs)) + 1e-300, "scaling relation");
    }

    @Property
    void expectedImprovementGrowsWithSigma(
            @ForAll @DoubleRange(min = -5, max = 5) double mu,
            @ForAll @DoubleRange(min = 0, max = 5) double sigma,
            @ForAll @DoubleRange(min = 0.01, max = 5) double extra,
            @ForAll @DoubleRange(min = -5, max = 5) double fMin) {
        // From the closed form: dEI/dsigma = phi(z) > 0
        assertTrue(Acquisitions.expectedImprovement(mu, sigma + extra, fMin)
                >= Acquisitions.expectedImprovement(mu, sigma, fMin), "monotone in sigma");
    }

    @Property
    void derivativesMatchTheClosedForms(
            @ForAll @DoubleRange(min = -3, max = 3) double mu,
            @ForAll @DoubleRange(min = 0.2, max = 3) double sigma,
            @ForAll @DoubleRange(min = -3, max = 3) double fMin) {
        // From the closed form: dEI/dmu = -Phi(z), dEI/dsigma = phi(z); central differences with h = 1e-5
        double h = 1e-5;
        double z = (fMin - mu) / sigma;
        double dMu = (Acquisitions.expectedImprovement(mu + h, sigma, fMin)
                - Acquisitions.expectedImprovement(mu - h, sigma, fMin)) / (2 * h);
        double dSigma = (Acquisitions.expectedImprovement(mu, sigma + h, fMin)
                - Acquisitions.expectedImprovement(mu, sigma - h, fMin)) / (2 * h);
        assertEquals(-StandardNormal.cdf(z), dMu, 1e-7, "dEI/dmu");
        assertEquals(StandardNormal.pdf(z), dSigma, 1e-7, "dEI/dsigma");
    }

    @Property
    void logExpectedImprovementIsTheLogarithmWhereBothAreRepresentable(
            @ForAll @DoubleRange(min = -50, max = 50) double mu,
            @ForAll @DoubleRange(min = 0.05, max = 5) double sigma,
            @ForAll @DoubleRange(min = -50, max = 50) double fMin) {
        double ei = Acquisitions.expectedImprovement(mu, sigma, fMin);
        double log = Acquisitions.logExpectedImprovement(mu, sigma, fMin, 0);
        if (ei > 1e-290) {
            assertEquals(Math.log(ei), log, 1e-12 * Math.max(1, Math.abs(log)), "ln EI");
        } else {
            assertTrue(log < Math.log(1e-290) + 1e-9 && log > Acquisitions.LOG_ZERO, "finite below the range: " + log);
        }
    }

    @Property
    void optimisticWindowProbabilityIsNeverBelowThePlainOne(
            @ForAll @DoubleRange(min = -5, max = 5) double mu,
            @ForAll @DoubleRange(min = 0, max = 3) double sigmaLatent,
            @ForAll @DoubleRange(min = 0.01, max = 3) double sigmaNew,
            @ForAll @DoubleRange(min = -6, max = 6) double a,
            @ForAll @DoubleRange(min = 0, max = 4) double width,
            @ForAll @DoubleRange(min = 0, max = 4) double beta) {
        double plain = Acquisitions.windowProbability(mu, sigmaNew, a, a + width);
        double opt = Acquisitions.optimisticWindowProbability(mu, sigmaLatent, sigmaNew, a, a + width, beta);
        assertTrue(opt >= plain, "optimistic " + opt + " < plain " + plain);
        assertEquals(plain, Acquisitions.optimisticWindowProbability(mu, sigmaLatent, sigmaNew, a, a + width, 0), 0.0,
                "beta = 0 gives the plain window probability");
        double wider = Acquisitions.optimisticWindowProbability(mu, sigmaLatent, sigmaNew, a, a + width, beta + 0.5);
        assertTrue(wider >= opt - 1e-12, "a wider band is at least as optimistic (to rounding)");
        // the closed-form maximiser beats every other mean in the band (checked on a grid; the
        // tolerance covers rounding of (lo - m)/s amplified by slopes up to 1/sigma_new)
        double best = Acquisitions.optimisticMean(mu, sigmaLatent, a, a + width, beta);
        double pBest = Acquisitions.windowProbability(best, sigmaNew, a, a + width);
        for (int k = 0; k <= 20; k++) {
            double m = mu - beta * sigmaLatent + k * (2 * beta * sigmaLatent) / 20;
            double pm = Acquisitions.windowProbability(m, sigmaNew, a, a + width);
            assertTrue(pm <= pBest + 1e-12, "grid mean " + m + " gives " + pm + " > " + pBest + " at best mean " + best
                    + " (mu " + mu + ", sl " + sigmaLatent + ", sn " + sigmaNew + ", a " + a + ", w " + width + ", beta " + beta + ")");
        }
    }

    @Property
    void windowProbabilitiesAddUpOverAdjacentWindows(
            @ForAll @DoubleRange(min = -5, max = 5) double mu,
            @ForAll @DoubleRange(min = 0.01, max = 3) double s,
            @ForAll @DoubleRange(min = -8, max = 8) double a,
            @ForAll @DoubleRange(min = 0, max = 4) double width) {
        double b = a + width;
        double below = Acquisitions.windowProbability(mu, s, Double.NaN, a);
        double inside = Acquisitions.windowProbability(mu, s, a, b);
        double above = Acquisitions.windowProbability(mu, s, b, Double.NaN);
        assertTrue(inside >= 0 && inside <= 1, "a probability");
        assertEquals(1.0, below + inside + above, 1e-14, "the three windows partition the line");
        double log = Acquisitions.logWindowProbability(mu, s, a, b);
        if (inside > 1e-290) {
            assertEquals(Math.log(inside), log, 1e-9 * Math.max(1, Math.abs(log)), "log form agrees");
        }
    }
}
