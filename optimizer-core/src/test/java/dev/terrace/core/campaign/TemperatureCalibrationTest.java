package dev.terrace.core.campaign;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.Role;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class TemperatureCalibrationTest {

    static final String HEAD = String.join("\n",
            "campaign: cal-test",
            "material: {substrate: GaAs, deposit: Ga, group_v: As}",
            "parameters:",
            "  t_sub: {unit: degC, min: 150, max: 650, role: substrate_temperature}",
            "  t_cryst: {unit: degC, min: 150, max: 650, role: crystallization_temperature}",
            "  coverage: {unit: ML, min: 1, max: 5, role: coverage}",
            "outcomes:",
            "  density: {unit: cm^-2, scale: log, role: island_density}",
            "");

    static Campaign parse(String extra) throws InputException {
        return CampaignReader.parse(Path.of("/virtual/campaign.yaml"), new StringReader(HEAD + extra), null).campaign();
    }

    static List<Diagnostic> errors(String extra) {
        InputException e = assertThrows(InputException.class, () -> parse(extra));
        return e.diagnostics();
    }

    @Test
    void builtInReferenceValuesAreTheIts90FixedPoints() {
        // ITS-90 defining fixed points, Preston-Thomas, Metrologia 27, 3 (1990), Table 1:
        // Ga melting point 302.9146 K, In freezing point 429.7485 K, Sn 505.078 K, Al 933.473 K
        assertEquals(302.9146, ReferenceEvent.GALLIUM_MELTING.trueKelvin(), 1e-9);
        assertEquals(429.7485, ReferenceEvent.INDIUM_MELTING.trueKelvin(), 1e-9);
        assertEquals(505.078, ReferenceEvent.TIN_MELTING.trueKelvin(), 1e-9);
        assertEquals(933.473, ReferenceEvent.ALUMINIUM_MELTING.trueKelvin(), 1e-9);
        // same points in degrees Celsius (ITS-90 Table 1): 29.7646 and 156.5985 degC
        assertEquals(29.7646, ReferenceEvent.GALLIUM_MELTING.trueKelvin() - 273.15, 1e-9);
        assertEquals(156.5985, ReferenceEvent.INDIUM_MELTING.trueKelvin() - 273.15, 1e-9);
        // GaAs(001) native-oxide desorption about 580 degC (in situ spectroscopic ellipsometry, MRS Online
        // Proceedings Library, "GaAs(100) surface modifications at elevated temperatures"); common practice
        // 580-620 degC under As: 620 degC must lie within two standard uncertainties
        assertEquals(580, ReferenceEvent.GAAS_OXIDE_DESORPTION.trueKelvin() - 273.15, 1e-9);
        assertTrue(620 - 580 <= 2 * ReferenceEvent.GAAS_OXIDE_DESORPTION.uncertaintyK());
        for (ReferenceEvent e : ReferenceEvent.values()) {
            assertFalse(e.source().isBlank(), e.key());
        }
    }

    @Test
    void offsetIsTheInverseVarianceMeanWithBirgeScaling() {
        // worked example, by hand: In melt read 150.0 degC (u 2 K), oxide desorption read 565 degC (u 2 K)
        //   d1 = 156.5985 - 150 = 6.5985 K, var1 = 2^2 + 0 = 4       -> w1 = 0.25
        //   d2 = 580 - 565 = 15 K,          var2 = 2^2 + 20^2 = 404  -> w2 = 1/404 = 0.00247525
        //   mean = (0.25*6.5985 + 15/404)/(0.25 + 1/404) = 6.680875 K; internal u = 1/sqrt(0.25247525) = 1.990172 K
        //   chi2 = 0.25*(6.5985-6.680875)^2 + (15-6.680875)^2/404 = 0.172998; Birge R = sqrt(chi2/1) = 0.4159 < 1
        var p1 = CalibrationPoint.of(ReferenceEvent.INDIUM_MELTING, 150 + 273.15, 2, SourcePosition.UNKNOWN);
        var p2 = CalibrationPoint.of(ReferenceEvent.GAAS_OXIDE_DESORPTION, 565 + 273.15, 2, SourcePosition.UNKNOWN);
        TemperatureOffset t = TemperatureCalibration.estimate(List.of(p1, p2));
        assertEquals(6.680875, t.offsetK(), 1e-5);
        assertEquals(1.990172, t.internalK(), 1e-5);
        assertEquals(0.41593, t.birgeRatio(), 1e-4);
        assertEquals(t.internalK(), t.uncertaintyK(), 1e-12, "points agree within their uncertainties: no scaling");
        assertEquals(2, t.pointsUsed());
    }

    @Test
    void pointsThatDisagreeWidenTheUncertaintyByTheBirgeRatio() {
        // two fixed points 10 K apart in offset with 1 K each: mean 5 K, internal 1/sqrt(2) = 0.7071 K,
        // chi2 = 2 * 5^2 = 50, R = sqrt(50) = 7.071, so u = 0.7071 * 7.071 = 5.0 K (by hand)
        var a = CalibrationPoint.of(ReferenceEvent.GALLIUM_MELTING, 302.9146 - 0, 1, SourcePosition.UNKNOWN);
        var b = CalibrationPoint.of(ReferenceEvent.INDIUM_MELTING, 429.7485 - 10, 1, SourcePosition.UNKNOWN);
        TemperatureOffset t = TemperatureCalibration.estimate(List.of(a, b));
        assertEquals(5, t.offsetK(), 1e-9);
        assertEquals(5, t.uncertaintyK(), 1e-9);
    }

    @Test
    void readsBuiltInAndCustomPointsAndAppliesTheOffsetToHolderTemperatures() throws Exception {
        Campaign c = parse(String.join("\n",
                "temperature_calibration:",
                "  fit_offset: true",
                "  points:",
                "    - {event: indium_melting, reading: 146.5985 degC, reading_uncertainty: 1 K}",
                "    - event: c4x4_to_2x4",
                "      reading: 480 degC",
                "      true: 490 degC",
                "      uncertainty: 1 K",
                "      source: own calibration wafer (invented example)",
                ""));
        TemperatureCalibration cal = c.temperatureCalibration();
        assertTrue(cal.fitOffset());
        assertEquals(2, cal.points().size());
        assertTrue(cal.points().get(0).builtIn());
        assertFalse(cal.points().get(1).builtIn());
        assertEquals(10, cal.estimate().offsetK(), 1e-9);
        Conditions cond = RecipeConverter.conditions(c, Map.of("t_sub", 500.0, "t_cryst", 300.0, "coverage", 2.0),
                Map.of());
        assertEquals(500 + 273.15 + 10, cond.value(Role.SUBSTRATE_TEMPERATURE).getAsDouble(), 1e-9);
        assertEquals(300 + 273.15 + 10, cond.value(Role.CRYSTALLIZATION_TEMPERATURE).getAsDouble(), 1e-9);
        assertEquals(2.0, cond.value(Role.COVERAGE).getAsDouble(), 1e-12, "other settings untouched");
    }

    @Test
    void withoutCalibrationReadingsPassUnchanged() throws Exception {
        Campaign c = parse("");
        assertEquals(0, c.temperatureOffsetK());
        Conditions cond = RecipeConverter.conditions(c, Map.of("t_sub", 500.0), Map.of());
        assertEquals(773.15, cond.value(Role.SUBSTRATE_TEMPERATURE).getAsDouble(), 1e-9);
    }

    @Test
    void customEventWithoutItsTrueValueIsOnePositionedError() {
        List<Diagnostic> d = errors(String.join("\n",
                "temperature_calibration:",
                "  points:",
                "    - {event: indium_meltng, reading: 150 degC}",
                ""));
        assertEquals(1, d.size(), d.toString());
        assertEquals(11, d.get(0).line());
        assertEquals(15, d.get(0).column());
        assertTrue(d.get(0).message().contains("did you mean the built-in 'indium_melting'"), d.get(0).message());
        assertTrue(d.get(0).message().contains("true, uncertainty, source"), d.get(0).message());
    }

    @Test
    void builtInEventRefusesItsOwnTrueValue() {
        List<Diagnostic> d = errors(String.join("\n",
                "temperature_calibration:",
                "  points:",
                "    - {event: gallium_melting, reading: 25 degC, true: 30 degC}",
                ""));
        assertEquals(1, d.size(), d.toString());
        assertEquals(11, d.get(0).line());
        assertTrue(d.get(0).message().contains("'true' is built in for gallium_melting (29.7646 degC"), d.get(0).message());
    }

    @Test
    void badReadingsAndKeysArePositioned() {
        List<Diagnostic> d = errors(String.join("\n",
                "temperature_calibration:",
                "  fit_ofset: true",
                "  points:",
                "    - {event: indium_melting, reading: 150 Torr}",
                "    - {event: tin_melting, reading: 230}",
                "    - {event: tin_melting, reading: 230 degC, reading_uncertainty: -1 K}",
                ""));
        assertEquals(4, d.size(), d.toString());
        assertEquals(10, d.get(0).line());
        assertTrue(d.get(0).message().contains("did you mean 'fit_offset'"), d.get(0).message());
        assertEquals(12, d.get(1).line());
        assertTrue(d.get(1).message().contains("not a temperature unit"), d.get(1).message());
        assertEquals(13, d.get(2).line());
        assertTrue(d.get(2).message().contains("with its unit"), d.get(2).message());
        assertEquals(14, d.get(3).line());
        assertTrue(d.get(3).message().contains("reading_uncertainty"), d.get(3).message());
    }

    @Test
    void fitOffsetNeedsPoints() {
        List<Diagnostic> d = errors("temperature_calibration: {fit_offset: true}\n");
        assertEquals(1, d.size(), d.toString());
        assertTrue(d.get(0).message().contains("needs points"), d.get(0).message());
    }

    @Test
    void priorsResolveAgainstTheCampaignFolderAndAMissingFileIsPositioned(@TempDir Path dir) throws Exception {
        Path spring = Files.createDirectories(dir.resolve("spring-series")).resolve("campaign.yaml");
        Files.writeString(spring, "campaign: spring\n");
        Path here = Files.createDirectories(dir.resolve("autumn")).resolve("campaign.yaml");
        Campaign c = CampaignReader.parse(here, new StringReader(HEAD + "priors: [../spring-series/campaign.yaml]\n"),
                null).campaign();
        assertEquals(spring.toAbsolutePath().normalize(), c.priors().get(0).file());
        InputException e = assertThrows(InputException.class, () -> CampaignReader.parse(here,
                new StringReader(HEAD + "priors: [../spring-series/campaign.yaml, ../winter/campaign.yaml]\n"), null));
        assertEquals(1, e.diagnostics().size(), e.diagnostics().toString());
        Diagnostic d = e.diagnostics().get(0);
        assertEquals(9, d.line());
        assertEquals(42, d.column());
        assertTrue(d.message().contains("prior campaign file not found") && d.message().contains("winter"), d.message());
    }
}
