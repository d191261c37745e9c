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
 * Contract cases plus golden values for {@link StepFlowModel}. Check values come from the researched physics
 * check values (§3; their original sources are named beside each value); each assertion names its source.
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
        // w = h/tan(α), h = 0.28266 nm: 0.1° 161.95, 0.5° 32.39, 1° 16.19, 2° 8.09, 4° 4.04 nm (§3, derived)
        double h = GAAS.monolayerHeightNm();
        assertEquals(161.95, StepFlowModel.terraceWidthNm(0.1, h).orElseThrow(), 0.01);
        assertEquals(32.39, StepFlowModel.terraceWidthNm(0.5, h).orElseThrow(), 0.01);
        assertEquals(16.19, StepFlowModel.terraceWidthNm(1.0, h).orElseThrow(), 0.01);
        assertEquals(8.09, StepFlowModel.terraceWidthNm(2.0, h).orElseThrow(), 0.01);
        assertEquals(4.04, StepFlowModel.terraceWidthNm(-4.0, h).orElseThrow(), 0.01);
        assertTrue(StepFlowModel.terraceWidthNm(0.0, h).isEmpty());
        assertThrows(IllegalArgumentException.class, () -> StepFlowModel.terraceWidthNm(90, h));
    }

    @Test
    void nucleationLengthsMatchGoldenValues() {
        // eta = 0.25, i = 1: D/F = 1e6, 1e8, 1e9 -> l = 8.0, 17.2, 25.3 nm on GaAs(001) (§1a/§3, derived)
        NucleationLaw law = NucleationLaw.from(defaults, NucleationLaw.ALPHA_2D);
        double[] ratios = {1e6, 1e8, 1e9};
        double[] expected = {8.0, 17.2, 25.3};
        for (int k = 0; k < 3; k++) {
            double l = StepFlowModel.nucleationLengthNm(law, 1.0, temperatureForHopRatio(ratios[k]), 0,
                    GAAS.sitesPerCm2());
            assertEquals(expected[k], l, 0.05, "l at D/F = " + ratios[k]);
        }
    }

    @Test
    void oneDegreeMiscutAtHopRatio1e8IsJustAtTheTransition() {
        // l = 17.2 nm against w(1°) = 16.2 nm: "just at the transition" (§3, BCF criterion l ≈ w)
        double t = temperatureForHopRatio(1e8);
        double p = stepFlowProbability(conditions(t, 1.0, 1.0), defaults);
        assertTrue(p > 0.5 && p < 0.6, "P(step-flow) = " + p);
        StepFlowModel.Onset onset = StepFlowModel.transitionTemperature(1.0, 1.0, 0, GAAS, defaults);
        assertEquals(StepFlowModel.Onset.Status.FOUND, onset.status());
        // l grows only as exp(-E_d/(6kT)), so l/w = 1.064 at T puts T* about 30 K lower (774 K against 802 K)
        assertTrue(onset.temperatureK() < t && onset.temperatureK() > t - 40, "T* = " + onset.temperatureK());
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
