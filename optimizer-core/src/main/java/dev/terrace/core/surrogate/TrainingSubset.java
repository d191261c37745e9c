package dev.terrace.core.surrogate;

import dev.terrace.core.CheckSummary;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.space.DesignPoint;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * Which runs a Gaussian process trains on when a run log is too long to use whole: the
 * <em>subset of data</em> approximation (Rasmussen &amp; Williams 2006, <i>Gaussian Processes for
 * Machine Learning</i>, sec. 8.3.3, "Subset of Datapoints"; section title from memory), with the
 * subset chosen by a stated rule instead of at random.
 *
 * <p><b>Rule</b> ("focused space-filling subset"), for {@code n} runs of which at most
 * {@code max} are kept:
 * <ol>
 *   <li>the <em>focus</em> part, {@link #FOCUS_FRACTION} of {@code max}: the focus runs (those that
 *       met the most targets, chosen by the caller) and the runs nearest to them, so the region the
 *       search is drawn to keeps every nearby run. When the focus runs alone exceed that share, a
 *       space-filling subset of them is taken instead (rule 2 restricted to them);</li>
 *   <li>the <em>space-filling</em> remainder: greedy farthest-point selection (each step keeps the
 *       run farthest from every run kept so far; Gonzalez, Theor. Comput. Sci. 38, 293 (1985),
 *       from memory, for the k-centre problem), so the kept runs cover everything the log covers.</li>
 * </ol>
 * Distances are Euclidean in the design space's unit cube, each differing categorical choice
 * adding 1 to the squared distance. Ties go to the earlier run in log order; the seed only picks
 * the first run when there is no focus run, so the choice is deterministic for a seed.
 *
 * <p><b>What it costs in honesty.</b> A run left out is never farther than {@link #coverRadius()}
 * from a kept one. The GP's latent variance can only grow when runs are removed (conditioning on
 * fewer observations), so the intervals are, if anything, wider than the full GP's; the mean is
 * learnt from fewer repeats, which the note states. The class and success models (parametric,
 * linear in the number of runs) and the growth-model fits are not affected by this subset.
 *
 * <p>Instances are immutable.
 *
 * @param indices     indices of the kept runs into the caller's list, increasing; never null
 * @param total       number of runs offered
 * @param focusRuns   how many focus runs were offered
 * @param coverRadius largest distance from a left-out run to its nearest kept run (0 when nothing
 *                    is left out)
 * @since 0.1
 */
public record TrainingSubset(int[] indices, int total, int focusRuns, double coverRadius) {

    /**
     * Default largest number of runs a GP trains on: 200. A likelihood evaluation with gradient is
     * O(n³) and each predicted variance O(n²), so the hyperparameter search dominates a proposal
     * on a long log; measured in-process on a 1000-run log of the 6-setting demo campaign (2-core
     * machine, CPU seconds of fitting the surrogates): 5.2 s at 100 runs, 6.7 s at 200, 11.9 s at
     * 300. 200 keeps a long log's proposal within about twice the 30-run call (DEVELOPERS.md,
     * benchmarks) while 200 runs in 6 settings still leave every left-out run within about a third
     * of the box of a kept one. Own choice.
     */
    public static final int DEFAULT_MAX_RUNS = 200;

    /**
     * System property that overrides {@link #DEFAULT_MAX_RUNS} (an integer of at least
     * {@link #MIN_MAX_RUNS}), for tests and for labs that accept a slower proposal.
     */
    public static final String MAX_RUNS_PROPERTY = "terrace.gp.maxRuns";

    /** Smallest accepted override of the run cap: fewer runs cannot fit a GP's hyperparameters. */
    public static final int MIN_MAX_RUNS = 10;

    /**
     * Share of the kept runs spent on the focus region: one half, so the region the search is
     * drawn to and the rest of the box are covered equally densely. Own choice.
     */
    public static final double FOCUS_FRACTION = 0.5;

    /** Name of the rule, as printed in notes and JSON. */
    public static final String METHOD = "subset of data (focused space-filling)";

    /** Checks and copies the indices. */
    public TrainingSubset {
        Objects.requireNonNull(indices, "indices");
        indices = indices.clone();
        if (total < 0 || indices.length > total || focusRuns < 0 || focusRuns > total) {
            throw new IllegalArgumentException("subset sizes out of range");
        }
        for (int i = 0; i < indices.length; i++) {
            if (indices[i] < 0 || indices[i] >= total || (i > 0 && indices[i] <= indices[i - 1])) {
                throw new IllegalArgumentException("subset indices must increase within the runs");
            }
        }
        if (!(coverRadius >= 0) || !Double.isFinite(coverRadius)) {
            throw new IllegalArgumentException("cover radius must be finite and non-negative");
        }
    }

    /** @return a copy of the kept indices */
    @Override
    public int[] indices() {
        return indices.clone();
    }

