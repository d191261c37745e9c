package dev.terrace.core.plugins;

import dev.terrace.spi.GrowthModel;

import java.util.Objects;

/**
 * A discovered growth model with where it was found.
 *
 * @param model     the plugin instance; never null
 * @param id        its id, read once at discovery; never blank
 * @param className its implementation class; never null
 * @param source    the jar or folder it came from; never null
 * @since 0.1
 */
public record LoadedModel(GrowthModel model, String id, String className, String source) {
    /** Checks the invariants. */
    public LoadedModel {
        Objects.requireNonNull(model);
        Objects.requireNonNull(id);
        Objects.requireNonNull(className);
        Objects.requireNonNull(source);
    }
}
