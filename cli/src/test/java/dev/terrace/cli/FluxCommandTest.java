package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

import java.io.PrintWriter;
import java.io.StringWriter;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class FluxCommandTest {

    /** Output of one in-process run. */
    private record Run(int exitCode, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = new CommandLine(new FluxCommand());
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    @Test
    void ratioPrintsTheReferenceV3RatioWithFormulaAndUncertainty() {
        // BEP-to-flux conversion J_a/J_b = (P_a/P_b)(eta_b/eta_a) sqrt(T_a M_b/(T_b M_a)) (ion gauge reads
        // density; kinetic theory), eta by the electron-count rule 0.6 Z/14 + 0.4 (the form closer to the
        // measured sensitivities of Summers, NASA TN D-5285 (1969); see IonGaugeTest): P_As4/P_Ga = 20,
        // T_As = 600 K, T_Ga = 1200 K gives 20 * (1.728571/6.057143) * sqrt(600 * 69.723/(1200 * 299.686))
        // = 1.94666 As4 molecules and 4 * 1.94666 = 7.78663 As atoms per Ga atom (printed 1.947 and 7.79).
        Run r = run("ratio", "--group-v", "As4", "--bep-v", "1.0e-5", "--group-iii", "Ga", "--bep-iii", "5.0e-7",
                "--t-v", "600", "--t-iii", "1200");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("1.947"), r.out());
        assertTrue(r.out().contains("V/III atom ratio = 7.79"), r.out());
        assertTrue(r.out().contains("sqrt(T_a*M_b/(T_b*M_a))"), r.out());
        assertTrue(r.out().contains("about ±30 % unless your gauge is calibrated for these species"), r.out());
        assertTrue(r.out().contains("on GaAs(001)"), "GaAs is inferred from Ga + As4: " + r.out());
    }

    @Test
    void ratioJsonCarriesTheSameNumbers() throws Exception {
        Run r = run("ratio", "--group-v", "As4", "--bep-v", "1.0e-5", "--group-iii", "Ga", "--bep-iii", "5.0e-7",
                "--format", "json");
        assertEquals(0, r.exitCode(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        // Defaults As4 600 K and Ga 1200 K are the case above: 1.94666 molecules, 7.78663 atoms per Ga.
        assertEquals(7.78663, j.get("atomRatio").asDouble(), 1e-5 * 7.78663);
        assertEquals(1.94666, j.get("moleculeRatio").asDouble(), 1e-5 * 1.94666);
        assertEquals(0.30, j.get("relativeUncertainty").asDouble(), 0.0);
        assertTrue(j.get("groupV").get("temperatureDefaulted").asBoolean());
        assertEquals(600.0, j.get("groupV").get("sourceTemperatureK").asDouble(), 0.0);
        // 1e-5 Torr As4 at 600 K on GaAs(001): n = 1.333224e-3 Pa/(6.057143 * 1.380649e-23 J/K * 300 K)
        // = 5.31411e16 m^-3; v = sqrt(8 k 600 K/(pi * 299.686 u)) = 205.887 m/s; 4 n v = 4.37643e15 As
        // atoms cm^-2 s^-1; / (2/a^2 = 6.25797e14 cm^-2, a = 0.565325 nm, Vurgaftman et al., J. Appl.
        // Phys. 89, 5815 (2001)) = 6.99337 per site per second.
        assertEquals(6.99337, j.get("absolute").get("groupVAtomsPerSitePerS").asDouble(), 1e-5 * 6.99337);
    }

    @Test
    void pressureUnitChangesAbsoluteFluxButNotTheRatio() throws Exception {
        Run torr = run("ratio", "--group-v", "As2", "--bep-v", "4e-6", "--group-iii", "In", "--bep-iii", "2e-7",
                "--format", "json");
        Run pa = run("ratio", "--group-v", "As2", "--bep-v", "4e-6", "--group-iii", "In", "--bep-iii", "2e-7",
                "--unit", "Pa", "--format", "json");
        assertEquals(0, torr.exitCode(), torr.err());
        assertEquals(0, pa.exitCode(), pa.err());
        ObjectMapper m = new ObjectMapper();
        JsonNode jt = m.readTree(torr.out());
        JsonNode jp = m.readTree(pa.out());
        assertEquals(jt.get("atomRatio").asDouble(), jp.get("atomRatio").asDouble(), 1e-12);
        // 1 Torr = 101325/760 Pa exactly.
        assertEquals(101325.0 / 760.0, jt.get("absolute").get("groupVAtomsPerCm2PerS").asDouble()
                / jp.get("absolute").get("groupVAtomsPerCm2PerS").asDouble(), 1e-9);
    }

    @Test
    void rheedPeriodGivesTheReferenceGrowthRate() {
        // One RHEED period = 1 ML = a/2 (Harris, Joyce, Dobson, Surf. Sci. 103, L90 (1981); from memory),
        // a(GaAs) = 0.565325 nm (Vurgaftman et al., J. Appl. Phys. 89, 5815 (2001)): 1/1.25 s = 0.8 ML/s;
        // 0.8 * 0.2826625 nm = 0.22613 nm/s; * 3.6 = 0.81407 um/h; 0.8 * 2/a^2 = 0.8 * 6.25797e14
        // = 5.00638e14 cm^-2 s^-1.
        Run r = run("rheed", "--period", "1.25");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("0.8000 ML/s = 0.2261 nm/s = 0.8141 um/h"), r.out());
        assertTrue(r.out().contains("5.0064e+14"), r.out());
        assertTrue(r.out().contains("1/T_osc"), r.out());
    }

    @Test
    void rheedCountedPeriodsOverASpanOnInAs() throws Exception {
        // a(InAs) = 0.60583 nm (Vurgaftman et al., J. Appl. Phys. 89, 5815 (2001)): 8 periods in 8.0 s is
        // 1 ML/s = a/2 = 0.302915 nm/s = 0.302915 * 3.6 = 1.090494 um/h.
        Run r = run("rheed", "--periods", "8", "--span", "8.0", "--material", "InAs", "--format", "json");
        assertEquals(0, r.exitCode(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertEquals(1.0, j.get("mlPerS").asDouble(), 1e-12);
        assertEquals(0.302915, j.get("nmPerS").asDouble(), 1e-9);
        assertEquals(1.090494, j.get("umPerH").asDouble(), 1e-6);
        assertEquals("InAs", j.get("material").asText());
    }

    @Test
    void unknownSpeciesExitsWithTwoAndListsTheValidNames() {
        Run r = run("ratio", "--group-v", "As5", "--bep-v", "1e-5", "--group-iii", "Ga", "--bep-iii", "5e-7");
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("unknown beam species 'As5'"), r.err());
        assertTrue(r.err().contains("As, As2, As4, Sb, Sb2, Sb4, P2, P4, Ga, In, Al"), r.err());
        assertFalse(r.out().contains("V/III"));
    }

    @Test
    void swappedGroupsExitWithTwo() {
        Run r = run("ratio", "--group-v", "Ga", "--bep-v", "1e-5", "--group-iii", "As4", "--bep-iii", "5e-7");
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("group-III species"), r.err());
    }

    @Test
    void nonPositivePressureExitsWithTwo() {
        Run zero = run("ratio", "--group-v", "As4", "--bep-v", "0", "--group-iii", "Ga", "--bep-iii", "5e-7");
        assertEquals(2, zero.exitCode());
        assertTrue(zero.err().contains("--bep-v"), zero.err());
        Run negative = run("ratio", "--group-v", "As4", "--bep-v", "1e-5", "--group-iii", "Ga", "--bep-iii", "-5e-7");
        assertEquals(2, negative.exitCode());
        assertTrue(negative.err().contains("--bep-iii"), negative.err());
        Run nan = run("ratio", "--group-v", "As4", "--bep-v", "NaN", "--group-iii", "Ga", "--bep-iii", "5e-7");
        assertEquals(2, nan.exitCode());
        // A ratio too large for a double must be refused, never printed as Infinity.
        Run overflow = run("ratio", "--group-v", "As4", "--bep-v", "1e300", "--group-iii", "Ga", "--bep-iii", "1e-300");
        assertEquals(2, overflow.exitCode(), overflow.out());
        assertFalse(overflow.out().contains("Infinity"));
        assertEquals(2, run("ratio", "--group-v", "As4", "--bep-v", "1e307", "--group-iii", "Ga", "--bep-iii", "1e-7")
                .exitCode(), "1e307 Torr overflows on conversion to Pa");
    }

    @Test
    void unknownUnitAndMaterialExitWithTwo() {
        Run unit = run("ratio", "--group-v", "As4", "--bep-v", "1e-5", "--group-iii", "Ga", "--bep-iii", "5e-7",
                "--unit", "psi");
        assertEquals(2, unit.exitCode());
        assertTrue(unit.err().contains("Torr"), unit.err());
        Run material = run("rheed", "--period", "1.25", "--material", "GaN");
        assertEquals(2, material.exitCode());
        assertTrue(material.err().contains("unknown material 'GaN'"), material.err());
    }

    @Test
    void rheedNeedsExactlyOneWayOfGivingThePeriod() {
        assertEquals(2, run("rheed").exitCode());
        assertEquals(2, run("rheed", "--periods", "5").exitCode());
        assertEquals(2, run("rheed", "--period", "1.2", "--periods", "5", "--span", "6").exitCode());
        assertEquals(2, run("rheed", "--periods", "0", "--span", "6").exitCode());
        assertEquals(2, run("rheed", "--period", "-1").exitCode());
        // 1/1e-320 overflows a double: refused rather than printed as Infinity.
        assertEquals(2, run("rheed", "--period", "1e-320").exitCode());
    }

    @Test
    void missingSubcommandExitsWithTwoAndHelpExitsWithZero() {
        Run none = run();
        assertEquals(2, none.exitCode());
        assertTrue(none.err().contains("ratio"), none.err());
        Run help = run("--help");
        assertEquals(0, help.exitCode());
        assertTrue(help.out().contains("rheed"), help.out());
        assertEquals(0, run("ratio", "--help").exitCode());
    }
}
