package dev.terrace.core.window;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.design.LatinHypercube;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.core.units.Units;
import dev.terrace.spi.Role;
import io.jenetics.Chromosome;
import io.jenetics.DoubleChromosome;
import io.jenetics.DoubleGene;
import io.jenetics.Genotype;
import io.jenetics.Phenotype;
import io.jenetics.TournamentSelector;
import io.jenetics.engine.Engine;
import io.jenetics.engine.Evaluator;
import io.jenetics.ext.moea.MOEA;
import io.jenetics.ext.moea.NSGA2Selector;
import io.jenetics.ext.moea.Vec;
import io.jenetics.util.ISeq;
import io.jenetics.util.IntRange;
import io.jenetics.util.RandomRegistry;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.SplittableRandom;

/**
 * The trade-off between a recipe's predicted yield (to maximise) and what a run costs (to
 * minimise): the set of recipes none of which is beaten on both counts by another.
 *
 * <p>Costs: {@value #GROWTH_TIME} is the deposition time coverage / deposition rate in seconds
 * (needs settings with the roles {@code coverage} and {@code deposition_rate});
 * {@value #GROUP_V} is the group-V exposure BEP × deposition time in Torr·s, a proxy for the
 * arsenic or antimony a run consumes (needs {@code group_v_bep} as well). Both are exact
 * functions of the recipe; only the yield comes from the surrogate.
 *
 * <p>Search: NSGA-II (Deb, Pratap, Agarwal &amp; Meyarivan, IEEE Trans. Evol. Comput. 6(2), 2002)
 * through Jenetics' multi-objective support ({@link NSGA2Selector#ofVec()} as survivor selector,
 * {@link MOEA#toParetoSet(IntRange)} to collect the front) over the same genotype as the
 * proposer's search: the unit-cube coordinates plus one gene per categorical setting. The first
 * population is a maximin Latin hypercube; each generation's new feasible individuals are
 * predicted in one batched {@link CampaignSurrogate#evaluate} call. Recipes that break a limit are
 * never predicted: they get a penalty vector that every feasible recipe dominates. The run is
 * deterministic for a seed (seeded {@code RandomRegistry}, calling-thread executor).
 *
 * @param costKind       {@value #GROWTH_TIME} or {@value #GROUP_V}
 * @param costName       the cost in words, for labels
 * @param costUnit       the cost's unit symbol ("s" or "Torr s")
 * @param points         the front, sorted by cost ascending (yield then ascends too); no point
 *                       dominates another
 * @param populationSize the population size used
 * @param generations    the generations run
 * @param seed           the seed
 * @param evaluations    recipes predicted by the surrogate
 * @since 0.1
 */
