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
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Contract cases plus published regime checks for {@link DropletCrystallizationModel}. Each check value
 * names its primary source beside it and shows the arithmetic of any derived number. Group-V fluxes are converted from flux-gauge readings with {@link RoughBeamFlux}.
 */
class DropletCrystallizationModelTest extends GrowthModelContractTest {

    /**
     * Group-III atoms per nm³ in zinc-blende crystals, 4/a³, with a300 from Vurgaftman, Meyer, Ram-Mohan,
     * J. Appl. Phys. 89, 5815 (2001): GaAs 5.65325 Å gives 22.1394, InAs 6.0583 Å gives 17.9890, AlAs 5.6611 Å
     * gives 22.0474 nm^-3 (arithmetic done here).
     */
    static final double GAAS_CATIONS = 22.1394, INAS_CATIONS = 17.9890, ALAS_CATIONS = 22.0474;

    /**
     * Liquid atom densities at the melting point, ρ·N_A/M, from the CRC Handbook of Chemistry and Physics
     * liquid densities (from memory): Ga 6.095 g/cm³ gives 52.64, In 7.02 g/cm³ gives 36.82, Al 2.375 g/cm³
     * gives 53.01 nm^-3 (IUPAC molar masses 69.723, 114.818, 26.9815 g/mol; arithmetic done here).
     */
    static final double GA_LIQUID = 52.65, IN_LIQUID = 36.82, AL_LIQUID = 53.01;

    /** Ga droplets on GaAs(001), crystallising into GaAs; Ga supercools down to 150 K (Bosio and Windsor, PRL 35, 1652 (1975)). */
    private static final Surface GAAS_GA = new Surface("GaAs", 0.282663, 6.258e14, "Ga", 302.9146, GA_LIQUID, "As",
            150.0, GAAS_CATIONS);
    /** In droplets on GaAs(001), crystallising into InAs; In melting point 429.7485 K (ITS-90, from memory), no margin. */
    private static final Surface GAAS_IN = new Surface("GaAs", 0.282663, 6.258e14, "In", 429.7485, IN_LIQUID, "As",
            429.7485, INAS_CATIONS);
    /** Al droplets on GaAs(001), crystallising into AlAs; Al melting point 933.473 K (ITS-90, from memory). */
    private static final Surface GAAS_AL = new Surface("GaAs", 0.282663, 6.258e14, "Al", 933.473, AL_LIQUID, "As",
            933.473, ALAS_CATIONS);
    /** Ga droplets on GaAs(001) under a phosphorus beam, forming GaP, which is not in the material table. */
    private static final Surface GAAS_GA_P = new Surface("GaAs", 0.282663, 6.258e14, "Ga", 302.9146, GA_LIQUID, "P",
            150.0, Double.NaN);
    private static final double CELSIUS = 273.15;

    private final DropletCrystallizationModel model = new DropletCrystallizationModel();
    private final ParameterValues defaults = ParameterValues.defaults(model.parameters());

    @Override
    protected GrowthModel model() {
        return new DropletCrystallizationModel();
    }

    @Override
    protected Conditions typicalConditions() {
        // Ga droplets, 1 ML at 1e9 cm^-2, crystallised at 150 °C under 1e-5 Torr As4 (invented typical recipe
        // in the compact-dot range of low-temperature droplet epitaxy, Watanabe, Koguchi, Gotoh, JJAP 39, L79 (2000),
        // citation from memory).
        return recipe(150, 1.0, 1e9, RoughBeamFlux.atomFlux(1e-5, "As4"), "As4");
    }

    @Override
    protected Surface typicalSurface() {
        return GAAS_GA;
    }

