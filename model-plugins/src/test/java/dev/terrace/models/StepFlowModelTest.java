package dev.terrace.models;

import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.contract.GrowthModelContractTest;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Contract cases plus golden values for {@link StepFlowModel}. Each check value names its primary source beside
 * it and shows the arithmetic of any derived number. The step-flow criterion is that of Burton, Cabrera, Frank,
 * Phil. Trans. R. Soc. A 243, 299 (1951) (volume and page from memory): step flow when adatoms reach a step
 * before they meet each other, i.e. the nucleation length exceeds the terrace width.
 */
class StepFlowModelTest extends GrowthModelContractTest {

    private static final Surface GAAS = IslandNucleationModelTest.GAAS_FILM;
    private static final double KB = NucleationLaw.BOLTZMANN_EV_PER_K;

    private final StepFlowModel model = new StepFlowModel();
    private final ParameterValues defaults = ParameterValues.defaults(model.parameters());

    @Override
    protected GrowthModel model() {
        return new StepFlowModel();
    }

    @Override
    protected Conditions typicalConditions() {
        // GaAs homoepitaxy at 580 °C, 0.5 ML/s, 2° miscut (invented typical recipe, common-practice range).
        return conditions(853.15, 0.5, 2.0);
    }

    @Override
    protected Surface typicalSurface() {
        return GAAS;
    }

