package dev.terrace.core.propose;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The Student-t widening of the predictive spread against printed t quantiles: one-sided 95 %
 * points t(0.95, nu) = 2.132 (nu 4), 1.833 (9), 1.729 (19), 1.684 (40), 1.660 (100), from the
 * NIST/SEMATECH e-Handbook of Statistical Methods, table 1.3.6.7.2 (critical values of the t
 * distribution; three decimals), divided by z(0.95) = 1.644854.
 */
class StudentFactorTest {

    @Test
    void matchesTheTableOfTQuantiles() {
        double z = 1.644854; // z(0.95), NIST/SEMATECH e-Handbook, table 1.3.6.7.1 (normal quantiles)
        assertEquals(2.132 / z, StudentSpread.factor(5), 0.0006); // NIST/SEMATECH e-Handbook, table 1.3.6.7.2
        assertEquals(1.833 / z, StudentSpread.factor(10), 0.0006); // NIST/SEMATECH e-Handbook, table 1.3.6.7.2
        assertEquals(1.729 / z, StudentSpread.factor(20), 0.0006); // NIST/SEMATECH e-Handbook, table 1.3.6.7.2
        assertEquals(1.684 / z, StudentSpread.factor(41), 0.0006); // NIST/SEMATECH e-Handbook, table 1.3.6.7.2
        assertEquals(1.660 / z, StudentSpread.factor(101), 0.0006); // NIST/SEMATECH e-Handbook, table 1.3.6.7.2
    }

    @Test
    void oneRunKeepsItsOwnSpreadAndLongLogsTendToTheNormal() {
        assertEquals(1.0, StudentSpread.factor(1), 0);
        // the table and the first-order expansion meet at the switch: one more run moves the factor by
        // about (1 + z^2) / (4 nu^2) = 6e-6 and the expansion errs by about 5e-6
        int n = StudentSpread.TABLE_RUNS;
        assertEquals(StudentSpread.factor(n), StudentSpread.factor(n + 1), 2e-5);
        assertEquals(1.0, StudentSpread.factor(1_000_000), 1e-5);
    }
}