public record ParetoFront(String costKind, String costName, String costUnit, List<FrontPoint> points,
                          int populationSize, int generations, long seed, int evaluations) {

    /** Cost kind: deposition time coverage / rate, in seconds. */
    public static final String GROWTH_TIME = "growth-time";
    /** Cost kind: group-V exposure BEP × deposition time, in Torr·s. */
    public static final String GROUP_V = "group-v";
    /** The cost kinds, in the order the command line lists them. */
    public static final List<String> COST_KINDS = List.of(GROWTH_TIME, GROUP_V);
    /** Default population size (Deb et al. 2002 ran their tests with 100; fronts here are 2-D and smaller). */
    public static final int DEFAULT_POPULATION = 60;
    /** Default number of generations (a choice for Terrace: the front of the demo stops moving well before). */
    public static final int DEFAULT_GENERATIONS = 60;
    /** Crossover probability 0.9, as in Deb et al. 2002. */
    public static final double CROSSOVER_PROBABILITY = 0.9;
    /**
     * Step of the Gaussian mutation in the unit cube: 0.1 of a box edge (common practice for
     * real-coded GAs on a normalised box).
     */
    public static final double MUTATION_SIGMA = 0.1;
    /** Probability that a categorical setting switches level in a mutation (common practice: small). */
    public static final double LEVEL_MUTATION_PROBABILITY = 0.1;

    /**
     * One recipe of the front.
     *
     * @param recipe every setting in campaign order, campaign units (Double for numeric, String for
     *               choices); unmodifiable
     * @param yield  predicted yield, in [0, 1]
     * @param cost   the run's cost in {@link ParetoFront#costUnit()}, finite and &ge; 0
     */
    public record FrontPoint(Map<String, Object> recipe, double yield, double cost) {
        /** Copies the recipe and checks the numbers. */
        public FrontPoint {
            recipe = Collections.unmodifiableMap(new LinkedHashMap<>(recipe));
            if (!(yield >= 0 && yield <= 1)) {
                throw new IllegalArgumentException("yield must lie in [0, 1], found " + yield);
            }
            if (!(cost >= 0) || !Double.isFinite(cost)) {
                throw new IllegalArgumentException("cost must be finite and >= 0, found " + cost);
            }
        }

        /**
         * @param other another point
         * @return true when this point is at least as good on both counts and better on one
         */
        public boolean dominates(FrontPoint other) {
            return yield >= other.yield && cost <= other.cost && (yield > other.yield || cost < other.cost);
        }
    }

    /** Copies the list and checks the values. */
    public ParetoFront {
        Objects.requireNonNull(costKind, "costKind");
        Objects.requireNonNull(costName, "costName");
        Objects.requireNonNull(costUnit, "costUnit");
        points = List.copyOf(points);
        for (int i = 1; i < points.size(); i++) {
            if (points.get(i).cost() < points.get(i - 1).cost()) {
                throw new IllegalArgumentException("front points must be sorted by cost");
            }
        }
    }

    /**
     * Says why a cost cannot be computed for a campaign.
     *
     * @param c        the campaign
     * @param costKind a cost kind as the user wrote it
     * @return a message, or empty when the cost can be computed
     */
    public static Optional<String> costProblem(Campaign c, String costKind) {
        if (!COST_KINDS.contains(costKind)) {
            return Optional.of("unknown cost '" + costKind + "'; use " + String.join(" or ", COST_KINDS));
        }
        List<Role> need = new ArrayList<>(List.of(Role.COVERAGE, Role.DEPOSITION_RATE));
        if (costKind.equals(GROUP_V)) {
            need.add(Role.GROUP_V_BEP);
        }
        List<String> missing = new ArrayList<>();
        for (Role r : need) {
            if (setting(c, r) == null) {
                missing.add(r.key());
            }
        }
        if (!missing.isEmpty()) {
            return Optional.of("the cost " + costKind + " needs numeric settings with the role"
                    + (missing.size() > 1 ? "s " : " ") + String.join(", ", missing) + "; campaign " + c.id()
                    + " has none");
        }
        return Optional.empty();
    }

    private static ParameterSpec setting(Campaign c, Role r) {
        for (ParameterSpec p : c.parameters()) {
            if (!p.isCategorical() && p.role() == r) {
                return p;
            }
        }
        return null;
    }

    /**
     * The cost of a recipe.
     *
     * @param c        the campaign
     * @param costKind {@value #GROWTH_TIME} or {@value #GROUP_V}
     * @param numbers  numeric settings by name, campaign units
     * @return the cost in s ({@value #GROWTH_TIME}) or Torr·s ({@value #GROUP_V})
     * @throws IllegalArgumentException when the campaign lacks the settings the cost needs
     */
    public static double cost(Campaign c, String costKind, Map<String, Double> numbers) {
        Optional<String> problem = costProblem(c, costKind);
        if (problem.isPresent()) {
            throw new IllegalArgumentException(problem.get());
        }
        double h = c.surface().monolayerHeightNm();
        ParameterSpec cov = setting(c, Role.COVERAGE);
        ParameterSpec rate = setting(c, Role.DEPOSITION_RATE);
        double ml = cov.unit().toCanonical(numbers.get(cov.name()), h);
        double mlPerS = rate.unit().toCanonical(numbers.get(rate.name()), h);
        double seconds = ml / mlPerS;
        if (costKind.equals(GROWTH_TIME)) {
            return seconds;
        }
        ParameterSpec bep = setting(c, Role.GROUP_V_BEP);
        double torr = bep.unit().toCanonical(numbers.get(bep.name()), h) / Units.PA_PER_TORR;
        return torr * seconds;
    }

    /** The largest cost over the box (each cost grows with coverage and BEP and falls with the rate). */
    private static double costCeiling(Campaign c, String costKind) {
        Map<String, Double> worst = new LinkedHashMap<>();
        for (ParameterSpec p : c.parameters()) {
            if (!p.isCategorical()) {
                worst.put(p.name(), p.role() == Role.DEPOSITION_RATE ? p.min() : p.max());
            }
        }
        return cost(c, costKind, worst);
    }

    /**
     * Computes the front.
     *
     * @param sur            the fitted surrogate
     * @param costKind       {@value #GROWTH_TIME} or {@value #GROUP_V}
     * @param populationSize individuals per generation, 8 to 1000
     * @param generations    generations to run, 1 to 1000
     * @param seed           the seed
     * @return the front; never null (empty only when no feasible recipe was found)
     * @throws IllegalArgumentException for an unknown cost, one the campaign cannot compute, or
     *                                  sizes out of range
     */
    public static ParetoFront compute(CampaignSurrogate sur, String costKind, int populationSize, int generations,
                                      long seed) {
        Campaign c = sur.campaign();
        Optional<String> problem = costProblem(c, costKind);
        if (problem.isPresent()) {
            throw new IllegalArgumentException(problem.get());
        }
        if (populationSize < 8 || populationSize > 1000) {
            throw new IllegalArgumentException("population size must be 8 to 1000, found " + populationSize);
        }
        if (generations < 1 || generations > 1000) {
            throw new IllegalArgumentException("generations must be 1 to 1000, found " + generations);
        }
        DesignSpace space = sur.space();
        int d = space.dimensions();
        int[] levels = space.levelCounts();
        double ceiling = costCeiling(c, costKind);
        int[] evaluations = {0};
        Evaluator<DoubleGene, Vec<double[]>> evaluator = population -> {
            int n = population.size();
            List<Vec<double[]>> fit = new ArrayList<>(Collections.nCopies(n, null));
            List<Integer> pending = new ArrayList<>();
            List<DesignPoint> pts = new ArrayList<>();
            List<Double> costs = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                Phenotype<DoubleGene, Vec<double[]>> pt = population.get(i);
                if (pt.isEvaluated()) {
                    continue;
                }
                DesignPoint p = decode(pt.genotype(), d, levels);
                double v = space.violation(p);
                if (v > 0) {
                    // bounded penalty, dominated by every feasible recipe: f0 > 0 >= -yield, f1 >= ceiling >= cost
                    double s = v / (1 + v);
                    fit.set(i, Vec.of(1 + s, ceiling * (1 + s)));
                } else {
                    pending.add(i);
                    pts.add(p);
                    costs.add(cost(c, costKind, space.numbers(p)));
                }
            }
            if (!pts.isEmpty()) {
                double[] y = Proposer.yields(sur, sur.evaluate(pts));
                evaluations[0] += pts.size();
                for (int k = 0; k < y.length; k++) {
                    fit.set(pending.get(k), Vec.of(-y[k], costs.get(k)));
                }
            }
            List<Phenotype<DoubleGene, Vec<double[]>>> out = new ArrayList<>(n);
            for (int i = 0; i < n; i++) {
                Phenotype<DoubleGene, Vec<double[]>> pt = population.get(i);
                out.add(pt.isEvaluated() ? pt : pt.withFitness(fit.get(i)));
            }
            return ISeq.of(out);
        };
        List<Genotype<DoubleGene>> first = new ArrayList<>();
        for (DesignPoint p : LatinHypercube.maximinPoints(populationSize, d, levels, seed, 2000)) {
            first.add(encode(p, d, levels));
        }
        Genotype<DoubleGene> template = template(d, levels);
        double geneProbability = d > 0 ? 1.0 / d : 0;
        ISeq<Phenotype<DoubleGene, Vec<double[]>>> set = RandomRegistry.with(new SplittableRandom(seed).split(), r -> {
            Engine<DoubleGene, Vec<double[]>> engine = new Engine.Builder<>(evaluator, template)
                    .populationSize(populationSize)
                    .offspringSelector(new TournamentSelector<>(2))
                    .survivorsSelector(NSGA2Selector.ofVec())
                    .alterers(new FrontOperators.Recombination<Vec<double[]>>(d > 0, CROSSOVER_PROBABILITY),
                            new FrontOperators.Mutation<Vec<double[]>>(d > 0, geneProbability, MUTATION_SIGMA,
                                    LEVEL_MUTATION_PROBABILITY))
                    .minimizing()
                    .executor(Runnable::run)
                    .build();
            return engine.stream(first).limit(generations)
                    .collect(MOEA.toParetoSet(IntRange.of(Math.max(2, populationSize / 2), populationSize)));
        });
        List<FrontPoint> raw = new ArrayList<>();
        for (Phenotype<DoubleGene, Vec<double[]>> pt : set) {
            double[] f = pt.fitness().data();
            if (f[0] > 0) {
                continue; // breaks a limit
            }
            DesignPoint p = decode(pt.genotype(), d, levels);
            Map<String, Object> recipe = new LinkedHashMap<>();
            Map<String, Double> nums = space.numbers(p);
            Map<String, String> cats = space.categories(p);
            for (ParameterSpec ps : c.parameters()) {
                recipe.put(ps.name(), ps.isCategorical() ? cats.get(ps.name()) : nums.get(ps.name()));
            }
            raw.add(new FrontPoint(recipe, Math.max(0, Math.min(1, -f[0])), f[1]));
        }
        List<FrontPoint> front = nonDominated(raw);
        String name = costKind.equals(GROWTH_TIME) ? "deposition time" : "group-V exposure (BEP x deposition time)";
        String unit = costKind.equals(GROWTH_TIME) ? "s" : "Torr s";
        return new ParetoFront(costKind, name, unit, front, populationSize, generations, seed, evaluations[0]);
    }

    /**
     * The points no other point dominates, duplicates (same yield and cost) kept once, sorted by
     * cost then yield.
     *
     * @param points candidate points
     * @return the non-dominated ones; never null
     */
    static List<FrontPoint> nonDominated(List<FrontPoint> points) {
        List<FrontPoint> sorted = new ArrayList<>(points);
        sorted.sort(Comparator.comparingDouble(FrontPoint::cost).thenComparing(Comparator.comparingDouble(FrontPoint::yield).reversed()));
        List<FrontPoint> out = new ArrayList<>();
        double bestYield = Double.NEGATIVE_INFINITY;
        for (FrontPoint p : sorted) {
            // sorted by cost: p is dominated exactly when an earlier (cheaper or equal) point yields at least as much
            if (p.yield() > bestYield) {
                out.add(p);
                bestYield = p.yield();
            }
        }
        return out;
    }

    private static Genotype<DoubleGene> template(int d, int[] levels) {
        List<Chromosome<DoubleGene>> chs = new ArrayList<>();
        if (d > 0) {
            chs.add(DoubleChromosome.of(0, FrontOperators.geneMax(), d));
        }
        for (int k : levels) {
            chs.add(DoubleChromosome.of(0, k, 1));
        }
        return Genotype.of(chs);
    }

    private static Genotype<DoubleGene> encode(DesignPoint p, int d, int[] levels) {
        List<Chromosome<DoubleGene>> chs = new ArrayList<>();
        if (d > 0) {
            DoubleGene[] genes = new DoubleGene[d];
            for (int i = 0; i < d; i++) {
                genes[i] = DoubleGene.of(FrontOperators.reflect(p.x(i)), 0, FrontOperators.geneMax());
            }
            chs.add(DoubleChromosome.of(genes));
        }
        for (int j = 0; j < levels.length; j++) {
            chs.add(DoubleChromosome.of(DoubleGene.of(p.level(j) + 0.5, 0, levels[j])));
        }
        return Genotype.of(chs);
    }

    private static DesignPoint decode(Genotype<DoubleGene> g, int d, int[] levels) {
        double[] x = new double[d];
        if (d > 0) {
            for (int i = 0; i < d; i++) {
                x[i] = Math.max(0.0, Math.min(1.0, g.get(0).get(i).doubleValue()));
            }
        }
        int[] lv = new int[levels.length];
        int off = d > 0 ? 1 : 0;
        for (int j = 0; j < levels.length; j++) {
            int l = (int) Math.floor(g.get(off + j).get(0).doubleValue());
            lv[j] = Math.max(0, Math.min(levels[j] - 1, l));
        }
        return new DesignPoint(x, lv);
    }

    /**
     * Hypervolume of this front: the area of (cost, yield) space its points dominate, bounded by
     * the reference cost and yield 0 (Zitzler &amp; Thiele's S metric).
     *
     * @param costReference the largest cost counted, in {@link #costUnit()}
     * @return the area in costUnit × yield; 0 for an empty front
     */
    public double hypervolume(double costReference) {
        List<double[]> pts = new ArrayList<>();
        for (FrontPoint p : points) {
            pts.add(new double[] {p.cost(), -p.yield()});
        }
        return hypervolume(pts, costReference, 0);
    }

    /**
     * Hypervolume of a set of points for two objectives, both minimised (Zitzler &amp; Thiele 1998,
     * the S metric): the area dominated by the set and bounded by the reference point. Points that
     * do not strictly dominate the reference are ignored; dominated points add nothing.
     *
     * @param points points (f1, f2); never null
     * @param r1     reference f1
     * @param r2     reference f2
     * @return the area, &ge; 0
     */
    public static double hypervolume(List<double[]> points, double r1, double r2) {
        List<double[]> in = new ArrayList<>();
        for (double[] p : points) {
            if (p[0] < r1 && p[1] < r2) {
                in.add(p);
            }
        }
        in.sort(Comparator.<double[]>comparingDouble(p -> p[0]).thenComparingDouble(p -> p[1]));
        double area = 0;
        double f2 = r2;
        for (int i = 0; i < in.size(); i++) {
            double[] p = in.get(i);
            if (p[1] >= f2) {
                continue; // dominated by an earlier point
            }
            // the strip from this point's f1 to the next non-dominated point's f1 (or r1)
            double next = r1;
            for (int k = i + 1; k < in.size(); k++) {
                if (in.get(k)[1] < p[1]) {
                    next = in.get(k)[0];
                    break;
                }
            }
            area += (next - p[0]) * (r2 - p[1]);
            f2 = p[1];
        }
        return area;
    }

    /**
     * NSGA-II crowding distance of each point of one front (Deb et al. 2002): per objective the
     * two extreme points get infinity and each other point adds the gap between its neighbours
     * divided by the objective's range; objectives with zero range are skipped.
     *
     * @param front points of one front, each with the same number of objectives; never null
     * @return the distance per point, in input order (infinite for boundary points)
     */
    public static double[] crowdingDistance(List<double[]> front) {
        int n = front.size();
        double[] dist = new double[n];
        if (n <= 2) {
            Arrays.fill(dist, Double.POSITIVE_INFINITY);
            return dist;
        }
        int m = front.get(0).length;
        for (int obj = 0; obj < m; obj++) {
            final int o = obj;
            Integer[] idx = new Integer[n];
            for (int i = 0; i < n; i++) {
                idx[i] = i;
            }
            Arrays.sort(idx, Comparator.comparingDouble(i -> front.get(i)[o]));
            double lo = front.get(idx[0])[o];
            double hi = front.get(idx[n - 1])[o];
            if (!(hi > lo)) {
                continue;
            }
            dist[idx[0]] = Double.POSITIVE_INFINITY;
            dist[idx[n - 1]] = Double.POSITIVE_INFINITY;
            for (int k = 1; k < n - 1; k++) {
                dist[idx[k]] += (front.get(idx[k + 1])[o] - front.get(idx[k - 1])[o]) / (hi - lo);
            }
        }
        return dist;
    }

    /**
     * Up to {@code k} points spread along the front for a short listing: both ends, then again and
     * again the point farthest from those already chosen, with cost and yield each scaled to
     * [0, 1] over the front (greedy farthest-point selection; common practice).
     *
     * @param k how many points at most, &ge; 2
     * @return the chosen points sorted by cost; never null
     */
    public List<FrontPoint> spread(int k) {
        if (k < 2) {
            throw new IllegalArgumentException("spread needs k >= 2");
        }
        int n = points.size();
        if (n <= k) {
            return points;
        }
        double cLo = points.get(0).cost();
        double cHi = points.get(n - 1).cost();
        double yLo = points.get(0).yield();
        double yHi = points.get(n - 1).yield();
        double[][] q = new double[n][2];
        for (int i = 0; i < n; i++) {
            q[i][0] = cHi > cLo ? (points.get(i).cost() - cLo) / (cHi - cLo) : 0;
            q[i][1] = yHi > yLo ? (points.get(i).yield() - yLo) / (yHi - yLo) : 0;
        }
        double[] dmin = new double[n];
        Arrays.fill(dmin, Double.POSITIVE_INFINITY);
        boolean[] chosen = new boolean[n];
        List<Integer> keep = new ArrayList<>();
        int next = 0;
        while (keep.size() < k) {
            chosen[next] = true;
            keep.add(next);
            for (int i = 0; i < n; i++) {
                dmin[i] = Math.min(dmin[i], Math.hypot(q[i][0] - q[next][0], q[i][1] - q[next][1]));
            }
            if (keep.size() == 1) {
                next = n - 1;
                continue;
            }
            int best = -1;
            for (int i = 0; i < n; i++) {
                if (!chosen[i] && (best < 0 || dmin[i] > dmin[best])) {
                    best = i;
                }
            }
            next = best;
        }
        Collections.sort(keep);
        List<FrontPoint> out = new ArrayList<>();
        for (int i : keep) {
            out.add(points.get(i));
        }
        return out;
    }
}
