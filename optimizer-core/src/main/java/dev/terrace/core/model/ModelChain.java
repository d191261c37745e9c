package dev.terrace.core.model;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * A campaign's growth models run in their listed order. Numeric outcomes an earlier model predicts
 * are passed to later models as inputs unless the conditions already carry them (a measured value
 * wins); when two models predict the same outcome, the later one wins. A model that throws is
 * isolated: its failure becomes a not-applicable prediction with the reason, and the others run on.
 *
 * @since 0.1
 */
public final class ModelChain {

    /**
     * One model with the parameter values it runs with.
     *
     * @param model  the plugin; never null
     * @param values its parameter values; never null
     */
    public record Step(GrowthModel model, ParameterValues values) {
        /** Checks the invariants. */
        public Step {
            Objects.requireNonNull(model);
            Objects.requireNonNull(values);
        }
    }

    /**
     * What the chain predicts for one recipe.
     *
     * @param byModel       each model's own prediction, by model id, in chain order; never null
     * @param values        merged numeric outcomes from valid predictions (later models win); never null
     * @param probabilities merged class probabilities from valid predictions (later models win); never null
     * @param source        which model supplied each merged outcome; never null
     */
    public record Result(Map<String, Prediction> byModel, Map<Role, Double> values,
                         Map<Role, Map<String, Double>> probabilities, Map<Role, String> source) {
        /** Copies the maps. */
        public Result {
            byModel = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(byModel));
            // role order (EnumMap): the same iteration order in every JVM
            values = values.isEmpty() ? Map.of() : java.util.Collections.unmodifiableMap(new java.util.EnumMap<>(values));
            probabilities = probabilities.isEmpty() ? Map.of()
                    : java.util.Collections.unmodifiableMap(new java.util.EnumMap<>(probabilities));
            source = source.isEmpty() ? Map.of() : java.util.Collections.unmodifiableMap(new java.util.EnumMap<>(source));
        }
    }

    private final List<Step> steps;
    private final Surface surface;

    private ModelChain(List<Step> steps, Surface surface) {
        this.steps = List.copyOf(steps);
        this.surface = Objects.requireNonNull(surface);
    }

    /**
     * @param steps   models in order with their parameter values
     * @param surface the campaign's surface
     * @return the chain; never null
     */
    public static ModelChain of(List<Step> steps, Surface surface) {
        return new ModelChain(steps, surface);
    }

    /** @return the steps in order; never null */
    public List<Step> steps() {
        return steps;
    }

    /** @return the surface the chain predicts for; never null */
    public Surface surface() {
        return surface;
    }

    /**
     * @param id a model id
     * @param values new parameter values for it
     * @return a copy of this chain with that model's values replaced; never null
     */
    public ModelChain with(String id, ParameterValues values) {
        List<Step> out = new ArrayList<>();
        for (Step s : steps) {
            out.add(s.model().id().equals(id) ? new Step(s.model(), values) : s);
        }
        return new ModelChain(out, surface);
    }

    /**
     * Runs the chain on one recipe.
     *
     * @param conditions the recipe (and any measured outcomes to use in place of predictions)
     * @return the result; never null
     */
    public Result predict(Conditions conditions) {
        Map<String, Prediction> byModel = new LinkedHashMap<>();
        Map<Role, Double> values = new EnumMap<>(Role.class);
        Map<Role, Map<String, Double>> probs = new EnumMap<>(Role.class);
        Map<Role, String> source = new EnumMap<>(Role.class);
        Conditions current = conditions;
        for (Step s : steps) {
            String id = s.model().id();
            Prediction p = safePredict(s, current);
            byModel.put(id, p);
            if (!p.validity().valid()) {
                continue;
            }
            p.values().forEach((r, v) -> {
                values.put(r, v);
                source.put(r, id);
            });
            p.probabilities().forEach((r, m) -> {
                probs.put(r, m);
                source.put(r, id);
            });
            Conditions.Builder b = null;
            for (Map.Entry<Role, Double> e : p.values().entrySet()) {
                if (!current.has(e.getKey())) {
                    if (b == null) {
                        b = Conditions.builder();
                        current.numbers().forEach(b::set);
                        current.categories().forEach(b::set);
                    }
                    b.set(e.getKey(), e.getValue());
                }
            }
            if (b != null) {
                current = b.build();
            }
        }
        return new Result(byModel, values, probs, source);
    }

    /**
     * Calls one model, turning any exception or contract breach into a not-applicable prediction.
     *
     * @param step       the model and its values
     * @param conditions the recipe
     * @return the prediction; never null
     */
    public Prediction safePredict(Step step, Conditions conditions) {
        try {
            Prediction p = step.model().predict(conditions, surface, step.values());
            if (p == null) {
                return Prediction.notApplicable("model " + step.model().id() + " returned nothing");
            }
            return p;
        } catch (RuntimeException | StackOverflowError e) {
            String msg = e.getMessage();
            return Prediction.notApplicable("model " + step.model().id() + " failed: " + e.getClass().getSimpleName()
                    + (msg == null ? "" : ": " + msg));
        }
    }
}
