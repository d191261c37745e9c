package dev.terrace.core.propose;

import dev.terrace.core.acquisition.Acquisitions;
import dev.terrace.core.design.LatinHypercube;
import dev.terrace.core.propose.Proposer.Scores;
import dev.terrace.core.search.BatchObjective;
import dev.terrace.core.search.GeneticSearch;
import dev.terrace.core.search.SearchResult;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Chooses the points of a batch: the genetic search with the Kriging believer, or the space-filling
 * start, in the {@link SearchBox}, keeping every two picks at least
 * {@link Proposer#MIN_BATCH_SEPARATION} apart over the scaled numeric settings after rounding.
 */
final class BatchSearch {

    /** Points of the extra Latin hypercube scored when no search result is far enough from the earlier picks. */
    static final int FALLBACK_POINTS = 200;

    private BatchSearch() {
    }

    /**
     * The chosen points, rounded and in the campaign's space, best bet first.
     *
     * @param points    the picks
     * @param reference the highest-yield recipe found (for the objective's trade line), or null
     *                  when the campaign has no objective or the search did not look for it
     * @param notes     what the grower should know (a batch cut short by the separation rule)
     */
    record Picks(List<DesignPoint> points, DesignPoint reference, List<String> notes) {
        Picks {
            points = List.copyOf(points);
            notes = List.copyOf(notes);
        }
    }

    /**
     * Distance over the numeric settings only: Euclidean in the unit cube of the campaign box (log
     * settings on log10). A different categorical choice alone does not make two recipes differ.
     *
     * @param a a point
     * @param b another point of the same space
     * @return the distance
     */
    static double separation(DesignPoint a, DesignPoint b) {
        double s = 0;
        for (int i = 0; i < a.dimensions(); i++) {
            double d = a.x(i) - b.x(i);
            s += d * d;
        }
        return Math.sqrt(s);
    }

    static boolean apart(DesignPoint p, List<DesignPoint> others, double d) {
        for (DesignPoint q : others) {
            if (separation(p, q) < d) {
                return false;
            }
        }
        return true;
    }

    static String cutShortNote(int found, int asked) {
        return String.format(Locale.ROOT, "the box and limits leave room for only %d recipe%s at least %.2f apart in"
                        + " the scaled numeric settings (a different choice alone does not count): proposing %d of the %d asked",
                found, found == 1 ? "" : "s", Proposer.MIN_BATCH_SEPARATION, found, asked);
    }

    // ------------------------------------------------------------------ search

    static Picks search(CampaignSurrogate sur, ProposeSettings s, SearchBox box, Double inc) {
        DesignSpace space = box.inner();
        boolean objective = sur.campaign().targets().stream().anyMatch(dev.terrace.core.campaign.Target::isObjective);
        // starts: the runs the model rates best, plus the space-filling sample
        List<DesignPoint> runPts = new ArrayList<>();
        List<DesignPoint> runOuter = new ArrayList<>();
        for (DesignPoint p : sur.runPoints()) {
            DesignPoint q = box.toInner(p);
            if (Proposer.inCube(p) && space.feasible(q)) {
                runPts.add(q);
                runOuter.add(box.toOuter(q));
            }
        }
        List<DesignPoint> starts = new ArrayList<>();
        if (!runPts.isEmpty()) {
            Scores sc = Proposer.score(sur, sur.evaluate(runOuter), s.explore(), inc);
            Integer[] idx = new Integer[runPts.size()];
            for (int i = 0; i < idx.length; i++) {
                idx[i] = i;
            }
            Arrays.sort(idx, (a, b) -> Double.compare(sc.logAcq()[b], sc.logAcq()[a]));
            for (int i = 0; i < Math.min(5, idx.length); i++) {
                starts.add(runPts.get(idx[i]));
            }
        }
        List<DesignPoint> filling = LatinHypercube.maximinPoints(Math.max(20, s.search().populationSize() / 2),
                space.dimensions(), space.levelCounts(), s.seed(), 500);
        List<DesignPoint> chosen = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        DesignPoint reference = null;
        CampaignSurrogate cur = sur;
        GeneticSearch ga = GeneticSearch.of(s.search());
        double penaltyDistance = Math.max(s.minDistance(), Proposer.MIN_BATCH_SEPARATION);
        for (int k = 0; k < s.batch(); k++) {
            // the first pick of a batch, and every pick at explore 0, is the best bet: highest predicted yield
            boolean yieldOnly = s.explore() == 0 || (k == 0 && s.batch() > 1);
            BatchObjective obj = objective(cur, box, s.explore(), inc, yieldOnly, chosen, penaltyDistance);
            List<DesignPoint> st = new ArrayList<>(starts);
            for (DesignPoint c : chosen) {
                st.add(box.toInner(c));
            }
            SearchResult res = ga.maximise(space, obj, st, filling, s.seed() * 31 + k);
            DesignPoint pick = firstApart(box, res.feasibleFound() ? res.topDistinct() : List.of(res.best()), chosen);
            if (pick == null) {
                pick = fallback(box, obj, s.seed() * 31 + k, chosen);
            }
            if (pick == null) {
                notes.add(cutShortNote(chosen.size(), s.batch()));
                break;
            }
            chosen.add(pick);
            if (k == 0 && yieldOnly && objective) {
                reference = pick;
            }
            if (k + 1 < s.batch()) {
                cur = cur.believe(pick);
            }
        }
        if (objective && reference == null) {
            // a single exploring pick: find the highest-yield recipe too, to say what the pick trades
            SearchResult res = ga.maximise(space, objective(sur, box, 0, inc, true, List.of(), penaltyDistance),
                    starts, filling, s.seed() * 31 + s.batch());
            reference = box.settle(res.best());
        }
        return new Picks(chosen, reference, notes);
    }

    /** The search's objective in the inner space: log yield, or log acquisition, minus a penalty near earlier picks. */
    private static BatchObjective objective(CampaignSurrogate model, SearchBox box, double beta, Double inc,
                                            boolean yieldOnly, List<DesignPoint> chosen, double penaltyDistance) {
        List<DesignPoint> picked = List.copyOf(chosen);
        return pts -> {
            List<DesignPoint> outer = new ArrayList<>(pts.size());
            for (DesignPoint p : pts) {
                outer.add(box.toOuter(p));
            }
            Scores sc = Proposer.score(model, model.evaluate(outer), yieldOnly ? 0 : beta, yieldOnly ? null : inc);
            double[] v = (yieldOnly ? sc.logYield() : sc.logAcq()).clone();
            for (int i = 0; i < v.length; i++) {
                if (!apart(outer.get(i), picked, penaltyDistance)) {
                    v[i] -= Proposer.DIVERSITY_PENALTY;
                }
                if (!Double.isFinite(v[i])) {
                    v[i] = Acquisitions.LOG_ZERO;
                }
            }
            return v;
        };
    }

    /** The first candidate (inner space) whose rounded recipe is far enough from every earlier pick, or null. */
    private static DesignPoint firstApart(SearchBox box, List<DesignPoint> candidates, List<DesignPoint> chosen) {
        for (DesignPoint c : candidates) {
            DesignPoint q = box.settle(c);
            if (apart(q, chosen, Proposer.MIN_BATCH_SEPARATION)) {
                return q;
            }
        }
        return null;
    }

    /** Scores a fresh Latin hypercube and returns the best feasible rounded point far enough from the picks, or null. */
    private static DesignPoint fallback(SearchBox box, BatchObjective obj, long seed, List<DesignPoint> chosen) {
        DesignSpace space = box.inner();
        List<DesignPoint> pts = new ArrayList<>();
        for (DesignPoint p : LatinHypercube.maximinPoints(FALLBACK_POINTS, space.dimensions(), space.levelCounts(),
                seed, 50)) {
            if (space.feasible(p)) {
                pts.add(p);
            }
        }
        if (pts.isEmpty()) {
            return null;
        }
        double[] v = obj.evaluate(pts);
        Integer[] idx = new Integer[pts.size()];
        for (int i = 0; i < idx.length; i++) {
            idx[i] = i;
        }
        Arrays.sort(idx, (a, b) -> Double.compare(v[b], v[a]));
        for (Integer i : idx) {
            DesignPoint q = box.settle(pts.get(i));
            if (apart(q, chosen, Proposer.MIN_BATCH_SEPARATION) && box.outer().feasible(q)) {
                return q;
            }
        }
        return null;
    }

    // ------------------------------------------------------------------ space-filling start

    static Picks spaceFilling(CampaignSurrogate sur, ProposeSettings s, SearchBox box) {
        DesignSpace space = box.inner();
        int m = Math.max(10 * s.batch(), 40);
        List<DesignPoint> cands = new ArrayList<>();
        for (DesignPoint p : LatinHypercube.maximinPoints(m, space.dimensions(), space.levelCounts(), s.seed(), 2000)) {
            if (space.feasible(p)) {
                DesignPoint q = box.settle(p);
                if (!cands.contains(q)) {
                    cands.add(q);
                }
            }
        }
        if (cands.isEmpty()) {
            // the limits cut the box hard: let the search find feasible points
            return search(sur, s, box, null);
        }
        boolean physics = s.usePhysics() && !sur.campaign().models().isEmpty();
        double[] logYield = physics ? Proposer.score(sur, sur.evaluate(cands), s.explore(), null).logAcq()
                : new double[cands.size()];
        List<DesignPoint> existing = sur.runPoints();
        List<DesignPoint> chosen = new ArrayList<>();
        double sep = Math.max(s.minDistance(), 0.25);
        while (chosen.size() < s.batch()) {
            int best = -1;
            double bestScore = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < cands.size(); i++) {
                DesignPoint p = cands.get(i);
                if (!apart(p, chosen, Proposer.MIN_BATCH_SEPARATION)) {
                    continue;
                }
                double dmin = Double.POSITIVE_INFINITY;
                for (DesignPoint q : chosen) {
                    dmin = Math.min(dmin, DesignSpace.distance(p, q));
                }
                for (DesignPoint q : existing) {
                    dmin = Math.min(dmin, DesignSpace.distance(p, q));
                }
                double score = physics ? (dmin >= sep ? logYield[i] : logYield[i] - Proposer.DIVERSITY_PENALTY + dmin) : dmin;
                if (score > bestScore) {
                    bestScore = score;
                    best = i;
                }
            }
            if (best < 0) {
                break;
            }
            chosen.add(cands.get(best));
        }
        List<String> notes = new ArrayList<>();
        if (chosen.size() < s.batch()) {
            notes.add(cutShortNote(chosen.size(), s.batch()));
        }
        return new Picks(chosen, null, notes);
    }
}
