package dev.terrace.core.surrogate;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The leave-one-out variance scale: scaling every predictive variance by c leaves the
 * leave-one-out means alone and multiplies the leave-one-out variances by c; the c that maximises
 * the leave-one-out log predictive probability (Rasmussen and Williams 2006, eq. 5.10) is the mean
 * squared standardized error (set the derivative of sum -0.5 ln(2 pi c v_i) - e_i^2/(2 c v_i) to
 * zero). Checked here against a brute-force maximisation of that sum over a fine grid of c.
 */
class GpLeaveOneOutScaleTest {

    static double looLogPredictive(double c, double[] e, double[] v) {
        double s = 0;
        for (int i = 0; i < e.length; i++) {
            s += -0.5 * Math.log(2 * Math.PI * c * v[i]) - e[i] * e[i] / (2 * c * v[i]);
        }
        return s;
    }

    @Test
    void theScaleMaximisesTheLeaveOneOutLogPredictiveProbability() {
        double[] y = {1.0, 1.4, 0.7, 2.2, 1.9, 0.4};
        double[] e = {0.3, -0.5, 0.2, 0.9, -0.1, -0.7};
        double[] v = {0.04, 0.09, 0.05, 0.2, 0.03, 0.1};
        GpLeaveOneOut loo = GpLeaveOneOut.of(y, e, v);
        double bestC = Double.NaN;
        double best = Double.NEGATIVE_INFINITY;
        for (int k = 1; k <= 200_000; k++) {
            double c = k * 1e-4;
            double l = looLogPredictive(c, e, v);
            if (l > best) {
                best = l;
                bestC = c;
            }
        }
        assertEquals(bestC, loo.varianceScale(), 1e-4, "grid maximum of the leave-one-out log predictive");
        // derived by hand from the definition (R&W 2006 eq. 5.10, no published table value):
        // z^2 = e^2/v = 2.25, 2.778, 0.8, 4.05, 0.333, 4.9; mean 2.5185
        assertEquals(2.5185, loo.varianceScale(), 1e-4);
        assertEquals(Math.sqrt(loo.varianceScale()), loo.sdFactor(), 1e-12, "six runs: the spread is widened");
    }

    @Test
    void theSpreadIsOnlyWidenedAndOnlyFromFiveRunsOn() {
        double[] y = {1, 2, 3, 4};
        GpLeaveOneOut four = GpLeaveOneOut.of(y, new double[] {1, 1, 1, 1}, new double[] {0.1, 0.1, 0.1, 0.1});
        // derived by hand: e^2/v = 1/0.1 = 10 for every run; below, 0.01/1 = 0.01
        assertEquals(10, four.varianceScale(), 1e-12);
        assertEquals(1, four.sdFactor(), 0, "below GpLeaveOneOut.MIN_RUNS errors the factor stays 1");
        double[] y5 = {1, 2, 3, 4, 5};
        GpLeaveOneOut tight = GpLeaveOneOut.of(y5, new double[] {0.1, -0.1, 0.1, -0.1, 0.1},
                new double[] {1, 1, 1, 1, 1});
        assertEquals(0.01, tight.varianceScale(), 1e-12);
        assertEquals(1, tight.sdFactor(), 0, "an over-wide spread is not narrowed");
    }
}
