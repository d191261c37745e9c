package dev.terrace.spi;

import java.util.List;
import java.util.Objects;

/**
 * One adjustable parameter of a growth model, with its default and where that default comes from.
 *
 * @param name         identifier used in fits and reports, lower case with underscores; never blank
 * @param unit         unit symbol for display (for example {@code "eV"}), empty when dimensionless
 * @param defaultValue value used when the lab's runs cannot determine the parameter
 * @param min          lowest physically sensible value (a fit never leaves {@code [min, max]})
 * @param max          highest physically sensible value
 * @param choices      the allowed values of a discrete parameter (for example critical size 1, 2, 3),
 *                     empty for a continuous one
 * @param logScale     true when the parameter spans decades and is fitted on its logarithm
 * @param source       where the default and bounds come from (paper, handbook, or "no general value
 *                     published"); never blank
 * @param description  one line saying what the parameter means
 * @param meaning      the physical quantity the parameter stands for when other models may use the same
 *                     one, as a shared key (lower case with underscores, for example
 *                     {@code droplet_contact_angle}); empty when the parameter belongs to this model
 *                     alone. Parameters of the models of one campaign that declare the same meaning are
 *                     one parameter: the fit determines it once (in the first model, in chain order,
 *                     whose runs determine it) and every model predicts with that value. Parameters that
 *                     share a meaning must share the unit and the scale; a plugin should reuse the keys
 *                     listed in {@link #MEANING_KEYS} where they fit.
 * @since 0.1
 */
public record ModelParameter(String name, String unit, double defaultValue, double min, double max,
                             List<Double> choices, boolean logScale, String source, String description,
                             String meaning) {

    /**
     * Shared meanings used by the bundled plugins: the contact angle of a liquid metal droplet on the
     * substrate (degrees), the surface diffusion barrier (eV) and attempt frequency (Hz) of a deposited
     * adatom, and the change of that barrier at a full surfactant layer (eV).
     *
     * @since 0.2
     */
    public static final List<String> MEANING_KEYS = List.of("droplet_contact_angle", "adatom_diffusion_barrier",
            "adatom_attempt_frequency", "surfactant_diffusion_shift");

    /** Checks the invariants. */
    public ModelParameter {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(description, "description");
        Objects.requireNonNull(meaning, "meaning");
        if (!meaning.isEmpty() && !meaning.matches("[a-z][a-z0-9_]*")) {
            throw new IllegalArgumentException("parameter " + name + ": meaning '" + meaning
                    + "' must be lower case letters, digits and underscores");
        }
        choices = List.copyOf(choices);
        if (name.isBlank()) {
            throw new IllegalArgumentException("parameter name is blank");
        }
        if (source.isBlank()) {
            throw new IllegalArgumentException("parameter " + name + " has no source for its default");
        }
        if (!(min <= defaultValue && defaultValue <= max)) {
            throw new IllegalArgumentException("parameter " + name + ": default " + defaultValue
                    + " outside [" + min + ", " + max + "]");
        }
        if (logScale && min <= 0) {
            throw new IllegalArgumentException("parameter " + name + ": log scale needs min > 0");
        }
        if (!choices.isEmpty() && !choices.contains(defaultValue)) {
            throw new IllegalArgumentException("parameter " + name + ": default is not one of its choices");
        }
    }

    /**
     * A parameter of this model alone (no shared meaning).
     *
     * @since 0.1
     */
    public ModelParameter(String name, String unit, double defaultValue, double min, double max,
                          List<Double> choices, boolean logScale, String source, String description) {
        this(name, unit, defaultValue, min, max, choices, logScale, source, description, "");
    }

    /**
     * @param key the shared meaning (see {@link #meaning()})
     * @return a copy of this parameter that declares the meaning; never null
     * @since 0.2
     */
    public ModelParameter withMeaning(String key) {
        return new ModelParameter(name, unit, defaultValue, min, max, choices, logScale, source, description, key);
    }

    /** @return true when the parameter declares a meaning shared with other models */
    public boolean hasSharedMeaning() {
        return !meaning.isEmpty();
    }

    /**
     * A continuous parameter.
     *
     * @return the parameter; never null
     */
    public static ModelParameter continuous(String name, String unit, double defaultValue, double min, double max,
                                            boolean logScale, String source, String description) {
        return new ModelParameter(name, unit, defaultValue, min, max, List.of(), logScale, source, description);
    }

    /**
     * A discrete parameter chosen among a few values (by information criterion when fitted).
     *
     * @return the parameter; never null
     */
    public static ModelParameter discrete(String name, double defaultValue, List<Double> choices,
                                          String source, String description) {
        double lo = choices.stream().mapToDouble(Double::doubleValue).min().orElse(defaultValue);
        double hi = choices.stream().mapToDouble(Double::doubleValue).max().orElse(defaultValue);
        return new ModelParameter(name, "", defaultValue, lo, hi, choices, false, source, description);
    }

    /** @return true when the parameter takes one of a few listed values */
    public boolean isDiscrete() {
        return !choices.isEmpty();
    }
}
