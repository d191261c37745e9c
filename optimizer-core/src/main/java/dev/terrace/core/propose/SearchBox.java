package dev.terrace.core.propose;

import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * The box the search runs in: the campaign's box, or with a margin around the ok runs
 * ({@link ProposeSettings#withinRuns()}) its intersection with
 * [runs_min − m·span, runs_max + m·span] per numeric setting, where span = runs_max − runs_min
 * and all three are taken on the setting's scaled axis (log10 for {@code scale: log}). The ends
 * are rounded inward to what a grower can set ({@link RecipeRounding}), so a rounded proposal stays
 * inside the margin, and clipped to the campaign box. The search works in the unit cube of the narrowed box; {@link #toOuter} and {@link #toInner}
 * map points between it and the campaign's space.
 *
 * <p>A setting every ok run held at one value (span 0) is held at that value. A setting no ok run
 * recorded keeps the campaign box, and so does every setting when the log has no ok run.
 */
final class SearchBox {

    /** Width, as a fraction of the campaign box, left to a setting that is held at one value. */
    static final double HELD_WIDTH = 1e-9;

    private final DesignSpace outer;
    private final DesignSpace inner;
    private final boolean narrowed;
    private final List<String> notes;
    private final java.util.Map<String, Double> held;

    private SearchBox(DesignSpace outer, DesignSpace inner, boolean narrowed, List<String> notes) {
        this(outer, inner, narrowed, notes, java.util.Map.of());
    }

    private SearchBox(DesignSpace outer, DesignSpace inner, boolean narrowed, List<String> notes,
                      java.util.Map<String, Double> held) {
        this.held = java.util.Map.copyOf(held);
        this.outer = outer;
        this.inner = inner;
        this.narrowed = narrowed;
        this.notes = List.copyOf(notes);
    }

    /**
     * @param outer  the campaign's design space
     * @param ranges the ranges of the ok runs
     * @param margin the margin m as a fraction of each logged span; infinite for the whole box
     * @return the search box; never null
     */
    static SearchBox of(DesignSpace outer, RunRanges ranges, double margin) {
        Objects.requireNonNull(outer, "outer");
        if (Double.isInfinite(margin)) {
            return new SearchBox(outer, outer, false, List.of());
        }
        List<String> notes = new ArrayList<>();
        if (ranges.empty()) {
            notes.add("no ok run yet, so the margin around the runs cannot apply: searching the whole campaign box");
            return new SearchBox(outer, outer, false, notes);
        }
        List<ParameterSpec> specs = new ArrayList<>();
        java.util.Map<String, Double> held = new java.util.LinkedHashMap<>();
        for (ParameterSpec p : outer.continuous()) {
            Double lo = ranges.low().get(p.name());
            Double hi = ranges.high().get(p.name());
            if (lo == null || (p.scale() == Scale.LOG && !(lo > 0))) {
                specs.add(p);
                continue;
            }
            double a = p.toUnit(lo);
            double b = p.toUnit(hi);
            double span = b - a;
            double uLo = Math.max(0, a - margin * span);
            double uHi = Math.min(1, b + margin * span);
            double min;
            double max;
            if (uLo > uHi) {
                // every ok run lies outside today's box on one side: hold the setting at that edge
                min = b < 0 ? p.min() : p.max();
                max = min;
                notes.add(String.format(Locale.ROOT, "every ok run set %s outside today's box; it is held at %s",
                        p.name(), b < 0 ? "the box minimum" : "the box maximum"));
            } else {
                // rounded inward, so that a settable value at an end is still inside the margin
                min = Math.max(p.min(), RecipeRounding.round(p, p.fromUnit(uLo), true));
                max = Math.min(p.max(), RecipeRounding.round(p, p.fromUnit(uHi), false));
                if (min > max) {
                    min = Math.max(p.min(), p.fromUnit(uLo));
                    max = Math.min(p.max(), p.fromUnit(uHi));
                }
            }
            if (!(min < max)) {
                held.put(p.name(), min);
            }
            specs.add(narrow(p, min, max));
        }
        List<ParameterSpec> all = new ArrayList<>(specs);
        all.addAll(outer.categorical());
        return new SearchBox(outer, DesignSpace.of(all, outer.limits()), true, notes, held);
    }

    /** A copy of a numeric setting with another box; a box of zero width keeps a sliver inside the campaign box. */
    private static ParameterSpec narrow(ParameterSpec p, double min, double max) {
        double lo = min;
        double hi = max;
        if (!(lo < hi)) {
            if (p.scale() == Scale.LOG) {
                double f = Math.pow(p.max() / p.min(), HELD_WIDTH);
                if (lo * f <= p.max()) {
                    hi = lo * f;
                } else {
                    lo = hi / f;
                }
            } else {
                double w = HELD_WIDTH * (p.max() - p.min());
                if (lo + w <= p.max()) {
                    hi = lo + w;
                } else {
                    lo = hi - w;
                }
            }
        }
        return new ParameterSpec(p.name(), p.unit(), lo, hi, p.scale(), p.role(), p.choices(), p.position());
    }

    /** @return the space the search runs in; the campaign's own when nothing is narrowed */
    DesignSpace inner() {
        return inner;
    }

    /** @return the campaign's space */
    DesignSpace outer() {
        return outer;
    }

    /** @return true when a margin around the runs narrows the box */
    boolean narrowed() {
        return narrowed;
    }

    /** @return what the grower should know about the box; never null */
    List<String> notes() {
        return notes;
    }

    /**
     * @param p a point of the inner space
     * @return the same recipe as a point of the campaign's space
     */
    DesignPoint toOuter(DesignPoint p) {
        if (!narrowed) {
            return p;
        }
        double[] x = new double[p.dimensions()];
        for (int i = 0; i < x.length; i++) {
            x[i] = outer.continuous().get(i).toUnit(inner.continuous().get(i).fromUnit(p.x(i)));
        }
        return new DesignPoint(x, p.levels());
    }

    /**
     * @param p a point of the campaign's space
     * @return the same recipe in the inner space, clamped into its unit cube
     */
    DesignPoint toInner(DesignPoint p) {
        if (!narrowed) {
            return p;
        }
        double[] x = new double[p.dimensions()];
        for (int i = 0; i < x.length; i++) {
            double u = inner.continuous().get(i).toUnit(outer.continuous().get(i).fromUnit(p.x(i)));
            x[i] = Double.isFinite(u) ? Math.max(0, Math.min(1, u)) : 0;
        }
        return new DesignPoint(x, p.levels());
    }

    /**
     * Rounds a point of the inner space to settable values (inside the inner box and, when possible,
     * the limits) and returns it in the campaign's space.
     *
     * @param p a point of the inner space
     * @return the rounded recipe as a point of the campaign's space
     */
    DesignPoint settle(DesignPoint p) {
        java.util.Map<String, Double> nums = RecipeRounding.round(inner, p);
        nums.putAll(held); // a setting held at one value keeps exactly that value, not the sliver around it
        DesignPoint q = outer.encode(nums, inner.categories(p));
        return q != null ? q : toOuter(p);
    }
}
