package dev.terrace.core.space;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.LinearLimit;
import dev.terrace.core.campaign.ParameterSpec;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The search space of a campaign: its numeric settings mapped to the unit cube (on log10 for
 * {@code scale: log}), its categorical settings as level indices, and its linear limits.
 *
 * <p>Distances between points are Euclidean in the unit cube plus 1 per differing categorical
 * level, the "scaled space" in which batch diversity is measured.
 *
 * @since 0.1
 */
public final class DesignSpace {

    private final List<ParameterSpec> continuous;
    private final List<ParameterSpec> categorical;
    private final List<LinearLimit> limits;

    private DesignSpace(List<ParameterSpec> continuous, List<ParameterSpec> categorical, List<LinearLimit> limits) {
        this.continuous = List.copyOf(continuous);
        this.categorical = List.copyOf(categorical);
        this.limits = List.copyOf(limits);
    }

    /**
     * @param c a campaign
     * @return its design space; never null
     */
    public static DesignSpace of(Campaign c) {
        List<ParameterSpec> num = new ArrayList<>();
        List<ParameterSpec> cat = new ArrayList<>();
        for (ParameterSpec p : c.parameters()) {
            (p.isCategorical() ? cat : num).add(p);
        }
        return new DesignSpace(num, cat, c.limits());
    }

    /**
     * A space from explicit settings (tests, benchmarks).
     *
     * @param parameters settings in order
     * @param limits     linear limits over their names
     * @return the space; never null
     */
    public static DesignSpace of(List<ParameterSpec> parameters, List<LinearLimit> limits) {
        List<ParameterSpec> num = new ArrayList<>();
        List<ParameterSpec> cat = new ArrayList<>();
        for (ParameterSpec p : parameters) {
            (p.isCategorical() ? cat : num).add(p);
        }
        return new DesignSpace(num, cat, limits);
    }

    /** @return number of continuous dimensions */
    public int dimensions() {
        return continuous.size();
    }

    /** @return the numeric settings in dimension order; never null */
    public List<ParameterSpec> continuous() {
        return continuous;
    }

    /** @return the categorical settings in order; never null */
    public List<ParameterSpec> categorical() {
        return categorical;
    }

    /** @return the number of levels of each categorical setting; never null */
    public int[] levelCounts() {
        int[] n = new int[categorical.size()];
        for (int j = 0; j < n.length; j++) {
            n[j] = categorical.get(j).choices().size();
        }
        return n;
    }

    /** @return the linear limits; never null */
    public List<LinearLimit> limits() {
        return limits;
    }

    /**
     * @param p a point
     * @return its numeric settings in campaign units, by name; never null
     */
    public Map<String, Double> numbers(DesignPoint p) {
        Map<String, Double> m = new LinkedHashMap<>();
        for (int i = 0; i < continuous.size(); i++) {
            m.put(continuous.get(i).name(), continuous.get(i).fromUnit(p.x(i)));
        }
        return m;
    }

    /**
     * @param p a point
     * @return its categorical settings by name; never null
     */
    public Map<String, String> categories(DesignPoint p) {
        Map<String, String> m = new LinkedHashMap<>();
        for (int j = 0; j < categorical.size(); j++) {
            m.put(categorical.get(j).name(), categorical.get(j).choices().get(p.level(j)));
        }
        return m;
    }

    /**
     * Encodes a recipe; numeric values outside the box map outside [0, 1] (old runs may predate
     * today's box) and are kept there, so distances and surrogates see where they really were.
     *
     * @param numbers    numeric settings by name (campaign units)
     * @param categories categorical settings by name
     * @return the point, or null when a setting is missing or unknown
     */
    public DesignPoint encode(Map<String, Double> numbers, Map<String, String> categories) {
        double[] x = new double[continuous.size()];
        for (int i = 0; i < x.length; i++) {
            Double v = numbers.get(continuous.get(i).name());
            if (v == null || !Double.isFinite(v) || (continuous.get(i).scale() == dev.terrace.core.campaign.Scale.LOG && v <= 0)) {
                return null;
            }
            x[i] = continuous.get(i).toUnit(v);
        }
        int[] lv = new int[categorical.size()];
        for (int j = 0; j < lv.length; j++) {
            String s = categories.get(categorical.get(j).name());
            int idx = s == null ? -1 : categorical.get(j).choices().indexOf(s);
            if (idx < 0) {
                return null;
            }
            lv[j] = idx;
        }
        return new DesignPoint(x, lv);
    }

    /**
     * @param numbers numeric settings by name, campaign units
     * @return true when every value lies inside its box (within a relative 1e-9)
     */
    public boolean insideBox(Map<String, Double> numbers) {
        for (ParameterSpec p : continuous) {
            Double v = numbers.get(p.name());
            if (v == null) {
                return false;
            }
            double tol = 1e-9 * Math.max(Math.abs(p.min()), Math.abs(p.max()));
            if (v < p.min() - tol || v > p.max() + tol) {
                return false;
            }
        }
        return true;
    }

    /**
     * @param p a point
     * @return total violation of the limits in campaign units (0 when every limit holds)
     */
    public double violation(DesignPoint p) {
        if (limits.isEmpty()) {
            return 0;
        }
        Map<String, Double> nums = numbers(p);
        double v = 0;
        for (LinearLimit l : limits) {
            double s = l.slack(nums);
            if (s < 0) {
                v -= s;
            }
        }
        return v;
    }

    /**
     * @param p a point
     * @return true when every limit holds
     */
    public boolean feasible(DesignPoint p) {
        Map<String, Double> nums = numbers(p);
        for (LinearLimit l : limits) {
            if (!l.holds(nums)) {
                return false;
            }
        }
        return true;
    }

    /**
     * Distance in the scaled space: Euclidean over the unit cube plus 1 per differing level.
     *
     * @param a a point
     * @param b another point
     * @return the distance
     */
    public static double distance(DesignPoint a, DesignPoint b) {
        Objects.requireNonNull(a);
        Objects.requireNonNull(b);
        double s = 0;
        int d = a.dimensions();
        for (int i = 0; i < d; i++) {
            double diff = a.x(i) - b.x(i);
            s += diff * diff;
        }
        for (int j = 0; j < a.levelCount(); j++) {
            if (a.level(j) != b.level(j)) {
                s += 1;
            }
        }
        return Math.sqrt(s);
    }
}