    /**
     * The run cap in force: {@value #MAX_RUNS_PROPERTY} when set to a valid integer, otherwise
     * {@link #DEFAULT_MAX_RUNS}.
     *
     * @return the largest number of runs a GP trains on
     * @throws IllegalArgumentException when the property is set but not an integer of at least
     *                                  {@link #MIN_MAX_RUNS}
     */
    public static int maxRuns() {
        String v = System.getProperty(MAX_RUNS_PROPERTY);
        if (v == null || v.isBlank()) {
            return DEFAULT_MAX_RUNS;
        }
        int n;
        try {
            n = Integer.parseInt(v.strip());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(MAX_RUNS_PROPERTY + " must be an integer, found '" + v + "'");
        }
        if (n < MIN_MAX_RUNS) {
            throw new IllegalArgumentException(MAX_RUNS_PROPERTY + " must be at least " + MIN_MAX_RUNS
                    + ", found " + n);
        }
        return n;
    }

    /**
     * The focus runs of a log: the ok runs that met the most targets (window and class targets; a
     * maximise or minimise target without a window counts for every run that measured it), when
     * at least one run met at least one target.
     *
     * @param targets the campaign's targets; never null
     * @param runs    the runs; never null
     * @return one flag per run; all false when no run met a target or there are no targets
     */
    public static boolean[] focusOnTargets(List<Target> targets, List<Run> runs) {
        Objects.requireNonNull(targets, "targets");
        int[] met = new int[runs.size()];
        int best = 0;
        for (int i = 0; i < met.length; i++) {
            Run r = runs.get(i);
            if (!r.ok()) {
                continue;
            }
            for (Target t : targets) {
                Boolean m = CheckSummary.meets(t, r);
                if (m != null && m) {
                    met[i]++;
                }
            }
            best = Math.max(best, met[i]);
        }
        boolean[] focus = new boolean[met.length];
        for (int i = 0; i < met.length; i++) {
            focus[i] = best > 0 && met[i] == best;
        }
        return focus;
    }

    /**
     * Chooses the runs to train on.
     *
     * @param x     the runs' design points, all with the same numbers of coordinates and levels
     * @param focus true for the focus runs (same length as {@code x}); null or all false for none
     * @param max   largest number of runs kept, at least 1
     * @param seed  seed of the first pick when there is no focus run
     * @return the subset; every run when {@code x.size() <= max}. Never null.
     * @throws IllegalArgumentException on mismatched input
     */
    public static TrainingSubset select(List<DesignPoint> x, boolean[] focus, int max, long seed) {
        Objects.requireNonNull(x, "x");
        if (max < 1) {
            throw new IllegalArgumentException("max must be at least 1: " + max);
        }
        if (focus != null && focus.length != x.size()) {
            throw new IllegalArgumentException("focus flags and runs differ in number");
        }
        int n = x.size();
        int nFocus = 0;
        if (focus != null) {
            for (boolean b : focus) {
                nFocus += b ? 1 : 0;
            }
        }
        if (n <= max) {
            int[] all = new int[n];
            for (int i = 0; i < n; i++) {
                all[i] = i;
            }
            return new TrainingSubset(all, n, nFocus, 0);
        }
        Geometry g = Geometry.of(x);
        boolean[] kept = new boolean[n];
        double[] dist = new double[n];
        Arrays.fill(dist, Double.POSITIVE_INFINITY);
        int count = 0;
        int focusShare = (int) Math.floor(FOCUS_FRACTION * max);
        if (nFocus > 0 && focusShare > 0) {
            if (nFocus >= focusShare) {
                // too many focus runs: spread the focus share over them
                double[] fd = new double[n];
                Arrays.fill(fd, Double.POSITIVE_INFINITY);
                int first = firstFlagged(focus);
                count += keep(first, kept, fd, g);
                while (count < focusShare) {
                    int next = farthest(fd, kept, focus);
                    count += keep(next, kept, fd, g);
                }
                for (int i = 0; i < n; i++) {
                    if (kept[i]) {
                        g.update(i, dist);
                    }
                }
            } else {
                for (int i = 0; i < n; i++) {
                    if (focus[i]) {
                        count += keep(i, kept, dist, g);
                    }
                }
                // the runs nearest to the focus runs, nearest first (ties: log order)
                Integer[] order = new Integer[n];
                for (int i = 0; i < n; i++) {
                    order[i] = i;
                }
                double[] d0 = dist.clone();
                Arrays.sort(order, (a, b) -> d0[a] != d0[b] ? Double.compare(d0[a], d0[b]) : Integer.compare(a, b));
                for (int k = 0; k < n && count < focusShare; k++) {
                    int i = order[k];
                    if (!kept[i]) {
                        count += keep(i, kept, dist, g);
                    }
                }
            }
        }
        if (count == 0) {
            count += keep(new SplittableRandom(seed).nextInt(n), kept, dist, g);
        }
        while (count < max) {
            count += keep(farthest(dist, kept, null), kept, dist, g);
        }
        double cover = 0;
        for (int i = 0; i < n; i++) {
            if (!kept[i]) {
                cover = Math.max(cover, dist[i]);
            }
        }
        int[] idx = new int[count];
        int k = 0;
        for (int i = 0; i < n; i++) {
            if (kept[i]) {
                idx[k++] = i;
            }
        }
        return new TrainingSubset(idx, n, nFocus, Math.sqrt(cover));
    }

