package dev.terrace.models;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Checks the test helper's BEP conversion against the reference values before other tests rely on it. */
class RoughBeamFluxTest {

    @Test
    void summersSensitivitiesMatchTabulatedValues() {
        // eta(As4) = 4.371, eta(Ga) = 1.486, eta(As2) = 2.486: Summers, NASA TN D-5285 (1969), Z-formula values
        // as tabulated in physics-check-values.md §5 [derived there].
        assertEquals(4.371, RoughBeamFlux.ionisationEfficiency(4 * 33), 5e-4);
        assertEquals(1.486, RoughBeamFlux.ionisationEfficiency(31), 5e-4);
        assertEquals(2.486, RoughBeamFlux.ionisationEfficiency(2 * 33), 5e-4);
    }

    @Test
    void as4ToGaFluxRatioMatchesBepRatioGoldenValue() {
        // P_As4/P_Ga = 20, T_As = 600 K, T_Ga = 1200 K -> J_As4/J_Ga = 2.318 molecules per Ga
        // (physics-check-values.md §5, from the ion-gauge density relation, [derived]).
        double as4Molecules = RoughBeamFlux.atomFlux(2e-5, "As4") / 4;
        double ga = RoughBeamFlux.galliumFlux(1e-6, 1200);
        assertEquals(2.318, as4Molecules / ga, 2e-3);
    }
}
