package dev.terrace.models;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Role;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Limiting cases of the saturating surfactant form {@code E_d,eff = E_d + shift·min(θ_s/1 ML, 1)}
 * (NucleationLaw; saturation at one floating layer after Copel et al., PRL 63, 632 (1989), from memory;
 * either sign after Massies and Grandjean, PRB 48, 8502 (1993)).
 */
class SurfactantFormTest {

    private static final double KB = NucleationLaw.BOLTZMANN_EV_PER_K;

    private static NucleationLaw law(double shiftEv) {
        return new NucleationLaw(0.7, 1e13, 1, 0, 0.25, shiftEv, NucleationLaw.ALPHA_2D);
    }

    @Test
    void zeroCoverageChangesNothing() {
        assertEquals(0.7, law(0.3).rawEffectiveBarrierEv(0.0), 0.0);
        assertEquals(0.0, NucleationLaw.surfactantFraction(0.0), 0.0);
    }

    @Test
    void aFullLayerOrMoreGivesTheWholeShift() {
        assertEquals(0.7 + 0.2, law(0.2).rawEffectiveBarrierEv(1.0), 1e-15);
        assertEquals(0.7 + 0.2, law(0.2).rawEffectiveBarrierEv(2.5), 1e-15);
        assertEquals(0.7 - 0.2, law(-0.2).rawEffectiveBarrierEv(4.0), 1e-15);
    }

    @Test
    void belowAFullLayerTheShiftIsProportional() {
        assertEquals(0.7 + 0.05, law(0.2).rawEffectiveBarrierEv(0.25), 1e-15);
    }

    @Test
    void signDecidesWhetherDensityRisesOrFalls() {
        // positive shift: slower adatoms, more islands by exp(chi·ΔE/kT) with chi = 1/3 (Venables 1984)
        IslandNucleationModel m = new IslandNucleationModel();
        ParameterValues p = ParameterValues.defaults(m.parameters()).with(NucleationLaw.CRITICAL_SIZE, 1)
                .with(IslandNucleationModel.ISLAND_DIMENSION, 2);
        Conditions none = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 500).set(Role.DEPOSITION_RATE, 0.1)
                .build();
        Conditions full = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 500).set(Role.DEPOSITION_RATE, 0.1)
                .set(Role.SURFACTANT_COVERAGE, 3.0).build();
        double plain = m.predict(none, IslandNucleationModelTest.GAAS_FILM, p).value(Role.ISLAND_DENSITY).orElseThrow();
        double up = m.predict(full, IslandNucleationModelTest.GAAS_FILM, p.with(NucleationLaw.SURFACTANT_SHIFT, 0.1))
                .value(Role.ISLAND_DENSITY).orElseThrow();
        double down = m.predict(full, IslandNucleationModelTest.GAAS_FILM, p.with(NucleationLaw.SURFACTANT_SHIFT, -0.1))
                .value(Role.ISLAND_DENSITY).orElseThrow();
        assertEquals(Math.exp(0.1 / (3 * KB * 500)), up / plain, 1e-9);
        assertEquals(Math.exp(-0.1 / (3 * KB * 500)), down / plain, 1e-9);
    }

    @Test
    void stepFlowTransitionMovesByTheSaturatedShift() {
        // T* = E/(k_B·rhs) with E = chi·E_d,eff (i = 1, E_1 = 0): T* scales with the effective barrier
        // (StepFlowModel.transitionTemperature); 3 ML of surfactant acts as 1 ML
        ParameterValues p = ParameterValues.defaults(new StepFlowModel().parameters());
        var g = IslandNucleationModelTest.GAAS_FILM;
        double t0 = StepFlowModel.transitionTemperature(0.5, 1.0, 0.0, g, p).temperatureK();
        double tDown = StepFlowModel.transitionTemperature(0.5, 1.0, 3.0, g,
                p.with(NucleationLaw.SURFACTANT_SHIFT, -0.1)).temperatureK();
        double tOne = StepFlowModel.transitionTemperature(0.5, 1.0, 1.0, g,
                p.with(NucleationLaw.SURFACTANT_SHIFT, -0.1)).temperatureK();
        assertEquals(t0 * 0.6 / 0.7, tDown, 1e-9 * t0);
        assertEquals(tOne, tDown, 0.0);
        assertTrue(tDown < t0, "a negative shift favours step flow at lower temperature");
    }

    @Test
    void parameterIsNamedInEvWithAFreeSign() {
        var q = NucleationLaw.parameters().stream().filter(x -> x.name().equals("surfactant_shift")).findFirst()
                .orElseThrow();
        assertEquals("eV", q.unit());
        assertTrue(q.min() < 0 && q.max() > 0);
        assertEquals(0.0, q.defaultValue(), 0.0);
    }
}
