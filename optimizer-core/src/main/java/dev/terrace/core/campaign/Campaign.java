package dev.terrace.core.campaign;

import dev.terrace.spi.Surface;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * One growth series: its recipe settings, measured outcomes, targets, limits and growth models.
 * Read from a campaign YAML file by {@link CampaignReader}.
 *
 * @param id         identifier (lower case, digits, '-'); never blank
 * @param title      free text; never null
 * @param material   the material section; never null
 * @param surface    the resolved material facts growth models use; never null
 * @param parameters the settings, in file order; never null
 * @param outcomes   the outcomes, in file order; never null
 * @param targets    the targets, in file order; never null
 * @param limits     the linear limits; never null
 * @param models     growth-model plugin ids; never null, possibly empty
 * @param file       the campaign file; never null
 * @param runs       the run-log file, resolved against the campaign file's folder; never null
 * @param journal    the proposal journal ({@code journal:} key, default {@value CampaignReader#DEFAULT_JOURNAL}
 *                   beside the campaign file), resolved against the campaign file's folder; never null
 * @param temperatureCalibration how the substrate-temperature readings were calibrated
 *                   ({@code temperature_calibration:}); {@link TemperatureCalibration#NONE} when absent; never null
 * @param priors     earlier campaigns whose fitted parameters are priors of this one ({@code priors:});
 *                   never null, possibly empty
 * @since 0.1
 */
public record Campaign(String id, String title, MaterialSpec material, Surface surface,
                       List<ParameterSpec> parameters, List<OutcomeSpec> outcomes, List<Target> targets,
                       List<LinearLimit> limits, List<String> models, Path file, Path runs, Path journal,
                       TemperatureCalibration temperatureCalibration, List<PriorSource> priors) {

    /** Copies and checks the contents. */
    public Campaign {
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(material, "material");
        Objects.requireNonNull(surface, "surface");
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(runs, "runs");
        Objects.requireNonNull(journal, "journal");
        parameters = List.copyOf(parameters);
        outcomes = List.copyOf(outcomes);
        targets = List.copyOf(targets);
        limits = List.copyOf(limits);
        models = List.copyOf(models);
        Objects.requireNonNull(temperatureCalibration, "temperatureCalibration");
        priors = List.copyOf(priors);
    }

    /**
     * A campaign without temperature calibration or priors.
     *
     * @param id         identifier
     * @param title      free text
     * @param material   the material section
     * @param surface    the resolved material facts
     * @param parameters the settings
     * @param outcomes   the outcomes
     * @param targets    the targets
     * @param limits     the linear limits
     * @param models     growth-model plugin ids
     * @param file       the campaign file
     * @param runs       the run-log file
     * @param journal    the proposal journal
     */
    public Campaign(String id, String title, MaterialSpec material, Surface surface,
                    List<ParameterSpec> parameters, List<OutcomeSpec> outcomes, List<Target> targets,
                    List<LinearLimit> limits, List<String> models, Path file, Path runs, Path journal) {
        this(id, title, material, surface, parameters, outcomes, targets, limits, models, file, runs, journal,
                TemperatureCalibration.NONE, List.of());
    }

    /**
     * @param calibration the calibration to use instead
     * @return a copy with that temperature calibration; never null
     */
    public Campaign withTemperatureCalibration(TemperatureCalibration calibration) {
        return new Campaign(id, title, material, surface, parameters, outcomes, targets, limits, models, file, runs,
                journal, calibration, priors);
    }

    /** @return the offset, kelvin, added to every substrate-temperature reading before the physics */
    public double temperatureOffsetK() {
        return temperatureCalibration.appliedOffsetK();
    }

    /**
     * A campaign with the default journal, {@value CampaignReader#DEFAULT_JOURNAL} beside the campaign file.
     *
     * @param id         identifier
     * @param title      free text
     * @param material   the material section
     * @param surface    the resolved material facts
     * @param parameters the settings
     * @param outcomes   the outcomes
     * @param targets    the targets
     * @param limits     the linear limits
     * @param models     growth-model plugin ids
     * @param file       the campaign file
     * @param runs       the run-log file
     */
    public Campaign(String id, String title, MaterialSpec material, Surface surface,
                    List<ParameterSpec> parameters, List<OutcomeSpec> outcomes, List<Target> targets,
                    List<LinearLimit> limits, List<String> models, Path file, Path runs) {
        this(id, title, material, surface, parameters, outcomes, targets, limits, models, file, runs,
                defaultJournal(file));
    }

    private static Path defaultJournal(Path file) {
        Objects.requireNonNull(file, "file");
        Path dir = file.toAbsolutePath().getParent();
        return dir == null ? Path.of(CampaignReader.DEFAULT_JOURNAL) : dir.resolve(CampaignReader.DEFAULT_JOURNAL);
    }

    /**
     * @param name a column name
     * @return the setting of that name, if any
     */
    public Optional<ParameterSpec> parameter(String name) {
        return parameters.stream().filter(p -> p.name().equals(name)).findFirst();
    }

    /**
     * @param name a column name
     * @return the outcome of that name, if any
     */
    public Optional<OutcomeSpec> outcome(String name) {
        return outcomes.stream().filter(o -> o.name().equals(name)).findFirst();
    }

    /**
     * @param outcome an outcome name
     * @return its target, if any
     */
    public Optional<Target> target(String outcome) {
        return targets.stream().filter(t -> t.outcome().equals(outcome)).findFirst();
    }

    /** @return the names of the numeric settings, in file order; never null */
    public List<String> numericParameterNames() {
        return parameters.stream().filter(p -> !p.isCategorical()).map(ParameterSpec::name).toList();
    }

    /**
     * @param numeric numeric recipe values by name, campaign units
     * @return true when every limit holds
     */
    public boolean limitsHold(Map<String, Double> numeric) {
        return limits.stream().allMatch(l -> l.holds(numeric));
    }

    /** @return settings by name, in file order; never null */
    public Map<String, ParameterSpec> parametersByName() {
        Map<String, ParameterSpec> m = new LinkedHashMap<>();
        parameters.forEach(p -> m.put(p.name(), p));
        return m;
    }
}
