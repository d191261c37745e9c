package dev.terrace.models;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Checks the test helper's BEP conversion against the reference values before other tests rely on it. */
class RoughBeamFluxTest {

    @Test
    void electronCountSensitivitiesMatchTabulatedValues() {
        // eta = 0.6 Z/14 + 0.4 (the form closer to Summers' measured sensitivities, NASA TN D-5285 (1969)).
        // Arithmetic: As4 (Z 132) 0.6*132/14 + 0.4 = 6.057143; Ga (Z 31) 0.6*31/14 + 0.4 = 1.728571;
        // As2 (Z 66) 0.6*66/14 + 0.4 = 3.228571.
        assertEquals(6.057143, RoughBeamFlux.ionisationEfficiency(4 * 33), 1e-6);
        assertEquals(1.728571, RoughBeamFlux.ionisationEfficiency(31), 1e-6);
        assertEquals(3.228571, RoughBeamFlux.ionisationEfficiency(2 * 33), 1e-6);
    }

    @Test
    void as4ToGaFluxRatioMatchesBepRatioGoldenValue() {
        // Ion-gauge density relation n = P/(eta k T_gauge) and beam flux J = n v_mean, v_mean ~ sqrt(T/M)
        // (kinetic theory; the usual BEP-to-flux conversion of MBE practice):
        // J_a/J_b = (P_a/P_b)(eta_b/eta_a) sqrt(T_a M_b/(T_b M_a)). P_As4/P_Ga = 20, T_As = 600 K,
        // T_Ga = 1200 K, M(As4) = 299.686, M(Ga) = 69.723 (IUPAC standard atomic weights, from memory):
        // 20 * (1.728571/6.057143) * sqrt(600 * 69.723/(1200 * 299.686)) = 20 * 0.285377 * 0.341063
        // = 1.94666 As4 molecules per Ga atom.
        double as4Molecules = RoughBeamFlux.atomFlux(2e-5, "As4") / 4;
        double ga = RoughBeamFlux.galliumFlux(1e-6, 1200);
        assertEquals(1.94666, as4Molecules / ga, 1e-5 * 1.94666);
    }
}
