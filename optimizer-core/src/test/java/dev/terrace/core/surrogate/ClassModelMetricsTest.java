package dev.terrace.core.surrogate;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * Hand-worked examples of {@link ClassModelMetrics} from the definitions: mean log loss, and the
 * expected calibration error of Guo, Pleiss, Sun &amp; Weinberger 2017 (ICML), eq. (3):
 * ECE = &Sigma;_m (|B_m|/n)|acc(B_m) &minus; conf(B_m)|.
 */
class ClassModelMetricsTest {

    @Test
    void expectedCalibrationErrorMatchesAHandWorkedExample() {
        // four cases, each alone in its bin: |1 - 0.9| + |0 - 0.8| + |1 - 0.6| + |1 - 0.7| = 1.6, / 4 = 0.4
        double[][] p = {{0.9, 0.1}, {0.8, 0.2}, {0.6, 0.4}, {0.3, 0.7}};
        int[] y = {0, 1, 0, 1};
        assertEquals(0.4, ClassModelMetrics.expectedCalibrationError(p, y, 10), 1e-15, "hand-worked");
        // one bin: accuracy 3/4, mean confidence (0.9 + 0.8 + 0.6 + 0.7)/4 = 0.75, so ECE = 0
        assertEquals(0.0, ClassModelMetrics.expectedCalibrationError(p, y, 1), 1e-15, "hand-worked, one bin");
        assertEquals(-(Math.log(0.9) + Math.log(0.2) + Math.log(0.6) + Math.log(0.7)) / 4,
                ClassModelMetrics.logLoss(p, y), 1e-15, "hand-worked log loss");
    }

    @Test
    void binaryFormsAgreeWithTheTwoColumnForms() {
        double[] ps = {0.1, 0.2, 0.4, 0.7};
        boolean[] ok = {false, true, false, true};
        assertEquals(0.4, ClassModelMetrics.expectedCalibrationError(ps, ok, 10), 1e-15, "same cases as above");
        assertEquals(-(Math.log(0.9) + Math.log(0.2) + Math.log(0.6) + Math.log(0.7)) / 4,
                ClassModelMetrics.logLoss(ps, ok), 1e-15, "same cases as above");
        assertThrows(IllegalArgumentException.class, () -> ClassModelMetrics.logLoss(new double[] {1.5}, new boolean[] {true}));
    }
}
