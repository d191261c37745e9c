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
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Contract cases plus golden values for {@link IslandNucleationModel}. Each check value names its primary
 * source beside it and shows the arithmetic of any derived number.
 */
class IslandNucleationModelTest extends GrowthModelContractTest {

    /** GaAs(001): h = a/2 and N0 = 2/a² from a = 5.65325 Å (Vurgaftman et al. 2001); liquid Ga 52.65 nm^-3 (CRC, from memory). */
    static final Surface GAAS_GA = new Surface("GaAs", 0.282663, 6.258e14, "Ga", 302.9146, 52.65, "As");

    /** GaAs(001) with no deposit metal: film growth. */
    static final Surface GAAS_FILM = new Surface("GaAs", 0.282663, 6.258e14, null, Double.NaN, Double.NaN, "As");

    /**
     * GaAs(001) with In droplets: In melting point 429.7485 K (ITS-90, from memory); liquid In 7.02 g/cm³
     * (CRC, from memory) and 114.818 g/mol give 36.82 atoms nm^-3.
     */
    static final Surface GAAS_IN = new Surface("GaAs", 0.282663, 6.258e14, "In", 429.7485,
            7.02 * 6.02214076e23 / 114.818 * 1e-21, "As");

    private static final double KB = NucleationLaw.BOLTZMANN_EV_PER_K;

    private final IslandNucleationModel model = new IslandNucleationModel();

    @Override
    protected GrowthModel model() {
        return new IslandNucleationModel();
    }

