package dev.terrace.core.propose;

import dev.terrace.core.acquisition.Acquisitions;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.SourcePosition;
import dev.terrace.core.units.Units;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

/** The physical range of an outcome and the censored view of a normal prediction against it. */
class PhysicalRangeTest {

    private static OutcomeSpec outcome(String unit, Scale scale) {
        return new OutcomeSpec("x", Units.bySymbol(unit).orElseThrow(), scale, null, List.of(), SourcePosition.UNKNOWN);
    }

    @Test
    void rangesFollowTheQuantityOfTheUnit() {
        assertEquals(new PhysicalRange(0, Double.POSITIVE_INFINITY), PhysicalRange.of(outcome("nm", Scale.LINEAR)));
        assertEquals(new PhysicalRange(0, Double.POSITIVE_INFINITY), PhysicalRange.of(outcome("cm^-2", Scale.LOG)));
        assertEquals(new PhysicalRange(0, Double.POSITIVE_INFINITY), PhysicalRange.of(outcome("nm/s", Scale.LINEAR)));
        // 0 K = -273.15 degC exactly (BIPM, The International System of Units, 9th ed. 2019, 2.3.1)
        assertEquals(-273.15, PhysicalRange.of(outcome("degC", Scale.LINEAR)).min(), 1e-12);
        assertEquals(new PhysicalRange(0, 1), PhysicalRange.of(outcome("fraction", Scale.LINEAR)));
        assertFalse(PhysicalRange.of(outcome("1", Scale.LINEAR)).bounded(), "a plain number may be negative");
        assertFalse(PhysicalRange.of(outcome("deg", Scale.LINEAR)).bounded(), "a miscut angle may be negative");
        assertThrows(IllegalArgumentException.class, () -> PhysicalRange.of(new OutcomeSpec("shape", null, Scale.LINEAR,
                null, List.of("dot", "ring"), SourcePosition.UNKNOWN)));
        assertThrows(IllegalArgumentException.class, () -> new PhysicalRange(1, 1));
    }

    /**
     * The censored variable max(Y, 0) has the quantiles max(q, 0) of Y (Tobin, Econometrica 26,
     * 1958): the 5 % point of N(2, 3^2) is 2 - 1.6449*3 < 0, so it is printed as 0; the 95 % point
     * is kept. Quantiles from Commons Math's NormalDistribution.
     */
    @Test
    void clippingGivesTheQuantilesOfTheCensoredNormal() {
        PhysicalRange r = PhysicalRange.of(outcome("nm", Scale.LINEAR));
        NormalDistribution n = new NormalDistribution(2, 3);
        assertEquals(0.0, r.clip(n.inverseCumulativeProbability(0.05)), 0.0);
        assertEquals(2 + 1.6448536 * 3, r.clip(n.inverseCumulativeProbability(0.95)), 1e-6);
        assertEquals(2.0, r.clip(2.0), 0.0);
    }

    /**
     * A window that reaches the bound counts the mass beyond it: P(max(Y,0) in [0, 4]) = P(Y <= 4)
     * for Y ~ N(2, 3^2), which Commons Math gives as Phi(2/3); a window that stops short of the
     * bound, [1, 4], is the plain normal probability.
     */
    @Test
    void windowProbabilitiesAreThoseOfTheCensoredNormal() {
        PhysicalRange r = PhysicalRange.of(outcome("nm", Scale.LINEAR));
        NormalDistribution n = new NormalDistribution(2, 3);
        double atBound = Acquisitions.windowProbability(2, 3, r.windowLow(Scale.LINEAR, 0), r.windowHigh(Scale.LINEAR, 4));
        assertEquals(n.cumulativeProbability(4), atBound, 1e-9);
        double inside = Acquisitions.windowProbability(2, 3, r.windowLow(Scale.LINEAR, 1), r.windowHigh(Scale.LINEAR, 4));
        assertEquals(n.cumulativeProbability(4) - n.cumulativeProbability(1), inside, 1e-9);
        PhysicalRange f = PhysicalRange.of(outcome("fraction", Scale.LINEAR));
        assertEquals(Double.POSITIVE_INFINITY, f.windowHigh(Scale.LINEAR, 1.0), 0.0);
        assertEquals(0.9, f.windowHigh(Scale.LINEAR, 0.9), 0.0);
        PhysicalRange log = PhysicalRange.of(outcome("cm^-2", Scale.LOG));
        assertEquals(9.0, log.windowLow(Scale.LOG, 9.0), 0.0, "log outcomes are positive already");
        assertEquals(Double.NaN, r.windowLow(Scale.LINEAR, Double.NaN), 0.0, "no lower end stays none");
    }
}
