package dev.terrace.demo;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.spi.Role;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * The series a grower plans by hand before using a tool: a start recipe in the middle of the
 * box, then one-factor-at-a-time sweeps around it, a switch of each categorical setting, and a
 * repeat of the start recipe at the end to check for drift. This is common practice, not an
 * optimal design; Terrace uses it to make demo and benchmark logs that look like a lab's first
 * weeks on a new campaign.
 *
 * <p>Every recipe lies inside the campaign's boxes and keeps its limits
 * ({@link Campaign#limitsHold(Map)}). Values are rounded the way growers write them: linear
 * settings to a 1-2-5 step of about a fortieth of the box, log settings to two significant digits.
 * When the campaign has both a substrate and a crystallisation temperature, the start recipe
 * crystallises at the deposition temperature, and the substrate-temperature sweep keeps them
 * together, as growers do unless they study the crystallisation step itself.
 *
 * @since 0.1
 */
public final class GrowerDesign {

    /** Runs in a default plan, 14: about three weeks of one run per working day. */
    public static final int DEFAULT_RUNS = 14;
    /** Largest random shift of a sweep level, in box units, 0.03. */
    public static final double LEVEL_JITTER = 0.03;

    /** Order in which growers sweep settings, by role; settings without a role come last. */
    private static final List<Role> PRIORITY = List.of(Role.SUBSTRATE_TEMPERATURE, Role.GROUP_V_BEP,
            Role.GROUP_V_FLUX, Role.CRYSTALLIZATION_TEMPERATURE, Role.DEPOSITION_RATE, Role.COVERAGE,
            Role.MISCUT_ANGLE, Role.ANNEAL_TEMPERATURE, Role.ANNEAL_TIME, Role.SURFACTANT_COVERAGE);
    /** Levels given to the first sweeps, in order; later sweeps get two. */
    private static final int[] LEVELS = {4, 3, 2};
    private static final int MAX_LIMIT_TRIES = 20_000;

    private GrowerDesign() {
    }

    /**
     * A plan of {@link #DEFAULT_RUNS} runs.
     *
     * @param campaign the campaign; never null
     * @param seed     the seed of the level jitter
     * @return the recipes in run order; never null
     * @throws IllegalArgumentException when no recipe in the box keeps the limits
     */
    public static List<Recipe> plan(Campaign campaign, long seed) {
        return plan(campaign, DEFAULT_RUNS, seed);
    }

    /**
     * A plan of a given number of runs: the start recipe, sweeps, categorical switches and (from
     * ten runs on) a final repeat of the start recipe.
     *
     * @param campaign the campaign; never null
     * @param runs     the number of runs; at least 1
     * @param seed     the seed of the level jitter
     * @return the recipes in run order, {@code runs} of them; never null
     * @throws IllegalArgumentException when {@code runs} is below 1 or no recipe in the box keeps
     *                                  the limits
     */
    public static List<Recipe> plan(Campaign campaign, int runs, long seed) {
        Objects.requireNonNull(campaign, "campaign");
        if (runs < 1) {
            throw new IllegalArgumentException("a plan needs at least one run, got " + runs);
        }
        SplittableRandom rng = new SplittableRandom(seed);
        List<ParameterSpec> numeric = new ArrayList<>();
        List<ParameterSpec> categorical = new ArrayList<>();
        for (ParameterSpec p : campaign.parameters()) {
            (p.isCategorical() ? categorical : numeric).add(p);
        }
        ParameterSpec substrate = byRole(numeric, Role.SUBSTRATE_TEMPERATURE);
        ParameterSpec crystal = byRole(numeric, Role.CRYSTALLIZATION_TEMPERATURE);

        Map<String, Double> start = new LinkedHashMap<>();
        for (ParameterSpec p : numeric) {
            start.put(p.name(), rounded(p, p.fromUnit(0.5)));
        }
        boolean tied = false;
        if (substrate != null && crystal != null) {
            double follow = follow(campaign, substrate, crystal, start.get(substrate.name()));
            if (follow >= crystal.min() && follow <= crystal.max()) {
                Map<String, Double> tiedStart = new LinkedHashMap<>(start);
                tiedStart.put(crystal.name(), follow);
                if (campaign.limitsHold(tiedStart)) {
                    start = tiedStart;
                    tied = true;
                }
            }
        }
        String startNote = "start recipe, middle of the box";
        if (!campaign.limitsHold(start)) {
            start = feasibleStart(campaign, numeric, rng);
            tied = false;
            startNote = "start recipe (the middle of the box breaks a limit)";
        }
        Map<String, String> startCategories = new LinkedHashMap<>();
        for (ParameterSpec p : categorical) {
            startCategories.put(p.name(), p.choices().get(0));
        }

        List<ParameterSpec> switches = new ArrayList<>();
        for (ParameterSpec p : categorical) {
            if (p.choices().size() > 1) {
                switches.add(p);
            }
        }
        int budget = runs - 1;
        int repeat = runs >= 10 ? 1 : 0;
        budget -= repeat;
        int switchCount = Math.min(switches.size(), Math.max(0, budget / 6));
        budget -= switchCount;

        List<ParameterSpec> factors = new ArrayList<>(numeric);
        factors.sort(Comparator.comparingInt(GrowerDesign::priority));
        int[] levels = allocate(factors.size(), budget);

        List<Recipe> out = new ArrayList<>();
        out.add(new Recipe(start, startCategories, startNote));
        int switchesDone = 0;
        for (int f = 0; f < factors.size(); f++) {
            if (levels[f] == 0) {
                continue;
            }
            ParameterSpec p = factors.get(f);
            boolean follows = tied && p == substrate;
            List<Double> positions = positions(levels[f], rng);
            List<Recipe> sweep = new ArrayList<>();
            for (double u : positions) {
                Map<String, Double> r = sweepPoint(campaign, start, p, u, follows ? crystal : null, substrate);
                sweep.add(new Recipe(r, startCategories, p.name() + " series"));
            }
            sweep.sort(Comparator.comparingDouble(r -> r.numbers().get(p.name())));
            out.addAll(sweep);
            if (f == 0 && switchesDone < switchCount) {
                out.add(switchRecipe(start, startCategories, switches.get(switchesDone++)));
            }
        }
        while (switchesDone < switchCount) {
            out.add(switchRecipe(start, startCategories, switches.get(switchesDone++)));
        }
        if (repeat == 1) {
            out.add(new Recipe(start, startCategories, "repeat of the start recipe"));
        }
        while (out.size() < runs) {
            out.add(new Recipe(start, startCategories, "repeat of the start recipe"));
        }
        return List.copyOf(out.subList(0, runs));
    }

    private static Recipe switchRecipe(Map<String, Double> start, Map<String, String> startCategories,
                                       ParameterSpec p) {
        Map<String, String> cats = new LinkedHashMap<>(startCategories);
        cats.put(p.name(), p.choices().get(1));
        return new Recipe(start, cats, "switched " + p.name() + " to " + p.choices().get(1));
    }

    /** A sweep point, pulled back toward the start recipe until it keeps the limits. */
    private static Map<String, Double> sweepPoint(Campaign campaign, Map<String, Double> start, ParameterSpec p,
                                                  double u, ParameterSpec follower, ParameterSpec substrate) {
        double u0 = p.toUnit(start.get(p.name()));
        double at = u;
        for (int k = 0; k < 30; k++) {
            Map<String, Double> r = new LinkedHashMap<>(start);
            double v = rounded(p, p.fromUnit(at));
            r.put(p.name(), v);
            if (follower != null) {
                double fv = follow(campaign, substrate, follower, v);
                r.put(follower.name(), Math.max(follower.min(), Math.min(follower.max(), fv)));
            }
            if (campaign.limitsHold(r)) {
                return r;
            }
            at = 0.5 * (at + u0);
        }
        return new LinkedHashMap<>(start);
    }

    /** The crystallisation temperature equal to a substrate temperature, in the follower's unit and rounding. */
    private static double follow(Campaign campaign, ParameterSpec substrate, ParameterSpec follower, double value) {
        double h = campaign.surface().monolayerHeightNm();
        double same = follower.unit().fromCanonical(substrate.unit().toCanonical(value, h), h);
        return rounded(follower, same);
    }

    private static Map<String, Double> feasibleStart(Campaign campaign, List<ParameterSpec> numeric,
                                                     SplittableRandom rng) {
        Map<String, Double> best = null;
        double bestDistance = Double.POSITIVE_INFINITY;
        for (int k = 0; k < MAX_LIMIT_TRIES; k++) {
            Map<String, Double> r = new LinkedHashMap<>();
            double distance = 0;
            for (ParameterSpec p : numeric) {
                double u = rng.nextDouble();
                double v = rounded(p, p.fromUnit(u));
                r.put(p.name(), v);
                double d = p.toUnit(v) - 0.5;
                distance += d * d;
            }
            if (distance < bestDistance && campaign.limitsHold(r)) {
                best = r;
                bestDistance = distance;
            }
        }
        if (best == null) {
            throw new IllegalArgumentException("no recipe inside the boxes of campaign " + campaign.id()
                    + " keeps its limits");
        }
        return best;
    }

    /** Levels per factor in priority order: 4, 3, then 2, cut back from the end or topped up in turn. */
    private static int[] allocate(int factors, int budget) {
        int[] levels = new int[factors];
        int sum = 0;
        for (int f = 0; f < factors; f++) {
            levels[f] = f < LEVELS.length ? LEVELS[f] : 2;
            sum += levels[f];
        }
        for (int f = factors - 1; sum > budget && f >= 0; f--) {
            while (levels[f] > 1 && sum > budget) {
                levels[f]--;
                sum--;
            }
        }
        for (int f = factors - 1; sum > budget && f >= 0; f--) {
            levels[f] = 0;
            sum--;
        }
        for (int f = 0; sum < budget && factors > 0; f = (f + 1) % factors) {
            levels[f]++;
            sum++;
        }
        return levels;
    }

    /** Box positions of a sweep with k levels, away from the start recipe at 0.5, jittered. */
    private static List<Double> positions(int k, SplittableRandom rng) {
        double[] base;
        boolean flip = rng.nextBoolean();
        switch (k) {
            case 1:
                base = new double[] {0.2};
                break;
            case 2:
                base = new double[] {0.2, 0.8};
                break;
            case 3:
                base = new double[] {0.15, 0.35, 0.8};
                break;
            case 4:
                base = new double[] {0.1, 0.3, 0.7, 0.9};
                break;
            default:
                base = new double[k];
                for (int j = 0; j < k; j++) {
                    double u = 0.05 + 0.9 * (j + 0.5) / k;
                    base[j] = Math.abs(u - 0.5) < 0.45 / k ? u + 0.45 / k : u;
                }
                break;
        }
        List<Double> out = new ArrayList<>();
        for (double b : base) {
            double u = flip ? 1 - b : b;
            u += LEVEL_JITTER * (2 * rng.nextDouble() - 1);
            out.add(Math.max(0.02, Math.min(0.98, u)));
        }
        return out;
    }

    /**
     * A value as a grower writes it, inside the box: linear settings on a 1-2-5 step of about a
     * fortieth of the box, log settings to two significant digits.
     */
    static double rounded(ParameterSpec p, double v) {
        BigDecimal b;
        if (p.scale() == Scale.LOG) {
            b = new BigDecimal(v).round(new MathContext(2, RoundingMode.HALF_EVEN));
        } else {
            BigDecimal step = niceStep((p.max() - p.min()) / 40);
            b = new BigDecimal(v).divide(step, 0, RoundingMode.HALF_EVEN).multiply(step);
        }
        double r = b.doubleValue();
        if (r < p.min()) {
            return p.min();
        }
        if (r > p.max()) {
            return p.max();
        }
        return r;
    }

    /** The largest 1, 2 or 5 times a power of ten not above {@code raw}, computed in decimal. */
    private static BigDecimal niceStep(double raw) {
        BigDecimal b = new BigDecimal(Double.toString(raw)).round(new MathContext(12)).stripTrailingZeros();
        int e = b.precision() - b.scale() - 1;
        double m = b.movePointLeft(e).doubleValue();
        int mant = m >= 5 ? 5 : m >= 2 ? 2 : 1;
        return BigDecimal.valueOf(mant).scaleByPowerOfTen(e);
    }

    private static int priority(ParameterSpec p) {
        int i = p.role() == null ? -1 : PRIORITY.indexOf(p.role());
        return i < 0 ? PRIORITY.size() : i;
    }

    private static ParameterSpec byRole(List<ParameterSpec> ps, Role role) {
        for (ParameterSpec p : ps) {
            if (p.role() == role) {
                return p;
            }
        }
        return null;
    }
}
