package dev.terrace.core.campaign;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.spi.Role;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.InputStream;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CampaignReaderTest {

    private static final Path FILE = Path.of("/lab/series/campaign.yaml");

    static String template() throws IOException {
        try (InputStream in = CampaignReader.class.getResourceAsStream("/dev/terrace/core/campaign-template.yaml")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    static Campaign parse(String yaml) throws InputException {
        return CampaignReader.parse(FILE, new StringReader(yaml), null).campaign();
    }

    static List<Diagnostic> errors(String yaml) {
        InputException e = assertThrows(InputException.class, () -> parse(yaml));
        return e.diagnostics();
    }

    static Diagnostic only(String yaml, String fragment) {
        List<Diagnostic> ds = errors(yaml);
        assertEquals(1, ds.size(), ds.toString());
        assertTrue(ds.get(0).message().contains(fragment), ds.get(0).message());
        return ds.get(0);
    }

    private static final String MINIMAL = String.join("\n",
            "campaign: t1",
            "material: {substrate: GaAs}",
            "parameters:",
            "  temp: {unit: degC, min: 500, max: 640, role: substrate_temperature}",
            "  rate: {unit: um/h, min: 0.1, max: 1.0, scale: log, role: deposition_rate}",
            "outcomes:",
            "  mode: {classes: [step-flow, islands], role: growth_mode}",
            "");

    @Test
    void readsTheBundledTemplate() throws Exception {
        Campaign c = parse(template());
        assertEquals("new-campaign", c.id());
        assertEquals(6, c.parameters().size());
        assertEquals(3, c.outcomes().size());
        assertEquals(List.of("island-nucleation", "droplet-crystallization"), c.models());
        ParameterSpec rate = c.parameter("in_rate").orElseThrow();
        assertEquals(Scale.LOG, rate.scale());
        assertEquals(Role.DEPOSITION_RATE, rate.role());
        assertTrue(c.parameter("cracker").orElseThrow().isCategorical());
        assertEquals(Path.of("/lab/series/runs.csv"), c.runs());
        assertEquals("In", c.surface().deposit());
        // GaAs (001) monolayer a/2 = 0.28266 nm; Vurgaftman et al. 2001 a = 5.65325 A
        assertEquals(0.28266, c.surface().monolayerHeightNm(), 5e-6);
        assertEquals(1, c.limits().size());
        assertTrue(c.limitsHold(Map.of("anneal_temp", 300.0, "substrate_temp", 250.0)));
        assertFalse(c.limitsHold(Map.of("anneal_temp", 200.0, "substrate_temp", 250.0)));
    }

    @Test
    void aCampaignWithoutRolesOrTargetsIsValid() throws Exception {
        Campaign c = parse("campaign: plain\nmaterial: {substrate: InP}\nparameters:\n"
                + "  x: {unit: s, min: 1, max: 10}\noutcomes:\n  y: {unit: nm}\n");
        assertTrue(c.models().isEmpty());
        assertTrue(c.targets().isEmpty());
        assertEquals(Path.of("/lab/series/runs.csv"), c.runs());
    }

    @Test
    void unknownKeysGetADidYouMeanWithPosition() {
        Diagnostic d = only(MINIMAL + "targts:\n  mode: {is: islands}\n", "unknown top-level key 'targts'");
        assertTrue(d.message().contains("did you mean 'targets'"));
        assertEquals(8, d.line());
        assertEquals(1, d.column());
        Diagnostic k = only(MINIMAL.replace("min: 500", "mni: 500").replace("max: 640", "min: 500, max: 640"),
                "unknown parameter key 'mni'");
        assertTrue(k.message().contains("did you mean 'min'"), k.message());
        assertEquals(4, k.line());
    }

    @Test
    void reportsMinNotBelowMax() {
        Diagnostic d = only(MINIMAL.replace("min: 500, max: 640", "min: 640, max: 500"), "must be below max");
        assertEquals(4, d.line());
    }

    @Test
    void aBadBoxIsOneMessageEvenWhenALimitNamesTheSetting() {
        // one cause, one message: the limit must not add "unknown parameter 'temp'"
        Diagnostic d = only(MINIMAL.replace("min: 500, max: 640", "min: 640, max: 500")
                + "limits:\n  - temp >= 550\n", "must be below max");
        assertEquals(4, d.line());
    }

    @Test
    void aProductOfTwoSettingsInALimitSaysLimitsMustBeLinear() {
        Diagnostic d = only(MINIMAL + "limits:\n  - temp >= rate * temp\n", "limits must be linear");
        assertTrue(d.message().contains("'rate * temp' multiplies two settings"), d.message());
        assertEquals(9, d.line());
        assertEquals(5 + "temp >= rate * ".length(), d.column());
        only(MINIMAL + "limits:\n  - temp >= 2 * rate * 3\n", "limits must be linear");
    }

    @Test
    void reportsLogScaleWithNonPositiveMin() {
        only(MINIMAL.replace("min: 0.1, max: 1.0, scale: log", "min: 0, max: 1.0, scale: log"), "scale: log needs min > 0");
    }

    @Test
    void reportsTargetOnUndeclaredOutcome() {
        only(MINIMAL + "targets:\n  mood: {is: islands}\n", "not a declared outcome (did you mean 'mode'?)");
    }

    @Test
    void reportsTargetClassNotAmongClasses() {
        only(MINIMAL + "targets:\n  mode: {is: stepflow}\n", "'stepflow' is not a class of 'mode'");
    }

    @Test
    void reportsLimitOnUnknownParameterAtItsColumn() {
        Diagnostic d = only(MINIMAL + "limits:\n  - temp >= 5 * rat\n", "unknown parameter 'rat' (did you mean 'rate'?)");
        assertEquals(9, d.line());
        assertEquals(5 + "temp >= 5 * ".length(), d.column());
    }

    @Test
    void reportsALimitNoPointOfTheBoxSatisfies() {
        only(MINIMAL + "limits:\n  - temp >= 700\n", "no setting inside the parameter boxes satisfies");
    }

    @Test
    void reportsLimitsThatCannotHoldTogether() {
        // each alone is satisfiable in the box, together they are not
        only(MINIMAL + "limits:\n  - temp >= 600\n  - temp + 100 * rate <= 560\n", "cannot all hold at once");
    }

    @Test
    void reportsUnknownUnitsAndUnitsThatDoNotFitTheRole() {
        only(MINIMAL.replace("unit: degC", "unit: celsius"), "unit 'celsius' does not fit role quantity temperature");
        only(MINIMAL.replace("unit: um/h", "unit: Torr"), "does not fit role quantity deposition rate");
        only("campaign: t\nmaterial: {substrate: GaAs}\nparameters:\n  x: {unit: furlong, min: 1, max: 2}\n"
                + "outcomes:\n  y: {unit: nm}\n", "unknown unit 'furlong'");
    }

    @Test
    void reportsUnknownMaterialKeys() {
        only(MINIMAL.replace("substrate: GaAs", "substrate: GaAs, deposit: Gx"), "unknown deposit metal 'Gx'");
        only(MINIMAL.replace("substrate: GaAs", "substrate: GaN"), "unknown substrate 'GaN'");
        only(MINIMAL.replace("substrate: GaAs", "substrate: GaAs, group_v: N"), "unknown group-V element 'N'");
        only(MINIMAL.replace("substrate: GaAs", "substrate: GaAs, dopant: Si"), "unknown material key 'dopant'");
    }

    @Test
    void acceptsTernaryAlloySubstratesByVegardsLaw() throws Exception {
        Campaign c = parse(MINIMAL.replace("substrate: GaAs", "substrate: In0.3Ga0.7As"));
        // Vegard: 0.3 * 6.0583 + 0.7 * 5.65325 = 5.7748 A (Vurgaftman et al. 2001 binaries)
        assertEquals(0.57748 / 2, c.surface().monolayerHeightNm(), 1e-5);
    }

    @Test
    void collectsEveryProblemAtOnceInLineOrder() {
        String yaml = String.join("\n",
                "campaign: Bad Id",
                "material: {substrate: GaAs}",
                "parameters:",
                "  temp: {unit: degC, min: 700, max: 600}",
                "  bep: {unit: Torr, min: -1, max: 1, scale: log}",
                "outcomes:",
                "  dens: {unit: cm^-2, role: island_densty}",
                "");
        List<Diagnostic> ds = errors(yaml);
        assertEquals(4, ds.size(), ds.toString());
        assertEquals(List.of(1, 4, 5, 7), ds.stream().map(Diagnostic::line).toList());
        assertTrue(ds.get(3).message().contains("did you mean 'island_density'"), ds.get(3).message());
    }

    @Test
    void reportsDuplicateKeysWithTheFirstLine() {
        only(MINIMAL.replace("outcomes:", "  temp: {unit: K, min: 1, max: 2}\noutcomes:"),
                "duplicate parameter 'temp' (first at line 4)");
    }

    @Test
    void reportsYamlSyntaxErrorsWithPosition() {
        List<Diagnostic> ds = errors("campaign: x\nparameters: {a: [1, 2}\n");
        assertEquals(1, ds.size());
        assertTrue(ds.get(0).message().startsWith("not valid YAML"), ds.get(0).message());
        assertEquals(2, ds.get(0).line());
    }

    @Test
    void reportsReservedColumnNamesAndRoleMisuse() {
        only(MINIMAL.replace("  rate:", "  notes:"), "reserved run-log column");
        only(MINIMAL.replace("role: growth_mode", "role: substrate_temperature"), "unknown outcome role");
        only(MINIMAL.replace("classes: [step-flow, islands], role: growth_mode", "unit: nm, role: growth_mode"),
                "needs classes");
    }

    @Test
    void checksModelIdsWhenPluginsAreKnown() {
        InputException e = assertThrows(InputException.class, () -> CampaignReader.parse(FILE,
                new StringReader(MINIMAL + "models: [step-flw]\n"), Set.of("step-flow")));
        assertTrue(e.diagnostics().get(0).message().contains("did you mean 'step-flow'"));
    }

    @Test
    void missingFileIsAnInputErrorNotACrash() {
        InputException e = assertThrows(InputException.class,
                () -> CampaignReader.read(Path.of("/nonexistent/x.yaml"), null));
        assertTrue(e.getMessage().contains("not found"));
    }

    @Test
    void readsObjectivesWithOptionalWindows() throws Exception {
        String base = "campaign: t\nmaterial: {substrate: GaAs}\nparameters:\n  x: {unit: s, min: 1, max: 10}\n"
                + "outcomes:\n  y: {unit: nm}\n  z: {unit: nm}\n";
        Campaign c = parse(base + "targets:\n  y: {maximize: true, max: 50}\n  z: {min: 1}\n");
        Target t = c.target("y").orElseThrow();
        assertEquals(Target.Goal.MAXIMIZE, t.goal());
        assertTrue(t.isObjective() && t.hasWindow());
        assertEquals(Target.Goal.MINIMIZE, parse(base + "targets:\n  y: {minimize: true}\n").target("y").orElseThrow().goal());
        only(base + "targets:\n  y: {maximize: true}\n  z: {minimize: true}\n", "only one target may maximize or minimize");
        only(base + "targets:\n  y: {maximize: true, minimize: true}\n", "cannot both maximize and minimize");
        only(base + "targets:\n  y: {maximize: yes please}\n", "expects true or false");
        assertTrue(errors(base + "targets:\n  y: {maximise: true}\n").stream()
                .anyMatch(d -> d.message().contains("did you mean 'maximize'")));
    }
}
