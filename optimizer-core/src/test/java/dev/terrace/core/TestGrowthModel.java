package dev.terrace.core;

import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.Role;

import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * The fixed part of a growth model written for a test: its id, a description, the one setting it
 * needs and the outcomes it predicts, given to the constructor; a subclass gives the law
 * ({@code predict}) and, when it has any, its parameters. Shared by the fitter, validation,
 * surrogate and registry tests so each states only what its model does.
 */
public abstract class TestGrowthModel implements GrowthModel {

    private final String id;
    private final String description;
    private final Set<Role> inputs;
    private final Set<Role> outcomes;

    /**
     * @param id          the plugin id (may be malformed, for registry tests); never null
     * @param description one line; never null
     * @param input       the required input
     * @param outcomes    the predicted outcomes
     */
    protected TestGrowthModel(String id, String description, Role input, Role... outcomes) {
        this.id = Objects.requireNonNull(id, "id");
        this.description = Objects.requireNonNull(description, "description");
        this.inputs = Set.of(input);
        this.outcomes = Set.of(outcomes);
    }

    @Override
    public String id() {
        return id;
    }

    @Override
    public String description() {
        return description;
    }

    @Override
    public Set<Role> requiredInputs() {
        return inputs;
    }

    @Override
    public Set<Role> predictedOutcomes() {
        return outcomes;
    }

    /** @return no parameters; a model with parameters overrides this */
    @Override
    public List<ModelParameter> parameters() {
        return List.of();
    }
}
