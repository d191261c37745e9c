package dev.terrace.core.model;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.flux.BeamFlux;
import dev.terrace.core.flux.BeamReading;
import dev.terrace.core.flux.Species;
import dev.terrace.core.runlog.Run;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.Role;

import java.util.Map;
import java.util.Optional;

/**
 * Turns a recipe written in a campaign's units into the canonical {@link Conditions} growth models
 * read, and derives the group-V atom flux from a BEP reading when the campaign gives one.
 *
 * <p>Group-V flux: when the campaign has a {@code group_v_bep} setting and no {@code group_v_flux}
 * setting, the flux is estimated with {@link BeamFlux#absolute(BeamReading)} (ion-gauge density,
 * the ion-gauge electron-count sensitivity, effusive mean speed at the species' default source temperature). That
 * estimate is uncertain by about a factor of 2; the models' fitted cut points absorb a constant
 * factor. Without a species setting the species is {@link #defaultSpecies(String)}.
 *
 * @since 0.1
 */
public final class RecipeConverter {

    private RecipeConverter() {
    }

    /**
     * Default molecular species of a group-V element when the campaign does not say, from the one table
     * in {@link dev.terrace.spi.Surface#defaultGroupVSpecies(String)} that the growth models' sticking also
     * follows: As4, Sb4 and P2 (common practice).
     *
     * @param element group-V element symbol
     * @return the species, or empty for an unknown element
     */
    public static Optional<Species> defaultSpecies(String element) {
        return dev.terrace.spi.Surface.defaultGroupVSpecies(element).map(Species::parse);
    }

    /**
     * Converts the settings of a recipe (and optionally measured outcomes) to canonical conditions.
     *
     * @param c          the campaign
     * @param numbers    numeric values by column name, in the campaign's units (unknown names ignored)
     * @param categories categorical values by column name
     * @return the conditions; never null
     */
    public static Conditions conditions(Campaign c, Map<String, Double> numbers, Map<String, String> categories) {
        Conditions.Builder b = Conditions.builder();
        double h = c.surface().monolayerHeightNm();
        for (ParameterSpec p : c.parameters()) {
            if (p.role() == null) {
                continue;
            }
            if (p.isCategorical()) {
                String v = categories.get(p.name());
                if (v != null) {
                    b.set(p.role(), v);
                }
            } else {
                Double v = numbers.get(p.name());
                if (v != null && Double.isFinite(v)) {
                    // thermocouple readings become true temperatures (campaign temperature_calibration)
                    double offset = isHolderTemperature(p.role()) ? c.temperatureOffsetK() : 0;
                    b.set(p.role(), p.unit().toCanonical(v, h) + offset);
                }
            }
        }
        Conditions partial = b.build();
        if (!partial.has(Role.GROUP_V_FLUX) && partial.value(Role.GROUP_V_BEP).isPresent()) {
            double bepPa = partial.value(Role.GROUP_V_BEP).getAsDouble();
            Optional<Species> sp = partial.category(Role.GROUP_V_SPECIES).flatMap(RecipeConverter::parseSpecies)
                    .or(() -> defaultSpecies(c.surface().groupV()));
            if (sp.isPresent() && bepPa > 0) {
                double flux = BeamFlux.absolute(BeamReading.of(sp.get(), bepPa)).atomsPerCm2PerS();
                if (Double.isFinite(flux)) {
                    b.set(Role.GROUP_V_FLUX, flux);
                }
            }
        }
        return b.build();
    }

    /**
     * The conditions of a logged run, with its measured numeric outcomes added under their roles
     * (so a later model in a chain can use a measured density instead of a predicted one).
     *
     * @param c the campaign
     * @param r the run
     * @param withMeasured whether to add measured numeric outcomes
     * @return the conditions; never null
     */
    public static Conditions conditions(Campaign c, Run r, boolean withMeasured) {
        Conditions base = conditions(c, r.numbers(), r.categories());
        if (!withMeasured) {
            return base;
        }
        Conditions.Builder b = Conditions.builder();
        base.numbers().forEach(b::set);
        base.categories().forEach(b::set);
        for (OutcomeSpec o : c.outcomes()) {
            if (o.role() != null && !o.isClass()) {
                r.number(o.name()).ifPresent(v -> b.set(o.role(), o.unit().toCanonical(v, c.surface().monolayerHeightNm())));
            }
        }
        return b.build();
    }

    /**
     * The roles read on the substrate holder's thermocouple, to which a campaign's
     * {@linkplain dev.terrace.core.campaign.TemperatureCalibration temperature offset} applies.
     *
     * @param role a setting role
     * @return true for the substrate, crystallisation and anneal temperatures
     */
    public static boolean isHolderTemperature(Role role) {
        return role == Role.SUBSTRATE_TEMPERATURE || role == Role.CRYSTALLIZATION_TEMPERATURE
                || role == Role.ANNEAL_TEMPERATURE;
    }

    private static Optional<Species> parseSpecies(String s) {
        try {
            return Optional.of(Species.parse(s));
        } catch (IllegalArgumentException e) {
            return Optional.empty();
        }
    }
}
