package dev.terrace.core.runlog;

import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.MaterialSpec;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.SourcePosition;
import dev.terrace.core.units.Unit;
import dev.terrace.core.units.Units;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;

/**
 * A campaign built directly from its records, for run-log tests. The scenario (indium droplets on
 * GaAs(001), crystallised under arsenic) and every number in it are invented for these tests; it
 * is no lab's data.
 */
final class RunLogFixtures {

    /**
     * GaAs lattice constant in nm at 300 K: 0.565325 (Vurgaftman, Meyer, Ram-Mohan,
     * J. Appl. Phys. 89, 5815 (2001), also in the project's material table).
     */
    static final double GAAS_A_NM = 0.565325;
    /** One (001) monolayer of GaAs is a/2 high. */
    static final double GAAS_ML_NM = GAAS_A_NM / 2;
    /** Sites per (001) monolayer, 2/a^2, in cm^-2 (a in cm). */
    static final double GAAS_SITES_PER_CM2 = 2 / Math.pow(GAAS_A_NM * 1e-7, 2);

    /** The name diagnostics carry in the tests. */
    static final Path RUNS = Path.of("runs.csv");

    /** Header naming every column of {@link #campaign()} in campaign order. */
    static final String FULL_HEADER = "run_id,t_sub,in_rate,in_amount,as_bep,as_species,anneal_t,"
            + "density,diameter,shape,pl_ratio,status,date,proposal,notes";

    private RunLogFixtures() {
    }

    private static Unit unit(String symbol) {
        return Units.bySymbol(symbol).orElseThrow();
    }

    private static ParameterSpec numeric(String name, String unit, double min, double max, Scale scale, Role role) {
        return new ParameterSpec(name, unit(unit), min, max, scale, role, List.of(), SourcePosition.UNKNOWN);
    }

    /**
     * The test campaign: settings t_sub (degC, 100 to 300), in_rate (ML/s, 0.01 to 0.5, log),
     * in_amount (nm of indium as coverage, 0.5 to 3), as_bep (Torr, 1e-7 to 1e-4, log),
     * as_species (As2 or As4), anneal_t (min, 0 to 30); outcomes density (cm^-2), diameter (nm),
     * shape (dot, ring or hole) and pl_ratio (dimensionless).
     *
     * @return the campaign; its run log is {@link #RUNS}
     */
    static Campaign campaign() {
        Surface surface = new Surface("GaAs", GAAS_ML_NM, GAAS_SITES_PER_CM2, "In", 429.7485, Double.NaN, "As");
        List<ParameterSpec> params = List.of(
                numeric("t_sub", "degC", 100, 300, Scale.LINEAR, Role.SUBSTRATE_TEMPERATURE),
                numeric("in_rate", "ML/s", 0.01, 0.5, Scale.LOG, Role.DEPOSITION_RATE),
                new ParameterSpec("in_amount", Units.NM_COVERAGE, 0.5, 3, Scale.LINEAR, Role.COVERAGE, List.of(),
                        SourcePosition.UNKNOWN),
                numeric("as_bep", "Torr", 1e-7, 1e-4, Scale.LOG, Role.GROUP_V_BEP),
                new ParameterSpec("as_species", null, Double.NaN, Double.NaN, Scale.LINEAR, Role.GROUP_V_SPECIES,
                        List.of("As2", "As4"), SourcePosition.UNKNOWN),
                numeric("anneal_t", "min", 0, 30, Scale.LINEAR, Role.ANNEAL_TIME));
        List<OutcomeSpec> outcomes = List.of(
                new OutcomeSpec("density", unit("cm^-2"), Scale.LOG, Role.ISLAND_DENSITY, List.of(),
                        SourcePosition.UNKNOWN),
                new OutcomeSpec("diameter", unit("nm"), Scale.LINEAR, Role.ISLAND_DIAMETER, List.of(),
                        SourcePosition.UNKNOWN),
                new OutcomeSpec("shape", null, Scale.LINEAR, Role.MORPHOLOGY, List.of("dot", "ring", "hole"),
                        SourcePosition.UNKNOWN),
                new OutcomeSpec("pl_ratio", unit("1"), Scale.LINEAR, null, List.of(), SourcePosition.UNKNOWN));
        return new Campaign("in-droplets-test", "Invented test campaign: In droplets on GaAs(001)",
                new MaterialSpec("GaAs", "In", "As"), surface, params, outcomes, List.of(), List.of(), List.of(),
                Path.of("campaign.yaml"), RUNS);
    }

    /**
     * A campaign with one numeric setting in the given unit, for unit-specific checks.
     *
     * @param unit the setting's unit
     * @param min  box minimum in that unit
     * @param max  box maximum in that unit
     * @return a campaign whose only setting is {@code x}
     */
    static Campaign singleSetting(Unit unit, double min, double max) {
        Surface surface = new Surface("GaAs", GAAS_ML_NM, GAAS_SITES_PER_CM2, null, Double.NaN, Double.NaN, null);
        ParameterSpec x = new ParameterSpec("x", unit, min, max, Scale.LINEAR, null, List.of(), SourcePosition.UNKNOWN);
        return new Campaign("single", "Invented one-setting campaign", new MaterialSpec("GaAs", null, null), surface,
                List.of(x), List.of(), List.of(), List.of(), List.of(), Path.of("campaign.yaml"), RUNS);
    }

    /**
     * Reads run-log text against the test campaign.
     *
     * @param text the run-log text
     * @return the log
     * @throws InputException when the text holds an error
     * @throws IOException    never, for a string
     */
    static RunLog read(String text) throws IOException, InputException {
        return RunLogReader.read(campaign(), RUNS, new StringReader(text));
    }
}
