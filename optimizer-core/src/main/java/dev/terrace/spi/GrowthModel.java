package dev.terrace.spi;

import java.util.List;
import java.util.Set;

/**
 * A growth model plugin: a physical law with parameters that predicts run outcomes from a recipe.
 *
 * <p>Implementations are found with {@link java.util.ServiceLoader}: list the class in
 * {@code META-INF/services/dev.terrace.spi.GrowthModel}. They need a public no-argument
 * constructor, must be stateless and thread-safe, and must depend on nothing in Terrace but
 * this package.
 *
 * @apiNote {@link #predict} is called many thousands of times during fits and searches. It must
 *     not throw for any recipe inside the physical ranges of its roles; when its assumptions do
 *     not hold it returns a prediction whose {@link Validity} says why. Numeric outcomes are in
 *     the canonical unit of their role's {@link Quantity}; they must be finite.
 * @since 0.1
 */
public interface GrowthModel {

    /**
     * @return the stable, unique, lower-case, hyphenated identifier a campaign file names in
     *     its {@code models:} list; never blank
     */
    String id();

    /** @return one sentence saying what the model describes; never null */
    String description();

    /** @return the roles a recipe must set for the model to predict anything; never null */
    Set<Role> requiredInputs();

    /** @return roles the model uses when present (for example a surfactant); never null */
    default Set<Role> optionalInputs() {
        return Set.of();
    }

    /** @return the outcome roles the model predicts; never null, not empty */
    Set<Role> predictedOutcomes();

    /**
     * @param role a class-valued outcome role this model predicts
     * @return the class names the model assigns probabilities to, in their natural order; never null
     */
    default List<String> classes(Role role) {
        return List.of();
    }

    /** @return the model's parameters with defaults and their sources; never null */
    List<ModelParameter> parameters();

    /**
     * Predicts the outcomes of one recipe.
     *
     * @param conditions the recipe in canonical units; never null
     * @param surface    material facts of the growth surface; never null
     * @param parameters a value for every parameter in {@link #parameters()}; never null
     * @return the prediction; never null
     */
    Prediction predict(Conditions conditions, Surface surface, ParameterValues parameters);
}