    @Override
    protected Conditions typicalConditions() {
        // Ga droplets: 200 °C, 0.1 ML/s, 3 ML (invented typical recipe, common-practice range).
        return Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 473.15).set(Role.DEPOSITION_RATE, 0.1)
                .set(Role.COVERAGE, 3.0).build();
    }

    @Override
    protected Surface typicalSurface() {
        return GAAS_GA;
    }

    private static ParameterValues params(int criticalSize, int dimension) {
        return ParameterValues.defaults(new IslandNucleationModel().parameters())
                .with(NucleationLaw.CRITICAL_SIZE, criticalSize)
                .with(IslandNucleationModel.ISLAND_DIMENSION, dimension);
    }

    private double density(double temperatureK, double rate, ParameterValues p, Surface s) {
        Conditions c = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, temperatureK)
                .set(Role.DEPOSITION_RATE, rate).build();
        Prediction pr = model.predict(c, s, p);
        assertTrue(pr.validity().valid(), pr.validity().reason());
        return pr.value(Role.ISLAND_DENSITY).orElseThrow();
    }

    /** Temperature at which D/F equals the given ratio for E_d = 0.7 eV, nu0 = 1e13 Hz, F = 1 ML/s. */
    private static double temperatureForHopRatio(double ratio) {
        return 0.7 / (KB * Math.log(1e13 / 4 / ratio));
    }

    @Test
    void exponentsFor2dIslandsAreIOverIPlus2() {
        // chi = 1/3, 1/2, 3/5: Venables, Phil. Mag. 27, 697 (1973); Venables et al., Rep. Prog. Phys. 47, 399 (1984)
        double[] expected = {1.0 / 3, 0.5, 0.6};
        for (int i = 1; i <= 3; i++) {
            NucleationLaw law = new NucleationLaw(0.7, 1e13, i, 0, 0.25, 0, NucleationLaw.ALPHA_2D);
            assertEquals(expected[i - 1], law.exponent(), 1e-12, "2D chi for i = " + i);
            double slope = Math.log(density(600, 0.2, params(i, 2), GAAS_FILM) / density(600, 0.02, params(i, 2),
                    GAAS_FILM)) / Math.log(10);
            assertEquals(expected[i - 1], slope, 1e-9, "log-log slope of N against F for i = " + i);
        }
    }

    @Test
    void exponentsFor3dIslandsAreIOverIPlus2Point5() {
        // chi = i/(i + 2.5) = 1/3.5, 2/4.5, 3/5.5 = 0.285714, 0.444444, 0.545455: Venables, Spiller,
        // Hanbuecken, Rep. Prog. Phys. 47, 399 (1984), regime table; Venables, Surf. Sci. 299/300, 798 (1994)
        // (from memory). A tenfold rate step must change ln N by exactly chi ln 10.
        double[] expected = {1 / 3.5, 2 / 4.5, 3 / 5.5};
        for (int i = 1; i <= 3; i++) {
            double slope = Math.log(density(600, 0.2, params(i, 3), GAAS_FILM) / density(600, 0.02, params(i, 3),
                    GAAS_FILM)) / Math.log(10);
            assertEquals(expected[i - 1], slope, 1e-9, "3D log-log slope for i = " + i);
        }
    }

    @Test
    void doublingRateRaisesDensityBy2ToTheChi() {
        // N ~ F^chi with chi = i/(i+2) (Venables, Spiller, Hanbuecken, Rep. Prog. Phys. 47, 399 (1984)), so doubling
        // F multiplies N by exactly 2^(1/3) = 1.259921, 2^(1/2) = 1.414214, 2^(3/5) = 1.515717 for i = 1, 2, 3.
        double[] expected = {Math.cbrt(2), Math.sqrt(2), Math.pow(2, 0.6)};
        for (int i = 1; i <= 3; i++) {
            double ratio = density(550, 0.4, params(i, 2), GAAS_FILM) / density(550, 0.2, params(i, 2), GAAS_FILM);
            assertEquals(expected[i - 1], ratio, 1e-9 * expected[i - 1], "N(2F)/N(F) for i = " + i);
        }
    }

    @Test
    void goldenDensityOnGaAsAtFixedHopToDepositionRatio() {
        // N/N0 = eta (F/D)^(1/3) for i = 1, 2D islands (Venables, Spiller, Hanbuecken, Rep. Prog. Phys. 47, 399
        // (1984)), eta = 0.25 for point islands at 0.1-0.2 ML (Bales & Chrzan, Phys. Rev. B 50, 6057 (1994);
        // Amar, Family, Lam, Phys. Rev. B 50, 8781 (1994); the value 0.25 from memory). N0 = 6.258e14 cm^-2.
        // D/F = 1e6: 0.25 * 1e-2 = 2.5e-3 -> 1.5645e12 cm^-2; D/F = 1e8: 0.25 * 1e-8^(1/3) = 5.386087e-4
        // -> 3.370613e11 cm^-2; D/F = 1e9: 0.25 * 1e-3 = 2.5e-4 -> 1.5645e11 cm^-2.
        double[] ratios = {1e6, 1e8, 1e9};
        double[] expected = {1.5645e12, 3.370613e11, 1.5645e11};
        for (int k = 0; k < ratios.length; k++) {
            double n = density(temperatureForHopRatio(ratios[k]), 1.0, params(1, 2), GAAS_FILM);
            assertEquals(expected[k], n, expected[k] * 1e-6, "N at D/F = " + ratios[k]);
        }
        double perSite = density(temperatureForHopRatio(1e8), 1.0, params(1, 2), GAAS_FILM) / 6.258e14;
        assertEquals(5.386087e-4, perSite, 1e-6 * 5.386087e-4, "N/N0 at D/F = 1e8");
    }

    @Test
    void attemptFrequencyIsTotalRateNotPerDirection() {
        // D = (nu0/4)exp(-E/kT): nu0 is the total attempt rate out of a site on a square lattice, four hop
        // directions (Einstein relation in 2D, D = Gamma a^2/4; Venables' usual form, from memory). Reading nu0
        // per direction (D = nu0 exp(-E/kT)) would raise D by 4 and so scale N by 4^(-chi):
        // 4^(-1/3) = 0.629961 (i = 1), 4^(-1/2) = 0.5 (i = 2), 4^(-3/5) = 0.435275 (i = 3).
        double[] factor = {Math.pow(4, -1 / 3.0), 0.5, Math.pow(4, -0.6)};
        double t = 600;
        double rate = 0.5;
        for (int i = 1; i <= 3; i++) {
            double n = density(t, rate, params(i, 2), GAAS_FILM);
            double chi = i / (i + 2.0);
            double perDirection = 0.25 * 6.258e14 * Math.pow(rate / (1e13 * Math.exp(-0.7 / (KB * t))), chi);
            assertEquals(factor[i - 1], perDirection / n, 1e-9, "factor-4 convention for i = " + i);
        }
    }

    @Test
    void arrheniusRatioBetween200And250CelsiusMatchesGolden() {
        // i = 1, 2D: N ~ exp(E/kT) with E = E_d/3 (Venables, Spiller, Hanbuecken, Rep. Prog. Phys. 47, 399 (1984)),
        // E_d = 0.7 eV, k = 8.617333262e-5 eV/K (CODATA 2018):
        // N(523.15 K)/N(473.15 K) = exp((0.7/3)/k * (1/523.15 - 1/473.15)) = exp(-0.546952) = 0.578711.
        double ratio = density(523.15, 0.1, params(1, 2), GAAS_FILM) / density(473.15, 0.1, params(1, 2), GAAS_FILM);
        double exact = Math.exp(0.7 / 3 / 8.617333262e-5 * (1 / 523.15 - 1 / 473.15));
        assertEquals(0.578711, exact, 1e-6, "the arithmetic above");
        assertEquals(exact, ratio, 1e-9 * exact);
    }

    @Test
    void arrheniusSlopeIsVenablesEnergy() {
        // E = (E_i + i E_d)/(i + 2) for 2D (Venables 1984): E_d = 0.67 eV (Si/Si(001), Mo et al., PRL 66, 1998 (1991))
        // gives 0.2233 eV for i = 1 and (0.3 + 2·0.67)/4 = 0.41 eV for i = 2 with E_2 = 0.3 eV.
        ParameterValues p1 = params(1, 2).with(NucleationLaw.DIFFUSION_BARRIER, 0.67);
        ParameterValues p2 = params(2, 2).with(NucleationLaw.DIFFUSION_BARRIER, 0.67)
                .with(NucleationLaw.BINDING_ENERGY, 0.3);
        double[] expected = {0.67 / 3, 0.41};
        ParameterValues[] ps = {p1, p2};
        for (int k = 0; k < 2; k++) {
            double t1 = 500;
            double t2 = 600;
            double slope = Math.log(density(t1, 0.1, ps[k], GAAS_FILM) / density(t2, 0.1, ps[k], GAAS_FILM))
                    / (1 / (KB * t1) - 1 / (KB * t2));
            assertEquals(expected[k], slope, 1e-9, "Arrhenius energy case " + k);
        }
    }

    @Test
    void defaultDropletDensityRatioMatchesLowTemperatureDropletEpitaxyData() {
        // GaAs droplet-epitaxy dots, 5 ML: 2.7e11 cm^-2 at 130 °C and 1.1e11 at 200 °C, ratio 2.45
        // (Appl. Phys. Lett. 100(21) (2012), doi 10.1063/1.4721663). Defaults (3D, i = 1, E_d = 0.7 eV) give 2.34.
        ParameterValues defaults = ParameterValues.defaults(model.parameters());
        double ratio = density(403.15, 0.1, defaults, GAAS_GA) / density(473.15, 0.1, defaults, GAAS_GA);
        assertEquals(2.7 / 1.1, ratio, 0.1 * 2.7 / 1.1);
    }

    @Test
    void threeDimensionalBranchDiffersFrom2d() {
        assertNotEquals(density(500, 0.1, params(1, 2), GAAS_FILM), density(500, 0.1, params(1, 3), GAAS_FILM));
        // With i = 1 (E_1 = 0) and the same eta, N3D/N2D = (F/D)^(1/3.5 - 1/3) (Venables et al. 1984 exponents),
        // D = (1e13/4) exp(-0.7 eV/kT) per site per second (the model's default barrier and attempt rate).
        double d = 1e13 / 4 * Math.exp(-0.7 / (KB * 500));
        double expected = Math.pow(0.1 / d, 1 / 3.5 - 1 / 3.0);
        assertEquals(expected, density(500, 0.1, params(1, 3), GAAS_FILM) / density(500, 0.1, params(1, 2), GAAS_FILM),
                1e-9 * expected);
    }

    @Test
    void bindingEnergyIsIgnoredForCriticalSizeOneAndRaisesDensityOtherwise() {
        // E_1 = 0 by definition; for i = 2 the factor is exp(E_2/((2 + 2) kT)) (Walton relation, Venables 1984).
        ParameterValues p = params(1, 2);
        assertEquals(density(500, 0.1, p, GAAS_FILM),
                density(500, 0.1, p.with(NucleationLaw.BINDING_ENERGY, 0.5), GAAS_FILM), 0.0);
        ParameterValues q = params(2, 2);
        double ratio = density(500, 0.1, q.with(NucleationLaw.BINDING_ENERGY, 0.4), GAAS_FILM)
                / density(500, 0.1, q, GAAS_FILM);
        assertEquals(Math.exp(0.4 / (4 * KB * 500)), ratio, 1e-9);
    }

    @Test
    void hemisphereDropletDiametersMatchVolumeGoldenValues() {
        // Atoms per droplet = theta N0 / N_d; volume V = atoms / rho; hemisphere V = (2/3) pi r^3. With the
        // surface above (N0 = 6.258e14 cm^-2 from a = 5.65325 A, Vurgaftman et al., J. Appl. Phys. 89, 5815 (2001);
        // liquid Ga rho = 52.65 nm^-3 from 6.095 g/cm^3, CRC Handbook, from memory):
        //   2 ML, 1e8 cm^-2: 1.2516e7 atoms, V = 2.37721e5 nm^3, r = (3V/2pi)^(1/3) = 48.4176 nm, d = 96.8351 nm;
        //   1 ML, 1e9: 6.258e5 atoms, V = 1.18860e4 nm^3, d = 35.6744 nm;
        //   1 ML, 1e10: 6.258e4 atoms, V = 1.18860e3 nm^3, d = 16.5586 nm.
        assertEquals(96.83511, IslandNucleationModel.dropletBaseDiameterNm(2, 1e8, GAAS_GA, 90).orElseThrow(), 1e-6 * 96.8);
        assertEquals(35.67436, IslandNucleationModel.dropletBaseDiameterNm(1, 1e9, GAAS_GA, 90).orElseThrow(), 1e-6 * 35.7);
        assertEquals(16.55857, IslandNucleationModel.dropletBaseDiameterNm(1, 1e10, GAAS_GA, 90).orElseThrow(), 1e-6 * 16.6);
    }

    @Test
    void smallerContactAngleSpreadsTheDroplet() {
        // a contact angle below 90° gives a larger base radius than the hemisphere (spherical-cap geometry)
        double hemisphere = IslandNucleationModel.dropletBaseDiameterNm(2, 1e8, GAAS_GA, 90).orElseThrow();
        double flatter = IslandNucleationModel.dropletBaseDiameterNm(2, 1e8, GAAS_GA, 60).orElseThrow();
        assertTrue(flatter > hemisphere);
        // spherical cap: V = (π r³/3)(1 − cos θ)²(2 + cos θ)/sin³θ; at 60° the shape factor is 0.962 against 2
        assertEquals(Math.cbrt(2 / ((0.5 * 0.5 * 2.5) / Math.pow(Math.sqrt(3) / 2, 3))), flatter / hemisphere, 1e-9);
    }

    @Test
    void predictedDiameterUsesPredictedDensityAndCoverage() {
        Prediction p = model.predict(typicalConditions(), GAAS_GA, ParameterValues.defaults(model.parameters()));
        double n = p.value(Role.ISLAND_DENSITY).orElseThrow();
        assertEquals(IslandNucleationModel.dropletBaseDiameterNm(3, n, GAAS_GA, 90).orElseThrow(),
                p.value(Role.ISLAND_DIAMETER).orElseThrow(), 1e-9);
    }

    @Test
    void filmGrowthPredictsNoDropletDiameter() {
        Prediction p = model.predict(typicalConditions(), GAAS_FILM, ParameterValues.defaults(model.parameters()));
        assertTrue(p.validity().valid());
        assertTrue(p.value(Role.ISLAND_DIAMETER).isEmpty());
        assertTrue(p.value(Role.ISLAND_DENSITY).isPresent());
    }

    @Test
    void indiumDropletsBelowTheMeltingPointAreFlaggedNotScaled() {
        // In melts at 156.5985 °C (ITS-90, from memory); In island density breaks from the liquid law below
        // about 160 °C (Tuktamyshev et al., Nanomaterials 10, 1512 (2020)).
        ParameterValues defaults = ParameterValues.defaults(model.parameters());
        Conditions cold = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 140 + 273.15)
                .set(Role.DEPOSITION_RATE, 0.1).set(Role.COVERAGE, 2.0).build();
        Prediction solid = model.predict(cold, GAAS_IN, defaults);
        assertFalse(solid.validity().valid());
        assertTrue(solid.validity().reason().contains("156.6 °C"), solid.validity().reason());
        assertTrue(solid.validity().reason().contains("In"), solid.validity().reason());
        assertTrue(solid.values().isEmpty(), "no liquid-droplet values below the melting point");

        Conditions warm = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 170 + 273.15)
                .set(Role.DEPOSITION_RATE, 0.1).set(Role.COVERAGE, 2.0).build();
        Prediction liquid = model.predict(warm, GAAS_IN, defaults);
        assertTrue(liquid.validity().valid(), liquid.validity().reason());
        assertTrue(liquid.value(Role.ISLAND_DIAMETER).isPresent());
    }

    @Test
    void zeroSurfactantShiftLeavesDensityUnchanged() {
        ParameterValues defaults = ParameterValues.defaults(model.parameters());
        Conditions plain = typicalConditions();
        Conditions withSurfactant = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 473.15)
                .set(Role.DEPOSITION_RATE, 0.1).set(Role.COVERAGE, 3.0).set(Role.SURFACTANT_COVERAGE, 1.0).build();
        assertEquals(model.predict(plain, GAAS_GA, defaults).values(),
                model.predict(withSurfactant, GAAS_GA, defaults).values());
    }

    @Test
    void positiveSurfactantShiftRaisesDensityByTheArrheniusFactor() {
        // E_d,eff = E_d + shift·θ_s: a higher barrier lowers D and raises N by exp(chi·ΔE/kT) (NucleationLaw sign)
        ParameterValues p = params(1, 2).with(NucleationLaw.SURFACTANT_BARRIER_SHIFT, 0.1);
        Conditions c = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 500).set(Role.DEPOSITION_RATE, 0.1)
                .set(Role.SURFACTANT_COVERAGE, 0.5).build();
        double shifted = model.predict(c, GAAS_FILM, p).value(Role.ISLAND_DENSITY).orElseThrow();
        double plain = density(500, 0.1, params(1, 2), GAAS_FILM);
        assertEquals(Math.exp(0.05 / (3 * KB * 500)), shifted / plain, 1e-9);
        double negative = model.predict(c, GAAS_FILM, p.with(NucleationLaw.SURFACTANT_BARRIER_SHIFT, -0.1))
                .value(Role.ISLAND_DENSITY).orElseThrow();
        assertTrue(negative < plain);
    }

    @Test
    void tooFewHopsPerMonolayerIsFlaggedAndCapped() {
        // D/F << 1e3: the rate-equation scaling needs D/F >> 1 (NucleationLaw.MIN_HOP_TO_DEPOSITION_RATIO)
        Conditions c = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 200).set(Role.DEPOSITION_RATE, 1.0).build();
        Prediction p = model.predict(c, GAAS_FILM, ParameterValues.defaults(model.parameters()));
        assertFalse(p.validity().valid());
        assertTrue(p.validity().reason().contains("D/F"), p.validity().reason());
        assertTrue(p.value(Role.ISLAND_DENSITY).orElseThrow() <= GAAS_FILM.sitesPerCm2());
    }

    @Test
    void parameterOutsideItsBoundsIsReportedNotThrown() {
        Prediction p = model.predict(typicalConditions(), GAAS_GA,
                ParameterValues.defaults(model.parameters()).with(NucleationLaw.PREFACTOR, -1));
        assertFalse(p.validity().valid());
        assertTrue(p.validity().reason().contains(NucleationLaw.PREFACTOR));
    }
}
