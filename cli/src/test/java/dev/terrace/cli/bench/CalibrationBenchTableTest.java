package dev.terrace.cli.bench;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The calibration benchmark's summary numbers on a worked example: the bin-weighted mean absolute
 * calibration error (the expected calibration error of a reliability diagram, DeGroot and
 * Fienberg, The Statistician 32, 12 (1983); weighting by bin size is common practice) and the
 * runs to a reliable top recipe, computed by hand below.
 */
class CalibrationBenchTableTest {

    @Test
    void weightedErrorAndRunsToReliableByHand() {
        List<CalibrationBench.Record> rs = List.of(
                // seed 1: top proposal reliable (truth >= 0.8) first at 9 runs
                new CalibrationBench.Record(1, 5, true, 0.9, 0.5),
                new CalibrationBench.Record(1, 5, false, 0.3, 0.1),
                new CalibrationBench.Record(1, 9, true, 0.9, 0.85),
                // seed 2: reliable at 7 runs; the non-top record at 5 runs does not count
                new CalibrationBench.Record(2, 5, false, 0.5, 0.9),
                new CalibrationBench.Record(2, 7, true, 0.7, 0.8),
                // seed 3: never reliable
                new CalibrationBench.Record(3, 5, true, 0.1, 0.0));
        // bins: [0,0.2): {0.1/0.0} -> 1 x 0.1; [0.2,0.4): {0.3/0.1} -> 1 x 0.2; [0.4,0.6): {0.5/0.9} -> 1 x 0.4;
        // [0.6,0.8): {0.7/0.8} -> 1 x 0.1; [0.8,1]: {0.9/0.5, 0.9/0.85} -> 2 x |0.9 - 0.675| = 0.45
        // sum 1.25 over 6 records
        assertEquals(1.25 / 6, CalibrationBench.weightedCalibrationError(rs), 1e-12);
        String t = CalibrationBench.table(new CalibrationBench.Result(rs, new CalibrationBench.Coverage(9, 10), 3));
        // runs to reliable per seed: 9, 7, never (22) -> median 9
        assertTrue(t.contains("runs until the top proposal is reliable (true P(in spec) >= 0.8): median 9.0 over 3"
                + " seeds (1 never within 20 runs)"), t);
        assertTrue(t.contains("90 % interval coverage of measured outcomes  0.900  (9 of 10)"), t);
    }
}