    private static Conditions conditions(double t, double rate, double miscut) {
        return Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, t).set(Role.DEPOSITION_RATE, rate)
                .set(Role.MISCUT_ANGLE, miscut).build();
    }

    private double stepFlowProbability(Conditions c, ParameterValues p) {
        Prediction pr = model.predict(c, GAAS, p);
        return pr.classProbabilities(Role.GROWTH_MODE).get(StepFlowModel.STEP_FLOW);
    }

    /** Temperature at which D/F equals the given ratio for E_d = 0.7 eV, nu0 = 1e13 Hz, F = 1 ML/s. */
    private static double temperatureForHopRatio(double ratio) {
        return 0.7 / (KB * Math.log(1e13 / 4 / ratio));
    }

    @Test
    void terraceWidthsOnGaAs001MatchGoldenValues() {
        // w = h/tan(α) for monolayer steps of height h = a/2 = 0.282663 nm (a = 5.65325 A, Vurgaftman et al.,
        // J. Appl. Phys. 89, 5815 (2001)): 0.1° 0.282663/1.745331e-3 = 161.9538 nm; 0.5° /8.726867e-3 = 32.38997;
        // 1° /1.745506e-2 = 16.19375; 2° /3.492077e-2 = 8.094409; 4° /6.992681e-2 = 4.042269 nm.
        double h = GAAS.monolayerHeightNm();
        assertEquals(161.9538, StepFlowModel.terraceWidthNm(0.1, h).orElseThrow(), 1e-6 * 161.95);
        assertEquals(32.38997, StepFlowModel.terraceWidthNm(0.5, h).orElseThrow(), 1e-6 * 32.39);
        assertEquals(16.19375, StepFlowModel.terraceWidthNm(1.0, h).orElseThrow(), 1e-6 * 16.19);
        assertEquals(8.094409, StepFlowModel.terraceWidthNm(2.0, h).orElseThrow(), 1e-6 * 8.09);
        assertEquals(4.042269, StepFlowModel.terraceWidthNm(-4.0, h).orElseThrow(), 1e-6 * 4.04);
        assertTrue(StepFlowModel.terraceWidthNm(0.0, h).isEmpty());
        assertThrows(IllegalArgumentException.class, () -> StepFlowModel.terraceWidthNm(90, h));
    }

    @Test
    void nucleationLengthsMatchGoldenValues() {
        // l = N^(-1/2) with N = eta N0 (F/D)^(1/3) (i = 1, 2D islands; Venables, Spiller, Hanbuecken, Rep. Prog.
        // Phys. 47, 399 (1984); eta = 0.25, Bales & Chrzan, Phys. Rev. B 50, 6057 (1994), value from memory),
        // N0 = 6.258e14 cm^-2: D/F = 1e6 -> N = 1.5645e12 cm^-2, l = 1e7/sqrt(N) = 7.994885 nm; 1e8 -> 17.22446 nm;
        // 1e9 -> 25.28205 nm.
        NucleationLaw law = NucleationLaw.from(defaults, NucleationLaw.ALPHA_2D);
        double[] ratios = {1e6, 1e8, 1e9};
        double[] expected = {7.994885, 17.22446, 25.28205};
        for (int k = 0; k < 3; k++) {
            double l = StepFlowModel.nucleationLengthNm(law, 1.0, temperatureForHopRatio(ratios[k]), 0,
                    GAAS.sitesPerCm2());
            assertEquals(expected[k], l, 1e-6 * expected[k], "l at D/F = " + ratios[k]);
        }
    }

    @Test
    void oneDegreeMiscutAtHopRatio1e8IsJustAtTheTransition() {
        // l = 17.22 nm against w(1°) = 16.19 nm: just above the transition (BCF criterion l = w)
        double t = temperatureForHopRatio(1e8);
        double p = stepFlowProbability(conditions(t, 1.0, 1.0), defaults);
        assertTrue(p > 0.5 && p < 0.6, "P(step-flow) = " + p);
        StepFlowModel.Onset onset = StepFlowModel.transitionTemperature(1.0, 1.0, 0, GAAS, defaults);
        assertEquals(StepFlowModel.Onset.Status.FOUND, onset.status());
        // l grows only as exp(-E_d/(6kT)), so l/w = 1.064 at T puts T* about 30 K lower. Closed form: l = w gives
        // D/F = (w^2 eta N0)^3 = ((16.19375e-7 cm)^2 * 0.25 * 6.258e14)^3 = 6.703e7, and with D = (nu0/4) exp(-E_d/kT),
        // T* = E_d / (k ln(nu0/4 / (F (w^2 eta N0)^3))) = 0.7 / (8.617333262e-5 * ln(2.5e12 / 6.703e7)) = 773.866 K
        // (against T = 802.158 K for D/F = 1e8).
        assertEquals(802.158, t, 1e-3);
        assertEquals(773.866, onset.temperatureK(), 1e-3, "T* by the closed form");
    }

    @Test
    void transitionTemperatureMakesNucleationLengthEqualTerraceWidth() {
        NucleationLaw law = NucleationLaw.from(defaults, NucleationLaw.ALPHA_2D);
        for (double miscut : new double[] {0.5, 1, 2, 4}) {
            StepFlowModel.Onset onset = StepFlowModel.transitionTemperature(0.3, miscut, 0, GAAS, defaults);
            assertEquals(StepFlowModel.Onset.Status.FOUND, onset.status(), "miscut " + miscut);
            double l = StepFlowModel.nucleationLengthNm(law, 0.3, onset.temperatureK(), 0, GAAS.sitesPerCm2());
            double w = StepFlowModel.terraceWidthNm(miscut, GAAS.monolayerHeightNm()).orElseThrow();
            assertEquals(w, l, w * 1e-9, "l(T*) = w for miscut " + miscut);
            double p = stepFlowProbability(conditions(onset.temperatureK(), 0.3, miscut), defaults);
            assertEquals(0.5, p, 1e-9, "P(step-flow) = 1/2 at T*");
            assertTrue(onset.note().startsWith("step flow needs at least "), onset.note());
        }
    }

    @Test
    void largerMiscutOrLowerRateLowersTransitionTemperature() {
        // Shitara et al., PRB 46, 6815 (1992): larger miscut or lower Ga flux moves the transition down (qualitative)
        double t1 = StepFlowModel.transitionTemperature(0.5, 1.0, 0, GAAS, defaults).temperatureK();
        double t2 = StepFlowModel.transitionTemperature(0.5, 2.0, 0, GAAS, defaults).temperatureK();
        double t3 = StepFlowModel.transitionTemperature(0.5, 3.0, 0, GAAS, defaults).temperatureK();
        assertTrue(t2 < t1 && t3 < t2, "miscut 1°, 2°, 3°: " + t1 + ", " + t2 + ", " + t3);
        double slow = StepFlowModel.transitionTemperature(0.1, 2.0, 0, GAAS, defaults).temperatureK();
        assertTrue(slow < t2, "lower rate: " + slow + " against " + t2);
        // Exact values by the closed form of oneDegreeMiscutAtHopRatio1e8IsJustAtTheTransition,
        // T* = E_d / (k ln(nu0/4 / (F (w^2 eta N0)^3))), w = h/tan(miscut):
        // F = 0.5 ML/s: 1° 725.930 K, 2° 529.171 K, 3° 456.702 K; F = 0.1 ML/s, 2°: 478.956 K.
        assertEquals(725.930, t1, 1e-3);
        assertEquals(529.171, t2, 1e-3);
        assertEquals(456.702, t3, 1e-3);
        assertEquals(478.956, slow, 1e-3);
    }

    @Test
    void stepFlowProbabilityRisesWithTemperature() {
        // BCF: hotter adatoms travel farther, so step flow wins at high T (Burton, Cabrera, Frank 1951)
        double previous = -1;
        for (double t = 500; t <= 1000; t += 10) {
            double p = stepFlowProbability(conditions(t, 0.5, 2.0), defaults);
            assertTrue(p >= previous, "P(step-flow) fell at " + t + " K");
            previous = p;
        }
        assertTrue(previous > 0.9);
    }

    @Test
    void flatSurfaceGivesIslandsWithProbabilityOne() {
        Prediction p = model.predict(conditions(900, 0.5, 0.0), GAAS, defaults);
        Map<String, Double> probs = p.classProbabilities(Role.GROWTH_MODE);
        assertEquals(0.0, probs.get(StepFlowModel.STEP_FLOW), 0.0);
        assertEquals(1.0, probs.get(StepFlowModel.ISLANDS), 0.0);
        assertEquals(StepFlowModel.Onset.Status.NEVER,
                StepFlowModel.transitionTemperature(0.5, 0, 0, GAAS, defaults).status());
    }

    @Test
    void onsetOutsideSearchRangeIsReported() {
        // 6° miscut (w = 2.69 nm), 0.01 ML/s, E_d = 0.3 eV: l = w at about 135 K, below the 200 K search range
        StepFlowModel.Onset low = StepFlowModel.transitionTemperature(0.01, 6, 0, GAAS,
                defaults.with(NucleationLaw.DIFFUSION_BARRIER, 0.3));
        assertEquals(StepFlowModel.Onset.Status.BELOW_RANGE, low.status());
        assertEquals(StepFlowModel.SEARCH_LOW_K, low.temperatureK());
        // 1° miscut, 5 ML/s, E_d = 1.8 eV: l = w only at about 2300 K, above the 1200 K range
        StepFlowModel.Onset high = StepFlowModel.transitionTemperature(5, 1.0, 0, GAAS,
                defaults.with(NucleationLaw.DIFFUSION_BARRIER, 1.8));
        assertEquals(StepFlowModel.Onset.Status.ABOVE_RANGE, high.status());
        assertTrue(high.note().contains("expect islands"), high.note());
        // 0.1° miscut (w = 162 nm) at 5 ML/s would need D above nu0/4: no temperature is enough
        StepFlowModel.Onset never = StepFlowModel.transitionTemperature(5, 0.1, 0, GAAS, defaults);
        assertEquals(StepFlowModel.Onset.Status.NEVER, never.status());
        assertTrue(never.note().contains("never reaches"), never.note());
    }

    @Test
    void predictionCarriesTheTransitionNote() {
        Prediction p = model.predict(typicalConditions(), GAAS, defaults);
        assertTrue(p.notes().stream().anyMatch(n -> n.startsWith("step flow needs at least ")), p.notes().toString());
    }

    @Test
    void zeroSurfactantShiftLeavesPredictionUnchanged() {
        Conditions with = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 853.15).set(Role.DEPOSITION_RATE, 0.5)
                .set(Role.MISCUT_ANGLE, 2.0).set(Role.SURFACTANT_COVERAGE, 1.0).build();
        assertEquals(model.predict(typicalConditions(), GAAS, defaults), model.predict(with, GAAS, defaults));
    }

    @Test
    void positiveSurfactantShiftPushesTowardIslandsAndNegativeTowardStepFlow() {
        // higher barrier -> lower D -> higher N -> shorter l -> islands (sign documented in StepFlowModel)
        Conditions c = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 800).set(Role.DEPOSITION_RATE, 0.5)
                .set(Role.MISCUT_ANGLE, 1.0).set(Role.SURFACTANT_COVERAGE, 1.0).build();
        double plain = stepFlowProbability(c, defaults);
        double up = stepFlowProbability(c, defaults.with(NucleationLaw.SURFACTANT_BARRIER_SHIFT, 0.1));
        double down = stepFlowProbability(c, defaults.with(NucleationLaw.SURFACTANT_BARRIER_SHIFT, -0.1));
        assertTrue(up < plain && plain < down, up + " < " + plain + " < " + down);
        double tPlain = StepFlowModel.transitionTemperature(0.5, 1.0, 1.0, GAAS, defaults).temperatureK();
        double tUp = StepFlowModel.transitionTemperature(0.5, 1.0, 1.0, GAAS,
                defaults.with(NucleationLaw.SURFACTANT_BARRIER_SHIFT, 0.1)).temperatureK();
        assertTrue(tUp > tPlain);
    }

    @Test
    void veryLargeMiscutIsFlagged() {
        Prediction p = model.predict(conditions(853.15, 0.5, 20), GAAS, defaults);
        assertFalse(p.validity().valid());
        assertTrue(p.validity().reason().contains("miscut"));
    }
}
