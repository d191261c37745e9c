package dev.terrace.core.search;

import dev.terrace.core.campaign.LinearLimit;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;

/**
 * Local refinement of a point over its continuous coordinates at fixed categorical levels: a
 * compass (coordinate pattern) search that polls x ± step·e_i, moves to the best improving poll
 * point and halves the step when none improves (Kolda, Lewis &amp; Torczon, "Optimization by
 * direct search", SIAM Review 45(3), 2003; from memory).
 *
 * <p>All poll points of one step are evaluated in one objective call. Poll points outside the unit
 * cube are clamped into it, and poll points that break a limit are dropped without being
 * evaluated, so the search stays feasible. Near a limit the axis directions alone can stall (a
 * limit not parallel to an axis blocks every improving axis move), so the poll set then also holds
 * the axis directions projected onto the tangent space of the nearly active limits, the usual
 * remedy for linear constraints in generating-set search (same source).
 */
final class CompassPolish {

    /** Smallest step in the unit cube; below it the search stops (about 1e-6 of each range). */
    static final double MIN_STEP = 1e-6;

    /** A limit counts as nearly active when its boundary is within this many steps. */
    static final double NEAR_ACTIVE_STEPS = 2.0;

    private CompassPolish() {
    }

    /**
     * @param run           the search state (objective, archive)
     * @param start         a feasible evaluated point
     * @param maxCalls      cap on objective calls
     * @param initialStep   first step in the unit cube
     * @return the best point reached and its value (never worse than {@code start})
     */
    static SearchRun.Entry polish(SearchRun run, SearchRun.Entry start, int maxCalls, double initialStep) {
        double[] x = start.point().x();
        int[] levels = start.point().levels();
        double f = start.value();
        double step = initialStep;
        int calls = 0;
        while (calls < maxCalls && step >= MIN_STEP && x.length > 0) {
            List<DesignPoint> polls = new ArrayList<>();
            for (double[] dir : directions(run.space(), new DesignPoint(x, levels), step)) {
                for (int sign = -1; sign <= 1; sign += 2) {
                    double[] y = new double[x.length];
                    for (int i = 0; i < x.length; i++) {
                        y[i] = Math.max(0.0, Math.min(1.0, x[i] + sign * step * dir[i]));
                    }
                    if (Arrays.equals(x, y)) {
                        continue;
                    }
                    DesignPoint p = new DesignPoint(y, levels);
                    if (run.violation(p) > 0) {
                        continue;
                    }
                    polls.add(p);
                }
            }
            if (polls.isEmpty()) {
                step /= 2;
                continue;
            }
            double[] values = run.evaluate(polls);
            calls++;
            int k = 0;
            for (int i = 1; i < values.length; i++) {
                if (values[i] > values[k]) {
                    k = i;
                }
            }
            if (values[k] > f) {
                f = values[k];
                x = polls.get(k).x();
            } else {
                step /= 2;
            }
        }
        return new SearchRun.Entry(new DesignPoint(x, levels), f);
    }

    /**
     * @return unit poll directions: the axes, plus the axes projected onto the tangent space of
     *         the limits that are nearly active at {@code p}
     */
    static List<double[]> directions(DesignSpace space, DesignPoint p, double step) {
        int d = p.dimensions();
        List<double[]> dirs = new ArrayList<>();
        for (int i = 0; i < d; i++) {
            double[] e = new double[d];
            e[i] = 1;
            dirs.add(e);
        }
        List<double[]> basis = new ArrayList<>();
        Map<String, Double> numbers = space.numbers(p);
        for (LinearLimit l : space.limits()) {
            double slack = l.slack(numbers);
            if (Double.isNaN(slack)) {
                continue;
            }
            double[] g = unitGradient(space, l, p);
            double norm = norm(g);
            if (norm == 0 || slack > NEAR_ACTIVE_STEPS * step * norm) {
                continue;
            }
            // Gram-Schmidt against the gradients already kept
            for (double[] b : basis) {
                double dot = dot(g, b);
                for (int i = 0; i < d; i++) {
                    g[i] -= dot * b[i];
                }
            }
            double n = norm(g);
            if (n > 1e-9) {
                for (int i = 0; i < d; i++) {
                    g[i] /= n;
                }
                basis.add(g);
            }
        }
        if (basis.isEmpty()) {
            return dirs;
        }
        List<double[]> tangent = new ArrayList<>();
        for (double[] e : dirs) {
            double[] t = e.clone();
            for (double[] b : basis) {
                double dot = dot(t, b);
                for (int i = 0; i < d; i++) {
                    t[i] -= dot * b[i];
                }
            }
            double n = norm(t);
            if (n > 1e-6) {
                for (int i = 0; i < d; i++) {
                    t[i] /= n;
                }
                tangent.add(t);
            }
        }
        dirs.addAll(tangent);
        return dirs;
    }

    /** Gradient of a limit's slack with respect to the unit-cube coordinates at {@code p}. */
    private static double[] unitGradient(DesignSpace space, LinearLimit l, DesignPoint p) {
        List<ParameterSpec> specs = space.continuous();
        double[] g = new double[specs.size()];
        for (int i = 0; i < g.length; i++) {
            ParameterSpec s = specs.get(i);
            Double coef = l.coefficients().get(s.name());
            if (coef == null) {
                continue;
            }
            double dvdu = s.scale() == Scale.LOG
                    ? s.fromUnit(p.x(i)) * Math.log(10) * (Math.log10(s.max()) - Math.log10(s.min()))
                    : s.max() - s.min();
            g[i] = coef * dvdu;
        }
        return g;
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    private static double norm(double[] a) {
        return Math.sqrt(dot(a, a));
    }
}
