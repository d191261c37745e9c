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
        // (the usual BEP-to-flux conversion of MBE practice). eta by Summers' rule, 0.4 Z/14 + 0.6
        // (R. L. Summers, NASA TN D-5285 (1969); coefficients from memory): eta(As4, Z 132) = 4.37143,
        // eta(Ga, Z 31) = 1.48571. M(As4) = 4 * 74.921595 = 299.686, M(Ga) = 69.723 (IUPAC standard
        // atomic weights, Pure Appl. Chem. 88, 265 (2016), from memory).
        // Derivation: 20 * (1.48571/4.37143) * sqrt(600 * 69.723 / (1200 * 299.686))
        //           = 20 * 0.339869 * 0.341063 = 2.31836 molecules per Ga atom; * 4 = 9.27345 As atoms.
        FluxRatio r = BeamFlux.vToIii(BeamReading.of(Species.As4, 1.0e-5 * TORR, 600),
                BeamReading.of(Species.Ga, 5.0e-7 * TORR, 1200));
        assertEquals(2.31836, r.moleculeRatio(), 1e-5 * 2.31836, "J_As4/J_Ga");
        assertEquals(9.27345, r.atomRatio(), 1e-5 * 9.27345, "As atoms per Ga atom");
        assertEquals(IonGauge.DEFAULT_RELATIVE_UNCERTAINTY, r.relativeUncertainty(), 0.0);
        // +/-30 % unless calibrated [common practice], consistent with the +/-15 % gauge-to-gauge
        // spread and the 20-30 % error of Summers' rule on Ar and Hg against the CRC Handbook
        // Bayard-Alpert sensitivity table (see IonGaugeTest).
        assertEquals(0.30, r.relativeUncertainty(), 0.0, "+/-30 % unless calibrated [common practice]");
        assertTrue(r.formula().contains("sqrt"));
        assertEquals(9.27345 * 0.7, r.atomRatioLow(), 1e-5 * 9.27345);
        assertEquals(9.27345 * 1.3, r.atomRatioHigh(), 1e-5 * 9.27345);
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
        // 2019), 1 Torr = 101325/760 Pa, eta(As4) = 4.37143 (Summers' rule, see above),
        // M(As4) = 299.686 g/mol. Derivation for 1e-5 Torr As4, T_source = 600 K, T_gauge = 300 K:
        //   m = 0.299686 / 6.02214076e23 = 4.97639e-25 kg; v = sqrt(8 * 1.380649e-23 * 600 / (pi * m))
        //     = 205.887 m/s;
        //   n = 1.333224e-3 Pa / (4.37143 * 1.380649e-23 * 300) = 7.36334e16 m^-3;
        //   J = n v = 1.51602e19 m^-2 s^-1 = 1.51602e15 cm^-2 s^-1 molecules, * 4 = 6.06407e15 As atoms;
        //   per GaAs(001) site (2/a^2 = 6.25797e14 cm^-2, a = 0.565325 nm, Vurgaftman et al., J. Appl.
        //   Phys. 89, 5815 (2001)): 6.06407e15 / 6.25797e14 = 9.69016 As atoms per site per second.
        assertEquals(205.887, BeamFlux.meanSpeed(Species.As4, 600), 1e-5 * 205.887, "mean speed of As4 at 600 K");
        AtomFlux f = BeamFlux.absolute(BeamReading.of(Species.As4, 1e-5 * TORR, 600));
        assertEquals(1.51602e15, f.moleculesPerCm2PerS(), 1e-5 * 1.51602e15);
        assertEquals(6.06407e15, f.atomsPerCm2PerS(), 1e-5 * 6.06407e15);
        assertEquals(2.0, f.uncertaintyFactor(), 0.0, "about a factor of 2 [common practice]");
        assertEquals(9.69016, f.perSite(GAAS), 1e-5 * 9.69016, "per GaAs(001) site, 6.25797e14 cm^-2");
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
        // absoluteFluxFollowsTheDensityTimesMeanSpeedFormula: 6.06407e15 As atoms cm^-2 s^-1 /
        // 6.25797e14 sites cm^-2 = 9.69016 per site per second.
        double perSite = BeamFlux.arrivalPerSite(Species.As4, 1e-5 * TORR, GAAS);
        assertEquals(9.69016, perSite, 1e-5 * 9.69016, "As atoms per site per second");
        // Plausibility against growth practice: Heyn, Schnuell, Jesson, Hansen, Nanoscale Res. Lett.
        // 9, 285 (2014) (citation from memory) grew GaAs buffers at 0.8 ML/s under a 1e-5 Torr As
        // flux-gauge reading; with As4 sticking at most 0.5 (Foxon and Joyce, Surf. Sci. 50, 434
        // (1975)) the usable As is about 4.8 atoms per site per second, a V/III excess of about 6
        // over 0.8 ML/s, which is the As-rich growth of common practice.
        assertEquals(6.06, 0.5 * perSite / 0.8, 0.01, "As-rich excess over a 0.8 ML/s Ga supply");
    }

    @Test
    void typicalGalliumBepGivesAboutOneMonolayerPerSecond() {
        // Same formula (see above) for Ga at the default cell temperature 1200 K, eta(Ga) = 1.48571,
        // M(Ga) = 69.723 g/mol: m = 1.15778e-25 kg, v = sqrt(8 k 1200/(pi m)) = 603.656 m/s;
        // n = 5e-7 * 133.3224 Pa / (1.48571 * 1.380649e-23 * 300) = 1.08326e15 m^-3;
        // J = n v = 6.53917e13 cm^-2 s^-1; / 6.25797e14 sites cm^-2 = 1.04494 ML/s.
        double mlPerS = BeamFlux.arrivalPerSite(Species.Ga, 5e-7 * TORR, GAAS);
        assertEquals(1.04494, mlPerS, 1e-5 * 1.04494, "Ga ML/s from 5e-7 Torr");
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
