package dev.terrace.models;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.contract.GrowthModelContractTest;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Contract cases plus golden values for {@link CriticalThicknessModel}. Each check value names its primary
 * source beside it and shows the arithmetic of any derived number.
 */
class CriticalThicknessModelTest extends GrowthModelContractTest {

    /** InAs deposited on GaAs(001): the GaAs surface (Vurgaftman et al. 2001 lattice constant), In and As. */
    static final Surface GAAS_INAS = IslandNucleationModelTest.GAAS_IN;

    private final CriticalThicknessModel model = new CriticalThicknessModel();
    private final ParameterValues defaults = ParameterValues.defaults(model.parameters());

    @Override
    protected GrowthModel model() {
        return new CriticalThicknessModel();
    }

    @Override
    protected Conditions typicalConditions() {
        // InAs dots: 500 °C, 0.05 ML/s, 2.0 ML (invented typical recipe, common-practice range)
        return conditions(773.15, 0.05, 2.0);
    }

    @Override
    protected Surface typicalSurface() {
        return GAAS_INAS;
    }

    private static Conditions conditions(double temperatureK, double rate, double coverage) {
        return Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, temperatureK).set(Role.DEPOSITION_RATE, rate)
                .set(Role.COVERAGE, coverage).build();
    }

    private double density(Conditions c, ParameterValues p) {
        Prediction pr = model.predict(c, GAAS_INAS, p);
        assertTrue(pr.validity().valid(), pr.validity().reason());
        return pr.value(Role.ISLAND_DENSITY).orElseThrow();
    }

    private double pDots(Conditions c) {
        return model.predict(c, GAAS_INAS, defaults).classProbabilities(Role.GROWTH_MODE)
                .get(CriticalThicknessModel.DOTS);
    }

    @Test
    void defaultOnsetLiesInThePublishedInAsWindow() {
        // 1.45 and 1.59 ML, Patella et al., arXiv cond-mat/0510353 (2005); 1.5-1.6 ML, Leonard, Pond, Petroff,
        // PRB 50, 11687 (1994) (from memory); the 1.4-1.8 ML window spans both
        double d = defaults.get(CriticalThicknessModel.CRITICAL_THICKNESS);
        assertEquals(1.59, d, 1e-12);
        assertTrue(d >= 1.4 && d <= 1.8);
        // the onset: P(dots) = 1/2 exactly at θc
        assertEquals(0.5, pDots(conditions(773.15, 0.05, d)), 1e-12);
    }

    @Test
    void densityRisesWithTheExcessCoverageByThePublishedExponent() {
        // N ∝ (θ − θc)^1.76, Leonard, Pond, Petroff, PRB 50, 11687 (1994) (from memory); at 0.4 and 0.8 ML past
        // θc (8 and 16 onset widths) the smoothing changes Δ by below 1e-3 relative, so the ratio is 2^1.76
        double n1 = density(conditions(773.15, 0.05, 1.59 + 0.4), defaults);
        double n2 = density(conditions(773.15, 0.05, 1.59 + 0.8), defaults);
        assertEquals(1.76, defaults.get(CriticalThicknessModel.ONSET_EXPONENT), 1e-12);
        assertEquals(Math.pow(2, 1.76), n2 / n1, 1e-3 * Math.pow(2, 1.76));
    }

    @Test
    void noIslandsBelowTheCriticalThickness() {
        Conditions wetting = conditions(773.15, 0.05, 1.2);
        Prediction p = model.predict(wetting, GAAS_INAS, defaults);
        assertTrue(p.validity().valid(), p.validity().reason());
        // 0.39 ML below θc (7.8 widths): P(dots) = logistic(−7.8) = 4.1e-4 (derived here)
        assertEquals(1 / (1 + Math.exp(7.8)), pDots(wetting), 1e-9);
        // far below any microscope's detection (1e8 cm^-2 is a typical AFM limit, common practice)
        assertTrue(p.value(Role.ISLAND_DENSITY).orElseThrow() < 1e6, p.toString());
        assertTrue(p.notes().get(0).startsWith("below the critical thickness"), p.notes().toString());
        // and the density never rises as the coverage falls
        assertTrue(density(conditions(773.15, 0.05, 1.0), defaults) <= density(wetting, defaults));
    }

    @Test
    void densityFollowsNucleationScalingInRateAndTemperature() {
        // far past the onset, N ∝ F^chi with chi = i/(i + 2.5) for 3D islands (Venables et al., Rep. Prog.
        // Phys. 47, 399 (1984)); default i = 3 gives chi = 3/5.5
        double slow = density(conditions(773.15, 0.02, 2.2), defaults);
        double fast = density(conditions(773.15, 0.2, 2.2), defaults);
        assertEquals(Math.pow(10, 3 / 5.5), fast / slow, 1e-9 * fast / slow);
        // hotter substrate, longer diffusion: fewer dots (Venables 1984 sign)
        assertTrue(density(conditions(803.15, 0.05, 2.2), defaults) < density(conditions(743.15, 0.05, 2.2), defaults));
    }

    @Test
    void defaultDensityIsInTheUsualInAsDotRange() {
        // one ML past the onset at 500 °C, 0.05 ML/s: a few 1e10 cm^-2 is the usual InAs/GaAs(001) dot density
        // (common practice); the 1e9-1e11 window is a test design choice
        double n = density(conditions(773.15, 0.05, 2.59), defaults);
        assertTrue(n > 1e9 && n < 1e11, "density " + n);
    }

    @Test
    void otherMaterialSystemsAreOutsideValidityWithAReason() {
        Surface gaOnGaAs = IslandNucleationModelTest.GAAS_GA;
        Prediction ga = model.predict(typicalConditions(), gaOnGaAs, defaults);
        assertFalse(ga.validity().valid());
        assertFalse(ga.validity().dependsOnParameters());
        assertTrue(ga.validity().reason().contains("InAs on GaAs(001)"), ga.validity().reason());
        assertTrue(ga.validity().reason().contains("InGaAs"), ga.validity().reason());
        assertTrue(ga.values().isEmpty());
        Prediction film = model.predict(typicalConditions(), IslandNucleationModelTest.GAAS_FILM, defaults);
        assertFalse(film.validity().valid());
        // InAs on InP: a = 5.8697 Å (Vurgaftman et al. 2001), h = a/2, N0 = 2/a²
        Surface inp = new Surface("InP", 0.293485, 5.8049e14, "In", 429.7485, 36.82, "As");
        assertFalse(model.predict(typicalConditions(), inp, defaults).validity().valid());
    }

    @Test
    void farPastTheOnsetIsFlaggedAsOutside() {
        Prediction p = model.predict(conditions(773.15, 0.05, 3.5), GAAS_INAS, defaults);
        assertFalse(p.validity().valid());
        assertTrue(p.validity().dependsOnParameters());
        assertTrue(p.validity().reason().contains("coalesce"), p.validity().reason());
    }

    @Test
    void messagesSpeakOfInAsNotOfDroplets() {
        Prediction p = model.predict(typicalConditions(), GAAS_INAS, defaults);
        StringBuilder all = new StringBuilder(String.join(" ", p.notes())).append(' ').append(model.description());
        model.parameters().forEach(q -> all.append(' ').append(q.source()).append(' ').append(q.description()));
        Prediction outside = model.predict(typicalConditions(), IslandNucleationModelTest.GAAS_GA, defaults);
        all.append(' ').append(outside.validity().reason());
        String text = all.toString();
        assertFalse(text.toLowerCase(java.util.Locale.ROOT).contains("droplet"), text);
        assertTrue(text.contains("InAs"), text);
    }

    @Test
    void smoothedExcessIsTheSoftplusAndStaysFinite() {
        // Δ = w·ln(1 + e^x): at x = 0, Δ = w·ln 2 (derived)
        assertEquals(Math.log(0.05 * Math.log(2)), CriticalThicknessModel.lnExcessMl(1.59, 1.59, 0.05), 1e-12);
        assertTrue(Double.isFinite(CriticalThicknessModel.lnExcessMl(0, 2.5, 0.01)));
        assertTrue(Double.isFinite(CriticalThicknessModel.lnExcessMl(100, 1.0, 0.01)));
        assertEquals(Math.log(1.0), CriticalThicknessModel.lnExcessMl(2.59, 1.59, 0.01), 1e-12);
    }
}