    /** @return true when some runs were left out */
    public boolean isSubset() {
        return indices.length < total;
    }

    /** @return how many runs are kept */
    public int size() {
        return indices.length;
    }

    /**
     * @param all one entry per offered run
     * @param <T> the entry type
     * @return the kept entries in order; never null
     */
    public <T> List<T> pick(List<T> all) {
        checkLength(all.size());
        List<T> out = new ArrayList<>(indices.length);
        for (int i : indices) {
            out.add(all.get(i));
        }
        return out;
    }

    /**
     * @param all one value per offered run, or null
     * @return the kept values in order, or null for null
     */
    public double[] pick(double[] all) {
        if (all == null) {
            return null;
        }
        checkLength(all.length);
        double[] out = new double[indices.length];
        for (int k = 0; k < indices.length; k++) {
            out[k] = all[indices[k]];
        }
        return out;
    }

    /**
     * A one-line note for the grower, naming the method and the counts.
     *
     * @param outcome the outcome whose GP this subset trains
     * @return the note; never null
     */
    public String note(String outcome) {
        return String.format(Locale.ROOT, "%s: the Gaussian process trained on %d of %d runs, a %s around the"
                        + " %d run%s that met the most targets; every other run lies within %.3f (unit-box distance)"
                        + " of one it trained on; the class and success models use every run",
                outcome, indices.length, total, METHOD, focusRuns, focusRuns == 1 ? "" : "s", coverRadius);
    }

    private void checkLength(int len) {
        if (len != total) {
            throw new IllegalArgumentException("expected " + total + " entries, found " + len);
        }
    }

    private static int firstFlagged(boolean[] flags) {
        for (int i = 0; i < flags.length; i++) {
            if (flags[i]) {
                return i;
            }
        }
        throw new IllegalStateException("no flagged run");
    }

    /** Keeps run i and lowers every distance to the kept set; returns 1. */
    private static int keep(int i, boolean[] kept, double[] dist, Geometry g) {
        kept[i] = true;
        g.update(i, dist);
        return 1;
    }

    /** The run not kept (and allowed, when {@code allowed} is given) farthest from the kept set; ties to the first. */
    private static int farthest(double[] dist, boolean[] kept, boolean[] allowed) {
        int best = -1;
        double bestD = -1;
        for (int i = 0; i < dist.length; i++) {
            if (!kept[i] && (allowed == null || allowed[i]) && dist[i] > bestD) {
                bestD = dist[i];
                best = i;
            }
        }
        if (best < 0) {
            throw new IllegalStateException("no run left to keep");
        }
        return best;
    }

    /** The runs' coordinates in flat arrays, for fast squared distances. */
    private record Geometry(double[] x, int[] levels, int d, int c, int n) {
        static Geometry of(List<DesignPoint> pts) {
            int n = pts.size();
            int d = pts.get(0).dimensions();
            int c = pts.get(0).levelCount();
            double[] x = new double[n * d];
            int[] l = new int[n * c];
            for (int i = 0; i < n; i++) {
                DesignPoint p = Objects.requireNonNull(pts.get(i), "design point");
                if (p.dimensions() != d || p.levelCount() != c) {
                    throw new IllegalArgumentException("run " + i + " has another number of settings");
                }
                for (int k = 0; k < d; k++) {
                    x[i * d + k] = p.x(k);
                }
                for (int k = 0; k < c; k++) {
                    l[i * c + k] = p.level(k);
                }
            }
            return new Geometry(x, l, d, c, n);
        }

        /** dist[j] = min(dist[j], |x_j - x_i|²) for every run j. */
        void update(int i, double[] dist) {
            int oi = i * d;
            int li = i * c;
            for (int j = 0; j < n; j++) {
                double s = 0;
                int oj = j * d;
                for (int k = 0; k < d; k++) {
                    double t = x[oj + k] - x[oi + k];
                    s += t * t;
                }
                int lj = j * c;
                for (int k = 0; k < c; k++) {
                    if (levels[lj + k] != levels[li + k]) {
                        s += 1;
                    }
                }
                if (s < dist[j]) {
                    dist[j] = s;
                }
            }
        }
    }
}
