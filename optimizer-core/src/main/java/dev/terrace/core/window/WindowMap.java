package dev.terrace.core.window;

import dev.terrace.core.DidYouMean;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.CampaignSurrogate.Evaluation;
import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.spi.Role;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Process-window maps: the predicted yield of a campaign over two of its numeric settings with
 * every other setting held, optionally made robust against a thermocouple error.
 *
 * <p><b>Yield</b> is the probability that a run meets every target, computed exactly as the
 * proposer does ({@link Proposer#yields}). Cells whose recipe breaks a campaign limit get yield 0
 * and are marked infeasible. The <b>window</b> is the share of the map's cells with yield of at
 * least {@link #WINDOW_THRESHOLD}: where a run is more likely than not to meet spec. Cells tile
 * the box evenly in the design space's unit cube (evenly in log10 for {@code scale: log}), so the
 * share is an area share on the axes as plotted.
 *
 * <p><b>Robust windows.</b> A window that worked last month and not today is often a drifting
 * thermocouple: the substrate is not at the temperature the controller reads. With
 * {@code temperatureUncertaintyK = sigma > 0} each cell's yield is averaged over a normal error
 * delta ~ N(0, sigma²) added to the true temperature of every setting whose role is a temperature
 * ({@link #TEMPERATURE_ROLES}). One offset hits all of them together, because one thermocouple
 * reads the substrate during deposition, crystallisation and anneal. The average uses
 * {@link #QUADRATURE_NODES}-point Gauss–Hermite quadrature ({@link GaussHermite}; Abramowitz &amp;
 * Stegun 25.4.46, nodes by Golub–Welsch). The limits are judged at the set point, which is what
 * the grower controls. The class map always shows the most likely class at the set point.
 *
 * <p>Averaging can only spread a yield peak, but it is not a theorem that the window share never
 * grows: between two good regions a narrow dip just under the threshold could be lifted above it.
 * The tests check on the demo campaign that the share and the best yield do not grow with sigma.
 *
 * <p>All cells are predicted in one batched {@link CampaignSurrogate#evaluate} call, the
 * quadrature points included.
 *
 * @since 0.1
 */
public final class WindowMap {

    /** A cell is in the window when its yield is at least this: a run is more likely than not to meet spec. */
    public static final double WINDOW_THRESHOLD = 0.5;
    /**
     * Default cells per axis: 41 × 41 cells, each 1/41 (about 2.4 %) of a box edge, fine enough for
     * class boundaries to read smoothly in print and cheap to predict (a choice made for Terrace).
     */
    public static final int DEFAULT_GRID = 41;
    /** Fewest cells per axis. */
    public static final int MIN_GRID = 5;
    /** Most cells per axis (40 000 cells, 280 000 predictions with the quadrature). */
    public static final int MAX_GRID = 200;
    /**
     * Gauss–Hermite nodes for the thermocouple average: 7 nodes integrate polynomials up to degree
     * 13 exactly (Abramowitz &amp; Stegun 25.4.46) and include the set point itself as the centre node.
     */
    public static final int QUADRATURE_NODES = 7;
    /** The roles whose settings one thermocouple error shifts together. */
    public static final Set<Role> TEMPERATURE_ROLES = Set.of(Role.SUBSTRATE_TEMPERATURE,
            Role.CRYSTALLIZATION_TEMPERATURE, Role.ANNEAL_TEMPERATURE);

    private WindowMap() {
    }

    /**
     * Says why a name cannot be a map axis.
     *
     * @param c    the campaign
     * @param name a setting name as the user wrote it
     * @return a message (with a did-you-mean hint where one fits), or empty when the name is a
     *         numeric setting of the campaign
     */
    public static Optional<String> axisProblem(Campaign c, String name) {
        Optional<ParameterSpec> p = c.parameter(name);
        if (p.isEmpty()) {
            return Optional.of(unknownSetting(c, name));
        }
        if (p.get().isCategorical()) {
            return Optional.of("'" + name + "' is a choice (" + String.join(", ", p.get().choices())
                    + "), not a number; map two numeric settings and hold it with --at " + name + "="
                    + p.get().choices().get(0));
        }
        return Optional.empty();
    }

    private static String unknownSetting(Campaign c, String name) {
        List<String> names = c.parameters().stream().map(ParameterSpec::name).toList();
        String hint = DidYouMean.suggest(name, names).map(s -> "; did you mean '" + s + "'?")
                .orElse("; the settings are " + String.join(", ", names));
        return "campaign " + c.id() + " has no setting '" + name + "'" + hint;
    }

    /**
     * Computes a process-window map.
     *
     * @param sur                     the fitted surrogate
     * @param xParam                  the numeric setting along x
     * @param yParam                  the numeric setting along y (different from x)
     * @param at                      the settings to hold (Number or numeric String for numeric
     *                                settings, String for choices); settings left out are taken
     *                                from {@link #bestRecipe}; may be empty, never null
     * @param grid                    cells per axis, {@link #MIN_GRID} to {@link #MAX_GRID}
     * @param temperatureUncertaintyK standard deviation in K of the thermocouple error, &ge; 0
     *                                (0 gives the plain map)
     * @param seed                    seed of the proposer run that fills settings left out of {@code at}
     * @return the map; never null
     * @throws IllegalArgumentException for an unknown, categorical or repeated axis, a bad held
     *                                  value, a grid size outside its range or a negative uncertainty
     */
    public static WindowMapResult compute(CampaignSurrogate sur, String xParam, String yParam, Map<String, Object> at,
                                          int grid, double temperatureUncertaintyK, long seed) {
        Campaign c = sur.campaign();
        for (String name : new String[] {xParam, yParam}) {
            Optional<String> problem = axisProblem(c, name);
            if (problem.isPresent()) {
                throw new IllegalArgumentException(problem.get());
            }
        }
        if (xParam.equals(yParam)) {
            throw new IllegalArgumentException("x and y must be two different settings, both are '" + xParam + "'");
        }
        if (grid < MIN_GRID || grid > MAX_GRID) {
            throw new IllegalArgumentException("grid must be " + MIN_GRID + " to " + MAX_GRID + " cells per axis, found " + grid);
        }
        if (!(temperatureUncertaintyK >= 0) || !Double.isFinite(temperatureUncertaintyK)) {
            throw new IllegalArgumentException("temperature uncertainty must be a finite number of kelvin >= 0");
        }
        Map<String, Object> held = complete(sur, at, seed);
        ParameterSpec xs = c.parameter(xParam).orElseThrow();
        ParameterSpec ys = c.parameter(yParam).orElseThrow();
        DesignSpace space = sur.space();
        int n = grid;
        double[] xc = new double[n];
        double[] yc = new double[n];
        for (int k = 0; k < n; k++) {
            xc[k] = xs.fromUnit((k + 0.5) / n);
            yc[k] = ys.fromUnit((k + 0.5) / n);
        }
        Map<String, Double> baseNumbers = new LinkedHashMap<>();
        Map<String, String> categories = new LinkedHashMap<>();
        for (ParameterSpec p : c.parameters()) {
            if (p.isCategorical()) {
                categories.put(p.name(), (String) held.get(p.name()));
            } else {
                baseNumbers.put(p.name(), (Double) held.get(p.name()));
            }
        }
        List<ParameterSpec> temps = new ArrayList<>();
        for (ParameterSpec p : c.parameters()) {
            if (!p.isCategorical() && p.role() != null && TEMPERATURE_ROLES.contains(p.role())) {
                temps.add(p);
            }
        }
        boolean robust = temperatureUncertaintyK > 0 && !temps.isEmpty();
        GaussHermite rule = robust ? GaussHermite.standardNormal(QUADRATURE_NODES) : GaussHermite.standardNormal(1);
        int nodes = rule.size();
        int cells = n * n;
        boolean[][] feasible = new boolean[n][n];
        List<DesignPoint> pts = new ArrayList<>(cells * nodes);
        for (int k = 0; k < nodes; k++) {
            double offsetK = temperatureUncertaintyK * rule.node(k);
            for (int j = 0; j < n; j++) {
                for (int i = 0; i < n; i++) {
                    Map<String, Double> nums = new LinkedHashMap<>(baseNumbers);
                    nums.put(xParam, xc[i]);
                    nums.put(yParam, yc[j]);
                    if (k == 0) {
                        feasible[j][i] = c.limitsHold(nums);
                    }
                    if (robust) {
                        for (ParameterSpec t : temps) {
                            double v = nums.get(t.name()) + offsetK / t.unit().factor();
                            nums.put(t.name(), t.scale() == Scale.LOG ? Math.max(v, Double.MIN_NORMAL) : v);
                        }
                    }
                    DesignPoint p = space.encode(nums, categories);
                    if (p == null) {
                        throw new IllegalStateException("cannot encode the map recipe " + nums + " " + categories);
                    }
                    pts.add(p);
                }
            }
        }
        Evaluation e = sur.evaluate(pts);
        double[] all = Proposer.yields(sur, e);
        int centre = rule.centreIndex();
        double[][] plain = new double[n][n];
        double[][] avg = new double[n][n];
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < n; i++) {
                int idx = j * n + i;
                if (!feasible[j][i]) {
                    continue;
                }
                plain[j][i] = all[centre * cells + idx];
                if (robust) {
                    double s = 0;
                    for (int k = 0; k < nodes; k++) {
                        s += rule.weight(k) * all[k * cells + idx];
                    }
                    avg[j][i] = Math.max(0, Math.min(1, s));
                } else {
                    avg[j][i] = plain[j][i];
                }
            }
        }
        String classOutcome = null;
        List<String> classNames = List.of();
        String[][] likely = null;
        double[][][] classProb = null;
        for (Target t : c.targets()) {
            if (t.isClassTarget()) {
                OutcomeSpec o = c.outcome(t.outcome()).orElseThrow();
                classOutcome = o.name();
                classNames = o.classes();
                double[][] probs = e.classProbs().get(o.name());
                likely = new String[n][n];
                classProb = new double[classNames.size()][n][n];
                for (int j = 0; j < n; j++) {
                    for (int i = 0; i < n; i++) {
                        double[] pr = probs[centre * cells + j * n + i];
                        for (int q = 0; q < pr.length; q++) {
                            classProb[q][j][i] = Math.max(0, Math.min(1, pr[q]));
                        }
                        int best = 0;
                        for (int q = 1; q < pr.length; q++) {
                            if (pr[q] > pr[best]) {
                                best = q;
                            }
                        }
                        likely[j][i] = classNames.get(best);
                    }
                }
                break;
            }
        }
        Map<String, Object> atOut = new LinkedHashMap<>(held);
        return new WindowMapResult(xs, ys, xc, yc, avg, plain, feasible, classOutcome, classNames, likely, classProb, atOut,
                temps.stream().map(ParameterSpec::name).toList(), robust ? temperatureUncertaintyK : 0.0,
                share(avg), share(plain));
    }

    /**
     * @param yield a map's yields
     * @return the share of cells at or above {@link #WINDOW_THRESHOLD}
     */
    static double share(double[][] yield) {
        int in = 0;
        int total = 0;
        for (double[] row : yield) {
            for (double v : row) {
                total++;
                if (v >= WINDOW_THRESHOLD) {
                    in++;
                }
            }
        }
        return total == 0 ? 0 : (double) in / total;
    }

    /**
     * The recipe of the best proposal: the proposer's single recipe with the highest predicted yield
     * (batch 1, exploration weight 0, otherwise the default settings).
     *
     * @param sur  the surrogate
     * @param seed the proposer's seed
     * @return every setting in campaign order (Double for numeric, String for choices); never null
     */
    public static Map<String, Object> bestRecipe(CampaignSurrogate sur, long seed) {
        ProposalSet set = Proposer.propose(sur, ProposeSettings.defaults().withBatch(1).withSeed(seed).withExplore(0));
        return new LinkedHashMap<>(set.proposals().get(0).recipe());
    }

    /**
     * The settings a logged run used.
     *
     * @param lc    the campaign and its run log
     * @param runId the run's id
     * @return the settings the run records, in campaign order (settings it leaves empty are left
     *         out); never null
     * @throws IllegalArgumentException when no run has that id (with a did-you-mean hint)
     */
    public static Map<String, Object> runRecipe(LoadedCampaign lc, String runId) {
        List<String> ids = new ArrayList<>();
        for (Run r : lc.runLog().runs()) {
            ids.add(r.runId());
            if (r.runId().equals(runId)) {
                Map<String, Object> m = new LinkedHashMap<>();
                for (ParameterSpec p : lc.campaign().parameters()) {
                    if (p.isCategorical()) {
                        r.category(p.name()).ifPresent(v -> m.put(p.name(), v));
                    } else if (r.number(p.name()).isPresent()) {
                        m.put(p.name(), r.number(p.name()).getAsDouble());
                    }
                }
                return m;
            }
        }
        String hint = DidYouMean.suggest(runId, ids).map(s -> "; did you mean '" + s + "'?").orElse("");
        throw new IllegalArgumentException("the run log of " + lc.campaign().id() + " has no run '" + runId + "'" + hint);
    }

    /**
     * Parses held settings written as {@code name=value,name=value}.
     *
     * @param c    the campaign
     * @param text the list; blank gives an empty map
     * @return the settings in the order written (Double for numeric, String for choices); never null
     * @throws IllegalArgumentException for an unknown name (with a did-you-mean hint), a value that is
     *                                  not a number, a choice the setting does not offer, or a
     *                                  malformed or repeated entry
     */
    public static Map<String, Object> parseSettings(Campaign c, String text) {
        Map<String, Object> m = new LinkedHashMap<>();
        if (text == null || text.isBlank()) {
            return m;
        }
        for (String part : text.split(",")) {
            String s = part.strip();
            int eq = s.indexOf('=');
            if (eq <= 0 || eq == s.length() - 1) {
                throw new IllegalArgumentException("'" + s + "' is not of the form name=value");
            }
            String name = s.substring(0, eq).strip();
            String value = s.substring(eq + 1).strip();
            if (m.containsKey(name)) {
                throw new IllegalArgumentException("setting '" + name + "' is given twice");
            }
            m.put(name, coerce(c, name, value));
        }
        return m;
    }

    /** Checks one held value and returns it as Double (numeric) or String (choice). */
    static Object coerce(Campaign c, String name, Object value) {
        ParameterSpec p = c.parameter(name).orElseThrow(() -> new IllegalArgumentException(unknownSetting(c, name)));
        if (p.isCategorical()) {
            String s = String.valueOf(value);
            if (!p.choices().contains(s)) {
                throw new IllegalArgumentException("setting '" + name + "' offers " + String.join(", ", p.choices())
                        + ", not '" + s + "'");
            }
            return s;
        }
        double v;
        if (value instanceof Number) {
            v = ((Number) value).doubleValue();
        } else {
            try {
                v = Double.parseDouble(String.valueOf(value).strip());
            } catch (NumberFormatException ex) {
                throw new IllegalArgumentException("setting '" + name + "' needs a number in " + p.unit().symbol()
                        + ", found '" + value + "'");
            }
        }
        if (!Double.isFinite(v) || (p.scale() == Scale.LOG && !(v > 0))) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "setting '%s' needs a finite%s number, found %s",
                    name, p.scale() == Scale.LOG ? " positive" : "", value));
        }
        return v;
    }

    /** The held recipe: {@code at} checked, with settings left out taken from the best proposal. */
    static Map<String, Object> complete(CampaignSurrogate sur, Map<String, Object> at, long seed) {
        Campaign c = sur.campaign();
        Map<String, Object> given = new LinkedHashMap<>();
        for (Map.Entry<String, Object> e : at.entrySet()) {
            given.put(e.getKey(), coerce(c, e.getKey(), e.getValue()));
        }
        Map<String, Object> best = null;
        Map<String, Object> out = new LinkedHashMap<>();
        for (ParameterSpec p : c.parameters()) {
            Object v = given.get(p.name());
            if (v == null) {
                if (best == null) {
                    best = bestRecipe(sur, seed);
                }
                v = best.get(p.name());
            }
            out.put(p.name(), v);
        }
        return out;
    }
}