    private static Conditions recipe(double celsius, double coverage, double density, double flux, String species) {
        return Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, celsius + CELSIUS)
                .set(Role.COVERAGE, coverage).set(Role.ISLAND_DENSITY, density).set(Role.GROUP_V_FLUX, flux)
                .set(Role.GROUP_V_SPECIES, species).build();
    }

    private static String mostLikely(Prediction p) {
        return p.classProbabilities(Role.MORPHOLOGY).entrySet().stream().max(Map.Entry.comparingByValue())
                .orElseThrow().getKey();
    }

    @Test
    void lowTemperatureHighArsenicFluxGivesDots() {
        // compact dots at 150 °C under 1e-4 Torr As4 BEP: Watanabe, Koguchi, Gotoh, JJAP 39, L79 (2000) (from memory);
        // "modified droplet epitaxy" with high As flux at low substrate temperature, JJAP Part 2 (2000). Droplets:
        // 2 ML at 1e8 cm^-2 and 1 ML at 1e10 cm^-2 (hemisphere radii 48.4 and 8.3 nm; see deepDotDiameter... below).
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        for (double[] droplet : new double[][] {{2, 1e8}, {1, 1e10}}) {
            Prediction p = model.predict(recipe(150, droplet[0], droplet[1], flux, "As4"), GAAS_GA, defaults);
            assertTrue(p.validity().valid(), p.validity().reason());
            assertEquals(DropletCrystallizationModel.DOT, mostLikely(p), p.classProbabilities(Role.MORPHOLOGY).toString());
            assertTrue(p.classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT) > 0.9);
        }
    }

    @Test
    void hotSubstrateWithArsenicBelow1e7TorrGivesHoles() {
        // local droplet etching at 570-620 °C with the As reading below 1e-7 Torr: Heyn et al., Nanoscale Res. Lett.
        // 9, 285 (2014) (citation from memory; the temperatures were read in the paper). 1e-8 Torr As4, and the
        // valve closed.
        for (double flux : new double[] {RoughBeamFlux.atomFlux(1e-8, "As4"), 0.0}) {
            Prediction p = model.predict(recipe(620, 2.0, 1e8, flux, "As4"), GAAS_GA, defaults);
            assertTrue(p.validity().valid(), p.validity().reason());
            assertEquals(DropletCrystallizationModel.HOLE, mostLikely(p), p.classProbabilities(Role.MORPHOLOGY).toString());
            assertTrue(p.classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.HOLE) > 0.9);
        }
    }

    @Test
    void intermediateTemperatureAndFluxGivesRings() {
        // rings at intermediate T (200-400 °C) and lower As flux (1e-7 to 1e-5 Torr): Mano et al., Nano Lett. 5, 425
        // (2005); Somaschini et al., Nanoscale Res. Lett. 5, 1865 (2010) (windows as read in those papers' abstracts).
        // 300 °C, 1e-6 Torr As4, droplets of 1 ML at 1e9 and 2 ML at 1e8 cm^-2 (radii 17.8 and 48.4 nm).
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        for (double[] droplet : new double[][] {{1, 1e9}, {2, 1e8}}) {
            Prediction p = model.predict(recipe(300, droplet[0], droplet[1], flux, "As4"), GAAS_GA, defaults);
            assertEquals(DropletCrystallizationModel.RING, mostLikely(p), p.classProbabilities(Role.MORPHOLOGY).toString());
        }
    }

    @Test
    void etchingNeedsBothHighTemperatureAndLowFlux() {
        // the hole regime depends on the As flux, not only on T: Zhou, Zheng, Tang, Jesson, Tersoff, "Congruent
        // evaporation temperature of GaAs(001) controlled by As flux", Appl. Phys. Lett. (2010) (volume and page
        // not recorded)
        Prediction hotWithArsenic = model.predict(recipe(620, 2.0, 1e8, RoughBeamFlux.atomFlux(1e-5, "As4"), "As4"),
                GAAS_GA, defaults);
        assertNotEquals(DropletCrystallizationModel.HOLE, mostLikely(hotWithArsenic));
        Prediction coolWithout = model.predict(recipe(300, 2.0, 1e8, RoughBeamFlux.atomFlux(1e-8, "As4"), "As4"),
                GAAS_GA, defaults);
        assertTrue(coolWithout.classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.HOLE) < 0.01);
    }

    @Test
    void featureDiameterNeverShrinksAsCrystallisationTemperatureRises() {
        // ring and outer-disk diameters grow with crystallisation T at fixed As flux: Mano et al. 2005; Somaschini
        // et al. 2010 (Arrhenius growth of the Ga diffusion area)
        for (double bep : new double[] {1e-4, 1e-6, 1e-8}) {
            double flux = RoughBeamFlux.atomFlux(bep, "As4");
            double previous = 0;
            for (double c = 30; c <= 700; c += 5) {
                Prediction p = model.predict(recipe(c, 2.0, 1e8, flux, "As4"), GAAS_GA, defaults);
                double d = p.value(Role.ISLAND_DIAMETER).orElseThrow();
                assertTrue(d >= previous, "diameter fell at " + c + " °C and " + bep + " Torr: " + d + " < " + previous);
                previous = d;
            }
        }
    }

    @Test
    void ringDiameterGrowsBetween200And400Celsius() {
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        double d200 = model.predict(recipe(200, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults)
                .value(Role.ISLAND_DIAMETER).orElseThrow();
        double d400 = model.predict(recipe(400, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults)
                .value(Role.ISLAND_DIAMETER).orElseThrow();
        assertTrue(d400 > 1.2 * d200, d200 + " nm at 200 °C, " + d400 + " nm at 400 °C");
    }

    @Test
    void deepDotHoldsTheDropletsGaAtomsAsGaAs() {
        // hemisphere droplet diameters d = 2 (3V/(2 pi))^(1/3), V = theta N0/(N_d rho), with N0 = 6.258e14 cm^-2 and
        // liquid Ga rho = 52.65 nm^-3 (see IslandNucleationModelTest.hemisphereDropletDiametersMatchVolumeGoldenValues
        // for the arithmetic): 96.83511 nm (2 ML, 1e8), 35.67436 nm (1 ML, 1e9), 16.55857 nm (1 ML, 1e10). The GaAs
        // dot holds the same Ga atoms at 22.1394 nm^-3 (4/a³, Vurgaftman et al. 2001), 2.37812 times the volume, so a
        // cap of the same angle is 2.37812^(1/3) = 1.334778 times wider: 129.2540, 47.6176, 22.1021 nm (arithmetic
        // done here). At 30 °C under 1e-4 Torr As4 the Ga barely migrates, so no ring spread is added.
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        double[][] cases = {{2, 1e8, 129.2540}, {1, 1e9, 47.6176}, {1, 1e10, 22.1021}};
        for (double[] k : cases) {
            double d = model.predict(recipe(30, k[0], k[1], flux, "As4"), GAAS_GA, defaults)
                    .value(Role.ISLAND_DIAMETER).orElseThrow();
            assertEquals(k[2], d, 2e-6 * k[2], "diameter for " + k[0] + " ML at " + k[1]);
        }
    }

    @Test
    void migrationLengthFollowsSquareRootOfDiffusionTimesArrivalTime() {
        // L = sqrt(D_c·tau): at 150 °C, E_c = 0.7 eV, nu0 = 1e13 Hz, D_c = 2.5e12·exp(-0.7/kT)/N0 = 1838 nm²/s;
        // 1e-4 Torr As4 gives 4.37643e16 atoms cm^-2 s^-1 (RoughBeamFlux), s = 0.5, tau = N0/(s·J) = 0.028599 s,
        // L = 7.2506 nm (arithmetic done here, a regression value for the formula only)
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        assertEquals(4.37643e16, flux, 1e-5 * 4.37643e16);
        double l = DropletCrystallizationModel.migrationLengthNm(423.15, flux, 0.5, 0.7, 1e13, 6.258e14);
        double kT = NucleationLaw.BOLTZMANN_EV_PER_K * 423.15;
        double dc = 2.5e12 * Math.exp(-0.7 / kT) * 1e14 / 6.258e14;
        double tau = 6.258e14 / (0.5 * flux);
        assertEquals(Math.sqrt(dc * tau), l, 1e-9 * l);
        assertEquals(7.25060, l, 1e-5 * 7.25060);
        // Arrhenius: tau does not depend on T, so L(T2)/L(T1) = exp(E_c/(2k) (1/T1 - 1/T2)) with
        // k = 8.617333262e-5 eV/K (CODATA 2018); 150 -> 250 °C: exp(0.7/(2k) (1/423.15 - 1/523.15)) = 6.26351
        double hot = DropletCrystallizationModel.migrationLengthNm(523.15, flux, 0.5, 0.7, 1e13, 6.258e14);
        assertEquals(Math.exp(0.7 / (2 * 8.617333262e-5) * (1 / 423.15 - 1 / 523.15)), hot / l, 1e-9 * hot / l);
        assertEquals(6.26351, hot / l, 1e-5 * 6.26351);
        // quadrupling the flux halves L
        assertEquals(0.5, DropletCrystallizationModel.migrationLengthNm(423.15, 4 * flux, 0.5, 0.7, 1e13, 6.258e14) / l,
                1e-12);
    }

    @Test
    void dimerSticksBetterThanTetramerAndFavoursDots() {
        // s(As4) <= 0.5, Foxon & Joyce, Surf. Sci. 50, 434 (1975); s(As2) ≈ 1, Surf. Sci. 64, 293 (1977) (from memory):
        // at the same atom flux dimers arrive twice as effectively, so Ga migrates less
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        double dotAs4 = model.predict(recipe(250, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults)
                .classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT);
        double dotAs2 = model.predict(recipe(250, 1.0, 1e9, flux, "As2"), GAAS_GA, defaults)
                .classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT);
        assertTrue(dotAs2 > dotAs4, dotAs2 + " > " + dotAs4);
    }

    @Test
    void higherGroupVFluxKeepsDropletsCompact() {
        // high As flux at low T keeps the droplet's base size ("modified droplet epitaxy", JJAP Part 2 (2000))
        double previous = -1;
        for (double bep = 1e-7; bep <= 1e-4 * 1.001; bep *= 10) {
            double dot = model.predict(recipe(200, 1.0, 1e9, RoughBeamFlux.atomFlux(bep, "As4"), "As4"), GAAS_GA,
                    defaults).classProbabilities(Role.MORPHOLOGY).get(DropletCrystallizationModel.DOT);
            assertTrue(dot > previous, "P(dot) did not rise at " + bep + " Torr");
            previous = dot;
        }
    }

    @Test
    void missingDensityAsksForIslandNucleationOrAMeasurement() {
        Conditions c = Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, 423.15).set(Role.COVERAGE, 1.0)
                .set(Role.GROUP_V_FLUX, 1e15).build();
        Prediction p = model.predict(c, GAAS_GA, defaults);
        assertFalse(p.validity().valid());
        assertTrue(p.validity().reason().contains(IslandNucleationModel.ID), p.validity().reason());
        assertTrue(p.validity().reason().contains("measure"), p.validity().reason());
    }

    @Test
    void densityPredictedByIslandNucleationFeedsThisModel() {
        // the core runs island-nucleation first and passes its ISLAND_DENSITY on (campaign models: order); the
        // crystallised feature is never narrower than the liquid droplet it came from
        IslandNucleationModel upstream = new IslandNucleationModel();
        Conditions deposition = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 423.15)
                .set(Role.DEPOSITION_RATE, 0.1).set(Role.COVERAGE, 2.0).build();
        Prediction droplets = upstream.predict(deposition, GAAS_GA, ParameterValues.defaults(upstream.parameters()));
        double density = droplets.value(Role.ISLAND_DENSITY).orElseThrow();
        for (double bep : new double[] {1e-4, 1e-6}) {
            Prediction p = model.predict(recipe(150, 2.0, density, RoughBeamFlux.atomFlux(bep, "As4"), "As4"),
                    GAAS_GA, defaults);
            assertTrue(p.validity().valid(), p.validity().reason());
            assertTrue(p.value(Role.ISLAND_DIAMETER).orElseThrow()
                    >= droplets.value(Role.ISLAND_DIAMETER).orElseThrow() * (1 - 1e-12));
        }
    }

    @Test
    void substrateTemperatureIsUsedWhenNoCrystallisationTemperatureIsGiven() {
        double flux = RoughBeamFlux.atomFlux(1e-5, "As4");
        Conditions fallback = Conditions.builder().set(Role.SUBSTRATE_TEMPERATURE, 150 + CELSIUS)
                .set(Role.COVERAGE, 1.0).set(Role.ISLAND_DENSITY, 1e9).set(Role.GROUP_V_FLUX, flux)
                .set(Role.GROUP_V_SPECIES, "As4").build();
        Prediction viaSubstrate = model.predict(fallback, GAAS_GA, defaults);
        Prediction direct = model.predict(recipe(150, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults);
        assertEquals(direct.probabilities(), viaSubstrate.probabilities());
        assertTrue(viaSubstrate.notes().stream().anyMatch(n -> n.contains("substrate temperature is used")));
    }

    @Test
    void solidIndiumIsNotTreatedAsLiquidDroplets() {
        // In melts at 156.5985 °C (ITS-90, from memory); Tuktamyshev et al., Nanomaterials 10, 1512 (2020)
        double flux = RoughBeamFlux.atomFlux(1e-5, "As4");
        Prediction cold = model.predict(recipe(140, 1.0, 1e9, flux, "As4"), GAAS_IN, defaults);
        assertFalse(cold.validity().valid());
        assertTrue(cold.validity().reason().contains("156.6 °C"), cold.validity().reason());
        Prediction warm = model.predict(recipe(170, 1.0, 1e9, flux, "As4"), GAAS_IN, defaults);
        assertTrue(warm.validity().valid(), warm.validity().reason());
    }

    @Test
    void closedValveBelowEtchingOnsetIsFlagged() {
        Prediction p = model.predict(recipe(200, 1.0, 1e9, 0.0, "As4"), GAAS_GA, defaults);
        assertFalse(p.validity().valid());
        assertTrue(p.validity().reason().contains("no group-V flux"), p.validity().reason());
        assertTrue(p.value(Role.ISLAND_DIAMETER).isEmpty());
    }

    @Test
    void missingSpeciesAssumesTheDefaultMoleculeAndSaysSo() {
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        Conditions noSpecies = Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, 250 + CELSIUS)
                .set(Role.COVERAGE, 1.0).set(Role.ISLAND_DENSITY, 1e9).set(Role.GROUP_V_FLUX, flux).build();
        Prediction p = model.predict(noSpecies, GAAS_GA, defaults);
        assertEquals(model.predict(recipe(250, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults).probabilities(),
                p.probabilities());
        assertTrue(p.notes().stream().anyMatch(n -> n.contains("As4 assumed")), p.notes().toString());
    }

    @Test
    void cationDensityRatiosMatchHandbookValues() {
        // volume of compound per volume of liquid = n_liquid / (4/a³): Ga into GaAs 52.64/22.139 = 2.378 (liquid Ga
        // about 2.4 times denser in Ga than GaAs); In into InAs 36.82/17.989 = 2.047; Al into AlAs 53.01/22.047 =
        // 2.404. Liquid densities: CRC Handbook (from memory); lattice constants: Vurgaftman et al. 2001 (see fields)
        assertEquals(2.378, DropletCrystallizationModel.crystalToLiquidVolumeRatio(GA_LIQUID, GAAS_CATIONS), 2e-3);
        assertEquals(2.047, DropletCrystallizationModel.crystalToLiquidVolumeRatio(IN_LIQUID, INAS_CATIONS), 2e-3);
        assertEquals(2.404, DropletCrystallizationModel.crystalToLiquidVolumeRatio(AL_LIQUID, ALAS_CATIONS), 2e-3);
        // the dot is a cap of the droplet's contact angle: its base is ratio^(1/3) times the droplet base, at any angle
        for (double angle : new double[] {30, 60, 90, 120}) {
            double liquid = ModelSupport.capBaseRadiusNm(6.258e5, IN_LIQUID, angle);
            double crystal = DropletCrystallizationModel.crystalBaseRadiusNm(6.258e5, IN_LIQUID, INAS_CATIONS, angle);
            assertEquals(Math.cbrt(IN_LIQUID / INAS_CATIONS), crystal / liquid, 1e-12);
        }
    }

    @Test
    void indiumAndAluminiumDotsUseTheirOwnCompoundAndNoGaWording() {
        // 1 ML at 1e9 cm^-2 under 1e-4 Torr As4, each metal above its melting point (In 156.6 °C, Al 660.3 °C; ITS-90,
        // from memory): In at 170 °C, Al at 700 °C. The In dot is the hemisphere holding theta N0/N_d atoms at the
        // InAs cation density, plus at most a small ring spread at this low temperature and high flux (5 % allowed);
        // the Al case checks the wording only.
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        Prediction in = model.predict(recipe(170, 1.0, 1e9, flux, "As4"), GAAS_IN, defaults);
        assertTrue(in.validity().valid(), in.validity().reason());
        double atoms = 6.258e14 / 1e9;
        double inasDot = 2 * ModelSupport.capBaseRadiusNm(atoms, INAS_CATIONS, 90);
        double inDroplet = 2 * ModelSupport.capBaseRadiusNm(atoms, IN_LIQUID, 90);
        double d = in.value(Role.ISLAND_DIAMETER).orElseThrow();
        assertTrue(d >= inasDot * (1 - 1e-9) && d < inasDot * 1.05, d + " nm against an InAs hemisphere of " + inasDot);
        assertTrue(d > 1.25 * inDroplet, "the InAs dot is wider than the In droplet's base");
        for (Prediction p : new Prediction[] {in, model.predict(recipe(700, 1.0, 1e9, flux, "As4"), GAAS_AL, defaults)}) {
            for (String note : p.notes()) {
                assertFalse(note.matches(".*\\bGa\\b(?! value| default).*") && !note.contains("GaAs evaporates"),
                        "Ga wording for another metal: " + note);
            }
            assertTrue(p.notes().stream().anyMatch(n -> n.contains("carried over")), p.notes().toString());
        }
        // with Ga itself the published Ga defaults are not flagged
        Prediction ga = model.predict(recipe(170, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults);
        assertTrue(ga.notes().stream().noneMatch(n -> n.contains("carried over")), ga.notes().toString());
    }

    @Test
    void unknownCompoundGivesNoDiameterButSaysWhy() {
        // GaP is not in the material table: the crystallised size cannot be converted
        Prediction p = model.predict(recipe(150, 1.0, 1e9, RoughBeamFlux.atomFlux(1e-5, "As4"), "P2"), GAAS_GA_P, defaults);
        assertTrue(p.value(Role.ISLAND_DIAMETER).isEmpty());
        assertTrue(p.notes().stream().anyMatch(n -> n.contains("not in the material table")), p.notes().toString());
    }

    @Test
    void supercooledGaIsLiquidWithinItsMarginAndSolidBelow() {
        // liquid Ga supercools down to its metastability limit of 150 K = -123.15 °C (Bosio and Windsor, Phys. Rev.
        // Lett. 35, 1652 (1975)); the melting point is 29.7646 °C (ITS-90). 0 °C is inside the margin, -150 °C is not.
        double flux = RoughBeamFlux.atomFlux(1e-4, "As4");
        Prediction cold = model.predict(recipe(0, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults);
        assertTrue(cold.validity().valid(), cold.validity().reason());
        assertTrue(cold.notes().stream().anyMatch(n -> n.contains("supercooled")), cold.notes().toString());
        Prediction frozen = model.predict(recipe(-150, 1.0, 1e9, flux, "As4"), GAAS_GA, defaults);
        assertFalse(frozen.validity().valid());
        assertTrue(frozen.validity().reason().contains("-123.1 °C")
                && frozen.validity().reason().contains("outside the validity"), frozen.validity().reason());
        // In has no margin: just below its melting point it is solid, and the message says there is no margin
        Prediction in = model.predict(recipe(150, 1.0, 1e9, flux, "As4"), GAAS_IN, defaults);
        assertFalse(in.validity().valid());
        assertTrue(in.validity().reason().contains("no supercooling margin"), in.validity().reason());
    }

    @Test
    void stickingFollowsTheSameDefaultMoleculeAsTheFluxConverter() {
        // one table for both: the BEP-to-flux conversion (RecipeConverter.defaultSpecies) and this model's sticking.
        // As campaigns assume As4 (tetramer sticking 0.5), P campaigns P2 (dimer sticking 1), common practice.
        double flux = RoughBeamFlux.atomFlux(1e-6, "As4");
        Conditions noSpecies = Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, 250 + CELSIUS)
                .set(Role.COVERAGE, 1.0).set(Role.ISLAND_DENSITY, 1e9).set(Role.GROUP_V_FLUX, flux).build();
        Surface inOnInP = new Surface("InP", 0.293485, 5.8049e14, "In", 429.7485, IN_LIQUID, "P", 429.7485,
                4 / Math.pow(0.58697, 3));
        for (Surface surface : new Surface[] {GAAS_GA, inOnInP}) {
            String converter = dev.terrace.core.model.RecipeConverter.defaultSpecies(surface.groupV()).orElseThrow().name();
            assertEquals(converter, DropletCrystallizationModel.assumedSpecies(java.util.Optional.empty(), surface)
                    .orElseThrow());
            Conditions named = Conditions.builder().set(Role.CRYSTALLIZATION_TEMPERATURE, 250 + CELSIUS)
                    .set(Role.COVERAGE, 1.0).set(Role.ISLAND_DENSITY, 1e9).set(Role.GROUP_V_FLUX, flux)
                    .set(Role.GROUP_V_SPECIES, converter).build();
            assertEquals(model.predict(named, surface, defaults).probabilities(),
                    model.predict(noSpecies, surface, defaults).probabilities(), surface.groupV());
        }
        assertEquals("As4", DropletCrystallizationModel.assumedSpecies(java.util.Optional.empty(), GAAS_GA).orElseThrow());
        assertEquals("P2", DropletCrystallizationModel.assumedSpecies(java.util.Optional.empty(), inOnInP).orElseThrow());
        // an unrecognised spelling falls back to the same default as the converter
        assertEquals("P2", DropletCrystallizationModel.assumedSpecies(java.util.Optional.of("P3"), inOnInP).orElseThrow());
    }
}
