package dev.terrace.core.flux;

import dev.terrace.core.material.Compound;
import dev.terrace.core.material.Materials;
import dev.terrace.core.units.Units;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class BeamFluxTest {

    private static final double TORR = Units.PA_PER_TORR;
    private static final Compound GAAS = Materials.compound("GaAs").orElseThrow();

    @Test
    void bepRatioOfTwentyGivesTheReferenceV3Ratio() {
        // The ion gauge reads density: n = P/(eta k T_gauge), and a beam carries J = n * v_mean with
        // v_mean ~ sqrt(T/M) (kinetic theory), so J_a/J_b = (P_a/P_b)(eta_b/eta_a) sqrt(T_a M_b/(T_b M_a))
        // (the usual BEP-to-flux conversion of MBE practice). eta by the electron-count rule 0.6 Z/14 + 0.4
        // (the form that fits Summers' measured sensitivities, NASA TN D-5285 (1969), better; see
        // IonGaugeTest): eta(As4, Z 132) = 6.05714, eta(Ga, Z 31) = 1.72857. M(As4) = 4 * 74.921595 = 299.686, M(Ga) = 69.723 (IUPAC standard
        // atomic weights, Pure Appl. Chem. 88, 265 (2016), from memory).
        // Derivation: 20 * (1.72857/6.05714) * sqrt(600 * 69.723 / (1200 * 299.686))
        //           = 20 * 0.285377 * 0.341063 = 1.94666 molecules per Ga atom; * 4 = 7.78663 As atoms.
        FluxRatio r = BeamFlux.vToIii(BeamReading.of(Species.As4, 1.0e-5 * TORR, 600),
                BeamReading.of(Species.Ga, 5.0e-7 * TORR, 1200));
        assertEquals(1.94666, r.moleculeRatio(), 1e-5 * 1.94666, "J_As4/J_Ga");
        assertEquals(7.78663, r.atomRatio(), 1e-5 * 7.78663, "As atoms per Ga atom");
        assertEquals(IonGauge.DEFAULT_RELATIVE_UNCERTAINTY, r.relativeUncertainty(), 0.0);
        // +/-30 % unless calibrated [common practice], consistent with the +/-15 % gauge-to-gauge
        // spread and the up to 16 % error of the rule on Ar and Hg against the CRC Handbook
        // Bayard-Alpert sensitivity table (see IonGaugeTest).
        assertEquals(0.30, r.relativeUncertainty(), 0.0, "+/-30 % unless calibrated [common practice]");
        assertTrue(r.formula().contains("sqrt"));
        assertEquals(7.78663 * 0.7, r.atomRatioLow(), 1e-5 * 7.78663);
        assertEquals(7.78663 * 1.3, r.atomRatioHigh(), 1e-5 * 7.78663);
    }

    @Test
    void ratioDependsOnlyOnThePressureRatioNotOnThePressureUnit() {
        FluxRatio pa = BeamFlux.ratio(BeamReading.of(Species.As4, 20.0, 600), BeamReading.of(Species.Ga, 1.0, 1200));
        FluxRatio torr = BeamFlux.ratio(BeamReading.of(Species.As4, 20.0 * TORR, 600),
                BeamReading.of(Species.Ga, 1.0 * TORR, 1200));
        assertEquals(pa.atomRatio(), torr.atomRatio(), 1e-12 * pa.atomRatio());
    }

    @Test
    void swappingTheBeamsInvertsTheRatio() {
        BeamReading v = BeamReading.of(Species.Sb2, 3e-4);
        BeamReading iii = BeamReading.of(Species.In, 2e-5);
        assertEquals(1.0, BeamFlux.ratio(v, iii).moleculeRatio() * BeamFlux.ratio(iii, v).moleculeRatio(), 1e-12);
        assertEquals(1.0, BeamFlux.ratio(v, iii).atomRatio() * BeamFlux.ratio(iii, v).atomRatio(), 1e-12);
    }

    @Test
    void defaultTemperaturesAreUsedAndFlaggedWhenNoneIsGiven() {
        BeamReading r = BeamReading.of(Species.As4, 1e-3);
        assertTrue(r.temperatureDefaulted());
        assertEquals(Species.As4.defaultSourceTemperatureK(), r.sourceTemperatureK(), 0.0);
        assertFalse(BeamReading.of(Species.As4, 1e-3, 610).temperatureDefaulted());
    }

    @Test
    void aCalibratedSensitivityReplacesSummersRule() {
        BeamReading summers = BeamReading.of(Species.As4, 1e-3, 600);
        BeamReading calibrated = summers.withSensitivity(2 * summers.sensitivity());
        BeamReading ga = BeamReading.of(Species.Ga, 1e-4, 1200);
        // A gauge twice as sensitive to As4 means half the As4 density for the same reading.
        assertEquals(0.5, BeamFlux.ratio(calibrated, ga).moleculeRatio() / BeamFlux.ratio(summers, ga).moleculeRatio(), 1e-12);
        assertEquals(0.1, BeamFlux.ratio(summers, ga, 0.1).relativeUncertainty(), 0.0);
    }

    @Test
    void vToIiiRejectsBeamsOfTheWrongGroup() {
        BeamReading as = BeamReading.of(Species.As4, 1e-3);
        BeamReading ga = BeamReading.of(Species.Ga, 1e-4);
        assertThrows(IllegalArgumentException.class, () -> BeamFlux.vToIii(ga, as));
        assertThrows(IllegalArgumentException.class, () -> BeamFlux.vToIii(as, as));
    }

    @Test
    void absoluteFluxFollowsTheDensityTimesMeanSpeedFormula() {
        // Kinetic theory (mean speed sqrt(8kT/(pi m)) of a Maxwellian gas), with the SI defining
        // constants k_B = 1.380649e-23 J/K and N_A = 6.02214076e23 /mol (BIPM SI Brochure, 9th ed.
        // 2019), 1 Torr = 101325/760 Pa, eta(As4) = 6.05714 (electron-count rule, see above),
        // M(As4) = 299.686 g/mol. Derivation for 1e-5 Torr As4, T_source = 600 K, T_gauge = 300 K:
        //   m = 0.299686 / 6.02214076e23 = 4.97639e-25 kg; v = sqrt(8 * 1.380649e-23 * 600 / (pi * m))
        //     = 205.887 m/s;
        //   n = 1.333224e-3 Pa / (6.05714 * 1.380649e-23 * 300) = 5.31411e16 m^-3;
        //   J = n v = 1.09411e19 m^-2 s^-1 = 1.09411e15 cm^-2 s^-1 molecules, * 4 = 4.37643e15 As atoms;
        //   per GaAs(001) site (2/a^2 = 6.25797e14 cm^-2, a = 0.565325 nm, Vurgaftman et al., J. Appl.
        //   Phys. 89, 5815 (2001)): 4.37643e15 / 6.25797e14 = 6.99337 As atoms per site per second.
        assertEquals(205.887, BeamFlux.meanSpeed(Species.As4, 600), 1e-5 * 205.887, "mean speed of As4 at 600 K");
        AtomFlux f = BeamFlux.absolute(BeamReading.of(Species.As4, 1e-5 * TORR, 600));
        assertEquals(1.09411e15, f.moleculesPerCm2PerS(), 1e-5 * 1.09411e15);
        assertEquals(4.37643e15, f.atomsPerCm2PerS(), 1e-5 * 4.37643e15);
        assertEquals(2.0, f.uncertaintyFactor(), 0.0, "about a factor of 2 [common practice]");
        assertEquals(6.99337, f.perSite(GAAS), 1e-5 * 6.99337, "per GaAs(001) site, 6.25797e14 cm^-2");
    }

    @Test
    void absoluteFluxScalesWithPressureAndSquareRootOfSourceTemperature() {
        AtomFlux base = BeamFlux.absolute(BeamReading.of(Species.Ga, 1e-4, 1000));
        AtomFlux twicePressure = BeamFlux.absolute(BeamReading.of(Species.Ga, 2e-4, 1000));
        AtomFlux fourTimesT = BeamFlux.absolute(BeamReading.of(Species.Ga, 1e-4, 4000));
        assertEquals(2.0, twicePressure.atomsPerCm2PerS() / base.atomsPerCm2PerS(), 1e-12);
        assertEquals(2.0, fourTimesT.atomsPerCm2PerS() / base.atomsPerCm2PerS(), 1e-12);
    }

    @Test
    void typicalArsenicBepSuppliesAboutOneMonolayerPerSecondOrMore() {
        // Exact value with the default As4 source temperature (600 K) is the derivation of
        // absoluteFluxFollowsTheDensityTimesMeanSpeedFormula: 4.37643e15 As atoms cm^-2 s^-1 /
        // 6.25797e14 sites cm^-2 = 6.99337 per site per second.
        double perSite = BeamFlux.arrivalPerSite(Species.As4, 1e-5 * TORR, GAAS);
        assertEquals(6.99337, perSite, 1e-5 * 6.99337, "As atoms per site per second");
        // Plausibility against growth practice: Heyn, Schnuell, Jesson, Hansen, Nanoscale Res. Lett.
        // 9, 285 (2014) (citation from memory) grew GaAs buffers at 0.8 ML/s under a 1e-5 Torr As
        // flux-gauge reading; with As4 sticking at most 0.5 (Foxon and Joyce, Surf. Sci. 50, 434
        // (1975)) the usable As is about 3.5 atoms per site per second, a V/III excess of about 4.4
        // over 0.8 ML/s, which is the As-rich growth of common practice.
        assertEquals(4.37, 0.5 * perSite / 0.8, 0.01, "As-rich excess over a 0.8 ML/s Ga supply");
    }

    @Test
    void typicalGalliumBepGivesAboutOneMonolayerPerSecond() {
        // Same formula (see above) for Ga at the default cell temperature 1200 K, eta(Ga) = 1.72857,
        // M(Ga) = 69.723 g/mol: m = 1.15778e-25 kg, v = sqrt(8 k 1200/(pi m)) = 603.656 m/s;
        // n = 5e-7 * 133.3224 Pa / (1.72857 * 1.380649e-23 * 300) = 9.31067e15 m^-3;
        // J = n v = 5.62045e14 cm^-2 s^-1; / 6.25797e14 sites cm^-2 = 0.89813 ML/s.
        double mlPerS = BeamFlux.arrivalPerSite(Species.Ga, 5e-7 * TORR, GAAS);
        assertEquals(0.89813, mlPerS, 1e-5 * 0.89813, "Ga ML/s from 5e-7 Torr");
        // [common practice]: a Ga BEP of about 5e-7 to 1e-6 Torr gives about 1 ML/s of GaAs.
        assertTrue(mlPerS >= 0.5 && mlPerS <= 2, "Ga ML/s from 5e-7 Torr: " + mlPerS);
    }

    @Test
    void readingsRejectNonPositiveOrNonFiniteInputs() {
        assertThrows(IllegalArgumentException.class, () -> BeamReading.of(Species.Ga, 0));
        assertThrows(IllegalArgumentException.class, () -> BeamReading.of(Species.Ga, -1e-4));
        assertThrows(IllegalArgumentException.class, () -> BeamReading.of(Species.Ga, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> BeamReading.of(Species.Ga, 1e-4, 0));
        assertThrows(IllegalArgumentException.class, () -> BeamReading.of(Species.Ga, 1e-4, Double.POSITIVE_INFINITY));
        assertThrows(IllegalArgumentException.class, () -> BeamReading.of(Species.Ga, 1e-4).withSensitivity(0));
        assertThrows(IllegalArgumentException.class, () -> BeamFlux.meanSpeed(Species.Ga, -5));
        AtomFlux f = BeamFlux.absolute(BeamReading.of(Species.Ga, 1e-4));
        assertThrows(IllegalArgumentException.class, () -> f.perSite(0.0));
    }
}
