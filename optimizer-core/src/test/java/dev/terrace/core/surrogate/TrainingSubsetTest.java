package dev.terrace.core.surrogate;

import dev.terrace.core.campaign.SourcePosition;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Tests of {@link TrainingSubset}. The run logs are random points invented for these tests. The
 * external yardsticks are a brute-force recomputation of the distances in the test itself and the
 * factor-2 bound of greedy farthest-point selection for the k-centre problem (Gonzalez, Theor.
 * Comput. Sci. 38, 293 (1985); from memory).
 */
class TrainingSubsetTest {

    static List<DesignPoint> randomPoints(int n, int d, int levels, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        List<DesignPoint> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double[] x = new double[d];
            for (int k = 0; k < d; k++) {
                x[k] = r.nextDouble();
            }
            out.add(new DesignPoint(x, levels > 0 ? new int[] {r.nextInt(levels)} : new int[0]));
        }
        return out;
    }

    /** Squared distance as the class documents it: unit cube, +1 per differing choice. */
    static double dist2(DesignPoint a, DesignPoint b) {
        double s = 0;
        for (int k = 0; k < a.dimensions(); k++) {
            double t = a.x(k) - b.x(k);
            s += t * t;
        }
        for (int k = 0; k < a.levelCount(); k++) {
            s += a.level(k) != b.level(k) ? 1 : 0;
        }
        return s;
    }

    @Test
    void keepsEveryRunWhenTheLogIsShort() {
        List<DesignPoint> x = randomPoints(50, 3, 2, 1);
        TrainingSubset s = TrainingSubset.select(x, null, 50, 9);
        assertFalse(s.isSubset());
        assertEquals(50, s.size());
        assertEquals(0, s.coverRadius());
        assertEquals(x, s.pick(x));
    }

    @Test
    void isDeterministicForASeedAndStatesTheCount() {
        List<DesignPoint> x = randomPoints(400, 4, 2, 2);
        TrainingSubset a = TrainingSubset.select(x, null, 60, 123);
        TrainingSubset b = TrainingSubset.select(x, null, 60, 123);
        assertArrayEquals(a.indices(), b.indices());
        assertTrue(a.isSubset());
        assertEquals(60, a.size());
        assertEquals(400, a.total());
        String note = a.note("dot_density");
        assertTrue(note.contains("trained on 60 of 400 runs"), note);
        assertTrue(note.contains(TrainingSubset.METHOD), note);
        // the seed picks the first run, so another seed generally gives another subset
        TrainingSubset c = TrainingSubset.select(x, null, 60, 124);
        assertFalse(Arrays.equals(a.indices(), c.indices()));
    }

    @Test
    void keepsTheRunsNearestTheFocusRuns() {
        List<DesignPoint> x = randomPoints(500, 3, 0, 3);
        boolean[] focus = new boolean[x.size()];
        focus[17] = true;
        focus[321] = true;
        int max = 80;
        TrainingSubset s = TrainingSubset.select(x, focus, max, 5);
        Set<Integer> kept = new HashSet<>();
        for (int i : s.indices()) {
            kept.add(i);
        }
        assertTrue(kept.contains(17) && kept.contains(321));
        // brute force: the FOCUS_FRACTION * max runs nearest to either focus run are all kept
        Integer[] order = new Integer[x.size()];
        double[] d = new double[x.size()];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
            d[i] = Math.min(dist2(x.get(i), x.get(17)), dist2(x.get(i), x.get(321)));
        }
        Arrays.sort(order, (p, q) -> Double.compare(d[p], d[q]));
        int share = (int) Math.floor(TrainingSubset.FOCUS_FRACTION * max);
        for (int k = 0; k < share; k++) {
            assertTrue(kept.contains(order[k]), "run " + order[k] + " is among the nearest to the focus");
        }
        assertEquals(max, s.size());
        assertEquals(2, s.focusRuns());
    }

    @Test
    void spreadsTheFocusShareWhenManyRunsAreInFocus() {
        List<DesignPoint> x = randomPoints(300, 2, 0, 4);
        boolean[] focus = new boolean[x.size()];
        for (int i = 0; i < focus.length; i += 2) {
            focus[i] = true;
        }
        TrainingSubset s = TrainingSubset.select(x, focus, 40, 6);
        int focusKept = 0;
        for (int i : s.indices()) {
            focusKept += focus[i] ? 1 : 0;
        }
        // at least the focus share comes from the focus runs; the space-filling rest may add more
        assertTrue(focusKept >= 20, "focus runs kept: " + focusKept);
        assertEquals(40, s.size());
        assertEquals(150, s.focusRuns());
    }

    @Test
    void coverRadiusIsTheLargestDistanceOfALeftOutRunToAKeptOne() {
        List<DesignPoint> x = randomPoints(300, 3, 2, 7);
        TrainingSubset s = TrainingSubset.select(x, null, 30, 8);
        Set<Integer> kept = new HashSet<>();
        for (int i : s.indices()) {
            kept.add(i);
        }
        double worst = 0;
        for (int i = 0; i < x.size(); i++) {
            if (kept.contains(i)) {
                continue;
            }
            double best = Double.POSITIVE_INFINITY;
            for (int j : kept) {
                best = Math.min(best, dist2(x.get(i), x.get(j)));
            }
            worst = Math.max(worst, best);
        }
        assertEquals(Math.sqrt(worst), s.coverRadius(), 1e-12);
    }

    @Test
    void farthestPointCoverIsWithinTwiceTheOptimalOnAGrid() {
        // 101 points 0, 0.01, ..., 1 on a line; 11 centres. A centre covers 2m + 1 grid points within
        // radius m steps, so 11 (2m + 1) >= 101 needs m >= 5: the optimal k-centre radius is 0.05
        // (arithmetic). Gonzalez 1985: greedy farthest-point is within a factor 2 of it.
        List<DesignPoint> x = new ArrayList<>();
        for (int i = 0; i <= 100; i++) {
            x.add(new DesignPoint(new double[] {i / 100.0}, new int[0]));
        }
        for (long seed = 0; seed < 5; seed++) {
            TrainingSubset s = TrainingSubset.select(x, null, 11, seed);
            assertTrue(s.coverRadius() <= 2 * 0.05 + 1e-12, "cover radius " + s.coverRadius());
        }
    }

    @Test
    void focusIsTheRunsThatMetTheMostTargets() {
        List<Target> targets = List.of(
                new Target("density", 5e9, 2e10, null, SourcePosition.UNKNOWN),
                new Target("shape", Double.NaN, Double.NaN, "dot", SourcePosition.UNKNOWN));
        List<Run> runs = List.of(
                run("a", 1e10, "dot", Run.Status.OK),     // meets both
                run("b", 1e10, "ring", Run.Status.OK),    // meets one
                run("c", 1e8, "dot", Run.Status.OK),      // meets one
                run("d", 1e10, "dot", Run.Status.FAILED), // failed: never in focus
                run("e", 1e10, "dot", Run.Status.OK));    // meets both
        assertArrayEquals(new boolean[] {true, false, false, false, true},
                TrainingSubset.focusOnTargets(targets, runs));
        assertArrayEquals(new boolean[5], TrainingSubset.focusOnTargets(List.of(), runs));
    }

    static Run run(String id, double density, String shape, Run.Status status) {
        return new Run(id, Map.of("density", density), Map.of("shape", shape), status, null, null, null, 2);
    }

    @Test
    void picksMatchingEntriesAndRejectsMismatchedInput() {
        List<DesignPoint> x = randomPoints(40, 2, 0, 9);
        TrainingSubset s = TrainingSubset.select(x, null, 10, 1);
        double[] y = new double[40];
        for (int i = 0; i < y.length; i++) {
            y[i] = i;
        }
        double[] ys = s.pick(y);
        int[] idx = s.indices();
        for (int k = 0; k < idx.length; k++) {
            assertEquals(idx[k], ys[k]);
            assertEquals(x.get(idx[k]), s.pick(x).get(k));
        }
        assertThrows(IllegalArgumentException.class, () -> s.pick(new double[3]));
        assertThrows(IllegalArgumentException.class, () -> TrainingSubset.select(x, new boolean[3], 10, 1));
        assertThrows(IllegalArgumentException.class, () -> TrainingSubset.select(x, null, 0, 1));
    }

    @Test
    void runCapComesFromTheSystemPropertyWhenSet() {
        String old = System.getProperty(TrainingSubset.MAX_RUNS_PROPERTY);
        try {
            System.clearProperty(TrainingSubset.MAX_RUNS_PROPERTY);
            assertEquals(TrainingSubset.DEFAULT_MAX_RUNS, TrainingSubset.maxRuns());
            System.setProperty(TrainingSubset.MAX_RUNS_PROPERTY, "25");
            assertEquals(25, TrainingSubset.maxRuns());
            System.setProperty(TrainingSubset.MAX_RUNS_PROPERTY, "3");
            assertThrows(IllegalArgumentException.class, TrainingSubset::maxRuns);
            System.setProperty(TrainingSubset.MAX_RUNS_PROPERTY, "many");
            assertThrows(IllegalArgumentException.class, TrainingSubset::maxRuns);
        } finally {
            if (old == null) {
                System.clearProperty(TrainingSubset.MAX_RUNS_PROPERTY);
            } else {
                System.setProperty(TrainingSubset.MAX_RUNS_PROPERTY, old);
            }
        }
    }
}
